package dev.standin.maven;

import java.util.Locale;
import java.util.Properties;
import org.apache.maven.plugin.MojoFailureException;

/**
 * The rule for parameters that a {@code -D} on the command line should change even when the pom
 * sets them ({@code seed}, {@code rows}, {@code format}, {@code skip}, {@code force}).
 *
 * <p>Maven injects a parameter from the plugin's {@code <configuration>} when the pom gives one and
 * only otherwise from its property ("Guide to Configuring Plug-ins", maven.apache.org: the
 * {@code property} of {@code @Parameter} names the expression used when no value is configured). For
 * these five parameters a user who types {@code -Dstandin.rows=7} means it, so a user property (a
 * {@code -D} given to {@code mvn}, as in {@code MavenSession#getUserProperties()}) wins over the pom;
 * every other parameter follows Maven's own rule.
 */
final class CommandLine {

    /** A flag's value and where it came from, for the log. */
    record Flag(boolean on, boolean fromCommandLine) {
    }

    private CommandLine() {
    }

    /** The user property when given, else the configured value (which may be null). */
    static String value(Properties userProperties, String property, String configured) {
        String given = userProperties == null ? null : userProperties.getProperty(property);
        return given != null ? given : configured;
    }

    /**
     * The user property when given ({@code true} or {@code false} in any letter case; a bare
     * {@code -Dname} is {@code true}, as Maven sets it so), else the configured value.
     *
     * @throws MojoFailureException naming the property when the value is neither
     */
    static Flag flag(Properties userProperties, String property, boolean configured) throws MojoFailureException {
        String given = userProperties == null ? null : userProperties.getProperty(property);
        if (given == null) {
            return new Flag(configured, false);
        }
        String word = given.trim().toLowerCase(Locale.ROOT);
        if (word.equals("true")) {
            return new Flag(true, true);
        }
        if (word.equals("false")) {
            return new Flag(false, true);
        }
        throw new MojoFailureException(property + " must be true or false: " + given);
    }

    /**
     * Why a flag is on, for the log: {@code standin.skip is true (-Dstandin.skip on the command line)},
     * or {@code standin.skip is true (set in the pom)} for a {@code <skip>} or a pom property.
     */
    static String reason(String property, Flag flag) {
        return property + " is true (" + (flag.fromCommandLine() ? "-D" + property + " on the command line" : "set in the pom")
                + ")";
    }

    /**
     * The generating threads: {@code -Dstandin.threads} when given, else the configured number.
     *
     * @throws MojoFailureException when the value is not a whole number
     */
    static int threads(Properties userProperties, int configured) throws MojoFailureException {
        String text = value(userProperties, PluginBridge.THREADS_PROPERTY, Integer.toString(configured));
        try {
            return Integer.parseInt(text.trim());
        } catch (NumberFormatException e) {
            throw new MojoFailureException(PluginBridge.THREADS_PROPERTY + " must be a whole number from 1 to 1024: " + text);
        }
    }
}
