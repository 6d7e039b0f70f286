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
 * <p>Rows are produced as they are read ({@link TableStream}): a window of steps of every cell at a
 * time is copied out of the chunks (through the shared chunk cache), and {@link
 * TableStream#BATCH_ROWS} rows go out per batch, so the memory a request holds is bounded
 * ({@link #windowValues}: at most 64 MB and a sixteenth of the heap) whatever the period or the region. The number of rows is known before
 * the first ({@code rows} in the metadata).
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
    return open(p, cache, source, windowValues(Runtime.getRuntime().maxMemory()));
  }

  /**
   * The window for a heap of {@code maxHeapBytes}: {@link #WINDOW_VALUES}, or a sixteenth of the
   * heap where that is less, so that beside the chunk cache (a quarter of the heap) and the batches
   * a small heap keeps room (with 128 MB, 2 M values).
   */
  static int windowValues(long maxHeapBytes) {
    return (int) Math.max(1, Math.min(WINDOW_VALUES, maxHeapBytes / 16 / Float.BYTES));
  }

  /** With the window's size chosen (tests use small windows to cross many of them). */
  static TableStream open(Plan p, ChunkSource cache, String source, int windowValues) {
    return new Rows(p, cache, header(p, source), windowValues);
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
    List<Column> cols = columns(p, daily ? new LocalDate[0] : null, daily ? null : new String[0], new long[0], new long[0],
        new double[0], new double[0], new double[0], new double[0]);
    String title = p.cube().name() + " cell by cell over " + p.regionLabel() + ", " + p.query().period().start() + " to "
        + p.query().period().endInclusive();
    return new ResultTable(title, cols, meta, p.warnings());
  }

  /** The export's columns in their order; time as dates for daily and coarser cubes, else as instants. */
  private static List<Column> columns(Plan p, LocalDate[] dates, String[] instants, long[] row, long[] column,
      double[] lat, double[] lon, double[] fraction, double[] value) {
    return List.of(dates != null ? new Column.Dates("time", dates) : new Column.Strings("time", instants),
        new Column.Longs("row", "", row), new Column.Longs("column", "", column),
        new Column.Doubles("lat", "degrees_north", lat), new Column.Doubles("lon", "degrees_east", lon),
        new Column.Doubles("fraction_inside", "1", fraction), new Column.Doubles(p.cube().name(), p.unit(), value));
  }

  /** Values a window holds at most (4 bytes each): 64 MB, whatever the region and the period; less on a small heap. */
  static final int WINDOW_VALUES = 1 << 24;

  /**
   * The cursor over (step, cell). Values are copied a window of steps at a time out of the chunks
   * (every tile's chunks overlapping the window, one after the other, through the cache) into one
   * array of steps x cells, so a request holds at most {@link #WINDOW_VALUES} values (or one step) and no chunk
   * beyond the one being copied, however many tiles the region spans.
   */
  private static final class Rows implements TableStream {
    private final Plan p;
    private final ChunkSource cache;
    private final ResultTable header;
    private final boolean daily;
    private final TimeAxis time;
    private final int m;
    // Per cell of the weights: grid row and column, centre, fraction.
    private final long[] row;
    private final long[] col;
    private final double[] lat;
    private final double[] lon;
    private final double[] fraction;
    /** Per tile: its cells (indices into the weights) and its chunks in time order. */
    private final List<int[]> tileCells = new ArrayList<>();
    private final List<List<ChunkRecord>> tileChunks = new ArrayList<>();
    /** Steps [windowStart, windowEnd) of every cell: window[(t - windowStart) * m + cell], NaN where no chunk holds it. */
    private final float[] window;
    private final int windowSteps;
    private int windowStart;
    private int windowEnd;
    private int step;
    private int cell;

    Rows(Plan p, ChunkSource cache, ResultTable header, int windowValues) {
      this.p = p;
      this.cache = cache;
      this.header = header;
      this.daily = header.columns().get(0) instanceof Column.Dates;
      this.time = p.cube().descriptor().time();
      CellWeights w = p.weights();
      m = w.size();
      int rows = p.cube().layout().rows(), cols = p.cube().layout().columns();
      LatLonGrid g = p.cube().descriptor().grid();
      Map<Long, List<Integer>> tiles = new LinkedHashMap<>();
      row = new long[m];
      col = new long[m];
      lat = new double[m];
      lon = new double[m];
      fraction = new double[m];
      for (int i = 0; i < m; i++) {
        long tile = ((long) (w.row(i) / rows * rows) << 32) | (w.column(i) / cols * cols);
        tiles.computeIfAbsent(tile, k -> new ArrayList<>()).add(i);
        row[i] = w.row(i);
        col[i] = w.column(i);
        lat[i] = g.latCenter(w.row(i));
        lon[i] = g.lonCenter(w.column(i));
        fraction[i] = w.fraction(i);
      }
      Map<Long, Integer> index = new LinkedHashMap<>();
      for (Map.Entry<Long, List<Integer>> e : tiles.entrySet()) {
        index.put(e.getKey(), tileCells.size());
        tileCells.add(e.getValue().stream().mapToInt(Integer::intValue).toArray());
        tileChunks.add(new ArrayList<>());
      }
      for (ChunkRecord c : p.cube().chunks()) {
        Integer t = index.get(((long) c.key().y0() << 32) | c.key().x0());
        if (t != null && c.key().t0() < p.range()[1] && c.key().t0() + c.key().nt() > p.range()[0]) {
          tileChunks.get(t).add(c);
        }
      }
      tileChunks.forEach(l -> l.sort(Comparator.comparingInt(c -> c.key().t0())));
      int steps = p.range()[1] - p.range()[0];
      windowSteps = m == 0 ? 1 : (int) Math.max(1, Math.min(steps, windowValues / m));
      window = new float[m == 0 ? 0 : windowSteps * m];
      step = p.range()[0];
      windowStart = windowEnd = step;
    }

    @Override
    public ResultTable header() {
      return header;
    }

    @Override
    public ResultTable next() throws IOException {
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
        if (step == windowEnd) {
          fill(step);
        }
        LocalDate date = daily ? time.date(step) : null;
        String instant = daily ? null : time.instant(step).toString();
        int end = Math.min(m, cell + (n - k));
        int base = (step - windowStart) * m;
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
          double x = window[base + i];
          v[k] = identity || Double.isNaN(x) ? x : conv.apply(x);
        }
        cell = end;
        if (cell == m) {
          cell = 0;
          step++;
        }
      }
      return new ResultTable(header.title(), columns(p, dates, instants, r, c, la, lo, fr, v), header.metadata(),
          header.warnings());
    }

    /** Copies steps [from, from + windowSteps) (within the range) of every cell into the window. */
    private void fill(int from) throws IOException {
      windowStart = from;
      windowEnd = Math.min(p.range()[1], from + windowSteps);
      java.util.Arrays.fill(window, 0, (windowEnd - windowStart) * m, Float.NaN);
      for (int tile = 0; tile < tileCells.size(); tile++) {
        int[] cells = tileCells.get(tile);
        for (ChunkRecord chunk : tileChunks.get(tile)) {
          ChunkKey key = chunk.key();
          int t0 = Math.max(windowStart, key.t0()), t1 = Math.min(windowEnd, key.t0() + key.nt());
          if (t0 >= t1) {
            continue;
          }
          float[] values = cache.get(p.cube(), chunk);
          int plane = key.ny() * key.nx();
          for (int t = t0; t < t1; t++) {
            int src = (t - key.t0()) * plane, dst = (t - windowStart) * m;
            for (int i : cells) {
              window[dst + i] = values[src + (int) (row[i] - key.y0()) * key.nx() + (int) (col[i] - key.x0())];
            }
          }
        }
      }
    }
  }
}
