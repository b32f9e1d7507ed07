package org.loadstone.video;

import static org.bytedeco.ffmpeg.global.avcodec.AV_CODEC_FLAG_GLOBAL_HEADER;
import static org.bytedeco.ffmpeg.global.avcodec.AV_CODEC_FLAG_QSCALE;
import static org.bytedeco.ffmpeg.global.avcodec.av_packet_alloc;
import static org.bytedeco.ffmpeg.global.avcodec.av_packet_free;
import static org.bytedeco.ffmpeg.global.avcodec.av_packet_rescale_ts;
import static org.bytedeco.ffmpeg.global.avcodec.av_packet_unref;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_alloc_context3;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_find_encoder_by_name;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_free_context;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_open2;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_parameters_from_context;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_receive_packet;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_send_frame;
import static org.bytedeco.ffmpeg.global.avformat.AVFMT_GLOBALHEADER;
import static org.bytedeco.ffmpeg.global.avformat.AVIO_FLAG_WRITE;
import static org.bytedeco.ffmpeg.global.avformat.av_interleaved_write_frame;
import static org.bytedeco.ffmpeg.global.avformat.av_write_trailer;
import static org.bytedeco.ffmpeg.global.avformat.avformat_alloc_output_context2;
import static org.bytedeco.ffmpeg.global.avformat.avformat_free_context;
import static org.bytedeco.ffmpeg.global.avformat.avformat_new_stream;
import static org.bytedeco.ffmpeg.global.avformat.avformat_write_header;
import static org.bytedeco.ffmpeg.global.avformat.avio_closep;
import static org.bytedeco.ffmpeg.global.avformat.avio_open;
import static org.bytedeco.ffmpeg.global.avutil.AVERROR_EAGAIN;
import static org.bytedeco.ffmpeg.global.avutil.AVERROR_EOF;
import static org.bytedeco.ffmpeg.global.avutil.av_dict_set;
import static org.bytedeco.ffmpeg.global.avutil.av_frame_alloc;
import static org.bytedeco.ffmpeg.global.avutil.av_frame_free;
import static org.bytedeco.ffmpeg.global.avutil.av_frame_get_buffer;
import static org.bytedeco.ffmpeg.global.avutil.av_frame_make_writable;

import java.nio.ByteBuffer;
import java.nio.file.Path;
import org.bytedeco.ffmpeg.avcodec.AVCodec;
import org.bytedeco.ffmpeg.avcodec.AVCodecContext;
import org.bytedeco.ffmpeg.avcodec.AVPacket;
import org.bytedeco.ffmpeg.avformat.AVFormatContext;
import org.bytedeco.ffmpeg.avformat.AVIOContext;
import org.bytedeco.ffmpeg.avformat.AVStream;
import org.bytedeco.ffmpeg.avutil.AVDictionary;
import org.bytedeco.ffmpeg.avutil.AVFrame;
import org.bytedeco.ffmpeg.avutil.AVRational;
import org.bytedeco.ffmpeg.global.avutil;

/**
 * Test helper: encodes grey frames into a clip with the same FFmpeg build Loadstone decodes
 * with. H.264 uses {@code libopenh264} (the H.264 encoder the LGPL build carries; libx264 is GPL
 * and absent), MJPEG the built-in {@code mjpeg} encoder. Timestamps are given per frame, so a
 * variable frame rate can be written.
 */
final class ClipWriter implements AutoCloseable {
  /** Which encoder and container. */
  enum Kind {
    H264_MP4("libopenh264", avutil.AV_PIX_FMT_YUV420P),
    MJPEG_AVI("mjpeg", avutil.AV_PIX_FMT_YUVJ420P),
    MPEG4_MP4("mpeg4", avutil.AV_PIX_FMT_YUV420P);

    final String encoder;
    final int pixFmt;

    Kind(String encoder, int pixFmt) {
      this.encoder = encoder;
      this.pixFmt = pixFmt;
    }
  }

  private final AVFormatContext oc = new AVFormatContext(null);
  private final AVCodecContext c;
  private final AVStream st;
  private final AVFrame frame;
  private final AVPacket pkt;
  private final int w;
  private final int h;
  private final int ticksPerSecond;

