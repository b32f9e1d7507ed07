package org.loadstone.video;

import static org.bytedeco.ffmpeg.global.avcodec.av_packet_alloc;
import static org.bytedeco.ffmpeg.global.avcodec.av_packet_free;
import static org.bytedeco.ffmpeg.global.avcodec.av_packet_unref;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_alloc_context3;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_flush_buffers;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_find_decoder;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_free_context;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_get_name;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_open2;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_parameters_to_context;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_receive_frame;
import static org.bytedeco.ffmpeg.global.avcodec.avcodec_send_packet;
import static org.bytedeco.ffmpeg.global.avformat.av_find_best_stream;
import static org.bytedeco.ffmpeg.global.avformat.AVSEEK_FLAG_BACKWARD;
import static org.bytedeco.ffmpeg.global.avformat.av_read_frame;
import static org.bytedeco.ffmpeg.global.avformat.av_seek_frame;
import static org.bytedeco.ffmpeg.global.avformat.avformat_close_input;
import static org.bytedeco.ffmpeg.global.avformat.avformat_find_stream_info;
import static org.bytedeco.ffmpeg.global.avformat.avformat_open_input;
import static org.bytedeco.ffmpeg.global.avutil.AVERROR_EAGAIN;
import static org.bytedeco.ffmpeg.global.avutil.AVERROR_EOF;
import static org.bytedeco.ffmpeg.global.avutil.AVMEDIA_TYPE_VIDEO;
import static org.bytedeco.ffmpeg.global.avutil.AV_LOG_ERROR;
import static org.bytedeco.ffmpeg.global.avutil.AV_NOPTS_VALUE;
import static org.bytedeco.ffmpeg.global.avutil.av_dict_get;
import static org.bytedeco.ffmpeg.global.avutil.av_frame_alloc;
import static org.bytedeco.ffmpeg.global.avutil.av_frame_free;
import static org.bytedeco.ffmpeg.global.avutil.av_log_set_level;
import static org.bytedeco.ffmpeg.global.avutil.av_strerror;

import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Set;
import org.bytedeco.ffmpeg.avcodec.AVCodec;
import org.bytedeco.ffmpeg.avcodec.AVCodecContext;
import org.bytedeco.ffmpeg.avcodec.AVCodecParameters;
import org.bytedeco.ffmpeg.avcodec.AVPacket;
import org.bytedeco.ffmpeg.avformat.AVFormatContext;
import org.bytedeco.ffmpeg.avformat.AVStream;
import org.bytedeco.ffmpeg.avutil.AVDictionary;
import org.bytedeco.ffmpeg.avutil.AVDictionaryEntry;
import org.bytedeco.ffmpeg.avutil.AVFrame;
import org.bytedeco.ffmpeg.avutil.AVRational;
import org.bytedeco.ffmpeg.global.avutil;
import org.bytedeco.javacpp.BytePointer;
import org.loadstone.units.LoadstoneException;

/**
 * A clip file decoded by FFmpeg (the LGPL build shipped by the {@code org.bytedeco:ffmpeg}
 * artifacts). Frames come out in presentation order with their own timestamps, converted to
 * capture seconds from the first frame; the luma plane is copied out, so NCC tracking works on
 * the camera's own grey values.
 *
 * <p>Slow motion: a clip whose container states a capture rate ({@code com.android.capture.fps})
 * above its stream rate has timestamps at the playback rate; they are scaled by
 * playback ÷ capture rate. A clip whose timestamps are already capture times (a high-rate stream)
 * is left alone. A capture rate given by the caller overrides both.
 */
final class FfmpegClip implements ClipSource {
  /** Codecs whose clips the tests encode and decode; others FFmpeg decodes are let through. */
  static final String SUPPORTED = "MP4/MOV with H.264 or H.265 (HEVC), AVI with MJPEG, "
      + "or a folder of numbered PNG/JPEG images";
  private static final Set<Integer> LUMA_FIRST = Set.of(avutil.AV_PIX_FMT_YUV420P,
      avutil.AV_PIX_FMT_YUVJ420P, avutil.AV_PIX_FMT_YUV422P, avutil.AV_PIX_FMT_YUVJ422P,
      avutil.AV_PIX_FMT_YUV444P, avutil.AV_PIX_FMT_YUVJ444P, avutil.AV_PIX_FMT_GRAY8,
      avutil.AV_PIX_FMT_NV12, avutil.AV_PIX_FMT_NV21, avutil.AV_PIX_FMT_YUV440P,
      avutil.AV_PIX_FMT_YUVJ440P, avutil.AV_PIX_FMT_YUV411P);

