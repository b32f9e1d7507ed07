package org.loadstone.device;

import java.io.FileOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.loadstone.HangGuard;
import org.loadstone.acquire.DeviceReader;
import org.loadstone.acquire.SampleRing;
import org.loadstone.protocol.Encoding;
import org.loadstone.protocol.WireEncoder;

/**
 * A stream of samples with a share of its bytes damaged, sent through a pseudo-terminal into the
 * real transport, decoder and ring, and judged against {@link ReferenceDecoder} on the same
 * bytes. Shared by the fault test (short) and the bench-profile fault run (long).
 */
public final class DamagedStream {
  /** How bytes are damaged. */
  public enum Mode {
    /** one bit of the byte flipped */
    FLIP,
    /** the byte replaced by another */
    SUBSTITUTE,
    /** a random byte put before it */
    INSERT,
    /** the byte left out */
    DELETE,
    /** runs of 1–16 bytes replaced, as a noisy line does, the same share of bytes in all */
    BURST
  }

  /**
   * What one stream gave.
   *
   * @param sent samples sent
   * @param intact samples none of whose bytes was damaged
   * @param keptOfIntact intact samples the host accepted
   * @param accepted samples the host accepted
   * @param falseAccepts accepted samples that were never sent (a damaged record whose CRC
   *     matched by chance)
   * @param referenceAgrees whether the host accepted exactly the reference decoder's samples,
   *     in order
   * @param firstDisagreement where they first differ, or -1
   */
  public record Figures(Encoding encoding, Mode mode, int sent, int intact, int keptOfIntact,
      int accepted, int falseAccepts, boolean referenceAgrees, int firstDisagreement) {}

  private DamagedStream() {}

  /**
   * @param fraction share of bytes damaged (0.01 for 1 %)
   * @throws IOException when the pseudo-terminal cannot be written
   */
  public static Figures run(Encoding encoding, Mode mode, int samples, double fraction,
      long seed) throws IOException, InterruptedException {
    SplittableRandom rnd = new SplittableRandom(seed);
    WireEncoder enc = new WireEncoder(encoding);
    byte[] clean = new byte[samples * WireEncoder.MAX_SAMPLE_BYTES];
    int[] starts = new int[samples + 1];
    ReferenceDecoder.Sample[] sent = new ReferenceDecoder.Sample[samples];
    int len = 0;
    for (int i = 0; i < samples; i++) {
      int seq = i & 0xFFFF;
      long us = (1_000_000L + 1000L * i) & 0xFFFF_FFFFL; // 1 kS/s; unique within the stream
      int load = rnd.nextInt(-8_388_608, 8_388_608);
      int pos = rnd.nextInt(-100_000, 100_000);
      starts[i] = len;
      len += enc.sample(clean, len, seq, us, load, true, pos);
      sent[i] = new ReferenceDecoder.Sample(seq, us, load, pos);
    }
    starts[samples] = len;
    boolean[] touched = new boolean[samples];
    byte[] damaged = damage(clean, len, starts, touched, mode, fraction, rnd);
    // an intact end marker after a boundary: once the host has it, it has had every byte
    byte[] tail = new byte[4 * WireEncoder.MAX_SAMPLE_BYTES];
    int t = 0;
    tail[t++] = (byte) (encoding == Encoding.TEXT ? '\n' : 0);
    long endUs = 4_000_000_000L;
    t += enc.sample(tail, t, 12345, endUs, 0, true, 0);
    byte[] all = new byte[damaged.length + t];
    System.arraycopy(damaged, 0, all, 0, damaged.length);
    System.arraycopy(tail, 0, all, damaged.length, t);

    List<ReferenceDecoder.Sample> host = throughPty(all, endUs);
    List<ReferenceDecoder.Sample> ref = encoding == Encoding.TEXT ? ReferenceDecoder.text(all)
        : ReferenceDecoder.binary(all);
    host.remove(host.size() - 1); // the end marker
    ref.remove(ref.size() - 1);

    Map<Long, ReferenceDecoder.Sample> byTime = new HashMap<>();
    Map<Long, Integer> indexOf = new HashMap<>();
    for (int i = 0; i < samples; i++) {
      byTime.put(sent[i].deviceUs(), sent[i]);
      indexOf.put(sent[i].deviceUs(), i);
    }
    int intact = 0;
    for (boolean x : touched) {
      intact += x ? 0 : 1;
    }
    int kept = 0;
    int falseAccepts = 0;
    for (ReferenceDecoder.Sample s : host) {
      ReferenceDecoder.Sample orig = byTime.get(s.deviceUs());
      if (orig == null || !orig.equals(s)) {
        falseAccepts++;
      } else if (!touched[indexOf.get(s.deviceUs())]) {
        kept++;
      }
    }
    int firstDiff = -1;
    for (int i = 0; i < Math.max(host.size(), ref.size()) && firstDiff < 0; i++) {
      if (i >= host.size() || i >= ref.size() || !host.get(i).equals(ref.get(i))) {
        firstDiff = i;
      }
    }
    return new Figures(encoding, mode, samples, intact, kept, host.size(), falseAccepts,
        firstDiff < 0, firstDiff);
  }

