package org.liepath.algebra;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.*;

class PauliStringTest {

    /** Powers of i as (re, im). */
    private static double[] ipow(int k) {
        switch (k & 3) {
            case 0: return new double[]{1, 0};
            case 1: return new double[]{0, 1};
            case 2: return new double[]{-1, 0};
            default: return new double[]{0, -1};
        }
    }

    static String randomLetters(Random r, int n) {
        char[] c = new char[n];
        for (int k = 0; k < n; k++) {
            c[k] = "IXYZ".charAt(r.nextInt(4));
        }
        return new String(c);
    }

    // Single-qubit Pauli product table σ_a σ_b = δ_ab I + i ε_abc σ_c (common practice; e.g. J. J. Sakurai,
    // Modern Quantum Mechanics, eq. (3.2.34) — equation number from memory).
    @Test
    void singleQubitProductTable() {
        String[][] table = {
                // a, b, product letter, phase exponent k of i^k
                {"X", "Y", "Z", "1"}, {"Y", "Z", "X", "1"}, {"Z", "X", "Y", "1"},
                {"Y", "X", "Z", "3"}, {"Z", "Y", "X", "3"}, {"X", "Z", "Y", "3"},
                {"X", "X", "I", "0"}, {"Y", "Y", "I", "0"}, {"Z", "Z", "I", "0"},
                {"I", "X", "X", "0"}, {"Y", "I", "Y", "0"}, {"I", "I", "I", "0"}};
        for (String[] row : table) {
            PauliString a = PauliString.of(row[0]), b = PauliString.of(row[1]);
            assertEquals(row[2], a.times(b).toString(), row[0] + row[1]);
            assertEquals(Integer.parseInt(row[3]), a.phaseExponent(b), row[0] + row[1]);
            assertEquals(!row[0].equals(row[1]) && !row[0].equals("I") && !row[1].equals("I"), a.anticommutes(b));
        }
    }

    // The product of strings factorises over qubits (Kronecker product rule, common practice): the phase of a long
    // product is the sum of the single-qubit phases mod 4, computed here letter by letter from the table above.
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void multiWordProductsFactorOverQubits(long seed) {
        Random r = new Random(seed);
        for (int n : new int[]{63, 64, 65, 70, 128, 130, 200}) {
            String la = randomLetters(r, n), lb = randomLetters(r, n);
            PauliString a = PauliString.of(la), b = PauliString.of(lb);
            int k = 0, anti = 0;
            StringBuilder prod = new StringBuilder();
            for (int q = 0; q < n; q++) {
                PauliString sa = PauliString.of(la.substring(q, q + 1)), sb = PauliString.of(lb.substring(q, q + 1));
                k += sa.phaseExponent(sb);
                prod.append(sa.times(sb));
                if (sa.anticommutes(sb)) {
                    anti++;
                }
            }
            assertEquals(prod.toString(), a.times(b).toString());
            assertEquals(k & 3, a.phaseExponent(b));
            // strings commute iff they differ (both non-identity) on an even number of qubits (common practice)
            assertEquals(anti % 2 == 0, a.commutes(b));
            assertEquals(a.phaseExponent(b) % 2 == 1, a.anticommutes(b));
            assertEquals(la, a.toString());
            assertEquals(n, a.qubits());
        }
    }

    // Dense cross-check: P·Q = i^k R as 2^n×2^n matrices built by core's Kronecker construction.
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void productMatchesDenseMatrices(long seed) {
        Random r = new Random(seed);
        int n = 1 + r.nextInt(4);
        PauliString a = PauliString.of(randomLetters(r, n)), b = PauliString.of(randomLetters(r, n));
        Operator lhs = a.toOperator().times(b.toOperator());
        double[] ph = ipow(a.phaseExponent(b));
        Operator rhs = a.times(b).toOperator().scale(new org.apache.commons.math3.complex.Complex(ph[0], ph[1]));
        assertEquals(0, lhs.distance(rhs), 1e-15); // entries are 0, ±1, ±i: exact
    }

