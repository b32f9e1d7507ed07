package org.loadstone.ui;

import java.util.Locale;
import javafx.scene.control.Label;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import org.jfree.chart.fx.ChartViewer;
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.report.Charts;
import org.loadstone.report.GroupColours;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.Metric;
import org.loadstone.study.Selection;
import org.loadstone.study.StudyResult;
import org.loadstone.units.LoadstoneException;

/**
 * The archive review's comparison: the groups shown compared on one figure by
 * {@link GroupStudy#compare} (as {@code loadstone compare}), drawn as a strip chart in the groups'
 * colours beside the per-group table, the test, the plain sentence, the sample-size advice and
 * the possible outliers.
 */
final class ArchiveStudyView {
  /** The sample-size advice aims at this difference, as the command line's default. */
  static final double TARGET_DIFFERENCE = GroupComparison.DEFAULT_TARGET_DIFFERENCE;

  private final BorderPane strip = new BorderPane();
  private final VBox statistics = new VBox(6);
  private final HBox node = new HBox(12, strip, statistics);

  ArchiveStudyView() {
    statistics.setId("archive-statistics");
    statistics.getStyleClass().add("archive-statistics");
    statistics.setPrefWidth(420);
    HBox.setHgrow(strip, Priority.ALWAYS);
    node.setPrefHeight(300);
  }

  HBox node() {
    return node;
  }

  /**
   * Compares the selection's groups on {@code m}, or says why they cannot be compared.
   *
   * @param sel the runs shown, or null before a folder is loaded
   * @param m the figure, or null
   * @param colours the archive's group colours
   * @return the runs left out of the comparison with the reason (the selection's, and those
   *     without the figure), empty before a folder is loaded
   */
  java.util.List<org.loadstone.study.LeftOut> show(Selection sel, Metric m,
      GroupColours colours) {
    statistics.getChildren().clear();
    strip.setCenter(null);
    if (m == null || sel == null) {
      return sel == null ? java.util.List.of() : sel.leftOut();
    }
    try {
      StudyResult r = GroupStudy.compare(sel, m, TARGET_DIFFERENCE);
      ChartViewer v = new ChartViewer(Charts.strip(r.comparison(), r.plainValues(), m.heading(),
          colours));
      v.setId("archive-strip");
      strip.setCenter(v);
      statistics.getChildren().add(StudyTable.of(r));
      statistics.getChildren().add(LivePane.label("archive-test", r.test().words()
          + (r.pValue().isPresent()
          ? String.format(Locale.ROOT, ", p = %.3g", r.pValue().getAsDouble()) : "")));
      wrapped("archive-sentence", r.sentence());
      r.advice().ifPresent(a -> wrapped("archive-advice", a.sentence()));
      for (StudyResult.Outlier o : r.outliers()) {
        note("possible outlier in " + o.group() + ": run " + o.runId() + " (" + o.specimen()
            + "), " + m.format(o.value()) + " " + m.unit() + " (Grubbs, α = 0.05)");
      }
      if (!r.leftOut().isEmpty()) {
        note(GroupStudy.leftOutSummary(r.leftOut()) + ", listed under the runs with the reason");
      }
      return r.leftOut();
    } catch (LoadstoneException e) {
      wrapped("archive-sentence", e.getMessage() + (sel.leftOut().isEmpty() ? ""
          : " — tick a kind of run above to count it, or tick more groups"));
      return sel.leftOut();
    }
  }

  private void wrapped(String id, String text) {
    Label l = LivePane.label(id, text);
    l.setWrapText(true);
    statistics.getChildren().add(l);
  }

  private void note(String text) {
    Label l = new Label(text);
    l.setWrapText(true);
    l.getStyleClass().add("archive-note");
    statistics.getChildren().add(l);
  }
}
