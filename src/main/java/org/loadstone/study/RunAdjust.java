package org.loadstone.study;

import org.loadstone.archive.FinishCause;
import org.loadstone.archive.RunData;
import org.loadstone.archive.RunMetadata;
import org.loadstone.archive.ScaleForce;
import org.loadstone.archive.ScaleSpec;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.DoubleUnaryOperator;
import org.loadstone.analysis.position.BreakAlignment;
import org.loadstone.analysis.position.Compliance;
import org.loadstone.analysis.position.CrossheadRate;
import org.loadstone.analysis.position.PositionTable;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Derives a run again from its raw data, for re-analysis; nothing here writes a file, so the stored
 * run is never changed. Each step returns a new run and says what it did in {@link #notes()}.
 *
 * @param metadata the (adjusted) metadata
 * @param data the (adjusted) columns
 * @param notes what was changed, in words
 */
public record RunAdjust(RunMetadata metadata, RunData data, List<String> notes) {
  public RunAdjust {
    Precondition.notNull(metadata, "metadata");
    Precondition.notNull(data, "data");
    notes = List.copyOf(notes);
  }

  /** Starts from a stored run, unchanged. */
  public static RunAdjust of(RunMetadata metadata, RunData data) {
    return new RunAdjust(metadata, data, List.of());
  }

  private RunAdjust with(RunMetadata m, RunData d, String note) {
    List<String> n = new ArrayList<>(notes);
    n.add(note);
    return new RunAdjust(m, d, n);
  }

  /**
   * Derives force again from the raw counts with another calibration; the zero offset recorded
   * with the run is kept.
   *
   * @param spec the other calibration's response
   * @param calibrationId its id
   * @param sha256 its content hash
   * @throws LoadstoneException for an imported run, which has no raw counts
   */
  public RunAdjust recalibrated(ScaleSpec spec, String calibrationId, String sha256) {
    if (metadata.cause() == FinishCause.IMPORTED) {
      throw new LoadstoneException("run " + metadata.runId() + " was imported and has no raw "
          + "counts, so another calibration cannot be applied to it");
    }
    DoubleUnaryOperator f = ScaleForce.of(spec);
    int[] raw = data.rawCounts();
    double zero = metadata.zeroOffset_counts();
    double[] force = new double[raw.length];
    for (int i = 0; i < raw.length; i++) {
      force[i] = f.applyAsDouble(raw[i] - zero);
    }
    RunMetadata m = metadata.withScale(calibrationId, sha256, "calibration " + calibrationId,
        spec);
    return with(m, new RunData(data.time_s(), force, data.position_mm(), raw, data.rawPosition(),
        data.seq()), "force derived again from the raw counts with calibration " + calibrationId
        + " (the stored run keeps " + (metadata.calibrationId() == null ? "its nominal scale"
            : "calibration " + metadata.calibrationId()) + ")");
  }

  /**
   * Position from a constant crosshead rate: rate × time since the first sample.
   *
   * @param rate_mm_per_min crosshead rate, mm/min, greater than zero
   */
  public RunAdjust withCrossheadRate(double rate_mm_per_min) {
    double[] x = CrossheadRate.position_mm(data.time_s(), rate_mm_per_min);
    return with(metadata, withPosition(x), String.format(Locale.ROOT,
        "position from a constant crosshead rate of %.4g mm/min", rate_mm_per_min));
  }

  /**
   * Position from an imported position–time table, aligned by a given offset or by the break
   * seen in both records, interpolated onto the force timestamps.
   *
   * @param table the table
   * @param offset_s table clock minus run clock, or null to align by the break
   */
  public RunAdjust withPositionTable(PositionTable table, Double offset_s) {
    double off;
    String how;
    if (offset_s == null) {
      BreakAlignment.Alignment a = BreakAlignment.byBreak(data.time_s(), data.force_N(), table);
      off = a.offset_s();
      how = String.format(Locale.ROOT, "aligned by the break (force record %.4f s, table %.4f s)",
          a.forceBreakTime_s(), a.tableBreakTime_s());
    } else {
      off = offset_s;
      how = "aligned by the given offset";
    }
    double[] t = data.time_s();
    double lo = table.time_s()[0] - off;
    double hi = table.time_s()[table.time_s().length - 1] - off;
    int i0 = 0;
    while (i0 < t.length && t[i0] < lo) {
      i0++;
    }
    int i1 = t.length - 1;
    while (i1 >= 0 && t[i1] > hi) {
      i1--;
    }
    if (i1 - i0 < 1) {
      throw new LoadstoneException(String.format(Locale.ROOT, "the position table covers run "
          + "times %.4f to %.4f s, which holds fewer than 2 of the run's samples (run: %.4f to "
          + "%.4f s): check the table's time offset against the run and its time unit", lo, hi,
          t[0], t[t.length - 1]), org.loadstone.units.Setting.TABLE_OFFSET);
    }
    RunAdjust cut = i0 == 0 && i1 == t.length - 1 ? this : trimmed(i0, i1);
    double[] x = table.resampleOnto(cut.data.time_s(), off);
    String trimNote = cut == this ? "" : String.format(Locale.ROOT,
        "; the run was trimmed to the %d samples the table covers (%.4f to %.4f s)",
        i1 - i0 + 1, t[i0], t[i1]);
    return cut.with(cut.metadata, cut.withPosition(x), String.format(Locale.ROOT,
        "position from an imported table, %s: table time = run time %+.4f s%s", how, off,
        trimNote));
  }

  /**
   * Records what the run's position channel measures (crosshead, a mid-span gauge, a video point),
   * which decides the four-point deflection formula; the samples are unchanged.
   *
   * @param source what the position measures
   */
  public RunAdjust positionMeasures(org.loadstone.analysis.PositionSource source) {
    Precondition.notNull(source, "source");
    java.util.Map<String, Object> extra = new java.util.LinkedHashMap<>(metadata.extra());
    extra.put(org.loadstone.analysis.PositionSource.METADATA_KEY, source.wireName());
    return with(metadata.toBuilder().extra(extra).build(), data,
        "the position channel measures: " + source.wireName());
  }

  /**
   * Removes the load frame's own deflection: position − F / k_frame.
   *
   * @param frameStiffness_N_per_mm the frame's stiffness
   * @param source where it comes from, for the note
   */
  public RunAdjust complianceCorrected(double frameStiffness_N_per_mm, String source) {
    if (data.position_mm() == null) {
      throw new LoadstoneException("run " + metadata.runId() + " has no position, so there is "
          + "nothing to correct for frame compliance: give a position source first");
    }
    double[] x = Compliance.correct(data.position_mm(), data.force_N(), frameStiffness_N_per_mm);
    return with(metadata, withPosition(x), String.format(Locale.ROOT,
        "frame compliance removed: position − F / %.5g N/mm (%s)", frameStiffness_N_per_mm,
        source));
  }

  private RunAdjust trimmed(int i0, int i1) {
    RunData d = data;
    RunData c = new RunData(java.util.Arrays.copyOfRange(d.time_s(), i0, i1 + 1),
        java.util.Arrays.copyOfRange(d.force_N(), i0, i1 + 1),
        d.position_mm() == null ? null : java.util.Arrays.copyOfRange(d.position_mm(), i0, i1 + 1),
        java.util.Arrays.copyOfRange(d.rawCounts(), i0, i1 + 1),
        d.rawPosition() == null ? null : java.util.Arrays.copyOfRange(d.rawPosition(), i0, i1 + 1),
        java.util.Arrays.copyOfRange(d.seq(), i0, i1 + 1));
    Integer b = metadata.breakIndex();
    Integer nb = b == null || b < i0 || b > i1 ? null : b - i0;
    RunMetadata mm = metadata.withBreak(nb, nb == null ? null : metadata.breakTime_s());
    return new RunAdjust(mm, c, notes);
  }

  private RunData withPosition(double[] x) {
    int[] rawPos = data.rawPosition() != null ? data.rawPosition() : new int[x.length];
    return new RunData(data.time_s(), data.force_N(), x, data.rawCounts(), rawPos, data.seq());
  }
}
