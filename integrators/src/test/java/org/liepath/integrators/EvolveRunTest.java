package org.liepath.integrators;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;
import org.liepath.core.StateVector;
import org.liepath.core.Superoperator;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Statuses, modes, sampling, listeners and thread safety of Evolve runs. */
class EvolveRunTest {
    static List<Scheme> schemes() {
        return Fixtures.steppable();
    }

    /** exp(−iθ n·σ) = cos θ I − i sin θ (n·σ) for a unit vector n (textbook identity, e.g. M.A. Nielsen, I.L.
     *  Chuang, Quantum Computation and Quantum Information, CUP 2000, exercise 4.2; from memory). */
    static Operator pauliExp(double bx, double bz, double t) {
        double b = Math.hypot(bx, bz), th = b * t;
        Operator ns = Pauli.string("X").scale(bx / b).plus(Pauli.string("Z").scale(bz / b));
        return Operator.identity(2).scale(Math.cos(th)).minus(ns.timesI().scale(Math.sin(th)));
    }

    /** Two constant segments: U = exp(−i 0.6 H2) exp(−i 0.4 H1), from the closed form of qubit exponentials. */
    @Test
    void piecewiseExactMatchesClosedForm() {
        Operator exact = pauliExp(-0.4, 0.6, 0.6).times(pauliExp(0.9, 0.6, 0.4));
        Evolution ev = Evolve.of(Fixtures.piecewiseQubit()).over(0, 1).scheme(Scheme.piecewiseExact()).run();
        assertEquals(0.0, ev.propagator().distance(exact), 1e-15 * 8);
        assertEquals(2, ev.stats().acceptedSteps(), "one step per segment");
        assertEquals(2, ev.stats().exponentials());
        assertEquals(0.0, ev.errorEstimate());
    }

    /**
     * Fixed-step runs estimate their error after the fact from a sample of grid steps (step doubling on up to eight
     * steps, scaled to all of them). Against a converged run (Magnus 8, 4000 steps), for step counts inside each
     * scheme's asymptotic range, the estimate is at least half the true global error and at most ten times it: it
     * estimates a sum of local errors (a linear-accumulation bound, common practice: E. Hairer, S.P. Nørsett,
     * G. Wanner, Solving Ordinary Differential Equations I, Springer 1993, §II.3), so it should not fall below the
     * error by more than the sampling of eight steps allows, and partial cancellation of the local errors of a smooth
     * unitary flow keeps it within an order of magnitude above; and it falls
     * by 2^p within 30 % when the steps are halved (local errors of order p+1 summed over twice as many steps).
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void fixedStepRunsEstimateTheirError(Scheme s) {
        Hamiltonian h = Fixtures.drivenFour(23);
        Operator exact = Evolve.of(h).over(0, 2).scheme(Scheme.magnus8()).steps(4000).run().propagator();
        int p = s.order();
        // steps where the error is well above rounding (~1e-13) and inside the asymptotic range
        int n = p <= 2 ? 400 : p == 4 ? 60 : 16;
        Evolution coarse = Evolve.of(h).over(0, 2).scheme(s).steps(n).run();
        Evolution fine = Evolve.of(h).over(0, 2).scheme(s).steps(2 * n).run();
        double err = coarse.propagator().distance(exact) / 2; // relative Frobenius (‖U‖_F = 2)
        double est = coarse.errorEstimate(), estFine = fine.errorEstimate();
        // measured estimate/error: 2.5–6.9 over the seven schemes
        assertTrue(est >= err / 2 && est <= 10 * err, s.name() + ": error " + err + " vs estimate " + est);
        double slope = Math.log(est / estFine) / Math.log(2);
        assertEquals(p, slope, 0.3 * p, s.name() + ": estimate " + est + " then " + estFine);
        assertEquals(est, coarse.errorEstimate(), "made once, then kept");
    }

    /** State-vector and GKLS runs on fixed steps get an estimate too (measured on their initial state). */
    @Test
    void fixedStepStateAndDensityRunsEstimate() {
        Hamiltonian h = Fixtures.drivenFour(5);
        StateVector psi = StateVector.unit(4, 1);
        StateVector exact = Evolve.of(h).over(0, 2).scheme(Scheme.magnus8()).steps(4000).state(psi).run().state();
        Evolution ev = Evolve.of(h).over(0, 2).scheme(Scheme.magnus4()).steps(40).state(psi).run();
        double err = ev.state().distance(exact);
        assertTrue(ev.errorEstimate() >= err / 10 && ev.errorEstimate() <= 100 * err,
                "error " + err + " vs estimate " + ev.errorEstimate());
        Lindbladian l = Lindbladian.builder(h).jump(0.1, Operator.unit(4, 0, 1)).build();
        Evolution d = Evolve.of(l).over(0, 1).scheme(Scheme.commutatorFree4()).steps(20).run();
        assertTrue(d.errorEstimate() > 0 && d.errorEstimate() < 1e-3, "estimate " + d.errorEstimate());
    }

