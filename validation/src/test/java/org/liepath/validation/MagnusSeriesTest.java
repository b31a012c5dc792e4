package org.liepath.validation;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.testing.Seeds;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class MagnusSeriesTest {

    private static Operator minusI(Operator h) {
        return h.timesI().scale(-1.0);
    }

    private static double maxAbsDiff(Operator a, Operator b) {
        double m = 0;
        for (int i = 0; i < a.dim(); i++) {
            for (int j = 0; j < a.dim(); j++) {
                m = Math.max(m, Math.hypot(a.re(i, j) - b.re(i, j), a.im(i, j) - b.im(i, j)));
            }
        }
        return m;
    }

    /**
     * Closed forms for A(t) = A0 + t A1 on [0, h]: Ω1 = hA0 + (h²/2)A1, Ω2 = −(h³/12)[A0, A1],
     * Ω3 = (h⁵/240)[A1, [A1, A0]] (derived from the series of W. Magnus, Comm. Pure Appl. Math. 7 (1954) 649, as
     * reviewed by S. Blanes, F. Casas, J.A. Oteo, J. Ros, Phys. Rep. 470 (2009) 151; values computed independently
     * against Dyson-series logarithms). The quadrature is exact for linear A (integrands of degree ≤ 7 on 12 Gauss
     * nodes), so only rounding remains: 1e-13 relative to the size of each term.
     */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void linearGeneratorClosedForms(long seed) {
        Random r = new Random(seed);
        int n = 2 + r.nextInt(3);
        Operator h0 = Seeds.randomHermitian(r, n).scale(0.5), h1 = Seeds.randomHermitian(r, n).scale(0.5);
        double h = 0.2 + 0.6 * r.nextDouble();
        Hamiltonian ham = Hamiltonian.builder(n).term(1.0, h0).term(h1, t -> t).build();
        MagnusSeries ms = MagnusSeries.of(ham, 0, h);
        Operator a0 = minusI(h0), a1 = minusI(h1);
        Operator om1 = a0.scale(h).plus(a1.scale(h * h / 2));
        Operator om2 = a0.commutator(a1).scale(-Math.pow(h, 3) / 12);
        Operator om3 = a1.commutator(a1.commutator(a0)).scale(Math.pow(h, 5) / 240);
        List<Operator> t = ms.terms(3);
        assertEquals(0, t.get(0).distance(om1), 1e-13 * om1.norm(), "Ω1");
        assertEquals(0, t.get(1).distance(om2), 1e-13 * om1.norm() * om1.norm(), "Ω2");
        assertEquals(0, t.get(2).distance(om3), 1e-13 * Math.pow(om1.norm(), 3), "Ω3");
    }

    /**
     * Two-level example H(t) = ½σz + (t/2)σx: Ω2 = (i h³/24)σy, Ω3 = (i h⁵/480)σz, and the error table of the
     * truncated exponentials against the exact propagator (computed independently with mpmath.odefun, 30 digits);
     * the errors are compared to the 3 significant digits given.
     */
    @ParameterizedTest
    @ValueSource(doubles = {1.0, 0.5})
    void twoLevelExampleTable(double h) {
        Hamiltonian ham = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), t -> 0.5 * t).build();
        MagnusSeries ms = MagnusSeries.of(ham, 0, h);
        assertEquals(0, ms.term(2).distance(Pauli.y().scale(new Complex(0, Math.pow(h, 3) / 24))), 1e-15);
        assertEquals(0, ms.term(3).distance(Pauli.z().scale(new Complex(0, Math.pow(h, 5) / 480))), 1e-15);
        Complex u00, u01;
        double[] expected;
        if (h == 1.0) {
            u00 = new Complex(0.847946528415386, -0.472339199206666);
            u01 = new Complex(0.040306295323636, -0.237187201169);
            expected = new double[]{0.0403063, 0.00212868, 0.000773842};
        } else {
            u00 = new Complex(0.966982909744409, -0.24717755008272);
            u01 = new Complex(0.00517325021901454, -0.0618105854972493);
            expected = new double[]{0.00517325, 6.55829e-5, 2.23655e-5};
        }
        Complex u10 = u01.conjugate().negate(), u11 = u00.conjugate();
        Operator exact = Operator.of(new double[][]{{u00.getReal(), u01.getReal()}, {u10.getReal(), u11.getReal()}},
                new double[][]{{u00.getImaginary(), u01.getImaginary()}, {u10.getImaginary(), u11.getImaginary()}});
        for (int k = 1; k <= 3; k++) {
            double err = maxAbsDiff(ms.propagator(k), exact);
            assertEquals(expected[k - 1], err, 5e-3 * expected[k - 1], "truncation after Ω" + k);
        }
    }

    /**
     * ∫‖H‖₂ for the two-level example: ‖H(t)‖₂ = ½√(1 + t²), so ∫₀¹ = ¼(√2 + asinh 1) (elementary integral). The
     * quadrature error of a smooth integrand on 12 Gauss nodes is far below 1e-12.
     */
    @Test
    void convergenceIndicatorClosedForm() {
        Hamiltonian ham = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), t -> 0.5 * t).build();
        MagnusSeries ms = MagnusSeries.of(ham, 0, 1);
        double exact = 0.25 * (Math.sqrt(2) + Math.log(1 + Math.sqrt(2)));
        assertEquals(exact, ms.convergenceIndicator(), 1e-12);
        assertTrue(ms.isConvergenceGuaranteed());
        // 6 ∫‖H‖ ≈ 3.44 > π: the sufficient condition fails (P.C. Moan, J. Niesen, Found. Comput. Math. 8 (2008) 291)
        Hamiltonian big = Hamiltonian.builder(2).term(3.0, Pauli.z()).term(Pauli.x(), t -> 3 * t).build();
        assertTrue(!MagnusSeries.of(big, 0, 1).isConvergenceGuaranteed());
    }

    private static Hamiltonian smoothRandom(Random r, int n, double eps) {
        Operator h0 = Seeds.randomHermitian(r, n), h1 = Seeds.randomHermitian(r, n), h2 = Seeds.randomHermitian(r, n);
        double w = 1 + 2 * r.nextDouble();
        return Hamiltonian.builder(n).term(eps, h0).term(h1, t -> eps * Math.cos(w * t))
                .term(h2, t -> eps * t * t).build();
    }

    /**
     * Ω4 against an independent evaluation: for H → εH, log U − (Ω1 + Ω2 + Ω3) = Ω4 + O(ε⁵), with U from a
     * general-purpose ODE solver (Commons Math Dormand–Prince 8(5,3)) and log by the Mercator series. Halving ε must
     * divide the remainder after Ω4 by ≈ 2⁵ = 32 while the remainder after Ω3 falls only by ≈ 2⁴ = 16 (homogeneity
     * of Ω_k in ε, Blanes et al. 2009 §2). Observed ratios are checked in [24, 42] resp. [12, 21]: the next term
     * perturbs the leading ratio by O(ε).
     */
    @ParameterizedTest(name = "seed {0}")
    @ValueSource(longs = {11, 23, 57})
    void fourthTermMatchesLogarithmOfExactPropagator(long seed) {
        double[] eps = {0.08, 0.04};
        double[] rem3 = new double[2], rem4 = new double[2];
        for (int e = 0; e < 2; e++) {
            Hamiltonian ham = smoothRandom(new Random(seed), 3, eps[e]);
            MagnusSeries ms = MagnusSeries.of(ham, 0, 1);
            Operator log = OdeReference.logNearIdentity(OdeReference.propagator(ham, 0, 1));
            rem3[e] = log.distance(ms.exponent(3));
            rem4[e] = log.distance(ms.exponent(4));
            assertTrue(rem4[e] < 0.3 * rem3[e], "Ω4 must account for most of the ε⁴ remainder");
        }
        double r3 = rem3[0] / rem3[1], r4 = rem4[0] / rem4[1];
        assertTrue(r3 > 12 && r3 < 21, "remainder after Ω3 scales as ε⁴, ratio " + r3);
        assertTrue(r4 > 24 && r4 < 42, "remainder after Ω4 scales as ε⁵, ratio " + r4);
    }

    /**
     * Piecewise-constant generator: U = e^B e^A (A on [0, 1), B on [1, 2)); the Magnus terms are then the homogeneous
     * parts of the Baker–Campbell–Hausdorff series log(e^X e^Y) = X + Y + ½[X,Y] + (1/12)([X,[X,Y]] + [Y,[Y,X]])
     * − (1/24)[Y,[X,[X,Y]]] + … with X = B, Y = A (B.C. Hall, Lie Groups, Lie Algebras, and Representations, 2nd ed.,
     * Springer 2015, §5.6 — section number from memory). Tests the degree-4 term exactly; rounding only (1e-13).
     */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void piecewiseConstantMatchesBakerCampbellHausdorff(long seed) {
        Random r = new Random(seed);
        int n = 2 + r.nextInt(2);
        Operator ha = Seeds.randomHermitian(r, n).scale(0.3), hb = Seeds.randomHermitian(r, n).scale(0.3);
        Drive first = Drive.piecewiseConstant(new double[]{0, 1, 2}, new double[]{1, 0});
        Drive second = Drive.piecewiseConstant(new double[]{0, 1, 2}, new double[]{0, 1});
        Hamiltonian ham = Hamiltonian.builder(n).term(ha, first).term(hb, second).build();
        MagnusSeries ms = MagnusSeries.of(ham, 0, 2);
        Operator y = minusI(ha), x = minusI(hb);
        Operator b2 = x.commutator(y).scale(0.5);
        Operator b3 = x.commutator(x.commutator(y)).plus(y.commutator(y.commutator(x))).scale(1.0 / 12);
        Operator b4 = y.commutator(x.commutator(x.commutator(y))).scale(-1.0 / 24);
        double s = x.norm() + y.norm();
        assertEquals(0, ms.term(1).distance(x.plus(y)), 1e-13 * s);
        assertEquals(0, ms.term(2).distance(b2), 1e-13 * s * s);
        assertEquals(0, ms.term(3).distance(b3), 1e-13 * s * s * s);
        assertEquals(0, ms.term(4).distance(b4), 1e-13 * s * s * s * s);
    }

    /**
     * Below the Moan–Niesen bound the truncations approach the exact propagator: errors of exp(Ω1 + … + Ωk) decrease
     * with k (each term is smaller by a factor ~∫‖A‖), unitarity is kept to rounding (exponential of an
     * anti-Hermitian matrix).
     */
    @ParameterizedTest(name = "seed {0}")
    @ValueSource(longs = {3, 5, 8, 13})
    void truncationsConvergeBelowBound(long seed) {
        Random r = new Random(seed);
        Hamiltonian ham = smoothRandom(r, 3, 0.15);
        MagnusSeries ms = MagnusSeries.of(ham, 0, 1);
        assertTrue(ms.isConvergenceGuaranteed(), ms.toString());
        Operator exact = OdeReference.propagator(ham, 0, 1);
        double prev = Double.POSITIVE_INFINITY;
        for (int k = 1; k <= 4; k++) {
            Operator u = ms.propagator(k);
            assertTrue(Checks.unitarityError(u) < 1e-13);
            double err = u.distance(exact);
            assertTrue(err < 0.6 * prev, "error after Ω" + k + " = " + err + ", before " + prev);
            prev = err;
        }
    }

    /** Time symmetry of the Magnus series, Ω(t0, t1) = −Ω(t1, t0), holds term by term (homogeneity in ε). */
    @Test
    void backwardIntervalNegatesTerms() {
        Hamiltonian ham = smoothRandom(new Random(99), 2, 0.4);
        MagnusSeries fw = MagnusSeries.of(ham, 0.3, 1.7), bw = MagnusSeries.of(ham, 1.7, 0.3);
        for (int k = 1; k <= 4; k++) {
            assertEquals(0, fw.term(k).plus(bw.term(k)).norm(), 1e-13 * Math.max(1, fw.term(k).norm()), "Ω" + k);
        }
    }

    /**
     * Quadrature accuracy for a smooth pulse: a Gaussian drive whose width spans many panels, compared with the
     * independent ODE reference through the remainder after Ω4 for a weak drive (ε small: Ω5 ~ 1e-8 relative),
     * and with the same series computed on a sub-interval sum for Ω1 (additivity of ∫A).
     */
    @Test
    void gaussianPulseFirstTermIsAdditive() {
        Hamiltonian ham = Hamiltonian.builder(2).term(0.3, Pauli.z())
                .term(Pauli.x(), Drive.gaussian(0.5, 2.0, 0.4)).build();
        Operator whole = MagnusSeries.of(ham, 0, 4).term(1);
        Operator parts = MagnusSeries.of(ham, 0, 1.3).term(1).plus(MagnusSeries.of(ham, 1.3, 4).term(1));
        assertEquals(0, whole.distance(parts), 1e-13);
        // the σx part of Ω1 is −i ∫ 0.5 exp(−(t−2)²/(2·0.16)) dt = −i·0.5·0.4·√(2π)·erf(2/(0.4√2)) (Gaussian integral)
        double integral = 0.5 * 0.4 * Math.sqrt(2 * Math.PI) * org.apache.commons.math3.special.Erf.erf(2 / (0.4 * Math.sqrt(2)));
        assertEquals(-integral, whole.im(0, 1), 1e-13);
    }

    /**
     * Quadrature convergence for Ω2 … Ω4 on a smooth, strongly time-dependent problem: forcing 40 extra panel cuts
     * (a drive that declares breakpoints but is smooth) must not change the terms beyond rounding — the default panels
     * already resolve the nested integrals (spectral accuracy of 12-node interpolatory quadrature). Common practice:
     * refinement study.
     */
    @Test
    void extraPanelsDoNotChangeTheTerms() {
        double[] cuts = new double[41];
        for (int k = 0; k <= 40; k++) {
            cuts[k] = 4.0 * k / 40;
        }
        Drive smooth = t -> 0.6 * Math.cos(3 * t) + 0.2 * t;
        Drive cut = new Drive() {
            @Override
            public double at(double t) {
                return smooth.at(t);
            }

            @Override
            public double[] breakpoints() {
                return cuts.clone();
            }
        };
        Operator z = Pauli.z().scale(0.4);
        MagnusSeries coarse = MagnusSeries.of(Hamiltonian.builder(2).term(1.0, z).term(Pauli.x(), smooth).build(), 0, 4);
        MagnusSeries fine = MagnusSeries.of(Hamiltonian.builder(2).term(1.0, z).term(Pauli.x(), cut).build(), 0, 4);
        assertTrue(fine.panels() >= 40 && coarse.panels() < fine.panels());
        for (int k = 1; k <= 4; k++) {
            double scale = Math.max(1, coarse.term(k).norm());
            assertEquals(0, coarse.term(k).distance(fine.term(k)), 1e-12 * scale, "Ω" + k);
        }
    }

    @Test
    void badInput() {
        Hamiltonian ham = Hamiltonian.builder(2).term(0.5, Pauli.z()).build();
        MagnusSeries ms = MagnusSeries.of(ham, 0, 1);
        for (int k : new int[]{0, 5, -1}) {
            InvalidInputException e = assertThrows(InvalidInputException.class, () -> ms.terms(k));
            assertEquals(InvalidInputException.Reason.OUT_OF_RANGE, e.reason());
            assertTrue(e.getMessage().contains("k") && e.getMessage().contains(String.valueOf(k)), e.getMessage());
            assertThrows(InvalidInputException.class, () -> ms.propagator(k));
        }
        InvalidInputException empty = assertThrows(InvalidInputException.class, () -> MagnusSeries.of(ham, 0.5, 0.5));
        assertEquals(InvalidInputException.Reason.OUT_OF_RANGE, empty.reason());
        assertTrue(empty.getMessage().contains("t1") && empty.getMessage().contains("0.5"), empty.getMessage());
        InvalidInputException nan = assertThrows(InvalidInputException.class, () -> MagnusSeries.of(ham, 0, Double.NaN));
        assertEquals(InvalidInputException.Reason.NOT_FINITE, nan.reason());
        assertTrue(nan.getMessage().contains("NaN"));
        InvalidInputException nul = assertThrows(InvalidInputException.class, () -> MagnusSeries.of(null, 0, 1));
        assertEquals(InvalidInputException.Reason.NULL, nul.reason());
    }
}
