package org.loadstone.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Whether standard error is a terminal: the one test for the status lines that rewrite themselves
 * with a carriage return ({@code record}, {@code calibrate}, {@code verify}). Piped or captured,
 * standard error gets whole lines only.
 */
final class Terminal {
  private static final boolean STDERR_IS_TERMINAL = stderrIsTerminal();

  private Terminal() {}

  /** @return whether status lines (rewritten in place) may be shown on standard error */
  static boolean statusLines() {
    return STDERR_IS_TERMINAL;
  }

  private static boolean stderrIsTerminal() {
    Path fd2 = Path.of("/proc/self/fd/2");
    if (Files.exists(fd2, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
      try {
        String target = Files.readSymbolicLink(fd2).toString();
        return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty");
      } catch (IOException | UnsupportedOperationException | SecurityException e) {
        return false;
      }
    }
    // elsewhere: Java sees a console only when input and output are both terminals
    return System.console() != null;
  }
}
