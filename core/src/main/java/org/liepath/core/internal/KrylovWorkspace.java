package org.liepath.core.internal;

/**
 * Zero-allocation Krylov propagation of one vector: w = exp(−i t H) v for Hermitian H (Lanczos) or w = exp(t A) v
 * for any square A (Arnoldi), with a-posteriori error control and automatic sub-stepping.
 *
 * <h2>Signature and ownership</h2>
 * <pre>{@code
 * KrylovWorkspace ws = new KrylovWorkspace(n, m);        // n = dimension, m = maximal Krylov dimension (e.g. 30)
 * boolean ok = ws.expMinusI(hr, hi, t, vr, vi, tol, outRe, outIm);   // H Hermitian, planar row-major n×n
 * boolean ok = ws.expAction(ar, ai, t, vr, vi, tol, outRe, outIm);   // A general,   planar row-major n×n
 * double err = ws.errorEstimate(); int steps = ws.substeps(); ...
 * }</pre>
 * <ul>
 *   <li>{@code hr, hi} / {@code ar, ai}: input, not modified: the matrix, planar row-major, length n².</li>
 *   <li>{@code t}: any finite time (negative runs backward).</li>
 *   <li>{@code vr, vi}: input, not modified: the vector, length n.</li>
 *   <li>{@code tol}: positive; the target for the 2-norm error of the whole result relative to ‖v‖, i.e.
 *       ‖w − exp(tA)v‖ ≲ tol·‖v‖. Each sub-step of length τ may spend tol·‖v‖·τ/|t|.</li>
 *   <li>{@code outRe, outIm}: output, length n; may alias {@code vr, vi}.</li>
 *   <li>return value: true on success; false if the sub-step limit ({@link #MAX_SUBSTEPS}) was reached (the output
 *       then holds the vector propagated as far as the limit allowed, and {@link #timeReached()} says how far).</li>
 * </ul>
 * Nothing is checked (callers validate at their front door); nothing is allocated. Not thread-safe: one workspace
 * per thread.
 *
 * <h2>Method</h2>
 * Arnoldi / Lanczos projection exp(τA)v ≈ β V_m exp(τH_m) e_1 (Y. Saad, "Analysis of some Krylov subspace
 * approximations to the matrix exponential operator", SIAM J. Numer. Anal. 29 (1992) 209–228), with the step-size
 * control and the "corrected" approximation of R.B. Sidje, "Expokit: a software package for computing matrix
 * exponentials", ACM Trans. Math. Softw. 24 (1998) 130–156: one Padé exponential of the augmented
 * (m+2)×(m+2) matrix [[H_m, 0, 0], [h_{m+1,m} e_mᵀ, 0, 0], [0, 1, 0]] gives exp(τH_m)e_1 together with the
 * generalised-residual quantities τ h_{m+1,m} e_mᵀ φ₁(τH_m) e_1 and τ² h_{m+1,m} e_mᵀ φ₂(τH_m) e_1 that estimate the
 * local error (Saad 1992; M. Hochbruck, C. Lubich, SIAM J. Numer. Anal. 34 (1997) 1911–1925). The result uses m+1
 * basis vectors (the corrected scheme). A happy breakdown (invariant subspace found) ends the run in one exact step.
 * Lanczos is used with full re-orthogonalisation (one classical Gram–Schmidt pass), which keeps the basis orthonormal
 * to rounding at a cost of 4mn extra flops per vector; Arnoldi uses modified Gram–Schmidt with one re-orthogonalisation
 * pass ("twice is enough", W. Kahan / B.N. Parlett, <i>The Symmetric Eigenvalue Problem</i>, 1980, §6.9).
 *
 * <p>Cost per sub-step: m + 1 dense matrix–vector products (8n² flops each; the last one feeds the error
 * estimate), about 8jn flops per orthogonalisation pass at basis vector j, and one Padé exponential of order m+2 per
 * trial step size. The matrix norm used for the first step size is the row-sum bound Σ_j (|Re a_ij| + |Im a_ij|).
 */
public final class KrylovWorkspace {
    /** Upper bound on the number of sub-steps of one call (protects against |t|·‖A‖ far too large for Krylov). */
    public static final int MAX_SUBSTEPS = 100_000;
    private static final int MAX_REJECTIONS = 10;
    private static final double GAMMA = 0.9, DELTA = 1.2;
    private static final double EPS = Math.ulp(1.0);

