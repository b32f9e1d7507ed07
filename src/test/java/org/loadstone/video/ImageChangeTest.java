package org.loadstone.video;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** The frame difference's energy per pixel, measured on frames of known noise. */
class ImageChangeTest {
  static GreyFrame noisy(Random r, int k, int w, int h, double sd) {
    byte[] luma = new byte[w * h];
    for (int i = 0; i < luma.length; i++) {
      luma[i] = (byte) Math.round(128 + sd * r.nextGaussian());
    }
    return new GreyFrame(k, k / 30.0, w, h, luma);
  }

  @Test
  void twoFramesOfIndependentNoiseDifferByTwiceTheirVariance() {
    // the difference of two independent normal variables of variance σ² has variance 2σ²; each
    // rounding to a whole grey level adds 1/12 (uniform rounding error, Sheppard's correction)
    double sd = 4;
    double expected = 2 * (sd * sd + 1.0 / 12);
    Random r = new Random(8);
    ImageChange change = new ImageChange(160, 120, null, null);
    assertThat(change.next(noisy(r, 0, 160, 120, sd), true)).isNaN();
    for (int k = 1; k < 20; k++) {
      // 19 200 pixels: the mean of d² has a standard error of √2·2σ²/√19200 ≈ 1 % of it
      assertThat(change.next(noisy(r, k, 160, 120, sd), false))
          .isCloseTo(expected, within(0.05 * expected));
    }
  }

  @Test
  void aLargeFrameIsSampledOnAGridAndTheLightIsLeftOut() {
    ImageChange full = new ImageChange(1920, 1080, null, null);
    assertThat(full.samples()).isBetween(ImageChange.MAX_SAMPLES / 2, ImageChange.MAX_SAMPLES);
    // a region small enough is compared pixel for pixel, less the light's pixels inside it
    ImageChange small = new ImageChange(160, 120, null, new PixelRegion(0, 0, 10, 10));
    assertThat(small.samples()).isEqualTo(160 * 120 - 100);
    // the light coming on is no change of the image
    byte[] dark = new byte[160 * 120];
    byte[] lit = dark.clone();
    for (int y = 0; y < 10; y++) {
      for (int x = 0; x < 10; x++) {
        lit[y * 160 + x] = (byte) 240;
      }
    }
    small.next(new GreyFrame(0, 0, 160, 120, dark), true);
    assertThat(small.next(new GreyFrame(1, 0.1, 160, 120, lit), false)).isZero();
  }
}
