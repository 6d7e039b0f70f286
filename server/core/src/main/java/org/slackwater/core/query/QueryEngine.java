package org.slackwater.core.query;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.slackwater.core.analytics.ChunkCache;
import org.slackwater.core.analytics.ChunkSource;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.result.ResultTable;
import org.slackwater.core.result.TableStream;
import org.slackwater.query.QueryParser;
import org.slackwater.query.QueryPrinter;
import org.slackwater.query.QueryException;
import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.CellExport;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.Watch;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.MapStatement;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.DescribeVariable;
import org.slackwater.query.ast.ListRegions;
import org.slackwater.query.ast.ListVariables;
import org.slackwater.query.ast.Script;
import org.slackwater.query.ast.Statement;

/**
 * Runs query text against the catalog: parse, then for each statement analyse (names, regions,
 * dates, units; errors at their position) and execute, one {@link ResultTable} per statement.
 *
 * <p>Every problem with the user's text is a {@link org.slackwater.query.QueryException} with a
 * line and column; an I/O failure of the store is an {@link UncheckedIOException}, which the
 * server reports as its own fault, not the user's. Thread-safe.
 */
public final class QueryEngine {

  private final Catalog catalog;
  private final ChunkCache cache;
  private final WeightsCache weights;

  public QueryEngine(Catalog catalog, ChunkCache cache, WeightsCache weights) {
    this.catalog = Objects.requireNonNull(catalog);
    this.cache = Objects.requireNonNull(cache);
    this.weights = Objects.requireNonNull(weights);
  }

  /** Rows of a cell export that {@link #run} still holds in one table; {@link #open} streams any number. */
  public static final long MAX_HELD_ROWS = 2_000_000;

  /**
   * Parses, analyses every statement (so an error in the last one is reported before any work), then
   * executes, every result whole in memory. A cell export is held too, up to {@link #MAX_HELD_ROWS}
   * rows; {@link #open} streams longer ones.
   */
  public List<ResultTable> run(String text) {
    Analysis a = analysis(text);
    for (Object plan : a.plans()) {
      if (plan instanceof CellExportStatement.Plan p && p.rows() > MAX_HELD_ROWS) {
        throw QueryException.at(p.query(), text, "this export has " + p.rows() + " rows, more than the "
            + MAX_HELD_ROWS + " an answer held in memory may have",
            "ask the HTTP query endpoint (POST /api/query), which streams it as CSV, JSON or Arrow, or export a shorter period or a smaller region");
      }
    }
    return executeAll(a, text);
  }

  private List<ResultTable> executeAll(Analysis a, String text) {
    ChunkSource chunks = a.derived().chunks(cache);
    List<ResultTable> out = new ArrayList<>();
    for (int i = 0; i < a.plans().size(); i++) {
      out.add(execute(a.plans().get(i), chunks, text).with(ResultKind.KEY, a.kinds().get(i).label()));
    }
    return out;
  }

  /** What {@link #open} answers: tables held whole, or the rows of one export as they are read. */
  public sealed interface Answer permits Answer.Tables, Answer.Rows {
    /** Every statement's result, as {@link #run} gives them. */
    record Tables(List<ResultTable> tables) implements Answer {}

    /** The rows of the request's one cell export; the caller closes the stream. */
    record Rows(TableStream stream) implements Answer {}
  }

  /**
   * Like {@link #run}, but a request whose statement is a cell export ({@code cells of ...}) is
   * answered by a stream of its rows, read as the caller writes them out, whatever their number. Such
   * a request holds that one statement, after any {@code let} definitions it uses.
   */
  public Answer open(String text) {
    Analysis a = analysis(text);
    int exports = 0;
    CellExportStatement.Plan export = null;
    for (Object plan : a.plans()) {
      if (plan instanceof CellExportStatement.Plan p) {
        exports++;
        export = p;
      }
    }
    if (exports == 0) {
      return new Answer.Tables(executeAll(a, text));
    }
    for (int i = 0; i < a.plans().size(); i++) {
      if (a.kinds().get(i) != ResultKind.DEFINITION && a.kinds().get(i) != ResultKind.CELLS) {
        throw QueryException.at(export.query(), text, "a cell export streams its rows and must be the request's only statement"
            + " (after any 'let' definitions it uses)", "send the other statements in a request of their own");
      }
    }
    if (exports > 1) {
      throw QueryException.at(export.query(), text, "a request holds one cell export, this one has " + exports,
          "send each export in a request of its own");
    }
    return new Answer.Rows(CellExportStatement.open(export, a.derived().chunks(cache), text));
  }

