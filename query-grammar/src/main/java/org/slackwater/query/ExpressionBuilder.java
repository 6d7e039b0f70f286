package org.slackwater.query;

import java.util.List;
import java.util.Optional;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.tree.ParseTree;
import org.antlr.v4.runtime.tree.TerminalNode;
import org.slackwater.query.ast.ArithmeticOperator;
import org.slackwater.query.ast.BinaryOp;
import org.slackwater.query.ast.Expression;
import org.slackwater.query.ast.Identifier;
import org.slackwater.query.ast.Negate;
import org.slackwater.query.ast.NumberLiteral;
import org.slackwater.query.ast.UnitRef;
import org.slackwater.query.ast.VariableRef;
import org.slackwater.query.parser.SlackwaterBaseVisitor;
import org.slackwater.query.parser.SlackwaterParser;

/**
 * Builds the expression of one {@code let}, one method per labelled alternative. Chains such
 * as {@code a - b + c} are folded from the left in a loop. A reference to the name being
 * defined is refused at that reference, since a variable cannot be computed from itself.
 */
final class ExpressionBuilder extends SlackwaterBaseVisitor<Expression> {

    private final String source;
    private final Identifier defined;

    /** @param defined the name the expression defines */
    ExpressionBuilder(String source, Identifier defined) {
        this.source = source;
        this.defined = defined;
    }

    @Override
    public Expression visitExpression(SlackwaterParser.ExpressionContext ctx) {
        return fold(ctx, ctx.children);
    }

    @Override
    public Expression visitTerm(SlackwaterParser.TermContext ctx) {
        return fold(ctx, ctx.children);
    }

    /** Children are operand (operator operand)*; the result groups from the left. */
    private Expression fold(ParserRuleContext ctx, List<ParseTree> children) {
        Expression result = visit(children.get(0));
        for (int i = 1; i + 1 < children.size(); i += 2) {
            Token operator = ((TerminalNode) children.get(i)).getSymbol();
            result = new BinaryOp(result, operator(operator), visit(children.get(i + 1)), Literals.position(ctx.getStart()));
        }
        return result;
    }

    private static ArithmeticOperator operator(Token token) {
        switch (token.getType()) {
            case SlackwaterParser.PLUS:
                return ArithmeticOperator.ADD;
            case SlackwaterParser.MINUS:
                return ArithmeticOperator.SUBTRACT;
            case SlackwaterParser.STAR:
                return ArithmeticOperator.MULTIPLY;
            default:
                return ArithmeticOperator.DIVIDE;
        }
    }

    @Override
    public Expression visitFactor(SlackwaterParser.FactorContext ctx) {
        Expression operand = visit(ctx.primary());
        return ctx.MINUS() == null ? operand : new Negate(operand, Literals.position(ctx.MINUS().getSymbol()));
    }

    @Override
    public Expression visitNumberPrimary(SlackwaterParser.NumberPrimaryContext ctx) {
        Token number = ctx.NUMBER().getSymbol();
        double value = Literals.number(number);
        if (!Double.isFinite(value)) {
            throw Literals.error(number, source, "the number " + SyntaxErrors.quote(number.getText()) + " is too large",
                    "");
        }
        Optional<UnitRef> unit = Optional.ofNullable(ctx.numberUnit())
                .map(u -> Units.read(u.getStart(), Literals.position(u.getStart()), source));
        return new NumberLiteral(value, unit, Literals.position(number));
    }

    @Override
    public Expression visitVariablePrimary(SlackwaterParser.VariablePrimaryContext ctx) {
        Token token = ctx.getStart();
        Identifier variable = new Identifier(token.getText(), Literals.position(token));
        if (variable.name().equals(defined.name())) {
            throw Literals.error(token, source, "'" + variable.name() + "' is used in its own definition",
                    "a let can use only variables of the catalog and those defined before it");
        }
        return new VariableRef(variable, variable.position());
    }

    @Override
    public Expression visitParenthesizedPrimary(SlackwaterParser.ParenthesizedPrimaryContext ctx) {
        return visit(ctx.expression());
    }
}
