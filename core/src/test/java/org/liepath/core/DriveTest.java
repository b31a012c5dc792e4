package org.liepath.core;

import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Drives (factories, combinators, breakpoints), their use in Hamiltonians, and DriveException. */
class DriveTest {

    @Test
    void analyticFactoriesHaveTheirTextbookValues() {
        Drive c = Drive.constant(2.5);
        assertEquals(2.5, c.at(-7), 0);
        assertEquals(2.5, c.at(1e9), 0);
        assertTrue(c.isPiecewiseConstant());
        assertEquals(0, c.breakpoints().length);
        // a cos(ωt + φ): cos(π) = −1, cos(π/2) = 0; a sin(ωt + φ): sin(π/2) = 1
        assertEquals(-2.0, Drive.cosine(2, Math.PI).at(1), 1e-15);
        assertEquals(0.0, Drive.cosine(2, 1, Math.PI / 2).at(0), 1e-15);
        assertEquals(1.0, Drive.sine(1, Math.PI / 2, 0).at(1), 1e-15);
        assertEquals(-0.5, Drive.sine(0.5, 1, -Math.PI / 2).at(0), 1e-15);
        assertFalse(Drive.cosine(1, 1).isPiecewiseConstant());
        // a exp(−(t − t0)²/(2σ²)): a at the centre, a e^{−1/2} one σ away, symmetric
        Drive g = Drive.gaussian(3, 1, 0.5);
        assertEquals(3.0, g.at(1), 0);
        assertEquals(3 * Math.exp(-0.5), g.at(1.5), 1e-15);
        assertEquals(g.at(0.3), g.at(1.7), 1e-15);
        assertEquals(0, g.breakpoints().length);
    }

    @Test
    void piecewiseConstantIsLeftClosedAndZeroOutside() {
        Drive p = Drive.piecewiseConstant(new double[]{0, 1, 3, 4}, new double[]{0.5, -1, 2});
        assertEquals(0.0, p.at(-1e-12), 0, "before the first time");
        assertEquals(0.5, p.at(0), 0, "value[0] on [t0, t1)");
        assertEquals(0.5, p.at(0.999), 0);
        assertEquals(-1.0, p.at(1), 0, "left-closed: value[1] at t1");
        assertEquals(-1.0, p.at(2.5), 0);
        assertEquals(2.0, p.at(3), 0);
        assertEquals(2.0, p.at(Math.nextDown(4.0)), 0);
        assertEquals(0.0, p.at(4), 0, "zero from the last time on");
        assertEquals(0.0, p.at(100), 0);
        assertArrayEquals(new double[]{0, 1, 3, 4}, p.breakpoints(), 0);
        assertTrue(p.isPiecewiseConstant());
        assertEquals("piecewise(3 segments)", p.name());
        // breakpoints() is a copy: mutating it does not change the drive
        p.breakpoints()[0] = 99;
        assertEquals(0.0, p.breakpoints()[0], 0);
    }

    @Test
    void piecewiseConstantCopiesItsInput() {
        double[] times = {0, 1, 2}, values = {1, 2};
        Drive p = Drive.piecewiseConstant(times, values);
        times[1] = 1.5;
        values[0] = 7;
        assertEquals(1.0, p.at(0.5), 0, "values were copied");
        assertEquals(2.0, p.at(1.2), 0, "times were copied (the segment still starts at 1)");
        assertArrayEquals(new double[]{0, 1, 2}, p.breakpoints(), 0);
    }

    @Test
    void samplesAreEquallySpacedSegments() {
        Drive s = Drive.samples(2, 0.5, 1, 2, 3);
        assertArrayEquals(new double[]{2, 2.5, 3, 3.5}, s.breakpoints(), 0);
        assertEquals(1.0, s.at(2.2), 0);
        assertEquals(2.0, s.at(2.5), 0);
        assertEquals(3.0, s.at(3.4), 0);
        assertEquals(0.0, s.at(3.5), 0);
        assertTrue(s.isPiecewiseConstant());
    }

