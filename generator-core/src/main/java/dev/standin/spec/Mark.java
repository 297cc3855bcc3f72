package dev.standin.spec;

/** A place in a spec file: 1-based line and column. */
public record Mark(String file, int line, int column) {

    /** The mark for a whole file, used when a problem has no better place (line 1, column 1). */
    public static Mark startOf(String file) {
        return new Mark(file, 1, 1);
    }

    /** Converts a snakeyaml mark (0-based) to ours (1-based). */
    static Mark of(String file, org.yaml.snakeyaml.error.Mark yamlMark) {
        if (yamlMark == null) {
            return startOf(file);
        }
        return new Mark(file, yamlMark.getLine() + 1, yamlMark.getColumn() + 1);
    }
}
