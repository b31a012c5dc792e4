package org.liepath.core;

import org.apache.commons.math3.complex.Complex;
import org.ejml.data.ZMatrixRMaj;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.InvalidInputException.Reason;

import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.params.provider.Arguments.arguments;

/**
 * Bad input to every core entry point: each case asserts the exception type, its reason(), the argument it names
 * and that the message names the argument and the value seen.
 */
class CoreBadInputTest {
    private static final double NAN = Double.NaN;

    private static Arguments bad(String label, Executable call, Reason reason, String argument, String seen) {
        return arguments(label, call, reason, argument, seen);
    }

    private static final Hamiltonian H2 = Hamiltonian.builder(2).term(1, Pauli.z()).build();

    /** A user drive whose breakpoints are not usable. */
    private static Drive withBreakpoints(double[] b) {
        return new Drive() {
            @Override
            public double at(double t) {
                return 1;
            }

            @Override
            public double[] breakpoints() {
                return b;
            }

            @Override
            public String name() {
                return "user pulse";
            }
        };
    }

    static Stream<Arguments> cases() {
        Operator x = Pauli.x();
        Operator i3 = Operator.identity(3);
        return Stream.of(
                // Operator factories
                bad("NaN entry", () -> Operator.of(new double[][]{{1, NAN}, {0, 1}}, new double[2][2]),
                        Reason.NOT_FINITE, "re", "NaN at (0, 1)"),
                bad("infinite entry", () -> Operator.real(new double[][]{{1, 0}, {Double.POSITIVE_INFINITY, 1}}),
                        Reason.NOT_FINITE, "re", "Infinity at (1, 0)"),
                bad("infinite imaginary entry", () -> Operator.of(new double[2][2], new double[][]{{0, 0}, {0, Double.NEGATIVE_INFINITY}}),
                        Reason.NOT_FINITE, "im", "-Infinity at (1, 1)"),
                bad("ragged rows", () -> Operator.real(new double[][]{{1, 0}, {0}}), Reason.NOT_SQUARE, "re",
                        "row 1 of length 1"),
                bad("non-square", () -> Operator.real(new double[][]{{1, 0, 0}, {0, 1, 0}}), Reason.NOT_SQUARE, "re",
                        "row 0 of length 3"),
                bad("empty array", () -> Operator.real(new double[0][0]), Reason.EMPTY, "re", "0 rows"),
                bad("null rows array", () -> Operator.of(null, new double[1][1]), Reason.NULL, "re", "null"),
                bad("null row", () -> Operator.real(new double[][]{{1, 0}, null}), Reason.NULL, "re", "null row 1"),
                bad("re/im sizes differ", () -> Operator.of(new double[2][2], new double[3][3]),
                        Reason.DIMENSION_MISMATCH, "im", "3x3"),
                bad("planar length", () -> Operator.ofPlanar(2, new double[3], new double[4]),
                        Reason.DIMENSION_MISMATCH, "re", "length 3"),
                bad("planar NaN", () -> Operator.ofPlanar(1, new double[]{0}, new double[]{NAN}),
                        Reason.NOT_FINITE, "im", "NaN at index 0"),
                bad("identity(0)", () -> Operator.identity(0), Reason.OUT_OF_RANGE, "n", "0"),
                bad("identity too large", () -> Operator.identity(50_000), Reason.LIMIT_EXCEEDED, "n", "50000"),
                bad("diagonal empty", Operator::diagonal, Reason.EMPTY, "d", "none"),
                bad("diagonal NaN", () -> Operator.diagonal(1, NAN), Reason.NOT_FINITE, "d", "NaN at index 1"),
                bad("unit index", () -> Operator.unit(2, 2, 0), Reason.OUT_OF_RANGE, "i", "2"),
                bad("unit negative index", () -> Operator.unit(2, 0, -1), Reason.OUT_OF_RANGE, "j", "-1"),
                bad("get out of range", () -> x.get(0, 5), Reason.OUT_OF_RANGE, "j", "5"),
                bad("fromEjml non-square", () -> Operator.fromEjml(new ZMatrixRMaj(2, 3)), Reason.NOT_SQUARE, "m", "2x3"),
                bad("fromEjml NaN", () -> {
                    ZMatrixRMaj m = new ZMatrixRMaj(1, 1);
                    m.set(0, 0, 1, NAN);
                    Operator.fromEjml(m);
                }, Reason.NOT_FINITE, "m (imaginary part)", "NaN"),
                bad("copyTo short arrays", () -> x.copyTo(new double[3], new double[4]), Reason.DIMENSION_MISMATCH,
                        "reOut/imOut", "3/4"),
                // Operator algebra
                bad("plus dimensions", () -> x.plus(i3), Reason.DIMENSION_MISMATCH, "b", "dimension 3"),
                bad("times dimensions", () -> i3.times(x), Reason.DIMENSION_MISMATCH, "b", "dimension 2"),
                bad("commutator null", () -> x.commutator(null), Reason.NULL, "b", "null"),
                bad("scale NaN", () -> x.scale(NAN), Reason.NOT_FINITE, "s", "NaN"),
                bad("scale complex infinite", () -> x.scale(new Complex(0, Double.POSITIVE_INFINITY)),
                        Reason.NOT_FINITE, "z (imaginary part)", "Infinity"),
                bad("isHermitian negative tolerance", () -> x.isHermitian(-1), Reason.OUT_OF_RANGE, "tol", "-1.0"),
                bad("expMinusI non-Hermitian", () -> Operator.unit(2, 0, 1).expMinusI(1), Reason.NOT_HERMITIAN,
                        "this", "‖A − A†‖_F = 1.41"),
                bad("expMinusI NaN time", () -> x.expMinusI(NAN), Reason.NOT_FINITE, "t", "NaN"),
                bad("negative power", () -> x.power(-2), Reason.OUT_OF_RANGE, "k", "-2"),
                bad("overflowing product", () -> Operator.identity(2).scale(1e200).times(Operator.identity(2).scale(1e200)),
                        Reason.NOT_FINITE, "b", "overflow at entry (0, 0)"),
                bad("overflowing sum", () -> Operator.diagonal(1, Double.MAX_VALUE).plus(Operator.diagonal(1, Double.MAX_VALUE)),
                        Reason.NOT_FINITE, "b", "overflow at entry (1, 1)"),
                bad("overflowing scale", () -> Operator.diagonal(1e300, 1).scale(1e10), Reason.NOT_FINITE, "s",
                        "overflow at entry (0, 0)"),
                bad("overflowing Kronecker product", () -> Operator.diagonal(1e200).kron(Operator.diagonal(1, 1e200)),
                        Reason.NOT_FINITE, "b", "overflow at entry (1, 1)"),
                bad("Kronecker product too large", () -> Operator.zero(300).kron(Operator.zero(300)),
                        Reason.LIMIT_EXCEEDED, "b", "300 × 300 = 90000"),
                bad("overflowing power", () -> Operator.identity(2).scale(1e200).power(3), Reason.NOT_FINITE, "k",
                        "3 (overflow"),
                bad("overflowing exponential", () -> Operator.identity(2).scale(1e6).exp(), Reason.NOT_FINITE, "this",
                        "overflow"),
                // StateVector
                bad("state lengths differ", () -> StateVector.of(new double[2], new double[3]),
                        Reason.DIMENSION_MISMATCH, "im", "length 3"),
                bad("state empty", () -> StateVector.real(), Reason.EMPTY, "re", "length 0"),
                bad("state NaN", () -> StateVector.real(1, NAN), Reason.NOT_FINITE, "re", "NaN at index 1"),
                bad("basis index", () -> StateVector.unit(3, 3), Reason.OUT_OF_RANGE, "k", "3"),
                bad("state apply dimension", () -> StateVector.unit(2, 0).apply(i3), Reason.DIMENSION_MISMATCH, "a",
                        "dimension 3"),
                bad("state copyTo short", () -> StateVector.unit(3, 0).copyTo(new double[2], new double[3]),
                        Reason.DIMENSION_MISMATCH, "reOut/imOut", "2/3"),
                bad("normalize zero", () -> StateVector.real(0, 0).normalized(), Reason.OUT_OF_RANGE, "this",
                        "the zero vector"),
                bad("state inner dimension", () -> StateVector.unit(2, 0).inner(StateVector.unit(3, 0)),
                        Reason.DIMENSION_MISMATCH, "b", "dimension 3"),
                // Pauli, Spin, Levels
                bad("invalid Pauli letter", () -> Pauli.string("XQZ"), Reason.SYNTAX, "s", "'Q' at position 1 of \"XQZ\""),
                bad("invalid Pauli letter at end", () -> Pauli.string("XY "), Reason.SYNTAX, "s", "' ' at position 2"),
                bad("empty Pauli string", () -> Pauli.string(""), Reason.EMPTY, "s", "\"\""),
                bad("too many qubits", () -> Pauli.string("XXXXXXXXXXXXX"), Reason.LIMIT_EXCEEDED, "s", "13 letters"),
                bad("bad Pauli letter", () -> Pauli.letter('W'), Reason.SYNTAX, "letter", "'W'"),
                bad("non-half-integer spin", () -> Spin.of(0.3), Reason.OUT_OF_RANGE, "j", "0.3"),
                bad("negative spin", () -> Spin.of(-1.5), Reason.OUT_OF_RANGE, "j", "-1.5"),
                bad("spin zero", () -> Spin.of(0), Reason.OUT_OF_RANGE, "j", "0.0"),
                bad("spin within rounding of zero", () -> Spin.of(1e-13), Reason.OUT_OF_RANGE, "j", "1.0E-13"),
                bad("spin NaN", () -> Spin.of(NAN), Reason.NOT_FINITE, "j", "NaN"),
                bad("spin too large", () -> Spin.of(1000.5), Reason.LIMIT_EXCEEDED, "j", "1000.5"),
                bad("spin m index", () -> Spin.of(1).m(3), Reason.OUT_OF_RANGE, "k", "3"),
                bad("Gell-Mann d = 1", () -> Levels.gellMann(1), Reason.OUT_OF_RANGE, "d", "1"),
                bad("Gell-Mann too large", () -> Levels.gellMann(65), Reason.OUT_OF_RANGE, "d", "65"),
                bad("annihilation d = 0", () -> Levels.annihilation(0), Reason.OUT_OF_RANGE, "d", "0"),
                bad("annihilation too large", () -> Levels.annihilation(50_000), Reason.LIMIT_EXCEEDED, "d", "50000"),
                // HilbertSpace
                bad("subsystem dimension 0", () -> HilbertSpace.of(2, 0, 3), Reason.OUT_OF_RANGE, "dims",
                        "0 at position 1"),
                bad("no subsystems", HilbertSpace::of, Reason.EMPTY, "dims", "none"),
                bad("space too large", () -> HilbertSpace.of(64, 128), Reason.LIMIT_EXCEEDED, "dims", "[64, 128]"),
                bad("embed wrong dimension", () -> HilbertSpace.of(2, 3).embed(x, 1), Reason.DIMENSION_MISMATCH, "op",
                        "dimension 2"),
                bad("embed index", () -> HilbertSpace.of(2, 3).embed(x, 2), Reason.OUT_OF_RANGE, "k", "2"),
                bad("embed same subsystem twice", () -> HilbertSpace.of(2, 2).embed(x, 1, x, 1), Reason.OUT_OF_RANGE,
                        "j", "1"),
                bad("product count", () -> HilbertSpace.of(2, 2).product(x), Reason.DIMENSION_MISMATCH, "ops", "1"),
                bad("basis level", () -> HilbertSpace.of(2, 3).basis(1, 3), Reason.OUT_OF_RANGE, "levels[1]", "3"),
                bad("joint embed repeated", () -> HilbertSpace.of(2, 2).embed(Operator.identity(4), 0, 0),
                        Reason.OUT_OF_RANGE, "subsystems", "[0, 0] (0 repeated)"),
                bad("joint embed wrong size", () -> HilbertSpace.of(2, 3).embed(Operator.identity(4), 0, 1),
                        Reason.DIMENSION_MISMATCH, "op", "dimension 4"),
                bad("joint embed no subsystems", () -> HilbertSpace.of(2, 3).embed(x, new int[0]), Reason.EMPTY,
                        "subsystems", "none"),
                bad("joint embed index", () -> HilbertSpace.of(2, 3).embed(Operator.identity(4), 0, 5),
                        Reason.OUT_OF_RANGE, "subsystems[1]", "5"),
                bad("partial trace repeated", () -> HilbertSpace.of(2, 2).partialTrace(Operator.identity(4), 1, 1),
                        Reason.OUT_OF_RANGE, "traced", "[1, 1]"),
                bad("partial trace index", () -> HilbertSpace.of(2, 2).partialTrace(Operator.identity(4), 2),
                        Reason.OUT_OF_RANGE, "traced[0]", "2"),
                bad("partial trace dimension", () -> HilbertSpace.of(2, 2).partialTrace(x, 0),
                        Reason.DIMENSION_MISMATCH, "op", "dimension 2"),
                // Hamiltonian
                bad("non-Hermitian term", () -> Hamiltonian.builder(2).term(1, Pauli.z()).term(1, Operator.unit(2, 0, 1)),
                        Reason.NOT_HERMITIAN, "operator of term 1", "‖A − A†‖_F"),
                bad("term dimension", () -> Hamiltonian.builder(2).term(1, i3), Reason.DIMENSION_MISMATCH,
                        "operator of term 0", "dimension 3"),
                bad("NaN coefficient", () -> Hamiltonian.builder(2).term(NAN, x), Reason.NOT_FINITE, "c", "NaN"),
                bad("null drive", () -> Hamiltonian.builder(2).term(x, null), Reason.NULL, "drive of term 0", "null"),
                bad("null operator", () -> Hamiltonian.builder(2).term(null, Drive.constant(1)), Reason.NULL,
                        "operator of term 0", "null"),
                bad("no terms", () -> Hamiltonian.builder(2).build(), Reason.EMPTY, "terms", "none"),
                bad("builder dimension", () -> Hamiltonian.builder(0), Reason.OUT_OF_RANGE, "dim", "0"),
                bad("NaN breakpoint of a user drive", () -> Hamiltonian.builder(2).term(x, withBreakpoints(new double[]{0, NAN})),
                        Reason.OUT_OF_RANGE, "drive of term 0", "NaN at index 1"),
                bad("descending breakpoints", () -> Hamiltonian.builder(2).term(x, withBreakpoints(new double[]{2, 1})),
                        Reason.OUT_OF_RANGE, "drive of term 0", "1.0 at index 1 after 2.0"),
                bad("null breakpoints", () -> Hamiltonian.builder(2).term(x, withBreakpoints(null)), Reason.NULL,
                        "drive of term 0", "null from 'user pulse'"),
                bad("coefficients array too short", () -> H2.coefficients(0, new double[0]), Reason.DIMENSION_MISMATCH,
                        "out", "length 0"),
                bad("coefficients null array", () -> H2.coefficients(0, null), Reason.NULL, "out", "null"),
                bad("H at NaN time", () -> H2.at(NAN), Reason.NOT_FINITE, "t", "NaN"),
                bad("coefficients at NaN time", () -> H2.coefficients(NAN, new double[1]), Reason.NOT_FINITE, "t", "NaN"),
                bad("selected coefficients, index out of range", () -> H2.coefficients(0, new int[]{1}, new double[1]),
                        Reason.OUT_OF_RANGE, "terms", "1"),
                bad("selected coefficients, negative index", () -> H2.coefficients(0, new int[]{-1}, new double[1]),
                        Reason.OUT_OF_RANGE, "terms", "-1"),
                bad("selected coefficients, short output", () -> H2.coefficients(0, new int[]{0}, new double[0]),
                        Reason.DIMENSION_MISMATCH, "out", "length 0"),
                bad("selected coefficients, null terms", () -> H2.coefficients(0, null, new double[1]), Reason.NULL,
                        "terms", "null"),
                bad("selected coefficients at NaN time", () -> H2.coefficients(NAN, new int[]{0}, new double[1]),
                        Reason.NOT_FINITE, "t", "NaN"),
                // Lindbladian
                bad("negative rate", () -> Lindbladian.builder(H2).jump(-0.1, x), Reason.OUT_OF_RANGE, "rate of jump 0",
                        "-0.1"),
                bad("NaN rate", () -> Lindbladian.builder(H2).jump(1, x).jump(NAN, x), Reason.NOT_FINITE,
                        "rate of jump 1", "NaN"),
                bad("jump dimension", () -> Lindbladian.builder(H2).jump(1, i3), Reason.DIMENSION_MISMATCH,
                        "jump operator 0", "dimension 3"),
                bad("null jump", () -> Lindbladian.builder(H2).jump(1, null), Reason.NULL, "jump operator 0", "null"),
                bad("null Hamiltonian", () -> Lindbladian.builder(null), Reason.NULL, "h", "null"),
                bad("steady state, time-dependent H", () -> Lindbladian.builder(
                                Hamiltonian.builder(2).term(x, Drive.cosine(1, 1)).build()).jump(1, Operator.unit(2, 0, 1))
                        .build().steadyState(), Reason.UNSUPPORTED, "this", "time-dependent"),
                bad("steady state not unique", () -> Lindbladian.builder(H2).jump(1, Pauli.z()).build().steadyState(),
                        Reason.UNSUPPORTED, "this", "rank-deficient"),
                // Drive
                bad("piecewise times not increasing", () -> Drive.piecewiseConstant(new double[]{0, 1, 1}, new double[]{1, 2}),
                        Reason.OUT_OF_RANGE, "times", "1.0 then 1.0 at index 2"),
                bad("piecewise times decreasing", () -> Drive.piecewiseConstant(new double[]{0, 2, 1}, new double[]{1, 2}),
                        Reason.OUT_OF_RANGE, "times", "2.0 then 1.0 at index 2"),
                bad("piecewise wrong lengths", () -> Drive.piecewiseConstant(new double[]{0, 1}, new double[]{1, 2}),
                        Reason.DIMENSION_MISMATCH, "times", "2 times"),
                bad("piecewise no values", () -> Drive.piecewiseConstant(new double[]{0}, new double[0]), Reason.EMPTY,
                        "values", "none"),
                bad("piecewise NaN value", () -> Drive.piecewiseConstant(new double[]{0, 1}, new double[]{NAN}),
                        Reason.NOT_FINITE, "values", "NaN at index 0"),
                bad("piecewise infinite time", () -> Drive.piecewiseConstant(new double[]{0, Double.POSITIVE_INFINITY},
                        new double[]{1}), Reason.NOT_FINITE, "times", "Infinity at index 1"),
                bad("samples dt", () -> Drive.samples(0, 0, 1, 2), Reason.OUT_OF_RANGE, "dt", "0.0"),
                bad("samples none", () -> Drive.samples(0, 1), Reason.EMPTY, "values", "none"),
                bad("spline too few knots", () -> Drive.spline(new double[]{0, 1}, new double[]{0, 1}),
                        Reason.DIMENSION_MISMATCH, "times", "2 times"),
                bad("spline lengths", () -> Drive.spline(new double[]{0, 1, 2}, new double[]{0, 1}),
                        Reason.DIMENSION_MISMATCH, "values", "2 values"),
                bad("spline times not increasing", () -> Drive.spline(new double[]{0, 2, 1}, new double[]{0, 1, 2}),
                        Reason.OUT_OF_RANGE, "times", "2.0 then 1.0 at index 2"),
                bad("gaussian sigma", () -> Drive.gaussian(1, 0, -1), Reason.OUT_OF_RANGE, "sigma", "-1.0"),
                bad("cosine NaN frequency", () -> Drive.cosine(1, NAN), Reason.NOT_FINITE, "omega", "NaN"),
                bad("constant infinite", () -> Drive.constant(Double.NEGATIVE_INFINITY), Reason.NOT_FINITE, "c", "-Infinity"),
                bad("window reversed", () -> Drive.constant(1).window(2, 1), Reason.OUT_OF_RANGE, "end", "1.0"),
                bad("shift NaN", () -> Drive.constant(1).shift(NAN), Reason.NOT_FINITE, "dt", "NaN"),
                bad("plus null", () -> Drive.constant(1).plus(null), Reason.NULL, "other", "null"),
                // Superoperator
                bad("superoperator not n²", () -> Superoperator.ofMatrix(Operator.identity(3)), Reason.DIMENSION_MISMATCH,
                        "s", "3x3"),
                bad("superoperator apply", () -> Superoperator.identity(2).apply(i3), Reason.DIMENSION_MISMATCH, "rho",
                        "dimension 3"),
                bad("compose dimensions", () -> Superoperator.identity(2).compose(Superoperator.identity(3)),
                        Reason.DIMENSION_MISMATCH, "other", "dimension 3"),
                bad("no Kraus operators", () -> Superoperator.kraus(List.of()), Reason.EMPTY, "ks", "none"),
                bad("Kraus dimensions", () -> Superoperator.kraus(List.of(x, i3)), Reason.DIMENSION_MISMATCH, "ks[1]",
                        "dimension 3"),
                bad("sandwich dimensions", () -> Superoperator.sandwich(x, i3), Reason.DIMENSION_MISMATCH, "b",
                        "dimension 3"),
                bad("superoperator identity(0)", () -> Superoperator.identity(0), Reason.OUT_OF_RANGE, "n", "0"),
                bad("Choi matrix not n²", () -> Superoperator.ofChoi(Operator.identity(5)), Reason.DIMENSION_MISMATCH,
                        "j", "5x5"),
                bad("exp at NaN time", () -> Superoperator.identity(2).exp(NAN), Reason.NOT_FINITE, "t", "NaN"),
                bad("Kraus of a non-CP map (transpose)", () -> Superoperator.ofMatrix(transposeMap()).krausOperators(),
                        Reason.OUT_OF_RANGE, "this", "indefinite remainder"),
                bad("Kraus of a non-CP map (negative diagonal)", () -> Superoperator.identity(2).scale(-1).krausOperators(),
                        Reason.OUT_OF_RANGE, "this", "negative pivot"),
                bad("steady state of a non-generator", () -> Superoperator.identity(2).steadyState(), Reason.UNSUPPORTED,
                        "this", "trace defect")
        );
    }

    /** The transpose map ρ ↦ ρᵀ on qubits: positive but not completely positive (Choi J = swap, eigenvalue −1). */
    private static Operator transposeMap() {
        double[][] s = new double[4][4];
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                s[j + 2 * i][i + 2 * j] = 1; // vec(Xᵀ)[j + n i] = X_ij = vec(X)[i + n j]
            }
        }
        return Operator.real(s);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void refusesWithReasonArgumentAndValue(String label, Executable call, Reason reason, String argument, String seen) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call, label);
        assertEquals(reason, e.reason(), () -> label + ": " + e.getMessage());
        assertEquals(argument, e.argument(), () -> label + ": " + e.getMessage());
        assertTrue(e.getMessage().startsWith(argument + ": expected "), () -> label + ": " + e.getMessage());
        assertTrue(e.getMessage().contains(seen), () -> label + ": message lacks '" + seen + "': " + e.getMessage());
        assertTrue(e instanceof IllegalArgumentException);
    }
}
