package org.liepath.core.internal;

/**
 * Matrix exponential of a dense complex matrix by scaling and squaring with diagonal Padé approximants.
 *
 * <p>Method: N.J. Higham, "The scaling and squaring method for the matrix exponential revisited", SIAM J. Matrix
 * Anal. Appl. 26(4) (2005) 1179–1193: degree m ∈ {3, 5, 7, 9} is used when ‖A‖₁ ≤ θ_m, otherwise A is scaled by 2^-s
 * so that ‖2^-s A‖₁ ≤ θ_13, r_13 is evaluated with six products and one LU solve, and the result squared s times.
 * θ_m and the Padé coefficients b_j = (2m−j)!/((m−j)! j!) are the published double-precision values. The powers
 * A², A⁴ formed for the degree tests are reused (rescaled by 2^{-2s}, 2^{-4s}) after scaling, as in the paper.
 * Orders 1 and 2 use closed forms ({@link #exp2}), which are exact to rounding also for defective and nearly
 * degenerate 2×2 matrices. For anti-Hermitian A (Hamiltonian steps), {@link #computeIncrementAntiHermitian}
 * evaluates the same approximant with half-cost products, since its even powers and V are Hermitian and U is
 * anti-Hermitian.
 *
 * <p>A workspace object holds every scratch array, so repeated calls at one dimension allocate nothing. Instances are
 * not thread-safe; use one per thread. Not part of the public API.
 */
public final class Expm {
    static final double[] THETA = {1.495585217958292e-2, 2.539398330063230e-1, 9.504178996162932e-1,
        2.097847961257068e0, 5.371920351148152e0};
    static final double[] B3 = {120, 60, 12, 1};
    static final double[] B5 = {30240, 15120, 3360, 420, 30, 1};
    static final double[] B7 = {17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1};
    static final double[] B9 = {17643225600.0, 8821612800.0, 2075673600, 302702400, 30270240, 2162160, 110880, 3960,
        90, 1};
    static final double[] B13 = {64764752532480000.0, 32382376266240000.0, 7771770303897600.0, 1187353796428800.0,
        129060195264000.0, 10559470521600.0, 670442572800.0, 33522128640.0, 1323241920.0, 40840800.0, 960960.0,
        16380.0, 182.0, 1.0};

    private final int n;
    private final double[] ar, ai, a2r, a2i, a4r, a4i, a6r, a6i, ur, ui, vr, vi, tr, ti, sr, si;
    private final int[] piv;
    /** Whether the current call returns exp(A) − I ({@link #computeIncrement}) rather than exp(A). */
    private boolean increment;
    /** Whether the current call's A is anti-Hermitian ({@link #computeIncrementAntiHermitian}). */
    private boolean skew;
    /** Interleaved buffers for EJML's product, used from {@link #EJML_FROM} on (null below). */
    private final org.ejml.data.ZMatrixRMaj ea, eb, ec;

    /**
     * Dimension from which products go through EJML's {@code CommonOps_ZDRM.mult} (with a planar↔interleaved copy
     * of 6n² doubles, negligible against 8n³ flops): in an interleaved A/B timing on these machines EJML took
     * 0.76–0.82 of our planar kernel's time (median) for n = 64 … 256, and tied or lost below.
     */
    static final int EJML_FROM = 64;

    /** Creates a workspace for n×n matrices. */
    public Expm(int n) {
        this.n = n;
        int len = n * n;
        ar = new double[len]; ai = new double[len];
        a2r = new double[len]; a2i = new double[len];
        a4r = new double[len]; a4i = new double[len];
        a6r = new double[len]; a6i = new double[len];
        ur = new double[len]; ui = new double[len];
        vr = new double[len]; vi = new double[len];
        tr = new double[len]; ti = new double[len];
        sr = new double[len]; si = new double[len];
        piv = new int[n];
        colSums = new double[n];
        boolean big = n >= EJML_FROM;
        ea = big ? new org.ejml.data.ZMatrixRMaj(n, n) : null;
        eb = big ? new org.ejml.data.ZMatrixRMaj(n, n) : null;
        ec = big ? new org.ejml.data.ZMatrixRMaj(n, n) : null;
    }

