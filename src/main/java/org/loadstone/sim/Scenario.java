package org.loadstone.sim;

import java.util.Locale;
import org.loadstone.units.LoadstoneException;

/**
 * Named presets of the simulated frame: what is on it. The frame and its load cell stay the same
 * whichever scenario runs (one machine, one cell), so a calibration made in the dead-weight
 * scenario applies to every specimen. Every preset is a physical model; its numbers are
 * illustrative, not material data. The command line takes the {@link #cliName()}.
 */
public enum Scenario {
  /** a brittle bar in three-point bending: toe, linear, fracture within ~2 ms */
  BRITTLE("brittle", "brittle bar in three-point bend: linear, then fracture"),
  /** a brittle bar in four-point bending, load span a third of the support span */
  FOUR_POINT("four-point", "brittle bar in four-point bend (load span L/3): linear, then fracture"),
  /** a ductile specimen: linear, yield, plateau, gradual drop, rupture */
  DUCTILE("ductile", "ductile specimen: linear, yield, plateau, gradual drop"),
  /** progressive crushing: a saw-tooth of rises and partial drops */
  CRUSH("crush", "progressive crushing: saw-tooth of rises and partial drops"),
  /** far stiffer and stronger than the frame's 1 kN cell: saturates the converter */
  OVER_RANGE("over-range", "specimen far stiffer and stronger than the cell (overload)"),
  /** a practically rigid block: the slope is the frame's own stiffness */
  RIGID_BLOCK("rigid-block", "rigid block: measures the frame compliance"),
  /** sandwich shelf panel with a foam core, three-point bend */
  PANEL_FOAM("panel-foam", "sandwich panel, foam core: core shear, gradual failure"),
  /** sandwich shelf panel with an end-grain balsa core */
  PANEL_BALSA("panel-balsa", "sandwich panel, balsa core: core shear, sudden failure"),
  /** sandwich shelf panel with a corrugated-board core */
  PANEL_BOARD("panel-board", "sandwich panel, corrugated-board core: progressive collapse"),
  /** no crosshead motion: known masses are placed on the cell, for calibration */
  DEAD_WEIGHT("dead-weight", "dead weights placed on the cell, for calibration");

  private final String cliName;
  private final String description;

  Scenario(String cliName, String description) {
    this.cliName = cliName;
    this.description = description;
  }

  /** @return the name the command line takes, e.g. {@code panel-foam} */
  public String cliName() {
    return cliName;
  }

  /** @return a one-line description */
  public String description() {
    return description;
  }

  /** @return whether the crosshead moves a specimen (false only for the dead-weight mode) */
  public boolean hasSpecimen() {
    return this != DEAD_WEIGHT;
  }

  /** @return all command-line names, comma separated, in declaration order */
  public static String names() {
    StringBuilder sb = new StringBuilder();
    for (Scenario s : values()) {
      if (sb.length() > 0) {
        sb.append(", ");
      }
      sb.append(s.cliName);
    }
    return sb.toString();
  }

  /**
   * Finds a scenario by its command-line name, ignoring case, surrounding blanks and the choice
   * of {@code -} or {@code _}.
   *
   * @param text the name, may be null
   * @throws LoadstoneException naming the text and listing the accepted names
   */
  public static Scenario parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT).replace('_', '-');
    for (Scenario s : values()) {
      if (s.cliName.equals(t)) {
        return s;
      }
    }
    throw new LoadstoneException(
        "unknown simulator scenario '" + text + "': use one of " + names());
  }
}
