package org.loadstone.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.loadstone.calibration.MassText;
import org.loadstone.units.LoadstoneException;

/**
 * The weights of a live calibration as the operator lists them: masses separated by commas,
 * semicolons or line breaks, each one or a sum ("1 kg + 500 g"), in any order.
 */
final class LoadList {
  private LoadList() {}

  /**
   * @param text the --loads value, or null
   * @param file the --loads-file, or null
   * @return the loads in kg, ascending
   * @throws LoadstoneException when neither or both are given, the file cannot be read, or an
   *     item is not a mass, is zero, or repeats; the message names the item
   */
  static List<Double> parse(String text, Path file) {
    if ((text == null) == (file == null)) {
      throw new LoadstoneException(text == null
          ? "no weights given: list them with --loads \"0.5 kg, 1 kg, 2 kg, 5 kg\" or"
              + " --loads-file FILE (or fit earlier points with --from FILE)"
          : "--loads and --loads-file both given: use one of them");
    }
    String where;
    List<String> items = new ArrayList<>();
    if (file != null) {
      where = "loads file " + file;
      List<String> lines;
      try {
        lines = Files.readAllLines(file, StandardCharsets.UTF_8);
      } catch (NoSuchFileException e) {
        throw new LoadstoneException(where + " does not exist: check the path");
      } catch (IOException e) {
        throw new LoadstoneException(where + " cannot be read: " + e.getMessage(), e);
      }
      for (String line : lines) {
        int hash = line.indexOf('#');
        items.addAll(split(hash >= 0 ? line.substring(0, hash) : line));
      }
    } else {
      where = "--loads";
      items.addAll(split(text));
    }
    List<Double> out = new ArrayList<>();
    for (int i = 0; i < items.size(); i++) {
      String item = items.get(i);
      double kg;
      try {
        kg = MassText.parse_kg(item);
      } catch (LoadstoneException e) {
        throw new LoadstoneException(where + ", weight " + (i + 1) + ": " + e.getMessage());
      }
      if (kg == 0) {
        throw new LoadstoneException(where + ", weight " + (i + 1) + " ('" + item + "') is"
            + " zero: the zero point is always read, list only the weights");
      }
      for (int j = 0; j < out.size(); j++) {
        if (out.get(j) == kg) {
          throw new LoadstoneException(where + ": '" + item + "' is listed twice: give each"
              + " load once (use --series to repeat the whole set)");
        }
      }
      out.add(kg);
    }
    if (out.isEmpty()) {
      throw new LoadstoneException(where + " lists no weights: give at least two, e.g."
          + " \"1 kg, 2 kg, 5 kg\"");
    }
    out.sort(null);
    return out;
  }

  private static List<String> split(String s) {
    List<String> out = new ArrayList<>();
    for (String part : s.split("[,;\\n]")) {
      if (!part.isBlank()) {
        out.add(part.strip());
      }
    }
    return out;
  }
}
