package org.liepath.core.internal;

/**
 * Eigendecomposition H = V diag(λ) V† of a dense complex Hermitian n×n matrix (planar, row-major).
 *
 * <p>Method (three classical stages, see G.H. Golub, C.F. Van Loan, <i>Matrix Computations</i>, 4th ed., Johns
 * Hopkins 2013, §8.3):
 * <ol>
 *   <li>Householder reduction to tridiagonal form, P_k = I − τ v v† with τ real, so Q† H Q = T with complex
 *       sub-diagonal ({@code Q = P_0 … P_{n−3}});</li>
 *   <li>a unitary diagonal D (entries of modulus one) that makes the sub-diagonal real and non-negative, so
 *       T = D T' D† with T' real symmetric tridiagonal;</li>
 *   <li>the implicit QL iteration with Wilkinson-type shifts on T' (the algorithm "tql2" of the EISPACK collection:
 *       B.T. Smith et al., <i>Matrix Eigensystem Routines — EISPACK Guide</i>, Springer LNCS 6, 1976), accumulating the
 *       real orthogonal Z with T' = Z Λ Zᵀ; then V = Q D Z by applying the stored reflectors.</li>
 * </ol>
 * Eigenvalues are returned in ascending order; V is unitary to a few ulps times n. Cost about 9n³ real flops for the
 * reduction and back-transformation plus about 6n³ for the QL rotations (two QL sweeps per eigenvalue on average).
 *
 * <p>The input is scaled by its largest entry before the reduction, so no intermediate overflows or underflows
 * destructively for any finite input. Both triangles are read (the full trailing block is updated), so a matrix that
 * is Hermitian only to rounding gives the decomposition of its Hermitian part to first order.
 *
 * <p>A workspace instance holds all scratch arrays: {@link #compute} allocates nothing. Not thread-safe (one
 * instance per thread). Not part of the public API.
 */
public final class HermitianEigen {
    /** Upper bound on QL sweeps per eigenvalue; the iteration converges in 1–3 sweeps in practice. */
    private static final int MAX_SWEEPS = 60;
    private static final double EPS = Math.ulp(1.0);

    private final int n;
    private final double[] wr, wi;          // working copy of H, reduced in place
    private final double[] hvr, hvi;        // Householder vectors: row k holds v_k (entries k+1..n-1)
    private final double[] tau;
    private final double[] d, e;            // tridiagonal diagonal and sub-diagonal
    private final double[] phr, phi;        // the unitary diagonal D
    private final double[] zt;              // rows are the eigenvectors of T' (Zᵀ), n×n real
    private final double[] pr, pi;          // scratch vectors

    /** Creates a workspace for n×n matrices. */
    public HermitianEigen(int n) {
        if (n <= 0) {
            throw new IllegalArgumentException("n: expected a positive dimension, got " + n);
        }
        this.n = n;
        int len = n * n;
        wr = new double[len];
        wi = new double[len];
        hvr = new double[len];
        hvi = new double[len];
        tau = new double[n];
        d = new double[n];
        e = new double[n];
        phr = new double[n];
        phi = new double[n];
        zt = new double[len];
        pr = new double[n];
        pi = new double[n];
    }

    /** @return the dimension this workspace serves */
    public int dim() {
        return n;
    }

    /**
     * Decomposes the Hermitian matrix (hr, hi): on return {@code lambda} holds the eigenvalues in ascending order and
     * (vr, vi) the unitary matrix whose column j is the eigenvector of lambda[j] (planar, row-major).
     * Inputs are not modified; outputs must not alias inputs. Allocates nothing.
     *
     * @return false only if the QL iteration failed to converge (never observed; outputs are then NaN)
     */
    public boolean compute(double[] hr, double[] hi, double[] lambda, double[] vr, double[] vi) {
        int len = n * n;
        double scale = 0;
        for (int k = 0; k < len; k++) {
            scale = Math.max(scale, Math.max(Math.abs(hr[k]), Math.abs(hi[k])));
        }
        if (scale == 0 || n == 1) {
            java.util.Arrays.fill(lambda, 0, n, 0.0);
            if (n == 1) {
                lambda[0] = hr[0];
            }
            Dense.identity(n, vr, vi);
            return true;
        }
        double inv = 1.0 / scale;
        for (int k = 0; k < len; k++) {
            wr[k] = hr[k] * inv;
            wi[k] = hi[k] * inv;
        }
        tridiagonalize();
        for (int k = 0; k < len; k++) {
            zt[k] = 0;
        }
        for (int i = 0; i < n; i++) {
            zt[i * n + i] = 1;
        }
        boolean ok = tridiagonalEigen(n, d, e, zt, n);
        sortAscending(n, d, zt, n);
        for (int j = 0; j < n; j++) {
            lambda[j] = d[j] * scale;
        }
        backTransform(vr, vi);
        if (!ok) {
            java.util.Arrays.fill(lambda, 0, n, Double.NaN);
            java.util.Arrays.fill(vr, 0, len, Double.NaN);
            java.util.Arrays.fill(vi, 0, len, Double.NaN);
        }
        return ok;
    }

