package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Levels;
import org.liepath.core.Operator;
import org.liepath.core.Spin;
import org.liepath.integrators.internal.wn.Chart;
import org.liepath.integrators.internal.wn.Symbolic;
import org.liepath.testing.Seeds;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;

/** Seeded properties of chart reconstruction and of the closed-form equations. */
class WeiNormanPropertiesTest {
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void propagatorIsTheProductOfExponentials(long seed) {
        // U(g) = Π exp(g_k X_k) by the closed forms (band, triangular, diagonal, unitary diagonalisation) equals the
        // product of Padé exponentials (Operator.exp; Higham 2005) for random coordinates.
        Random r = new Random(seed);
        List<Operator> basis;
        if (r.nextBoolean()) {
            Spin s = Spin.of(0.5 * (1 + r.nextInt(8)));
            basis = new ArrayList<>(List.of(s.plus(), s.z(), s.minus()));
            if (r.nextBoolean()) {
                basis = new ArrayList<>(List.of(s.x().timesI().scale(-1), s.y().timesI().scale(-1),
                        s.z().timesI().scale(-1)));
            }
        } else {
            int n = 2 + r.nextInt(2);
            basis = new ArrayList<>(WnTesting.closure(List.of(Seeds.randomHermitian(r, n),
                    Seeds.randomHermitian(r, n))));
        }
        Collections.shuffle(basis, r);
        WeiNorman chart = WeiNorman.of(basis);
        int m = basis.size();
        Complex[] g = new Complex[m];
        Operator ref = Operator.identity(basis.get(0).dim());
        for (int k = 0; k < m; k++) {
            g[k] = new Complex(0.6 * r.nextGaussian(), 0.6 * r.nextGaussian());
            ref = ref.times(basis.get(k).scale(g[k]).exp());
        }
        double scale = Math.max(1, ref.norm());
        double err = WnTesting.maxDiff(ref, chart.propagator(g));
        // both sides are backward stable to ~1e-15 relative per factor; products of non-unitary factors amplify
        assertTrue(err <= 1e-11 * scale, "error " + err + " (scale " + scale + ")");
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void closedFormEquationsOfShuffledSl3LaddersAgreeWithTheNumericalSolve(long seed) {
        // Whenever an ordering of the Cartan–Weyl basis of sl(3) has a solved closed form, it equals the LU solve of
        // Γ(g)ġ = a at random g and a.
        Random r = new Random(seed);
        List<Operator> b = new ArrayList<>(List.of(Levels.unit(3, 0, 1), Levels.unit(3, 0, 2), Levels.unit(3, 1, 2),
                Operator.diagonal(1, -1, 0), Operator.diagonal(0, 1, -1), Levels.unit(3, 1, 0), Levels.unit(3, 2, 0),
                Levels.unit(3, 2, 1)));
        Collections.shuffle(b, r);
        WeiNorman chart = WeiNorman.of(b);
        Symbolic s = chart.symbolic();
        if (s == null || !s.solved()) {
            return;
        }
        Chart c = chart.chart();
        int m = c.m;
        double[] g = new double[2 * m], aR = new double[m], aI = new double[m], d = new double[2 * m];
        for (int e = 0; e < 2 * m; e++) {
            g[e] = 0.5 * r.nextGaussian();
        }
        for (int k = 0; k < m; k++) {
            aR[k] = r.nextGaussian();
            aI[k] = r.nextGaussian();
        }
        assertTrue(c.solve(g, aR, aI, d, new Chart.Work(c)));
        double[][] inv = s.evalInverse(g);
        for (int k = 0; k < m; k++) {
            double sr = 0, si = 0;
            for (int j = 0; j < m; j++) {
                sr += inv[0][k * m + j] * aR[j] - inv[1][k * m + j] * aI[j];
                si += inv[0][k * m + j] * aI[j] + inv[1][k * m + j] * aR[j];
            }
            double tol = 1e-9 * (1 + Math.hypot(sr, si));
            assertTrue(Math.abs(d[2 * k] - sr) <= tol && Math.abs(d[2 * k + 1] - si) <= tol,
                    "coordinate " + k + ": closed form " + sr + " + " + si + "i, solve " + d[2 * k] + " + "
                            + d[2 * k + 1] + "i");
        }
    }
}
