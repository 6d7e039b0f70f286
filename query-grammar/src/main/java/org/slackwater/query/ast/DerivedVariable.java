package org.slackwater.query.ast;

import java.util.Objects;
import java.util.Optional;

/**
 * {@code let <name> = <expression> [in <unit>]}: a variable computed cell by cell and step by
 * step from other variables, usable by name in the statements after it in the same query. The
 * parser refuses a name defined twice in one query and a definition that uses its own name;
 * whether the variables exist and the units agree is the analyzer's to check. With
 * {@code in}, the result is converted to that unit.
 */
public record DerivedVariable(Identifier name, Expression expression, Optional<UnitRef> unit, Position position)
        implements Statement {

    public DerivedVariable {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(expression, "expression");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(position, "position");
    }
}
