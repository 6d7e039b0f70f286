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
 */
final class LimitedTokenSource implements TokenSource {

    private final TokenSource lexer;
    private final String text;
    private int depth;
    private int clips;

    LimitedTokenSource(TokenSource lexer, String text) {
        this.lexer = lexer;
        this.text = text;
    }

    @Override
    public Token nextToken() {
        Token token = lexer.nextToken();
        switch (token.getType()) {
            case SlackwaterLexer.LPAREN:
                if (++depth > QueryParser.MAX_NESTING) {
                    throw error(token, "regions nested too deeply: more than " + QueryParser.MAX_NESTING
                            + " levels of parentheses", "clipped to needs no parentheses: a clipped to b clipped to c");
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
                break;
            default:
                break;
        }
        return token;
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
