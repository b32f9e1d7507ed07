package org.loadstone.bench;

import java.io.BufferedReader;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.TimeUnit;
import org.loadstone.device.FrameSampleSource;
import org.loadstone.device.SampleSource;
import org.loadstone.device.SimSetup;
import org.loadstone.protocol.DecodeListener;
import org.loadstone.protocol.DeviceMessage;
import org.loadstone.protocol.Encoding;
import org.loadstone.protocol.StreamDecoder;
import org.loadstone.protocol.WireEncoder;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;

/**
 * Samples decoded per second: the streaming decoder on text and binary wire bytes, beside the
 * naive way (readLine, split, parseLong) on the same text bytes. Bytes are fed in 4 KiB chunks, as
 * a serial read delivers them. Each operation decodes {@link #SAMPLES} samples.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class DecoderBenchmark {
  static final int SAMPLES = 100_000;
  static final int CHUNK = 4096;

  byte[] text;
  byte[] binary;

  @Setup
  public void setUp() {
    text = wire(Encoding.TEXT);
    binary = wire(Encoding.BINARY);
  }

  private static byte[] wire(Encoding e) {
    SampleSource src = new FrameSampleSource(
        new SimSetup("panel-balsa", 3, 20_000, false, 1).buildFrame());
    WireEncoder enc = new WireEncoder(e);
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    byte[] buf = new byte[WireEncoder.MAX_SAMPLE_BYTES];
    SampleSource.SampleSlot s = new SampleSource.SampleSlot();
    for (int i = 0; i < SAMPLES; i++) {
      src.next(s);
      out.write(buf, 0, enc.sample(buf, 0, s.seq, s.deviceUs, s.counts, true, s.positionCounts));
    }
    return out.toByteArray();
  }

  /** Sums what it is given so the JIT cannot drop the decoding. */
  static final class Sum implements DecodeListener {
    long total;

    @Override
    public void onSample(int seq, long us, int counts, boolean hasPos, int pos) {
      total += seq + us + counts + pos;
    }

    @Override
    public void onMessage(DeviceMessage m) {}
  }

  private static long decode(byte[] wire) {
    Sum sum = new Sum();
    StreamDecoder d = new StreamDecoder(sum);
    for (int i = 0; i < wire.length; i += CHUNK) {
      d.feed(wire, i, Math.min(CHUNK, wire.length - i));
    }
    return sum.total;
  }

  @Benchmark
  @OperationsPerInvocation(SAMPLES)
  public void streamingText(Blackhole bh) {
    bh.consume(decode(text));
  }

  @Benchmark
  @OperationsPerInvocation(SAMPLES)
  public void streamingBinary(Blackhole bh) {
    bh.consume(decode(binary));
  }

  /** The baseline: what a quick script does with a serial port's text. No checksum check. */
  @Benchmark
  @OperationsPerInvocation(SAMPLES)
  public void naiveReadLineSplit(Blackhole bh) throws IOException {
    BufferedReader r = new BufferedReader(
        new InputStreamReader(new ByteArrayInputStream(text), StandardCharsets.US_ASCII), CHUNK);
    long total = 0;
    String line;
    while ((line = r.readLine()) != null) {
      String[] f = line.split(" ");
      if (f.length >= 5 && f[0].equals("S")) {
        total += Long.parseLong(f[1]) + Long.parseLong(f[2]) + Long.parseLong(f[3])
            + Long.parseLong(f[4]);
      }
    }
    bh.consume(total);
  }

  /**
   * The naive loop doing the same job as the decoder: it also checks each line's CRC (with the
   * same table-driven CRC-16), so the two do equal work. Shown beside the plain baseline for
   * context; the target is set against the plain one.
   */
  @Benchmark
  @OperationsPerInvocation(SAMPLES)
  public void naiveReadLineSplitWithChecksum(Blackhole bh) throws IOException {
    BufferedReader r = new BufferedReader(
        new InputStreamReader(new ByteArrayInputStream(text), StandardCharsets.US_ASCII), CHUNK);
    long total = 0;
    String line;
    while ((line = r.readLine()) != null) {
      int tilde = line.lastIndexOf(" ~");
      if (tilde < 0) {
        continue;
      }
      byte[] body = line.substring(0, tilde).getBytes(StandardCharsets.US_ASCII);
      if (org.loadstone.protocol.Crc16.compute(body, 0, body.length)
          != Integer.parseInt(line.substring(tilde + 2), 16)) {
        continue;
      }
      String[] f = line.substring(0, tilde).split(" ");
      if (f.length >= 5 && f[0].equals("S")) {
        total += Long.parseLong(f[1]) + Long.parseLong(f[2]) + Long.parseLong(f[3])
            + Long.parseLong(f[4]);
      }
    }
    bh.consume(total);
  }
}