    private final int n, m;
    private final double[][] br, bi;           // basis vectors v_0 … v_m (m+1 rows) and a scratch row
    private final double[] hr, hi;             // small (m+2)×(m+2) matrix
    private final double[] fr, fi;             // its exponential
    private final double[] sr, si;             // τ·Hbar
    private final double[] xr, xi;             // scratch vector of length n
    private final Expm small;

    private double errorEstimate, timeReached;
    private int substeps, dimension, rejections;
    private long products;

    /**
     * @param n dimension of the matrices and vectors (≥ 1)
     * @param m maximal Krylov dimension (≥ 1; clamped to n); 20–40 is usual
     */
    public KrylovWorkspace(int n, int m) {
        if (n < 1 || m < 1) {
            throw new IllegalArgumentException("n, m: expected positive sizes, got " + n + ", " + m);
        }
        this.n = n;
        this.m = Math.max(1, Math.min(m, n));
        int mm = this.m + 2;
        br = new double[this.m + 2][n];
        bi = new double[this.m + 2][n];
        hr = new double[mm * mm];
        hi = new double[mm * mm];
        fr = new double[mm * mm];
        fi = new double[mm * mm];
        sr = new double[mm * mm];
        si = new double[mm * mm];
        xr = new double[n];
        xi = new double[n];
        small = new Expm(mm);
    }

    /** @return the vector dimension this workspace serves */
    public int dim() {
        return n;
    }

    /** @return the maximal Krylov dimension (after clamping to n) */
    public int maxKrylovDimension() {
        return m;
    }

    /** w = exp(−i t H) v by Lanczos; see the class documentation for the arguments. */
    public boolean expMinusI(double[] hRe, double[] hIm, double t, double[] vr, double[] vi, double tol,
                             double[] outRe, double[] outIm) {
        return run(true, hRe, hIm, t, vr, vi, tol, outRe, outIm);
    }

    /** w = exp(t A) v by Arnoldi; see the class documentation for the arguments. */
    public boolean expAction(double[] aRe, double[] aIm, double t, double[] vr, double[] vi, double tol,
                             double[] outRe, double[] outIm) {
        return run(false, aRe, aIm, t, vr, vi, tol, outRe, outIm);
    }

    /** @return the sum of the local error estimates of the last call (absolute, 2-norm) */
    public double errorEstimate() {
        return errorEstimate;
    }

    /** @return the number of sub-steps of the last call */
    public int substeps() {
        return substeps;
    }

    /** @return the largest Krylov dimension used in the last call */
    public int krylovDimension() {
        return dimension;
    }

    /** @return the number of matrix–vector products of the last call */
    public long matrixVectorProducts() {
        return products;
    }

    /** @return the number of rejected trial step sizes in the last call */
    public int rejections() {
        return rejections;
    }

    /** @return |t| reached by the last call (equal to |t| on success) */
    public double timeReached() {
        return timeReached;
    }

