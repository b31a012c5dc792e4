package org.liepath.algebra;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.*;

/** Closures of general Pauli sums (floating-point elimination path), and bad input. */
class PauliAlgebraSumsTest {

    /** Dimension of the centre: the null space of x ↦ ([x, b_1], …, [x, b_d]) in basis coordinates. */
    static int centreDimension(PauliAlgebra a) {
        List<PauliCombination> b = a.basis();
        int d = b.size();
        Map<String, Integer> rowOf = new HashMap<>();
        List<double[]> rows = new ArrayList<>();
        for (int j = 0; j < d; j++) {
            for (int k = 0; k < d; k++) {
                for (Map.Entry<PauliString, Double> e : b.get(k).commutator(b.get(j)).terms().entrySet()) {
                    String key = j + ":" + e.getKey();
                    Integer r = rowOf.get(key);
                    if (r == null) {
                        r = rows.size();
                        rowOf.put(key, r);
                        rows.add(new double[d]);
                    }
                    rows.get(r)[k] += e.getValue();
                }
            }
        }
        if (rows.isEmpty()) {
            return d;
        }
        double[][] m = rows.toArray(new double[0][]);
        return d - new SingularValueDecomposition(new Array2DRowRealMatrix(m, false)).getRank();
    }

    // D. D'Alessandro, Y. Isik, "Controllability of the periodic quantum Ising spin chain", arXiv:2405.00898
    // (abstract): with the periodic Ising coupling Σ Z_iZ_{i+1} and the transverse field Σ X_i as the two
    // generators, the dynamical Lie algebra has dimension 3n − 1 with a 2-dimensional centre.
    @ParameterizedTest(name = "n = {0}")
    @ValueSource(ints = {3, 4, 5, 6, 8, 10})
    void periodicIsingWithGlobalControls(int n) {
        PauliAlgebra a = PauliAlgebra.generatedBy(SpinChains.isingSummed(n, true));
        assertEquals(3 * n - 1, a.dimension());
        assertFalse(a.isStringBasis());
        if (n <= 6) {
            assertEquals(2, centreDimension(a));
        }
        if (n <= 5) {
            // the type comes from the dense algebra here; its centre part must be the published u(1)^2
            assertTrue(a.type().endsWith(" ⊕ u(1)^2"), a.type());
        }
        for (PauliCombination g : SpinChains.isingSummed(n, true)) {
            assertTrue(a.contains(g));
        }
    }

    // Local X and Y on every qubit plus ZZ on the edges of a connected graph generate su(2^n); a disconnected
    // graph splits the algebra over its components (F. Albertini, D. D'Alessandro, Linear Algebra Appl. 350, 213
    // (2002), arXiv:quant-ph/0106115; R. Zeier, T. Schulte-Herbrüggen, J. Math. Phys. 52, 113510 (2011)).
    // With X only the chain is the free-fermion so(2n) (see the Ising per-term check).
    @Test
    void localControlsOnAPath() {
        for (int n = 2; n <= 6; n++) {
            List<PauliCombination> g = new ArrayList<>(SpinChains.perBond(n, false, "ZZ"));
            for (int i = 0; i < n; i++) {
                g.add(PauliCombination.of(PauliString.single(n, i, 'X')));
                g.add(PauliCombination.of(PauliString.single(n, i, 'Y')));
            }
            PauliAlgebra a = PauliAlgebra.generatedBy(g);
            assertEquals((1 << (2 * n)) - 1, a.dimension(), "n = " + n);
            assertEquals("su(" + (1 << n) + ")", a.type());
            if (n >= 3) {
                // remove the last edge: su(2^{n−1}) on the first n−1 qubits and su(2) on the last
                g.remove(n - 2);
                PauliAlgebra split = PauliAlgebra.generatedBy(g);
                assertEquals((1 << (2 * n - 2)) - 1 + 3, split.dimension());
                assertEquals("su(" + (1 << (n - 1)) + ") ⊕ su(2)", split.type());
            }
        }
        // the controls as weighted sums. One sum a X_i + b Y_i per qubit is a rotated X_i (a rotation about z, which
        // leaves Z_iZ_{i+1} alone), so the algebra is that of X only + ZZ, the free-fermion so(2n); two independent
        // sums per qubit span X_i and Y_i again and give su(2^n).
        int n = 4;
        Random r = new Random(7);
        List<PauliCombination> one = new ArrayList<>(SpinChains.perBond(n, false, "ZZ"));
        List<PauliCombination> two = new ArrayList<>(SpinChains.perBond(n, false, "ZZ"));
        for (int i = 0; i < n; i++) {
            PauliString x = PauliString.single(n, i, 'X'), y = PauliString.single(n, i, 'Y');
            PauliCombination s1 = PauliCombination.of(1 + r.nextDouble(), x).plus(PauliCombination.of(1 + r.nextDouble(), y));
            PauliCombination s2 = PauliCombination.of(1 + r.nextDouble(), x).minus(PauliCombination.of(1 + r.nextDouble(), y));
            one.add(s1);
            two.add(s1);
            two.add(s2);
        }
        assertEquals(n * (2 * n - 1), PauliAlgebra.generatedBy(one).dimension());
        assertEquals(255, PauliAlgebra.generatedBy(two).dimension());
        assertEquals(LieAlgebra.generatedBy(dense(one)).dimension(), PauliAlgebra.generatedBy(one).dimension());
    }

