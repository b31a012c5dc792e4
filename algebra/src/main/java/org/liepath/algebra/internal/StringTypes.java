package org.liepath.algebra.internal;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.Comparator;
import java.util.List;

/**
 * Certified type identification of Lie algebras with a basis of Pauli strings (see PauliAlgebra.type for the
 * reasoning). The facts used are standard Lie theory: compact simple algebras by Cartan type with their dimension
 * and rank (A_k: su(k+1), k(k+2); B_k: so(2k+1), k(2k+1); C_k: sp(2k), k(2k+1); D_k: so(2k), k(2k−1); E6: 78;
 * E7: 133; e.g. W. Fulton, J. Harris, Representation Theory, Springer 1991, §21), and the gradings of depth one
 * (elements H of a Cartan subalgebra with every root value in {0, ±λ}, H a multiple of a cominuscule fundamental
 * coweight; e.g. A. W. Knapp, Lie Groups Beyond an Introduction, 2nd ed., Birkhäuser 2002, §VII.9, Hermitian
 * symmetric spaces), whose ad-rank dim g − dim g_0 we tabulate: A_k: 2j(k+1−j) for j = 1…k; B_k: 2(2k−1);
 * C_k: k(k+1); D_k: 4(k−1) and k(k−1); E6: 32; E7: 54; G2, F4, E8: none. Not part of the public API.
 */
public final class StringTypes {
    private static final int NODE_BUDGET = 200_000;
    private static final int MAX_CANDIDATES = 16;
    private static final long WORK_BUDGET = 300_000_000L;

    private StringTypes() {
    }

    private static final class Simple {
        final String name;
        final int rank;
        final int dim;
        final int[] degrees;

        Simple(String name, int rank, int dim, int... degrees) {
            this.name = name;
            this.rank = rank;
            this.dim = dim;
            this.degrees = degrees;
        }
    }

    /** @return the type of the algebra spanned by all strings of {@code t} (which must be closed) */
    public static String identify(StringTable t) {
        int d = t.size();
        if (d == 0) {
            return "0";
        }
        int[] parent = new int[d];
        int[] degree = new int[d];
        for (int i = 0; i < d; i++) {
            parent[i] = i;
        }
        for (int i = 0; i < d; i++) {
            for (int j = 0; j < i; j++) {
                if (t.anticommute(i, j)) {
                    degree[i]++;
                    degree[j]++;
                    union(parent, i, j);
                }
            }
        }
        List<List<Integer>> comps = new ArrayList<>();
        int[] compOf = new int[d];
        java.util.Arrays.fill(compOf, -1);
        for (int i = 0; i < d; i++) {
            int root = find(parent, i);
            if (compOf[root] < 0) {
                compOf[root] = comps.size();
                comps.add(new ArrayList<>());
            }
            comps.get(compOf[root]).add(i);
        }
        List<String[]> parts = new ArrayList<>(); // {name, dim}
        int u1 = 0;
        for (List<Integer> c : comps) {
            if (c.size() == 1) {
                u1++;
                continue;
            }
            List<Simple> factors = component(t, c, degree);
            if (factors == null) {
                return "unknown";
            }
            for (Simple s : factors) {
                parts.add(new String[]{s.name, Integer.toString(s.dim)});
            }
        }
        parts.sort(Comparator.comparingInt((String[] p) -> -Integer.parseInt(p[1])).thenComparing(p -> p[0]));
        StringBuilder sb = new StringBuilder();
        for (String[] p : parts) {
            sb.append(sb.length() == 0 ? "" : " ⊕ ").append(p[0]);
        }
        for (int k = 0; k < u1; k++) {
            sb.append(sb.length() == 0 ? "" : " ⊕ ").append("u(1)");
        }
        return sb.toString();
    }

    private static int find(int[] parent, int i) {
        while (parent[i] != i) {
            parent[i] = parent[parent[i]];
            i = parent[i];
        }
        return i;
    }

    private static void union(int[] parent, int a, int b) {
        int ra = find(parent, a), rb = find(parent, b);
        if (ra != rb) {
            parent[Math.max(ra, rb)] = Math.min(ra, rb);
        }
    }