    /** c = a·b (c must not alias a or b): our kernel for small n, EJML's for large n. */
    private void mul(double[] xr, double[] xi, double[] yr, double[] yi, double[] zr, double[] zi) {
        if (ea == null) {
            Dense.mul(n, xr, xi, yr, yi, zr, zi);
            return;
        }
        int len = n * n;
        double[] a = ea.data, b = eb.data, c = ec.data;
        for (int k = 0; k < len; k++) {
            a[2 * k] = xr[k];
            a[2 * k + 1] = xi[k];
        }
        org.ejml.data.ZMatrixRMaj right = eb;
        if (yr == xr && yi == xi) {
            right = ea;
        } else {
            for (int k = 0; k < len; k++) {
                b[2 * k] = yr[k];
                b[2 * k + 1] = yi[k];
            }
        }
        org.ejml.dense.row.CommonOps_ZDRM.mult(ea, right, ec);
        for (int k = 0; k < len; k++) {
            zr[k] = c[2 * k];
            zi[k] = c[2 * k + 1];
        }
    }

    /**
     * z = x·y for a product that is an even function of A (powers of A², and real polynomials in A² times one
     * another): Hermitian when A is anti-Hermitian, so {@link #computeIncrementAntiHermitian} forms only its upper
     * triangle; a general product otherwise.
     */
    private void evenProduct(double[] xr, double[] xi, double[] yr, double[] yi, double[] zr, double[] zi) {
        if (skew) {
            Dense.mulHermitian(n, xr, xi, yr, yi, zr, zi);
        } else {
            mul(xr, xi, yr, yi, zr, zi);
        }
    }

    /** z = A·S(A²), the odd part U: anti-Hermitian when A is, so then only its upper triangle is formed. */
    private void oddProduct(double[] xr, double[] xi, double[] yr, double[] yi, double[] zr, double[] zi) {
        if (skew) {
            Dense.mulAntiHermitian(n, xr, xi, yr, yi, zr, zi);
        } else {
            mul(xr, xi, yr, yi, zr, zi);
        }
    }

    /** @return the dimension this workspace serves */
    public int dim() {
        return n;
    }

    /** Convenience: allocates a workspace and computes exp(A). */
    public static void exp(int n, double[] inRe, double[] inIm, double[] outRe, double[] outIm) {
        new Expm(n).compute(inRe, inIm, outRe, outIm);
    }

    /**
     * out = exp(scale·A). Inputs are not modified; outputs may alias inputs.
     */
    public void compute(double scale, double[] inRe, double[] inIm, double[] outRe, double[] outIm) {
        increment = false;
        load(scale, inRe, inIm);
        run(outRe, outIm);
    }

    private void load(double scale, double[] inRe, double[] inIm) {
        int len = n * n;
        for (int k = 0; k < len; k++) {
            ar[k] = scale * inRe[k];
            ai[k] = scale * inIm[k];
        }
    }

    /** out = exp(A). Inputs are not modified; outputs may alias inputs. */
    public void compute(double[] inRe, double[] inIm, double[] outRe, double[] outIm) {
        compute(1.0, inRe, inIm, outRe, outIm);
    }

    private void run(double[] outRe, double[] outIm) {
        run(Double.NaN, outRe, outIm);
    }

