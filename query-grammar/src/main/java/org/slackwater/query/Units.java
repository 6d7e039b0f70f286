package org.slackwater.query;

import org.antlr.v4.runtime.Token;
import org.slackwater.query.ast.Position;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.parser.SlackwaterParser;

/**
 * Reads a written unit: a unit word ({@code mg/m3}), a plain word ({@code degC}) or a quoted
 * unit ({@code "mg m-3"}), case kept. Only emptiness is checked here; whether it is a unit is
 * the analyzer's question.
 */
final class Units {

    private Units() {}

    static UnitRef read(Token token, Position position, String source) {
        String unit = token.getType() == SlackwaterParser.STRING ? Literals.unquote(token, source) : token.getText();
        if (unit.isBlank()) {
            throw Literals.error(token, source, "the unit is empty", "write a unit such as degC, mm/day or \"mg m-3\"");
        }
        return new UnitRef(unit, position);
    }
}
