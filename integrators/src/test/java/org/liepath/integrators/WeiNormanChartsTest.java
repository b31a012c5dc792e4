package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Levels;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;
import org.liepath.testing.Seeds;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.liepath.integrators.WnTesting.maxDiff;
import static org.liepath.integrators.WnTesting.reference;
import static org.liepath.integrators.WnTesting.wn;

/** Wei–Norman charts on several algebras, re-anchoring through singularities, and random algebras. */
class WeiNormanChartsTest {
    static List<Operator> ladder(Spin s) {
        return List.of(s.plus(), s.z(), s.minus());
    }

    /** H = ω0 Jz + Ω cos(ωt) Jx + Ω' sin(1.7ωt) Jy, a time-dependent field. */
    static Hamiltonian spinField(Spin s) {
        return Hamiltonian.builder(s.dim()).term(0.7, s.z()).term(s.x(), Drive.cosine(0.9, 1.1, 0))
                .term(s.y(), Drive.cosine(0.5, 1.9, 0.3)).build();
    }

    @ParameterizedTest(name = "pulse area {0}π")
    @ValueSource(ints = {1, 3})
    void resonantPulsesCrossTheChartSingularity(int area) {
        // Resonant drive Δ = 0, Ω = 1.3: U = exp(−iHT) with H = (Ω/2)σx is exact; at Ωt = π the coordinate
        // X22 = cos(Ωt/2) of the ladder chart vanishes (g1, g3 → ∞), so the run must re-anchor (Wei and Norman,
        // J. Math. Phys. 4 (1963) 575: coordinates of the second kind are local). Tolerance 1e-12 ⇒ error ≤ 1e-9.
        double omega = 1.3, t = area * Math.PI / omega;
        Operator sp = WeiNormanSu2Test.SP, sm = WeiNormanSu2Test.SM;
        Hamiltonian h = Hamiltonian.builder(2).term(omega / 2, Pauli.x()).build();
        WeiNorman chart = WeiNorman.of(List.of(sp, Pauli.z(), sm));
        double[] samples = new double[60];
        for (int k = 0; k < samples.length; k++) {
            samples[k] = t * (k + 0.5) / samples.length;
        }
        CoordinateRun run = chart.integrate(h, 0, t, 1e-12, samples, (f, c) -> true);
        assertNull(run.failure);
        Operator exact = Pauli.x().expMinusI(omega / 2 * t);
        assertTrue(maxDiff(exact, run.propagator) <= 1e-9, "error " + maxDiff(exact, run.propagator));
        assertTrue(run.charts >= 1 + area, "charts " + run.charts);
        // the monitor re-anchors before the error grows: every sampled propagator is accurate
        for (int k = 0; k < samples.length; k++) {
            Operator ex = Pauli.x().expMinusI(omega / 2 * samples[k]);
            double err = maxDiff(ex, run.propagators.get(k));
            assertTrue(err <= 1e-9, "t = " + samples[k] + ": error " + err);
        }
        // through the evolution builder
        Evolution ev = wn(chart, h, 0, t, 1e-12);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertTrue(maxDiff(exact, ev.propagator()) <= 1e-9);
        assertEquals(run.charts, ev.stats().charts());
        // without re-anchoring the chart cannot pass the pole: a failed status, never a wrong number
        Evolution bad = wn(chart.withoutReanchoring(), h, 0, t, 1e-12);
        assertFalse(bad.status().isSuccess());
    }

    @ParameterizedTest(name = "j = {0}")
    @ValueSource(doubles = {0.5, 1, 3.5, 10})
    void spinLadderChartMatchesReference(double j) {
        // Reference: Commons Math DP853 on the full (2j+1)-dimensional equation at tolerance 1e-12. The chart
        // integrates 3 coordinates at 1e-12; the growth limit bounds cancellation in the product to ~1e3·eps·‖·‖.
        Spin s = Spin.of(j);
        Hamiltonian h = spinField(s);
        WeiNorman chart = WeiNorman.of(ladder(s));
        assertEquals(3, chart.dimension());
        assertEquals(s.dim(), chart.representationDim());
        Evolution ev = wn(chart, h, 0, 6, 1e-12);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        double err = maxDiff(reference(h, 0, 6), ev.propagator());
        assertTrue(err <= 1e-8, "j = " + j + ": error " + err);
    }

