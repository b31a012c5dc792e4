package org.liepath.algebra;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;

import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

class PauliCombinationTest {

    static PauliCombination randomSum(Random r, int n, int terms) {
        PauliCombination s = PauliCombination.zero(n);
        for (int k = 0; k < terms; k++) {
            s = s.plus(PauliCombination.of(r.nextGaussian(), PauliString.of(PauliStringTest.randomLetters(r, n))));
        }
        return s;
    }

    @Test
    void parsesTheDocumentedForms() {
        PauliCombination s = PauliCombination.parse("0.5 XXI + YYI - 2 ZII");
        assertEquals(3, s.size());
        assertEquals(0.5, s.coefficient(PauliString.of("XXI")));
        assertEquals(1.0, s.coefficient(PauliString.of("YYI")));
        assertEquals(-2.0, s.coefficient(PauliString.of("ZII")));
        assertEquals(0.0, s.coefficient(PauliString.of("ZZZ")));
        PauliCombination t = PauliCombination.parse("  -1e-3*xz+.5 ZZ −2.5E+1 * IX + XZ ");
        assertEquals(1 - 1e-3, t.coefficient(PauliString.of("XZ")));
        assertEquals(0.5, t.coefficient(PauliString.of("ZZ")));
        assertEquals(-25.0, t.coefficient(PauliString.of("IX")));
        assertEquals(PauliCombination.parse("2XY"), PauliCombination.parse("XY + XY"));
        assertTrue(PauliCombination.parse("XY - XY").isZero());
        assertEquals(2, PauliCombination.parse("XY - XY").qubits());
        // the contract's expression
        PauliCombination c = PauliCombination.parse("0.5 XXI + YYI - 2 ZII").plus(PauliCombination.parse("ZZZ")).scale(2.0);
        assertEquals(Map.of(PauliString.of("XXI"), 1.0, PauliString.of("YYI"), 2.0, PauliString.of("ZII"), -4.0,
                PauliString.of("ZZZ"), 2.0), c.terms());
        assertEquals("XXI + 2 YYI - 4 ZII + 2 ZZZ", c.toString());
        assertEquals("0 III", PauliCombination.zero(3).toString());
        assertEquals(PauliCombination.zero(3), PauliCombination.parse("0 III"));
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void toStringRoundTrips(long seed) {
        Random r = new Random(seed);
        int n = 1 + r.nextInt(r.nextBoolean() ? 5 : 90);
        PauliCombination s = PauliCombination.zero(n);
        for (int k = r.nextInt(6); k >= 0; k--) {
            double c;
            switch (r.nextInt(4)) {
                case 0: c = r.nextInt(7) - 3; break;
                case 1: c = r.nextGaussian() * Math.pow(10, r.nextInt(40) - 20); break;
                case 2: c = Double.longBitsToDouble(r.nextLong()); break;
                default: c = r.nextDouble();
            }
            if (!Double.isFinite(c)) {
                c = 1.5;
            }
            s = s.plus(PauliCombination.of(c, PauliString.of(PauliStringTest.randomLetters(r, n))));
        }
        assertEquals(s, PauliCombination.parse(s.toString()), s.toString());
    }

    // Fuzzing: random texts over the grammar's alphabet (and some noise) either parse or throw
    // InvalidInputException; nothing else may escape and nothing may hang.
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void fuzzedTextOnlyThrowsInvalidInput(long seed) {
        Random r = new Random(seed);
        String alphabet = "IXYZixyz0123456789.eE+-*  \t\u2212Q#(٣";
        for (int rep = 0; rep < 50; rep++) {
            StringBuilder b = new StringBuilder();
            int len = r.nextInt(30);
            for (int k = 0; k < len; k++) {
                b.append(alphabet.charAt(r.nextInt(alphabet.length())));
            }
            String text = b.toString();
            try {
                PauliCombination s = PauliCombination.parse(text);
                assertEquals(s, PauliCombination.parse(s.toString()), text);
            } catch (InvalidInputException e) {
                assertNotNull(e.reason());
                assertTrue(e.getMessage().startsWith("text:") || e.getMessage().startsWith("letters:"),
                        e.getMessage());
            }
        }
    }

    @Test
    void syntaxErrorsNamePositions() {
        assertSyntax("0.5 XXI + YQI", "'Q' at position 11");
        assertSyntax("XX YY", "'Y' at position 3");
        assertSyntax("0.5 + XX", "'+' at position 4");
        assertSyntax("1e XX", "' ' at position 2");
        assertSyntax("XX +", "end of text at position 4");
        assertSyntax("2 * * XX", "'*' at position 4");
        assertSyntax("XX + 1.2.3 YY", "'.' at position 8");
        assertSyntax("NaN XX", "'N' at position 0");
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> PauliCombination.parse("XX + 1e999 YY"));
        assertEquals(Reason.NOT_FINITE, e.reason());
        assertTrue(e.getMessage().contains("1e999 at position 5"), e.getMessage());
        e = assertThrows(InvalidInputException.class, () -> PauliCombination.parse("0.5 XXI + YY - 2 ZII"));
        assertEquals(Reason.DIMENSION_MISMATCH, e.reason());
        assertTrue(e.getMessage().contains("\"YY\" of 2 letters at position 10"), e.getMessage());
        assertEquals(Reason.EMPTY, assertThrows(InvalidInputException.class, () -> PauliCombination.parse("  ")).reason());
        assertEquals(Reason.NULL, assertThrows(InvalidInputException.class, () -> PauliCombination.parse(null)).reason());
    }

