package org.liepath.algebra.internal;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;

/**
 * Structure theory in coordinates: every routine works on the structure constants of a real-orthonormal basis and
 * returns coordinate vectors, so no matrix bracket is recomputed. All null spaces and spans are taken from the
 * eigen-decomposition of a positive semidefinite Gram matrix (Commons Math, symmetric QL), with "zero" meaning at or
 * below {@link #REL_ZERO} times the largest eigenvalue. Not part of the public API.
 *
 * <p>Stateless static helpers: thread-safe.
 */
public final class Analysis {
    private Analysis() {
    }

    /**
     * Relative level below which an eigenvalue of a Gram matrix (a sum of squares of brackets) counts as zero. The
     * structure constants are accurate to about 1e-13; squares of that are 1e-26, while the smallest genuine squared
     * bracket of a generic element in the algebras we meet (dimension ≤ a few thousand) is many orders larger.
     */
    public static final double REL_ZERO = 1e-9;

    /** Seed of the "generic" random elements (rank, Cartan subalgebras, ideals): fixed so results are reproducible. */
    public static final long SEED = 0x5EEDL;

    /** Eigen-decomposition of a symmetric matrix: values ascending, vectors[k] the unit eigenvector of values[k]. */
    public static final class Eig {
        public final double[] values;
        public final double[][] vectors;

        Eig(double[] values, double[][] vectors) {
            this.values = values;
            this.vectors = vectors;
        }
    }

