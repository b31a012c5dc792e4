package org.liepath.algebra.internal;

import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.ProgressListener;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CancellationException;

/**
 * Lie closure of Pauli sums without dense matrices. Two kernels:
 * <ul>
 *   <li>{@link #ofStrings}: every generator is one Pauli string. The bracket of two strings is zero or ±2 times a
 *   third string, so the closure is the smallest set of strings closed under "product of an anticommuting pair";
 *   phases never matter and no arithmetic on coefficients is done at all: the result is exact.</li>
 *   <li>{@link #ofSums}: general real combinations. Vectors are sparse over interned strings; each new bracket is
 *   reduced against a basis kept in reduced echelon form over strings (every basis row has coefficient 1 on its own
 *   pivot string and exactly 0 on every other row's pivot), with the pivot chosen as the entry of largest magnitude.
 *   A reduced bracket counts as new when its largest coefficient exceeds {@link #RELATIVE_TOLERANCE} times the
 *   largest coefficient of the bracket before reduction.</li>
 * </ul>
 * In both kernels every pair of accepted elements is bracketed once (element i with all j &lt; i, in the order of
 * acceptance), which suffices because the accepted elements span the algebra. Not part of the public API.
 */
public final class PauliClosure {
    /** A reduced bracket whose largest coefficient is below this fraction of its unreduced size is taken as zero. */
    public static final double RELATIVE_TOLERANCE = 1e-9;
    /**
     * Entries below this fraction of a vector's scale are dropped after each elimination step; rows are normalised to
     * 1 on their pivot with |entries| ≤ 1 at creation, so this is a few hundred ulps of the data.
     */
    public static final double DROP = 1e-13;

    private PauliClosure() {
    }

    /** Result of a closure: the strings in the table, and for the sum kernel the reduced rows over them. */
    public static final class Result {
        public final StringTable table;
        /** For the string kernel: null (the basis is entries 0 … table.size()−1). */
        public final List<int[]> rowIds;
        public final List<double[]> rowCoefs;
        public final int[] pivots;

        Result(StringTable table, List<int[]> rowIds, List<double[]> rowCoefs, int[] pivots) {
            this.table = table;
            this.rowIds = rowIds;
            this.rowCoefs = rowCoefs;
            this.pivots = pivots;
        }
    }

    private static void report(ProgressListener[] listener, long count) {
        if (listener[0] == null) {
            return;
        }
        boolean go;
        try {
            go = listener[0].onProgress(Double.NaN, count);
        } catch (RuntimeException e) {
            // a failing listener is dropped and the work goes on (ProgressListener's contract)
            listener[0] = null;
            return;
        }
        if (!go) {
            throw new CancellationException("Pauli closure cancelled by its progress listener at dimension " + count);
        }
    }

    private static InvalidInputException limit(int maxDimension) {
        return InvalidInputException.of(Reason.LIMIT_EXCEEDED, "maxDimension",
                "a closure of at most " + maxDimension + " elements", "more than " + maxDimension + " elements");
    }

    /**
     * Closure of single strings. {@code gens} holds the generators' words back to back (x then z, 2w words each).
     */
    public static Result ofStrings(int words, long[] gens, int count, int maxDimension, ProgressListener listener) {
        StringTable t = new StringTable(words);
        for (int g = 0; g < count; g++) {
            t.intern(gens, g * 2 * words);
            if (t.size() > maxDimension) {
                throw limit(maxDimension);
            }
        }
        ProgressListener[] l = {listener};
        long[] buf = new long[2 * words];
        long pairs = 0;
        int[] partners = new int[64];
        int[] np = new int[1];
        for (int i = 0; i < t.size(); i++) {
            partners = t.anticommutingWith(i, i, partners, np);
            for (int e = 0; e < np[0]; e++) {
                t.product(i, partners[e], buf);
                int before = t.size();
                t.intern(buf, 0);
                if (t.size() > before && t.size() > maxDimension) {
                    throw limit(maxDimension);
                }
            }
            pairs += i;
            if ((i & 63) == 0 || pairs > (1L << 22)) {
                pairs = 0;
                report(l, t.size());
            }
        }
        report(l, t.size());
        return new Result(t, null, null, null);
    }

    // ------------------------------------------------------------------ general sums

    /**
     * Closure of general sums: generator g has strings {@code gens[g]} (words back to back) with coefficients
     * {@code coefs[g]}.
     */
    public static Result ofSums(int words, List<long[]> gens, List<double[]> coefs, int maxDimension,
                                ProgressListener listener) {
        return new SumKernel(words, maxDimension, listener).run(gens, coefs);
    }

