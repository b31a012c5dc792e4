package org.liepath.algebra.internal;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.List;

/**
 * Certified type identification of Lie algebras with a basis of Pauli strings, by computing the root system
 * exactly. Not part of the public API.
 *
 * <p>Steps (each exact; the Lie theory is textbook, e.g. J. E. Humphreys, Introduction to Lie Algebras and
 * Representation Theory, Springer 1972, §§8–12; compact real forms as in W. Fulton, J. Harris, Representation
 * Theory, Springer 1991):
 * <ol>
 *   <li>The centre is spanned by the strings that commute with every basis string (a sum commuting with a string
 *   Q has zero coefficient on every string anticommuting with Q, since the products PQ are distinct): one u(1)
 *   each.</li>
 *   <li>A maximal commuting set of basis strings T = {P_1 … P_r} spans a Cartan subalgebra: its centraliser is
 *   spanned by the strings commuting with all of T, which is T itself by maximality.</li>
 *   <li>Roots: for a string Q outside T let σ be the set of P_k anticommuting with Q. On the span of the orbit of Q
 *   under multiplication by those P_k, the operators J_k = ad(P_k)/2 commute and square to −1, so their joint
 *   eigenvalues are i·t_k with t_k = ±1, and the roots there are the vectors 2t supported on σ (coordinates in the
 *   trace-orthonormal basis of T). A product of P_k equal to the identity string gives a product of J_k equal to a
 *   sign ε on the orbit, hence the parity constraint ∏ t_k = ε·(−1)^{|A|/2}; every sign vector satisfying all such
 *   constraints occurs exactly once, and their number is checked against the size of the orbit.</li>
 *   <li>Roots of different simple ideals are orthogonal, and the roots of one simple ideal form an irreducible
 *   system. A basis of the root space is picked among the roots by elimination modulo the prime 2^31 − 1 (vectors
 *   independent modulo p are independent over the rationals; the basis must have r − dim(centre) elements, which
 *   certifies it); the simple ideals are the classes of basis roots linked through some root that is not orthogonal
 *   to them, and the rank of an ideal is its number of basis roots.</li>
 *   <li>A component with N roots of rank k is named by (N, k, root lengths): one length: A_k with N = k(k+1),
 *   D_k (k ≥ 4) with 2k(k−1), E6 with 72, E7 with 126, E8 with 240; two lengths of squared ratio 2: B_k with 2k²
 *   roots of which 2k short, C_k (k ≥ 3) with 2k² roots of which 2k(k−1) short, F4 with 48; ratio 3: G2 with 12.</li>
 * </ol>
 *
 * <p>Stateless static helpers: thread-safe.
 */
public final class StringTypes {
    /** Above this many roots (dimension minus rank) the root system is not built. */
    public static final int MAX_ROOTS = 200_000;
    private static final long PRIME = 2147483647L;

    private StringTypes() {
    }

