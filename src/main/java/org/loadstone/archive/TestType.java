package org.loadstone.archive;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/** The kind of test a run is. */
public enum TestType {
  THREE_POINT_BEND("three-point"),
  FOUR_POINT_BEND("four-point"),
  COMPRESSION("compression"),
  TENSION("tension"),
  /**
   * progressive crushing (a tube, a honeycomb, a crash absorber): the run goes on through the
   * load drops to a travel, force or time limit, and is read by its mean crush force
   */
  CRUSH("crush");

  private final String wireName;

  TestType(String wireName) {
    this.wireName = wireName;
  }

  /** @return the stored and command-line name, e.g. {@code three-point} */
  public String wireName() {
    return wireName;
  }

  /** @throws LoadstoneException naming the text and the accepted names */
  public static TestType parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
    for (TestType x : values()) {
      if (x.wireName.equals(t) || x.name().toLowerCase(Locale.ROOT).replace('_', '-').equals(t)) {
        return x;
      }
    }
    throw new LoadstoneException("unknown test type '" + text
        + "': use three-point, four-point, compression, tension or crush");
  }
}
