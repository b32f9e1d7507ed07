package org.loadstone.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;
import org.loadstone.calibration.MassText;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.TextFiles;

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
              + " --loads-file FILE (or fit earlier points with --points FILE)"
          : "--loads and --loads-file both given: use one of them");
    }
    if (text != null) {
      return MassText.parseList_kg(text, "--loads");
    }
    String where = "loads file " + file;
    List<String> lines = TextFiles.read(file, "loads file").lines().toList();
    StringBuilder all = new StringBuilder();
    for (String line : lines) {
      int hash = line.indexOf('#');
      all.append(hash >= 0 ? line.substring(0, hash) : line).append('\n');
    }
    return MassText.parseList_kg(all.toString(), where);
  }
}
