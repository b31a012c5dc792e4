package org.liepath.algebra;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Dynamical Lie algebras of qubit chains against published classifications. Dimensions are exact integers, so the
 * checks are equalities.
 */
class DynamicalAlgebrasTest {

    @ParameterizedTest(name = "n = {0}")
    @ValueSource(ints = {2, 3, 4, 5, 6})
    void transverseFieldIsingTermsGenerateSo2n(int n) {
        // X_i and Z_iZ_{i+1} as separate generators: free fermions, so(2n), dimension n(2n−1) (Jordan–Wigner: the
        // terms are nearest-neighbour Majorana bilinears, which generate all γ_aγ_b). R. Wiersema, E. Kökcü,
        // A. F. Kemper, B. N. Bakalov, npj Quantum Inf. 10, 110 (2024), arXiv:2309.05690; values in the check list §2.4
        LieAlgebra g = LieAlgebra.generatedBy(Gens.ising(n));
        assertEquals(n * (2 * n - 1), g.dimension());
        String want = n == 2 ? "su(2) ⊕ su(2)" : n == 3 ? "su(4)" : "so(" + 2 * n + ")";
        assertEquals(want, g.type());
        assertEquals(n, g.rank());
    }

    @ParameterizedTest(name = "n = {0}")
    @ValueSource(ints = {2, 3, 4})
    void localXYWithIsingCouplingOnAConnectedGraphIsFullyControllable(int n) {
        // F. Albertini, D. D'Alessandro, Linear Algebra Appl. 350, 213 (2002), arXiv:quant-ph/0106115: with x/y
        // controls on each spin and Ising couplings along a connected graph the DLA is su(2^n) (check list §2.6)
        LieAlgebra g = LieAlgebra.generatedBy(Gens.localXYPlusZZ(n, Gens.path(n, n - 1)));
        int d = 1 << n;
        assertEquals(d * d - 1, g.dimension());
        assertTrue(g.isFullUnitary());
        assertEquals("su(" + d + ")", g.type());
    }

    @Test
    void starGraphIsAlsoConnected() {
        LieAlgebra g = LieAlgebra.generatedBy(Gens.localXYPlusZZ(3, new int[][] {{0, 1}, {0, 2}}));
        assertEquals(63, g.dimension());
        assertTrue(g.isFullUnitary());
    }

    @ParameterizedTest(name = "n = {0}")
    @CsvSource({"3, 18, su(4) ⊕ su(2)", "4, 66, su(8) ⊕ su(2)"})
    void disconnectedGraphSplitsOverItsComponents(int n, int dim, String type) {
        // path with the last edge removed: components of n−1 and 1 qubits, su(2^{n−1}) ⊕ su(2), dimension
        // (4^{n−1} − 1) + 3 (same sources, check list §2.6)
        LieAlgebra g = LieAlgebra.generatedBy(Gens.localXYPlusZZ(n, Gens.path(n, n - 2)));
        assertEquals(dim, g.dimension());
        assertEquals(type, g.type());
        assertFalse(g.isFullUnitary());
        assertEquals(2, g.simpleIdeals().size());
    }

    // Per-bond generator sets of the classification of Wiersema et al. (2024) on open chains: dimensions [computed
    // exactly, check list §2.2]; the algebra names are the paper's classification as transcribed there, with sp in
    // the 2m×2m convention (sp(2^{n−2}) in rank notation is our sp(2^{n−1})).
    @ParameterizedTest(name = "{0} n = {1}")
    @CsvSource(delimiter = ';', value = {
            "XX XZ; 3; 10; so(5)", "XX XZ; 4; 21; so(7)",
            "XY XZ; 3; 10; so(5)", "XY XZ; 4; 36; sp(8)",
            "XX YY XY; 3; 15; su(4)", "XX YY XY; 4; 28; so(8)",
            "XX YY YZ; 3; 30; su(4) ⊕ su(4)", "XX YY YZ; 4; 126; su(8) ⊕ su(8)",
            "XY XI IX; 3; 11; so(5) ⊕ u(1)", "XY XI IX; 4; 37; sp(8) ⊕ u(1)",
            "XI YI IX IY; 3; 9; su(2) ⊕ su(2) ⊕ su(2)", "XI YI IX IY; 4; 12; su(2) ⊕ su(2) ⊕ su(2) ⊕ su(2)",
            "XX; 4; 3; u(1)^3", "XX XI IX; 4; 7; u(1)^7",
            "XY; 4; 6; su(2) ⊕ su(2)", "XX XY YZ; 4; 255; su(16)"})
    void perBondClassificationRows(String words, int n, int dim, String type) {
        LieAlgebra g = LieAlgebra.generatedBy(Gens.perBond(n, words.split(" ")));
        assertEquals(dim, g.dimension());
        assertEquals(type, g.type());
    }

    @Test
    void so9AndSp8AreToldApartInsideDynamicalAlgebras() {
        // a8 (XX, XZ) at n = 5 is so(9), a9 (XY, XZ) at n = 4 is sp(8): both dimension 36, rank 4 (check list §2.2)
        LieAlgebra b4 = LieAlgebra.generatedBy(Gens.perBond(5, "XX", "XZ"));
        LieAlgebra c4 = LieAlgebra.generatedBy(Gens.perBond(4, "XY", "XZ"));
        assertEquals(36, b4.dimension());
        assertEquals(36, c4.dimension());
        assertEquals(4, b4.rank());
        assertEquals(4, c4.rank());
        assertEquals("so(9)", b4.type());
        assertEquals("sp(8)", c4.type());
    }

    @Test
    void hamiltonianFormUsesItsOperators() {
        Hamiltonian h = Hamiltonian.builder(4).term(0.7, Gens.pauli(2, new int[] {0, 1}, new char[] {'Z', 'Z'}))
                .term(1.0, Gens.pauli(2, new int[] {0}, new char[] {'X'}))
                .term(1.0, Gens.pauli(2, new int[] {1}, new char[] {'X'})).build();
        LieAlgebra g = LieAlgebra.generatedBy(h);
        assertEquals(6, g.dimension()); // so(4), check list §2.4 (n = 2)
        Controllability c = Controllability.of(h);
        assertFalse(c.isControllable());
        assertEquals(15, c.fullDimension());
        assertTrue(c.toString().contains("| 6"), c.toString());
    }

    @Test
    void controllabilityReportNamesAMinimalGeneratingSubset() {
        List<Operator> gens = Gens.localXYPlusZZ(2, Gens.path(2, 1));
        Controllability c = Controllability.of(gens);
        assertTrue(c.isControllable());
        assertEquals(15, c.dimension());
        assertEquals("su(4)", c.type());
        List<Integer> needed = c.neededGenerators();
        List<Operator> sub = new ArrayList<>();
        for (int k : needed) {
            sub.add(gens.get(k));
        }
        // the subset generates the same algebra, and none of its members can be dropped (checked independently)
        assertEquals(15, LieAlgebra.generatedBy(sub).dimension());
        for (int drop = 0; drop < sub.size(); drop++) {
            List<Operator> fewer = new ArrayList<>(sub);
            fewer.remove(drop);
            assertTrue(LieAlgebra.generatedBy(fewer).dimension() < 15, "generator " + needed.get(drop) + " needed");
        }
        assertTrue(c.toString().contains("controllable"));
    }
}
