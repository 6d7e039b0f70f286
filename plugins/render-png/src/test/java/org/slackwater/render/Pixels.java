package org.slackwater.render;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.imageio.ImageIO;

/** Decoding rendered PNGs and looking at their pixels. */
final class Pixels {
  private Pixels() {}

  /** The PNG signature, PNG specification (ISO/IEC 15948) section 5.2. */
  static final byte[] SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};

  /** Decodes with ImageIO after checking the signature; keeps a copy in target/rendered for a look. */
  static BufferedImage decode(byte[] png, String name) {
    byte[] head = java.util.Arrays.copyOf(png, 8);
    assertArrayEquals(SIGNATURE, head, "PNG signature");
    try {
      Path dir = Path.of("target", "rendered");
      Files.createDirectories(dir);
      Files.write(dir.resolve(name + ".png"), png);
      BufferedImage img = ImageIO.read(new ByteArrayInputStream(png));
      assertTrue(img != null, "ImageIO could not decode the PNG");
      return img;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  static Color at(BufferedImage img, double x, double y) {
    return new Color(img.getRGB((int) Math.floor(x), (int) Math.floor(y)));
  }

  static boolean close(Color a, Color b, int tolerance) {
    return Math.abs(a.getRed() - b.getRed()) <= tolerance && Math.abs(a.getGreen() - b.getGreen()) <= tolerance
        && Math.abs(a.getBlue() - b.getBlue()) <= tolerance;
  }

  static void assertColour(Color expected, Color actual, int tolerance, String what) {
    assertTrue(close(expected, actual, tolerance), what + ": expected " + hex(expected) + " within ±" + tolerance + ", got " + hex(actual));
  }

  static void assertSize(BufferedImage img, int width, int height) {
    assertEquals(width, img.getWidth(), "PNG width");
    assertEquals(height, img.getHeight(), "PNG height");
  }

  /** Pixels of exactly this colour (± tolerance per channel) within rows y0..y1 (exclusive). */
  static int count(BufferedImage img, Color c, int tolerance, int y0, int y1) {
    int n = 0;
    for (int y = Math.max(0, y0); y < Math.min(img.getHeight(), y1); y++) {
      for (int x = 0; x < img.getWidth(); x++) {
        if (close(new Color(img.getRGB(x, y)), c, tolerance)) {
          n++;
        }
      }
    }
    return n;
  }

  static int count(BufferedImage img, Color c, int tolerance) {
    return count(img, c, tolerance, 0, img.getHeight());
  }

  static String hex(Color c) {
    return String.format("#%02x%02x%02x", c.getRed(), c.getGreen(), c.getBlue());
  }

  static Color hex(String s) {
    return new Color(Integer.parseInt(s.substring(1), 16));
  }
}
