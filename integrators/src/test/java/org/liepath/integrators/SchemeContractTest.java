package org.liepath.integrators;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The contract every scheme passes (identity for a zero generator, the exact exponential for a constant one,
 * composition, backward runs, unitarity), each with a budget justified by the scheme's error.
 */
class SchemeContractTest {
    /** Rounding budget of a handful of exponentials and products of 4×4 unitaries (a few hundred ulps). */
    static final double ROUNDING = 1e-13;
    /**
     * The reference integrator is an explicit Runge–Kutta method: at tolerance 1e-12 its global error over O(1)
     * times is a few hundred times the tolerance (error per step ≤ tol, some tens of steps, norm of U ~ 2).
     */
    static final double REFERENCE_TOL = 1e-12, REFERENCE_BUDGET = 1e-9;

    static List<Scheme> schemes() {
        return Fixtures.schemes();
    }

    static boolean isReference(Scheme s) {
        return s.equals(Scheme.reference());
    }

    /** Run with fixed steps where the scheme allows it, else adaptive at the reference tolerance. */
    static Evolve configure(Evolve e, Scheme s, int steps) {
        return isReference(s) ? e.scheme(s).tolerance(REFERENCE_TOL) : e.scheme(s).steps(steps);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void zeroHamiltonianGivesIdentity(Scheme s) {
        Hamiltonian zero = Hamiltonian.builder(3).term(0.0, Operator.diagonal(1, 2, 3)).build();
        Evolution ev = configure(Evolve.of(zero).over(0.2, 1.7), s, 7).run();
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertEquals(0.0, ev.propagator().distance(Operator.identity(3)), 1e-15);
    }

    /**
     * Constant H: every exponential scheme is exact (the exponents of a constant generator commute and sum to
     * t·A); the reference is Commons Math's symmetric eigendecomposition.
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void constantHamiltonianGivesExponential(Scheme s) {
        Random r = new Random(42);
        double[][] a = Fixtures.randomSymmetric(r, 4), b = Fixtures.randomSymmetric(r, 4);
        double[][] h = new double[4][4];
        for (int i = 0; i < 4; i++) {
            for (int j = 0; j < 4; j++) {
                h[i][j] = 0.7 * a[i][j] - 0.2 * b[i][j];
            }
        }
        Hamiltonian ham = Hamiltonian.builder(4).term(0.7, Operator.real(a)).term(-0.2, Operator.real(b)).build();
        Operator exact = Fixtures.expMinusIReference(h, 1.3);
        Evolution ev = configure(Evolve.of(ham).over(0, 1.3), s, 5).run();
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertEquals(0.0, ev.propagator().distance(exact), isReference(s) ? REFERENCE_BUDGET : ROUNDING);
        // adaptive runs of a constant generator take a single exact exponential, whatever the scheme
        Evolution ad = Evolve.of(ham).over(0, 1.3).scheme(s).run();
        assertEquals(0.0, ad.propagator().distance(exact), isReference(s) ? 1e-7 : ROUNDING);
    }

    /** U(t2, t0) = U(t2, t1) U(t1, t0): the runs share no steps, so they agree to the tolerance. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void propagatorsCompose(Scheme s) {
        Hamiltonian h = s.equals(Scheme.piecewiseExact()) ? Fixtures.piecewiseQubit() : Fixtures.drivenFour(3);
        double tol = isReference(s) ? REFERENCE_TOL : 1e-11;
        Operator u20 = Evolve.of(h).over(0, 1.2).scheme(s).tolerance(tol).run().propagator();
        Operator u10 = Evolve.of(h).over(0, 0.55).scheme(s).tolerance(tol).run().propagator();
        Operator u21 = Evolve.of(h).over(0.55, 1.2).scheme(s).tolerance(tol).run().propagator();
        // global error ≲ (number of steps) × tol; a few hundred steps at most here
        assertEquals(0.0, u20.distance(u21.times(u10)), isReference(s) ? REFERENCE_BUDGET : 1e-8);
    }

    /**
     * A backward run over(t1, t0) gives U(t0, t1) = U(t1, t0)⁻¹. Every exponential scheme here is time symmetric
     * (symmetric nodes and tables), so on the same grid the backward steps invert the forward ones exactly and the
     * product is the identity to rounding.
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void backwardRunInvertsForwardRun(Scheme s) {
        Hamiltonian h = s.equals(Scheme.piecewiseExact()) ? Fixtures.piecewiseQubit() : Fixtures.drivenFour(5);
        Operator fwd = configure(Evolve.of(h).over(0.1, 1.1), s, 40).run().propagator();
        Operator bwd = configure(Evolve.of(h).over(1.1, 0.1), s, 40).run().propagator();
        assertEquals(0.0, bwd.times(fwd).distance(Operator.identity(h.dim())),
                isReference(s) ? REFERENCE_BUDGET : ROUNDING);
    }

    /**
     * Every exponential factor is unitary to rounding. After 20 steps of a 4×4 system ‖U†U − I‖_F ≤ 1e-13; over a
     * long run the defect accumulates at most linearly in the number of exponential factors, with about 20 ulps
     * (2e-15) per factor of dimension 4 (eigen-based exponential plus one product).
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void propagatorIsUnitary(Scheme s) {
        if (isReference(s)) {
            return; // not structure preserving: see referenceDriftIsVisible
        }
        Hamiltonian h = s.equals(Scheme.piecewiseExact())
                ? Hamiltonian.builder(4).term(1.0, Operator.real(Fixtures.randomSymmetric(new Random(1), 4)))
                .term(Operator.real(Fixtures.randomSymmetric(new Random(2), 4)),
                        Drive.samples(0, 0.05, new Random(3).doubles(200, -1, 1).toArray())).build()
                : Fixtures.drivenFour(9);
        Operator shortRun = Evolve.of(h).over(0, 1).scheme(s).steps(20).run().propagator();
        assertTrue(Fixtures.unitarityDefect(shortRun) <= ROUNDING, "defect " + Fixtures.unitarityDefect(shortRun));
        Evolution longRun = Evolve.of(h).over(0, 10).scheme(s).steps(200).run();
        double defect = Fixtures.unitarityDefect(longRun.propagator());
        assertTrue(defect <= 2e-15 * longRun.stats().exponentials(), "defect " + defect + " after "
                + longRun.stats().exponentials() + " exponentials");
    }

    /**
     * The reference integrator does not preserve unitarity: at a loose tolerance over a long run its defect is
     * orders of magnitude above rounding, and it is reported as is (no re-unitarisation).
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void referenceDriftIsVisible(Scheme s) {
        if (!isReference(s)) {
            return;
        }
        Hamiltonian h = Fixtures.drivenQubit();
        Operator u = Evolve.of(h).over(0, 50).scheme(s).tolerance(1e-6).run().propagator();
        assertTrue(Fixtures.unitarityDefect(u) > 1e-10, "defect " + Fixtures.unitarityDefect(u));
    }
}
