package org.slackwater.render;

import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.Iterator;
import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageTypeSpecifier;
import javax.imageio.ImageWriter;
import javax.imageio.metadata.IIOInvalidTreeException;
import javax.imageio.metadata.IIOMetadata;
import javax.imageio.metadata.IIOMetadataNode;
import javax.imageio.stream.ImageOutputStream;

/**
 * PNG bytes of an image, with the physical pixel size (the pHYs chunk of the PNG specification,
 * ISO/IEC 15948, 11.3.5.3: pixels per metre) so that a plot rendered at scale 2 prints at its
 * layout size with twice the resolution.
 */
final class PngEncoder {
  private PngEncoder() {}

  static byte[] encode(BufferedImage image, double dotsPerInch) {
    Iterator<ImageWriter> writers = ImageIO.getImageWritersByFormatName("png");
    if (!writers.hasNext()) {
      throw new IllegalStateException("this Java runtime has no PNG writer (javax.imageio)");
    }
    ImageWriter writer = writers.next();
    ByteArrayOutputStream out = new ByteArrayOutputStream(1 << 16);
    try (ImageOutputStream stream = ImageIO.createImageOutputStream(out)) {
      writer.setOutput(stream);
      IIOMetadata meta = writer.getDefaultImageMetadata(ImageTypeSpecifier.createFromRenderedImage(image), writer.getDefaultWriteParam());
      long perMetre = Math.round(dotsPerInch / 0.0254);
      IIOMetadataNode phys = new IIOMetadataNode("pHYs");
      phys.setAttribute("pixelsPerUnitXAxis", Long.toString(perMetre));
      phys.setAttribute("pixelsPerUnitYAxis", Long.toString(perMetre));
      phys.setAttribute("unitSpecifier", "meter");
      IIOMetadataNode root = new IIOMetadataNode("javax_imageio_png_1.0");
      root.appendChild(phys);
      meta.mergeTree("javax_imageio_png_1.0", root);
      writer.write(new IIOImage(image, null, meta));
    } catch (IIOInvalidTreeException e) {
      throw new IllegalStateException("the PNG writer refused the pixel-size metadata: " + e.getMessage(), e);
    } catch (IOException e) {
      throw new UncheckedIOException("writing a PNG into memory failed", e);
    } finally {
      writer.dispose();
    }
    return out.toByteArray();
  }
}
