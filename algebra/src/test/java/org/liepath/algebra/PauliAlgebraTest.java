package org.liepath.algebra;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

class PauliAlgebraTest {

    // Free fermions: the transverse-field Ising chain with separate terms {X_i} ∪ {Z_iZ_{i+1}} (open) generates
    // so(2n) of dimension n(2n−1): under the Jordan–Wigner map its terms are nearest-neighbour Majorana bilinears,
    // which generate all γ_aγ_b (R. Wiersema, E. Kökcü, A. F. Kemper, B. N. Bakalov, npj Quantum Inf. 10, 110
    // (2024), arXiv:2309.05690, free-fermion class; E. Kökcü et al., PRL 129, 070501 (2022), basis statement).
    @ParameterizedTest(name = "n = {0}")
    @ValueSource(ints = {2, 3, 4, 5, 6, 8, 12, 17, 24, 30})
    void isingPerTermIsSo2n(int n) {
        PauliAlgebra a = PauliAlgebra.generatedBy(SpinChains.isingPerTerm(n));
        assertEquals(n * (2 * n - 1), a.dimension());
        assertTrue(a.isStringBasis());
        // so(4) = su(2) ⊕ su(2) and so(6) = su(4) (exceptional isomorphisms D2 = A1×A1, D3 = A3)
        String expected = n == 2 ? "su(2) ⊕ su(2)" : n == 3 ? "su(4)" : "so(" + 2 * n + ")";
        assertEquals(expected, a.type());
    }

    // Strings of two (and, in the soak run, three) 64-bit words in the closure and in the type identification.
    @ParameterizedTest(name = "n = {0}")
    @ValueSource(ints = {65, 70, 130})
    void isingPerTermMultiWord(int n) {
        org.junit.jupiter.api.Assumptions.assumeTrue(n < 100 || Boolean.getBoolean("liepath.soak"),
                "130 qubits (dimension 33 670) only in the soak run");
        PauliAlgebra a = PauliAlgebra.generatedBy(SpinChains.isingPerTerm(n));
        assertEquals(n * (2 * n - 1), a.dimension());
        if (n < 100) {
            assertEquals("so(" + 2 * n + ")", a.type());
        }
        // a Majorana bilinear spanning the whole chain: Y_0 Z … Z X_{n−1}-type strings are in, a lone Y is not
        assertFalse(a.contains(PauliCombination.of(PauliString.single(n, n - 1, 'Y'))));
        assertTrue(a.contains(PauliCombination.of(PauliString.single(n, n - 1, 'X'))));
    }

    @Test
    void isingPerTermFiftyQubits() {
        PauliAlgebra a = PauliAlgebra.generatedBy(SpinChains.isingPerTerm(50));
        assertEquals(4950, a.dimension());
        assertEquals("so(100)", a.type());
        // the basis is {Z_j} ∪ {A_i Z…Z B_j}-type strings: every basis string has weight ≤ 50 and is in the algebra
        assertTrue(a.contains(a.basis().get(4949)));
        assertFalse(a.contains(PauliCombination.of(PauliString.single(50, 3, 'Y'))));
    }

