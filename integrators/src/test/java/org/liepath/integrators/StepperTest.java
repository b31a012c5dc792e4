package org.liepath.integrators;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;

import java.lang.management.ManagementFactory;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The zero-allocation tier: same bits as the fluent tier, no allocation per step. */
class StepperTest {
    static List<Scheme> schemes() {
        return Fixtures.steppable();
    }

    /** Propagator mode: n steps of the stepper equal Evolve…steps(n) bit for bit (a drive with breakpoints). */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void propagatorBitsMatchFluentTier(Scheme s) {
        Hamiltonian h = Fixtures.drivenFour(17);
        int n = 4, steps = 37;
        double t0 = 0.05, t1 = 1.3, dt = (t1 - t0) / steps;
        double[] u = new double[2 * n * n];
        for (int i = 0; i < n; i++) {
            u[i * n + i] = 1;
        }
        Stepper st = s.stepper(h);
        for (int k = 0; k < steps; k++) {
            st.advance(t0 + k * dt, dt, u);
        }
        Operator fluent = Evolve.of(h).over(t0, t1).scheme(s).steps(steps).run().propagator();
        double[] expected = new double[2 * n * n];
        System.arraycopy(fluent.reArray(), 0, expected, 0, n * n);
        System.arraycopy(fluent.imArray(), 0, expected, n * n, n * n);
        assertArrayEquals(expected, u);
    }

    /** State mode, forward and backward. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void stateBitsMatchFluentTier(Scheme s) {
        Hamiltonian h = Fixtures.drivenFour(19);
        StateVector psi = StateVector.of(new double[]{0.5, 0.5, 0.5, 0.1}, new double[]{0, 0.1, -0.3, 0.3})
                .normalized();
        for (double[] iv : new double[][]{{0, 1}, {1.2, 0.1}}) {
            int steps = 23;
            double dt = (iv[1] - iv[0]) / steps;
            double[] u = new double[8];
            psi.copyTo(u, new double[4]);
            double[] im = new double[4];
            psi.copyTo(new double[4], im);
            System.arraycopy(im, 0, u, 4, 4);
            Stepper st = s.stepper(h);
            for (int k = 0; k < steps; k++) {
                st.advance(iv[0] + k * dt, dt, u);
            }
            StateVector out = Evolve.of(h).over(iv[0], iv[1]).scheme(s).steps(steps).state(psi).run().state();
            for (int i = 0; i < 4; i++) {
                assertEquals(out.re(i), u[i], 0.0);
                assertEquals(out.im(i), u[4 + i], 0.0);
            }
        }
    }

    /** Liouville space: the density stepper equals the fluent density run bit for bit. */
    @Test
    void liouvilleBitsMatchFluentTier() {
        Lindbladian l = Lindbladian.builder(Fixtures.drivenQubit()).jump(0.3, Operator.unit(2, 1, 0)).build();
        Operator rho = Operator.unit(2, 0, 0);
        int steps = 15;
        double dt = 2.0 / steps;
        double[] u = new double[8];
        u[0] = 1; // vec(ρ) = (ρ00, ρ10, ρ01, ρ11)
        Stepper st = Scheme.magnus4().stepper(l);
        assertTrue(st.isLiouville());
        for (int k = 0; k < steps; k++) {
            st.advance(k * dt, dt, u);
        }
        Operator out = Evolve.of(l).over(0, 2).scheme(Scheme.magnus4()).steps(steps).density(rho).run().density();
        assertEquals(out.re(0, 0), u[0], 0.0);
        assertEquals(out.re(1, 0), u[1], 0.0);
        assertEquals(out.re(0, 1), u[2], 0.0);
        assertEquals(out.im(0, 1), u[4 + 2], 0.0);
        assertEquals(out.re(1, 1), u[3], 0.0);
    }

    /** After warm-up, 10 000 steps allocate (almost) nothing: < 1 KB in total. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void advanceDoesNotAllocate(Scheme s) {
        Hamiltonian h = Fixtures.drivenQubit();
        Stepper st = s.stepper(h);
        double[] u = new double[8];
        u[0] = 1;
        u[3] = 1;
        double[] v = {1, 0, 0, 0};
        for (int k = 0; k < 20_000; k++) {
            st.advance(1e-3 * k, 1e-3, v);
        }
        assertNoAllocationPerStep(st, u, s);
    }

    /** Warms the stepper up on u, then checks that 10 000 more steps allocate less than 1 KB in all. */
    private static void assertNoAllocationPerStep(Stepper st, double[] u, Scheme s) {
        com.sun.management.ThreadMXBean bean = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        for (int k = 0; k < 20_000; k++) {
            st.advance(1e-3 * k, 1e-3, u);
        }
        long tid = Thread.currentThread().getId();
        long before = bean.getThreadAllocatedBytes(tid);
        for (int k = 0; k < 10_000; k++) {
            st.advance(1e-3 * k, 1e-3, u);
        }
        long after = bean.getThreadAllocatedBytes(tid);
        assertTrue(after - before < 1024, (after - before) + " bytes allocated by 10 000 steps of " + s.name());
        assertTrue(Double.isFinite(u[0]));
    }

