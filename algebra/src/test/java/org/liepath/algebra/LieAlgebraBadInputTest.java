package org.liepath.algebra;

import org.junit.jupiter.api.Test;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;
import org.junit.jupiter.api.function.Executable;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Every refusal: exception type, reason, and a message naming the argument and the value seen. */
class LieAlgebraBadInputTest {

    static InvalidInputException refused(Reason reason, Executable call, String... inMessage) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call);
        assertEquals(reason, e.reason(), e.getMessage());
        for (String s : inMessage) {
            assertTrue(e.getMessage().contains(s), "'" + s + "' not in: " + e.getMessage());
        }
        return e;
    }

    @Test
    void spanThatIsNotClosedNamesAWitnessBracket() {
        // [X, Y] = 2iZ leaves span{X, Y}
        InvalidInputException e = refused(Reason.NOT_CLOSED,
                () -> LieAlgebra.spannedBy(List.of(Pauli.x(), Pauli.y())), "basis", "[b_0, b_1]", "outside the span");
        assertEquals("basis", e.argument());
        // the witness is among the caller's own elements even when the first pair closes
        refused(Reason.NOT_CLOSED, () -> LieAlgebra.spannedBy(List.of(Pauli.string("ZI"), Pauli.string("IZ"),
                Pauli.string("XI"))), "[b_0, b_2]");
        refused(Reason.NOT_CLOSED, () -> LieAlgebra.complexSpan(List.of(Spin.of(0.5).plus(), Spin.of(0.5).minus())),
                "[b_0, b_1]");
    }

    @Test
    void spanOfMixedOrNonHermitianElementsIsRefused() {
        refused(Reason.NOT_HERMITIAN, () -> LieAlgebra.spannedBy(List.of(Pauli.x(), Pauli.z().timesI())), "basis[1]",
                "‖A + A†‖_F");
        refused(Reason.NOT_HERMITIAN, () -> LieAlgebra.spannedBy(List.of(Spin.of(0.5).plus())), "basis[0]",
                "complexSpan");
    }

    @Test
    void generatorsMustBeHermitianOfOneDimensionAndPresent() {
        refused(Reason.NOT_HERMITIAN, () -> LieAlgebra.generatedBy(List.of(Pauli.x(), Spin.of(0.5).plus())),
                "hermitianOps[1]", "‖A − A†‖_F");
        refused(Reason.DIMENSION_MISMATCH, () -> LieAlgebra.generatedBy(List.of(Pauli.x(), Pauli.string("XX"))),
                "hermitianOps[1]", "dimension 4", "dimension 2");
        refused(Reason.EMPTY, () -> LieAlgebra.generatedBy(List.of()), "hermitianOps", "empty");
        refused(Reason.NULL, () -> LieAlgebra.generatedBy((List<Operator>) null), "hermitianOps", "null");
        refused(Reason.NULL, () -> LieAlgebra.generatedBy(Arrays.asList(Pauli.x(), null)), "hermitianOps[1]");
        refused(Reason.NULL, () -> LieAlgebra.generatedBy((org.liepath.core.Hamiltonian) null), "hamiltonian");
        refused(Reason.EMPTY, () -> LieAlgebra.spannedBy(new ArrayList<>()), "basis");
        refused(Reason.EMPTY, () -> LieAlgebra.complexSpan(new ArrayList<>()), "basis");
        refused(Reason.NULL, () -> Controllability.of((List<Operator>) null), "hermitianOps");
    }

    @Test
    void closureLimitAndConfiguration() {
        // su(4) has dimension 15 > 10
        refused(Reason.LIMIT_EXCEEDED, () -> LieAlgebra.closure().maxDimension(10)
                .of(Gens.localXYPlusZZ(2, Gens.path(2, 1))), "maxDimension", "at most 10", "4×4");
        refused(Reason.OUT_OF_RANGE, () -> LieAlgebra.closure().maxDimension(0), "maxDimension", "0");
        refused(Reason.OUT_OF_RANGE, () -> LieAlgebra.closure().tolerance(0), "tolerance", "0.0");
        refused(Reason.OUT_OF_RANGE, () -> LieAlgebra.closure().tolerance(2), "tolerance", "2.0");
        refused(Reason.NOT_FINITE, () -> LieAlgebra.closure().tolerance(Double.NaN), "tolerance", "NaN");
        refused(Reason.NULL, () -> LieAlgebra.closure().monitor(null), "listener");
    }

    @Test
    void closureReportsProgressAndCanBeCancelled() {
        AtomicInteger calls = new AtomicInteger();
        CancellationException c = assertThrows(CancellationException.class, () -> LieAlgebra.closure()
                .monitor((f, count) -> {
                    calls.incrementAndGet();
                    assertTrue(Double.isNaN(f));
                    return count < 5;
                }).of(Gens.localXYPlusZZ(3, Gens.path(3, 2))));
        assertTrue(c.getMessage().contains("dimension 5"), c.getMessage());
        assertEquals(5, calls.get());
        // a listener that throws is dropped and the closure completes
        LieAlgebra g = LieAlgebra.closure().monitor((f, count) -> {
            throw new IllegalStateException("listener bug");
        }).of(Gens.localXYPlusZZ(2, Gens.path(2, 1)));
        assertEquals(15, g.dimension());
    }

    @Test
    void queriesCheckTheirArguments() {
        LieAlgebra su2 = LieAlgebra.generatedBy(List.of(Pauli.x(), Pauli.z()));
        assertTrue(su2.contains(Pauli.y()));
        assertTrue(!su2.contains(Operator.identity(2)));
        refused(Reason.OUT_OF_RANGE, () -> su2.coordinates(Operator.identity(2)), "x", "residual");
        refused(Reason.DIMENSION_MISMATCH, () -> su2.contains(Pauli.string("XX")), "x", "dimension 4");
        refused(Reason.NULL, () -> su2.coordinates(null), "x");
        refused(Reason.OUT_OF_RANGE, () -> su2.adjoint(3), "i", "3");
        refused(Reason.OUT_OF_RANGE, () -> su2.structureConstants().get(0, 0, -1), "k", "-1");
        refused(Reason.OUT_OF_RANGE, () -> su2.commutationTable().commutes(5, 0), "i", "5");
        LieAlgebra sl2 = LieAlgebra.complexSpan(List.of(Spin.of(0.5).plus(), Spin.of(0.5).z(), Spin.of(0.5).minus()));
        refused(Reason.UNSUPPORTED, () -> sl2.coordinates(Pauli.x()), "x", "complexCoordinates");
        refused(Reason.UNSUPPORTED, () -> sl2.adjoint(0), "adjoint", "complexAdjoint");
        refused(Reason.UNSUPPORTED, sl2::killingForm, "killingForm", "complexKillingForm");
        refused(Reason.UNSUPPORTED, () -> sl2.structureConstants().get(0, 1, 0), "get", "getComplex");
        LieAlgebra borel = LieAlgebra.complexSpan(List.of(Gens.unit(2, 0, 0, 1, 0), Gens.unit(2, 0, 1, 1, 0)));
        refused(Reason.UNSUPPORTED, borel::rank, "rank", "compact real form");
    }

    @Test
    void subsetEnumerationChecksTheMonomialBracketProperty() {
        // Gell-Mann basis with λ3, λ8 rotated into (λ3 ± λ8)/√2: [λ1, λ2] = 2iλ3 spreads over two elements
        List<Operator> l = new ArrayList<>(ClassicalAlgebrasTest.gellMann());
        Operator a = l.get(2), b = l.get(7);
        l.set(2, a.plus(b).scale(Math.sqrt(0.5)));
        l.set(7, a.minus(b).scale(Math.sqrt(0.5)));
        refused(Reason.UNSUPPORTED, () -> Subalgebras.closedSubsets(l), "basis", "[b_0, b_1]", "monomial");
        refused(Reason.UNSUPPORTED, () -> Subalgebras.closedSubsets(List.of(Pauli.x(), Pauli.x().plus(Pauli.z()))),
                "basis", "orthogonal");
        refused(Reason.NOT_CLOSED, () -> Subalgebras.closedSubsets(List.of(Pauli.x(), Pauli.y())), "[b_0, b_1]");
        refused(Reason.OUT_OF_RANGE, () -> Subalgebras.closedSubsets(List.of(Pauli.x(), Operator.zero(2))),
                "basis[1]", "zero");
        refused(Reason.EMPTY, () -> Subalgebras.closedSubsets(List.of()), "basis");
        refused(Reason.DIMENSION_MISMATCH, () -> Subalgebras.closedSubsets(List.of(Pauli.x(), Pauli.string("XX"))),
                "basis[1]");
        List<Operator> xyz = List.of(Pauli.x(), Pauli.y(), Pauli.z());
        refused(Reason.OUT_OF_RANGE, () -> Subalgebras.closureOf(xyz, 3), "chosen", "3");
        refused(Reason.EMPTY, () -> Subalgebras.closureOf(xyz), "chosen");
        // X, Y, Z have 4 closed subsets ({X}, {Y}, {Z}, all): a limit of 3 is refused
        refused(Reason.LIMIT_EXCEEDED, () -> Subalgebras.closedSubsets(xyz, 3), "maxSubsets", "at most 3");
        assertEquals(4, Subalgebras.closedSubsets(xyz, 4).size());
    }
}
