package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loadstone.files.FakeDisk;
import org.loadstone.units.LoadstoneException;

class CalibrationFilesTest {
  @TempDir Path dir;

  static CalibrationDocument doc(String id) {
    CalibrationReport r = CalibrationService.fitFromPoints(CalibrationServiceTest.isoSet(),
        CalibrationSettings.defaults().withFullScale_N(1000));
    return CalibrationDocument.of(r, id, LocalDate.of(2026, 12, 2), "A. Tester", "shelf-rig-500N",
        LocalDate.of(2027, 12, 1), "constructed test points");
  }

  @Test
  void roundTripKeepsEveryFieldAndTheHash() {
    CalibrationDocument d = doc("cal-2026-12-02");
    Path f = CalibrationFiles.saveCalibration(dir, d);
    assertThat(f.getFileName().toString()).isEqualTo("cal-2026-12-02.json");
    CalibrationDocument back = CalibrationFiles.readCalibration(f);
    assertThat(back).isEqualTo(d);
    assertThat(CalibrationFiles.contentSha256(back)).isEqualTo(d.contentSha256());
    assertThat(CalibrationStatus.check(f, d.contentSha256(), LocalDate.of(2027, 1, 5)).ok())
        .isTrue();
    LoadCellProfile p = new LoadCellProfile("cell-a", "test cell", 500, "SN1", 8589.9);
    assertThat(CalibrationFiles.readProfile(CalibrationFiles.saveProfile(dir, p))).isEqualTo(p);
  }

