package org.loadstone.video;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.CsvInput;
import org.loadstone.units.InputException;
import org.loadstone.units.JsonInput;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.TextFiles;

/**
 * A video table on disk: {@code NAME.csv} with the columns {@code time_s, position_mm,
 * across_mm, confidence, frame, lost} (time and position first, so any reader of position tables
 * takes columns 1 and 2; a lost frame has empty position cells, which such a reader refuses
 * rather than bridges), and {@code NAME.json} beside it with the scale, its source and
 * uncertainty, the loading direction, the sync and what was tracked. Both are published together
 * through {@link FilePublisher}: nothing is ever overwritten, and the sidecar marks a complete
 * pair.
 */
public final class VideoTableFiles {
  private VideoTableFiles() {}

  /** Header of the CSV. */
  public static final String HEADER = "time_s,position_mm,across_mm,confidence,frame,lost";

  /** Folder of the archive that holds the video tables of its runs. */
  public static final String ARCHIVE_FOLDER = "video";

  /**
   * @param csv the table's file name, ending in .csv; the sidecar takes the same name with .json
   * @return the CSV's path
   * @throws org.loadstone.files.FileExistsException when either file exists
   */
  public static Path publish(Path csv, VideoTable table) {
    Path json = sidecarOf(csv);
    byte[] body = csvText(table).getBytes(StandardCharsets.UTF_8);
    byte[] side;
    try {
      side = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
          .writeValueAsBytes(sidecar(table));
    } catch (IOException e) {
      throw new IllegalStateException(e);
    }
    FilePublisher.publishAll(List.of(
        new FilePublisher.Part(csv, "video table", out -> out.write(body)),
        new FilePublisher.Part(json, "video table sidecar", out -> out.write(side))));
    return csv;
  }

  /**
   * @param archive the archive folder
   * @param runId the run
   * @return the first free name {@code <archive>/video/<run-id>.csv}, {@code …-2.csv}, …
   */
  public static Path freeNameFor(Path archive, String runId) {
    Path dir = archive.resolve(ARCHIVE_FOLDER);
    for (int i = 1; ; i++) {
      Path p = dir.resolve(runId + (i == 1 ? "" : "-" + i) + ".csv");
      if (!Files.exists(p) && !Files.exists(sidecarOf(p))) {
        return p;
      }
    }
  }

  /**
   * @return the newest complete video table stored for the run (the highest number whose sidecar
   *     exists), or null
   */
  public static Path storedFor(Path archive, String runId) {
    Path dir = archive.resolve(ARCHIVE_FOLDER);
    Path found = null;
    for (int i = 1; i < 10_000; i++) {
      Path p = dir.resolve(runId + (i == 1 ? "" : "-" + i) + ".csv");
      if (!Files.exists(p)) {
        break;
      }
      if (Files.exists(sidecarOf(p))) {
        found = p;
      }
    }
    return found;
  }

  public static Path sidecarOf(Path csv) {
    String n = csv.getFileName().toString();
    if (!n.endsWith(".csv")) {
      throw new LoadstoneException("video table " + csv + " must be named NAME.csv (its "
          + "sidecar NAME.json goes beside it)");
    }
    return csv.resolveSibling(n.substring(0, n.length() - 4) + ".json");
  }

  static String csvText(VideoTable t) {
    StringBuilder b = new StringBuilder(HEADER).append('\n');
    for (int i = 0; i < t.rows(); i++) {
      if (t.lost()[i]) {
        b.append(String.format(Locale.ROOT, "%.6f,,,%.4f,%d,1%n", t.time_s()[i],
            t.confidence()[i], t.frame()[i]));
      } else {
        b.append(String.format(Locale.ROOT, "%.6f,%.6f,%.6f,%.4f,%d,0%n", t.time_s()[i],
            t.position_mm()[i], t.across_mm()[i], t.confidence()[i], t.frame()[i]));
      }
    }
    return b.toString();
  }

