package org.liepath.algebra.internal;

import java.util.Arrays;

/**
 * Sparse real structure constants [e_i, e_j] = Σ_k c_ij^k e_k of a real-orthonormal basis, stored for i &lt; j only
 * (antisymmetry gives the rest). Entries below {@link #dropLevel(int)} are stored as zero. Immutable once built;
 * not part of the public API.
 */
public final class RealStructure {
    private final int m;
    private final int[] start; // per pair p(i,j), i<j: entries start[p] .. start[p+1]-1
    private final int[] ks;
    private final double[] vals;
    /** per entry: its pair (i, j), so that visits skip empty pairs */
    private final int[] is;
    private final int[] js;

    private RealStructure(int m, int[] start, int[] ks, double[] vals) {
        this.m = m;
        this.start = start;
        this.ks = ks;
        this.vals = vals;
        this.is = new int[ks.length];
        this.js = new int[ks.length];
        int p = 0;
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++, p++) {
                for (int e = start[p]; e < start[p + 1]; e++) {
                    is[e] = i;
                    js[e] = j;
                }
            }
        }
    }

    /**
     * Entries of a bracket of two unit-norm elements below this level are rounding noise: the computed bracket has
     * an error of order n·ε·‖e_i‖‖e_j‖ (each entry is a sum of 2n products), and its projections inherit it.
     */
    public static double dropLevel(int n) {
        return 64.0 * Math.max(1, n) * Math.ulp(1.0);
    }

    /** Receives the first bracket that leaves the span (closure check). */
    public interface Leak {
        void at(int i, int j, double residual);
    }

    /**
     * Computes the structure constants of the basis. If {@code leak} is non-null, each bracket's residual outside
     * the span is measured and the first one above {@code residualTol} is reported; the computation then stops and
     * null is returned.
     */
    public static RealStructure of(Basis b, double residualTol, Leak leak) {
        int n = b.n(), m = b.size();
        long pairs = (long) m * (m - 1) / 2;
        int[] start = new int[(int) pairs + 1];
        int cap = 16;
        int[] ks = new int[cap];
        double[] vals = new double[cap];
        int count = 0;
        double drop = dropLevel(n);
        double[] c = new double[2 * n * n];
        int p = 0;
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++) {
                start[p] = count;
                MatVec.commutator(n, b.vec(i), b.support(i), b.vec(j), b.support(j), c);
                double[] co = b.project(c);
                if (leak != null) {
                    double[] r = c.clone();
                    for (int k = 0; k < m; k++) {
                        if (co[k] != 0.0) {
                            MatVec.axpy(n, -co[k], b.vec(k), b.support(k), r);
                        }
                    }
                    double res = MatVec.norm(r);
                    if (res > residualTol) {
                        leak.at(i, j, res);
                        return null;
                    }
                }
                for (int k = 0; k < m; k++) {
                    if (Math.abs(co[k]) > drop) {
                        if (count == cap) {
                            cap *= 2;
                            ks = Arrays.copyOf(ks, cap);
                            vals = Arrays.copyOf(vals, cap);
                        }
                        ks[count] = k;
                        vals[count] = co[k];
                        count++;
                    }
                }
                p++;
            }
        }
        start[p] = count;
        return new RealStructure(m, start, Arrays.copyOf(ks, count), Arrays.copyOf(vals, count));
    }

    /** Structure constants given as a dense array c[i][j][k] (antisymmetric in i, j); used by sub-algebras. */
    public static RealStructure ofDense(double[][][] c, double drop) {
        int m = c.length;
        int pairs = m * (m - 1) / 2;
        int[] start = new int[pairs + 1];
        int[] ks = new int[Math.max(16, m * m)];
        double[] vals = new double[ks.length];
        int count = 0, p = 0;
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++) {
                start[p++] = count;
                for (int k = 0; k < m; k++) {
                    if (Math.abs(c[i][j][k]) > drop) {
                        if (count == ks.length) {
                            ks = Arrays.copyOf(ks, 2 * count);
                            vals = Arrays.copyOf(vals, 2 * count);
                        }
                        ks[count] = k;
                        vals[count++] = c[i][j][k];
                    }
                }
            }
        }
        start[p] = count;
        return new RealStructure(m, start, Arrays.copyOf(ks, count), Arrays.copyOf(vals, count));
    }

    public int dimension() {
        return m;
    }

    /** @return the number of stored non-zero c_ij^k with i &lt; j */
    public int nonZeros() {
        return ks.length;
    }

    private int pair(int i, int j) {
        return i * m - i * (i + 1) / 2 + (j - i - 1);
    }

    /** @return c_ij^k */
    public double get(int i, int j, int k) {
        if (i == j) {
            return 0.0;
        }
        double sign = 1;
        if (i > j) {
            int t = i;
            i = j;
            j = t;
            sign = -1;
        }
        int p = pair(i, j);
        for (int e = start[p]; e < start[p + 1]; e++) {
            if (ks[e] == k) {
                return sign * vals[e];
            }
        }
        return 0.0;
    }

    /** Visits the stored entries (i &lt; j, k, c_ij^k). */
    public interface Visitor {
        void entry(int i, int j, int k, double value);
    }

    public void forEach(Visitor v) {
        for (int e = 0; e < ks.length; e++) {
            v.entry(is[e], js[e], ks[e], vals[e]);
        }
    }

    /** @return the coordinates of [x, y] for coordinate vectors x, y */
    public double[] bracket(double[] x, double[] y) {
        double[] out = new double[m];
        for (int e = 0; e < ks.length; e++) {
            int i = is[e], j = js[e];
            out[ks[e]] += vals[e] * (x[i] * y[j] - x[j] * y[i]);
        }
        return out;
    }

    /** @return the dense m×m matrix of ad_x (column j = coordinates of [x, e_j]) */
    public double[][] ad(double[] x) {
        double[][] a = new double[m][m];
        forEach((i, j, k, c) -> {
            a[k][j] += x[i] * c;
            a[k][i] -= x[j] * c;
        });
        return a;
    }

    /** @return ad of basis element i */
    public double[][] ad(int i) {
        double[] x = new double[m];
        x[i] = 1;
        return ad(x);
    }

    /** @return the Killing form tr(ad_i ad_j), accumulated over the sparse entries */
    public double[][] killing() {
        // ad_i[l][j] = c_ij^l; K_ab = Σ_{l,j} ad_a[l][j] ad_b[j][l] = Σ_{l,j} c_aj^l c_bl^j
        // collect per element a its entries (j, l, value)
        int[][] cnt = new int[1][m];
        forEach((i, j, k, c) -> {
            cnt[0][i]++;
            cnt[0][j]++;
        });
        int[][] js = new int[m][], ls = new int[m][];
        double[][] vs = new double[m][];
        for (int a = 0; a < m; a++) {
            js[a] = new int[cnt[0][a]];
            ls[a] = new int[cnt[0][a]];
            vs[a] = new double[cnt[0][a]];
        }
        int[] fill = new int[m];
        forEach((i, j, k, c) -> {
            int f = fill[i]++;
            js[i][f] = j;
            ls[i][f] = k;
            vs[i][f] = c;
            f = fill[j]++;
            js[j][f] = i;
            ls[j][f] = k;
            vs[j][f] = -c;
        });
        double[][] kf = new double[m][m];
        for (int a = 0; a < m; a++) {
            // dense ad_a transposed lookup table: t[j*m + l] = ad_a[l][j]
            double[] t = new double[m * m];
            for (int e = 0; e < js[a].length; e++) {
                t[js[a][e] * m + ls[a][e]] += vs[a][e];
            }
            for (int b = a; b < m; b++) {
                double s = 0;
                // Σ_{j,l} ad_a[l][j] ad_b[j][l]: entries of ad_b are (col l', row j') = (js[b], ls[b])
                for (int e = 0; e < js[b].length; e++) {
                    // ad_b[ls][js] = vs; need ad_a[js][ls]
                    s += vs[b][e] * t[ls[b][e] * m + js[b][e]];
                }
                kf[a][b] = s;
                kf[b][a] = s;
            }
        }
        return kf;
    }
}
