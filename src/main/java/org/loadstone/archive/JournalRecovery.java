package org.loadstone.archive;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import java.util.function.DoubleUnaryOperator;
import org.loadstone.files.FileExistsException;
import org.loadstone.files.FilePublisher;
import org.loadstone.files.Folders;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Turns journals left by an unfinished run into stored runs, at start-up.
 *
 * <p>Each {@code <archive>/.journal/*.journal} becomes a run with cause {@code recovered}: every
 * intact record is kept (a torn last record is left out), force is derived again from the raw
 * counts with the header's scale spec and zero. The journal is deleted only after the run is
 * safely stored. A journal whose header cannot be read, or whose intact records could not all
 * be stored, is moved to {@code <archive>/.journal/damaged/}, never deleted.
 */
public final class JournalRecovery {
  private static final System.Logger LOG = System.getLogger(JournalRecovery.class.getName());

  private JournalRecovery() {}

  /** Same as {@link #recoverAll(Path, Consumer)}, with notices going to the system logger. */
  public static List<StoredRun> recoverAll(Path archiveDir) {
    return recoverAll(archiveDir, m -> LOG.log(System.Logger.Level.WARNING, m));
  }

  /**
   * @param archiveDir the archive folder; nothing happens when it has no journals
   * @param notices told one sentence per journal handled (recovered, moved aside, kept)
   * @return the runs stored, in journal-name (hence start-time) order
   * @throws LoadstoneException after trying every journal, when some could not be stored (e.g.
   *     disk full); those journals stay where they are and the message names them
   */
  public static List<StoredRun> recoverAll(Path archiveDir, Consumer<String> notices) {
    org.loadstone.units.SlowWork.check("recovering runs from journals");
    Precondition.notNull(archiveDir, "archiveDir");
    Precondition.notNull(notices, "notices");
    Path dir = JournalFormat.journalDir(archiveDir);
    if (!Files.isDirectory(dir)) {
      return List.of();
    }
    List<Path> journals = new ArrayList<>();
    try (DirectoryStream<Path> ds = Files.newDirectoryStream(dir, "*.journal")) {
      ds.forEach(p -> {
        if (Files.isRegularFile(p)) {
          journals.add(p);
        }
      });
    } catch (IOException e) {
      throw new LoadstoneException("cannot list journals in " + dir + ": " + e.getMessage()
          + ": check the folder's permissions", e);
    }
    journals.sort(null);
    List<StoredRun> stored = new ArrayList<>();
    List<String> failed = new ArrayList<>();
    for (Path j : journals) {
      try {
        StoredRun s = recoverOne(archiveDir, j, notices);
        if (s != null) {
          stored.add(s);
        }
      } catch (LoadstoneException e) {
        failed.add(e.getMessage());
        notices.accept(e.getMessage());
      } catch (RuntimeException e) {
        // a fault of ours must not stop the other journals; this one stays for the next start
        String m = "journal " + j + " could not be recovered (" + e + ")";
        failed.add(m);
        notices.accept(m);
      }
    }
    if (!failed.isEmpty()) {
      throw new LoadstoneException(failed.size() + " unfinished run(s) could not be recovered and"
          + " their journals are kept for the next try: " + String.join("; ", failed));
    }
    return stored;
  }

  private static StoredRun recoverOne(Path archiveDir, Path journal, Consumer<String> notices) {
    JournalContents c;
    // how the run ended, when it was finished before the program died (kept beside the journal)
    Optional<JournalEnd.Ended> end = JournalEnd.read(journal);
    try {
      c = readJournal(journal, end.map(JournalEnd.Ended::lastIndex).orElse(Long.MAX_VALUE));
    } catch (DamagedHeader e) {
      Path moved = moveAside(archiveDir, journal);
      notices.accept("journal " + journal + " has an unreadable header (" + e.getMessage()
          + ") and was moved to " + moved + ": its samples are kept there but could not be"
          + " turned into a run; report it with the file attached");
      return null;
    }
    String id = c.startInfo().runId();
    Path csv = archiveDir.resolve(id + ".csv");
    Path json = archiveDir.resolve(id + ".json");
    if (Files.exists(csv) && Files.exists(json) && readsBack(csv, c.data().size())) {
      delete(journal);
      notices.accept("journal " + journal + " belonged to run " + id + ", which was already"
          + " stored in full; the journal was removed");
      return null;
    }
    StoredRun s;
    String newId;
    if (!Files.exists(csv) && !Files.exists(json)) {
      newId = id; // the journal holds it
      s = RunWriter.write(archiveDir, recoveredMetadata(c, newId, journal, end), c.data());
    } else {
      // a part of the run is stored under `id`: another id, held while the files are made
      try (RunIdClaim claim = RunIdClaim.claim(archiveDir, id)) {
        newId = claim.id();
        s = RunWriter.write(archiveDir, recoveredMetadata(c, newId, journal, end), c.data());
      }
    }
    if (c.complete()) {
      delete(journal);
      notices.accept("unfinished run " + id + " was recovered from its journal as " + newId
          + " (" + c.data().size() + " samples)");
    } else {
      Path moved = moveAside(archiveDir, journal);
      notices.accept("unfinished run " + id + " was recovered as " + newId + ", but some"
          + " records could not be stored as samples (see the run's warnings); the journal was"
          + " kept as " + moved);
    }
    return s;
  }

  private static boolean readsBack(Path csv, int samples) {
    try {
      return RunReader.read(csv).data().size() >= samples;
    } catch (LoadstoneException e) {
      return false;
    }
  }

  private static RunMetadata recoveredMetadata(JournalContents c, String id, Path journal,
      Optional<JournalEnd.Ended> end) {
    RunMetadata h = c.startInfo();
    Optional<RunMetadata> ended = end.flatMap(e -> e.applyTo(h));
    RunMetadata e = ended.orElse(null);
    List<String> w = new ArrayList<>(ended.orElse(h).warnings());
    int n = c.data().size();
    if (e == null) {
      w.add("recovered from journal " + journal.getFileName() + ": the program ended before the"
          + " run was stored; " + n + " samples kept; why the run ended, and its break if it"
          + " had one, were not kept");
    } else {
      w.add("recovered from journal " + journal.getFileName() + ": the program ended while the"
          + " run was being stored; " + n + " samples kept; why the run ended and its break"
          + " were kept beside the journal");
      if (e.breakIndex() != null && e.breakIndex() >= n) {
        w.add("the run's break (sample " + e.breakIndex() + ") lies past the last sample the"
            + " journal holds (" + (n - 1) + "): the samples after it were held in memory"
            + " when the program ended and are lost, so the break was left out");
        e = e.toBuilder().breakIndex(null).breakTime_s(null).peakBeforeBreak_N(null)
            .dropAtBreak_pct(null).build();
      }
    }
    if (c.tornBytes() > 0) {
      w.add("the journal ended in " + c.tornBytes() + " bytes of an incomplete record (the last"
          + " write before the program ended); they were left out");
    }
    if (c.missedByJournal() > 0) {
      w.add(c.missedByJournal() + " samples were missed by the journal (it fell behind)");
    }
    if (c.outOfOrder() > 0) {
      w.add(c.outOfOrder() + " records were left out because their time was not after the"
          + " previous sample; the journal is kept in .journal/damaged");
    }
    if (c.positionDropped()) {
      w.add("position was present on only some records and was left out; the journal is kept"
          + " in .journal/damaged");
    }
    return RunMetadata.builder()
        .runId(id)
        .startedAt(h.startedAt())
        .specimen(h.specimen())
        .group(h.group())
        .tags(h.tags())
        .operator(h.operator())
        .notes(h.notes())
        .mass_g(h.mass_g())
        .geometry(h.geometry())
        .testType(h.testType())
        .device(h.device())
        .sampleRate_Hz(h.sampleRate_Hz())
        .calibrationId(h.calibrationId())
        .calibrationSha256(h.calibrationSha256())
        .scale(h.scale())
        .scaleSpec(h.scaleSpec())
        .zeroOffset_counts(h.zeroOffset_counts())
        .dropped(h.dropped() + c.seqGaps())
        .checksumErrors(h.checksumErrors())
        .cause(e == null ? FinishCause.RECOVERED : e.cause())
        .breakIndex(e == null ? null : e.breakIndex())
        .breakTime_s(e == null ? null : e.breakTime_s())
        .peakBeforeBreak_N(e == null ? null : e.peakBeforeBreak_N())
        .dropAtBreak_pct(e == null ? null : e.dropAtBreak_pct())
        .returnToZero_N(e == null ? null : e.returnToZero_N())
        .pretrigger_s(h.pretrigger_s())
        .startThreshold_N(h.startThreshold_N())
        .checkWeight(h.checkWeight())
        .warnings(w)
        .softwareVersion(h.softwareVersion())
        .extra(h.extra())
        .build();
  }

  /** The header could not be read. */
  static final class DamagedHeader extends LoadstoneException {
    private static final long serialVersionUID = 1L;

    DamagedHeader(String message) {
      super(message);
    }
  }

  /**
   * Reads a journal: its header and every intact record, stopping at the first torn one.
   *
   * @param journal a {@code .journal} file
   * @throws LoadstoneException when the file cannot be read or its header is damaged
   */
  public static JournalContents readJournal(Path journal) {
    return readJournal(journal, Long.MAX_VALUE);
  }

  /** As {@link #readJournal(Path)}, up to the record of ring index {@code lastIndex}. */
  static JournalContents readJournal(Path journal, long lastIndex) {
    Precondition.notNull(journal, "journal");
    try (InputStream in = new java.io.BufferedInputStream(Files.newInputStream(journal), 1 << 16)) {
      RunMetadata header = readHeader(in, journal);
      return readRecords(in, header, derive(header), lastIndex);
    } catch (IOException e) {
      throw new LoadstoneException("journal " + journal + " cannot be read: " + e.getMessage()
          + ": check the file's permissions", e);
    }
  }

  /**
   * How the journal's samples become columns.
   *
   * @throws DamagedHeader when the header's scale cannot turn counts into force
   */
  static JournalScan.Derive derive(RunMetadata header) {
    DoubleUnaryOperator force;
    try {
      force = ScaleForce.of(header.scaleSpec());
    } catch (LoadstoneException e) {
      throw new DamagedHeader("its scale_spec cannot be used: " + e.getMessage());
    }
    return new JournalScan.Derive(force, header.zeroOffset_counts(), countsPerMm(header));
  }

  /** Reads the header line; the stream is left at the first record. */
  static RunMetadata readHeader(InputStream in, Path journal) throws IOException {
    ByteArrayOutputStream line = new ByteArrayOutputStream();
    int b;
    while ((b = in.read()) != '\n') {
      if (b < 0) {
        throw new DamagedHeader("the header line is incomplete");
      }
      if (line.size() >= JournalFormat.MAX_HEADER_BYTES) {
        throw new DamagedHeader("the header line is longer than 1 MiB");
      }
      line.write(b);
    }
    JsonNode root;
    try {
      root = RunJson.LINE.readTree(line.toByteArray());
    } catch (IOException e) {
      throw new DamagedHeader("the header is not valid JSON");
    }
    if (root == null || !root.isObject() || root.path("journal_format").asInt(-1)
        != JournalFormat.VERSION) {
      throw new DamagedHeader("the header has no journal_format " + JournalFormat.VERSION);
    }
    ((com.fasterxml.jackson.databind.node.ObjectNode) root).remove("journal_format");
    RunMetadata m;
    try {
      m = RunJson.fromTree(root, "journal " + journal, FinishCause.RECOVERED);
    } catch (LoadstoneException e) {
      throw new DamagedHeader(e.getMessage());
    }
    if (!RunIds.isValid(m.runId())) {
      throw new DamagedHeader("its run_id '" + m.runId() + "' is not a safe file name");
    }
    return m;
  }

  private static double countsPerMm(RunMetadata h) {
    String v = h.device().get("cpm");
    try {
      double d = v == null ? Double.NaN : Double.parseDouble(v);
      return Double.isFinite(d) && d != 0 ? d : Double.NaN;
    } catch (NumberFormatException e) {
      return Double.NaN;
    }
  }

  private static JournalContents readRecords(InputStream in, RunMetadata header,
      JournalScan.Derive d, long lastIndex) throws IOException {
    int[] cap = {4096};
    long[][] t = {new long[cap[0]]};
    int[][] k = {new int[cap[0]]};
    int[][] p = {new int[cap[0]]};
    int[][] s = {new int[cap[0]]};
    JournalScan scan = JournalScan.run(in, lastIndex, (i, timeUs, counts, hp, pos, seq) -> {
      if (i == t[0].length) {
        int m = i * 2;
        t[0] = Arrays.copyOf(t[0], m);
        k[0] = Arrays.copyOf(k[0], m);
        p[0] = Arrays.copyOf(p[0], m);
        s[0] = Arrays.copyOf(s[0], m);
      }
      t[0][i] = timeUs;
      k[0][i] = counts;
      p[0][i] = pos;
      s[0][i] = seq;
    });
    int n = scan.samples;
    boolean pos = scan.position();
    double[] time = new double[n];
    double[] f = new double[n];
    double[] mm = pos ? new double[n] : null;
    for (int i = 0; i < n; i++) {
      time[i] = d.time_s(t[0][i], scan.firstTimeUs);
      f[i] = d.force_N(k[0][i]);
      if (pos) {
        mm[i] = d.position_mm(p[0][i]);
      }
    }
    RunMetadata h = header.withWarnings(d.warnings(header, pos));
    RunData data = new RunData(time, f, mm, Arrays.copyOf(k[0], n),
        pos ? Arrays.copyOf(p[0], n) : null, Arrays.copyOf(s[0], n));
    return new JournalContents(h, data, scan.firstIndex, scan.missedByJournal, scan.seqGaps,
        scan.outOfOrder, scan.tornBytes, scan.positionDropped());
  }

  private static Path moveAside(Path archiveDir, Path journal) {
    Path dir = JournalFormat.damagedDir(archiveDir);
    RunWriter.ensureFolder(dir);
    String name = journal.getFileName().toString();
    for (int n = 1; ; n++) {
      Path target = dir.resolve(n == 1 ? name : name + "." + n);
      try {
        FilePublisher.moveWithoutReplacing(journal, target, "journal");
        JournalEnd.delete(journal); // what it said is in the recovered run, if one was made
        return target;
      } catch (FileExistsException e) {
        // an earlier damaged journal of that name: take the next number
      } catch (LoadstoneException e) {
        throw new LoadstoneException("journal " + journal + " could not be moved to " + dir
            + " (" + e.getMessage() + "): move it there by hand; it was not changed", e);
      }
    }
  }

  private static void delete(Path journal) {
    try {
      Files.delete(journal);
      JournalEnd.delete(journal);
      Folders.sync(journal.getParent());
    } catch (IOException e) {
      throw new LoadstoneException("journal " + journal + " was recovered but cannot be removed: "
          + e.getMessage() + ": delete it by hand so it is not recovered twice", e);
    }
  }
}
