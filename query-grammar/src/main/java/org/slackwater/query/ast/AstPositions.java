package org.slackwater.query.ast;

import java.util.List;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * Copies of trees with every position set to {@link Position#NONE}, so that two trees can be
 * compared for meaning alone (for example a parsed tree and the tree of its printed text).
 */
public final class AstPositions {

    private AstPositions() {}

    /** The same tree with all positions erased; the result has the type of the argument. */
    @SuppressWarnings("unchecked")
    public static <T extends Node> T erase(T node) {
        return (T) eraseNode(node);
    }

    private static Node eraseNode(Node node) {
        Position none = Position.NONE;
        if (node instanceof Script) {
            List<Statement> statements = ((Script) node).statements().stream()
                    .map(AstPositions::erase)
                    .collect(Collectors.toList());
            return new Script(statements, none);
        }
        if (node instanceof AreaSeries) {
            AreaSeries s = (AreaSeries) node;
            return new AreaSeries(erase(s.statistic()), erase(s.variable()), erase(s.region()),
                    erase(s.period()), erase(s.step()), s.unit().map(AstPositions::erase),
                    s.comparison().map(AstPositions::erase), s.gaps().map(AstPositions::erase), s.coverage().map(AstPositions::erase), none);
        }
        if (node instanceof ListVariables) {
            return new ListVariables(none);
        }
        if (node instanceof ListRegions) {
            return new ListRegions(none);
        }
        if (node instanceof CellExport) {
            CellExport c = (CellExport) node;
            return new CellExport(erase(c.variable()), erase(c.region()), erase(c.period()), c.unit().map(AstPositions::erase), none);
        }
        if (node instanceof DescribeVariable) {
            return new DescribeVariable(erase(((DescribeVariable) node).variable()), none);
        }
        if (node instanceof Statistic) {
            Statistic s = (Statistic) node;
            return new Statistic(s.kind(), s.percentile(), none);
        }
        if (node instanceof Identifier) {
            return new Identifier(((Identifier) node).name(), none);
        }
        if (node instanceof NamedRegion) {
            return new NamedRegion(((NamedRegion) node).name(), none);
        }
        if (node instanceof CircleRegion) {
            CircleRegion c = (CircleRegion) node;
            return new CircleRegion(erase(c.center()), erase(c.radius()), none);
        }
        if (node instanceof BoxRegion) {
            BoxRegion b = (BoxRegion) node;
            return new BoxRegion(b.south(), b.west(), b.north(), b.east(), none);
        }
        if (node instanceof WktRegion) {
            return new WktRegion(((WktRegion) node).wkt(), none);
        }
        if (node instanceof ClippedRegion) {
            ClippedRegion c = (ClippedRegion) node;
            return new ClippedRegion(erase(c.region()), erase(c.clip()), none);
        }
        if (node instanceof Coordinate) {
            Coordinate c = (Coordinate) node;
            return new Coordinate(c.latitude(), c.longitude(), none);
        }
        if (node instanceof Quantity) {
            Quantity q = (Quantity) node;
            return new Quantity(q.value(), q.unit(), none);
        }
        if (node instanceof Period) {
            Period p = (Period) node;
            return new Period(erase(p.from()), erase(p.to()), none);
        }
        if (node instanceof PartialDate) {
            PartialDate d = (PartialDate) node;
            return new PartialDate(d.year(), d.month(), d.day(), none);
        }
        if (node instanceof Step) {
            return new Step(((Step) node).kind(), none);
        }
        if (node instanceof UnitRef) {
            return new UnitRef(((UnitRef) node).unit(), none);
        }
        if (node instanceof Comparison) {
            Comparison c = (Comparison) node;
            return new Comparison(c.kind(), c.baseline().map(AstPositions::erase), none);
        }
        if (node instanceof GapAllowance g) {
            return new GapAllowance(g.missingDays(), g.consecutiveDays(), none);
        }
        if (node instanceof Coverage) {
            return new Coverage(((Coverage) node).percent(), none);
        }
        Node statement = eraseNewStatement(node);
        if (statement != null) {
            return statement;
        }
        Node part = eraseNewPart(node);
        if (part != null) {
            return part;
        }
        throw new IllegalArgumentException("unknown node type " + node.getClass().getName());
    }

    /** The statements beyond the area series, or null for any other node. */
    private static Node eraseNewStatement(Node node) {
        Position none = Position.NONE;
        if (node instanceof Correlation c) {
            return new Correlation(erase(c.series()), erase(c.driver()), erase(c.region()), erase(c.period()),
                    erase(c.step()), eraseAll(c.lags()), c.method(), eraseAll(c.deseasonalized()),
                    eraseAll(c.gaps()), eraseAll(c.coverage()), none);
        }
        if (node instanceof DriverRanking r) {
            return new DriverRanking(erase(r.series()), eraseAll(r.drivers()), erase(r.region()), erase(r.period()),
                    erase(r.step()), eraseAll(r.lags()), r.method(), eraseAll(r.baseline()), eraseAll(r.gaps()), eraseAll(r.coverage()),
                    none);
        }
        if (node instanceof EventWindow w) {
            return new EventWindow(erase(w.length()), eraseAll(w.events()), eraseAll(w.drivers()), erase(w.region()),
                    eraseAll(w.baseline()), eraseAll(w.coverage()), none);
        }
        if (node instanceof StatisticMap m) {
            return new StatisticMap(erase(m.values()), erase(m.region()), erase(m.period()), eraseAll(m.unit()), none);
        }
        if (node instanceof DifferenceMap m) {
            return new DifferenceMap(erase(m.values()), erase(m.region()), erase(m.period()), erase(m.reference()),
                    eraseAll(m.unit()), none);
        }
        if (node instanceof ComparisonMap m) {
            return new ComparisonMap(erase(m.values()), erase(m.region()), erase(m.period()), eraseAll(m.unit()),
                    erase(m.comparison()), none);
        }
        if (node instanceof CorrelationMap m) {
            return new CorrelationMap(erase(m.values()), erase(m.region()), erase(m.driver()),
                    erase(m.driverRegion()), erase(m.period()), erase(m.step()), eraseAll(m.lags()), m.method(),
                    eraseAll(m.deseasonalized()), none);
        }
        if (node instanceof Watch w) {
            return new Watch(w.name(), erase(w.region()), eraseAll(w.rules()), none);
        }
        if (node instanceof DerivedVariable d) {
            return new DerivedVariable(erase(d.name()), erase(d.expression()), eraseAll(d.unit()), none);
        }
        return null;
    }

    /** The parts of those statements (conditions, expressions, lags, ...), or null. */
    private static Node eraseNewPart(Node node) {
        Position none = Position.NONE;
        if (node instanceof SeriesTerm t) {
            return new SeriesTerm(erase(t.statistic()), erase(t.variable()), eraseAll(t.region()), none);
        }
        if (node instanceof Duration d) {
            return new Duration(d.amount(), d.unit(), none);
        }
        if (node instanceof LagRange l) {
            return new LagRange(l.first(), l.last(), l.step(), l.unit(), none);
        }
        if (node instanceof Deseasonalized d) {
            return new Deseasonalized(eraseAll(d.baseline()), none);
        }
        if (node instanceof WatchRule r) {
            return new WatchRule(erase(r.condition()), r.severity(), none);
        }
        if (node instanceof AnyOf a) {
            return new AnyOf(eraseAll(a.operands()), none);
        }
        if (node instanceof AllOf a) {
            return new AllOf(eraseAll(a.operands()), none);
        }
        if (node instanceof Not n) {
            return new Not(erase(n.operand()), none);
        }
        if (node instanceof ThresholdCondition t) {
            return new ThresholdCondition(erase(t.series()), erase(t.threshold()), eraseAll(t.persistence()), none);
        }
        if (node instanceof ComparisonCondition c) {
            return new ComparisonCondition(c.kind(), erase(c.series()), erase(c.threshold()), eraseAll(c.baseline()),
                    eraseAll(c.persistence()), none);
        }
        if (node instanceof WatchSeries s) {
            return new WatchSeries(erase(s.statistic()), erase(s.variable()), eraseAll(s.region()),
                    eraseAll(s.window()), none);
        }
        if (node instanceof Threshold t) {
            return new Threshold(t.operator(), t.value(), eraseAll(t.unit()), none);
        }
        if (node instanceof BinaryOp b) {
            return new BinaryOp(erase(b.left()), b.operator(), erase(b.right()), none);
        }
        if (node instanceof Negate n) {
            return new Negate(erase(n.operand()), none);
        }
        if (node instanceof VariableRef v) {
            return new VariableRef(erase(v.variable()), none);
        }
        if (node instanceof NumberLiteral n) {
            return new NumberLiteral(n.value(), eraseAll(n.unit()), none);
        }
        return null;
    }

    private static <T extends Node> Optional<T> eraseAll(Optional<T> node) {
        return node.map(AstPositions::erase);
    }

    private static <T extends Node> List<T> eraseAll(List<T> nodes) {
        return nodes.stream().map(AstPositions::erase).collect(Collectors.toList());
    }
}
