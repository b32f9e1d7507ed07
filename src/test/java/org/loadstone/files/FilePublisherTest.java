package org.loadstone.files;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermission;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.units.LoadstoneException;

class FilePublisherTest {
  @TempDir Path tmp;

  private static List<String> names(Path dir) throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }

  private static byte[] utf8(String s) {
    return s.getBytes(StandardCharsets.UTF_8);
  }

  @Test
  void publishesTheWholeContentCreatesTheFolderAndLeavesNoTemporaryName() throws Exception {
    Path target = tmp.resolve("new/folder/a.txt");
    assertThat(FilePublisher.publish(target, "note", utf8("hello\n"))).isEqualTo(target);
    assertThat(Files.readString(target)).isEqualTo("hello\n");
    assertThat(names(target.getParent())).containsExactly("a.txt");
  }

  @Test
  void anExistingFileIsNeverReplacedAndTheMessageNamesItAndTheFix() throws Exception {
    Path target = Files.writeString(tmp.resolve("keep.txt"), "old");
    assertThatThrownBy(() -> FilePublisher.publish(target, "PDF report", utf8("new")))
        .isInstanceOf(FileExistsException.class)
        .hasMessageContaining("PDF report " + target + " already exists")
        .hasMessageContaining("choose another name or move the old file away");
    assertThat(Files.readString(target)).isEqualTo("old");
    assertThat(names(tmp)).containsExactly("keep.txt");
  }

  @Test
  void aFailingContentLeavesNothingBehind() throws Exception {
    Path target = tmp.resolve("x.csv");
    assertThatThrownBy(() -> FilePublisher.publish(target, "CSV file", out -> {
      out.write(utf8("half"));
      throw new LoadstoneException("cell 3 is not a number");
    })).isInstanceOf(LoadstoneException.class).hasMessage("cell 3 is not a number");
    assertThat(names(tmp)).isEmpty();
  }

  @Test
  void withoutHardLinksTheFallbackPublishesAndStillNeverReplaces() throws Exception {
    FakeDisk disk = FakeDisk.create().withoutLinks();
    Path target = disk.path(tmp.resolve("cal.json"));
    FilePublisher.publish(target, "calibration file", utf8("{\"id\":1}\n"));
    assertThat(disk.linksRefused()).isEqualTo(1);
    assertThat(Files.readString(tmp.resolve("cal.json"))).isEqualTo("{\"id\":1}\n");
    assertThat(names(tmp)).containsExactly("cal.json");

    assertThatThrownBy(() -> FilePublisher.publish(target, "calibration file", utf8("other")))
        .isInstanceOf(FileExistsException.class);
    assertThat(Files.readString(tmp.resolve("cal.json"))).isEqualTo("{\"id\":1}\n");
    assertThat(names(tmp)).containsExactly("cal.json");
  }

  @Test
  void withoutHardLinksANameThatAppearsWhileWritingIsStillNotReplaced() throws Exception {
    FakeDisk disk = FakeDisk.create().withoutLinks();
    Path target = disk.path(tmp.resolve("late.txt"));
    assertThatThrownBy(() -> FilePublisher.publish(target, "export", out -> {
      Files.writeString(tmp.resolve("late.txt"), "another program's"); // a rival, mid-write
      out.write(utf8("ours"));
    })).isInstanceOf(FileExistsException.class).hasMessageContaining("late.txt");
    assertThat(Files.readString(tmp.resolve("late.txt"))).isEqualTo("another program's");
    assertThat(names(tmp)).containsExactly("late.txt");
  }

  @Test
  void aGroupIsPublishedInOrderAndAPartThatCannotBeRemovesTheOthers() throws Exception {
    Path a = tmp.resolve("r.csv");
    Path b = tmp.resolve("r.json");
    List<Path> out = FilePublisher.publishAll(List.of(
        new FilePublisher.Part(a, "run file", o -> o.write(utf8("t,f\n"))),
        new FilePublisher.Part(b, "run file", o -> o.write(utf8("{}\n")))));
    assertThat(out).containsExactly(a, b);
    assertThat(Files.readString(a)).isEqualTo("t,f\n");

    Path c = tmp.resolve("s.csv");
    Path d = tmp.resolve("s.json");
    assertThatThrownBy(() -> FilePublisher.publishAll(List.of(
        new FilePublisher.Part(c, "run file", o -> o.write(utf8("t,f\n"))),
        new FilePublisher.Part(d, "run file", o -> {
          Files.writeString(d, "rival"); // the second name is taken while the group is written
          o.write(utf8("{}\n"));
        }))))
        .isInstanceOf(FileExistsException.class).hasMessageContaining("s.json");
    assertThat(c).doesNotExist(); // published first, then removed: no half group
    assertThat(Files.readString(d)).isEqualTo("rival");
    assertThat(names(tmp)).containsExactly("r.csv", "r.json", "s.json");
  }

  @Test
  void aGroupWithAnyNameTakenWritesNothing() throws Exception {
    Files.writeString(tmp.resolve("t.json"), "kept");
    assertThatThrownBy(() -> FilePublisher.publishAll(List.of(
        new FilePublisher.Part(tmp.resolve("t.csv"), "run file", o -> o.write(1)),
        new FilePublisher.Part(tmp.resolve("t.json"), "run file", o -> o.write(2)))))
        .isInstanceOf(FileExistsException.class).hasMessageContaining("t.json");
    assertThat(names(tmp)).containsExactly("t.json");
  }

  @Test
  void aFullDiskIsNamedWithTheFileAndTheFixAndLeavesNothing() throws Exception {
    for (boolean links : new boolean[] {true, false}) {
      FakeDisk disk = FakeDisk.create().bytesLeft(1000);
      if (!links) {
        disk.withoutLinks();
      }
      Path target = disk.path(tmp.resolve("big-" + links + ".pdf"));
      assertThatThrownBy(() -> FilePublisher.publish(target, "PDF report", new byte[5000]))
          .isInstanceOf(LoadstoneException.class)
          .isNotInstanceOf(FileExistsException.class)
          .hasMessageContaining("PDF report " + target + " cannot be written")
          .hasMessageContaining("is full (No space left on device)")
          .hasMessageContaining("free space on it or choose another folder");
      assertThat(names(tmp)).isEmpty();
    }
  }

  @Test
  void aFolderThatCannotBeMadeIsNamed() throws Exception {
    // a folder below a regular file cannot be made, even by root (permissions would not stop it)
    Path file = Files.writeString(tmp.resolve("plain"), "x");
    assertThatThrownBy(() -> FilePublisher.publish(file.resolve("sub/a.png"), "image",
        utf8("png")))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("folder " + file.resolve("sub") + " for the image cannot be created")
        .hasMessageContaining("choose a folder you may write to");
  }

  @Test
  void filesGetThePermissionsTheUmaskGivesNotOwnerOnly() throws Exception {
    if (!Files.getFileStore(tmp).supportsFileAttributeView("posix")) {
      return; // no POSIX permissions on this file system: nothing to compare
    }
    // an ordinary new file in the same folder shows what the process's umask gives
    Set<PosixFilePermission> umaskGives =
        Files.getPosixFilePermissions(Files.createFile(tmp.resolve("reference")));
    Path linked = FilePublisher.publish(tmp.resolve("linked.txt"), "note", utf8("a"));
    FakeDisk noLinks = FakeDisk.create().withoutLinks();
    FilePublisher.publish(noLinks.path(tmp.resolve("fallback.txt")), "note", utf8("b"));
    Path log = tmp.resolve("log.jsonl");
    FileLog.append(log, "log", utf8("{}\n"));
    assertThat(Files.getPosixFilePermissions(linked)).isEqualTo(umaskGives);
    assertThat(Files.getPosixFilePermissions(tmp.resolve("fallback.txt"))).isEqualTo(umaskGives);
    assertThat(Files.getPosixFilePermissions(log)).isEqualTo(umaskGives);
  }

  @Test
  void moveWithoutReplacingMovesAndRefusesATakenName() throws Exception {
    for (FakeDisk disk : List.of(FakeDisk.create(), FakeDisk.create().withoutLinks())) {
      Path dir = Files.createDirectories(tmp.resolve("m" + disk.links));
      Path src = Files.writeString(dir.resolve("a.journal"), "samples");
      Files.writeString(dir.resolve("taken"), "other");
      assertThatThrownBy(() -> FilePublisher.moveWithoutReplacing(disk.path(src),
          disk.path(dir.resolve("taken")), "journal")).isInstanceOf(FileExistsException.class);
      assertThat(Files.readString(dir.resolve("taken"))).isEqualTo("other");
      FilePublisher.moveWithoutReplacing(disk.path(src), disk.path(dir.resolve("aside/a")),
          "journal");
      assertThat(src).doesNotExist();
      assertThat(Files.readString(dir.resolve("aside/a"))).isEqualTo("samples");
    }
  }

  @Test
  void aLogGrowsLineByLineAndKeepsWhatWasThere() throws Exception {
    Path log = tmp.resolve("sub/cal.checks.jsonl");
    FileLog.append(log, "check-weight log", utf8("{\"n\":1}\n"));
    FileLog.append(log, "check-weight log", utf8("{\"n\":2}\n"));
    assertThat(Files.readAllLines(log)).containsExactly("{\"n\":1}", "{\"n\":2}");
    FakeDisk full = FakeDisk.create().bytesLeft(0);
    assertThatThrownBy(() -> FileLog.append(full.path(log), "check-weight log", utf8("x\n")))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("check-weight log " + log)
        .hasMessageContaining("full");
    assertThat(Files.readAllLines(log)).containsExactly("{\"n\":1}", "{\"n\":2}");
  }
}
