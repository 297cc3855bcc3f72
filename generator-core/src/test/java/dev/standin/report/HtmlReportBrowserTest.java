package dev.standin.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.standin.engine.CompiledSpec;
import dev.standin.engine.Engine;
import dev.standin.spec.Overrides;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Renders the HTML report of an example spec in headless Chromium (Debian's {@code chromium}, which
 * {@code .ci/run} installs when missing): the screenshot must not be blank and the browser's DOM must
 * hold the expected SVG charts. Skipped, saying why, when no Chromium is installed.
 */
class HtmlReportBrowserTest {

    private static final Path CHROMIUM = Path.of(System.getProperty("standin.test.chromium", "/usr/bin/chromium"));

    private static final String SPEC = "dataset: lighthouse\nrows: 3000\nseed: 8\ncolumns:\n"
            + "  visit: {dist: sequence}\n"
            + "  keepers: {dist: poisson, mean: 2}\n"
            + "  oil_l: {dist: gamma, mean: 40, sd: 9, decimals: 1}\n"
            + "  lamp_h: {dist: weibull, shape: 2, scale: 900, decimals: 0}\n"
            + "  weather: {dist: categorical, levels: {fog: 2, gale: 1, calm: 4}}\n"
            + "  logged_on: {dist: date, from: 2026-01-01, to: 2026-06-30}\n"
            + "correlation:\n  measure: spearman\n  pairs: {oil_l ~ lamp_h: 0.7, keepers ~ oil_l: 0.3}\n";

    @Test
    void reportRendersWithItsCharts(@TempDir Path dir) throws Exception {
        assumeTrue(Files.isExecutable(CHROMIUM), "skipped: no Chromium at " + CHROMIUM
                + " (apt-get install chromium, or set -Dstandin.test.chromium=PATH)");
        Engine engine = Engine.create(Overrides.none());
        CompiledSpec c = engine.compile("lighthouse.yaml", SPEC.getBytes(StandardCharsets.UTF_8), "");
        engine.generate(c, dir);
        Path html = dir.resolve(c.htmlReportFile());
        Path png = dir.resolve("shot.png");

        run(dir, "--window-size=1280,800", "--screenshot=" + png, html.toUri().toString());
        BufferedImage image = ImageIO.read(png.toFile());
        assertEquals(1280, image.getWidth());
        Set<Integer> colours = new HashSet<>();
        int dataColour = Integer.parseInt(HtmlReport.DATA.substring(1), 16);
        boolean sawData = false;
        for (int y = 0; y < image.getHeight(); y += 2) {
            for (int x = 0; x < image.getWidth(); x += 2) {
                int rgb = image.getRGB(x, y) & 0xFFFFFF;
                colours.add(rgb);
                sawData |= rgb == dataColour;
            }
        }
        assertTrue(colours.size() > 20, "the screenshot is blank or nearly so: " + colours.size() + " colours");
        assertTrue(sawData, "the data colour " + HtmlReport.DATA + " appears on the first screen");

        String dom = run(dir, "--dump-dom", html.toUri().toString());
        List<String> charts = new ArrayList<>();
        Matcher m = Pattern.compile("<svg[^>]*data-chart=\"([^\"]+)\"").matcher(dom);
        while (m.find()) {
            charts.add(m.group(1));
        }
        for (String expected : List.of("hist-visit", "bars-keepers", "hist-oil_l", "hist-lamp_h", "bars-weather",
                "hist-logged_on", "heatmap-requested", "heatmap-achieved", "scatter-matrix")) {
            assertTrue(charts.contains(expected), "chart " + expected + " in the rendered DOM: " + charts);
        }
    }

    private static String run(Path dir, String... args) throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of(CHROMIUM.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--hide-scrollbars", "--user-data-dir=" + dir.resolve("profile")));
        command.addAll(List.of(args));
        Process p = new ProcessBuilder(command).directory(dir.toFile()).redirectError(dir.resolve("chromium.log").toFile())
                .start();
        byte[] out = p.getInputStream().readAllBytes();
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "chromium finished");
        assertEquals(0, p.exitValue(), () -> "chromium failed: " + read(dir.resolve("chromium.log")));
        return new String(out, StandardCharsets.UTF_8);
    }

    private static String read(Path p) {
        try {
            return Files.readString(p);
        } catch (IOException e) {
            return e.toString();
        }
    }
}
