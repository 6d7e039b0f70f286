package org.slackwater.core.query;

import java.io.IOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.analytics.UnitConversion;
import org.slackwater.core.catalog.CubeEntry;
import org.slackwater.core.cube.LatLonGrid;
import org.slackwater.core.cube.TimeAxis;
import org.slackwater.core.region.CellWeights;
import org.slackwater.core.result.Column;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.result.TableStream;
import org.slackwater.core.store.ChunkKey;
import org.slackwater.core.store.ChunkRecord;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.CellExport;

/**
 * {@code cells of <variable> over <region> <period> [in <unit>]}: the cube's values cell by cell
 * and step by step, one row per (step, cell) in step order and, within a step, in the grid's
 * row-major order: time, row, column, lat, lon, fraction of the cell inside the region, value
 * (empty where the cube has none, so every step lists the same cells). Cells are those with any
 * area inside the region, as for maps.
 *
 * <p>Rows are produced as they are read ({@link TableStream}): the chunks of one time chunk's
 * tiles at a time, through the shared chunk cache, and {@link TableStream#BATCH_ROWS} rows per
 * batch, so the memory a request holds does not grow with the period or the region. The number
 * of rows is known before the first ({@code rows} in the metadata).
 */
final class CellExportStatement {
  private CellExportStatement() {}

  record Plan(CellExport query, CubeEntry cube, CellWeights weights, String regionLabel, String regionWkt, int[] range,
      UnitConversion conversion, String unit, List<String> warnings) {
    long rows() {
      return (long) (range[1] - range[0]) * weights.size();
    }
  }

  static Plan analyze(CellExport q, SeriesPlanner planner) {
    CubeEntry cube = planner.cube(q.variable());
    SeriesPlanner.OnGrid on = planner.onGrid(cube, q.region());
    List<String> warnings = new ArrayList<>();
    int[] range = planner.range(cube.descriptor().time(), q.period(), cube.name(), warnings);
    String unit = cube.descriptor().units();
    UnitConversion conversion = UnitConversion.between(unit, unit);
    if (q.unit().isPresent()) {
      try {
        conversion = UnitConversion.between(unit, q.unit().get().unit());
      } catch (UnitConversion.UnitMismatchException e) {
        throw QueryException.at(q.unit().get(), planner.source(), e.getMessage(), "the data are in '" + unit + "'");
      }
      unit = q.unit().get().unit();
    }
    RegionResolver.Resolved region = on.region();
    return new Plan(q, cube, on.weights(), region.label(), region.geometry().toText(), range, conversion, unit, warnings);
  }

  static TableStream open(Plan p, ChunkSource cache, String source) {
    return new Rows(p, cache, header(p, source));
  }

  private static ResultTable header(Plan p, String source) {
    boolean daily = SeriesPlanner.nativeStepDays(p.cube().descriptor().time()) >= 1 - 1e-9;
    Map<String, String> meta = new LinkedHashMap<>();
    meta.put("query", source);
    meta.put("variable", p.cube().name());
    meta.put("cube_version", Integer.toString(p.cube().version()));
    meta.put("units", p.unit());
    meta.put("region", p.regionLabel());
    meta.put("period", p.query().period().start() + " to " + p.query().period().endInclusive());
    LatLonGrid g = p.cube().descriptor().grid();
    meta.put("grid", g.ny() + " x " + g.nx() + " cells");
    meta.put("cells", Integer.toString(p.weights().size()));
    meta.put("steps", Integer.toString(p.range()[1] - p.range()[0]));
    meta.put("rows", Long.toString(p.rows()));
    meta.put("order", "by time, then by grid row and column");
    meta.put("region_wkt", p.regionWkt());
    meta.put(ResultKind.KEY, ResultKind.CELLS.label());
    List<Column> cols = List.of(daily ? new Column.Dates("time", new LocalDate[0]) : new Column.Strings("time", new String[0]),
        new Column.Longs("row", "", new long[0]), new Column.Longs("column", "", new long[0]),
        new Column.Doubles("lat", "degrees_north", new double[0]), new Column.Doubles("lon", "degrees_east", new double[0]),
        new Column.Doubles("fraction_inside", "1", new double[0]), new Column.Doubles(p.cube().name(), p.unit(), new double[0]));
    String title = p.cube().name() + " cell by cell over " + p.regionLabel() + ", " + p.query().period().start() + " to "
        + p.query().period().endInclusive();
    return new ResultTable(title, cols, meta, p.warnings());
  }

  /** The cursor over (step, cell): the current step's chunk of each tile, refreshed as steps pass its end. */
  private static final class Rows implements TableStream {
    private final Plan p;
    private final ChunkSource cache;
    private final ResultTable header;
    private final boolean daily;
    private final TimeAxis time;
    // Per cell of the weights: its tile, grid row and column, centre, fraction.
    private final int[] tileOf;
    private final long[] row;
    private final long[] col;
    private final double[] lat;
    private final double[] lon;
    private final double[] fraction;
    /** Per tile its chunks in time order, and the one holding the current step (or none). */
    private final List<List<ChunkRecord>> tileChunks;
    private final int[] current;
    private final float[][] values;
    private final ChunkKey[] keys;
    private int step;
    private int cell;

