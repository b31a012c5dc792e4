package org.liepath.algebra;

import org.liepath.algebra.internal.MatVec;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.internal.Require;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Subalgebras spanned by subsets of a basis with the <em>monomial-bracket property</em>: the elements are pairwise
 * orthogonal under tr(X†Y) and the bracket of any two is zero or a non-zero multiple of one element of the basis
 * (Pauli strings: [P, Q] = 0 or ±2i·PQ with PQ ∝ a Pauli string; matrix units: [E_ij, E_kl] = δ_jk E_il − δ_li E_kj
 * for the off-diagonal ones). A subset S is then closed exactly when, for every pair in S whose bracket lands on
 * element k, k is in S, so closure is decided on the "i, j land on k" table with bit masks and no dense algebra.
 *
 * <p>Elements that are all Hermitian are read with the DLA convention (−i b, real algebras), all anti-Hermitian as
 * they are (real algebras), anything else as a complex algebra ({@link LieAlgebra#complexSpan}).
 *
 * <p>Stateless and thread-safe.
 */
public final class Subalgebras {
    /** Largest basis handled (subsets are 64-bit masks). */
    public static final int MAX_BASIS = 64;
    /** Default limit on the number of closed subsets enumerated (each costs one 64-bit mask while enumerating). */
    public static final int DEFAULT_MAX_SUBSETS = 1 << 18;

    private Subalgebras() {
    }

    /**
     * Every non-empty subset of the basis that is closed under the bracket, each as a {@link LieAlgebra} spanned by
     * that subset (its {@link LieAlgebra#type()} is computed on demand). Ordered by dimension, then by the subset's
     * indices in lexicographic order. Enumeration: breadth-first over closures — every closed set is the closure of a
     * smaller closed set plus one element — so the work is proportional to (number of closed sets) × (basis size),
     * not to 2^m. For the 15 non-identity two-qubit Pauli strings this visits the closed sets instead of the 32767
     * candidate subsets (milliseconds); the 63 three-qubit strings have about 1.1·10⁵ closed subsets (seconds).
     *
     * @param basis the basis elements
     * @return every non-empty subset of the basis that is closed under the bracket, each as a {@link LieAlgebra}
     *     spanned by that subset (its {@link LieAlgebra#type()} is computed on demand)
     * @throws InvalidInputException NULL, EMPTY, DIMENSION_MISMATCH; LIMIT_EXCEEDED for more than {@value #MAX_BASIS}
     *                               elements or more than {@value #DEFAULT_MAX_SUBSETS} closed subsets; UNSUPPORTED if
     *                               the basis lacks the monomial-bracket property (the message names the pair);
     *                               NOT_CLOSED if a bracket leaves the span of the basis
     */
    public static List<LieAlgebra> closedSubsets(List<Operator> basis) {
        return closedSubsets(basis, DEFAULT_MAX_SUBSETS);
    }

    /**
     * {@link #closedSubsets(List)} with a limit on the number of closed subsets. The list is built lazily: element k
     * is a new {@link LieAlgebra} made on each {@code get(k)} from the stored subset (no closure check is needed, the
     * table proved it), so a long list costs one bit mask per entry until its elements are used.
     *
     * @param basis the basis elements
     * @param maxSubsets the largest number of closed subsets allowed (positive)
     * @return the closed subalgebras, one per closed subset
     */
    public static List<LieAlgebra> closedSubsets(List<Operator> basis, int maxSubsets) {
        Require.positive(maxSubsets, "maxSubsets");
        Table t = table(basis);
        long[] masks = enumerate(t, maxSubsets).stream().mapToLong(Long::longValue).toArray();
        return new java.util.AbstractList<LieAlgebra>() {
            @Override
            public LieAlgebra get(int index) {
                Require.index(index, masks.length, "index");
                return t.algebra(masks[index]);
            }

            @Override
            public int size() {
                return masks.length;
            }
        };
    }

    /**
     * The closed subsets as sorted index arrays, in the order of {@link #closedSubsets}.
     *
     * @param basis the basis elements
     * @return the closed subsets as sorted index arrays, in the order of {@link #closedSubsets}
     */
    public static List<int[]> closedIndexSets(List<Operator> basis) {
        Require.nonNull(basis, "basis");
        Table t = table(basis);
        List<int[]> out = new ArrayList<>();
        for (long mask : enumerate(t, DEFAULT_MAX_SUBSETS)) {
            out.add(indices(mask));
        }
        return Collections.unmodifiableList(out);
    }

    /**
     * The smallest closed subset containing the chosen elements, as an algebra; e.g. {@code closureOf(paulis, 0, 4)}.
     * (For generators without the monomial-bracket property use {@link LieAlgebra#generatedBy}.)
     *
     * @param basis the basis elements
     * @param chosen indices of the chosen basis elements
     * @return the smallest closed subset containing the chosen elements, as an algebra
     * @throws InvalidInputException as {@link #closedSubsets}, and OUT_OF_RANGE / EMPTY for the indices
     */
    public static LieAlgebra closureOf(List<Operator> basis, int... chosen) {
        Table t = table(basis);
        Require.nonNull(chosen, "chosen");
        if (chosen.length == 0) {
            throw InvalidInputException.of(Reason.EMPTY, "chosen", "at least one index", "none");
        }
        long mask = 0;
        for (int c : chosen) {
            Require.index(c, t.m, "chosen");
            mask |= 1L << c;
        }
        return t.algebra(t.close(mask));
    }

    /**
     * The closure of a subset given as a bit mask (bit k = element k), as indices.
     *
     * @param basis the basis elements
     * @param chosen indices of the chosen basis elements
     * @return the closure of a subset given as a bit mask (bit k = element k), as indices
     */
    public static int[] closureIndices(List<Operator> basis, int... chosen) {
        Table t = table(basis);
        long mask = 0;
        for (int c : Require.nonNull(chosen, "chosen")) {
            Require.index(c, t.m, "chosen");
            mask |= 1L << c;
        }
        return indices(t.close(mask));
    }

    static int[] indices(long mask) {
        int[] out = new int[Long.bitCount(mask)];
        int c = 0;
        for (int k = 0; k < 64; k++) {
            if ((mask >>> k & 1) != 0) {
                out[c++] = k;
            }
        }
        return out;
    }

    /** The landing table: land[i][j] = k if [b_i, b_j] ∝ b_k, −1 if they commute. */
    private static final class Table {
        final int m;
        final int[][] land;
        final List<Operator> basis;

        Table(int m, int[][] land, List<Operator> basis) {
            this.m = m;
            this.land = land;
            this.basis = basis;
        }

        /** masks of the elements that do not commute with element i */
        long[] partners;

        /** Closure of a set; elements are added from a work list and bracketed only with the current set. */
        long close(long mask) {
            return extend(0L, mask);
        }

        /** Closure of closed ∪ add, for a closed set {@code closed}. */
        long extend(long closed, long add) {
            long s = closed;
            long todo = add & ~closed;
            while (todo != 0) {
                int y = Long.numberOfTrailingZeros(todo);
                todo &= todo - 1;
                if ((s >>> y & 1) != 0) {
                    continue;
                }
                s |= 1L << y;
                long hits = s & partners[y];
                while (hits != 0) {
                    int z = Long.numberOfTrailingZeros(hits);
                    hits &= hits - 1;
                    int k = land[y][z];
                    if ((s >>> k & 1) == 0) {
                        todo |= 1L << k;
                    }
                }
            }
            return s;
        }

        LieAlgebra algebra(long mask) {
            List<Operator> sub = new ArrayList<>();
            for (int k : indices(mask)) {
                sub.add(basis.get(k));
            }
            return LieAlgebra.ofClosedOrthogonal(sub, kindComplex);
        }

        boolean kindComplex;
    }

    private static List<Long> enumerate(Table t, int maxSubsets) {
        MaskSet seen = new MaskSet();
        long[] queue = new long[64];
        int head = 0, tail = 0;
        queue[tail++] = 0L;
        seen.add(0L);
        while (head < tail) {
            long c = queue[head++];
            for (int x = 0; x < t.m; x++) {
                if ((c >>> x & 1) != 0) {
                    continue;
                }
                long d = t.extend(c, 1L << x);
                if (seen.add(d)) {
                    if (seen.size() > maxSubsets + 1) {
                        throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "maxSubsets",
                                "at most " + maxSubsets + " closed subsets", "more");
                    }
                    if (tail == queue.length) {
                        queue = java.util.Arrays.copyOf(queue, 2 * tail);
                    }
                    queue[tail++] = d;
                }
            }
        }
        List<Long> out = new ArrayList<>(tail - 1);
        for (int k = 1; k < tail; k++) {
            out.add(queue[k]);
        }
        out.sort((a, b) -> {
            int ca = Long.bitCount(a), cb = Long.bitCount(b);
            if (ca != cb) {
                return Integer.compare(ca, cb);
            }
            if (a == b) {
                return 0;
            }
            // lexicographic order of the sorted index lists: the lowest element in exactly one of the sets decides
            long low = Long.lowestOneBit(a ^ b);
            return (a & low) != 0 ? -1 : 1;
        });
        return out;
    }

    /** Open-addressing set of 64-bit masks (bit patterns of subsets hash badly with Long.hashCode). */
    private static final class MaskSet {
        private long[] keys = new long[1 << 10];
        private boolean[] used = new boolean[1 << 10];
        private int size;

        int size() {
            return size;
        }

        boolean add(long k) {
            if (2 * (size + 1) > keys.length) {
                grow();
            }
            int mask = keys.length - 1;
            int i = (int) (mix(k) & mask);
            while (used[i]) {
                if (keys[i] == k) {
                    return false;
                }
                i = (i + 1) & mask;
            }
            used[i] = true;
            keys[i] = k;
            size++;
            return true;
        }

        private void grow() {
            long[] ok = keys;
            boolean[] ou = used;
            keys = new long[2 * ok.length];
            used = new boolean[2 * ok.length];
            size = 0;
            for (int i = 0; i < ok.length; i++) {
                if (ou[i]) {
                    add(ok[i]);
                }
            }
        }

        private static long mix(long z) {
            // SplitMix64 finaliser (G. Steele, D. Lea, C. Flood, OOPSLA 2014)
            z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
            z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
            return z ^ (z >>> 31);
        }
    }

    private static Table table(List<Operator> basis) {
        Require.nonNull(basis, "basis");
        if (basis.isEmpty()) {
            throw InvalidInputException.of(Reason.EMPTY, "basis", "at least one operator", "an empty list");
        }
        int m = basis.size();
        if (m > MAX_BASIS) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "basis", "at most " + MAX_BASIS + " elements",
                    m + " elements");
        }
        int n = Require.nonNull(basis.get(0), "basis[0]").dim();
        double[][] v = new double[m][];
        int[][] sup = new int[m][];
        boolean allH = true, allA = true;
        for (int k = 0; k < m; k++) {
            Operator b = Require.nonNull(basis.get(k), "basis[" + k + "]");
            if (b.dim() != n) {
                throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "basis[" + k + "]",
                        "dimension " + n + " like basis[0]", "dimension " + b.dim());
            }
            double nb = b.norm();
            if (nb == 0) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "basis[" + k + "]", "a non-zero operator",
                        "the zero operator");
            }
            double[] d = MatVec.hermitianDefects(b);
            allH &= d[0] <= 1e-12 * Math.max(1, nb);
            allA &= d[1] <= 1e-12 * Math.max(1, nb);
            v[k] = MatVec.of(b, false, 1 / nb);
            sup[k] = MatVec.support(n, v[k]);
        }
        // pairwise orthogonality (complex inner product: real and imaginary part)
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++) {
                double re = MatVec.dot(n, v[i], sup[i], v[j], sup[j]);
                double im = MatVec.dot(n, v[i], sup[i], timesI(n, v[j]), null);
                if (Math.hypot(re, im) > 1e-10) {
                    throw InvalidInputException.of(Reason.UNSUPPORTED, "basis",
                            "pairwise orthogonal elements (monomial-bracket property)",
                            String.format(Locale.ROOT, "|tr(b_%d† b_%d)| / (‖b_%d‖‖b_%d‖) = %.3g", i, j, i, j,
                                    Math.hypot(re, im)));
                }
            }
        }
        int[][] land = new int[m][m];
        double[] c = new double[2 * n * n];
        for (int i = 0; i < m; i++) {
            land[i][i] = -1;
            for (int j = i + 1; j < m; j++) {
                MatVec.commutator(n, v[i], sup[i], v[j], sup[j], c);
                double nc = MatVec.norm(c);
                int k = -1;
                if (nc > 1e-12) {
                    double[] ic = timesI(n, c);
                    double best = 0;
                    for (int l = 0; l < m; l++) {
                        // |tr(b_l† c)|
                        double re = MatVec.dot(n, v[l], sup[l], c, null);
                        double im = MatVec.dot(n, v[l], sup[l], ic, null);
                        double a = Math.hypot(re, im);
                        if (a > best) {
                            best = a;
                            k = l;
                        }
                    }
                    // monomial: the bracket is entirely along b_k (residuals are formed explicitly: the difference of
                    // squared norms would lose half the digits)
                    double one = k < 0 ? 1.0 : residual(n, c, ic, v, sup, new int[] {k}) / nc;
                    if (one > 1e-9) {
                        int[] all = new int[m];
                        for (int l = 0; l < m; l++) {
                            all[l] = l;
                        }
                        double outside = residual(n, c, ic, v, sup, all) / nc;
                        if (outside > 1e-9) {
                            throw InvalidInputException.of(Reason.NOT_CLOSED, "basis",
                                    "elements whose brackets stay in their span",
                                    String.format(Locale.ROOT, "[b_%d, b_%d] (indices %d and %d) with a component "
                                            + "of relative size %.3g outside the span", i, j, i, j, outside));
                        }
                        throw InvalidInputException.of(Reason.UNSUPPORTED, "basis",
                                "a basis whose brackets are multiples of single elements (monomial-bracket property)",
                                String.format(Locale.ROOT, "[b_%d, b_%d] with a relative part %.3g off its largest "
                                        + "component b_%d", i, j, one, k));
                    }
                }
                land[i][j] = k;
                land[j][i] = k;
            }
        }
        Table t = new Table(m, land, basis);
        t.partners = new long[m];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                if (land[i][j] >= 0) {
                    t.partners[i] |= 1L << j;
                }
            }
        }
        t.kindComplex = !(allH || allA);
        return t;
    }

    /** ‖c − Σ_l tr(b_l† c) b_l‖ over the listed l (b_l unit, pairwise orthogonal); ic is the vector of i·c. */
    private static double residual(int n, double[] c, double[] ic, double[][] v, int[][] sup, int[] ls) {
        double[] r = c.clone();
        for (int l : ls) {
            double re = MatVec.dot(n, v[l], sup[l], c, null);
            double im = MatVec.dot(n, v[l], sup[l], ic, null);
            // tr(b† c) = re − i·im with these conventions; subtract (re − i im)·b = re·b + im·(−i b)
            MatVec.axpy(n, -re, v[l], sup[l], r);
            double[] mib = timesI(n, v[l]);
            for (int q = 0; q < r.length; q++) {
                mib[q] = -mib[q];
            }
            MatVec.axpy(n, -im, mib, null, r);
        }
        return MatVec.norm(r);
    }

    /** @return the vector of i·x (so that dot(a, i x) = Im tr(a† x)) */
    private static double[] timesI(int n, double[] x) {
        int nn = n * n;
        double[] w = new double[2 * nn];
        for (int q = 0; q < nn; q++) {
            w[q] = -x[nn + q];
            w[nn + q] = x[q];
        }
        return w;
    }
}
