package org.liepath.core.internal;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link Skew3}: packed 3×3 anti-Hermitian arithmetic against planar products ({@link Dense#mul}), and its increment
 * against the general workspace ({@link Expm#computeIncrementAntiHermitian}) and closed forms.
 */
class Skew3Test {
    private static final double U = 0x1p-53;

    private static double[] packed(Random r, double scale) {
        double[] x = new double[Skew3.LEN];
        for (int q = 0; q < x.length; q++) {
            x[q] = scale * r.nextGaussian();
        }
        return x;
    }

    private static double[][] planar(double[] x) {
        double[] re = new double[9], im = new double[9];
        Skew3.unpack(x, re, im);
        return new double[][]{re, im};
    }

    /** Planar Hermitian from the packed Hermitian layout. */
    private static double[][] planarHermitian(double[] h) {
        double[] re = new double[9], im = new double[9];
        re[0] = h[0];
        re[4] = h[1];
        re[8] = h[2];
        int[][] pairs = {{1, 3, 3}, {2, 6, 5}, {5, 7, 7}};
        for (int[] p : pairs) {
            re[p[0]] = h[p[2]];
            im[p[0]] = h[p[2] + 1];
            re[p[1]] = h[p[2]];
            im[p[1]] = -h[p[2] + 1];
        }
        return new double[][]{re, im};
    }

    private static double[][] mul(double[][] a, double[][] b) {
        double[] cr = new double[9], ci = new double[9];
        Dense.mul(3, a[0], a[1], b[0], b[1], cr, ci);
        return new double[][]{cr, ci};
    }

    private static double maxDiff(double[][] a, double[][] b) {
        double m = 0;
        for (int k = 0; k < 9; k++) {
            m = Math.max(m, Math.hypot(a[0][k] - b[0][k], a[1][k] - b[1][k]));
        }
        return m;
    }

    private static double maxAbs(double[] x) {
        double m = 0;
        for (double v : x) {
            m = Math.max(m, Math.abs(v));
        }
        return m;
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void bracketIsTheCommutatorOfThePlanarMatrices(long seed) {
        Random r = new Random(seed);
        double[] x = packed(r, 1.0), y = packed(r, 2.0), c = new double[9];
        Skew3.bracket(0.75, x, y, c);
        double[][] px = planar(x), py = planar(y), xy = mul(px, py), yx = mul(py, px);
        double[][] want = new double[2][9];
        for (int k = 0; k < 9; k++) {
            want[0][k] = 0.75 * (xy[0][k] - yx[0][k]);
            want[1][k] = 0.75 * (xy[1][k] - yx[1][k]);
        }
        // each entry sums at most twelve products of entries bounded by max|x|·max|y|: γ₁₂-type bound
        double bound = 24 * U * 0.75 * 12 * maxAbs(x) * maxAbs(y);
        assertTrue(maxDiff(planar(c), want) <= bound, "bracket " + maxDiff(planar(c), want));
        // the packed result is traceless exactly in the sense of the algebra: d0 + d1 + d2 = 0 to rounding
        assertEquals(0.0, c[0] + c[1] + c[2], bound);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void bracketOfACombinationIsTheBracketOfTheFormedCombination(long seed) {
        // s·[a·x + b·y, z] formed in registers equals the bracket of the stored combination bit for bit: the same
        // products and sums in the same order
        Random r = new Random(seed);
        double[] x = packed(r, 1.0), y = packed(r, 1.0), z = packed(r, 1.0), xy = new double[9];
        double a = r.nextGaussian(), b = r.nextGaussian(), s = r.nextGaussian();
        Skew3.lin(a, x, b, y, xy);
        double[] want = new double[9], got = new double[9];
        Skew3.bracket(s, xy, z, want);
        Skew3.bracket(s, a, x, b, y, z, got);
        assertArrayEquals(want, got, 0.0);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void structuredProductsAreThePlanarProducts(long seed) {
        Random r = new Random(seed);
        double[] x = packed(r, 1.0);
        double[][] px = planar(x);
        double[] x2 = new double[9];
        Skew3.square(x, x2);
        double[][] want2 = mul(px, px);
        double scale = maxAbs(x) * maxAbs(x);
        assertTrue(maxDiff(planarHermitian(x2), want2) <= 24 * U * 6 * scale, "square");
        // commuting Hermitian operands: polynomials in X² (as in the Padé evaluation)
        double[] h = new double[9], g = new double[9], hg = new double[9], xh = new double[9];
        for (int q = 0; q < 9; q++) {
            h[q] = 0.3 * x2[q];
            g[q] = -1.7 * x2[q];
        }
        h[0] += 2;
        h[1] += 2;
        h[2] += 2;
        Skew3.mulHermitian(h, g, hg);
        double[][] wantHg = mul(planarHermitian(h), planarHermitian(g));
        double s2 = maxAbs(h) * maxAbs(g);
        assertTrue(maxDiff(planarHermitian(hg), wantHg) <= 24 * U * 6 * s2, "Hermitian product");
        Skew3.mulOdd(x, h, xh);
        double[][] wantXh = mul(px, planarHermitian(h));
        assertTrue(maxDiff(planar(xh), wantXh) <= 24 * U * 6 * maxAbs(x) * maxAbs(h), "odd product");
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void packTakesTheAntiHermitianPartAndRoundTrips(long seed) {
        Random r = new Random(seed);
        double[] x = packed(r, 1.0), back = new double[9];
        double[][] p = planar(x);
        Skew3.pack(p[0], p[1], back);
        assertArrayEquals(x, back, 0.0);
        // a general matrix packs to (X − X†)/2
        double[] gr = new double[9], gi = new double[9];
        for (int k = 0; k < 9; k++) {
            gr[k] = r.nextGaussian();
            gi[k] = r.nextGaussian();
        }
        Skew3.pack(gr, gi, back);
        double[][] q = planar(back);
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                int ij = 3 * i + j, ji = 3 * j + i;
                assertEquals((gr[ij] - gr[ji]) / 2, q[0][ij], 1e-15);
                assertEquals((gi[ij] + gi[ji]) / 2, q[1][ij], 1e-15);
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void conjugateIsTheDiagonalUnitaryConjugation(long seed) {
        Random r = new Random(seed);
        double[] x = packed(r, 1.0), c = {r.nextGaussian(), r.nextGaussian(), r.nextGaussian()};
        double[][] p = planar(x);
        Skew3.conjugate(x, c[0], c[1], c[2]);
        double[][] got = planar(x);
        for (int a = 0; a < 3; a++) {
            for (int b = 0; b < 3; b++) {
                double ang = c[a] - c[b], re = p[0][3 * a + b], im = p[1][3 * a + b];
                assertEquals(Math.cos(ang) * re - Math.sin(ang) * im, got[0][3 * a + b], 1e-15);
                assertEquals(Math.cos(ang) * im + Math.sin(ang) * re, got[1][3 * a + b], 1e-15);
            }
        }
    }

    /** ‖A‖₁ points inside every degree branch of Higham's selection, including one to four squarings. */
    static double[] norms() {
        return new double[]{1e-9, 1e-3, 0.01, 0.1, 0.25, 0.5, 0.9, 1.5, 2.05, 3.0, 5.3, 9.0, 20.0, 42.0, 80.0};
    }

    @ParameterizedTest(name = "‖A‖₁ = {0}")
    @MethodSource("norms")
    void incrementAgreesWithTheGeneralWorkspaceAndIsUnitary(double norm) {
        Random r = new Random(Double.doubleToLongBits(norm));
        Expm general = new Expm(3);
        Skew3 packedWs = new Skew3();
        for (int trial = 0; trial < 20; trial++) {
            double[] x = packed(r, 1.0);
            // an energy offset in half the trials, so that the Gershgorin shift is taken as well as skipped
            if (trial % 2 == 1) {
                x[0] += 3;
                x[1] += 3;
                x[2] += 3;
            }
            double f = norm / Skew3.norm1(x);
            for (int q = 0; q < 9; q++) {
                x[q] *= f;
            }
            double[][] p = planar(x);
            assertEquals(norm, Dense.norm1(3, p[0], p[1]), 8 * U * norm);
            double[] wr = new double[9], wi = new double[9], gr = new double[9], gi = new double[9];
            assertTrue(packedWs.increment(1.0, x, wr, wi, Double.POSITIVE_INFINITY));
            general.computeIncrementAntiHermitian(1.0, p[0], p[1], gr, gi);
            // the same rational function summed in another order: each product and the solve round at the level
            // γ₆·max(1, ‖A‖₁); every squaring doubles the relative error of the increment it squares
            int squarings = Math.max(0, Expm.cost(norm) - 4);
            double tol = 64 * U * norm * Math.scalb(1.0, squarings);
            double diff = maxDiff(new double[][]{wr, wi}, new double[][]{gr, gi});
            assertTrue(diff <= tol, "trial " + trial + ": " + diff + " > " + tol);
            double defect = ExpmAntiHermitianTest.unitarityDefect(3, new double[][]{wr, wi});
            assertTrue(defect <= 10 * 3 * U * Math.max(1, norm) * Math.scalb(1.0, squarings), "unitarity " + defect);
        }
    }

    @ParameterizedTest(name = "θ = {0}")
    @ValueSource(doubles = {1e-3, 0.01, 0.3, 1.0, 2.0, 3.0, 5.5})
    void spinOneRotationIsTheWignerSmallDMatrix(double theta) {
        // d¹(θ) = exp(−iθJ_y) = [[(1+cos θ)/2, −sin θ/√2, (1−cos θ)/2], [sin θ/√2, cos θ, −sin θ/√2],
        // [(1−cos θ)/2, sin θ/√2, (1+cos θ)/2]] (J.J. Sakurai, Modern Quantum Mechanics, rev. ed., Addison-Wesley
        // 1994, eq. (3.5.57) [from memory]); increments in the cancellation-free forms, tolerance 10 n u ‖A‖₁.
        double s = Math.sin(theta), h = Math.sin(theta / 2), r2 = Math.sqrt(2);
        double[] want = {-h * h, -s / r2, h * h, s / r2, -2 * h * h, -s / r2, h * h, s / r2, -h * h};
        double[] a = ExpmAntiHermitianTest.spinRotationExponent(2, theta), x = new double[9];
        Skew3.pack(a, new double[9], x);
        double[] dr = new double[9], di = new double[9];
        assertTrue(new Skew3().increment(1.0, x, dr, di, Double.POSITIVE_INFINITY));
        double norm = r2 * theta;
        double diff = maxDiff(new double[][]{dr, di}, new double[][]{want, new double[9]});
        assertTrue(diff <= 10 * 3 * U * norm, "θ = " + theta + ": " + diff);
    }

    @ParameterizedTest(name = "E = {0}")
    @ValueSource(doubles = {-40.0, 7.0, 2000.0})
    void energyOffsetIsAPhase(double e) {
        // exp(−i(θJ_y + E·I)) = e^{−iE} d¹(θ), since E·I commutes with J_y (common practice); the shift removes E
        // from the degree selection, so the phase is applied exactly once: error ≈ u·|E| from rounding E·h.
        double theta = 0.4;
        double[] a = ExpmAntiHermitianTest.spinRotationExponent(2, theta), x = new double[9], y = new double[9];
        Skew3.pack(a, new double[9], x);
        System.arraycopy(x, 0, y, 0, 9);
        y[0] -= e;
        y[1] -= e;
        y[2] -= e;
        Skew3 ws = new Skew3();
        double[] dr = new double[9], di = new double[9], fr = new double[9], fi = new double[9];
        ws.increment(1.0, x, dr, di, Double.POSITIVE_INFINITY);
        ws.increment(1.0, y, fr, fi, Double.POSITIVE_INFINITY);
        double c = Math.cos(e), s = -Math.sin(e);
        for (int k = 0; k < 9; k++) {
            double ur = dr[k] + (k % 4 == 0 ? 1 : 0), ui = di[k];
            double wantR = c * ur - s * ui - (k % 4 == 0 ? 1 : 0), wantI = c * ui + s * ur;
            assertEquals(wantR, fr[k], 20 * U * Math.abs(e) + 1e-15, "re " + k);
            assertEquals(wantI, fi[k], 20 * U * Math.abs(e) + 1e-15, "im " + k);
        }
    }

    @Test
    void refusesAboveTheLimitAndPropagatesNonFiniteInput() {
        double[] x = {0, 0, 0, 100, 0, 0, 0, 0, 0};
        double[] dr = new double[9], di = new double[9];
        dr[4] = 42;
        Skew3 ws = new Skew3();
        assertFalse(ws.increment(1.0, x, dr, di, 86.0));
        assertEquals(42, dr[4], 0.0, "output untouched when refused");
        x[3] = Double.NaN;
        assertTrue(ws.increment(1.0, x, dr, di, 86.0));
        assertTrue(Double.isNaN(dr[0]) && Double.isNaN(di[8]));
        x[3] = Double.POSITIVE_INFINITY;
        ws.increment(1.0, x, dr, di, Double.POSITIVE_INFINITY);
        assertTrue(Double.isNaN(dr[4]));
        double[] zero = new double[9];
        assertTrue(ws.increment(1.0, zero, dr, di, 86.0));
        assertArrayEquals(new double[9], dr, 0.0);
        assertArrayEquals(new double[9], di, 0.0);
    }
}
