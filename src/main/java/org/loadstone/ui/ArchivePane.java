package org.loadstone.ui;

import java.nio.file.Path;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.TreeMap;
import javafx.application.Platform;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.collections.FXCollections;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.SelectionMode;
import javafx.scene.control.SplitPane;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.fx.ChartViewer;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.stats.ComparisonResult;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.archive.ArchiveIndex;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.RunMetrics;
import org.loadstone.report.Charts;
import org.loadstone.report.PdfReport;
import org.loadstone.units.LoadstoneException;

/**
 * Reviewing the archive after a day of testing: the runs of a folder, their curves overlaid (the
 * runs picked, or all shown), and the groups compared on a chosen figure — means with their
 * scatter, the test, the plain sentence and the sample-size advice, as {@code loadstone compare}
 * and the group report give them. Thin: figures come from {@link GroupStudy}, charts from {@link
 * Charts}.
 */
final class ArchivePane {
  /** The comparison's sample-size advice aims at this difference, as the command line's default. */
  private static final double TARGET_DIFFERENCE = 0.10;
  private static final DateTimeFormatter WHEN =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm", Locale.ROOT).withZone(ZoneId.systemDefault());

  private final BorderPane root = new BorderPane();
  private final TextField folder = new TextField();
  private final ComboBox<String> group = new ComboBox<>();
  private final ComboBox<GroupStudy.Metric> metric = new ComboBox<>();
  private final TableView<RunMetrics> table = new TableView<>();
  private final BorderPane curves = new BorderPane();
  private final BorderPane strip = new BorderPane();
  private final VBox statistics = new VBox(6);
  private final Label status = LivePane.label("archive-status", "");
  /** Runs read and analysed so far, by sidecar file. */
  private final Map<Path, RunMetrics> analysed = new java.util.concurrent.ConcurrentHashMap<>();
  /** Every run of the folder, analysed, by group (group order). */
  private Map<String, List<RunMetrics>> runs = Map.of();

  ArchivePane(Path archive) {
    folder.setText(archive.toString());
    build();
  }

  Parent root() {
    return root;
  }

  private void build() {
    root.getStyleClass().add("archive");
    folder.setId("archive-folder");
    folder.setPromptText("archive folder");
    HBox.setHgrow(folder, Priority.ALWAYS);
    folder.setOnAction(e -> reload());
    Button load = new Button("Load");
    load.setId("archive-load");
    load.setOnAction(e -> reload());
    group.setId("archive-group");
    group.setOnAction(e -> showRuns());
    metric.setId("archive-metric");
    metric.setItems(FXCollections.observableArrayList(GroupStudy.Metric.values()));
    metric.setValue(GroupStudy.Metric.PEAK);
    metric.setConverter(new javafx.util.StringConverter<>() {
      @Override
      public String toString(GroupStudy.Metric m) {
        return m == null ? "" : m.label() + " (" + m.unit() + ")";
      }

      @Override
      public GroupStudy.Metric fromString(String s) {
        return GroupStudy.Metric.parse(s);
      }
    });
    metric.setOnAction(e -> compare());
    Button report = new Button("Report (PDF)");
    report.setId("archive-report");
    report.setOnAction(e -> writeReport());
    HBox bar = new HBox(10, LivePane.label("archive-caption", "ARCHIVE"), folder, load,
        LivePane.label("group-caption", "group"), group, LivePane.label("metric-caption",
            "compare"), metric, report);
    bar.setAlignment(Pos.CENTER_LEFT);
    bar.getStyleClass().add("archive-bar");
    root.setTop(bar);

    table.setId("archive-runs");
    table.getSelectionModel().setSelectionMode(SelectionMode.MULTIPLE);
    table.getSelectionModel().getSelectedItems().addListener(
        (javafx.collections.ListChangeListener<RunMetrics>) c -> showCurves());
    table.getColumns().add(column("specimen", m -> m.metadata().specimen()));
    table.getColumns().add(column("group", m -> m.metadata().group()));
    table.getColumns().add(column("cause", m -> m.metadata().cause().wireName()));
    TableColumn<RunMetrics, String> started =
        column("started", m -> WHEN.format(m.metadata().startedAt()));
    started.setPrefWidth(150);
    table.getColumns().add(started);
    table.getColumns().add(column("peak N", m -> String.format(Locale.ROOT, "%.1f",
        m.analysis().peakForce_N())));
    table.setPlaceholder(new Label("no runs here"));
    table.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);

