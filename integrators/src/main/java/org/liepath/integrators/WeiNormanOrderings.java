package org.liepath.integrators;

import org.liepath.algebra.LieAlgebra;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Operator;
import org.liepath.core.internal.Require;
import org.liepath.integrators.internal.wn.Chart;
import org.liepath.integrators.internal.wn.ExpForm;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * Proposes orderings of a basis for Wei–Norman charts, best (least nonlinear) first.
 *
 * <p>Heuristic (common practice for Cartan–Weyl bases; cf. J. Wei, E. Norman, Proc. AMS 15 (1964) 327 for solvable
 * algebras): the elements whose adjoint action is diagonal in the basis (a Cartan subalgebra, e.g. Jz or the diagonal
 * H_i of sl(n)) define weights λ_j through ad h X_j = λ_j X_j for a generic h in their span; raising elements
 * (λ &gt; 0) are put first, then weight-zero elements, then lowering ones (λ &lt; 0) — the Gauss (LDU) order, which
 * for ladder bases of su(n) gives Riccati (quadratic) systems. Each candidate is classified with
 * {@link WeiNorman#nonlinearity()}; for bases of at most {@value #EXHAUSTIVE} elements every permutation is tried.
 * Anti-Hermitian bases (no diagonal adjoint action) usually admit no polynomial ordering; the proposal then reports
 * the nonlinearity of the orderings tried (complexify into a ladder basis to obtain Riccati equations).
 *
 * <p>Stateless and thread-safe. Cost: one chart construction and one symbolic classification per candidate.
 */
public final class WeiNormanOrderings {
    /** Bases up to this size are searched exhaustively. */
    public static final int EXHAUSTIVE = 4;

    private WeiNormanOrderings() {
    }

    /** One proposed ordering. Immutable. */
    public static final class Proposal {
        private final int[] order;
        private final WeiNorman chart;
        private final Nonlinearity nonlinearity;

        Proposal(int[] order, WeiNorman chart) {
            this.order = order;
            this.chart = chart;
            this.nonlinearity = chart.nonlinearity();
        }

        /** @return the ordering as indices into the given basis (a copy): factor k is basis[order[k]] */
        public int[] order() {
            return order.clone();
        }

        /** @return the chart for this ordering */
        public WeiNorman chart() {
            return chart;
        }

        /** @return the nonlinearity of its coordinate equations */
        public Nonlinearity nonlinearity() {
            return nonlinearity;
        }

        @Override
        public String toString() {
            return "ordering " + Arrays.toString(order) + ": " + nonlinearity;
        }
    }

    /**
     * Proposals for the basis of an algebra.
     *
     * @param algebra the Lie algebra
     * @return the proposals, best first
     */
    public static List<Proposal> propose(LieAlgebra algebra) {
        Require.nonNull(algebra, "algebra");
        return propose(algebra.basis());
    }

    /**
     * Proposals for a basis, best first (distinct orderings; the given order is always among them).
     *
     * @param basis the basis elements
     * @return the proposals, best first
     * @throws InvalidInputException as {@link WeiNorman#of(List)} for a basis that is not closed or not independent
     */
    public static List<Proposal> propose(List<Operator> basis) {
        WeiNorman given = WeiNorman.of(basis);
        int m = given.dimension();
        Set<List<Integer>> candidates = new LinkedHashSet<>();
        candidates.add(identity(m));
        if (m <= EXHAUSTIVE) {
            permutations(new ArrayList<>(), new boolean[m], candidates);
        } else {
            candidates.addAll(weightOrders(given.chart()));
        }
        List<Proposal> out = new ArrayList<>();
        for (List<Integer> c : candidates) {
            int[] order = c.stream().mapToInt(Integer::intValue).toArray();
            List<Operator> b = new ArrayList<>();
            for (int k : order) {
                b.add(basis.get(k));
            }
            out.add(new Proposal(order, c.equals(identity(m)) ? given : WeiNorman.of(b)));
        }
        out.sort((a, b) -> a.nonlinearity.compareTo(b.nonlinearity));
        return Collections.unmodifiableList(out);
    }

    private static List<Integer> identity(int m) {
        List<Integer> l = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            l.add(k);
        }
        return l;
    }

    private static void permutations(List<Integer> prefix, boolean[] used, Set<List<Integer>> out) {
        if (prefix.size() == used.length) {
            out.add(new ArrayList<>(prefix));
            return;
        }
        for (int k = 0; k < used.length; k++) {
            if (!used[k]) {
                used[k] = true;
                prefix.add(k);
                permutations(prefix, used, out);
                prefix.remove(prefix.size() - 1);
                used[k] = false;
            }
        }
    }

    /** Raising–Cartan–lowering orders from the weights under a generic element of the diagonal-ad span. */
    private static List<List<Integer>> weightOrders(Chart c) {
        int m = c.m;
        double[] wr = new double[m], wi = new double[m];
        boolean any = false;
        for (int k = 0; k < m; k++) {
            ExpForm.Kind kind = c.adExp[k].kind();
            if (kind != ExpForm.Kind.DIAGONAL) {
                continue;
            }
            any = true;
            // generic weights: irrational multiples keep distinct roots apart
            double r = 1 + 0.6180339887498949 * (k + 1) + 0.1 * Math.sqrt(k + 2);
            for (int j = 0; j < m; j++) {
                wr[j] += r * c.adRe[k][j * m + j];
                wi[j] += r * c.adIm[k][j * m + j];
            }
        }
        List<List<Integer>> out = new ArrayList<>();
        if (!any) {
            return out;
        }
        Integer[] idx = new Integer[m];
        for (int k = 0; k < m; k++) {
            idx[k] = k;
        }
        double[] key = new double[m];
        for (int k = 0; k < m; k++) {
            key[k] = Math.abs(wr[k]) > 1e-9 ? wr[k] : wi[k];
        }
        List<Integer> pos = new ArrayList<>(), zero = new ArrayList<>(), neg = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            if (key[k] > 1e-9) {
                pos.add(k);
            } else if (key[k] < -1e-9) {
                neg.add(k);
            } else {
                zero.add(k);
            }
        }
        for (int variant = 0; variant < 4; variant++) {
            List<Integer> p = new ArrayList<>(pos), n = new ArrayList<>(neg);
            boolean pUp = (variant & 1) == 0, nUp = (variant & 2) == 0;
            p.sort((a, b) -> pUp ? Double.compare(key[a], key[b]) : Double.compare(key[b], key[a]));
            n.sort((a, b) -> nUp ? Double.compare(key[a], key[b]) : Double.compare(key[b], key[a]));
            List<Integer> order = new ArrayList<>(p);
            order.addAll(zero);
            order.addAll(n);
            out.add(order);
            List<Integer> rev = new ArrayList<>(n);
            rev.addAll(zero);
            rev.addAll(p);
            out.add(rev);
        }
        return out;
    }
}