    /** As {@link #run(double[], double[])} with ‖A‖₁ already known (NaN: compute it). */
    private void run(double knownNorm, double[] outRe, double[] outIm) {
        int len = n * n;
        if (n <= 2) {
            if (n == 1) {
                expScalar(ar[0], ai[0], outRe, outIm, 0);
                if (increment) {
                    scalarMinusOne(ar[0], ai[0], outRe, outIm);
                }
            } else {
                if (skew && increment) {
                    skewIncrement2(ar, ai, outRe, outIm);
                } else {
                    exp2(1.0, 0.0, ar, ai, outRe, outIm, increment);
                }
            }
            return;
        }
        double norm = Double.isNaN(knownNorm) ? Dense.norm1(n, ar, ai) : knownNorm;
        if (norm == 0) {
            if (increment) {
                java.util.Arrays.fill(outRe, 0, len, 0.0);
                java.util.Arrays.fill(outIm, 0, len, 0.0);
            } else {
                Dense.identity(n, outRe, outIm);
            }
            return;
        }
        if (!Double.isFinite(norm)) {
            java.util.Arrays.fill(outRe, 0, len, Double.NaN);
            java.util.Arrays.fill(outIm, 0, len, Double.NaN);
            return;
        }
        evenProduct(ar, ai, ar, ai, a2r, a2i);
        if (norm <= THETA[0]) {
            lowDegree(B3, 1, outRe, outIm);
            return;
        }
        evenProduct(a2r, a2i, a2r, a2i, a4r, a4i);
        if (norm <= THETA[1]) {
            lowDegree(B5, 2, outRe, outIm);
            return;
        }
        if (norm <= THETA[2]) {
            evenProduct(a4r, a4i, a2r, a2i, a6r, a6i);
            lowDegree(B7, 3, outRe, outIm);
            return;
        }
        if (norm <= THETA[3]) {
            evenProduct(a4r, a4i, a2r, a2i, a6r, a6i);
            lowDegree(B9, 4, outRe, outIm);
            return;
        }
        // scaling: smallest s >= 0 with norm / 2^s <= theta13, computed exactly via the binary exponent
        int s = 0;
        double ratio = norm / THETA[4];
        if (ratio > 1) {
            s = Math.getExponent(ratio);
            if (ratio > Math.scalb(1.0, s)) {
                s++;
            }
        }
        if (s > 0) {
            // the powers already formed are rescaled by 2^-2s and 2^-4s instead of recomputed (Higham 2005 §2);
            // scaling by a power of two is exact unless it underflows, which only loses entries below 1e-300·‖A‖
            double f = Math.scalb(1.0, -s), f2 = Math.scalb(1.0, -2 * s), f4 = Math.scalb(1.0, -4 * s);
            for (int k = 0; k < len; k++) {
                ar[k] *= f;
                ai[k] *= f;
                a2r[k] *= f2;
                a2i[k] *= f2;
                a4r[k] *= f4;
                a4i[k] *= f4;
            }
        }
        evenProduct(a4r, a4i, a2r, a2i, a6r, a6i);
        double[] b = B13;
        // U = A [A6 (b13 A6 + b11 A4 + b9 A2) + b7 A6 + b5 A4 + b3 A2 + b1 I]
        for (int k = 0; k < len; k++) {
            tr[k] = b[13] * a6r[k] + b[11] * a4r[k] + b[9] * a2r[k];
            ti[k] = b[13] * a6i[k] + b[11] * a4i[k] + b[9] * a2i[k];
        }
        evenProduct(a6r, a6i, tr, ti, sr, si);
        for (int k = 0; k < len; k++) {
            sr[k] += b[7] * a6r[k] + b[5] * a4r[k] + b[3] * a2r[k];
            si[k] += b[7] * a6i[k] + b[5] * a4i[k] + b[3] * a2i[k];
        }
        for (int i = 0; i < n; i++) {
            sr[i * n + i] += b[1];
        }
        oddProduct(ar, ai, sr, si, ur, ui);
        // V = A6 (b12 A6 + b10 A4 + b8 A2) + b6 A6 + b4 A4 + b2 A2 + b0 I
        for (int k = 0; k < len; k++) {
            tr[k] = b[12] * a6r[k] + b[10] * a4r[k] + b[8] * a2r[k];
            ti[k] = b[12] * a6i[k] + b[10] * a4i[k] + b[8] * a2i[k];
        }
        evenProduct(a6r, a6i, tr, ti, vr, vi);
        for (int k = 0; k < len; k++) {
            vr[k] += b[6] * a6r[k] + b[4] * a4r[k] + b[2] * a2r[k];
            vi[k] += b[6] * a6i[k] + b[4] * a4i[k] + b[2] * a2i[k];
        }
        for (int i = 0; i < n; i++) {
            vr[i * n + i] += b[0];
        }
        solve(outRe, outIm);
        for (int q = 0; q < s; q++) {
            System.arraycopy(outRe, 0, tr, 0, len);
            System.arraycopy(outIm, 0, ti, 0, len);
            mul(tr, ti, tr, ti, outRe, outIm);
            if (increment) {
                // (I + D)² − I = D² + 2D
                for (int k = 0; k < len; k++) {
                    outRe[k] += 2 * tr[k];
                    outIm[k] += 2 * ti[k];
                }
            }
        }
    }

    /** Padé of degree 2q+1 with coefficients b, using the powers A2 (q>=1), A4 (q>=2), A6 (q>=3), A8 (q=4). */
    private void lowDegree(double[] b, int q, double[] outRe, double[] outIm) {
        int len = n * n;
        // odd part polynomial in A2: sum_{k odd} b_k A^{k-1}; even part V = sum_{k even} b_k A^k
        java.util.Arrays.fill(sr, 0, len, 0.0);
        java.util.Arrays.fill(si, 0, len, 0.0);
        java.util.Arrays.fill(vr, 0, len, 0.0);
        java.util.Arrays.fill(vi, 0, len, 0.0);
        for (int i = 0; i < n; i++) {
            sr[i * n + i] = b[1];
            vr[i * n + i] = b[0];
        }
        addScaled(b[3], b[2], a2r, a2i);
        if (q >= 2) {
            addScaled(b[5], b[4], a4r, a4i);
        }
        if (q >= 3) {
            addScaled(b[7], b[6], a6r, a6i);
        }
        if (q >= 4) {
            // A8 = A4 * A4 into (tr, ti)
            evenProduct(a4r, a4i, a4r, a4i, tr, ti);
            addScaled(b[9], b[8], tr, ti);
        }
        oddProduct(ar, ai, sr, si, ur, ui);
        solve(outRe, outIm);
    }