    private static final class SumKernel {
        final int w;
        final int maxDimension;
        final ProgressListener[] listener;
        final StringTable t;
        // reduced echelon rows: ids sorted ascending, coefficient arrays aligned
        final List<int[]> rowIds = new ArrayList<>();
        final List<double[]> rowCoefs = new ArrayList<>();
        final List<Integer> rowPivot = new ArrayList<>();
        // accepted elements as first found (they span the algebra), used for the brackets
        final List<int[]> accIds = new ArrayList<>();
        final List<double[]> accCoefs = new ArrayList<>();
        int[] pivotRow = new int[64];
        double[] acc = new double[64];
        final long[] buf;

        SumKernel(int w, int maxDimension, ProgressListener listener) {
            this.w = w;
            this.maxDimension = maxDimension;
            this.listener = new ProgressListener[]{listener};
            this.t = new StringTable(w);
            this.buf = new long[2 * w];
            Arrays.fill(pivotRow, -1);
        }

        Result run(List<long[]> gens, List<double[]> coefs) {
            for (int g = 0; g < gens.size(); g++) {
                long[] words = gens.get(g);
                double[] c = coefs.get(g);
                int[] ids = new int[c.length];
                for (int k = 0; k < c.length; k++) {
                    ids[k] = t.intern(words, k * 2 * w);
                }
                grow();
                for (int k = 0; k < c.length; k++) {
                    acc[ids[k]] += c[k];
                }
                offer(ids, ids.length);
            }
            for (int i = 0; i < accIds.size(); i++) {
                for (int j = 0; j < i; j++) {
                    bracket(i, j);
                }
                report(listener, rowIds.size());
            }
            int[] piv = new int[rowPivot.size()];
            for (int k = 0; k < piv.length; k++) {
                piv[k] = rowPivot.get(k);
            }
            return new Result(t, rowIds, rowCoefs, piv);
        }

        private void grow() {
            if (acc.length < t.size()) {
                int n = Math.max(t.size(), acc.length * 2);
                acc = Arrays.copyOf(acc, n);
                int old = pivotRow.length;
                pivotRow = Arrays.copyOf(pivotRow, n);
                Arrays.fill(pivotRow, old, n, -1);
            }
        }

        /** Moves the touched entries of the dense accumulator into a sparse vector (and clears them). */
        private Object[] gather(int[] touched, double drop) {
            int[] ids = touched.clone();
            Arrays.sort(ids);
            int m = 0;
            double[] c = new double[ids.length];
            for (int k = 0; k < ids.length; k++) {
                int id = ids[k];
                if (k > 0 && id == ids[k - 1]) {
                    continue;
                }
                double v = acc[id];
                acc[id] = 0;
                if (Math.abs(v) > drop) {
                    ids[m] = id;
                    c[m++] = v;
                }
            }
            return new Object[]{Arrays.copyOf(ids, m), Arrays.copyOf(c, m)};
        }

        /** −i[A_i, A_j] for accepted elements i and j, in the Hermitian-coefficient convention (see PauliSum). */
        private void bracket(int i, int j) {
            int[] ai = accIds.get(i), aj = accIds.get(j);
            double[] ci = accCoefs.get(i), cj = accCoefs.get(j);
            int[] touched = new int[16];
            int nt = 0;
            for (int a = 0; a < ai.length; a++) {
                for (int b = 0; b < aj.length; b++) {
                    if (!t.anticommute(ai[a], aj[b])) {
                        continue;
                    }
                    int k = t.product(ai[a], aj[b], buf);
                    int id = t.intern(buf, 0);
                    grow();
                    acc[id] += (k == 1 ? 2.0 : -2.0) * ci[a] * cj[b];
                    if (nt == touched.length) {
                        touched = Arrays.copyOf(touched, nt * 2);
                    }
                    touched[nt++] = id;
                }
            }
            offer(touched, nt);
        }

        private void clear(int[] touched, int nt) {
            for (int k = 0; k < nt; k++) {
                acc[touched[k]] = 0;
            }
        }