    @Test
    void splineIsTheNaturalCubicInterpolant() {
        // knots (0,0), (1,1), (2,0): the natural spline has second derivatives M0 = M2 = 0 and M1 = −3 from
        // M0 + 4M1 + M2 = 6(y0 − 2y1 + y2)/h², so S(x) = 1.5x − 0.5x³ on [0,1] (R. L. Burden, J. D. Faires, Numerical
        // Analysis, 9th ed. 2011, §3.5, Theorem 3.11 [M for the numbering]); symmetric about x = 1
        Drive s = Drive.spline(new double[]{0, 1, 2}, new double[]{0, 1, 0});
        for (double x : new double[]{0, 0.25, 0.5, 0.9, 1}) {
            assertEquals(1.5 * x - 0.5 * x * x * x, s.at(x), 1e-14, "S(" + x + ")");
            assertEquals(s.at(x), s.at(2 - x), 1e-14, "symmetry");
        }
        // constant extrapolation, knots as breakpoints, not piecewise constant
        assertEquals(0.0, s.at(-5), 0);
        assertEquals(0.0, s.at(7), 0);
        assertArrayEquals(new double[]{0, 1, 2}, s.breakpoints(), 0);
        assertFalse(s.isPiecewiseConstant());
    }

    @Test
    void splineReproducesLinearDataAndHasNaturalEnds() {
        // a natural cubic spline is exact on linear data (the linear function itself satisfies all conditions);
        // on general data it interpolates the knots, is C² and has S'' = 0 at both ends (Burden & Faires §3.5)
        double[] t = {0, 0.3, 1, 1.2, 2.5};
        double[] lin = new double[t.length], wiggly = new double[t.length];
        for (int k = 0; k < t.length; k++) {
            lin[k] = 2 - 3 * t[k];
            wiggly[k] = Math.sin(3 * t[k]) + t[k] * t[k];
        }
        Drive l = Drive.spline(t, lin), w = Drive.spline(t, wiggly);
        for (double x = 0; x <= 2.5; x += 0.05) {
            assertEquals(2 - 3 * x, l.at(x), 1e-13, "linear at " + x);
        }
        for (int k = 0; k < t.length; k++) {
            assertEquals(wiggly[k], w.at(t[k]), 1e-14, "knot " + k);
        }
        double h = 1e-4; // central second differences: truncation O(h²·S'''') ≈ 1e-8, rounding ≈ ε/h² ≈ 2e-8
        double endLeft = (w.at(2 * h) - 2 * w.at(h) + w.at(0)) / (h * h); // one-sided: O(h) ≈ 1e-4·|S'''|
        double endRight = (w.at(2.5) - 2 * w.at(2.5 - h) + w.at(2.5 - 2 * h)) / (h * h);
        assertEquals(0.0, endLeft, 1e-2, "S''(0) = 0");
        assertEquals(0.0, endRight, 1e-2, "S''(2.5) = 0");
        double knot = 1.0; // second derivative continuous across an interior knot: one-sided values agree to O(h)
        double leftSide = (w.at(knot) - 2 * w.at(knot - h) + w.at(knot - 2 * h)) / (h * h);
        double rightSide = (w.at(knot + 2 * h) - 2 * w.at(knot + h) + w.at(knot)) / (h * h);
        assertEquals(leftSide, rightSide, 1e-2, "C² at a knot");
    }

