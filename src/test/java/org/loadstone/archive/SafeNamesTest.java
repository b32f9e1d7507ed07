package org.loadstone.archive;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Sources: the POSIX portable filename character set (IEEE Std 1003.1-2017, Base Definitions
 * §3.282: A–Z, a–z, 0–9, period, underscore, hyphen) and Microsoft's "Naming Files, Paths, and
 * Namespaces" (reserved device names CON, PRN, AUX, NUL, COM1–COM9, LPT1–LPT9, also with an
 * extension; no trailing period or space; no characters 0–31; no &lt; &gt; : " / \ | ? *).
 */
class SafeNamesTest {
  static Stream<Arguments> table() {
    return Stream.of(
        Arguments.of("balsa-07", "balsa-07"),
        Arguments.of("Foam core 3", "Foam_core_3"),
        Arguments.of("../x", "x"),
        Arguments.of("../../etc/passwd", "etc_passwd"),
        Arguments.of("/etc/passwd", "etc_passwd"),
        Arguments.of("..\\x", "x"),
        Arguments.of("C:\\panels\\p1", "C_panels_p1"),
        Arguments.of("a/b\\c:d*e?f\"g<h>i|j", "a_b_c_d_e_f_g_h_i_j"),
        Arguments.of("tab\there\nnew\u0000nul\u001fus", "tab_here_new_nul_us"),
        Arguments.of(".hidden", "hidden"),
        Arguments.of("...", "specimen"),
        Arguments.of("..", "specimen"),
        Arguments.of("panel. . .", "panel"),
        Arguments.of("panel   ", "panel"),
        Arguments.of("panel.", "panel"),
        Arguments.of("-rf", "rf"),
        Arguments.of("", "specimen"),
        Arguments.of("   ", "specimen"),
        Arguments.of("con", "con_"),
        Arguments.of("CON", "CON_"),
        Arguments.of("Nul.txt", "Nul_.txt"),
        Arguments.of("aux.tar.gz", "aux_.tar.gz"),
        Arguments.of("prn", "prn_"),
        Arguments.of("com1", "com1_"),
        Arguments.of("COM9.csv", "COM9_.csv"),
        Arguments.of("lpt5", "lpt5_"),
        Arguments.of("LPT9", "LPT9_"),
        Arguments.of("com10", "com10"),
        Arguments.of("console", "console"),
        Arguments.of("lpt", "lpt"),
        Arguments.of("Kern Ø12 – Welle", "Kern_12_Welle"),
        Arguments.of("a__b", "a_b"),
        Arguments.of("v1.2_final", "v1.2_final"));
  }

  @ParameterizedTest(name = "{0} -> {1}")
  @MethodSource("table")
  void sanitisesAsTheTableSays(String in, String out) {
    assertThat(SafeNames.forFile(in)).isEqualTo(out);
  }

  @Test
  void nullBecomesTheFallback() {
    assertThat(SafeNames.forFile(null)).isEqualTo("specimen");
  }

  @Test
  void longTextIsCutTo64WithoutATrailingDot() {
    String cut = SafeNames.forFile("x".repeat(63) + ".yyyy");
    assertThat(cut).isEqualTo("x".repeat(63));
    String longer = SafeNames.forFile("p".repeat(500));
    assertThat(longer).hasSize(64).isEqualTo("p".repeat(64));
  }

  @Test
  void resultsOnlyUsePortableCharactersAndNeverStartWithADot() {
    java.util.SplittableRandom r = new java.util.SplittableRandom(20261202L);
    for (int i = 0; i < 2000; i++) {
      StringBuilder b = new StringBuilder();
      int len = r.nextInt(0, 90);
      for (int j = 0; j < len; j++) {
        b.appendCodePoint(r.nextInt(10) == 0 ? r.nextInt(0x80, 0x3000) : r.nextInt(0, 0x80));
      }
      String s = SafeNames.forFile(b.toString());
      assertThat(s).as("from %s", b).matches("[A-Za-z0-9][A-Za-z0-9._-]{0,63}")
          .doesNotEndWith(".");
    }
  }
}
