package org.loadstone.archive;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/** Why a run ended. Stored with every run as its {@link #wireName()}. */
public enum FinishCause {
  /** the load dropped: the specimen broke */
  BREAK,
  /** force reached the stop level of the cell's rated capacity */
  OVERLOAD,
  /** the operator stopped it */
  MANUAL,
  /** the run reached its longest allowed duration */
  TIME_LIMIT,
  /** a crush run: the crosshead travelled as far as the run allows */
  TRAVEL_LIMIT,
  /** a crush run: force stayed below the set fraction of the peak for the set time */
  LOW_FORCE,
  /** the device stopped answering (cable pulled, port gone) */
  DEVICE_LOST,
  /**
   * the device restarted during the run (it sent its identity again, its sample sequence or
   * clock started over); the run ends at the last sample before the restart
   */
  DEVICE_RESET,
  /**
   * the journal could not be written during the run (disk full); the run holds what was kept,
   * and its break, if it had one
   */
  DISK_FULL,
  /** the program ended before the run was stored; the run was rebuilt from its journal at the next start */
  RECOVERED,
  /** the run was imported from another program's file */
  IMPORTED;

  /** @return the stored name: {@code break}, {@code overload}, {@code time-limit}, … */
  public String wireName() {
    return name().toLowerCase(Locale.ROOT).replace('_', '-');
  }

  /** @throws LoadstoneException naming the text and the accepted names */
  public static FinishCause parse(String text) {
    for (FinishCause c : values()) {
      if (c.wireName().equalsIgnoreCase(text == null ? "" : text.trim())) {
        return c;
      }
    }
    throw new LoadstoneException("unknown finish cause '" + text + "': expected one of "
        + "break, overload, manual, time-limit, travel-limit, low-force, device-lost, device-reset, disk-full, recovered,"
        + " imported");
  }
}
