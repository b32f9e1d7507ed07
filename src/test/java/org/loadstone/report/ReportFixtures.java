package org.loadstone.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.nio.file.Path;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.RunSelection;
import org.loadstone.study.Selection;
import org.loadstone.archive.TestRuns;

/** Three groups of synthetic shelf-panel runs (foam, balsa, corrugated-board cores). */
final class ReportFixtures {
  private ReportFixtures() {}

  static final double[][] PEAKS = {{455, 470, 462, 448}, {610, 640, 625}, {380, 395, 372, 388}};
  static final double[][] STIFFNESS = {{60, 63, 58, 61}, {85, 90, 88}, {41, 44, 40, 43}};
  static final String[] NAMES = {"foam", "balsa", "board"};

  /** The groups compared on these figures, as the group report is given them. */
  static GroupStudy.Report study(Map<String, List<RunMetrics>> groups, List<Metric> metrics) {
    Selection s = new Selection(Path.of("test-archive"), RunSelection.DEFAULT, groups, List.of(),
        List.copyOf(groups.keySet()));
    return GroupStudy.compareEach(s, metrics, 0.10);
  }

  static Map<String, List<RunMetrics>> groups() {
    Map<String, List<RunMetrics>> g = new LinkedHashMap<>();
    for (int i = 0; i < NAMES.length; i++) {
      List<RunMetrics> l = new ArrayList<>();
      for (int j = 0; j < PEAKS[i].length; j++) {
        String id = NAMES[i].substring(0, 2).toUpperCase() + "-" + (j + 1);
        l.add(RunMetrics.of(TestRuns.meta(id, NAMES[i], TestRuns.panel(), 48.0 + 3 * i + j),
            TestRuns.bend(STIFFNESS[i][j], PEAKS[i][j])));
      }
      g.put(NAMES[i], l);
    }
    return g;
  }
}