    /**
     * @param t          a set of strings closed under the bracket
     * @param generators the first {@code generators} entries of t generate it as a Lie algebra (t.size() if unsure)
     * @return the type of the algebra spanned by all strings of {@code t}, or "unknown"
     */
    public static String identify(StringTable t, int generators) {
        int d = t.size();
        if (d == 0) {
            return "0";
        }
        int w = t.words();
        // central = commutes with every generator (then with all brackets of them, by the Jacobi identity)
        boolean[] central = new boolean[d];
        for (int i = 0; i < d; i++) {
            boolean c = true;
            for (int g = 0; g < generators && c; g++) {
                c = !t.anticommute(i, g);
            }
            central[i] = c;
        }
        int z = 0;
        long[] support = new long[w];
        for (int i = 0; i < d; i++) {
            if (central[i]) {
                z++;
            } else {
                for (int k = 0; k < w; k++) {
                    support[k] |= t.supportWord(i, k);
                }
            }
        }
        int rest = d - z;
        List<String[]> factors = new ArrayList<>(); // {name, dimension}
        int sk = 0;
        for (long s : support) {
            sk += Long.bitCount(s);
        }
        if (rest == 0) {
            // abelian
        } else if (sk < 16 && rest == (1L << (2 * sk)) - 1) {
            // every non-identity string on the support: su(2^k) (the short way, also for sizes beyond MAX_ROOTS)
            factors.add(new String[]{"su(" + (1 << sk) + ")", Integer.toString(rest)});
        } else {
            List<String[]> simple = simpleFactors(t, central, z);
            if (simple == null) {
                return "unknown";
            }
            factors.addAll(simple);
        }
        factors.sort((a, b) -> a[1].equals(b[1]) ? a[0].compareTo(b[0])
                : Integer.compare(Integer.parseInt(b[1]), Integer.parseInt(a[1])));
        StringBuilder sb = new StringBuilder();
        for (String[] f : factors) {
            sb.append(sb.length() == 0 ? "" : " ⊕ ").append(f[0]);
        }
        if (z > 0) {
            sb.append(sb.length() == 0 ? "" : " ⊕ ").append(z == 1 ? "u(1)" : "u(1)^" + z);
        }
        return sb.toString();
    }

