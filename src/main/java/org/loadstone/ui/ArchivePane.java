package org.loadstone.ui;

import java.awt.Color;
import java.nio.file.Path;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import javafx.application.Platform;
import javafx.collections.FXCollections;
import javafx.collections.ListChangeListener;
import javafx.geometry.Insets;
import javafx.geometry.Orientation;
import javafx.geometry.Pos;
import javafx.scene.Parent;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.SplitPane;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.fx.ChartViewer;
import org.loadstone.report.Charts;
import org.loadstone.report.GroupColours;
import org.loadstone.report.PdfReport;
import org.loadstone.report.RunCurves;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.GroupStudy;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;
import org.loadstone.study.RunSelection;
import org.loadstone.study.Selection;
import org.loadstone.units.LoadstoneException;

/**
 * Reviewing the archive after a day of testing: the runs of a folder, their curves overlaid (the
 * runs picked, or all shown), and the groups ticked compared on a chosen figure — means with
 * their scatter, the test, the plain sentence and the sample-size advice, as {@code loadstone
 * compare} and the group report give them. Which runs count is the one rule of
 * {@link RunSelection}: by default broken, calibrated runs; check boxes let the other kinds in,
 * and the runs left out are listed with the reason. A group keeps its colour in every view
 * ({@link GroupColours#of(Selection)}); up to {@link RunCurves#MAX_RUNS} curves are drawn each in
 * its own colour, shown beside its row. Thin: figures come from {@link GroupStudy}, charts from
 * {@link Charts} and {@link RunCurves}.
 */
