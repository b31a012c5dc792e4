package org.liepath.algebra;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

import java.util.Arrays;
import java.util.Locale;

/**
 * The structure constants of a Lie algebra in its basis: [e_i, e_j] = Σ_k c_ij^k e_k.
 *
 * <p>Stored sparsely: only the non-zero c_ij^k with i &lt; j are kept (antisymmetry c_ji^k = −c_ij^k gives the
 * others, and c_ii^k = 0). For a real algebra the basis is the algebra's real-orthonormal anti-Hermitian basis and the
 * constants are real, so c_ij^k = Re tr(e_k† [e_i, e_j]); for a complex algebra ({@link LieAlgebra#complexSpan}) they
 * are complex, c_ij^k = tr(e_k† [e_i, e_j]). Entries whose modulus is at rounding level (about 64·N·ε for N×N
 * matrices) are stored as zero.
 *
 * <p>Immutable and thread-safe. {@link #get} and {@link #getComplex} cost O(entries of the pair).
 */
public final class StructureConstants {
    private final int m;
    private final boolean complex;
    private final int[] start; // per pair (i<j)
    private final int[] ks;
    private final double[] re;
    private final double[] im;

    StructureConstants(int m, boolean complex, int[] start, int[] ks, double[] re, double[] im) {
        this.m = m;
        this.complex = complex;
        this.start = start;
        this.ks = ks;
        this.re = re;
        this.im = im;
    }

    /** @return the dimension m of the algebra (indices run over 0 … m−1) */
    public int dimension() {
        return m;
    }

    /** @return whether the constants are complex (the algebra was built by {@link LieAlgebra#complexSpan}) */
    public boolean isComplex() {
        return complex;
    }

    /** @return the number of stored non-zero constants c_ij^k with i &lt; j */
    public int nonZeros() {
        return ks.length;
    }

    private int pair(int i, int j) {
        return i * m - i * (i + 1) / 2 + (j - i - 1);
    }

    private int find(int i, int j, int k) {
        int p = pair(i, j);
        int e = Arrays.binarySearch(ks, start[p], start[p + 1], k);
        return e >= 0 ? e : -1;
    }

    private void check(int i, int j, int k) {
        Require.index(i, m, "i");
        Require.index(j, m, "j");
        Require.index(k, m, "k");
    }

    /**
     * @param i the index
     * @param j the index
     * @param k the index
     * @return the real constant c_ij^k
     * @throws InvalidInputException for an index out of range, or (reason UNSUPPORTED) for complex constants, which
     *                               {@link #getComplex} returns
     */
    public double get(int i, int j, int k) {
        check(i, j, k);
        if (complex) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "get", "real structure constants (use getComplex)",
                    "a complex algebra");
        }
        return signedGet(i, j, k)[0];
    }

    /**
     * @param i the index
     * @param j the index
     * @param k the index
     * @return c_ij^k as a complex number (imaginary part zero for real algebras)
     */
    public Complex getComplex(int i, int j, int k) {
        check(i, j, k);
        double[] v = signedGet(i, j, k);
        return new Complex(v[0], v[1]);
    }

    private double[] signedGet(int i, int j, int k) {
        if (i == j) {
            return new double[2];
        }
        double s = 1;
        if (i > j) {
            int t = i;
            i = j;
            j = t;
            s = -1;
        }
        int e = find(i, j, k);
        return e < 0 ? new double[2] : new double[] {s * re[e], s * im[e]};
    }

    /** One line per non-zero bracket, e.g. {@code [e0, e1] = 1 e2}; at most 200 lines, then a count of the rest. */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append("structure constants of a ").append(complex ? "complex" : "real").append(" Lie algebra of dimension ")
                .append(m).append(", ").append(ks.length).append(" non-zero c_ij^k (i < j)\n");
        int lines = 0, p = 0;
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++, p++) {
                if (start[p] == start[p + 1]) {
                    continue;
                }
                if (lines == 200) {
                    sb.append("…\n");
                    return sb.toString();
                }
                sb.append("[e").append(i).append(", e").append(j).append("] =");
                for (int e = start[p]; e < start[p + 1]; e++) {
                    sb.append(' ').append(coefficient(re[e], im[e], e == start[p])).append(" e").append(ks[e]);
                }
                sb.append('\n');
                lines++;
            }
        }
        return sb.toString();
    }

    private String coefficient(double r, double i, boolean first) {
        String s;
        if (!complex || i == 0) {
            s = fmt(r);
        } else {
            s = "(" + fmt(r) + (i < 0 ? " − " : " + ") + fmt(Math.abs(i)) + "i)";
        }
        if (!first) {
            s = s.startsWith("-") ? "- " + s.substring(1) : "+ " + s;
        }
        return s;
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v).replaceAll("\\.?0+(e|$)", "$1");
    }
}
