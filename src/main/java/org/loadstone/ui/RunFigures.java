package org.loadstone.ui;

import java.nio.file.Path;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.function.Consumer;
import java.util.function.Supplier;
import javafx.application.Platform;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.VBox;
import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.archive.Run;
import org.loadstone.archive.RunReader;
import org.loadstone.study.RunMetrics;
import org.loadstone.units.ForceUnit;
import org.loadstone.units.LoadstoneException;

/**
 * The console's post-run figures: the stored run read back from the archive and shown as tiles (a
 * name over a large value: peak, break, stiffness, energy, bending or compression stresses, the
 * mean crush force of a crush run, per gram). Thin: the figures are {@link RunMetrics}'; {@link RunPanel} says when a run is stored.
 */
final class RunFigures {
  /** The last run's figures, as tiles. */
  private final FlowPane figures = new FlowPane(28, 8);
  /** The run's curve with its marks and stiffness window, with a band of one's own. */
  private final StiffnessView stiffness = new StiffnessView(this::refit);
  /** The run shown, read back once; null until one is. */
  private volatile Run run;
  /** Forces in this unit. */
  private volatile ForceUnit unit = ForceUnit.N;
  /** The figures shown, null while none are. */
  private RunMetrics shown;
  /** Reading and analysing a stored run: a bar through its steps and what it is doing. */
  private final ProgressBar progress = new ProgressBar(0);
  private final Label doing = LivePane.label("analysing-line", "");
  private final VBox analysing = new VBox(4, doing, progress);

  RunFigures() {
    figures.setId("run-figures");
    figures.getStyleClass().add("run-figures");
    analysing.setId("analysing");
    progress.setId("analysing-progress");
    progress.setPrefWidth(320);
    showFigures(false);
  }

  /** Shows forces in {@code u} (the figures shown are drawn again in it). */
  void setUnit(ForceUnit u) {
    unit = u;
    RunMetrics m = shown;
    if (m != null) {
      later(() -> {
        StiffnessView.Drawing d = StiffnessView.prepare(m, u);
        return () -> show(d);
      });
    }
  }

  /** @return the post-run chart */
  StiffnessView stiffnessView() {
    return stiffness;
  }

  /** @return the unit the figures are shown in */
  ForceUnit unit() {
    return unit;
  }

  /** The reading and analysing of a run in steps: shown at once, updated from the worker. */
  private void step(double done, String what) {
    Platform.runLater(() -> {
      if (!figures.getChildren().contains(analysing)) {
        figures.getChildren().setAll(analysing);
        showFigures(true);
      }
      progress.setProgress(done);
      doing.setText(what);
    });
  }

  /** The tiles, for a place of their own (empty until a run is stored). */
  FlowPane node() {
    return figures;
  }

  /**
   * Reads the stored run back and shows its figures; the reading is off the JavaFX thread.
   *
   * @param csv the stored run
   * @param failed told on the JavaFX thread why the run could not be analysed
   */
  void analyse(Path csv, Consumer<String> failed) {
    shown = null;
    step(ProgressBar.INDETERMINATE_PROGRESS, "analysing… reading the stored run");
    later(() -> {
      try {
        Run r = RunReader.read(csv);
        step(1 / 3.0, String.format(Locale.ROOT, "analysing… %,d samples: peak, break, "
            + "stiffness, energy", r.data().size()));
        RunMetrics m = RunMetrics.of(r.metadata(), r.data());
        run = r;
        step(2 / 3.0, "analysing… drawing the curve");
        StiffnessView.Drawing d = StiffnessView.prepare(m, unit);
        return () -> show(d);
      } catch (LoadstoneException e) {
        return () -> {
          clear();
          failed.accept(e.getMessage());
        };
      }
    });
  }

  /**
   * Shows a run already read (the archive's, or a test's), analysed with default settings.
   *
   * @param r the run
   */
  void analyse(Run r) {
    run = r;
    refit(null);
  }

  /**
   * Analyses the shown run again with a stiffness band (or the automatic search) and shows the
   * figures; a band the run cannot give is refused with the reason under the chart.
   *
   * @param band a force band, or null for the automatic search
   */
  void refit(AnalysisSettings.StiffnessBounds band) {
    Run r = run;
    if (r == null) {
      return;
    }
    later(() -> {
      try {
        RunMetrics m = RunMetrics.of(r.metadata(), r.data(),
            AnalysisSettings.DEFAULTS.withStiffnessBounds(band));
        StiffnessView.Drawing d = StiffnessView.prepare(m, unit);
        return () -> show(d);
      } catch (LoadstoneException e) {
        return () -> stiffness.refuse(e.getMessage());
      }
    });
  }

  /** Works off the JavaFX thread, then runs what the work returns on it. */
  private static void later(Supplier<Runnable> work) {
    Thread t = new Thread(() -> Platform.runLater(work.get()), "post-run analysis");
    t.setDaemon(true);
    t.start();
  }

