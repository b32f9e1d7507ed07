package org.loadstone.device;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.SampleRing;
import org.loadstone.cli.LoadstoneCommand;
import org.loadstone.sim.SimulatedFrame;
import org.loadstone.units.LoadstoneException;
import org.assertj.core.api.Assertions;

/**
 * The whole byte path over a real pseudo-terminal pair: {@code loadstone simulate} writes to one
 * end, the jSerialComm transport reads the other, the decoder turns bytes into samples, and every
 * sample is compared bit for bit with the simulator run again with the same seed.
 */
class SerialEndToEndTest {

  @ParameterizedTest(name = "{0} at {1} samples/s")
  @CsvSource({"binary, 25000, 100000", "text, 10000, 30000"})
  @Timeout(120)
  void everySampleArrivesBitExact(String encoding, int rateHz, int count) throws Exception {
    try (SocatPair pty = SocatPair.start()) {
      SerialTransport t = SerialTransport.open(pty.b().toString(), SerialSettings.DEFAULT);
      SampleRing ring = new SampleRing(1 << 18);
      DeviceReader reader = new DeviceReader(t, ring);
      reader.start();
      double seconds = (double) count / rateHz;
      AtomicInteger exit = new AtomicInteger(-1);
      Thread writer = new Thread(() -> exit.set(LoadstoneCommand.run("simulate",
          "--scenario", "brittle", "--seed", "7", "--rate-hz", Integer.toString(rateHz),
          "--duration-s", Double.toString(seconds), "--out", pty.a().toString(),
          encoding.equals("binary") ? "--binary" : "--unpaced=false")));
      writer.start();
      writer.join(Duration.ofSeconds(90).toMillis());
      assertThat(exit.get()).isZero();
      long until = System.nanoTime() + 20_000_000_000L;
      while (reader.samplesAccepted() < count && System.nanoTime() < until) {
        Thread.sleep(20);
      }
      reader.close();

      assertThat(reader.samplesAccepted()).isEqualTo(count);
      assertThat(reader.counters().dropped()).isZero();
      assertThat(reader.counters().checksumErrors()).isZero();

      // the simulate command's press starts by itself (nobody arms a stand-alone stream)
      SimulatedFrame truth = new SimSetup("brittle", 7, rateHz, false, 1, Double.NaN).buildFrame();
      SampleRing.Cursor c = ring.cursorAtOldest();
      int[] mismatches = {0};
      c.drain((i, seq, us, tUs, counts, hasPos, pos) -> truth.next((s2, us2, load2, pos2) -> {
        if (s2 != seq || us2 != us || load2 != counts || pos2 != pos) {
          mismatches[0]++;
        }
      }), Integer.MAX_VALUE);
      assertThat(c.position()).isEqualTo(count);
      assertThat(mismatches[0]).as("samples differing from the simulator's record").isZero();
    }
  }

  @Test
  @Timeout(60)
  @Tag("fault")
  void cablePulledEndsTheStreamWithAMessage() throws Exception {
    try (SocatPair pty = SocatPair.start()) {
      SerialTransport t = SerialTransport.open(pty.b().toString(), SerialSettings.DEFAULT);
      DeviceReader reader = new DeviceReader(t, new SampleRing(1 << 16));
      reader.start();
      Thread writer = new Thread(() -> LoadstoneCommand.run("simulate", "--scenario", "ductile",
          "--rate-hz", "1000", "--duration-s", "30", "--out", pty.a().toString()));
      writer.setDaemon(true);
      writer.start();
      long until = System.nanoTime() + 10_000_000_000L;
      while (reader.samplesAccepted() < 500 && System.nanoTime() < until) {
        Thread.sleep(10);
      }
      assertThat(reader.samplesAccepted()).isGreaterThanOrEqualTo(500);
      pty.kill();
      until = System.nanoTime() + 10_000_000_000L;
      while (reader.lostReason().isEmpty() && System.nanoTime() < until) {
        Thread.sleep(10);
      }
      assertThat(reader.lostReason()).hasValueSatisfying(
          why -> assertThat(why).contains(pty.b().toString()).contains("reconnect"));
      reader.close();
    }
  }

  @Test
  void missingPortNamesThePortAndTheFix() {
    Assertions.assertThatThrownBy(
            () -> SerialTransport.open("/dev/ttyNOPE42", SerialSettings.DEFAULT))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("/dev/ttyNOPE42")
        .hasMessageContaining("choose one of the serial ports present")
        .hasMessageNotContaining("--")
        .satisfies(e -> Assertions.assertThat(((LoadstoneException) e).settings())
            .containsExactly(org.loadstone.units.Setting.PORT));
  }
}
