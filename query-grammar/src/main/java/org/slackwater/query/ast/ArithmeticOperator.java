package org.slackwater.query.ast;

/** The four operators of an {@link Expression}, each with the symbol the language writes. */
public enum ArithmeticOperator {
    ADD("+"),
    SUBTRACT("-"),
    MULTIPLY("*"),
    DIVIDE("/");

    private final String symbol;

    ArithmeticOperator(String symbol) {
        this.symbol = symbol;
    }

    public String symbol() {
        return symbol;
    }

    /** Whether this operator binds more tightly than + and -. */
    public boolean isMultiplicative() {
        return this == MULTIPLY || this == DIVIDE;
    }
}
