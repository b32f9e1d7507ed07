package org.loadstone.intake;

import org.loadstone.units.DurationUnit;
import org.loadstone.units.ForceUnit;
import org.loadstone.units.LengthUnit;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * How {@link CsvImport} reads a foreign CSV. Immutable; start from {@link #of(ColumnMap)} and
 * change one setting at a time.
 *
 * @param columns which columns hold time, force, position; not null
 * @param forceUnit unit of the force column, or {@code null} to read it from the header
 *     ({@code Load [kN]}, {@code Load (kN)}) and otherwise take newtons
 * @param lengthUnit unit of the position column, or {@code null} as for force (default mm)
 * @param timeUnit unit of the time column, or {@code null} as for force (default s)
 * @param delimiter field delimiter, or {@code null} to detect comma, semicolon or tab
 * @param decimalComma whether numbers use a comma as decimal mark ({@code 1,5} = 1.5)
 * @param skipLines lines to skip before the header row (a preamble), 0 or more
 * @param usualForceUnit the force unit taken when none is given and the header states none (the
 *     user's own default), or {@code null} for newtons
 * @param usualLengthUnit the same for the position column, or {@code null} for mm
 */
public record ImportSettings(
    ColumnMap columns,
    ForceUnit forceUnit,
    LengthUnit lengthUnit,
    DurationUnit timeUnit,
    Character delimiter,
    boolean decimalComma,
    int skipLines,
    ForceUnit usualForceUnit,
    LengthUnit usualLengthUnit) {

  /** Checks the settings. */
  public ImportSettings {
    Precondition.notNull(columns, "columns");
    if (skipLines < 0) {
      throw new LoadstoneException(
          "Header skip count is " + skipLines + "; give 0 or more lines to skip.");
    }
    if (delimiter != null && "\"\r\n0123456789.+-eE".indexOf(delimiter) >= 0) {
      throw new LoadstoneException("Delimiter '" + delimiter + "' cannot separate numbers; use "
          + "comma, semicolon or tab.");
    }
    if (decimalComma && delimiter != null && delimiter == ',') {
      throw new LoadstoneException("Delimiter and decimal mark are both ','; with a decimal comma "
          + "the columns must be separated by ';' or tab.");
    }
  }

  /** @return settings for a column map: units from the headers, delimiter detected, point decimal */
  public static ImportSettings of(ColumnMap columns) {
    return new ImportSettings(columns, null, null, null, null, false, 0, null, null);
  }

  /** @return these settings with a force unit */
  public ImportSettings withForceUnit(ForceUnit u) {
    return new ImportSettings(columns, u, lengthUnit, timeUnit, delimiter, decimalComma,
        skipLines, usualForceUnit, usualLengthUnit);
  }

  /** @return these settings with a length unit */
  public ImportSettings withLengthUnit(LengthUnit u) {
    return new ImportSettings(columns, forceUnit, u, timeUnit, delimiter, decimalComma,
        skipLines, usualForceUnit, usualLengthUnit);
  }

  /** @return these settings with a time unit */
  public ImportSettings withTimeUnit(DurationUnit u) {
    return new ImportSettings(columns, forceUnit, lengthUnit, u, delimiter, decimalComma,
        skipLines, usualForceUnit, usualLengthUnit);
  }

  /** @return these settings with a given delimiter ({@code null}: detect) */
  public ImportSettings withDelimiter(Character d) {
    return new ImportSettings(columns, forceUnit, lengthUnit, timeUnit, d, decimalComma,
        skipLines, usualForceUnit, usualLengthUnit);
  }

  /** @return these settings with or without a decimal comma */
  public ImportSettings withDecimalComma(boolean on) {
    return new ImportSettings(columns, forceUnit, lengthUnit, timeUnit, delimiter, on,
        skipLines, usualForceUnit, usualLengthUnit);
  }

  /** @return these settings taking these units when neither given nor in the header */
  public ImportSettings withUsualUnits(ForceUnit force, LengthUnit length) {
    return new ImportSettings(columns, forceUnit, lengthUnit, timeUnit, delimiter, decimalComma,
        skipLines, force, length);
  }

  /** @return these settings skipping a number of lines before the header */
  public ImportSettings withSkipLines(int n) {
    return new ImportSettings(columns, forceUnit, lengthUnit, timeUnit, delimiter,
        decimalComma, n, usualForceUnit, usualLengthUnit);
  }
}
