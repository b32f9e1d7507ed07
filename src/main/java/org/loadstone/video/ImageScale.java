package org.loadstone.video;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.loadstone.units.LengthUnit;
import org.loadstone.units.LoadstoneException;

/**
 * Millimetres per pixel, from two points a known distance apart in the image.
 *
 * <p>Uncertainty: each marked point is taken as good to half a pixel along the line (standard
 * uncertainty, common practice for a point placed by eye on a sharp mark), so the distance is
 * good to √2·0.5 px and the scale to that over the distance, relative.
 *
 * @param mm_per_px the scale, millimetres per pixel, positive
 * @param source how it was found, in words (the points and the length)
 * @param relativeUncertainty standard uncertainty of the scale over the scale, 0 or more
 */
public record ImageScale(double mm_per_px, String source, double relativeUncertainty) {
  /** Standard uncertainty of a point marked by eye, pixels (common practice). */
  public static final double POINT_UNCERTAINTY_PX = 0.5;

  private static final Pattern TEXT = Pattern.compile(
      "\\s*([-0-9.]+)\\s*,\\s*([-0-9.]+)\\s+([-0-9.]+)\\s*,\\s*([-0-9.]+)\\s*=\\s*([0-9.eE+-]+)"
          + "\\s*([a-zA-Zµ]*)\\s*");

  /** Checks the values. */
  public ImageScale {
    if (!(mm_per_px > 0) || !Double.isFinite(mm_per_px)) {
      throw new LoadstoneException("a scale of " + mm_per_px + " mm per pixel cannot be used: "
          + "mark two points a known distance apart");
    }
    if (!(relativeUncertainty >= 0)) {
      throw new IllegalArgumentException("relative uncertainty " + relativeUncertainty);
    }
  }

  /**
   * @param a one end of the known length, in the image
   * @param b the other end
   * @param length_mm the distance between them, millimetres, positive
   * @throws LoadstoneException when the points coincide (a scale of zero length) or the length is
   *     not positive
   */
  public static ImageScale fromPoints(PixelPoint a, PixelPoint b, double length_mm) {
    double d = a.distanceTo(b);
    if (!(d >= 1)) {
      throw new LoadstoneException("the two scale points " + a + " and " + b + " are "
          + String.format(Locale.ROOT, "%.2f", d) + " pixels apart: mark two points a known "
          + "distance apart, as far apart as the frame allows");
    }
    if (!(length_mm > 0) || !Double.isFinite(length_mm)) {
      throw new LoadstoneException("the known length between the scale points is "
          + length_mm + " mm: give the real distance between them, more than zero");
    }
    return new ImageScale(length_mm / d, String.format(Locale.ROOT,
        "%s to %s = %.6g mm (%.2f px)", a, b, length_mm, d),
        Math.sqrt(2) * POINT_UNCERTAINTY_PX / d);
  }

  /**
   * Reads "X1,Y1 X2,Y2 = 50 mm" (a length unit mm, cm, m, in or µm; mm when none is given).
   *
   * @throws LoadstoneException when the text has another shape, or names an unknown unit
   */
  public static ImageScale parse(String text) {
    Matcher m = TEXT.matcher(text);
    if (!m.matches()) {
      throw new LoadstoneException("the scale '" + text + "' has not the shape "
          + "\"X1,Y1 X2,Y2 = LENGTH UNIT\" (two points in pixels and the known distance "
          + "between them, for example \"12,40 148,40 = 50 mm\")");
    }
    try {
      PixelPoint a = new PixelPoint(Double.parseDouble(m.group(1)),
          Double.parseDouble(m.group(2)));
      PixelPoint b = new PixelPoint(Double.parseDouble(m.group(3)),
          Double.parseDouble(m.group(4)));
      double len = Double.parseDouble(m.group(5));
      String unit = m.group(6).isEmpty() ? "mm" : m.group(6);
      return fromPoints(a, b, LengthUnit.parse(unit).toMm(len));
    } catch (NumberFormatException e) {
      throw new LoadstoneException("the scale '" + text + "' holds a number that cannot be "
          + "read: write it as \"X1,Y1 X2,Y2 = 50 mm\"");
    }
  }
}
