package org.slackwater.query;

import org.antlr.v4.runtime.CharStream;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.TokenFactory;
import org.antlr.v4.runtime.TokenSource;
import org.slackwater.query.parser.SlackwaterLexer;

/**
 * Passes the lexer's tokens on while enforcing the nesting limits token by token, so that a
 * hostile input (a megabyte of '(') is refused as soon as it passes the limit, before the rest
 * is even lexed and long before the recursive parser could run out of stack.
 *
 * <p>Parentheses are counted over the whole text; {@code clipped to} and the arithmetic
 * operators of a {@code let} per statement. Operators are limited because the tree of
 * {@code a + b + c ...} is as deep as the chain is long. The message names what the
 * parentheses nest in the statement at hand: regions, the expression of a {@code let}, or the
 * conditions of a {@code watch}.
 */
final class LimitedTokenSource implements TokenSource {

    private final TokenSource lexer;
    private final String text;
    private int depth;
    private int clips;
    private int operators;
    /** The first token type of the current statement, 0 before it is seen. */
    private int statementType;

    LimitedTokenSource(TokenSource lexer, String text) {
        this.lexer = lexer;
        this.text = text;
    }

    @Override
    public Token nextToken() {
        Token token = lexer.nextToken();
        if (statementType == 0 && token.getChannel() == Token.DEFAULT_CHANNEL) {
            statementType = token.getType();
        }
        switch (token.getType()) {
            case SlackwaterLexer.LPAREN:
                if (++depth > QueryParser.MAX_NESTING) {
                    throw tooDeep(token);
                }
                break;
            case SlackwaterLexer.PLUS:
            case SlackwaterLexer.MINUS:
            case SlackwaterLexer.STAR:
            case SlackwaterLexer.SLASH:
                if (statementType == SlackwaterLexer.LET && ++operators > QueryParser.MAX_OPERATORS) {
                    throw error(token, "expression too long: more than " + QueryParser.MAX_OPERATORS
                            + " operators in one let", "split it into several let statements");
                }
                break;
            case SlackwaterLexer.RPAREN:
                depth = Math.max(0, depth - 1);
                break;
            case SlackwaterLexer.CLIPPED:
                if (++clips > QueryParser.MAX_CLIPS) {
                    throw error(token, "too many 'clipped to' in one statement: the limit is " + QueryParser.MAX_CLIPS,
                            "define the intersection as a named region");
                }
                break;
            case SlackwaterLexer.SEMI:
                clips = 0;
                operators = 0;
                statementType = 0;
                break;
            default:
                break;
        }
        return token;
    }

    private QueryException tooDeep(Token token) {
        String levels = " nested too deeply: more than " + QueryParser.MAX_NESTING + " levels of parentheses";
        switch (statementType) {
            case SlackwaterLexer.LET:
                return error(token, "expressions" + levels, "name a part of the expression with a let of its own");
            case SlackwaterLexer.WATCH:
                return error(token, "conditions" + levels, "'and' binds more tightly than 'or', so fewer parentheses may do");
            default:
                return error(token, "regions" + levels, "clipped to needs no parentheses: a clipped to b clipped to c");
        }
    }

    private QueryException error(Token token, String message, String hint) {
        return new QueryException(message, token.getLine(), token.getCharPositionInLine() + 1, text, hint);
    }

    @Override
    public int getLine() {
        return lexer.getLine();
    }

    @Override
    public int getCharPositionInLine() {
        return lexer.getCharPositionInLine();
    }

    @Override
    public CharStream getInputStream() {
        return lexer.getInputStream();
    }

    @Override
    public String getSourceName() {
        return lexer.getSourceName();
    }

    @Override
    public void setTokenFactory(TokenFactory<?> factory) {
        lexer.setTokenFactory(factory);
    }

    @Override
    public TokenFactory<?> getTokenFactory() {
        return lexer.getTokenFactory();
    }
}
