package org.liepath.integrators.internal;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The unrolled 3×3 commutators of anti-Hermitian operands, plain and fused, called directly (whatever this machine's
 * FMA detection chose), against the definition [A, B] = AB − BA evaluated entry by entry.
 */
class SkewBracketTest {
    private static final double U = 0x1p-53;

    /** A random anti-Hermitian 3×3 matrix (planar), exactly anti-Hermitian in floating point. */
    private static double[][] skew(Random r) {
        double[] re = new double[9], im = new double[9];
        for (int i = 0; i < 3; i++) {
            im[4 * i] = r.nextGaussian();
            for (int j = i + 1; j < 3; j++) {
                double x = r.nextGaussian(), y = r.nextGaussian();
                re[3 * i + j] = x;
                im[3 * i + j] = y;
                re[3 * j + i] = -x;
                im[3 * j + i] = y;
            }
        }
        return new double[][]{re, im};
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void unrolledBracketsAreTheCommutatorAndExactlyAntiHermitian(long seed) {
        // Bound: each entry of AB − BA is a real dot product of 12 terms per plane, within γ_12 Σ|terms| of exact
        // whether the terms are fused or not (N.J. Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed.,
        // SIAM 2002, §3.1); the reference, formed the same way in the other order, adds as much again, and the
        // scale one more rounding.
        Random r = new Random(seed);
        double[][] a = skew(r), b = skew(r);
        double s = r.nextBoolean() ? 1.0 : r.nextGaussian();
        double gamma = 12 * U / (1 - 12 * U);
        for (boolean fused : new boolean[]{false, true}) {
            double[] cr = new double[9], ci = new double[9];
            if (fused) {
                Kernel.skewBracket3Fused(s, a[0], a[1], b[0], b[1], cr, ci);
            } else {
                Kernel.skewBracket3(s, a[0], a[1], b[0], b[1], cr, ci);
            }
            for (int i = 0; i < 3; i++) {
                for (int j = 0; j < 3; j++) {
                    double wr = 0, wi = 0, abs = 0;
                    for (int k = 0; k < 3; k++) {
                        double xr = a[0][3 * i + k], xi = a[1][3 * i + k], yr = b[0][3 * k + j], yi = b[1][3 * k + j];
                        double ur = b[0][3 * i + k], ui = b[1][3 * i + k], vr = a[0][3 * k + j], vi = a[1][3 * k + j];
                        wr += xr * yr - xi * yi - (ur * vr - ui * vi);
                        wi += xr * yi + xi * yr - (ur * vi + ui * vr);
                        abs += Math.hypot(xr, xi) * Math.hypot(yr, yi) + Math.hypot(ur, ui) * Math.hypot(vr, vi);
                    }
                    double tol = Math.abs(s) * (2 * gamma * abs * Math.sqrt(2) + 2 * U * Math.hypot(wr, wi));
                    int q = 3 * i + j;
                    String what = (fused ? "fused" : "plain") + " entry (" + i + ", " + j + ")";
                    assertTrue(Math.abs(cr[q] - s * wr) <= tol && Math.abs(ci[q] - s * wi) <= tol, what);
                    // exactly anti-Hermitian: c_ji = −conj(c_ij), real diagonal part zero
                    int t = 3 * j + i;
                    assertTrue(cr[t] == -cr[q] && ci[t] == ci[q], what + " mirror");
                }
            }
        }
    }
}
