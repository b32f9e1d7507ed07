package org.loadstone.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import org.loadstone.acquire.SigkillRuns;
import org.loadstone.device.DamagedStream;
import org.loadstone.protocol.Encoding;

/**
 * The fault suite's longer run (bench profile): the damaged-byte streams of {@code
 * DamagedBytesTest} with more samples, and the SIGKILL of {@code SigkillLossTest} repeated,
 * printing the figures the contributor guide quotes (samples kept of intact, false accepts, ms
 * lost with min/median/max).
 *
 * <pre>
 * mvn -P bench test -Dbench.main=org.loadstone.bench.FaultRun -Dbench.args="200000 5"
 * </pre>
 *
 * Arguments: samples per damaged stream (default 200 000), kills per rate (default 5).
 */
public final class FaultRun {
  private FaultRun() {}

  public static void main(String[] args) throws Exception {
    int samples = args.length > 0 ? Integer.parseInt(args[0]) : 200_000;
    int kills = args.length > 1 ? Integer.parseInt(args[1]) : 5;
    long sent = 0;
    long intact = 0;
    long kept = 0;
    long falseAccepts = 0;
    boolean agree = true;
    System.out.println("| stream | sent | intact | kept of intact | false accepts |"
        + " reference decoder |");
    System.out.println("|---|---|---|---|---|---|");
    for (Encoding e : Encoding.values()) {
      for (DamagedStream.Mode m : DamagedStream.Mode.values()) {
        long seed = 7_000_000L + 31L * e.ordinal() + m.ordinal();
        DamagedStream.Figures f = DamagedStream.run(e, m, samples, 0.01, seed);
        System.out.printf(Locale.ROOT, "| %s %s | %d | %d | %d | %d | %s |%n",
            e.name().toLowerCase(Locale.ROOT), m.name().toLowerCase(Locale.ROOT), f.sent(),
            f.intact(), f.keptOfIntact(), f.falseAccepts(),
            f.referenceAgrees() ? "agrees" : "differs at " + f.firstDisagreement());
        sent += f.sent();
        intact += f.intact();
        kept += f.keptOfIntact();
        falseAccepts += f.falseAccepts();
        agree &= f.referenceAgrees();
      }
    }
    System.out.printf(Locale.ROOT, "| all | %d | %d | %d | %d | %s |%n%n", sent, intact, kept,
        falseAccepts, agree ? "agrees" : "differs");
    Path dir = Files.createTempDirectory("loadstone-kill");
    for (int rate : new int[] {1000, 50_000}) {
      double[] ms = new double[kills];
      for (int k = 0; k < kills; k++) {
        long[] f = SigkillRuns.killAndRecover(dir, rate, rate == 1000 ? 1500 : 20_000,
            "kill-" + rate + "-" + k);
        ms[k] = (f[0] - f[1]) * 1000.0 / rate;
        System.out.println(SigkillRuns.describe(rate, f));
      }
      Arrays.sort(ms);
      System.out.printf(Locale.ROOT, "SIGKILL at %d samples/s, %d kills: ms lost min %.2f,"
          + " median %.2f, max %.2f; every recovered run bit for bit%n%n", rate, kills, ms[0],
          ms[kills / 2], ms[kills - 1]);
    }
  }
}
