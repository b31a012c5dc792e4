package org.liepath.integrators.internal.wn;

import org.liepath.core.internal.Expm;

import java.util.Arrays;

/**
 * exp(z·X) for one chart element X in the chart's own N×N representation, in closed form where X's structure allows:
 * diagonal (N exponentials), a single off-diagonal band (a ladder operator such as J±: the exponential is the finite
 * sum Σ_q z^q X^q/q!, whose entries are products along the band), strictly triangular (nilpotent: Horner's rule on
 * the finite Taylor polynomial), otherwise Padé scaling and squaring. Also a cheap bound of ‖exp(zX)‖, used to
 * re-anchor a chart before the product of factors loses accuracy to cancellation.
 *
 * <p>Immutable; evaluation takes caller-owned scratch. Not part of the public API.
 */
public final class FactorExp {
    enum Kind { ZERO, DIAGONAL, BAND, TRIANGULAR, NORMAL, GENERAL }

    private final int n;
    private final Kind kind;
    private final double[] xr, xi;
    private final int offset;      // BAND: column − row of the band
    private final int index;       // TRIANGULAR: nilpotency index p (X^p = 0)
    private final double[] powerNorms; // TRIANGULAR: ‖X^q‖₁/q!
    private final double norm1;
    private final boolean antiHermitian, hermitian;
    // NORMAL: X = V diag(μ) V† with μ = λ (Hermitian X) or −iλ (anti-Hermitian X = −iA, A = V diag(λ) V†)
    private final double[] lam, vr, vi, vhr, vhi;

