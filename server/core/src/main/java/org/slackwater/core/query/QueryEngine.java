package org.slackwater.core.query;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.slackwater.core.analytics.ChunkCache;
import org.slackwater.core.catalog.Catalog;
import org.slackwater.core.result.ResultTable;
import org.slackwater.query.QueryParser;
import org.slackwater.query.ast.AreaSeries;
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

  public List<ResultTable> run(String text) {
    Script script = QueryParser.parse(text);
    List<ResultTable> out = new ArrayList<>();
    for (Statement s : script.statements()) {
      out.add(execute(s, text));
    }
    return out;
  }

  private ResultTable execute(Statement s, String text) {
    try {
      if (s instanceof AreaSeries a) {
        return new AreaSeriesStatement(catalog, cache, weights, text).run(a);
      }
      CatalogStatements cat = new CatalogStatements(catalog, text);
      if (s instanceof ListVariables) {
        return cat.listVariables();
      }
      if (s instanceof DescribeVariable d) {
        return cat.describe(d);
      }
      if (s instanceof ListRegions) {
        return cat.listRegions();
      }
      throw new IllegalStateException("no executor for " + s.getClass().getSimpleName());
    } catch (IOException e) {
      throw new UncheckedIOException("reading the data store failed: " + e.getMessage(), e);
    }
  }
}
