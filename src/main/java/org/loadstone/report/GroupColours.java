package org.loadstone.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Stroke;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.loadstone.units.Precondition;

/**
 * One colour per group, the same in every chart of a report (curves, each group's chart, the
 * strip plots): the groups in the order given take the palette's colours in turn. The palette is
 * chosen to stay apart for the common kinds of colour blindness: the seven colours of Okabe and
 * Ito's "Color Universal Design" set (2008) without its yellow, which is too light on white
 * paper. From the eighth group on the colours repeat with a dashed line, so no two groups look
 * alike.
 */
public final class GroupColours {
  /** The palette, in order of use. */
  static final List<Color> PALETTE = List.of(
      new Color(0x00, 0x72, 0xB2), // blue
      new Color(0xD5, 0x5E, 0x00), // vermilion
      new Color(0x00, 0x9E, 0x73), // bluish green
      new Color(0xCC, 0x79, 0xA7), // reddish purple
      new Color(0xE6, 0x9F, 0x00), // orange
      new Color(0x56, 0xB4, 0xE9), // sky blue
      new Color(0x40, 0x40, 0x40)); // near black

  private final Map<String, Integer> index = new LinkedHashMap<>();

  private GroupColours(Collection<String> groups) {
    for (String g : groups) {
      index.putIfAbsent(g, index.size());
    }
  }

  /**
   * @param groups group names in report order, not null
   * @return the colours of these groups
   */
  public static GroupColours of(Collection<String> groups) {
    Precondition.notNull(groups, "groups");
    return new GroupColours(groups);
  }

  /**
   * The colours of an archive's groups, keyed by name: every group in the folder, counted or not,
   * takes its colour in the order of the names, so a group keeps its colour whichever groups are
   * shown or compared — in the console's views and in the group report alike.
   *
   * @param sel a selection of an archive's runs, not null
   * @return the colours of the archive's groups
   */
  public static GroupColours of(org.loadstone.study.Selection sel) {
    Precondition.notNull(sel, "selection");
    java.util.List<String> names = new java.util.ArrayList<>(sel.groupsInArchive());
    names.addAll(sel.groups().keySet()); // a selection made by hand may not list them
    return new GroupColours(names);
  }

  /** @return the group's colour; a group not given at first gets the next one */
  public Color colour(String group) {
    return PALETTE.get(slot(group) % PALETTE.size());
  }

  /** @return the group's line: solid for the first seven groups, dashed for the next seven… */
  public Stroke line(String group, float width) {
    int round = slot(group) / PALETTE.size();
    if (round == 0) {
      return new BasicStroke(width, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    }
    float dash = 3f + 2f * round;
    return new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 1f,
        new float[] {dash, 2.5f}, 0f);
  }

  private int slot(String group) {
    return index.computeIfAbsent(group, g -> index.size());
  }
}
