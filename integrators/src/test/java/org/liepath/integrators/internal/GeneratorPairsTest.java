package org.liepath.integrators.internal;

import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.testing.Seeds;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The stored-pair route of the Magnus exponent against the product route. By bilinearity of the commutator,
 * [Σ x_k G_k, Σ y_l G_l] = Σ_{k&lt;l} (x_k y_l − x_l y_k)[G_k, G_l] exactly (common practice: the structure-constant
 * form of a Lie bracket), so both routes compute the same Ω and differ by rounding only.
 *
 * <p>Tolerance: one step from X = I with h‖A‖ of order one; every Ω term is a sum of at most a few hundred products of
 * order-one numbers, so the two summation orders differ by a few tens of u (seen: at most 7e-15 relative over all
 * seeds and sizes here); 1e-13 relative to ‖X‖ leaves a margin of ten, while a single wrong pair weight or sign would
 * move the result by the size of a commutator term, h²‖[A, A]‖ ≈ 1e-2.
 */
class GeneratorPairsTest {
    static final int[] DIMS = {2, 3, 4, 8, 16};
    static final int MAX_TERMS = 6;
    static final double TOL = 1e-13;

    /** A Hamiltonian system of L random Hermitian terms with random smooth drives. */
    static LinearSystem hamiltonian(Random r, int n, int terms) {
        Hamiltonian.Builder b = Hamiltonian.builder(n);
        for (int k = 0; k < terms; k++) {
            Operator a = Seeds.randomHermitian(r, n).scale(1.0 / Math.sqrt(n));
            b.term(a, Drive.cosine(0.5 + r.nextDouble(), 3 * r.nextDouble(), 2 * Math.PI * r.nextDouble()));
        }
        return LinearSystem.of(b.build());
    }

    /** A GKLS generator in Liouville space (m = n²): L driven Hamiltonian terms plus one or two jump operators. */
    static LinearSystem gkls(Random r, int n, int terms) {
        Hamiltonian.Builder b = Hamiltonian.builder(n);
        for (int k = 0; k < terms; k++) {
            b.term(Seeds.randomHermitian(r, n).scale(1.0 / Math.sqrt(n)),
                    Drive.sine(0.5 + r.nextDouble(), 3 * r.nextDouble(), 2 * Math.PI * r.nextDouble()));
        }
        Lindbladian.Builder l = Lindbladian.builder(b.build());
        int jumps = 1 + r.nextInt(2);
        for (int j = 0; j < jumps; j++) {
            l.jump(0.1 + 0.4 * r.nextDouble(), Seeds.randomMatrix(r, n).scale(1.0 / Math.sqrt(n)));
        }
        return LinearSystem.of(l.build());
    }

    /** A general (non-skew, no constant part) system of random complex generators with polynomial coefficients. */
    static LinearSystem general(Random r, int m, int terms) {
        double[][] gr = new double[terms][], gi = new double[terms][];
        for (int k = 0; k < terms; k++) {
            Operator g = Seeds.randomMatrix(r, m).scale(1.0 / Math.sqrt(m));
            gr[k] = g.reArray();
            gi[k] = g.imArray();
        }
        double[] c = new double[terms];
        for (int k = 0; k < terms; k++) {
            c[k] = r.nextGaussian();
        }
        return LinearSystem.general(m, gr, gi, (t, out) -> {
            for (int k = 0; k < terms; k++) {
                out[k] = c[k] + t * (k + 1);
            }
        });
    }

    /** Max over orders 4, 6, 8 of ‖X_pairs − X_products‖ / ‖X‖ after one step from I (also checks the counters). */
    static double deviation(LinearSystem sys, double t, double h) {
        int m = sys.dim(), len = m * m;
        double worst = 0;
        for (int order : new int[]{4, 6, 8}) {
            // the planar route: the packed three-level route of MagnusKernel does not use stored pairs
            MagnusKernel direct = new MagnusKernel(sys, order, false, false), pairs = new MagnusKernel(sys, order, true, false);
            assertTrue(pairs.usesPairs());
            assertFalse(direct.usesPairs());
            double[][] x = new double[4][len];
            for (int i = 0; i < m; i++) {
                x[0][i * m + i] = 1;
                x[2][i * m + i] = 1;
            }
            direct.step(t, h, m, x[0], x[1]);
            pairs.step(t, h, m, x[2], x[3]);
            // a pair-built commutator is still the one commutator of the scheme it stands for
            assertEquals(direct.commutators, pairs.commutators, "order " + order + " commutator count");
            assertEquals(order == 4 ? 1 : order == 6 ? 3 : 10, pairs.commutators, "order " + order);
            worst = Math.max(worst, Kernel.diff(len, x[0], x[1], x[2], x[3]) / Kernel.norm(len, x[0], x[1]));
            if (sys.isSkewHermitian()) {
                assertExactlySkew(m, pairs.wr, pairs.wi, "order " + order + " pair route");
                assertExactlySkew(m, direct.wr, direct.wi, "order " + order + " product route");
            }
        }
        return worst;
    }

