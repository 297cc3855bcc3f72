package dev.standin.maven;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Properties;
import org.apache.maven.plugin.MojoFailureException;
import org.junit.jupiter.api.Test;

/**
 * The -D-wins rule for seed, rows, format, skip and force. Maven passes a bare {@code -Dname} as the
 * user property {@code name=true} (Maven CLI reference, "-D,--define": "Define a user property";
 * from memory: the value defaults to "true").
 */
class CommandLineTest {

    private static Properties user(String... pairs) {
        Properties p = new Properties();
        for (int i = 0; i < pairs.length; i += 2) {
            p.setProperty(pairs[i], pairs[i + 1]);
        }
        return p;
    }

    @Test
    void aUserPropertyWinsOverThePomAndThePomOverNothing() {
        assertEquals("7", CommandLine.value(user("standin.rows", "7"), "standin.rows", "50"));
        assertEquals("50", CommandLine.value(user(), "standin.rows", "50"));
        assertEquals("50", CommandLine.value(null, "standin.rows", "50"));
        assertNull(CommandLine.value(user("standin.seed", "1"), "standin.rows", null));
    }

    @Test
    void flagsReadTrueAndFalseInAnyCaseAndSayWhereTheyCameFrom() throws Exception {
        assertEquals(new CommandLine.Flag(true, true), CommandLine.flag(user("standin.skip", "true"), "standin.skip", false));
        assertEquals(new CommandLine.Flag(false, true), CommandLine.flag(user("standin.skip", " FALSE "), "standin.skip", true));
        assertEquals(new CommandLine.Flag(true, false), CommandLine.flag(user(), "standin.skip", true));
        assertEquals("standin.skip is true (-Dstandin.skip on the command line)",
                CommandLine.reason("standin.skip", new CommandLine.Flag(true, true)));
        assertEquals("standin.force is true (set in the pom)",
                CommandLine.reason("standin.force", new CommandLine.Flag(true, false)));
    }

    @Test
    void aFlagThatIsNeitherTrueNorFalseNamesTheProperty() {
        MojoFailureException e = assertThrows(MojoFailureException.class,
                () -> CommandLine.flag(user("standin.force", "yes"), "standin.force", false));
        assertEquals("standin.force must be true or false: yes", e.getMessage());
    }
}
