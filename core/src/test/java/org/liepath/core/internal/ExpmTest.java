package org.liepath.core.internal;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.testing.Seeds;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Scaling-and-squaring Padé exponential ({@link Expm}) and the 2×2 closed form: published test matrices, offline
 * high-precision references, and properties.
 */
class ExpmTest {
    private static final double U = 0x1p-53; // unit roundoff of IEEE double

    /** Relative Frobenius distance ‖x − y‖_F / ‖y‖_F. */
    static double rel(double[] xr, double[] xi, double[] yr, double[] yi) {
        double num = 0, den = 0;
        for (int k = 0; k < yr.length; k++) {
            double a = xr[k] - yr[k], b = xi[k] - yi[k];
            num += a * a + b * b;
            den += yr[k] * yr[k] + yi[k] * yi[k];
        }
        return Math.sqrt(num / den);
    }

    static double[][] exp(int n, double[] re, double[] im) {
        double[] r = new double[n * n], i = new double[n * n];
        new Expm(n).compute(1.0, re, im, r, i);
        return new double[][]{r, i};
    }

    /** Row-major flattening of a real matrix given by rows. */
    static double[] flat(double[][] a) {
        int n = a.length;
        double[] out = new double[n * n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(a[i], 0, out, i * n, n);
        }
        return out;
    }

    private static void assertRealClose(double[][] expected, double[][] got, double rtol, String what) {
        double[] e = flat(expected);
        double r = rel(got[0], got[1], e, new double[e.length]);
        assertTrue(r <= rtol, what + ": relative error " + r + " > " + rtol);
    }

    // ------------------------------------------------------------------ published test matrices

    @Test
    void molerVanLoan2x2() {
        // C. Moler, C. Van Loan, "Nineteen dubious ways to compute the exponential of a matrix, twenty-five years
        // later", SIAM Rev. 45(1) (2003) 3-49: A = [[-49, 24], [-64, 31]], eigenvalues -1, -17. Exact exponential
        // (from the Jordan form) [[3e^-17 - 2e^-1, 1.5(e^-1 - e^-17)], [4e^-17 - 4e^-1, 3e^-1 - 2e^-17]].
        double e1 = Math.exp(-1), e17 = Math.exp(-17);
        double[][] expected = {{3 * e17 - 2 * e1, 1.5 * (e1 - e17)}, {4 * e17 - 4 * e1, 3 * e1 - 2 * e17}};
        double[][] got = exp(2, flat(new double[][]{{-49, 24}, {-64, 31}}), new double[4]);
        // relative condition number of exp at this A is ~ ‖A‖ (about 100): forward error ≲ 1e2·u ≈ 1e-14
        assertRealClose(expected, got, 1e-13, "Moler-Van Loan (closed form 2x2)");
        // the same matrix through the Padé branch (embedded as diag(A, 0): exp = diag(e^A, 1))
        double[][] big = {{-49, 24, 0}, {-64, 31, 0}, {0, 0, 0}};
        double[][] gotPade = exp(3, flat(big), new double[9]);
        double[][] expectedBig = {{expected[0][0], expected[0][1], 0}, {expected[1][0], expected[1][1], 0}, {0, 0, 1}};
        // tolerance 1e-13 relative to ‖e^A‖_F ≈ 2 (the embedded 1 keeps the norm from collapsing)
        assertRealClose(expectedBig, gotPade, 1e-13, "Moler-Van Loan (Padé)");
        // tabulated digits as printed in CHECKS (exact via SymPy + mpmath): -0.73575875814475308
        assertEquals(-0.73575875814475308, got[0][0], 1e-15);
        assertEquals(1.1036382407155726, got[0][3], 1e-15);
    }

    @Test
    void ward1977Case1Defective() {
        // R.C. Ward, "Numerical computation of the matrix exponential with accuracy estimate", SIAM J. Numer. Anal.
        // 14 (1977) 600-610, test case 1: eigenvalue 3 with a Jordan block of size 2, and 6. Exact exponential from
        // the Jordan form: (e^3/9) [[3(2+e^3), 2(1+2e^3), 2(e^3-4)], [3(e^3-1), 2(1+2e^3), 1+2e^3],
        // [3(e^3-1), 4e^3-7, 2(5+e^3)]].
        double e3 = Math.exp(3), f = e3 / 9;
        double[][] expected = {
            {f * 3 * (2 + e3), f * 2 * (1 + 2 * e3), f * 2 * (e3 - 4)},
            {f * 3 * (e3 - 1), f * 2 * (1 + 2 * e3), f * (1 + 2 * e3)},
            {f * 3 * (e3 - 1), f * (4 * e3 - 7), f * 2 * (5 + e3)}};
        double[][] got = exp(3, flat(new double[][]{{4, 2, 0}, {1, 4, 1}, {1, 1, 4}}), new double[9]);
        // well conditioned (κ ≈ ‖A‖ ≈ 7): Higham's backward error u per step gives ≲ 1e-14
        assertRealClose(expected, got, 1e-13, "Ward case 1");
        assertEquals(147.86662244637015, got[0][0], 147.87 * 1e-13);
    }