    @Test
    void combinatorsComposeValuesBreakpointsAndFlags() {
        Drive a = Drive.samples(0, 1, 1, 2), b = Drive.cosine(1, 2);
        Drive sum = a.plus(b), prod = a.times(b), sc = a.scale(-3), sh = a.shift(0.5);
        for (double t : new double[]{-0.5, 0.2, 1.3, 2.7}) {
            assertEquals(a.at(t) + b.at(t), sum.at(t), 0);
            assertEquals(a.at(t) * b.at(t), prod.at(t), 0);
            assertEquals(-3 * a.at(t), sc.at(t), 0);
            assertEquals(a.at(t - 0.5), sh.at(t), 0);
        }
        assertArrayEquals(new double[]{0, 1, 2}, sum.breakpoints(), 0);
        assertArrayEquals(new double[]{0.5, 1.5, 2.5}, sh.breakpoints(), 0);
        assertFalse(sum.isPiecewiseConstant(), "pc + smooth is not pc");
        assertTrue(a.plus(Drive.constant(1)).isPiecewiseConstant());
        assertTrue(a.times(a).isPiecewiseConstant());
        assertTrue(sc.isPiecewiseConstant() && sh.isPiecewiseConstant());
        // breakpoints of both operands are merged and de-duplicated
        Drive c = Drive.samples(0.5, 1, 3, 4);
        assertArrayEquals(new double[]{0, 0.5, 1, 1.5, 2, 2.5}, a.plus(c).breakpoints(), 0);
        assertArrayEquals(new double[]{0, 1, 2}, a.plus(a).breakpoints(), 0);
        // names describe the composition
        assertEquals("(1·cos(2t) + piecewise(2 segments))", b.plus(a).name());
        assertEquals("2·sin(3t − 0.5000)", Drive.sine(2, 3, -0.5).name());
        assertEquals("piecewise(2 segments)(t − 0.5000)", sh.name());
        assertEquals("piecewise(2 segments)(t + 1)", a.shift(-1).name());
        assertEquals("-3·piecewise(2 segments)", sc.name());
        assertEquals("piecewise(2 segments)·1·cos(2t)", prod.name());
        assertEquals("pulse", a.named("pulse").name());
        assertEquals(a.at(0.5), a.named("pulse").at(0.5), 0);
        assertArrayEquals(a.breakpoints(), a.named("pulse").breakpoints(), 0);
        assertEquals("pulse", a.named("pulse").toString());
    }

    @Test
    void signedZeroBreakpointsMergeIntoOne() {
        // −0.0 and 0.0 are the same instant; a TreeSet keeps both, which gave a zero-length segment before the fix
        Drive a = Drive.piecewiseConstant(new double[]{-0.0, 1}, new double[]{1});
        Drive b = Drive.piecewiseConstant(new double[]{0.0, 2}, new double[]{1});
        assertArrayEquals(new double[]{0, 1, 2}, a.plus(b).breakpoints(), 0);
        Hamiltonian h = Hamiltonian.builder(2).term(Pauli.x(), a).term(Pauli.z(), b).build();
        assertEquals(3, h.breakpoints().length);
    }

    @Test
    void windowCutsTheDriveAndItsBreakpoints() {
        Drive s = Drive.samples(0, 1, 1, 2, 3, 4);
        Drive w = s.window(1.5, 2.5);
        assertEquals(0.0, w.at(1.4), 0);
        assertEquals(2.0, w.at(1.5), 0);
        assertEquals(3.0, w.at(2.2), 0);
        assertEquals(0.0, w.at(2.5), 0, "half-open window");
        // breakpoints outside the window are not breakpoints of the windowed drive
        assertArrayEquals(new double[]{1.5, 2, 2.5}, w.breakpoints(), 0);
        assertTrue(w.isPiecewiseConstant());
        Drive cw = Drive.cosine(1, 1).window(0, 3);
        assertArrayEquals(new double[]{0, 3}, cw.breakpoints(), 0);
        assertFalse(cw.isPiecewiseConstant());
        assertEquals(Math.cos(1), cw.at(1), 0);
    }

    @Test
    void lambdaDrivesHaveDefaultMetadata() {
        Drive f = t -> t * t;
        assertEquals(0, f.breakpoints().length);
        assertEquals("drive", f.name());
        assertFalse(f.isPiecewiseConstant());
        assertEquals(4.0, f.at(2), 0);
    }

    // ------------------------------------------------------------------ Hamiltonian metadata

