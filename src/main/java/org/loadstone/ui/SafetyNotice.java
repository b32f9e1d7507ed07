package org.loadstone.ui;

import java.nio.file.Files;
import java.nio.file.Path;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;

/** The safety cautions shown on first start, and whether this user has acknowledged them. */
public final class SafetyNotice {
  /** The cautions, as shown in the window and in the README. */
  public static final String TEXT =
      "Brittle specimens can fail explosively and throw fragments: use a shield and eye "
          + "protection. Keep hands clear of the press. Never load a cell beyond its rated "
          + "capacity; the software's overload stop does not replace the press's own mechanical "
          + "limits or an emergency stop. Loadstone's figures are engineering estimates, not an "
          + "accredited calibration or certification; follow your lab's rules, local codes and "
          + "licensed practice.";

  private final Path marker;

  /** @param home Loadstone's settings folder (e.g. {@code ~/.loadstone}) */
  public SafetyNotice(Path home) {
    this.marker = home.resolve("safety-acknowledged");
  }

  /** @return the settings folder: system property {@code loadstone.home}, else {@code ~/.loadstone} */
  public static Path defaultHome() {
    String h = System.getProperty("loadstone.home");
    return h != null ? Path.of(h) : Path.of(System.getProperty("user.home"), ".loadstone");
  }

  /** @return whether the notice still has to be shown */
  public boolean needed() {
    return !Files.exists(marker);
  }

  /** Records that the user has read the notice; a failure to write only means it shows again. */
  public void acknowledge() {
    try {
      FilePublisher.publish(marker, "safety acknowledgement",
          (java.time.Instant.now() + "\n").getBytes(java.nio.charset.StandardCharsets.UTF_8));
    } catch (LoadstoneException e) {
      // already acknowledged, or shown again next start; nothing else depends on it
    }
  }
}
