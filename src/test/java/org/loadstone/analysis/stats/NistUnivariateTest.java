package org.loadstone.analysis.stats;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * NIST Statistical Reference Datasets, univariate summary statistics: certified mean and
 * standard deviation (n − 1), read from each file's header (src/test/resources/nist-strd/).
 */
class NistUnivariateTest {
  private static final Pattern MEAN = Pattern.compile("ybar:\\s*(\\S+)");
  private static final Pattern SD = Pattern.compile("\\s s:\\s*(\\S+)");

  @ParameterizedTest
  @ValueSource(
      strings = {"Michelso", "NumAcc1", "NumAcc2", "NumAcc3", "NumAcc4", "Lew", "Lottery", "Mavro"})
  void meanAndSdMatchCertifiedValues(String name) throws IOException {
    String text;
    try (InputStream in = getClass().getResourceAsStream("/nist-strd/" + name + ".dat")) {
      assertThat(in).as(name).isNotNull();
      text = new String(in.readAllBytes(), StandardCharsets.US_ASCII);
    }
    List<String> lines = text.lines().toList();
    double certMean = certified(MEAN, lines.subList(40, 43));
    double certSd = certified(SD, lines.subList(40, 43));
    double[] data =
        lines.subList(60, lines.size()).stream()
            .map(String::trim)
            .filter(s -> !s.isEmpty())
            .mapToDouble(Double::parseDouble)
            .toArray();
    GroupSummary s = GroupSummary.of(name, data);
    // NIST gives 15 significant digits, but the inputs are rounded to double on reading: near
    // 1e7 (NumAcc4) doubles are 1.9e-9 apart, so a deviation of 0.1 already carries up to 1e-8
    // relative error. Agreement to 1e-13 (mean) and 1e-8 (SD, relative) is the attainable limit.
    assertThat(s.mean()).as("mean").isCloseTo(certMean, within(1e-13 * Math.abs(certMean)));
    assertThat(s.sd().orElseThrow()).as("sd").isCloseTo(certSd, within(1e-8 * certSd));
  }

  private static double certified(Pattern p, List<String> lines) {
    for (String l : lines) {
      Matcher m = p.matcher(l);
      if (m.find()) {
        return Double.parseDouble(m.group(1));
      }
    }
    throw new AssertionError("certified value not found by " + p);
  }
}
