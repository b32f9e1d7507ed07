package org.loadstone.ui;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.awt.Color;
import java.awt.Paint;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.control.TableView;
import javafx.scene.layout.BackgroundFill;
import javafx.scene.shape.Rectangle;
import javafx.stage.Stage;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.fx.ChartViewer;
import org.jfree.chart.plot.XYPlot;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.loadstone.HangGuard;
import org.loadstone.analysis.stats.GroupSummary;
import org.loadstone.cli.LoadstoneCommand;
import org.loadstone.study.MixedArchive;
import org.loadstone.study.RunMetrics;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The archive review under the console's look, on an archive of three groups (13 runs that
 * count, 6 left out): runs told apart by colour, a group's colour the same in every view, the
 * groups ticked compared as {@code loadstone compare --group} compares them, and the light and
 * dark looks reaching the tables and the charts, remembered for the next start.
 */
@ExtendWith(ApplicationExtension.class)
class ArchiveLookTest {
  private ArchivePane pane;
  private Look look;
  private Path home;
  private Path mixed;

  @Start
  void start(Stage stage) throws Exception {
    home = Files.createTempDirectory("loadstone-look");
    mixed = MixedArchive.write(Files.createTempDirectory("loadstone-mixed"));
    pane = new ArchivePane(mixed);
    look = new Look(home);
    Scene scene = new Scene(look.withControls(pane.root()), 1200, 760);
    look.install(scene);
    stage.setScene(scene);
    stage.show();
    pane.reload();
  }

  private void loaded(FxRobot robot) throws Exception {
    WaitForAsyncUtils.waitFor(HangGuard.S, TimeUnit.SECONDS, () -> robot.lookup("#archive-status")
        .queryAs(Label.class).getText().contains("counted in " + mixed));
    settle();
  }

  /** Two rounds of events: the views are built in one, the look is laid on after its layout. */
  private static void settle() {
    WaitForAsyncUtils.waitForFxEvents();
    WaitForAsyncUtils.waitForFxEvents();
  }

  private static JFreeChart chart(FxRobot robot, String id) {
    return robot.lookup(id).queryAs(ChartViewer.class).getChart();
  }

  /** @return the colour a chart draws the series whose name starts with {@code name} in */
  private static Paint paintOf(JFreeChart chart, String name) {
    XYPlot p = chart.getXYPlot();
    for (int i = 0; i < p.getDataset().getSeriesCount(); i++) {
      if (p.getDataset().getSeriesKey(i).toString().startsWith(name)) {
        return p.getRenderer().getSeriesPaint(i);
      }
    }
    throw new AssertionError("no series " + name);
  }

  private static Color awt(javafx.scene.paint.Paint fx) {
    javafx.scene.paint.Color c = (javafx.scene.paint.Color) fx;
    return new Color((int) Math.round(c.getRed() * 255), (int) Math.round(c.getGreen() * 255),
        (int) Math.round(c.getBlue() * 255));
  }

  @Test
  void picksRunsInColoursOfTheirOwnShownBesideTheirRows(FxRobot robot) throws Exception {
    loaded(robot);
    robot.interact(() -> pane.table().getSelectionModel().selectRange(0, 6));
    settle();
    List<RunMetrics> picked = List.copyOf(pane.table().getSelectionModel().getSelectedItems());
    assertThat(picked).hasSize(6);
    JFreeChart c = chart(robot, "#archive-curves");
    XYPlot p = c.getXYPlot();
    assertThat(p.getDataset().getSeriesCount()).isEqualTo(6);
    Set<Paint> drawn = new HashSet<>();
    for (int i = 0; i < 6; i++) {
      Paint paint = p.getRenderer().getSeriesPaint(i);
      drawn.add(paint);
      // the row's square is the curve's colour as the look draws it
      assertThat(paint).isEqualTo(Theme.DARK.onGround(pane.curveColour(picked.get(i))));
      // and the legend names the specimen, so a curve is matched to its row by name as well
      assertThat(p.getDataset().getSeriesKey(i).toString())
          .startsWith(picked.get(i).metadata().specimen() + " · ");
    }
    assertThat(drawn).hasSize(6); // no two runs alike
    // apart enough to be told apart, not only unequal: every pair differs by a clear step in
    // at least one channel (a difference of 40 of 255 is plainly visible, common practice)
    List<Color> list = drawn.stream().map(Color.class::cast).toList();
    for (int i = 0; i < list.size(); i++) {
      for (int j = i + 1; j < list.size(); j++) {
        Color a = list.get(i);
        Color b = list.get(j);
        assertThat(Math.max(Math.abs(a.getRed() - b.getRed()), Math.max(
            Math.abs(a.getGreen() - b.getGreen()), Math.abs(a.getBlue() - b.getBlue()))))
            .as("%s against %s", a, b).isGreaterThanOrEqualTo(40);
      }
    }
  }

