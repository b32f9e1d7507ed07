package org.loadstone.analysis;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;
import org.loadstone.units.LoadstoneException;

/**
 * What a run's position channel measures, which decides the deflection formula of a bend test:
 * in four-point bending the crosshead moves with the loading noses, not with the middle of the
 * span, and the two deflections differ by 15 % at a load span of a third of the span.
 */
public enum PositionSource {
  /** the crosshead (encoder, crosshead rate): the loading nose or noses */
  CROSSHEAD("crosshead", false),
  /** a gauge (dial, LVDT, deflectometer) under the middle of the span */
  MID_SPAN_GAUGE("mid-span-gauge", true),
  /** a point tracked on video at a loading nose */
  VIDEO_LOAD_POINT("video-load-point", false),
  /** a point tracked on video at the middle of the span */
  VIDEO_MID_SPAN("video-mid-span", true);

  /** The key under which a run's metadata records it. */
  public static final String METADATA_KEY = "position_source";

  private final String wireName;
  private final boolean midSpan;

  PositionSource(String wireName, boolean midSpan) {
    this.wireName = wireName;
    this.midSpan = midSpan;
  }

  /** @return the stored and command-line name, e.g. {@code mid-span-gauge} */
  public String wireName() {
    return wireName;
  }

  /** @return whether it measures the deflection at the middle of the span */
  public boolean atMidSpan() {
    return midSpan;
  }

  /**
   * @param text a wire name, any case
   * @throws LoadstoneException naming the text and the accepted names
   */
  public static PositionSource parse(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
    for (PositionSource s : values()) {
      if (s.wireName.equals(t)) {
        return s;
      }
    }
    throw new LoadstoneException("unknown position source '" + text + "': use "
        + Arrays.stream(values()).map(PositionSource::wireName).collect(Collectors.joining(", ")));
  }
}
