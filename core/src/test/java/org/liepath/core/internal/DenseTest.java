package org.liepath.core.internal;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The dense kernels against their definitions: the product against the textbook triple loop with
 * compensation-free summation, the LU solve by its residual (partial pivoting is backward stable in practice:
 * ‖A X − B‖ ≲ c n u ‖A‖ ‖X‖; Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed. SIAM 2002, Thm. 9.4).
 */
class DenseTest {
    private static final double U = 0x1p-53;

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void productMatchesDefinitionForEverySmallSize(long seed) {
        Random r = new Random(seed);
        for (int n = 1; n <= 20; n++) {
            double[] ar = gauss(r, n * n), ai = gauss(r, n * n), br = gauss(r, n * n), bi = gauss(r, n * n);
            if (r.nextBoolean()) {
                ar[r.nextInt(n * n)] = 0; // exercise the zero-skipping path
                ai[r.nextInt(n * n)] = 0;
            }
            double[] cr = new double[n * n], ci = new double[n * n];
            Dense.mul(n, ar, ai, br, bi, cr, ci);
            double err = 0, scale = 0;
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    double sr = 0, si = 0;
                    for (int k = 0; k < n; k++) {
                        sr += ar[i * n + k] * br[k * n + j] - ai[i * n + k] * bi[k * n + j];
                        si += ar[i * n + k] * bi[k * n + j] + ai[i * n + k] * br[k * n + j];
                    }
                    err = Math.max(err, Math.abs(sr - cr[i * n + j]) + Math.abs(si - ci[i * n + j]));
                    scale = Math.max(scale, Math.abs(sr) + Math.abs(si));
                }
            }
            // two summation orders of n terms of size O(1) differ by ≲ 2 n u Σ|terms| ≈ 2 n u · 2n
            assertTrue(err <= 8 * n * n * U, "n = " + n + ": " + err);
            // y = A x against the product with a one-column matrix
            double[] xr = gauss(r, n), xi = gauss(r, n), yr = new double[n], yi = new double[n];
            Dense.mulVec(n, ar, ai, xr, xi, yr, yi);
            for (int i = 0; i < n; i++) {
                double sr = 0, si = 0;
                for (int k = 0; k < n; k++) {
                    sr += ar[i * n + k] * xr[k] - ai[i * n + k] * xi[k];
                    si += ar[i * n + k] * xi[k] + ai[i * n + k] * xr[k];
                }
                assertTrue(Math.abs(sr - yr[i]) + Math.abs(si - yi[i]) <= 8 * n * n * U, "mulVec n = " + n);
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void solveHasSmallResidual(long seed) {
        Random r = new Random(seed);
        int n = 1 + r.nextInt(40);
        double[] ar = gauss(r, n * n), ai = gauss(r, n * n), br = gauss(r, n * n), bi = gauss(r, n * n);
        double[] fr = ar.clone(), fi = ai.clone(), xr = br.clone(), xi = bi.clone();
        assertTrue(Dense.solveInPlace(n, fr, fi, xr, xi, new int[n]));
        double[] pr = new double[n * n], pi = new double[n * n];
        Dense.mul(n, ar, ai, xr, xi, pr, pi);
        for (int k = 0; k < n * n; k++) {
            pr[k] -= br[k];
            pi[k] -= bi[k];
        }
        double res = Dense.frobenius(n * n, pr, pi);
        double bound = 10 * n * U * Dense.frobenius(n * n, ar, ai) * Dense.frobenius(n * n, xr, xi);
        assertTrue(res <= bound, "n = " + n + ": residual " + res + " > " + bound);
    }

    @org.junit.jupiter.api.Test
    void blockedProductMatchesDefinition() {
        // n = 131: the k loop runs in blocks of 62 rows with an odd remainder
        Random r = new Random(131);
        int n = 131;
        double[] ar = gauss(r, n * n), ai = gauss(r, n * n), br = gauss(r, n * n), bi = gauss(r, n * n);
        double[] cr = new double[n * n], ci = new double[n * n];
        Dense.mul(n, ar, ai, br, bi, cr, ci);
        double err = 0;
        for (int i = 0; i < n; i += 13) {
            for (int j = 0; j < n; j++) {
                double sr = 0, si = 0;
                for (int k = 0; k < n; k++) {
                    sr += ar[i * n + k] * br[k * n + j] - ai[i * n + k] * bi[k * n + j];
                    si += ar[i * n + k] * bi[k * n + j] + ai[i * n + k] * br[k * n + j];
                }
                err = Math.max(err, Math.abs(sr - cr[i * n + j]) + Math.abs(si - ci[i * n + j]));
            }
        }
        assertTrue(err <= 8 * n * n * U, "error " + err);
    }

    @org.junit.jupiter.api.Test
    void norm1DoesNotOverflowForHugeFiniteEntries() {
        // |3e200 + 4e200 i| = 5e200 (the modulus squared would overflow)
        double norm = Dense.norm1(2, new double[]{3e200, 0, 0, 1}, new double[]{4e200, 0, 0, 0});
        org.junit.jupiter.api.Assertions.assertEquals(5e200, norm, 1e185);
        org.junit.jupiter.api.Assertions.assertEquals(5.0, Dense.norm1(2, new double[]{3, 0, 0, 1},
                new double[]{4, 0, 0, 0}), 1e-15);
    }

    private static double[] gauss(Random r, int len) {
        double[] a = new double[len];
        for (int k = 0; k < len; k++) {
            a[k] = r.nextGaussian();
        }
        return a;
    }
}
