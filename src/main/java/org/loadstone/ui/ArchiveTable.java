package org.loadstone.ui;

import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.function.Function;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.scene.control.Label;
import javafx.scene.control.SelectionMode;
import javafx.scene.control.TableCell;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.shape.Rectangle;
import org.loadstone.study.ArchiveRuns;
import org.loadstone.study.LeftOut;
import org.loadstone.study.Metric;
import org.loadstone.study.RunMetrics;

/**
 * The archive review's two lists: the runs that count (with the colour of each run's curve and
 * of its group, and the figures a batch is judged by) and the runs left out with the reason.
 * Figures are formatted by the metric catalogue ({@link Metric}), as {@code compare} prints them.
 */
final class ArchiveTable {
  private ArchiveTable() {}

  private static final DateTimeFormatter WHEN =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm", Locale.ROOT).withZone(ZoneId.systemDefault());

  /**
   * @param curveColour the colour of a run's curve in the chart shown, null when not drawn
   * @param groupColour the colour of a group
   * @return the table of counted runs (id {@code archive-runs})
   */
  static TableView<RunMetrics> runs(Function<RunMetrics, java.awt.Color> curveColour,
      Function<String, java.awt.Color> groupColour) {
    TableView<RunMetrics> table = new TableView<>();
    table.setId("archive-runs");
    table.getSelectionModel().setSelectionMode(SelectionMode.MULTIPLE);
    TableColumn<RunMetrics, String> curve = column("", m -> ""); // the square says it all
    curve.setId("archive-curve-colour");
    curve.setCellFactory(c -> swatchCell(null, curveColour));
    curve.setPrefWidth(34);
    table.getColumns().add(curve);
    table.getColumns().add(column("specimen", m -> m.metadata().specimen()));
    TableColumn<RunMetrics, String> group =
        column("group", m -> ArchiveRuns.groupName(m.metadata().group()));
    group.setId("archive-group-colour");
    group.setCellFactory(c -> swatchCell(Function.identity(),
        m -> groupColour.apply(ArchiveRuns.groupName(m.metadata().group()))));
    table.getColumns().add(group);
    TableColumn<RunMetrics, String> cause =
        column("ended by", m -> m.metadata().cause().wireName().replace('-', ' '));
    cause.setId("archive-cause");
    table.getColumns().add(cause);
    table.getColumns().add(figure("mass g", "archive-mass", m -> m.metadata().mass_g() == null
        ? "—" : RunFigures.fmt(m.metadata().mass_g(), "").strip()));
    table.getColumns().add(figure("peak", Metric.PEAK, "archive-peak"));
    table.getColumns().add(figure("per gram", Metric.SPECIFIC_PEAK, "archive-per-gram"));
    table.getColumns().add(figure("stiffness", Metric.STIFFNESS, "archive-stiffness"));
    TableColumn<RunMetrics, String> started =
        column("started", m -> WHEN.format(m.metadata().startedAt()));
    started.setPrefWidth(130);
    table.getColumns().add(started);
    TableColumn<RunMetrics, String> amended = column("record", m -> m.metadata().amendments()
        .changes().stream().map(c -> c.field() + " " + c.now()).reduce((a, b) -> a + ", " + b)
        .map(t -> "amended: " + t).orElse(""));
    amended.setId("archive-amended");
    table.getColumns().add(amended);
    table.setPlaceholder(new Label("no runs here"));
    // each column as wide as its heading and figures need; a narrow pane scrolls sideways
    // rather than cutting every figure short
    return table;
  }

  /** @return the list of runs left out (id {@code archive-left-out}): run, specimen, group, why */
  static TableView<LeftOut> leftOut() {
    TableView<LeftOut> t = new TableView<>();
    t.setId("archive-left-out");
    TableColumn<LeftOut, String> run = new TableColumn<>("run");
    run.setCellValueFactory(f -> new ReadOnlyStringWrapper(f.getValue().runId()));
    TableColumn<LeftOut, String> specimen = new TableColumn<>("specimen");
    specimen.setCellValueFactory(f -> new ReadOnlyStringWrapper(f.getValue().specimen()));
    TableColumn<LeftOut, String> group = new TableColumn<>("group");
    group.setCellValueFactory(f -> new ReadOnlyStringWrapper(f.getValue().group()));
    TableColumn<LeftOut, String> why = new TableColumn<>("why");
    why.setId("archive-left-out-why");
    why.setCellValueFactory(f -> new ReadOnlyStringWrapper(f.getValue().reason()));
    why.setPrefWidth(420);
    t.getColumns().add(run);
    t.getColumns().add(specimen);
    t.getColumns().add(group);
    t.getColumns().add(why);
    t.setPlaceholder(new Label("every run of the groups shown counts"));
    t.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);
    return t;
  }

  /** A figure's column, headed by a short name and the figure's unit. */
  private static TableColumn<RunMetrics, String> figure(String name, Metric m, String id) {
    return figure(name + " " + m.unit(), id, r -> m.format(m.of(r)));
  }

  private static TableColumn<RunMetrics, String> figure(String name, String id,
      Function<RunMetrics, String> value) {
    TableColumn<RunMetrics, String> c = column(name, value);
    c.setId(id);
    c.setStyle("-fx-alignment: CENTER-RIGHT;");
    c.setPrefWidth(Math.max(70, 8.5 * name.length()));
    return c;
  }

  private static TableColumn<RunMetrics, String> column(String name,
      Function<RunMetrics, String> value) {
    TableColumn<RunMetrics, String> c = new TableColumn<>(name);
    c.setCellValueFactory(f -> new ReadOnlyStringWrapper(value.apply(f.getValue())));
    return c;
  }

  /**
   * A cell with a small square of a colour before its text (or alone).
   *
   * @param text the cell's text from its value, or null for none
   */
  private static TableCell<RunMetrics, String> swatchCell(Function<String, String> text,
      Function<RunMetrics, java.awt.Color> colour) {
    return new TableCell<>() {
      @Override
      protected void updateItem(String item, boolean empty) {
        super.updateItem(item, empty);
        RunMetrics m = empty || getTableRow() == null ? null : getTableRow().getItem();
        setText(m == null || text == null ? null : text.apply(item));
        java.awt.Color c = m == null ? null : colour.apply(m);
        setGraphic(c == null ? null : swatch(c, this));
      }
    };
  }

  /** A square of the colour as the look draws it on the charts of the node's window. */
  static Rectangle swatch(java.awt.Color c, javafx.scene.Node in) {
    Theme t = Look.themeOf(in);
    java.awt.Color shown = t == null ? c : t.onGround(c);
    Rectangle r = new Rectangle(14, 14, javafx.scene.paint.Color.rgb(shown.getRed(),
        shown.getGreen(), shown.getBlue()));
    r.getStyleClass().add("swatch");
    return r;
  }
}
