package org.loadstone.files;

import java.nio.file.Path;
import org.loadstone.units.LoadstoneException;

/** A file was not written because its name is taken; Loadstone never replaces a file. */
public final class FileExistsException extends LoadstoneException {
  private static final long serialVersionUID = 1L;
  private final transient Path file;

  /**
   * @param file the name that exists
   * @param what what was to be written, e.g. "PDF report"
   */
  public FileExistsException(Path file, String what) {
    super(what + " " + file + " already exists and Loadstone never overwrites a file: choose"
        + " another name or move the old file away");
    this.file = file;
  }

  /** @return the name that exists */
  public Path file() {
    return file;
  }
}
