package org.loadstone.video;

import static org.assertj.core.api.Assertions.assertThat;

import org.bytedeco.ffmpeg.avcodec.AVCodec;
import org.bytedeco.ffmpeg.global.avcodec;
import org.junit.jupiter.api.Test;

/**
 * The FFmpeg build the jar carries decodes what the README promises: H.264 and H.265 (HEVC) from
 * MP4/MOV and MJPEG from AVI, and demuxes those containers. (H.265 clips are not encoded in the
 * tests: the LGPL build has no H.265 encoder, libx265 being GPL.)
 */
class DecoderSetTest {
  @Test
  void theBuildDecodesThePromisedCodecs() {
    for (int id : new int[] {avcodec.AV_CODEC_ID_H264, avcodec.AV_CODEC_ID_HEVC,
        avcodec.AV_CODEC_ID_MJPEG}) {
      AVCodec c = avcodec.avcodec_find_decoder(id);
      assertThat(c != null && !c.isNull()).as("decoder for %s",
          avcodec.avcodec_get_name(id).getString()).isTrue();
    }
    for (String demuxer : new String[] {"mov", "avi"}) {
      var f = org.bytedeco.ffmpeg.global.avformat.av_find_input_format(demuxer);
      assertThat(f != null && !f.isNull()).as("demuxer %s", demuxer).isTrue();
    }
  }
}
