/**
 * Lagged correlation between two dated series, with significance corrected for autocorrelation.
 *
 * <p>Data flow: {@link org.slackwater.core.analytics.correlation.DatedSeries} (optionally through
 * {@link org.slackwater.core.analytics.correlation.Deseasonalize}) &rarr; {@link
 * org.slackwater.core.analytics.correlation.Alignment} (one calendar step axis, lags in steps,
 * positive lag = driver leads) &rarr; {@link org.slackwater.core.analytics.correlation.LagCorrelator}
 * (one {@link org.slackwater.core.analytics.correlation.LagRow} per lag) &rarr; {@link
 * org.slackwater.core.analytics.correlation.CorrelationResult}. {@link
 * org.slackwater.core.analytics.correlation.LaggedCorrelation} is the one-call entry point.
 *
 * <p>Pure computation: no I/O, no query language. Input mistakes are {@link
 * org.slackwater.core.analytics.correlation.CorrelationInputException}s whose {@code kind} tells
 * the query analyzer which part of the statement to point at.
 */
package org.slackwater.core.analytics.correlation;