    private void addScaled(double odd, double even, double[] pr, double[] pi) {
        int len = n * n;
        for (int k = 0; k < len; k++) {
            sr[k] += odd * pr[k];
            si[k] += odd * pi[k];
            vr[k] += even * pr[k];
            vi[k] += even * pi[k];
        }
    }

    /** out = (V − U)^{-1} (V + U), or its increment (V − U)^{-1} (V + U) − I = 2 (V − U)^{-1} U. */
    private void solve(double[] outRe, double[] outIm) {
        int len = n * n;
        for (int k = 0; k < len; k++) {
            double pr = increment ? 2 * ur[k] : vr[k] + ur[k], pi = increment ? 2 * ui[k] : vi[k] + ui[k];
            tr[k] = vr[k] - ur[k];
            ti[k] = vi[k] - ui[k];
            outRe[k] = pr;
            outIm[k] = pi;
        }
        if (!Dense.solveInPlace(n, tr, ti, outRe, outIm, piv)) {
            java.util.Arrays.fill(outRe, 0, len, Double.NaN);
            java.util.Arrays.fill(outIm, 0, len, Double.NaN);
        }
    }

    /** out[o] = exp(zr + i zi). */
    private static void expScalar(double zr, double zi, double[] outRe, double[] outIm, int o) {
        double m = Math.exp(zr);
        outRe[o] = m * Math.cos(zi);
        outIm[o] = m * Math.sin(zi);
    }

    /**
     * Closed form of exp(c·A) for any complex 2×2 matrix A (planar, row-major, length 4) and complex scalar
     * c = cr + i·ci. Outputs may alias inputs; nothing is allocated.
     *
     * <p>With μ = tr(cA)/2 and B = cA − μI (traceless, so B² = δ² I with δ² = −det B):
     * exp(cA) = e^μ (cosh δ · I + (sinh δ / δ) · B), which is even in δ, so either square root serves
     * (the Cayley–Hamilton form for 2×2 matrices; e.g. N.J. Higham, <i>Functions of Matrices</i>, SIAM 2008, §10.4.3
     * and Problem 10.8 [from memory]). For |δ| &lt; 1/2 the factor sinh δ / δ is summed as its Taylor series, so
     * nearly degenerate and defective matrices (Jordan blocks, δ → 0) lose no accuracy to cancellation. For larger
     * |δ| the two scalar exponentials e^{μ±δ} are formed directly, which cannot overflow unless the result does.
     */
    public static void exp2(double cr, double ci, double[] inRe, double[] inIm, double[] outRe, double[] outIm) {
        exp2(cr, ci, inRe, inIm, outRe, outIm, false);
    }