    /** Simple ideals of the semisimple part as {name, dimension}, or null when they cannot be certified. */
    private static List<String[]> simpleFactors(StringTable t, boolean[] central, int z) {
        int d = t.size(), w = t.words();
        // maximal commuting set; central strings are taken first and always fit
        List<Integer> torus = new ArrayList<>();
        boolean[] inTorus = new boolean[d];
        for (int pass = 0; pass < 2; pass++) {
            for (int i = 0; i < d; i++) {
                if (inTorus[i] || central[i] != (pass == 0)) {
                    continue;
                }
                boolean ok = true;
                for (int j : torus) {
                    if (t.anticommute(i, j)) {
                        ok = false;
                        break;
                    }
                }
                if (ok) {
                    torus.add(i);
                    inTorus[i] = true;
                }
            }
        }
        int r = torus.size();
        int nRoots = d - r;
        if (nRoots > MAX_ROOTS) {
            return null;
        }
        int rw = (r + 63) >>> 6;
        // positive roots only (half of them); roots of one pair lie in one simple ideal
        long[] pos = new long[nRoots / 2 * rw], neg = new long[nRoots / 2 * rw];
        int[] lengths = new int[nRoots / 2];
        int m = 0;
        boolean[] seen = new boolean[d];
        long[] buf = new long[2 * w];
        long[] cur = new long[2 * w];
        long[] tmp = new long[2 * w];
        for (int q = 0; q < d; q++) {
            if (inTorus[q] || seen[q]) {
                continue;
            }
            // σ: torus strings anticommuting with q
            int[] sigma = new int[r];
            int s = 0;
            for (int k = 0; k < r; k++) {
                if (t.anticommute(torus.get(k), q)) {
                    sigma[s++] = k;
                }
            }
            sigma = Arrays.copyOf(sigma, s);
            // orbit of q under multiplication by the P_k in σ (all members share σ)
            List<Integer> orbit = new ArrayList<>();
            orbit.add(q);
            seen[q] = true;
            for (int o = 0; o < orbit.size(); o++) {
                for (int k : sigma) {
                    t.product(torus.get(k), orbit.get(o), buf);
                    int id = t.find(buf, 0);
                    if (id < 0) {
                        return null; // not closed under brackets: nothing can be certified
                    }
                    if (!seen[id]) {
                        seen[id] = true;
                        orbit.add(id);
                    }
                }
            }
            // relations: subsets A of σ whose product is the identity string (F2 kernel)
            List<BitSet> relations = kernel(t, torus, sigma, w);
            // constraint rows over u (t_k = (−1)^{u_k}): Σ_{A} u = b
            List<BitSet> rows = new ArrayList<>();
            for (BitSet a : relations) {
                long[] x = new long[w], zz = new long[w];
                t.copy(q, x, zz);
                System.arraycopy(x, 0, cur, 0, w);
                System.arraycopy(zz, 0, cur, w, w);
                int sign = 0; // number of −1 factors
                for (int e = a.nextSetBit(0); e >= 0; e = a.nextSetBit(e + 1)) {
                    int k = phaseTimes(t, torus.get(sigma[e]), cur, tmp, w);
                    long[] sw = cur;
                    cur = tmp;
                    tmp = sw;
                    if (k != 1) {
                        sign ^= 1;
                    }
                }
                int half = (a.cardinality() / 2) & 1;
                BitSet row = (BitSet) a.clone();
                if ((sign ^ half) == 1) {
                    row.set(s); // right-hand side bit stored at index s
                }
                rows.add(row);
            }
            List<int[]> solutions = solve(rows, s);
            if (solutions == null || solutions.size() != orbit.size()) {
                return null;
            }
            for (int[] u : solutions) {
                if (u[0] != 0) {
                    continue; // keep one root of each pair ±α: the one positive on the first coordinate of σ
                }
                for (int e = 0; e < s; e++) {
                    int k = sigma[e];
                    long bit = 1L << (k & 63);
                    if (u[e] == 0) {
                        pos[m * rw + (k >>> 6)] |= bit;
                    } else {
                        neg[m * rw + (k >>> 6)] |= bit;
                    }
                }
                lengths[m++] = s;
            }
        }
        if (2 * m != nRoots) {
            return null;
        }
        nRoots = m;
        // a basis of the root space among the roots (independent modulo p, hence over the rationals); it must have
        // r − z elements, the rank of the semisimple part, which certifies it
        int[] basisRoot = new int[r];
        long[][] basisVec = new long[r][];
        int[] lead = new int[r];
        int nb = 0;
        for (int i = 0; i < nRoots && nb < r - z; i++) {
            long[] v = vector(i, pos, neg, rw, r);
            for (int b = 0; b < nb; b++) {
                long f = v[lead[b]];
                if (f != 0) {
                    long[] bv = basisVec[b];
                    for (int k = 0; k < r; k++) {
                        v[k] = Math.floorMod(v[k] - f * bv[k], PRIME);
                    }
                }
            }
            int l = -1;
            for (int k = 0; k < r && l < 0; k++) {
                if (v[k] != 0) {
                    l = k;
                }
            }
            if (l >= 0) {
                long inv = modInverse(v[l]);
                for (int k = 0; k < r; k++) {
                    v[k] = v[k] * inv % PRIME;
                }
                basisVec[nb] = v;
                lead[nb] = l;
                basisRoot[nb++] = i;
            }
        }
        if (nb != r - z) {
            return null;
        }
        // simple ideals = components of "non-orthogonal" among the basis roots, each root joining the basis roots it
        // is not orthogonal to (they all lie in its ideal; a split inside one ideal would split its root system
        // orthogonally, which an irreducible root system does not allow)
        int[] parent = new int[nb];
        for (int b = 0; b < nb; b++) {
            parent[b] = b;
        }
        int[] attach = new int[nRoots];
        for (int i = 0; i < nRoots; i++) {
            attach[i] = -1;
            for (int b = 0; b < nb; b++) {
                if (dot(i, basisRoot[b], pos, neg, rw) != 0) {
                    if (attach[i] < 0) {
                        attach[i] = b;
                    } else {
                        union(parent, attach[i], b);
                    }
                }
            }
            if (attach[i] < 0) {
                return null; // a non-zero root is orthogonal to no basis of the root space
            }
        }
        int[] compOf = new int[nb];
        Arrays.fill(compOf, -1);
        List<List<Integer>> comps = new ArrayList<>();
        int[] compRank = new int[nb];
        for (int b = 0; b < nb; b++) {
            int root = find(parent, b);
            if (compOf[root] < 0) {
                compOf[root] = comps.size();
                comps.add(new ArrayList<>());
            }
            compRank[compOf[root]]++;
        }
        for (int i = 0; i < nRoots; i++) {
            comps.get(compOf[find(parent, attach[i])]).add(i);
        }
        List<String[]> out = new ArrayList<>();
        for (int c = 0; c < comps.size(); c++) {
            int k = compRank[c];
            String name = name(comps.get(c), lengths, k);
            if (name == null) {
                return null;
            }
            out.add(new String[]{name, Integer.toString(k + 2 * comps.get(c).size())});
        }
        return out;
    }

