package org.liepath.core.internal;

/**
 * Kernels on dense complex n×n matrices stored planar and row-major: entry (i, j) is {@code re[i*n+j] + i im[i*n+j]}.
 * No method allocates; outputs must not alias inputs unless stated. Not part of the public API.
 */
public final class Dense {
    private Dense() {
    }

    /**
     * c = a·b. Outputs must not alias inputs. Cost 8n³ flops.
     *
     * <p>Kernel choice (measured with JMH in the benchmarks module, {@code MatMulBenchmark}): n = 2 is fully
     * unrolled, n = 3 and 4 keep a row of c in registers; otherwise an i-k-j loop on the planar arrays over pairs of
     * rows of c with two k-rows of b per pass, so each row of c is loaded and stored half as often, each element of b
     * serves two rows, and the j loop (unit stride in b and c) is vectorised by the JIT. Blocks of four rows were
     * tried and measured no faster (more live vector registers than x86-64 has). On machines with hardware fused
     * multiply–add ({@link #FUSED}), n = 5 … {@link #FUSED_MAX} go through {@link #fused} instead: below ~32 the
     * j loop is too short for the vectoriser, so the plain kernel runs at scalar rates, where fused steps halve the
     * arithmetic instructions; up to 128 the fused kernel still measured faster than the vectorised plain loop.
     */
    public static void mul(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        if (n == 2) {
            mul2(ar, ai, br, bi, cr, ci);
            return;
        }
        if (n == 4) {
            mul4(ar, ai, br, bi, cr, ci);
            return;
        }
        if (n == 3) {
            mul3(ar, ai, br, bi, cr, ci);
            return;
        }
        blocked(n, false, ar, ai, br, bi, cr, ci);
    }

    /**
     * The general product loop: all of c, or (upper) its triangle j ≥ i, where each row pair's j loop starts at the
     * pair's first row (still unit stride) and entry (i+1, i) is formed too, to keep one loop for both rows.
     */
    private static void blocked(int n, boolean upper, double[] ar, double[] ai, double[] br, double[] bi,
                                double[] cr, double[] ci) {
        if (FUSED && n >= 5 && n <= FUSED_MAX) {
            fused(n, upper, ar, ai, br, bi, cr, ci);
            return;
        }
        plain(n, upper, ar, ai, br, bi, cr, ci);
    }

    /** The row-pair kernel of {@link #blocked}, whatever {@link #FUSED} says (package-private for tests). */
    static void plain(int n, boolean upper, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                      double[] ci) {
        java.util.Arrays.fill(cr, 0, n * n, 0.0);
        java.util.Arrays.fill(ci, 0, n * n, 0.0);
        // k is blocked so that the panel of b rows in use (both planes) stays within ~128 KB (a Level-2 cache)
        int kb = Math.max(2, (8192 / n) & ~1);
        for (int k0 = 0; k0 < n; k0 += kb) {
            int k1 = Math.min(n, k0 + kb);
            int i = 0;
            for (; i + 1 < n; i += 2) {
                rowPair(n, i, upper ? i : 0, k0, k1, ar, ai, br, bi, cr, ci);
            }
            if (i < n) {
                if (upper) {
                    upperLastRow(n, i, k0, k1, ar, ai, br, bi, cr, ci);
                } else {
                    row(n, i, k0, k1, ar, ai, br, bi, cr, ci);
                }
            }
        }
    }

    /**
     * Whether products of dimension 5 … {@link #FUSED_MAX} use the fused kernel {@link #fused}: true where HotSpot
     * reports a hardware fused multiply–add (its {@code UseFMA} flag), so that {@link Math#fma} is one instruction;
     * elsewhere Math.fma may be a slow exact software emulation, and the plain kernel serves. The system property
     * {@code liepath.fusedProducts} ({@code true} or {@code false}), read once when this class loads, overrides the
     * detection. Both kernels round differently (a fused step rounds once where the plain one rounds twice), so
     * results agree across machines to rounding, not bit for bit; on one machine every path is deterministic.
     */
    public static final boolean FUSED = detectFused();

    /**
     * Largest dimension for the fused kernel: its 2×2 blocks walk two columns of b over all k, which stays cheap
     * while the 2n rows touched (both planes) sit in the level-1 and level-2 caches; beyond it the row-pair kernel's
     * k-blocked panels serve. Interleaved timing on this project's machines (2×2 fused blocks against the plain
     * row-pair kernel, one JVM): 1.6× at n = 8, 1.3× at 16, 1.6× at 32, 1.4× at 48 and 64, 2.1× at 96, 1.45× at 128.
     */
    static final int FUSED_MAX = 128;

    private static boolean detectFused() {
        String forced = System.getProperty("liepath.fusedProducts");
        if (forced != null) {
            return Boolean.parseBoolean(forced.trim());
        }
        try {
            com.sun.management.HotSpotDiagnosticMXBean vm = java.lang.management.ManagementFactory
                    .getPlatformMXBean(com.sun.management.HotSpotDiagnosticMXBean.class);
            return vm != null && "true".equals(vm.getVMOption("UseFMA").getValue());
        } catch (RuntimeException | LinkageError e) {
            // not HotSpot, no jdk.management module, or no such flag: the plain kernel is the safe choice
            return false;
        }
    }