  @Test
  void aGroupHasTheSameColourInEveryViewWhateverIsTicked(FxRobot robot) throws Exception {
    loaded(robot);
    // all 13 runs shown: more than draw in colours of their own, so the curves are by group
    JFreeChart curves = chart(robot, "#archive-curves");
    JFreeChart strip = chart(robot, "#archive-strip");
    for (String g : List.of("balsa", "board", "foam")) {
      Paint inStrip = paintOf(strip, g);
      assertThat(paintOf(curves, g)).as(g).isEqualTo(inStrip);
      Rectangle box = (Rectangle) pane.picker().box(g).getGraphic();
      assertThat(awt(box.getFill())).as(g).isEqualTo(inStrip);
    }
    Paint foam = paintOf(strip, "foam");
    Paint board = paintOf(strip, "board");
    assertThat(foam).isNotEqualTo(board);
    // two groups ticked: each keeps its colour in the new comparison
    robot.interact(() -> pane.picker().pick(List.of("foam", "board")));
    settle();
    JFreeChart two = chart(robot, "#archive-strip");
    assertThat(two.getXYPlot().getDataset().getSeriesCount()).isEqualTo(2);
    assertThat(paintOf(two, "foam")).isEqualTo(foam);
    assertThat(paintOf(two, "board")).isEqualTo(board);
  }

  @Test
  void theGroupsTickedAreComparedAsCompareDoes(FxRobot robot) throws Exception {
    loaded(robot);
    robot.interact(() -> pane.picker().pick(List.of("foam", "board")));
    settle();
    // the command line on the same folder, for the same two groups
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int exit = LoadstoneCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
        "compare", "--archive", mixed.toString(), "--group", "foam,board", "--metric", "peak",
        "--json");
    assertThat(exit).as(err.toString()).isZero();
    String[] lines = out.toString().trim().split("\n");
    JsonNode j = new ObjectMapper().readTree(lines[lines.length - 1]);
    @SuppressWarnings("unchecked")
    TableView<GroupSummary> groups = robot.lookup("#archive-groups").queryAs(TableView.class);
    assertThat(groups.getItems()).extracting(GroupSummary::name)
        .containsExactlyInAnyOrder("foam", "board");
    for (GroupSummary g : groups.getItems()) {
      JsonNode cli = j.get("groups").get(g.name());
      assertThat(g.n()).isEqualTo(cli.get("n").asInt());
      assertThat(g.mean()).isCloseTo(cli.get("mean").asDouble(), within(1e-9));
      assertThat(g.sd().getAsDouble()).isCloseTo(cli.get("sd").asDouble(), within(1e-9));
    }
    assertThat(robot.lookup("#archive-sentence").queryAs(Label.class).getText())
        .isEqualTo(j.get("sentence").asText());
    // two groups: Welch's t-test, where three were compared by ANOVA
    assertThat(robot.lookup("#archive-test").queryAs(Label.class).getText())
        .containsIgnoringCase("welch");
    // the runs left out are those of the two groups, each with its reason, as compare lists them
    assertThat(pane.leftOut().getItems()).hasSize(j.get("left_out").size())
        .allSatisfy(l -> assertThat(l.group()).isIn("foam", "board"))
        .allSatisfy(l -> assertThat(l.reason()).isNotBlank());
  }

  @Test
  void theLookReachesTablesAndChartsAndIsRememberedForTheNextStart(FxRobot robot)
      throws Exception {
    loaded(robot);
    TableView<RunMetrics> table = pane.table();
    Color darkTable = tableGround(table);
    JFreeChart strip = chart(robot, "#archive-strip");
    assertThat(strip.getBackgroundPaint()).isEqualTo(Theme.DARK.ground());

    robot.clickOn("#look-theme");
    settle();
    // the table's ground is the light look's (white), the chart's ground, axes and text too
    assertThat(tableGround(table)).isEqualTo(Color.WHITE).isNotEqualTo(darkTable);
    JFreeChart lightStrip = chart(robot, "#archive-strip");
    assertThat(lightStrip.getBackgroundPaint()).isEqualTo(Theme.LIGHT.ground());
    assertThat(lightStrip.getXYPlot().getBackgroundPaint()).isEqualTo(Theme.LIGHT.ground());
    assertThat(lightStrip.getXYPlot().getRangeAxis().getTickLabelPaint())
        .isEqualTo(Theme.LIGHT.ink());
    assertThat(chart(robot, "#archive-curves").getBackgroundPaint())
        .isEqualTo(Theme.LIGHT.ground());
    // the group squares follow the charts into the new look
    Rectangle box = (Rectangle) pane.picker().box("foam").getGraphic();
    assertThat(awt(box.getFill())).isEqualTo(paintOf(lightStrip, "foam"));

    // larger text: the window's base grows by a step, the chart's text with it
    double before = robot.lookup("#archive-status").queryAs(Label.class).getFont().getSize();
    robot.clickOn("#look-larger");
    settle();
    double after = robot.lookup("#archive-status").queryAs(Label.class).getFont().getSize();
    assertThat(after / before).isCloseTo(1.1, within(0.01));
    assertThat(chart(robot, "#archive-strip").getXYPlot().getRangeAxis().getTickLabelFont()
        .getSize()).isEqualTo(Math.round(13 * 1.1f));

    // a console started afterwards takes the light look at 110 %
    Look next = new Look(home);
    assertThat(next.theme().get()).isEqualTo(Theme.LIGHT);
    assertThat(next.sizePct().get()).isEqualTo(110);
  }

  /** The colour a table's rows are drawn on: the last fill of its background. */
  private static Color tableGround(TableView<?> t) {
    List<BackgroundFill> fills = t.getBackground().getFills();
    return awt(fills.get(fills.size() - 1).getFill());
  }
}