    @ParameterizedTest(name = "j = {0}")
    @ValueSource(doubles = {0.5, 3.5, 10})
    void antiHermitianSpinChartMatchesReference(double j) {
        // Chart exp(g1(−iJz)) exp(g2(−iJy)) exp(g3(−iJx)) with real coordinates (Tait–Bryan angles, gimbal lock at
        // g2 = ±π/2 handled by re-anchoring); unitary factors, so the reconstruction has no cancellation. Reference as
        // above (DP853 on the full equation at 1e-12).
        Spin s = Spin.of(j);
        Hamiltonian h = spinField(s);
        WeiNorman chart = WeiNorman.of(List.of(s.z().timesI().scale(-1), s.y().timesI().scale(-1),
                s.x().timesI().scale(-1)));
        Evolution ev = wn(chart, h, 0, 6, 1e-12);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        double err = maxDiff(reference(h, 0, 6), ev.propagator());
        assertTrue(err <= 1e-8, "j = " + j + ": error " + err);
        for (Complex g : ev.coordinates().last()) {
            assertTrue(Math.abs(g.getImaginary()) <= 1e-9);
        }
    }

    @ParameterizedTest(name = "j = {0}")
    @ValueSource(doubles = {1, 3.5, 10})
    void spinJPropagatorIsTheSpinJRepresentationOfTheSpinHalfOne(double j) {
        // Common practice (the Wigner D-matrix): the spin-j propagator of H = b(t)·J is D^j(α, β, γ) =
        // e^{−iαJz}e^{−iβJy}e^{−iγJz} with the Euler angles of the spin-½ propagator; and the ladder chart's
        // coordinates are the same for every j (the structure constants do not depend on j).
        Spin half = Spin.of(0.5), s = Spin.of(j);
        WeiNorman c2 = WeiNorman.of(ladder(half)).withoutReanchoring();
        WeiNorman cj = WeiNorman.of(ladder(s)).withoutReanchoring();
        double t = 0.8;
        Evolution e2 = wn(c2, spinField(half), 0, t, 1e-13);
        Evolution ej = wn(cj, spinField(s), 0, t, 1e-13);
        assertTrue(e2.status().isSuccess() && ej.status().isSuccess());
        Complex[] g2 = e2.coordinates().last(), gj = ej.coordinates().last();
        for (int k = 0; k < 3; k++) {
            assertTrue(g2[k].subtract(gj[k]).abs() <= 1e-11, "coordinate " + k + ": " + g2[k] + " vs " + gj[k]);
        }
        Operator u = e2.propagator();
        Complex a = u.get(0, 0), b = u.get(0, 1);
        double beta = 2 * Math.atan2(b.abs(), a.abs());
        double argA = a.getArgument(), argMb = b.negate().getArgument();
        double alpha = -argA - argMb, gamma = -argA + argMb;
        Operator d = s.z().expMinusI(alpha).times(s.y().expMinusI(beta)).times(s.z().expMinusI(gamma));
        double err = maxDiff(d, cj.propagator(g2));
        assertTrue(err <= 1e-10, "j = " + j + ": |D^j − U_j(g)| = " + err);
        assertTrue(maxDiff(d, ej.propagator()) <= 1e-10);
    }

    @Test
    void su3DrivenThreeLevelSystemInGellMannBasis() {
        // Λ system: detunings plus two drives on λ1 (levels 0–1) and λ6 (levels 1–2); chart of −iλ_a/2, a = 1..8.
        List<Operator> gm = Levels.gellMann(3);
        List<Operator> basis = new ArrayList<>();
        for (Operator l : gm) {
            basis.add(l.timesI().scale(-0.5));
        }
        WeiNorman chart = WeiNorman.of(basis);
        assertEquals(8, chart.dimension());
        Hamiltonian h = Hamiltonian.builder(3).term(0.3, gm.get(2)).term(-0.2, gm.get(7))
                .term(gm.get(0), Drive.cosine(0.8, 1.0, 0)).term(gm.get(5), Drive.cosine(0.6, 1.4, 0)).build();
        Evolution ev = wn(chart, h, 0, 5, 1e-12);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertTrue(maxDiff(reference(h, 0, 5), ev.propagator()) <= 1e-8);
        // Hermitian H in an anti-Hermitian basis: the coordinates stay real
        for (Complex g : ev.coordinates().last()) {
            assertTrue(Math.abs(g.getImaginary()) <= 1e-9, "coordinate " + g);
        }
    }

    @Test
    void su3CartanWeylLadderIsRiccati() {
        // sl(3) in the ordering (E01, E02, E12, H1, H2, E10, E20, E21) — raising, Cartan, lowering — gives a
        // hierarchy of at most quadratic equations (block Gauss decomposition; Wei and Norman 1964 for solvable
        // parts); run against the reference for a Λ system.
        List<Operator> b = List.of(Levels.unit(3, 0, 1), Levels.unit(3, 0, 2), Levels.unit(3, 1, 2),
                Operator.diagonal(1, -1, 0), Operator.diagonal(0, 1, -1), Levels.unit(3, 1, 0),
                Levels.unit(3, 2, 0), Levels.unit(3, 2, 1));
        WeiNorman chart = WeiNorman.of(b);
        assertTrue(chart.isRiccati(), chart.equations(Hamiltonian.constant(Operator.diagonal(1, 0, -1))).render());
        List<Operator> gm = Levels.gellMann(3);
        Hamiltonian h = Hamiltonian.builder(3).term(0.3, gm.get(2)).term(gm.get(0), Drive.cosine(0.8, 1.0, 0))
                .term(gm.get(5), Drive.cosine(0.6, 1.4, 0)).build();
        Evolution ev = wn(chart, h, 0, 5, 1e-12);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertTrue(maxDiff(reference(h, 0, 5), ev.propagator()) <= 1e-8);
    }

