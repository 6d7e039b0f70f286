package org.slackwater.query.ast;

/** One statement of a script; statements are separated by ';'. */
public sealed interface Statement extends Node
        permits AreaSeries, ListVariables, DescribeVariable, ListRegions, Correlation, DriverRanking,
                EventWindow, MapStatement, Watch, DerivedVariable, CellExport {}