    private static void assertSyntax(String text, String where) {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> PauliCombination.parse(text));
        assertEquals(Reason.SYNTAX, e.reason(), e.getMessage());
        assertEquals("text", e.argument());
        assertTrue(e.getMessage().contains(where), e.getMessage());
        assertTrue(e.getMessage().contains(text), e.getMessage());
    }

    @Test
    void badCoefficientsAndSizes() {
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> PauliCombination.of(Double.NaN, PauliString.of("XY")));
        assertEquals(Reason.NOT_FINITE, e.reason());
        assertTrue(e.getMessage().contains("NaN"), e.getMessage());
        e = assertThrows(InvalidInputException.class, () -> PauliCombination.of("XY").scale(Double.POSITIVE_INFINITY));
        assertEquals(Reason.NOT_FINITE, e.reason());
        e = assertThrows(InvalidInputException.class, () -> PauliCombination.of(1e300, PauliString.of("XY")).scale(1e300));
        assertEquals(Reason.NOT_FINITE, e.reason());
        e = assertThrows(InvalidInputException.class, () -> PauliCombination.of(Map.of(PauliString.of("X"), Double.NaN)));
        assertEquals(Reason.NOT_FINITE, e.reason());
        e = assertThrows(InvalidInputException.class,
                () -> PauliCombination.of(Map.of(PauliString.of("X"), 1.0, PauliString.of("XY"), 2.0)));
        assertEquals(Reason.DIMENSION_MISMATCH, e.reason());
        e = assertThrows(InvalidInputException.class, () -> PauliCombination.of("XY").plus(PauliCombination.of("XYZ")));
        assertEquals(Reason.DIMENSION_MISMATCH, e.reason());
        assertTrue(e.getMessage().contains("3 qubits"), e.getMessage());
        assertEquals(Reason.EMPTY, assertThrows(InvalidInputException.class, () -> PauliCombination.of(Map.of())).reason());
        assertEquals(Reason.LIMIT_EXCEEDED,
                assertThrows(InvalidInputException.class, () -> PauliCombination.of("X".repeat(13)).toOperator()).reason());
    }

    // The bracket convention against dense matrices: C = −i[A, B] with [A, B] = AB − BA computed by dense
    // multiplication (the definition of the commutator).
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void commutatorMatchesDense(long seed) {
        Random r = new Random(seed);
        int n = 1 + r.nextInt(4);
        PauliCombination a = randomSum(r, n, 1 + r.nextInt(5)), b = randomSum(r, n, 1 + r.nextInt(5));
        Operator dense = a.toOperator().commutator(b.toOperator()).timesI().scale(-1.0);
        // entries are sums of at most 25 products of O(1) Gaussians: 1e-13 covers the rounding
        assertEquals(0, a.commutator(b).toOperator().distance(dense), 1e-13);
        assertEquals(0, a.plus(b).toOperator().distance(a.toOperator().plus(b.toOperator())), 1e-14);
        assertEquals(0, a.minus(b).scale(0.3).toOperator()
                .distance(a.toOperator().minus(b.toOperator()).scale(0.3)), 1e-14);
        assertTrue(a.commutator(a).isZero());
        // antisymmetric up to the order of summation of repeated products
        assertEquals(0, a.commutator(b).plus(b.commutator(a)).norm(), 1e-13);
    }
}
