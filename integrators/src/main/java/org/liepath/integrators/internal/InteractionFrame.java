package org.liepath.integrators.internal;

/**
 * The interaction picture of a {@link Kernel} on a system from {@link LinearSystem#interaction}.
 *
 * <p>With the static part H_0 = V diag(d) V† and the driven part H_1(t) = Σ c_k(t) A_k (A'_k = V† A_k V in the
 * eigenbasis), the kernel evolves X_I(t) = e^{iD(t−t_r)} V† X(t) from an origin t_r (the start of a run, or of a
 * stepper's sequence of calls), whose generator is −iH_I(s) with H_I(s) = e^{iD(s−t_r)} H'_1(s) e^{−iD(s−t_r)},
 * entrywise (H'_1)_ab e^{i(d_a−d_b)(s−t_r)}. States enter once (X_I = V† X at t_r) and leave once per sample
 * (X = V e^{−iD(t−t_r)} X_I), so the frame's own factors are never applied step after step: every step is one
 * exponential of an anti-Hermitian exponent, unitary to rounding as in the Schrödinger picture, and its rounding
 * does not repeat coherently (a phase factor e^{−idh} applied every step would, its modulus being 1 only to
 * rounding).
 *
 * <p>A step [t, t+h] is computed about its own midpoint τ: the node values in the frame of τ,
 * Φ_j∘(−iH'_1(t + c_j h)) with Φ_j = e^{i(d_a−d_b)(c_j−1/2)h}, depend on h and the nodes alone and are cached (for
 * the last two step sizes: a fixed-step run uses one, step doubling alternates two), and the scheme's exponent Ω_τ
 * is carried to the frame of t_r by the entrywise phases e^{i(d_a−d_b)(τ−t_r)} (a constant unitary conjugation, which
 * every Magnus exponent follows exactly). Phase arguments are formed from the times directly, never accumulated.
 *
 * <p>Accuracy: the transformation is exact, so the scheme keeps its order; its error constant is that of H_I, which
 * no longer contains H_0: for a strong static part and weak drives (the common case of level energies plus control
 * fields) far fewer steps reach a given accuracy (the interaction picture as a preliminary transformation of the
 * Magnus expansion: S. Blanes, F. Casas, J.A. Oteo, J. Ros, Phys. Rep. 470 (2009) 151–238, from memory; section
 * not checked).
 *
 * <p>Work per step beyond the scheme: m sines and cosines and m² complex products for the conjugation; the node
 * combinations scatter phased generators (the table route) or multiply node matrices by their phases
 * (nodes × m² complex products). Entering and leaving cost one m×m product each when H_0 is not diagonal.
 *
 * <p>Mutable and not thread-safe: part of its kernel.
 */
final class InteractionFrame {
    private final int m;
    /** Energies of the static part (eigenvalues, or its diagonal). */
    private final double[] d;
    /** Energies less their midrange: only differences enter the node phases. */
    private final double[] dc;
    final double[] vr, vi, vhr, vhi;
    /** Node matrices in the frame of the current step (−iH_I at the nodes), planar m×m; null on the table route. */
    final double[][] nr, ni;
    /**
     * Whether node combinations come from a per-step-size table of phased generators Φ_j∘G_k (same sparsity as G_k,
     * so a combination scatters only their nonzeros), rather than from node matrices Σ_k c_k G_k multiplied by Φ_j
     * entrywise. The table holds nodes × terms × m² entries per cached step size; it is used up to
     * {@link #TABLE_LIMIT} of them.
     */
    final boolean table;
    static final int TABLE_LIMIT = 1 << 17;
    private final LinearSystem sys;
    /** Nonzero positions of each generator (either plane), or null where it is dense. */
    private final int[][] nz;

    /** Phase values for one step size. */
    private static final class Slot {
        double h = Double.NaN;
        double[] nodes;
        /** Entrywise node phases e^{i(d_a−d_b)(c_j−1/2)h} (diagonal exactly 1). */
        double[][] phr, phi;
        /** Phased generators Φ_j∘G_k on the table route: [node][term][m²]. */
        double[][][] tr, ti;
    }

    private final Slot[] slots = {new Slot(), new Slot()};
    private Slot cur;
    private final double[] er, ei;
    /** Write-only destination of the unused outputs of {@link #combinations}. */
    private final double[] spareR, spareI;
    /** Holders of a single {@link #combination} passed to {@link #combinations}. */
    private final double[] oneScale = new double[1];
    private final double[][] oneAlpha = new double[1][], oneR = new double[1][], oneI = new double[1][];

    InteractionFrame(LinearSystem sys, int nodes) {
        this(sys, nodes, (long) Math.max(nodes, 1) * sys.terms * sys.m * sys.m <= TABLE_LIMIT);
    }

