package org.loadstone.archive;

/**
 * Specimen geometry, all in mm; any value may be null when not measured.
 *
 * @param span_mm support span L (bend tests)
 * @param loadSpan_mm load span (four-point bend)
 * @param width_mm width b
 * @param depth_mm depth (thickness) d
 * @param facing_mm facing thickness t (sandwich panels)
 * @param core_mm core thickness c (sandwich panels)
 * @param area_mm2 loaded cross-section area (compression, tension)
 */
public record Geometry(Double span_mm, Double loadSpan_mm, Double width_mm, Double depth_mm,
    Double facing_mm, Double core_mm, Double area_mm2) {
  /** No measurements. */
  public static final Geometry NONE = new Geometry(null, null, null, null, null, null, null);

  public Geometry {
    check(span_mm, "span_mm");
    check(loadSpan_mm, "load_span_mm");
    check(width_mm, "width_mm");
    check(depth_mm, "depth_mm");
    check(facing_mm, "facing_mm");
    check(core_mm, "core_mm");
    check(area_mm2, "area_mm2");
  }

  private static void check(Double v, String name) {
    if (v != null && !(Double.isFinite(v) && v > 0)) {
      throw new org.loadstone.units.LoadstoneException(
          "specimen " + name + " must be a positive number of mm, was " + v);
    }
  }
}
