package org.liepath.integrators.internal.wn;

import org.liepath.core.internal.Expm;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * exp(z·A) for a fixed small complex n×n matrix A and any complex z, in closed form where A allows one.
 *
 * <p>The analysis is done once: A = 0; A diagonal (exp is diagonal); A nilpotent (exp(zA) = Σ_{q<p} z^q A^q/q!, a
 * polynomial of degree p − 1 in z); A diagonalisable with a minimal polynomial μ of simple roots λ_1..λ_d
 * (exp(zA) = Σ_j e^{zλ_j} P_j with the spectral projectors P_j = Π_{i≠j}(A − λ_i)/(λ_j − λ_i), the Lagrange–Sylvester
 * interpolation formula, common practice; cf. Putzer's method as used by C. Altafini, Systems &amp; Control Letters
 * 54 (2005) 1121 for Wei–Norman formulae); otherwise Padé scaling and squaring. The closed forms double as the
 * symbolic description used to print coordinate equations ({@link #terms()}).
 *
 * <p>Immutable; {@link #eval} needs a caller-owned {@link Expm} workspace only for the numeric kind. Not part of the
 * public API.
 */
public final class ExpForm {
    /** How exp(zA) is evaluated. */
    public enum Kind {
        /** A = 0. */
        ZERO,
        /** A diagonal. */
        DIAGONAL,
        /** A nilpotent: a polynomial in z. */
        NILPOTENT,
        /** A diagonalisable: a sum of exponentials e^{zλ_j} times projectors. */
        SPECTRAL,
        /** No closed form found: Padé scaling and squaring. */
        NUMERIC
    }

    /** One term c(z)·M of the closed form, with c(z) = z^power·e^{z·λ}. */
    public static final class Term {
        /** Power of z. */
        public final int power;
        /** Exponent rate λ (real and imaginary part). */
        public final double lamRe, lamIm;
        /** The matrix coefficient (planar n×n), including the 1/power! factor. */
        public final double[] re, im;

        Term(int power, double lamRe, double lamIm, double[] re, double[] im) {
            this.power = power;
            this.lamRe = lamRe;
            this.lamIm = lamIm;
            this.re = re;
            this.im = im;
        }
    }

    private static final double NIL_TOL = 1e-12;
    private static final double MINPOLY_TOL = 1e-10;
    private static final double VERIFY_TOL = 1e-10;

    private final int n;
    private final Kind kind;
    private final double[] aRe, aIm;
    private final double normA;
    private final List<Term> terms;
    private final Term[] termArray;

    /** Analyses A (planar n×n; copied). */
    public ExpForm(int n, double[] re, double[] im) {
        this.n = n;
        this.aRe = re.clone();
        this.aIm = im.clone();
        this.normA = Small.norm1(n, n, aRe, aIm);
        List<Term> t = new ArrayList<>();
        this.kind = analyse(t);
        this.terms = Collections.unmodifiableList(t);
        this.termArray = t.toArray(new Term[0]);
    }

    /** @return the evaluation kind */
    public Kind kind() {
        return kind;
    }

    /** @return the matrix size */
    public int dim() {
        return n;
    }

    /** @return the closed-form terms (empty for {@link Kind#NUMERIC}) */
    public List<Term> terms() {
        return terms;
    }

    /** @return ‖A‖₁ */
    public double norm1() {
        return normA;
    }

    private Kind analyse(List<Term> out) {
        int len = n * n;
        if (normA == 0) {
            double[] ir = new double[len], ii = new double[len];
            Small.identity(n, ir, ii);
            out.add(new Term(0, 0, 0, ir, ii));
            return Kind.ZERO;
        }
        if (isDiagonal()) {
            // group equal diagonal entries into projectors (for printing); eval uses the diagonal directly
            boolean[] used = new boolean[n];
            for (int i = 0; i < n; i++) {
                if (used[i]) {
                    continue;
                }
                double[] pr = new double[len], pi = new double[len];
                for (int k = i; k < n; k++) {
                    if (!used[k] && Math.hypot(aRe[k * n + k] - aRe[i * n + i], aIm[k * n + k] - aIm[i * n + i])
                            <= 1e-13 * normA) {
                        used[k] = true;
                        pr[k * n + k] = 1.0;
                    }
                }
                out.add(new Term(0, aRe[i * n + i], aIm[i * n + i], pr, pi));
            }
            return Kind.DIAGONAL;
        }
        // nilpotent?
        List<double[][]> powers = new ArrayList<>();
        double[] pr = new double[len], pi = new double[len];
        Small.identity(n, pr, pi);
        powers.add(new double[][]{pr, pi});
        double scale = Math.max(1.0, normA);
        for (int q = 1; q <= n; q++) {
            double[] cr = new double[len], ci = new double[len];
            Small.mul(n, n, n, powers.get(q - 1)[0], powers.get(q - 1)[1], aRe, aIm, cr, ci);
            if (Small.norm1(n, n, cr, ci) <= NIL_TOL * Math.pow(scale, q)) {
                double fact = 1;
                for (int k = 0; k < q; k++) {
                    if (k > 0) {
                        fact *= k;
                    }
                    double[] mr = powers.get(k)[0].clone(), mi = powers.get(k)[1].clone();
                    for (int e = 0; e < len; e++) {
                        mr[e] /= fact;
                        mi[e] /= fact;
                    }
                    out.add(new Term(k, 0, 0, mr, mi));
                }
                return Kind.NILPOTENT;
            }
            powers.add(new double[][]{cr, ci});
        }
        if (spectral(out)) {
            return Kind.SPECTRAL;
        }
        out.clear();
        return Kind.NUMERIC;
    }

    private boolean isDiagonal() {
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (i != j && (aRe[i * n + j] != 0 || aIm[i * n + j] != 0)) {
                    return false;
                }
            }
        }
        return true;
    }

    /** Minimal polynomial by Gram–Schmidt on vec(B^q), B = A/‖A‖; simple roots ⇒ spectral projectors. */
    private boolean spectral(List<Term> out) {
        int len = n * n;
        double s = normA;
        double[] br = new double[len], bi = new double[len];
        for (int e = 0; e < len; e++) {
            br[e] = aRe[e] / s;
            bi[e] = aIm[e] / s;
        }
        // Q columns (orthonormal) and R (upper triangular) of [vec I, vec B, vec B^2, ...]
        double[][] qr = new double[n + 1][], qi = new double[n + 1][];
        double[][] rr = new double[n + 1][n + 1], ri = new double[n + 1][n + 1];
        double[] vr = new double[len], vi = new double[len];
        Small.identity(n, vr, vi);
        double[] powR = vr.clone(), powI = vi.clone();
        int d = -1;
        double[] coefR = null, coefI = null;
        for (int q = 0; q <= n; q++) {
            if (q > 0) {
                double[] nr = new double[len], ni = new double[len];
                Small.mul(n, n, n, powR, powI, br, bi, nr, ni);
                powR = nr;
                powI = ni;
            }
            double[] wr = powR.clone(), wi = powI.clone();
            double norm0 = Math.sqrt(dot2(wr, wi));
            for (int k = 0; k < q; k++) {
                // <q_k, w> = Σ conj(q_k) w
                double sr = 0, si = 0;
                for (int e = 0; e < len; e++) {
                    sr += qr[k][e] * wr[e] + qi[k][e] * wi[e];
                    si += qr[k][e] * wi[e] - qi[k][e] * wr[e];
                }
                rr[k][q] = sr;
                ri[k][q] = si;
                for (int e = 0; e < len; e++) {
                    wr[e] -= sr * qr[k][e] - si * qi[k][e];
                    wi[e] -= sr * qi[k][e] + si * qr[k][e];
                }
            }
            double res = Math.sqrt(dot2(wr, wi));
            if (q > 0 && res <= MINPOLY_TOL * Math.max(1e-300, norm0)) {
                d = q;
                // solve R[0..q-1][0..q-1] c = R[0..q-1][q]:  B^q = Σ c_k B^k
                coefR = new double[q];
                coefI = new double[q];
                for (int k = q - 1; k >= 0; k--) {
                    double sr = rr[k][q], si = ri[k][q];
                    for (int l = k + 1; l < q; l++) {
                        sr -= rr[k][l] * coefR[l] - ri[k][l] * coefI[l];
                        si -= rr[k][l] * coefI[l] + ri[k][l] * coefR[l];
                    }
                    double dr = rr[k][k], di = ri[k][k], den = dr * dr + di * di;
                    coefR[k] = (sr * dr + si * di) / den;
                    coefI[k] = (si * dr - sr * di) / den;
                }
                break;
            }
            rr[q][q] = res;
            ri[q][q] = 0;
            qr[q] = new double[len];
            qi[q] = new double[len];
            for (int e = 0; e < len; e++) {
                qr[q][e] = wr[e] / res;
                qi[q][e] = wi[e] / res;
            }
        }
        if (d < 1) {
            return false;
        }
        // monic polynomial x^d − Σ c_k x^k: coefficients p[k] for k = 0..d
        double[] pr = new double[d + 1], pi = new double[d + 1];
        for (int k = 0; k < d; k++) {
            pr[k] = -coefR[k];
            pi[k] = -coefI[k];
        }
        pr[d] = 1;
        double[][] roots = Roots.of(pr, pi);
        if (roots == null) {
            return false;
        }
        double minSep = Double.POSITIVE_INFINITY;
        for (int a = 0; a < d; a++) {
            for (int b = a + 1; b < d; b++) {
                minSep = Math.min(minSep, Math.hypot(roots[0][a] - roots[0][b], roots[1][a] - roots[1][b]));
            }
        }
        if (minSep < 1e-6) {
            return false;
        }
        double[] sumR = new double[len], sumI = new double[len], accR = new double[len], accI = new double[len];
        List<Term> tmp = new ArrayList<>();
        for (int j = 0; j < d; j++) {
            double ljr = snap(roots[0][j] * s), lji = snap(roots[1][j] * s);
            double[] mr = new double[len], mi = new double[len];
            Small.identity(n, mr, mi);
            for (int i = 0; i < d; i++) {
                if (i == j) {
                    continue;
                }
                double lir = roots[0][i] * s, lii = roots[1][i] * s;
                // (A − λ_i)/(λ_j − λ_i)
                double dr = roots[0][j] * s - lir, di = roots[1][j] * s - lii, den = dr * dr + di * di;
                double fr = dr / den, fi = -di / den;
                double[] xr = aRe.clone(), xi = aIm.clone();
                for (int k = 0; k < n; k++) {
                    xr[k * n + k] -= lir;
                    xi[k * n + k] -= lii;
                }
                for (int e = 0; e < len; e++) {
                    double ur = xr[e], ui = xi[e];
                    xr[e] = ur * fr - ui * fi;
                    xi[e] = ur * fi + ui * fr;
                }
                double[] nr = new double[len], ni = new double[len];
                Small.mul(n, n, n, mr, mi, xr, xi, nr, ni);
                mr = nr;
                mi = ni;
            }
            for (int e = 0; e < len; e++) {
                sumR[e] += mr[e];
                sumI[e] += mi[e];
                accR[e] += ljr * mr[e] - lji * mi[e];
                accI[e] += ljr * mi[e] + lji * mr[e];
            }
            tmp.add(new Term(0, ljr, lji, mr, mi));
        }
        for (int k = 0; k < n; k++) {
            sumR[k * n + k] -= 1;
        }
        for (int e = 0; e < len; e++) {
            accR[e] -= aRe[e];
            accI[e] -= aIm[e];
        }
        if (Small.norm1(n, n, sumR, sumI) > VERIFY_TOL * n || Small.norm1(n, n, accR, accI) > VERIFY_TOL * n * normA) {
            return false;
        }
        out.addAll(tmp);
        return true;
    }

    /** Rounds eigenvalues that are integers or zero to within rounding, so printed exponents read e^{2 g}. */
    private static double snap(double x) {
        double r = Math.rint(x);
        return Math.abs(x - r) <= 1e-11 * Math.max(1, Math.abs(x)) ? r : x;
    }

    private static double dot2(double[] r, double[] i) {
        double s = 0;
        for (int e = 0; e < r.length; e++) {
            s += r[e] * r[e] + i[e] * i[e];
        }
        return s;
    }

    /**
     * out = exp(z·A). For the numeric kind, ws must be an {@link Expm} of size n; scratch (length n²) is needed by
     * the numeric kind only (may be null otherwise). Allocates nothing.
     */
    public void eval(double zr, double zi, double[] outR, double[] outI, Expm ws, double[] scrR, double[] scrI) {
        int len = n * n;
        switch (kind) {
            case ZERO:
                Small.identity(n, outR, outI);
                return;
            case DIAGONAL:
                java.util.Arrays.fill(outR, 0, len, 0.0);
                java.util.Arrays.fill(outI, 0, len, 0.0);
                for (int k = 0; k < n; k++) {
                    double xr = zr * aRe[k * n + k] - zi * aIm[k * n + k];
                    double xi = zr * aIm[k * n + k] + zi * aRe[k * n + k];
                    double e = Math.exp(xr);
                    outR[k * n + k] = e * Math.cos(xi);
                    outI[k * n + k] = e * Math.sin(xi);
                }
                return;
            case NILPOTENT:
            case SPECTRAL: {
                java.util.Arrays.fill(outR, 0, len, 0.0);
                java.util.Arrays.fill(outI, 0, len, 0.0);
                for (Term t : termArray) {
                    // c = z^power e^{zλ}; an array, not the list, so that no iterator is allocated
                    double cr, ci;
                    if (t.power == 0) {
                        double xr = zr * t.lamRe - zi * t.lamIm, xi = zr * t.lamIm + zi * t.lamRe;
                        double e = Math.exp(xr);
                        cr = e * Math.cos(xi);
                        ci = e * Math.sin(xi);
                    } else {
                        cr = 1;
                        ci = 0;
                        for (int p = 0; p < t.power; p++) {
                            double u = cr * zr - ci * zi;
                            ci = cr * zi + ci * zr;
                            cr = u;
                        }
                    }
                    for (int e = 0; e < len; e++) {
                        double mr = t.re[e], mi = t.im[e];
                        outR[e] += cr * mr - ci * mi;
                        outI[e] += cr * mi + ci * mr;
                    }
                }
                return;
            }
            default:
                for (int e = 0; e < len; e++) {
                    scrR[e] = zr * aRe[e] - zi * aIm[e];
                    scrI[e] = zr * aIm[e] + zi * aRe[e];
                }
                ws.compute(scrR, scrI, outR, outI);
        }
    }
}
