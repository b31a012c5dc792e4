package org.liepath.integrators.internal.wn;

import org.liepath.core.internal.Dense;
import org.liepath.core.internal.Expm;

/**
 * The numerical data of a Wei–Norman chart U = exp(g_1X_1)…exp(g_mX_m): the basis in its own N×N representation, its
 * Gram matrix (for coordinates of operators in the complex span), the structure constants as m×m adjoint matrices
 * (ad_i)_{lj} = c_{ij}^l with [X_i, X_j] = Σ_l c_{ij}^l X_l, and the closed forms of exp(g·ad X_k) and exp(g X_k).
 *
 * <p>J. Wei, E. Norman, "Lie algebraic solution of linear differential equations", J. Math. Phys. 4 (1963) 575:
 * Σ_k ġ_k Ad(e^{g_1X_1}…e^{g_{k−1}X_{k−1}}) X_k = A(t), written in the adjoint representation as Γ(g) ġ = a(t) with
 * column k of Γ equal to e^{g_1 ad_1}…e^{g_{k−1} ad_{k−1}} e_k.
 *
 * <p>Immutable after construction; per-thread scratch lives in {@link Work}. Not part of the public API.
 */
public final class Chart {
    /** Relative size of a residual outside the span that still counts as inside (rounding of brackets). */
    public static final double SPAN_TOL = 1e-9;

    public final int n, m;
    public final double[][] bRe, bIm;
    public final double[] bNorm;
    private final double[] gInvR, gInvI;
    /** ad_i as planar m×m matrices. */
    public final double[][] adRe, adIm;
    public final ExpForm[] adExp;
    public final FactorExp[] factor;
    private final double[][][] links;

    /** Thrown (internally) with the index of a dependent element or the indices of a bracket outside the span. */
    public static final class Defect extends Exception {
        private static final long serialVersionUID = 1L;
        public final int i, j;
        public final double residual;

        Defect(int i, int j, double residual) {
            super(null, null, false, false);
            this.i = i;
            this.j = j;
            this.residual = residual;
        }
    }

