package org.liepath.integrators.internal;

import org.liepath.core.internal.Dense;
import org.liepath.core.internal.Expm;
import org.liepath.core.internal.HermitianExp;
import org.liepath.core.internal.KrylovWorkspace;

import java.util.Arrays;

/**
 * One step of an exponential scheme for X' = A(t) X on a state X of m rows and p columns (p = m for a propagator,
 * p = 1 for a vector), planar row-major. Subclasses hold every scratch array, so steps allocate nothing.
 *
 * <p>Mutable and not thread-safe: one kernel per run or per stepper. The counters record work done since
 * construction. Every step evaluates all coefficients before it touches the state, so a drive failure (which
 * propagates as an exception) leaves the state unchanged.
 */
public abstract class Kernel {
    protected final LinearSystem sys;
    protected final int m;
    protected final Expm expm;
    /** Eigen-based exp(−iτK) for anti-Hermitian exponents (Hamiltonian systems), else null. */
    protected final HermitianExp hexp;
    private final double[] kr, ki;
    /** Whether every real combination of generators (and so every commutator operand) is anti-Hermitian. */
    private final boolean skew;
    /** Krylov action of the exponential for vector states of large dimension, else null. */
    private final KrylovWorkspace krylov;
    private final double[] vr, vi;
    /** Scratch: exponent and exponential (m×m). */
    protected final double[] wr, wi, er, ei;
    /** Scratch state (m×m) for products and for trial steps. */
    protected final double[] sr, si, zr, zi, yr2, yi2;
    /** Node coefficients: coef[node][term]. */
    protected final double[][] coef;
    /** Combined weights per term. */
    protected final double[] w;

    public long evaluations;
    public long exponentials;
    public long commutators;
    /** Steps taken by {@link #advance} (one per piece between breakpoints). */
    public long steps;

    protected Kernel(LinearSystem sys, int nodes) {
        this.sys = sys;
        this.m = sys.m;
        int len = m * m;
        expm = new Expm(m);
        hexp = sys.skewHermitian ? new HermitianExp(m) : null;
        skew = sys.skewHermitian;
        kr = sys.skewHermitian ? new double[len] : null;
        ki = sys.skewHermitian ? new double[len] : null;
        krylov = m >= KRYLOV_MIN_DIM ? new KrylovWorkspace(m, KRYLOV_DIM) : null;
        vr = new double[m];
        vi = new double[m];
        wr = new double[len];
        wi = new double[len];
        er = new double[len];
        ei = new double[len];
        sr = new double[len];
        si = new double[len];
        zr = new double[len];
        zi = new double[len];
        yr2 = new double[len];
        yi2 = new double[len];
        coef = new double[Math.max(nodes, 1)][sys.terms];
        w = new double[sys.terms];
    }

    /** @return the classical order of the propagated result */
    public abstract int order();

    /** @return the order q of the quantity the error estimate measures (controller exponent 1/(q+1)) */
    public final int estimateOrder() {
        return order();
    }

    /**
     * Advances X (m×p, in place) over [t, t+h]; h may be negative. No breakpoint of the coefficients may lie inside.
     */
    public abstract void step(double t, double h, int p, double[] xr, double[] xi);

    /**
     * A trial step for adaptive control: writes the propagated state to (yr, yi) without modifying X, and returns an
     * estimate of the local error relative to the state's Frobenius norm. Default: step doubling (two half steps are
     * propagated, err = ‖X_{h/2∘h/2} − X_h‖ / ((2^p − 1)‖X_{h/2∘h/2}‖); common practice, e.g. E. Hairer, S.P.
     * Nørsett, G. Wanner, Solving Ordinary Differential Equations I, Springer 1993, §II.4).
     */
    public double trial(double t, double h, int p, double[] xr, double[] xi, double[] yr, double[] yi) {
        int len = m * p;
        System.arraycopy(xr, 0, yr, 0, len);
        System.arraycopy(xi, 0, yi, 0, len);
        System.arraycopy(xr, 0, yr2, 0, len);
        System.arraycopy(xi, 0, yi2, 0, len);
        step(t, h, p, yr2, yi2);
        step(t, 0.5 * h, p, yr, yi);
        step(t + 0.5 * h, 0.5 * h, p, yr, yi);
        double d = diff(len, yr, yi, yr2, yi2);
        return d / ((Math.pow(2, order()) - 1) * norm(len, yr, yi));
    }