    private boolean run(boolean hermitian, double[] ar, double[] ai, double t, double[] vr, double[] vi, double tol,
                        double[] outRe, double[] outIm) {
        errorEstimate = 0;
        substeps = 0;
        dimension = 0;
        products = 0;
        rejections = 0;
        timeReached = 0;
        double tOut = Math.abs(t);
        // w lives in the scratch vector x while stepping
        System.arraycopy(vr, 0, xr, 0, n);
        System.arraycopy(vi, 0, xi, 0, n);
        double beta = norm(xr, xi);
        double anorm = normInf(ar, ai);
        if (beta == 0 || tOut == 0 || anorm == 0) {
            copyOut(outRe, outIm);
            timeReached = tOut;
            return true;
        }
        double sgn = Math.signum(t);
        if (n == 1) {
            // exp(τ a) v, exact
            double zr = hermitian ? t * ai[0] : t * ar[0], zi = hermitian ? -t * ar[0] : t * ai[0];
            double em = Math.exp(zr), c = em * Math.cos(zi), s = em * Math.sin(zi);
            double a = xr[0], b = xi[0];
            outRe[0] = c * a - s * b;
            outIm[0] = c * b + s * a;
            substeps = 1;
            dimension = 1;
            products = 0;
            timeReached = tOut;
            return true;
        }
        double beta0 = beta;
        double rate = tol * beta0 / tOut;            // allowed error per unit time
        double btol = 16 * EPS * Math.sqrt(n) * anorm; // residual norm indistinguishable from rounding
        double xm = 1.0 / m;
        double fact = Math.pow((m + 1) / Math.E, m + 1) * Math.sqrt(2 * Math.PI * (m + 1));
        double tNew = roundUp(Math.pow(fact * rate / (4 * beta * anorm), xm) / anorm);
        double tNow = 0;
        int mm = m + 2;
        while (tNow < tOut) {
            if (substeps >= MAX_SUBSTEPS) {
                copyOut(outRe, outIm);
                timeReached = tNow;
                return false;
            }
            double tStep = Math.min(tOut - tNow, tNew);
            // ---- Krylov basis from w / beta
            double ib = 1.0 / beta;
            for (int i = 0; i < n; i++) {
                br[0][i] = xr[i] * ib;
                bi[0][i] = xi[i] * ib;
            }
            java.util.Arrays.fill(hr, 0.0);
            java.util.Arrays.fill(hi, 0.0);
            int mb = m;
            boolean breakdown = false;
            double hLast = 0;
            for (int j = 0; j < m; j++) {
                double[] wr = br[j + 1], wi = bi[j + 1];
                Dense.mulVec(n, ar, ai, br[j], bi[j], wr, wi);
                products++;
                double h;
                if (hermitian) {
                    h = lanczosStep(j, wr, wi);
                } else {
                    h = arnoldiStep(j, wr, wi);
                }
                if (h <= btol || j + 1 == n) {
                    // invariant subspace (happy breakdown) or the whole space: the projection is exact
                    breakdown = true;
                    mb = j + 1;
                    break;
                }
                hLast = h;
                if (j + 1 < m) {
                    setSub(j, h, hermitian, mm);
                }
                double ih = 1.0 / h;
                for (int i = 0; i < n; i++) {
                    wr[i] *= ih;
                    wi[i] *= ih;
                }
            }
            double avnorm = 0;
            if (breakdown) {
                tStep = tOut - tNow;
            } else {
                // augmented matrix: Hbar(m, m−1) = h_{m+1,m} (−iβ_m for Lanczos; no upper partner), Hbar(m+1, m) = 1
                if (hermitian) {
                    hi[m * mm + m - 1] = -hLast;
                } else {
                    hr[m * mm + m - 1] = hLast;
                }
                hr[(m + 1) * mm + m] = 1;
                Dense.mulVec(n, ar, ai, br[m], bi[m], br[m + 1], bi[m + 1]);
                products++;
                avnorm = norm(br[m + 1], bi[m + 1]); // ‖A v_{m+1}‖, the same for H and −iH
            }
            dimension = Math.max(dimension, mb);
            // ---- step-size trials on the same basis
            double err;
            int reject = 0;
            while (true) {
                double tau = sgn * tStep;
                int len = mm * mm;
                for (int k = 0; k < len; k++) {
                    sr[k] = tau * hr[k];
                    si[k] = tau * hi[k];
                }
                small.compute(sr, si, fr, fi);
                if (breakdown) {
                    err = 0;
                    xm = 1.0 / m;
                    break;
                }
                double phi1 = beta * Math.hypot(fr[m * mm], fi[m * mm]);
                double phi2 = beta * Math.hypot(fr[(m + 1) * mm], fi[(m + 1) * mm]) * avnorm;
                if (phi1 > 10 * phi2) {
                    err = phi2;
                    xm = 1.0 / m;
                } else if (phi1 > phi2) {
                    err = phi1 * phi2 / (phi1 - phi2);
                    xm = 1.0 / m;
                } else {
                    err = phi1;
                    xm = 1.0 / Math.max(1, m - 1);
                }
                double allowed = rate * tStep;
                // after MAX_REJECTIONS the step is accepted; its estimate, above the allowance, is reported
                if (err <= DELTA * allowed || reject == MAX_REJECTIONS) {
                    break;
                }
                tStep = roundUp(GAMMA * tStep * Math.pow(allowed / err, xm));
                reject++;
                rejections++;
            }
            // ---- w = V (β F(:, 0)) with m+1 vectors (corrected scheme), or mb vectors after breakdown
            int mx = breakdown ? mb : m + 1;
            java.util.Arrays.fill(xr, 0.0);
            java.util.Arrays.fill(xi, 0.0);
            for (int k = 0; k < mx; k++) {
                double cr = beta * fr[k * mm], ci = beta * fi[k * mm];
                double[] ur = br[k], ui = bi[k];
                for (int i = 0; i < n; i++) {
                    xr[i] += cr * ur[i] - ci * ui[i];
                    xi[i] += cr * ui[i] + ci * ur[i];
                }
            }
            beta = norm(xr, xi);
            // the last sub-step lands exactly on |t| (no sliver step from rounding in tNow + tStep)
            tNow = tStep >= tOut - tNow ? tOut : tNow + tStep;
            substeps++;
            if (!breakdown) {
                double allowed = rate * tStep;
                tNew = roundUp(GAMMA * tStep * Math.pow(allowed / Math.max(err, Double.MIN_NORMAL), xm));
            }
            // rounding floor of one sub-step: about √n ulps of ‖w‖ from the n-term sums in products and updates
            errorEstimate += Math.max(err, EPS * Math.sqrt(n) * beta);
            if (beta == 0) {
                break;
            }
        }
        timeReached = tOut;
        copyOut(outRe, outIm);
        return true;
    }

