package org.loadstone.ui;

import java.nio.file.Path;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import javafx.application.Platform;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.collections.FXCollections;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
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
import org.loadstone.analysis.stats.GroupComparison;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.RunSelection;
import org.loadstone.study.Selection;
import org.loadstone.study.StudyResult;
import org.loadstone.report.Charts;
import org.loadstone.report.PdfReport;
import org.loadstone.units.LoadstoneException;

/**
 * Reviewing the archive after a day of testing: the runs of a folder, their curves overlaid (the
 * runs picked, or all shown), and the groups compared on a chosen figure — means with their
 * scatter, the test, the plain sentence and the sample-size advice, as {@code loadstone compare}
 * and the group report give them. Which runs count is the one rule of {@link RunSelection}: by
 * default broken, calibrated runs; check boxes let the other kinds in, and the runs left out are
 * listed with the reason. Thin: figures come from {@link GroupStudy}, charts from {@link Charts}.
 */
final class ArchivePane {
  /** The comparison's sample-size advice aims at this difference, as the command line's default. */
  private static final double TARGET_DIFFERENCE = GroupComparison.DEFAULT_TARGET_DIFFERENCE;
  private static final DateTimeFormatter WHEN =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm", Locale.ROOT).withZone(ZoneId.systemDefault());

  private final BorderPane root = new BorderPane();
  private final TextField folder = new TextField();
  private final ComboBox<String> group = new ComboBox<>();
  private final ComboBox<Metric> metric = new ComboBox<>();
  private final Map<LeftOut.Kind, CheckBox> include = new EnumMap<>(LeftOut.Kind.class);
  private final TableView<RunMetrics> table = new TableView<>();
  private final BorderPane curves = new BorderPane();
  private final BorderPane strip = new BorderPane();
  private final VBox statistics = new VBox(6);
  private final Label status = LivePane.label("archive-status", "");
  /** The folder's runs, analysed; null before the first load. */
  private ArchiveRuns archive;
  /** The runs that count under the boxes ticked, by group, and those left out. */
  private Selection selection;

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
    metric.setItems(FXCollections.observableArrayList(Metric.comparableOnes()));
    metric.setValue(Metric.PEAK);
    metric.setConverter(new javafx.util.StringConverter<>() {
      @Override
      public String toString(Metric m) {
        return m == null ? "" : m.heading();
      }

      @Override
      public Metric fromString(String s) {
        return Metric.parse(s);
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
    HBox counts = new HBox(10, LivePane.label("include-caption",
        "counted: runs ended by a break, force from a calibration; also count"));
    for (LeftOut.Kind k : LeftOut.Kind.admissibleOnes()) {
      CheckBox box = new CheckBox(k.word());
      box.setId("archive-include-" + k.word());
      box.setOnAction(e -> select());
      include.put(k, box);
      counts.getChildren().add(box);
    }
    counts.setAlignment(Pos.CENTER_LEFT);
    counts.getStyleClass().add("archive-bar");
    root.setTop(new VBox(bar, counts));

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
    table.getColumns().add(column("peak N", m -> Metric.PEAK.format(Metric.PEAK.of(m))));
    table.getColumns().add(column("mass g", m -> m.metadata().mass_g() == null ? "—"
        : RunFigures.fmt(m.metadata().mass_g(), "").strip()));
    TableColumn<RunMetrics, String> amended = column("record", m -> m.metadata().amendments()
        .changes().stream().map(c -> c.field() + " " + c.now()).reduce((a, b) -> a + ", " + b)
        .map(t -> "amended: " + t).orElse(""));
    amended.setId("archive-amended");
    table.getColumns().add(amended);
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

  /** Scans the folder and analyses every run not analysed before, off the JavaFX thread. */
  void reload() {
    Path dir = Path.of(folder.getText().trim());
    ArchiveRuns before = archive;
    status.setText("reading " + dir + " …");
    Thread t = new Thread(() -> {
      try {
        if (!java.nio.file.Files.isDirectory(dir)) {
          Platform.runLater(() -> {
            archive = null;
            select();
            status.setText("no runs yet: " + dir + " does not exist (runs stored from the Live "
                + "tab go there); type another folder above and press Load");
          });
          return;
        }
        ArchiveRuns runs = ArchiveRuns.rescan(dir, before);
        runs.analyseAll(); // so that ticking a box needs no file access on this thread
        Platform.runLater(() -> {
          archive = runs;
          select();
        });
      } catch (LoadstoneException e) {
        Platform.runLater(() -> status.setText(ConsoleHints.withHow(e)));
      }
    }, "archive review");
    t.setDaemon(true);
    t.start();
  }

  /** @return the selection settings the boxes give */
  RunSelection settings() {
    List<LeftOut.Kind> kinds = new ArrayList<>();
    include.forEach((k, box) -> {
      if (box.isSelected()) {
        kinds.add(k);
      }
    });
    return RunSelection.DEFAULT.admitting(kinds);
  }

  /** Applies the boxes to the loaded runs and shows what counts. */
  private void select() {
    if (archive == null) {
      show(null);
      return;
    }
    Selection sel = archive.select(settings());
    show(sel);
    status.setText(sel.counted() + " runs counted in " + sel.folder()
        + (sel.leftOut().isEmpty() ? "" : " · " + GroupStudy.leftOutSummary(sel.leftOut())
            + ", listed beside the comparison"));
  }

  private static final String ALL = "all groups";

  private void show(Selection sel) {
    selection = sel;
    String was = group.getValue();
    List<String> groups = new ArrayList<>();
    groups.add(ALL);
    if (sel != null) {
      groups.addAll(sel.groups().keySet());
    }
    group.setItems(FXCollections.observableArrayList(groups));
    group.setValue(groups.contains(was) ? was : ALL);
    showRuns();
  }

  /**
   * Writes a PDF into the archive folder (a new file, named by the time): the report of the run
   * picked when one is, otherwise the comparison of the groups shown.
   */
  private void writeReport() {
    List<RunMetrics> picked = List.copyOf(table.getSelectionModel().getSelectedItems());
    Selection groups = shown();
    Path dir = Path.of(folder.getText().trim());
    Path file = dir.resolve("report-" + java.time.LocalDateTime.now().format(
        DateTimeFormatter.ofPattern("yyyyMMdd-HHmmss", Locale.ROOT)) + ".pdf");
    status.setText("writing " + file + " …");
    Thread t = new Thread(() -> {
      String done;
      try {
        if (picked.size() == 1) {
          PdfReport.writeRun(picked.get(0), file);
        } else if (groups == null) {
          throw new LoadstoneException("no runs loaded: press Load first");
        } else {
          PdfReport.writeGroups("Comparison of " + String.join(", ", groups.groups().keySet()),
              GroupStudy.compareEach(groups, PdfReport.DEFAULT_METRICS, TARGET_DIFFERENCE), file);
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

  /** The selection limited to the chosen group (or all); null before a folder is loaded. */
  private Selection shown() {
    String g = group.getValue();
    if (selection == null || g == null || g.equals(ALL)) {
      return selection;
    }
    return selection.onlyGroup(g);
  }

  private void showRuns() {
    List<RunMetrics> rows = shown() == null ? List.of() : shown().runs();
    table.setItems(FXCollections.observableArrayList(rows));
    showCurves();
    compare();
  }

  /** The curves of the runs picked in the table, or of all shown when none is picked. */
  private void showCurves() {
    List<RunMetrics> picked = table.getSelectionModel().getSelectedItems();
    Map<String, List<RunMetrics>> byGroup = new TreeMap<>();
    if (picked.isEmpty()) {
      if (shown() != null) {
        byGroup.putAll(shown().groups());
      }
    } else {
      for (RunMetrics m : picked) {
        byGroup.computeIfAbsent(ArchiveRuns.groupName(m.metadata().group()),
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
    Metric m = metric.getValue();
    Selection sel = shown();
    if (m == null || sel == null) {
      return;
    }
    try {
      StudyResult r = GroupStudy.compare(sel, m, TARGET_DIFFERENCE);
      strip.setCenter(viewer("archive-strip",
          Charts.strip(r.comparison(), r.plainValues(), m.heading())));
      statistics.getChildren().add(StudyTable.of(r));
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
      for (StudyResult.Outlier o : r.outliers()) {
        note("possible outlier in " + o.group() + ": run " + o.runId() + " (" + o.specimen()
            + "), " + m.format(o.value()) + " " + m.unit() + " (Grubbs, α = 0.05)");
      }
      for (LeftOut left : r.leftOut()) {
        note("left out: " + left.line());
      }
    } catch (LoadstoneException e) {
      Label why = LivePane.label("archive-sentence", e.getMessage()
          + (sel.leftOut().isEmpty() ? "" : " — tick a kind above to count it"));
      why.setWrapText(true);
      statistics.getChildren().add(why);
      for (LeftOut left : sel.leftOut()) {
        note("left out: " + left.line());
      }
    }
  }

  private void note(String text) {
    Label l = new Label(text);
    l.setWrapText(true);
    l.getStyleClass().add("archive-note");
    statistics.getChildren().add(l);
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

  ComboBox<Metric> metric() {
    return metric;
  }

  /** @return the box that lets runs of this kind count */
  CheckBox include(LeftOut.Kind kind) {
    return include.get(kind);
  }
}