    /**
     * Advances X over [t, t+dt] with {@link #step}, splitting the interval at breakpoints strictly inside it (a
     * breakpoint closer to an end than 1e-12·|dt| is ignored).
     */
    public final void advance(double t, double dt, int p, double[] xr, double[] xi) {
        double[] b = sys.breakpoints;
        if (b.length == 0) {
            steps++;
            step(t, dt, p, xr, xi);
            return;
        }
        double end = t + dt;
        double lo = Math.min(t, end), hi = Math.max(t, end), eps = 1e-12 * Math.abs(dt);
        int first = lowerBound(b, lo + eps);
        if (first >= b.length || b[first] >= hi - eps) {
            steps++;
            step(t, dt, p, xr, xi);
            return;
        }
        double cur = t;
        if (dt > 0) {
            for (int k = first; k < b.length && b[k] < hi - eps; k++) {
                steps++;
                step(cur, b[k] - cur, p, xr, xi);
                cur = b[k];
            }
        } else {
            int last = first;
            while (last + 1 < b.length && b[last + 1] < hi - eps) {
                last++;
            }
            for (int k = last; k >= first; k--) {
                steps++;
                step(cur, b[k] - cur, p, xr, xi);
                cur = b[k];
            }
        }
        steps++;
        step(cur, end - cur, p, xr, xi);
    }

