package org.liepath.algebra;

import org.liepath.core.internal.Require;

/**
 * Which basis elements of a Lie algebra commute: {@code commutes(i, j)} is true when [e_i, e_j] = 0 (no structure
 * constant of the pair above rounding level).
 *
 * <p>{@link #toString()} prints a grid with {@code ·} for commuting and {@code x} for non-commuting pairs;
 * {@link #toCsv()} gives a header row and one row per element with 1 (commute) or 0. Labels are {@code e0 … e(m−1)},
 * the indices of {@link LieAlgebra#basis()}. Immutable and thread-safe.
 */
public final class CommutationTable {
    private final boolean[][] commute;

    CommutationTable(boolean[][] commute) {
        this.commute = commute;
    }

    /** @return the number of basis elements */
    public int dimension() {
        return commute.length;
    }

    /**
     * @param i the index
     * @param j the index
     * @return whether [e_i, e_j] = 0
     */
    public boolean commutes(int i, int j) {
        Require.index(i, commute.length, "i");
        Require.index(j, commute.length, "j");
        return commute[i][j];
    }

    /** @return the number of unordered pairs i &lt; j that do not commute */
    public int nonCommutingPairs() {
        int c = 0;
        for (int i = 0; i < commute.length; i++) {
            for (int j = i + 1; j < commute.length; j++) {
                if (!commute[i][j]) {
                    c++;
                }
            }
        }
        return c;
    }

    /** @return comma-separated values: a header {@code ,e0,e1,…} and rows {@code e0,1,0,…} (1 = commute) */
    public String toCsv() {
        StringBuilder sb = new StringBuilder();
        int m = commute.length;
        for (int j = 0; j < m; j++) {
            sb.append(",e").append(j);
        }
        sb.append('\n');
        for (int i = 0; i < m; i++) {
            sb.append('e').append(i);
            for (int j = 0; j < m; j++) {
                sb.append(',').append(commute[i][j] ? '1' : '0');
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** A grid: rows and columns labelled by index, {@code ·} where the pair commutes, {@code x} where it does not. */
    @Override
    public String toString() {
        int m = commute.length;
        int w = Math.max(2, String.valueOf(m - 1).length() + 1);
        StringBuilder sb = new StringBuilder();
        sb.append(" ".repeat(w + 1));
        for (int j = 0; j < m; j++) {
            sb.append(pad(String.valueOf(j), w));
        }
        sb.append('\n');
        for (int i = 0; i < m; i++) {
            sb.append(pad("e" + i, w + 1));
            for (int j = 0; j < m; j++) {
                sb.append(pad(commute[i][j] ? "·" : "x", w));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static String pad(String s, int w) {
        return " ".repeat(Math.max(0, w - s.length())) + s;
    }
}