    /**
     * c = a·b (or, with upper, its blocks on and above the diagonal) by 2×2 blocks of c held in eight register
     * accumulators over the whole k range, each complex multiply–add as two fused steps per plane:
     * re ← fma(−x_i, p_i, fma(x_r, p_r, re)), im ← fma(x_i, p_r, fma(x_r, p_i, im)). Every entry receives this same
     * sequence in k order whatever block shape holds it (2×2, 2×1, 1×2, 1×1 at odd edges), so the upper variant is
     * bit-identical to the full product on its entries. Operand rows with a zero pair of entries at k skip that k
     * (as the plain kernel skips zero blocks), which only drops exact zeros. Outputs must not alias inputs.
     */
    static void fused(int n, boolean upper, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                      double[] ci) {
        int i = 0;
        for (; i + 1 < n; i += 2) {
            int j = upper ? i : 0;
            for (; j + 1 < n; j += 2) {
                fused22(n, i, j, ar, ai, br, bi, cr, ci);
            }
            if (j < n) {
                fused21(n, i, j, ar, ai, br, bi, cr, ci);
            }
        }
        if (i < n) {
            int j = upper ? i : 0;
            for (; j + 1 < n; j += 2) {
                fused12(n, i, j, ar, ai, br, bi, cr, ci);
            }
            if (j < n) {
                fused11(n, i, j, ar, ai, br, bi, cr, ci);
            }
        }
    }

    /** Entries (i, j), (i, j+1), (i+1, j), (i+1, j+1) of {@link #fused}. */
    private static void fused22(int n, int i, int j, double[] ar, double[] ai, double[] br, double[] bi,
                                double[] cr, double[] ci) {
        int in = i * n, jn = in + n;
        double ar0 = 0, ai0 = 0, ar1 = 0, ai1 = 0, br0 = 0, bi0 = 0, br1 = 0, bi1 = 0;
        for (int k = 0, kn = j; k < n; k++, kn += n) {
            double xr = ar[in + k], xi = ai[in + k], ur = ar[jn + k], ui = ai[jn + k];
            if (xr == 0 && xi == 0 && ur == 0 && ui == 0) {
                continue;
            }
            double pr = br[kn], pi = bi[kn], qr = br[kn + 1], qi = bi[kn + 1];
            ar0 = Math.fma(-xi, pi, Math.fma(xr, pr, ar0));
            ai0 = Math.fma(xi, pr, Math.fma(xr, pi, ai0));
            ar1 = Math.fma(-xi, qi, Math.fma(xr, qr, ar1));
            ai1 = Math.fma(xi, qr, Math.fma(xr, qi, ai1));
            br0 = Math.fma(-ui, pi, Math.fma(ur, pr, br0));
            bi0 = Math.fma(ui, pr, Math.fma(ur, pi, bi0));
            br1 = Math.fma(-ui, qi, Math.fma(ur, qr, br1));
            bi1 = Math.fma(ui, qr, Math.fma(ur, qi, bi1));
        }
        cr[in + j] = ar0;
        ci[in + j] = ai0;
        cr[in + j + 1] = ar1;
        ci[in + j + 1] = ai1;
        cr[jn + j] = br0;
        ci[jn + j] = bi0;
        cr[jn + j + 1] = br1;
        ci[jn + j + 1] = bi1;
    }

    /** Entries (i, j) and (i+1, j) of {@link #fused} (the last column of an odd n). */
    private static void fused21(int n, int i, int j, double[] ar, double[] ai, double[] br, double[] bi,
                                double[] cr, double[] ci) {
        int in = i * n, jn = in + n;
        double ar0 = 0, ai0 = 0, br0 = 0, bi0 = 0;
        for (int k = 0, kn = j; k < n; k++, kn += n) {
            double xr = ar[in + k], xi = ai[in + k], ur = ar[jn + k], ui = ai[jn + k];
            if (xr == 0 && xi == 0 && ur == 0 && ui == 0) {
                continue;
            }
            double pr = br[kn], pi = bi[kn];
            ar0 = Math.fma(-xi, pi, Math.fma(xr, pr, ar0));
            ai0 = Math.fma(xi, pr, Math.fma(xr, pi, ai0));
            br0 = Math.fma(-ui, pi, Math.fma(ur, pr, br0));
            bi0 = Math.fma(ui, pr, Math.fma(ur, pi, bi0));
        }
        cr[in + j] = ar0;
        ci[in + j] = ai0;
        cr[jn + j] = br0;
        ci[jn + j] = bi0;
    }

