package org.loadstone.device;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Locale;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.loadstone.FaultFigures;
import org.loadstone.HangGuard;
import org.loadstone.protocol.Encoding;

/**
 * 1 % of the bytes damaged in each way a serial line damages them, both encodings, through a
 * real pseudo-terminal into the transport, decoder and ring. The oracle is {@link
 * ReferenceDecoder}, a plain decoder written from PROTOCOL.md alone: the host must accept exactly
 * its samples, in order. Every intact sample is kept unless a damaged neighbour swallowed it,
 * and no sample that was never sent is accepted except by a chance CRC match. The bench profile
 * runs the same streams longer ({@code FaultRun}).
 */
@Tag("fault")
class DamagedBytesTest {
  /** Samples per stream here; the bench profile's run sends many more. */
  static final int SAMPLES = 20_000;

  @ParameterizedTest(name = "{0}, {1}")
  @CsvSource({"TEXT, FLIP", "TEXT, SUBSTITUTE", "TEXT, INSERT", "TEXT, DELETE", "TEXT, BURST",
      "BINARY, FLIP", "BINARY, SUBSTITUTE", "BINARY, INSERT", "BINARY, DELETE", "BINARY, BURST"})
  @Timeout(HangGuard.TEST_S)
  void onePercentDamagedKeepsTheIntactSamplesAndAcceptsNoDamagedOne(Encoding encoding,
      DamagedStream.Mode mode) throws Exception {
    long seed = 20261204L + 31L * encoding.ordinal() + mode.ordinal();
    DamagedStream.Figures f = DamagedStream.run(encoding, mode, SAMPLES, 0.01, seed);
    FaultFigures.report(describe(f, seed));
    assertThat(f.referenceAgrees()).as("host and reference decoder differ at sample %d",
        f.firstDisagreement()).isTrue();
    // the damage reached a share of the samples (a sample is 17–42 bytes: 1 % of bytes hits
    // about 15–35 % of text samples and 10–20 % of binary ones; bursts fewer)
    assertThat(f.intact()).isLessThan(f.sent()).isGreaterThan(f.sent() / 2);
    // CRC-16 lets a damaged record through about once in 65 536 (CRC catalogue; from memory),
    // and the record's shape checks make it rarer still
    assertThat(f.falseAccepts()).isLessThanOrEqualTo(1);
    // an intact sample is lost only where a damaged record next to it was taken in its place
    assertThat(f.intact() - f.keptOfIntact()).isLessThanOrEqualTo(f.falseAccepts());
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource({"TEXT", "BINARY"})
  @Timeout(HangGuard.TEST_S)
  void theOracleReadsAnUndamagedStreamWhole(Encoding encoding) throws Exception {
    // the CRC catalogue's check value for CRC-16/CCITT-FALSE (PROTOCOL.md "Checksum")
    byte[] check = "123456789".getBytes(java.nio.charset.StandardCharsets.US_ASCII);
    assertThat(ReferenceDecoder.crc16(check, 0, check.length)).isEqualTo(0x29B1);
    DamagedStream.Figures f = DamagedStream.run(encoding, DamagedStream.Mode.FLIP, 2000, 0.0, 1);
    assertThat(f.intact()).isEqualTo(2000);
    assertThat(f.keptOfIntact()).isEqualTo(2000);
    assertThat(f.accepted()).isEqualTo(2000);
    assertThat(f.referenceAgrees()).isTrue();
  }

  static String describe(DamagedStream.Figures f, long seed) {
    return String.format(Locale.ROOT, "damaged bytes 1 %%, %s %s: kept %d of %d intact samples,"
        + " %d false accepts, %d samples sent, reference decoder %s (seed %d)",
        f.encoding().name().toLowerCase(Locale.ROOT), f.mode().name().toLowerCase(Locale.ROOT),
        f.keptOfIntact(), f.intact(), f.falseAccepts(), f.sent(),
        f.referenceAgrees() ? "agrees" : "differs at " + f.firstDisagreement(), seed);
  }
}
