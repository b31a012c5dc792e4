package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Schemes in the interaction picture of the static part ({@link Scheme#inInteractionPicture()}): exact where the frame
 * makes the problem time independent, the same propagator as the Schrödinger-picture scheme at convergence, unitary
 * for every step size, fewer steps for a strong static part, the stepper's bit identity, and the refusals. (The
 * general contract suite, the exactly solvable problems and the observed orders run these schemes too, through
 * {@link Fixtures} and {@link SchemeCases}.)
 */
class InteractionPictureTest {
    static List<Scheme> schemes() {
        return List.of(Scheme.exponentialMidpoint().inInteractionPicture(), Scheme.magnus4().inInteractionPicture(),
                Scheme.magnus6().inInteractionPicture(), Scheme.magnus8().inInteractionPicture());
    }

    /** A random complex Hermitian n×n matrix (entries N(0, 1), symmetrised) scaled by s. */
    static Operator randomHermitian(Random r, int n, double s) {
        double[] re = new double[n * n], im = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            re[k] = r.nextGaussian();
            im[k] = r.nextGaussian();
        }
        Operator g = Operator.ofPlanar(n, re, im);
        return g.plus(g.dagger()).scale(0.5 * s);
    }

    /**
     * A driven n-level system: static part diagonal (energies spread over [0, spread]) or a full random Hermitian
     * matrix of that norm, and two random drives of amplitude amp.
     */
    static Hamiltonian driven(long seed, int n, boolean diagonal, double spread, double amp) {
        Random r = new Random(seed);
        Operator h0;
        if (diagonal) {
            double[] e = new double[n];
            for (int k = 0; k < n; k++) {
                e[k] = spread * (k + 0.3 * r.nextDouble()) / n;
            }
            h0 = Operator.diagonal(e);
        } else {
            h0 = randomHermitian(r, n, spread / Math.sqrt(n));
        }
        return Hamiltonian.builder(n).term(1.0, h0)
                .term(randomHermitian(r, n, 1.0 / Math.sqrt(n)), Drive.cosine(amp, 0.7 + r.nextDouble()))
                .term(randomHermitian(r, n, 1.0 / Math.sqrt(n)), Drive.sine(amp, 1.1 + r.nextDouble(), 0.4))
                .build();
    }

    static Operator run(Hamiltonian h, Scheme s, double t0, double t1, int steps) {
        Evolution ev = Evolve.of(h).over(t0, t1).scheme(s).steps(steps).run();
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        return ev.propagator();
    }

    /**
     * The rotating drive on resonance: in the frame of H_0 = (ω0/2)σz the Hamiltonian (Ω/2)(cos ωt σx + sin ωt σy)
     * becomes (Ω/2)(cos((ω−ω0)t)σx + sin((ω−ω0)t)σy), time independent for ω = ω0, so one step of every scheme is
     * the exact propagator exp(−iω0tσz/2) exp(−iΩtσx/2) (I. I. Rabi, Phys. Rev. 51, 652 (1937); C. J. Foot, Atomic
     * Physics, OUP 2005, eqs. (7.41)–(7.46)). In the Schrödinger picture one step is nowhere near it.
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void resonantRotatingDriveIsExactInOneStep(Scheme s) {
        ReferenceProblems.Problem p = ReferenceProblems.rabi(1.3, 0.4, 1.3, 7);
        Operator u = run(p.h(), s, p.t0(), p.t1(), 1);
        // two 2×2 closed forms and a phase conjugation: a few ulps of order-one entries
        assertEquals(0, Exact.maxDiff(u, p.exact()), 1e-14, s.name());
        Operator plain = run(p.h(), Scheme.magnus8(), p.t0(), p.t1(), 1);
        assertTrue(Exact.maxDiff(plain, p.exact()) > 1e-3, "the Schrödinger-picture step is not exact");
        // and with many steps, forward and then back
        Operator back = run(p.h(), s, p.t1(), p.t0(), 17);
        assertEquals(0, Exact.maxDiff(back, p.exact().dagger()), 1e-13, s.name() + " backward");
    }

    /** Off resonance the frame still rotates: the schemes converge to the closed form (same source) at their order. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void detunedRotatingDriveConverges(Scheme s) {
        ReferenceProblems.Problem p = ReferenceProblems.rabi(1.0, 0.3, 0.9, 10);
        int steps = s.order() == 2 ? 4000 : 200;
        // global errors C·h^p (h = 2.5e-3 for the midpoint rule, 0.05 otherwise; the frame leaves a rotation at the
        // detuning 0.1 only), measured: midpoint 1.5e-8, Magnus 4 3.5e-11, Magnus 6 and 8 at rounding (9e-16)
        double budget = s.order() == 2 ? 1e-7 : s.order() == 4 ? 1e-10 : 1e-13;
        assertEquals(0, Exact.maxDiff(run(p.h(), s, 0, 10, steps), p.exact()), budget, s.name());
    }

    /**
     * A Hamiltonian of constant terms only is all frame: one step gives V e^{−iDt} V† exactly, for any step count,
     * against the propagator from Commons Math's symmetric eigendecomposition ({@link Fixtures#expMinusIReference}).
     */
    @ParameterizedTest(name = "seed {0}")
    @ValueSource(ints = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10})
    void constantHamiltonianIsTheFrameAlone(int seed) {
        Random r = new Random(seed);
        int n = 2 + seed % 5;
        double[][] a = Fixtures.randomSymmetric(r, n), b = Fixtures.randomSymmetric(r, n);
        double[][] sum = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                sum[i][j] = a[i][j] + 0.5 * b[i][j];
            }
        }
        Hamiltonian h = Hamiltonian.builder(n).term(1.0, Operator.real(a)).term(0.5, Operator.real(b)).build();
        double t = 3.0;
        Operator exact = Fixtures.expMinusIReference(sum, t);
        for (Scheme s : schemes()) {
            for (int steps : new int[]{1, 7}) {
                // ‖H‖t ≈ 10 to 20: u·n·‖H‖t for the two eigendecompositions
                assertEquals(0, Exact.maxDiff(run(h, s, 0, t, steps), exact), 2e-13, s.name() + " n=" + n);
            }
        }
    }

    /**
     * At convergence the frame changes nothing: Magnus 8 in the interaction picture with 64 steps against Magnus 8
     * in the Schrödinger picture with 512 (both far below 1e-12 here: h‖H‖ ≤ 0.1), for diagonal and full static parts.
     */
    @ParameterizedTest(name = "seed {0}")
    @ValueSource(ints = {11, 12, 13, 14, 15, 16, 17, 18})
    void agreesWithTheSchroedingerPictureAtConvergence(int seed) {
        int n = 2 + seed % 5;
        boolean diagonal = seed % 2 == 0;
        Hamiltonian h = driven(seed, n, diagonal, 3.0, 0.4);
        Operator ref = run(h, Scheme.magnus8(), 0, 2, 512);
        Operator ip = run(h, Scheme.magnus8().inInteractionPicture(), 0, 2, 64);
        assertEquals(0, Exact.maxDiff(ip, ref), 1e-12, "n=" + n + (diagonal ? " diagonal" : " full"));
    }

    /**
     * Unitary by construction for every step size, even with steps far beyond accuracy (h‖H_0‖ up to 100): the
     * defect stays at rounding level (the contract's 1e-13), for diagonal and full static parts.
     */
    @ParameterizedTest(name = "seed {0}")
    @ValueSource(ints = {21, 22, 23, 24, 25, 26, 27, 28, 29, 30})
    void unitaryForEveryStepSize(int seed) {
        int n = 2 + seed % 6;
        boolean diagonal = seed % 2 == 1;
        Hamiltonian h = driven(seed, n, diagonal, 50.0, 2.0);
        for (Scheme s : schemes()) {
            for (int steps : new int[]{1, 3, 20, 300}) {
                Operator u = run(h, s, 0, 2, steps);
                assertTrue(Exact.unitarityDefect(u) <= 1e-13, s.name() + " n=" + n + " steps=" + steps + ": "
                        + Exact.unitarityDefect(u));
            }
        }
    }

    /**
     * What the frame is for: level energies far apart (spacings ~10) and weak drives. At equal steps the error of
     * Magnus 4 and 6 drops by more than ten times (measured here: 10^2–10^4), against Magnus 8 with 4096 steps in
     * the Schrödinger picture (converged to rounding). Our own scenario.
     */
    @Test
    void strongStaticPartNeedsFarFewerSteps() {
        Operator x01 = Operator.unit(3, 0, 1).plus(Operator.unit(3, 1, 0));
        Operator x12 = Operator.unit(3, 1, 2).plus(Operator.unit(3, 2, 1));
        Hamiltonian h = Hamiltonian.builder(3).term(1.0, Operator.diagonal(0, 10, 21))
                .term(x01, Drive.cosine(0.05, 10.2)).term(x12, Drive.cosine(0.05, 10.9)).build();
        Operator ref = run(h, Scheme.magnus8(), 0, 4, 4096);
        for (Scheme s : List.of(Scheme.magnus4(), Scheme.magnus6())) {
            double plain = Exact.maxDiff(run(h, s, 0, 4, 40), ref);
            double framed = Exact.maxDiff(run(h, s.inInteractionPicture(), 0, 4, 40), ref);
            assertTrue(framed * 10 < plain, s.name() + ": " + framed + " in the frame, " + plain + " without");
        }
    }

    /**
     * An energy offset E·I is a phase: U(H + E·I) = e^{−iEt} U(H), to the rounding of the phase argument
     * (u·E·t ≈ 4.4e-13 for E = 2000, t = 1).
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void energyOffsetIsAPhase(Scheme s) {
        Hamiltonian h = driven(41, 3, false, 2.0, 0.5);
        Hamiltonian shifted = Hamiltonian.builder(3).term(1.0, h.operators().get(0).plus(Operator.identity(3).scale(2000)))
                .term(h.operators().get(1), h.drives().get(1)).term(h.operators().get(2), h.drives().get(2)).build();
        Operator u = run(h, s, 0, 1, 30).scale(new Complex(Math.cos(2000), -Math.sin(2000)));
        assertEquals(0, Exact.maxDiff(run(shifted, s, 0, 1, 30), u), 2e-12, s.name());
    }

    /** Without a constant term there is no frame: the same bits as the Schrödinger-picture scheme. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void noStaticPartMeansNoFrame(Scheme s) {
        Random r = new Random(51);
        Hamiltonian h = Hamiltonian.builder(3).term(randomHermitian(r, 3, 1), Drive.cosine(0.7, 1.3))
                .term(randomHermitian(r, 3, 1), Drive.sine(0.4, 0.8, 0)).build();
        Scheme plain = schemeWithoutFrame(s);
        assertTrue(Exact.sameBits(run(h, s, 0, 2, 13), run(h, plain, 0, 2, 13)), s.name());
    }

    static Scheme schemeWithoutFrame(Scheme s) {
        for (Scheme p : List.of(Scheme.exponentialMidpoint(), Scheme.magnus4(), Scheme.magnus6(), Scheme.magnus8())) {
            if (p.inInteractionPicture().equals(s)) {
                return p;
            }
        }
        throw new AssertionError(s.name());
    }

    /**
     * The stepper steps the frame's state and hands out the laboratory state: n calls equal the fluent run bit for
     * bit (a full static part, so the basis change is exercised), for propagators and vectors; an array the caller
     * changed between calls enters the frame afresh, exactly as a new stepper would take it.
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void stepperMatchesTheFluentTierAndReentersChangedStates(Scheme s) {
        Hamiltonian h = driven(61, 4, false, 6.0, 0.5);
        int n = 25, m = 4;
        double t0 = 0.2, t1 = 1.7, dt = (t1 - t0) / n;
        Stepper st = s.stepper(h);
        double[] u = new double[2 * m * m];
        for (int i = 0; i < m; i++) {
            u[i * m + i] = 1;
        }
        for (int k = 0; k < n; k++) {
            st.advance(t0 + k * dt, dt, u);
        }
        Operator fluent = run(h, s, t0, t1, n);
        assertTrue(Exact.sameBits(fluent, Operator.ofPlanar(m, java.util.Arrays.copyOf(u, m * m),
                java.util.Arrays.copyOfRange(u, m * m, 2 * m * m))), s.name() + " propagator");

        StateVector psi = StateVector.unit(m, 1);
        double[] v = new double[2 * m];
        v[1] = 1;
        for (int k = 0; k < n; k++) {
            st.advance(t0 + k * dt, dt, v);
        }
        Evolution ev = Evolve.of(h).over(t0, t1).scheme(s).steps(n).state(psi).run();
        for (int i = 0; i < m; i++) {
            assertEquals(ev.state().get(i).getReal(), v[i], 0.0, s.name() + " state");
            assertEquals(ev.state().get(i).getImaginary(), v[m + i], 0.0, s.name() + " state");
        }

        // change the array between calls (a kick: swap two amplitudes), then go on; a fresh stepper from the kicked
        // array must give the same bits
        double[] w = v.clone();
        swap(w, 0, 2, m);
        double[] x = w.clone();
        Stepper fresh = s.stepper(h);
        for (int k = 0; k < 5; k++) {
            st.advance(t1 + k * dt, dt, w);
            fresh.advance(t1 + k * dt, dt, x);
        }
        assertTrue(java.util.Arrays.equals(w, x), s.name() + " re-entry");
    }

    private static void swap(double[] v, int a, int b, int m) {
        for (int part = 0; part < 2; part++) {
            double tmp = v[part * m + a];
            v[part * m + a] = v[part * m + b];
            v[part * m + b] = tmp;
        }
    }

    /**
     * Vector states of Krylov size (m = 64) take the frame's phases around the Krylov action: the state equals the
     * propagator (dense exponentials) applied to the initial vector, to the Krylov tolerance times the step count.
     */
    @Test
    void krylovStatesInTheFrame() {
        Hamiltonian h = driven(71, 64, true, 20.0, 0.3);
        Scheme s = Scheme.magnus4().inInteractionPicture();
        Operator u = run(h, s, 0, 0.5, 12);
        StateVector psi = StateVector.unit(64, 5);
        StateVector out = Evolve.of(h).over(0, 0.5).scheme(s).steps(12).state(psi).run().state();
        double worst = 0;
        for (int i = 0; i < 64; i++) {
            worst = Math.max(worst, out.get(i).subtract(u.get(i, 5)).abs());
        }
        assertTrue(worst < 1e-12, "Krylov against dense: " + worst);
    }

    /** Adaptive runs with piecewise-constant drives use exact stepping, which needs the whole generator. */
    @Test
    void piecewiseConstantDrivesStepExactly() {
        Hamiltonian h = Fixtures.piecewiseQubit();
        Evolution framed = Evolve.of(h).over(0, 1.5).scheme(Scheme.magnus6().inInteractionPicture())
                .tolerance(1e-10).run();
        Evolution exact = Evolve.of(h).over(0, 1.5).scheme(Scheme.piecewiseExact()).tolerance(1e-10).run();
        assertEquals(0, Exact.maxDiff(framed.propagator(), exact.propagator()), 1e-14);
    }

    /** The scheme data are the base scheme's; the variant is a different scheme; asking twice changes nothing. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void schemeData(Scheme s) {
        Scheme base = schemeWithoutFrame(s);
        assertEquals(base.order(), s.order());
        assertEquals(base.nodes(), s.nodes());
        assertEquals(base.exponentialsPerStep(), s.exponentialsPerStep());
        assertEquals(base.commutatorsPerStep(), s.commutatorsPerStep());
        assertTrue(s.isInteractionPicture() && !base.isInteractionPicture());
        assertNotEquals(base, s);
        assertSame(s, s.inInteractionPicture());
        assertEquals(base.inInteractionPicture(), s);
        assertEquals(base.inInteractionPicture().hashCode(), s.hashCode());
        assertTrue(s.name().contains("interaction picture"), s.name());
    }

    /** Schemes of several exponentials, exact stepping and the reference are refused, naming the scheme. */
    @Test
    void refusesSchemesWithoutASingleExponential() {
        for (Scheme s : List.of(Scheme.commutatorFree4(), Scheme.commutatorFree4Opt(), Scheme.commutatorFree6(),
                Scheme.piecewiseExact(), Scheme.reference())) {
            InvalidInputException e = assertThrows(InvalidInputException.class, s::inInteractionPicture);
            assertEquals(InvalidInputException.Reason.UNSUPPORTED, e.reason());
            assertTrue(e.getMessage().contains("scheme") && e.getMessage().contains(s.name()), e.getMessage());
        }
    }

    /** Open systems are refused, by the fluent tier and by the stepper, naming the argument. */
    @Test
    void refusesOpenSystems() {
        Lindbladian l = Lindbladian.builder(Fixtures.drivenQubit()).jump(0.2, Operator.unit(2, 0, 1)).build();
        Scheme s = Scheme.magnus4().inInteractionPicture();
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> Evolve.of(l).over(0, 1).scheme(s).steps(10).run());
        assertEquals(InvalidInputException.Reason.UNSUPPORTED, e.reason());
        assertTrue(e.getMessage().contains("l") && e.getMessage().contains("Lindbladian"), e.getMessage());
        e = assertThrows(InvalidInputException.class, () -> s.stepper(l));
        assertEquals(InvalidInputException.Reason.UNSUPPORTED, e.reason());
    }
}