    /**
     * The tolerance is honoured: against a converged run (Magnus 8, 4000 fixed steps: error ~ C h^8 far below 1e-13),
     * the global error of an adaptive run at tol is within ten times its own error estimate (plus rounding), and the
     * estimate is not absurdly pessimistic: below 1000·tol (a run of up to ~1000 steps), or within ten times the
     * true error (the exponential midpoint rule in the interaction picture of this static part, which is no larger
     * than the drives, needs ~1600 steps; its estimate, the sum of honest local estimates, is 4.5 times its error).
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void adaptiveRunsMeetTheirEstimate(Scheme s) {
        Hamiltonian h = Fixtures.drivenFour(23);
        Operator exact = Evolve.of(h).over(0, 2).scheme(Scheme.magnus8()).steps(4000).run().propagator();
        double tol = 1e-9;
        Evolution ev = Evolve.of(h).over(0, 2).scheme(s).tolerance(tol).run();
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        double err = ev.propagator().distance(exact) / 2; // relative Frobenius (‖U‖_F = 2)
        assertTrue(err <= 10 * ev.errorEstimate() + 1e-12, "error " + err + " vs estimate " + ev.errorEstimate());
        assertTrue(ev.errorEstimate() < 1000 * tol || ev.errorEstimate() < 10 * err,
                "estimate " + ev.errorEstimate() + " vs error " + err);
    }

    /**
     * A generator that commutes with itself, H = cos(t) X: U(t) = exp(−i sin(t) X) = cos(sin t) I − i sin(sin t) X.
     * An embedded partner on the same nodes would be blind to the quadrature error here (they share the quadrature
     * of ∫A); the adaptive run must still meet its tolerance (global error ≲ steps × tol).
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void selfCommutingDriveMeetsTheTolerance(Scheme s) {
        Hamiltonian h = Hamiltonian.builder(2).term(Pauli.string("X"), Drive.cosine(1.0, 1.0)).build();
        double t = 10, phi = Math.sin(t);
        Operator exact = Operator.identity(2).scale(Math.cos(phi)).minus(Pauli.string("X").timesI()
                .scale(Math.sin(phi)));
        Evolution ev = Evolve.of(h).over(0, t).scheme(s).tolerance(1e-9).run();
        assertTrue(ev.propagator().distance(exact) < 1e-9 * Math.max(10, ev.stats().acceptedSteps()),
                "error " + ev.propagator().distance(exact) + " in " + ev.stats().acceptedSteps() + " steps");
    }

    @Test
    void driveFailureEndsTheRunWithItsNameAndTime() {
        Drive bad = new Drive() {
            @Override
            public double at(double t) {
                if (t > 0.5) {
                    throw new ArithmeticException("boom");
                }
                return 1.0;
            }

            @Override
            public String name() {
                return "fragile";
            }
        };
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, Pauli.string("Z")).term(Pauli.string("X"), bad).build();
        for (Evolve e : new Evolve[]{Evolve.of(h).over(0, 1), Evolve.of(h).over(0, 1).steps(20),
            Evolve.of(h).over(0, 1).scheme(Scheme.reference())}) {
            Evolution ev = e.run();
            assertEquals(Status.Kind.DRIVE_FAILED, ev.status().kind());
            assertTrue(ev.status().message().contains("fragile") && ev.status().message().contains("t = "),
                    ev.status().message());
            IllegalStateException ex = assertThrows(IllegalStateException.class, ev::propagator);
            assertTrue(ex.getMessage().contains("DRIVE_FAILED"), ex.getMessage());
            Timeline tr = ev.timeline();
            double reached = tr.time(tr.size() - 1);
            assertTrue(reached <= 0.5 && reached == ev.status().time(), "reached " + reached);
            assertTrue(Fixtures.unitarityDefect(tr.propagator(tr.size() - 1)) < 1e-6);
        }
    }

    @Test
    void nonFiniteDriveValueIsADriveFailure() {
        Hamiltonian h = Hamiltonian.builder(2).term(Pauli.string("X"), t -> t < 0.3 ? 1 : Double.NaN).build();
        Evolution ev = Evolve.of(h).over(0, 1).run();
        assertEquals(Status.Kind.DRIVE_FAILED, ev.status().kind());
        assertTrue(ev.status().message().contains("NaN"), ev.status().message());
    }

    @Test
    void listenerCancels() {
        AtomicInteger calls = new AtomicInteger();
        Evolution ev = Evolve.of(Fixtures.drivenQubit()).over(0, 5).steps(50)
                .monitor((f, c) -> calls.incrementAndGet() < 3).run();
        assertEquals(Status.Kind.CANCELLED, ev.status().kind());
        assertEquals(3, calls.get());
        assertEquals(3, ev.stats().acceptedSteps());
        assertEquals(0.3, ev.status().time(), 1e-15);
    }

    /** The listener hears about every accepted step, the last one with fraction 1; a late "stop" is moot. */
    @Test
    void listenerSeesEveryStepUpToTheEnd() {
        Evolve fixed = Evolve.of(Fixtures.drivenFour(6)).over(0, 2).steps(17);
        for (Evolve e : new Evolve[]{Evolve.of(Fixtures.drivenFour(6)).over(0, 2), fixed,
            Evolve.of(Fixtures.drivenFour(6)).over(0, 2).scheme(Scheme.reference())}) {
            List<Double> fractions = new ArrayList<>();
            Evolution ev = e.monitor((f, c) -> {
                fractions.add(f);
                return f < 1.0;
            }).run();
            assertTrue(ev.status().isSuccess(), ev.status().toString());
            // fixed runs report once per grid step (a grid step split at a breakpoint counts once)
            long expected = e == fixed ? 17 : ev.stats().acceptedSteps();
            assertEquals(expected, fractions.size());
            assertEquals(1.0, fractions.get(fractions.size() - 1), 1e-12);
        }
    }