    /** @param table whether to use the table route (forced, for tests) */
    InteractionFrame(LinearSystem sys, int nodes, boolean table) {
        this.sys = sys;
        this.table = table;
        m = sys.m;
        d = sys.frameEnergies;
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (double x : d) {
            lo = Math.min(lo, x);
            hi = Math.max(hi, x);
        }
        double mid = 0.5 * (lo + hi);
        dc = new double[m];
        for (int a = 0; a < m; a++) {
            dc[a] = d[a] - mid;
        }
        vr = sys.frameVr;
        vi = sys.frameVi;
        vhr = sys.frameVhr;
        vhi = sys.frameVhi;
        int len = m * m, count = Math.max(nodes, 1), terms = sys.terms;
        nr = table ? null : new double[count][len];
        ni = table ? null : new double[count][len];
        nz = new int[terms][];
        for (int k = 0; k < terms; k++) {
            int c = 0;
            double[] gr = sys.gr[k], gi = sys.gi[k];
            for (int q = 0; q < len; q++) {
                c += gr[q] != 0.0 || gi[q] != 0.0 ? 1 : 0;
            }
            if (2 * c <= len) {
                nz[k] = new int[c];
                for (int q = 0, i = 0; q < len; q++) {
                    if (gr[q] != 0.0 || gi[q] != 0.0) {
                        nz[k][i++] = q;
                    }
                }
            }
        }
        for (Slot s : slots) {
            if (table) {
                s.tr = new double[count][terms][len];
                s.ti = new double[count][terms][len];
            }
            s.phr = new double[count][len];
            s.phi = new double[count][len];
        }
        er = new double[m];
        ei = new double[m];
        spareR = new double[len];
        spareI = new double[len];
        cur = slots[0];
    }

    /** @return whether the static part was diagonal (no basis change per step) */
    boolean diagonal() {
        return vr == null;
    }

    /** Makes the phases of step size h on the given nodes current (computed unless cached). */
    void phases(double h, double[] nodes) {
        for (Slot s : slots) {
            if (s.h == h && s.nodes == nodes) {
                cur = s;
                return;
            }
        }
        // replace the slot not used last
        Slot s = cur == slots[0] ? slots[1] : slots[0];
        for (int j = 0; j < nodes.length; j++) {
            double off = (nodes[j] - 0.5) * h;
            for (int a = 0; a < m; a++) {
                double x = dc[a] * off;
                er[a] = Math.cos(x);
                ei[a] = Math.sin(x);
            }
            double[] fr = s.phr[j], fi = s.phi[j];
            for (int a = 0; a < m; a++) {
                for (int b = 0; b < m; b++) {
                    int ab = a * m + b;
                    if (a == b) {
                        fr[ab] = 1.0;
                        fi[ab] = 0.0;
                    } else {
                        // e_a conj(e_b): the (b, a) entry is the exact conjugate, so H_I stays Hermitian bit for bit
                        fr[ab] = er[a] * er[b] + ei[a] * ei[b];
                        fi[ab] = ei[a] * er[b] - er[a] * ei[b];
                    }
                }
            }
        }
        if (table) {
            int len = m * m;
            for (int j = 0; j < nodes.length; j++) {
                double[] fr = s.phr[j], fi = s.phi[j];
                for (int k = 0; k < sys.terms; k++) {
                    double[] gr = sys.gr[k], gi = sys.gi[k], or = s.tr[j][k], oi = s.ti[j][k];
                    int[] idx = nz[k];
                    int count = idx == null ? len : idx.length;
                    for (int i = 0; i < count; i++) {
                        int q = idx == null ? i : idx[i];
                        double a = gr[q], b = gi[q], c = fr[q], e = fi[q];
                        or[q] = a * c - b * e;
                        oi[q] = a * e + b * c;
                    }
                }
            }
        }
        s.h = h;
        s.nodes = nodes;
        cur = s;
    }

    /** Node matrices −iH_I(t + c_j h) from the coefficients coef[j] (after {@link #phases}; not on the table route). */
    void nodes(double[][] coef, int count) {
        int len = m * m;
        for (int j = 0; j < count; j++) {
            double[] xr = nr[j], xi = ni[j], fr = cur.phr[j], fi = cur.phi[j];
            sys.combine(coef[j], 0.0, xr, xi);
            for (int q = 0; q < len; q++) {
                double a = xr[q], b = xi[q], c = fr[q], e = fi[q];
                xr[q] = a * c - b * e;
                xi[q] = a * e + b * c;
            }
        }
    }

    /** out = Σ_j s·alpha_j N_j, the node matrices N_j = Σ_k coef[j][k] Φ_j∘G_k (after {@link #phases}). */
    void combination(double s, double[] alpha, double[][] coef, double[] outR, double[] outI) {
        if (table) {
            oneScale[0] = s;
            oneAlpha[0] = alpha;
            oneR[0] = outR;
            oneI[0] = outI;
            combinations(1, oneScale, oneAlpha, coef, oneR, oneI);
            return;
        }
        int len = m * m;
        boolean started = false;
        for (int j = 0; j < alpha.length; j++) {
            double c = s * alpha[j];
            if (c == 0.0) {
                continue;
            }
            double[] xr = nr[j], xi = ni[j];
            if (started) {
                for (int q = 0; q < len; q++) {
                    outR[q] += c * xr[q];
                    outI[q] += c * xi[q];
                }
            } else {
                for (int q = 0; q < len; q++) {
                    outR[q] = c * xr[q];
                    outI[q] = c * xi[q];
                }
                started = true;
            }
        }
        if (!started) {
            java.util.Arrays.fill(outR, 0, len, 0.0);
            java.util.Arrays.fill(outI, 0, len, 0.0);
        }
    }