    /** @return the simple factors of one semisimple component, or null if they cannot be certified */
    private static List<Simple> component(StringTable t, List<Integer> c, int[] degree) {
        int dim = c.size();
        // rank: a maximal commuting subset spans a maximal torus (its centraliser among strings is itself)
        List<Integer> torus = new ArrayList<>();
        for (int i : c) {
            boolean ok = true;
            for (int j : torus) {
                if (t.anticommute(i, j)) {
                    ok = false;
                    break;
                }
            }
            if (ok) {
                torus.add(i);
            }
        }
        int rank = torus.size();
        // all non-identity strings on a k-qubit support: su(2^k)
        int k = 0;
        for (int w = 0; w < t.words(); w++) {
            long s = 0;
            for (int i : c) {
                s |= t.supportWord(i, w);
            }
            k += Long.bitCount(s);
        }
        if (k < 16 && dim == (1L << (2 * k)) - 1) {
            return List.of(new Simple("su(" + (1 << k) + ")", (1 << k) - 1, dim));
        }
        BitSet seen = new BitSet();
        for (int i : c) {
            seen.set(degree[i]);
        }
        List<Simple> items = items(rank);
        if ((long) items.size() * rank * (dim / 64 + 1) > WORK_BUDGET) {
            return null;
        }
        BitSet[] reach = new BitSet[rank + 1];
        for (int r = 0; r <= rank; r++) {
            reach[r] = new BitSet(dim + 1);
        }
        reach[0].set(0);
        for (Simple s : items) {
            for (int r = s.rank; r <= rank; r++) {
                BitSet from = reach[r - s.rank];
                for (int x = from.nextSetBit(0); x >= 0 && x + s.dim <= dim; x = from.nextSetBit(x + 1)) {
                    reach[r].set(x + s.dim);
                }
            }
        }
        if (!reach[rank].get(dim)) {
            return null;
        }
        List<List<Simple>> found = new ArrayList<>();
        int[] budget = {NODE_BUDGET};
        search(items, 0, rank, dim, reach, new ArrayList<>(), found, budget);
        if (budget[0] <= 0 || found.size() >= MAX_CANDIDATES) {
            return null;
        }
        List<Simple> only = null;
        for (List<Simple> cand : found) {
            if (degreesPossible(cand, seen, dim)) {
                if (only != null) {
                    return null;
                }
                only = cand;
            }
        }
        return only;
    }

    private static void search(List<Simple> items, int from, int rank, int dim, BitSet[] reach, List<Simple> chosen,
                               List<List<Simple>> found, int[] budget) {
        if (--budget[0] <= 0 || found.size() >= MAX_CANDIDATES) {
            return;
        }
        if (rank == 0 && dim == 0) {
            found.add(new ArrayList<>(chosen));
            return;
        }
        for (int k = from; k < items.size(); k++) {
            Simple s = items.get(k);
            if (s.rank <= rank && s.dim <= dim && reach[rank - s.rank].get(dim - s.dim)) {
                chosen.add(s);
                search(items, k, rank - s.rank, dim - s.dim, reach, chosen, found, budget);
                chosen.remove(chosen.size() - 1);
            }
        }
    }

    /** Every observed ad-rank must be a sum, over the factors, of 0 or one of the factor's depth-one ad-ranks. */
    private static boolean degreesPossible(List<Simple> factors, BitSet seen, int dim) {
        BitSet sums = new BitSet(dim + 1);
        sums.set(0);
        for (Simple s : factors) {
            BitSet next = (BitSet) sums.clone();
            for (int x = sums.nextSetBit(0); x >= 0; x = sums.nextSetBit(x + 1)) {
                for (int g : s.degrees) {
                    if (x + g <= dim) {
                        next.set(x + g);
                    }
                }
            }
            sums = next;
        }
        BitSet missing = (BitSet) seen.clone();
        missing.andNot(sums);
        return missing.isEmpty();
    }

    private static List<Simple> items(int maxRank) {
        List<Simple> l = new ArrayList<>();
        for (int k = 1; k <= maxRank; k++) {
            int[] a = new int[k];
            for (int j = 1; j <= k; j++) {
                a[j - 1] = 2 * j * (k + 1 - j);
            }
            l.add(new Simple("su(" + (k + 1) + ")", k, k * (k + 2), a));
            if (k >= 2) {
                l.add(new Simple("so(" + (2 * k + 1) + ")", k, k * (2 * k + 1), 2 * (2 * k - 1)));
            }
            if (k >= 3) {
                l.add(new Simple("sp(" + (2 * k) + ")", k, k * (2 * k + 1), k * (k + 1)));
            }
            if (k >= 4) {
                l.add(new Simple("so(" + (2 * k) + ")", k, k * (2 * k - 1), 4 * (k - 1), k * (k - 1)));
            }
            if (k == 6) {
                l.add(new Simple("e6", 6, 78, 32));
            }
            if (k == 7) {
                l.add(new Simple("e7", 7, 133, 54));
            }
        }
        return l;
    }
}
