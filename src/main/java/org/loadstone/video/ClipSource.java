package org.loadstone.video;

import org.loadstone.units.LoadstoneException;

/**
 * Frames of a clip, one at a time in capture order. Holds at most a few decoded frames, so a
 * long high-rate clip streams in bounded memory.
 */
public interface ClipSource extends AutoCloseable {
  /** @return what the clip is */
  ClipInfo info();

  /**
   * @return the next frame, or null at the end of the clip
   * @throws LoadstoneException when the clip is damaged at this point (names the file and frame)
   */
  GreyFrame next();

  /** Frees the decoder. */
  @Override
  void close();
}
