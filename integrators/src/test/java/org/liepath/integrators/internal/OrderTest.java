package org.liepath.integrators.internal;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;
import java.util.function.Function;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Order test of every coefficient table: one step of the scheme against the exact one-step propagator of
 * X' = A(t) X with a random polynomial A(t) = Σ_k t^k C_k/(k+1), C_k complex 3×3 (k = 0..9), computed by the Taylor
 * recursion X_{k+1} = (1/(k+1)) Σ_j B_j X_{k−j} (the recipe of verifying a transcribed table by the slope of the
 * local error, cf. S. Blanes, F. Casas, J.A. Oteo, J. Ros, Phys. Rep. 470 (2009) 151–238, and A. Alvermann, H.
 * Fehske, J. Comput. Phys. 230 (2011) 5930–5956, who verify their tables the same way).
 *
 * <p>A scheme of order p has local error C h^{p+1}, so log2(e(h)/e(h/2)) → p + 1. In double precision the steps are
 * chosen so that the smallest local error stays ≥ 5e-14 (fifty times the rounding floor of ~1e-15) and the
 * largest h‖A‖ is small enough that the next term of the error expansion moves the slope by less than 0.2; the
 * slopes are taken over two step halvings (for order 8, two steps of √2).
 */
class OrderTest {
    static final int M = 3, K = 10;

