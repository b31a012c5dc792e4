package org.liepath.validation;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.algebra.LieAlgebra;
import org.liepath.algebra.PauliAlgebra;
import org.liepath.algebra.PauliString;
import org.liepath.algebra.PauliCombination;
import org.liepath.algebra.Subalgebras;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.HilbertSpace;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Levels;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;
import org.liepath.core.StateVector;
import org.liepath.core.Superoperator;
import org.liepath.integrators.BlockRiccati;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;
import org.liepath.integrators.WeiNorman;

import java.util.Arrays;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.params.provider.Arguments.arguments;

/**
 * At least one bad-input case for every public entry point of the API contract of every module, seen from the
 * outside (this module sees them all): each asserts the exception type {@link InvalidInputException}, its
 * {@link InvalidInputException#reason()}, and that the message names the argument and the value seen. Entry points
 * the module tests already cover are repeated here only where the contract lists them, so that this one table shows
 * the whole front door.
 */
class BadInputAcrossModulesTest {
    static final double NAN = Double.NaN;
    static final Operator X = Pauli.x(), Z = Pauli.z(), I3 = Operator.identity(3);
    static final Hamiltonian H2 = Hamiltonian.builder(2).term(0.5, Z).term(X, Drive.cosine(0.3, 1.0)).build();
    static final Lindbladian L2 = Lindbladian.builder(H2).jump(0.1, Operator.unit(2, 0, 1)).build();
    static final WeiNorman CHART = WeiNorman.of(List.of(Spin.of(0.5).plus(), Spin.of(0.5).z(), Spin.of(0.5).minus()));
    static final Complex[] G3 = {Complex.ZERO, Complex.ZERO, Complex.ZERO};

    private static Arguments bad(String label, Executable call, Reason reason, String argument, String seen) {
        return arguments(label, call, reason, argument, seen);
    }

