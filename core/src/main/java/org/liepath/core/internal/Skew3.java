package org.liepath.core.internal;

/**
 * Arithmetic on 3×3 anti-Hermitian matrices (the Lie algebra u(3) of a three-level Hamiltonian step, X = −iH) in a
 * packed form of nine reals, and the increment exp(X) − I of such a matrix.
 *
 * <p>Packed layout {@code [d0, d1, d2, r01, i01, r02, i02, r12, i12]}: X_aa = i·d_a, X_ab = r_ab + i·i_ab for
 * a &lt; b, and X_ba = −r_ab + i·i_ab. The same layout holds Hermitian matrices (H_aa = d_a real, H_ab as above for
 * a &lt; b, H_ba its conjugate), the form of the even powers and of the Padé denominators below. A packed matrix
 * is anti-Hermitian (or Hermitian) by construction, so every linear combination and bracket stays in the algebra
 * exactly in floating point, and each operation touches nine numbers instead of the eighteen of a planar 3×3.
 *
 * <p>Why: for three levels the planar kernels spend most of their time loading and storing entries, half of which
 * the structure fixes. The bracket [X, Y] below costs 48 products (the general planar route 108 for P = XY); the
 * products of the Padé evaluation are those of {@link Expm#computeIncrementAntiHermitian} on nine numbers.
 *
 * <p>The increment is the approximant of {@link Expm#computeIncrementAntiHermitian}: N.J. Higham, "The scaling and
 * squaring method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl. 26(4) (2005) 1179–1193, with
 * the same degree selection, scaling, Gershgorin-centre shift and increment form 2(V − U)^{-1}U; the two agree to
 * rounding (the order of the sums differs).
 *
 * <p>Instances hold scratch arrays and are not thread-safe; the static methods are. Nothing is allocated per call.
 */
public final class Skew3 {
    /** Length of a packed matrix. */
    public static final int LEN = 9;

    private final double[] a = new double[LEN], a2 = new double[LEN], a4 = new double[LEN], a6 = new double[LEN];
    private final double[] s = new double[LEN], v = new double[LEN], u = new double[LEN], t = new double[LEN];
    private final double[] mr = new double[9], mi = new double[9], tr = new double[9], ti = new double[9];

    /**
     * Packs the anti-Hermitian part (X − X†)/2 of a planar 3×3 matrix (real diagonal parts dropped); an exactly
     * anti-Hermitian input passes unchanged, bit for bit.
     */
    public static void pack(double[] re, double[] im, double[] out) {
        out[0] = im[0];
        out[1] = im[4];
        out[2] = im[8];
        out[3] = (re[1] - re[3]) * 0.5;
        out[4] = (im[1] + im[3]) * 0.5;
        out[5] = (re[2] - re[6]) * 0.5;
        out[6] = (im[2] + im[6]) * 0.5;
        out[7] = (re[5] - re[7]) * 0.5;
        out[8] = (im[5] + im[7]) * 0.5;
    }

    /** Writes a packed anti-Hermitian matrix as a planar 3×3 (row-major). */
    public static void unpack(double[] x, double[] re, double[] im) {
        re[0] = 0.0;
        im[0] = x[0];
        re[4] = 0.0;
        im[4] = x[1];
        re[8] = 0.0;
        im[8] = x[2];
        re[1] = x[3];
        im[1] = x[4];
        re[3] = -x[3];
        im[3] = x[4];
        re[2] = x[5];
        im[2] = x[6];
        re[6] = -x[5];
        im[6] = x[6];
        re[5] = x[7];
        im[5] = x[8];
        re[7] = -x[7];
        im[7] = x[8];
    }

    /** out = a·x + b·y (packed; out may alias an input). */
    public static void lin(double a, double[] x, double b, double[] y, double[] out) {
        for (int q = 0; q < LEN; q++) {
            out[q] = a * x[q] + b * y[q];
        }
    }

    /** out = a·x + b·y + c·z (packed; out may alias an input). */
    public static void lin(double a, double[] x, double b, double[] y, double c, double[] z, double[] out) {
        for (int q = 0; q < LEN; q++) {
            out[q] = a * x[q] + b * y[q] + c * z[q];
        }
    }

