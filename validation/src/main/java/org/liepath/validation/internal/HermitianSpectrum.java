package org.liepath.validation.internal;

import org.liepath.core.Operator;
import org.liepath.core.internal.HermitianEigen;

import java.util.function.DoubleUnaryOperator;

/**
 * Eigenvalues and matrix functions f(H) = V f(Λ) V† of the Hermitian part of a matrix, on top of core's Hermitian
 * eigen-solver (Householder tridiagonalisation + implicit QL). Immutable once built; each call to {@link #of}
 * uses its own workspace, so instances may be shared between threads. Cost O(n³). Not part of the public API.
 */
public final class HermitianSpectrum {
    private final int n;
    private final double[] values;       // ascending
    private final double[] vr, vi;       // column j = eigenvector of values[j], planar row-major

    private HermitianSpectrum(int n, double[] values, double[] vr, double[] vi) {
        this.n = n;
        this.values = values;
        this.vr = vr;
        this.vi = vi;
    }

    /**
     * Decomposes (H + H†)/2.
     *
     * @throws IllegalStateException if the QL iteration does not converge (not observed in practice)
     */
    public static HermitianSpectrum of(Operator h) {
        int n = h.dim();
        double[] hr = new double[n * n], hi = new double[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                // the Hermitian part: defined for any input, and what a Hermitian solver must see
                hr[i * n + j] = 0.5 * (h.re(i, j) + h.re(j, i));
                hi[i * n + j] = 0.5 * (h.im(i, j) - h.im(j, i));
            }
        }
        double[] lambda = new double[n], vr = new double[n * n], vi = new double[n * n];
        if (!new HermitianEigen(n).compute(hr, hi, lambda, vr, vi)) {
            throw new IllegalStateException("Hermitian eigen-solver did not converge for a " + n + "x" + n + " matrix");
        }
        return new HermitianSpectrum(n, lambda, vr, vi);
    }

    /** @return the eigenvalues, ascending (a fresh copy) */
    public double[] values() {
        return values.clone();
    }

    /** @return the smallest eigenvalue */
    public double min() {
        return values[0];
    }

    /** @return the largest absolute eigenvalue (the spectral norm) */
    public double spectralNorm() {
        return Math.max(Math.abs(values[0]), Math.abs(values[n - 1]));
    }

    /** @return f(H) = V f(Λ) V†, Hermitian */
    public Operator apply(DoubleUnaryOperator f) {
        double[] fl = new double[n];
        for (int k = 0; k < n; k++) {
            fl[k] = f.applyAsDouble(values[k]);
        }
        double[] re = new double[n * n], im = new double[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double a = 0, b = 0;
                for (int k = 0; k < n; k++) {
                    // V_ik f_k conj(V_jk)
                    double xr = vr[i * n + k], xi = vi[i * n + k], yr = vr[j * n + k], yi = -vi[j * n + k];
                    a += fl[k] * (xr * yr - xi * yi);
                    b += fl[k] * (xr * yi + xi * yr);
                }
                re[i * n + j] = a;
                im[i * n + j] = b;
            }
        }
        return Operator.ofPlanar(n, re, im);
    }
}
