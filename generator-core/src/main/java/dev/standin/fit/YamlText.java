package dev.standin.fit;

import dev.standin.output.NumberText;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;

/** Writing scalars of a fitted spec as YAML 1.1 text that snakeyaml reads back unchanged. */
final class YamlText {

    /** Plain scalars that stay strings in YAML 1.1 (no indicator, number, bool, null or date look). */
    private static final Pattern PLAIN = Pattern.compile("[A-Za-z_][A-Za-z0-9_-]*");
    /** Plain words that YAML 1.1 resolves to booleans or null (YAML 1.1 type repository, bool and null). */
    private static final Set<String> RESERVED = Set.of("y", "yes", "n", "no", "true", "false", "on", "off", "null");

    private YamlText() {
    }

    /** A string as a plain scalar when that is safe, else double-quoted with escapes. */
    static String string(String s) {
        if (PLAIN.matcher(s).matches() && !RESERVED.contains(s.toLowerCase(Locale.ROOT))) {
            return s;
        }
        return quoted(s);
    }

    /** A double-quoted scalar (YAML 1.1 §5.7 escapes for quote, backslash and control characters). */
    static String quoted(String s) {
        StringBuilder sb = new StringBuilder("\"");
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> sb.append("\\\"");
                case '\\' -> sb.append("\\\\");
                case '\n' -> sb.append("\\n");
                case '\r' -> sb.append("\\r");
                case '\t' -> sb.append("\\t");
                default -> {
                    if (c < 0x20 || c == 0x7f || (c >= 0x80 && c <= 0x9f) || c == '\u2028' || c == '\u2029' || c == '\ufeff'
                            || Character.isSurrogate(c) && !validPair(s, i)) {
                        sb.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
                    } else {
                        sb.append(c);
                    }
                }
            }
        }
        return sb.append('"').toString();
    }

    private static boolean validPair(String s, int i) {
        char c = s.charAt(i);
        if (Character.isHighSurrogate(c)) {
            return i + 1 < s.length() && Character.isLowSurrogate(s.charAt(i + 1));
        }
        return i > 0 && Character.isHighSurrogate(s.charAt(i - 1));
    }

    /** A number in the shortest text that reads back as the same double. */
    static String number(double d) {
        return NumberText.shortest(d);
    }

    /** Text for a YAML comment: one line, no control characters. */
    static String comment(String s) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            sb.append(Character.isISOControl(c) ? ' ' : c);
        }
        return sb.toString();
    }
}
