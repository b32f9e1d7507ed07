package org.loadstone.cli;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import picocli.CommandLine.Option;

/**
 * What describes a specimen, every option optional (null: not given): for commands that set or
 * correct it on a run that exists ({@code amend}) or arrives ({@code import}).
 */
public final class SpecimenOptions {
  @Option(names = "--specimen", paramLabel = "ID", description = "Specimen id.")
  String specimen;

  @Option(names = "--group", paramLabel = "GROUP", description = "Group for comparisons, e.g. balsa.")
  String group;

  @Option(names = "--tag", paramLabel = "TAG", description = "A tag (repeatable; replaces the run's tags).")
  List<String> tags;

  @Option(names = "--operator", paramLabel = "NAME", description = "Who ran the test.")
  String operator;

  @Option(names = "--notes", paramLabel = "TEXT", description = "Free notes kept with the run.")
  String notes;

  @Option(names = "--mass-g", paramLabel = "G", description = "Specimen mass in g (for strength per weight).")
  Double mass_g;

  @Option(names = "--test", paramLabel = "KIND", description = "Test kind: three-point, four-point, compression or tension.")
  String test;

  @Option(names = "--span-mm", paramLabel = "MM", description = "Support span L (bend tests).")
  Double span;

  @Option(names = "--load-span-mm", paramLabel = "MM", description = "Load span (four-point bend).")
  Double loadSpan;

  @Option(names = "--width-mm", paramLabel = "MM", description = "Specimen width b.")
  Double width;

  @Option(names = "--depth-mm", paramLabel = "MM", description = "Specimen depth (total thickness) d.")
  Double depth;

  @Option(names = "--facing-mm", paramLabel = "MM", description = "Sandwich facing thickness t.")
  Double facing;

  @Option(names = "--core-mm", paramLabel = "MM", description = "Sandwich core thickness c.")
  Double core;

  @Option(names = "--area-mm2", paramLabel = "MM2", description = "Loaded area (compression, tension), mm².")
  Double area;

  /**
   * @return the values given, by their sidecar field names (as {@link
   *     org.loadstone.archive.Amendment#changes()} takes them), in a fixed order
   */
  Map<String, Object> given() {
    Map<String, Object> m = new LinkedHashMap<>();
    put(m, "specimen", specimen);
    put(m, "group", group);
    put(m, "tags", tags);
    put(m, "operator", operator);
    put(m, "notes", notes);
    put(m, "mass_g", mass_g);
    put(m, "test_type", test);
    put(m, "span_mm", span);
    put(m, "load_span_mm", loadSpan);
    put(m, "width_mm", width);
    put(m, "depth_mm", depth);
    put(m, "facing_mm", facing);
    put(m, "core_mm", core);
    put(m, "area_mm2", area);
    return m;
  }

  private static void put(Map<String, Object> m, String k, Object v) {
    if (v != null) {
      m.put(k, v);
    }
  }
}