    /**
     * @param n   the representation size N
     * @param bRe real parts of the m basis elements (planar N×N each)
     * @param bIm imaginary parts
     * @throws Defect with j = −1 if element i lies in the span of the elements before it; with (i, j) if [X_i, X_j]
     *                leaves the span
     */
    public Chart(int n, double[][] bRe, double[][] bIm) throws Defect {
        this.n = n;
        this.m = bRe.length;
        this.bRe = bRe;
        this.bIm = bIm;
        int len = n * n;
        bNorm = new double[m];
        for (int k = 0; k < m; k++) {
            bNorm[k] = Dense.frobenius(len, bRe[k], bIm[k]);
        }
        // independence by modified Gram–Schmidt on the flattened elements
        double[][] qr = new double[m][], qi = new double[m][];
        for (int k = 0; k < m; k++) {
            double[] wr = bRe[k].clone(), wi = bIm[k].clone();
            for (int l = 0; l < k; l++) {
                double sr = 0, si = 0;
                for (int e = 0; e < len; e++) {
                    sr += qr[l][e] * wr[e] + qi[l][e] * wi[e];
                    si += qr[l][e] * wi[e] - qi[l][e] * wr[e];
                }
                for (int e = 0; e < len; e++) {
                    wr[e] -= sr * qr[l][e] - si * qi[l][e];
                    wi[e] -= sr * qi[l][e] + si * qr[l][e];
                }
            }
            double r = Dense.frobenius(len, wr, wi);
            if (!(r > SPAN_TOL * bNorm[k])) {
                throw new Defect(k, -1, bNorm[k] == 0 ? 0 : r / bNorm[k]);
            }
            for (int e = 0; e < len; e++) {
                wr[e] /= r;
                wi[e] /= r;
            }
            qr[k] = wr;
            qi[k] = wi;
        }
        double[] gr = new double[m * m], gi = new double[m * m];
        for (int k = 0; k < m; k++) {
            for (int l = 0; l < m; l++) {
                double sr = 0, si = 0;
                for (int e = 0; e < len; e++) {
                    sr += bRe[k][e] * bRe[l][e] + bIm[k][e] * bIm[l][e];
                    si += bRe[k][e] * bIm[l][e] - bIm[k][e] * bRe[l][e];
                }
                gr[k * m + l] = sr;
                gi[k * m + l] = si;
            }
        }
        gInvR = new double[m * m];
        gInvI = new double[m * m];
        Small.invert(m, gr, gi, new int[m], gInvR, gInvI, new double[m], new double[m]);
        // structure constants
        adRe = new double[m][m * m];
        adIm = new double[m][m * m];
        double[] p1r = new double[len], p1i = new double[len], p2r = new double[len], p2i = new double[len];
        double[] cr = new double[m], ci = new double[m];
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++) {
                Dense.mul(n, bRe[i], bIm[i], bRe[j], bIm[j], p1r, p1i);
                Dense.mul(n, bRe[j], bIm[j], bRe[i], bIm[i], p2r, p2i);
                for (int e = 0; e < len; e++) {
                    p1r[e] -= p2r[e];
                    p1i[e] -= p2i[e];
                }
                double res = coordinates(p1r, p1i, cr, ci);
                double scale = bNorm[i] * bNorm[j];
                if (res > SPAN_TOL * scale) {
                    throw new Defect(i, j, res / scale);
                }
                for (int l = 0; l < m; l++) {
                    adRe[i][l * m + j] = cr[l];
                    adIm[i][l * m + j] = ci[l];
                    adRe[j][l * m + i] = -cr[l];
                    adIm[j][l * m + i] = -ci[l];
                }
            }
        }
        // clean rounding noise so that closed forms (nilpotent, diagonal) are recognised
        double big = 0;
        for (int i = 0; i < m; i++) {
            for (int e = 0; e < m * m; e++) {
                big = Math.max(big, Math.hypot(adRe[i][e], adIm[i][e]));
            }
        }
        for (int i = 0; i < m; i++) {
            for (int e = 0; e < m * m; e++) {
                if (Math.abs(adRe[i][e]) <= 1e-13 * big) {
                    adRe[i][e] = 0;
                }
                if (Math.abs(adIm[i][e]) <= 1e-13 * big) {
                    adIm[i][e] = 0;
                }
            }
        }
        adExp = new ExpForm[m];
        factor = new FactorExp[m];
        for (int k = 0; k < m; k++) {
            adExp[k] = new ExpForm(m, adRe[k], adIm[k]);
            factor[k] = new FactorExp(n, bRe[k], bIm[k]);
        }
        // V_k† V_{k+1} for consecutive diagonalised factors: the product of their exponentials then costs one
        // matrix product instead of two
        links = new double[m][][];
        for (int k = 0; k + 1 < m; k++) {
            if (factor[k].isNormal() && factor[k + 1].isNormal()) {
                double[][] a = factor[k].eigenvectorsDagger(), b = factor[k + 1].eigenvectors();
                double[] lr = new double[len], li = new double[len];
                Small.mulLarge(n, a[0], a[1], b[0], b[1], lr, li);
                links[k] = new double[][]{lr, li};
            }
        }
    }

    /**
     * Least-squares coordinates c of Y (planar N×N) in the complex span of the basis.
     *
     * @return the Frobenius norm of the residual Y − Σ c_k X_k
     */
    public double coordinates(double[] yr, double[] yi, double[] cr, double[] ci) {
        int len = n * n;
        double[] br = new double[m], bi = new double[m];
        for (int k = 0; k < m; k++) {
            double sr = 0, si = 0;
            for (int e = 0; e < len; e++) {
                sr += bRe[k][e] * yr[e] + bIm[k][e] * yi[e];
                si += bRe[k][e] * yi[e] - bIm[k][e] * yr[e];
            }
            br[k] = sr;
            bi[k] = si;
        }
        for (int k = 0; k < m; k++) {
            double sr = 0, si = 0;
            for (int l = 0; l < m; l++) {
                sr += gInvR[k * m + l] * br[l] - gInvI[k * m + l] * bi[l];
                si += gInvR[k * m + l] * bi[l] + gInvI[k * m + l] * br[l];
            }
            cr[k] = sr;
            ci[k] = si;
        }
        double s = 0;
        for (int e = 0; e < len; e++) {
            double rr = yr[e], ri = yi[e];
            for (int k = 0; k < m; k++) {
                rr -= cr[k] * bRe[k][e] - ci[k] * bIm[k][e];
                ri -= cr[k] * bIm[k][e] + ci[k] * bRe[k][e];
            }
            s += rr * rr + ri * ri;
        }
        return Math.sqrt(s);
    }

    /** @return true if every ad X_k and every factor exp(g X_k) has a closed form */
    public boolean allClosedForm() {
        for (int k = 0; k < m; k++) {
            if (adExp[k].kind() == ExpForm.Kind.NUMERIC) {
                return false;
            }
        }
        return true;
    }

    /** Scratch for one thread: Γ(g), its LU, solves and the N×N reconstruction. Mutable, not thread-safe. */
    public static final class Work {
        final Chart c;
        final double[] tr, ti, er, ei, sr, si, gamR, gamI, luR, luI, colR, colI, invR, invI;
        final int[] piv;
        final Expm admExp;
        Expm bigExp;
        double[] accR, accI, facR, facI, tmpR, tmpI, scR, scI, dR, dI;

        public Work(Chart c) {
            this.c = c;
            int mm = c.m * c.m;
            tr = new double[mm];
            ti = new double[mm];
            er = new double[mm];
            ei = new double[mm];
            sr = new double[mm];
            si = new double[mm];
            gamR = new double[mm];
            gamI = new double[mm];
            luR = new double[mm];
            luI = new double[mm];
            invR = new double[mm];
            invI = new double[mm];
            colR = new double[c.m];
            colI = new double[c.m];
            piv = new int[c.m];
            admExp = new Expm(c.m);
        }
    }

    /** Fills w.gam with Γ(g) for interleaved coordinates g (length 2m). */
    public void gamma(double[] g, Work w) {
        Small.identity(m, w.tr, w.ti);
        for (int k = 0; k < m; k++) {
            for (int i = 0; i < m; i++) {
                w.gamR[i * m + k] = w.tr[i * m + k];
                w.gamI[i * m + k] = w.ti[i * m + k];
            }
            if (k == m - 1) {
                break;
            }
            double zr = g[2 * k], zi = g[2 * k + 1];
            if (zr == 0 && zi == 0) {
                continue;
            }
            adExp[k].eval(zr, zi, w.er, w.ei, w.admExp, w.sr, w.si);
            Small.mul(m, m, m, w.tr, w.ti, w.er, w.ei, w.sr, w.si);
            System.arraycopy(w.sr, 0, w.tr, 0, m * m);
            System.arraycopy(w.si, 0, w.ti, 0, m * m);
        }
    }

    /**
     * ġ = Γ(g)⁻¹ a for interleaved g and a (length 2m); result into gDot (interleaved).
     *
     * @return false if Γ(g) is singular
     */
    public boolean solve(double[] g, double[] aR, double[] aI, double[] gDot, Work w) {
        gamma(g, w);
        System.arraycopy(w.gamR, 0, w.luR, 0, m * m);
        System.arraycopy(w.gamI, 0, w.luI, 0, m * m);
        if (!Small.lu(m, w.luR, w.luI, w.piv)) {
            return false;
        }
        System.arraycopy(aR, 0, w.colR, 0, m);
        System.arraycopy(aI, 0, w.colI, 0, m);
        Small.luSolve(m, w.luR, w.luI, w.piv, w.colR, w.colI);
        for (int k = 0; k < m; k++) {
            gDot[2 * k] = w.colR[k];
            gDot[2 * k + 1] = w.colI[k];
        }
        return true;
    }

    /** @return κ₁(Γ(g)) = ‖Γ‖₁‖Γ⁻¹‖₁ (infinite if singular) */
    public double condition(double[] g, Work w) {
        gamma(g, w);
        double nrm = Small.norm1(m, m, w.gamR, w.gamI);
        System.arraycopy(w.gamR, 0, w.luR, 0, m * m);
        System.arraycopy(w.gamI, 0, w.luI, 0, m * m);
        if (!Small.invert(m, w.luR, w.luI, w.piv, w.invR, w.invI, w.colR, w.colI)) {
            return Double.POSITIVE_INFINITY;
        }
        double k = nrm * Small.norm1(m, m, w.invR, w.invI);
        return Double.isNaN(k) ? Double.POSITIVE_INFINITY : k;
    }

    /** @return Π_k ‖exp(g_k X_k)‖₁ (bounds), the cancellation amplification of the product in the N×N representation */
    public double growth(double[] g) {
        double p = 1;
        for (int k = 0; k < m; k++) {
            p *= factor[k].growth(g[2 * k], g[2 * k + 1]);
        }
        return p;
    }

    /**
     * out (planar N×N) = exp(g_1X_1)…exp(g_mX_m). Diagonal factors scale columns; a diagonalised factor
     * V diag(e^{gμ}) V† is applied as a product with V (or with the precomputed V_k†V_{k+1} after another such
     * factor), a scaling, and a pending V† flushed at the end. Allocates its scratch in w on first use only.
     */
    public void reconstruct(double[] g, double[] outR, double[] outI, Work w) {
        int len = n * n;
        if (w.accR == null) {
            w.accR = new double[len];
            w.accI = new double[len];
            w.facR = new double[len];
            w.facI = new double[len];
            w.tmpR = new double[len];
            w.tmpI = new double[len];
            w.scR = new double[len];
            w.scI = new double[len];
            w.dR = new double[n];
            w.dI = new double[n];
        }
        if (w.bigExp == null) {
            for (int k = 0; k < m; k++) {
                if (!factor[k].isClosedForm()) {
                    w.bigExp = new Expm(n);
                    break;
                }
            }
        }
        Dense.identity(n, w.accR, w.accI);
        int state = 0; // 0: acc = I, 1: acc diagonal, 2: dense
        int pending = -1; // factor whose V† still multiplies acc from the right
        for (int k = 0; k < m; k++) {
            double zr = g[2 * k], zi = g[2 * k + 1];
            if (zr == 0 && zi == 0) {
                continue;
            }
            FactorExp f = factor[k];
            if (f.isNormal()) {
                double[][] right;
                if (pending >= 0 && pending == k - 1 && links[pending] != null) {
                    right = links[pending];
                } else {
                    state = flush(pending, state, w);
                    right = f.eigenvectors();
                }
                pending = -1;
                state = timesRight(right[0], right[1], state, w);
                f.spectralFactors(zr, zi, w.dR, w.dI);
                scaleColumns(w.accR, w.accI, w.dR, w.dI);
                pending = k;
                continue;
            }
            state = flush(pending, state, w);
            pending = -1;
            if (f.isDiagonal()) {
                f.eval(zr, zi, w.facR, w.facI, w.bigExp, w.scR, w.scI);
                for (int d = 0; d < n; d++) {
                    w.dR[d] = w.facR[d * n + d];
                    w.dI[d] = w.facI[d * n + d];
                }
                scaleColumns(w.accR, w.accI, w.dR, w.dI);
                state = Math.max(state, 1);
            } else {
                f.eval(zr, zi, w.facR, w.facI, w.bigExp, w.scR, w.scI);
                state = timesRight(w.facR, w.facI, state, w);
            }
        }
        flush(pending, state, w);
        System.arraycopy(w.accR, 0, outR, 0, len);
        System.arraycopy(w.accI, 0, outI, 0, len);
    }

    private int flush(int pending, int state, Work w) {
        if (pending < 0) {
            return state;
        }
        double[][] vh = factor[pending].eigenvectorsDagger();
        return timesRight(vh[0], vh[1], state, w);
    }

    /** acc ← acc·(br, bi): a copy if acc = I, a cheap sparse product if acc is diagonal, else a full product. */
    private int timesRight(double[] br, double[] bi, int state, Work w) {
        int len = n * n;
        if (state == 0) {
            System.arraycopy(br, 0, w.accR, 0, len);
            System.arraycopy(bi, 0, w.accI, 0, len);
            return 2;
        }
        if (state == 1) {
            Dense.mul(n, w.accR, w.accI, br, bi, w.tmpR, w.tmpI);
        } else {
            Small.mulLarge(n, w.accR, w.accI, br, bi, w.tmpR, w.tmpI);
        }
        double[] s = w.accR;
        w.accR = w.tmpR;
        w.tmpR = s;
        s = w.accI;
        w.accI = w.tmpI;
        w.tmpI = s;
        return 2;
    }

    private void scaleColumns(double[] ar, double[] ai, double[] dr, double[] di) {
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double xr = ar[i * n + j], xi = ai[i * n + j];
                ar[i * n + j] = xr * dr[j] - xi * di[j];
                ai[i * n + j] = xr * di[j] + xi * dr[j];
            }
        }
    }

}
