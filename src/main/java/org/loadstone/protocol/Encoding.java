package org.loadstone.protocol;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/** The two encodings of the wire protocol (firmware-protocol/PROTOCOL.md). */
public enum Encoding {
  /** one record per line, readable in a serial terminal */
  TEXT,
  /** COBS frames with a CRC-16 */
  BINARY;

  /** @return the name used on the wire and on the command line: {@code text} or {@code binary} */
  public String wireName() {
    return name().toLowerCase(Locale.ROOT);
  }

  /**
   * @param text {@code text} or {@code binary}, any case
   * @throws LoadstoneException naming the value and the accepted names
   */
  public static Encoding parse(String text) {
    for (Encoding e : values()) {
      if (e.wireName().equalsIgnoreCase(text == null ? "" : text.trim())) {
        return e;
      }
    }
    throw new LoadstoneException("unknown encoding '" + text + "': use text or binary");
  }
}