  private final Path file;
  private final AVFormatContext format;
  private final AVCodecContext decoder;
  private final int stream;
  private final AVPacket packet;
  private final AVFrame frame;
  private final double tickSeconds;
  private final ClipInfo info;
  private GreyConverter converter;
  private long firstPts = Long.MIN_VALUE;
  private int index;
  private boolean draining;
  private boolean ended;

  private FfmpegClip(Path file, Double captureRate_fps) {
    this.file = file;
    av_log_set_level(AV_LOG_ERROR - 8); // quiet: failures become our own messages
    format = new AVFormatContext(null);
    int err = avformat_open_input(format, file.toString(), null, null);
    if (err < 0) {
      throw new LoadstoneException("clip " + file + " cannot be read as a video (" + text(err)
          + "): Loadstone reads " + SUPPORTED + "; convert it to one of those");
    }
    AVCodecContext ctx = null;
    try {
      if (avformat_find_stream_info(format, (AVDictionary) null) < 0) {
        throw new LoadstoneException("clip " + file + " holds no stream information FFmpeg can "
            + "read: the file may be cut short or damaged; copy it from the camera again");
      }
      stream = av_find_best_stream(format, AVMEDIA_TYPE_VIDEO, -1, -1, (AVCodec) null, 0);
      String container = format.iformat().name().getString();
      if (stream < 0) {
        throw new LoadstoneException("clip " + file + " (" + container + ") holds no video "
            + "stream: Loadstone reads " + SUPPORTED);
      }
      AVStream st = format.streams(stream);
      AVCodecParameters par = st.codecpar();
      String codec = avcodec_get_name(par.codec_id()).getString();
      AVCodec dec = avcodec_find_decoder(par.codec_id());
      if (dec == null || dec.isNull()) {
        throw new LoadstoneException("clip " + file + " is coded as '" + codec + "', which this "
            + "build's FFmpeg cannot decode: Loadstone reads " + SUPPORTED + "; convert the clip");
      }
      ctx = avcodec_alloc_context3(dec);
      avcodec_parameters_to_context(ctx, par);
      ctx.thread_count(2);
      err = avcodec_open2(ctx, dec, (AVDictionary) null);
      if (err < 0) {
        throw new LoadstoneException("clip " + file + ": the '" + codec + "' decoder does not "
            + "start (" + text(err) + "): Loadstone reads " + SUPPORTED);
      }
      if (par.width() < 1 || par.height() < 1) {
        throw new LoadstoneException("clip " + file + " states no frame size: the file may be "
            + "damaged; copy it from the camera again");
      }
      AVRational tb = st.time_base();
      AVRational avg = st.avg_frame_rate();
      double streamRate = avg.den() == 0 ? 0 : (double) avg.num() / avg.den();
      double scale = 1;
      String timeSource = "stream timestamps";
      Double stated = statedCaptureRate(st);
      if (captureRate_fps != null) {
        if (streamRate > 0 && captureRate_fps > streamRate * 1.2) {
          scale = streamRate / captureRate_fps;
        }
        timeSource = String.format(Locale.ROOT, "stream timestamps, capture rate %.6g frames/s "
            + "given", captureRate_fps);
      } else if (stated != null && streamRate > 0 && stated > streamRate * 1.2) {
        scale = streamRate / stated;
        timeSource = String.format(Locale.ROOT, "stream timestamps at the %.6g frames/s playback "
            + "rate, scaled to the %.6g frames/s capture rate the clip states", streamRate,
            stated);
      }
      tickSeconds = (double) tb.num() / tb.den() * scale;
      info = new ClipInfo(file, container, codec, par.width(), par.height(),
          streamRate / scale, scale, timeSource);
      decoder = ctx;
      packet = av_packet_alloc();
      frame = av_frame_alloc();
    } catch (RuntimeException e) {
      if (ctx != null) {
        avcodec_free_context(ctx);
      }
      avformat_close_input(format);
      throw e;
    }
  }

  /**
   * @param file a clip file
   * @param captureRate_fps the capture rate when the clip does not state it (slow motion), or null
   * @throws LoadstoneException naming the file, the codec found and what is supported
   */
  static FfmpegClip open(Path file, Double captureRate_fps) {
    if (!Files.isRegularFile(file)) {
      throw new LoadstoneException("clip " + file + " does not exist or is not a file: give the "
          + "path of the video file");
    }
    return new FfmpegClip(file, captureRate_fps);
  }

