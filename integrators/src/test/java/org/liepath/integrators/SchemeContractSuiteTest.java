package org.liepath.integrators;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;
import org.liepath.testing.Seeds;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The contract every scheme passes (one parameterized suite over all schemes, each with its own calibrated budget):
 * zero generator → identity, constant generator → the exact exponential, the group property
 * U(t2,t0) = U(t2,t1) U(t1,t0), backward runs give the inverse, unitarity for every step size, inputs untouched,
 * and parallel runs equal sequential ones bit for bit.
 *
 * <p>Budgets. The exponential schemes evaluate exp(−i h Σ α_k H(t_k)) with Σ α = 1 (Magnus schemes also add
 * commutators that vanish for a constant H), so for a constant H they are exact in exact arithmetic and only rounding
 * remains. Each exponential and each product of d×d matrices commits an error of about d·u (u = 2⁻⁵³; N. J.
 * Higham, Accuracy and Stability of Numerical Algorithms, SIAM 2002, §3.5), and N of them accumulate at most
 * linearly, so the rounding budget of a run with N exponentials is max(1e-13, 4·d·u·N): 1e-13 up to ~60 exponentials
 * of a 3×3 problem, growing linearly beyond (the same bound serves unitarity). The Runge–Kutta reference is only as good as its tolerance: its budget is 1e3·tol
 * (global error of an adaptive method is a modest multiple of the local tolerance over a few periods; common practice).
 */
class SchemeContractSuiteTest {
    /** Floor of the rounding budget (see class comment). */
    static final double ROUNDING = 1e-13;
    /** Unit roundoff 2⁻⁵³. */
    static final double U = 0x1p-53;
    /** Tolerance given to the reference integrator in these tests. */
    static final double REF_TOL = 1e-12;
    /** Its budget: 1e3 × tolerance. */
    static final double REF_BUDGET = 1e3 * REF_TOL;

    static Evolve configured(SchemeCases.Case c, Evolve b, int steps) {
        return c.fixedStep() ? b.scheme(c.get()).steps(steps) : b.scheme(c.get()).tolerance(REF_TOL);
    }

    /** Rounding budget of a fixed-step run of d×d matrices with the given steps (see class comment). */
    static double rounding(SchemeCases.Case c, int dim, int steps) {
        long exps = (long) steps * Math.max(1, c.get().exponentialsPerStep());
        return Math.max(ROUNDING, 4 * dim * U * exps);
    }

    static double budget(SchemeCases.Case c, int dim, int steps) {
        return c.fixedStep() ? rounding(c, dim, steps) : REF_BUDGET;
    }

    /** The driven three-level ladder, or its piecewise-constant sampling for the piecewise-exact scheme. */
    static Hamiltonian driven(SchemeCases.Case c) {
        Hamiltonian h = ReferenceProblems.threeLevel().h();
        return c.exactPiecewise() ? sampled(h, 0, 6, 24) : h;
    }

    /** H with every drive replaced by its values at the midpoints of m equal segments of [t0, t1]. */
    static Hamiltonian sampled(Hamiltonian h, double t0, double t1, int m) {
        Hamiltonian.Builder b = Hamiltonian.builder(h.dim());
        double dt = (t1 - t0) / m;
        for (int k = 0; k < h.size(); k++) {
            double[] v = new double[m];
            for (int s = 0; s < m; s++) {
                v[s] = h.drives().get(k).at(t0 + (s + 0.5) * dt);
            }
            b.term(h.operators().get(k), Drive.samples(t0, dt, v));
        }
        return b.build();
    }

