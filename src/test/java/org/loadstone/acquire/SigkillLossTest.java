package org.loadstone.acquire;

import java.nio.file.Path;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.loadstone.FaultFigures;
import org.loadstone.HangGuard;

/**
 * A recording process killed with SIGKILL at 1 kS/s and 50 kS/s: the recovered run is the
 * device's samples from the first on, bit for bit, with no gap, and holds at least every sample
 * the writer had reported durable. How many milliseconds of samples were lost is counted
 * exactly (the child stores its count of delivered samples in a shared file mapping, which
 * outlives the kill) and reported as a figure, never asserted against a time.
 */
@Tag("fault")
class SigkillLossTest {
  @TempDir Path archive;

  @ParameterizedTest(name = "{0} samples/s")
  @ValueSource(ints = {1000, 50_000})
  @Timeout(HangGuard.TEST_S)
  void killedWhileRecordingTheRecoveredRunIsBitExactAndTheLossIsCounted(int rate)
      throws Exception {
    long[] f = SigkillRuns.killAndRecover(archive, rate, rate == 1000 ? 1500 : 20_000, "kill-" + rate);
    FaultFigures.report(SigkillRuns.describe(rate, f));
  }
}
