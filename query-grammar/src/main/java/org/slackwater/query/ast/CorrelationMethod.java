package org.slackwater.query.ast;

/** {@code using pearson} (the default: linear correlation) or {@code using spearman} (of ranks). */
public enum CorrelationMethod {
    PEARSON,
    SPEARMAN
}