    /** {@link #exp2}, or with {@code increment} its increment exp(cA) − I (see {@link #computeIncrement}). */
    private static void exp2(double cr, double ci, double[] inRe, double[] inIm, double[] outRe, double[] outIm,
                             boolean increment) {
        // cA
        double ar = cr * inRe[0] - ci * inIm[0], ai = cr * inIm[0] + ci * inRe[0];
        double br = cr * inRe[1] - ci * inIm[1], bi = cr * inIm[1] + ci * inRe[1];
        double gr = cr * inRe[2] - ci * inIm[2], gi = cr * inIm[2] + ci * inRe[2];
        double dr = cr * inRe[3] - ci * inIm[3], di = cr * inIm[3] + ci * inRe[3];
        double mur = 0.5 * (ar + dr), mui = 0.5 * (ai + di);
        // B = cA − μI: diagonal ±h with h = (a − d)/2
        double hr = 0.5 * (ar - dr), hi = 0.5 * (ai - di);
        // δ² = h² + b·g
        double sqr = hr * hr - hi * hi + br * gr - bi * gi;
        double sqi = 2 * hr * hi + br * gi + bi * gr;
        // principal square root of δ², in the cancellation-free form (no trigonometry, so that a real δ² < 0,
        // the Hermitian case, gives an exactly imaginary δ and exactly unimodular e^{μ±δ})
        double abs2 = HermitianEigen.hyp(sqr, sqi);
        double mod = Math.sqrt(abs2);
        double delr, deli;
        if (abs2 == 0) {
            delr = 0;
            deli = 0;
        } else if (sqr >= 0) {
            delr = Math.sqrt(0.5 * (abs2 + sqr));
            deli = sqi / (2 * delr);
        } else {
            double q = Math.sqrt(0.5 * (abs2 - sqr));
            delr = Math.abs(sqi) / (2 * q);
            deli = Math.copySign(q, sqi);
        }
        double chr, chi, shr, shi; // e^μ cosh δ and e^μ sinh δ / δ
        if (mod < 0.5) {
            // sinh δ / δ = Σ δ^{2k} / (2k+1)!  (|δ²| < 1/4: 9 terms leave < 1e-23); cosh δ = Σ δ^{2k} / (2k)!
            double sr = 1, si = 0, cshr = 1, cshi = 0, cm1r = 0, cm1i = 0;
            for (int k = 9; k >= 1; k--) {
                // Horner: s ← 1 + δ² s / ((2k)(2k+1)), c ← 1 + δ² c / ((2k−1)(2k))
                double fs = 1.0 / ((2.0 * k) * (2.0 * k + 1)), fc = 1.0 / ((2.0 * k - 1) * (2.0 * k));
                double tr = sqr * sr - sqi * si, ti = sqr * si + sqi * sr;
                sr = 1 + fs * tr;
                si = fs * ti;
                tr = sqr * cshr - sqi * cshi;
                ti = sqr * cshi + sqi * cshr;
                cm1r = fc * tr;
                cm1i = fc * ti;
                cshr = 1 + cm1r;
                cshi = cm1i;
            }
            double em = Math.exp(mur), cm = Math.cos(mui), sm = Math.sin(mui), er = em * cm, ei = em * sm;
            if (increment) {
                // e^μ cosh δ − 1 = e^μ (cosh δ − 1) + (e^μ − 1), each part formed without cancellation:
                // Re(e^μ − 1) = expm1(Re μ) cos(Im μ) + (cos(Im μ) − 1), and cos b − 1 = −sin²b / (1 + cos b)
                // where cos b > 0 (no cancellation either way); Re μ = 0 for Hamiltonians, so expm1 is skipped
                double cosm1 = cm > 0 ? -sm * sm / (1 + cm) : cm - 1;
                chr = er * cm1r - ei * cm1i + (mur == 0 ? cosm1 : Math.expm1(mur) * cm + cosm1);
                chi = er * cm1i + ei * cm1r + ei;
            } else {
                chr = er * cshr - ei * cshi;
                chi = er * cshi + ei * cshr;
            }
            shr = er * sr - ei * si;
            shi = er * si + ei * sr;
        } else {
            double ep = Math.exp(mur + delr), em = Math.exp(mur - delr);
            double pr = ep * Math.cos(mui + deli), pim = ep * Math.sin(mui + deli);
            double qr = em * Math.cos(mui - deli), qim = em * Math.sin(mui - deli);
            // |δ| ≥ 1/2: the increment is of order one, so subtracting 1 costs nothing relative to its size
            chr = 0.5 * (pr + qr) - (increment ? 1 : 0);
            chi = 0.5 * (pim + qim);
            // (e^{μ+δ} − e^{μ−δ}) / (2δ)
            double nr = 0.5 * (pr - qr), ni = 0.5 * (pim - qim);
            double den = delr * delr + deli * deli;
            shr = (nr * delr + ni * deli) / den;
            shi = (ni * delr - nr * deli) / den;
        }
        outRe[0] = chr + shr * hr - shi * hi;
        outIm[0] = chi + shr * hi + shi * hr;
        outRe[3] = chr - (shr * hr - shi * hi);
        outIm[3] = chi - (shr * hi + shi * hr);
        outRe[1] = shr * br - shi * bi;
        outIm[1] = shr * bi + shi * br;
        outRe[2] = shr * gr - shi * gi;
        outIm[2] = shr * gi + shi * gr;
    }

    /**
     * out = exp(scale·A) − I, the increment of the exponential, by the same Padé approximant as {@link #compute}
     * (to rounding, out + I equals compute's result). Inputs are not modified; outputs may alias inputs; nothing is
     * allocated.
     *
     * <p>Why: for a small exponent (‖A‖ ≪ 1, as in one step of an integrator) exp(A) has entries of order one and
     * each is rounded to an absolute error of order u = 2⁻⁵³, whatever the accuracy of the approximant; that
     * rounding is nearly the same in every step of a long run with a slowly varying A, so its non-unitary part adds
     * up linearly with the step count. The increment is of order ‖A‖ and carries only errors of order u·‖A‖:
     * r_m(A) − I = (V − U)^{-1}(V + U) − I = 2 (V − U)^{-1} U (U odd, V even part of the Padé numerator), which costs
     * the same one solve; after scaling, (I + D)² − I = D² + 2D is squared in the same form; the 1×1 and 2×2 closed
     * forms use expm1 and the cosh δ − 1 series. Applying X ← X + D X then rounds each entry of X once per step,
     * which no longer repeats coherently. This is the classical device of working with increments to reduce
     * round-off in long integrations (E. Hairer, C. Lubich, G. Wanner, Geometric Numerical Integration, 2nd ed.,
     * Springer 2006, §VIII.5 "Reducing Rounding Errors").
     */
    public void computeIncrement(double scale, double[] inRe, double[] inIm, double[] outRe, double[] outIm) {
        increment = true;
        load(scale, inRe, inIm);
        run(outRe, outIm);
        increment = false;
    }

