package org.slackwater.render;

import java.awt.Graphics2D;
import java.util.ArrayList;
import java.util.List;

/**
 * Title and subtitle lines of a hand-drawn figure, wrapped to its width: the title in
 * {@link Style#TITLE} (at most 2 lines), each subtitle in {@link Style#SUBTITLE} (at most 2 lines
 * each), all left-aligned at {@link #PAD} from the top left, as the chart titles of the other plots.
 */
record Heading(List<String> title, List<String> subtitle) {
  static final double PAD = 12, TOP = 10;

  Heading {
    title = List.copyOf(title);
    subtitle = List.copyOf(subtitle);
  }

  static Heading of(String title, List<String> subtitles, double width) {
    double w = width - 2 * PAD;
    List<String> sub = new ArrayList<>();
    for (String s : subtitles) {
      sub.addAll(Text.wrap(s, Style.SUBTITLE, w, 2));
    }
    return new Heading(Text.wrap(title, Style.TITLE, w, 2), sub);
  }

  /** The y just below the heading. */
  double bottom() {
    return TOP + title.size() * Text.height(Style.TITLE) + subtitle.size() * Text.height(Style.SUBTITLE);
  }

  void draw(Graphics2D g) {
    double y = TOP;
    g.setColor(Style.TEXT);
    g.setFont(Style.TITLE);
    for (String s : title) {
      g.drawString(s, (float) PAD, (float) (y + Text.ascent(Style.TITLE)));
      y += Text.height(Style.TITLE);
    }
    g.setColor(Style.MUTED_TEXT);
    g.setFont(Style.SUBTITLE);
    for (String s : subtitle) {
      g.drawString(s, (float) PAD, (float) (y + Text.ascent(Style.SUBTITLE)));
      y += Text.height(Style.SUBTITLE);
    }
  }

  /** Footer notes, each shortened to one line of {@code width}, drawn upwards from {@code bottom}; returns their top. */
  static double notes(Graphics2D g, List<String> notes, double width, double bottom) {
    double lh = Text.height(Style.NOTE), y = bottom - notes.size() * lh;
    if (g != null) {
      g.setFont(Style.NOTE);
      g.setColor(Style.MUTED_TEXT);
      for (int i = 0; i < notes.size(); i++) {
        g.drawString(Text.shorten(notes.get(i), Style.NOTE, width - 2 * PAD), (float) PAD, (float) (y + i * lh + Text.ascent(Style.NOTE)));
      }
    }
    return y;
  }
}
