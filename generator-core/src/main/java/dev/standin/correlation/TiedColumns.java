package dev.standin.correlation;

import java.util.Arrays;

/**
 * Columns tied together by specified pairs of exactly +1 or −1: such columns are the same latent
 * variable up to sign, so a target with free pairs can be completed on one representative per tie
 * and expanded back, exactly: X<sub>ij</sub> = s<sub>i</sub> s<sub>j</sub> R<sub>c(i) c(j)</sub> for the completed
 * k × k matrix R of the representatives, c(i) the tie of column i and s<sub>i</sub> its sign. X is
 * positive semidefinite whenever R is (X = S P R P<sup>T</sup> S), and its specified pairs hold exactly,
 * whereas a completion of the full singular set by projections only approaches it. Ties are found by
 * union–find with a sign per link (R. E. Tarjan, "Efficiency of a good but not linear set union
 * algorithm", J. ACM 22 (1975) 215-225).
 */
final class TiedColumns {

    private final int[] tie;
    private final double[] sign;
    private final int ties;

    private TiedColumns(int[] tie, double[] sign, int ties) {
        this.tie = tie;
        this.sign = sign;
        this.ties = ties;
    }

    /** The ties of a requested matrix (NaN = free), or null when no pair is ±1 or the ±1 pairs contradict each other. */
    static TiedColumns of(double[][] requested) {
        int n = requested.length;
        int[] parent = new int[n];
        double[] toParent = new double[n];
        for (int i = 0; i < n; i++) {
            parent[i] = i;
            toParent[i] = 1.0;
        }
        boolean any = false;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                double v = requested[i][j];
                if (v != 1.0 && v != -1.0) {
                    continue;
                }
                any = true;
                int ri = root(parent, i);
                int rj = root(parent, j);
                double si = signToRoot(parent, toParent, i);
                double sj = signToRoot(parent, toParent, j);
                if (ri == rj) {
                    // column i = v · column j must agree with what the ties already say
                    if (si * sj != v) {
                        return null;
                    }
                } else {
                    parent[rj] = ri;
                    toParent[rj] = si * v * sj;
                }
            }
        }
        if (!any) {
            return null;
        }
        int[] tie = new int[n];
        double[] sign = new double[n];
        int[] index = new int[n];
        Arrays.fill(index, -1);
        int ties = 0;
        for (int i = 0; i < n; i++) {
            int r = root(parent, i);
            if (index[r] < 0) {
                index[r] = ties++;
            }
            tie[i] = index[r];
            sign[i] = signToRoot(parent, toParent, i);
        }
        return new TiedColumns(tie, sign, ties);
    }

    private static int root(int[] parent, int i) {
        while (parent[i] != i) {
            i = parent[i];
        }
        return i;
    }

    /** s with column i = s · (its root column). */
    private static double signToRoot(int[] parent, double[] toParent, int i) {
        double s = 1.0;
        while (parent[i] != i) {
            s *= toParent[i];
            i = parent[i];
        }
        return s;
    }

    /**
     * The requested matrix of the representatives (NaN = free), or null when the pairs given do not
     * reduce consistently: a pair other than ±1 inside a tie, or two pairs implying different values
     * between the same two ties.
     */
    double[][] reduce(double[][] requested) {
        int n = requested.length;
        double[][] r = new double[ties][ties];
        for (double[] row : r) {
            Arrays.fill(row, Double.NaN);
        }
        for (int c = 0; c < ties; c++) {
            r[c][c] = 1.0;
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                double v = requested[i][j];
                if (Double.isNaN(v) || v == 1.0 || v == -1.0) {
                    continue;
                }
                int a = tie[i];
                int b = tie[j];
                if (a == b) {
                    return null;
                }
                double w = v * sign[i] * sign[j];
                if (!Double.isNaN(r[a][b]) && r[a][b] != w) {
                    return null;
                }
                r[a][b] = w;
                r[b][a] = w;
            }
        }
        return r;
    }

    /** The full matrix from the representatives' matrix. */
    double[][] expand(double[][] reduced) {
        int n = tie.length;
        double[][] x = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                x[i][j] = i == j ? 1.0 : sign[i] * sign[j] * reduced[tie[i]][tie[j]];
            }
        }
        return x;
    }
}