  /**
   * Station grab samples (CSV) against a cube: per station and overall n, bias, RMSE and r (see
   * {@link org.slackwater.core.analytics.MatchUps}).
   *
   * @throws IllegalArgumentException for an unknown variable or a bad row (the message names it)
   */
  public ResultTable matchUps(String variable, String csv, int windowDays) {
    var cube = catalog.cube(variable).orElseThrow(() -> new IllegalArgumentException("there is no variable '" + variable + "'"));
    if (windowDays < 0 || windowDays > 30) {
      throw new IllegalArgumentException("window must be 0 to 30 days, was " + windowDays);
    }
    var samples = org.slackwater.core.analytics.MatchUps.parse(csv, variable, cube.descriptor().units());
    try {
      var stats = org.slackwater.core.analytics.MatchUps.compute(cache, cube, samples, windowDays);
      int n = stats.size();
      String[] station = new String[n];
      long[] count = new long[n], matched = new long[n];
      double[] bias = new double[n], rmse = new double[n], r = new double[n], ms = new double[n], mc = new double[n];
      for (int i = 0; i < n; i++) {
        var st = stats.get(i);
        station[i] = st.station();
        count[i] = st.samples();
        matched[i] = st.n();
        bias[i] = st.bias();
        rmse[i] = st.rmse();
        r[i] = st.r();
        ms[i] = st.meanSample();
        mc[i] = st.meanCube();
      }
      String u = cube.descriptor().units();
      return new ResultTable("match-ups of " + variable + " with station samples", List.of(
          new org.slackwater.core.result.Column.Strings("station", station), new org.slackwater.core.result.Column.Longs("samples", "", count),
          new org.slackwater.core.result.Column.Longs("n", "", matched), new org.slackwater.core.result.Column.Doubles("bias", u, bias),
          new org.slackwater.core.result.Column.Doubles("rmse", u, rmse), new org.slackwater.core.result.Column.Doubles("r", "1", r),
          new org.slackwater.core.result.Column.Doubles("mean_sample", u, ms), new org.slackwater.core.result.Column.Doubles("mean_cube", u, mc)),
          java.util.Map.of("variable", variable, "cube_version", Integer.toString(cube.version()),
              "pairing", "the cell containing the station, on the sample's UTC date" + (windowDays > 0 ? " +/- " + windowDays + " days (mean)" : ""),
              "bias", "mean(cube - sample)"), List.of());
    } catch (IOException e) {
      throw new UncheckedIOException("reading the data store failed: " + e.getMessage(), e);
    }
  }

  /** A watch definition that passed its checks: its name, canonical text and description. */
  public record CheckedWatch(String name, String text, ResultTable description) {}

  /**
   * Parses and checks one watch definition (the body of {@code POST /api/watches}); nothing is
   * stored here.
   */
  public CheckedWatch checkWatch(String text) {
    Script script = QueryParser.parse(text);
    if (script.statements().size() != 1 || !(script.statements().get(0) instanceof Watch w)) {
      throw QueryException.at(script.statements().isEmpty() ? script : script.statements().get(0), text,
          "send exactly one watch definition", "e.g. watch \"North Intake bloom\" over \"North Intake\" when mean chlorophyll above 10 mg/m3 for 3 days");
    }
    DerivedVariables derived = new DerivedVariables(catalog, text);
    ResultTable d = WatchStatements.check(w, new SeriesPlanner(catalog, weights, text, derived));
    return new CheckedWatch(w.name(), QueryPrinter.print(w), d);
  }

  /**
   * Evaluates a stored watch's text day by day over {@code [from, to]} (clipped to the data; see
   * {@link WatchEvaluator} for the rules). Checks the watch first, so a watch whose variables or
   * regions went away fails with the same positioned errors as when it was stored.
   */
  public org.slackwater.core.watch.WatchRun evaluateWatch(String text, java.time.LocalDate from, java.time.LocalDate to) {
    Watch w = onlyWatch(text);
    SeriesPlanner planner = new SeriesPlanner(catalog, weights, text, new DerivedVariables(catalog, text));
    WatchStatements.check(w, planner);
    try {
      return WatchEvaluator.evaluate(w, text, planner, cache, from, to);
    } catch (IOException e) {
      throw new UncheckedIOException("reading the data store failed: " + e.getMessage(), e);
    }
  }