    /** Entries (i, j) and (i, j+1) of {@link #fused} (the last row of an odd n). */
    private static void fused12(int n, int i, int j, double[] ar, double[] ai, double[] br, double[] bi,
                                double[] cr, double[] ci) {
        int in = i * n;
        double ar0 = 0, ai0 = 0, ar1 = 0, ai1 = 0;
        for (int k = 0, kn = j; k < n; k++, kn += n) {
            double xr = ar[in + k], xi = ai[in + k];
            if (xr == 0 && xi == 0) {
                continue;
            }
            double pr = br[kn], pi = bi[kn], qr = br[kn + 1], qi = bi[kn + 1];
            ar0 = Math.fma(-xi, pi, Math.fma(xr, pr, ar0));
            ai0 = Math.fma(xi, pr, Math.fma(xr, pi, ai0));
            ar1 = Math.fma(-xi, qi, Math.fma(xr, qr, ar1));
            ai1 = Math.fma(xi, qr, Math.fma(xr, qi, ai1));
        }
        cr[in + j] = ar0;
        ci[in + j] = ai0;
        cr[in + j + 1] = ar1;
        ci[in + j + 1] = ai1;
    }

    /** Entry (i, j) of {@link #fused} (the corner of an odd n). */
    private static void fused11(int n, int i, int j, double[] ar, double[] ai, double[] br, double[] bi,
                                double[] cr, double[] ci) {
        int in = i * n;
        double ar0 = 0, ai0 = 0;
        for (int k = 0, kn = j; k < n; k++, kn += n) {
            double xr = ar[in + k], xi = ai[in + k];
            if (xr == 0 && xi == 0) {
                continue;
            }
            double pr = br[kn], pi = bi[kn];
            ar0 = Math.fma(-xi, pi, Math.fma(xr, pr, ar0));
            ai0 = Math.fma(xi, pr, Math.fma(xr, pi, ai0));
        }
        cr[in + j] = ar0;
        ci[in + j] = ai0;
    }

    /**
     * Rows i and i+1 of c on columns j0 … n−1 over the k range [k0, k1), two k-rows of b per pass: each b element
     * loaded serves both rows of c, so a vectorised j step moves 12 doubles for 32 flops instead of 8 for 16. Each
     * entry of c receives the same sums in the same order as in {@link #row}, so the result does not depend on the
     * row pairing, nor on the start column.
     */
    private static void rowPair(int n, int i, int j0, int k0, int k1, double[] ar, double[] ai, double[] br,
                                double[] bi, double[] cr, double[] ci) {
        int in = i * n, jn = in + n;
        int k = k0;
        for (; k + 1 < k1; k += 2) {
            double xr = ar[in + k], xi = ai[in + k], yr = ar[in + k + 1], yi = ai[in + k + 1];
            double ur = ar[jn + k], ui = ai[jn + k], vr = ar[jn + k + 1], vi = ai[jn + k + 1];
            if (xr == 0 && xi == 0 && yr == 0 && yi == 0 && ur == 0 && ui == 0 && vr == 0 && vi == 0) {
                continue; // sparse operands (Kronecker products, superoperators) skip whole 2×2 blocks of a
            }
            int kn = k * n, k1n = kn + n;
            for (int j = j0; j < n; j++) {
                double pr = br[kn + j], pim = bi[kn + j], qr = br[k1n + j], qi = bi[k1n + j];
                cr[in + j] += xr * pr - xi * pim + yr * qr - yi * qi;
                ci[in + j] += xr * pim + xi * pr + yr * qi + yi * qr;
                cr[jn + j] += ur * pr - ui * pim + vr * qr - vi * qi;
                ci[jn + j] += ur * pim + ui * pr + vr * qi + vi * qr;
            }
        }
        if (k < k1) {
            double xr = ar[in + k], xi = ai[in + k], ur = ar[jn + k], ui = ai[jn + k];
            int kn = k * n;
            for (int j = j0; j < n; j++) {
                double pr = br[kn + j], pim = bi[kn + j];
                cr[in + j] += xr * pr - xi * pim;
                ci[in + j] += xr * pim + xi * pr;
                cr[jn + j] += ur * pr - ui * pim;
                ci[jn + j] += ur * pim + ui * pr;
            }
        }
    }

    /** Row i of c over the k range [k0, k1), two k-rows of b per pass (the odd last row of an odd n). */
    private static void row(int n, int i, int k0, int k1, double[] ar, double[] ai, double[] br, double[] bi,
                            double[] cr, double[] ci) {
        int in = i * n;
        int k = k0;
        for (; k + 1 < k1; k += 2) {
            double xr = ar[in + k], xi = ai[in + k], yr = ar[in + k + 1], yi = ai[in + k + 1];
            if (xr == 0 && xi == 0 && yr == 0 && yi == 0) {
                continue;
            }
            int kn = k * n, k1n = kn + n;
            for (int j = 0; j < n; j++) {
                double pr = br[kn + j], pim = bi[kn + j], qr = br[k1n + j], qi = bi[k1n + j];
                cr[in + j] += xr * pr - xi * pim + yr * qr - yi * qi;
                ci[in + j] += xr * pim + xi * pr + yr * qi + yi * qr;
            }
        }
        if (k < k1) {
            double xr = ar[in + k], xi = ai[in + k];
            int kn = k * n;
            for (int j = 0; j < n; j++) {
                double pr = br[kn + j], pim = bi[kn + j];
                cr[in + j] += xr * pr - xi * pim;
                ci[in + j] += xr * pim + xi * pr;
            }
        }
    }

