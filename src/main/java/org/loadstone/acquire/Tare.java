package org.loadstone.acquire;

import org.loadstone.units.LoadstoneException;

/**
 * The zero (tare) taken from the sample stream before a run: the mean counts of the next samples
 * the device sends, and where the samples after them begin in the ring.
 *
 * @param counts mean counts of the samples averaged
 * @param nextIndex ring index of the first sample after them: a run armed on this zero is
 *     decided from there, so load that comes on while the run is being set up is not missed
 */
public record Tare(double counts, long nextIndex) {

  /**
   * Averages the next {@code samples} samples from the ring as the zero, waiting for them.
   *
   * @param reader the running device reader
   * @param samples how many samples to average, at least 1
   * @param timeoutMs how long the samples may take to arrive
   * @return the mean counts and where the samples after them begin
   * @throws LoadstoneException when the samples do not come in time (device silent or lost)
   */
  public static Tare take(DeviceReader reader, int samples, long timeoutMs) {
    SampleRing.Cursor c = reader.ring().cursorAtEnd();
    double[] sum = {0};
    int[] n = {0};
    long until = System.nanoTime() + timeoutMs * 1_000_000;
    while (n[0] < samples) {
      c.drain((i, s, d, t, counts, hp, p) -> {
        if (n[0] < samples) {
          sum[0] += counts;
          n[0]++;
        }
      }, samples - n[0]);
      if (n[0] < samples) {
        if (reader.lostReason().isPresent()) {
          throw new DeviceLostException("zeroing failed: only " + n[0] + " of " + samples
              + " samples arrived from " + reader.transport().name() + " ("
              + reader.lostReason().get() + ")");
        }
        if (System.nanoTime() > until) {
          throw new LoadstoneException("zeroing failed: only " + n[0] + " of " + samples
              + " samples arrived from " + reader.transport().name() + " in "
              + timeoutMs / 1000.0 + " s"
              + reader.lostReason().map(w -> " (" + w + ")").orElse(
                  "; check that the device is streaming samples"));
        }
        try {
          Thread.sleep(5);
        } catch (InterruptedException e) {
          Thread.currentThread().interrupt();
        }
      }
    }
    return new Tare(sum[0] / samples, c.position());
  }

  /**
   * Averages the next {@code samples} samples from the ring, waiting for them.
   *
   * @return mean counts
   * @throws LoadstoneException when the samples do not come in time (device silent or lost)
   */
  public static double counts(DeviceReader reader, int samples, long timeoutMs) {
    return take(reader, samples, timeoutMs).counts();
  }
}