    @Test
    void throwingListenerDoesNotCorruptTheResult() {
        AtomicInteger calls = new AtomicInteger();
        Evolve e = Evolve.of(Fixtures.drivenQubit()).over(0, 2);
        Evolution quiet = e.run();
        Evolution ev = e.monitor((f, c) -> {
            calls.incrementAndGet();
            throw new IllegalStateException("listener bug");
        }).observe((t, dt, err) -> {
            throw new UnsupportedOperationException("observer bug");
        }).run();
        assertTrue(ev.status().isSuccess());
        assertEquals(1, calls.get(), "a listener that threw is not called again");
        assertTrue(ev.stats().monitorFailure().contains("listener bug"));
        assertTrue(ev.stats().observerFailure().contains("observer bug"));
        assertTrue(ev.status().message().contains("listener bug"));
        assertArrayEquals(quiet.propagator().reArray(), ev.propagator().reArray());
        assertArrayEquals(quiet.propagator().imArray(), ev.propagator().imArray());
    }

    @Test
    void observerSeesEveryAcceptedStep() {
        List<Double> times = new ArrayList<>();
        Evolution ev = Evolve.of(Fixtures.drivenFour(2)).over(0, 1.5).tolerance(1e-7).sampleEveryStep()
                .observe((t, dt, err) -> times.add(t)).run();
        assertEquals(ev.stats().acceptedSteps(), times.size());
        assertEquals(times.size() + 1, ev.timeline().size());
        assertEquals(1.5, times.get(times.size() - 1), 0.0);
        // steps land exactly on the window's breakpoints 0.3 and 0.8
        assertTrue(times.contains(0.3) && times.contains(0.8), times.toString());
    }