        /**
         * Reduces the vector held in the dense accumulator at the {@code touched} ids against the rows, and accepts
         * the residual as a new row if it is not negligible. Rows vanish on every other row's pivot, so subtracting
         * the rows of the pivots present, each once with the vector's original coefficient there, reduces fully.
         */
        private void offer(int[] touched, int nt) {
            double scale = 0;
            for (int k = 0; k < nt; k++) {
                scale = Math.max(scale, Math.abs(acc[touched[k]]));
            }
            if (scale == 0) {
                clear(touched, nt);
                return;
            }
            int base = nt;
            for (int k = 0; k < base; k++) {
                int id = touched[k];
                int r = pivotRow[id];
                double f = acc[id];
                if (r < 0 || f == 0) {
                    continue;
                }
                int[] ri = rowIds.get(r);
                double[] rc = rowCoefs.get(r);
                if (nt + ri.length > touched.length) {
                    touched = Arrays.copyOf(touched, Math.max(2 * touched.length, nt + ri.length));
                }
                for (int e = 0; e < ri.length; e++) {
                    acc[ri[e]] -= f * rc[e];
                    touched[nt++] = ri[e];
                }
                acc[id] = 0;
            }
            Object[] v = gather(Arrays.copyOf(touched, nt), DROP * scale);
            int[] ids = (int[]) v[0];
            double[] c = (double[]) v[1];
            double rest = maxAbs(c);
            if (rest <= RELATIVE_TOLERANCE * scale) {
                return;
            }
            if (rowIds.size() + 1 > maxDimension) {
                throw limit(maxDimension);
            }
            int best = 0;
            for (int k = 1; k < c.length; k++) {
                if (Math.abs(c[k]) > Math.abs(c[best])) {
                    best = k;
                }
            }
            int p = ids[best];
            double inv = 1.0 / c[best];
            double[] nc = new double[c.length];
            for (int k = 0; k < c.length; k++) {
                nc[k] = c[k] * inv;
            }
            nc[best] = 1.0;
            // keep the echelon form reduced: clear the new pivot from every other row
            for (int r = 0; r < rowIds.size(); r++) {
                int[] ri = rowIds.get(r);
                int pos = Arrays.binarySearch(ri, p);
                if (pos >= 0) {
                    double f = rowCoefs.get(r)[pos];
                    Object[] nv = axpy(ri, rowCoefs.get(r), -f, ids, nc, p, 1.0);
                    rowIds.set(r, (int[]) nv[0]);
                    rowCoefs.set(r, (double[]) nv[1]);
                }
            }
            rowIds.add(ids);
            rowCoefs.add(nc);
            rowPivot.add(p);
            pivotRow[p] = rowIds.size() - 1;
            accIds.add(ids);
            accCoefs.add(nc);
        }

        /** a + f·b over sorted ids; entry {@code zeroId} is set to exactly 0 and tiny entries are dropped. */
        private Object[] axpy(int[] ai, double[] ac, double f, int[] bi, double[] bc, int zeroId, double scale) {
            int[] ri = new int[ai.length + bi.length];
            double[] rc = new double[ri.length];
            int i = 0, j = 0, m = 0;
            double drop = DROP * scale;
            while (i < ai.length || j < bi.length) {
                int id;
                double v;
                if (j == bi.length || (i < ai.length && ai[i] < bi[j])) {
                    id = ai[i];
                    v = ac[i++];
                } else if (i == ai.length || bi[j] < ai[i]) {
                    id = bi[j];
                    v = f * bc[j++];
                } else {
                    id = ai[i];
                    v = ac[i++] + f * bc[j++];
                }
                if (id != zeroId && Math.abs(v) > drop) {
                    ri[m] = id;
                    rc[m++] = v;
                }
            }
            return new Object[]{Arrays.copyOf(ri, m), Arrays.copyOf(rc, m)};
        }

        private static double maxAbs(double[] c) {
            double m = 0;
            for (double v : c) {
                m = Math.max(m, Math.abs(v));
            }
            return m;
        }
    }

    /**
     * Reduces a vector against finished rows: returns the residual's largest coefficient divided by the vector's
     * largest coefficient (0 for the zero vector).
     */
    public static double residual(Result r, int[] ids, double[] c) {
        double scale = 0;
        for (double v : c) {
            scale = Math.max(scale, Math.abs(v));
        }
        if (scale == 0) {
            return 0;
        }
        double[] dense = new double[r.table.size()];
        boolean outside = false;
        for (int k = 0; k < ids.length; k++) {
            if (ids[k] < 0) {
                outside = true;
            } else {
                dense[ids[k]] += c[k];
            }
        }
        if (outside) {
            return 1;
        }
        int[] pivotRow = new int[r.table.size()];
        Arrays.fill(pivotRow, -1);
        for (int k = 0; k < r.pivots.length; k++) {
            pivotRow[r.pivots[k]] = k;
        }
        for (int k = 0; k < r.pivots.length; k++) {
            double f = dense[r.pivots[k]];
            if (f != 0) {
                int[] ri = r.rowIds.get(k);
                double[] rc = r.rowCoefs.get(k);
                for (int e = 0; e < ri.length; e++) {
                    dense[ri[e]] -= f * rc[e];
                }
                dense[r.pivots[k]] = 0;
            }
        }
        double rest = 0;
        for (double v : dense) {
            rest = Math.max(rest, Math.abs(v));
        }
        return rest / scale;
    }
}