    /** n = 4: one row of c in eight register accumulators (the j loop is too short for the vectoriser). */
    private static void mul4(double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        for (int i = 0; i < 16; i += 4) {
            double r0 = 0, r1 = 0, r2 = 0, r3 = 0, i0 = 0, i1 = 0, i2 = 0, i3 = 0;
            for (int k = 0; k < 4; k++) {
                double xr = ar[i + k], xi = ai[i + k];
                int o = 4 * k;
                double p0 = br[o], p1 = br[o + 1], p2 = br[o + 2], p3 = br[o + 3];
                double q0 = bi[o], q1 = bi[o + 1], q2 = bi[o + 2], q3 = bi[o + 3];
                r0 += xr * p0 - xi * q0;
                i0 += xr * q0 + xi * p0;
                r1 += xr * p1 - xi * q1;
                i1 += xr * q1 + xi * p1;
                r2 += xr * p2 - xi * q2;
                i2 += xr * q2 + xi * p2;
                r3 += xr * p3 - xi * q3;
                i3 += xr * q3 + xi * p3;
            }
            cr[i] = r0;
            cr[i + 1] = r1;
            cr[i + 2] = r2;
            cr[i + 3] = r3;
            ci[i] = i0;
            ci[i + 1] = i1;
            ci[i + 2] = i2;
            ci[i + 3] = i3;
        }
    }

    /**
     * n = 3: one row of c in six register accumulators; the general loop's fill, blocking and pair bookkeeping cost
     * more than the 216 flops of a 3×3 product.
     */
    private static void mul3(double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        double p0 = br[0], p1 = br[1], p2 = br[2], p3 = br[3], p4 = br[4], p5 = br[5], p6 = br[6], p7 = br[7],
            p8 = br[8];
        double q0 = bi[0], q1 = bi[1], q2 = bi[2], q3 = bi[3], q4 = bi[4], q5 = bi[5], q6 = bi[6], q7 = bi[7],
            q8 = bi[8];
        for (int i = 0; i < 9; i += 3) {
            double xr = ar[i], xi = ai[i], yr = ar[i + 1], yi = ai[i + 1], zr = ar[i + 2], zi = ai[i + 2];
            cr[i] = xr * p0 - xi * q0 + yr * p3 - yi * q3 + zr * p6 - zi * q6;
            ci[i] = xr * q0 + xi * p0 + yr * q3 + yi * p3 + zr * q6 + zi * p6;
            cr[i + 1] = xr * p1 - xi * q1 + yr * p4 - yi * q4 + zr * p7 - zi * q7;
            ci[i + 1] = xr * q1 + xi * p1 + yr * q4 + yi * p4 + zr * q7 + zi * p7;
            cr[i + 2] = xr * p2 - xi * q2 + yr * p5 - yi * q5 + zr * p8 - zi * q8;
            ci[i + 2] = xr * q2 + xi * p2 + yr * q5 + yi * p5 + zr * q8 + zi * p8;
        }
    }

    private static void mul2(double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        double a0 = ar[0], a1 = ar[1], a2 = ar[2], a3 = ar[3], e0 = ai[0], e1 = ai[1], e2 = ai[2], e3 = ai[3];
        double b0 = br[0], b1 = br[1], b2 = br[2], b3 = br[3], f0 = bi[0], f1 = bi[1], f2 = bi[2], f3 = bi[3];
        cr[0] = a0 * b0 - e0 * f0 + a1 * b2 - e1 * f2;
        ci[0] = a0 * f0 + e0 * b0 + a1 * f2 + e1 * b2;
        cr[1] = a0 * b1 - e0 * f1 + a1 * b3 - e1 * f3;
        ci[1] = a0 * f1 + e0 * b1 + a1 * f3 + e1 * b3;
        cr[2] = a2 * b0 - e2 * f0 + a3 * b2 - e3 * f2;
        ci[2] = a2 * f0 + e2 * b0 + a3 * f2 + e3 * b2;
        cr[3] = a2 * b1 - e2 * f1 + a3 * b3 - e3 * f3;
        ci[3] = a2 * f1 + e2 * b1 + a3 * f3 + e3 * b3;
    }

