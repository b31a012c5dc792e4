package org.liepath.algebra;

import org.junit.jupiter.api.Test;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Closed subsets of the 15 non-identity two-qubit Pauli strings, checked against a brute force over all 2^15 − 1
 * subsets written here on the symplectic (x, z) bit representation of Pauli strings (P ∝ X^x Z^z; two strings
 * anticommute iff x₁·z₂ + z₁·x₂ is odd, and their product is ∝ (x₁ ⊕ x₂, z₁ ⊕ z₂); D. Gottesman, PhD thesis, Caltech
 * 1997, §3.1). Published counts [computed exactly, check list §3]: six closed subsets of dimension 10 (so(5)), fifteen
 * of dimension 7, none of dimension 8.
 */
class PauliSubsetsTest {
    static final String LETTERS = "IXYZ";

    /** The 15 strings in the order II excluded, index = 4·a + b − 1 for letters a, b. */
    static List<String> names() {
        List<String> out = new ArrayList<>();
        for (int a = 0; a < 4; a++) {
            for (int b = 0; b < 4; b++) {
                if (a + b > 0) {
                    out.add("" + LETTERS.charAt(a) + LETTERS.charAt(b));
                }
            }
        }
        return out;
    }

    /** (x bits, z bits) of a letter: I = (0,0), X = (1,0), Y = (1,1), Z = (0,1). */
    static int[] bits(String s) {
        int x = 0, z = 0;
        for (int k = 0; k < s.length(); k++) {
            char c = s.charAt(k);
            x = x << 1 | (c == 'X' || c == 'Y' ? 1 : 0);
            z = z << 1 | (c == 'Z' || c == 'Y' ? 1 : 0);
        }
        return new int[] {x, z};
    }

    /** Signature (dim, rank, centre dim) of a closed subset, computed with bit operations only. */
    static String signature(int mask, int[][] b) {
        List<Integer> els = new ArrayList<>();
        for (int k = 0; k < 15; k++) {
            if ((mask >> k & 1) != 0) {
                els.add(k);
            }
        }
        int centre = 0;
        for (int p : els) {
            boolean central = true;
            for (int q : els) {
                central &= !anti(b[p], b[q]);
            }
            centre += central ? 1 : 0;
        }
        // rank = size of a maximal commuting subset (a maximal abelian subalgebra spanned by strings is a Cartan
        // subalgebra: an element commuting with all of it has all its strings commuting with it)
        List<Integer> cartan = new ArrayList<>();
        for (int p : els) {
            boolean ok = true;
            for (int q : cartan) {
                ok &= !anti(b[p], b[q]);
            }
            if (ok) {
                cartan.add(p);
            }
        }
        return els.size() + "/" + cartan.size() + "/" + centre;
    }

    static boolean anti(int[] p, int[] q) {
        return ((Integer.bitCount(p[0] & q[1]) + Integer.bitCount(p[1] & q[0])) & 1) == 1;
    }

