package org.slackwater.alerts;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.Instant;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import javax.imageio.ImageIO;

/** Alerts of the invented Wrenmouth scenario, and a real PNG written by the JDK's ImageIO encoder. */
final class TestAlerts {

  static final String WATCH = "North Intake bloom";
  static final LocalDate STEP = LocalDate.of(2020, 7, 14);
  static final Instant RAISED_AT = Instant.parse("2020-07-15T06:00:00Z");
  static final String SECRET = "wrenmouth-test-secret-0123456789abcdef";

  private TestAlerts() {}

  static Map<String, String> values() {
    Map<String, String> v = new LinkedHashMap<>();
    v.put("region", "North Intake");
    v.put("mean chlorophyll", "12.6 mg/m3");
    v.put("days above threshold", "3");
    return v;
  }

  static Alert raised(Optional<byte[]> png) {
    return raised(STEP, png);
  }

  static Alert raised(LocalDate step, Optional<byte[]> png) {
    return new Alert(Alert.transitionKey(WATCH, "raised", step), WATCH, "raised", "warning", step,
        "mean chlorophyll over \"North Intake\" above 10 mg/m3 for 3 days", values(), Alert.CAUTION, RAISED_AT, png);
  }

  /** A small map-like picture: water blue with a green patch, as a PNG from ImageIO. */
  static byte[] png() {
    BufferedImage img = new BufferedImage(32, 24, BufferedImage.TYPE_INT_RGB);
    for (int y = 0; y < img.getHeight(); y++) {
      for (int x = 0; x < img.getWidth(); x++) {
        img.setRGB(x, y, (x > 10 && x < 20 && y > 6 && y < 16 ? new Color(40, 160, 60) : new Color(30, 80, 160)).getRGB());
      }
    }
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    try {
      if (!ImageIO.write(img, "png", out)) {
        throw new IllegalStateException("no PNG writer in this JDK");
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toByteArray();
  }

  static Channel webhook(String id, int port) {
    return Channel.webhook(id, "http://127.0.0.1:" + port + "/hooks/slackwater", SECRET);
  }
}