    /** y = a·x for a vector x (planar). Outputs must not alias inputs. */
    public static void mulVec(int n, double[] ar, double[] ai, double[] xr, double[] xi, double[] yr, double[] yi) {
        // two independent partial sums per component halve the floating-point dependency chain, which otherwise
        // limits this memory-streaming loop (Krylov propagation spends its time here)
        for (int i = 0; i < n; i++) {
            double sr = 0, si = 0, tr = 0, ti = 0;
            int in = i * n;
            int k = 0;
            for (; k + 1 < n; k += 2) {
                double pr = ar[in + k], pi = ai[in + k], qr = xr[k], qi = xi[k];
                double pr1 = ar[in + k + 1], pi1 = ai[in + k + 1], qr1 = xr[k + 1], qi1 = xi[k + 1];
                sr += pr * qr - pi * qi;
                si += pr * qi + pi * qr;
                tr += pr1 * qr1 - pi1 * qi1;
                ti += pr1 * qi1 + pi1 * qr1;
            }
            if (k < n) {
                double pr = ar[in + k], pi = ai[in + k], qr = xr[k], qi = xi[k];
                sr += pr * qr - pi * qi;
                si += pr * qi + pi * qr;
            }
            yr[i] = sr + tr;
            yi[i] = si + ti;
        }
    }

    /** Maximum absolute column sum (the matrix 1-norm), with |z| the complex modulus. */
    public static double norm1(int n, double[] re, double[] im) {
        double best = 0;
        for (int j = 0; j < n; j++) {
            double s = 0;
            for (int i = 0; i < n; i++) {
                double a = re[i * n + j], b = im[i * n + j];
                s += Math.sqrt(a * a + b * b);
            }
            best = Math.max(best, s);
        }
        // the plain modulus overflows only for entries beyond 1e154; redo those (rare) cases with hypot
        if (best == Double.POSITIVE_INFINITY) {
            best = 0;
            for (int j = 0; j < n; j++) {
                double s = 0;
                for (int i = 0; i < n; i++) {
                    s += Math.hypot(re[i * n + j], im[i * n + j]);
                }
                best = Math.max(best, s);
            }
        }
        return best;
    }

    /** Frobenius norm. */
    public static double frobenius(int len, double[] re, double[] im) {
        double s = 0;
        for (int i = 0; i < len; i++) {
            s += re[i] * re[i] + im[i] * im[i];
        }
        return Math.sqrt(s);
    }

    /** Sets (re, im) to the identity. */
    public static void identity(int n, double[] re, double[] im) {
        java.util.Arrays.fill(re, 0, n * n, 0.0);
        java.util.Arrays.fill(im, 0, n * n, 0.0);
        for (int i = 0; i < n; i++) {
            re[i * n + i] = 1.0;
        }
    }

    /**
     * Solves (a) x = b in place for k = n right-hand sides (b is n×n, overwritten with x) by LU with partial
     * pivoting; a is overwritten with its factors. Returns false if a pivot is exactly zero.
     */
    public static boolean solveInPlace(int n, double[] ar, double[] ai, double[] br, double[] bi, int[] piv) {
        // fused updates measured 1.5× faster at n = 8 and 1.06× at n = 16 (interleaved), but slower at n = 3
        return solveInPlace(n, ar, ai, br, bi, piv, FUSED && n >= 5);
    }

    /** {@link #solveInPlace} with the update kernel chosen by the caller (package-private for tests). */
    static boolean solveInPlace(int n, double[] ar, double[] ai, double[] br, double[] bi, int[] piv,
                                boolean fused) {
        for (int k = 0; k < n; k++) {
            int p = k;
            double best = -1;
            for (int i = k; i < n; i++) {
                double m = Math.abs(ar[i * n + k]) + Math.abs(ai[i * n + k]);
                if (m > best) {
                    best = m;
                    p = i;
                }
            }
            piv[k] = p;
            if (best == 0) {
                return false;
            }
            if (p != k) {
                swapRows(n, ar, k, p);
                swapRows(n, ai, k, p);
                swapRows(n, br, k, p);
                swapRows(n, bi, k, p);
            }
            double dr = ar[k * n + k], di = ai[k * n + k];
            double den = dr * dr + di * di;
            double invr = dr / den, invi = -di / den;
            for (int i = k + 1; i < n; i++) {
                double xr = ar[i * n + k], xi = ai[i * n + k];
                double lr = xr * invr - xi * invi, li = xr * invi + xi * invr;
                ar[i * n + k] = lr;
                ai[i * n + k] = li;
                if (lr == 0 && li == 0) {
                    continue;
                }
                if (fused) {
                    eliminateFused(n, k, i, lr, li, ar, ai, br, bi);
                    continue;
                }
                for (int j = k + 1; j < n; j++) {
                    double ur = ar[k * n + j], ui = ai[k * n + j];
                    ar[i * n + j] -= lr * ur - li * ui;
                    ai[i * n + j] -= lr * ui + li * ur;
                }
                for (int j = 0; j < n; j++) {
                    double ur = br[k * n + j], ui = bi[k * n + j];
                    br[i * n + j] -= lr * ur - li * ui;
                    bi[i * n + j] -= lr * ui + li * ur;
                }
            }
        }
        // back substitution by rows: row k of x = (row k of b − Σ_{m>k} u_km · row m of x) / u_kk, so every inner
        // loop runs with unit stride over a row of b
        for (int k = n - 1; k >= 0; k--) {
            int kn = k * n;
            for (int m = k + 1; m < n; m++) {
                double ur = ar[kn + m], ui = ai[kn + m];
                if (ur == 0 && ui == 0) {
                    continue;
                }
                int mn = m * n;
                if (fused) {
                    // row k of b −= u_km · row m of b, each complex multiply–subtract as two fused steps per plane
                    double nur = -ur, nui = -ui;
                    for (int j = 0; j < n; j++) {
                        double xr = br[mn + j], xi = bi[mn + j];
                        br[kn + j] = Math.fma(ui, xi, Math.fma(nur, xr, br[kn + j]));
                        bi[kn + j] = Math.fma(nui, xr, Math.fma(nur, xi, bi[kn + j]));
                    }
                    continue;
                }
                for (int j = 0; j < n; j++) {
                    double xr = br[mn + j], xi = bi[mn + j];
                    br[kn + j] -= ur * xr - ui * xi;
                    bi[kn + j] -= ur * xi + ui * xr;
                }
            }
            double dr = ar[kn + k], di = ai[kn + k];
            double den = dr * dr + di * di;
            double invr = dr / den, invi = -di / den;
            for (int j = 0; j < n; j++) {
                double sr = br[kn + j], si = bi[kn + j];
                br[kn + j] = sr * invr - si * invi;
                bi[kn + j] = sr * invi + si * invr;
            }
        }
        return true;
    }