    public static Eig eig(double[][] sym) {
        int m = sym.length;
        if (m == 0) {
            return new Eig(new double[0], new double[0][]);
        }
        double[][] a = new double[m][m];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                a[i][j] = 0.5 * (sym[i][j] + sym[j][i]);
            }
        }
        EigenDecomposition ed = new EigenDecomposition(new Array2DRowRealMatrix(a, false));
        double[] v = ed.getRealEigenvalues();
        Integer[] order = new Integer[m];
        for (int i = 0; i < m; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (x, y) -> Double.compare(v[x], v[y]));
        double[] vals = new double[m];
        double[][] vecs = new double[m][];
        for (int i = 0; i < m; i++) {
            vals[i] = v[order[i]];
            vecs[i] = ed.getEigenvector(order[i]).toArray();
        }
        return new Eig(vals, vecs);
    }

    /** @return orthonormal vectors spanning the kernel (zero == false) or the range (zero == true) of a PSD matrix */
    static double[][] split(double[][] psd, boolean kernel) {
        Eig e = eig(psd);
        int m = psd.length;
        double max = m == 0 ? 0 : Math.max(0, e.values[m - 1]);
        List<double[]> out = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            boolean isZero = e.values[k] <= REL_ZERO * max || max == 0;
            if (isZero == kernel) {
                out.add(e.vectors[k]);
            }
        }
        return out.toArray(new double[0][]);
    }

    /**
     * @return an orthonormal basis (coordinates) of the centre. The centre commutes with the generic element h, so it
     *         lies in the kernel t of ad_h; inside t it is the kernel of the Gram matrix ⟨ad_a, ad_b⟩_F (a, b ∈ t),
     *         an r×r problem instead of an m×m one.
     */
    public static double[][] center(RealStructure s, Roots generic) {
        double[][] t = generic.cartan;
        int r = t.length;
        if (r == 0) {
            return new double[0][];
        }
        double[][][] ads = new double[r][][];
        for (int a = 0; a < r; a++) {
            ads[a] = s.ad(t[a]);
        }
        double[][] g = new double[r][r];
        for (int a = 0; a < r; a++) {
            for (int b = a; b < r; b++) {
                double x = 0;
                for (int i = 0; i < ads[a].length; i++) {
                    x += dot(ads[a][i], ads[b][i]);
                }
                g[a][b] = x;
                g[b][a] = x;
            }
        }
        Eig e = eig(g);
        double max = Math.max(0, e.values[r - 1]);
        // the scale of "zero" is set by the whole algebra: compare with the largest squared bracket of h
        double scale = Math.max(max, generic.maxEigenvalue);
        List<double[]> out = new ArrayList<>();
        for (int k = 0; k < r; k++) {
            if (e.values[k] <= REL_ZERO * scale || scale == 0) {
                double[] v = new double[s.dimension()];
                for (int a = 0; a < r; a++) {
                    double c = e.vectors[k][a];
                    for (int i = 0; i < v.length; i++) {
                        v[i] += c * t[a][i];
                    }
                }
                out.add(v);
            }
        }
        return out.toArray(new double[0][]);
    }

    /** @return an orthonormal basis (coordinates) of the derived algebra [g, g] */
    public static double[][] derived(RealStructure s) {
        int m = s.dimension();
        double[][] g = new double[m][m];
        java.util.Map<Integer, List<double[]>> pairs = new java.util.HashMap<>();
        s.forEach((i, j, k, c) -> pairs.computeIfAbsent(i * m + j, key -> new ArrayList<>()).add(new double[] {k, c}));
        for (List<double[]> list : pairs.values()) {
            for (double[] x : list) {
                for (double[] y : list) {
                    g[(int) x[0]][(int) y[0]] += x[1] * y[1];
                }
            }
        }
        return split(g, false);
    }

    /** @return an orthonormal basis of the span of the given coordinate vectors */
    public static double[][] span(List<double[]> vs, int m) {
        double[][] g = new double[m][m];
        for (double[] v : vs) {
            for (int a = 0; a < m; a++) {
                if (v[a] == 0) {
                    continue;
                }
                for (int b = 0; b < m; b++) {
                    g[a][b] += v[a] * v[b];
                }
            }
        }
        return split(g, false);
    }

    /** @return [V, W] as an orthonormal basis, V and W given as orthonormal coordinate bases */
    public static double[][] bracketSpan(RealStructure s, double[][] v, double[][] w) {
        List<double[]> out = new ArrayList<>();
        for (double[] x : v) {
            for (double[] y : w) {
                out.add(s.bracket(x, y));
            }
        }
        return span(out, s.dimension());
    }

    /** Derived series reaches 0? */
    public static boolean isSolvable(RealStructure s) {
        double[][] d = identity(s.dimension());
        while (d.length > 0) {
            double[][] next = bracketSpan(s, d, d);
            if (next.length == d.length) {
                return false;
            }
            d = next;
        }
        return true;
    }

    /** Lower central series reaches 0? */
    public static boolean isNilpotent(RealStructure s) {
        double[][] all = identity(s.dimension());
        double[][] d = all;
        while (d.length > 0) {
            double[][] next = bracketSpan(s, all, d);
            if (next.length == d.length) {
                return false;
            }
            d = next;
        }
        return true;
    }

    static double[][] identity(int m) {
        double[][] id = new double[m][m];
        for (int i = 0; i < m; i++) {
            id[i][i] = 1;
        }
        return id;
    }

    /** @return a seeded random coordinate vector (standard normal entries) */
    public static double[] generic(int m, Random r) {
        double[] x = new double[m];
        for (int i = 0; i < m; i++) {
            x[i] = r.nextGaussian();
        }
        return x;
    }

    static double[][] ata(double[][] a) {
        int m = a.length;
        double[][] s = new double[m][m];
        for (int k = 0; k < m; k++) {
            double[] row = a[k];
            for (int i = 0; i < m; i++) {
                double x = row[i];
                if (x == 0) {
                    continue;
                }
                for (int j = 0; j < m; j++) {
                    s[i][j] += x * row[j];
                }
            }
        }
        return s;
    }

    /** @return the dimension of the centraliser of a seeded generic element */
    public static int rank(RealStructure s) {
        return generic(s).cartan.length;
    }

    /**
     * The root decomposition of a seeded generic element, used by rank, centre and ideals. A random element is
     * non-generic (its centraliser too large) only if some root nearly vanishes on it; such a near-zero shows up as a
     * squared root value close to the zero threshold, so when the smallest non-zero eigenvalue is within a factor 1e3
     * of the threshold further seeds are tried and the decomposition with the smallest centraliser (then the best
     * separation) is kept. Any element's centraliser is at least a Cartan subalgebra, so the minimum is the rank.
     */
    public static Roots generic(RealStructure s) {
        Roots best = null;
        for (int attempt = 0; attempt < 4; attempt++) {
            Roots r = roots(s, new Random(SEED + 31L * attempt));
            if (best == null || r.cartan.length < best.cartan.length
                    || (r.cartan.length == best.cartan.length && r.separation > best.separation)) {
                best = r;
            }
            if (best.separation > 1e3 * REL_ZERO) {
                break;
            }
        }
        return best;
    }

    /** @return the structure constants, in their own orthonormal basis, of the subalgebra with coordinate basis v */
    public static RealStructure restrict(RealStructure s, double[][] v) {
        int d = v.length;
        double[][][] c = new double[d][d][d];
        for (int a = 0; a < d; a++) {
            for (int b = a + 1; b < d; b++) {
                double[] br = s.bracket(v[a], v[b]);
                for (int k = 0; k < d; k++) {
                    double x = dot(v[k], br);
                    c[a][b][k] = x;
                    c[b][a][k] = -x;
                }
            }
        }
        return RealStructure.ofDense(c, 1e-13);
    }

    static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    static double[] matVec(double[][] a, double[] x) {
        int m = a.length;
        double[] y = new double[m];
        for (int i = 0; i < m; i++) {
            double t = 0;
            double[] row = a[i];
            for (int j = 0; j < m; j++) {
                t += row[j] * x[j];
            }
            y[i] = t;
        }
        return y;
    }

    /** Root planes of ad_h for a generic h of a compact semisimple algebra: Cartan basis and clusters. */
    public static final class Roots {
        public final double[][] cartan;
        public final List<double[][]> planes;
        public final List<Double> gaps;
        public final double maxEigenvalue;
        /** smallest non-zero eigenvalue over the largest (1 if there is none) */
        public final double separation;

        Roots(double[][] cartan, List<double[][]> planes, List<Double> gaps, double maxEigenvalue, double separation) {
            this.cartan = cartan;
            this.planes = planes;
            this.gaps = gaps;
            this.maxEigenvalue = maxEigenvalue;
            this.separation = separation;
        }
    }

    /**
     * For a compact algebra ad_h is antisymmetric in an orthonormal basis, so S = ad_hᵀ ad_h = −ad_h² has the Cartan
     * subalgebra (centraliser of h) as kernel and the real root planes V_α as eigenspaces for α(h)², each of
     * dimension 2 when h is generic. Eigenvalues closer than 1e-7 relative are grouped.
     */
    public static Roots roots(RealStructure s, Random r) {
        int m = s.dimension();
        double[] h = generic(m, r);
        Eig e = eig(ata(s.ad(h)));
        double max = m == 0 ? 0 : Math.max(0, e.values[m - 1]);
        List<double[]> cartan = new ArrayList<>();
        List<double[][]> planes = new ArrayList<>();
        List<Double> centres = new ArrayList<>();
        int k = 0;
        while (k < m && e.values[k] <= REL_ZERO * max) {
            cartan.add(e.vectors[k++]);
        }
        double separation = k < m && max > 0 ? e.values[k] / max : 1.0;
        while (k < m) {
            int l = k + 1;
            while (l < m && e.values[l] - e.values[l - 1] <= 1e-7 * max) {
                l++;
            }
            planes.add(Arrays.copyOfRange(e.vectors, k, l));
            centres.add(e.values[k]);
            k = l;
        }
        List<Double> gaps = new ArrayList<>();
        for (int p = 0; p < centres.size(); p++) {
            double g = Double.POSITIVE_INFINITY;
            if (p > 0) {
                g = Math.min(g, centres.get(p) - centres.get(p - 1));
            }
            if (p + 1 < centres.size()) {
                g = Math.min(g, centres.get(p + 1) - centres.get(p));
            }
            gaps.add(g);
        }
        return new Roots(cartan.toArray(new double[0][]), planes, gaps, max, separation);
    }

    /**
     * Splits a compact semisimple algebra into its simple ideals. Each ideal is generated by one root plane of a
     * generic element (a root plane lies in exactly one simple ideal); the plane with the largest eigenvalue gap is
     * used first so that accidental near-degeneracies across ideals cannot mix two ideals. The ideal generated by a
     * subspace is its closure under ad of three seeded random elements, which generate the algebra with probability
     * one (two generic elements already generate a semisimple Lie algebra: M. Kuranishi, Nagoya Math. J. 2, 63 (1951)).
     *
     * @return orthonormal coordinate bases of the simple ideals (empty for the zero algebra)
     */
    public static List<double[][]> simpleIdeals(RealStructure s, Roots roots) {
        int m = s.dimension();
        List<double[][]> ideals = new ArrayList<>();
        if (m == 0) {
            return ideals;
        }
        Random r = new Random(SEED + 7);
        double[][][] gens = new double[3][][];
        for (int g = 0; g < gens.length; g++) {
            gens[g] = s.ad(generic(m, r));
        }
        List<Integer> order = new ArrayList<>();
        for (int p = 0; p < roots.planes.size(); p++) {
            order.add(p);
        }
        order.sort((a, b) -> Double.compare(roots.gaps.get(b), roots.gaps.get(a)));
        boolean[] done = new boolean[roots.planes.size()];
        int covered = 0;
        for (int p : order) {
            if (done[p]) {
                continue;
            }
            double[][] ideal = generate(roots.planes.get(p), gens, m);
            ideals.add(ideal);
            covered += ideal.length;
            for (int q = 0; q < done.length; q++) {
                if (!done[q] && inside(roots.planes.get(q)[0], ideal)) {
                    done[q] = true;
                }
            }
            if (covered >= m) {
                break;
            }
        }
        if (covered != m) {
            // the pieces do not add up (a degenerate generic element): report the algebra undivided rather than guess
            ideals.clear();
            ideals.add(identity(m));
        }
        return ideals;
    }

    private static boolean inside(double[] v, double[][] basis) {
        double[] r = v.clone();
        for (double[] b : basis) {
            double c = dot(b, r);
            for (int i = 0; i < r.length; i++) {
                r[i] -= c * b[i];
            }
        }
        return Math.sqrt(dot(r, r)) < 1e-6;
    }

    /** Smallest subspace containing start and invariant under the given matrices (CGS2 in coordinates). */
    static double[][] generate(double[][] start, double[][][] mats, int m) {
        List<double[]> basis = new ArrayList<>();
        for (double[] v : start) {
            addIfNew(basis, v.clone(), 1e-8);
        }
        double[] tols = new double[mats.length];
        for (int a = 0; a < mats.length; a++) {
            tols[a] = 1e-8 * norm(mats[a]);
        }
        for (int idx = 0; idx < basis.size() && basis.size() < m; idx++) {
            for (int a = 0; a < mats.length; a++) {
                addIfNew(basis, matVec(mats[a], basis.get(idx)), tols[a]);
            }
        }
        return basis.toArray(new double[0][]);
    }

    private static double norm(double[][] a) {
        double s = 0;
        for (double[] row : a) {
            s += dot(row, row);
        }
        return Math.sqrt(s);
    }

    private static void addIfNew(List<double[]> basis, double[] v, double tol) {
        if (basis.size() == v.length) {
            return;
        }
        double n = 0;
        for (int pass = 0; pass < 2; pass++) {
            for (double[] b : basis) {
                double c = dot(b, v);
                for (int i = 0; i < v.length; i++) {
                    v[i] -= c * b[i];
                }
            }
            n = Math.sqrt(dot(v, v));
            if (n <= tol) {
                return;
            }
        }
        if (n > tol) {
            for (int i = 0; i < v.length; i++) {
                v[i] /= n;
            }
            basis.add(v);
        }
    }

    /**
     * Squared root lengths of a compact simple algebra, one per root plane (±α), in the metric dual to the invariant
     * inner product of the basis (any invariant inner product on a simple algebra is a multiple of the Killing form,
     * so ratios of root lengths are those of the root system). α(t) is read off the rotation of ad_t on the plane.
     *
     * Retries with other seeds when an eigenvalue cluster is not a single plane (two roots with equal |α(h)|).
     *
     * @return squared lengths, or null if no seed gave two-dimensional planes
     */
    public static double[] rootLengths(RealStructure s) {
        for (int attempt = 0; attempt < 4; attempt++) {
            double[] len = rootLengths(s, roots(s, new Random(SEED + 1 + 31L * attempt)));
            if (len != null) {
                return len;
            }
        }
        return null;
    }

    private static double[] rootLengths(RealStructure s, Roots roots) {
        int r = roots.cartan.length;
        double[][][] adT = new double[r][][];
        for (int j = 0; j < r; j++) {
            adT[j] = s.ad(roots.cartan[j]);
        }
        double[] out = new double[roots.planes.size()];
        for (int p = 0; p < out.length; p++) {
            double[][] pl = roots.planes.get(p);
            if (pl.length != 2) {
                return null;
            }
            double len = 0;
            for (int j = 0; j < r; j++) {
                double a = dot(pl[1], matVec(adT[j], pl[0]));
                len += a * a;
            }
            out[p] = len;
        }
        return out;
    }
}