    @Test
    void stepLimit() {
        Evolution ev = Evolve.of(Fixtures.drivenFour(4)).over(0, 10).tolerance(1e-12).maxSteps(5).run();
        assertEquals(Status.Kind.STEP_LIMIT, ev.status().kind());
        assertTrue(ev.status().message().contains("5"), ev.status().message());
        assertThrows(IllegalStateException.class, ev::propagator);
    }

    /** A tolerance far below rounding cannot be met: the step size underflows and the run says so. */
    @Test
    void impossibleToleranceEndsWithStepUnderflow() {
        for (Scheme s : List.of(Scheme.commutatorFree4Opt(), Scheme.magnus4(), Scheme.magnus6())) {
            Evolution ev = Evolve.of(Fixtures.drivenQubit()).over(0, 1).scheme(s).tolerance(1e-300).run();
            assertEquals(Status.Kind.STEP_UNDERFLOW, ev.status().kind(), s.name());
            assertTrue(ev.status().message().contains("fell below"), ev.status().message());
        }
        Evolution ref = Evolve.of(Fixtures.drivenQubit()).over(0, 1).scheme(Scheme.reference()).tolerance(1e-300)
                .run();
        assertTrue(!ref.status().isSuccess(), ref.status().toString());
    }

    @Test
    void samplesAreHitExactlyAndAgreeWithSeparateRuns() {
        Hamiltonian h = Fixtures.drivenFour(8);
        double tol = 1e-11;
        Evolution ev = Evolve.of(h).over(0, 2).tolerance(tol).sampleAt(1.25, 0.5, 2.0, 0.0).run();
        Timeline tr = ev.timeline();
        assertArrayEquals(new double[]{0.0, 0.5, 1.25, 2.0}, tr.times());
        Operator half = Evolve.of(h).over(0, 0.5).tolerance(tol).run().propagator();
        assertEquals(0.0, tr.propagator(1).distance(half), 1e-8);
        assertEquals(0.0, tr.propagator(0).distance(Operator.identity(4)), 0.0);
        assertThrows(IllegalStateException.class, () -> tr.state(0));
        // backward runs sample in the order reached
        Timeline back = Evolve.of(h).over(2, 0).steps(8).sampleAt(0.5, 1.25).run().timeline();
        assertArrayEquals(new double[]{2.0, 1.25, 0.5, 0.0}, back.times());
    }

    @Test
    void stateModeEqualsPropagatorTimesState() {
        Hamiltonian h = Fixtures.drivenFour(12);
        StateVector psi = StateVector.unit(4, 2);
        Evolve e = Evolve.of(h).over(0, 1.7).steps(60);
        StateVector out = e.state(psi).run().state();
        StateVector viaU = psi.apply(e.run().propagator());
        assertEquals(0.0, out.distance(viaU), 1e-14);
        // 180 unitary factors applied to a vector, each off unitarity by a few ulps
        assertEquals(1.0, out.norm(), 1e-13);
        assertThrows(IllegalStateException.class, () -> e.state(psi).run().propagator());
    }