    /**
     * Row i of the factor and of b minus l·(row k) in fused multiply–adds ({@link #solveInPlace} on a machine with
     * {@link #FUSED}): a_ij −= l·u_kj for j > k, b_ij −= l·b_kj for all j.
     */
    private static void eliminateFused(int n, int k, int i, double lr, double li, double[] ar, double[] ai,
                                       double[] br, double[] bi) {
        int kn = k * n, in = i * n;
        double nlr = -lr, nli = -li;
        for (int j = k + 1; j < n; j++) {
            double ur = ar[kn + j], ui = ai[kn + j];
            ar[in + j] = Math.fma(li, ui, Math.fma(nlr, ur, ar[in + j]));
            ai[in + j] = Math.fma(nli, ur, Math.fma(nlr, ui, ai[in + j]));
        }
        for (int j = 0; j < n; j++) {
            double ur = br[kn + j], ui = bi[kn + j];
            br[in + j] = Math.fma(li, ui, Math.fma(nlr, ur, br[in + j]));
            bi[in + j] = Math.fma(nli, ur, Math.fma(nlr, ui, bi[in + j]));
        }
    }

    private static void swapRows(int n, double[] a, int r1, int r2) {
        int o1 = r1 * n, o2 = r2 * n;
        for (int j = 0; j < n; j++) {
            double t = a[o1 + j];
            a[o1 + j] = a[o2 + j];
            a[o2 + j] = t;
        }
    }
    /**
     * c = a·b for factors whose product is known to be Hermitian (c = c†), e.g. two commuting Hermitian matrices
     * such as powers of A² or real polynomials in A² for an anti-Hermitian A. Only the upper triangle (i ≤ j) is
     * computed; the lower one is filled with its exact conjugate mirror c_ji = conj(c_ij) and the diagonal's
     * imaginary part is set to exactly 0, so the result is Hermitian to the last bit.
     *
     * <p>Precondition (not checked): a·b is Hermitian in exact arithmetic. If it is not, the result is the
     * Hermitian matrix with the upper triangle of a·b. Outputs must not alias inputs. Cost ≈ 4n³ flops (half of
     * {@link #mul}). For n ≥ 5 each upper entry receives the same sums in the same order as in {@link #mul}, so it
     * is bit-identical to {@link #mul}'s entry; n = 3 and 4 have straight-line triangle kernels (same expressions as
     * {@link #mul}'s unrolled ones, so again bit-identical), and n = 2 uses the full 2×2 product, mirrored.
     */
    public static void mulHermitian(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                                    double[] ci) {
        if (n == 3 || n == 4) {
            upperSmall(n, ar, ai, br, bi, cr, ci, 1.0);
            return;
        }
        mulUpper(n, ar, ai, br, bi, cr, ci);
        mirrorUpper(n, cr, ci, 1.0);
    }

    /**
     * c = a·b for factors whose product is known to be anti-Hermitian (c = −c†), e.g. A·S(A²) for an
     * anti-Hermitian A and a Hermitian real polynomial S in A² (which commutes with A). Only the upper triangle is
     * computed; the lower one is filled with c_ji = −conj(c_ij) and the diagonal's real part is set to exactly 0.
     * Preconditions, aliasing, cost and bit-identity of the upper triangle as for {@link #mulHermitian}.
     */
    public static void mulAntiHermitian(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                                        double[] ci) {
        if (n == 3 || n == 4) {
            upperSmall(n, ar, ai, br, bi, cr, ci, -1.0);
            return;
        }
        mulUpper(n, ar, ai, br, bi, cr, ci);
        mirrorUpper(n, cr, ci, -1.0);
    }