    /** Ω = −Ω† bit for bit: the property that keeps every exponential unitary to rounding. */
    static void assertExactlySkew(int m, double[] re, double[] im, String what) {
        for (int i = 0; i < m; i++) {
            assertEquals(0.0, re[i * m + i], 0.0, what + ": real diagonal");
            for (int j = i + 1; j < m; j++) {
                assertEquals(-re[j * m + i], re[i * m + j], 0.0, what + ": real part antisymmetric at " + i + "," + j);
                assertEquals(im[j * m + i], im[i * m + j], 0.0, what + ": imaginary part symmetric at " + i + "," + j);
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void hamiltonianPairRouteAgreesWithProducts(long seed) {
        Random r = new Random(seed);
        for (int m : DIMS) {
            for (int terms = 1; terms <= MAX_TERMS; terms++) {
                double d = deviation(hamiltonian(r, m, terms), r.nextDouble(), 0.3 + 0.5 * r.nextDouble());
                assertTrue(d < TOL, "m " + m + ", L " + terms + ": deviation " + d);
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void gklsPairRouteAgreesWithProducts(long seed) {
        Random r = new Random(seed);
        // Liouville dimensions m = n² = 4, 9, 16; the dissipator joins the pairs as one more generator
        for (int n = 2; n <= 4; n++) {
            for (int terms = 1; terms <= MAX_TERMS; terms++) {
                LinearSystem sys = gkls(r, n, terms);
                assertFalse(sys.isSkewHermitian());
                double d = deviation(sys, r.nextDouble(), 0.3 + 0.5 * r.nextDouble());
                assertTrue(d < TOL, "n " + n + ", L " + terms + ": deviation " + d);
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void generalPairRouteAgreesWithProducts(long seed) {
        Random r = new Random(seed);
        for (int m : DIMS) {
            for (int terms = 1; terms <= MAX_TERMS; terms++) {
                double d = deviation(general(r, m, terms), r.nextDouble(), 0.2 + 0.3 * r.nextDouble());
                assertTrue(d < TOL, "m " + m + ", L " + terms + ": deviation " + d);
            }
        }
    }

    /**
     * The comparisons above can fail: the commutator term the pair route builds moves a Magnus-4 step by far more than
     * the tolerance (here against the same step without it), so a lost or mis-signed pair weight would be seen.
     */
    @Test
    void aWrongPairWeightIsSeen() {
        Random r = new Random(5);
        LinearSystem sys = hamiltonian(r, 4, 3);
        int m = 4, len = m * m;
        MagnusKernel direct = new MagnusKernel(sys, 4, false);
        double[] xr = new double[len], xi = new double[len], yr = new double[len], yi = new double[len];
        for (int i = 0; i < m; i++) {
            xr[i * m + i] = 1;
            yr[i * m + i] = 1;
        }
        direct.step(0.2, 0.5, m, xr, xi);
        // exp(h/2 (A1 + A2)): the same step with the commutator weight set to zero
        CommutatorFreeKernel noCommutator = new CommutatorFreeKernel(sys, Tables.GAUSS2, new double[][]{{0.5, 0.5}},
                2);
        noCommutator.step(0.2, 0.5, m, yr, yi);
        assertTrue(Kernel.diff(len, xr, xi, yr, yi) > 1e3 * TOL);
    }

    /** Commuting generators store no pair, and the step then stays exactly diagonal. */
    @Test
    void commutingGeneratorsStoreNoPair() {
        Hamiltonian h = Hamiltonian.builder(3)
                .term(Operator.diagonal(1, 2, 3), Drive.cosine(1, 1))
                .term(Operator.diagonal(0, -1, 4), Drive.sine(1, 2, 0))
                .build();
        LinearSystem sys = LinearSystem.of(h);
        MagnusKernel k = new MagnusKernel(sys, 8, true);
        GeneratorPairs p = new GeneratorPairs(sys, (ar, ai, br, bi, cr, ci) -> k.bracket(1.0, ar, ai, br, bi, cr, ci));
        assertEquals(0, p.pairs());
        double[] xr = new double[9], xi = new double[9];
        for (int i = 0; i < 3; i++) {
            xr[i * 3 + i] = 1;
        }
        k.step(0, 0.4, 3, xr, xi);
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                if (i != j) {
                    assertEquals(0.0, xr[i * 3 + j], 0.0);
                    assertEquals(0.0, xi[i * 3 + j], 0.0);
                }
            }
        }
    }
}