    /**
     * Large vector states use the Krylov action of each exponential (accuracy 1e-14 per exponential): the state run
     * agrees with the dense propagator applied to ψ to ~ (number of exponentials) × 1e-14.
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void largeStatesUseKrylovAndAgreeWithTheDensePropagator(Scheme s) {
        int n = 64; // the smallest dimension that takes the Krylov route
        java.util.Random r = new java.util.Random(77);
        Hamiltonian h = Hamiltonian.builder(n).term(0.1, Operator.real(Fixtures.randomSymmetric(r, n)))
                .term(Operator.real(Fixtures.randomSymmetric(r, n)), Drive.cosine(0.05, 2.0)).build();
        StateVector psi = StateVector.of(r.doubles(n).toArray(), r.doubles(n).toArray()).normalized();
        Evolve e = Evolve.of(h).over(0, 1).scheme(s).steps(4);
        Evolution ev = e.state(psi).run();
        StateVector dense = psi.apply(e.run().propagator());
        long exps = ev.stats().exponentials();
        assertEquals(0.0, ev.state().distance(dense), 1e-14 * exps + 1e-13);
        assertEquals(1.0, ev.state().norm(), 1e-14 * exps + 1e-13);
    }

    /** Many threads evolving the same configuration give identical bits. */
    @Test
    void parallelRunsEqualSequentialOnes() throws Exception {
        Evolve e = Evolve.of(Fixtures.drivenFour(31)).over(0, 3).tolerance(1e-9);
        Operator seq = e.run().propagator();
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<Operator>> fs = new ArrayList<>();
            for (int k = 0; k < 8; k++) {
                fs.add(pool.submit(() -> e.run().propagator()));
            }
            for (Future<Operator> f : fs) {
                assertEquals(seq, f.get());
            }
        } finally {
            pool.shutdown();
        }
    }

    /**
     * Amplitude damping with a Rabi drive switched off (H = 0 part time independent): populations and coherence
     * follow the closed form ρ11(t) = e^{−Γt} ρ11(0), ρ01(t) = e^{−Γt/2} ρ01(0) (H.-P. Breuer, F. Petruccione, The
     * Theory of Open Quantum Systems, OUP 2002, §3.4 — from memory), computed with one exponential.
     */
    @Test
    void amplitudeDampingClosedForm() {
        double gamma = 0.7, t = 1.9;
        Hamiltonian zero = Hamiltonian.builder(2).term(0.0, Pauli.string("Z")).build();
        Lindbladian l = Lindbladian.builder(zero).jump(gamma, Operator.unit(2, 0, 1)).build();
        Operator rho0 = Operator.of(new double[][]{{0.3, 0.2}, {0.2, 0.7}}, new double[][]{{0, 0.1}, {-0.1, 0}});
        Evolution ev = Evolve.of(l).over(0, t).density(rho0).run();
        Operator rho = ev.density();
        assertEquals(1, ev.stats().exponentials(), "a time-independent generator takes one exponential");
        assertEquals(Math.exp(-gamma * t) * 0.7, rho.re(1, 1), 1e-14);
        assertEquals(0.3 + (1 - Math.exp(-gamma * t)) * 0.7, rho.re(0, 0), 1e-14);
        assertEquals(Math.exp(-gamma * t / 2) * 0.2, rho.re(0, 1), 1e-14);
        assertEquals(Math.exp(-gamma * t / 2) * 0.1, rho.im(0, 1), 1e-14);
        assertTrue(ev.minEigenvalue() > 0);
    }

    /** The schemes that serve GKLS generators. */
    static List<Scheme> openSchemes() {
        return Fixtures.steppableOpen();
    }

    /** Driven open system: trace preserved to rounding, channel and density modes agree, positivity holds. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("openSchemes")
    void drivenOpenSystem(Scheme s) {
        Lindbladian l = Lindbladian.builder(Fixtures.drivenQubit()).jump(0.3, Operator.unit(2, 0, 1))
                .jump(0.1, Pauli.string("Z")).build();
        Operator rho0 = Operator.unit(2, 1, 1);
        Evolution dens = Evolve.of(l).over(0, 3).scheme(s).tolerance(1e-10).density(rho0).run();
        Evolution chan = Evolve.of(l).over(0, 3).scheme(s).tolerance(1e-10).run();
        assertTrue(dens.status().isSuccess() && chan.status().isSuccess());
        // each step's generator annihilates the trace exactly in exact arithmetic: only rounding remains
        assertEquals(1.0, dens.density().trace().getReal(), 1e-13);
        Superoperator map = chan.channel();
        assertTrue(map.traceDefect() < 1e-13, "trace defect " + map.traceDefect());
        assertEquals(0.0, map.apply(rho0).distance(dens.density()), 1e-8);
        assertTrue(dens.minEigenvalue() > -1e-12);
        assertTrue(chan.minEigenvalue() > -1e-9, "Choi minimum " + chan.minEigenvalue());
        assertThrows(IllegalStateException.class, dens::propagator);
        assertThrows(IllegalStateException.class, dens::coordinates);
    }

    /**
     * Wei–Norman runs are routed to the chart's coordinate integrator and wrapped: the propagator agrees with a
     * Magnus 6 run at the tolerance, coordinates are available, and misuse is refused.
     */
    @Test
    void weiNormanRunsAreRoutedToTheChart() {
        Hamiltonian h = Fixtures.drivenQubit();
        WeiNorman chart = WeiNorman.of(List.of(Spin.of(0.5).plus(), Spin.of(0.5).z(), Spin.of(0.5).minus()));
        Evolution wn = Evolve.of(h).over(0, 2).scheme(Scheme.weiNorman(chart)).tolerance(1e-11).sampleAt(1.0).run();
        assertTrue(wn.status().isSuccess(), wn.status().toString());
        Operator ref = Evolve.of(h).over(0, 2).scheme(Scheme.magnus6()).tolerance(1e-12).run().propagator();
        assertEquals(0.0, wn.propagator().distance(ref), 1e-8);
        assertEquals(3, wn.coordinates().last().length);
        assertTrue(wn.stats().charts() >= 1);
        StateVector psi = Evolve.of(h).over(0, 2).scheme(Scheme.weiNorman(chart)).tolerance(1e-11)
                .state(StateVector.unit(2, 0)).run().state();
        assertEquals(0.0, psi.distance(StateVector.unit(2, 0).apply(ref)), 1e-8);
        assertThrows(IllegalStateException.class, () -> Evolve.of(h).over(0, 1).run().coordinates());
        Lindbladian l = Lindbladian.builder(h).jump(0.1, Pauli.string("Z")).build();
        EvolveInputTest.refused(org.liepath.core.InvalidInputException.Reason.UNSUPPORTED, "scheme",
                "Hamiltonians only", () -> Evolve.of(l).over(0, 1).scheme(Scheme.weiNorman(chart)).run());
        EvolveInputTest.refused(org.liepath.core.InvalidInputException.Reason.UNSUPPORTED, "steps",
                "10 fixed steps", () -> Evolve.of(h).over(0, 1).scheme(Scheme.weiNorman(chart)).steps(10).run());
    }

    /**
     * Reference and Wei–Norman runs estimate their global error by a second run at a tolerance 100 times smaller.
     * Truth: Magnus 8 with 4000 fixed steps on [0, 2] (global error ~ (2/4000)^8, far below 1e-14). With the error
     * of the second run ~1 % of the first's (tolerance proportionality, Hairer–Nørsett–Wanner, Solving ODEs I,
     * §II.4), estimate/true lies near 1: measured 0.987–0.995 for both integrators at the three tolerances. The
     * interval [0.8, 1.25] allows the second run an error up to 20 % of the first's (a rough proportionality).
     */
    @Test
    void referenceAndWeiNormanRunsEstimateTheirError() {
        Hamiltonian h = Fixtures.drivenQubit();
        Operator truth = Evolve.of(h).over(0, 2).scheme(Scheme.magnus8()).steps(4000).run().propagator();
        WeiNorman chart = WeiNorman.of(List.of(Spin.of(0.5).plus(), Spin.of(0.5).z(), Spin.of(0.5).minus()));
        for (Scheme s : List.of(Scheme.reference(), Scheme.weiNorman(chart))) {
            for (double tol : new double[]{1e-5, 1e-7, 1e-9}) {
                Evolution ev = Evolve.of(h).over(0, 2).scheme(s).tolerance(tol).run();
                assertTrue(ev.status().isSuccess(), ev.status().toString());
                double err = ev.propagator().distance(truth) / Math.sqrt(2);
                double est = ev.errorEstimate();
                assertTrue(est >= 0.8 * err && est <= 1.25 * err, s.name() + " tol " + tol + ": error " + err
                        + ", estimate " + est + " (ratio " + est / err + ")");
                assertEquals(est, ev.errorEstimate(), "made once, then kept");
            }
            // no tighter tolerance to compare with: no estimate rather than a wrong one
            assertTrue(Double.isNaN(Evolve.of(h).over(0, 0.1).scheme(s).tolerance(1e-15).run().errorEstimate()));
        }
    }

    /**
     * A large energy offset E·I only multiplies the propagator by the phase e^{−iE(t1−t0)}, since it commutes with
     * everything (common practice). With E = 2000 each step's exponent has ‖Ω‖₁ ≈ 2000·h = 200, beyond the Padé
     * limit before the shift; the Gershgorin-centre shift removes it, so the steps stay on the Padé route. Tolerance:
     * the phase E·h of each of the steps is rounded to u·E·h, so over the run ≈ u·E·T = 4.4e-13, plus the
     * scheme's own rounding (measured 0.9e-13 … 4.5e-13); 2e-12 leaves room. Unitarity as for every run.
     */
    @Test
    void largeEnergyOffsetsAreAPhase() {
        java.util.Random r = new java.util.Random(17);
        for (int n : new int[]{3, 6}) {
            Operator k = org.liepath.testing.Seeds.randomHermitian(r, n);
            Operator v = org.liepath.testing.Seeds.randomHermitian(r, n);
            Hamiltonian plain = Hamiltonian.builder(n).term(1.0, k).term(v, Drive.cosine(0.3, 1.1)).build();
            Hamiltonian offset = Hamiltonian.builder(n).term(1.0, k.plus(Operator.identity(n).scale(2000.0)))
                    .term(v, Drive.cosine(0.3, 1.1)).build();
            for (Scheme s : List.of(Scheme.magnus4(), Scheme.magnus6(), Scheme.commutatorFree4Opt())) {
                Operator u0 = Evolve.of(plain).over(0, 1).scheme(s).steps(10).run().propagator();
                Operator u1 = Evolve.of(offset).over(0, 1).scheme(s).steps(10).run().propagator();
                Operator want = u0.scale(new org.apache.commons.math3.complex.Complex(Math.cos(2000.0),
                        -Math.sin(2000.0)));
                assertEquals(0.0, u1.distance(want), 2e-12, s.name() + ", n = " + n);
                assertEquals(0.0, u1.dagger().times(u1).distance(Operator.identity(n)), 1e-13, "unitarity");
            }
        }
    }

    @Test
    void statsPrintAsATable() {
        Evolution ev = Evolve.of(Fixtures.drivenQubit()).over(0, 1).run();
        String table = ev.stats().toString();
        assertTrue(table.contains("accepted steps") && table.contains("exponentials") && table.contains("wall time"),
                table);
        assertTrue(ev.toString().contains("CF4:3Opt"));
    }
}