    @Test
    void ward1977Case2Symmetric() {
        // Ward (1977) test case 2: symmetric, eigenvalues about 20, 30, 40. Reference: mpmath at 50 digits from the
        // decimal entries (CHECKS, computed independently).
        double[][] a = {
            {29.87942128909879, .7815750847907159, -2.289519314033932},
            {.7815750847907159, 25.72656945571064, 8.680737820540137},
            {-2.289519314033932, 8.680737820540137, 34.39400925519054}};
        double[][] expected = {
            {5496313853692405.1, -18231880972009066.0, -30475770808580150.0},
            {-18231880972009066.0, 60605228702221317.0, 1.0129184293024867e17},
            {-30475770808580150.0, 1.0129184293024867e17, 1.6929441124085004e17}};
        double[][] got = exp(3, flat(a), new double[9]);
        // normal matrix, κ ≈ ‖A‖₂ ≈ 40: forward error ≲ 40u ≈ 5e-15 (plus the 17-digit rounding of the table)
        assertRealClose(expected, got, 1e-13, "Ward case 2");
    }

    @Test
    void ward1977Case3() {
        // Ward (1977) test case 3 (eigenvalues -1, -2, -20); exact exponential from the eigendecomposition, e.g.
        // (1,1) = 7e^-20 - 3e^-1 - 3e^-2. Older tabulated values are off by up to 3e-11; CHECKS explains that the
        // eigenvector matrix has condition number ≈ 66 and that a current double-precision scaling-and-squaring
        // code reaches 5e-14 on (1,1), so rtol 1e-12 is the fair tolerance here.
        double e1 = Math.exp(-1), e2 = Math.exp(-2), e20 = Math.exp(-20);
        double[][] expected = {
            {7 * e20 - 3 * e1 - 3 * e2, e1 - e20, e2 - e20},
            {21 * e20 - 12 * e1 - 9 * e2, 4 * e1 - 3 * e20, 3 * e2 - 3 * e20},
            {21 * e20 - 9 * e1 - 12 * e2, 3 * e1 - 3 * e20, 4 * e2 - 3 * e20}};
        double[][] got = exp(3, flat(new double[][]{{-131, 19, 18}, {-390, 56, 54}, {-387, 57, 52}}), new double[9]);
        for (int k = 0; k < 9; k++) {
            double ex = expected[k / 3][k % 3];
            assertEquals(ex, got[0][k], 1e-12 * Math.abs(ex), "entry " + k);
            assertEquals(0.0, got[1][k], 0.0);
        }
        assertEquals(-1.5096441587960897, got[0][0], 1e-12 * 1.51);
    }

    @ParameterizedTest(name = "n = {0}")
    @ValueSource(ints = {2, 3, 5, 8})
    void nilpotentJordanBlock(int n) {
        // exp(tN) for N with ones on the superdiagonal: entries t^(j-i)/(j-i)! for j >= i (the exponential series
        // terminates; e.g. Higham, Functions of Matrices, SIAM 2008, eq. (1.4) [from memory]).
        for (double t : new double[]{1.0, 0.3, 7.5}) {
            double[] re = new double[n * n];
            for (int i = 0; i + 1 < n; i++) {
                re[i * n + i + 1] = t;
            }
            double[][] got = exp(n, re, new double[n * n]);
            double[] expected = new double[n * n];
            for (int i = 0; i < n; i++) {
                double term = 1;
                for (int j = i; j < n; j++) {
                    expected[i * n + j] = term;
                    term *= t / (j - i + 1);
                }
            }
            // well conditioned (κ ≈ ‖tN‖): ≤ 1e-13 relative in the Frobenius norm
            double r = rel(got[0], got[1], expected, new double[n * n]);
            assertTrue(r <= 1e-13, "t = " + t + ": " + r);
            if (n == 5 && t == 1.0) {
                // exact: row 1 of e^{N_5} = [1, 1, 1/2, 1/6, 1/24]
                assertEquals(1.0 / 24, got[0][4], 1e-16);
            }
        }
    }

