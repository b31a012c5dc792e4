package org.liepath.integrators.internal;

import org.liepath.core.internal.Dense;
import org.liepath.core.internal.Expm;
import org.liepath.core.internal.HermitianExp;
import org.liepath.core.internal.KrylovWorkspace;
import org.liepath.core.internal.Skew3;

import java.util.Arrays;

/**
 * One step of an exponential scheme for X' = A(t) X on a state X of m rows and p columns (p = m for a propagator,
 * p = 1 for a vector), planar row-major. Subclasses hold every scratch array, so steps allocate nothing.
 *
 * <p>Three-level Hamiltonian systems take a packed route ({@link Skew3}): every exponent is exponentiated on its
 * nine reals, and kernels that form their exponents packed ({@link MagnusKernel}) combine node values packed too.
 *
 * <p>Mutable and not thread-safe: one kernel per run or per stepper (a run may take over the kernel of its thread's
 * previous run, see {@link #reset}). The counters record work done since construction or the last reset. Every step evaluates all coefficients before it touches the state, so a drive failure (which
 * propagates as an exception) leaves the state unchanged.
 */
public abstract class Kernel {
    protected final LinearSystem sys;
    protected final int m;
    /** Padé workspace, created on first use (the packed three-level route needs it only for exponents beyond its
     * limit; a workspace per run costs more than the few steps of a small run). */
    private Expm expm;
    /** Eigen-based exp(−iτK) for anti-Hermitian exponents (Hamiltonian systems), else null. */
    private HermitianExp hexp;
    /** Scratch of the eigen and Krylov routes, created on first use. */
    private double[] kr, ki;
    /** Whether every real combination of generators (and so every commutator operand) is anti-Hermitian. */
    private final boolean skew;
    /** Krylov action of the exponential for vector states of large dimension, else null. */
    private final KrylovWorkspace krylov;
    private final double[] vr, vi;
    /** Scratch: exponent and exponential (m×m). */
    protected final double[] wr, wi, er, ei;
    /** Scratch state (m×m) for products. */
    protected final double[] sr, si;
    /** Scratch of {@link #trial}, created on first use (fixed-step runs never need it). */
    private double[] yr2, yi2;
    /** Node coefficients: coef[node][term]. */
    protected final double[][] coef;
    /** Combined weights per term. */
    protected final double[] w;
    /** The per-step interaction picture for a system from {@link LinearSystem#interaction}, else null. */
    final InteractionFrame frame;
    /** Scratch for the frame's basis change (m×m), null without a frame. */
    private final double[] fr1, fi1;
    /** The frame's origin t_r and the midpoint of the step being taken. */
    private double frameOrigin, frameMid;
    /**
     * Packed arithmetic for Hamiltonian systems of three levels ({@link Skew3}), else null: exponents are formed and
     * exponentiated on the nine reals that fix a 3×3 anti-Hermitian matrix.
     */
    protected final Skew3 skew3;
    /** Scratch for a packed exponent taken from planar arrays, and for its planar copy on the eigen route. */
    private final double[] packedW, unpackedR, unpackedI;

    public long evaluations;
    public long exponentials;
    public long commutators;
    /** Steps taken by {@link #advance} (one per piece between breakpoints). */
    public long steps;

    /**
     * Readies the kernel for another run: the counters restart from zero. Everything else a run reads is either
     * written by the run before it is read (scratch, the frame's origin) or depends on the system and step size
     * alone (the frame's cached node phases), so a reused kernel computes bit for bit what a new one would.
     */
    public final void reset() {
        evaluations = 0;
        exponentials = 0;
        commutators = 0;
        steps = 0;
    }

    /** @return the system this kernel steps */
    public final LinearSystem system() {
        return sys;
    }

    protected Kernel(LinearSystem sys, int nodes) {
        this(sys, nodes, true);
    }

    /** @param allowPacked whether three-level Hamiltonian systems take the packed route (false: planar, for tests) */
    Kernel(LinearSystem sys, int nodes, boolean allowPacked) {
        this(sys, nodes, allowPacked, false);
    }