    /**
     * Upper triangle (j ≥ i) of c = a·b; entries below it are unspecified (the mirror overwrites them). Same
     * k blocking and row pairing as {@link #mul}, with the j loop of each row pair starting at the pair's first
     * row: still unit stride, so the JIT vectorises it as before.
     */
    private static void mulUpper(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                                 double[] ci) {
        if (n >= 2 && n <= 4) {
            mul(n, ar, ai, br, bi, cr, ci);
            return;
        }
        blocked(n, true, ar, ai, br, bi, cr, ci);
    }

    /** n = 3 or 4: {@link #upper3} or {@link #upper4}, each with its mirror written out. */
    private static void upperSmall(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr,
                                   double[] ci, double sign) {
        if (n == 3) {
            upper3(ar, ai, br, bi, cr, ci, sign);
        } else {
            upper4(ar, ai, br, bi, cr, ci, sign);
        }
    }

    /**
     * n = 4: row i of the upper triangle (columns i … 3) in register accumulators, summed over k in the order of
     * {@link #mul4} (so bit-identical to it), 10 of its 16 entries; then the mirror as in {@link #upper3}.
     */
    private static void upper4(double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci,
                               double sign) {
        double r0 = 0, r1 = 0, r2 = 0, r3 = 0, i0 = 0, i1 = 0, i2 = 0, i3 = 0;
        for (int k = 0; k < 4; k++) {
            double xr = ar[k], xi = ai[k];
            int o = 4 * k;
            double p0 = br[o], p1 = br[o + 1], p2 = br[o + 2], p3 = br[o + 3];
            double q0 = bi[o], q1 = bi[o + 1], q2 = bi[o + 2], q3 = bi[o + 3];
            r0 += xr * p0 - xi * q0;
            i0 += xr * q0 + xi * p0;
            r1 += xr * p1 - xi * q1;
            i1 += xr * q1 + xi * p1;
            r2 += xr * p2 - xi * q2;
            i2 += xr * q2 + xi * p2;
            r3 += xr * p3 - xi * q3;
            i3 += xr * q3 + xi * p3;
        }
        double s5 = 0, s6 = 0, s7 = 0, t5 = 0, t6 = 0, t7 = 0, s10 = 0, s11 = 0, t10 = 0, t11 = 0, s15 = 0, t15 = 0;
        for (int k = 0; k < 4; k++) {
            int o = 4 * k;
            double p1 = br[o + 1], p2 = br[o + 2], p3 = br[o + 3], q1 = bi[o + 1], q2 = bi[o + 2], q3 = bi[o + 3];
            double xr = ar[4 + k], xi = ai[4 + k];
            s5 += xr * p1 - xi * q1;
            t5 += xr * q1 + xi * p1;
            s6 += xr * p2 - xi * q2;
            t6 += xr * q2 + xi * p2;
            s7 += xr * p3 - xi * q3;
            t7 += xr * q3 + xi * p3;
            xr = ar[8 + k];
            xi = ai[8 + k];
            s10 += xr * p2 - xi * q2;
            t10 += xr * q2 + xi * p2;
            s11 += xr * p3 - xi * q3;
            t11 += xr * q3 + xi * p3;
            xr = ar[12 + k];
            xi = ai[12 + k];
            s15 += xr * p3 - xi * q3;
            t15 += xr * q3 + xi * p3;
        }
        double m = -sign;
        cr[0] = r0;
        cr[1] = r1;
        cr[2] = r2;
        cr[3] = r3;
        ci[0] = i0;
        ci[1] = i1;
        ci[2] = i2;
        ci[3] = i3;
        cr[5] = s5;
        cr[6] = s6;
        cr[7] = s7;
        ci[5] = t5;
        ci[6] = t6;
        ci[7] = t7;
        cr[10] = s10;
        cr[11] = s11;
        ci[10] = t10;
        ci[11] = t11;
        cr[15] = s15;
        ci[15] = t15;
        cr[4] = sign * r1;
        ci[4] = m * i1;
        cr[8] = sign * r2;
        ci[8] = m * i2;
        cr[12] = sign * r3;
        ci[12] = m * i3;
        cr[9] = sign * s6;
        ci[9] = m * t6;
        cr[13] = sign * s7;
        ci[13] = m * t7;
        cr[14] = sign * s11;
        ci[14] = m * t11;
        if (sign > 0) {
            ci[0] = 0.0;
            ci[5] = 0.0;
            ci[10] = 0.0;
            ci[15] = 0.0;
        } else {
            cr[0] = 0.0;
            cr[5] = 0.0;
            cr[10] = 0.0;
            cr[15] = 0.0;
        }
    }

