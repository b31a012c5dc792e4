package org.liepath.core;

import org.liepath.core.internal.Require;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * Operators of a d-level system: matrix units |i⟩⟨j| and the generalized Gell-Mann matrices.
 *
 * <p>Convention: index 0 is the ground level. The generalized Gell-Mann matrices of dimension d are the d²−1
 * traceless Hermitian matrices normalised as tr(λ_a λ_b) = 2δ_ab, ordered as in Gell-Mann's su(3) table when d = 3
 * (λ1 … λ8): for each pair j &lt; k the symmetric (|j⟩⟨k| + |k⟩⟨j|) and antisymmetric (−i|j⟩⟨k| + i|k⟩⟨j|) matrices,
 * interleaved with the diagonal ones sqrt(2/(l(l+1))) (Σ_{m&lt;l} |m⟩⟨m| − l|l⟩⟨l|) as soon as level l is reached. For d
 * = 2 these are the Pauli matrices X, Y, Z. Reference: M. Gell-Mann, Phys. Rev. 125 (1962) 1067; the generalisation
 * is common practice (e.g. R.A. Bertlmann, P. Krammer, J. Phys. A 41 (2008) 235303).
 *
 * <p>Stateless and thread-safe. Cost O(d⁴) for the whole list.
 */
public final class Levels {
    /** Largest d accepted. */
    public static final int MAX_LEVELS = 64;

    private Levels() {
    }

    /**
     * @param d the number of levels
     * @param i the index
     * @param j the index
     * @return the matrix unit |i⟩⟨j| in dimension d
     */
    public static Operator unit(int d, int i, int j) {
        return Operator.unit(d, i, j);
    }

    /**
     * @param d the number of levels
     * @param k the index
     * @return the projector |k⟩⟨k| in dimension d
     */
    public static Operator projector(int d, int k) {
        return Operator.unit(d, k, k);
    }

    /**
     * The d²−1 generalized Gell-Mann matrices (see class comment for order and normalisation).
     *
     * @param d at least 2, at most {@value #MAX_LEVELS}
     * @return the d²−1 generalized Gell-Mann matrices (see class comment for order and normalisation)
     */
    public static List<Operator> gellMann(int d) {
        if (d < 2 || d > MAX_LEVELS) {
            throw InvalidInputException.of(InvalidInputException.Reason.OUT_OF_RANGE, "d",
                    "a dimension in [2, " + MAX_LEVELS + "]", d);
        }
        List<Operator> out = new ArrayList<>(d * d - 1);
        // Gell-Mann's order for d = 3: (01)s, (01)a, diag1, (02)s, (02)a, (12)s, (12)a, diag2
        for (int k = 1; k < d; k++) {
            for (int j = 0; j < k; j++) {
                double[] re = new double[d * d], im = new double[d * d];
                re[j * d + k] = 1;
                re[k * d + j] = 1;
                out.add(new Operator(d, re, im));
                double[] re2 = new double[d * d], im2 = new double[d * d];
                im2[j * d + k] = -1;
                im2[k * d + j] = 1;
                out.add(new Operator(d, re2, im2));
                if (j == 0 && k == 1) {
                    out.add(diag(d, 1));
                }
            }
            if (k >= 2) {
                out.add(diag(d, k));
            }
        }
        return Collections.unmodifiableList(out);
    }

    private static Operator diag(int d, int l) {
        double c = Math.sqrt(2.0 / (l * (l + 1.0)));
        double[] diag = new double[d];
        for (int m = 0; m < l; m++) {
            diag[m] = c;
        }
        diag[l] = -l * c;
        return Operator.diagonal(diag);
    }

    /**
     * @param d the number of levels
     * @return the d-level ladder a = Σ sqrt(k) |k−1⟩⟨k| truncated to d levels (a harmonic-oscillator annihilator)
     */
    public static Operator annihilation(int d) {
        Require.positive(d, "d");
        if (d > Operator.MAX_DIM) {
            throw InvalidInputException.of(InvalidInputException.Reason.LIMIT_EXCEEDED, "d",
                    "a dimension ≤ " + Operator.MAX_DIM, d);
        }
        double[] re = new double[d * d];
        for (int k = 1; k < d; k++) {
            re[(k - 1) * d + k] = Math.sqrt(k);
        }
        return new Operator(d, re, new double[d * d]);
    }
}