    /**
     * @param allowPacked       whether three-level Hamiltonian systems take the packed route
     * @param packedCombination whether the subclass combines node values only through {@link #combinePacked} when
     *                          packed (the interaction frame then keeps packed tables alone)
     */
    Kernel(LinearSystem sys, int nodes, boolean allowPacked, boolean packedCombination) {
        this.sys = sys;
        this.m = sys.m;
        int len = m * m;
        skew = sys.skewHermitian;
        krylov = m >= KRYLOV_MIN_DIM ? new KrylovWorkspace(m, KRYLOV_DIM) : null;
        vr = new double[m];
        vi = new double[m];
        wr = new double[len];
        wi = new double[len];
        er = new double[len];
        ei = new double[len];
        sr = new double[len];
        si = new double[len];
        coef = Scratch.rows(Math.max(nodes, 1), sys.terms);
        w = new double[sys.terms];
        frame = sys.isInteractionPicture() ? new InteractionFrame(sys, nodes,
                (long) Math.max(nodes, 1) * sys.terms * m * m <= InteractionFrame.TABLE_LIMIT,
                packedCombination && allowPacked) : null;
        boolean change = frame != null && !frame.diagonal();
        fr1 = change ? new double[len] : null;
        fi1 = change ? new double[len] : null;
        boolean packed = allowPacked && m == 3 && skew;
        skew3 = packed ? new Skew3() : null;
        packedW = packed ? new double[Skew3.LEN] : null;
        unpackedR = packed ? new double[len] : null;
        unpackedI = packed ? new double[len] : null;
    }

    private void skewScratch() {
        if (kr == null) {
            kr = new double[m * m];
            ki = new double[m * m];
        }
    }

    /** @return the Padé workspace, created on first use */
    private Expm expm() {
        if (expm == null) {
            expm = new Expm(m);
        }
        return expm;
    }

    /**
     * @return whether every entry of X (len entries) is finite (independent comparisons, false for NaN; a running sum
     *     would chain its additions)
     */
    static boolean finite(int len, double[] xr, double[] xi) {
        for (int q = 0; q < len; q++) {
            if (!(Math.abs(xr[q]) <= Double.MAX_VALUE && Math.abs(xi[q]) <= Double.MAX_VALUE)) {
                return false;
            }
        }
        return true;
    }

    /** @return whether exponents of this kernel are packed 3×3 anti-Hermitian matrices ({@link Skew3}) */
    protected final boolean packed() {
        return skew3 != null;
    }

    /**
     * out_i = Σ_j scale_i·alpha_i[j] A(t_j) packed, for i &lt; count ≤ 4 (three-level Hamiltonian systems, after
     * {@link #evaluate}); in the interaction picture the node values of the step's frame.
     */
    protected final void combinePacked(int count, double[] scale, double[][] alpha, double[][] out) {
        if (frame != null) {
            frame.combinationsPacked(count, scale, alpha, coef, out);
            return;
        }
        for (int i = 0; i < count; i++) {
            double[] o = out[i];
            double w0 = nodeWeights(scale[i], alpha[i], w);
            if (sys.packed0 != null) {
                for (int q = 0; q < Skew3.LEN; q++) {
                    o[q] = w0 * sys.packed0[q];
                }
            } else {
                Arrays.fill(o, 0.0);
            }
            double[][] packedG = sys.packed;
            int[][] packedNz = sys.packedNz;
            for (int k = 0; k < packedG.length; k++) {
                double c = w[k];
                if (c == 0.0) {
                    continue;
                }
                double[] g = packedG[k];
                for (int q : packedNz[k]) {
                    o[q] += c * g[q];
                }
            }
        }
    }

    /**
     * X ← exp(Ω) X for a packed exponent Ω (three levels; Ω is modified in the interaction picture, carried to the
     * frame of the origin), in the increment form of {@link #expApply}.
     */
    protected final void expApplyPacked(double[] om, int p, double[] xr, double[] xi) {
        if (frame != null) {
            frame.conjugatePacked(frameMid - frameOrigin, om);
        }
        incrementPacked(1.0, om, er, ei);
        addLeft(p, er, ei, xr, xi);
    }

