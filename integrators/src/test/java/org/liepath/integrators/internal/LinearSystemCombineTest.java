package org.liepath.integrators.internal;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link LinearSystem#combine} and {@link LinearSystem#combineAll} with generators stored sparse, dense or mixed:
 * every entry must be the plain sum Σ_k w_k G_k taken in generator order (the same value as a dense sweep; only the
 * sign of an exact zero may differ, which == ignores), and both routes must agree bit for bit.
 */
class LinearSystemCombineTest {
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void sparseAndDenseGeneratorsCombineToThePlainSum(long seed) {
        Random r = new Random(seed);
        int m = 1 + r.nextInt(12), len = m * m, terms = 1 + r.nextInt(5);
        double[][] gr = new double[terms][len], gi = new double[terms][len];
        for (int k = 0; k < terms; k++) {
            // fill fractions from none to all, with whole zero planes now and then (−i times a real symmetric matrix)
            double fill = r.nextInt(4) == 0 ? 1.0 : r.nextDouble() * 0.4;
            boolean realOnly = r.nextInt(3) == 0;
            for (int q = 0; q < len; q++) {
                if (r.nextDouble() < fill) {
                    gr[k][q] = realOnly ? 0.0 : r.nextGaussian();
                    gi[k][q] = r.nextGaussian();
                }
            }
        }
        LinearSystem sys = LinearSystem.general(m, gr, gi, (t, out) -> { });
        double[] w = new double[terms];
        for (int k = 0; k < terms; k++) {
            w[k] = r.nextInt(4) == 0 ? 0.0 : r.nextGaussian();
        }
        double[] cr = new double[len], ci = new double[len];
        java.util.Arrays.fill(cr, Double.NaN); // stale content must not leak into the result
        java.util.Arrays.fill(ci, Double.NaN);
        sys.combine(w, 0.0, cr, ci);
        double[] ar = new double[len], ai = new double[len];
        java.util.Arrays.fill(ar, Double.NaN);
        sys.combineAll(1, new double[][]{w}, new double[][]{ar}, new double[][]{ai});
        for (int q = 0; q < len; q++) {
            double er = 0, ei = 0;
            for (int k = 0; k < terms; k++) {
                if (w[k] != 0.0) {
                    er += w[k] * gr[k][q];
                    ei += w[k] * gi[k][q];
                }
            }
            int qq = q;
            double wantR = er, wantI = ei;
            assertTrue(cr[q] == wantR && ci[q] == wantI, () -> "m = " + m + ", entry " + qq + ": " + cr[qq] + " vs "
                    + wantR);
            assertTrue(ar[q] == cr[q] && ai[q] == ci[q], () -> "combineAll differs at entry " + qq);
        }
    }
}
