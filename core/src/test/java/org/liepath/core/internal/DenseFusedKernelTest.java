package org.liepath.core.internal;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.math.BigDecimal;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The fused multiply–add product kernel {@link Dense#fused} and the fused LU updates of {@link Dense#solveInPlace},
 * called directly so that both kernels are tested whatever this machine's {@link Dense#FUSED} says, against exact
 * (BigDecimal) products and against the plain kernel.
 */
class DenseFusedKernelTest {
    private static final double U = 0x1p-53;

    private static double[] random(Random r, int len, double sparsity) {
        double[] x = new double[len];
        for (int k = 0; k < len; k++) {
            x[k] = r.nextDouble() < sparsity ? 0.0 : r.nextGaussian();
        }
        return x;
    }

    /**
     * The exact product rounded once to double (every double product is exact in BigDecimal, so is their sum), and
     * Σ_k |a_ik||b_kj| for the error bound.
     */
    private static double[][] exact(int n, double[] ar, double[] ai, double[] br, double[] bi) {
        double[] cr = new double[n * n], ci = new double[n * n], abs = new double[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                BigDecimal re = BigDecimal.ZERO, im = BigDecimal.ZERO;
                double s = 0;
                for (int k = 0; k < n; k++) {
                    BigDecimal xr = new BigDecimal(ar[i * n + k]), xi = new BigDecimal(ai[i * n + k]);
                    BigDecimal yr = new BigDecimal(br[k * n + j]), yi = new BigDecimal(bi[k * n + j]);
                    re = re.add(xr.multiply(yr)).subtract(xi.multiply(yi));
                    im = im.add(xr.multiply(yi)).add(xi.multiply(yr));
                    s += Math.hypot(ar[i * n + k], ai[i * n + k]) * Math.hypot(br[k * n + j], bi[k * n + j]);
                }
                cr[i * n + j] = re.doubleValue();
                ci[i * n + j] = im.doubleValue();
                abs[i * n + j] = s;
            }
        }
        return new double[][]{cr, ci, abs};
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void fusedAndPlainProductsAreWithinTheDotProductBoundOfTheExactOne(long seed) {
        // Bound: a complex inner product of length n is a real one of length 2n per plane; with fused or plain
        // multiply–adds its error is at most γ_{2n} Σ_k |x_k||y_k| per plane (N.J. Higham, Accuracy and Stability
        // of Numerical Algorithms, 2nd ed., SIAM 2002, §3.1 and §3.6; a fused step rounds once, a plain one twice,
        // so γ_{2n} covers both), plus the final rounding u|c| of the reference.
        Random r = new Random(seed);
        int n = 5 + r.nextInt(36); // the exact reference costs n³ BigDecimal products: sizes up to 40 here
        if (r.nextInt(3) == 0) {
            n = 5 + r.nextInt(6); // small odd and even edges more often
        }
        double sparsity = r.nextInt(4) == 0 ? 0.6 : 0.0;
        int len = n * n;
        double[] ar = random(r, len, sparsity), ai = random(r, len, sparsity), br = random(r, len, 0),
                bi = random(r, len, 0);
        double[][] want = exact(n, ar, ai, br, bi);
        double gamma = 2 * n * U / (1 - 2 * n * U);
        for (boolean fused : new boolean[]{true, false}) {
            double[] cr = new double[len], ci = new double[len];
            java.util.Arrays.fill(cr, Double.NaN); // every entry must be written
            if (fused) {
                Dense.fused(n, false, ar, ai, br, bi, cr, ci);
            } else {
                Dense.plain(n, false, ar, ai, br, bi, cr, ci);
            }
            for (int k = 0; k < len; k++) {
                double tol = gamma * want[2][k] + U * Math.max(Math.abs(want[0][k]), Math.abs(want[1][k]));
                int q = k;
                String what = (fused ? "fused" : "plain") + " n = " + n + ", entry " + q;
                assertTrue(Math.abs(cr[k] - want[0][k]) <= tol, () -> what + " re");
                assertTrue(Math.abs(ci[k] - want[1][k]) <= tol, () -> what + " im");
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void fusedUpperTriangleIsTheFusedFullProductBitForBit(long seed) {
        // the kernel gives every entry the same fused sequence in k order whatever block holds it (documented), so
        // the triangle variant must reproduce the full product on and above the diagonal exactly, odd n included
        Random r = new Random(seed);
        int n = 5 + r.nextInt(Dense.FUSED_MAX - 4);
        int len = n * n;
        double[] ar = random(r, len, 0.3), ai = random(r, len, 0.3), br = random(r, len, 0), bi = random(r, len, 0);
        double[] fr = new double[len], fi = new double[len], ur = new double[len], ui = new double[len];
        Dense.fused(n, false, ar, ai, br, bi, fr, fi);
        Dense.fused(n, true, ar, ai, br, bi, ur, ui);
        for (int i = 0; i < n; i++) {
            for (int j = i; j < n; j++) {
                int k = i * n + j;
                assertTrue(fr[k] == ur[k] && fi[k] == ui[k], "n = " + n + ", entry (" + i + ", " + j + ")");
            }
        }
    }

    @Test
    void smallIntegerProductsAreExactInBothKernels() {
        // integer entries below 2^10 give sums below 2^53: every intermediate is exact, fused or not
        Random r = new Random(5);
        for (int n = 5; n <= 13; n++) {
            int len = n * n;
            double[] ar = new double[len], ai = new double[len], br = new double[len], bi = new double[len];
            for (int k = 0; k < len; k++) {
                ar[k] = r.nextInt(2001) - 1000;
                ai[k] = r.nextInt(2001) - 1000;
                br[k] = r.nextInt(2001) - 1000;
                bi[k] = r.nextInt(2001) - 1000;
            }
            double[][] want = exact(n, ar, ai, br, bi);
            double[] cr = new double[len], ci = new double[len], pr = new double[len], pi = new double[len];
            Dense.fused(n, false, ar, ai, br, bi, cr, ci);
            Dense.plain(n, false, ar, ai, br, bi, pr, pi);
            for (int k = 0; k < len; k++) {
                assertEquals(want[0][k], cr[k], 0.0, "fused re");
                assertEquals(want[1][k], ci[k], 0.0, "fused im");
                assertEquals(want[0][k], pr[k], 0.0, "plain re");
                assertEquals(want[1][k], pi[k], 0.0, "plain im");
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void fusedAndPlainSolvesHaveBackwardStableResiduals(long seed) {
        // LU with partial pivoting is backward stable: ‖A X − B‖ ≲ c n u ‖A‖ ‖X‖ (N.J. Higham, Accuracy and Stability
        // of Numerical Algorithms, 2nd ed., SIAM 2002, Thm. 9.4 and §9.4 [the growth factor is small for these
        // diagonally weighted random matrices]); c = 8 covers complex arithmetic in either kernel
        Random r = new Random(seed);
        int n = 1 + r.nextInt(24);
        int len = n * n;
        double[] ar = random(r, len, 0), ai = random(r, len, 0), br = random(r, len, 0), bi = random(r, len, 0);
        for (int i = 0; i < n; i++) {
            ar[i * n + i] += n;
        }
        for (boolean fused : new boolean[]{true, false}) {
            double[] fr = ar.clone(), fi = ai.clone(), xr = br.clone(), xi = bi.clone();
            assertTrue(Dense.solveInPlace(n, fr, fi, xr, xi, new int[n], fused));
            double[] rr = new double[len], ri = new double[len];
            Dense.plain(n, false, ar, ai, xr, xi, rr, ri);
            double res = 0;
            for (int k = 0; k < len; k++) {
                res = Math.hypot(res, Math.hypot(rr[k] - br[k], ri[k] - bi[k]));
            }
            double bound = 8 * n * U * Dense.frobenius(len, ar, ai) * Dense.frobenius(len, xr, xi);
            assertTrue(res <= bound, (fused ? "fused" : "plain") + " n = " + n + ": residual " + res + " > " + bound);
        }
    }
}
