package org.slackwater.core.query;

import org.slackwater.query.ast.AreaSeries;
import org.slackwater.query.ast.Correlation;
import org.slackwater.query.ast.CorrelationMap;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.DriverRanking;
import org.slackwater.query.ast.EventWindow;
import org.slackwater.query.ast.MapStatement;
import org.slackwater.query.ast.Statement;
import org.slackwater.query.ast.Watch;

/**
 * What shape of answer a statement gives, written into every result's metadata under
 * {@link #KEY} so that renderers and clients can choose a plot without guessing from column names.
 */
public enum ResultKind {
  SERIES("series"),
  CORRELATION("correlation"),
  RANKING("ranking"),
  EVENT_WINDOW("event_window"),
  MAP("map"),
  CORRELATION_MAP("correlation_map"),
  WATCH("watch"),
  /** The cube's values cell by cell and step by step (an export, streamed). */
  CELLS("cells"),
  DEFINITION("definition"),
  CATALOG("catalog");

  /** The metadata key. */
  public static final String KEY = "result_kind";

  private final String label;

  ResultKind(String label) {
    this.label = label;
  }

  public String label() {
    return label;
  }

  static ResultKind of(Statement s) {
    if (s instanceof AreaSeries) {
      return SERIES;
    }
    if (s instanceof Correlation) {
      return CORRELATION;
    }
    if (s instanceof DriverRanking) {
      return RANKING;
    }
    if (s instanceof EventWindow) {
      return EVENT_WINDOW;
    }
    if (s instanceof CorrelationMap) {
      return CORRELATION_MAP;
    }
    if (s instanceof MapStatement) {
      return MAP;
    }
    if (s instanceof org.slackwater.query.ast.CellExport) {
      return CELLS;
    }
    if (s instanceof Watch) {
      return WATCH;
    }
    if (s instanceof DerivedVariable) {
      return DEFINITION;
    }
    return CATALOG;
  }
}