  /** Empties the tiles and hides them until the next run is shown. */
  void clear() {
    shown = null;
    figures.getChildren().clear();
    showFigures(false);
  }

  private void showFigures(boolean on) {
    figures.setVisible(on);
    figures.setManaged(on);
  }

  private void show(StiffnessView.Drawing d) {
    RunMetrics m = d.metrics();
    ForceUnit u = d.unit();
    shown = m;
    figures.getChildren().clear();
    showFigures(true);
    var r = m.analysis();
    tile("peak", fmt(r.peakForce_N(), u), at(r.displacementAtPeak_mm()));
    r.breakPoint().ifPresent(b -> tile("break", fmt(b.force_N(), u),
        at(r.displacementAtBreak_mm())));
    tile("stiffness", r.stiffness().map(s -> fmt(u.fromNewtons(s.slope_N_per_mm()),
        u.symbol() + "/mm")).orElse("—"),
        r.stiffness().map(s -> String.format(Locale.ROOT, "R² %.4f", s.rSquared())).orElse(""));
    if (r.breakPoint().isPresent()) {
      tile("energy", opt(r.energyToBreak_J(), "J"), "to break · " + opt(r.energyToPeak_J(), "J")
          + " to peak");
    } else { // a crush run (no break: it ends by its own rule) or a run that did not break
      tile("energy", opt(r.energyToPeak_J(), "J"), "to peak · no break, ended "
          + m.metadata().cause().wireName());
    }
    if (m.flexuralStressAtPeak_MPa().isPresent()) {
      tile("flexural stress", opt(m.flexuralStressAtPeak_MPa(), "MPa"), "at peak · modulus "
          + opt(m.flexuralModulus_MPa(), "MPa"));
    }
    if (m.coreShearStressAtPeak_MPa().isPresent()) {
      tile("core shear", opt(m.coreShearStressAtPeak_MPa(), "MPa"), "at peak · facing "
          + opt(m.facingStressAtPeak_MPa(), "MPa"));
    }
    if (m.compressionStressAtPeak_MPa().isPresent()) {
      tile("compression", opt(m.compressionStressAtPeak_MPa(), "MPa"), "stress at peak");
    }
    r.crush().ifPresent(c -> tile("mean crush", fmt(c.meanForce_N(), u),
        String.format(Locale.ROOT, "efficiency %.2f · %s over %.1f–%.1f mm", c.efficiency(),
            fmt(c.energy_J(), "J"), c.from_mm(), c.to_mm())
            + (m.specificCrushEnergy_J_per_g().isPresent()
                ? " · " + opt(m.specificCrushEnergy_J_per_g(), "J/g") : "")));
    if (m.specificPeak_N_per_g().isPresent()) {
      tile("per gram", fmt(u.fromNewtons(m.specificPeak_N_per_g().getAsDouble()),
          u.symbol() + "/g"), r.breakPoint().isPresent()
          ? opt(m.specificEnergyToBreak_J_per_g(), "J/g") + " to break"
          : opt(m.specificEnergyToPeak_J_per_g(), "J/g") + " to peak");
    }
    figures.getChildren().add(stiffness.node());
    stiffness.show(d);
    if (m.metadata().amendments().any()) {
      Label amended = LivePane.label("run-amended", m.metadata().amendments().summary());
      amended.setWrapText(true);
      figures.getChildren().add(amended);
    }
    if (!m.notes().isEmpty()) {
      Label note = LivePane.label("run-note", "note: " + m.notes().get(0));
      note.setWrapText(true);
      figures.getChildren().add(note);
    }
  }

  private void tile(String name, String value, String detail) {
    Label k = new Label(name.toUpperCase(Locale.ROOT));
    k.getStyleClass().add("figure-name");
    Label v = new Label(value);
    v.getStyleClass().add("figure-value");
    v.setId("figure-" + name.replace(' ', '-'));
    Label d = new Label(detail);
    d.getStyleClass().add("figure-detail");
    figures.getChildren().add(new VBox(2, k, v, d));
  }

  private static String at(OptionalDouble travel_mm) {
    return travel_mm.isPresent()
        ? String.format(Locale.ROOT, "at %.2f mm", travel_mm.getAsDouble()) : "";
  }

  private static String opt(OptionalDouble v, String unit) {
    return v.isPresent() ? fmt(v.getAsDouble(), unit) : "—";
  }

  /** A force in N shown in {@code u}, e.g. {@code 0.412 kN}. */
  static String fmt(double v_N, ForceUnit u) {
    return fmt(u.fromNewtons(v_N), u.symbol());
  }

  static String fmt(double v, String unit) {
    double a = Math.abs(v);
    String f = a >= 1000 ? "%.0f" : a >= 100 ? "%.1f" : a >= 1 ? "%.2f" : "%.3g";
    return String.format(Locale.ROOT, f, v) + " " + unit;
  }
}
