package org.loadstone.video;

import java.nio.file.Path;

/**
 * What a clip is, as its container says.
 *
 * @param file the clip file or image folder
 * @param container container format (for example "mov,mp4,m4a,3gp,3g2,mj2", "avi", "images")
 * @param codec video codec name (for example "h264", "hevc", "mjpeg", "png")
 * @param width frame width, pixels
 * @param height frame height, pixels
 * @param nominalRate_fps the stream's average frame rate, frames per second of capture time (0
 *     when the container does not say)
 * @param timeScale capture seconds per stream second: 1 for a normal clip; playback rate ÷
 *     capture rate for a slow-motion clip whose timestamps run at the playback rate
 * @param timeSource where the capture times come from, in words
 */
public record ClipInfo(Path file, String container, String codec, int width, int height,
    double nominalRate_fps, double timeScale, String timeSource) {}