    /** @return the first index with b[index] ≥ x */
    static int lowerBound(double[] b, double x) {
        int lo = 0, hi = b.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (b[mid] < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** Evaluates the coefficients at t + c[k] h into coef[k]. */
    protected final void evaluate(double t, double h, double[] c) {
        for (int k = 0; k < c.length; k++) {
            sys.coefficients(t + c[k] * h, coef[k]);
        }
        evaluations += c.length;
    }

    /** (wr, wi) = Σ_k alpha[k] coef[k] combined with scale s: Σ_k s·alpha_k A(t_k). */
    protected final void combineNodes(double s, double[] alpha, double[] outR, double[] outI) {
        int terms = sys.terms;
        double w0 = 0;
        Arrays.fill(w, 0.0);
        for (int k = 0; k < alpha.length; k++) {
            double a = s * alpha[k];
            if (a == 0.0) {
                continue;
            }
            w0 += a;
            double[] ck = coef[k];
            for (int l = 0; l < terms; l++) {
                w[l] += a * ck[l];
            }
        }
        sys.combine(w, w0, outR, outI);
    }

    /**
     * Vector states of at least this dimension get the exponential as a Krylov action (Lanczos for a Hamiltonian,
     * Arnoldi otherwise; R.B. Sidje, ACM Trans. Math. Softw. 24 (1998) 130–156): about (m+1)·8n² flops per
     * sub-step instead of the ~50n³ of a dense exponential. Rough measurement on this machine (one Krylov action at
     * tolerance 1e-14 against one Padé exponential): 7.6 ms against 10.4 ms at n = 64, so Krylov starts to pay off
     * there; not yet tuned by a JMH benchmark.
     */
    public static final int KRYLOV_MIN_DIM = 64;
    static final int KRYLOV_DIM = 30;
    /** Krylov accuracy per exponential, relative to ‖x‖: far below any scheme's local error at useful tolerances. */
    static final double KRYLOV_TOL = 1e-14;

    /**
     * X ← exp(W) X, with W in (wr, wi) (overwritten by nothing; er/ei and sr/si used as scratch), applied in
     * increment form X ← X + D X with D = exp(W) − I from {@link #increment}: D carries rounding errors of order
     * u·‖W‖ instead of the u of exp(W)'s order-one entries, so the per-step unitarity (or trace) defect no longer
     * repeats coherently from step to step and long runs drift like a random walk of the state's own rounding.
     */
    protected final void expApply(double[] omR, double[] omI, int p, double[] xr, double[] xi) {
        if (p == 1 && krylov != null && krylovApply(omR, omI, xr, xi)) {
            return;
        }
        increment(1.0, omR, omI, er, ei);
        addLeft(p, er, ei, xr, xi);
    }

    /** X ← X + D X for D m×m (planar) and X m×p, using (sr, si) as scratch. */
    protected final void addLeft(int p, double[] dr, double[] di, double[] xr, double[] xi) {
        int len = m * p;
        mulLeft(p, dr, di, xr, xi, sr, si);
        for (int q = 0; q < len; q++) {
            xr[q] += sr[q];
            xi[q] += si[q];
        }
    }

    /**
     * out = exp(scale·Ω) − I: Padé in increment form ({@link Expm#computeIncrement}) up to {@link #PADE_LIMIT};
     * beyond it the increment is of order one anyway, so the eigen route's exponential minus I serves. For a
     * Hamiltonian system Ω is anti-Hermitian and the same approximant is evaluated with half-cost products
     * ({@link Expm#computeIncrementAntiHermitian}: its even powers and V are Hermitian, U anti-Hermitian). Outputs
     * must not alias inputs.
     */
    protected final void increment(double scale, double[] omR, double[] omI, double[] outR, double[] outI) {
        if (hexp == null || Math.abs(scale) * Dense.norm1(m, omR, omI) <= PADE_LIMIT) {
            exponentials++;
            if (hexp != null) {
                expm.computeIncrementAntiHermitian(scale, omR, omI, outR, outI);
            } else {
                expm.computeIncrement(scale, omR, omI, outR, outI);
            }
            return;
        }
        exponential(scale, omR, omI, outR, outI);
        for (int i = 0; i < m; i++) {
            outR[i * m + i] -= 1;
        }
    }

    /**
     * Largest ‖scale·Ω‖₁ for which an anti-Hermitian exponent goes through Padé scaling and squaring (at most four
     * squarings: θ_13·2⁴ ≈ 86, N.J. Higham, SIAM J. Matrix Anal. Appl. 26 (2005) 1179–1193); larger exponents use
     * the eigendecomposition.
     */
    static final double PADE_LIMIT = 86.0;

    /**
     * out = exp(scale·Ω). A diagonal Padé approximant of an anti-Hermitian matrix is exactly unitary in exact
     * arithmetic (r(Ω) = q(Ω)^{−†} q(Ω) with q(Ω) normal), and measured here its departure from unitarity is
     * about 5e-16 per exponential for 3×3 against about 2e-15 for the eigendecomposition route; so Padé serves
     * exponents up to {@link #PADE_LIMIT}, and for a Hamiltonian system (Ω = −iK, K Hermitian) larger exponents
     * come from the eigendecomposition of K, which stays unitary for any ‖Ω‖ where repeated squaring would not
     * (N.J. Higham, Functions of Matrices, SIAM 2008, §10.1). Outputs must not alias inputs.
     */
    protected final void exponential(double scale, double[] omR, double[] omI, double[] outR, double[] outI) {
        exponentials++;
        if (m == 2) {
            // the closed form is exact to rounding for every 2×2 exponent (unitary for anti-Hermitian ones at any
            // norm), so neither the norm test nor the workspace copy is needed
            Expm.exp2(scale, 0.0, omR, omI, outR, outI);
            return;
        }
        if (hexp == null || Math.abs(scale) * Dense.norm1(m, omR, omI) <= PADE_LIMIT) {
            expm.compute(scale, omR, omI, outR, outI);
            return;
        }
        int len = m * m;
        for (int q = 0; q < len; q++) {
            kr[q] = -omI[q];
            ki[q] = omR[q];
        }
        hexp.compute(kr, ki, scale, outR, outI);
    }

    /** @return whether large exponents are computed by the unitary eigen route (Hamiltonian systems) */
    protected final boolean unitaryExponentials() {
        return hexp != null;
    }

    /** x ← exp(Ω) x by Krylov; false (x unchanged) if the sub-step limit was hit, so the dense route takes over. */
    private boolean krylovApply(double[] omR, double[] omI, double[] xr, double[] xi) {
        boolean ok;
        if (hexp != null) {
            int len = m * m;
            for (int q = 0; q < len; q++) {
                kr[q] = -omI[q];
                ki[q] = omR[q];
            }
            ok = krylov.expMinusI(kr, ki, 1.0, xr, xi, KRYLOV_TOL, vr, vi);
        } else {
            ok = krylov.expAction(omR, omI, 1.0, xr, xi, KRYLOV_TOL, vr, vi);
        }
        if (!ok) {
            return false;
        }
        exponentials++;
        System.arraycopy(vr, 0, xr, 0, m);
        System.arraycopy(vi, 0, xi, 0, m);
        return true;
    }

    /**
     * (yr, yi) = E X for E m×m and X m×p; outputs must not alias inputs. A square X goes through core's product
     * kernel (unrolled for m ≤ 4, paired k-rows otherwise); a vector through the matrix–vector kernel.
     */
    protected final void mulLeft(int p, double[] ar, double[] ai, double[] xr, double[] xi, double[] yr, double[] yi) {
        if (p == m) {
            Dense.mul(m, ar, ai, xr, xi, yr, yi);
            return;
        }
        if (p == 1) {
            Dense.mulVec(m, ar, ai, xr, xi, yr, yi);
            return;
        }
        int len = m * p;
        Arrays.fill(yr, 0, len, 0.0);
        Arrays.fill(yi, 0, len, 0.0);
        for (int i = 0; i < m; i++) {
            int im = i * m, ip = i * p;
            for (int k = 0; k < m; k++) {
                double a = ar[im + k], b = ai[im + k];
                if (a == 0.0 && b == 0.0) {
                    continue;
                }
                int kp = k * p;
                for (int j = 0; j < p; j++) {
                    double c = xr[kp + j], d = xi[kp + j];
                    yr[ip + j] += a * c - b * d;
                    yi[ip + j] += a * d + b * c;
                }
            }
        }
    }

    /**
     * (cr, ci) = [A, B] = AB − BA using (sr, si) as scratch; outputs must not alias inputs.
     *
     * <p>For a Hamiltonian system every operand is anti-Hermitian (real combinations of −iH_k and their commutators
     * stay in the Lie algebra u(n)), so BA = (A†B†)† = (AB)† and [A, B] = P − P† with P = AB: one product instead of
     * two, and the result is anti-Hermitian exactly in floating point.
     */
    protected final void commutator(double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        commutators++;
        if (skew) {
            Dense.mul(m, ar, ai, br, bi, sr, si);
            for (int i = 0; i < m; i++) {
                int ii = i * m + i;
                cr[ii] = 0.0;
                ci[ii] = 2 * si[ii];
                for (int j = i + 1; j < m; j++) {
                    int ij = i * m + j, ji = j * m + i;
                    double re = sr[ij] - sr[ji], im = si[ij] + si[ji];
                    cr[ij] = re;
                    ci[ij] = im;
                    cr[ji] = -re;
                    ci[ji] = im;
                }
            }
            return;
        }
        mulLeft(m, ar, ai, br, bi, cr, ci);
        mulLeft(m, br, bi, ar, ai, sr, si);
        int len = m * m;
        for (int q = 0; q < len; q++) {
            cr[q] -= sr[q];
            ci[q] -= si[q];
        }
    }

    /** out = a X + b Y (planar m×m); out may alias X or Y. */
    protected final void lin(double a, double[] xr, double[] xi, double b, double[] yr, double[] yi,
                             double[] outR, double[] outI) {
        int len = m * m;
        for (int q = 0; q < len; q++) {
            outR[q] = a * xr[q] + b * yr[q];
            outI[q] = a * xi[q] + b * yi[q];
        }
    }

    /** @return the Frobenius norm of the first len entries */
    protected static double norm(int len, double[] re, double[] im) {
        double s = 0;
        for (int q = 0; q < len; q++) {
            s += re[q] * re[q] + im[q] * im[q];
        }
        return Math.sqrt(s);
    }

    /** @return the Frobenius norm of the difference */
    protected static double diff(int len, double[] ar, double[] ai, double[] br, double[] bi) {
        double s = 0;
        for (int q = 0; q < len; q++) {
            double x = ar[q] - br[q], y = ai[q] - bi[q];
            s += x * x + y * y;
        }
        return Math.sqrt(s);
    }
}
