package dev.standin.correlation;

/** What to do with a correlation target that is not positive semidefinite. */
public enum RepairPolicy {
    /** Higham's nearest correlation matrix ({@link NearestCorrelation}). */
    NEAREST("nearest"),
    /** Eigenvalue clipping and rescaling ({@link EigenClip}): fast, cruder. */
    CLIP("clip"),
    /** Fail with the diagnostic. */
    FAIL("fail");

    private final String word;

    RepairPolicy(String word) {
        this.word = word;
    }

    public String word() {
        return word;
    }

    public static RepairPolicy parse(String word) {
        for (RepairPolicy p : values()) {
            if (p.word.equals(word)) {
                return p;
            }
        }
        return null;
    }

    public static String choices() {
        return "nearest, clip, fail";
    }
}
