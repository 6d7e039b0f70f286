package org.slackwater.netcdf;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * The leading bytes of the NetCDF formats: {@code CDF\001} (classic), {@code CDF\002} (64-bit
 * offset), {@code CDF\005} (CDF-5, 64-bit data) and {@code \211HDF} (NetCDF-4, an HDF5 file whose
 * superblock sits at the start, as the netCDF library writes it).
 */
final class NetCdfMagic {

  private NetCdfMagic() {}

  /** Whether the file starts like a NetCDF file; false if it cannot be read. */
  static boolean matches(Path file) {
    byte[] head = head(file);
    return head != null && matches(head);
  }

  static boolean matches(byte[] head) {
    if (head.length < 4) {
      return false;
    }
    boolean cdf = head[0] == 'C' && head[1] == 'D' && head[2] == 'F' && (head[3] == 1 || head[3] == 2 || head[3] == 5);
    boolean hdf = (head[0] & 0xFF) == 0x89 && head[1] == 'H' && head[2] == 'D' && head[3] == 'F';
    return cdf || hdf;
  }

  /** Up to the first four bytes, or null if the file cannot be read. */
  static byte[] head(Path file) {
    try (InputStream in = Files.newInputStream(file)) {
      return in.readNBytes(4);
    } catch (IOException | SecurityException e) {
      return null;
    }
  }

  /** The leading bytes for a message, e.g. {@code 'PK\003\004'}. */
  static String show(byte[] head) {
    StringBuilder sb = new StringBuilder("'");
    for (byte b : head) {
      int c = b & 0xFF;
      sb.append(c >= 32 && c < 127 ? String.valueOf((char) c) : String.format("\\%03o", c));
    }
    return sb.append("'").toString();
  }
}
