package org.liepath.core;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Dense;
import org.liepath.core.internal.Require;

import java.util.Locale;

/**
 * An immutable complex column vector: a (not necessarily normalised) pure state |ψ⟩ in C^n.
 *
 * <p>Factories copy their arguments and refuse non-finite entries. Basis index k follows the conventions of the
 * operator that acts on it (index 0 is spin up for spin ½, the ground level for a d-level system, the leftmost qubit
 * is the most significant bit of a multi-qubit index).
 *
 * <p>Thread-safety: immutable, safe to share.
 */
public final class StateVector {
    final double[] re;
    final double[] im;

    StateVector(double[] re, double[] im) {
        this.re = re;
        this.im = im;
    }

    /**
     * Largest dimension of a state vector: that of vec(ρ) for the largest {@link Operator} ({@link Operator#MAX_DIM}²),
     * which is also below every JVM's array-length limit.
     */
    public static final int MAX_DIM = Operator.MAX_DIM * Operator.MAX_DIM;

    /**
     * The basis vector |k⟩ of C^n.
     *
     * @param n the dimension, 1 … {@link #MAX_DIM}
     * @param k the index of the basis vector, 0 … n − 1
     * @return |k⟩
     * @throws InvalidInputException for n &lt; 1, LIMIT_EXCEEDED for n &gt; MAX_DIM, OUT_OF_RANGE for k outside
     *                               0 … n − 1
     */
    public static StateVector unit(int n, int k) {
        Require.positive(n, "n");
        if (n > MAX_DIM) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "n", "a dimension ≤ " + MAX_DIM, n);
        }
        Require.index(k, n, "k");
        double[] r = new double[n];
        r[k] = 1;
        return new StateVector(r, new double[n]);
    }

    /**
     * A vector from its real and imaginary parts (copied, equal lengths, finite).
     *
     * @param re the real parts
     * @param im the imaginary parts
     * @return a vector from its real and imaginary parts (copied, equal lengths, finite)
     */
    public static StateVector of(double[] re, double[] im) {
        Require.nonNull(re, "re");
        Require.nonNull(im, "im");
        if (re.length == 0) {
            throw InvalidInputException.of(Reason.EMPTY, "re", "at least one component", "length 0");
        }
        if (im.length != re.length) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "im", "length " + re.length, "length " + im.length);
        }
        Require.finite(re, "re");
        Require.finite(im, "im");
        return new StateVector(re.clone(), im.clone());
    }

    /**
     * A real vector.
     *
     * @param re the components
     * @return a real vector
     */
    public static StateVector real(double... re) {
        Require.nonNull(re, "re");
        return of(re, new double[re.length]);
    }

    /** @return the dimension */
    public int dim() {
        return re.length;
    }

    /**
     * @param i the index
     * @return Re ψ_i
     */
    public double re(int i) {
        return re[Require.index(i, re.length, "i")];
    }

    /**
     * @param i the index
     * @return Im ψ_i
     */
    public double im(int i) {
        return im[Require.index(i, re.length, "i")];
    }

    /**
     * @param i the index
     * @return ψ_i
     */
    public Complex get(int i) {
        Require.index(i, re.length, "i");
        return new Complex(re[i], im[i]);
    }

    /**
     * @param i the index
     * @return |ψ_i|²
     */
    public double probability(int i) {
        Require.index(i, re.length, "i");
        return re[i] * re[i] + im[i] * im[i];
    }

    /**
     * Copies the components into the caller's arrays (length ≥ n).
     *
     * @param reOut output: the real parts (length ≥ n)
     * @param imOut output: the imaginary parts (length ≥ n)
     */
    public void copyTo(double[] reOut, double[] imOut) {
        Require.nonNull(reOut, "reOut");
        Require.nonNull(imOut, "imOut");
        if (reOut.length < re.length || imOut.length < re.length) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "reOut/imOut", "length >= " + re.length,
                    reOut.length + "/" + imOut.length);
        }
        System.arraycopy(re, 0, reOut, 0, re.length);
        System.arraycopy(im, 0, imOut, 0, im.length);
    }

    /** @return the Euclidean norm */
    public double norm() {
        return Operator.safeNorm(re, im);
    }

    /** @return this vector divided by its norm */
    public StateVector normalized() {
        double s = norm();
        if (s == 0) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "this", "a non-zero vector", "the zero vector");
        }
        // divide rather than multiply by 1/s, which overflows for norms below ~1e-308
        double[] r = new double[re.length], i = new double[re.length];
        for (int k = 0; k < re.length; k++) {
            r[k] = re[k] / s;
            i[k] = im[k] / s;
        }
        return new StateVector(r, i);
    }

    /**
     * @param s the factor
     * @return s·ψ
     */
    public StateVector scale(double s) {
        Require.finite(s, "s");
        double[] r = new double[re.length], i = new double[re.length];
        for (int k = 0; k < re.length; k++) {
            r[k] = s * re[k];
            i[k] = s * im[k];
        }
        return new StateVector(r, i);
    }

    /**
     * @param b the other state
     * @return ψ + φ
     */
    public StateVector plus(StateVector b) {
        Require.nonNull(b, "b");
        Require.sameDim(dim(), b.dim(), "b");
        double[] r = new double[re.length], i = new double[re.length];
        for (int k = 0; k < re.length; k++) {
            r[k] = re[k] + b.re[k];
            i[k] = im[k] + b.im[k];
        }
        return new StateVector(r, i);
    }

    /**
     * @param b the other state
     * @return the inner product ⟨this|b⟩ (conjugate-linear in this)
     */
    public Complex inner(StateVector b) {
        Require.nonNull(b, "b");
        Require.sameDim(dim(), b.dim(), "b");
        double r = 0, i = 0;
        for (int k = 0; k < re.length; k++) {
            r += re[k] * b.re[k] + im[k] * b.im[k];
            i += re[k] * b.im[k] - im[k] * b.re[k];
        }
        return new Complex(r, i);
    }

    /**
     * @param a the operator
     * @return ⟨ψ|A|ψ⟩
     */
    public Complex expectation(Operator a) {
        return inner(apply(a));
    }

    /**
     * @param a the operator
     * @return A|ψ⟩
     */
    public StateVector apply(Operator a) {
        Require.nonNull(a, "a");
        Require.sameDim(dim(), a.n, "a");
        double[] r = new double[re.length], i = new double[re.length];
        Dense.mulVec(a.n, a.re, a.im, re, im, r, i);
        return new StateVector(r, i);
    }

    /** @return the density matrix |ψ⟩⟨ψ| */
    public Operator toDensity() {
        return Operator.outer(this, this);
    }

    /**
     * @param b the other state
     * @return the Euclidean distance ‖ψ − φ‖
     */
    public double distance(StateVector b) {
        Require.nonNull(b, "b");
        Require.sameDim(dim(), b.dim(), "b");
        double s = 0;
        for (int k = 0; k < re.length; k++) {
            double dr = re[k] - b.re[k], di = im[k] - b.im[k];
            s += dr * dr + di * di;
        }
        if (Operator.inRange(s)) {
            return Math.sqrt(s);
        }
        Operator.Ssq q = new Operator.Ssq();
        for (int k = 0; k < re.length; k++) {
            q.add(0.5 * re[k] - 0.5 * b.re[k]);
            q.add(0.5 * im[k] - 0.5 * b.im[k]);
        }
        return 2 * q.value();
    }

    /** Exact componentwise equality (0.0 equals −0.0; use {@link #distance} for approximate comparison). */
    @Override
    public boolean equals(Object o) {
        if (!(o instanceof StateVector)) {
            return false;
        }
        StateVector b = (StateVector) o;
        if (b.re.length != re.length) {
            return false;
        }
        for (int k = 0; k < re.length; k++) {
            if (re[k] != b.re[k] || im[k] != b.im[k]) {
                return false;
            }
        }
        return true;
    }

    @Override
    public int hashCode() {
        return 31 * Operator.zeroSafeHash(re) + Operator.zeroSafeHash(im);
    }

    @Override
    public String toString() {
        double tiny = Operator.noiseFloor(re, im);
        StringBuilder sb = new StringBuilder("StateVector ").append(re.length).append(" [");
        int shown = Math.min(re.length, 16);
        for (int k = 0; k < shown; k++) {
            if (k > 0) {
                sb.append(", ");
            }
            sb.append(Operator.formatEntry(re[k], im[k], tiny));
        }
        if (shown < re.length) {
            sb.append(String.format(Locale.ROOT, ", … (%d more)", re.length - shown));
        }
        return sb.append(']').toString();
    }

    // ------------------------------------------------------------------ added conveniences

    /**
     * @param b the other state
     * @return ψ − φ
     */
    public StateVector minus(StateVector b) {
        Require.nonNull(b, "b");
        Require.sameDim(dim(), b.dim(), "b");
        double[] r = new double[re.length], i = new double[re.length];
        for (int k = 0; k < re.length; k++) {
            r[k] = re[k] - b.re[k];
            i[k] = im[k] - b.im[k];
        }
        return new StateVector(r, i);
    }

    /**
     * @param z the factor
     * @return z·ψ
     */
    public StateVector scale(Complex z) {
        Require.nonNull(z, "z");
        double zr = Require.finite(z.getReal(), "z (real part)"), zi = Require.finite(z.getImaginary(), "z (imaginary part)");
        double[] r = new double[re.length], i = new double[re.length];
        for (int k = 0; k < re.length; k++) {
            r[k] = zr * re[k] - zi * im[k];
            i[k] = zr * im[k] + zi * re[k];
        }
        return new StateVector(r, i);
    }

    /**
     * The tensor product ψ ⊗ φ (this is the left, slower-varying factor, as in {@link Operator#kron}); dimension
     * dim(ψ)·dim(φ), which must fit in a Java array.
     *
     * @param b the other state
     * @return the tensor product ψ ⊗ φ (this is the left, slower-varying factor, as in {@link Operator#kron})
     */
    public StateVector kron(StateVector b) {
        Require.nonNull(b, "b");
        long len = (long) re.length * b.re.length;
        if (len > Integer.MAX_VALUE - 8) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "b", "a product dimension that fits in an array",
                    re.length + " × " + b.re.length);
        }
        int m = b.re.length;
        double[] r = new double[(int) len], i = new double[(int) len];
        for (int p = 0; p < re.length; p++) {
            for (int q = 0; q < m; q++) {
                r[p * m + q] = re[p] * b.re[q] - im[p] * b.im[q];
                i[p * m + q] = re[p] * b.im[q] + im[p] * b.re[q];
            }
        }
        return new StateVector(r, i);
    }

    /** @return the probabilities |ψ_k|², k = 0 … n−1 (a new array) */
    public double[] probabilities() {
        double[] p = new double[re.length];
        for (int k = 0; k < re.length; k++) {
            p[k] = re[k] * re[k] + im[k] * im[k];
        }
        return p;
    }
}