    /** Householder reduction of (wr, wi) to tridiagonal form; fills d, e (real, e[i] couples i and i+1) and D. */
    private void tridiagonalize() {
        for (int k = 0; k + 2 < n; k++) {
            int k1 = k + 1, vo = k * n;
            double rest2 = 0;
            for (int i = k1 + 1; i < n; i++) {
                double a = wr[i * n + k], b = wi[i * n + k];
                rest2 += a * a + b * b;
            }
            // x is already a multiple of e_1 (exactly): no reflection needed
            if (rest2 == 0) {
                tau[k] = 0;
                continue;
            }
            double x0r = wr[k1 * n + k], x0i = wi[k1 * n + k];
            double x0abs2 = x0r * x0r + x0i * x0i;
            double x0abs = Math.sqrt(x0abs2);
            double xnorm2 = x0abs2 + rest2;
            double xnorm = Math.sqrt(xnorm2);
            double cr = 1, ci = 0;
            if (x0abs > 0) {
                cr = x0r / x0abs;
                ci = x0i / x0abs;
            }
            // alpha = −phase(x0)·‖x‖; v = x − alpha e_1 (no cancellation: v_0 = phase·(|x0| + ‖x‖))
            double alr = -cr * xnorm, ali = -ci * xnorm;
            for (int i = k1; i < n; i++) {
                hvr[vo + i] = wr[i * n + k];
                hvi[vo + i] = wi[i * n + k];
            }
            hvr[vo + k1] -= alr;
            hvi[vo + k1] -= ali;
            double t = 1.0 / (xnorm2 + xnorm * x0abs); // 2 / v†v
            tau[k] = t;
            // p = τ W v on the trailing block; K = τ (v† p) / 2; q = p − K v
            double vp = 0;
            for (int i = k1; i < n; i++) {
                double sr = 0, si = 0;
                int in = i * n;
                for (int j = k1; j < n; j++) {
                    double ar = wr[in + j], ai = wi[in + j], br = hvr[vo + j], bi = hvi[vo + j];
                    sr += ar * br - ai * bi;
                    si += ar * bi + ai * br;
                }
                pr[i] = t * sr;
                pi[i] = t * si;
                vp += hvr[vo + i] * pr[i] + hvi[vo + i] * pi[i]; // Re(conj(v_i) p_i); the imaginary part sums to 0
            }
            double kk = 0.5 * t * vp;
            for (int i = k1; i < n; i++) {
                pr[i] -= kk * hvr[vo + i];
                pi[i] -= kk * hvi[vo + i];
            }
            // W ← W − v q† − q v† on the trailing block
            for (int i = k1; i < n; i++) {
                double vir = hvr[vo + i], vii = hvi[vo + i], qir = pr[i], qii = pi[i];
                int in = i * n;
                for (int j = k1; j < n; j++) {
                    double vjr = hvr[vo + j], vji = hvi[vo + j], qjr = pr[j], qji = pi[j];
                    wr[in + j] -= vir * qjr + vii * qji + qir * vjr + qii * vji;
                    wi[in + j] -= vii * qjr - vir * qji + qii * vjr - qir * vji;
                }
            }
            wr[k1 * n + k] = alr;
            wi[k1 * n + k] = ali;
            for (int i = k1 + 1; i < n; i++) {
                wr[i * n + k] = 0;
                wi[i * n + k] = 0;
            }
        }
        // diagonal, and the phases that make the sub-diagonal real: δ_{i+1} = δ_i · e_i / |e_i|
        phr[0] = 1;
        phi[0] = 0;
        for (int i = 0; i < n; i++) {
            d[i] = wr[i * n + i];
            if (i + 1 < n) {
                double sr = wr[(i + 1) * n + i], si = wi[(i + 1) * n + i];
                double m = Math.sqrt(sr * sr + si * si);
                e[i] = m;
                double ur = 1, ui = 0;
                if (m > 0) {
                    ur = sr / m;
                    ui = si / m;
                }
                phr[i + 1] = phr[i] * ur - phi[i] * ui;
                phi[i + 1] = phr[i] * ui + phi[i] * ur;
            } else {
                e[i] = 0;
            }
        }
    }

