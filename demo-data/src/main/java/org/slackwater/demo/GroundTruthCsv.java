package org.slackwater.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;

/**
 * ground_truth.csv: {@code event_id,region,onset,peak,peak_chlorophyll_mg_m3,drivers,lead_days}.
 * Drivers and lead days are semicolon-separated lists in the same order; dates ISO 8601; the
 * chlorophyll column is empty for turbidity events.
 */
final class GroundTruthCsv {

  static final List<String> HEADER = List.of("event_id", "region", "onset", "peak", "peak_chlorophyll_mg_m3",
      "drivers", "lead_days");

  private GroundTruthCsv() {
  }

  static void write(Path file, List<GroundTruthRow> events) throws IOException {
    List<List<String>> rows = new ArrayList<>();
    for (GroundTruthRow e : events) {
      rows.add(List.of(e.eventId(), e.region(), e.onset().toString(), e.peak().toString(),
          Double.isNaN(e.peakChlorophyll()) ? "" : CsvText.number(e.peakChlorophyll(), 2),
          String.join(";", e.drivers()),
          e.leadDays().stream().map(String::valueOf).collect(Collectors.joining(";"))));
    }
    CsvText.write(file, HEADER, rows);
  }
}