    @Test
    void nearConfluentTriangular() {
        // Higham, Functions of Matrices (SIAM 2008), the 2x2 triangular formula: for [[a, b], [0, c]] the (1,2)
        // entry of the exponential is b (e^c - e^a)/(c - a), which loses all accuracy if evaluated as written when
        // c ≈ a. Reference values (mpmath, 20 digits): (1,2) = 2.7182818285949593268, e^a = 2.7182818284590452354,
        // e^c = 2.7182818287308734182 for a = 1, c = 1 + 1e-10, b = 1.
        double c = 1 + 1e-10;
        double[] re = {1, 1, 0, c};
        double[][] got = exp(2, re, new double[4]);
        assertEquals(2.7182818285949593268, got[0][1], 2e-16 * 2.72);
        assertEquals(2.7182818284590452354, got[0][0], 2e-16 * 2.72);
        assertEquals(2.7182818287308734182, got[0][3], 2e-16 * 2.72);
        assertEquals(0.0, got[0][2], 0.0);
        // the same through Padé (diag(A, 0) embedding): the Padé route is also stable here
        double[] big = {1, 1, 0, 0, c, 0, 0, 0, 0};
        double[][] gotPade = exp(3, big, new double[9]);
        assertEquals(2.7182818285949593268, gotPade[0][1], 1e-14 * 2.72);
    }

    @Test
    void su2AndSo2Rotations() {
        // su(2): exp(-i (θ/2) n·σ) = cos(θ/2) I - i sin(θ/2) n·σ (e.g. M.A. Nielsen, I.L. Chuang, Quantum Computation
        // and Quantum Information, CUP 2000, eq. (4.8) [from memory]); θ = 2, n = (1, 2, 2)/3. Values computed independently (mpmath, 40 digits).
        double nx = 1.0 / 3, ny = 2.0 / 3, nz = 2.0 / 3, h = 1.0; // θ/2 = 1
        // A = -i h (nx X + ny Y + nz Z) = -i h [[nz, nx - i ny], [nx + i ny, -nz]]
        double[] ar = {0, -h * ny, h * ny, 0};
        double[] ai = {-h * nz, -h * nx, -h * nx, h * nz};
        double[][] got = exp(2, ar, ai);
        assertEquals(0.54030230586813972, got[0][0], 2e-16);
        assertEquals(-0.56098065653859767, got[1][0], 2e-16);
        assertEquals(-0.56098065653859767, got[0][1], 2e-16);
        assertEquals(-0.28049032826929884, got[1][1], 2e-16);
        assertEquals(0.56098065653859767, got[0][2], 2e-16);
        assertEquals(-0.28049032826929884, got[1][2], 2e-16);
        assertEquals(0.54030230586813972, got[0][3], 2e-16);
        assertEquals(0.56098065653859767, got[1][3], 2e-16);
        // so(2): exp(θ [[0, -1], [1, 0]]) = [[cos θ, -sin θ], [sin θ, cos θ]], θ = 0.75
        double th = 0.75;
        double[][] rot = exp(2, new double[]{0, -th, th, 0}, new double[4]);
        assertEquals(0.73168886887382089, rot[0][0], 2e-16);
        assertEquals(-0.68163876002333417, rot[0][1], 2e-16);
        assertEquals(0.68163876002333417, rot[0][2], 2e-16);
        assertEquals(0.73168886887382089, rot[0][3], 2e-16);
    }

    // ------------------------------------------------------------------ offline high-precision references

    record Case(String name, int n, double kappa, double[] ar, double[] ai, double[] er, double[] ei) {
    }