    private static long dot(int i, int j, long[] pos, long[] neg, int rw) {
        long dot = 0;
        for (int k = 0; k < rw; k++) {
            long pi = pos[i * rw + k], ni = neg[i * rw + k], pj = pos[j * rw + k], nj = neg[j * rw + k];
            dot += Long.bitCount(pi & pj) + Long.bitCount(ni & nj) - Long.bitCount(pi & nj) - Long.bitCount(ni & pj);
        }
        return dot;
    }

    /** Root i as a vector modulo p: +1 / −1 (= p − 1) on its support. */
    private static long[] vector(int i, long[] pos, long[] neg, int rw, int r) {
        long[] v = new long[r];
        for (int k = 0; k < r; k++) {
            long bit = 1L << (k & 63);
            if ((pos[i * rw + (k >>> 6)] & bit) != 0) {
                v[k] = 1;
            } else if ((neg[i * rw + (k >>> 6)] & bit) != 0) {
                v[k] = PRIME - 1;
            }
        }
        return v;
    }

    /** out ← P·cur (string part) and returns the phase exponent of P·cur. */
    private static int phaseTimes(StringTable t, int p, long[] cur, long[] out, int w) {
        long[] px = new long[w], pz = new long[w];
        t.copy(p, px, pz);
        int k = 0;
        for (int e = 0; e < w; e++) {
            long ax = px[e], az = pz[e], bx = cur[e], bz = cur[w + e];
            long cx = ax ^ bx, cz = az ^ bz;
            out[e] = cx;
            out[w + e] = cz;
            k += Long.bitCount(ax & az) + Long.bitCount(bx & bz) - Long.bitCount(cx & cz) + 2 * Long.bitCount(az & bx);
        }
        return k & 3;
    }

    /** F2 kernel of the symplectic vectors of the torus strings listed in σ: a basis of relations as index sets. */
    private static List<BitSet> kernel(StringTable t, List<Integer> torus, int[] sigma, int w) {
        List<long[]> pivVec = new ArrayList<>();
        List<BitSet> pivTag = new ArrayList<>();
        List<Integer> pivBit = new ArrayList<>();
        List<BitSet> rel = new ArrayList<>();
        for (int e = 0; e < sigma.length; e++) {
            long[] v = new long[2 * w];
            long[] x = new long[w], zz = new long[w];
            t.copy(torus.get(sigma[e]), x, zz);
            System.arraycopy(x, 0, v, 0, w);
            System.arraycopy(zz, 0, v, w, w);
            BitSet tag = new BitSet();
            tag.set(e);
            for (int p = 0; p < pivVec.size(); p++) {
                int b = pivBit.get(p);
                if (((v[b >>> 6] >>> (b & 63)) & 1) != 0) {
                    long[] pv = pivVec.get(p);
                    for (int k = 0; k < v.length; k++) {
                        v[k] ^= pv[k];
                    }
                    tag.xor(pivTag.get(p));
                }
            }
            int lead = -1;
            for (int k = 0; k < v.length && lead < 0; k++) {
                if (v[k] != 0) {
                    lead = (k << 6) + Long.numberOfTrailingZeros(v[k]);
                }
            }
            if (lead < 0) {
                rel.add(tag);
            } else {
                // keep pivots reduced so that one pass of elimination suffices
                for (int p = 0; p < pivVec.size(); p++) {
                    long[] pv = pivVec.get(p);
                    if (((pv[lead >>> 6] >>> (lead & 63)) & 1) != 0) {
                        for (int k = 0; k < v.length; k++) {
                            pv[k] ^= v[k];
                        }
                        pivTag.get(p).xor(tag);
                    }
                }
                pivVec.add(v);
                pivTag.add(tag);
                pivBit.add(lead);
            }
        }
        return rel;
    }

