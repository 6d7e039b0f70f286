package org.slackwater.query.ast;

/** {@code above} (&gt;), {@code below} (&lt;), {@code at least} (&ge;), {@code at most} (&le;). */
public enum ThresholdOperator {
    ABOVE,
    BELOW,
    AT_LEAST,
    AT_MOST
}