    /**
     * n = 3: the six entries on and above the diagonal in straight-line code (2/3 of the 216 flops of
     * {@link #mul3}) and the mirror c_ji = sign·conj(c_ij) with the diagonal made exactly real (sign = 1) or
     * imaginary (sign = −1); the full kernel followed by the general mirror loop measured slower than the full
     * product alone. Each upper entry is the same expression as in {@link #mul3}, so it is bit-identical to it.
     */
    private static void upper3(double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci,
                               double sign) {
        double p0 = br[0], p1 = br[1], p2 = br[2], p4 = br[4], p5 = br[5], p7 = br[7], p8 = br[8];
        double q0 = bi[0], q1 = bi[1], q2 = bi[2], q4 = bi[4], q5 = bi[5], q7 = bi[7], q8 = bi[8];
        double p3 = br[3], p6 = br[6], q3 = bi[3], q6 = bi[6];
        double xr = ar[0], xi = ai[0], yr = ar[1], yi = ai[1], zr = ar[2], zi = ai[2];
        cr[0] = xr * p0 - xi * q0 + yr * p3 - yi * q3 + zr * p6 - zi * q6;
        ci[0] = xr * q0 + xi * p0 + yr * q3 + yi * p3 + zr * q6 + zi * p6;
        cr[1] = xr * p1 - xi * q1 + yr * p4 - yi * q4 + zr * p7 - zi * q7;
        ci[1] = xr * q1 + xi * p1 + yr * q4 + yi * p4 + zr * q7 + zi * p7;
        cr[2] = xr * p2 - xi * q2 + yr * p5 - yi * q5 + zr * p8 - zi * q8;
        ci[2] = xr * q2 + xi * p2 + yr * q5 + yi * p5 + zr * q8 + zi * p8;
        xr = ar[3];
        xi = ai[3];
        yr = ar[4];
        yi = ai[4];
        zr = ar[5];
        zi = ai[5];
        cr[4] = xr * p1 - xi * q1 + yr * p4 - yi * q4 + zr * p7 - zi * q7;
        ci[4] = xr * q1 + xi * p1 + yr * q4 + yi * p4 + zr * q7 + zi * p7;
        cr[5] = xr * p2 - xi * q2 + yr * p5 - yi * q5 + zr * p8 - zi * q8;
        ci[5] = xr * q2 + xi * p2 + yr * q5 + yi * p5 + zr * q8 + zi * p8;
        xr = ar[6];
        xi = ai[6];
        yr = ar[7];
        yi = ai[7];
        zr = ar[8];
        zi = ai[8];
        cr[8] = xr * p2 - xi * q2 + yr * p5 - yi * q5 + zr * p8 - zi * q8;
        ci[8] = xr * q2 + xi * p2 + yr * q5 + yi * p5 + zr * q8 + zi * p8;
        cr[3] = sign * cr[1];
        ci[3] = -sign * ci[1];
        cr[6] = sign * cr[2];
        ci[6] = -sign * ci[2];
        cr[7] = sign * cr[5];
        ci[7] = -sign * ci[5];
        if (sign > 0) {
            ci[0] = 0.0;
            ci[4] = 0.0;
            ci[8] = 0.0;
        } else {
            cr[0] = 0.0;
            cr[4] = 0.0;
            cr[8] = 0.0;
        }
    }

    /** The last row of an odd n on its single triangle entry (i, i) = (n−1, n−1), as {@link #row} forms it. */
    private static void upperLastRow(int n, int i, int k0, int k1, double[] ar, double[] ai, double[] br,
                                     double[] bi, double[] cr, double[] ci) {
        int in = i * n;
        double sr = cr[in + i], si = ci[in + i];
        int k = k0;
        for (; k + 1 < k1; k += 2) {
            double xr = ar[in + k], xi = ai[in + k], yr = ar[in + k + 1], yi = ai[in + k + 1];
            if (xr == 0 && xi == 0 && yr == 0 && yi == 0) {
                continue;
            }
            double pr = br[k * n + i], pim = bi[k * n + i], qr = br[k * n + n + i], qi = bi[k * n + n + i];
            sr += xr * pr - xi * pim + yr * qr - yi * qi;
            si += xr * pim + xi * pr + yr * qi + yi * qr;
        }
        if (k < k1) {
            double xr = ar[in + k], xi = ai[in + k], pr = br[k * n + i], pim = bi[k * n + i];
            sr += xr * pr - xi * pim;
            si += xr * pim + xi * pr;
        }
        cr[in + i] = sr;
        ci[in + i] = si;
    }

    /**
     * Overwrites the strict lower triangle with sign·conj of the upper one (c_ji = sign·conj(c_ij)) and zeroes the
     * diagonal's imaginary part (sign = +1, Hermitian) or real part (sign = −1, anti-Hermitian).
     */
    private static void mirrorUpper(int n, double[] cr, double[] ci, double sign) {
        for (int i = 0; i < n; i++) {
            int in = i * n;
            for (int j = i + 1; j < n; j++) {
                cr[j * n + i] = sign * cr[in + j];
                ci[j * n + i] = -sign * ci[in + j];
            }
            if (sign > 0) {
                ci[in + i] = 0.0;
            } else {
                cr[in + i] = 0.0;
            }
        }
    }
}
