package org.loadstone.acquire;

import org.loadstone.archive.Geometry;
import org.loadstone.device.SimSetup;

/**
 * On the simulated frame, the specimen's dimensions and mass are what a tester would measure with
 * calipers and a scale before the run: what the user did not give is filled from the simulated
 * specimen, and the run's notes say so. The same for the command line and the console.
 */
public final class SimulatedSpecimen {
  /** The note added to a run whose geometry or mass was filled in. */
  public static final String NOTE =
      "Geometry and mass not given were taken from the simulated specimen.";

  private SimulatedSpecimen() {}

  /**
   * The specimen as given, completed from the simulated one.
   *
   * @param geometry what the user gave
   * @param mass_g what the user gave, or null
   * @param filled whether anything was taken from the simulated specimen
   */
  public record Described(Geometry geometry, Double mass_g, boolean filled) {}

  /**
   * @param setup the simulated frame
   * @param given the geometry the user gave (fields may be null)
   * @param mass_g the mass the user gave, or null
   * @return the geometry and mass with what was missing filled in
   */
  public static Described fill(SimSetup setup, Geometry given, Double mass_g) {
    var spec = setup.buildFrame().truth().specimen();
    Geometry g = given == null ? Geometry.NONE : given;
    if (spec == null) {
      return new Described(g, mass_g, false);
    }
    Double span = g.span_mm();
    Double width = g.width_mm();
    Double depth = g.depth_mm();
    Double loadSpan = g.loadSpan_mm();
    Double facing = g.facing_mm();
    Double core = g.core_mm();
    boolean filled = false;
    if (spec.panel() != null) {
      var p = spec.panel();
      if (span == null) {
        span = p.span_mm();
        filled = true;
      }
      if (width == null) {
        width = p.width_mm();
        filled = true;
      }
      if (facing == null && core == null && depth == null) {
        facing = p.facing_mm();
        core = p.core_mm();
        depth = p.core_mm() + 2 * p.facing_mm();
        filled = true;
      }
    } else if (spec.beam() != null) {
      var b = spec.beam();
      if (span == null && width == null && depth == null) {
        span = b.span_mm();
        width = b.width_mm();
        depth = b.depth_mm();
        if (loadSpan == null && b.loadSpan_mm() > 0) {
          loadSpan = b.loadSpan_mm();
        }
        filled = true;
      }
    }
    Double mass = mass_g;
    if (mass == null && spec.mass_kg() > 0) {
      mass = Math.round(spec.mass_kg() * 1e4) / 10.0;
      filled = true;
    }
    Geometry out = new Geometry(span, loadSpan, width, depth, facing, core, g.area_mm2());
    return new Described(out, mass, filled);
  }
}
