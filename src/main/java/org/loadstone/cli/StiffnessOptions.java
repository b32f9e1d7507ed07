package org.loadstone.cli;

import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.AnalysisSettings.StiffnessBounds;
import org.loadstone.units.LoadstoneException;
import picocli.CommandLine.Option;

/** How the stiffness is taken, shared by {@code analyze} and {@code record}. */
final class StiffnessOptions {
  @Option(names = "--stiffness-from-n", paramLabel = "N",
      description = "Fit the stiffness over every sample between this force and --stiffness-to-n "
          + "instead of searching.")
  Double fromN;

  @Option(names = "--stiffness-to-n", paramLabel = "N", description = "Upper force of the band.")
  Double toN;

  @Option(names = "--stiffness-band-pct", paramLabel = "LOW-PCT,HIGH-PCT", split = ",",
      description = "Fit the stiffness between two percentages of the peak force, e.g. 10,40.")
  double[] bandPct;

  @Option(names = "--stiffness-from-mm", paramLabel = "MM",
      description = "Fit the stiffness between two displacements from the first sample (with "
          + "--stiffness-to-mm).")
  Double fromMm;

  @Option(names = "--stiffness-to-mm", paramLabel = "MM",
      description = "Upper displacement of the band, mm.")
  Double toMm;

  @Option(names = "--stiffness-precision-pct", paramLabel = "PCT", defaultValue = "3",
      description = "The automatic stiffness must be known to within this many per cent (95 %% interval), else it is "
          + "refused with the reason (default: ${DEFAULT-VALUE}).")
  double precisionPct;

  /**
   * @return the settings with the chosen stiffness method
   * @throws LoadstoneException when a band is half given, or more than one band is given
   */
  AnalysisSettings apply(AnalysisSettings settings) {
    if ((fromN == null) != (toN == null)) {
      throw new LoadstoneException("--stiffness-from-n and --stiffness-to-n go together; give "
          + "both or neither.");
    }
    if ((fromMm == null) != (toMm == null)) {
      throw new LoadstoneException("--stiffness-from-mm and --stiffness-to-mm go together; give "
          + "both or neither.");
    }
    if (bandPct != null && bandPct.length != 2) {
      throw new LoadstoneException("--stiffness-band-pct takes two percentages of the peak, "
          + "e.g. 10,40.");
    }
    int bands = (fromN != null ? 1 : 0) + (fromMm != null ? 1 : 0) + (bandPct != null ? 1 : 0);
    if (bands > 1) {
      throw new LoadstoneException("Give one stiffness band: forces (--stiffness-from-n/-to-N), "
          + "percentages of the peak (--stiffness-band-pct) or displacements "
          + "(--stiffness-from-mm/-to-mm).");
    }
    AnalysisSettings s = settings.withStiffnessPrecision(precisionPct / 100.0);
    if (fromN != null) {
      return s.withStiffnessBounds(StiffnessBounds.force_N(fromN, toN));
    }
    if (bandPct != null) {
      return s.withStiffnessBounds(StiffnessBounds.peakFraction(bandPct[0] / 100, bandPct[1] / 100));
    }
    if (fromMm != null) {
      return s.withStiffnessBounds(StiffnessBounds.displacement_mm(fromMm, toMm));
    }
    return s;
  }
}
