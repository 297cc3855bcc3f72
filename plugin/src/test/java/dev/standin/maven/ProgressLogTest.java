package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Progress lines from a hand-driven clock: at most one per 5 s, percentages rounded down. */
class ProgressLogTest {

    @Test
    void logsAtMostOncePerIntervalWithRowsPercentAndTime() {
        long[] now = {1_000L};
        List<String> lines = new ArrayList<>();
        ProgressLog p = ProgressLog.of("ferry-crossings", 5_000_000, lines::add, () -> now[0]);
        p.accept(65_536);                       // 0 s: too early
        now[0] += 4_999_999_999L;
        p.accept(131_072);                      // just under 5 s: still too early
        now[0] += 1;
        p.accept(1_310_720);                    // 5.0 s: 1310720 / 5e6 = 26.2144 % → 26
        now[0] += 1_000_000_000L;
        p.accept(1_376_256);                    // 1 s later: too early again
        now[0] += 7_250_000_000L;
        p.accept(4_980_736);                    // 13.25 s: 99.61 % → 99; "13.3 s" (Formatter rounds HALF_UP)
        assertEquals(List.of("ferry-crossings: 1310720 of 5000000 rows (26%) after 5.0 s",
                "ferry-crossings: 4980736 of 5000000 rows (99%) after 13.3 s"), lines);
    }

    @Test
    void secondsHaveOneDecimalWhateverTheLocale() {
        // java.util.Formatter with Locale.ROOT uses '.' as the decimal separator (Java SE 17 Formatter docs).
        assertEquals("0.4 s", ProgressLog.seconds(400_000_000L));
        assertEquals("0.0 s", ProgressLog.seconds(0));
        assertEquals("61.0 s", ProgressLog.seconds(61_000_000_000L));
    }
}