    @Test
    void hamiltonianCollectsBreakpointsAndClassifiesItsDrives() {
        Hamiltonian constant = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(0.1, Pauli.x()).build();
        assertTrue(constant.isTimeIndependent());
        assertTrue(constant.isPiecewiseConstant());
        assertEquals(0, constant.breakpoints().length);
        Hamiltonian pc = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), Drive.samples(0, 0.5, 1, -1))
                .term(Pauli.y(), Drive.samples(0.25, 0.5, 2)).build();
        assertFalse(pc.isTimeIndependent());
        assertTrue(pc.isPiecewiseConstant());
        assertArrayEquals(new double[]{0, 0.25, 0.5, 0.75, 1}, pc.breakpoints(), 0);
        Hamiltonian smooth = Hamiltonian.builder(2).term(Pauli.x(), Drive.cosine(1, 1)).build();
        assertFalse(smooth.isPiecewiseConstant());
        assertFalse(smooth.isTimeIndependent());
        assertEquals(3, pc.size());
        assertEquals(2, pc.dim());
        assertTrue(pc.toString().contains("piecewise(2 segments) · A1"), pc.toString());
        // H(t) for a piecewise drive: at t = 0.6 the X term has value −1 and the Y term 2
        Operator expect = Pauli.z().scale(0.5).plus(Pauli.x().scale(-1)).plus(Pauli.y().scale(2));
        assertEquals(0.0, expect.distance(pc.at(0.6)), 1e-15);
        // constant(H) is the one-term Hamiltonian with coefficient 1
        Operator hz = Pauli.z().scale(0.3);
        assertEquals(hz, Hamiltonian.constant(hz).at(12.0));
        // the builder copies its lists: adding more terms later does not change a built Hamiltonian
        Hamiltonian.Builder b = Hamiltonian.builder(2).term(1, Pauli.x());
        Hamiltonian first = b.build();
        b.term(1, Pauli.z());
        assertEquals(1, first.size());
        assertThrows(UnsupportedOperationException.class, () -> first.operators().add(Pauli.z()));
    }

    // ------------------------------------------------------------------ DriveException

    private static Hamiltonian withBadDrive(Drive bad) {
        return Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), bad.named("faulty pulse")).build();
    }

    @Test
    void aThrowingDriveIsReportedWithNameTermAndTime() {
        IllegalStateException boom = new IllegalStateException("boom");
        Hamiltonian h = withBadDrive(t -> {
            if (t > 0.2) {
                throw boom;
            }
            return 1;
        });
        assertEquals(1.0, h.at(0.1).re(0, 1), 0, "fine before the failure");
        DriveException e = assertThrows(DriveException.class, () -> h.at(0.25));
        assertEquals("faulty pulse", e.driveName());
        assertEquals(1, e.term());
        assertEquals(0.25, e.time(), 0);
        assertSame(boom, e.getCause());
        assertTrue(e.getMessage().contains("'faulty pulse'") && e.getMessage().contains("term 1")
                && e.getMessage().contains("t = 0.25") && e.getMessage().contains("boom"), e.getMessage());
        DriveException e2 = assertThrows(DriveException.class, () -> h.coefficients(0.75, new double[2]));
        assertEquals(0.75, e2.time(), 0);
        assertEquals(1, e2.term());
    }

    @Test
    void aNonFiniteDriveValueIsReportedWithNameTermAndTime() {
        for (double bad : new double[]{Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}) {
            Hamiltonian h = withBadDrive(t -> t < 1 ? 0.0 : bad);
            DriveException e = assertThrows(DriveException.class, () -> h.coefficients(1.5, new double[2]));
            assertEquals("faulty pulse", e.driveName());
            assertEquals(1, e.term());
            assertEquals(1.5, e.time(), 0);
            assertNull(e.getCause());
            assertTrue(e.getMessage().contains("returned " + bad) && e.getMessage().contains("t = 1.5"), e.getMessage());
            assertThrows(DriveException.class, () -> h.at(2.0));
            assertThrows(DriveException.class, () -> h.normBound(2.0));
            // a GKLS generator built on it reports the same failure
            Lindbladian l = Lindbladian.builder(h).jump(0.1, Operator.unit(2, 0, 1)).build();
            DriveException e3 = assertThrows(DriveException.class, () -> l.at(3.0));
            assertEquals(3.0, e3.time(), 0);
        }
        // an unnamed lambda is reported under the default name "drive"
        Hamiltonian anon = Hamiltonian.builder(2).term(Pauli.x(), t -> Double.NaN).build();
        DriveException e = assertThrows(DriveException.class, () -> anon.at(0));
        assertEquals("drive", e.driveName());
        assertEquals(0, e.term());
    }
}
