package org.liepath.validation.internal;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.liepath.core.Operator;

import java.util.Arrays;
import java.util.function.DoubleUnaryOperator;

/**
 * Eigenvalues and matrix functions of a Hermitian matrix H = A + iB through its real symmetric 2n×2n embedding
 * M = [[A, −B], [B, A]], diagonalised by Commons Math's symmetric eigen-solver.
 *
 * <p>Why the embedding: it is a real algebra homomorphism, so f(M) is the embedding of f(H) for any real function f
 * of the spectrum, and every eigenvalue of H appears exactly twice in M. Reading f(H) off the blocks of f(M) avoids
 * having to pair degenerate complex eigenvectors. Cost O((2n)³) — eight times a direct complex solver; fine for the
 * validation sizes (n ≤ 64). Not part of the public API.
 */
public final class HermitianSpectrum {
    private final int n;
    private final double[] values;       // ascending, each eigenvalue of H once
    private final EigenDecomposition eig;

    private HermitianSpectrum(int n, double[] values, EigenDecomposition eig) {
        this.n = n;
        this.values = values;
        this.eig = eig;
    }

    /** Decomposes the Hermitian part (H + H†)/2 of the argument. */
    public static HermitianSpectrum of(Operator h) {
        int n = h.dim();
        double[][] m = new double[2 * n][2 * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double a = 0.5 * (h.re(i, j) + h.re(j, i));
                double b = 0.5 * (h.im(i, j) - h.im(j, i));
                m[i][j] = a;
                m[i + n][j + n] = a;
                m[i][j + n] = -b;
                m[i + n][j] = b;
            }
        }
        EigenDecomposition eig = new EigenDecomposition(new Array2DRowRealMatrix(m, false));
        double[] all = eig.getRealEigenvalues().clone();
        Arrays.sort(all);
        double[] values = new double[n];
        for (int k = 0; k < n; k++) {
            // the doubled eigenvalues sit next to each other after sorting; average the pair against rounding
            values[k] = 0.5 * (all[2 * k] + all[2 * k + 1]);
        }
        return new HermitianSpectrum(n, values, eig);
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
        RealMatrix v = eig.getV();
        double[] lam = eig.getRealEigenvalues();
        int m = 2 * n;
        double[] fl = new double[m];
        for (int k = 0; k < m; k++) {
            fl[k] = f.applyAsDouble(lam[k]);
        }
        double[] re = new double[n * n], im = new double[n * n];
        double[][] vd = v.getData();
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double a = 0, b = 0;
                for (int k = 0; k < m; k++) {
                    a += vd[i][k] * fl[k] * vd[j][k];
                    b += vd[i + n][k] * fl[k] * vd[j][k];
                }
                re[i * n + j] = a;
                im[i * n + j] = b;
            }
        }
        return Operator.ofPlanar(n, re, im);
    }
}
