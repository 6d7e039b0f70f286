package org.slackwater.core.analytics.correlation;

/**
 * Sorts indices by the values they point at without boxing (the JDK sorts only primitives by
 * themselves or objects by comparator). Bottom-up merge sort: stable, O(n log n), no recursion.
 */
final class IndexSort {
  private IndexSort() {}

  /** Sorts {@code idx[0, n)} so that {@code values[idx[i]]} ascends; {@code scratch} holds at least n. */
  static void byValue(int[] idx, int n, double[] values, int[] scratch) {
    int[] src = idx;
    int[] dst = scratch;
    for (int width = 1; width < n; width *= 2) {
      for (int lo = 0; lo < n; lo += 2 * width) {
        int mid = Math.min(lo + width, n);
        int hi = Math.min(lo + 2 * width, n);
        int a = lo;
        int b = mid;
        int k = lo;
        while (a < mid && b < hi) {
          dst[k++] = values[src[b]] < values[src[a]] ? src[b++] : src[a++];
        }
        while (a < mid) {
          dst[k++] = src[a++];
        }
        while (b < hi) {
          dst[k++] = src[b++];
        }
      }
      int[] swap = src;
      src = dst;
      dst = swap;
    }
    if (src != idx) {
      System.arraycopy(src, 0, idx, 0, n);
    }
  }
}