    /** out[0] ← exp(zr + i zi) − 1 without cancellation: expm1(zr) cos zi − 2 sin²(zi/2) + i e^{zr} sin zi. */
    private static void scalarMinusOne(double zr, double zi, double[] outRe, double[] outIm) {
        double s2 = Math.sin(0.5 * zi);
        outRe[0] = Math.expm1(zr) * Math.cos(zi) - 2 * s2 * s2;
        outIm[0] = Math.exp(zr) * Math.sin(zi);
    }
    /**
     * out = exp(scale·A) − I for an anti-Hermitian A (A = −A†, e.g. A = −iK with K Hermitian: one step of a
     * Hamiltonian evolution), by the same approximant as {@link #computeIncrement}: the same degree selection on
     * ‖scale·A‖₁, the same scaling, Padé coefficients and increment form (Higham 2005, see the class comment), so the
     * two agree to rounding. Inputs are not modified; outputs may alias inputs; nothing is allocated.
     *
     * <p>Structure used: with A anti-Hermitian, A² = −K² is Hermitian, and so are A⁴, A⁶, A⁸ and every real
     * polynomial in A²; the product of two commuting Hermitian matrices is Hermitian, so each such product needs
     * only its upper triangle (i ≤ j), the lower one being the conjugate mirror ({@link Dense#mulHermitian}). The odd
     * part U = A·S(A²), with S Hermitian and commuting with A, is anti-Hermitian (U† = S A† = −S A = −A S = −U):
     * again only its upper triangle is formed ({@link Dense#mulAntiHermitian}); V is Hermitian as a real polynomial
     * in A². Every product of the Padé evaluation (six at degree 13) thus costs about 4n³ instead of 8n³ flops, and
     * A², A⁴, A⁶, U and V are exactly (anti-)Hermitian in floating point. The LU solve with V − U and the squaring
     * phase D ← D² + 2D (D = r(A) − I is normal but neither Hermitian nor anti-Hermitian) stay general.
     *
     * <p>Input: only the anti-Hermitian part (A − A†)/2 of the input is used (a real diagonal part is dropped); for an
     * input that is exactly anti-Hermitian in floating point this is the input itself, bit for bit, so the matrix
     * exponentiated is then exactly the one {@link #computeIncrement} sees. An input that departs from
     * anti-Hermitian by δ gives the increment of its anti-Hermitian part, which differs from its own by O(δ).
     * Non-finite input gives NaN, as {@link #computeIncrement} does.
     */
    public void computeIncrementAntiHermitian(double scale, double[] inRe, double[] inIm, double[] outRe,
                                              double[] outIm) {
        computeIncrementAntiHermitian(scale, inRe, inIm, outRe, outIm, Double.POSITIVE_INFINITY);
    }

    /**
     * As {@link #computeIncrementAntiHermitian(double, double[], double[], double[], double[])}, unless the 1-norm
     * that selects degree and scaling (after the shift of {@link #centre}) exceeds maxNorm: then nothing is written
     * and false is returned, so that a caller can take another route for large exponents without a norm pass of its
     * own. For n ≤ 2 (closed forms, any norm) it always proceeds; a NaN input gives NaN, as the other overload.
     *
     * @return whether the increment was written
     */
    public boolean computeIncrementAntiHermitian(double scale, double[] inRe, double[] inIm, double[] outRe,
                                                 double[] outIm, double maxNorm) {
        increment = true;
        skew = true;
        try {
            double norm = load(scale, inRe, inIm, colSums);
            double c = centre(colSums, norm);
            if (c != 0.0) {
                norm = shiftedNorm;
            }
            if (n > 2 && norm > maxNorm) {
                return false;
            }
            lastCost = n <= 2 ? -1 : cost(norm);
            lastShift = c;
            run(norm, outRe, outIm);
            if (c != 0.0) {
                unshift(c, outRe, outIm);
            }
            return true;
        } finally {
            skew = false;
            increment = false;
        }
    }

    /** Cost class ({@link #cost}) and shift c of the last anti-Hermitian call, for tests (−1 for n ≤ 2). */
    private int lastCost;
    private double lastShift;

    /** @return the cost class of the degree and scaling the last {@link #computeIncrementAntiHermitian} used */
    int lastCost() {
        return lastCost;
    }

