package org.loadstone.acquire;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.stream.Stream;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.RunReader;
import org.loadstone.units.LoadstoneException;

/**
 * The last tare of a device as the archive remembers it: the zero of the newest run recorded on
 * the same port from a device of the same name. For a command that connects afresh for each run,
 * this is the tare the zero check compares with.
 */
public final class LastTare {
  /** How many of the newest runs are looked at. */
  static final int LOOK_BACK = 50;

  private LastTare() {}

  /**
   * @param archive the archive folder (need not exist)
   * @param port the device's port, as stored in a run's {@code device.port}
   * @param deviceName the device's name from its identity, or null when it sent none
   * @return the newest matching run's zero and its start, or null when there is none
   */
  public static ZeroCheck.Tare fromArchive(Path archive, String port, String deviceName) {
    if (!Files.isDirectory(archive)) {
      return null;
    }
    List<Path> newest;
    try (Stream<Path> s = Files.list(archive)) {
      // run ids begin with their time, so the names sort by age
      newest = s.filter(p -> p.getFileName().toString().endsWith(".json"))
          .sorted(Comparator.comparing((Path p) -> p.getFileName().toString()).reversed())
          .limit(LOOK_BACK).toList();
    } catch (IOException e) {
      return null; // no tare to compare with: the run itself still checks its folder
    }
    for (Path json : newest) {
      RunMetadata m;
      try {
        m = RunReader.readMetadata(json);
      } catch (LoadstoneException unreadable) {
        continue; // listed by the archive's own commands; not a tare to compare with
      }
      if (port.equals(m.device().get("port"))
          && Objects.equals(deviceName, m.device().get("name"))) {
        return new ZeroCheck.Tare(m.zeroOffset_counts(), m.startedAt());
      }
    }
    return null;
  }
}