    @Test
    void twoIndependentlyDrivenQubitsSu2PlusSu2() {
        Operator i2 = Operator.identity(2);
        Operator sp = WeiNormanSu2Test.SP, sm = WeiNormanSu2Test.SM, z = Pauli.z();
        List<Operator> b = List.of(sp.kron(i2), z.kron(i2), sm.kron(i2), i2.kron(sp), i2.kron(z), i2.kron(sm));
        WeiNorman chart = WeiNorman.of(b);
        assertEquals(Nonlinearity.RICCATI, chart.nonlinearity());
        Hamiltonian h = Hamiltonian.builder(4).term(0.5, Pauli.string("ZI")).term(0.35, Pauli.string("IZ"))
                .term(Pauli.string("XI"), Drive.cosine(0.6, 1.1, 0)).term(Pauli.string("IY"), Drive.cosine(0.4, 0.7, 1))
                .build();
        Evolution ev = wn(chart, h, 0, 8, 1e-12);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertTrue(maxDiff(reference(h, 0, 8), ev.propagator()) <= 1e-8);
        assertTrue(ev.stats().charts() >= 1);
    }

    @Test
    void so5InsideTwoQubitSu4() {
        // The 10 two-qubit Pauli strings {IX,IY,IZ,XX,XY,XZ,YX,YY,YZ,ZI} close to so(5) ≅ sp(4) (products γ_aγ_b of
        // the five anticommuting strings XI, YI, ZX, ZY, ZZ; a Clifford-algebra construction, common practice).
        String[] names = {"IX", "IY", "IZ", "XX", "XY", "XZ", "YX", "YY", "YZ", "ZI"};
        List<Operator> b = new ArrayList<>();
        for (String s : names) {
            b.add(Pauli.string(s).timesI().scale(-0.5));
        }
        WeiNorman chart = WeiNorman.of(b);
        assertEquals(10, chart.dimension());
        Hamiltonian h = Hamiltonian.builder(4).term(0.5, Pauli.string("ZI")).term(0.3, Pauli.string("IZ"))
                .term(Pauli.string("XX"), Drive.cosine(0.4, 1.0, 0)).term(Pauli.string("YZ"), Drive.cosine(0.3, 1.7, 0.2))
                .build();
        Evolution ev = wn(chart, h, 0, 4, 1e-12);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertTrue(maxDiff(reference(h, 0, 4), ev.propagator()) <= 1e-8);
        assertEquals(10, ev.coordinates().last().length);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void randomAlgebraRandomOrderingMatchesReference(long seed) {
        // Property: for the closure of random Hermitian generators (sparse, so that proper subalgebras occur) and a
        // random ordering of its basis, the reconstructed U equals the full-matrix reference.
        Random r = new Random(seed);
        int n = 2 + r.nextInt(2);
        List<Operator> gens = new ArrayList<>();
        for (int k = 0; k < 2; k++) {
            Operator a = Seeds.randomHermitian(r, n);
            if (n == 3 && r.nextBoolean()) {
                // block structure: keep level 2 decoupled, so the algebra is u(2) ⊕ u(1) or smaller
                double[] re = a.reArray(), im = a.imArray();
                for (int q = 0; q < 2; q++) {
                    re[q * 3 + 2] = re[2 * 3 + q] = im[q * 3 + 2] = im[2 * 3 + q] = 0;
                }
                a = Operator.ofPlanar(3, re, im);
            }
            gens.add(a);
        }
        List<Operator> basis = new ArrayList<>(WnTesting.closure(gens));
        Collections.shuffle(basis, r);
        WeiNorman chart = WeiNorman.of(basis);
        Hamiltonian h = Hamiltonian.builder(n).term(gens.get(0), Drive.cosine(0.5 + r.nextDouble(), 1 + r.nextDouble(), 0))
                .term(0.3 + r.nextDouble(), gens.get(1)).build();
        double t = 1 + 2 * r.nextDouble();
        Evolution ev = wn(chart, h, 0, t, 1e-11);
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        double err = maxDiff(reference(h, 0, t), ev.propagator());
        assertTrue(err <= 1e-7, "dim " + basis.size() + ": error " + err);
    }
}
