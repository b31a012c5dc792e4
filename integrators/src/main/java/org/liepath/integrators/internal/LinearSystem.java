package org.liepath.integrators.internal;

import org.liepath.core.internal.Skew3;

import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;

/**
 * The linear equation X' = A(t) X with A(t) = Σ_k c_k(t) G_k + G_0, the one form every scheme works on.
 *
 * <p>For a Hamiltonian H(t) = Σ c_k(t) A_k the generators are G_k = −i A_k and G_0 = 0 (so every exponential of a
 * real combination is unitary to rounding). For a GKLS generator in Liouville space (column stacking) G_k is the
 * matrix of ρ ↦ −i[A_k, ρ] and G_0 the dissipator. Matrices are planar row-major.
 *
 * <p>Immutable after construction and safe to share between threads; the coefficient source must be pure.
 */
public final class LinearSystem {
    /** Source of the coefficients c_k(t); may throw (e.g. a drive failure). */
    @FunctionalInterface
    public interface Coefficients {
        void at(double t, double[] out);
    }

    final int m;
    final int terms;
    final double[][] gr, gi;
    /** Constant part G_0, or null. */
    final double[] g0r, g0i;
    private final Coefficients source;
    final double[] breakpoints;
    final boolean piecewiseConstant;
    final boolean skewHermitian;
    /**
     * The interaction-picture frame (see {@link #interaction}): energies of the static part in the basis the
     * generators are written in, or null for the Schrödinger picture.
     */
    final double[] frameEnergies;
    /** Eigenvectors V of the static part (columns) and V†, planar; null when the static part is diagonal. */
    final double[] frameVr, frameVi, frameVhr, frameVhi;

    private LinearSystem(int m, double[][] gr, double[][] gi, double[] g0r, double[] g0i, Coefficients source,
                         double[] breakpoints, boolean piecewiseConstant, boolean skewHermitian) {
        this(m, gr, gi, g0r, g0i, source, breakpoints, piecewiseConstant, skewHermitian, null, null, null, null, null);
    }

    private LinearSystem(int m, double[][] gr, double[][] gi, double[] g0r, double[] g0i, Coefficients source,
                         double[] breakpoints, boolean piecewiseConstant, boolean skewHermitian,
                         double[] frameEnergies, double[] frameVr, double[] frameVi, double[] frameVhr,
                         double[] frameVhi) {
        this.frameEnergies = frameEnergies;
        this.frameVr = frameVr;
        this.frameVi = frameVi;
        this.frameVhr = frameVhr;
        this.frameVhi = frameVhi;
        this.m = m;
        this.terms = gr.length;
        this.gr = gr;
        this.gi = gi;
        this.g0r = g0r;
        this.g0i = g0i;
        this.source = source;
        this.breakpoints = breakpoints;
        this.piecewiseConstant = piecewiseConstant;
        this.skewHermitian = skewHermitian;
        int n = generators(), len = m * m;
        if (m == 3 && skewHermitian) {
            packed = Scratch.rows(terms, Skew3.LEN);
            packedNz = new int[terms][];
            for (int k = 0; k < terms; k++) {
                Skew3.pack(gr[k], gi[k], packed[k]);
                packedNz[k] = nonzeros(packed[k], Skew3.LEN);
            }
            packed0 = g0r == null ? null : new double[Skew3.LEN];
            if (packed0 != null) {
                Skew3.pack(g0r, g0i, packed0);
            }
        } else {
            packed = null;
            packedNz = null;
            packed0 = null;
        }
        spRe = new int[n][];
        spIm = new int[n][];
        for (int k = 0; k < n; k++) {
            int[] re = nonzeros(generatorRe(k), len), im = nonzeros(generatorIm(k), len);
            if (re.length + im.length <= len / 2) {
                spRe[k] = re;
                spIm[k] = im;
            }
        }
    }

    /**
     * Indices of the nonzero entries of each generator's two planes when together they fill at most a quarter of
     * them (null otherwise): Hamiltonians built from Pauli strings, ladder operators or level projectors, and their
     * Liouville-space commutators, have a few nonzeros per row, and −i·(real symmetric) leaves a whole plane zero.
     * {@link #combine} then scatters these entries instead of sweeping all m² of them.
     */
    private final int[][] spRe, spIm;

