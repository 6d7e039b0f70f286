package org.slackwater.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.time.LocalDate;
import java.util.List;
import org.hipparchus.stat.correlation.PearsonsCorrelation;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.locationtech.jts.geom.Geometry;
import org.locationtech.jts.geom.Polygon;

/**
 * The planted story of small() is really in the files, measured only through the files themselves
 * (NetCDF-Java, the GeoJSON regions, the ground-truth CSV), not through generator internals.
 */
class PlantedSignalsTest {

  private static RegionsFile regions;
  private static List<String[]> truth;

  @BeforeAll
  static void read() throws IOException {
    regions = new RegionsFile(SmallScenario.get().regions());
    truth = Files.readAllLines(SmallScenario.get().groundTruth()).stream().skip(1).map(l -> l.split(",", -1)).toList();
  }

  @Test
  void wetWinterSpringOfTheBloomYearOutrainsTheYearBefore() throws IOException {
    NcFile rain = new NcFile(SmallScenario.file("rainfall.nc"), "rainfall");
    double[] series = areaMean(rain, regions.polygons.get("Harle Watershed"));
    double y2013 = meanOver(rain, series, LocalDate.of(2013, 1, 1), LocalDate.of(2013, 5, 31));
    double y2014 = meanOver(rain, series, LocalDate.of(2014, 1, 1), LocalDate.of(2014, 5, 31));
    assertTrue(y2014 > y2013, "Jan-May watershed rain 2014 " + y2014 + " vs 2013 " + y2013);
  }

  @Test
  void bloomIn2014SummerAndNoneIn2013() throws IOException {
    NcFile chl = new NcFile(SmallScenario.file("chlorophyll.nc"), "chlorophyll");
    double summer2014 = maxOver(chl, LocalDate.of(2014, 6, 1), LocalDate.of(2014, 8, 31));
    double all2013 = maxOver(chl, LocalDate.of(2013, 1, 1), LocalDate.of(2013, 12, 31));
    assertTrue(summer2014 > 20, "2014 summer max " + summer2014);
    assertTrue(all2013 < 10, "2013 max " + all2013);
    List<String[]> blooms = truth.stream().filter(r -> r[0].startsWith("bloom-")).toList();
    assertEquals(1, blooms.size());
    assertEquals("bloom-2014", blooms.get(0)[0]);
    assertTrue(Double.parseDouble(blooms.get(0)[4]) >= summer2014 - 1e-3,
        "ground truth uses the gap-free field, so its peak is at least what the satellite saw");
  }

  @Test
  void runoffLagsRainfall() throws IOException {
    NcFile rain = new NcFile(SmallScenario.file("rainfall.nc"), "rainfall");
    NcFile runoff = new NcFile(SmallScenario.file("runoff.nc"), "runoff");
    double[] r = areaMean(rain, regions.polygons.get("Harle Watershed"));
    double[] q = areaMean(runoff, regions.polygons.get("Harle Watershed"));
    // Align by decoded date: the noleap runoff has no 29 February (none in 2013-2014 anyway).
    double[] ra = new double[q.length];
    for (int i = 0; i < q.length; i++) {
      int j = rain.indexOf(runoff.dates[i]);
      assertTrue(j >= 0, "rain has " + runoff.dates[i]);
      ra[i] = r[j];
    }
    int best = 0;
    double bestCorr = -2;
    for (int lag = 0; lag <= 20; lag++) {
      double c = correlation(ra, q, lag);
      if (c > bestCorr) {
        bestCorr = c;
        best = lag;
      }
    }
    assertTrue(best > 0, "cross-correlation peaks at lag " + best + " days (r = " + bestCorr + ")");
    assertTrue(bestCorr > correlation(ra, q, 0), "lagged correlation beats the same-day one");
  }

  @Test
  void stormRaisesUpperReachTurbidity() throws IOException {
    String[] storm = truth.stream().filter(r -> r[0].equals("turbidity-2013")).findFirst().orElseThrow();
    LocalDate onset = LocalDate.parse(storm[2]);
    NcFile tur = new NcFile(SmallScenario.file("turbidity.nc"), "turbidity");
    double[] near = nearMouthMean(tur);
    double before = meanOver(tur, near, onset.minusDays(40), onset.minusDays(10));
    double after = Double.NEGATIVE_INFINITY;
    for (int d = 0; d <= 10; d++) {
      int i = tur.indexOf(onset.plusDays(d));
      after = Double.isNaN(near[i]) ? after : Math.max(after, near[i]);
    }
    assertTrue(after > 2 * before, "turbidity near the mouth after the storm " + after + " vs before " + before);
  }

