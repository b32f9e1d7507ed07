package org.loadstone.report;

import java.awt.Color;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.font.PDType0Font;

/**
 * Text in a report's font: shown at a place, measured, wrapped to a width, and made printable
 * (a character without a glyph becomes its Unicode number, and {@link #replacedAny()} remembers
 * that it happened).
 */
final class PdfText {
  private final PDType0Font regular;
  private final PDType0Font bold;
  private final Map<Integer, Boolean> encodable = new HashMap<>();
  private boolean replaced;

  PdfText(PDType0Font regular, PDType0Font bold) {
    this.regular = regular;
    this.bold = bold;
  }

  /** @return whether some character was printed as its Unicode number */
  boolean replacedAny() {
    return replaced;
  }

  void show(PDPageContentStream cs, PDType0Font font, float size, Color c, float x,
      float baseline, String s) {
    try {
      cs.beginText();
      cs.setFont(font, size);
      cs.setNonStrokingColor(c);
      cs.newLineAtOffset(x, baseline);
      cs.showText(safe(s));
      cs.endText();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  List<String> wrap(String s, PDType0Font font, float size, float width) {
    List<String> out = new ArrayList<>();
    for (String para : safe(s).split("\n", -1)) {
      StringBuilder line = new StringBuilder();
      for (String word : para.split(" ")) {
        String trial = line.length() == 0 ? word : line + " " + word;
        if (width(font, size, trial) <= width || line.length() == 0) {
          line.setLength(0);
          line.append(trial);
          while (width(font, size, line.toString()) > width && line.length() > 1) {
            int cut = Math.max(1, (int) (line.length() * width / width(font, size, line.toString())) - 1);
            // a long word (a run id, a file path) breaks after a hyphen, dot or slash if it can
            int mark = Math.max(Math.max(line.lastIndexOf("-", cut - 1), line.lastIndexOf(".",
                cut - 1)), Math.max(line.lastIndexOf("/", cut - 1), line.lastIndexOf("_",
                cut - 1)));
            if (mark >= cut / 2) {
              cut = mark + 1;
            }
            out.add(line.substring(0, cut));
            line.delete(0, cut);
          }
        } else {
          out.add(line.toString());
          line.setLength(0);
          line.append(word);
        }
      }
      out.add(line.toString());
    }
    return out;
  }

  float width(PDType0Font font, float size, String s) {
    try {
      return font.getStringWidth(s) / 1000 * size;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /**
   * The text as the report font can print it: tabs and carriage returns as spaces, other control
   * characters dropped, and each character without a glyph as its Unicode number, e.g. {@code
   * [U+8BD5]}.
   */
  String safe(String s) {
    StringBuilder b = new StringBuilder(s.length());
    s.codePoints().forEach(c -> {
      if (c == '\n') {
        b.append('\n');
      } else if (c == '\t' || c == '\r') {
        b.append(' ');
      } else if (Character.isISOControl(c)) {
        replaced = true;
      } else if (encodable.computeIfAbsent(c, this::canEncode)) {
        b.appendCodePoint(c);
      } else {
        replaced = true;
        b.append(ReportFonts.code(c));
      }
    });
    return b.toString();
  }

  private boolean canEncode(int c) {
    String one = new String(Character.toChars(c));
    try {
      regular.encode(one);
      bold.encode(one);
      return true;
    } catch (IOException | IllegalArgumentException e) {
      return false;
    }
  }

}
