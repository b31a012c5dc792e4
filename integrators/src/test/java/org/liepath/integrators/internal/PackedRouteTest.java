package org.liepath.integrators.internal;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.testing.Seeds;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The packed three-level route of {@link MagnusKernel} ({@link org.liepath.core.internal.Skew3}) against the planar
 * route it replaces for Hamiltonian systems of three levels: the same scheme, so the same step to rounding, in both
 * pictures, with and without a constant part, for states and propagators, and beyond the Padé limit.
 */
class PackedRouteTest {
    private static final double U = 0x1p-53;

    /** A random three-level Hamiltonian: static part (diagonal or full, or none) and two or three driven terms. */
    static Hamiltonian random(Random r, int kind, double scale) {
        Hamiltonian.Builder b = Hamiltonian.builder(3);
        if (kind == 1) {
            b.term(1.0, Operator.diagonal(r.nextGaussian(), 3 * r.nextGaussian(), 5 * r.nextGaussian()));
        } else if (kind == 2) {
            b.term(1.0, Seeds.randomHermitian(r, 3).scale(4.0));
        }
        int terms = 2 + r.nextInt(2);
        for (int k = 0; k < terms; k++) {
            b.term(Seeds.randomHermitian(r, 3).scale(scale),
                    Drive.cosine(0.3 + r.nextDouble(), 0.5 + 2 * r.nextDouble(), r.nextDouble()));
        }
        return b.build();
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void packedStepsEqualPlanarStepsToRounding(long seed) {
        Random r = new Random(seed);
        for (int kind = 0; kind < 3; kind++) {
            Hamiltonian h = random(r, kind, 1.0);
            for (boolean frame : new boolean[]{false, true}) {
                LinearSystem sys = frame ? LinearSystem.interaction(h) : LinearSystem.of(h);
                for (int order : new int[]{4, 6, 8}) {
                    for (int p : new int[]{1, 3}) {
                        // backward steps too (dt < 0): the inverse propagator, on both routes
                        double t = r.nextDouble(), dt = (p == 1 ? -1 : 1) * (0.05 + 0.3 * r.nextDouble());
                        MagnusKernel packed = new MagnusKernel(sys, order, false, true);
                        MagnusKernel planar = new MagnusKernel(sys, order, false, false);
                        assertTrue(packed.packed());
                        assertTrue(!planar.packed());
                        double[][] x = state(r, p);
                        double[][] y = {x[0].clone(), x[1].clone()};
                        packed.toFrame(t, p, x[0], x[1]);
                        planar.toFrame(t, p, y[0], y[1]);
                        for (int s = 0; s < 3; s++) {
                            packed.step(t + s * dt, dt, p, x[0], x[1]);
                            planar.step(t + s * dt, dt, p, y[0], y[1]);
                        }
                        String what = "kind " + kind + (frame ? " frame" : "") + " order " + order + " p " + p;
                        // three steps of the same scheme: the two routes differ by the rounding of their sums, a few
                        // u·‖Ω‖ per step (‖Ω‖ ≲ 10 dt here) plus the products with the state
                        double d = Kernel.diff(3 * p, x[0], x[1], y[0], y[1]) / Kernel.norm(3 * p, y[0], y[1]);
                        assertTrue(d <= 200 * U, what + ": " + d);
                        assertEquals(planar.commutators, packed.commutators, what + " commutators");
                        assertEquals(planar.exponentials, packed.exponentials, what + " exponentials");
                        assertEquals(planar.evaluations, packed.evaluations, what + " evaluations");
                    }
                }
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void exponentsBeyondThePadeLimitTakeTheEigenRoute(long seed) {
        // drives of norm ~40 and a step of 3: ‖Ω‖₁ > Kernel.PADE_LIMIT, so both routes use the eigendecomposition
        Random r = new Random(seed);
        Hamiltonian h = random(r, 0, 40.0);
        LinearSystem sys = LinearSystem.of(h);
        MagnusKernel packed = new MagnusKernel(sys, 4, false, true), planar = new MagnusKernel(sys, 4, false, false);
        double[][] x = state(r, 3), y = {x[0].clone(), x[1].clone()};
        packed.step(0.0, 3.0, 3, x[0], x[1]);
        planar.step(0.0, 3.0, 3, y[0], y[1]);
        double d = Kernel.diff(9, x[0], x[1], y[0], y[1]) / Kernel.norm(9, y[0], y[1]);
        double norm = org.liepath.core.internal.Dense.norm1(3, planar.wr, planar.wi);
        assertTrue(norm > Kernel.PADE_LIMIT, "exponent norm " + norm);
        // the two exponents differ by the rounding of their sums, a few u·‖Ω‖ (the commutator term alone is of
        // order h²‖A‖² here), and the exponential map is an isometry on anti-Hermitian perturbations to first order
        assertTrue(d <= 20 * U * norm, "deviation " + d + " > " + 20 * U * norm);
        double[][] u = {x[0], x[1]};
        assertTrue(unitarity(u) <= 1e-13, "unitarity " + unitarity(u));
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void packedAndPlanarFramesCombineTheSameNodeValues(long seed) {
        // a packed-only frame (its own packed tables) against a planar frame whose combinations are packed after
        Random r = new Random(seed);
        LinearSystem sys = LinearSystem.interaction(random(r, 2, 1.0));
        InteractionFrame packedOnly = new InteractionFrame(sys, 4, true, true);
        InteractionFrame planar = new InteractionFrame(sys, 4, true, false);
        double h = 0.1 + r.nextDouble();
        packedOnly.phases(h, Tables.GAUSS4);
        planar.phases(h, Tables.GAUSS4);
        double[][] coef = new double[4][sys.terms];
        for (double[] c : coef) {
            for (int k = 0; k < c.length; k++) {
                c[k] = r.nextGaussian();
            }
        }
        double[] scale = {1.0, -0.5, 2.0};
        double[][] alpha = {{0.1, 0.2, 0.3, 0.4}, {1, -1, 1, -1}, {0, 1, 0, 0}};
        double[][] a = new double[3][9], b = new double[3][9];
        packedOnly.combinationsPacked(3, scale, alpha, coef, a);
        planar.combinationsPacked(3, scale, alpha, coef, b);
        for (int i = 0; i < 3; i++) {
            for (int q = 0; q < 9; q++) {
                // the same sums in another grouping: Σ|terms| ≤ |scale|·Σ|α|·Σ|c|·max|G| ≲ 100 here, and each
                // grouping rounds to at most ~20 u of it
                assertEquals(b[i][q], a[i][q], 2000 * U, "output " + i + " entry " + q);
            }
        }
    }

    private static double[][] state(Random r, int p) {
        double[][] x = new double[2][3 * p];
        if (p == 3) {
            Operator q = Seeds.randomHermitian(r, 3);
            // a unitary start: exp(−iQ) from the planar route's own exponential would be circular; the identity
            // rotated by a random phase per column is enough to make the state generic
            for (int i = 0; i < 3; i++) {
                double ph = q.reArray()[i * 4];
                x[0][i * 4] = Math.cos(ph);
                x[1][i * 4] = Math.sin(ph);
            }
            return x;
        }
        double n = 0;
        for (int i = 0; i < 3; i++) {
            x[0][i] = r.nextGaussian();
            x[1][i] = r.nextGaussian();
            n += x[0][i] * x[0][i] + x[1][i] * x[1][i];
        }
        for (int i = 0; i < 3; i++) {
            x[0][i] /= Math.sqrt(n);
            x[1][i] /= Math.sqrt(n);
        }
        return x;
    }

    /** ‖X†X − I‖_F for a 3×3 planar X. */
    private static double unitarity(double[][] x) {
        double s = 0;
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                double re = 0, im = 0;
                for (int k = 0; k < 3; k++) {
                    double ar = x[0][k * 3 + i], ai = -x[1][k * 3 + i], br = x[0][k * 3 + j], bi = x[1][k * 3 + j];
                    re += ar * br - ai * bi;
                    im += ar * bi + ai * br;
                }
                re -= i == j ? 1 : 0;
                s += re * re + im * im;
            }
        }
        return Math.sqrt(s);
    }
}