    static List<Case> referenceCases() throws IOException {
        List<Case> out = new ArrayList<>();
        try (BufferedReader in = new BufferedReader(new InputStreamReader(
                ExpmTest.class.getResourceAsStream("/org/liepath/core/expm/reference.csv"), StandardCharsets.UTF_8))) {
            String line;
            while ((line = in.readLine()) != null) {
                if (line.startsWith("#") || line.isBlank()) {
                    continue;
                }
                String[] f = line.split(",");
                int n = Integer.parseInt(f[1]), len = n * n, o = 4;
                double[][] parts = new double[4][len];
                for (int p = 0; p < 4; p++) {
                    for (int k = 0; k < len; k++) {
                        parts[p][k] = Double.parseDouble(f[o++]);
                    }
                }
                out.add(new Case(f[0], n, Double.parseDouble(f[2]), parts[0], parts[1], parts[2], parts[3]));
            }
        }
        return out;
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("referenceCases")
    void againstFiftyDigitReference(Case c) {
        // References: make_reference.py beside reference.csv (mpmath, Taylor and Padé at 60 digits agreeing to
        // 1e-45). Tolerance: Higham (2005) chooses θ_m so that the backward error of r_m is ≤ u; the forward
        // relative error is then ≲ κ_exp(A)·u plus rounding in the squarings. All cases kept have κ ≤ 300 (the
        // script discards the others), so κ u ≤ 3.3e-14 and 1e-13 leaves a factor 3 for the rounding terms.
        double[][] got = exp(c.n(), c.ar(), c.ai());
        double r = rel(got[0], got[1], c.er(), c.ei());
        assertTrue(r <= 1e-13, c.name() + " (κ ≈ " + c.kappa() + "): relative error " + r);
    }

    @Test
    void referenceFileIsComplete() throws IOException {
        // guards against a truncated resource silently shrinking the parameterized test above
        List<Case> cases = referenceCases();
        assertTrue(cases.size() >= 30, "only " + cases.size() + " reference cases");
        assertTrue(cases.stream().anyMatch(c -> c.name().contains("norm150")), "large-norm cases present");
        assertTrue(cases.stream().anyMatch(c -> c.name().startsWith("shifted_nilpotent")), "nilpotent cases present");
    }

    // ------------------------------------------------------------------ properties

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void expTimesExpOfNegativeIsIdentity(long seed) {
        // e^A e^{-A} = I (A commutes with -A). Each factor has relative error ≲ κ u with κ ≲ ‖A‖₁ for these
        // Gaussian matrices of moderate norm, so ‖e^A e^{-A} − I‖_F ≲ 2 κ u ‖e^A‖_F ‖e^{-A}‖_F; we allow
        // 20 (1 + ‖A‖₁) n u ‖e^A‖_F ‖e^{-A}‖_F (the factor n for the n-term sums in the final product).
        Random r = new Random(seed);
        int n = 1 + r.nextInt(12);
        double target = 8 * r.nextDouble();
        double[] ar = new double[n * n], ai = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            ar[k] = r.nextGaussian();
            ai[k] = r.nextGaussian();
        }
        double s = target / Dense.norm1(n, ar, ai);
        double[] br = new double[n * n], bi = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            ar[k] *= s;
            ai[k] *= s;
            br[k] = -ar[k];
            bi[k] = -ai[k];
        }
        double[][] x = exp(n, ar, ai), y = exp(n, br, bi);
        double[] pr = new double[n * n], pi = new double[n * n];
        Dense.mul(n, x[0], x[1], y[0], y[1], pr, pi);
        for (int i = 0; i < n; i++) {
            pr[i * n + i] -= 1;
        }
        double defect = Dense.frobenius(n * n, pr, pi);
        double bound = 20 * (1 + target) * n * U * Dense.frobenius(n * n, x[0], x[1]) * Dense.frobenius(n * n, y[0], y[1]);
        assertTrue(defect <= bound, "n = " + n + ", ‖A‖₁ = " + target + ": defect " + defect + " > " + bound);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void continuousAcrossDegreeThresholds(long seed) {
        // Continuity across the branch points θ_m of Higham (2005): A₊ = (1 + ε) A and A₋ = (1 − ε) A with
        // ‖A‖₁ = θ_m take different Padé degrees (or one more squaring). Since A₊ and A₋ commute,
        // e^{A₊} = e^{A₋} e^{2εA} exactly; both branches have backward error ≤ u, so the two sides must agree
        // to a few u·κ (κ ≈ ‖A‖ ≤ 5.4 here) relative: we allow 1e-14.
        Random r = new Random(seed);
        int n = 3 + r.nextInt(6);
        double eps = 1e-12;
        for (double theta : Expm.THETA) {
            double[] ar = new double[n * n], ai = new double[n * n];
            for (int k = 0; k < n * n; k++) {
                ar[k] = r.nextGaussian();
                ai[k] = r.nextGaussian();
            }
            double s = theta / Dense.norm1(n, ar, ai);
            double[] pr = new double[n * n], pim = new double[n * n], mr = new double[n * n], mi = new double[n * n];
            double[] dr = new double[n * n], di = new double[n * n];
            for (int k = 0; k < n * n; k++) {
                pr[k] = ar[k] * s * (1 + eps);
                pim[k] = ai[k] * s * (1 + eps);
                mr[k] = ar[k] * s * (1 - eps);
                mi[k] = ai[k] * s * (1 - eps);
                dr[k] = ar[k] * s * 2 * eps;
                di[k] = ai[k] * s * 2 * eps;
            }
            assertTrue(Dense.norm1(n, pr, pim) > theta && Dense.norm1(n, mr, mi) <= theta, "straddles θ = " + theta);
            double[][] plus = exp(n, pr, pim), minus = exp(n, mr, mi), small = exp(n, dr, di);
            double[] qr = new double[n * n], qi = new double[n * n];
            Dense.mul(n, minus[0], minus[1], small[0], small[1], qr, qi);
            double d = rel(qr, qi, plus[0], plus[1]);
            assertTrue(d <= 1e-14, "θ = " + theta + ", n = " + n + ": " + d);
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void closedForm2x2AgreesWithPade(long seed) {
        // the 2x2 closed form against the Padé algorithm on diag(A, 0) (3x3, so the general path runs), for any
        // complex A, including nearly degenerate ones (δ → 0) and ones with a large norm. Both are accurate to
        // ≲ κ u, κ ≲ ‖A‖ ≤ 30: tolerance 1e-13 relative (Frobenius, with the embedded 1).
        Random r = new Random(seed);
        double[] ar = new double[4], ai = new double[4];
        double scale = Math.pow(10, -3 + 4.5 * r.nextDouble());
        for (int k = 0; k < 4; k++) {
            ar[k] = scale * r.nextGaussian();
            ai[k] = scale * r.nextGaussian();
        }
        if (r.nextBoolean()) {
            // nearly confluent: a - d tiny and b·g tiny
            ar[3] = ar[0] + 1e-9 * r.nextGaussian();
            ai[3] = ai[0];
            ar[2] *= 1e-8;
            ai[2] *= 1e-8;
        }
        double[][] closed = exp(2, ar, ai);
        double[] br = new double[9], bi = new double[9];
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                br[i * 3 + j] = ar[i * 2 + j];
                bi[i * 3 + j] = ai[i * 2 + j];
            }
        }
        double[][] pade = exp(3, br, bi);
        double[] cr = new double[9], ci = new double[9];
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                cr[i * 3 + j] = closed[0][i * 2 + j];
                ci[i * 3 + j] = closed[1][i * 2 + j];
            }
        }
        cr[8] = 1;
        double d = rel(cr, ci, pade[0], pade[1]);
        double kappa = Math.max(1, Dense.norm1(2, ar, ai));
        assertTrue(d <= 1e-14 * kappa + 1e-14, "scale " + scale + ": " + d);
        assertEquals(1.0, pade[0][8], 1e-13);
    }

    @Test
    void largeDimensionsThroughEjmlProductsAgreeWithEigen() {
        // from n = Expm.EJML_FROM the products run through EJML; check that path against the independent
        // eigendecomposition route for A = −itH (normal: both accurate to ≲ (n + ‖tH‖) u; tolerance 20 times that)
        Random r = new Random(64);
        int n = Expm.EJML_FROM + 6;
        org.liepath.core.Operator h = Seeds.randomHermitian(r, n);
        double t = 0.7;
        double[] hr = h.reArray(), hi = h.imArray(), ar = new double[n * n], ai = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            ar[k] = t * hi[k];
            ai[k] = -t * hr[k];
        }
        double[][] pade = exp(n, ar, ai);
        double[] er = new double[n * n], ei = new double[n * n];
        new HermitianExp(n).compute(hr, hi, t, er, ei);
        double d = rel(pade[0], pade[1], er, ei);
        assertTrue(d <= 20 * (n + t * h.norm()) * U, "relative difference " + d);
    }

    @Test
    void workspaceCanBeReusedAndOutputsMayAliasInputs() {
        Random r = new Random(7);
        int n = 6;
        Expm ws = new Expm(n);
        double[] ar = new double[n * n], ai = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            ar[k] = r.nextGaussian();
            ai[k] = r.nextGaussian();
        }
        double[] er = new double[n * n], ei = new double[n * n];
        ws.compute(0.7, ar, ai, er, ei);
        double[] cr = ar.clone(), ci = ai.clone();
        ws.compute(0.7, cr, ci, cr, ci); // in place
        assertTrue(java.util.Arrays.equals(er, cr) && java.util.Arrays.equals(ei, ci), "same bits in place");
        assertEquals(n, ws.dim());
    }

    @Test
    void nonFiniteInputGivesNaNNotAHang() {
        double[] ar = {1, Double.NaN, 0, 1, 0, 0, 0, 0, 1}, ai = new double[9];
        double[] er = new double[9], ei = new double[9];
        new Expm(3).compute(1.0, ar, ai, er, ei);
        assertTrue(Double.isNaN(er[0]));
        assertFalse(Double.isFinite(er[4]));
    }
}
