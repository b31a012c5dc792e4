package org.liepath.algebra;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import java.util.Random;
import java.util.TreeSet;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Properties of the exact string closure and of the order of its basis, on seeded random sets of Pauli strings: the
 * basis is exactly the closure found by an independent brute force over {@link PauliString} objects (a string set
 * closed under products of anticommuting pairs contains every bracket, since [P, Q] = 2PQ when P, Q anticommute and
 * 0 otherwise: common practice for Pauli algebras), and it is listed in the canonical order of
 * {@link PauliString#compareTo}. Qubit counts cover one-word strings short enough for the packed-key sort (≤ 26
 * qubits at these sizes), longer one-word strings (merge sort, up to 64 qubits) and two-word strings (65–90 qubits).
 */
class PauliBasisOrderTest {

    private static final int[] QUBITS = {1, 2, 3, 5, 9, 20, 26, 31, 33, 47, 64, 65, 90};

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void basisIsTheClosureInCanonicalOrder(long seed) {
        Random r = new Random(seed);
        int q = QUBITS[r.nextInt(QUBITS.length)];
        List<PauliCombination> gens = new ArrayList<>();
        List<PauliString> strings = new ArrayList<>();
        int k = 1 + r.nextInt(4);
        for (int g = 0; g < k; g++) {
            // sparse strings (a few non-identity letters) keep the closures small enough for the brute force
            char[] c = new char[q];
            java.util.Arrays.fill(c, 'I');
            int letters = 1 + r.nextInt(Math.min(3, q));
            for (int e = 0; e < letters; e++) {
                c[r.nextInt(q)] = "XYZ".charAt(r.nextInt(3));
            }
            PauliString p = PauliString.of(new String(c));
            if (p.weight() == 0) {
                continue;
            }
            strings.add(p);
            gens.add(PauliCombination.of(2.5 - g, p));
        }
        if (gens.isEmpty()) {
            return;
        }
        TreeSet<PauliString> expected = bruteForce(strings);
        PauliAlgebra a = PauliAlgebra.generatedBy(gens);
        List<PauliCombination> basis = a.basis();
        assertEquals(expected.size(), a.dimension());
        assertEquals(expected.size(), basis.size());
        List<PauliString> got = new ArrayList<>();
        for (PauliCombination s : basis) {
            assertEquals(1, s.size());
            assertEquals(1.0, s.coefficientAt(0));
            got.add(s.stringAt(0));
        }
        assertEquals(new ArrayList<>(expected), got, "basis in canonical order, q = " + q);
        for (PauliString p : got) {
            assertTrue(a.contains(PauliCombination.of(p)));
        }
    }

    /** Smallest set containing the strings and closed under products of anticommuting pairs. */
    private static TreeSet<PauliString> bruteForce(List<PauliString> gens) {
        TreeSet<PauliString> set = new TreeSet<>(gens);
        Deque<PauliString> todo = new ArrayDeque<>(set);
        while (!todo.isEmpty()) {
            PauliString p = todo.pop();
            for (PauliString s : new ArrayList<>(set)) {
                if (p.anticommutes(s)) {
                    PauliString prod = p.times(s);
                    if (set.add(prod)) {
                        todo.push(prod);
                    }
                }
            }
        }
        return set;
    }
}
