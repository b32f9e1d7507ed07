package org.loadstone.video;

import static org.bytedeco.ffmpeg.global.swscale.SWS_POINT;
import static org.bytedeco.ffmpeg.global.swscale.sws_freeContext;
import static org.bytedeco.ffmpeg.global.swscale.sws_getCachedContext;
import static org.bytedeco.ffmpeg.global.swscale.sws_scale;

import org.bytedeco.ffmpeg.avutil.AVFrame;
import org.bytedeco.ffmpeg.global.avutil;
import org.bytedeco.ffmpeg.swscale.SwsContext;
import org.bytedeco.javacpp.BytePointer;
import org.bytedeco.javacpp.DoublePointer;
import org.bytedeco.javacpp.IntPointer;
import org.bytedeco.javacpp.PointerPointer;

/** Frames of a pixel format without a luma plane (RGB, paletted…) turned grey by swscale. */
final class GreyConverter implements AutoCloseable {
  private SwsContext sws;
  private BytePointer out;
  private int outSize;

  void convert(AVFrame frame, byte[] luma) {
    int w = frame.width();
    int h = frame.height();
    sws = sws_getCachedContext(sws, w, h, frame.format(), w, h, avutil.AV_PIX_FMT_GRAY8,
        SWS_POINT, null, null, (DoublePointer) null);
    if (out == null || outSize != w * h) {
      if (out != null) {
        out.close();
      }
      out = new BytePointer((long) w * h);
      outSize = w * h;
    }
    try (PointerPointer<BytePointer> dst = new PointerPointer<>(out);
        IntPointer stride = new IntPointer(new int[] {w})) {
      sws_scale(sws, frame.data(), frame.linesize(), 0, h, dst, stride);
    }
    out.position(0).get(luma, 0, w * h);
  }

  @Override
  public void close() {
    if (sws != null) {
      sws_freeContext(sws);
    }
    if (out != null) {
      out.close();
    }
  }
}
