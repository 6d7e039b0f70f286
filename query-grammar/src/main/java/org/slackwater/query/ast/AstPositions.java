package org.slackwater.query.ast;

import java.util.List;
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
                    s.comparison().map(AstPositions::erase), s.coverage().map(AstPositions::erase), none);
        }
        if (node instanceof ListVariables) {
            return new ListVariables(none);
        }
        if (node instanceof ListRegions) {
            return new ListRegions(none);
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
        if (node instanceof Coverage) {
            return new Coverage(((Coverage) node).percent(), none);
        }
        throw new IllegalArgumentException("unknown node type " + node.getClass().getName());
    }
}
