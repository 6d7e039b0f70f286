package org.slackwater.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;

/** stations.csv: {@code station,lon,lat,time,variable,value,units}, times ISO 8601 in UTC. */
final class StationsCsv {

  static final List<String> HEADER = List.of("station", "lon", "lat", "time", "variable", "value", "units");
  private static final DateTimeFormatter ISO = DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss'Z'");

  private StationsCsv() {
  }

  static void write(Path file, List<StationSample> samples) throws IOException {
    List<List<String>> rows = new ArrayList<>();
    for (StationSample s : samples) {
      rows.add(List.of(s.station().name(), CsvText.number(s.station().lon(), 5), CsvText.number(s.station().lat(), 5),
          ISO.format(s.time()), s.variable(), CsvText.number(s.value(), 2), s.units()));
    }
    CsvText.write(file, HEADER, rows);
  }
}