    /** V = Q D Z: for each eigenvector z_j (row j of zt) y = D z_j, then y ← P_k y for k = n−3 … 0. */
    private void backTransform(double[] vr, double[] vi) {
        for (int j = 0; j < n; j++) {
            int jo = j * n;
            for (int i = 0; i < n; i++) {
                double z = zt[jo + i];
                pr[i] = phr[i] * z;
                pi[i] = phi[i] * z;
            }
            for (int k = n - 3; k >= 0; k--) {
                double t = tau[k];
                if (t == 0) {
                    continue;
                }
                int vo = k * n;
                double sr = 0, si = 0; // s = v† y
                for (int i = k + 1; i < n; i++) {
                    double ar = hvr[vo + i], ai = hvi[vo + i];
                    sr += ar * pr[i] + ai * pi[i];
                    si += ar * pi[i] - ai * pr[i];
                }
                sr *= t;
                si *= t;
                for (int i = k + 1; i < n; i++) {
                    double ar = hvr[vo + i], ai = hvi[vo + i];
                    pr[i] -= ar * sr - ai * si;
                    pi[i] -= ar * si + ai * sr;
                }
            }
            for (int i = 0; i < n; i++) {
                vr[i * n + j] = pr[i];
                vi[i * n + j] = pi[i];
            }
        }
    }

    /**
     * Implicit QL iteration for a real symmetric tridiagonal matrix of order m, in place (EISPACK "tql2", with the
     * eigenvector rotations applied to the ROWS of zt so that every update is contiguous).
     *
     * @param m  order
     * @param d  in: diagonal; out: eigenvalues (not sorted)
     * @param e  in: e[i] couples i and i+1 (e[m−1] ignored); destroyed
     * @param zt in: an m×m row-major matrix, usually the identity (row stride {@code stride}); out: row j is
     *           multiplied from the left by the accumulated rotations, so that for zt = I row j is the eigenvector
     *           of d[j]
     * @return false if some eigenvalue needed more than 60 sweeps
     */
    public static boolean tridiagonalEigen(int m, double[] d, double[] e, double[] zt, int stride) {
        e[m - 1] = 0; // e[i] couples i and i+1: already the convention tql2 uses after its initial shift
        double f = 0, tst1 = 0;
        boolean ok = true;
        for (int l = 0; l < m; l++) {
            tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
            int k = l;
            while (k < m - 1 && Math.abs(e[k]) > EPS * tst1) {
                k++;
            }
            if (k > l) {
                int sweeps = 0;
                do {
                    if (++sweeps > MAX_SWEEPS) {
                        ok = false;
                        break;
                    }
                    double g = d[l];
                    double p = (d[l + 1] - g) / (2.0 * e[l]);
                    double r = hyp(p, 1.0);
                    if (p < 0) {
                        r = -r;
                    }
                    d[l] = e[l] / (p + r);
                    d[l + 1] = e[l] * (p + r);
                    double dl1 = d[l + 1];
                    double h = g - d[l];
                    for (int i = l + 2; i < m; i++) {
                        d[i] -= h;
                    }
                    f += h;
                    p = d[k];
                    double c = 1, c2 = 1, c3 = 1, s = 0, s2 = 0;
                    double el1 = e[l + 1];
                    for (int i = k - 1; i >= l; i--) {
                        c3 = c2;
                        c2 = c;
                        s2 = s;
                        g = c * e[i];
                        h = c * p;
                        r = hyp(p, e[i]);
                        e[i + 1] = s * r;
                        s = e[i] / r;
                        c = p / r;
                        p = c * d[i] - s * g;
                        d[i + 1] = h + s * (c * g + s * d[i]);
                        // rotate rows i and i+1 of zt
                        int oi = i * stride, oj = oi + stride;
                        for (int q = 0; q < m; q++) {
                            double zi = zt[oi + q], zj = zt[oj + q];
                            zt[oj + q] = s * zi + c * zj;
                            zt[oi + q] = c * zi - s * zj;
                        }
                    }
                    p = -s * s2 * c3 * el1 * e[l] / dl1;
                    e[l] = s * p;
                    d[l] = c * p;
                } while (Math.abs(e[l]) > EPS * tst1);
            }
            d[l] = d[l] + f;
            e[l] = 0;
        }
        return ok;
    }

    /**
     * Sorts d ascending and permutes the rows of zt (row stride {@code stride}, m used columns) alongside.
     */
    public static void sortAscending(int m, double[] d, double[] zt, int stride) {
        // selection sort with row swaps: O(m²) comparisons, O(m) row swaps, nothing allocated
        for (int i = 0; i < m - 1; i++) {
            int k = i;
            double p = d[i];
            for (int j = i + 1; j < m; j++) {
                if (d[j] < p) {
                    k = j;
                    p = d[j];
                }
            }
            if (k != i) {
                d[k] = d[i];
                d[i] = p;
                int oi = i * stride, ok = k * stride;
                for (int q = 0; q < m; q++) {
                    double t = zt[oi + q];
                    zt[oi + q] = zt[ok + q];
                    zt[ok + q] = t;
                }
            }
        }
    }

    /** sqrt(a² + b²) without overflow or destructive underflow (cheaper than Math.hypot). */
    static double hyp(double a, double b) {
        double x = Math.abs(a), y = Math.abs(b);
        if (x < y) {
            double t = x;
            x = y;
            y = t;
        }
        if (x == 0) {
            return 0;
        }
        double q = y / x;
        return x * Math.sqrt(1 + q * q);
    }
}
