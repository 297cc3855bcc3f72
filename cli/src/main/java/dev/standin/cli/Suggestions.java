package dev.standin.cli;

import java.util.Collection;
import java.util.Optional;

/**
 * "Did you mean ...?" for mistyped commands and options.
 *
 * <p>Closeness is the optimal string alignment distance: the Levenshtein edit distance
 * (V. I. Levenshtein, "Binary codes capable of correcting deletions, insertions and reversals",
 * Soviet Physics Doklady 10(8), 1966) extended by transpositions of adjacent characters
 * (F. J. Damerau, "A technique for computer detection and correction of spelling errors",
 * Communications of the ACM 7(3), 1964), with no substring edited twice. A candidate is suggested
 * when it is within one edit per three characters (at least one, at most two) or when the typed
 * word is a prefix of it of at least three characters (common practice).
 */
final class Suggestions {

    private Suggestions() {
    }

    /** The closest candidate to {@code typed}, if any is close enough; ties go to the earlier candidate. */
    static Optional<String> closest(String typed, Collection<String> candidates) {
        String core = strip(typed);
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        int allowed = Math.max(1, Math.min(2, core.length() / 3));
        for (String candidate : candidates) {
            String c = strip(candidate);
            int d = distance(core, c);
            boolean prefix = core.length() >= 3 && c.startsWith(core);
            if ((d <= allowed || prefix) && d < bestDistance) {
                best = candidate;
                bestDistance = d;
            }
        }
        return Optional.ofNullable(best);
    }

    /** Optimal string alignment distance between {@code a} and {@code b} (see the class comment). */
    static int distance(String a, String b) {
        int n = a.length();
        int m = b.length();
        int[][] d = new int[n + 1][m + 1];
        for (int i = 0; i <= n; i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= m; j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= n; i++) {
            for (int j = 1; j <= m; j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                int v = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    v = Math.min(v, d[i - 2][j - 2] + 1);
                }
                d[i][j] = v;
            }
        }
        return d[n][m];
    }

    private static String strip(String s) {
        int i = 0;
        while (i < s.length() && s.charAt(i) == '-') {
            i++;
        }
        return s.substring(i);
    }
}
