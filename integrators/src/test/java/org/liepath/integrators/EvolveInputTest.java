package org.liepath.integrators;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Bad input of the evolution builder: the exception type, its reason, and a message naming argument and value. */
class EvolveInputTest {
    final Hamiltonian h = Fixtures.drivenQubit();
    final Evolve e = Evolve.of(h).over(0, 1);
    final Lindbladian l = Lindbladian.builder(h).jump(0.2, Operator.unit(2, 1, 0)).build();

    static void refused(Reason reason, String argument, String seen, Executable call) {
        InvalidInputException ex = assertThrows(InvalidInputException.class, call);
        assertEquals(reason, ex.reason(), ex.getMessage());
        assertTrue(ex.getMessage().contains(argument), "message names " + argument + ": " + ex.getMessage());
        assertTrue(ex.getMessage().contains(seen), "message shows " + seen + ": " + ex.getMessage());
    }

    @Test
    void interval() {
        refused(Reason.OUT_OF_RANGE, "t1", "0.5", () -> Evolve.of(h).over(0.5, 0.5));
        refused(Reason.NOT_FINITE, "t0", "NaN", () -> Evolve.of(h).over(Double.NaN, 1));
        refused(Reason.NOT_FINITE, "t1", "Infinity", () -> Evolve.of(h).over(0, Double.POSITIVE_INFINITY));
        refused(Reason.NULL, "interval", "none", () -> Evolve.of(h).run());
    }

    @Test
    void toleranceStepsAndLimits() {
        refused(Reason.OUT_OF_RANGE, "tolerance", "0.0", () -> e.tolerance(0));
        refused(Reason.OUT_OF_RANGE, "tolerance", "-1.0E-8", () -> e.tolerance(-1e-8));
        refused(Reason.NOT_FINITE, "tolerance", "NaN", () -> e.tolerance(Double.NaN));
        refused(Reason.OUT_OF_RANGE, "steps", "0", () -> e.steps(0));
        refused(Reason.OUT_OF_RANGE, "steps", "-3", () -> e.steps(-3));
        refused(Reason.OUT_OF_RANGE, "maxSteps", "0", () -> e.maxSteps(0));
    }

    @Test
    void nulls() {
        refused(Reason.NULL, "h", "null", () -> Evolve.of((Hamiltonian) null));
        refused(Reason.NULL, "l", "null", () -> Evolve.of((Lindbladian) null));
        refused(Reason.NULL, "scheme", "null", () -> e.scheme(null));
        refused(Reason.NULL, "listener", "null", () -> e.monitor(null));
        refused(Reason.NULL, "observer", "null", () -> e.observe(null));
        refused(Reason.NULL, "psi", "null", () -> e.state(null));
        refused(Reason.NULL, "times", "null", () -> e.sampleAt((double[]) null));
    }

    @Test
    void states() {
        refused(Reason.DIMENSION_MISMATCH, "psi", "dimension 3", () -> e.state(StateVector.unit(3, 0)));
        refused(Reason.OUT_OF_RANGE, "psi", "norm 2", () -> e.state(StateVector.real(2, 0)));
        refused(Reason.UNSUPPORTED, "psi", "state vector", () -> Evolve.of(l).state(StateVector.unit(2, 0)));
    }

    @Test
    void densities() {
        Evolve o = Evolve.of(l).over(0, 1);
        refused(Reason.DIMENSION_MISMATCH, "rho0", "dimension 3", () -> o.density(Operator.unit(3, 0, 0)));
        refused(Reason.NOT_HERMITIAN, "rho0", "‖A − A†‖", () -> o.density(Operator.real(new double[][]{{1, 1},
                {0, 0}})));
        refused(Reason.OUT_OF_RANGE, "rho0", "trace 2", () -> o.density(Operator.identity(2)));
        refused(Reason.UNSUPPORTED, "rho0", "density matrix", () -> e.density(Operator.unit(2, 0, 0)));
    }

    @Test
    void samples() {
        refused(Reason.NOT_FINITE, "times", "NaN", () -> e.sampleAt(0.5, Double.NaN));
        refused(Reason.OUT_OF_RANGE, "times", "1.5", () -> e.sampleAt(0.5, 1.5).run());
        refused(Reason.OUT_OF_RANGE, "times", "-0.1", () -> Evolve.of(h).over(1, 0).sampleAt(-0.1).run());
    }

    @Test
    void schemesThatCannotServeTheProblem() {
        refused(Reason.UNSUPPORTED, "h", "not piecewise constant", () -> e.scheme(Scheme.piecewiseExact()).run());
        refused(Reason.UNSUPPORTED, "l", "not piecewise constant",
                () -> Evolve.of(l).over(0, 1).scheme(Scheme.piecewiseExact()).run());
        refused(Reason.UNSUPPORTED, "steps", "10 fixed steps", () -> e.scheme(Scheme.reference()).steps(10).run());
    }

    /** Each call returns a copy: a configuration is never changed by later calls. */
    @Test
    void configurationsAreImmutable() {
        Evolve fixed = e.steps(10);
        Evolve adaptive = fixed.tolerance(1e-6);
        assertEquals(10, fixed.run().stats().acceptedSteps());
        assertTrue(Double.isFinite(adaptive.run().errorEstimate()));
        assertTrue(Double.isFinite(fixed.run().errorEstimate()), "fixed-step runs estimate after the fact");
    }
}
