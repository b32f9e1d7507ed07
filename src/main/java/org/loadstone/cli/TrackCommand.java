package org.loadstone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.loadstone.cli.RunResolver.ResolvedRun;
import org.loadstone.study.VideoPosition;
import org.loadstone.units.LoadstoneException;
import org.loadstone.video.ClipSource;
import org.loadstone.video.Clips;
import org.loadstone.video.ImageScale;
import org.loadstone.video.LoadingDirection;
import org.loadstone.video.PixelPoint;
import org.loadstone.video.PixelRegion;
import org.loadstone.video.Track;
import org.loadstone.video.TrackSettings;
import org.loadstone.video.VideoSync;
import org.loadstone.video.VideoTable;
import org.loadstone.video.VideoTableFiles;
import org.loadstone.video.VideoTracker;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code loadstone track}: displacement from a clip, as a video table beside the run. */
@Command(
    name = "track",
    description = {
      "Track a marked point through a clip and store its displacement as a video table.",
      "Reads MP4/MOV (H.264, H.265), AVI (MJPEG) or a folder of numbered images (with --frame-rate-hz). "
          + "Progress goes to stderr. The run's own files are never changed."
    })
public final class TrackCommand implements Callable<Integer> {
  @CommandLine.Mixin ArchiveOption archive;

  @Parameters(paramLabel = "VIDEO", description = "The clip, or a folder of numbered images.")
  Path video;

  @Option(names = "--point", required = true, paramLabel = "X,Y", description = "The point on the moving part in the first frame, pixels from the top-left corner (y down).")
  String point;

  @Option(names = "--reference", paramLabel = "X,Y", description = "A fixed point in the first frame whose motion (camera shake) is taken off.")
  String reference;

  @Option(names = "--scale", required = true, paramLabel = "SCALE", description = "Two points a known distance apart and that distance, X1,Y1 X2,Y2 = L UNIT, e.g. \"12,40 148,40 = 50 mm\".")
  String scale;

  @Option(names = "--direction", paramLabel = "WAY", defaultValue = "down", description = "Way the loading part moves in the image: down, up, left or right (default: ${DEFAULT-VALUE}).")
  String direction;

  @Option(names = "--sync", arity = "1..2", paramLabel = "HOW", description = "With --run: break, change [X,Y,W,H] (the image's sudden change at the break, over the whole frame or a region), light X,Y,W,H (the light's region) or offset S (clip time minus run time). (default: break).")
  String[] sync;

  @Option(names = "--run", paramLabel = "RUN", description = "The run the clip belongs to (id, id prefix or run file); the table is stored beside it.")
  String run;

  @Option(names = "--out", paramLabel = "FILE", description = "Write the table here (NAME.csv, with NAME.json beside it) instead of beside the run.")
  Path out;

  @Option(names = "--frame-rate-hz", paramLabel = "HZ", description = "Capture rate, frames/s: required for an image folder; for a slow-motion clip that does not state it.")
  Double frameRate;

  @Option(names = "--template-px", paramLabel = "PX", defaultValue = "25", description = "Side of the tracked template, pixels (default: ${DEFAULT-VALUE}).")
  int templatePx;

  @Option(names = "--search-px", paramLabel = "PX", defaultValue = "16", description = "Search reach around the predicted place, pixels (default: ${DEFAULT-VALUE}).")
  int searchPx;