    Rows(Plan p, ChunkSource cache, ResultTable header) {
      this.p = p;
      this.cache = cache;
      this.header = header;
      this.daily = header.columns().get(0) instanceof Column.Dates;
      this.time = p.cube().descriptor().time();
      CellWeights w = p.weights();
      int m = w.size();
      int rows = p.cube().layout().rows(), cols = p.cube().layout().columns();
      LatLonGrid g = p.cube().descriptor().grid();
      Map<Long, Integer> tiles = new LinkedHashMap<>();
      tileOf = new int[m];
      row = new long[m];
      col = new long[m];
      lat = new double[m];
      lon = new double[m];
      fraction = new double[m];
      for (int i = 0; i < m; i++) {
        int y0 = w.row(i) / rows * rows, x0 = w.column(i) / cols * cols;
        tileOf[i] = tiles.computeIfAbsent(((long) y0 << 32) | x0, k -> tiles.size());
        row[i] = w.row(i);
        col[i] = w.column(i);
        lat[i] = g.latCenter(w.row(i));
        lon[i] = g.lonCenter(w.column(i));
        fraction[i] = w.fraction(i);
      }
      tileChunks = new ArrayList<>();
      for (int t = 0; t < tiles.size(); t++) {
        tileChunks.add(new ArrayList<>());
      }
      for (ChunkRecord c : p.cube().chunks()) {
        Integer t = tiles.get(((long) c.key().y0() << 32) | c.key().x0());
        if (t != null && c.key().t0() < p.range()[1] && c.key().t0() + c.key().nt() > p.range()[0]) {
          tileChunks.get(t).add(c);
        }
      }
      tileChunks.forEach(l -> l.sort(Comparator.comparingInt(c -> c.key().t0())));
      current = new int[tiles.size()];
      java.util.Arrays.fill(current, -1);
      values = new float[tiles.size()][];
      keys = new ChunkKey[tiles.size()];
      step = p.range()[0];
      cell = 0;
    }

    @Override
    public ResultTable header() {
      return header;
    }

    @Override
    public ResultTable next() throws IOException {
      int m = p.weights().size();
      long left = (long) (p.range()[1] - step) * m - cell;
      if (m == 0 || left <= 0) {
        return null;
      }
      int n = (int) Math.min(BATCH_ROWS, left);
      LocalDate[] dates = daily ? new LocalDate[n] : null;
      String[] instants = daily ? null : new String[n];
      long[] r = new long[n], c = new long[n];
      double[] la = new double[n], lo = new double[n], fr = new double[n], v = new double[n];
      UnitConversion conv = p.conversion();
      boolean identity = conv.identity();
      for (int k = 0; k < n; ) {
        if (cell == 0) {
          advance(step);
        }
        LocalDate date = daily ? time.date(step) : null;
        String instant = daily ? null : time.instant(step).toString();
        int end = Math.min(m, cell + (n - k));
        for (int i = cell; i < end; i++, k++) {
          if (daily) {
            dates[k] = date;
          } else {
            instants[k] = instant;
          }
          r[k] = row[i];
          c[k] = col[i];
          la[k] = lat[i];
          lo[k] = lon[i];
          fr[k] = fraction[i];
          float[] tile = values[tileOf[i]];
          double x = Double.NaN;
          if (tile != null) {
            ChunkKey key = keys[tileOf[i]];
            x = tile[(step - key.t0()) * key.ny() * key.nx() + (int) (row[i] - key.y0()) * key.nx() + (int) (col[i] - key.x0())];
          }
          v[k] = identity || Double.isNaN(x) ? x : conv.apply(x);
        }
        cell = end;
        if (cell == m) {
          cell = 0;
          step++;
        }
      }
      List<Column> cols = List.of(daily ? new Column.Dates("time", dates) : new Column.Strings("time", instants),
          new Column.Longs("row", "", r), new Column.Longs("column", "", c),
          new Column.Doubles("lat", "degrees_north", la), new Column.Doubles("lon", "degrees_east", lo),
          new Column.Doubles("fraction_inside", "1", fr), new Column.Doubles(p.cube().name(), p.unit(), v));
      return new ResultTable(header.title(), cols, header.metadata(), header.warnings());
    }

    /** Makes each tile's current chunk the one holding step t (none where the cube has no chunk there). */
    private void advance(int t) throws IOException {
      for (int tile = 0; tile < current.length; tile++) {
        List<ChunkRecord> list = tileChunks.get(tile);
        int at = current[tile];
        if (at >= 0 && holds(list.get(at), t)) {
          continue;
        }
        int found = -1;
        for (int q = Math.max(0, at); q < list.size(); q++) {
          if (holds(list.get(q), t)) {
            found = q;
            break;
          }
        }
        current[tile] = found;
        keys[tile] = found < 0 ? null : list.get(found).key();
        values[tile] = found < 0 ? null : cache.get(p.cube(), list.get(found));
      }
    }

    private static boolean holds(ChunkRecord c, int t) {
      return t >= c.key().t0() && t < c.key().t0() + c.key().nt();
    }
  }
}