    /** Analyses X (planar N×N, copied). */
    public FactorExp(int n, double[] re, double[] im) {
        this.n = n;
        this.xr = re.clone();
        this.xi = im.clone();
        this.norm1 = Small.norm1(n, n, xr, xi);
        int off = Integer.MIN_VALUE;
        boolean band = true, upper = true, lower = true, diag = true;
        double defA = 0, defH = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double a = xr[i * n + j], b = xi[i * n + j];
                defA = Math.max(defA, Math.hypot(a + xr[j * n + i], b - xi[j * n + i]));
                defH = Math.max(defH, Math.hypot(a - xr[j * n + i], b + xi[j * n + i]));
                if (a == 0 && b == 0) {
                    continue;
                }
                if (i != j) {
                    diag = false;
                }
                if (j <= i) {
                    upper = false;
                }
                if (j >= i) {
                    lower = false;
                }
                if (off == Integer.MIN_VALUE) {
                    off = j - i;
                } else if (off != j - i) {
                    band = false;
                }
            }
        }
        double scale = Math.max(1e-300, norm1);
        antiHermitian = defA <= 1e-14 * scale;
        hermitian = defH <= 1e-14 * scale;
        int p = 0;
        double[] pn = null;
        if (norm1 == 0) {
            kind = Kind.ZERO;
        } else if (diag) {
            kind = Kind.DIAGONAL;
        } else if (band) {
            kind = Kind.BAND;
        } else if (upper || lower) {
            kind = Kind.TRIANGULAR;
            double[] pr = xr.clone(), pi = xi.clone(), tr = new double[n * n], ti = new double[n * n];
            double[] tmp = new double[n + 1];
            tmp[0] = 1;
            tmp[1] = norm1;
            p = 1;
            double fact = 1;
            while (p < n) {
                Small.mul(n, n, n, pr, pi, xr, xi, tr, ti);
                p++;
                fact *= p;
                double nq = Small.norm1(n, n, tr, ti);
                if (nq == 0) {
                    break;
                }
                tmp[p] = nq / fact;
                double[] s = pr;
                pr = tr;
                tr = s;
                s = pi;
                pi = ti;
                ti = s;
            }
            // X^p = 0 for p = n at the latest (strictly triangular)
            pn = Arrays.copyOf(tmp, p);
        } else if (hermitian || antiHermitian) {
            kind = Kind.NORMAL;
        } else {
            kind = Kind.GENERAL;
        }
        if (kind == Kind.NORMAL) {
            // diagonalise once (Householder + implicit QL): each exp(zX) is then V·diag·V†, no Padé
            double[] ar = xr.clone(), ai = xi.clone();
            if (!hermitian) {
                // A = iX is Hermitian
                for (int e = 0; e < n * n; e++) {
                    ar[e] = -xi[e];
                    ai[e] = xr[e];
                }
            }
            lam = new double[n];
            vr = new double[n * n];
            vi = new double[n * n];
            new org.liepath.core.internal.HermitianEigen(n).compute(ar, ai, lam, vr, vi);
            vhr = new double[n * n];
            vhi = new double[n * n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    vhr[j * n + i] = vr[i * n + j];
                    vhi[j * n + i] = -vi[i * n + j];
                }
            }
        } else {
            lam = vr = vi = vhr = vhi = null;
        }
        this.offset = off;
        this.index = p;
        this.powerNorms = pn;
    }

    /** @return the matrix size N */
    public int dim() {
        return n;
    }

    /** @return true if exp(zX) is evaluated without Padé (diagonal, ladder band or strictly triangular) */
    public boolean isClosedForm() {
        return kind != Kind.GENERAL;
    }

    /** @return true if X was diagonalised once: exp(zX) = V diag(e^{zμ}) V† */
    public boolean isNormal() {
        return kind == Kind.NORMAL;
    }

    /** NORMAL kind: the eigenvector matrix V (planar; not to be modified). */
    double[][] eigenvectors() {
        return new double[][]{vr, vi};
    }

    /** NORMAL kind: V† (planar; not to be modified). */
    double[][] eigenvectorsDagger() {
        return new double[][]{vhr, vhi};
    }

    /** NORMAL kind: d_k = e^{zμ_k} into (dr, di), length N. */
    void spectralFactors(double zr, double zi, double[] dr, double[] di) {
        for (int k = 0; k < n; k++) {
            double ar = hermitian ? zr * lam[k] : zi * lam[k];
            double ai = hermitian ? zi * lam[k] : -zr * lam[k];
            double e = Math.exp(ar);
            dr[k] = e * Math.cos(ai);
            di[k] = e * Math.sin(ai);
        }
    }

    /** @return true if X is diagonal (exp(zX) acts by scaling columns) */
    public boolean isDiagonal() {
        return kind == Kind.DIAGONAL;
    }

    /** @return a short description of the closed form used */
    public String describe() {
        switch (kind) {
            case ZERO:
                return "identity";
            case DIAGONAL:
                return "diagonal";
            case BAND:
                return "band at offset " + offset + " (finite polynomial)";
            case TRIANGULAR:
                return "nilpotent of index " + index + " (finite polynomial)";
            case NORMAL:
                return "unitary diagonalisation V diag(e^{z mu}) V^H";
            default:
                return "Padé scaling and squaring";
        }
    }

    /**
     * An upper bound of ‖exp(zX)‖₁ (exact for the diagonal and band kinds). O(N²) at most; allocates nothing.
     */
    public double growth(double zr, double zi) {
        switch (kind) {
            case ZERO:
                return 1;
            case DIAGONAL: {
                double best = 0;
                for (int k = 0; k < n; k++) {
                    best = Math.max(best, Math.exp(zr * xr[k * n + k] - zi * xi[k * n + k]));
                }
                return best;
            }
            case BAND: {
                double az = Math.hypot(zr, zi), best = 0;
                // column c: entries at rows c − q·offset
                for (int c = 0; c < n; c++) {
                    double s = 1, term = 1;
                    int row = c;
                    for (int q = 1; ; q++) {
                        int prev = row;
                        row -= offset;
                        if (row < 0 || row >= n) {
                            break;
                        }
                        term *= az * Math.hypot(xr[row * n + prev], xi[row * n + prev]) / q;
                        s += term;
                    }
                    best = Math.max(best, s);
                }
                return best;
            }
            case TRIANGULAR: {
                double az = Math.hypot(zr, zi), s = 0, pw = 1;
                for (double v : powerNorms) {
                    s += v * pw;
                    pw *= az;
                }
                return s;
            }
            case NORMAL: {
                // exact spectral norm max_k |e^{z μ_k}|
                double best = 0;
                for (int k = 0; k < n; k++) {
                    best = Math.max(best, Math.exp(hermitian ? zr * lam[k] : zi * lam[k]));
                }
                return best;
            }
            default:
                if (antiHermitian) {
                    return Math.sqrt(n) * Math.exp(Math.abs(zi) * norm1);
                }
                if (hermitian) {
                    return Math.sqrt(n) * Math.exp(Math.abs(zr) * norm1);
                }
                return Math.exp(Math.hypot(zr, zi) * norm1);
        }
    }

    /**
     * out = exp(zX). ws: an {@link Expm} of size N (GENERAL kind only); sr/si: scratch of length N² (TRIANGULAR and
     * GENERAL kinds). Outputs must not alias the scratch. Allocates nothing.
     */
    public void eval(double zr, double zi, double[] outR, double[] outI, Expm ws, double[] sr, double[] si) {
        int len = n * n;
        switch (kind) {
            case ZERO:
                Small.identity(n, outR, outI);
                return;
            case DIAGONAL:
                Arrays.fill(outR, 0, len, 0.0);
                Arrays.fill(outI, 0, len, 0.0);
                for (int k = 0; k < n; k++) {
                    double ar = zr * xr[k * n + k] - zi * xi[k * n + k];
                    double ai = zr * xi[k * n + k] + zi * xr[k * n + k];
                    double e = Math.exp(ar);
                    outR[k * n + k] = e * Math.cos(ai);
                    outI[k * n + k] = e * Math.sin(ai);
                }
                return;
            case BAND:
                Small.identity(n, outR, outI);
                for (int c = 0; c < n; c++) {
                    double tr = 1, ti = 0;
                    int row = c;
                    for (int q = 1; ; q++) {
                        int prev = row;
                        row -= offset;
                        if (row < 0 || row >= n) {
                            break;
                        }
                        // entry(row, c) = entry(prev, c) · z · X(row, prev) / q
                        double ar = xr[row * n + prev], ai = xi[row * n + prev];
                        double ur = zr * ar - zi * ai, ui = zr * ai + zi * ar;
                        double nr = (tr * ur - ti * ui) / q, ni = (tr * ui + ti * ur) / q;
                        tr = nr;
                        ti = ni;
                        outR[row * n + c] = tr;
                        outI[row * n + c] = ti;
                    }
                }
                return;
            case TRIANGULAR:
                // Horner: R = I + (z/k) X R for k = p−1 … 1
                Small.identity(n, outR, outI);
                for (int k = index - 1; k >= 1; k--) {
                    Small.mul(n, n, n, xr, xi, outR, outI, sr, si);
                    double cr = zr / k, ci = zi / k;
                    for (int e = 0; e < len; e++) {
                        double a = sr[e], b = si[e];
                        outR[e] = cr * a - ci * b;
                        outI[e] = cr * b + ci * a;
                    }
                    for (int d = 0; d < n; d++) {
                        outR[d * n + d] += 1;
                    }
                }
                return;
            case NORMAL:
                // sr = V diag(e^{z μ}), out = sr V†
                for (int k = 0; k < n; k++) {
                    double ar = hermitian ? zr * lam[k] : zi * lam[k];
                    double ai = hermitian ? zi * lam[k] : -zr * lam[k];
                    double e = Math.exp(ar), cr = e * Math.cos(ai), ci = e * Math.sin(ai);
                    for (int i = 0; i < n; i++) {
                        double a = vr[i * n + k], b = vi[i * n + k];
                        sr[i * n + k] = a * cr - b * ci;
                        si[i * n + k] = a * ci + b * cr;
                    }
                }
                Small.mulLarge(n, sr, si, vhr, vhi, outR, outI);
                return;
            default:
                for (int e = 0; e < len; e++) {
                    sr[e] = zr * xr[e] - zi * xi[e];
                    si[e] = zr * xi[e] + zi * xr[e];
                }
                ws.compute(sr, si, outR, outI);
        }
    }
}
