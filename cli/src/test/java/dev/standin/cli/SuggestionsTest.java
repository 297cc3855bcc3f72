package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class SuggestionsTest {

    @Test
    void distanceMatchesPublishedExamples() {
        // kitten -> sitting needs 3 edits: the textbook Levenshtein example (from memory)
        assertEquals(3, Suggestions.distance("kitten", "sitting"));
        // "ca" -> "abc": 3 under optimal string alignment, 2 under unrestricted Damerau-Levenshtein
        // (the standard example that separates the two, from memory)
        assertEquals(3, Suggestions.distance("ca", "abc"));
        // one adjacent transposition is one edit (Damerau 1964)
        assertEquals(1, Suggestions.distance("rwos", "rows"));
        assertEquals(0, Suggestions.distance("", ""));
        assertEquals(4, Suggestions.distance("", "rows"));
    }

    @Test
    void suggestsOnlyCloseCandidates() {
        List<String> options = List.of("--out", "--seed", "--rows", "--format");
        assertEquals(Optional.of("--rows"), Suggestions.closest("--rwos", options));
        assertEquals(Optional.of("--format"), Suggestions.closest("--form", options));
        assertEquals(Optional.of("--seed"), Suggestions.closest("--sed", options));
        assertEquals(Optional.empty(), Suggestions.closest("--quiet", options));
        assertEquals(Optional.empty(), Suggestions.closest("--x", options));
    }
}
