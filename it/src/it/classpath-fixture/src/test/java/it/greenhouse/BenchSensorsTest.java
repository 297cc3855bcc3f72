package it.greenhouse;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import java.io.BufferedReader;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

class BenchSensorsTest {

    @Test
    void fixtureIsOnTheTestClasspath() throws Exception {
        // The spec src/test/standin/house-b/bench-sensors.yaml keeps its sub-folder on the classpath.
        try (InputStream in = BenchSensorsTest.class.getResourceAsStream("/house-b/bench-sensors.csv")) {
            assertNotNull(in, "house-b/bench-sensors.csv is not on the test classpath");
            List<String> lines = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))
                    .lines().collect(Collectors.toList());
            // A header line then one record per row (RFC 4180 §2.3); the spec asks for 240 rows.
            assertEquals("reading_no,air_temp_c,humidity_pct", lines.get(0));
            assertEquals(241, lines.size());
            for (String line : lines.subList(1, lines.size())) {
                assertEquals(3, line.split(",", -1).length, line);
            }
            assertEquals("1", lines.get(1).split(",")[0]);
            assertEquals("240", lines.get(240).split(",")[0]);
        }
    }
}
