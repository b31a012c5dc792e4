package org.liepath.core.internal;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The half-cost products {@link Dense#mulHermitian} and {@link Dense#mulAntiHermitian} against the full product
 * {@link Dense#mul} on factors whose product is Hermitian (resp. anti-Hermitian) in exact arithmetic.
 */
class DenseStructuredProductTest {
    private static final double U = 0x1p-53;
    private static final int[] DIMS = {1, 2, 3, 4, 5, 6, 7, 8, 16, 17, 33, 64};

    /** A random Hermitian matrix with entries of independent standard normal parts (diagonal real). */
    static double[][] hermitian(Random r, int n) {
        double[] hr = new double[n * n], hi = new double[n * n];
        for (int i = 0; i < n; i++) {
            hr[i * n + i] = r.nextGaussian();
            for (int j = i + 1; j < n; j++) {
                double x = r.nextGaussian(), y = r.nextGaussian();
                hr[i * n + j] = x;
                hr[j * n + i] = x;
                hi[i * n + j] = y;
                hi[j * n + i] = -y;
            }
        }
        return new double[][]{hr, hi};
    }

    /** A random Hermitian matrix with small integer entries, so that its low powers are exact in double. */
    private static double[][] integerHermitian(Random r, int n) {
        double[] hr = new double[n * n], hi = new double[n * n];
        for (int i = 0; i < n; i++) {
            hr[i * n + i] = r.nextInt(9) - 4;
            for (int j = i + 1; j < n; j++) {
                double x = r.nextInt(9) - 4, y = r.nextInt(9) - 4;
                hr[i * n + j] = x;
                hr[j * n + i] = x;
                hi[i * n + j] = y;
                hi[j * n + i] = -y;
            }
        }
        return new double[][]{hr, hi};
    }

    /** i·X (exact: a swap of the planes and one negation). */
    private static double[][] timesI(double[][] x) {
        double[] re = x[1].clone(), im = x[0].clone();
        for (int k = 0; k < re.length; k++) {
            re[k] = -re[k];
        }
        return new double[][]{re, im};
    }

    private static double[][] full(int n, double[][] a, double[][] b) {
        double[] cr = new double[n * n], ci = new double[n * n];
        Dense.mul(n, a[0], a[1], b[0], b[1], cr, ci);
        return new double[][]{cr, ci};
    }

    private static double[][] structured(int n, double[][] a, double[][] b, boolean hermitian) {
        double[] cr = new double[n * n], ci = new double[n * n];
        // stale values in the output must not leak into the result
        java.util.Arrays.fill(cr, Double.NaN);
        java.util.Arrays.fill(ci, Double.NaN);
        if (hermitian) {
            Dense.mulHermitian(n, a[0], a[1], b[0], b[1], cr, ci);
        } else {
            Dense.mulAntiHermitian(n, a[0], a[1], b[0], b[1], cr, ci);
        }
        return new double[][]{cr, ci};
    }

    /** Exact (anti-)Hermitian structure: c_ji = ±conj(c_ij) bit for bit, with the diagonal exactly real / imaginary. */
    private static void assertExactStructure(int n, double[][] c, boolean hermitian, String what) {
        double sign = hermitian ? 1 : -1;
        for (int i = 0; i < n; i++) {
            double diag = hermitian ? c[1][i * n + i] : c[0][i * n + i];
            assertTrue(diag == 0, what + ": diagonal part that must vanish is " + diag + " at " + i);
            for (int j = i + 1; j < n; j++) {
                assertTrue(c[0][j * n + i] == sign * c[0][i * n + j] && c[1][j * n + i] == -sign * c[1][i * n + j],
                    what + ": mirror broken at (" + j + ", " + i + ")");
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void upperTriangleIsTheFullProductBitForBitAndTheLowerItsMirror(long seed) {
        // Reference: the full product Dense.mul. The structured kernels form each entry (i ≤ j) with the same sums
        // in the same order (they document this), so the upper triangles agree exactly. The lower triangle of the
        // full product is the product's rounded (j, i) entry, the mirror the conjugate of the rounded (i, j) one;
        // both are within γ_n (|A||B|)_ij of the exact, equal values (complex inner products, N.J. Higham, Accuracy
        // and Stability of Numerical Algorithms, 2nd ed., SIAM 2002, §3.5 and §3.6: γ_n ≈ n u, with a factor of
        // at most √2·2 for complex arithmetic), so they differ by at most 2·2√2 γ_{n+2} (|A||B|)_ij.
        Random r = new Random(seed);
        int n = DIMS[r.nextInt(DIMS.length)];
        double[][] h = hermitian(r, n);
        boolean herm = r.nextBoolean();
        // Hermitian result: H·H; anti-Hermitian result: (iH)·H = iH². Both factor pairs commute exactly.
        double[][] a = herm ? h : timesI(h);
        double[][] c = structured(n, a, h, herm);
        double[][] f = full(n, a, h);
        assertExactStructure(n, c, herm, "n = " + n);
        double[] absA = new double[n * n], absB = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            absA[k] = Math.hypot(a[0][k], a[1][k]);
            absB[k] = Math.hypot(h[0][k], h[1][k]);
        }
        double gamma = (n + 2) * U / (1 - (n + 2) * U);
        for (int i = 0; i < n; i++) {
            for (int j = i; j < n; j++) {
                int ij = i * n + j, ji = j * n + i;
                double bound = 0;
                for (int k = 0; k < n; k++) {
                    bound += absA[j * n + k] * absB[k * n + i];
                }
                bound *= 4 * Math.sqrt(2) * gamma;
                if (i != j) {
                    assertTrue(c[0][ij] == f[0][ij] && c[1][ij] == f[1][ij], "upper entry (" + i + ", " + j + ")");
                } else {
                    // the diagonal's kept plane is the full product's; the other is exactly 0 in the structured
                    // result, while the full product leaves a rounding residue there when its kernel fuses
                    // multiply–adds (the two products that cancel are then rounded differently)
                    int kept = herm ? 0 : 1;
                    assertTrue(c[kept][ij] == f[kept][ij], "diagonal entry " + i);
                    assertTrue(Math.abs(f[1 - kept][ij]) <= bound, "full product's vanishing plane at " + i);
                }
                double d = Math.hypot(c[0][ji] - f[0][ji], c[1][ji] - f[1][ji]);
                assertTrue(d <= bound, "n = " + n + ", lower entry (" + j + ", " + i + "): " + d + " > " + bound);
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void productsOfExactPowersAreExact(long seed) {
        // Powers of a Hermitian H with integer parts in [−4, 4] are exact in double up to H⁴ for n ≤ 64: every
        // partial sum is an integer below n³·(4√2)⁴ ≈ 2.7e8 ≪ 2^53. So H²·H (Hermitian), (iH²)·H (anti-Hermitian)
        // and H²·H² are formed exactly by every kernel, and the structured ones must equal the full product on
        // every entry, lower triangle included (common practice: integer data makes floating-point products exact).
        Random r = new Random(seed);
        int n = DIMS[r.nextInt(DIMS.length)];
        double[][] h = integerHermitian(r, n);
        double[][] h2 = full(n, h, h);
        for (boolean herm : new boolean[]{true, false}) {
            double[][] a = herm ? h2 : timesI(h2);
            double[][] c = structured(n, a, h, herm);
            double[][] f = full(n, a, h);
            for (int k = 0; k < n * n; k++) {
                // == rather than bit equality: the full product may give −0.0 where the mirror sets +0.0
                assertTrue(c[0][k] == f[0][k] && c[1][k] == f[1][k], "n = " + n + ", entry " + k);
            }
            assertExactStructure(n, c, herm, "n = " + n);
            double[][] c2 = structured(n, h2, h2, true);
            double[][] f2 = full(n, h2, h2);
            for (int k = 0; k < n * n; k++) {
                assertTrue(c2[0][k] == f2[0][k] && c2[1][k] == f2[1][k], "H²·H², n = " + n + ", entry " + k);
            }
        }
    }

    @Test
    void pauliProductsGiveTheirClosedForms() {
        // σ_y² = I, hence (iσ_y)·σ_y = iI (Pauli algebra σ_a σ_b = δ_ab I + i ε_abc σ_c; e.g. J.J. Sakurai, Modern
        // Quantum Mechanics, rev. ed., Addison-Wesley 1994, eq. (3.2.34) [from memory]); embedded as σ_y ⊗ I₂ to
        // reach the unrolled 4×4 kernel, as σ_y ⊗ I₄ for the general one.
        for (int n : new int[]{4, 8}) {
            int half = n / 2;
            double[] yr = new double[n * n], yi = new double[n * n];
            for (int q = 0; q < half; q++) {
                yi[q * n + half + q] = -1;
                yi[(half + q) * n + q] = 1;
            }
            double[][] y = {yr, yi};
            double[][] c = structured(n, y, y, true);
            double[][] d = structured(n, timesI(y), y, false);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    double id = i == j ? 1 : 0;
                    int k = i * n + j;
                    assertTrue(c[0][k] == id && c[1][k] == 0, "n = " + n + ": σ_y² entry " + k);
                    assertTrue(d[0][k] == 0 && d[1][k] == id, "n = " + n + ": (iσ_y)σ_y entry " + k);
                }
            }
        }
    }
}
