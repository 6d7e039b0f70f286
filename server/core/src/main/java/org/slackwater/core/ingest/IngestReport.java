package org.slackwater.core.ingest;

/**
 * What one published cube version cost: values read from the source, bytes written, seconds.
 *
 * @param cube the cube's name
 * @param version the version now current
 * @param values time steps x cells read
 * @param bytesWritten size of the chunk files
 * @param seconds wall time from open to commit
 */
public record IngestReport(String cube, int version, long values, long bytesWritten, double seconds) {
  /** Throughput in MB/s of float32 values (4 bytes each), the figure the ingest benchmark quotes. */
  public double valueMegabytesPerSecond() {
    return seconds > 0 ? values * 4.0 / 1e6 / seconds : Double.POSITIVE_INFINITY;
  }
}