    static List<Operator> dense(List<PauliCombination> sums) {
        List<Operator> d = new ArrayList<>();
        for (PauliCombination s : sums) {
            d.add(s.toOperator());
        }
        return d;
    }

    // A sum whose strings commute pairwise generates only u(1): one dimension, and the basis is the normalised sum.
    @Test
    void singleSumAndEchelonNormalisation() {
        PauliAlgebra a = PauliAlgebra.generatedBy(List.of(PauliCombination.parse("2 XX + 4 ZZ")));
        assertEquals(1, a.dimension());
        PauliCombination b = a.basis().get(0);
        assertEquals(2, b.size());
        // pivot = the largest coefficient, scaled to 1
        assertEquals(1.0, b.coefficient(PauliString.of("ZZ")));
        assertEquals(0.5, b.coefficient(PauliString.of("XX")));
        assertTrue(a.contains(PauliCombination.parse("-3 XX - 6 ZZ")));
        assertFalse(a.contains(PauliCombination.parse("XX")));
        assertTrue(a.contains(PauliCombination.zero(2)));
    }

    // su(2) from the sums X + Y and Z (Pauli algebra, common practice): the elimination ends on single strings, so
    // the exact string identification applies; a large algebra of sums is not named.
    @Test
    void typesOfSumAlgebras() {
        PauliAlgebra su2 = PauliAlgebra.generatedBy(List.of(PauliCombination.parse("X + Y"), PauliCombination.parse("Z")));
        assertEquals(3, su2.dimension());
        assertTrue(su2.isStringBasis());
        assertEquals("su(2)", su2.type());
        assertEquals(List.of(PauliCombination.of("X"), PauliCombination.of("Y"), PauliCombination.of("Z")), su2.basis());
        PauliAlgebra big = PauliAlgebra.generatedBy(SpinChains.isingSummed(8, true));
        assertFalse(big.isStringBasis());
        assertEquals("unknown", big.type());
    }

    static List<PauliCombination> randomGenerators(Random r, int n) {
        List<PauliCombination> gens = new ArrayList<>();
        int m = 1 + r.nextInt(3);
        for (int g = 0; g < m; g++) {
            PauliCombination s = PauliCombination.zero(n);
            if (r.nextInt(3) == 0) {
                // a rotated one-qubit control a X_q + b Y_q: brackets with it cancel exactly in structured ways
                int q = r.nextInt(n);
                s = PauliCombination.of(1 + r.nextDouble(), PauliString.single(n, q, 'X'))
                        .plus(PauliCombination.of(r.nextGaussian(), PauliString.single(n, q, 'Y')));
            } else {
                for (int t = 1 + r.nextInt(3); t > 0; t--) {
                    String letters = PauliStringTest.randomLetters(r, n);
                    // local strings keep many closures below su(2^n), so that small algebras are exercised too
                    if (r.nextBoolean()) {
                        letters = letters.substring(0, 2) + "I".repeat(n - 2);
                    }
                    double c = r.nextBoolean() ? r.nextInt(5) - 2 : r.nextGaussian();
                    s = s.plus(PauliCombination.of(c, PauliString.of(letters)));
                }
            }
            gens.add(s);
        }
        if (r.nextBoolean()) {
            gens.addAll(SpinChains.perBond(n, false, "ZZ"));
        }
        return gens;
    }

