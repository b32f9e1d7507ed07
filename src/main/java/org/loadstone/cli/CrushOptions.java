package org.loadstone.cli;

import org.loadstone.analysis.AnalysisSettings;
import org.loadstone.analysis.AnalysisSettings.CrushWindow;
import picocli.CommandLine.Option;

/** The stroke the crush figures are taken over, shared by {@code analyze} and {@code record}. */
final class CrushOptions {
  @Option(names = "--crush-from-mm", paramLabel = "MM",
      description = "Mean crush force, crush-force efficiency and crush energy from this "
          + "displacement (default: 0; a crush run takes the whole stroke).")
  Double fromMm;

  @Option(names = "--crush-to-mm", paramLabel = "MM",
      description = "Crush figures up to this displacement (default: the end of the stroke).")
  Double toMm;

  /** @return the settings with the chosen stroke, unchanged when none is given */
  AnalysisSettings apply(AnalysisSettings settings) {
    if (fromMm == null && toMm == null) {
      return settings;
    }
    double from = fromMm == null ? 0 : fromMm;
    return settings.withCrushWindow(
        toMm == null ? CrushWindow.toEnd(from) : new CrushWindow(from, toMm));
  }
}