    /** out = exp(scale·Ω) − I for a packed Ω, as {@link #increment} (Padé up to its limit, else the eigen route). */
    private void incrementPacked(double scale, double[] om, double[] outR, double[] outI) {
        exponentials++;
        if (skew3.increment(scale, om, outR, outI, PADE_LIMIT)) {
            return;
        }
        exponentials--; // counted again by exponential()
        Skew3.unpack(om, unpackedR, unpackedI);
        exponential(scale, unpackedR, unpackedI, outR, outI);
        for (int i = 0; i < m; i++) {
            outR[i * m + i] -= 1;
        }
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
        if (yr2 == null) {
            yr2 = new double[m * m];
            yi2 = new double[m * m];
        }
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
        int first = interior(t, dt);
        steps++;
        if (first < 0) {
            // the whole step as given (not (t + dt) − t, which may round differently from dt)
            step(t, dt, p, xr, xi);
            return;
        }
        double[] b = sys.breakpoints;
        double cur = t;
        for (int q = 0, count = lastInterior - first; q <= count; q++) {
            int k = dt > 0 ? first + q : lastInterior - q;
            steps++;
            step(cur, b[k] - cur, p, xr, xi);
            cur = b[k];
        }
        step(cur, t + dt - cur, p, xr, xi);
    }

    /**
     * The local error estimates of {@link #trial} summed over the pieces into which {@link #advance} would split
     * [t, t+dt], each piece measured on the same state X (not modified; the trial results land in (yr, yi)).
     *
     * @return the sum of the pieces' relative local error estimates
     */
    public final double trialPieces(double t, double dt, int p, double[] xr, double[] xi, double[] yr, double[] yi) {
        int first = interior(t, dt);
        if (first < 0) {
            return trial(t, dt, p, xr, xi, yr, yi);
        }
        double[] b = sys.breakpoints;
        double cur = t, sum = 0;
        for (int q = 0, count = lastInterior - first; q <= count; q++) {
            int k = dt > 0 ? first + q : lastInterior - q;
            sum += trial(cur, b[k] - cur, p, xr, xi, yr, yi);
            cur = b[k];
        }
        return sum + trial(cur, t + dt - cur, p, xr, xi, yr, yi);
    }

    /** Index of the last breakpoint found by the latest {@link #interior} call. */
    private int lastInterior;

