package org.loadstone.device;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;
import org.loadstone.cli.LoadstoneCommand;

/**
 * {@code monitor} on a port that sends nothing says so with the likely fixes and exits with the
 * documented code instead of 0 with "0 samples" (bytes that are not samples: {@code
 * MonitorSilenceTest}).
 */
class SilentPortTest {
  private static String[] monitor(SocatPair pair) {
    return new String[] {"monitor", "--port", pair.b().toString(), "--duration-s", "1.5",
        "--quiet"};
  }

  @Test
  void aSilentPortIsNamedAndTheExitCodeSaysNoData() throws Exception {
    try (SocatPair pair = SocatPair.start()) {
      StringWriter out = new StringWriter();
      StringWriter err = new StringWriter();
      int code = LoadstoneCommand.run(new PrintWriter(out), new PrintWriter(err), monitor(pair));
      assertThat(code).as(err.toString()).isEqualTo(LoadstoneCommand.EXIT_NO_DATA);
      assertThat(err.toString()).contains("no samples: port " + pair.b() + " sent nothing",
          "loadstone ports", "--reset-wait-ms");
    }
  }
}