    static Operator run(SchemeCases.Case c, Hamiltonian h, double t0, double t1, int steps) {
        Evolution ev = configured(c, Evolve.of(h).over(t0, t1), steps).run();
        assertTrue(ev.status().isSuccess(), () -> c + ": " + ev.status());
        return ev.propagator();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#all")
    void zeroHamiltonianGivesIdentity(SchemeCases.Case c) {
        Hamiltonian zero = Hamiltonian.builder(3).term(0.0, Operator.unit(3, 0, 0)).build();
        Operator u = run(c, zero, 0, 2, 10);
        // exp(0) = I exactly and every correction term of every scheme is a product with H = 0
        assertEquals(0.0, Exact.maxDiff(u, Operator.identity(3)), 1e-15, c.name());
    }

    static Stream<Arguments> schemesAndSeeds() {
        List<Arguments> out = new ArrayList<>();
        SchemeCases.all().forEach(c -> Seeds.fewCases().limit(20).forEach(s -> out.add(Arguments.of(c, s))));
        return out.stream();
    }

    @ParameterizedTest(name = "{0}, seed {1}")
    @MethodSource("schemesAndSeeds")
    void constantHamiltonianGivesTheExactExponential(SchemeCases.Case c, long seed) {
        Random r = new Random(seed);
        int n = 4;
        Operator v = Exact.randomUnitary(r, n);
        double[] d = new double[n];
        for (int k = 0; k < n; k++) {
            d[k] = 2 * r.nextDouble() - 1;          // ‖H‖ ≤ 1
        }
        Operator hm = v.times(Operator.diagonal(d)).times(v.dagger());
        hm = hm.plus(hm.dagger()).scale(0.5);      // Hermitian to the last bit
        double t = 3;
        Operator u = run(c, Hamiltonian.constant(hm), 0, t, 30);
        // exact: U = V exp(−i D t) V† (spectral theorem)
        assertEquals(0.0, Exact.maxDiff(u, Exact.spectralExp(v, d, t)), budget(c, n, 30), c + " seed " + seed);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#all")
    void propagatorsCompose(SchemeCases.Case c) {
        Hamiltonian h = driven(c);
        Operator whole = run(c, h, 0, 6, 120);
        Operator first = run(c, h, 0, 3, 60), second = run(c, h, 3, 6, 60);
        // same step grid in both runs, so only rounding separates them for the fixed-step schemes
        assertEquals(0.0, Exact.maxDiff(whole, second.times(first)), budget(c, 3, 240), c.name());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#all")
    void backwardRunGivesTheInverse(SchemeCases.Case c) {
        Hamiltonian h = driven(c);
        Operator forward = run(c, h, 0, 6, 60), backward = run(c, h, 6, 0, 60);
        // exact: U(0,6) = U(6,0)^{-1}. The exponential schemes are time-symmetric (Gauss nodes, palindromic
        // coefficient tables), so on the same grid the backward step is the exact inverse of the forward step
        // (E. Hairer, C. Lubich, G. Wanner, Geometric Numerical Integration, Springer 2006, §V.1): rounding only.
        assertEquals(0.0, Exact.maxDiff(backward.times(forward), Operator.identity(3)), budget(c, 3, 120), c.name());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#lieGroup")
    void unitaryForEveryStepSize(SchemeCases.Case c) {
        Hamiltonian h = ReferenceProblems.threeLevel().h();
        for (int steps : new int[]{1, 2, 5, 17, 100, 1000}) {
            Operator u = run(c, h, 0, 6, steps);
            // each step is a product of exponentials of anti-Hermitian matrices: unitary up to rounding,
            // ~ (steps · ε · dim), independent of the truncation error; even one step of size 6 is unitary
            double defect = Exact.unitarityDefect(u);
            assertTrue(defect <= rounding(c, 3, steps), c + " with " + steps + " steps: ‖U†U − I‖ = " + defect);
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#lieGroup")
    void unitaryWhereTheRungeKuttaReferenceDrifts(SchemeCases.Case c) {
        // A Runge–Kutta method does not preserve the quadratic invariant U†U (only symplectic/Gauss RK methods do;
        // Hairer, Lubich, Wanner, Geometric Numerical Integration, §IV.2): at a loose tolerance its propagator
        // leaves the unitary group by about its error, while an exponential scheme stays on it at the same accuracy.
        Hamiltonian h = ReferenceProblems.threeLevel().h();
        Evolution rk = Evolve.of(h).over(0, 60).scheme(Scheme.reference()).tolerance(1e-6).run();
        Operator ours = run(c, h, 0, 60, 300);
        double drift = Exact.unitarityDefect(rk.propagator()), defect = Exact.unitarityDefect(ours);
        assertTrue(drift > 1e-10, "reference at tol 1e-6 over [0,60] should drift off the unitary group; defect " + drift);
        assertTrue(defect <= rounding(c, 3, 300), c + ": defect " + defect + " (Runge–Kutta reference drifts by " + drift + ")");
        assertTrue(drift > 100 * defect, c + ": defect " + defect + " vs Runge–Kutta drift " + drift);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#all")
    void inputsAreUntouched(SchemeCases.Case c) {
        Hamiltonian h = driven(c);
        List<double[]> before = new ArrayList<>();
        for (Operator a : h.operators()) {
            before.add(a.reArray());
            before.add(a.imArray());
        }
        double[] c0 = new double[h.size()];
        h.coefficients(1.25, c0);
        StateVector psi = StateVector.of(new double[]{0.6, 0, 0}, new double[]{0, 0.8, 0});
        double[] psiRe = new double[3], psiIm = new double[3];
        psi.copyTo(psiRe, psiIm);

        Evolution ev = configured(c, Evolve.of(h).over(0, 2).state(psi), 20).run();
        assertTrue(ev.status().isSuccess(), () -> c + ": " + ev.status());

        int k = 0;
        for (Operator a : h.operators()) {
            assertArrayEquals(before.get(k++), a.reArray(), c.name());
            assertArrayEquals(before.get(k++), a.imArray(), c.name());
        }
        double[] c1 = new double[h.size()];
        h.coefficients(1.25, c1);
        assertArrayEquals(c0, c1, c.name());
        double[] re = new double[3], im = new double[3];
        psi.copyTo(re, im);
        assertArrayEquals(psiRe, re, c.name());
        assertArrayEquals(psiIm, im, c.name());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#all")
    void parallelRunsEqualSequentialRunsBitForBit(SchemeCases.Case c) throws Exception {
        Hamiltonian h = driven(c);
        Scheme scheme = c.get();
        Operator sequential = configured(c, Evolve.of(h).over(0, 6), 60).run().propagator();
        ExecutorService pool = Executors.newFixedThreadPool(8);
        try {
            List<Future<Operator>> futures = new ArrayList<>();
            for (int k = 0; k < 16; k++) {
                futures.add(pool.submit(() -> (c.fixedStep()
                        ? Evolve.of(h).over(0, 6).scheme(scheme).steps(60)
                        : Evolve.of(h).over(0, 6).scheme(scheme).tolerance(REF_TOL)).run().propagator()));
            }
            for (Future<Operator> f : futures) {
                Operator p = f.get();
                assertTrue(Exact.sameBits(sequential, p), c + ": a parallel run differs from the sequential one by "
                        + Exact.maxDiff(sequential, p));
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#lieGroup")
    void stepperGivesTheSameBitsAsTheFluentTier(SchemeCases.Case c) {
        Hamiltonian h = ReferenceProblems.threeLevel().h();
        int steps = 40, n = 3;
        double t0 = 0, t1 = 6, dt = (t1 - t0) / steps;
        Stepper stepper = c.get().stepper(h);
        double[] u = new double[2 * n * n];
        for (int i = 0; i < n; i++) {
            u[i * n + i] = 1;
        }
        for (int k = 0; k < steps; k++) {
            stepper.advance(t0 + k * dt, dt, u);
        }
        Operator fluent = Evolve.of(h).over(t0, t1).scheme(c.get()).steps(steps).run().propagator();
        double[] re = Arrays.copyOfRange(u, 0, n * n), im = Arrays.copyOfRange(u, n * n, 2 * n * n);
        assertTrue(Exact.sameBits(fluent, Operator.ofPlanar(n, re, im)), c + ": stepper and fluent tier differ by "
                + Exact.maxDiff(fluent, Operator.ofPlanar(n, re, im)));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("org.liepath.integrators.SchemeCases#smooth")
    void declaredOrderIsThePublishedOrder(SchemeCases.Case c) {
        // the order a scheme declares is data; ObservedOrderTest measures it
        assertEquals(c.order(), c.get().order(), c.name());
    }
}
