package org.loadstone.ui;

import java.util.Locale;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.collections.FXCollections;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.study.Metric;
import org.loadstone.study.StudyResult;

/** The archive review's group table: n, mean, SD, CV and 95 % CI per group, in the figure's digits. */
final class StudyTable {
  private StudyTable() {}

    /** @return the per-group statistics of a comparison as a table (id {@code archive-groups}) */
  static TableView<GroupSummary> of(StudyResult r) {
    Metric m = r.metric();
    TableView<GroupSummary> t = new TableView<>(FXCollections.observableArrayList(r.groups()));
    t.setId("archive-groups");
    t.getColumns().add(summary("group", GroupSummary::name));
    t.getColumns().add(summary("n", g -> Integer.toString(g.n())));
    t.getColumns().add(summary("mean " + m.unit(), g -> m.format(g.mean())));
    t.getColumns().add(summary("SD", g -> m.format(g.sd())));
    t.getColumns().add(summary("CV %", g -> g.cvPct().isPresent()
        ? String.format(Locale.ROOT, "%.1f", g.cvPct().getAsDouble()) : "—"));
    t.getColumns().add(summary("95 % CI", g -> g.ci95Low().isPresent()
        ? m.format(g.ci95Low()) + " … " + m.format(g.ci95High()) : "needs n ≥ 2"));
    t.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);
    t.setPrefHeight(36 + 26 * r.groups().size());
    return t;
  }

  private static TableColumn<GroupSummary, String> summary(String name,
      java.util.function.Function<GroupSummary, String> value) {
    TableColumn<GroupSummary, String> c = new TableColumn<>(name);
    c.setCellValueFactory(f -> new ReadOnlyObjectWrapper<>(value.apply(f.getValue())));
    return c;
  }
}