  private Double statedCaptureRate(AVStream st) {
    for (AVDictionary d : new AVDictionary[] {st.metadata(), format.metadata()}) {
      if (d == null || d.isNull()) {
        continue;
      }
      AVDictionaryEntry e = av_dict_get(d, "com.android.capture.fps", null, 0);
      if (e != null && !e.isNull()) {
        try {
          double v = Double.parseDouble(e.value().getString().trim());
          if (v > 0 && Double.isFinite(v)) {
            return v;
          }
        } catch (NumberFormatException ignored) {
          // not a rate: ignore the tag
        }
      }
    }
    return null;
  }

  @Override
  public ClipInfo info() {
    return info;
  }

  @Override
  public GreyFrame next() {
    while (!ended) {
      int r = avcodec_receive_frame(decoder, frame);
      if (r == 0) {
        return take();
      }
      if (r == AVERROR_EOF()) {
        ended = true;
        break;
      }
      if (r != AVERROR_EAGAIN()) {
        throw damaged(r);
      }
      if (draining) {
        ended = true;
        break;
      }
      feed();
    }
    return null;
  }

  private void feed() {
    while (true) {
      int r = av_read_frame(format, packet);
      if (r < 0) {
        draining = true;
        avcodec_send_packet(decoder, null);
        return;
      }
      try {
        if (packet.stream_index() == stream) {
          int s = avcodec_send_packet(decoder, packet);
          if (s < 0 && s != AVERROR_EAGAIN()) {
            throw damaged(s);
          }
          return;
        }
      } finally {
        av_packet_unref(packet);
      }
    }
  }

  private GreyFrame take() {
    long pts = frame.best_effort_timestamp();
    if (pts == AV_NOPTS_VALUE) {
      pts = frame.pts();
    }
    if (pts == AV_NOPTS_VALUE) {
      throw new LoadstoneException("clip " + file + ", frame " + index + " carries no "
          + "timestamp, so its capture time is unknown: re-save the clip with timestamps "
          + "(remux it to MP4) or export it as numbered images and give their frame rate");
    }
    if (firstPts == Long.MIN_VALUE) {
      firstPts = pts;
    }
    int w = frame.width();
    int h = frame.height();
    byte[] luma = new byte[w * h];
    if (LUMA_FIRST.contains(frame.format())) {
      int stride = frame.linesize(0);
      BytePointer plane = frame.data(0);
      ByteBuffer buf = plane.capacity((long) stride * (h - 1) + w).asByteBuffer();
      for (int y = 0; y < h; y++) {
        buf.position(y * stride);
        buf.get(luma, y * w, w);
      }
    } else {
      if (converter == null) {
        converter = new GreyConverter();
      }
      converter.convert(frame, luma);
    }
    double t = (pts - firstPts) * tickSeconds;
    return new GreyFrame(index++, t, w, h, luma);
  }

  /**
   * Moves back (or on) so that the next frames start at the last key frame at or before a capture
   * time. The frames that follow carry their true capture times, but their numbers count on from
   * where the decoder was, not from the key frame: {@link ClipFrames} numbers them by their time.
   *
   * @param time_s capture time from the first frame, seconds
   * @throws LoadstoneException when the container cannot seek there (the clip is damaged)
   */
  void seekBefore(double time_s) {
    if (firstPts == Long.MIN_VALUE) {
      return; // nothing decoded yet: already at the start
    }
    long target = firstPts + (long) Math.floor(time_s / tickSeconds);
    int r = av_seek_frame(format, stream, target, AVSEEK_FLAG_BACKWARD);
    if (r < 0) {
      throw new LoadstoneException(String.format(Locale.ROOT, "clip %s cannot be wound to %.3f "
          + "s (%s): the file's index may be damaged; remux the clip to MP4", file, time_s,
          text(r)));
    }
    avcodec_flush_buffers(decoder);
    draining = false;
    ended = false;
  }

  private LoadstoneException damaged(int err) {
    return new LoadstoneException("clip " + file + " is damaged near frame " + index + " ("
        + text(err) + "): copy it from the camera again, or track the part before it");
  }

  static String text(int err) {
    byte[] b = new byte[256];
    av_strerror(err, b, b.length);
    int n = 0;
    while (n < b.length && b[n] != 0) {
      n++;
    }
    return new String(b, 0, n, java.nio.charset.StandardCharsets.UTF_8);
  }

  @Override
  public void close() {
    if (converter != null) {
      converter.close();
    }
    av_frame_free(frame);
    av_packet_free(packet);
    avcodec_free_context(decoder);
    avformat_close_input(format);
  }
}
