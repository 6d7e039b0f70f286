package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Geometry;

/** stations.csv and ground_truth.csv against their documented columns and against the grids. */
class StationsAndGroundTruthTest {

  @Test
  void stationsSampleEvery14DaysInTheWater() throws IOException {
    List<String> lines = Files.readAllLines(SmallScenario.get().stations());
    assertEquals("station,lon,lat,time,variable,value,units", lines.get(0));
    Geometry water = new RegionsFile(SmallScenario.get().regions()).water();
    RegionsFile regions = new RegionsFile(SmallScenario.get().regions());
    Map<String, List<Instant>> times = new TreeMap<>();
    for (String line : lines.subList(1, lines.size())) {
      String[] c = line.split(",");
      assertEquals(7, c.length, line);
      assertTrue(water.covers(regions.point(Double.parseDouble(c[1]), Double.parseDouble(c[2]))), "in water: " + line);
      Instant t = Instant.parse(c[3]); // ISO 8601 / RFC 3339 UTC form
      assertTrue(c[4].equals("chlorophyll") && c[6].equals("mg m-3") || c[4].equals("turbidity") && c[6].equals("FNU"),
          line);
      assertTrue(Double.parseDouble(c[5]) > 0, line);
      if (c[4].equals("chlorophyll")) {
        times.computeIfAbsent(c[0], k -> new ArrayList<>()).add(t);
      }
    }
    assertEquals(4, times.size());
    for (List<Instant> ts : times.values()) {
      for (int i = 1; i < ts.size(); i++) {
        assertEquals(14, ChronoUnit.DAYS.between(ts.get(i - 1), ts.get(i)));
      }
      assertTrue(ts.size() >= 730 / 14, "samples through both years");
    }
  }

  @Test
  void stationValuesAreTheGridValueNearbyPlusModestNoise() throws IOException {
    NcFile chl = new NcFile(SmallScenario.file("chlorophyll.nc"), "chlorophyll");
    List<String> lines = Files.readAllLines(SmallScenario.get().stations());
    int compared = 0;
    for (String line : lines.subList(1, lines.size())) {
      String[] c = line.split(",");
      if (!c[4].equals("chlorophyll")) {
        continue;
      }
      double lon = Double.parseDouble(c[1]);
      double lat = Double.parseDouble(c[2]);
      LocalDate day = LocalDate.ofInstant(Instant.parse(c[3]), ZoneOffset.UTC);
      double grid = nearestValue(chl, chl.indexOf(day), lon, lat);
      if (!Double.isNaN(grid)) {
        // Error is 8 % (1 sd) bounded at 3 sd by construction; allow 30 %.
        assertEquals(grid, Double.parseDouble(c[5]), 0.30 * grid + 0.01, line);
        compared++;
      }
    }
    assertTrue(compared > 50, "enough cloud-free matches: " + compared);
  }

  private static double nearestValue(NcFile f, int t, double lon, double lat) {
    double best = Double.MAX_VALUE;
    double value = Double.NaN;
    boolean anyWater;
    for (int i = 0; i < f.lat.length; i++) {
      for (int j = 0; j < f.lon.length; j++) {
        anyWater = false;
        for (double[][] day : f.values) {
          if (!Double.isNaN(day[i][j])) {
            anyWater = true;
            break;
          }
        }
        double d = Math.hypot((f.lon180(j) - lon) * 80, (f.lat[i] - lat) * 111);
        if (anyWater && d < best) {
          best = d;
          value = f.values[t][i][j];
        }
      }
    }
    return value;
  }

  @Test
  void groundTruthHasTheDocumentedColumnsAndConsistentRows() throws IOException {
    List<String> lines = Files.readAllLines(SmallScenario.get().groundTruth());
    assertEquals("event_id,region,onset,peak,peak_chlorophyll_mg_m3,drivers,lead_days", lines.get(0));
    assertEquals(2, lines.size() - 1, "one bloom (2014) and one storm (2013) in small()");
    for (String line : lines.subList(1, lines.size())) {
      String[] c = line.split(",", -1);
      assertEquals(7, c.length, line);
      LocalDate onset = LocalDate.parse(c[2]);
      LocalDate peak = LocalDate.parse(c[3]);
      assertTrue(!peak.isBefore(onset), line);
      String[] drivers = c[5].split(";");
      String[] leads = c[6].split(";");
      assertEquals(drivers.length, leads.length, line);
      for (String l : leads) {
        assertTrue(Integer.parseInt(l) >= 0, line);
      }
      if (c[0].startsWith("bloom-")) {
        double peakChl = Double.parseDouble(c[4]);
        assertTrue(peakChl >= 20 && peakChl <= 65, line);
        assertTrue(c[1].equals("Mid Reach") || c[1].equals("Outer Bay"), line);
        assertEquals(ChronoUnit.DAYS.between(LocalDate.of(onset.getYear(), 1, 1), onset), Long.parseLong(leads[0]),
            "rain anomaly planted from 1 January");
      } else {
        assertEquals("", c[4], "no chlorophyll for a turbidity event");
        assertEquals("rainfall+;runoff+", c[5]);
      }
    }
    String readme = Files.readString(SmallScenario.get().readme());
    assertTrue(readme.contains("lead_days") && readme.contains("invented"), "README explains the columns");
  }
}