    /** Stores the sub-diagonal coupling h between basis vectors j and j+1 of the small matrix. */
    private void setSub(int j, double h, boolean hermitian, int mm) {
        if (hermitian) {
            // A = −iH: the projection of A is −i T with T real symmetric tridiagonal
            hi[(j + 1) * mm + j] = -h;
            hi[j * mm + j + 1] = -h;
        } else {
            hr[(j + 1) * mm + j] = h;
        }
    }

    /**
     * Lanczos step on w = H v_j: three-term recurrence with real α_j, β_{j−1} (stored as −iT in the small matrix),
     * then one full re-orthogonalisation pass whose coefficients (rounding-level) are not kept. Returns ‖w‖.
     */
    private double lanczosStep(int j, double[] wr, double[] wi) {
        int mm = m + 2;
        double[] vr = br[j], vi = bi[j];
        double alpha = 0;
        for (int i = 0; i < n; i++) {
            alpha += vr[i] * wr[i] + vi[i] * wi[i];
        }
        hi[j * mm + j] = -alpha;
        double bPrev = j > 0 ? -hi[j * mm + j - 1] : 0;
        double[] pr = j > 0 ? br[j - 1] : null, pi = j > 0 ? bi[j - 1] : null;
        for (int i = 0; i < n; i++) {
            wr[i] -= alpha * vr[i];
            wi[i] -= alpha * vi[i];
            if (pr != null) {
                wr[i] -= bPrev * pr[i];
                wi[i] -= bPrev * pi[i];
            }
        }
        for (int k = 0; k <= j; k++) {
            project(k, wr, wi, -1);
        }
        return norm(wr, wi);
    }

    /** Arnoldi step on w = A v_j: modified Gram–Schmidt plus one re-orthogonalisation pass. Returns ‖w‖. */
    private double arnoldiStep(int j, double[] wr, double[] wi) {
        int mm = m + 2;
        for (int pass = 0; pass < 2; pass++) {
            for (int k = 0; k <= j; k++) {
                project(k, wr, wi, k * mm + j);
            }
        }
        return norm(wr, wi);
    }

    /** w ← w − (v_k† w) v_k; adds the coefficient to the small matrix entry {@code at} unless it is negative. */
    private void project(int k, double[] wr, double[] wi, int at) {
        double[] vr = br[k], vi = bi[k];
        double cr = 0, ci = 0;
        for (int i = 0; i < n; i++) {
            cr += vr[i] * wr[i] + vi[i] * wi[i];
            ci += vr[i] * wi[i] - vi[i] * wr[i];
        }
        for (int i = 0; i < n; i++) {
            wr[i] -= cr * vr[i] - ci * vi[i];
            wi[i] -= cr * vi[i] + ci * vr[i];
        }
        if (at >= 0) {
            hr[at] += cr;
            hi[at] += ci;
        }
    }

    private void copyOut(double[] outRe, double[] outIm) {
        System.arraycopy(xr, 0, outRe, 0, n);
        System.arraycopy(xi, 0, outIm, 0, n);
    }

    private double norm(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < n; i++) {
            s += a[i] * a[i] + b[i] * b[i];
        }
        return Math.sqrt(s);
    }

    /** Maximum absolute row sum. */
    private double normInf(double[] ar, double[] ai) {
        double best = 0;
        for (int i = 0; i < n; i++) {
            double s = 0;
            int in = i * n;
            for (int j = 0; j < n; j++) {
                s += Math.abs(ar[in + j]) + Math.abs(ai[in + j]);
            }
            best = Math.max(best, s);
        }
        return best;
    }

    /** Rounds a positive step up to two significant digits (as Expokit does, so step sizes stay readable). */
    static double roundUp(double x) {
        if (!(x > 0) || !Double.isFinite(x)) {
            return x > 0 ? Double.MAX_VALUE : Double.MIN_NORMAL;
        }
        double s = Math.pow(10, Math.floor(Math.log10(x)) - 1);
        return Math.ceil(x / s) * s;
    }
}