    /**
     * Three levels take the packed route (packed exponents, packed frame tables, workspaces created on first use):
     * after warm-up it allocates nothing per step either, in both pictures.
     */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void advanceDoesNotAllocateOnThreeLevels(Scheme s) {
        Operator x01 = Operator.unit(3, 0, 1).plus(Operator.unit(3, 1, 0));
        Operator x12 = Operator.unit(3, 1, 2).plus(Operator.unit(3, 2, 1));
        Hamiltonian h = Hamiltonian.builder(3).term(1.0, Operator.diagonal(0, 1, 2.3))
                .term(x01, Drive.cosine(0.3, 1.1)).term(x12, Drive.sine(0.2, 0.7, 0)).build();
        Stepper st = s.stepper(h);
        double[] u = new double[18];
        u[0] = 1;
        u[4] = 1;
        u[8] = 1;
        assertNoAllocationPerStep(st, u, s);
    }

    /** The Krylov route for large vectors allocates nothing per step either. */
    @Test
    void krylovVectorStepsDoNotAllocate() {
        com.sun.management.ThreadMXBean bean = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        int n = 64;
        java.util.Random r = new java.util.Random(3);
        Hamiltonian h = Hamiltonian.builder(n).term(0.1, Operator.real(Fixtures.randomSymmetric(r, n)))
                .term(Operator.real(Fixtures.randomSymmetric(r, n)), org.liepath.core.Drive.cosine(0.05, 2.0)).build();
        Stepper st = Scheme.commutatorFree4Opt().stepper(h);
        double[] v = new double[2 * n];
        v[0] = 1;
        for (int k = 0; k < 60; k++) {
            st.advance(0.01 * k, 0.01, v);
        }
        long tid = Thread.currentThread().getId();
        long before = bean.getThreadAllocatedBytes(tid);
        for (int k = 0; k < 100; k++) {
            st.advance(0.01 * k, 0.01, v);
        }
        long after = bean.getThreadAllocatedBytes(tid);
        assertTrue(after - before < 1024, (after - before) + " bytes allocated by 100 Krylov steps");
    }

    @Test
    void badInputIsRefused() {
        Stepper st = Scheme.magnus4().stepper(Fixtures.drivenQubit());
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> st.advance(0, 0.1, new double[5]));
        assertEquals(InvalidInputException.Reason.DIMENSION_MISMATCH, e.reason());
        assertTrue(e.getMessage().contains("u") && e.getMessage().contains("length 5"), e.getMessage());
        e = assertThrows(InvalidInputException.class, () -> st.advance(0, Double.NaN, new double[8]));
        assertEquals(InvalidInputException.Reason.NOT_FINITE, e.reason());
        assertTrue(e.getMessage().contains("dt") && e.getMessage().contains("NaN"), e.getMessage());
        e = assertThrows(InvalidInputException.class, () -> st.advance(0, 0.0, new double[8]));
        assertEquals(InvalidInputException.Reason.OUT_OF_RANGE, e.reason());
        e = assertThrows(InvalidInputException.class, () -> Scheme.reference().stepper(Fixtures.drivenQubit()));
        assertEquals(InvalidInputException.Reason.UNSUPPORTED, e.reason());
        assertTrue(e.getMessage().contains("reference"), e.getMessage());
        e = assertThrows(InvalidInputException.class, () -> Scheme.piecewiseExact().stepper(Fixtures.drivenQubit()));
        assertEquals(InvalidInputException.Reason.UNSUPPORTED, e.reason());
        assertTrue(e.getMessage().contains("piecewise constant"), e.getMessage());
    }

    @Test
    void piecewiseStepperIsExactAcrossBreakpoints() {
        Hamiltonian h = Fixtures.piecewiseQubit();
        Stepper st = Scheme.piecewiseExact().stepper(h);
        double[] u = {1, 0, 0, 1, 0, 0, 0, 0};
        st.advance(0, 1.0, u); // one call spans both segments: split at t = 0.4
        Operator exact = Evolve.of(h).over(0, 1).scheme(Scheme.piecewiseExact()).run().propagator();
        for (int q = 0; q < 4; q++) {
            assertEquals(exact.reArray()[q], u[q], 1e-15);
            assertEquals(exact.imArray()[q], u[4 + q], 1e-15);
        }
    }
}
