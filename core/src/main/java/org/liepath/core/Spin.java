package org.liepath.core;

import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

/**
 * Spin-j angular-momentum operators Jx, Jy, Jz, J+ and J− in dimension 2j+1.
 *
 * <p>Convention: basis ordered m = j, j−1, …, −j, so Jz = diag(j, j−1, …, −j) and, for j = ½, index 0 is spin up.
 * Standard Condon–Shortley phases: ⟨m+1|J+|m⟩ = sqrt(j(j+1) − m(m+1)) real and positive; Jx = (J+ + J−)/2,
 * Jy = (J+ − J−)/(2i). For j = ½ these are σ/2.
 *
 * <p>Immutable and thread-safe; operators are built on demand (O((2j+1)²) each). At most j = {@value #MAX_J}.
 */
public final class Spin {
    /** Largest spin accepted (dimension 2001). */
    public static final double MAX_J = 1000;

    private final double j;
    private final int dim;

    private Spin(double j) {
        this.j = j;
        this.dim = (int) Math.round(2 * j) + 1;
    }

    /**
     * @param j a positive integer or half-integer, at most {@value #MAX_J}
     * @return the spin-j operators
     * @throws InvalidInputException if j is not a positive multiple of ½ or too large
     */
    public static Spin of(double j) {
        Require.finite(j, "j");
        double twoJ = 2 * j;
        // test the rounded 2j too: j = 1e-13 is within the half-integer tolerance of 0, which is not a positive spin
        if (j <= 0 || Math.abs(twoJ - Math.rint(twoJ)) > 1e-12 || Math.rint(twoJ) < 1) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "j", "a positive integer or half-integer (½, 1, 3/2, …)", j);
        }
        if (j > MAX_J) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "j", "at most " + MAX_J, j);
        }
        return new Spin(Math.rint(twoJ) / 2);
    }

    /** @return j */
    public double j() {
        return j;
    }

    /** @return 2j + 1 */
    public int dim() {
        return dim;
    }

    /**
     * @param k the index
     * @return the m value of basis index k (m = j − k)
     */
    public double m(int k) {
        Require.index(k, dim, "k");
        return j - k;
    }

    /** @return Jz = diag(j, …, −j) */
    public Operator z() {
        double[] d = new double[dim];
        for (int k = 0; k < dim; k++) {
            d[k] = j - k;
        }
        return Operator.diagonal(d);
    }

    /** @return the raising operator J+ */
    public Operator plus() {
        double[] re = new double[dim * dim];
        // J+ |m> = c |m+1>: column k (m = j-k) to row k-1
        for (int k = 1; k < dim; k++) {
            double m = j - k;
            re[(k - 1) * dim + k] = Math.sqrt(j * (j + 1) - m * (m + 1));
        }
        return new Operator(dim, re, new double[dim * dim]);
    }

    /** @return the lowering operator J− = (J+)† */
    public Operator minus() {
        return plus().dagger();
    }

    /** @return Jx = (J+ + J−)/2 */
    public Operator x() {
        Operator p = plus();
        return p.plus(p.dagger()).scale(0.5);
    }

    /** @return Jy = (J+ − J−)/(2i) */
    public Operator y() {
        Operator p = plus();
        Operator d = p.minus(p.dagger());
        // (d)/(2i) = -i d / 2
        return d.timesI().scale(-0.5);
    }

    /** @return J² = j(j+1) I computed as Jx² + Jy² + Jz² */
    public Operator squared() {
        Operator x = x(), y = y(), z = z();
        return x.times(x).plus(y.times(y)).plus(z.times(z));
    }

    @Override
    public String toString() {
        return "Spin " + (dim % 2 == 0 ? (dim - 1) + "/2" : Integer.toString((dim - 1) / 2)) + " (dimension " + dim + ")";
    }
}
