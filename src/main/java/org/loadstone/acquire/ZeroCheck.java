package org.loadstone.acquire;

import java.time.Duration;
import java.time.Instant;
import java.util.Locale;
import java.util.Optional;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Setting;

/**
 * The zero check before a run: the fresh zero is compared with the last tare, and a shift larger
 * than the limit is warned about (a cell still warming up, a creeping zero, or something resting
 * on the cell). The run still uses the fresh zero; the warning is shown and stored with it.
 *
 * @param limit_N the largest shift accepted without a warning, N, greater than 0
 */
public record ZeroCheck(double limit_N) {
  /**
   * The default limit as a share of the cell's rated capacity: 0.1 %. Loadstone's own choice, not
   * taken from a standard; set a limit of your own where your cell and lab call for it.
   */
  public static final double DEFAULT_SHARE_OF_CAPACITY = 0.001;

  public ZeroCheck {
    if (!(Double.isFinite(limit_N) && limit_N > 0)) {
      throw new LoadstoneException("the zero-drift limit must be a force greater than 0 N, was "
          + String.format(Locale.ROOT, "%s", limit_N) + ": give the largest shift of the zero "
          + "between two tares that you accept without a warning (e.g. 0.1 % of the cell's "
          + "rated capacity)", Setting.ZERO_DRIFT_LIMIT);
    }
  }

  /**
   * @param given the limit the user set, N, or null for the default
   * @param ratedCapacity_N the cell's rated capacity
   * @return the check to apply
   * @throws LoadstoneException when the given limit is 0, negative or not a number
   */
  public static ZeroCheck of(Double given, double ratedCapacity_N) {
    return new ZeroCheck(given != null ? given : DEFAULT_SHARE_OF_CAPACITY * ratedCapacity_N);
  }

  /**
   * A zero taken at one time.
   *
   * @param zero_counts the mean counts of the unloaded cell
   * @param at when it was taken
   */
  public record Tare(double zero_counts, Instant at) {
    public Tare {
      org.loadstone.units.Precondition.notNull(at, "at");
    }
  }

  /**
   * @param last the last tare, or null when there is none to compare with
   * @param fresh the zero just taken
   * @param scale counts above zero → force
   * @return the warning to show and store, or empty when the shift is within the limit
   */
  public Optional<String> check(Tare last, Tare fresh, ForceScale scale) {
    if (last == null) {
      return Optional.empty();
    }
    double shift_N = scale.force_N(fresh.zero_counts() - last.zero_counts());
    if (!(Math.abs(shift_N) > limit_N)) {
      return Optional.empty();
    }
    return Optional.of(String.format(Locale.ROOT, "zero check: the zero moved by %+.3g N since "
        + "the last tare %s ago (limit %.3g N): the cell may still be warming up, its zero may "
        + "be creeping, or something may rest on it; unload it and let it settle, then zero "
        + "again", shift_N, ago(Duration.between(last.at(), fresh.at())), limit_N));
  }

  private static String ago(Duration d) {
    long s = Math.max(0, d.getSeconds());
    if (s < 120) {
      return s + " s";
    }
    if (s < 7200) {
      return s / 60 + " min";
    }
    if (s < 3 * 86_400) {
      return s / 3600 + " h";
    }
    return s / 86_400 + " days";
  }
}
