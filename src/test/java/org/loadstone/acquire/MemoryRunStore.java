package org.loadstone.acquire;

import java.util.ArrayList;
import java.util.List;
import org.loadstone.archive.RunMetadata;

/** A run store in memory, for tests: keeps the raw samples and the final metadata. */
final class MemoryRunStore implements RunStore {
  final List<long[]> samples = new ArrayList<>(); // index, seq, timeUs, counts, pos
  RunMetadata startMeta;
  RunMetadata finalMeta;
  long firstIndex;

  @Override
  public Recording begin(RunMetadata start, SampleRing ring, long first) {
    startMeta = start;
    firstIndex = first;
    SampleRing.Cursor c = ring.cursorAt(first);
    return new Recording() {
      @Override
      public long durableSamples() {
        return samples.size();
      }

      @Override
      public Stored finish(long lastIndex, RunMetadata meta) {
        finalMeta = meta;
        while (c.position() <= lastIndex) {
          c.drain((i, s, d, t, k, hp, p) -> {
            if (i <= lastIndex) {
              samples.add(new long[] {i, s, t, k, p});
            }
          }, (int) (lastIndex + 1 - c.position()));
        }
        return new Stored(meta.runId(), null, null, samples.size());
      }
    };
  }
}
