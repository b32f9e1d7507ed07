package org.loadstone.ui;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import javafx.application.Platform;
import org.loadstone.archive.JournalRecovery;
import org.loadstone.archive.StoredRun;
import org.loadstone.units.LoadstoneException;

/**
 * The runs a killed or crashed console left as journals, stored at start through the same core
 * service as {@code record} ({@link JournalRecovery}), off the JavaFX thread.
 */
final class LeftJournals {
  private LeftJournals() {}

  /**
   * @param archive the run archive
   * @param done told on the JavaFX thread what to say (the runs recovered, or why they could
   *     not be), or null when there were none
   */
  static void recover(Path archive, Consumer<String> done) {
    Thread t = new Thread(() -> {
      String notice;
      try {
        List<String> names = new ArrayList<>();
        for (StoredRun r : JournalRecovery.recoverAll(archive)) {
          names.add(r.csv().getFileName().toString());
        }
        notice = names.isEmpty() ? null : "recovered an unfinished run from its journal: "
            + String.join(", ", names);
      } catch (LoadstoneException e) {
        notice = ConsoleHints.withHow(e);
      }
      String shown = notice;
      Platform.runLater(() -> done.accept(shown));
    }, "journal recovery");
    t.setDaemon(true);
    t.start();
  }
}