    /**
     * out_i = Σ_j scale_i·alpha_i[j] N_j for i &lt; count ≤ 4: on the table route in one pass over the phased
     * generators, each nonzero read once for all outputs (a step's node combinations share their generators).
     */
    void combinations(int count, double[] scale, double[][] alpha, double[][] coef, double[][] outR,
                      double[][] outI) {
        if (!table) {
            for (int i = 0; i < count; i++) {
                combination(scale[i], alpha[i], coef, outR[i], outI[i]);
            }
            return;
        }
        int len = m * m, terms = sys.terms;
        double[] o0r = outR[0], o0i = outI[0];
        double[] o1r = count > 1 ? outR[1] : spareR, o1i = count > 1 ? outI[1] : spareI;
        double[] o2r = count > 2 ? outR[2] : spareR, o2i = count > 2 ? outI[2] : spareI;
        double[] o3r = count > 3 ? outR[3] : spareR, o3i = count > 3 ? outI[3] : spareI;
        // one clearing pass for all outputs (the spare ones included): for small m a call to Arrays.fill per array
        // costs more than the stores
        for (int q = 0; q < len; q++) {
            o0r[q] = 0.0;
            o0i[q] = 0.0;
            o1r[q] = 0.0;
            o1i[q] = 0.0;
            o2r[q] = 0.0;
            o2i[q] = 0.0;
            o3r[q] = 0.0;
            o3i[q] = 0.0;
        }
        int nodes = alpha[0].length;
        for (int j = 0; j < nodes; j++) {
            double a0 = scale[0] * alpha[0][j];
            double a1 = count > 1 ? scale[1] * alpha[1][j] : 0.0;
            double a2 = count > 2 ? scale[2] * alpha[2][j] : 0.0;
            double a3 = count > 3 ? scale[3] * alpha[3][j] : 0.0;
            double[] cj = coef[j];
            double[][] tj = cur.tr[j], uj = cur.ti[j];
            for (int k = 0; k < terms; k++) {
                double ck = cj[k], c0 = a0 * ck, c1 = a1 * ck, c2 = a2 * ck, c3 = a3 * ck;
                if (c0 == 0.0 && c1 == 0.0 && c2 == 0.0 && c3 == 0.0) {
                    continue;
                }
                double[] gr = tj[k], gi = uj[k];
                int[] idx = nz[k];
                int n = idx == null ? len : idx.length;
                for (int i = 0; i < n; i++) {
                    int q = idx == null ? i : idx[i];
                    double x = gr[q], y = gi[q];
                    o0r[q] += c0 * x;
                    o0i[q] += c0 * y;
                    o1r[q] += c1 * x;
                    o1i[q] += c1 * y;
                    o2r[q] += c2 * x;
                    o2i[q] += c2 * y;
                    o3r[q] += c3 * x;
                    o3i[q] += c3 * y;
                }
            }
        }
    }

    /**
     * X ← Φ∘X in place with Φ_ab = e^{i(d_a−d_b)s} (diagonal exactly 1, Φ_ba the exact conjugate of Φ_ab): the
     * conjugation e^{iDs} X e^{−iDs}, which keeps an anti-Hermitian X anti-Hermitian bit for bit.
     */
    void conjugate(double s, double[] xr, double[] xi) {
        for (int a = 0; a < m; a++) {
            double x = dc[a] * s;
            er[a] = Math.cos(x);
            ei[a] = Math.sin(x);
        }
        for (int a = 0; a < m; a++) {
            int row = a * m;
            for (int b = 0; b < m; b++) {
                if (a == b) {
                    continue;
                }
                double fr = er[a] * er[b] + ei[a] * ei[b], fi = ei[a] * er[b] - er[a] * ei[b];
                double x = xr[row + b], y = xi[row + b];
                xr[row + b] = fr * x - fi * y;
                xi[row + b] = fr * y + fi * x;
            }
        }
    }

    /** X ← e^{−iDs} X (m×p, rows scaled by the frame's phases; d itself, not the centred energies). */
    void phaseRows(double s, int p, double[] xr, double[] xi) {
        for (int a = 0; a < m; a++) {
            double x = d[a] * s, c = Math.cos(x), sn = -Math.sin(x);
            for (int j = a * p, end = j + p; j < end; j++) {
                double u = xr[j], v = xi[j];
                xr[j] = c * u - sn * v;
                xi[j] = c * v + sn * u;
            }
        }
    }
}
