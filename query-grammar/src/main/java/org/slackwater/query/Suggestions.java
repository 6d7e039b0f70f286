package org.slackwater.query;

import java.util.Collection;
import java.util.Locale;
import java.util.Optional;

/**
 * "Did you mean" candidates by edit distance: the optimal-string-alignment form of the
 * Damerau-Levenshtein distance (insertions, deletions, substitutions and transpositions of
 * two adjacent characters, each costing 1; no substring is edited twice), compared without
 * regard to case.
 *
 * <p>A candidate is close enough when its distance is at most {@code max(2, length / 3)} and
 * less than the length of the word, so that a two-letter word is not "corrected" into an
 * unrelated one; a match that differs only in case always counts. Of equally close candidates
 * the first in iteration order wins.
 */
public final class Suggestions {

    private Suggestions() {}

    /** The closest candidate to {@code word}, if any is close enough. */
    public static Optional<String> nearest(String word, Collection<String> candidates) {
        String lowerWord = word.toLowerCase(Locale.ROOT);
        int wordLength = codePoints(lowerWord);
        int limit = Math.max(0, Math.min(Math.max(2, wordLength / 3), wordLength - 1));
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        for (String candidate : candidates) {
            String lowerCandidate = candidate.toLowerCase(Locale.ROOT);
            if (Math.abs(codePoints(lowerCandidate) - wordLength) > limit) {
                continue; // the distance is at least the difference in length: too far anyway
            }
            int d = distance(lowerWord, lowerCandidate);
            if (d < bestDistance) {
                best = candidate;
                bestDistance = d;
            }
        }
        return bestDistance <= limit ? Optional.of(best) : Optional.empty();
    }

    private static int codePoints(String text) {
        return text.codePointCount(0, text.length());
    }

    /** The optimal-string-alignment distance between {@code a} and {@code b}, by code point. */
    public static int distance(String a, String b) {
        int[] s = a.codePoints().toArray();
        int[] t = b.codePoints().toArray();
        int[][] d = new int[s.length + 1][t.length + 1];
        for (int i = 0; i <= s.length; i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= t.length; j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= s.length; i++) {
            for (int j = 1; j <= t.length; j++) {
                int cost = s[i - 1] == t[j - 1] ? 0 : 1;
                int best = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && s[i - 1] == t[j - 2] && s[i - 2] == t[j - 1]) {
                    best = Math.min(best, d[i - 2][j - 2] + 1);
                }
                d[i][j] = best;
            }
        }
        return d[s.length][t.length];
    }
}
