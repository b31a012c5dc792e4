package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.testing.Seeds;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Exactly solvable and high-precision reference problems, each against its published or independently computed
 * answer. Conventions: ħ = 1, H(t) = (D(t)/2)σz + (W(t)/2)σx, i dc/dt = H c, |0⟩ = (1,0)ᵀ.
 *
 * <p>Tolerance of the adaptive runs: every scheme is run at tolerance {@value #TOL} per step (relative to the
 * Frobenius norm of U). The flow is unitary, so local errors are not amplified and the global error is at most their
 * sum (E. Hairer, S. P. Nørsett, G. Wanner, Solving Ordinary Differential Equations I, Springer 1993, §II.3, "Lady
 * Windermere's fan" with Lipschitz factor 1): N·tol·‖U‖_F after N accepted steps. For the schemes of order ≥ 4 the
 * step counts are a few hundred, and we assert {@value #GLOBAL}; the second-order midpoint rule needs ~10⁴ steps at
 * this tolerance, so its budget is that sum (with a factor 2 for the estimate's own error). So do the schemes in the
 * interaction picture: where the static part is small against the drives (Landau–Zener: Δ/2 against a sweep up to
 * 10) the frame makes the large driven part rotate, and Magnus 4 then needs ~6000 steps here (its error, 5.2e-9, stays
 * below its own estimate, 3.5e-8).
 */
class ExactSolutionsTest {
    static final double TOL = 1e-11;
    static final double GLOBAL = 1e-9;
    static final Operator X = Pauli.x(), Y = Pauli.y(), Z = Pauli.z();

    static Evolution adaptive(SchemeCases.Case c, Hamiltonian h, double t0, double t1) {
        Evolution ev = Evolve.of(h).over(t0, t1).scheme(c.get()).tolerance(TOL).run();
        assertTrue(ev.status().isSuccess(), () -> c + ": " + ev.status());
        return ev;
    }

    /** The global-error budget of an adaptive run (see the class comment). */
    static double budget(SchemeCases.Case c, Evolution ev) {
        if (c.order() >= 4 && !c.get().isInteractionPicture()) {
            return GLOBAL;
        }
        // ‖U‖_F = √n in propagator mode, ‖ψ‖ = 1 in state mode
        double normF = isStateMode(ev) ? 1 : Math.sqrt(ev.propagator().dim());
        return Math.max(GLOBAL, 2 * ev.stats().acceptedSteps() * TOL * normF);
    }

    static boolean isStateMode(Evolution ev) {
        try {
            ev.state();
            return true;
        } catch (IllegalStateException e) {
            return false;
        }
    }

    /** Runs adaptively and checks the propagator against the exact one within the budget; returns it. */
    static Operator check(SchemeCases.Case c, Hamiltonian h, double t0, double t1, Operator exact, String what) {
        Evolution ev = adaptive(c, h, t0, t1);
        assertEquals(0, Exact.maxDiff(ev.propagator(), exact), budget(c, ev), c + " on " + what);
        return ev.propagator();
    }

    /** Runs adaptively and checks the transition probability |U10|² within the budget. */
    static void checkTransition(SchemeCases.Case c, Hamiltonian h, double t0, double t1, double p) {
        Evolution ev = adaptive(c, h, t0, t1);
        Complex u10 = ev.propagator().get(1, 0);
        assertEquals(p, u10.abs() * u10.abs(), budget(c, ev), c.name());
    }

    // ------------------------------------------------------------------ Rabi

    @Test
    void rabiClosedFormMatchesTheTabulatedCaseR1() {
        // Case R1 (ω0 = 1, Ω = 0.3, ω = 0.9, t = 10), computed independently with mpmath.odefun to 30 digits;
        // closed form: I. I. Rabi, Phys. Rev. 51, 652 (1937); C. J. Foot, Atomic Physics (OUP 2005), eqs. (7.41)–(7.46)
        Operator u = ReferenceProblems.rabiExact(1, 0.3, 0.9, 10);
        Operator table = Exact.fromPairs(2, new double[][]{
                {0.3112857498591961, 0.05654599136014268}, {0.9273168974328135, 0.1999677587294452},
                {-0.9273168974328135, 0.1999677587294452}, {0.3112857498591961, -0.05654599136014268}});
        assertEquals(0, Exact.maxDiff(u, table), 1e-15);
        // P(0→1) = (Ω²/W²) sin²(Wt/2), W = √(Ω² + (ω0−ω)²)
        double w = Math.hypot(0.3, 0.1);
        assertEquals(0.89990373279569665841, Math.pow(0.3 / w * Math.sin(w * 10 / 2), 2), 1e-15);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void rabiRotatingDrive(SchemeCases.Case c) {
        ReferenceProblems.Problem p = ReferenceProblems.rabi(1, 0.3, 0.9, 10);
        check(c, p.h(), p.t0(), p.t1(), p.exact(), p.name());
        checkTransition(c, p.h(), p.t0(), p.t1(), 0.89990373279569665841);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void rabiStateVectorAtSampleTimes(SchemeCases.Case c) {
        // state mode: ψ(t) = U(t)|0⟩ with the closed-form rotating-frame propagator, at the sample times
        double[] times = {1.5, 4, 7.25};
        Evolution ev = Evolve.of(ReferenceProblems.rabi(1, 0.3, 0.9, 10).h()).over(0, 10).scheme(c.get()).tolerance(TOL)
                .state(org.liepath.core.StateVector.unit(2, 0)).sampleAt(times).run();
        assertTrue(ev.status().isSuccess(), () -> c + ": " + ev.status());
        Timeline tr = ev.timeline();
        for (double t : times) {
            int k = java.util.Arrays.binarySearch(tr.times(), t);
            assertTrue(k >= 0, c + ": no sample at t = " + t);
            Operator u = ReferenceProblems.rabiExact(1, 0.3, 0.9, t);
            org.liepath.core.StateVector exact = org.liepath.core.StateVector.of(
                    new double[]{u.re(0, 0), u.re(1, 0)}, new double[]{u.im(0, 0), u.im(1, 0)});
            // the samples are taken on the way, so their error is at most the final budget
            assertEquals(0, Exact.maxDiff(tr.state(k), exact), 2 * budget(c, ev), c + " at t = " + t);
        }
        Operator u10 = ReferenceProblems.rabiExact(1, 0.3, 0.9, 10);
        assertEquals(u10.re(1, 0), ev.state().re(1), 2 * budget(c, ev), c.name());
        assertEquals(u10.im(1, 0), ev.state().im(1), 2 * budget(c, ev), c.name());
    }

    // ------------------------------------------------------------------ mpmath references (linear drive, two qubits)

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void linearlyPolarisedDriveWithoutRotatingWaveApproximation(SchemeCases.Case c) {
        // H = (1/2)σz + 0.4 cos(t) σx; U(5) and U(10) computed independently with mpmath (18 digits)
        for (ReferenceProblems.Problem p : new ReferenceProblems.Problem[]{
                ReferenceProblems.linearDrive(), ReferenceProblems.linearDriveLong()}) {
            check(c, p.h(), p.t0(), p.t1(), p.exact(), p.name());
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void twoQubitsDriven(SchemeCases.Case c) {
        // U(5) of 0.5 ZI + 0.35 IZ + 0.25 ZZ + 0.3 cos(1.1t)(XI + IX), computed independently with mpmath
        ReferenceProblems.Problem p = ReferenceProblems.twoQubit();
        Evolution ev = adaptive(c, p.h(), p.t0(), p.t1());
        Operator u = ev.propagator();
        assertEquals(0, Exact.maxDiff(u, p.exact()), budget(c, ev), c.name());
        // populations of U|00⟩ (same source)
        double[] pop = {0.389419291141517, 0.281275396520894, 0.239958114449092, 0.0893471978884973};
        for (int k = 0; k < 4; k++) {
            assertEquals(pop[k], u.get(k, 0).abs() * u.get(k, 0).abs(), 2 * budget(c, ev), c + " population " + k);
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void threeLevelLadder(SchemeCases.Case c) {
        // U(6) computed independently with mpmath.odefun at 30 digits (reference/three_level.py)
        ReferenceProblems.Problem p = ReferenceProblems.threeLevel();
        check(c, p.h(), p.t0(), p.t1(), p.exact(), p.name());
    }

    // ------------------------------------------------------------------ self-commuting drives

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void selfCommutingDriveGivesTheExponentialOfTheIntegral(SchemeCases.Case c) {
        // [H(t), H(s)] = 0 for H(t) = f(t) A, so U(t1, t0) = exp(−i (∫f) A) exactly (the Magnus series stops at its
        // first term; W. Magnus, Commun. Pure Appl. Math. 7, 649 (1954)). Here f = cos t on [0, 10]: ∫f = sin 10,
        // and exp(−iθσx) = cos θ I − i sin θ σx (Euler's formula for Pauli vectors).
        Hamiltonian h = Hamiltonian.builder(2).term(X, Drive.cosine(1, 1)).build();
        check(c, h, 0, 10, Exact.su2Exp(0, 1, 0, 0, Math.sin(10)), "cos(t) σx");
        // a sech pulse (1/2) sech(t) σx on [−30, 30]: ∫f = gd(30) = 2 atan(tanh 15), the Gudermannian
        Hamiltonian pulse = Hamiltonian.builder(2).term(X, ((Drive) t -> 0.5 / Math.cosh(t)).named("sech")).build();
        check(c, pulse, -30, 30, Exact.su2Exp(0, 1, 0, 0, 2 * Math.atan(Math.tanh(15))), "sech(t)/2 σx");
    }

    // ------------------------------------------------------------------ Landau–Zener

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void landauZenerOnAFiniteWindow(SchemeCases.Case c) {
        // H = (αt/2)σz + (Δ/2)σx, α = Δ = 1, t ∈ [−20, 20], case L1: U(20, −20) from the exact parabolic-cylinder
        // solution, computed independently with mpmath (40 digits; DOP853 agrees to 1.2e-12)
        Evolution ev = adaptive(c, ReferenceProblems.landauZener(1, 1), -20, 20);
        Operator u = ev.propagator();
        double budget = budget(c, ev);
        assertEquals(0, u.get(0, 0).subtract(new Complex(0.46478882636428242683, 0)).abs(), budget, c + " U00");
        assertEquals(0, u.get(1, 0).subtract(new Complex(-0.16345615600049841201, -0.87020309810552481614)).abs(),
                budget, c + " U10");
        // The asymptotic probability P = exp(−2πδ), δ = Δ²/(4α) (C. Zener, Proc. R. Soc. Lond. A 137, 696 (1932))
        // holds on a finite window only up to slowly decaying oscillations; the tabulated deviation on [−20, 20] is
        // +0.0081, so that is all we may assert about it here.
        double stay = u.get(0, 0).abs() * u.get(0, 0).abs();
        double asymptotic = Math.exp(-2 * Math.PI * 0.25);
        assertEquals(0.20787957635076190855, asymptotic, 1e-16);
        assertEquals(0.2160286531130871, stay, 2 * budget, c.name());
        assertTrue(Math.abs(stay - asymptotic) <= 0.0082, c + ": |U00|² = " + stay);
    }

    @Test
    void landauZenerApproachesZenersFormulaOnAWideWindow() {
        // window [−100, 100]: finite-window |U00|² = 0.2059356759502721 (mpmath, parabolic-cylinder functions),
        // i.e. 0.0019 below exp(−π/2) (C. Zener 1932): the deviation shrinks as the window grows
        Operator u = Evolve.of(ReferenceProblems.landauZener(1, 1)).over(-100, 100)
                .scheme(Scheme.commutatorFree4Opt()).tolerance(1e-11).run().propagator();
        double stay = u.get(0, 0).abs() * u.get(0, 0).abs();
        assertEquals(0.2059356759502721, stay, 1e-8);
        assertTrue(Math.abs(stay - Math.exp(-Math.PI / 2)) <= 0.0020, "|U00|² = " + stay);
    }

    // ------------------------------------------------------------------ Rosen–Zener and Demkov–Kunike

    /** Rosen–Zener: P = sin²(πW0T/2) sech²(πDT/2) (N. Rosen, C. Zener, Phys. Rev. 40, 502 (1932)). */
    static double rosenZener(double w0, double t, double d) {
        double s = Math.sin(Math.PI * w0 * t / 2), ch = Math.cosh(Math.PI * d * t / 2);
        return s * s / (ch * ch);
    }

    /**
     * Demkov–Kunike: P = [cosh(πBT) − cos(πT√(W0² − B²))]/[cosh(πD0T) + cosh(πBT)], cos → cosh of the modulus for
     * W0 &lt; B (Yu. N. Demkov, M. Kunike, Vestn. Leningr. Univ. Fiz. Khim. 16, 39 (1969); K.-A. Suominen,
     * B. M. Garraway, Phys. Rev. A 45, 374 (1992)).
     */
    static double demkovKunike(double w0, double t, double d0, double b) {
        double q = w0 * w0 - b * b;
        double osc = q >= 0 ? Math.cos(Math.PI * t * Math.sqrt(q)) : Math.cosh(Math.PI * t * Math.sqrt(-q));
        return (Math.cosh(Math.PI * b * t) - osc) / (Math.cosh(Math.PI * d0 * t) + Math.cosh(Math.PI * b * t));
    }

    static Hamiltonian sechPulse(double w0, double width, double d0, double b) {
        return Hamiltonian.builder(2)
                .term(Z, ((Drive) t -> (d0 + b * Math.tanh(t / width)) / 2).named("detuning"))
                .term(X, ((Drive) t -> w0 / (2 * Math.cosh(t / width))).named("sech pulse"))
                .build();
    }

    @ParameterizedTest(name = "W0 = {0}, T = {1}, D = {2}")
    @CsvSource({"0.8, 1, 0.5, 0.51551011308684781521", "0.5, 2, 0.25, 0.56993396379337736547",
            "1, 1, 0, 1", "2.3, 0.7, 1.3, 0.0678259936155"})
    void rosenZenerPulse(double w0, double width, double d, double tabulated) {
        assertEquals(tabulated, rosenZener(w0, width, d), 1e-13, "formula vs table");
        // integrate over [−30T, 30T]: the sech tails beyond carry e^{−30} ≈ 1e-13 of the pulse area
        for (SchemeCases.Case c : SchemeCases.LIE_GROUP) {
            checkTransition(c, sechPulse(w0, width, d, 0), -30 * width, 30 * width, tabulated);
        }
    }

    @ParameterizedTest(name = "W0 = {0}, T = {1}, D0 = {2}, B = {3}")
    @CsvSource({"1, 1, 0.3, 0.5, 0.85822730794049151313", "2, 1, 0, 1, 0.86768288547882005943",
            "0.6, 1.5, 0.4, 1.2, 0.51895372698964495925", "1.5, 1, 1, 0.5, 0.1968234797804",
            "3, 0.8, -0.7, 2, 0.952293512991"})
    void demkovKunikePulse(double w0, double width, double d0, double b, double tabulated) {
        assertEquals(tabulated, demkovKunike(w0, width, d0, b), 1e-12, "formula vs table");
        for (SchemeCases.Case c : SchemeCases.LIE_GROUP) {
            checkTransition(c, sechPulse(w0, width, d0, b), -30 * width, 30 * width, tabulated);
        }
    }

    // ------------------------------------------------------------------ piecewise-constant drives

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void piecewiseExactEqualsTheProductOfExactExponentials(long seed) {
        Random r = new Random(seed);
        int m = 1 + r.nextInt(12);
        double[] times = new double[m + 1];
        double[][] v = new double[3][m];
        for (int s = 1; s <= m; s++) {
            times[s] = times[s - 1] + 0.05 + r.nextDouble();
        }
        for (int k = 0; k < 3; k++) {
            for (int s = 0; s < m; s++) {
                v[k][s] = 4 * r.nextDouble() - 2;
            }
        }
        Hamiltonian h = Hamiltonian.builder(2)
                .term(X, Drive.piecewiseConstant(times, v[0]))
                .term(Y, Drive.piecewiseConstant(times, v[1]))
                .term(Z, Drive.piecewiseConstant(times, v[2]))
                .build();
        // start and end inside segments, so the first and last exponentials cover partial segments
        double t0 = times[0] + 0.3 * (times[1] - times[0]), t1 = times[m] - 0.01;
        Operator exact = Operator.identity(2);
        for (int s = 0; s < m; s++) {
            double a = Math.max(times[s], t0), b = Math.min(times[s + 1], t1);
            if (b > a) {
                // each segment: exp(−i(b − a)(vx σx + vy σy + vz σz)) in closed form (Euler's formula for Pauli vectors)
                exact = Exact.su2Exp(0, v[0][s], v[1][s], v[2][s], b - a).times(exact);
            }
        }
        Evolution ev = Evolve.of(h).over(t0, t1).scheme(Scheme.piecewiseExact()).run();
        assertTrue(ev.status().isSuccess(), () -> ev.status().toString());
        // one exponential per segment: rounding only, ~ m·ε per entry
        assertEquals(0, Exact.maxDiff(ev.propagator(), exact), 1e-14, "seed " + seed);
        assertTrue(Exact.unitarityDefect(ev.propagator()) <= 1e-14);
    }

    @Test
    void piecewiseExactOnTwoQubitsEqualsKroneckerProductsOfExactExponentials() {
        // H_s = a_s·σ ⊗ I + I ⊗ b_s·σ commute across the two factors, so exp(−iτH_s) = exp(−iτ a_s·σ) ⊗ exp(−iτ b_s·σ)
        Random r = new Random(20261201);
        int m = 8;
        double[] times = new double[m + 1];
        for (int s = 1; s <= m; s++) {
            times[s] = times[s - 1] + 0.2 + r.nextDouble();
        }
        String[] letters = {"XI", "YI", "ZI", "IX", "IY", "IZ"};
        double[][] v = new double[6][m];
        Hamiltonian.Builder b = Hamiltonian.builder(4);
        for (int k = 0; k < 6; k++) {
            for (int s = 0; s < m; s++) {
                v[k][s] = 3 * r.nextDouble() - 1.5;
            }
            b.term(Pauli.string(letters[k]), Drive.piecewiseConstant(times, v[k]));
        }
        Operator exact = Operator.identity(4);
        for (int s = 0; s < m; s++) {
            double tau = times[s + 1] - times[s];
            Operator left = Exact.su2Exp(0, v[0][s], v[1][s], v[2][s], tau);
            Operator right = Exact.su2Exp(0, v[3][s], v[4][s], v[5][s], tau);
            exact = left.kron(right).times(exact);
        }
        Evolution ev = Evolve.of(b.build()).over(times[0], times[m]).scheme(Scheme.piecewiseExact()).run();
        assertTrue(ev.status().isSuccess(), () -> ev.status().toString());
        assertEquals(0, Exact.maxDiff(ev.propagator(), exact), 1e-14);
    }
}
