package dev.standin.spec;

import java.util.Collection;

/** Suggestions for misspelt names ("did you mean ..."), by Levenshtein edit distance. */
final class Names {

    private Names() {
    }

    /** The most characters of a user's text that a message repeats. */
    static final int SHOWN_CHARS = 200;

    /**
     * A user's text as a message repeats it: whole when short, else its first {@link #SHOWN_CHARS}
     * characters and its length, so that one line stays one readable line.
     */
    static String shown(String text) {
        if (text.length() <= SHOWN_CHARS) {
            return text;
        }
        return text.substring(0, SHOWN_CHARS) + "... (" + text.length() + " characters)";
    }

    /** The closest candidate within a third of the name's length (at least 2 edits), or null. */
    static String closest(String name, Collection<String> candidates) {
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        for (String c : candidates) {
            int d = distance(name, c);
            if (d < bestDistance) {
                bestDistance = d;
                best = c;
            }
        }
        int allowed = Math.max(2, name.length() / 3);
        return bestDistance <= allowed ? best : null;
    }

    /** ", did you mean 'x'?" or the empty string. */
    static String suggestion(String name, Collection<String> candidates) {
        String c = closest(name, candidates);
        return c == null ? "" : "; did you mean '" + c + "'?";
    }

    static int distance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                cur[j] = Math.min(Math.min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + cost);
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
