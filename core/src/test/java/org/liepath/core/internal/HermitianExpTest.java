package org.liepath.core.internal;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Operator;
import org.liepath.core.Spin;
import org.liepath.testing.Seeds;

import java.util.Arrays;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** exp(−i t H) from the eigendecomposition ({@link HermitianExp}): unitarity, agreement with Padé, closed forms. */
class HermitianExpTest {
    private static final double U = 0x1p-53;

    static double[][] propagator(Operator h, double t) {
        int n = h.dim();
        double[] r = new double[n * n], i = new double[n * n];
        new HermitianExp(n).compute(h.reArray(), h.imArray(), t, r, i);
        return new double[][]{r, i};
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void unitaryForRandomHermitian(long seed) {
        // exp(−itH) is unitary for Hermitian H. With V unitary to ‖V†V − I‖ ≤ c n u (backward-stable Householder
        // + QL, Golub & Van Loan, Matrix Computations, 4th ed. 2013, §8.3) and one more n-term product W V†, the
        // defect ‖U†U − I‖_F is ≲ 2 c n u, independent of t‖H‖ (no squarings). We allow 10·n·1e-15 ≈ 90 n u;
        // the worst of these 200 cases shows 11 n u (Padé with squarings on the same cases: up to 1800 n u).
        Random r = new Random(seed);
        int n = 1 + r.nextInt(40);
        Operator h = Seeds.randomHermitian(r, n);
        double t = Math.pow(10, -2 + 5 * r.nextDouble()) * (r.nextBoolean() ? 1 : -1); // |t| from 0.01 to 1000
        double[][] u = propagator(h, t);
        double defect = HermitianEigenTest.unitarityDefect(n, u[0], u[1]);
        assertTrue(defect <= 10 * n * 1e-15, "n = " + n + ", t = " + t + ": defect " + defect);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void eigenAgreesWithPade(long seed) {
        // two independent algorithms for the same function: eigendecomposition and Higham's (2005) scaling and
        // squaring applied to A = −itH. For normal A the relative condition number of exp is ‖A‖₂ (Higham,
        // Functions of Matrices, SIAM 2008, Thm. 10.16 [from memory]), so the two agree to ≲ (n + ‖tH‖) u each:
        // tolerance 20 (n + ‖tH‖₂) u in the Frobenius norm relative to ‖U‖_F = √n.
        Random r = new Random(seed);
        int n = 1 + r.nextInt(30);
        Operator h = Seeds.randomHermitian(r, n);
        double t = 0.05 + 10 * r.nextDouble();
        double[][] eig = propagator(h, t);
        double[] ar = new double[n * n], ai = new double[n * n];
        double[] hr = h.reArray(), hi = h.imArray();
        for (int k = 0; k < n * n; k++) {
            ar[k] = t * hi[k];
            ai[k] = -t * hr[k];
        }
        double[] pr = new double[n * n], pi = new double[n * n];
        new Expm(n).compute(1.0, ar, ai, pr, pi);
        double d = ExpmTest.rel(eig[0], eig[1], pr, pi);
        double bound = 20 * (n + t * h.norm()) * U;
        assertTrue(d <= bound, "n = " + n + ", t = " + t + ": " + d + " > " + bound);
    }

    @Test
    void spinRotationMatchesWignerSmallD() {
        // exp(−iβJy) for spin 1: Wigner's small d-matrix d^1(β) = [[(1+cos β)/2, −sin β/√2, (1−cos β)/2],
        // [sin β/√2, cos β, −sin β/√2], [(1−cos β)/2, sin β/√2, (1+cos β)/2]] in the basis m = 1, 0, −1
        // (J.J. Sakurai, Modern Quantum Mechanics, rev. ed. 1994, eq. (3.5.57)).
        double beta = 0.9;
        double c = Math.cos(beta), s = Math.sin(beta), q = Math.sqrt(2);
        double[] expected = {(1 + c) / 2, -s / q, (1 - c) / 2, s / q, c, -s / q, (1 - c) / 2, s / q, (1 + c) / 2};
        double[][] u = propagator(Spin.of(1).y(), beta);
        for (int k = 0; k < 9; k++) {
            assertEquals(expected[k], u[0][k], 1e-15, "re " + k);
            assertEquals(0.0, u[1][k], 1e-15, "im " + k);
        }
    }

    @Test
    void closedFormsForOneAndTwoLevels() {
        // 1×1: e^{−ith}; 2×2: exp(−it(a I + b·σ)) = e^{−ita}(cos(t|b|) I − i sin(t|b|) b̂·σ) (the su(2) rotation
        // formula, e.g. Nielsen & Chuang, Quantum Computation and Quantum Information, CUP 2000, Ex. 4.2)
        double[] r1 = new double[1], i1 = new double[1];
        new HermitianExp(1).compute(new double[]{2.5}, new double[]{0}, 0.4, r1, i1);
        assertEquals(Math.cos(1.0), r1[0], 1e-16);
        assertEquals(-Math.sin(1.0), i1[0], 1e-16);
        double a = 0.3, bx = 0.5, by = -1.2, bz = 0.7, t = 2.1;
        Operator h = Operator.of(new double[][]{{a + bz, bx}, {bx, a - bz}}, new double[][]{{0, -by}, {by, 0}});
        double[][] u = propagator(h, t);
        double b = Math.sqrt(bx * bx + by * by + bz * bz), cs = Math.cos(t * b), sn = Math.sin(t * b) / b;
        double pr = Math.cos(t * a), pi = -Math.sin(t * a);
        // M = cos I − i sin b̂·σ, entries (re, im): M00 = (cs, −sn bz), M01 = (−sn by, −sn bx),
        // M10 = (sn by, −sn bx), M11 = (cs, sn bz); U = e^{−ita} M
        double[][] m = {{cs, -sn * bz}, {-sn * by, -sn * bx}, {sn * by, -sn * bx}, {cs, sn * bz}};
        for (int k = 0; k < 4; k++) {
            assertEquals(pr * m[k][0] - pi * m[k][1], u[0][k], 1e-15, "re " + k);
            assertEquals(pr * m[k][1] + pi * m[k][0], u[1][k], 1e-15, "im " + k);
        }
    }

    @Test
    void workspaceReuseGivesSameBitsAndAllowsAliasing() {
        Random r = new Random(5);
        int n = 9;
        Operator h = Seeds.randomHermitian(r, n);
        HermitianExp ws = new HermitianExp(n);
        double[] ur = new double[n * n], ui = new double[n * n];
        ws.compute(h.reArray(), h.imArray(), 0.8, ur, ui);
        double[] vr = h.reArray(), vi = h.imArray();
        ws.compute(vr, vi, 0.8, vr, vi);
        assertTrue(Arrays.equals(ur, vr) && Arrays.equals(ui, vi));
        // the static form used elsewhere in the project gives the same bits
        double[] sr = new double[n * n], si = new double[n * n];
        HermitianExp.expMinusI(n, h.reArray(), h.imArray(), 0.8, sr, si);
        assertTrue(Arrays.equals(ur, sr) && Arrays.equals(ui, si));
        // and Operator.expMinusI goes through it
        Operator u = h.expMinusI(0.8);
        assertTrue(Arrays.equals(ur, u.reArray()) && Arrays.equals(ui, u.imArray()));
    }
}