    // Agreement with the dense closure (LieAlgebra: Gram–Schmidt on dense matrices, no Pauli-string arithmetic) on
    // random Pauli-sum generators of 3 and 4 qubits: same dimension, every Pauli basis element in the dense algebra,
    // and for string algebras the same type.
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void agreesWithDenseClosure(long seed) {
        Random r = new Random(seed);
        int n = r.nextInt(5) == 0 ? 4 : 3;
        List<PauliCombination> gens = randomGenerators(r, n);
        PauliAlgebra a = PauliAlgebra.generatedBy(gens);
        LieAlgebra d = LieAlgebra.generatedBy(dense(gens));
        assertEquals(d.dimension(), a.dimension(), gens.toString());
        for (PauliCombination b : a.basis()) {
            assertTrue(d.contains(b.toOperator()), b.toString());
        }
        // reduced echelon form: each element has a pivot string with coefficient 1 absent from all others
        for (PauliCombination b : a.basis()) {
            boolean found = false;
            for (PauliString p : b.strings()) {
                if (b.coefficient(p) == 1.0
                        && a.basis().stream().filter(o -> o != b).allMatch(o -> o.coefficient(p) == 0)) {
                    found = true;
                }
            }
            assertTrue(found, b.toString());
        }
        // closed: brackets of basis elements are contained
        List<PauliCombination> bs = a.basis();
        for (int i = 0; i < Math.min(bs.size(), 12); i++) {
            for (int j = 0; j < i; j++) {
                assertTrue(a.contains(bs.get(i).commutator(bs.get(j))));
            }
        }
        if (a.isStringBasis() && a.dimension() <= 64) {
            assertEquals(factors(d.type()), factors(a.type()), gens.toString());
        }
    }

    /** The factors of a type name as a sorted list, expanding "u(1)^k". */
    static List<String> factors(String type) {
        List<String> f = new ArrayList<>();
        for (String p : type.split(" ⊕ ")) {
            if (p.startsWith("u(1)^")) {
                for (int k = Integer.parseInt(p.substring(5)); k > 0; k--) {
                    f.add("u(1)");
                }
            } else {
                f.add(p);
            }
        }
        java.util.Collections.sort(f);
        return f;
    }

    @Test
    void badInput() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(List.of()));
        assertEquals(Reason.EMPTY, e.reason());
        assertTrue(e.getMessage().startsWith("sums:"), e.getMessage());
        List<PauliCombination> withNull = new ArrayList<>();
        withNull.add(PauliCombination.of("XX"));
        withNull.add(null);
        e = assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(withNull));
        assertEquals(Reason.NULL, e.reason());
        assertTrue(e.getMessage().contains("index 1"), e.getMessage());
        e = assertThrows(InvalidInputException.class,
                () -> PauliAlgebra.generatedBy(List.of(PauliCombination.of("XX"), PauliCombination.of("XXX"))));
        assertEquals(Reason.DIMENSION_MISMATCH, e.reason());
        assertTrue(e.getMessage().contains("3 qubits at index 1"), e.getMessage());
        assertEquals(Reason.NULL,
                assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(null)).reason());
        e = assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(List.of(PauliCombination.of("X")), 0));
        assertEquals(Reason.OUT_OF_RANGE, e.reason());
        assertTrue(e.getMessage().contains("maxDimension"), e.getMessage());
        // limits, on the exact string path and on the elimination path
        e = assertThrows(InvalidInputException.class,
                () -> PauliAlgebra.generatedBy(SpinChains.isingPerTerm(10), 100));
        assertEquals(Reason.LIMIT_EXCEEDED, e.reason());
        assertTrue(e.getMessage().contains("100"), e.getMessage());
        e = assertThrows(InvalidInputException.class,
                () -> PauliAlgebra.generatedBy(SpinChains.isingSummed(10, true), 20));
        assertEquals(Reason.LIMIT_EXCEEDED, e.reason());
        assertEquals(Reason.DIMENSION_MISMATCH, assertThrows(InvalidInputException.class,
                () -> PauliAlgebra.generatedBy(List.of(PauliCombination.of("XX"))).contains(PauliCombination.of("X"))).reason());
        // zero generators give the zero algebra
        PauliAlgebra zero = PauliAlgebra.generatedBy(List.of(PauliCombination.zero(3)));
        assertEquals(0, zero.dimension());
        assertEquals("0", zero.type());
    }

    @Test
    void progressAndCancellation() {
        AtomicInteger calls = new AtomicInteger();
        PauliAlgebra a = PauliAlgebra.generatedBy(SpinChains.isingPerTerm(12), 1000, (f, c) -> {
            assertTrue(Double.isNaN(f));
            calls.incrementAndGet();
            return true;
        });
        assertEquals(276, a.dimension());
        assertTrue(calls.get() > 1);
        assertThrows(CancellationException.class,
                () -> PauliAlgebra.generatedBy(SpinChains.isingPerTerm(12), 1000, (f, c) -> c < 100));
        assertThrows(CancellationException.class,
                () -> PauliAlgebra.generatedBy(SpinChains.isingSummed(8, true), 1000, (f, c) -> c < 5));
        // a listener that throws is dropped and the work goes on
        PauliAlgebra b = PauliAlgebra.generatedBy(SpinChains.isingSummed(5, true), 1000, (f, c) -> {
            throw new IllegalStateException("listener bug");
        });
        assertEquals(14, b.dimension());
    }
}
