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
        List<PauliSum> b = a.basis();
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
        for (PauliSum g : SpinChains.isingSummed(n, true)) {
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
            List<PauliSum> g = new ArrayList<>(SpinChains.perBond(n, false, "ZZ"));
            for (int i = 0; i < n; i++) {
                g.add(PauliSum.of(PauliString.single(n, i, 'X')));
                g.add(PauliSum.of(PauliString.single(n, i, 'Y')));
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
        // the same controls written as sums with unequal weights (one generator per qubit: a X_i + b Y_i)
        int n = 4;
        Random r = new Random(7);
        List<PauliSum> g = new ArrayList<>(SpinChains.perBond(n, false, "ZZ"));
        for (int i = 0; i < n; i++) {
            g.add(PauliSum.of(1 + r.nextDouble(), PauliString.single(n, i, 'X'))
                    .plus(PauliSum.of(1 + r.nextDouble(), PauliString.single(n, i, 'Y'))));
        }
        assertEquals(255, PauliAlgebra.generatedBy(g).dimension());
    }

    // A sum whose strings commute pairwise generates only u(1): one dimension, and the basis is the normalised sum.
    @Test
    void singleSumAndEchelonNormalisation() {
        PauliAlgebra a = PauliAlgebra.generatedBy(List.of(PauliSum.parse("2 XX + 4 ZZ")));
        assertEquals(1, a.dimension());
        PauliSum b = a.basis().get(0);
        assertEquals(2, b.size());
        // pivot = the largest coefficient, scaled to 1
        assertEquals(1.0, b.coefficient(PauliString.of("ZZ")));
        assertEquals(0.5, b.coefficient(PauliString.of("XX")));
        assertTrue(a.contains(PauliSum.parse("-3 XX - 6 ZZ")));
        assertFalse(a.contains(PauliSum.parse("XX")));
        assertTrue(a.contains(PauliSum.zero(2)));
    }

    static Operator bracket(Operator a, Operator b) {
        return a.commutator(b).timesI().scale(-1.0);
    }

    /**
     * Independent dense closure for the cross-check: Hermitian matrices H (standing for −iH) as real vectors
     * (Re, Im) with the Hilbert–Schmidt product Re tr(A†B), Gram–Schmidt with one re-orthogonalisation, every pair
     * of accepted elements bracketed once. A residual below 1e-8 of the bracket's norm counts as dependent: the
     * matrices are O(1)-normalised, so rounding is ~1e-13 and genuine new directions are O(1e-3) or larger.
     */
    static List<double[]> denseClosure(List<Operator> gens) {
        List<double[]> onb = new ArrayList<>();
        List<Operator> acc = new ArrayList<>();
        for (Operator g : gens) {
            accept(g, onb, acc);
        }
        for (int i = 0; i < acc.size(); i++) {
            for (int j = 0; j < i; j++) {
                accept(bracket(acc.get(i), acc.get(j)), onb, acc);
            }
        }
        return onb;
    }

    static double[] vec(Operator a) {
        double[] re = a.reArray(), im = a.imArray();
        double[] v = new double[2 * re.length];
        System.arraycopy(re, 0, v, 0, re.length);
        System.arraycopy(im, 0, v, re.length, im.length);
        return v;
    }

    static double residual(double[] v, List<double[]> onb) {
        double n0 = Math.sqrt(dot(v, v));
        if (n0 == 0) {
            return 0;
        }
        for (int pass = 0; pass < 2; pass++) {
            for (double[] e : onb) {
                double c = dot(e, v);
                for (int k = 0; k < v.length; k++) {
                    v[k] -= c * e[k];
                }
            }
        }
        return Math.sqrt(dot(v, v)) / n0;
    }

    private static void accept(Operator a, List<double[]> onb, List<Operator> acc) {
        double[] v = vec(a);
        if (residual(v, onb) > 1e-8) {
            double n = Math.sqrt(dot(v, v));
            for (int k = 0; k < v.length; k++) {
                v[k] /= n;
            }
            onb.add(v);
            acc.add(a.scale(1.0 / Math.sqrt(dot(vec(a), vec(a)))));
        }
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int k = 0; k < a.length; k++) {
            s += a[k] * b[k];
        }
        return s;
    }

    // Agreement with the dense closure on random Pauli-sum generators of 3 and 4 qubits (dense matrices built by
    // core's Kronecker construction; the dense closure above shares no code with the Pauli closure).
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void agreesWithDenseClosure(long seed) {
        Random r = new Random(seed);
        int n = r.nextInt(5) == 0 ? 4 : 3;
        int m = 1 + r.nextInt(3);
        List<PauliSum> gens = new ArrayList<>();
        for (int g = 0; g < m; g++) {
            PauliSum s = PauliSum.zero(n);
            for (int t = 1 + r.nextInt(3); t > 0; t--) {
                String letters = PauliStringTest.randomLetters(r, n);
                // local strings keep many closures below su(2^n), so that small algebras are exercised too
                if (r.nextBoolean()) {
                    letters = letters.substring(0, 2) + "I".repeat(n - 2);
                }
                double c = r.nextBoolean() ? r.nextInt(5) - 2 : r.nextGaussian();
                s = s.plus(PauliSum.of(c, PauliString.of(letters)));
            }
            gens.add(s);
        }
        PauliAlgebra a = PauliAlgebra.generatedBy(gens);
        List<Operator> dense = new ArrayList<>();
        for (PauliSum s : gens) {
            dense.add(s.toOperator());
        }
        List<double[]> onb = denseClosure(dense);
        assertEquals(onb.size(), a.dimension(), gens.toString());
        for (PauliSum b : a.basis()) {
            // every basis element lies in the dense span (relative residual at rounding level)
            assertTrue(residual(vec(b.toOperator()), onb) < 1e-9, b.toString());
        }
        // reduced echelon form: each element has a pivot string with coefficient 1 absent from all others
        for (PauliSum b : a.basis()) {
            boolean found = false;
            for (PauliString p : b.strings()) {
                if (b.coefficient(p) == 1.0 && a.basis().stream().filter(o -> o != b).allMatch(o -> o.coefficient(p) == 0)) {
                    found = true;
                }
            }
            assertTrue(found, b.toString());
        }
        // closed: brackets of basis elements are contained
        List<PauliSum> bs = a.basis();
        for (int i = 0; i < Math.min(bs.size(), 12); i++) {
            for (int j = 0; j < i; j++) {
                assertTrue(a.contains(bs.get(i).commutator(bs.get(j))));
            }
        }
        if (a.isStringBasis()) {
            assertNotEquals("unknown", a.type(), gens.toString());
        }
    }

    @Test
    void badInput() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(List.of()));
        assertEquals(Reason.EMPTY, e.reason());
        assertTrue(e.getMessage().startsWith("sums:"), e.getMessage());
        List<PauliSum> withNull = new ArrayList<>();
        withNull.add(PauliSum.of("XX"));
        withNull.add(null);
        e = assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(withNull));
        assertEquals(Reason.NULL, e.reason());
        assertTrue(e.getMessage().contains("index 1"), e.getMessage());
        e = assertThrows(InvalidInputException.class,
                () -> PauliAlgebra.generatedBy(List.of(PauliSum.of("XX"), PauliSum.of("XXX"))));
        assertEquals(Reason.DIMENSION_MISMATCH, e.reason());
        assertTrue(e.getMessage().contains("3 qubits at index 1"), e.getMessage());
        assertEquals(Reason.NULL,
                assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(null)).reason());
        e = assertThrows(InvalidInputException.class, () -> PauliAlgebra.generatedBy(List.of(PauliSum.of("X")), 0));
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
                () -> PauliAlgebra.generatedBy(List.of(PauliSum.of("XX"))).contains(PauliSum.of("X"))).reason());
        // zero generators give the zero algebra
        PauliAlgebra zero = PauliAlgebra.generatedBy(List.of(PauliSum.zero(3)));
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