  static Map<String, Object> sidecar(VideoTable t) {
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("kind", "loadstone video table");
    m.put("format_version", 1);
    m.put("scale_mm_per_px", t.scale().mm_per_px());
    m.put("scale_source", t.scale().source());
    m.put("scale_relative_uncertainty", t.scale().relativeUncertainty());
    m.put("direction", t.direction().word());
    if (t.sync() != null) {
      m.put("sync_method", t.sync().method());
      m.put("offset_s", t.sync().offset_s());
      m.put("sync_detail", t.sync().detail());
    }
    m.put("frames", t.rows());
    m.put("lost_frames", t.lostCount());
    m.put("tracked", new LinkedHashMap<>(t.about()));
    return m;
  }

  /**
   * Reads a table and its sidecar.
   *
   * @param csv the table's CSV
   * @throws LoadstoneException naming the file, line and column of anything wrong, or the missing
   *     sidecar
   */
  public static VideoTable read(Path csv) {
    Path json = sidecarOf(csv);
    if (!Files.exists(json)) {
      throw new LoadstoneException("video table " + csv + " has no sidecar " + json.getFileName()
          + " beside it (the scale and sync are kept there): track the clip again, or read the "
          + "CSV as a plain position table");
    }
    JsonNode side = JsonInput.readObject(json, "video table sidecar",
        "track the clip again to write a new table");
    String text = TextFiles.read(csv, "video table");
    List<double[]> rows = new ArrayList<>();
    CSVFormat fmt = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true)
        .setIgnoreEmptyLines(true).setTrim(true).get();
    try (Reader r = new StringReader(text); CSVParser p = CSVParser.parse(r, fmt)) {
      if (!String.join(",", p.getHeaderNames()).equals(HEADER)) {
        throw new LoadstoneException("video table " + csv + " has the columns "
            + InputException.shown(String.join(",", p.getHeaderNames())) + ", not " + HEADER
            + ": it is not a table Loadstone tracked; read it as a plain position table");
      }
      for (CSVRecord rec : p) {
        long line = rec.getParser().getCurrentLineNumber();
        boolean lost = "1".equals(rec.get(5));
        double[] row = new double[6];
        for (int c = 0; c < 6; c++) {
          row[c] = lost && (c == 1 || c == 2) ? Double.NaN : number(rec, c, csv, line);
        }
        rows.add(row);
      }
    } catch (IOException | IllegalStateException | IllegalArgumentException e) {
      throw CsvInput.translate(e, InputException.in("video table", csv),
          "track the clip again to write a new table");
    }
    int n = rows.size();
    double[] t = new double[n];
    double[] x = new double[n];
    double[] a = new double[n];
    double[] c = new double[n];
    int[] k = new int[n];
    boolean[] lost = new boolean[n];
    for (int i = 0; i < n; i++) {
      double[] row = rows.get(i);
      t[i] = row[0];
      x[i] = row[1];
      a[i] = row[2];
      c[i] = row[3];
      k[i] = (int) row[4];
      lost[i] = row[5] == 1;
    }
    ImageScale scale = new ImageScale(side.path("scale_mm_per_px").asDouble(),
        side.path("scale_source").asText(), side.path("scale_relative_uncertainty").asDouble());
    VideoSync sync = side.has("offset_s") ? new VideoSync(side.path("sync_method").asText(),
        side.path("offset_s").asDouble(), side.path("sync_detail").asText()) : null;
    Map<String, Object> about = new ObjectMapper().convertValue(side.path("tracked"),
        new com.fasterxml.jackson.core.type.TypeReference<Map<String, Object>>() {});
    return new VideoTable(t, x, a, c, k, lost, scale,
        LoadingDirection.parse(side.path("direction").asText("down")), sync,
        about == null ? Map.of() : about);
  }

  private static double number(CSVRecord rec, int c, Path file, long line) {
    String cell = c < rec.size() ? rec.get(c) : "";
    try {
      double v = Double.parseDouble(cell);
      if (Double.isFinite(v)) {
        return v;
      }
    } catch (NumberFormatException ignored) {
      // reported below
    }
    throw new LoadstoneException("video table " + file + ", line " + line + ", column "
        + HEADER.split(",")[c] + ": " + InputException.shown(cell) + " is not a number; track "
        + "the clip again to write a new table");
  }
}
