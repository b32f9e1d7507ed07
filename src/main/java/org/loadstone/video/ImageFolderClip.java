package org.loadstone.video;

import java.awt.image.BufferedImage;
import java.awt.image.DataBufferByte;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.loadstone.units.LoadstoneException;

/**
 * A folder of numbered images (PNG, JPEG, BMP) taken at a known frame rate. The frame's time is
 * its number less the first number, over the rate, so a gap in the numbering (a dropped frame)
 * keeps the later frames at their true times. Colour images are made grey with the BT.601 luma
 * weights 0.299, 0.587, 0.114 (the weights of the Y plane of a video frame).
 */
final class ImageFolderClip implements ClipSource {
  private static final Pattern NUMBER = Pattern.compile("(\\d+)(?!.*\\d)");
  private final List<Path> files;
  private final long[] numbers;
  private final double rate_fps;
  private final ClipInfo info;
  private int index;

  private ImageFolderClip(Path folder, double rate_fps) {
    this.rate_fps = rate_fps;
    record Numbered(Path file, long number) {}
    List<Numbered> found = new ArrayList<>();
    try (Stream<Path> s = Files.list(folder)) {
      for (Path p : (Iterable<Path>) s::iterator) {
        String n = p.getFileName().toString().toLowerCase(Locale.ROOT);
        if (n.matches(".*\\.(png|jpe?g|bmp)$")) {
          Matcher m = NUMBER.matcher(n.substring(0, n.lastIndexOf('.')));
          if (!m.find()) {
            throw new LoadstoneException("image " + p + " has no frame number in its name: name "
                + "the images of a clip with their frame numbers (frame-0001.png, …)");
          }
          found.add(new Numbered(p, Long.parseLong(m.group(1))));
        }
      }
    } catch (IOException e) {
      throw new LoadstoneException("image folder " + folder + " cannot be listed: "
          + e.getMessage(), e);
    }
    if (found.size() < 2) {
      throw new LoadstoneException("image folder " + folder + " holds " + found.size()
          + " numbered PNG/JPEG/BMP images; a clip needs at least 2");
    }
    found.sort(Comparator.comparingLong(Numbered::number));
    files = new ArrayList<>();
    numbers = new long[found.size()];
    for (int i = 0; i < found.size(); i++) {
      if (i > 0 && found.get(i).number() == found.get(i - 1).number()) {
        throw new LoadstoneException("images " + found.get(i - 1).file().getFileName() + " and "
            + found.get(i).file().getFileName() + " in " + folder + " carry the same frame "
            + "number: keep one image per frame in the folder");
      }
      files.add(found.get(i).file());
      numbers[i] = found.get(i).number();
    }
    BufferedImage first = read(files.get(0));
    String kind = files.get(0).getFileName().toString().replaceFirst(".*\\.", "")
        .toLowerCase(Locale.ROOT);
    info = new ClipInfo(folder, "images", kind, first.getWidth(), first.getHeight(), rate_fps, 1,
        String.format(Locale.ROOT, "image numbers at the given %.6g frames/s", rate_fps));
  }

  /**
   * @param folder a folder of numbered images
   * @param rate_fps the capture rate, frames per second
   * @throws LoadstoneException when the folder holds fewer than two numbered images, two carry the
   *     same number, or the rate is not positive
   */
  static ImageFolderClip open(Path folder, Double rate_fps) {
    if (rate_fps == null || !(rate_fps > 0) || !Double.isFinite(rate_fps)) {
      throw new LoadstoneException("image folder " + folder + " has no frame rate of its own: "
          + "give the rate at which the images were captured, frames per second",
          org.loadstone.units.Setting.VIDEO_FRAME_RATE);
    }
    return new ImageFolderClip(folder, rate_fps);
  }

  private static BufferedImage read(Path p) {
    try {
      BufferedImage img = ImageIO.read(p.toFile());
      if (img == null) {
        throw new LoadstoneException("image " + p + " is not a PNG, JPEG or BMP image that can be "
            + "read: save the frames as PNG");
      }
      return img;
    } catch (IOException e) {
      throw new LoadstoneException("image " + p + " cannot be read: " + e.getMessage(), e);
    }
  }

  @Override
  public ClipInfo info() {
    return info;
  }

  @Override
  public GreyFrame next() {
    if (index >= files.size()) {
      return null;
    }
    Path p = files.get(index);
    BufferedImage img = read(p);
    int w = img.getWidth();
    int h = img.getHeight();
    if (w != info.width() || h != info.height()) {
      throw new LoadstoneException("image " + p + " is " + w + "x" + h + " pixels, the first "
          + "image " + info.width() + "x" + info.height() + ": every frame of a clip must have "
          + "the same size");
    }
    byte[] luma;
    if (img.getType() == BufferedImage.TYPE_BYTE_GRAY) {
      luma = ((DataBufferByte) img.getRaster().getDataBuffer()).getData().clone();
    } else {
      luma = new byte[w * h];
      int[] rgb = img.getRGB(0, 0, w, h, null, 0, w);
      for (int i = 0; i < rgb.length; i++) {
        int c = rgb[i];
        double y = 0.299 * ((c >> 16) & 0xff) + 0.587 * ((c >> 8) & 0xff) + 0.114 * (c & 0xff);
        luma[i] = (byte) Math.min(255, Math.round(y));
      }
    }
    double t = (numbers[index] - numbers[0]) / rate_fps;
    return new GreyFrame(index++, t, w, h, luma);
  }

  /**
   * Moves to the last image at or before a capture time (the first image for an earlier time).
   *
   * @param time_s capture time from the first image, seconds
   */
  void seekBefore(double time_s) {
    int i = 0;
    while (i + 1 < numbers.length && (numbers[i + 1] - numbers[0]) / rate_fps <= time_s) {
      i++;
    }
    index = i;
  }

  @Override
  public void close() {
    // nothing held between frames
  }
}
