package org.slackwater.query.ast;

import java.util.List;

/** The invariants the statements share about their series terms. */
final class SeriesTerms {

    private SeriesTerms() {}

    /**
     * A map takes each region from its {@code over} clause, so its series has none of its own.
     *
     * @throws IllegalArgumentException if the term has a region
     */
    static void requireNoRegion(SeriesTerm term, String what) {
        if (term.region().isPresent()) {
            throw new IllegalArgumentException("the " + what + " of a map has no region of its own (within): "
                    + term.variable().name());
        }
    }

    /**
     * No two terms are the same series in the statement's region (see {@link SeriesTerm#sameSeries}).
     *
     * @throws IllegalArgumentException at the first repeated series
     */
    static void requireDistinct(List<SeriesTerm> terms, RegionRef statementRegion, String what) {
        for (int i = 1; i < terms.size(); i++) {
            for (int j = 0; j < i; j++) {
                if (terms.get(i).sameSeries(terms.get(j), statementRegion)) {
                    throw new IllegalArgumentException("the " + what + " " + terms.get(i).variable().name()
                            + " is listed twice (same statistic and region)");
                }
            }
        }
    }
}