  /**
   * Damages about {@code fraction} of the bytes of {@code clean[0..len)}; marks each sample one
   * of whose bytes was hit (an insertion before a sample's first byte counts as a hit).
   */
  static byte[] damage(byte[] clean, int len, int[] starts, boolean[] touched, Mode mode,
      double fraction, SplittableRandom rnd) {
    java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream(len + len / 50);
    int sample = 0;
    double burstStart = fraction / 8.5; // bursts of 1–16 bytes: 8.5 on average
    int burstLeft = 0;
    for (int i = 0; i < len; i++) {
      while (i >= starts[sample + 1]) {
        sample++;
      }
      byte b = clean[i];
      boolean hit = burstLeft > 0;
      if (!hit) {
        double p = mode == Mode.BURST ? burstStart : fraction;
        hit = rnd.nextDouble() < p;
        if (hit && mode == Mode.BURST) {
          burstLeft = 1 + rnd.nextInt(16);
        }
      }
      if (!hit) {
        out.write(b);
        continue;
      }
      touched[sample] = true;
      switch (mode) {
        case FLIP -> out.write(b ^ (1 << rnd.nextInt(8)));
        case SUBSTITUTE -> out.write(b ^ (1 + rnd.nextInt(255)));
        case INSERT -> {
          out.write(rnd.nextInt(256));
          out.write(b);
        }
        case DELETE -> {
          // left out
        }
        case BURST -> {
          out.write(b ^ (1 + rnd.nextInt(255)));
          burstLeft--;
          if (burstLeft > 0 && i + 1 < len && i + 1 >= starts[sample + 1]) {
            touched[sample + 1] = true; // the burst runs on into the next sample
          }
        }
      }
    }
    return out.toByteArray();
  }

  /** Sends the bytes through a socat pseudo-terminal pair into the real serial path. */
  private static List<ReferenceDecoder.Sample> throughPty(byte[] bytes, long endUs)
      throws IOException, InterruptedException {
    try (SocatPair pty = SocatPair.start()) {
      SerialTransport port = SerialTransport.open(pty.b().toString(), SerialSettings.DEFAULT);
      SampleRing ring = new SampleRing(1 << 22);
      DeviceReader reader = new DeviceReader(port, ring);
      reader.start();
      try (OutputStream out = new FileOutputStream(pty.a().toFile())) {
        for (int off = 0; off < bytes.length; off += 4096) {
          out.write(bytes, off, Math.min(4096, bytes.length - off));
        }
        out.flush();
      }
      // wait for the end marker (an event, not a time); the deadline only stops a hung test
      long until = System.nanoTime() + HangGuard.S * 1_000_000_000L;
      List<ReferenceDecoder.Sample> got = new ArrayList<>();
      SampleRing.Cursor c = ring.cursorAtOldest();
      boolean[] end = {false};
      while (!end[0] && System.nanoTime() < until && reader.lostReason().isEmpty()) {
        if (c.drain((i, seq, dev, tUs, load, hasPos, pos) -> {
          got.add(new ReferenceDecoder.Sample(seq, dev, load, hasPos ? pos : null));
          end[0] |= dev == endUs;
        }, 1 << 16) == 0) {
          Thread.sleep(5);
        }
      }
      reader.close();
      if (!end[0]) {
        throw new AssertionError("the end marker never arrived: " + got.size() + " samples, "
            + reader.lostReason().orElse("device not lost"));
      }
      return got;
    }
  }
}
