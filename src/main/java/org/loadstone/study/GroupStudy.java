package org.loadstone.study;

import org.loadstone.archive.ArchiveIndex;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunReader;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.TreeMap;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.units.LoadstoneException;

/**
 * Compares groups of archived runs on one metric: loads the runs, analyses each (raw data is not
 * touched), collects the metric per group and hands it to {@link GroupComparison}. Runs without
 * the metric (no position channel, no mass) are left out and named.
 */
public final class GroupStudy {
  private GroupStudy() {}

  /** The metrics one can compare, by command-line name. */
  public enum Metric {
    PEAK("peak", "peak_N", "peak force", "N"),
    STIFFNESS("stiffness", "stiffness_N_per_mm", "stiffness", "N/mm"),
    ENERGY("energy", "energy_to_peak_J", "energy to peak", "J"),
    ENERGY_TO_BREAK("energy-to-break", "energy_to_break_J", "energy to break", "J"),
    SPECIFIC_PEAK("specific-peak", "specific_peak_N_per_g", "peak force per gram", "N/g"),
    SPECIFIC_ENERGY("specific-energy", "specific_energy_to_peak_J_per_g", "energy to peak per gram",
        "J/g"),
    SPECIFIC_STIFFNESS("specific-stiffness", "specific_stiffness_N_per_mm_per_g",
        "stiffness per gram", "N/mm/g"),
    FLEXURAL_MODULUS("flexural-modulus", "flexural_modulus_MPa", "flexural modulus", "MPa"),
    CORE_SHEAR("core-shear", "core_shear_stress_at_peak_MPa", "core shear stress at peak", "MPa");

    private final String cliName;
    private final String key;
    private final String label;
    private final String unit;

    Metric(String cliName, String key, String label, String unit) {
      this.cliName = cliName;
      this.key = key;
      this.label = label;
      this.unit = unit;
    }

    public String cliName() {
      return cliName;
    }

    /** @return the key in {@link RunMetrics#toJsonMap()} */
    public String key() {
      return key;
    }

    public String label() {
      return label;
    }

    public String unit() {
      return unit;
    }

    /** @throws LoadstoneException naming the text and the accepted names */
    public static Metric parse(String text) {
      String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
      for (Metric m : values()) {
        if (m.cliName.equals(t) || m.key.equals(t)) {
          return m;
        }
      }
      StringBuilder names = new StringBuilder();
      for (Metric m : values()) {
        names.append(names.length() == 0 ? "" : ", ").append(m.cliName);
      }
      throw new LoadstoneException("unknown metric '" + text + "': use one of " + names);
    }
  }

  /**
   * The outcome.
   *
   * @param metric what was compared
   * @param runs the analysed runs by group (group name order)
   * @param comparison the statistics
   * @param leftOut runs without this metric, with the reason
   */
  public record Outcome(Metric metric, Map<String, List<RunMetrics>> runs,
      ComparisonResult comparison, List<String> leftOut) {}

  /**
   * Loads and analyses the runs, grouped by their group name (runs with no group are grouped as
   * {@code (none)}).
   */
  public static Map<String, List<RunMetrics>> load(List<ArchiveIndex.Entry> entries,
      AnalysisSettings settings) {
    Map<String, List<RunMetrics>> out = new TreeMap<>();
    for (ArchiveIndex.Entry e : entries) {
      RunMetrics m = analyse(e, settings);
      out.computeIfAbsent(groupOf(m.metadata()), k -> new ArrayList<>()).add(m);
    }
    return out;
  }

  /**
   * Reads one run and analyses it.
   *
   * @throws LoadstoneException when it cannot be read or analysed
   */
  public static RunMetrics analyse(ArchiveIndex.Entry e, AnalysisSettings settings) {
    Run run = RunReader.read(e.json());
    return RunMetrics.of(run.metadata(), run.data(), settings);
  }

  /** @return the group a run is compared in: its group name, {@code (none)} when it has none */
  public static String groupOf(RunMetadata m) {
    return m.group().isBlank() ? "(none)" : m.group();
  }

  /**
   * Compares the groups on a metric.
   *
   * @throws LoadstoneException when fewer than 2 groups have the metric
   */
  public static Outcome compare(Map<String, List<RunMetrics>> runs, Metric metric,
      double targetDifference) {
    Map<String, List<Double>> values = new LinkedHashMap<>();
    List<String> leftOut = new ArrayList<>();
    runs.forEach((g, list) -> {
      for (RunMetrics m : list) {
        OptionalDouble v = m.value(metric.key());
        if (v.isPresent()) {
          values.computeIfAbsent(g, k -> new ArrayList<>()).add(v.getAsDouble());
        } else {
          leftOut.add(m.metadata().runId() + " (" + m.metadata().specimen() + "): no "
              + metric.label() + (m.notes().isEmpty() ? "" : " — " + m.notes().get(0)));
        }
      }
    });
    if (values.size() < 2) {
      throw new LoadstoneException("comparing " + metric.label() + " needs runs from at least 2 "
          + "groups that have it; found " + values.size() + " (" + String.join(", ",
              values.keySet()) + "): record runs with --group, or pick another --metric");
    }
    ComparisonResult r = GroupComparison.compare(metric.label(), values, targetDifference);
    return new Outcome(metric, runs, r, leftOut);
  }
}