    /** @return the shift c of the last {@link #computeIncrementAntiHermitian} (0 if none) */
    double lastShift() {
        return lastShift;
    }

    /**
     * exp(A) − I for an anti-Hermitian 2×2 A (planar; real diagonal parts ignored, as loaded), in closed form: with
     * A = iφI + B, φ = (Im a₀₀ + Im a₁₁)/2 and B traceless anti-Hermitian, B² = −ω²I where
     * ω² = h² + |a₀₁|², h = (Im a₀₀ − Im a₁₁)/2, so exp(A) = e^{iφ}(cos ω I + (sin ω/ω) B) (the SU(2) rotation
     * formula; common practice, e.g. J.J. Sakurai, Modern Quantum Mechanics, rev. ed. 1994, eq. (3.2.45) [from
     * memory]). The diagonal of the increment is formed without cancellation: e^{iφ} cos ω − 1 has real part
     * −2 sin²(φ/2) cos ω − 2 sin²(ω/2). Four sines and cosines of half angles and one square root; nothing else
     * of the general {@link #exp2} is needed (its series and complex square root serve non-normal matrices).
     */
    private static void skewIncrement2(double[] ar, double[] ai, double[] outRe, double[] outIm) {
        double a = ai[0], d = ai[3], p = ar[1], q = ai[1];
        double phi = 0.5 * (a + d), h = 0.5 * (a - d);
        double omega = Math.sqrt(h * h + p * p + q * q);
        double sw = Math.sin(0.5 * omega), cw = Math.cos(0.5 * omega);
        double sp = Math.sin(0.5 * phi), cp = Math.cos(0.5 * phi);
        double c = 1 - 2 * sw * sw;                          // cos ω
        double s = omega == 0 ? 1.0 : 2 * sw * cw / omega;   // sin ω / ω
        double sphi = 2 * sp * cp, cphi = 1 - 2 * sp * sp;   // sin φ, cos φ
        double base = -2 * sp * sp * c - 2 * sw * sw;        // cos φ cos ω − 1
        double sh = s * h;
        outRe[0] = base - sphi * sh;
        outIm[0] = sphi * c + cphi * sh;
        outRe[3] = base + sphi * sh;
        outIm[3] = sphi * c - cphi * sh;
        // e^{iφ} s B_01 with B_01 = p + iq, and e^{iφ} s B_10 with B_10 = −p + iq
        double xr = s * (cphi * p - sphi * q), xi = s * (cphi * q + sphi * p);
        double yr = s * (-cphi * p - sphi * q), yi = s * (cphi * q - sphi * p);
        outRe[1] = xr;
        outIm[1] = xi;
        outRe[2] = yr;
        outIm[2] = yi;
    }

    /** Loads the anti-Hermitian part (A − A†)/2 of scale·A into the workspace. */
    private void loadSkew(double scale, double[] inRe, double[] inIm) {
        for (int i = 0; i < n; i++) {
            int in = i * n;
            ar[in + i] = 0.0;
            ai[in + i] = scale * inIm[in + i];
            for (int j = i + 1; j < n; j++) {
                int jn = j * n;
                // (x − (−x))·½ = x exactly, so an exactly anti-Hermitian input passes unchanged
                double re = scale * ((inRe[in + j] - inRe[jn + i]) * 0.5);
                double im = scale * ((inIm[in + j] + inIm[jn + i]) * 0.5);
                ar[in + j] = re;
                ai[in + j] = im;
                ar[jn + i] = -re;
                ai[jn + i] = im;
            }
        }
    }

    /** Off-diagonal modulus sums of the columns of the last anti-Hermitian load. */
    private final double[] colSums;
    /** ‖A − icI‖₁ after a shift by {@link #centre}. */
    private double shiftedNorm;

