package org.loadstone.calibration;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Checks {@link LeastSquares} against the certified values of the NIST Statistical Reference
 * Datasets for linear least squares (https://www.itl.nist.gov/div898/strd/lls/lls.shtml). The
 * data files are unmodified NIST copies in src/test/resources/nist-strd (see the README there).
 *
 * <p>Accuracy is counted as the log relative error LRE = −log10(|estimate − certified| /
 * |certified|), the measure NIST uses for these sets (McCullough, "Assessing the reliability of
 * statistical software", The American Statistician 52, 1998). Where the certified value is zero
 * (Wampler1/2 residual SD) the absolute error is bounded instead.
 */
class NistStrdFitTest {

  record Dataset(double[] x, double[] y, double[] certified, double residualSd) {}

  static Dataset load(String name) throws IOException {
    try (InputStream in = NistStrdFitTest.class.getResourceAsStream("/nist-strd/" + name + ".dat")) {
      assertThat(in).as(name).isNotNull();
      String[] lines = new String(in.readAllBytes(), StandardCharsets.US_ASCII).split("\r?\n");
      Pattern param = Pattern.compile("^\\s*B(\\d+)\\s+(\\S+)\\s+(\\S+)\\s*$");
      Pattern rsd = Pattern.compile("^\\s*Standard Deviation\\s+(\\S+)\\s*$");
      List<Double> cert = new ArrayList<>();
      double residualSd = Double.NaN;
      List<double[]> rows = new ArrayList<>();
      boolean data = false;
      for (String line : lines) {
        if (data) {
          String t = line.trim();
          if (!t.isEmpty()) {
            String[] f = t.split("\\s+");
            rows.add(new double[] {Double.parseDouble(f[0]), Double.parseDouble(f[1])});
          }
          continue;
        }
        Matcher m = param.matcher(line);
        if (m.matches()) {
          cert.add(Double.parseDouble(m.group(2)));
        }
        Matcher r = rsd.matcher(line);
        if (r.matches()) {
          residualSd = Double.parseDouble(r.group(1));
        }
        if (line.matches("^Data:\\s+y\\s+x\\s*$")) {
          data = true;
        }
      }
      double[] x = rows.stream().mapToDouble(rw -> rw[1]).toArray();
      double[] y = rows.stream().mapToDouble(rw -> rw[0]).toArray();
      return new Dataset(x, y, cert.stream().mapToDouble(Double::doubleValue).toArray(), residualSd);
    }
  }

  static double lre(double estimate, double certified) {
    if (estimate == certified) {
      return 15;
    }
    return Math.min(15, -Math.log10(Math.abs(estimate - certified) / Math.abs(certified)));
  }

  /**
   * Digits required. Pontius and Norris ("lower" difficulty): ≥ 10 for coefficients and ≥ 8 for
   * the residual SD, as the brief asks (reached: 11.8 / 12.2 and 11.8 / 13.4). NoInt1/2 (fit
   * through zero, "average"): same bar (reached ~15). Wampler1–5 ("higher", degree 5): the noise
   * added in Wampler3–5 is amplified by the conditioning into the coefficients, so the bar falls
   * with the noise: 9, 8, 7 digits (reached 10.0, 12.9, 9.6, 8.9, 7.1). Filip ("higher",
   * degree 10): the brief expected ~7 digits; centring and scaling x to [−1, 1] before the QR
   * reaches 13.3 digits in the coefficients and 14.1 in the residual SD, so 12 is required.
   */
  @ParameterizedTest(name = "{0} degree {1}")
  @CsvSource({
    "Pontius, 2, true, 10, 8",
    "Norris, 1, true, 10, 8",
    "NoInt1, 1, false, 10, 8",
    "NoInt2, 1, false, 10, 8",
    "Wampler1, 5, true, 9, 0",
    "Wampler2, 5, true, 9, 0",
    "Wampler3, 5, true, 9, 8",
    "Wampler4, 5, true, 8, 8",
    "Wampler5, 5, true, 7, 8",
    "Filip, 10, true, 12, 12"
  })
  void matchesCertifiedValues(String name, int degree, boolean intercept, double coefDigits,
      double sdDigits) throws IOException {
    Dataset d = load(name);
    LeastSquares.Result r = LeastSquares.polynomial(d.x(), d.y(), degree, intercept);
    int first = intercept ? 0 : 1;
    assertThat(d.certified()).hasSize(degree + 1 - first);
    double worst = 15;
    for (int k = 0; k < d.certified().length; k++) {
      double est = r.polynomial().coefficient(k + first);
      double digits = lre(est, d.certified()[k]);
      worst = Math.min(worst, digits);
      assertThat(digits).as("%s B%d = %s vs certified %s", name, k, est, d.certified()[k])
          .isGreaterThanOrEqualTo(coefDigits);
    }
    if (!intercept) {
      assertThat(r.polynomial().coefficient(0)).isZero();
    }
    if (d.residualSd() == 0) {
      // Wampler1/2 are exact fits: residual SD certified 0; bound it relative to the data scale
      double yMax = java.util.Arrays.stream(d.y()).map(Math::abs).max().orElseThrow();
      assertThat(r.residualSd()).isLessThan(1e-9 * yMax);
      System.out.printf("%s: coefficient LRE >= %.1f, residual SD %.3g (certified 0)%n",
          name, worst, r.residualSd());
    } else {
      double sd = lre(r.residualSd(), d.residualSd());
      assertThat(sd).as("%s residual SD %s vs %s", name, r.residualSd(), d.residualSd())
          .isGreaterThanOrEqualTo(sdDigits);
      System.out.printf("%s: coefficient LRE >= %.1f, residual SD LRE %.1f%n", name, worst, sd);
    }
    assertThat(r.degreesOfFreedom()).isEqualTo(d.x().length - d.certified().length);
  }
}