  @Test
  void theHashIsSha256OfTheCanonicalJsonAndFollowsACoefficient() throws Exception {
    CalibrationDocument d = doc("c1");
    // independent check with the JDK digest over the canonical text: keys sorted, no spaces
    String canonical = canonicalText(CalibrationFiles.MAPPER.valueToTree(d.withContentSha256(null)));
    String expected = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
        .digest(canonical.getBytes(StandardCharsets.UTF_8)));
    assertThat(d.contentSha256()).isEqualTo(expected);
    List<Double> c = new ArrayList<>(d.fit().coefficients());
    c.set(1, c.get(1) * (1 + 1e-12));
    CalibrationDocument changed = d.withFit(new CalibrationDocument.AdoptedFit(d.fit().kind(), c,
        d.fit().minForce_N(), d.fit().maxForce_N()));
    assertThat(CalibrationFiles.contentSha256(changed)).isNotEqualTo(d.contentSha256());
    assertThat(changed.withHash().contentSha256()).isNotEqualTo(d.contentSha256());
  }

  /** Writes a tree with sorted keys and no white space, written separately from the main code. */
  static String canonicalText(com.fasterxml.jackson.databind.JsonNode n) {
    if (n.isObject()) {
      List<String> keys = new ArrayList<>();
      n.fieldNames().forEachRemaining(keys::add);
      keys.remove("content_sha256");
      java.util.Collections.sort(keys);
      StringBuilder sb = new StringBuilder("{");
      for (String k : keys) {
        sb.append(sb.length() > 1 ? "," : "").append('"').append(k).append("\":")
            .append(canonicalText(n.get(k)));
      }
      return sb.append('}').toString();
    }
    if (n.isArray()) {
      StringBuilder sb = new StringBuilder("[");
      for (var e : n) {
        sb.append(sb.length() > 1 ? "," : "").append(canonicalText(e));
      }
      return sb.append(']').toString();
    }
    return n.toString();
  }

  @Test
  void savesToAStickWithoutHardLinks() throws Exception {
    FakeDisk stick = FakeDisk.create().withoutLinks(); // FAT/exFAT refuse hard links (EPERM)
    CalibrationDocument d = doc("stick");
    Path f = CalibrationFiles.saveCalibration(stick.path(dir), d);
    assertThat(stick.linksRefused()).isEqualTo(1);
    assertThat(CalibrationFiles.readCalibration(dir.resolve("stick.json"))).isEqualTo(d);
    assertThatThrownBy(() -> CalibrationFiles.saveCalibration(stick.path(dir), d))
        .isInstanceOf(LoadstoneException.class).hasMessageContaining("'stick-2'");
    try (var s = Files.list(dir)) {
      assertThat(s.map(p -> p.getFileName().toString())).containsExactly("stick.json");
    }
    assertThat(f.toString()).isEqualTo(dir.resolve("stick.json").toString());
  }

  @Test
  void anExistingFileIsNeverOverwritten() throws Exception {
    CalibrationDocument d = doc("same");
    Path f = CalibrationFiles.saveCalibration(dir, d);
    byte[] before = Files.readAllBytes(f);
    CalibrationDocument other = doc("same").withFit(new CalibrationDocument.AdoptedFit(
        FitKind.LINEAR, List.of(0.0, 99.0), 0, 1000));
    assertThatThrownBy(() -> CalibrationFiles.saveCalibration(dir, other))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining("never overwritten")
        .hasMessageContaining("'same-2'");
    assertThat(Files.readAllBytes(f)).isEqualTo(before);
    try (var s = Files.list(dir)) {
      assertThat(s.map(p -> p.getFileName().toString())).containsExactly("same.json");
    }
  }

  @Test
  void aMalformedFileIsNamedWithItsField() throws Exception {
    Path f = CalibrationFiles.saveCalibration(dir, doc("bad"));
    String text = Files.readString(f);
    Path wrongType = dir.resolve("wrong-type.json");
    Files.writeString(wrongType, text.replaceFirst("\"counts_mean\" : [-0-9.E]+",
        "\"counts_mean\" : \"many\""));
    assertThatThrownBy(() -> CalibrationFiles.readCalibration(wrongType))
        .isInstanceOf(LoadstoneException.class)
        .hasMessageContaining(wrongType.toString())
        .hasMessageContaining("field 'points[0].counts_mean'");
    Path missing = dir.resolve("missing.json");
    Files.writeString(missing, text.replaceFirst("\"operator\" : \"A. Tester\",", ""));
    assertThatThrownBy(() -> CalibrationFiles.readCalibration(missing))
        .hasMessageContaining(missing.toString()).hasMessageContaining("field 'operator'")
        .hasMessageContaining("missing");
    Path badDate = dir.resolve("bad-date.json");
    Files.writeString(badDate, text.replace("\"valid_until\" : \"2027-12-01\"",
        "\"valid_until\" : \"01.12.2027\""));
    assertThatThrownBy(() -> CalibrationFiles.readCalibration(badDate))
        .hasMessageContaining(badDate.toString()).hasMessageContaining("'valid_until'")
        .hasMessageContaining("yyyy-mm-dd");
    Path badG = dir.resolve("bad-g.json");
    Files.writeString(badG, text.replaceFirst("\"g_m_per_s2\" : [0-9.]+", "\"g_m_per_s2\" : 1.0"));
    assertThatThrownBy(() -> CalibrationFiles.readCalibration(badG))
        .hasMessageContaining("field 'force_model'").hasMessageContaining("9.7 to 9.9");
    Path profile = dir.resolve("cell.json");
    Files.writeString(profile, "{\"id\":\"c\",\"description\":\"\",\"rated_capacity_N\":-5,"
        + "\"serial_number\":\"\",\"nominal_counts_per_N\":100}");
    assertThatThrownBy(() -> CalibrationFiles.readProfile(profile))
        .hasMessageContaining("load-cell profile " + profile)
        .hasMessageContaining("'rated_capacity_N'");
    Path notJson = dir.resolve("not-json.json");
    Files.writeString(notJson, "{ \"id\": ");
    assertThatThrownBy(() -> CalibrationFiles.readCalibration(notJson))
        .hasMessageContaining("not valid JSON").hasMessageContaining("line 1");
  }

  @Test
  void statusWarnsBeforeARunWhenExpiredMissingOrChanged() throws Exception {
    CalibrationDocument d = doc("st");
    Path f = CalibrationFiles.saveCalibration(dir, d);
    CalibrationStatus expired = CalibrationStatus.check(f, null, LocalDate.of(2027, 12, 2));
    assertThat(expired.state()).isEqualTo(CalibrationStatus.State.EXPIRED);
    assertThat(expired.warning()).contains("expired on 2027-12-01");
    assertThat(CalibrationStatus.check(f, null, LocalDate.of(2027, 12, 1)).ok()).isTrue();
    assertThat(CalibrationStatus.check(dir.resolve("gone.json"), null, LocalDate.now()).state())
        .isEqualTo(CalibrationStatus.State.MISSING);
    assertThat(CalibrationStatus.check(f, "0".repeat(64), LocalDate.of(2027, 1, 1)).state())
        .isEqualTo(CalibrationStatus.State.HASH_MISMATCH);
    Path edited = dir.resolve("edited.json");
    Files.writeString(edited, Files.readString(f).replace("A. Tester", "B. Tester"));
    CalibrationStatus e = CalibrationStatus.check(edited, null, LocalDate.of(2027, 1, 1));
    assertThat(e.state()).isEqualTo(CalibrationStatus.State.HASH_MISMATCH);
    assertThat(e.warning()).contains("changed since it was saved");
    // a run stores these warnings as text; reading them back gives the state again
    assertThat(CalibrationStatus.stateOf(expired.warning())).contains(
        CalibrationStatus.State.EXPIRED);
    assertThat(CalibrationStatus.stateOf(e.warning())).contains(
        CalibrationStatus.State.HASH_MISMATCH);
    assertThat(CalibrationStatus.stateOf(CalibrationStatus.check(f, "0".repeat(64),
        LocalDate.of(2027, 1, 1)).warning())).contains(CalibrationStatus.State.HASH_MISMATCH);
    assertThat(CalibrationStatus.stateOf("calibration is 12 days old")).isEmpty();
  }

  @Test
  void checkWeightResultsAreAppendedBesideTheCalibration() {
    CalibrationDocument d = doc("cw");
    Path f = CalibrationFiles.saveCalibration(dir, d);
    d = CalibrationFiles.readCalibration(f);
    // 20 kg with the standard model: F = 20 × 9.80665 × (1 − 1.2/8000) = 196.1035802 N (by hand:
    // 196.133 × 0.99985). At ~100 counts/N, a reading 0.5 % high passes, 1.5 % high fails.
    double expected = 20 * 9.80665 * (1 - 1.2 / 8000);
    CountsToForce inv = d.fit().inverse();
    double netOk = inv.polynomial().value(expected * 1.005);
    double netBad = inv.polynomial().value(expected * 1.015);
    CheckWeightResult ok = CheckWeights.verify(d, 20, netOk, CheckWeights.DEFAULT_TOLERANCE_PCT,
        Instant.parse("2026-12-03T08:00:00Z"));
    CheckWeightResult bad = CheckWeights.verify(d, 20, netBad, CheckWeights.DEFAULT_TOLERANCE_PCT,
        Instant.parse("2026-12-03T08:05:00Z"));
    assertThat(ok.expected_N()).isCloseTo(196.1035802, within(1e-6));
    assertThat(ok.error_pct()).isCloseTo(0.5, within(1e-9));
    assertThat(ok.pass()).isTrue();
    assertThat(bad.error_pct()).isCloseTo(1.5, within(1e-9));
    assertThat(bad.pass()).isFalse();
    CheckWeights.append(f, ok);
    CheckWeights.append(f, bad);
    assertThat(CheckWeights.logFile(f).getFileName().toString()).isEqualTo("cw.checks.jsonl");
    assertThat(CheckWeights.readLog(f)).containsExactly(ok, bad);
    assertThatThrownBy(() -> CheckWeights.verify(CalibrationFiles.readCalibration(f), 0, 1, 1,
        Instant.now())).isInstanceOf(LoadstoneException.class).hasMessageContaining("mass");
  }
}
