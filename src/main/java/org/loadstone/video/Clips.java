package org.loadstone.video;

import java.nio.file.Files;
import java.nio.file.Path;

/** Opens a clip: a video file through FFmpeg, or a folder of numbered images. */
public final class Clips {
  private Clips() {}

  /** What Loadstone reads, in words, for messages. */
  public static final String SUPPORTED = FfmpegClip.SUPPORTED;

  /**
   * @param clip a video file (MP4/MOV with H.264 or H.265, AVI with MJPEG; any other container
   *     and codec this build's FFmpeg decodes is let through) or a folder of numbered images
   * @param rate_fps for a folder, the capture rate (required); for a file, the capture rate of a
   *     slow-motion clip whose timestamps run at the playback rate and which does not state it, or
   *     null to use the clip's own timestamps
   * @return the opened clip; close it
   * @throws org.loadstone.units.LoadstoneException naming the file, the codec found and what is
   *     supported, when the clip cannot be read
   */
  public static ClipSource open(Path clip, Double rate_fps) {
    if (Files.isDirectory(clip)) {
      return ImageFolderClip.open(clip, rate_fps);
    }
    return FfmpegClip.open(clip, rate_fps);
  }
}
