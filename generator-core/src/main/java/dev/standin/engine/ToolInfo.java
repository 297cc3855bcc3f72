package dev.standin.engine;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/** The tool's name and version, read from the core jar's {@code dev/standin/standin.properties}. */
public final class ToolInfo {

    private static final String NAME;
    private static final String VERSION;

    static {
        Properties p = new Properties();
        try (InputStream in = ToolInfo.class.getResourceAsStream("/dev/standin/standin.properties")) {
            if (in != null) {
                p.load(in);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        NAME = p.getProperty("name", "standin");
        VERSION = p.getProperty("version", "unknown");
    }

    private ToolInfo() {
    }

    public static String name() {
        return NAME;
    }

    public static String version() {
        return VERSION;
    }
}