  @Option(names = "--json", description = "Write the stored table and its summary as one JSON document on standard output (schema loadstone-track); the text goes to standard error.")
  boolean json;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    PrintWriter outText = JsonDocument.human(spec, json);
    PrintWriter err = spec.commandLine().getErr();
    ImageScale sc = ImageScale.parse(scale);
    LoadingDirection dir = LoadingDirection.parse(direction);
    PixelPoint p = PixelPoint.parse(point, "tracked point");
    PixelPoint r = reference == null ? null : PixelPoint.parse(reference, "reference point");
    String how = sync == null ? "break" : sync[0];
    PixelRegion lamp = null;
    PixelRegion changeRegion = null;
    if (how.equals("light")) {
      if (sync.length < 2) {
        throw new LoadstoneException("--sync light needs the light's region X,Y,W,H");
      }
      lamp = PixelRegion.parse(sync[1]);
    } else if (how.equals("change")) {
      changeRegion = sync.length < 2 ? null : PixelRegion.parse(sync[1]);
    } else if (!how.equals("break") && !how.equals("offset")) {
      throw new LoadstoneException("--sync '" + how + "': use break, change [X,Y,W,H], "
          + "light X,Y,W,H or offset S");
    }
    if (out == null && run == null) {
      throw new LoadstoneException("say where the table goes: --run RUN (stored beside the run) "
          + "or --out FILE");
    }
    ResolvedRun rr = run == null ? null : CliWiring.resolve(run, archive.folder());
    TrackSettings settings = TrackSettings.DEFAULTS.withWindow(templatePx, searchPx);
    Track track;
    try (ClipSource clip = Clips.open(video, frameRate)) {
      err.printf(Locale.ROOT, "clip %s: %s in %s, %dx%d, %.3g frames/s (%s)%n", video,
          clip.info().codec(), clip.info().container(), clip.info().width(),
          clip.info().height(), clip.info().nominalRate_fps(), clip.info().timeSource());
      err.flush();
      int[] shown = {0};
      track = VideoTracker.track(clip, new VideoTracker.Request(p, r, lamp, settings, changeRegion),
          (f, info) -> {
            if (f.index() % 50 == 0) {
              err.printf(Locale.ROOT, "frame %d, %.3f s%s%n", f.index(), f.time_s(),
                  f.lost() ? ", lost" : String.format(Locale.ROOT, ", confidence %.3f",
                      f.confidence()));
              err.flush();
              shown[0]++;
            }
          }, null);
    }
    VideoTable table = VideoTable.of(track, sc, dir);
    if (rr != null) {
      VideoSync.Way way = VideoSync.Way.valueOf(how.toUpperCase(Locale.ROOT));
      table = table.withSync(VideoPosition.sync(way,
          way == VideoSync.Way.OFFSET ? offsetValue() : 0, track, table, rr.metadata(),
          rr.data().time_s(), rr.data().force_N()));
    } else if (how.equals("offset")) {
      table = table.withSync(VideoSync.offset(offsetValue()));
    } else if (sync != null) {
      throw new LoadstoneException("--sync " + how + " needs the run: give --run RUN");
    }
    Path target = out != null ? out : VideoTableFiles.freeNameFor(
        Path.of(rr.source()).toAbsolutePath().getParent(), rr.metadata().runId());
    VideoTableFiles.publish(target, table);
    outText.printf(Locale.ROOT, "tracked %d frames, %d lost%n", table.rows(), table.lostCount());
    for (Track.LostSpan l : track.lostSpans()) {
      outText.printf(Locale.ROOT, "  lost: frames %d-%d (%.3f to %.3f s): no position there%n",
          l.firstFrame(), l.lastFrame(), l.from_s(), l.to_s());
    }
    outText.printf(Locale.ROOT, "scale %.6g mm/px ± %.2f %% (%s)%n", sc.mm_per_px(),
        100 * sc.relativeUncertainty(), sc.source());
    if (table.sync() != null) {
      outText.printf(Locale.ROOT, "sync by %s: clip time = run time %+.4f s (%s)%n",
          table.sync().method(), table.sync().offset_s(), table.sync().detail());
    }
    outText.println("table: " + target);
    if (json) {
      Map<String, Object> j = new LinkedHashMap<>();
      j.put("run_id", rr == null ? null : rr.metadata().runId());
      j.put("table_file", target.toString());
      j.put("sidecar_file", VideoTableFiles.sidecarOf(target).toString());
      j.put("frame_count", table.rows());
      j.put("lost_frame_count", table.lostCount());
      j.put("scale_mm_per_px", sc.mm_per_px());
      j.put("scale_relative_uncertainty", sc.relativeUncertainty());
      j.put("sync_method", table.sync() == null ? null : table.sync().method());
      j.put("sync_offset_s", table.sync() == null ? null : table.sync().offset_s());
      JsonDocument.write(spec.commandLine().getOut(), JsonDocument.Kind.TRACK, j);
    }
    outText.flush();
    return 0;
  }

  private double offsetValue() {
    if (sync.length < 2) {
      throw new LoadstoneException("--sync offset needs the offset S in seconds (clip time "
          + "minus run time)");
    }
    try {
      return Double.parseDouble(sync[1]);
    } catch (NumberFormatException e) {
      throw new LoadstoneException("--sync offset '" + sync[1] + "' is not a number of seconds");
    }
  }
}
