package org.loadstone.study;

import java.nio.file.Path;
import org.loadstone.files.ChildProgram;
import org.loadstone.study.LeftOut.Kind;

/**
 * A second station for {@link IndexedStudyTest}, run in its own JVM: for each line {@code
 * <archive> <group> <n>} it stores run {@code n} of that group, then compares the archive's
 * groups through the archive index as {@code compare} does, and answers how many runs counted
 * and how many notes the listing had (an index that could not be used gives one).
 */
public final class StudyChild {
  private StudyChild() {}

  public static void main(String[] args) throws Exception {
    ChildProgram.serve(line -> {
      String[] f = line.split(" ");
      Path dir = Path.of(f[0]);
      IndexedStudyTest.store(dir, f[1], Integer.parseInt(f[2]));
      ArchiveRuns runs = ArchiveRuns.scan(dir);
      Selection s = runs.select(RunSelection.DEFAULT.admitting(Kind.admissibleOnes()));
      return s.counted() + " " + runs.notes().size();
    });
  }
}