  /** The first and last day on which every variable of a watch has data. */
  public java.time.LocalDate[] watchSpan(String text) {
    return WatchEvaluator.span(onlyWatch(text), new SeriesPlanner(catalog, weights, text, new DerivedVariables(catalog, text)));
  }

  private static Watch onlyWatch(String text) {
    Script script = QueryParser.parse(text);
    if (script.statements().size() != 1 || !(script.statements().get(0) instanceof Watch w)) {
      throw QueryException.at(script.statements().isEmpty() ? script : script.statements().get(0), text, "send exactly one watch definition", "");
    }
    return w;
  }

  /** The plans of a request and the derived variables they may read. */
  private record Analysis(List<Object> plans, List<ResultKind> kinds, DerivedVariables derived) {}

  /**
   * Parses and analyses without computing: names, regions and their weights, dates and units are
   * resolved. Returns one opaque plan per statement, in order.
   */
  public List<Object> analyze(String text) {
    return analysis(text).plans();
  }

  private Analysis analysis(String text) {
    Script script = QueryParser.parse(text);
    DerivedVariables derived = new DerivedVariables(catalog, text);
    SeriesPlanner planner = new SeriesPlanner(catalog, weights, text, derived);
    CatalogStatements cat = new CatalogStatements(catalog, text);
    List<Object> plans = new ArrayList<>();
    for (Statement s : script.statements()) {
      if (s instanceof AreaSeries a) {
        plans.add(AreaSeriesStatement.analyze(a, planner));
      } else if (s instanceof DescribeVariable d) {
        cat.check(d);
        plans.add(d);
      } else if (s instanceof ListVariables || s instanceof ListRegions) {
        plans.add(s);
      } else if (s instanceof Correlation c) {
        plans.add(DriverStatements.analyze(c, planner));
      } else if (s instanceof DriverRanking r) {
        plans.add(DriverStatements.analyze(r, planner));
      } else if (s instanceof EventWindow w) {
        plans.add(DriverStatements.analyze(w, planner));
      } else if (s instanceof Watch w) {
        plans.add(WatchStatements.check(w, planner));
      } else if (s instanceof DerivedVariable d) {
        plans.add(derived.define(d));
      } else if (s instanceof CorrelationMap c) {
        plans.add(CorrelationMapStatement.analyze(c, planner));
      } else if (s instanceof MapStatement m) {
        plans.add(MapStatements.analyze(m, planner));
      } else if (s instanceof CellExport e) {
        plans.add(CellExportStatement.analyze(e, planner));
      } else {
        throw QueryException.at(s, text, "this kind of statement is understood but not run by this server version yet",
            "see 'Statements being built' in the language reference");
      }
    }
    return new Analysis(plans, script.statements().stream().map(ResultKind::of).toList(), derived);
  }

  private ResultTable execute(Object plan, ChunkSource cache, String text) {
    try {
      if (plan instanceof ResultTable t) {
        return t;
      }
      if (plan instanceof AreaSeriesStatement.Plan p) {
        return AreaSeriesStatement.execute(p, cache, text);
      }
      if (plan instanceof DriverStatements.CorrelationPlan p) {
        return DriverStatements.execute(p, cache, text);
      }
      if (plan instanceof DriverStatements.RankingPlan p) {
        return DriverStatements.execute(p, cache, text);
      }
      if (plan instanceof DriverStatements.WindowPlan p) {
        return DriverStatements.execute(p, cache, text);
      }
      if (plan instanceof MapStatements.Plan p) {
        return MapStatements.execute(p, cache, text);
      }
      if (plan instanceof CellExportStatement.Plan p) {
        return TableStream.collect(CellExportStatement.open(p, cache, text)); // run() checked MAX_HELD_ROWS
      }
      if (plan instanceof CorrelationMapStatement.Plan p) {
        try {
          return CorrelationMapStatement.execute(p, cache, text);
        } catch (org.slackwater.core.analytics.correlation.CorrelationInputException e) {
          throw QueryException.at(p.query(), text, e.getMessage(), "");
        }
      }
      CatalogStatements cat = new CatalogStatements(catalog, text);
      if (plan instanceof ListVariables) {
        return cat.listVariables();
      }
      if (plan instanceof DescribeVariable d) {
        return cat.describe(d);
      }
      if (plan instanceof ListRegions) {
        return cat.listRegions();
      }
      throw new IllegalStateException("no executor for " + plan.getClass().getSimpleName());
    } catch (IOException e) {
      throw new UncheckedIOException("reading the data store failed: " + e.getMessage(), e);
    }
  }
}
