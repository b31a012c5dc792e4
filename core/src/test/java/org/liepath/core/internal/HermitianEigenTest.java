package org.liepath.core.internal;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;
import org.liepath.testing.Seeds;

import java.util.Arrays;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link HermitianEigen} against Apache Commons Math's real symmetric eigensolver (an independent implementation),
 * against the real 2n×2n embedding for complex inputs, and on degenerate spectra with known eigenvalues.
 *
 * <p>Tolerances: Householder tridiagonalisation and the QL iteration are backward stable, so the computed
 * eigenvalues are exact for a matrix within c(n)·u·‖H‖ of H (Golub, Van Loan, Matrix Computations, 4th ed. 2013,
 * §8.3.6 and §8.3.7; c(n) a low-degree polynomial, in practice about n) and by Weyl's inequality each eigenvalue is
 * off by at most that much; the residual ‖HV − VΛ‖_F and ‖V†V − I‖_F are of the same order. We allow
 * 10·n·u·‖H‖_F (resp. 10·n·u) and observe 1–3·n·u.
 */
class HermitianEigenTest {
    private static final double U = 0x1p-53;

    /** Decomposition plus the two defect measures, relative to ‖H‖_F. */
    record Decomp(double[] lambda, double[] vr, double[] vi, double residual, double orthogonality) {
    }