    // Phase of a long product: (XYZ…)^2 on 130 qubits is the identity; X⊗…⊗X times Z⊗…⊗Z is (−i)^n Y⊗…⊗Y
    // because XZ = −iY (table above).
    @Test
    void longProducts() {
        for (int n : new int[]{1, 5, 64, 70, 130}) {
            PauliString xs = PauliString.of("X".repeat(n)), zs = PauliString.of("Z".repeat(n));
            assertEquals("Y".repeat(n), xs.times(zs).toString());
            assertEquals((3 * n) & 3, xs.phaseExponent(zs));
            PauliString p = PauliString.of(randomLetters(new Random(n), n));
            assertTrue(p.times(p).isIdentity());
            assertEquals(0, p.phaseExponent(p));
        }
        // a chain product X1 Z1 ... accumulates phases: X·Y·Z = i·I (XY = iZ, Z·Z = I)
        PauliString x = PauliString.of("X"), y = PauliString.of("Y"), z = PauliString.of("Z");
        int k = x.phaseExponent(y);
        PauliString xy = x.times(y);
        k += xy.phaseExponent(z);
        assertTrue(xy.times(z).isIdentity());
        assertEquals(1, k & 3);
    }

    @Test
    void weightSupportLetters() {
        PauliString p = PauliString.of("IXIYZ" + "I".repeat(70) + "X");
        assertEquals(4, p.weight());
        assertArrayEquals(new int[]{1, 3, 4, 75}, p.support());
        assertEquals('Y', p.letter(3));
        assertEquals('X', p.letter(75));
        assertEquals(PauliString.of("IIZII"), PauliString.single(5, 2, 'Z'));
        assertEquals(PauliString.of("xyzi"), PauliString.of("XYZI"));
        assertEquals(0, PauliString.identity(130).weight());
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void equalsHashCompareAgree(long seed) {
        Random r = new Random(seed);
        int n = 1 + r.nextInt(140);
        String la = randomLetters(r, n);
        String lb = r.nextBoolean() ? la : randomLetters(r, n);
        PauliString a = PauliString.of(la), b = PauliString.of(lb);
        assertEquals(la.equals(lb), a.equals(b));
        if (a.equals(b)) {
            assertEquals(a.hashCode(), b.hashCode());
        }
        // canonical order is lexicographic on letters with I < X < Y < Z (which is also ASCII order)
        int lex = Integer.signum(la.compareTo(lb));
        assertEquals(lex, Integer.signum(a.compareTo(b)), la + " vs " + lb);
    }

    @Test
    void badLettersNamePosition() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> PauliString.of("XXQZ"));
        assertEquals(Reason.SYNTAX, e.reason());
        assertTrue(e.getMessage().contains("'Q' at position 2"), e.getMessage());
        assertTrue(e.getMessage().contains("letters"), e.getMessage());
        String longer = "X".repeat(500) + "+" + "Z".repeat(500);
        e = assertThrows(InvalidInputException.class, () -> PauliString.of(longer));
        assertTrue(e.getMessage().contains("position 500"), e.getMessage());
        assertTrue(e.getMessage().length() < 200, e.getMessage());
        assertEquals(Reason.EMPTY, assertThrows(InvalidInputException.class, () -> PauliString.of("")).reason());
        assertEquals(Reason.NULL, assertThrows(InvalidInputException.class, () -> PauliString.of(null)).reason());
        e = assertThrows(InvalidInputException.class, () -> PauliString.of("XX").commutes(PauliString.of("XXX")));
        assertEquals(Reason.DIMENSION_MISMATCH, e.reason());
        assertTrue(e.getMessage().contains("3 qubits"), e.getMessage());
        e = assertThrows(InvalidInputException.class, () -> PauliString.identity(3).with(3, 'X'));
        assertEquals(Reason.OUT_OF_RANGE, e.reason());
        assertEquals(Reason.LIMIT_EXCEEDED,
                assertThrows(InvalidInputException.class, () -> PauliString.identity(13).toOperator()).reason());
    }
}
