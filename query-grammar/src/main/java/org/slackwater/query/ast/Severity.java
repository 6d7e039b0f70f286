package org.slackwater.query.ast;

/** How serious a watch rule is, in increasing order; {@code warning} when none is written. */
public enum Severity {
    NOTICE,
    WARNING,
    ALERT
}