    /**
     * Loads the anti-Hermitian part of scale·A and returns its 1-norm; r[j] receives the off-diagonal modulus sum of
     * column j. Each modulus serves both entries of its mirrored pair.
     */
    private double load(double scale, double[] inRe, double[] inIm, double[] r) {
        loadSkew(scale, inRe, inIm);
        if (n <= 2) {
            return Double.NaN; // the closed forms need no norm
        }
        java.util.Arrays.fill(r, 0.0);
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                double re = ar[i * n + j], im = ai[i * n + j];
                double mod = Math.sqrt(re * re + im * im);
                r[i] += mod;
                r[j] += mod;
            }
        }
        double norm = 0;
        for (int j = 0; j < n; j++) {
            norm = Math.max(norm, Math.abs(ai[j * n + j]) + r[j]);
        }
        if (norm == Double.POSITIVE_INFINITY) {
            // moduli beyond 1e154 overflow the plain formula: the careful norm decides
            norm = Dense.norm1(n, ar, ai);
        }
        return norm;
    }

    /**
     * Shifts the loaded anti-Hermitian A to A − icI when that lowers the Padé degree or the number of squarings (for
     * n = 3 below degree 13: by two degree steps at least, see the comment in the code), with
     * c the centre of A's Gershgorin hull on the imaginary axis: with d_j = Im a_jj and r_j the off-diagonal modulus
     * sum of column j, every eigenvalue iλ has λ ∈ [lo, hi] = [min_j (d_j − r_j), max_j (d_j + r_j)], and
     * c = (lo + hi)/2 minimises ‖A − icI‖₁ = max_j (|d_j − c| + r_j) over real c, to (hi − lo)/2. Because icI
     * commutes with A, exp(A) = e^{ic} exp(A − icI) exactly, and the diagonal entries change by at most a rounding of
     * |d_j|, a backward error of u‖A‖ like the approximant's own. The trace shift is the classical preprocessing of
     * R.C. Ward, "Numerical computation of the matrix exponential with accuracy estimate", SIAM J. Numer. Anal. 14
     * (1977) 600–610, and is recommended in N.J. Higham, Functions of Matrices, SIAM 2008, §10.7.3; the Gershgorin
     * centre in place of the mean diagonal is our choice (it is the optimal real shift for the 1-norm that selects
     * the degree, which the mean is not when levels are spread unevenly). It pays for Hamiltonian steps with a large
     * spread of level energies: h·(E_max − E_min)/2 instead of h·max|E| sets the degree.
     *
     * @return c (0 when the shift would not lower the cost, or for n ≤ 2, whose closed forms need none; A is then
     *     left as it is)
     */
    private double centre(double[] r, double norm) {
        if (n <= 2 || !(norm < Double.POSITIVE_INFINITY)) {
            return 0.0; // closed forms, exact at any norm; non-finite input goes its own way
        }
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (int j = 0; j < n; j++) {
            double d = ai[j * n + j];
            lo = Math.min(lo, d - r[j]);
            hi = Math.max(hi, d + r[j]);
        }
        double c = 0.5 * (lo + hi);
        int before = cost(norm), after = cost(0.5 * (hi - lo));
        // for 3×3 one degree step saves less than the shift's own pass and phase cost (measured on a driven
        // three-level system: 1.02–1.04× slower with it), so there only squarings or two steps justify it
        int needed = n == 3 && before < 4 ? 2 : 1;
        if (!Double.isFinite(c) || before - after < needed) {
            return 0.0;
        }
        double shifted = 0;
        for (int j = 0; j < n; j++) {
            int jj = j * n + j;
            ai[jj] -= c;
            shifted = Math.max(shifted, Math.abs(ai[jj]) + r[j]);
        }
        shiftedNorm = shifted;
        return c;
    }

    /** The cost class of a 1-norm in the degree selection: 0…3 for degrees 3…9, 4 + s for degree 13 with s squarings. */
    static int cost(double norm) {
        for (int k = 0; k < 4; k++) {
            if (norm <= THETA[k]) {
                return k;
            }
        }
        double ratio = norm / THETA[4];
        if (ratio <= 1) {
            return 4;
        }
        int s = Math.getExponent(ratio);
        if (ratio > Math.scalb(1.0, s)) {
            s++;
        }
        return 4 + s;
    }

    /**
     * out ← e^{ic}(out + I) − I = e^{ic}·out + (e^{ic} − 1)I, the increment of exp(A) from that of exp(A − icI);
     * e^{ic} − 1 = −2 sin²(c/2) + i sin c without cancellation, so the increment keeps its u·‖A‖ rounding.
     */
    private void unshift(double c, double[] outRe, double[] outIm) {
        double cr = Math.cos(c), ci = Math.sin(c), h = Math.sin(0.5 * c);
        int len = n * n;
        for (int k = 0; k < len; k++) {
            double x = outRe[k], y = outIm[k];
            outRe[k] = cr * x - ci * y;
            outIm[k] = cr * y + ci * x;
        }
        double mr = -2 * h * h;
        for (int i = 0; i < n; i++) {
            outRe[i * n + i] += mr;
            outIm[i * n + i] += ci;
        }
    }

    /**
     * The workspace's intermediates after the last call, for tests of their structure: {A2, A4, A6, U, V}, each as
     * {re, im} (the live arrays, not copies; after scaling, A2 … A6 are the powers of the scaled A). Which of them
     * the last call formed depends on its degree: A4 from degree 5 on, A6 from degree 7 on.
     */
    double[][][] intermediates() {
        return new double[][][]{{a2r, a2i}, {a4r, a4i}, {a6r, a6i}, {ur, ui}, {vr, vi}};
    }
}