  /**
   * @param file output file (.mp4 or .avi)
   * @param ticksPerSecond time base of the timestamps given to {@link #write}
   * @param nominalFps frame rate the encoder's rate control assumes
   * @param captureFps a capture rate to state as {@code com.android.capture.fps}, or 0
   */
  ClipWriter(Path file, Kind kind, int w, int h, int ticksPerSecond, int nominalFps,
      double captureFps) {
    this.w = w;
    this.h = h;
    this.ticksPerSecond = ticksPerSecond;
    check(avformat_alloc_output_context2(oc, null, null, file.toString()), "output");
    AVCodec codec = avcodec_find_encoder_by_name(kind.encoder);
    if (codec == null || codec.isNull()) {
      throw new IllegalStateException("no encoder " + kind.encoder);
    }
    st = avformat_new_stream(oc, null);
    c = avcodec_alloc_context3(codec);
    c.width(w);
    c.height(h);
    c.pix_fmt(kind.pixFmt);
    c.time_base(new AVRational().num(1).den(ticksPerSecond));
    c.framerate(new AVRational().num(nominalFps).den(1));
    c.gop_size(nominalFps);
    c.max_b_frames(0);
    AVDictionary opts = new AVDictionary(null);
    if (kind == Kind.H264_MP4) {
      // a good phone clip's quality: quantiser held to 4–10 (openh264 reads qmin/qmax)
      c.bit_rate(3_000_000);
      c.qmin(4);
      c.qmax(10);
    } else {
      // fixed quantiser 2: near-lossless JPEG frames (MJPEG) or MPEG-4 parts
      c.flags(c.flags() | AV_CODEC_FLAG_QSCALE);
      c.global_quality(2 * avutil.FF_QP2LAMBDA);
      c.qmin(2);
      c.qmax(2);
    }
    if ((oc.oformat().flags() & AVFMT_GLOBALHEADER) != 0) {
      c.flags(c.flags() | AV_CODEC_FLAG_GLOBAL_HEADER);
    }
    check(avcodec_open2(c, codec, opts), "encoder " + kind.encoder);
    check(avcodec_parameters_from_context(st.codecpar(), c), "parameters");
    st.time_base(c.time_base());
    st.avg_frame_rate(new AVRational().num(nominalFps).den(1));
    if (captureFps > 0) {
      AVDictionary md = new AVDictionary(null);
      av_dict_set(md, "com.android.capture.fps", Double.toString(captureFps), 0);
      oc.metadata(md);
    }
    AVIOContext pb = new AVIOContext(null);
    check(avio_open(pb, file.toString(), AVIO_FLAG_WRITE), "open " + file);
    oc.pb(pb);
    AVDictionary hopts = new AVDictionary(null);
    if (captureFps > 0) {
      av_dict_set(hopts, "movflags", "use_metadata_tags", 0);
    }
    check(avformat_write_header(oc, hopts), "header");
    frame = av_frame_alloc();
    frame.format(kind.pixFmt);
    frame.width(w);
    frame.height(h);
    check(av_frame_get_buffer(frame, 0), "frame buffer");
    pkt = av_packet_alloc();
  }

  /** Writes one grey frame at {@code pts} ticks. */
  void write(byte[] luma, long pts) {
    check(av_frame_make_writable(frame), "writable");
    int ys = frame.linesize(0);
    ByteBuffer y = frame.data(0).capacity((long) ys * h).asByteBuffer();
    for (int r = 0; r < h; r++) {
      y.position(r * ys);
      y.put(luma, r * w, w);
    }
    for (int p = 1; p <= 2; p++) {
      int s = frame.linesize(p);
      int ch = (h + 1) / 2;
      ByteBuffer b = frame.data(p).capacity((long) s * ch).asByteBuffer();
      for (int i = 0; i < s * ch; i++) {
        b.put(i, (byte) 128);
      }
    }
    frame.pts(pts);
    check(avcodec_send_frame(c, frame), "send frame");
    drain();
  }

  private void drain() {
    while (true) {
      int r = avcodec_receive_packet(c, pkt);
      if (r == AVERROR_EAGAIN() || r == AVERROR_EOF()) {
        return;
      }
      check(r, "receive packet");
      av_packet_rescale_ts(pkt, c.time_base(), st.time_base());
      pkt.stream_index(st.index());
      check(av_interleaved_write_frame(oc, pkt), "write packet");
      av_packet_unref(pkt);
    }
  }

  int ticksPerSecond() {
    return ticksPerSecond;
  }

  @Override
  public void close() {
    avcodec_send_frame(c, null);
    drain();
    check(av_write_trailer(oc), "trailer");
    avio_closep(oc.pb());
    av_frame_free(frame);
    av_packet_free(pkt);
    avcodec_free_context(c);
    avformat_free_context(oc);
  }

  private static void check(int r, String what) {
    if (r < 0) {
      throw new IllegalStateException(what + ": " + FfmpegClip.text(r));
    }
  }
}
