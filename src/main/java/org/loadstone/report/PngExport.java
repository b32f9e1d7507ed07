package org.loadstone.report;

import java.nio.file.Path;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/** Writes charts as PNG images. */
public final class PngExport {
  private PngExport() {}

  /**
   * Renders a chart to a PNG file of the given pixel size, through a temporary file.
   *
   * @param chart the chart, not null
   * @param file the target; must not exist
   * @param width_px image width, 16 to 10000 pixels
   * @param height_px image height, 16 to 10000 pixels
   * @throws LoadstoneException when the file exists, the size is out of range or writing fails
   */
  public static void write(JFreeChart chart, Path file, int width_px, int height_px) {
    org.loadstone.units.SlowWork.check("writing a chart image");
    Precondition.notNull(chart, "chart");
    Precondition.notNull(file, "file");
    if (width_px < 16 || height_px < 16 || width_px > 10_000 || height_px > 10_000) {
      throw new LoadstoneException("Image size " + width_px + " x " + height_px + " px is out of "
          + "range; give 16 to 10000 pixels each way.");
    }
    FilePublisher.publish(file, "image", out -> ChartUtils.writeChartAsPNG(out, chart, width_px,
        height_px));
  }
}