    static Decomp decompose(int n, double[] hr, double[] hi) {
        double[] lambda = new double[n], vr = new double[n * n], vi = new double[n * n];
        double[] hrc = hr.clone(), hic = hi.clone();
        assertTrue(new HermitianEigen(n).compute(hr, hi, lambda, vr, vi));
        assertTrue(Arrays.equals(hr, hrc) && Arrays.equals(hi, hic), "input untouched");
        double[] cr = new double[n * n], ci = new double[n * n];
        Dense.mul(n, hr, hi, vr, vi, cr, ci);
        double res = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double a = cr[i * n + j] - vr[i * n + j] * lambda[j], b = ci[i * n + j] - vi[i * n + j] * lambda[j];
                res += a * a + b * b;
            }
        }
        double norm = Math.max(Dense.frobenius(n * n, hr, hi), Double.MIN_NORMAL);
        return new Decomp(lambda, vr, vi, Math.sqrt(res) / norm, unitarityDefect(n, vr, vi));
    }

    /** ‖V†V − I‖_F. */
    static double unitarityDefect(int n, double[] vr, double[] vi) {
        double s = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double re = 0, im = 0;
                for (int k = 0; k < n; k++) {
                    // conj(V_ki) V_kj
                    double ar = vr[k * n + i], ai = vi[k * n + i], br = vr[k * n + j], bi = vi[k * n + j];
                    re += ar * br + ai * bi;
                    im += ar * bi - ai * br;
                }
                if (i == j) {
                    re -= 1;
                }
                s += re * re + im * im;
            }
        }
        return Math.sqrt(s);
    }

    private static void assertSorted(double[] lambda) {
        for (int i = 1; i < lambda.length; i++) {
            assertTrue(lambda[i] >= lambda[i - 1], "ascending at " + i);
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void realSymmetricAgainstCommonsMath(long seed) {
        Random r = new Random(seed);
        int n = 1 + r.nextInt(30);
        double[][] rows = new double[n][n];
        double[] hr = new double[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double x = r.nextGaussian();
                rows[i][j] = rows[j][i] = x;
                hr[i * n + j] = hr[j * n + i] = x;
            }
        }
        Decomp d = decompose(n, hr, new double[n * n]);
        // Apache Commons Math 3.6.1 EigenDecomposition (Householder + QL of its own, a general-purpose library)
        double[] ref = new EigenDecomposition(new Array2DRowRealMatrix(rows)).getRealEigenvalues().clone();
        Arrays.sort(ref);
        double norm = Dense.frobenius(n * n, hr, new double[n * n]);
        double tol = 10 * n * U * norm;
        assertSorted(d.lambda());
        for (int k = 0; k < n; k++) {
            assertEquals(ref[k], d.lambda()[k], tol, "eigenvalue " + k + " of n = " + n);
        }
        assertTrue(d.residual() <= 10 * n * U, "residual " + d.residual());
        assertTrue(d.orthogonality() <= 10 * n * U, "orthogonality " + d.orthogonality());
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void complexAgainstRealEmbedding(long seed) {
        // H = A + iB Hermitian ↔ the real symmetric [[A, −B], [B, A]], whose spectrum is that of H with every
        // eigenvalue doubled (e.g. Golub, Van Loan, Matrix Computations, 4th ed., §8.1 problems [from memory]; a
        // direct check: (x, y) ↦ [[A, −B], [B, A]] (x, y) is multiplication by H on x + iy, and (−y, x) ↔ i(x + iy)).
        Random r = new Random(seed);
        int n = 1 + r.nextInt(25);
        Operator h = Seeds.randomHermitian(r, n);
        double[] hr = h.reArray(), hi = h.imArray();
        double[][] big = new double[2 * n][2 * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                big[i][j] = big[n + i][n + j] = hr[i * n + j];
                big[i][n + j] = -hi[i * n + j];
                big[n + i][j] = hi[i * n + j];
            }
        }
        double[] ref = new EigenDecomposition(new Array2DRowRealMatrix(big)).getRealEigenvalues().clone();
        Arrays.sort(ref);
        Decomp d = decompose(n, hr, hi);
        double tol = 20 * n * U * h.norm(); // the embedding doubles the dimension of Commons Math's problem
        assertSorted(d.lambda());
        for (int k = 0; k < n; k++) {
            assertEquals(ref[2 * k], d.lambda()[k], tol, "eigenvalue " + k);
            assertEquals(ref[2 * k + 1], d.lambda()[k], tol, "eigenvalue " + k + " (its double)");
        }
        assertTrue(d.residual() <= 10 * n * U, "residual " + d.residual());
        assertTrue(d.orthogonality() <= 10 * n * U, "orthogonality " + d.orthogonality());
    }

    @ParameterizedTest(name = "j = {0}")
    @ValueSource(doubles = {0.5, 1, 1.5, 3, 7.5, 20})
    void spinComponentsHaveSpectrumMinusJToJ(double j) {
        // Jx, Jy, Jz of spin j all have eigenvalues m = −j, …, j (angular momentum theory, e.g. J.J. Sakurai,
        // Modern Quantum Mechanics, §3.5); Jx and Jy are tridiagonal with complex entries (Jy), Jz is diagonal.
        Spin s = Spin.of(j);
        int n = (int) Math.round(2 * j + 1);
        for (Operator op : new Operator[]{s.x(), s.y(), s.z()}) {
            Decomp d = decompose(n, op.reArray(), op.imArray());
            for (int k = 0; k < n; k++) {
                assertEquals(-j + k, d.lambda()[k], 10 * n * U * Math.max(1, op.norm()), "m index " + k);
            }
            assertTrue(d.residual() <= 10 * n * U && d.orthogonality() <= 10 * n * U);
        }
        // Jx² + Jy² + Jz² = j(j+1) I: a fully degenerate spectrum
        Operator casimir = s.x().times(s.x()).plus(s.y().times(s.y())).plus(s.z().times(s.z()));
        Decomp d = decompose(n, casimir.reArray(), casimir.imArray());
        for (int k = 0; k < n; k++) {
            assertEquals(j * (j + 1), d.lambda()[k], 10 * n * U * casimir.norm());
        }
        assertTrue(d.orthogonality() <= 10 * n * U);
    }

    @Test
    void degenerateSpectra() {
        // identity: every eigenvalue 1; Pauli strings: eigenvalues ±1, each with multiplicity 2^(q−1)
        // (P² = I and tr P = 0 for a non-identity string)
        for (int n : new int[]{1, 2, 5, 16}) {
            Decomp d = decompose(n, Operator.identity(n).reArray(), new double[n * n]);
            for (double l : d.lambda()) {
                assertEquals(1.0, l, 0.0);
            }
            assertEquals(0.0, d.orthogonality(), 0.0);
        }
        for (String p : new String[]{"X", "Y", "XZ", "YY", "XYZ", "ZIZI", "XXYZ", "YXZYX"}) {
            Operator op = Pauli.string(p);
            int n = op.dim();
            Decomp d = decompose(n, op.reArray(), op.imArray());
            for (int k = 0; k < n; k++) {
                assertEquals(k < n / 2 ? -1.0 : 1.0, d.lambda()[k], 10 * n * U * Math.sqrt(n), p + " eigenvalue " + k);
            }
            assertTrue(d.residual() <= 10 * n * U && d.orthogonality() <= 10 * n * U, p);
        }
        // zero matrix
        Decomp z = decompose(3, new double[9], new double[9]);
        assertEquals(0.0, z.lambda()[2], 0.0);
        assertEquals(0.0, z.orthogonality(), 0.0);
    }

    @Test
    void extremeScalesNeitherOverflowNorUnderflow() {
        // the input is scaled by its largest entry before the reduction: eigenvalues of s·H are s·λ(H) for s
        // near the ends of the double range (a property of the eigenvalue map, no reference needed)
        Random r = new Random(11);
        int n = 7;
        Operator h = Seeds.randomHermitian(r, n);
        Decomp base = decompose(n, h.reArray(), h.imArray());
        for (double s : new double[]{1e-300, 1e300}) {
            Decomp d = decompose(n, h.scale(s).reArray(), h.scale(s).imArray());
            for (int k = 0; k < n; k++) {
                assertEquals(base.lambda()[k] * s, d.lambda()[k], 10 * n * U * h.norm() * s);
            }
            assertTrue(d.orthogonality() <= 10 * n * U);
        }
    }

    @Test
    void tridiagonalSolverOnTheSecondDifferenceMatrix() {
        // tridiag(−1, 2, −1) of order m has eigenvalues 2 − 2cos(kπ/(m+1)), k = 1..m (a classical closed form,
        // e.g. G. Strang, Computational Science and Engineering, Wellesley-Cambridge 2007, §1.5 [from memory])
        int m = 40;
        double[] d = new double[m], e = new double[m], zt = new double[m * m];
        Arrays.fill(d, 2);
        Arrays.fill(e, -1);
        for (int i = 0; i < m; i++) {
            zt[i * m + i] = 1;
        }
        assertTrue(HermitianEigen.tridiagonalEigen(m, d, e, zt, m));
        HermitianEigen.sortAscending(m, d, zt, m);
        for (int k = 1; k <= m; k++) {
            assertEquals(2 - 2 * Math.cos(k * Math.PI / (m + 1)), d[k - 1], 10 * m * U * 4);
        }
    }
}