    static Stream<Arguments> tables() {
        Function<LinearSystem, Kernel> mid = s -> new CommutatorFreeKernel(s, Tables.MIDPOINT, Tables.MIDPOINT_TABLE,
                2);
        Function<LinearSystem, Kernel> m4 = s -> new MagnusKernel(s, 4);
        Function<LinearSystem, Kernel> m6 = s -> new MagnusKernel(s, 6);
        Function<LinearSystem, Kernel> m8 = s -> new MagnusKernel(s, 8);
        // the same schemes with their first-level commutators from stored generator pairs (forced: the cost rule
        // would keep the product route for these 3×3 systems)
        Function<LinearSystem, Kernel> p4 = s -> new MagnusKernel(s, 4, true);
        Function<LinearSystem, Kernel> p6 = s -> new MagnusKernel(s, 6, true);
        Function<LinearSystem, Kernel> p8 = s -> new MagnusKernel(s, 8, true);
        Function<LinearSystem, Kernel> cf4 = s -> new CommutatorFreeKernel(s, Tables.GAUSS2, Tables.CF4_2, 4);
        Function<LinearSystem, Kernel> opt = s -> new CommutatorFreeKernel(s, Tables.GAUSS3, Tables.CF4_3OPT, 4);
        Function<LinearSystem, Kernel> cf6 = s -> new CommutatorFreeKernel(s, Tables.GAUSS3, Tables.CF6_6, 6);
        double[] low = {0.05, 0.025, 0.0125};
        double[] four = {0.1, 0.05, 0.025};
        double[] six = {0.16, 0.08, 0.04};
        // eighth order leaves the rounding floor fastest: steps a factor √2 apart in the asymptotic window
        double[] eight = {0.16, 0.16 / Math.sqrt(2), 0.08};
        return Stream.of(
                Arguments.of("exponential midpoint", mid, 2, low),
                Arguments.of("Magnus 4", m4, 4, four),
                Arguments.of("Magnus 6", m6, 6, six),
                Arguments.of("Magnus 8", m8, 8, eight),
                Arguments.of("Magnus 4, generator pairs", p4, 4, four),
                Arguments.of("Magnus 6, generator pairs", p6, 6, six),
                Arguments.of("Magnus 8, generator pairs", p8, 8, eight),
                Arguments.of("CF4:2", cf4, 4, four),
                Arguments.of("CF4:3Opt", opt, 4, four),
                Arguments.of("CF6 six exponentials", cf6, 6, six));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("tables")
    void localErrorSlopeIsOrderPlusOne(String name, Function<LinearSystem, Kernel> make, int order, double[] hs) {
        for (long seed : new long[]{7, 11, 13}) {
            double[][][] c = randomPolynomial(seed);
            Kernel k = make.apply(system(c));
            assertEquals(order, k.order(), name + " declared order");
            double[] e = new double[hs.length];
            for (int i = 0; i < hs.length; i++) {
                e[i] = localError(k, c, hs[i]);
            }
            for (int i = 1; i < hs.length; i++) {
                double slope = Math.log(e[i - 1] / e[i]) / Math.log(hs[i - 1] / hs[i]);
                assertEquals(order + 1, slope, 0.2, name + " seed " + seed + " slope between h = " + hs[i - 1]
                        + " and " + hs[i] + " (errors " + e[i - 1] + ", " + e[i] + ")");
            }
            assertTrue(e[hs.length - 1] > 5e-14, name + ": smallest error " + e[hs.length - 1]
                    + " too close to rounding for a meaningful slope");
        }
    }

    /** The test can fail: CF4:2 with its exponentials in the wrong order is only second order (slope 3). */
    @ParameterizedTest(name = "reversed CF4:2, seed {0}")
    @MethodSource("seeds")
    void wronglyOrderedTableDropsToSecondOrder(long seed) {
        double[][][] c = randomPolynomial(seed);
        double[][] reversed = {Tables.CF4_2[1], Tables.CF4_2[0]};
        Kernel k = new CommutatorFreeKernel(system(c), Tables.GAUSS2, reversed, 4);
        double slope = Math.log(localError(k, c, 0.025) / localError(k, c, 0.0125)) / Math.log(2);
        assertEquals(3.0, slope, 0.2);
    }

    static Stream<Long> seeds() {
        return Stream.of(7L, 11L);
    }

    /** CF4:3Opt has a far smaller error constant than CF4:2 (the point of the optimisation). */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("seeds")
    void optimisedTableBeatsCf42(long seed) {
        double[][][] c = randomPolynomial(seed);
        LinearSystem s = system(c);
        double opt = localError(new CommutatorFreeKernel(s, Tables.GAUSS3, Tables.CF4_3OPT, 4), c, 0.05);
        double cf42 = localError(new CommutatorFreeKernel(s, Tables.GAUSS2, Tables.CF4_2, 4), c, 0.05);
        assertTrue(opt < cf42 / 5, "CF4:3Opt " + opt + " vs CF4:2 " + cf42);
    }

    static double[][][] randomPolynomial(long seed) {
        Random r = new Random(seed);
        double[][][] c = new double[2][K][M * M];
        for (int k = 0; k < K; k++) {
            for (int q = 0; q < M * M; q++) {
                c[0][k][q] = r.nextGaussian() / (k + 1);
                c[1][k][q] = r.nextGaussian() / (k + 1);
            }
        }
        return c;
    }

    static LinearSystem system(double[][][] c) {
        return LinearSystem.general(M, c[0], c[1], (t, out) -> {
            double p = 1;
            for (int k = 0; k < K; k++) {
                out[k] = p;
                p *= t;
            }
        });
    }

    static double localError(Kernel k, double[][][] c, double h) {
        double[] xr = new double[M * M], xi = new double[M * M];
        for (int i = 0; i < M; i++) {
            xr[i * M + i] = 1;
        }
        k.step(0, h, M, xr, xi);
        double[][] ex = taylor(c[0], c[1], h);
        return Kernel.diff(M * M, xr, xi, ex[0], ex[1]);
    }

    /** X(h) for X' = (Σ_j B_j s^j) X, X(0) = I, by the Taylor recursion with 140 terms. */
    static double[][] taylor(double[][] br, double[][] bi, double h) {
        int n = 140, len = M * M;
        double[][] xr = new double[n][len], xi = new double[n][len];
        for (int i = 0; i < M; i++) {
            xr[0][i * M + i] = 1;
        }
        for (int k = 0; k + 1 < n; k++) {
            for (int j = 0; j <= Math.min(k, K - 1); j++) {
                for (int i = 0; i < M; i++) {
                    for (int l = 0; l < M; l++) {
                        double ar = br[j][i * M + l], ai = bi[j][i * M + l];
                        for (int col = 0; col < M; col++) {
                            double cr = xr[k - j][l * M + col], ci = xi[k - j][l * M + col];
                            xr[k + 1][i * M + col] += ar * cr - ai * ci;
                            xi[k + 1][i * M + col] += ar * ci + ai * cr;
                        }
                    }
                }
            }
            for (int q = 0; q < len; q++) {
                xr[k + 1][q] /= k + 1;
                xi[k + 1][q] /= k + 1;
            }
        }
        double[] rr = new double[len], ri = new double[len];
        for (int k = n - 1; k >= 0; k--) {
            for (int q = 0; q < len; q++) {
                rr[q] = rr[q] * h + xr[k][q];
                ri[q] = ri[q] * h + xi[k][q];
            }
        }
        return new double[][]{rr, ri};
    }
}
