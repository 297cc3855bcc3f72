package dev.standin.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class ArgumentsTest {

    private static final List<Option> OPTIONS = List.of(
            Option.valued("--out", "DIR", "d"), Option.valued("--seed", "N", "s"), Option.HELP);

    @Test
    void bothValueFormsAndMixedOperands() throws UsageException {
        Arguments spaced = Arguments.parse("t", List.of("a.yaml", "--out", "x", "b.yaml"), OPTIONS);
        Arguments joined = Arguments.parse("t", List.of("a.yaml", "--out=x", "b.yaml"), OPTIONS);

        for (Arguments a : List.of(spaced, joined)) {
            assertEquals(List.of("a.yaml", "b.yaml"), a.operands());
            assertEquals(Optional.of("x"), a.value("--out"));
            assertFalse(a.has("--seed"));
        }
        // '=' inside the value is kept
        assertEquals(Optional.of("a=b"), Arguments.parse("t", List.of("--out=a=b"), OPTIONS).value("--out"));
    }

    @Test
    void doubleDashEndsOptionsAndLoneDashIsAnOperand() throws UsageException {
        // GNU C Library manual, "Program Argument Syntax Conventions": "--" terminates all options
        Arguments a = Arguments.parse("t", List.of("-", "--", "--seed", "-h"), OPTIONS);

        assertEquals(List.of("-", "--seed", "-h"), a.operands());
        assertFalse(a.has("--help"));
    }

    @Test
    void negativeNumberIsAValueButADoubleDashWordIsNot() throws UsageException {
        assertEquals(Optional.of("-5"), Arguments.parse("t", List.of("--seed", "-5"), OPTIONS).value("--seed"));
        UsageException e = assertThrows(UsageException.class,
                () -> Arguments.parse("t", List.of("--out", "--seed", "1"), OPTIONS));
        assertEquals("--out needs a value: --out DIR or --out=DIR", e.getMessage());
        assertEquals(Optional.of("--odd"), Arguments.parse("t", List.of("--out=--odd"), OPTIONS).value("--out"));
    }

    @Test
    void shortHelpAndFlagsWithoutValues() throws UsageException {
        assertTrue(Arguments.parse("t", List.of("-h"), OPTIONS).has("--help"));
        UsageException e = assertThrows(UsageException.class, () -> Arguments.parse("t", List.of("--help=yes"), OPTIONS));
        assertEquals("--help takes no value: yes", e.getMessage());
        UsageException s = assertThrows(UsageException.class, () -> Arguments.parse("t", List.of("-x"), OPTIONS));
        assertEquals("unknown option: -x (t takes --out, --seed, --help)", s.getMessage());
    }
}