    /**
     * Per-bond generator sets a0–a22, b0–b4 (labels and generator sets of Wiersema et al., npj Quantum Inf. 10, 110
     * (2024), arXiv:2309.05690); the dimensions for n = 3 … 6, open and periodic, were computed independently by an
     * exact Pauli-string closure outside this project (Python).
     */
    static Stream<Arguments> classification() {
        Object[][] rows = {
                {"a0", new String[]{"XX"}, new int[]{2, 3, 4, 5}, new int[]{3, 4, 5, 6}},
                {"a1", new String[]{"XY"}, new int[]{3, 6, 10, 15}, new int[]{6, 12, 20, 30}},
                {"a2", new String[]{"XY", "YX"}, new int[]{6, 12, 20, 30}, new int[]{12, 24, 40, 60}},
                {"a3", new String[]{"XX", "YZ"}, new int[]{10, 40, 136, 510}, new int[]{30, 40, 510, 1020}},
                {"a4", new String[]{"XX", "YY"}, new int[]{6, 12, 20, 30}, new int[]{15, 24, 45, 60}},
                {"a5", new String[]{"XY", "YZ"}, new int[]{10, 30, 120, 480}, new int[]{10, 120, 496, 480}},
                {"a6", new String[]{"XX", "YZ", "ZY"}, new int[]{15, 60, 255, 1020}, new int[]{30, 60, 510, 1020}},
                {"a7", new String[]{"XX", "YY", "ZZ"}, new int[]{15, 60, 255, 1020}, new int[]{15, 60, 255, 1020}},
                {"a8", new String[]{"XX", "XZ"}, new int[]{10, 21, 36, 55}, new int[]{30, 56, 90, 132}},
                {"a9", new String[]{"XY", "XZ"}, new int[]{10, 36, 136, 528}, new int[]{21, 120, 496, 2016}},
                {"a10", new String[]{"XY", "YZ", "ZX"}, new int[]{15, 60, 255, 1020}, new int[]{15, 255, 1023, 1020}},
                {"a11", new String[]{"XY", "YX", "YZ"}, new int[]{21, 120, 496, 2016}, new int[]{28, 120, 496, 2016}},
                {"a12", new String[]{"XX", "XY", "YZ"}, new int[]{36, 255, 1023, 4095}, new int[]{63, 255, 1023, 4095}},
                {"a13", new String[]{"XX", "YY", "YZ"}, new int[]{30, 126, 510, 2046}, new int[]{30, 126, 510, 2046}},
                {"a14", new String[]{"XX", "YY", "XY"}, new int[]{15, 28, 45, 66}, new int[]{30, 56, 90, 132}},
                {"a15", new String[]{"XX", "XY", "XZ"}, new int[]{30, 126, 510, 2046}, new int[]{63, 255, 1023, 4095}},
                {"a16", new String[]{"XY", "YX", "YZ", "ZY"}, new int[]{28, 120, 496, 2016},
                        new int[]{28, 120, 496, 2016}},
                {"a17", new String[]{"XX", "XY", "ZX"}, new int[]{36, 255, 1023, 4095}, new int[]{63, 255, 1023, 4095}},
                {"a18", new String[]{"XX", "XZ", "YY", "ZY"}, new int[]{63, 255, 1023, 4095},
                        new int[]{63, 255, 1023, 4095}},
                {"a19", new String[]{"XX", "XY", "ZX", "YZ"}, new int[]{63, 255, 1023, 4095},
                        new int[]{63, 255, 1023, 4095}},
                {"a20", new String[]{"XX", "YY", "ZZ", "ZY"}, new int[]{30, 126, 510, 2046},
                        new int[]{30, 126, 510, 2046}},
                {"a21", new String[]{"XX", "YY", "XY", "ZX"}, new int[]{63, 255, 1023, 4095},
                        new int[]{63, 255, 1023, 4095}},
                {"a22", new String[]{"XX", "XY", "XZ", "YX"}, new int[]{63, 255, 1023, 4095},
                        new int[]{63, 255, 1023, 4095}},
                {"b0", new String[]{"XI", "IX"}, new int[]{3, 4, 5, 6}, new int[]{3, 4, 5, 6}},
                {"b1", new String[]{"XX", "XI", "IX"}, new int[]{5, 7, 9, 11}, new int[]{6, 8, 10, 12}},
                {"b2", new String[]{"XY", "XI", "IX"}, new int[]{11, 37, 137, 529}, new int[]{21, 120, 496, 2016}},
                {"b3", new String[]{"XI", "YI", "IX", "IY"}, new int[]{9, 12, 15, 18}, new int[]{9, 12, 15, 18}},
                {"b4", new String[]{"XX", "XY", "XZ", "XI", "IX", "IY", "IZ"}, new int[]{31, 127, 511, 2047},
                        new int[]{63, 255, 1023, 4095}}};
        List<Arguments> out = new ArrayList<>();
        for (Object[] r : rows) {
            out.add(Arguments.of(r[0], r[1], r[2], r[3]));
        }
        return out.stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("classification")
    void perBondDimensions(String label, String[] patterns, int[] open, int[] periodic) {
        for (int n = 3; n <= 6; n++) {
            assertEquals(open[n - 3], PauliAlgebra.generatedBy(SpinChains.perBond(n, false, patterns)).dimension(),
                    label + " open n = " + n);
            assertEquals(periodic[n - 3], PauliAlgebra.generatedBy(SpinChains.perBond(n, true, patterns)).dimension(),
                    label + " periodic n = " + n);
        }
    }

    // Types against the algebra column of the same classification (Wiersema et al. 2024, as transcribed; sp in
    // matrix notation here, sp(2m) = 2m×2m, so their rank-notation sp(2^{n−2}) is our sp(2^{n−1})).
    @Test
    void perBondTypes() {
        assertEquals("so(7)", open(4, "XX", "XZ").type());                  // a8: so(2n−1)
        assertEquals("so(11)", open(6, "XX", "XZ").type());
        assertEquals("sp(8)", open(4, "XY", "XZ").type());                  // a9: sp(2^{n−2}) rank notation
        assertEquals("sp(32)", open(6, "XY", "XZ").type());
        assertEquals("so(10)", open(5, "XX", "YY", "XY").type());           // a14: so(2n)
        assertEquals("su(8) ⊕ su(8)", open(4, "XX", "YY", "YZ").type());    // a13
        assertEquals("su(16)", open(5, "XX", "YZ", "ZY").type());           // a6, n odd
        assertEquals("su(4) ⊕ su(4) ⊕ su(4) ⊕ su(4)", open(4, "XX", "YZ", "ZY").type()); // a6, n even
        assertEquals("sp(16)", open(5, "XX", "YZ").type());                 // a3, n mod 8 = 5
        assertEquals("su(16) ⊕ su(16)", open(6, "XX", "YZ").type());        // a3, n mod 8 = 6
        assertEquals("so(16)", open(5, "XY", "YZ").type());                 // a5, n mod 6 = 5: so(2^{n−1})
        assertEquals("so(5)", open(5, "XY").type());                        // a1: so(n)
        assertEquals("so(5) ⊕ so(5)", open(5, "XY", "YX").type());          // a2
        assertEquals("so(32)", open(5, "XY", "YX", "YZ").type());           // a11: so(2^n)
        assertEquals("su(16)", open(4, "XX", "XY", "YZ").type());           // a12: su(2^n)
        assertEquals("sp(8) ⊕ u(1)", open(4, "XY", "XI", "IX").type());     // b2
        assertEquals("su(2) ⊕ su(2) ⊕ su(2)", open(3, "XI", "YI", "IX", "IY").type()); // b3: n·so(3)
        assertEquals("su(8) ⊕ su(8) ⊕ u(1)", open(4, "XX", "XY", "XZ", "XI", "IX", "IY", "IZ").type()); // b4
        assertEquals("u(1)^5", open(3, "XX", "XI", "IX").type()); // b1: (2n−1)·u(1)
    }

    // Free fermions beyond the open chain (dimensions computed independently by an exact string closure outside this
    // project): the periodic chain {X_iX_{i+1}} ∪ {Z_i} has dimension 2n(2n−1); under the Jordan–Wigner map the
    // boundary bond carries the fermion parity, splitting the two parity sectors into so(2n) ⊕ so(2n). Adding
    // Z_iZ_{i+1} to the number-conserving hopping {XX, XY, YX, YY} ∪ {Z_i} leaves only parity, giving one full
    // su(2^{n−1}) per parity sector (30, 126, 510, 2046 for n = 3 … 6).
    @Test
    void freeFermionVariants() {
        for (int n = 3; n <= 6; n++) {
            List<PauliCombination> ring = new ArrayList<>(SpinChains.perBond(n, true, "XX"));
            List<PauliCombination> hop = new ArrayList<>(SpinChains.perBond(n, false, "XX", "XY", "YX", "YY", "ZZ"));
            for (int i = 0; i < n; i++) {
                ring.add(PauliCombination.of(PauliString.single(n, i, 'Z')));
                hop.add(PauliCombination.of(PauliString.single(n, i, 'Z')));
            }
            PauliAlgebra a = PauliAlgebra.generatedBy(ring), b = PauliAlgebra.generatedBy(hop);
            assertEquals(2 * n * (2 * n - 1), a.dimension());
            String so = n == 3 ? "su(4)" : "so(" + 2 * n + ")";
            assertEquals(so + " ⊕ " + so, a.type());
            assertEquals(2 * ((1 << (2 * n - 2)) - 1), b.dimension());
            assertEquals("su(" + (1 << (n - 1)) + ") ⊕ su(" + (1 << (n - 1)) + ")", b.type());
            if (n == 3) {
                // the dense decomposition (numerical, independent code) agrees
                assertEquals(PauliAlgebraSumsTest.factors(a.type()),
                        PauliAlgebraSumsTest.factors(LieAlgebra.generatedBy(PauliAlgebraSumsTest.dense(ring)).type()));
            }
        }
    }

    private static PauliAlgebra open(int n, String... patterns) {
        return PauliAlgebra.generatedBy(SpinChains.perBond(n, false, patterns));
    }
}
