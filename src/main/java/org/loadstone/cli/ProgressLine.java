package org.loadstone.cli;

import java.io.PrintWriter;
import org.loadstone.study.ArchiveRuns;

/**
 * Progress of a long job on standard error: on a terminal one line rewritten in place, else (a
 * log, a pipe) a plain line at each quarter, and only for jobs of {@value #LONG} runs or more.
 */
final class ProgressLine implements ArchiveRuns.Progress {
  /** Jobs shorter than this say nothing. */
  static final int LONG = 50;

  private final PrintWriter err;
  private final boolean terminal;
  private final String what;
  private int quarterShown;

  /**
   * @param err standard error
   * @param terminal whether it is a terminal (a line can be rewritten)
   * @param what the job, e.g. "analysing runs"
   */
  ProgressLine(PrintWriter err, boolean terminal, String what) {
    this.err = err;
    this.terminal = terminal;
    this.what = what;
  }

  /** @return progress for this process's standard error */
  static ProgressLine onStderr(PrintWriter err, String what) {
    return new ProgressLine(err, Terminal.statusLines(), what);
  }

  @Override
  public void analysed(int done, int total) {
    if (total < LONG) {
      return;
    }
    if (terminal) {
      err.print("\r" + what + " " + done + "/" + total + (done == total ? "\n" : ""));
      err.flush();
      return;
    }
    int quarter = 4 * done / total;
    if (quarter > quarterShown) {
      quarterShown = quarter;
      err.println(what + " " + done + "/" + total);
      err.flush();
    }
  }
}
