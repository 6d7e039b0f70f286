package org.slackwater.render;

import java.awt.Font;
import java.awt.font.FontRenderContext;
import java.util.ArrayList;
import java.util.List;

/**
 * Measuring, wrapping and shortening text for hand-drawn figures. Measures with antialiased,
 * fractional metrics, the hints {@link Style#quality} sets for drawing, so layout and drawing agree.
 */
final class Text {
  private Text() {}

  static final FontRenderContext FRC = new FontRenderContext(null, true, true);

  static double width(String s, Font f) {
    return f.getStringBounds(s, FRC).getWidth();
  }

  /** Line height (ascent + descent + leading). */
  static double height(Font f) {
    return f.getLineMetrics("Xg", FRC).getHeight();
  }

  static double descent(Font f) {
    return f.getLineMetrics("Xg", FRC).getDescent();
  }

  static double ascent(Font f) {
    return f.getLineMetrics("Xg", FRC).getAscent();
  }

  /** Word-wrapped to {@code max} width, at most {@code lines} lines, the last shortened with an ellipsis if needed. */
  static List<String> wrap(String s, Font f, double max, int lines) {
    return wrap(s, f, max, max, lines);
  }

  /** As {@link #wrap(String, Font, double, int)}, the first line {@code firstMax} wide (room for a lead-in before it). */
  static List<String> wrap(String s, Font f, double firstMax, double max, int lines) {
    List<String> out = new ArrayList<>();
    StringBuilder line = new StringBuilder();
    String[] words = s.split(" ");
    for (int i = 0; i < words.length; i++) {
      String next = line.length() == 0 ? words[i] : line + " " + words[i];
      if (width(next, f) <= (out.isEmpty() ? firstMax : max) || line.length() == 0) {
        line.setLength(0);
        line.append(next);
        continue;
      }
      if (out.size() == lines - 1) {
        out.add(shorten(line + " " + String.join(" ", java.util.Arrays.copyOfRange(words, i, words.length)), f, out.isEmpty() ? firstMax : max));
        return out;
      }
      out.add(line.toString());
      line.setLength(0);
      line.append(words[i]);
    }
    if (line.length() > 0) {
      out.add(shorten(line.toString(), f, out.isEmpty() ? firstMax : max));
    }
    return out;
  }

  /** {@code s}, or its longest start that fits with an ellipsis. */
  static String shorten(String s, Font f, double max) {
    if (width(s, f) <= max) {
      return s;
    }
    int n = s.length();
    while (n > 0 && width(s.substring(0, n) + "…", f) > max) {
      n--;
    }
    return s.substring(0, n) + "…";
  }
}