    static Stream<Arguments> cases() {
        return Stream.of(
                // ---- core: Operator
                bad("Operator.of NaN", () -> Operator.of(new double[][]{{1, 0}, {0, NAN}}, new double[2][2]),
                        Reason.NOT_FINITE, "re", "NaN"),
                bad("Operator.of im size", () -> Operator.of(new double[2][2], new double[3][3]),
                        Reason.DIMENSION_MISMATCH, "im", "3x3"),
                bad("Operator.real ragged", () -> Operator.real(new double[][]{{1, 0}, {0}}),
                        Reason.NOT_SQUARE, "re", "1"),
                bad("Operator.identity 0", () -> Operator.identity(0), Reason.OUT_OF_RANGE, "n", "0"),
                bad("Operator.zero negative", () -> Operator.zero(-4), Reason.OUT_OF_RANGE, "n", "-4"),
                bad("Operator.diagonal infinite", () -> Operator.diagonal(1, Double.NEGATIVE_INFINITY),
                        Reason.NOT_FINITE, "d", "-Infinity"),
                bad("Operator.unit index", () -> Operator.unit(2, 0, 2), Reason.OUT_OF_RANGE, "j", "2"),
                bad("Operator.re index", () -> X.re(2, 0), Reason.OUT_OF_RANGE, "i", "2"),
                bad("Operator.im index", () -> X.im(0, -1), Reason.OUT_OF_RANGE, "j", "-1"),
                bad("Operator.get index", () -> X.get(5, 0), Reason.OUT_OF_RANGE, "i", "5"),
                bad("Operator.plus dimension", () -> X.plus(I3), Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("Operator.minus dimension", () -> X.minus(I3), Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("Operator.times dimension", () -> X.times(I3), Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("Operator.scale NaN", () -> X.scale(NAN), Reason.NOT_FINITE, "s", "NaN"),
                bad("Operator.scale complex", () -> X.scale(new Complex(0, Double.POSITIVE_INFINITY)),
                        Reason.NOT_FINITE, "z", "Infinity"),
                bad("Operator.commutator dimension", () -> X.commutator(I3), Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("Operator.inner dimension", () -> X.inner(I3), Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("Operator.distance dimension", () -> X.distance(I3), Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("Operator.isHermitian tolerance", () -> X.isHermitian(-1), Reason.OUT_OF_RANGE, "tol", "-1"),
                bad("Operator.kron null", () -> X.kron(null), Reason.NULL, "b", "null"),
                bad("Operator.fromEjml null", () -> Operator.fromEjml(null), Reason.NULL, "m", "null"),
                // ---- core: StateVector
                bad("StateVector.basis index", () -> StateVector.unit(2, 2), Reason.OUT_OF_RANGE, "k", "2"),
                bad("StateVector.of lengths", () -> StateVector.of(new double[2], new double[3]),
                        Reason.DIMENSION_MISMATCH, "im", "length 3"),
                bad("StateVector.re index", () -> StateVector.unit(2, 0).re(2), Reason.OUT_OF_RANGE, "i", "2"),
                bad("StateVector.im index", () -> StateVector.unit(2, 0).im(-1), Reason.OUT_OF_RANGE, "i", "-1"),
                bad("StateVector.inner dimension", () -> StateVector.unit(2, 0).inner(StateVector.unit(3, 0)),
                        Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("StateVector.apply dimension", () -> StateVector.unit(2, 0).apply(I3),
                        Reason.DIMENSION_MISMATCH, "a", "3"),
                // ---- core: Pauli, Spin, Levels, HilbertSpace, Drive
                bad("Pauli.string letter", () -> Pauli.string("XQZ"), Reason.SYNTAX, "s", "Q"),
                bad("Spin.of not half-integer", () -> Spin.of(0.3), Reason.OUT_OF_RANGE, "j", "0.3"),
                bad("Levels.gellMann d=1", () -> Levels.gellMann(1), Reason.OUT_OF_RANGE, "d", "1"),
                bad("HilbertSpace.of zero", () -> HilbertSpace.of(2, 0), Reason.OUT_OF_RANGE, "dims", "0"),
                bad("HilbertSpace.embed index", () -> HilbertSpace.of(2, 3).embed(X, 2), Reason.OUT_OF_RANGE, "k",
                        "2"),
                bad("HilbertSpace.embed dimension", () -> HilbertSpace.of(2, 3).embed(X, 1),
                        Reason.DIMENSION_MISMATCH, "op", "2"),
                bad("Drive.cosine NaN", () -> Drive.cosine(1, NAN), Reason.NOT_FINITE, "omega", "NaN"),
                bad("Drive.gaussian sigma", () -> Drive.gaussian(1, 0, -2), Reason.OUT_OF_RANGE, "sigma", "-2"),
                // ---- core: Hamiltonian, Lindbladian, Superoperator
                bad("Hamiltonian.builder 0", () -> Hamiltonian.builder(0), Reason.OUT_OF_RANGE, "dim", "0"),
                bad("Hamiltonian.term NaN", () -> Hamiltonian.builder(2).term(NAN, X), Reason.NOT_FINITE, "c", "NaN"),
                bad("Hamiltonian.term dimension", () -> Hamiltonian.builder(2).term(1, I3),
                        Reason.DIMENSION_MISMATCH, "a", "3"),
                bad("Hamiltonian.term drive null", () -> Hamiltonian.builder(2).term(X, null), Reason.NULL, "c",
                        "null"),
                bad("Hamiltonian.term not Hermitian", () -> Hamiltonian.builder(2).term(1, Operator.unit(2, 0, 1)),
                        Reason.NOT_HERMITIAN, "a", "0"),
                bad("Hamiltonian.build empty", () -> Hamiltonian.builder(2).build(), Reason.EMPTY, "terms", "no"),
                bad("Hamiltonian.at NaN", () -> H2.at(NAN), Reason.NOT_FINITE, "t", "NaN"),
                bad("Lindbladian.jump rate", () -> Lindbladian.builder(H2).jump(-0.1, X), Reason.OUT_OF_RANGE, "rate",
                        "-0.1"),
                bad("Lindbladian.jump dimension", () -> Lindbladian.builder(H2).jump(0.1, I3),
                        Reason.DIMENSION_MISMATCH, "jump operator 0", "3"),
                bad("Lindbladian.at NaN", () -> L2.at(NAN), Reason.NOT_FINITE, "t", "NaN"),
                bad("Superoperator.apply dimension", () -> L2.at(0).apply(I3), Reason.DIMENSION_MISMATCH, "rho", "3"),
                bad("Superoperator.compose dimension", () -> L2.at(0).compose(Superoperator.identity(3)),
                        Reason.DIMENSION_MISMATCH, "other", "3"),
                bad("Superoperator.ofMatrix not n²", () -> Superoperator.ofMatrix(I3), Reason.DIMENSION_MISMATCH, "s",
                        "3"),
                // ---- algebra
                bad("LieAlgebra.generatedBy empty", () -> LieAlgebra.generatedBy(List.<Operator>of()), Reason.EMPTY,
                        "hermitianOps", "empty"),
                bad("LieAlgebra.generatedBy not Hermitian",
                        () -> LieAlgebra.generatedBy(List.of(X, Operator.unit(2, 0, 1))), Reason.NOT_HERMITIAN,
                        "hermitianOps[1]", "1"),
                bad("LieAlgebra.generatedBy mixed sizes", () -> LieAlgebra.generatedBy(List.of(X, I3)),
                        Reason.DIMENSION_MISMATCH, "hermitianOps[1]", "3"),
                bad("LieAlgebra.generatedBy null Hamiltonian", () -> LieAlgebra.generatedBy((Hamiltonian) null),
                        Reason.NULL, "hamiltonian", "null"),
                bad("LieAlgebra.spannedBy not closed",
                        () -> LieAlgebra.spannedBy(List.of(X.timesI(), Z.timesI())), Reason.NOT_CLOSED, "basis",
                        "[b_0, b_1]"),
                bad("LieAlgebra.complexSpan null element",
                        () -> LieAlgebra.complexSpan(Arrays.asList(X, null)), Reason.NULL, "basis[1]", "null"),
                bad("LieAlgebra.coordinates dimension", () -> LieAlgebra.generatedBy(List.of(X, Z)).coordinates(I3),
                        Reason.DIMENSION_MISMATCH, "x", "3"),
                bad("LieAlgebra.contains dimension", () -> LieAlgebra.generatedBy(List.of(X, Z)).contains(I3),
                        Reason.DIMENSION_MISMATCH, "x", "3"),
                bad("LieAlgebra.adjoint index", () -> LieAlgebra.generatedBy(List.of(X, Z)).adjoint(3),
                        Reason.OUT_OF_RANGE, "i", "3"),
                bad("Subalgebras.closedSubsets empty", () -> Subalgebras.closedSubsets(List.of()), Reason.EMPTY,
                        "basis", "empty"),
                bad("PauliString.of letter", () -> PauliString.of("XZW"), Reason.SYNTAX, "letters", "W"),
                bad("PauliCombination.parse syntax", () -> PauliCombination.parse("0.5 XX + * YY"), Reason.SYNTAX, "text", "*"),
                bad("PauliCombination.parse qubits", () -> PauliCombination.parse("XX + YYY"), Reason.DIMENSION_MISMATCH, "text",
                        "YYY"),
                bad("PauliCombination.plus qubits", () -> PauliCombination.parse("XX").plus(PauliCombination.parse("XXX")),
                        Reason.DIMENSION_MISMATCH, "b", "3"),
                bad("PauliCombination.scale NaN", () -> PauliCombination.parse("XX").scale(NAN), Reason.NOT_FINITE, "s", "NaN"),
                bad("PauliAlgebra.generatedBy empty", () -> PauliAlgebra.generatedBy(List.of()), Reason.EMPTY, "sums",
                        "empty"),
                bad("PauliAlgebra.generatedBy limit",
                        () -> PauliAlgebra.generatedBy(List.of(PauliCombination.parse("XX"), PauliCombination.parse("ZI")), 1),
                        Reason.LIMIT_EXCEEDED, "maxDimension", "1"),
                // ---- integrators
                bad("Evolve.of null Hamiltonian", () -> Evolve.of((Hamiltonian) null), Reason.NULL, "h", "null"),
                bad("Evolve.of null Lindbladian", () -> Evolve.of((Lindbladian) null), Reason.NULL, "l", "null"),
                bad("Evolve.over empty", () -> Evolve.of(H2).over(2, 2), Reason.OUT_OF_RANGE, "t1", "2.0"),
                bad("Evolve.over NaN", () -> Evolve.of(H2).over(NAN, 1), Reason.NOT_FINITE, "t0", "NaN"),
                bad("Evolve.scheme null", () -> Evolve.of(H2).scheme(null), Reason.NULL, "scheme", "null"),
                bad("Evolve.tolerance", () -> Evolve.of(H2).tolerance(-1), Reason.OUT_OF_RANGE, "tolerance", "-1"),
                bad("Evolve.steps", () -> Evolve.of(H2).steps(0), Reason.OUT_OF_RANGE, "steps", "0"),
                bad("Evolve.maxSteps", () -> Evolve.of(H2).maxSteps(0), Reason.OUT_OF_RANGE, "maxSteps", "0"),
                bad("Evolve.state dimension", () -> Evolve.of(H2).state(StateVector.unit(3, 0)),
                        Reason.DIMENSION_MISMATCH, "psi", "3"),
                bad("Evolve.density trace", () -> Evolve.of(L2).density(Operator.identity(2)), Reason.OUT_OF_RANGE,
                        "rho0", "2"),
                bad("Evolve.run without interval", () -> Evolve.of(H2).run(), Reason.NULL, "interval", "none"),
                bad("Evolve.run reference fixed", () -> Evolve.of(H2).over(0, 1).scheme(Scheme.reference()).steps(4)
                        .run(), Reason.UNSUPPORTED, "steps", "4"),
                bad("Evolve.run Wei–Norman for GKLS", () -> Evolve.of(L2).over(0, 1).scheme(Scheme.weiNorman(CHART))
                        .run(), Reason.UNSUPPORTED, "scheme", "Hamiltonians only"),
                bad("Scheme.stepper null", () -> Scheme.magnus4().stepper((Hamiltonian) null), Reason.NULL, "h",
                        "null"),
                bad("Scheme.weiNorman null", () -> Scheme.weiNorman(null), Reason.NULL, "chart", "null"),
                bad("WeiNorman.of empty", () -> WeiNorman.of(List.<Operator>of()), Reason.EMPTY, "orderedBasis",
                        "empty"),
                bad("WeiNorman.of not closed", () -> WeiNorman.of(List.of(X.timesI(), Z.timesI())), Reason.NOT_CLOSED,
                        "orderedBasis", "["),
                bad("WeiNorman.of null algebra", () -> WeiNorman.of((LieAlgebra) null), Reason.NULL, "algebra",
                        "null"),
                bad("WeiNorman.equations dimension", () -> CHART.equations(Hamiltonian.constant(I3)),
                        Reason.DIMENSION_MISMATCH, "h", "3"),
                bad("WeiNormanEquations.derivative length", () -> CHART.equations(H2).derivative(0, new Complex[2]),
                        Reason.DIMENSION_MISMATCH, "g", "2"),
                bad("WeiNormanEquations.derivative NaN time", () -> CHART.equations(H2).derivative(NAN, G3),
                        Reason.NOT_FINITE, "t", "NaN"),
                bad("WeiNorman.propagator length", () -> CHART.propagator(new Complex[1]), Reason.DIMENSION_MISMATCH,
                        "g", "1"),
                bad("WeiNorman.propagator NaN", () -> CHART.propagator(new Complex[]{Complex.NaN, Complex.ZERO,
                        Complex.ZERO}), Reason.NOT_FINITE, "g", "NaN"),
                bad("BlockRiccati.of split", () -> BlockRiccati.of(H2, 2), Reason.OUT_OF_RANGE, "split", "2"),
                // ---- validation
                bad("Checks.unitarityError null", () -> Checks.unitarityError(null), Reason.NULL, "u", "null"),
                bad("Checks.traceError null", () -> Checks.traceError(null), Reason.NULL, "channel", "null"),
                bad("Checks.choiMinEigenvalue null", () -> Checks.choiMinEigenvalue(null), Reason.NULL, "channel",
                        "null"),
                bad("MagnusSeries.of empty interval", () -> MagnusSeries.of(H2, 1, 1), Reason.OUT_OF_RANGE, "t1",
                        "1"),
                bad("MagnusSeries.of NaN", () -> MagnusSeries.of(H2, 0, NAN), Reason.NOT_FINITE, "t1", "NaN"),
                bad("MagnusSeries.terms order", () -> MagnusSeries.of(H2, 0, 1).terms(0), Reason.OUT_OF_RANGE, "k",
                        "0"),
                bad("MagnusSeries.propagator order", () -> MagnusSeries.of(H2, 0, 1).propagator(99),
                        Reason.OUT_OF_RANGE, "k", "99"),
                bad("Fidelity.averageGate dimension", () -> Fidelity.averageGate(X, I3), Reason.DIMENSION_MISMATCH,
                        "actual", "3")
        );
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void refusedWithReasonArgumentAndValue(String label, Executable call, Reason reason, String argument, String seen) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call, label);
        assertEquals(reason, e.reason(), label + ": " + e.getMessage());
        assertTrue(e.getMessage().contains(argument), () -> label + ": message should name " + argument + ": "
                + e.getMessage());
        assertTrue(e.getMessage().contains(seen), () -> label + ": message should show " + seen + ": "
                + e.getMessage());
    }
}