    /**
     * The breakpoints strictly inside [t, t+dt] (ignoring those within 1e-12·|dt| of an end), as the index range
     * [first, {@link #lastInterior}] of the ascending breakpoints.
     *
     * @return the first index, or −1 if there is none
     */
    private int interior(double t, double dt) {
        double[] b = sys.breakpoints;
        if (b.length == 0) {
            return -1;
        }
        double end = t + dt;
        double lo = Math.min(t, end), hi = Math.max(t, end), eps = 1e-12 * Math.abs(dt);
        int first = lowerBound(b, lo + eps);
        if (first >= b.length || b[first] >= hi - eps) {
            return -1;
        }
        int last = first;
        while (last + 1 < b.length && b[last + 1] < hi - eps) {
            last++;
        }
        lastInterior = last;
        return first;
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

    /**
     * Evaluates the coefficients at t + c[k] h into coef[k]; in the interaction picture also the node matrices of
     * the step's frame.
     */
    protected final void evaluate(double t, double h, double[] c) {
        for (int k = 0; k < c.length; k++) {
            sys.coefficients(t + c[k] * h, coef[k]);
        }
        evaluations += c.length;
        if (frame != null) {
            frameMid = t + 0.5 * h;
            frame.phases(h, c);
            if (!frame.table) {
                frame.nodes(coef, c.length);
            }
        }
    }

    /** (wr, wi) = Σ_k alpha[k] coef[k] combined with scale s: Σ_k s·alpha_k A(t_k). */
    protected final void combineNodes(double s, double[] alpha, double[] outR, double[] outI) {
        if (frame != null) {
            frame.combination(s, alpha, coef, outR, outI);
            return;
        }
        sys.combine(w, nodeWeights(s, alpha, w), outR, outI);
    }

    /**
     * out[l] = Σ_k s·alpha[k]·coef[k][l] for the driven terms l (the weights of Σ_k s·alpha_k A(t_k) on the
     * generators); entries of out beyond the terms are cleared.
     *
     * @return the weight Σ_k s·alpha_k of the constant part G_0
     */
    protected final double nodeWeights(double s, double[] alpha, double[] out) {
        int terms = sys.terms;
        double w0 = 0;
        Arrays.fill(out, 0.0);
        for (int k = 0; k < alpha.length; k++) {
            double a = s * alpha[k];
            if (a == 0.0) {
                continue;
            }
            w0 += a;
            double[] ck = coef[k];
            for (int l = 0; l < terms; l++) {
                out[l] += a * ck[l];
            }
        }
        return w0;
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
        if (frame != null) {
            // the exponent was formed about the step's midpoint: carry it to the frame of the origin
            frame.conjugate(frameMid - frameOrigin, omR, omI);
        }
        if (p == 1 && krylov != null && krylovApply(omR, omI, xr, xi)) {
            return;
        }
        increment(1.0, omR, omI, er, ei);
        addLeft(p, er, ei, xr, xi);
    }

    /**
     * @return whether this kernel's states live in an interaction frame (see {@link InteractionFrame}): callers
     *     bring states in with {@link #toFrame} and out with {@link #fromFrame}
     */
    public final boolean inFrame() {
        return frame != null;
    }

    /**
     * X ← V† X (m×p, in place): a state at time origin into the interaction frame of origin t_r = origin, for the
     * steps that follow (no-op without a frame).
     */
    public final void toFrame(double origin, int p, double[] xr, double[] xi) {
        if (frame == null) {
            return;
        }
        frameOrigin = origin;
        if (frame.diagonal()) {
            return;
        }
        int len = m * p;
        mulLeft(p, frame.vhr, frame.vhi, xr, xi, fr1, fi1);
        System.arraycopy(fr1, 0, xr, 0, len);
        System.arraycopy(fi1, 0, xi, 0, len);
    }

    /**
     * out = V e^{−iD(t−t_r)} X: the state of time t back in the Hamiltonian's basis (a copy without a frame).
     * Outputs must not alias inputs.
     */
    public final void fromFrame(double t, int p, double[] xr, double[] xi, double[] outR, double[] outI) {
        int len = m * p;
        if (frame == null || frame.diagonal()) {
            System.arraycopy(xr, 0, outR, 0, len);
            System.arraycopy(xi, 0, outI, 0, len);
            if (frame != null) {
                frame.phaseRows(t - frameOrigin, p, outR, outI);
            }
            return;
        }
        System.arraycopy(xr, 0, fr1, 0, len);
        System.arraycopy(xi, 0, fi1, 0, len);
        frame.phaseRows(t - frameOrigin, p, fr1, fi1);
        mulLeft(p, frame.vr, frame.vi, fr1, fi1, outR, outI);
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
     * out = exp(scale·Ω) − I: Padé in increment form ({@link Expm#computeIncrement}). For a Hamiltonian system Ω
     * is anti-Hermitian and the same approximant is evaluated with half-cost products
     * ({@link Expm#computeIncrementAntiHermitian}: its even powers and V are Hermitian, U anti-Hermitian), up to
     * {@link #PADE_LIMIT} on the 1-norm that selects the degree (after the workspace's Gershgorin-centre shift);
     * beyond it the increment is of order one anyway, so the eigen route's exponential minus I serves. Outputs
     * must not alias inputs.
     */
    protected final void increment(double scale, double[] omR, double[] omI, double[] outR, double[] outI) {
        if (skew3 != null) {
            Skew3.pack(omR, omI, packedW);
            incrementPacked(scale, packedW, outR, outI);
            return;
        }
        if (!skew) {
            exponentials++;
            expm().computeIncrement(scale, omR, omI, outR, outI);
            return;
        }
        // the workspace tests the norm it selects the degree by (after removing the Gershgorin centre, so a large
        // energy offset alone does not force the eigen route); m ≤ 2 always proceeds (closed forms)
        if (expm().computeIncrementAntiHermitian(scale, omR, omI, outR, outI, PADE_LIMIT)) {
            exponentials++;
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
        if (!skew || Math.abs(scale) * Dense.norm1(m, omR, omI) <= PADE_LIMIT) {
            expm().compute(scale, omR, omI, outR, outI);
            return;
        }
        int len = m * m;
        skewScratch();
        for (int q = 0; q < len; q++) {
            kr[q] = -omI[q];
            ki[q] = omR[q];
        }
        if (hexp == null) {
            hexp = new HermitianExp(m);
        }
        hexp.compute(kr, ki, scale, outR, outI);
    }

    /** @return whether large exponents are computed by the unitary eigen route (Hamiltonian systems) */
    protected final boolean unitaryExponentials() {
        return skew;
    }

    /** x ← exp(Ω) x by Krylov; false (x unchanged) if the sub-step limit was hit, so the dense route takes over. */
    private boolean krylovApply(double[] omR, double[] omI, double[] xr, double[] xi) {
        boolean ok;
        if (skew) {
            int len = m * m;
            skewScratch();
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
        bracket(1.0, ar, ai, br, bi, cr, ci);
    }

    /**
     * (cr, ci) = s·[A, B], as {@link #commutator} (and counted as one); the scale is applied to each difference, so
     * s·[A, B] has the bits of [A, B] scaled afterwards, without the extra pass.
     */
    protected final void commutator(double s, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                                    double[] ci) {
        commutators++;
        bracket(s, ar, ai, br, bi, cr, ci);
    }

    /** s·[A, B] without counting (also the route of the stored generator pairs, see {@link GeneratorPairs}). */
    final void bracket(double s, double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        if (skew && m == 3) {
            if (Dense.FUSED) {
                skewBracket3Fused(s, ar, ai, br, bi, cr, ci);
            } else {
                skewBracket3(s, ar, ai, br, bi, cr, ci);
            }
            return;
        }
        if (skew && m == 2) {
            skewBracket2(s, ar, ai, br, bi, cr, ci);
            return;
        }
        if (skew) {
            Dense.mul(m, ar, ai, br, bi, sr, si);
            for (int i = 0; i < m; i++) {
                int ii = i * m + i;
                cr[ii] = 0.0;
                ci[ii] = s * (2 * si[ii]);
                for (int j = i + 1; j < m; j++) {
                    int ij = i * m + j, ji = j * m + i;
                    double re = s * (sr[ij] - sr[ji]), im = s * (si[ij] + si[ji]);
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
            cr[q] = s * (cr[q] - sr[q]);
            ci[q] = s * (ci[q] - si[q]);
        }
    }

    /**
     * s·(P − P†) with P = AB for anti-Hermitian 2×2 operands, unrolled so that the entries of P stay in registers
     * instead of passing through a scratch product (same arithmetic as the general route up to summation order).
     */
    private static void skewBracket2(double s, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                                      double[] ci) {
        double ar00 = ar[0], ai00 = ai[0], ar01 = ar[1], ai01 = ai[1];
        double ar10 = ar[2], ai10 = ai[2], ar11 = ar[3], ai11 = ai[3];
        double br00 = br[0], bi00 = bi[0], br01 = br[1], bi01 = bi[1];
        double br10 = br[2], bi10 = bi[2], br11 = br[3], bi11 = bi[3];
        cr[0] = 0.0;
        ci[0] = s * (2 * (ar00 * bi00 + ai00 * br00 + ar01 * bi10 + ai01 * br10));
        cr[3] = 0.0;
        ci[3] = s * (2 * (ar10 * bi01 + ai10 * br01 + ar11 * bi11 + ai11 * br11));
        double pr01 = ar00 * br01 - ai00 * bi01 + ar01 * br11 - ai01 * bi11;
        double pr10 = ar10 * br00 - ai10 * bi00 + ar11 * br10 - ai11 * bi10;
        double pi01 = ar00 * bi01 + ai00 * br01 + ar01 * bi11 + ai01 * br11;
        double pi10 = ar10 * bi00 + ai10 * br00 + ar11 * bi10 + ai11 * br10;
        double re01 = s * (pr01 - pr10), im01 = s * (pi01 + pi10);
        cr[1] = re01;
        ci[1] = im01;
        cr[2] = -re01;
        ci[2] = im01;
    }

    /**
     * s·(P − P†) with P = AB for anti-Hermitian 3×3 operands, unrolled so that the entries of P stay in registers
     * instead of passing through a scratch product (same arithmetic as the general route up to summation order).
     */
    static void skewBracket3(double s, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                                      double[] ci) {
        double ar00 = ar[0], ai00 = ai[0], ar01 = ar[1], ai01 = ai[1], ar02 = ar[2], ai02 = ai[2];
        double ar10 = ar[3], ai10 = ai[3], ar11 = ar[4], ai11 = ai[4], ar12 = ar[5], ai12 = ai[5];
        double ar20 = ar[6], ai20 = ai[6], ar21 = ar[7], ai21 = ai[7], ar22 = ar[8], ai22 = ai[8];
        double br00 = br[0], bi00 = bi[0], br01 = br[1], bi01 = bi[1], br02 = br[2], bi02 = bi[2];
        double br10 = br[3], bi10 = bi[3], br11 = br[4], bi11 = bi[4], br12 = br[5], bi12 = bi[5];
        double br20 = br[6], bi20 = bi[6], br21 = br[7], bi21 = bi[7], br22 = br[8], bi22 = bi[8];
        cr[0] = 0.0;
        ci[0] = s * (2 * (ar00 * bi00 + ai00 * br00 + ar01 * bi10 + ai01 * br10 + ar02 * bi20 + ai02 * br20));
        cr[4] = 0.0;
        ci[4] = s * (2 * (ar10 * bi01 + ai10 * br01 + ar11 * bi11 + ai11 * br11 + ar12 * bi21 + ai12 * br21));
        cr[8] = 0.0;
        ci[8] = s * (2 * (ar20 * bi02 + ai20 * br02 + ar21 * bi12 + ai21 * br12 + ar22 * bi22 + ai22 * br22));
        double pr01 = ar00 * br01 - ai00 * bi01 + ar01 * br11 - ai01 * bi11 + ar02 * br21 - ai02 * bi21;
        double pr10 = ar10 * br00 - ai10 * bi00 + ar11 * br10 - ai11 * bi10 + ar12 * br20 - ai12 * bi20;
        double pi01 = ar00 * bi01 + ai00 * br01 + ar01 * bi11 + ai01 * br11 + ar02 * bi21 + ai02 * br21;
        double pi10 = ar10 * bi00 + ai10 * br00 + ar11 * bi10 + ai11 * br10 + ar12 * bi20 + ai12 * br20;
        double re01 = s * (pr01 - pr10), im01 = s * (pi01 + pi10);
        cr[1] = re01;
        ci[1] = im01;
        cr[3] = -re01;
        ci[3] = im01;
        double pr02 = ar00 * br02 - ai00 * bi02 + ar01 * br12 - ai01 * bi12 + ar02 * br22 - ai02 * bi22;
        double pr20 = ar20 * br00 - ai20 * bi00 + ar21 * br10 - ai21 * bi10 + ar22 * br20 - ai22 * bi20;
        double pi02 = ar00 * bi02 + ai00 * br02 + ar01 * bi12 + ai01 * br12 + ar02 * bi22 + ai02 * br22;
        double pi20 = ar20 * bi00 + ai20 * br00 + ar21 * bi10 + ai21 * br10 + ar22 * bi20 + ai22 * br20;
        double re02 = s * (pr02 - pr20), im02 = s * (pi02 + pi20);
        cr[2] = re02;
        ci[2] = im02;
        cr[6] = -re02;
        ci[6] = im02;
        double pr12 = ar10 * br02 - ai10 * bi02 + ar11 * br12 - ai11 * bi12 + ar12 * br22 - ai12 * bi22;
        double pr21 = ar20 * br01 - ai20 * bi01 + ar21 * br11 - ai21 * bi11 + ar22 * br21 - ai22 * bi21;
        double pi12 = ar10 * bi02 + ai10 * br02 + ar11 * bi12 + ai11 * br12 + ar12 * bi22 + ai12 * br22;
        double pi21 = ar20 * bi01 + ai20 * br01 + ar21 * bi11 + ai21 * br11 + ar22 * bi21 + ai22 * br21;
        double re12 = s * (pr12 - pr21), im12 = s * (pi12 + pi21);
        cr[5] = re12;
        ci[5] = im12;
        cr[7] = -re12;
        ci[7] = im12;
    }

    /**
     * {@link #skewBracket3} with fused multiply–adds, for machines with hardware FMA ({@link Dense#FUSED}): each
     * entry of P − P† is one chain over its twelve (diagonal: six) products, rounded once per term.
     */
    static void skewBracket3Fused(double s, double[] ar, double[] ai, double[] br, double[] bi,
                                          double[] cr, double[] ci) {
        double ar00 = ar[0], ar01 = ar[1], ar02 = ar[2];
        double ar10 = ar[3], ar11 = ar[4], ar12 = ar[5];
        double ar20 = ar[6], ar21 = ar[7], ar22 = ar[8];
        double ai00 = ai[0], ai01 = ai[1], ai02 = ai[2];
        double ai10 = ai[3], ai11 = ai[4], ai12 = ai[5];
        double ai20 = ai[6], ai21 = ai[7], ai22 = ai[8];
        double br00 = br[0], br01 = br[1], br02 = br[2];
        double br10 = br[3], br11 = br[4], br12 = br[5];
        double br20 = br[6], br21 = br[7], br22 = br[8];
        double bi00 = bi[0], bi01 = bi[1], bi02 = bi[2];
        double bi10 = bi[3], bi11 = bi[4], bi12 = bi[5];
        double bi20 = bi[6], bi21 = bi[7], bi22 = bi[8];
        double d0 = ar00 * bi00;
        d0 = Math.fma(ai00, br00, d0); d0 = Math.fma(ar01, bi10, d0);
        d0 = Math.fma(ai01, br10, d0); d0 = Math.fma(ar02, bi20, d0);
        d0 = Math.fma(ai02, br20, d0);
        cr[0] = 0.0;
        ci[0] = s * (2 * d0);
        double d1 = ar10 * bi01;
        d1 = Math.fma(ai10, br01, d1); d1 = Math.fma(ar11, bi11, d1);
        d1 = Math.fma(ai11, br11, d1); d1 = Math.fma(ar12, bi21, d1);
        d1 = Math.fma(ai12, br21, d1);
        cr[4] = 0.0;
        ci[4] = s * (2 * d1);
        double d2 = ar20 * bi02;
        d2 = Math.fma(ai20, br02, d2); d2 = Math.fma(ar21, bi12, d2);
        d2 = Math.fma(ai21, br12, d2); d2 = Math.fma(ar22, bi22, d2);
        d2 = Math.fma(ai22, br22, d2);
        cr[8] = 0.0;
        ci[8] = s * (2 * d2);
        double x01 = ar00 * br01;
        x01 = Math.fma(-ai00, bi01, x01); x01 = Math.fma(ar01, br11, x01);
        x01 = Math.fma(-ai01, bi11, x01); x01 = Math.fma(ar02, br21, x01);
        x01 = Math.fma(-ai02, bi21, x01); x01 = Math.fma(-ar10, br00, x01);
        x01 = Math.fma(ai10, bi00, x01); x01 = Math.fma(-ar11, br10, x01);
        x01 = Math.fma(ai11, bi10, x01); x01 = Math.fma(-ar12, br20, x01);
        x01 = Math.fma(ai12, bi20, x01);
        double y01 = ar00 * bi01;
        y01 = Math.fma(ai00, br01, y01); y01 = Math.fma(ar01, bi11, y01);
        y01 = Math.fma(ai01, br11, y01); y01 = Math.fma(ar02, bi21, y01);
        y01 = Math.fma(ai02, br21, y01); y01 = Math.fma(ar10, bi00, y01);
        y01 = Math.fma(ai10, br00, y01); y01 = Math.fma(ar11, bi10, y01);
        y01 = Math.fma(ai11, br10, y01); y01 = Math.fma(ar12, bi20, y01);
        y01 = Math.fma(ai12, br20, y01);
        cr[1] = s * x01;
        ci[1] = s * y01;
        cr[3] = -(s * x01);
        ci[3] = s * y01;
        double x02 = ar00 * br02;
        x02 = Math.fma(-ai00, bi02, x02); x02 = Math.fma(ar01, br12, x02);
        x02 = Math.fma(-ai01, bi12, x02); x02 = Math.fma(ar02, br22, x02);
        x02 = Math.fma(-ai02, bi22, x02); x02 = Math.fma(-ar20, br00, x02);
        x02 = Math.fma(ai20, bi00, x02); x02 = Math.fma(-ar21, br10, x02);
        x02 = Math.fma(ai21, bi10, x02); x02 = Math.fma(-ar22, br20, x02);
        x02 = Math.fma(ai22, bi20, x02);
        double y02 = ar00 * bi02;
        y02 = Math.fma(ai00, br02, y02); y02 = Math.fma(ar01, bi12, y02);
        y02 = Math.fma(ai01, br12, y02); y02 = Math.fma(ar02, bi22, y02);
        y02 = Math.fma(ai02, br22, y02); y02 = Math.fma(ar20, bi00, y02);
        y02 = Math.fma(ai20, br00, y02); y02 = Math.fma(ar21, bi10, y02);
        y02 = Math.fma(ai21, br10, y02); y02 = Math.fma(ar22, bi20, y02);
        y02 = Math.fma(ai22, br20, y02);
        cr[2] = s * x02;
        ci[2] = s * y02;
        cr[6] = -(s * x02);
        ci[6] = s * y02;
        double x12 = ar10 * br02;
        x12 = Math.fma(-ai10, bi02, x12); x12 = Math.fma(ar11, br12, x12);
        x12 = Math.fma(-ai11, bi12, x12); x12 = Math.fma(ar12, br22, x12);
        x12 = Math.fma(-ai12, bi22, x12); x12 = Math.fma(-ar20, br01, x12);
        x12 = Math.fma(ai20, bi01, x12); x12 = Math.fma(-ar21, br11, x12);
        x12 = Math.fma(ai21, bi11, x12); x12 = Math.fma(-ar22, br21, x12);
        x12 = Math.fma(ai22, bi21, x12);
        double y12 = ar10 * bi02;
        y12 = Math.fma(ai10, br02, y12); y12 = Math.fma(ar11, bi12, y12);
        y12 = Math.fma(ai11, br12, y12); y12 = Math.fma(ar12, bi22, y12);
        y12 = Math.fma(ai12, br22, y12); y12 = Math.fma(ar20, bi01, y12);
        y12 = Math.fma(ai20, br01, y12); y12 = Math.fma(ar21, bi11, y12);
        y12 = Math.fma(ai21, br11, y12); y12 = Math.fma(ar22, bi21, y12);
        y12 = Math.fma(ai22, br21, y12);
        cr[5] = s * x12;
        ci[5] = s * y12;
        cr[7] = -(s * x12);
        ci[7] = s * y12;
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

    /** out = a X + b Y + c Z (planar m×m), summed as (aX + bY) + cZ; out may alias any input. */
    protected final void lin(double a, double[] xr, double[] xi, double b, double[] yr, double[] yi, double c,
                             double[] zr, double[] zi, double[] outR, double[] outI) {
        int len = m * m;
        for (int q = 0; q < len; q++) {
            outR[q] = a * xr[q] + b * yr[q] + c * zr[q];
            outI[q] = a * xi[q] + b * yi[q] + c * zi[q];
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
