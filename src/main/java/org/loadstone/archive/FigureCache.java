package org.loadstone.archive;

import java.nio.file.Path;
import java.util.Map;

/**
 * Figures computed from runs, kept between calls so that a run is analysed once: the archive
 * index ({@link RunIndex}) keeps them keyed by the run's content (the SHA-256 of its sidecar and
 * of its samples) and a settings key chosen by the caller (the analysis settings, the analysis
 * code, the calibration). The figures themselves are text the caller writes and reads back; a
 * run whose files changed since its figures were stored gets none.
 */
public interface FigureCache {
  /** A cache that keeps nothing: every run is analysed again. */
  FigureCache NONE = new FigureCache() {
    @Override
    public Map<Path, String> load(String settingsKey) {
      return Map.of();
    }

    @Override
    public void store(String settingsKey, Map<Path, String> figures) {}
  };

  /**
   * @param settingsKey what the figures were computed with, not null
   * @return sidecar file → figures stored under {@code settingsKey}, for the runs whose files
   *     are unchanged since; never null
   */
  Map<Path, String> load(String settingsKey);

  /**
   * Keeps figures for later calls; a failure to keep them is not an error (they are computed
   * again next time).
   *
   * @param settingsKey what the figures were computed with, not null
   * @param figures sidecar file → figures, of runs listed by the same look at the archive
   */
  void store(String settingsKey, Map<Path, String> figures);
}
