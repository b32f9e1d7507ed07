package org.loadstone.archive;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;

/**
 * One pass over a journal's records, after its header: which records become samples (the rules
 * live here only) and what was left out. A record torn by the last write ends the pass; a record
 * whose time is not after the last sample's is left out and counted; an older index after a newer
 * one cannot come from the append-only writer and ends the pass like a torn write.
 *
 * <p>Records are read in blocks, and each sample goes to a {@link Sink} as primitives: a pass
 * holds one block, whatever the journal's length.
 */
final class JournalScan {
  /** Gets the samples of a pass, in order. */
  interface Sink {
    /**
     * @param i the sample's number in the run, from 0
     * @param timeUs unwrapped device time
     * @param counts load counts
     * @param hasPosition whether the record has position counts
     * @param position position counts (0 without)
     * @param seq device sequence number
     */
    void sample(int i, long timeUs, int counts, boolean hasPosition, int position, int seq)
        throws IOException;
  }

  private static final int BLOCK_RECORDS = 1489; // about 64 KiB

  /** Samples accepted. */
  int samples;
  /** Samples that had position. */
  int withPosition;
  /** Ring index of the first sample, -1 when none. */
  long firstIndex = -1;
  /** Time of the first sample, µs. */
  long firstTimeUs;
  long missedByJournal;
  long seqGaps;
  long outOfOrder;
  long tornBytes;

  /**
   * Reads the records that follow the header.
   *
   * @param in positioned after the header line
   * @param lastIndex records after this ring index are not read (Long.MAX_VALUE for all)
   * @param sink told each sample, or null to count only
   */
  static JournalScan run(InputStream in, long lastIndex, Sink sink) throws IOException {
    JournalScan s = new JournalScan();
    s.scan(in, lastIndex, sink);
    return s;
  }

  private void scan(InputStream in, long lastIndex, Sink sink) throws IOException {
    int size = JournalFormat.RECORD_BYTES;
    byte[] block = new byte[BLOCK_RECORDS * size];
    ByteBuffer bb = ByteBuffer.wrap(block);
    long prevIndex = -1;
    long prevTime = 0;
    int prevSeq = 0;
    while (true) {
      int got = in.readNBytes(block, 0, block.length);
      for (int off = 0; off < got; off += size) {
        if (got - off < size || !JournalFormat.intact(block, off)) {
          tornBytes = got - off + in.transferTo(OutputStream.nullOutputStream());
          return;
        }
        long index = bb.getLong(off);
        if (index > lastIndex) {
          return;
        }
        long timeUs = bb.getLong(off + 8);
        int counts = bb.getInt(off + 24);
        int pos = bb.getInt(off + 28);
        int seq = bb.getInt(off + 32);
        boolean hasPos = (bb.getInt(off + 36) & 1) != 0;
        if (prevIndex >= 0 && index <= prevIndex) {
          tornBytes = got - off + in.transferTo(OutputStream.nullOutputStream());
          return;
        }
        if (samples > 0 && timeUs <= prevTime) {
          outOfOrder++;
          prevIndex = index;
          continue;
        }
        if (prevIndex >= 0) {
          missedByJournal += index - prevIndex - 1;
          seqGaps += (seq - prevSeq - 1) & 0xFFFF;
        } else {
          firstIndex = index;
          firstTimeUs = timeUs;
        }
        prevIndex = index;
        prevTime = timeUs;
        prevSeq = seq;
        if (sink != null) {
          sink.sample(samples, timeUs, counts, hasPos, pos, seq);
        }
        withPosition += hasPos ? 1 : 0;
        samples++;
      }
      if (got < block.length) {
        return;
      }
    }
  }

  /** @return whether every sample has position (and there is one) */
  boolean position() {
    return samples > 0 && withPosition == samples;
  }

  /** @return whether some samples had position and some had not, so position is left out */
  boolean positionDropped() {
    return withPosition > 0 && withPosition < samples;
  }

  /** How a journal's samples become run columns: time from the first, force from the scale. */
  record Derive(DoubleUnaryOperator force, double zero_counts, double countsPerMm) {
    double time_s(long timeUs, long firstTimeUs) {
      return (timeUs - firstTimeUs) / 1e6;
    }

    double force_N(int counts) {
      return force.applyAsDouble(counts - zero_counts);
    }

    double position_mm(int position) {
      return Double.isNaN(countsPerMm) ? position : position / countsPerMm;
    }

    /** The header's warnings plus one when position counts could not be turned into mm. */
    List<String> warnings(RunMetadata header, boolean position) {
      List<String> w = new ArrayList<>(header.warnings());
      if (position && Double.isNaN(countsPerMm)) {
        w.add("the device identity gave no counts per mm (cpm): position_mm holds raw position"
            + " counts");
      }
      return w;
    }
  }
}
