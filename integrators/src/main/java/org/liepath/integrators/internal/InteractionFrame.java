package org.liepath.integrators.internal;

import org.liepath.core.internal.Skew3;

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
        /** The same, packed ({@link Skew3}; packed-only frames, which have no planar tables), else null. */
        double[][][] packed;
    }

    /** Nonzero positions of each packed phased generator (real and imaginary part of a pair together; packed-only
     * frames), else null. */
    private final int[][] packedNz;
    /** Planar scratch for packed combinations of a frame that is not packed-only (created on first use). */
    private double[][] scratchR, scratchI;
    /** Packed node matrices of the current step (three levels on the table route), else null. */
    private final double[][] packedNodes;
    /** The packed positions any generator occupies (the union of {@link #packedNz}). */
    private final int[] packedUsed;

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
        this(sys, nodes, table, false);
    }

    /**
     * @param table      whether to use the table route (forced, for tests)
     * @param packedOnly whether the kernel combines node values only packed ({@link #combinationsPacked}; three
     *                   levels on the table route): the planar tables and phases are then never formed
     */
    InteractionFrame(LinearSystem sys, int nodes, boolean table, boolean packedOnly) {
        this.sys = sys;
        this.table = table;
        this.packedOnly = packedOnly && table && sys.m == 3 && sys.skewHermitian;
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
        nr = table ? null : Scratch.rows(count, len);
        ni = table ? null : Scratch.rows(count, len);
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
        packedNz = this.packedOnly ? new int[terms][] : null;
        double[] union = new double[Skew3.LEN];
        if (packedNz != null) {
            double[] g = new double[Skew3.LEN];
            for (int k = 0; k < terms; k++) {
                System.arraycopy(sys.packed[k], 0, g, 0, Skew3.LEN);
                // the phases mix real and imaginary parts of an off-diagonal entry: both are kept if either is set
                for (int q = 3; q < Skew3.LEN; q += 2) {
                    if (g[q] != 0.0 || g[q + 1] != 0.0) {
                        g[q] = 1.0;
                        g[q + 1] = 1.0;
                    }
                }
                packedNz[k] = LinearSystem.nonzeros(g, Skew3.LEN);
                for (int q = 0; q < Skew3.LEN; q++) {
                    union[q] = union[q] != 0.0 || g[q] != 0.0 ? 1.0 : 0.0;
                }
            }
        }
        packedUsed = packedNz != null ? LinearSystem.nonzeros(union, Skew3.LEN) : null;
        packedNodes = packedNz != null ? Scratch.rows(count, Skew3.LEN) : null;
        slotNodes = count;
        er = new double[m];
        ei = new double[m];
        spareR = new double[len];
        spareI = new double[len];
        cur = slots[0];
    }

    /** Node count the slots are sized for. */
    private final int slotNodes;
    /** Whether only packed tables are kept (see the constructor). */
    private final boolean packedOnly;

    /** Sizes a slot's arrays on its first use (a fixed-step run uses one slot only). */
    private void allocate(Slot s) {
        int count = slotNodes, terms = sys.terms, len = m * m;
        if (packedOnly) {
            s.packed = Scratch.rows(count, terms, Skew3.LEN);
            s.phr = NONE;
            return;
        }
        if (table) {
            s.tr = Scratch.rows(count, terms, len);
            s.ti = Scratch.rows(count, terms, len);
        }
        s.phr = Scratch.rows(count, len);
        s.phi = Scratch.rows(count, len);
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
        if (s.phr == null) {
            allocate(s);
        }
        if (packedOnly) {
            packedPhases(s, h, nodes);
            return;
        }
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

    private void requirePlanar() {
        if (packedOnly) {
            throw new IllegalStateException("planar combination on a packed-only frame");
        }
    }

    /** Marks a packed-only slot as allocated (it has no planar phases). */
    private static final double[][] NONE = new double[0][];

    /**
     * The packed phased generators Φ_j∘G_k of step size h, straight from the packed generators: the off-diagonal
     * pair (a, b) times e_a conj(e_b) with e_a = e^{i dc_a (c_j − 1/2) h}, the products of the planar route.
     */
    private void packedPhases(Slot s, double h, double[] nodes) {
        int terms = sys.terms;
        for (int j = 0; j < nodes.length; j++) {
            double off = (nodes[j] - 0.5) * h;
            for (int a = 0; a < 3; a++) {
                double x = dc[a] * off;
                er[a] = Math.cos(x);
                ei[a] = Math.sin(x);
            }
            double f01r = er[0] * er[1] + ei[0] * ei[1], f01i = ei[0] * er[1] - er[0] * ei[1];
            double f02r = er[0] * er[2] + ei[0] * ei[2], f02i = ei[0] * er[2] - er[0] * ei[2];
            double f12r = er[1] * er[2] + ei[1] * ei[2], f12i = ei[1] * er[2] - er[1] * ei[2];
            for (int k = 0; k < terms; k++) {
                double[] g = sys.packed[k], o = s.packed[j][k];
                o[0] = g[0];
                o[1] = g[1];
                o[2] = g[2];
                o[3] = g[3] * f01r - g[4] * f01i;
                o[4] = g[3] * f01i + g[4] * f01r;
                o[5] = g[5] * f02r - g[6] * f02i;
                o[6] = g[5] * f02i + g[6] * f02r;
                o[7] = g[7] * f12r - g[8] * f12i;
                o[8] = g[7] * f12i + g[8] * f12r;
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
        requirePlanar();
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
        requirePlanar();
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
     * out_i = Σ_j scale_i·alpha_i[j] N_j packed ({@link Skew3}), for i &lt; count ≤ 4: {@link #combinations} for
     * three-level Hamiltonian systems, scattering the nonzeros of the packed phased generators (a frame that is not
     * packed-only packs its planar combinations).
     */
    void combinationsPacked(int count, double[] scale, double[][] alpha, double[][] coef, double[][] out) {
        if (!packedOnly) {
            if (scratchR == null) {
                scratchR = Scratch.rows(4, m * m);
                scratchI = Scratch.rows(4, m * m);
            }
            combinations(count, scale, alpha, coef, scratchR, scratchI);
            for (int i = 0; i < count; i++) {
                Skew3.pack(scratchR[i], scratchI[i], out[i]);
            }
            return;
        }
        int nodes = alpha[0].length, terms = sys.terms;
        int[] used = packedUsed;
        // node matrices first (a scatter of the few nonzeros), then each output as a sum over the nodes at the
        // positions some generator occupies (the others stay zero); plain loops: for nine entries a call to
        // Arrays.fill and the for-each over the index arrays cost more than the arithmetic (measured 2×)
        for (int j = 0; j < nodes; j++) {
            double[] nj = packedNodes[j], cj = coef[j];
            double[][] tj = cur.packed[j];
            for (int q = 0; q < Skew3.LEN; q++) {
                nj[q] = 0.0;
            }
            for (int k = 0; k < terms; k++) {
                double ck = cj[k];
                double[] g = tj[k];
                int[] idx = packedNz[k];
                for (int i = 0; i < idx.length; i++) {
                    int q = idx[i];
                    nj[q] += ck * g[q];
                }
            }
        }
        if (count == 4 && nodes == 4) {
            fourByFour(scale, alpha, out);
            return;
        }
        for (int i = 0; i < count; i++) {
            double[] o = out[i], row = alpha[i];
            double sc = scale[i];
            for (int q = 0; q < Skew3.LEN; q++) {
                o[q] = 0.0;
            }
            for (int j = 0; j < nodes; j++) {
                double c = sc * row[j];
                double[] nj = packedNodes[j];
                for (int u = 0; u < used.length; u++) {
                    int q = used[u];
                    o[q] += c * nj[q];
                }
            }
        }
    }

    /**
     * The four outputs of four nodes (Magnus 8) in one pass over the entries, the sixteen weights in registers: the
     * general loops cost twice as much for this size, spent on their indexing rather than the 144 multiply–adds.
     */
    private void fourByFour(double[] scale, double[][] alpha, double[][] out) {
        double[] r0 = alpha[0], r1 = alpha[1], r2 = alpha[2], r3 = alpha[3];
        double s0 = scale[0], s1 = scale[1], s2 = scale[2], s3 = scale[3];
        double c00 = s0 * r0[0], c01 = s0 * r0[1], c02 = s0 * r0[2], c03 = s0 * r0[3];
        double c10 = s1 * r1[0], c11 = s1 * r1[1], c12 = s1 * r1[2], c13 = s1 * r1[3];
        double c20 = s2 * r2[0], c21 = s2 * r2[1], c22 = s2 * r2[2], c23 = s2 * r2[3];
        double c30 = s3 * r3[0], c31 = s3 * r3[1], c32 = s3 * r3[2], c33 = s3 * r3[3];
        double[] n0 = packedNodes[0], n1 = packedNodes[1], n2 = packedNodes[2], n3 = packedNodes[3];
        double[] o0 = out[0], o1 = out[1], o2 = out[2], o3 = out[3];
        for (int q = 0; q < Skew3.LEN; q++) {
            double x0 = n0[q], x1 = n1[q], x2 = n2[q], x3 = n3[q];
            o0[q] = c00 * x0 + c01 * x1 + c02 * x2 + c03 * x3;
            o1[q] = c10 * x0 + c11 * x1 + c12 * x2 + c13 * x3;
            o2[q] = c20 * x0 + c21 * x1 + c22 * x2 + c23 * x3;
            o3[q] = c30 * x0 + c31 * x1 + c32 * x2 + c33 * x3;
        }
    }

    /** x ← Φ∘x for a packed x ({@link Skew3}): {@link #conjugate} for three levels. */
    void conjugatePacked(double s, double[] x) {
        Skew3.conjugate(x, dc[0] * s, dc[1] * s, dc[2] * s);
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
