package org.liepath.core.internal;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The increment exp(A) − I of {@link Expm#computeIncrement}: the same approximant, without the rounding of I. */
class ExpmIncrementTest {
    private static final double U = 0x1p-53;

    private static double[][] random(Random r, int n, double norm1) {
        double[] ar = new double[n * n], ai = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            ar[k] = r.nextGaussian();
            ai[k] = r.nextGaussian();
        }
        double s = norm1 / Dense.norm1(n, ar, ai);
        for (int k = 0; k < n * n; k++) {
            ar[k] *= s;
            ai[k] *= s;
        }
        return new double[][]{ar, ai};
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void incrementPlusIdentityIsTheExponential(long seed) {
        // Both outputs come from one Padé approximant r_m (N.J. Higham, SIAM J. Matrix Anal. Appl. 26 (2005)
        // 1179–1193), only evaluated in two algebraically equal forms, so they agree to a few roundings of
        // ‖e^A‖ times the conditioning of the solve and squarings; degrees 3 … 13 and up to 3 squarings are sampled.
        Random r = new Random(seed);
        int n = 1 + r.nextInt(10);
        double norm = Math.pow(10, -6 + 7.3 * r.nextDouble());
        double[][] a = random(r, n, norm);
        Expm ws = new Expm(n);
        double[] er = new double[n * n], ei = new double[n * n], dr = new double[n * n], di = new double[n * n];
        ws.compute(1.0, a[0], a[1], er, ei);
        ws.computeIncrement(1.0, a[0], a[1], dr, di);
        for (int i = 0; i < n; i++) {
            dr[i * n + i] += 1;
        }
        double diff = 0;
        for (int k = 0; k < n * n; k++) {
            diff = Math.hypot(diff, Math.hypot(dr[k] - er[k], di[k] - ei[k]));
        }
        double bound = 50 * (1 + norm) * n * U * Dense.frobenius(n * n, er, ei);
        assertTrue(diff <= bound, "n = " + n + ", ‖A‖₁ = " + norm + ": " + diff + " > " + bound);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void smallExponentsGiveTheIncrementToRelativeAccuracy(long seed) {
        // Reference: the defining power series e^A − I = A + A²/2 + A³/6 + A⁴/24 + … (e.g. N.J. Higham, Functions
        // of Matrices, SIAM 2008, §10.1), truncated after A⁴: for ‖A‖₁ ≤ 1e-3 the remainder is below
        // ‖A‖⁵/120 ≈ 1e-17 ‖A‖, and each kept term is formed to relative error ~n u. The increment must match to
        // ~n u relative to ‖A‖, where exp(A) − I formed from exp(A) loses everything below u absolute (a relative
        // error up to u/‖A‖, i.e. 1e-8 at ‖A‖ = 1e-8).
        Random r = new Random(seed);
        int n = 1 + r.nextInt(8);
        double norm = Math.pow(10, -8 + 5 * r.nextDouble());
        double[][] a = random(r, n, norm);
        if (r.nextBoolean()) {
            // anti-Hermitian half of the cases (a Hamiltonian step −i·dt·H: real diagonal exactly zero)
            for (int i = 0; i < n; i++) {
                for (int j = 0; j <= i; j++) {
                    double re = 0.5 * (a[0][i * n + j] - a[0][j * n + i]), im = 0.5 * (a[1][i * n + j] + a[1][j * n + i]);
                    a[0][i * n + j] = re;
                    a[0][j * n + i] = -re;
                    a[1][i * n + j] = im;
                    a[1][j * n + i] = im;
                }
            }
        }
        int len = n * n;
        double[] sr = a[0].clone(), si = a[1].clone(), pr = a[0].clone(), pi = a[1].clone();
        double[] tr = new double[len], ti = new double[len];
        for (int k = 2; k <= 4; k++) {
            Dense.mul(n, pr, pi, a[0], a[1], tr, ti);
            for (int q = 0; q < len; q++) {
                pr[q] = tr[q] / k;
                pi[q] = ti[q] / k;
                sr[q] += pr[q];
                si[q] += pi[q];
            }
        }
        double[] dr = new double[len], di = new double[len];
        new Expm(n).computeIncrement(1.0, a[0], a[1], dr, di);
        double diff = 0;
        for (int q = 0; q < len; q++) {
            diff = Math.hypot(diff, Math.hypot(dr[q] - sr[q], di[q] - si[q]));
        }
        double rel = diff / Dense.frobenius(len, sr, si);
        assertTrue(rel <= 20 * n * U, "n = " + n + ", ‖A‖₁ = " + norm + ": relative error " + rel);
    }

    @Test
    void zeroExponentHasZeroIncrementAndOutputsMayAliasInputs() {
        double[] zr = new double[9], zi = new double[9];
        new Expm(3).computeIncrement(1.0, zr, zi, zr, zi);
        assertArrayEquals(new double[9], zr);
        assertArrayEquals(new double[9], zi);
        // 1×1: e^{iθ} − 1 = −2 sin²(θ/2) + i sin θ (Euler's formula), here in place
        double[] xr = {0}, xi = {1e-9};
        new Expm(1).computeIncrement(1.0, xr, xi, xr, xi);
        assertTrue(Math.abs(xr[0] + 0.5e-18) <= 1e-33 && Math.abs(xi[0] - 1e-9) <= 1e-24, xr[0] + " " + xi[0]);
    }
}
