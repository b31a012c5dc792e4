package org.liepath.core;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.liepath.core.InvalidInputException.Reason;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Bad input to the numerical entry points (exponentials and Krylov propagation): each call must throw
 * {@link InvalidInputException} with the right reason and a message naming the argument and the value seen
 * (common practice; the project's error contract).
 */
class NumericalBadInputTest {
    private static final Operator H = Operator.of(new double[][]{{1, 0.5}, {0.5, -1}}, new double[][]{{0, 0.2}, {-0.2, 0}});
    private static final Operator NOT_HERMITIAN = Operator.real(new double[][]{{0, 1}, {0, 0}});
    private static final StateVector PSI = StateVector.unit(2, 0);

    private static InvalidInputException expect(Reason reason, String argument, String seen, Executable call) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call);
        assertEquals(reason, e.reason(), e.getMessage());
        assertEquals(argument, e.argument(), e.getMessage());
        assertTrue(e.getMessage().startsWith(argument + ":"), "names the argument: " + e.getMessage());
        assertTrue(e.getMessage().contains(seen), "names the value seen (" + seen + "): " + e.getMessage());
        return e;
    }

    @Test
    void operatorExpMinusI() {
        expect(Reason.NOT_FINITE, "t", "NaN", () -> H.expMinusI(Double.NaN));
        expect(Reason.NOT_FINITE, "t", "Infinity", () -> H.expMinusI(Double.POSITIVE_INFINITY));
        expect(Reason.NOT_HERMITIAN, "this", "‖A − A†‖_F", () -> NOT_HERMITIAN.expMinusI(1.0));
    }

    @Test
    void operatorExpOverflow() {
        // e^{1000} overflows a double: refused rather than returned as Infinity
        expect(Reason.NOT_FINITE, "this", "overflow", () -> Operator.diagonal(1000, 0, 0).exp());
        expect(Reason.NOT_FINITE, "this", "overflow", () -> Operator.diagonal(1000, 0).exp());
    }

    @Test
    void krylovHermitian() {
        expect(Reason.NULL, "h", "null", () -> Krylov.expMinusI(null, 1.0, PSI, 1e-8));
        expect(Reason.NULL, "psi", "null", () -> Krylov.expMinusI(H, 1.0, null, 1e-8));
        expect(Reason.NOT_HERMITIAN, "h", "‖A − A†‖_F", () -> Krylov.expMinusI(NOT_HERMITIAN, 1.0, PSI, 1e-8));
        expect(Reason.NOT_FINITE, "t", "NaN", () -> Krylov.expMinusI(H, Double.NaN, PSI, 1e-8));
        expect(Reason.NOT_FINITE, "t", "-Infinity", () -> Krylov.expMinusI(H, Double.NEGATIVE_INFINITY, PSI, 1e-8));
        expect(Reason.OUT_OF_RANGE, "tol", "-1.0E-8", () -> Krylov.expMinusI(H, 1.0, PSI, -1e-8));
        expect(Reason.OUT_OF_RANGE, "tol", "0.0", () -> Krylov.expMinusI(H, 1.0, PSI, 0.0));
        expect(Reason.NOT_FINITE, "tol", "NaN", () -> Krylov.expMinusI(H, 1.0, PSI, Double.NaN));
        expect(Reason.DIMENSION_MISMATCH, "psi", "dimension 3", () -> Krylov.expMinusI(H, 1.0, StateVector.unit(3, 0), 1e-8));
        expect(Reason.OUT_OF_RANGE, "m", "0", () -> Krylov.expMinusI(H, 1.0, PSI, 1e-8, 0));
    }

    @Test
    void krylovGeneral() {
        expect(Reason.NULL, "a", "null", () -> Krylov.expAction(null, 1.0, PSI, 1e-8));
        expect(Reason.NULL, "v", "null", () -> Krylov.expAction(NOT_HERMITIAN, 1.0, null, 1e-8));
        expect(Reason.NOT_FINITE, "t", "NaN", () -> Krylov.expAction(NOT_HERMITIAN, Double.NaN, PSI, 1e-8));
        expect(Reason.OUT_OF_RANGE, "tol", "-1.0", () -> Krylov.expAction(NOT_HERMITIAN, 1.0, PSI, -1.0));
        expect(Reason.DIMENSION_MISMATCH, "v", "dimension 4", () -> Krylov.expAction(NOT_HERMITIAN, 1.0, StateVector.unit(4, 1), 1e-8));
        expect(Reason.OUT_OF_RANGE, "m", "-3", () -> Krylov.expAction(NOT_HERMITIAN, 1.0, PSI, 1e-8, -3));
        // a non-Hermitian generator is fine here: exp(tN) for the nilpotent N = [[0, 1], [0, 0]] is I + tN
        StateVector out = Krylov.expAction(NOT_HERMITIAN, 2.0, StateVector.unit(2, 1), 1e-10).state();
        assertEquals(2.0, out.re(0), 1e-14);
        assertEquals(1.0, out.re(1), 1e-14);
    }
}