    /**
     * Three-level Hamiltonian systems: the driven generators and G_0 (null if none) packed ({@link Skew3}), with
     * the nonzero positions of each packed generator; null for every other system.
     */
    final double[][] packed;
    final double[] packed0;
    final int[][] packedNz;

    /** @return the positions of the nonzero entries among the first len of x */
    static int[] nonzeros(double[] x, int len) {
        int count = 0;
        for (int q = 0; q < len; q++) {
            if (x[q] != 0.0) {
                count++;
            }
        }
        int[] idx = new int[count];
        for (int q = 0, j = 0; q < len; q++) {
            if (x[q] != 0.0) {
                idx[j++] = q;
            }
        }
        return idx;
    }

    /**
     * X' = −i H(t) X. When two or more terms have a constant drive (piecewise constant without breakpoints), they
     * are folded into G_0 = −i Σ c_k A_k, so the schemes combine, and the stored generator pairs pair, only the driven
     * terms and G_0: a Hamiltonian written as many static terms plus a few drives costs per step what the drives
     * plus one generator cost.
     * A constant drive that throws or is not finite when evaluated here stays a driven term, so that the run reports
     * it with its time.
     */
    public static LinearSystem of(Hamiltonian h) {
        return PLAIN.get(h, LinearSystem::build);
    }

    /**
     * The system of the last generator seen: Hamiltonians and Lindbladians are immutable and so is a system (nothing
     * writes into its arrays after construction, and its coefficient source is the generator's own), so the runs of
     * one generator, in any thread, share it instead of rebuilding it per run (on a three-level system building it
     * took about a fifth of a one-step run). Identity, not equality, keys the entry; one entry per kind of system.
     */
    private static final class LastSeen<K> {
        /** {key, system}, replaced whole so that readers never see a key with another key's system. */
        private volatile Object[] entry;

        LinearSystem get(K key, java.util.function.Function<K, LinearSystem> build) {
            Object[] e = entry;
            if (e != null && e[0] == key) {
                return (LinearSystem) e[1];
            }
            LinearSystem sys = build.apply(key);
            if (sys.m <= SHARE_MAX_DIM) {
                entry = new Object[]{key, sys};
            }
            return sys;
        }
    }

    /**
     * Largest dimension whose system is kept for sharing: building a larger one costs little against its run, and
     * keeping it (a Liouville-space system of a few dozen levels holds hundreds of megabytes) would hold memory the
     * caller has let go of.
     */
    static final int SHARE_MAX_DIM = 64;

    private static final LastSeen<Hamiltonian> PLAIN = new LastSeen<>(), FRAME = new LastSeen<>();
    private static final LastSeen<Lindbladian> OPEN = new LastSeen<>();

    private static LinearSystem build(Hamiltonian h) {
        int n = h.dim(), L = h.size(), len = n * n;
        java.util.List<org.liepath.core.Drive> drives = h.drives();
        double[] value = new double[L];
        int constants = 0;
        for (int k = 0; k < L; k++) {
            value[k] = constantValue(drives.get(k));
            constants += Double.isNaN(value[k]) ? 0 : 1;
        }
        if (constants < 2) {
            // folding a single constant term would only rename it G_0 and add the subset evaluation's checks
            java.util.Arrays.fill(value, Double.NaN);
        }
        int[] driven = new int[L];
        int count = 0;
        double[] g0r = null, g0i = null;
        for (int k = 0; k < L; k++) {
            double c = value[k];
            if (Double.isNaN(c)) {
                driven[count++] = k;
                continue;
            }
            if (g0r == null) {
                g0r = new double[len];
                g0i = new double[len];
            }
            Operator a = h.operators().get(k);
            double[] re = a.reArray(), im = a.imArray();
            // −i c (re + i im) = c im − i c re
            for (int q = 0; q < len; q++) {
                g0r[q] += c * im[q];
                g0i[q] -= c * re[q];
            }
        }
        int[] idx = java.util.Arrays.copyOf(driven, count);
        double[][] gr = new double[count][], gi = new double[count][];
        for (int j = 0; j < count; j++) {
            Operator a = h.operators().get(idx[j]);
            double[] re = a.reArray(), im = a.imArray();
            gr[j] = im;
            gi[j] = new double[len];
            for (int q = 0; q < len; q++) {
                gi[j][q] = -re[q];
            }
        }
        Coefficients source = count == L ? h::coefficients : (t, out) -> h.coefficients(t, idx, out);
        return new LinearSystem(n, gr, gi, g0r, g0i, source, h.breakpoints(), h.isPiecewiseConstant(), true);
    }

