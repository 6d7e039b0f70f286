package org.slackwater.query;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SuggestionsTest {

    /**
     * Worked examples of edit distances. kitten/sitting = 3 and Saturday/Sunday = 3 are the
     * classic Levenshtein examples (Wikipedia, "Levenshtein distance"); CA/ABC = 3 is the
     * optimal-string-alignment value that differs from the unrestricted Damerau-Levenshtein
     * value 2 (Wikipedia, "Damerau-Levenshtein distance", section on OSA). All from memory.
     */
    @ParameterizedTest
    @CsvSource({
        "kitten, sitting, 3",
        "Saturday, Sunday, 3",
        "CA, ABC, 3",
        "flaw, lawn, 2",
        "mena, mean, 1",
        "abc, abc, 0",
        "'', abc, 3",
        "ab, ba, 1"
    })
    void distanceMatchesPublishedExamples(String a, String b, int expected) {
        assertEquals(expected, Suggestions.distance(a, b));
        assertEquals(expected, Suggestions.distance(b, a), "symmetric");
    }

    @Test
    void distanceCountsCodePointsNotCharUnits() {
        // One astral character (two UTF-16 units) replaced by another is one substitution.
        assertEquals(1, Suggestions.distance("bay\uD83C\uDF0A", "bay\uD83C\uDF0B"));
    }

    @Test
    void nearestPicksTheClosestCandidateWithinTheLimit() {
        List<String> keywords = List.of("mean", "sum", "min", "max", "median", "list", "describe");
        assertEquals(Optional.of("mean"), Suggestions.nearest("mena", keywords));
        assertEquals(Optional.of("median"), Suggestions.nearest("meidan", keywords));
        assertEquals(Optional.of("describe"), Suggestions.nearest("descrbie", keywords));
        assertEquals(Optional.empty(), Suggestions.nearest("select", keywords));
        // A two-letter word is never "corrected" into an unrelated two-letter word.
        assertEquals(Optional.empty(), Suggestions.nearest("qz", List.of("in", "as", "by")));
        assertEquals(Optional.of("by"), Suggestions.nearest("bi", List.of("in", "as", "by")));
    }

    @Test
    void nearestIgnoresCaseAndReturnsTheCandidateAsGiven() {
        List<String> regions = List.of("Upper Reach", "Mid Reach", "Outer Bay", "Harle Watershed");
        assertEquals(Optional.of("Outer Bay"), Suggestions.nearest("outer bay", regions));
        assertEquals(Optional.of("Harle Watershed"), Suggestions.nearest("Harle Watershad", regions));
        assertEquals(Optional.of("Mid Reach"), Suggestions.nearest("mid-reach", regions));
        assertEquals(Optional.empty(), Suggestions.nearest("North Sea", regions));
    }

    @Test
    void limitGrowsWithTheLengthOfTheWord() {
        // 14 letters allow 4 edits (14 / 3); 'watertempratur' vs 'water_temperature' needs 3.
        assertEquals(Optional.of("water_temperature"),
                Suggestions.nearest("watertempratur", List.of("water_temperature", "turbidity")));
        // Six letters allow 2 edits: two substitutions are close enough, three are not.
        assertEquals(Optional.of("abcdxy"), Suggestions.nearest("abcdef", List.of("abcdxy")));
        assertEquals(Optional.empty(), Suggestions.nearest("abcdef", List.of("abcxyz")));
    }
}