    /**
     * out = s·[X, Y] for packed anti-Hermitian X, Y (out must not alias an input). The diagonal of [X, Y] is
     * traceless, and each off-diagonal entry needs the two diagonal differences of its pair and four products of
     * the other two entries.
     */
    public static void bracket(double s, double[] x, double[] y, double[] out) {
        bracket(s, x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7], x[8], y, out);
    }

    /**
     * out = s·[a·x + b·y, z] (packed; out must not alias an input): the combination is formed in registers, not
     * stored and reloaded (the eighth-order Magnus exponent brackets such combinations seven times per step).
     */
    public static void bracket(double s, double a, double[] x, double b, double[] y, double[] z, double[] out) {
        bracket(s, a * x[0] + b * y[0], a * x[1] + b * y[1], a * x[2] + b * y[2], a * x[3] + b * y[3],
                a * x[4] + b * y[4], a * x[5] + b * y[5], a * x[6] + b * y[6], a * x[7] + b * y[7],
                a * x[8] + b * y[8], z, out);
    }

    private static void bracket(double s, double xd0, double xd1, double xd2, double xr01, double xi01,
                                double xr02, double xi02, double xr12, double xi12, double[] y, double[] out) {
        double yd0 = y[0], yd1 = y[1], yd2 = y[2], yr01 = y[3], yi01 = y[4], yr02 = y[5], yi02 = y[6],
                yr12 = y[7], yi12 = y[8];
        // Im of the pair products X_ab Y_ba − Y_ab X_ba, one per off-diagonal pair
        double p01 = xr01 * yi01 - xi01 * yr01, p02 = xr02 * yi02 - xi02 * yr02, p12 = xr12 * yi12 - xi12 * yr12;
        out[0] = s * (2 * (p01 + p02));
        out[1] = s * (2 * (p12 - p01));
        out[2] = s * (-2 * (p02 + p12));
        out[3] = s * ((xd1 - xd0) * yi01 - (yd1 - yd0) * xi01 + (xi12 * yi02 - xi02 * yi12)
                + (xr12 * yr02 - xr02 * yr12));
        out[4] = s * ((xd0 - xd1) * yr01 - (yd0 - yd1) * xr01 + (xr02 * yi12 - xi02 * yr12)
                + (xr12 * yi02 - xi12 * yr02));
        out[5] = s * ((xd2 - xd0) * yi02 - (yd2 - yd0) * xi02 + (xi12 * yi01 - xi01 * yi12)
                + (xr01 * yr12 - xr12 * yr01));
        out[6] = s * ((xd0 - xd2) * yr02 - (yd0 - yd2) * xr02 + (xi01 * yr12 - xi12 * yr01)
                + (xr01 * yi12 - xr12 * yi01));
        out[7] = s * ((xd2 - xd1) * yi12 - (yd2 - yd1) * xi12 + (xi02 * yi01 - xi01 * yi02)
                + (xr02 * yr01 - xr01 * yr02));
        out[8] = s * ((xd1 - xd2) * yr12 - (yd1 - yd2) * xr12 + (xi01 * yr02 - xr01 * yi02)
                + (xi02 * yr01 - xr02 * yi01));
    }

    /** out = X² (Hermitian, packed) for a packed anti-Hermitian X; out must not alias x. */
    static void square(double[] x, double[] out) {
        double d0 = x[0], d1 = x[1], d2 = x[2], r01 = x[3], i01 = x[4], r02 = x[5], i02 = x[6], r12 = x[7],
                i12 = x[8];
        double m01 = r01 * r01 + i01 * i01, m02 = r02 * r02 + i02 * i02, m12 = r12 * r12 + i12 * i12;
        out[0] = -(d0 * d0 + m01 + m02);
        out[1] = -(d1 * d1 + m01 + m12);
        out[2] = -(d2 * d2 + m02 + m12);
        out[3] = -((d0 + d1) * i01 + i02 * i12 + r02 * r12);
        out[4] = (d0 + d1) * r01 + i12 * r02 - i02 * r12;
        out[5] = r01 * r12 - (d0 + d2) * i02 - i01 * i12;
        out[6] = (d0 + d2) * r02 + i01 * r12 + i12 * r01;
        out[7] = -((d1 + d2) * i12 + i01 * i02 + r01 * r02);
        out[8] = (d1 + d2) * r12 + i01 * r02 - i02 * r01;
    }

    /**
     * out = the Hermitian part of H·G from its upper triangle (packed), for commuting Hermitian H, G (powers and
     * polynomials of one matrix, whose product is Hermitian); out must not alias an input.
     */
    static void mulHermitian(double[] h, double[] g, double[] out) {
        double hd0 = h[0], hd1 = h[1], hd2 = h[2], hr01 = h[3], hi01 = h[4], hr02 = h[5], hi02 = h[6],
                hr12 = h[7], hi12 = h[8];
        double gd0 = g[0], gd1 = g[1], gd2 = g[2], gr01 = g[3], gi01 = g[4], gr02 = g[5], gi02 = g[6],
                gr12 = g[7], gi12 = g[8];
        double c01 = hr01 * gr01 + hi01 * gi01, c02 = hr02 * gr02 + hi02 * gi02, c12 = hr12 * gr12 + hi12 * gi12;
        out[0] = hd0 * gd0 + c01 + c02;
        out[1] = hd1 * gd1 + c01 + c12;
        out[2] = hd2 * gd2 + c02 + c12;
        out[3] = hd0 * gr01 + hr01 * gd1 + (hr02 * gr12 + hi02 * gi12);
        out[4] = hd0 * gi01 + hi01 * gd1 + (hi02 * gr12 - hr02 * gi12);
        out[5] = hd0 * gr02 + hr02 * gd2 + (hr01 * gr12 - hi01 * gi12);
        out[6] = hd0 * gi02 + hi02 * gd2 + (hr01 * gi12 + hi01 * gr12);
        out[7] = hd1 * gr12 + hr12 * gd2 + (hr01 * gr02 + hi01 * gi02);
        out[8] = hd1 * gi12 + hi12 * gd2 + (hr01 * gi02 - hi01 * gr02);
    }

    /**
     * out = the anti-Hermitian part of X·H from its upper triangle (packed), for a packed anti-Hermitian X and a
     * Hermitian H that commutes with it (so that X·H is anti-Hermitian); out must not alias an input.
     */
    static void mulOdd(double[] x, double[] h, double[] out) {
        double xd0 = x[0], xd1 = x[1], xd2 = x[2], xr01 = x[3], xi01 = x[4], xr02 = x[5], xi02 = x[6],
                xr12 = x[7], xi12 = x[8];
        double hd0 = h[0], hd1 = h[1], hd2 = h[2], hr01 = h[3], hi01 = h[4], hr02 = h[5], hi02 = h[6],
                hr12 = h[7], hi12 = h[8];
        double c01 = hr01 * xi01 - hi01 * xr01, c02 = hr02 * xi02 - hi02 * xr02, c12 = hr12 * xi12 - hi12 * xr12;
        out[0] = hd0 * xd0 + c01 + c02;
        out[1] = hd1 * xd1 + c01 + c12;
        out[2] = hd2 * xd2 + c02 + c12;
        out[3] = hd1 * xr01 - hi01 * xd0 + (hi12 * xi02 + hr12 * xr02);
        out[4] = hd1 * xi01 + hr01 * xd0 + (hr12 * xi02 - hi12 * xr02);
        out[5] = hd2 * xr02 - hi02 * xd0 + (hr12 * xr01 - hi12 * xi01);
        out[6] = hd2 * xi02 + hr02 * xd0 + (hi12 * xr01 + hr12 * xi01);
        out[7] = hd2 * xr12 - hi12 * xd1 - (hi02 * xi01 + hr02 * xr01);
        out[8] = hd2 * xi12 + hr12 * xd1 + (hr02 * xi01 - hi02 * xr01);
    }

    /** x ← x ∘ e^{i(c_a − c_b)}: the conjugation e^{iC} X e^{−iC} by a real diagonal C = diag(c), on packed X. */
    public static void conjugate(double[] x, double c0, double c1, double c2) {
        // e^{i(c0−c2)} as the product of the other two phases: two sines and cosines instead of three pairs
        double a = c0 - c1, b = c1 - c2;
        double ca = Math.cos(a), sa = Math.sin(a), cb = Math.cos(b), sb = Math.sin(b);
        rotate(x, 3, ca, sa);
        rotate(x, 5, ca * cb - sa * sb, sa * cb + ca * sb);
        rotate(x, 7, cb, sb);
    }

    private static void rotate(double[] x, int k, double c, double s) {
        double re = x[k], im = x[k + 1];
        x[k] = c * re - s * im;
        x[k + 1] = c * im + s * re;
    }

    /** @return the 1-norm of scale·X for packed anti-Hermitian X (column sums of moduli) */
    public static double norm1(double[] x) {
        double m01 = Math.sqrt(x[3] * x[3] + x[4] * x[4]), m02 = Math.sqrt(x[5] * x[5] + x[6] * x[6]),
                m12 = Math.sqrt(x[7] * x[7] + x[8] * x[8]);
        return Math.max(Math.abs(x[0]) + m01 + m02, Math.max(Math.abs(x[1]) + m01 + m12,
                Math.abs(x[2]) + m02 + m12));
    }

    /**
     * out = exp(scale·X) − I (planar 3×3) for packed anti-Hermitian X, unless the 1-norm that selects degree and
     * scaling (after the Gershgorin-centre shift) exceeds maxNorm: then nothing is written and false is returned.
     * Non-finite input gives NaN. x is not modified.
     *
     * @return whether the increment was written
     */
    public boolean increment(double scale, double[] x, double[] outR, double[] outI, double maxNorm) {
        double[] a = this.a;
        for (int q = 0; q < LEN; q++) {
            a[q] = scale * x[q];
        }
        double m01 = Math.sqrt(a[3] * a[3] + a[4] * a[4]), m02 = Math.sqrt(a[5] * a[5] + a[6] * a[6]),
                m12 = Math.sqrt(a[7] * a[7] + a[8] * a[8]);
        double r0 = m01 + m02, r1 = m01 + m12, r2 = m02 + m12;
        double norm = Math.max(Math.abs(a[0]) + r0, Math.max(Math.abs(a[1]) + r1, Math.abs(a[2]) + r2));
        if (norm == Double.POSITIVE_INFINITY) {
            // moduli beyond 1e154 overflow the plain formula: the careful norm decides
            norm = Math.max(Math.abs(a[0]) + Math.hypot(a[3], a[4]) + Math.hypot(a[5], a[6]),
                    Math.max(Math.abs(a[1]) + Math.hypot(a[3], a[4]) + Math.hypot(a[7], a[8]),
                            Math.abs(a[2]) + Math.hypot(a[5], a[6]) + Math.hypot(a[7], a[8])));
        }
        if (!(norm < Double.POSITIVE_INFINITY)) {
            java.util.Arrays.fill(outR, 0, 9, Double.NaN);
            java.util.Arrays.fill(outI, 0, 9, Double.NaN);
            return true;
        }
        // Gershgorin centre, taken as the general workspace takes it for n = 3 (see Expm#centre)
        double lo = Math.min(a[0] - r0, Math.min(a[1] - r1, a[2] - r2));
        double hi = Math.max(a[0] + r0, Math.max(a[1] + r1, a[2] + r2));
        double c = 0.5 * (lo + hi);
        int before = Expm.cost(norm);
        int needed = before < 4 ? 2 : 1;
        if (before >= needed && Double.isFinite(c) && before - Expm.cost(0.5 * (hi - lo)) >= needed) {
            a[0] -= c;
            a[1] -= c;
            a[2] -= c;
            norm = Math.max(Math.abs(a[0]) + r0, Math.max(Math.abs(a[1]) + r1, Math.abs(a[2]) + r2));
        } else {
            c = 0.0;
        }
        if (norm > maxNorm) {
            return false;
        }
        if (norm == 0) {
            java.util.Arrays.fill(outR, 0, 9, 0.0);
            java.util.Arrays.fill(outI, 0, 9, 0.0);
        } else {
            pade(norm, outR, outI);
        }
        if (c != 0.0) {
            unshift(c, outR, outI);
        }
        return true;
    }

    /** The Padé increment of the loaded a with 1-norm norm (> 0, finite). */
    private void pade(double norm, double[] outR, double[] outI) {
        double[] a = this.a, a2 = this.a2, a4 = this.a4, a6 = this.a6, s = this.s, v = this.v, t = this.t;
        square(a, a2);
        int squarings = 0;
        if (norm <= Expm.THETA[0]) {
            double[] b = Expm.B3;
            polynomial(b[3], a2, 0, null, 0, null, b[1], s);
            polynomial(b[2], a2, 0, null, 0, null, b[0], v);
        } else {
            mulHermitian(a2, a2, a4);
            if (norm <= Expm.THETA[1]) {
                double[] b = Expm.B5;
                polynomial(b[3], a2, b[5], a4, 0, null, b[1], s);
                polynomial(b[2], a2, b[4], a4, 0, null, b[0], v);
            } else if (norm <= Expm.THETA[3]) {
                mulHermitian(a4, a2, a6);
                if (norm <= Expm.THETA[2]) {
                    double[] b = Expm.B7;
                    polynomial(b[3], a2, b[5], a4, b[7], a6, b[1], s);
                    polynomial(b[2], a2, b[4], a4, b[6], a6, b[0], v);
                } else {
                    double[] b = Expm.B9;
                    mulHermitian(a4, a4, t);
                    polynomial(b[3], a2, b[5], a4, b[7], a6, b[1], s);
                    polynomial(b[2], a2, b[4], a4, b[6], a6, b[0], v);
                    for (int q = 0; q < LEN; q++) {
                        s[q] += b[9] * t[q];
                        v[q] += b[8] * t[q];
                    }
                }
            } else {
                double ratio = norm / Expm.THETA[4];
                if (ratio > 1) {
                    squarings = Math.getExponent(ratio);
                    if (ratio > Math.scalb(1.0, squarings)) {
                        squarings++;
                    }
                }
                if (squarings > 0) {
                    double f = Math.scalb(1.0, -squarings), f2 = f * f, f4 = f2 * f2;
                    for (int q = 0; q < LEN; q++) {
                        a[q] *= f;
                        a2[q] *= f2;
                        a4[q] *= f4;
                    }
                }
                mulHermitian(a4, a2, a6);
                double[] b = Expm.B13;
                // S = A6 (b13 A6 + b11 A4 + b9 A2) + b7 A6 + b5 A4 + b3 A2 + b1 I, V likewise with the even b
                polynomial(b[9], a2, b[11], a4, b[13], a6, 0.0, t);
                mulHermitian(a6, t, s);
                polynomial(b[3], a2, b[5], a4, b[7], a6, b[1], t);
                for (int q = 0; q < LEN; q++) {
                    s[q] += t[q];
                }
                polynomial(b[8], a2, b[10], a4, b[12], a6, 0.0, t);
                mulHermitian(a6, t, v);
                polynomial(b[2], a2, b[4], a4, b[6], a6, b[0], t);
                for (int q = 0; q < LEN; q++) {
                    v[q] += t[q];
                }
            }
        }
        mulOdd(a, s, u);
        solve(outR, outI);
        for (int q = 0; q < squarings; q++) {
            // (I + D)² − I = D² + 2D
            System.arraycopy(outR, 0, tr, 0, 9);
            System.arraycopy(outI, 0, ti, 0, 9);
            Dense.mul(3, tr, ti, tr, ti, outR, outI);
            for (int k = 0; k < 9; k++) {
                outR[k] += 2 * tr[k];
                outI[k] += 2 * ti[k];
            }
        }
    }

    /** out = p·x + q·y + r·z + c·I (packed Hermitian; y, z may be null with zero weight). */
    private static void polynomial(double p, double[] x, double q, double[] y, double r, double[] z, double c,
                                   double[] out) {
        for (int k = 0; k < LEN; k++) {
            double e = p * x[k];
            if (y != null) {
                e += q * y[k];
            }
            if (z != null) {
                e += r * z[k];
            }
            out[k] = e;
        }
        out[0] += c;
        out[1] += c;
        out[2] += c;
    }

    /**
     * out = 2(V − U)^{-1}U (planar) from the packed Hermitian V and anti-Hermitian U, by Gaussian elimination with
     * partial pivoting (V − U is close to b₀I whenever the degree is chosen by the θ bounds, so the pivots are the
     * diagonal in practice; the search keeps the solve safe for any input). NaN if a pivot is exactly zero.
     */
    private void solve(double[] outR, double[] outI) {
        double[] v = this.v, u = this.u, mr = this.mr, mi = this.mi;
        // M = V − U: diagonal v_a − i u_a; (a, b) for a < b: V_ab − U_ab; (b, a): conj(V_ab + U_ab)
        mr[0] = v[0];
        mi[0] = -u[0];
        mr[4] = v[1];
        mi[4] = -u[1];
        mr[8] = v[2];
        mi[8] = -u[2];
        offDiagonal(mr, mi, 1, 3, v[3] - u[3], v[4] - u[4], v[3] + u[3], -(v[4] + u[4]));
        offDiagonal(mr, mi, 2, 6, v[5] - u[5], v[6] - u[6], v[5] + u[5], -(v[6] + u[6]));
        offDiagonal(mr, mi, 5, 7, v[7] - u[7], v[8] - u[8], v[7] + u[7], -(v[8] + u[8]));
        // right-hand side 2U (planar)
        outR[0] = 0.0;
        outI[0] = 2 * u[0];
        outR[4] = 0.0;
        outI[4] = 2 * u[1];
        outR[8] = 0.0;
        outI[8] = 2 * u[2];
        offDiagonal(outR, outI, 1, 3, 2 * u[3], 2 * u[4], -2 * u[3], 2 * u[4]);
        offDiagonal(outR, outI, 2, 6, 2 * u[5], 2 * u[6], -2 * u[5], 2 * u[6]);
        offDiagonal(outR, outI, 5, 7, 2 * u[7], 2 * u[8], -2 * u[7], 2 * u[8]);
        if (solveDominant(outR, outI)) {
            return;
        }
        for (int k = 0; k < 3; k++) {
            int p = k;
            double best = Math.abs(mr[4 * k]) + Math.abs(mi[4 * k]);
            for (int i = k + 1; i < 3; i++) {
                double x = Math.abs(mr[3 * i + k]) + Math.abs(mi[3 * i + k]);
                if (x > best) {
                    best = x;
                    p = i;
                }
            }
            if (!(best > 0)) {
                java.util.Arrays.fill(outR, 0, 9, Double.NaN);
                java.util.Arrays.fill(outI, 0, 9, Double.NaN);
                return;
            }
            if (p != k) {
                swapRows(mr, k, p);
                swapRows(mi, k, p);
                swapRows(outR, k, p);
                swapRows(outI, k, p);
            }
            double dr = mr[4 * k], di = mi[4 * k], den = dr * dr + di * di;
            double invr = dr / den, invi = -di / den;
            // row k scaled by the inverse pivot, so back substitution needs no division
            for (int j = k + 1; j < 3; j++) {
                double x = mr[3 * k + j], y = mi[3 * k + j];
                mr[3 * k + j] = x * invr - y * invi;
                mi[3 * k + j] = x * invi + y * invr;
            }
            for (int j = 0; j < 3; j++) {
                double x = outR[3 * k + j], y = outI[3 * k + j];
                outR[3 * k + j] = x * invr - y * invi;
                outI[3 * k + j] = x * invi + y * invr;
            }
            for (int i = k + 1; i < 3; i++) {
                double lr = mr[3 * i + k], li = mi[3 * i + k];
                for (int j = k + 1; j < 3; j++) {
                    double x = mr[3 * k + j], y = mi[3 * k + j];
                    mr[3 * i + j] -= lr * x - li * y;
                    mi[3 * i + j] -= lr * y + li * x;
                }
                for (int j = 0; j < 3; j++) {
                    double x = outR[3 * k + j], y = outI[3 * k + j];
                    outR[3 * i + j] -= lr * x - li * y;
                    outI[3 * i + j] -= lr * y + li * x;
                }
            }
        }
        // back substitution with the unit upper triangle
        for (int k = 1; k >= 0; k--) {
            for (int i = k + 1; i < 3; i++) {
                double lr = mr[3 * k + i], li = mi[3 * k + i];
                for (int j = 0; j < 3; j++) {
                    double x = outR[3 * i + j], y = outI[3 * i + j];
                    outR[3 * k + j] -= lr * x - li * y;
                    outI[3 * k + j] -= lr * y + li * x;
                }
            }
        }
    }

    /**
     * The solve of {@link #solve} without pivoting, unrolled, when M (in mr, mi) is strictly diagonally dominant by
     * columns (checked with max(|Re|, |Im|) ≤ |m_kk| on the diagonal and |Re| + |Im| ≥ |m_ik| off it, so the test
     * is sufficient): Gaussian elimination without pivoting is then stable, its growth factor at most 2 (N.J.
     * Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM 2002, §9.5 [from memory]). This is the
     * case of every low-degree Padé denominator, b₀I plus terms smaller by the θ bounds.
     *
     * @return false (nothing written) when the test fails
     */
    private boolean solveDominant(double[] outR, double[] outI) {
        double[] mr = this.mr, mi = this.mi;
        for (int k = 0; k < 3; k++) {
            double off = 0;
            for (int i = 0; i < 3; i++) {
                if (i != k) {
                    off += Math.abs(mr[3 * i + k]) + Math.abs(mi[3 * i + k]);
                }
            }
            if (!(Math.max(Math.abs(mr[4 * k]), Math.abs(mi[4 * k])) > off)) {
                return false;
            }
        }
        double r00 = mr[0], i00 = mi[0], r01 = mr[1], i01 = mi[1], r02 = mr[2], i02 = mi[2];
        double r10 = mr[3], i10 = mi[3], r11 = mr[4], i11 = mi[4], r12 = mr[5], i12 = mi[5];
        double r20 = mr[6], i20 = mi[6], r21 = mr[7], i21 = mi[7], r22 = mr[8], i22 = mi[8];
        double inv = 1.0 / (r00 * r00 + i00 * i00), p0r = r00 * inv, p0i = -i00 * inv;
        double l10r = r10 * p0r - i10 * p0i, l10i = r10 * p0i + i10 * p0r;
        double l20r = r20 * p0r - i20 * p0i, l20i = r20 * p0i + i20 * p0r;
        // Schur complement of m00
        double s11r = r11 - (l10r * r01 - l10i * i01), s11i = i11 - (l10r * i01 + l10i * r01);
        double s12r = r12 - (l10r * r02 - l10i * i02), s12i = i12 - (l10r * i02 + l10i * r02);
        double s21r = r21 - (l20r * r01 - l20i * i01), s21i = i21 - (l20r * i01 + l20i * r01);
        double s22r = r22 - (l20r * r02 - l20i * i02), s22i = i22 - (l20r * i02 + l20i * r02);
        inv = 1.0 / (s11r * s11r + s11i * s11i);
        double p1r = s11r * inv, p1i = -s11i * inv;
        double l21r = s21r * p1r - s21i * p1i, l21i = s21r * p1i + s21i * p1r;
        double t22r = s22r - (l21r * s12r - l21i * s12i), t22i = s22i - (l21r * s12i + l21i * s12r);
        inv = 1.0 / (t22r * t22r + t22i * t22i);
        double p2r = t22r * inv, p2i = -t22i * inv;
        for (int j = 0; j < 3; j++) {
            double y0r = outR[j], y0i = outI[j];
            double y1r = outR[3 + j] - (l10r * y0r - l10i * y0i), y1i = outI[3 + j] - (l10r * y0i + l10i * y0r);
            double y2r = outR[6 + j] - (l20r * y0r - l20i * y0i) - (l21r * y1r - l21i * y1i);
            double y2i = outI[6 + j] - (l20r * y0i + l20i * y0r) - (l21r * y1i + l21i * y1r);
            double x2r = y2r * p2r - y2i * p2i, x2i = y2r * p2i + y2i * p2r;
            double z1r = y1r - (s12r * x2r - s12i * x2i), z1i = y1i - (s12r * x2i + s12i * x2r);
            double x1r = z1r * p1r - z1i * p1i, x1i = z1r * p1i + z1i * p1r;
            double z0r = y0r - (r01 * x1r - i01 * x1i) - (r02 * x2r - i02 * x2i);
            double z0i = y0i - (r01 * x1i + i01 * x1r) - (r02 * x2i + i02 * x2r);
            outR[j] = z0r * p0r - z0i * p0i;
            outI[j] = z0r * p0i + z0i * p0r;
            outR[3 + j] = x1r;
            outI[3 + j] = x1i;
            outR[6 + j] = x2r;
            outI[6 + j] = x2i;
        }
        return true;
    }

    private static void offDiagonal(double[] re, double[] im, int ab, int ba, double xr, double xi, double yr,
                                    double yi) {
        re[ab] = xr;
        im[ab] = xi;
        re[ba] = yr;
        im[ba] = yi;
    }

    private static void swapRows(double[] x, int k, int p) {
        for (int j = 0; j < 3; j++) {
            double e = x[3 * k + j];
            x[3 * k + j] = x[3 * p + j];
            x[3 * p + j] = e;
        }
    }

    /** out ← e^{ic}·out + (e^{ic} − 1)I, without cancellation in e^{ic} − 1 (as {@link Expm}'s unshift). */
    private static void unshift(double c, double[] outR, double[] outI) {
        double cr = Math.cos(c), ci = Math.sin(c), h = Math.sin(0.5 * c);
        for (int k = 0; k < 9; k++) {
            double x = outR[k], y = outI[k];
            outR[k] = cr * x - ci * y;
            outI[k] = cr * y + ci * x;
        }
        double mr = -2 * h * h;
        outR[0] += mr;
        outI[0] += ci;
        outR[4] += mr;
        outI[4] += ci;
        outR[8] += mr;
        outI[8] += ci;
    }
}