    /**
     * X' = −i H(t) X in the interaction picture of the static part H_0 = Σ c_k A_k over the terms with a constant
     * drive (as in {@link #of(Hamiltonian)}, a constant drive that fails or is not finite stays driven). With
     * H_0 = V diag(d) V† (V = I when H_0 is diagonal, else from the Hermitian eigendecomposition) the generators of
     * the returned system are those of the driven terms in the eigenbasis, G_k = −i V† A_k V, with no G_0; the
     * kernels put the phases e^{±i d s} of the frame around them ({@link Kernel}). Without a constant term the
     * Schrödinger-picture system is returned (the frame would be the identity).
     */
    public static LinearSystem interaction(Hamiltonian h) {
        return FRAME.get(h, LinearSystem::buildInteraction);
    }

    private static LinearSystem buildInteraction(Hamiltonian h) {
        int n = h.dim(), L = h.size(), len = n * n;
        java.util.List<org.liepath.core.Drive> drives = h.drives();
        double[] h0r = new double[len], h0i = new double[len];
        int[] driven = new int[L];
        int count = 0;
        boolean anyStatic = false;
        for (int k = 0; k < L; k++) {
            double c = constantValue(drives.get(k));
            if (Double.isNaN(c)) {
                driven[count++] = k;
                continue;
            }
            anyStatic = true;
            Operator a = h.operators().get(k);
            double[] re = a.reArray(), im = a.imArray();
            for (int q = 0; q < len; q++) {
                h0r[q] += c * re[q];
                h0i[q] += c * im[q];
            }
        }
        if (!anyStatic) {
            return of(h);
        }
        boolean diagonal = true;
        for (int i = 0; i < n && diagonal; i++) {
            for (int j = 0; j < n; j++) {
                if (i != j && (h0r[i * n + j] != 0.0 || h0i[i * n + j] != 0.0)) {
                    diagonal = false;
                    break;
                }
            }
        }
        double[] d = new double[n], vr = null, vi = null, vhr = null, vhi = null;
        if (diagonal) {
            for (int i = 0; i < n; i++) {
                d[i] = h0r[i * n + i];
            }
        } else {
            vr = new double[len];
            vi = new double[len];
            if (!new org.liepath.core.internal.HermitianEigen(n).compute(h0r, h0i, d, vr, vi)) {
                throw new ArithmeticException("the eigendecomposition of the static part did not converge");
            }
            orthonormalizeColumns(n, vr, vi);
            vhr = new double[len];
            vhi = new double[len];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    vhr[i * n + j] = vr[j * n + i];
                    vhi[i * n + j] = -vi[j * n + i];
                }
            }
        }
        int[] idx = java.util.Arrays.copyOf(driven, count);
        double[][] gr = new double[count][], gi = new double[count][];
        double[] tr = new double[len], ti = new double[len], ur = new double[len], ui = new double[len];
        for (int j = 0; j < count; j++) {
            Operator a = h.operators().get(idx[j]);
            double[] re = a.reArray(), im = a.imArray();
            if (!diagonal) {
                // A' = V† A V
                org.liepath.core.internal.Dense.mul(n, re, im, vr, vi, tr, ti);
                org.liepath.core.internal.Dense.mul(n, vhr, vhi, tr, ti, ur, ui);
                // Hermitian only to rounding: take the Hermitian part, so that every exponent the schemes form is
                // anti-Hermitian bit for bit, as in the Schrödinger picture
                for (int i = 0; i < n; i++) {
                    ui[i * n + i] = 0.0;
                    for (int l = i + 1; l < n; l++) {
                        double xr = 0.5 * (ur[i * n + l] + ur[l * n + i]), xi = 0.5 * (ui[i * n + l] - ui[l * n + i]);
                        ur[i * n + l] = xr;
                        ui[i * n + l] = xi;
                        ur[l * n + i] = xr;
                        ui[l * n + i] = -xi;
                    }
                }
                re = ur;
                im = ui;
            }
            // −i (re + i im) = im − i re
            gr[j] = im.clone();
            gi[j] = new double[len];
            for (int q = 0; q < len; q++) {
                gi[j][q] = -re[q];
            }
        }
        Coefficients source = (t, out) -> h.coefficients(t, idx, out);
        return new LinearSystem(n, gr, gi, null, null, source, h.breakpoints(), h.isPiecewiseConstant(), true, d, vr,
                vi, vhr, vhi);
    }

    /**
     * Gram–Schmidt on the columns of V, twice ("twice is enough": L. Giraud, J. Langou, M. Rozložník, Comput. Math.
     * Appl. 50 (2005) 1069–1075): the eigenvectors come unitary to a few ulps times n, and the frame's basis change
     * enters a run once and leaves it once, so its defect lands on the result whole (measured at n = 64: 3.9e-14
     * before, against the 1e-14 the Schrödinger-picture schemes keep). The columns move by that defect only, far
     * below the eigendecomposition's own residual.
     */
    private static void orthonormalizeColumns(int n, double[] vr, double[] vi) {
        for (int pass = 0; pass < 2; pass++) {
            for (int j = 0; j < n; j++) {
                for (int k = 0; k < j; k++) {
                    double cr = 0, ci = 0;
                    for (int i = 0; i < n; i++) {
                        // conj(v_k) · v_j
                        double ar = vr[i * n + k], ai = vi[i * n + k], br = vr[i * n + j], bi = vi[i * n + j];
                        cr += ar * br + ai * bi;
                        ci += ar * bi - ai * br;
                    }
                    for (int i = 0; i < n; i++) {
                        double ar = vr[i * n + k], ai = vi[i * n + k];
                        vr[i * n + j] -= cr * ar - ci * ai;
                        vi[i * n + j] -= cr * ai + ci * ar;
                    }
                }
                double norm = 0;
                for (int i = 0; i < n; i++) {
                    norm += vr[i * n + j] * vr[i * n + j] + vi[i * n + j] * vi[i * n + j];
                }
                double inv = 1.0 / Math.sqrt(norm);
                for (int i = 0; i < n; i++) {
                    vr[i * n + j] *= inv;
                    vi[i * n + j] *= inv;
                }
            }
        }
    }

    /** @return whether this system is written in the interaction picture of a static part (see {@link #interaction}) */
    public boolean isInteractionPicture() {
        return frameEnergies != null;
    }

    /** The value of a constant drive, or NaN if it is not constant (or fails, or is not finite, at t = 0). */
    private static double constantValue(org.liepath.core.Drive d) {
        if (!d.isPiecewiseConstant() || d.breakpoints().length > 0) {
            return Double.NaN;
        }
        try {
            double v = d.at(0.0);
            return Double.isFinite(v) ? v : Double.NaN;
        } catch (RuntimeException e) {
            return Double.NaN;
        }
    }

    /** v' = S(t) v in Liouville space (column stacking), S(t) = Σ c_k(t)(−i(I⊗A_k − A_kᵀ⊗I)) + dissipator. */
    public static LinearSystem of(Lindbladian l) {
        return OPEN.get(l, LinearSystem::build);
    }

    private static LinearSystem build(Lindbladian l) {
        Hamiltonian h = l.hamiltonian();
        int L = h.size();
        double[][] gr = new double[L][], gi = new double[L][];
        for (int k = 0; k < L; k++) {
            Operator s = Lindbladian.hamiltonianPart(h.operators().get(k));
            gr[k] = s.reArray();
            gi[k] = s.imArray();
        }
        Operator d = l.dissipator().matrix();
        boolean anyDissipation = d.norm() > 0;
        int m = h.dim() * h.dim();
        return new LinearSystem(m, gr, gi, anyDissipation ? d.reArray() : null, anyDissipation ? d.imArray() : null,
                h::coefficients, h.breakpoints(), h.isPiecewiseConstant(), !anyDissipation);
    }

    /**
     * A general system (used by tests of coefficient tables): generators G_k (planar, m×m, not copied) with
     * coefficients from source.
     */
    public static LinearSystem general(int m, double[][] gr, double[][] gi, Coefficients source) {
        return new LinearSystem(m, gr, gi, null, null, source, new double[0], false, false);
    }

    /** @return the dimension m of X (m×m) */
    public int dim() {
        return m;
    }

    /** @return the number of driven terms */
    public int terms() {
        return terms;
    }

    /** @return interior non-smooth times of the coefficients, ascending (shared; do not modify) */
    public double[] breakpoints() {
        return breakpoints;
    }

    /** @return whether all coefficients are piecewise constant */
    public boolean isPiecewiseConstant() {
        return piecewiseConstant;
    }

    /** @return whether every real combination of generators is anti-Hermitian (exponentials are unitary) */
    public boolean isSkewHermitian() {
        return skewHermitian;
    }

    /** out[k] = c_k(t). */
    public void coefficients(double t, double[] out) {
        source.at(t, out);
    }

    /** out = Σ_k w_k G_k + w0 G_0 (planar m×m). */
    public void combine(double[] w, double w0, double[] outR, double[] outI) {
        sum(w, w0, outR, outI);
    }

    /**
     * out_j = Σ_k weights[j][k] G_k for j &lt; count, with the weights indexed over {@link #generators()} (G_0 last
     * when present), each by {@link #sum}, so {@link #combine} gives the same bits for the same weights.
     */
    void combineAll(int count, double[][] weights, double[][] outR, double[][] outI) {
        boolean g0 = g0r != null;
        for (int j = 0; j < count; j++) {
            double[] wj = weights[j];
            sum(wj, g0 ? wj[terms] : 0.0, outR[j], outI[j]);
        }
    }

    /**
     * out = Σ_{k &lt; terms} wk[k] G_k + w0 G_0 over the nonzero weights, in index order (G_0 last). When one of
     * them is stored sparse, out is cleared and every term added (sparse ones scattered): each entry receives the
     * same nonzero addends in the same order as in a dense sweep, so the value is the same up to the sign of an
     * exact zero. Otherwise the first term assigns and the others add. A non-finite weight poisons only the
     * entries its generator touches, which is enough for the non-finite check of the step that follows.
     */
    private void sum(double[] wk, double w0, double[] oR, double[] oI) {
        int len = m * m, n = generators();
        boolean anySparse = false, any = false;
        for (int k = 0; k < n; k++) {
            if ((k < terms ? wk[k] : w0) != 0.0) {
                any = true;
                anySparse |= spRe[k] != null;
            }
        }
        if (!any || anySparse) {
            java.util.Arrays.fill(oR, 0, len, 0.0);
            java.util.Arrays.fill(oI, 0, len, 0.0);
        }
        boolean started = anySparse;
        for (int k = 0; k < n; k++) {
            double c = k < terms ? wk[k] : w0;
            if (c == 0.0) {
                continue;
            }
            double[] r = generatorRe(k), i = generatorIm(k);
            int[] sr = spRe[k];
            if (sr != null) {
                for (int q : sr) {
                    oR[q] += c * r[q];
                }
                for (int q : spIm[k]) {
                    oI[q] += c * i[q];
                }
            } else {
                axpy(started, c, r, i, oR, oI, len);
                started = true;
            }
        }
    }

    /** out = c·G (assign) or out += c·G (add). */
    private static void axpy(boolean add, double c, double[] r, double[] i, double[] outR, double[] outI, int len) {
        if (add) {
            for (int q = 0; q < len; q++) {
                outR[q] += c * r[q];
                outI[q] += c * i[q];
            }
        } else {
            for (int q = 0; q < len; q++) {
                outR[q] = c * r[q];
                outI[q] = c * i[q];
            }
        }
    }

    /** @return the number of generators with a weight of their own: the driven terms, then G_0 if present */
    int generators() {
        return g0r == null ? terms : terms + 1;
    }

    /** @return the real part of generator k (k = terms is G_0) */
    double[] generatorRe(int k) {
        return k < terms ? gr[k] : g0r;
    }

    /** @return the imaginary part of generator k (k = terms is G_0) */
    double[] generatorIm(int k) {
        return k < terms ? gi[k] : g0i;
    }
}
