package org.slackwater.query;

import org.antlr.v4.runtime.DefaultErrorStrategy;
import org.antlr.v4.runtime.InputMismatchException;
import org.antlr.v4.runtime.Parser;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.RecognitionException;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.atn.ATNState;
import org.antlr.v4.runtime.misc.IntervalSet;

/**
 * Stops at the first syntax error with a {@link QueryException} instead of recovering: a query
 * is short and exact, and one precise message beats a cascade of guesses.
 *
 * <p>When the parser skips optional parts (say the {@code in}, {@code as} and {@code with}
 * clauses) and then fails on the same token, the error is reported with the expected tokens
 * of the first skipped part, so the message lists every word that could have come there and
 * not only what the enclosing rule wanted next.
 */
final class FailFastErrorStrategy extends DefaultErrorStrategy {

    private final SyntaxErrors errors;

    /** Where the first optional part was skipped at the current token, if any. */
    private ParserRuleContext skippedContext;
    private int skippedState;
    private int skippedAtIndex = -1;

    FailFastErrorStrategy(SyntaxErrors errors) {
        this.errors = errors;
    }

    @Override
    public void sync(Parser recognizer) {
        ATNState state = recognizer.getInterpreter().atn.states.get(recognizer.getState());
        int index = recognizer.getInputStream().index();
        int next = recognizer.getInputStream().LA(1);
        IntervalSet following = recognizer.getATN().nextTokens(state);
        if (following.contains(next)) {
            return;
        }
        if (following.contains(Token.EPSILON)) {
            if (skippedAtIndex != index) {
                skippedContext = recognizer.getContext();
                skippedState = recognizer.getState();
                skippedAtIndex = index;
            }
            return;
        }
        // Nothing inside the rule can start with this token and the rule cannot end here.
        throw errors.translate(recognizer, mismatch(recognizer));
    }

    @Override
    public Token recoverInline(Parser recognizer) {
        throw errors.translate(recognizer, mismatch(recognizer));
    }

    @Override
    public void reportError(Parser recognizer, RecognitionException e) {
        throw errors.translate(recognizer, e);
    }

    @Override
    public void recover(Parser recognizer, RecognitionException e) {
        throw errors.translate(recognizer, e);
    }

    private InputMismatchException mismatch(Parser recognizer) {
        if (skippedAtIndex == recognizer.getInputStream().index()) {
            return new InputMismatchException(recognizer, skippedState, skippedContext);
        }
        return new InputMismatchException(recognizer);
    }
}
