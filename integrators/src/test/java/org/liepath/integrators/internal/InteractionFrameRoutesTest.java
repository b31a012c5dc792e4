package org.liepath.integrators.internal;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The two routes to the node combinations of the interaction picture (a table of phased generators Φ_j∘G_k, or node
 * matrices multiplied by Φ_j entrywise) give the same matrices up to rounding, and both keep them anti-Hermitian bit
 * for bit (the phase of entry (b, a) is the exact conjugate of that of (a, b)). Sparse and dense generators, diagonal
 * and full static parts.
 */
class InteractionFrameRoutesTest {
    static Operator randomHermitian(Random r, int n, boolean sparse) {
        double[] re = new double[n * n], im = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            if (!sparse || r.nextInt(4) == 0) {
                re[k] = r.nextGaussian();
                im[k] = r.nextGaussian();
            }
        }
        Operator g = Operator.ofPlanar(n, re, im);
        return g.plus(g.dagger());
    }

    @ParameterizedTest(name = "seed {0}")
    @ValueSource(ints = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12})
    void routesAgree(int seed) {
        Random r = new Random(seed);
        int n = 2 + seed % 7;
        boolean sparse = seed % 2 == 0, diagonalStatic = seed % 3 == 0;
        Operator h0 = diagonalStatic ? Operator.diagonal(r.doubles(n, 0, 5).toArray()) : randomHermitian(r, n, false);
        Hamiltonian h = Hamiltonian.builder(n).term(1.0, h0)
                .term(randomHermitian(r, n, sparse), Drive.cosine(0.7, 1.3))
                .term(randomHermitian(r, n, sparse), Drive.sine(0.4, 0.8, 0.2)).build();
        LinearSystem sys = LinearSystem.interaction(h);
        assertTrue(sys.isInteractionPicture());
        double[] nodes = Tables.GAUSS4;
        InteractionFrame table = new InteractionFrame(sys, nodes.length, true);
        InteractionFrame direct = new InteractionFrame(sys, nodes.length, false);
        double h1 = 0.37, t = 1.1;
        double[][] coef = new double[nodes.length][sys.terms];
        for (int j = 0; j < nodes.length; j++) {
            sys.coefficients(t + nodes[j] * h1, coef[j]);
        }
        table.phases(h1, nodes);
        direct.phases(h1, nodes);
        direct.nodes(coef, nodes.length);
        double[][] alpha = {{0.2, 0.3, 0.3, 0.2}, {-0.1, -0.4, 0.4, 0.1}, {0, 1, 0, 0}, {0.5, 0, 0, -0.5}};
        double[] scale = {h1, 1.0, 2.0, -0.5};
        int len = n * n;
        double[][] ar = new double[4][len], ai = new double[4][len], br = new double[4][len], bi = new double[4][len];
        table.combinations(4, scale, alpha, coef, ar, ai);
        direct.combinations(4, scale, alpha, coef, br, bi);
        for (int i = 0; i < 4; i++) {
            double size = 0, diff = 0;
            for (int q = 0; q < len; q++) {
                size = Math.max(size, Math.hypot(ar[i][q], ai[i][q]));
                diff = Math.max(diff, Math.hypot(ar[i][q] - br[i][q], ai[i][q] - bi[i][q]));
            }
            // a few roundings of sums over 4 nodes × 2 terms: well inside 1e-15 relative
            assertTrue(diff <= 1e-15 * Math.max(size, 1), "combination " + i + ": " + diff + " of " + size);
            for (double[][] re : new double[][][]{ar, br}) {
                double[][] im = re == ar ? ai : bi;
                for (int a = 0; a < n; a++) {
                    assertEquals(0.0, re[i][a * n + a], 0.0, "real diagonal");
                    for (int b = 0; b < n; b++) {
                        assertEquals(-re[i][b * n + a], re[i][a * n + b], 0.0, "anti-Hermitian real part");
                        assertEquals(im[i][b * n + a], im[i][a * n + b], 0.0, "anti-Hermitian imaginary part");
                    }
                }
            }
        }
    }
}
