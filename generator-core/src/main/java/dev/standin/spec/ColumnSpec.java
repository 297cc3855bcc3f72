package dev.standin.spec;

import dev.standin.marginal.Marginal;

/** One column of a spec, in the order written. */
public sealed interface ColumnSpec permits ColumnSpec.Sequence, ColumnSpec.Random {

    String name();

    /** Where the column's name stands in the spec. */
    Mark mark();

    /** The spec's family word. */
    String dist();

    /** An arithmetic sequence start, start + step, ...: not random, outside any correlation. */
    record Sequence(String name, Mark mark, long start, long step) implements ColumnSpec {
        @Override
        public String dist() {
            return "sequence";
        }
    }

    /**
     * A random column drawn from its marginal by inversion.
     *
     * @param decimals digits after the decimal point of the written value, or -1 for the shortest
     *     text that reads back as the same double
     * @param nulls the probability that a row's value is missing, drawn from its own stream
     */
    record Random(String name, Mark mark, Marginal marginal, int decimals, double nulls) implements ColumnSpec {
        @Override
        public String dist() {
            return marginal.family();
        }
    }
}
