package org.loadstone.analysis;

import org.loadstone.units.LoadstoneException;

/**
 * Cross-section of a sandwich beam with two equal facings (ASTM C393, ASTM D7250).
 *
 * <p>The total thickness must agree with core + two facings: |d − (c + 2t)| ≤ 2 % of d. A larger
 * mismatch means a mistyped dimension (or a thick adhesive line that should be counted in the
 * facings), and the formulas would mislead, so it is refused.
 *
 * @param totalThickness_mm d, finite, above zero
 * @param coreThickness_mm c, finite, above zero
 * @param facingThickness_mm t, each facing, finite, above zero
 * @param width_mm b, finite, above zero
 * @throws LoadstoneException when a dimension is not positive or d ≉ c + 2t
 */
public record SandwichGeometry(
    double totalThickness_mm, double coreThickness_mm, double facingThickness_mm, double width_mm) {

  /** Relative tolerance on d = c + 2t. */
  public static final double THICKNESS_TOLERANCE = 0.02;

  /** Checks the dimensions and their consistency. */
  public SandwichGeometry {
    Flexure.positive(totalThickness_mm, "sandwich total thickness", "mm");
    Flexure.positive(coreThickness_mm, "sandwich core thickness", "mm");
    Flexure.positive(facingThickness_mm, "sandwich facing thickness", "mm");
    Flexure.positive(width_mm, "sandwich width", "mm");
    double sum = coreThickness_mm + 2 * facingThickness_mm;
    if (Math.abs(totalThickness_mm - sum) > THICKNESS_TOLERANCE * totalThickness_mm) {
      throw new LoadstoneException(
          String.format(
              "Sandwich geometry is inconsistent: total thickness %.4g mm but core %.4g mm + 2 × "
                  + "facing %.4g mm = %.4g mm (allowed difference 2 %%). Measure the three "
                  + "thicknesses again; d must equal c + 2t.",
              totalThickness_mm, coreThickness_mm, facingThickness_mm, sum));
    }
  }

  /** @return distance between the facing centroids, (d + c)/2, mm */
  public double facingCentroidDistance_mm() {
    return (totalThickness_mm + coreThickness_mm) / 2;
  }
}
