package org.slackwater.render;

import java.awt.geom.Rectangle2D;
import java.util.List;
import org.locationtech.jts.geom.Envelope;

/**
 * Where the parts of a map go on a canvas of layout pixels: header lines, the map frame, the
 * colour bar, the legend row and the notes. The projection is equirectangular with its standard
 * parallel at the middle latitude (a degree of longitude is cos φ₀ of a degree of latitude, common
 * practice for small areas), north up, fitted into the space left by the text and centred.
 */
record MapLayout(List<String> title, List<String> subtitle, List<String> notes, Rectangle2D frame, Rectangle2D bar,
    double legendTop, double lonWest, double latNorth, double pxPerDegLat, double pxPerDegLon, double latSouth, double lonEast) {

  static final double PAD = 12;
  static final double BAR_WIDTH = 16;
  static final double BAR_GAP = 22;
  static final double LEGEND_HEIGHT = 22;

  static MapLayout of(MapData d, String titleText, String subtitleText, List<String> noteTexts, int w, int h) {
    double textWidth = w - 2 * PAD;
    List<String> title = Text.wrap(titleText, Style.TITLE, textWidth, 2);
    List<String> subtitle = Text.wrap(subtitleText, Style.SUBTITLE, textWidth, 3);
    List<String> notes = noteTexts.stream().map(n -> Text.shorten(n, Style.NOTE, textWidth)).toList();
    double top = 10 + title.size() * Text.height(Style.TITLE) + subtitle.size() * Text.height(Style.SUBTITLE) + 10;
    double bottom = h - 8 - notes.size() * Text.height(Style.NOTE) - LEGEND_HEIGHT - (Text.height(Style.TICK) + 8);
    double left = PAD + Text.width("00.000°N", Style.TICK) + 8;
    double right = w - PAD - BAR_GAP - BAR_WIDTH - 6 - Text.width("-0000.00", Style.TICK) - 10 - Text.height(Style.TICK);

    Envelope geo = new Envelope();
    for (int i = 0; i < d.lat().length; i++) {
      geo.expandToInclude(d.lon()[i] - d.cellLon() / 2, d.lat()[i] - d.cellLat() / 2);
      geo.expandToInclude(d.lon()[i] + d.cellLon() / 2, d.lat()[i] + d.cellLat() / 2);
    }
    d.region().ifPresent(r -> geo.expandToInclude(r.getEnvelopeInternal()));
    geo.expandBy(geo.getWidth() * 0.03, geo.getHeight() * 0.03);

    double cos = Math.cos(Math.toRadians((geo.getMinY() + geo.getMaxY()) / 2));
    double availW = Math.max(40, right - left), availH = Math.max(40, bottom - top);
    double k = Math.min(availW / (geo.getWidth() * cos), availH / geo.getHeight());
    double fw = geo.getWidth() * cos * k, fh = geo.getHeight() * k;
    Rectangle2D frame = new Rectangle2D.Double(left + (availW - fw) / 2, top + (availH - fh) / 2, fw, fh);
    double barH = Math.min(availH, Math.max(fh, 140));
    Rectangle2D bar = new Rectangle2D.Double(frame.getMaxX() + BAR_GAP, frame.getCenterY() - barH / 2, BAR_WIDTH, barH);
    double legendTop = Math.max(frame.getMaxY(), bar.getMaxY()) + Text.height(Style.TICK) + 10;
    return new MapLayout(title, subtitle, notes, frame, bar, legendTop, geo.getMinX(), geo.getMaxY(), k, k * cos, geo.getMinY(), geo.getMaxX());
  }

  double x(double lon) {
    return frame.getX() + (lon - lonWest) * pxPerDegLon;
  }

  double y(double lat) {
    return frame.getY() + (latNorth - lat) * pxPerDegLat;
  }

  /** The rectangle of the cell centred at (lat, lon). */
  Rectangle2D cell(double lat, double lon, double cellLat, double cellLon) {
    double x0 = x(lon - cellLon / 2), x1 = x(lon + cellLon / 2), y0 = y(lat + cellLat / 2), y1 = y(lat - cellLat / 2);
    return new Rectangle2D.Double(x0, y0, x1 - x0, y1 - y0);
  }
}