  @Test
  void spellBeforeTheBloomIsClearAndWarmComparedWithTheSameDaysOf2013() throws IOException {
    String[] bloom = truth.stream().filter(r -> r[0].equals("bloom-2014")).findFirst().orElseThrow();
    assertEquals("rainfall+;runoff+;water_temperature+;cloud_fraction-;turbidity-", bloom[5]);
    LocalDate onset = LocalDate.parse(bloom[2]);
    int spellLead = Integer.parseInt(bloom[6].split(";")[2]);
    assertTrue(spellLead >= 14 && spellLead <= 28, "spell of 2-4 weeks: " + spellLead);
    LocalDate from = onset.minusDays(spellLead);
    LocalDate to = onset.minusDays(1);
    NcFile cloud = new NcFile(SmallScenario.file("cloud_fraction.nc"), "cloud_fraction");
    double[] cl = allMean(cloud);
    assertTrue(meanOver(cloud, cl, from, to) < meanOver(cloud, cl, from.minusYears(1), to.minusYears(1)) - 0.2,
        "clear spell");
    NcFile temp = new NcFile(SmallScenario.file("water_temperature.nc"), "water_temperature");
    double[] t = allMean(temp);
    assertTrue(meanOver(temp, t, from, to) > meanOver(temp, t, from.minusYears(1), to.minusYears(1)), "warm spell");
  }

  static double[] areaMean(NcFile f, Polygon area) {
    double[] out = new double[f.dates.length];
    int cells = 0;
    for (int i = 0; i < f.lat.length; i++) {
      for (int j = 0; j < f.lon.length; j++) {
        if (area.covers(regions.point(f.lon180(j), f.lat[i]))) {
          cells++;
          for (int t = 0; t < out.length; t++) {
            out[t] += f.values[t][i][j];
          }
        }
      }
    }
    assertTrue(cells > 0, "grid has a cell centre in the area");
    for (int t = 0; t < out.length; t++) {
      out[t] /= cells;
    }
    return out;
  }

  /** Daily mean over cells within 15 km of the mouth's water, ignoring gaps. */
  static double[] nearMouthMean(NcFile f) {
    Geometry water = regions.water();
    double[] out = new double[f.dates.length];
    for (int t = 0; t < out.length; t++) {
      double s = 0;
      int n = 0;
      for (int i = 0; i < f.lat.length; i++) {
        for (int j = 0; j < f.lon.length; j++) {
          double km = Math.hypot((f.lon180(j) + 31.40) * 80.0, (f.lat[i] - 44.30) * 111.0);
          double v = f.values[t][i][j];
          if (km < 25 && !Double.isNaN(v) && water.covers(regions.point(f.lon180(j), f.lat[i]))) {
            s += v;
            n++;
          }
        }
      }
      out[t] = n == 0 ? Double.NaN : s / n;
    }
    return out;
  }

  static double[] allMean(NcFile f) {
    double[] out = new double[f.dates.length];
    for (int t = 0; t < out.length; t++) {
      double s = 0;
      int n = 0;
      for (double[] row : f.values[t]) {
        for (double v : row) {
          if (!Double.isNaN(v)) {
            s += v;
            n++;
          }
        }
      }
      out[t] = s / n;
    }
    return out;
  }

  static double meanOver(NcFile f, double[] series, LocalDate from, LocalDate to) {
    double s = 0;
    int n = 0;
    for (int t = 0; t < series.length; t++) {
      if (!f.dates[t].isBefore(from) && !f.dates[t].isAfter(to) && !Double.isNaN(series[t])) {
        s += series[t];
        n++;
      }
    }
    assertTrue(n > 0, "values between " + from + " and " + to);
    return s / n;
  }

  static double maxOver(NcFile f, LocalDate from, LocalDate to) {
    double m = Double.NEGATIVE_INFINITY;
    for (int t = 0; t < f.dates.length; t++) {
      if (!f.dates[t].isBefore(from) && !f.dates[t].isAfter(to)) {
        for (double[] row : f.values[t]) {
          for (double v : row) {
            if (!Double.isNaN(v)) {
              m = Math.max(m, v);
            }
          }
        }
      }
    }
    return m;
  }

  /** Pearson correlation of x(t) with y(t + lag), computed by Hipparchus. */
  static double correlation(double[] x, double[] y, int lag) {
    double[] a = java.util.Arrays.copyOfRange(x, 0, x.length - lag);
    double[] b = java.util.Arrays.copyOfRange(y, lag, y.length);
    return new PearsonsCorrelation().correlation(a, b);
  }
}
