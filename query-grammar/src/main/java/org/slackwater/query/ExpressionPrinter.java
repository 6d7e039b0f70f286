package org.slackwater.query;

import org.slackwater.query.ast.BinaryOp;
import org.slackwater.query.ast.DerivedVariable;
import org.slackwater.query.ast.Expression;
import org.slackwater.query.ast.Negate;
import org.slackwater.query.ast.NumberLiteral;
import org.slackwater.query.ast.VariableRef;

/**
 * Writes {@code let} statements. An operand is parenthesized only when precedence would group
 * it otherwise: a left operand that binds less tightly than its operator, a right operand that
 * binds no more tightly (all four operators group from the left), and a compound or negated
 * operand of unary minus (the grammar takes one minus before a primary).
 */
final class ExpressionPrinter {

    private static final int ADDITIVE = 1;
    private static final int MULTIPLICATIVE = 2;
    private static final int UNARY = 3;
    private static final int PRIMARY = 4;

    private ExpressionPrinter() {}

    static String let(DerivedVariable let) {
        return "let " + let.name().name() + " = " + expression(let.expression())
                + let.unit().map(QueryPrinter::unitClause).orElse("");
    }

    static String expression(Expression expression) {
        if (expression instanceof BinaryOp b) {
            int precedence = precedence(b);
            String left = operand(b.left(), precedence(b.left()) < precedence);
            String right = operand(b.right(), precedence(b.right()) <= precedence);
            return left + " " + b.operator().symbol() + " " + right;
        }
        if (expression instanceof Negate n) {
            return "-" + operand(n.operand(), precedence(n.operand()) <= UNARY);
        }
        if (expression instanceof NumberLiteral n) {
            return Literals.formatNumber(n.value()) + n.unit().map(u -> " " + QueryPrinter.numberUnit(u)).orElse("");
        }
        return ((VariableRef) expression).variable().name();
    }

    private static String operand(Expression operand, boolean parenthesize) {
        String text = expression(operand);
        return parenthesize ? "(" + text + ")" : text;
    }

    private static int precedence(Expression expression) {
        if (expression instanceof BinaryOp b) {
            return b.operator().isMultiplicative() ? MULTIPLICATIVE : ADDITIVE;
        }
        return expression instanceof Negate ? UNARY : PRIMARY;
    }
}