    @Test
    void closedSubsetsMatchABruteForceOverAllSubsets() {
        List<String> names = names();
        int[][] b = new int[15][];
        for (int k = 0; k < 15; k++) {
            b[k] = bits(names.get(k));
        }
        int[] productIndex = new int[15 * 15];
        for (int p = 0; p < 15; p++) {
            for (int q = 0; q < 15; q++) {
                int x = b[p][0] ^ b[q][0], z = b[p][1] ^ b[q][1];
                int idx = -1;
                for (int k = 0; k < 15; k++) {
                    if (b[k][0] == x && b[k][1] == z) {
                        idx = k;
                    }
                }
                productIndex[p * 15 + q] = idx;
            }
        }
        Map<String, Integer> brute = new TreeMap<>();
        Map<Integer, Integer> bruteByDim = new TreeMap<>();
        List<Integer> bruteMasks = new ArrayList<>();
        for (int mask = 1; mask < 1 << 15; mask++) {
            boolean closed = true;
            for (int p = 0; p < 15 && closed; p++) {
                for (int q = p + 1; q < 15 && closed; q++) {
                    if ((mask >> p & 1) != 0 && (mask >> q & 1) != 0 && anti(b[p], b[q])) {
                        closed = (mask >> productIndex[p * 15 + q] & 1) != 0;
                    }
                }
            }
            if (closed) {
                bruteMasks.add(mask);
                brute.merge(signature(mask, b), 1, Integer::sum);
                bruteByDim.merge(Integer.bitCount(mask), 1, Integer::sum);
            }
        }
        List<Operator> ops = new ArrayList<>();
        for (String s : names) {
            ops.add(Pauli.string(s));
        }
        List<LieAlgebra> subs = Subalgebras.closedSubsets(ops);
        List<int[]> sets = Subalgebras.closedIndexSets(ops);
        assertEquals(bruteMasks.size(), subs.size());
        Map<String, Integer> ours = new TreeMap<>();
        Map<Integer, Integer> oursByDim = new TreeMap<>();
        Map<String, Integer> byType = new TreeMap<>();
        for (int k = 0; k < subs.size(); k++) {
            LieAlgebra g = subs.get(k);
            int mask = 0;
            for (int i : sets.get(k)) {
                mask |= 1 << i;
            }
            assertTrue(bruteMasks.contains(mask), "closed subset " + mask + " not closed by brute force");
            assertEquals(sets.get(k).length, g.dimension());
            ours.merge(g.dimension() + "/" + g.rank() + "/" + g.center().dimension(), 1, Integer::sum);
            oursByDim.merge(g.dimension(), 1, Integer::sum);
            byType.merge(g.type(), 1, Integer::sum);
        }
        assertEquals(brute, ours);
        assertEquals(bruteByDim, oursByDim);
        // published counts (check list §3)
        assertEquals(6, oursByDim.get(10));
        assertEquals(15, oursByDim.get(7));
        assertEquals(null, oursByDim.get(8));
        assertEquals(1, oursByDim.get(15));
        assertEquals(6, byType.get("so(5)"));
        assertEquals(15, byType.get("su(2) ⊕ su(2) ⊕ u(1)"));
        assertEquals(1, byType.get("su(4)"));
        assertEquals(null, byType.get("su(3)"));
        // every type agrees with the brute-force signature (dim/rank/centre) under the names of the classification
        for (LieAlgebra g : subs) {
            String t = g.type();
            int ss = g.dimension() - g.center().dimension();
            int rr = g.rank() - g.center().dimension();
            String semisimple = ss == 0 ? "" : ss == 3 ? "su(2)" : ss == 6 && rr == 2 ? "su(2) ⊕ su(2)"
                    : ss == 10 ? "so(5)" : ss == 15 ? "su(4)" : "?";
            assertTrue(t.startsWith(semisimple), t + " vs " + semisimple);
        }
    }

    @Test
    void closureOfAChosenSubset() {
        List<Operator> ops = new ArrayList<>();
        for (String s : names()) {
            ops.add(Pauli.string(s));
        }
        // XI and ZI generate the local su(2) on qubit 0: {XI, YI, ZI} = indices 3, 7, 11
        assertArrayEquals(new int[] {3, 7, 11}, Subalgebras.closureIndices(ops, 3, 11));
        LieAlgebra g = Subalgebras.closureOf(ops, 3, 11);
        assertEquals("su(2)", g.type());
        // XX and ZI: anticommute, product ∝ YX, so {XX, YX, ZI}
        assertEquals(3, Subalgebras.closureOf(ops, 4, 11).dimension());
        // the 3×3 matrix units E_ij (i ≠ j) have the monomial-bracket property; their closure is sl(3,C)
        List<Operator> units = new ArrayList<>();
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                if (i != j) {
                    units.add(Gens.unit(3, i, j, 1, 0));
                }
            }
        }
        // matrix units alone are not closed: [E_01, E_10] = E_00 − E_11 is outside their span
        assertEquals(org.liepath.core.InvalidInputException.Reason.NOT_CLOSED,
                org.junit.jupiter.api.Assertions.assertThrows(org.liepath.core.InvalidInputException.class,
                        () -> Subalgebras.closedSubsets(units)).reason());
    }

    @Test
    void threeQubitSubsetsOfASmallFamily() {
        // {XII, ZII, IXI, IZI}: local su(2) ⊕ su(2) plus their closed subsets
        List<Operator> ops = new ArrayList<>();
        for (String s : new String[] {"XII", "YII", "ZII", "IXI", "IYI", "IZI"}) {
            ops.add(Pauli.string(s));
        }
        List<LieAlgebra> subs = Subalgebras.closedSubsets(ops);
        // per qubit: ∅, {X}, {Y}, {Z}, {X,Y,Z} (5 choices); two qubits 25 − 1 non-empty
        assertEquals(24, subs.size());
        assertEquals("su(2) ⊕ su(2)", subs.get(subs.size() - 1).type());
    }
}