    /**
     * All solutions u ∈ F2^s of the rows (bits 0…s−1 the left side, bit s the right side), or null if inconsistent.
     */
    private static List<int[]> solve(List<BitSet> rows, int s) {
        List<BitSet> ech = new ArrayList<>();
        List<Integer> piv = new ArrayList<>();
        for (BitSet row0 : rows) {
            BitSet row = (BitSet) row0.clone();
            for (int p = 0; p < ech.size(); p++) {
                if (row.get(piv.get(p))) {
                    row.xor(ech.get(p));
                }
            }
            int lead = row.nextSetBit(0);
            if (lead < 0) {
                continue;
            }
            if (lead == s) {
                return null;
            }
            for (int p = 0; p < ech.size(); p++) {
                if (ech.get(p).get(lead)) {
                    ech.get(p).xor(row);
                }
            }
            ech.add(row);
            piv.add(lead);
        }
        boolean[] isPivot = new boolean[s];
        for (int p : piv) {
            isPivot[p] = true;
        }
        int[] free = new int[s];
        int nf = 0;
        for (int e = 0; e < s; e++) {
            if (!isPivot[e]) {
                free[nf++] = e;
            }
        }
        if (nf > 30) {
            return null;
        }
        List<int[]> out = new ArrayList<>();
        for (long mask = 0; mask < (1L << nf); mask++) {
            int[] u = new int[s];
            for (int f = 0; f < nf; f++) {
                u[free[f]] = (int) ((mask >>> f) & 1);
            }
            for (int p = 0; p < ech.size(); p++) {
                BitSet row = ech.get(p);
                int v = row.get(s) ? 1 : 0;
                for (int f = 0; f < nf; f++) {
                    if (row.get(free[f])) {
                        v ^= u[free[f]];
                    }
                }
                u[piv.get(p)] = v;
            }
            out.add(u);
        }
        return out;
    }

    private static long modInverse(long a) {
        long result = 1, base = a % PRIME, e = PRIME - 2;
        while (e > 0) {
            if ((e & 1) != 0) {
                result = result * base % PRIME;
            }
            base = base * base % PRIME;
            e >>= 1;
        }
        return result;
    }

    /** Names a simple root system from its positive roots (their number, rank and lengths), or null. */
    static String name(List<Integer> comp, int[] lengths, int k) {
        int n = 2 * comp.size();
        int lo = Integer.MAX_VALUE, hi = 0;
        for (int i : comp) {
            lo = Math.min(lo, lengths[i]);
            hi = Math.max(hi, lengths[i]);
        }
        int shortCount = 0;
        for (int i : comp) {
            if (lengths[i] == lo) {
                shortCount += 2;
            } else if (lengths[i] != hi) {
                return null; // three lengths: not a root system
            }
        }
        if (lo == hi) {
            if (n == k * (k + 1)) {
                return "su(" + (k + 1) + ")";
            }
            if (k >= 4 && n == 2 * k * (k - 1)) {
                return "so(" + 2 * k + ")";
            }
            if (k == 6 && n == 72) {
                return "e6";
            }
            if (k == 7 && n == 126) {
                return "e7";
            }
            if (k == 8 && n == 240) {
                return "e8";
            }
            return null;
        }
        if (hi == 2 * lo) {
            if (k == 4 && n == 48 && shortCount == 24) {
                return "f4";
            }
            if (n == 2 * k * k) {
                if (shortCount == 2 * k) {
                    return "so(" + (2 * k + 1) + ")";
                }
                if (k >= 3 && shortCount == 2 * k * (k - 1)) {
                    return "sp(" + 2 * k + ")";
                }
            }
            return null;
        }
        if (hi == 3 * lo && k == 2 && n == 12 && shortCount == 6) {
            return "g2";
        }
        return null;
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
}
