package org.slackwater.core.analytics.correlation;

/** How the strength of association is measured. */
public enum CorrelationMethod {
  /** Pearson's product-moment correlation of the values. */
  PEARSON,
  /**
   * Spearman's rank correlation: Pearson's r of the ranks, tied values sharing their average rank,
   * ranks taken afresh over the complete pairs at each lag. Its p-value uses the same t
   * approximation as Pearson's (common practice; close to exact from about n = 10 on).
   */
  SPEARMAN
}