    statistics.setId("archive-statistics");
    statistics.getStyleClass().add("archive-statistics");
    statistics.setPrefWidth(420);
    HBox comparison = new HBox(12, strip, statistics);
    HBox.setHgrow(strip, Priority.ALWAYS);
    comparison.setPrefHeight(300);
    SplitPane right = new SplitPane(curves, comparison);
    right.setOrientation(javafx.geometry.Orientation.VERTICAL);
    right.setDividerPositions(0.55);
    SplitPane split = new SplitPane(table, right);
    split.setDividerPositions(0.36);
    root.setCenter(split);
    status.setWrapText(true);
    HBox bottom = new HBox(status);
    bottom.getStyleClass().add("bottom-bar");
    root.setBottom(bottom);
    BorderPane.setMargin(split, new Insets(8));
  }

  private static TableColumn<RunMetrics, String> column(String name,
      java.util.function.Function<RunMetrics, String> value) {
    TableColumn<RunMetrics, String> c = new TableColumn<>(name);
    c.setCellValueFactory(f -> new ReadOnlyStringWrapper(value.apply(f.getValue())));
    return c;
  }

  /** Scans the folder and analyses every run, off the JavaFX thread. */
  void reload() {
    Path dir = Path.of(folder.getText().trim());
    status.setText("reading " + dir + " …");
    Thread t = new Thread(() -> {
      try {
        if (!java.nio.file.Files.isDirectory(dir)) {
          Platform.runLater(() -> {
            show(Map.of());
            status.setText("no runs yet: " + dir + " does not exist (runs stored from the Live "
                + "tab go there); type another folder above and press Load");
          });
          return;
        }
        ArchiveIndex index = ArchiveIndex.scan(dir);
        List<String> problems = new ArrayList<>(index.problems());
        // stored runs are never rewritten: read and analyse only those not seen before
        for (ArchiveIndex.Entry e : index.entries()) {
          if (!analysed.containsKey(e.json())) {
            try {
              analysed.put(e.json(), GroupStudy.analyse(e, AnalysisSettings.DEFAULTS));
            } catch (LoadstoneException ex) {
              problems.add(e.json().getFileName() + ": " + ex.getMessage());
            }
          }
        }
        Map<String, List<RunMetrics>> loaded = new TreeMap<>();
        for (ArchiveIndex.Entry e : index.entries()) {
          RunMetrics m = analysed.get(e.json());
          if (m != null) {
            loaded.computeIfAbsent(GroupStudy.groupOf(m.metadata()), k -> new ArrayList<>())
                .add(m);
          }
        }
        int n = loaded.values().stream().mapToInt(List::size).sum();
        String text = n + " runs in " + dir + (problems.isEmpty() ? ""
            : " · left out: " + String.join("; ", problems));
        Platform.runLater(() -> {
          show(loaded);
          status.setText(text);
        });
      } catch (LoadstoneException e) {
        Platform.runLater(() -> status.setText(e.getMessage()));
      }
    }, "archive review");
    t.setDaemon(true);
    t.start();
  }

  private static final String ALL = "all groups";

  private void show(Map<String, List<RunMetrics>> loaded) {
    runs = loaded;
    List<String> groups = new ArrayList<>();
    groups.add(ALL);
    groups.addAll(loaded.keySet());
    group.setItems(FXCollections.observableArrayList(groups));
    group.setValue(ALL);
    showRuns();
  }

  /**
   * Writes a PDF into the archive folder (a new file, named by the time): the report of the run
   * picked when one is, otherwise the comparison of the groups shown.
   */
  private void writeReport() {
    List<RunMetrics> picked = List.copyOf(table.getSelectionModel().getSelectedItems());
    Map<String, List<RunMetrics>> groups = shown();
    Path dir = Path.of(folder.getText().trim());
    Path file = dir.resolve("report-" + java.time.LocalDateTime.now().format(
        DateTimeFormatter.ofPattern("yyyyMMdd-HHmmss", Locale.ROOT)) + ".pdf");
    status.setText("writing " + file + " …");
    Thread t = new Thread(() -> {
      String done;
      try {
        if (picked.size() == 1) {
          PdfReport.writeRun(picked.get(0), file);
        } else {
          PdfReport.writeGroups("Comparison of " + String.join(", ", groups.keySet()), groups,
              PdfReport.DEFAULT_METRICS, file);
        }
        done = "report written to " + file;
      } catch (LoadstoneException e) {
        done = "no report: " + e.getMessage();
      }
      String text = done;
      Platform.runLater(() -> status.setText(text));
    }, "archive report");
    t.setDaemon(true);
    t.start();
  }

  /** The runs of the chosen group (or all), by group. */
  private Map<String, List<RunMetrics>> shown() {
    String g = group.getValue();
    if (g == null || g.equals(ALL)) {
      return runs;
    }
    return runs.containsKey(g) ? Map.of(g, runs.get(g)) : Map.of();
  }

  private void showRuns() {
    List<RunMetrics> rows = new ArrayList<>();
    shown().values().forEach(rows::addAll);
    table.setItems(FXCollections.observableArrayList(rows));
    showCurves();
    compare();
  }

  /** The curves of the runs picked in the table, or of all shown when none is picked. */
  private void showCurves() {
    List<RunMetrics> picked = table.getSelectionModel().getSelectedItems();
    Map<String, List<RunMetrics>> byGroup = new TreeMap<>();
    if (picked.isEmpty()) {
      byGroup.putAll(shown());
    } else {
      for (RunMetrics m : picked) {
        byGroup.computeIfAbsent(m.metadata().group().isBlank() ? "(none)" : m.metadata().group(),
            k -> new ArrayList<>()).add(m);
      }
    }
    int n = byGroup.values().stream().mapToInt(List::size).sum();
    if (n == 0) {
      curves.setCenter(new Label("no runs to draw"));
      return;
    }
    JFreeChart chart = byGroup.size() == 1
        ? Charts.group(byGroup.keySet().iterator().next(), byGroup.values().iterator().next())
        : Charts.overlay(picked.isEmpty() ? "all runs shown" : n + " runs picked", byGroup);
    curves.setCenter(viewer("archive-curves", chart));
  }

  /** Compares the shown groups on the chosen figure. */
  private void compare() {
    statistics.getChildren().clear();
    strip.setCenter(null);
    GroupStudy.Metric m = metric.getValue();
    if (m == null || runs.isEmpty()) {
      return;
    }
    try {
      GroupStudy.Outcome o = GroupStudy.compare(shown(), m, TARGET_DIFFERENCE);
      ComparisonResult r = o.comparison();
      Map<String, List<Double>> values = new LinkedHashMap<>();
      o.runs().forEach((g, list) -> {
        for (RunMetrics rm : list) {
          OptionalDouble v = rm.value(m.key());
          if (v.isPresent()) {
            values.computeIfAbsent(g, k -> new ArrayList<>()).add(v.getAsDouble());
          }
        }
      });
      strip.setCenter(viewer("archive-strip",
          Charts.strip(r, values, m.label() + " (" + m.unit() + ")")));
      statistics.getChildren().add(groupTable(r, m.unit()));
      statistics.getChildren().add(LivePane.label("archive-test", r.test().words()
          + (r.pValue().isPresent()
          ? String.format(Locale.ROOT, ", p = %.3g", r.pValue().getAsDouble()) : "")));
      Label sentence = LivePane.label("archive-sentence", r.sentence());
      sentence.setWrapText(true);
      statistics.getChildren().add(sentence);
      r.advice().ifPresent(a -> {
        Label advice = LivePane.label("archive-advice", a.sentence());
        advice.setWrapText(true);
        statistics.getChildren().add(advice);
      });
      for (ComparisonResult.FlaggedValue f : r.outliers()) {
        note("possible outlier in " + f.group() + ": " + num(f.outlier().value())
            + " (Grubbs, α = 0.05)");
      }
      for (String left : o.leftOut()) {
        note("left out: " + left);
      }
    } catch (LoadstoneException e) {
      Label why = LivePane.label("archive-sentence", e.getMessage());
      why.setWrapText(true);
      statistics.getChildren().add(why);
    }
  }

  private void note(String text) {
    Label l = new Label(text);
    l.setWrapText(true);
    l.getStyleClass().add("archive-note");
    statistics.getChildren().add(l);
  }

  private static TableView<GroupSummary> groupTable(ComparisonResult r, String unit) {
    TableView<GroupSummary> t = new TableView<>(FXCollections.observableArrayList(r.groups()));
    t.setId("archive-groups");
    t.getColumns().add(summary("group", GroupSummary::name));
    t.getColumns().add(summary("n", g -> Integer.toString(g.n())));
    t.getColumns().add(summary("mean " + unit, g -> num(g.mean())));
    t.getColumns().add(summary("SD", g -> opt(g.sd())));
    t.getColumns().add(summary("CV %", g -> g.cvPct().isPresent()
        ? String.format(Locale.ROOT, "%.1f", g.cvPct().getAsDouble()) : "—"));
    t.getColumns().add(summary("95 % CI", g -> g.ci95Low().isPresent()
        ? num(g.ci95Low().getAsDouble()) + " … " + num(g.ci95High().getAsDouble())
        : "needs n ≥ 2"));
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

  static String num(double v) {
    return String.format(Locale.ROOT, Math.abs(v) >= 1000 ? "%.0f" : Math.abs(v) >= 10 ? "%.1f"
        : "%.3f", v);
  }

  private static String opt(OptionalDouble v) {
    return v.isPresent() ? num(v.getAsDouble()) : "—";
  }

  private static ChartViewer viewer(String id, JFreeChart chart) {
    ChartViewer v = new ChartViewer(chart);
    v.setId(id);
    return v;
  }

  TableView<RunMetrics> table() {
    return table;
  }

  ComboBox<String> group() {
    return group;
  }

  ComboBox<GroupStudy.Metric> metric() {
    return metric;
  }
}
