package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.slackwater.query.ast.CellExport;
import org.slackwater.query.ast.NamedRegion;

/** {@code cells of <variable> over <region> <period> [in <unit>]}: its tree, its printing, its errors. */
class CellExportParseTest {

  @Test
  void cellsStatementParsesToItsParts() {
    CellExport c = (CellExport) QueryParser.parse("cells of chlorophyll over \"Outer Bay\" from 2014-06 to 2014-08 in mg/m3")
        .statements().get(0);
    assertEquals("chlorophyll", c.variable().name());
    assertEquals("Outer Bay", ((NamedRegion) c.region()).name());
    assertEquals(LocalDate.of(2014, 6, 1), c.period().start());
    assertEquals(LocalDate.of(2014, 8, 31), c.period().endInclusive());
    assertEquals("mg/m3", c.unit().orElseThrow().unit());
    assertEquals(1, c.position().line());
    assertEquals(1, c.position().column());
  }

  @Test
  void printedStatementParsesBackToTheSameTree() {
    String text = "cells of turbidity over box(44.0, -31.2, 44.2, -31.0) during 2018 in FNU";
    CellExport c = (CellExport) QueryParser.parse(text).statements().get(0);
    String printed = QueryPrinter.print(c);
    assertEquals(org.slackwater.query.ast.AstPositions.erase(c),
        org.slackwater.query.ast.AstPositions.erase(QueryParser.parse(printed).statements().get(0)), printed);
  }

  @Test
  void missingPeriodIsReportedWhereItShouldStart() {
    QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse("cells of chlorophyll over \"Outer Bay\" by day"));
    assertEquals(1, e.line());
    assertEquals(39, e.column()); // 'by', where the period should start
    assertTrue(e.hint().contains("period"), e.hint());
  }

  @Test
  void aStatisticIsNotTakenBecauseCellsAreTheValuesThemselves() {
    QueryException e = assertThrows(QueryException.class, () -> QueryParser.parse("cells of mean chlorophyll over \"Outer Bay\" during 2014"));
    assertEquals(10, e.column()); // 'mean': a variable name is expected
  }
}
