package org.loadstone.units;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class TextFilesTest {
  @TempDir Path tmp;

  @Test
  void aByteOrderMarkIsSkippedAndUtf8IsReadAsIs() throws Exception {
    Path f = tmp.resolve("bom.csv");
    // EF BB BF is the UTF-8 byte-order mark (Unicode Standard, ch. 23.8)
    byte[] body = "a,b\n1,2 °C\n".getBytes(StandardCharsets.UTF_8);
    byte[] all = new byte[body.length + 3];
    all[0] = (byte) 0xEF;
    all[1] = (byte) 0xBB;
    all[2] = (byte) 0xBF;
    System.arraycopy(body, 0, all, 3, body.length);
    Files.write(f, all);
    assertThat(TextFiles.read(f, "test file")).isEqualTo("a,b\n1,2 °C\n");
  }

  @Test
  void readingOnAfterTheEndKeepsAnsweringTheEnd() throws Exception {
    Path f = tmp.resolve("noend.csv");
    Files.writeString(f, "a,b\n1,2"); // no line end at the end
    try (Reader r = TextFiles.open(f, "test file")) {
      char[] buf = new char[64];
      assertThat(r.read(buf, 0, 64)).isEqualTo(7);
      assertThat(r.read(buf, 0, 64)).isEqualTo(-1);
      assertThat(r.read(buf, 0, 64)).isEqualTo(-1);
    }
  }

  @Test
  void latin1IsRefusedNamingTheLineTheByteAndTheFix() throws Exception {
    Path f = tmp.resolve("latin.csv");
    // 0xB0 is the degree sign in ISO-8859-1 and never valid alone in UTF-8 (RFC 3629)
    Files.write(f, "a,b\n1,2\n3,4 \u00b0C\n".getBytes(StandardCharsets.ISO_8859_1));
    assertThatThrownBy(() -> TextFiles.read(f, "test file"))
        .isInstanceOf(InputException.class)
        .hasMessageContaining("latin.csv, line 3")
        .hasMessageContaining("byte 13 (0xB0)")
        .hasMessageContaining("ISO-8859-1")
        .hasMessageContaining("save the file as UTF-8");
  }

  @Test
  void aBadByteFarIntoALargeFileIsFoundOnItsLineWhenStreamed() throws Exception {
    Path f = tmp.resolve("big.csv");
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < 20_000; i++) {
      sb.append(i).append(",x\n");
    }
    byte[] good = sb.toString().getBytes(StandardCharsets.UTF_8);
    byte[] all = new byte[good.length + 2];
    System.arraycopy(good, 0, all, 0, good.length);
    all[good.length] = (byte) 0xE9; // 'é' in Latin-1
    all[good.length + 1] = '\n';
    Files.write(f, all);
    assertThatThrownBy(() -> {
      try (Reader r = TextFiles.open(f, "test file")) {
        r.transferTo(java.io.Writer.nullWriter());
      }
    }).isInstanceOf(InputException.class).hasMessageContaining("line 20001");
  }

  @Test
  void utf16AFolderAndAMissingFileAreRefusedPlainly() throws Exception {
    Path f = tmp.resolve("u16.json");
    Files.write(f, "{}".getBytes(StandardCharsets.UTF_16)); // Java writes FE FF first
    assertThatThrownBy(() -> TextFiles.read(f, "test file")).hasMessageContaining("UTF-16");
    assertThatThrownBy(() -> TextFiles.read(tmp, "test file")).hasMessageContaining("is a folder");
    assertThatThrownBy(() -> TextFiles.read(tmp.resolve("none"), "test file"))
        .hasMessageContaining("none does not exist: check the path");
  }

  @Test
  void aHugeOrMultiLineCellIsShownCutAndEscaped() {
    String cell = "x".repeat(10_000_000);
    String shown = InputException.shown(cell);
    assertThat(shown).hasSizeLessThan(80).contains("…").contains("10000000 characters");
    assertThat(InputException.shown("a\nb")).isEqualTo("'a\\nb'");
  }
}
