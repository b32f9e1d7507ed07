package org.loadstone.archive;

import java.util.Locale;
import java.util.Set;

/**
 * Turns text a user typed (a specimen id, a group name) into a fragment that is safe as part of a
 * file name on Linux, macOS and Windows.
 */
public final class SafeNames {
  /** Longest fragment returned, in characters. */
  public static final int MAX_LENGTH = 64;
  /** Returned when nothing usable is left. */
  public static final String FALLBACK = "specimen";

  private static final Set<String> RESERVED = Set.of("con", "prn", "aux", "nul",
      "com1", "com2", "com3", "com4", "com5", "com6", "com7", "com8", "com9",
      "lpt1", "lpt2", "lpt3", "lpt4", "lpt5", "lpt6", "lpt7", "lpt8", "lpt9");

  private SafeNames() {}

  /**
   * Keeps only {@code A–Z a–z 0–9 . _ -}; every other character (separators, spaces, control
   * characters, non-ASCII letters) becomes {@code _}, and runs of {@code _} shrink to one. Leading
   * dots, dashes and underscores and trailing dots and underscores are removed, so the result
   * can never be {@code .}, {@code ..}, a hidden file or an option-like word. A Windows device
   * name ({@code con}, {@code nul}, {@code com1}, … with or without an extension, any case) gets a
   * {@code _} after its stem. The result is at most {@link #MAX_LENGTH} characters.
   *
   * @param userText any text, may be null
   * @return a non-empty fragment; {@value #FALLBACK} when nothing usable is left
   */
  public static String forFile(String userText) {
    String s = userText == null ? "" : userText;
    StringBuilder b = new StringBuilder(Math.min(s.length(), 4 * MAX_LENGTH));
    s.codePoints().forEach(cp -> {
      char c = allowed(cp) ? (char) cp : '_';
      if (!(c == '_' && b.length() > 0 && b.charAt(b.length() - 1) == '_')) {
        b.append(c);
      }
    });
    String t = trim(b.toString());
    if (t.length() > MAX_LENGTH) {
      t = trim(t.substring(0, MAX_LENGTH));
    }
    if (t.isEmpty()) {
      return FALLBACK;
    }
    int dot = t.indexOf('.');
    String stem = dot < 0 ? t : t.substring(0, dot);
    if (RESERVED.contains(stem.toLowerCase(Locale.ROOT))) {
      t = stem + "_" + t.substring(stem.length());
      if (t.length() > MAX_LENGTH) {
        t = trim(t.substring(0, MAX_LENGTH));
      }
    }
    return t;
  }

  private static boolean allowed(int cp) {
    return (cp >= 'a' && cp <= 'z') || (cp >= 'A' && cp <= 'Z') || (cp >= '0' && cp <= '9')
        || cp == '.' || cp == '_' || cp == '-';
  }

  private static String trim(String s) {
    int from = 0;
    int to = s.length();
    while (from < to && (s.charAt(from) == '.' || s.charAt(from) == '_' || s.charAt(from) == '-')) {
      from++;
    }
    while (to > from && (s.charAt(to - 1) == '.' || s.charAt(to - 1) == '_')) {
      to--;
    }
    return s.substring(from, to);
  }
}
