package org.liepath.integrators;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;

import java.util.concurrent.atomic.AtomicLong;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Bad input to {@link Evolve} (refused before any step with an {@link InvalidInputException} whose reason and message
 * name the argument and the value seen) and faults during a run (reported as a non-success {@link Status}).
 */
class EvolveFaultsAndInputTest {
    static final Hamiltonian RABI = ReferenceProblems.rabi(1, 0.3, 0.9, 10).h();

    static void refused(Reason reason, String argument, String seen, Executable call) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call);
        assertEquals(reason, e.reason(), e.getMessage());
        assertTrue(e.getMessage().contains(argument), () -> "message should name " + argument + ": " + e.getMessage());
        assertTrue(e.getMessage().contains(seen), () -> "message should show " + seen + ": " + e.getMessage());
    }

    @Test
    void emptyOrNonFiniteIntervalIsRefused() {
        refused(Reason.OUT_OF_RANGE, "t1", "1.5", () -> Evolve.of(RABI).over(1.5, 1.5).run());
        refused(Reason.NOT_FINITE, "t0", "NaN", () -> Evolve.of(RABI).over(Double.NaN, 1).run());
        refused(Reason.NOT_FINITE, "t1", "Infinity", () -> Evolve.of(RABI).over(0, Double.POSITIVE_INFINITY).run());
    }

    @Test
    void nonPositiveOrNaNToleranceIsRefused() {
        refused(Reason.OUT_OF_RANGE, "tolerance", "0.0", () -> Evolve.of(RABI).over(0, 1).tolerance(0).run());
        refused(Reason.OUT_OF_RANGE, "tolerance", "-1.0E-8", () -> Evolve.of(RABI).over(0, 1).tolerance(-1e-8).run());
        refused(Reason.NOT_FINITE, "tolerance", "NaN", () -> Evolve.of(RABI).over(0, 1).tolerance(Double.NaN).run());
    }

    @Test
    void nonPositiveStepCountIsRefused() {
        refused(Reason.OUT_OF_RANGE, "steps", "0", () -> Evolve.of(RABI).over(0, 1).steps(0).run());
        refused(Reason.OUT_OF_RANGE, "steps", "-3", () -> Evolve.of(RABI).over(0, 1).steps(-3).run());
    }

    @Test
    void stateOrDensityOfTheWrongDimensionIsRefused() {
        refused(Reason.DIMENSION_MISMATCH, "psi", "3", () -> Evolve.of(RABI).over(0, 1).state(StateVector.unit(3, 0)).run());
        Lindbladian l = Lindbladian.builder(RABI).jump(0.1, Operator.unit(2, 1, 0)).build();
        refused(Reason.DIMENSION_MISMATCH, "rho0", "3", () -> Evolve.of(l).over(0, 1).density(Operator.unit(3, 0, 0)).run());
    }

    @Test
    void nonNormalisedStateIsRefused() {
        StateVector psi = StateVector.real(1, 1);   // norm √2
        refused(Reason.OUT_OF_RANGE, "psi", "1.41", () -> Evolve.of(RABI).over(0, 1).state(psi).run());
    }

    @Test
    void piecewiseExactOnASmoothDriveIsRefused() {
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> Evolve.of(RABI).over(0, 1).scheme(Scheme.piecewiseExact()).run());
        assertEquals(Reason.UNSUPPORTED, e.reason(), e.getMessage());
        assertTrue(e.getMessage().contains("piecewise"), e.getMessage());
    }

    // ------------------------------------------------------------------ faults during a run

    static Hamiltonian failingAt(double tFail, boolean nan) {
        Drive bad = ((Drive) t -> {
            if (t > tFail) {
                if (nan) {
                    return Double.NaN;
                }
                throw new ArithmeticException("lookup table exhausted");
            }
            return 0.2 * Math.cos(t);
        }).named("faulty pulse");
        return Hamiltonian.builder(2).term(0.5, ReferenceProblems.Z).term(ReferenceProblems.X, bad).build();
    }

    /** The time in a message "… at t = 2.5125 …". */
    static double failureTime(Status s) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("at t = ([-0-9.eE]+)").matcher(s.message());
        assertTrue(m.find(), "the message should name the time: " + s);
        return Double.parseDouble(m.group(1));
    }

    @Test
    void aDriveThatThrowsMidRunEndsTheRunWithAStatusNamingDriveTermAndTime() {
        for (SchemeCases.Case c : SchemeCases.smooth().toList()) {
            Evolution ev = (c.fixedStep() ? Evolve.of(failingAt(2.5, false)).over(0, 5).scheme(c.get()).steps(50)
                    : Evolve.of(failingAt(2.5, false)).over(0, 5).scheme(c.get())).run();
            Status s = ev.status();
            assertFalse(s.isSuccess(), c.name());
            assertEquals(Status.Kind.DRIVE_FAILED, s.kind(), c + ": " + s);
            assertTrue(s.message().contains("faulty pulse"), c + ": " + s);
            assertTrue(s.message().contains("term 1"), c + ": " + s);
            double when = failureTime(s);
            assertTrue(when > 2.5 && when <= 2.6, c + ": " + s);
            assertTrue(s.time() <= when, c + ": the run claims to have reached " + s.time());
        }
    }

    @Test
    void aDriveThatReturnsNaNMidRunEndsTheRunWithAStatusNamingDriveTermAndTime() {
        for (SchemeCases.Case c : SchemeCases.smooth().toList()) {
            Evolution ev = (c.fixedStep() ? Evolve.of(failingAt(3, true)).over(0, 5).scheme(c.get()).steps(50)
                    : Evolve.of(failingAt(3, true)).over(0, 5).scheme(c.get())).run();
            Status s = ev.status();
            assertEquals(Status.Kind.DRIVE_FAILED, s.kind(), c + ": " + s);
            assertTrue(s.message().contains("faulty pulse") && s.message().contains("NaN"), c + ": " + s);
            double when = failureTime(s);
            assertTrue(when > 3 && when <= 3.1, c + ": " + s);
            assertTrue(s.time() <= when, c + ": the run claims to have reached " + s.time());
        }
    }

    @Test
    void aListenerThatThrowsDoesNotCorruptTheResult() {
        Operator clean = Evolve.of(RABI).over(0, 10).steps(400).run().propagator();
        Evolution ev = Evolve.of(RABI).over(0, 10).steps(400).monitor((f, n) -> {
            throw new IllegalStateException("listener bug");
        }).run();
        assertTrue(ev.status().isSuccess(), ev.status().toString());
        assertTrue(Exact.sameBits(clean, ev.propagator()), "a failing listener changed the result");
    }

    @Test
    void cancellationReturnsPromptlyWithACancelledStatus() {
        AtomicLong calls = new AtomicLong();
        int steps = 50_000_000;   // minutes of work if not cancelled
        Evolution ev = Evolve.of(RABI).over(0, 1000).steps(steps).monitor((f, n) -> calls.incrementAndGet() < 3).run();
        assertEquals(Status.Kind.CANCELLED, ev.status().kind(), ev.status().toString());
        assertFalse(ev.status().isSuccess());
        assertTrue(ev.stats().acceptedSteps() < steps / 10, "cancelled only after " + ev.stats().acceptedSteps() + " steps");
    }
}