final class ArchivePane {
  private final BorderPane root = new BorderPane();
  private final TextField folder = new TextField();
  private final ComboBox<Metric> metric = new ComboBox<>();
  private final Map<LeftOut.Kind, CheckBox> include = new EnumMap<>(LeftOut.Kind.class);
  private final GroupPicker picker = new GroupPicker(this::showRuns);
  /** The colour of each run's curve in the chart shown, by run id. */
  private final Map<String, Color> curveColours = new HashMap<>();
  private GroupColours colours = GroupColours.of(List.of());
  private final TableView<RunMetrics> table = ArchiveTable.runs(
      m -> curveColours.get(m.metadata().runId()), g -> colours.colour(g));
  private final TableView<LeftOut> leftOut = ArchiveTable.leftOut();
  private final BorderPane curves = new BorderPane();
  private final ArchiveStudyView study = new ArchiveStudyView();
  private final Label status = LivePane.label("archive-status", "");
  /** The folder's runs, analysed; null before the first load. */
  private ArchiveRuns archive;
  /** Every run that counts under the boxes ticked, all groups; null before a folder is read. */
  private Selection selection;
  /** The runs of the groups ticked, as last shown; null when none are. */
  private Selection current;
  /** Readings of the folder asked for, on the JavaFX thread: only the last one is shown. */
  private long reloads;

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
        LivePane.label("metric-caption", "compare"), metric, report);
    bar.setAlignment(Pos.CENTER_LEFT);
    bar.getStyleClass().add("archive-bar");
    javafx.scene.layout.FlowPane counts = new javafx.scene.layout.FlowPane(10, 4,
        LivePane.label("include-caption",
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
    counts.setPrefWrapLength(900);
    root.setTop(new VBox(bar, counts, picker.node()));

    table.getSelectionModel().getSelectedItems().addListener(
        (ListChangeListener<RunMetrics>) c -> showCurves());
    leftOut.setPrefHeight(150);
    SplitPane lists = new SplitPane(table, leftOut);
    lists.setOrientation(Orientation.VERTICAL);
    lists.setDividerPositions(0.72);
    curves.getStyleClass().add("archive-curves");
    SplitPane right = new SplitPane(curves, study.node());
    right.setOrientation(Orientation.VERTICAL);
    right.setDividerPositions(0.55);
    SplitPane split = new SplitPane(lists, right);
    split.setDividerPositions(0.45);
    root.setCenter(split);
    status.setWrapText(true);
    HBox bottom = new HBox(status);
    bottom.getStyleClass().add("bottom-bar");
    root.setBottom(bottom);
    BorderPane.setMargin(split, new Insets(8));
    // a change of look: the colour squares follow the charts
    root.sceneProperty().addListener((o, was, now) -> {
      if (now != null && now.getRoot() != null) {
        now.getRoot().getStyleClass().addListener((ListChangeListener<String>) c -> {
          table.refresh();
          picker.repaint();
        });
      }
    });
  }

  /** Reads the folder and analyses every run not analysed before, off the JavaFX thread. */
  void reload() {
    Path dir = Path.of(folder.getText().trim());
    ArchiveRuns before = archive;
    long asked = ++reloads; // a slower, older reading must not replace this one when it ends
    status.setText("reading " + dir + " …");
    Thread t = new Thread(() -> {
      try {
        if (!java.nio.file.Files.isDirectory(dir)) {
          Platform.runLater(() -> {
            if (asked != reloads) {
              return;
            }
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
          if (asked == reloads) {
            archive = runs;
            select();
          }
        });
      } catch (LoadstoneException e) {
        Platform.runLater(() -> {
          if (asked == reloads) {
            status.setText(ConsoleHints.withHow(e));
          }
        });
      }
    }, "archive review");
    t.setDaemon(true);
    t.start();
  }

  /** @return the selection settings the boxes give (every group; the groups are picked after) */
  RunSelection settings() {
    List<LeftOut.Kind> kinds = new ArrayList<>();
    include.forEach((k, box) -> {
      if (box.isSelected()) {
        kinds.add(k);
      }
    });
    return RunSelection.DEFAULT.admitting(kinds);
  }

  /** Applies the kind boxes to the loaded runs and lists the archive's groups. */
  private void select() {
    if (archive == null) {
      selection = null;
      picker.show(List.of(), colours);
      showRuns();
      return;
    }
    selection = archive.select(settings());
    colours = GroupColours.of(selection);
    picker.show(selection.groupsInArchive(), colours);
    showRuns();
  }

  /**
   * The runs the group boxes pick, as {@code compare} selects them for the same groups: every
   * group when all are ticked, the groups ticked when two or more are, one group's runs alone
   * when one is; null before a folder is read or when no group is ticked.
   */
  private Selection shown() {
    if (selection == null) {
      return null;
    }
    List<String> ticked = picker.ticked();
    if (picker.all()) {
      return selection;
    }
    if (ticked.isEmpty()) {
      return null;
    }
    if (ticked.size() == 1) {
      return selection.onlyGroup(ticked.get(0));
    }
    return archive.select(settings().withGroups(ticked));
  }

  private void showRuns() {
    Selection sel = shown();
    current = sel;
    table.setItems(FXCollections.observableArrayList(sel == null ? List.of() : sel.runs()));
    showCurves();
    compare();
    if (sel == null) {
      return;
    }
    status.setText(sel.counted() + " runs counted in " + sel.folder()
        + (sel.leftOut().isEmpty() ? "" : " · " + GroupStudy.leftOutSummary(sel.leftOut())
            + ", listed under the runs with the reason")
        + (selection != null && picker.ticked().isEmpty() ? " · no group ticked" : ""));
  }

  /**
   * The curves of the runs picked in the table, or of all shown when none is picked: each in its
   * own colour up to {@link RunCurves#MAX_RUNS} runs, by group beyond.
   */
  private void showCurves() {
    List<RunMetrics> picked = List.copyOf(table.getSelectionModel().getSelectedItems());
    List<RunMetrics> drawn = picked.isEmpty() ? List.copyOf(table.getItems()) : picked;
    curveColours.clear();
    if (drawn.isEmpty()) {
      curves.setCenter(new Label(selection != null && picker.ticked().isEmpty()
          ? "tick a group above" : "no runs to draw"));
      table.refresh();
      return;
    }
    String title = picked.isEmpty() ? "all runs shown" : drawn.size() + " runs picked";
    JFreeChart chart;
    if (drawn.size() <= RunCurves.MAX_RUNS) {
      chart = RunCurves.of(title, drawn);
      for (int i = 0; i < drawn.size(); i++) {
        curveColours.put(drawn.get(i).metadata().runId(), RunCurves.colour(i));
      }
    } else {
      Map<String, List<RunMetrics>> byGroup = new java.util.TreeMap<>();
      for (RunMetrics m : drawn) {
        String g = ArchiveRuns.groupName(m.metadata().group());
        byGroup.computeIfAbsent(g, k -> new ArrayList<>()).add(m);
        curveColours.put(m.metadata().runId(), colours.colour(g));
      }
      chart = Charts.overlay(title, byGroup, colours);
    }
    ChartViewer v = new ChartViewer(chart);
    v.setId("archive-curves");
    curves.setCenter(v);
    table.refresh();
  }

  /** Compares the groups shown on the chosen figure and lists the runs left out. */
  private void compare() {
    List<LeftOut> left = study.show(current, metric.getValue(), colours);
    leftOut.setItems(FXCollections.observableArrayList(left));
  }

  /**
   * Writes a PDF into the archive folder (a new file, named by the time): the report of the run
   * picked when one is, otherwise the comparison of the groups shown.
   */
  private void writeReport() {
    List<RunMetrics> picked = List.copyOf(table.getSelectionModel().getSelectedItems());
    Selection groups = current;
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
          throw new LoadstoneException("no runs to report: load a folder and tick a group");
        } else {
          PdfReport.writeGroups("Comparison of " + String.join(", ", groups.groups().keySet()),
              GroupStudy.compareEach(groups, PdfReport.DEFAULT_METRICS,
                  ArchiveStudyView.TARGET_DIFFERENCE), file);
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

  TableView<RunMetrics> table() {
    return table;
  }

  TableView<LeftOut> leftOut() {
    return leftOut;
  }

  GroupPicker picker() {
    return picker;
  }

  ComboBox<Metric> metric() {
    return metric;
  }

  /** @return the colours of the archive's groups as last read */
  GroupColours colours() {
    return colours;
  }

  /** @return the colour of a run's curve in the chart shown, or null when it is not drawn */
  Color curveColour(RunMetrics m) {
    return curveColours.get(m.metadata().runId());
  }

  /** @return the box that lets runs of this kind count */
  CheckBox include(LeftOut.Kind kind) {
    return include.get(kind);
  }
}
