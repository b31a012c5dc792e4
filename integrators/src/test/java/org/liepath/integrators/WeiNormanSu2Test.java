package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Wei–Norman charts of su(2) in the ladder ordering: the Riccati form and its published check values. */
class WeiNormanSu2Test {
    static final Operator SP = Operator.of(new double[][]{{0, 1}, {0, 0}}, new double[2][2]);
    static final Operator SM = Operator.of(new double[][]{{0, 0}, {1, 0}}, new double[2][2]);
    static final Operator SZ = Pauli.z();

    static CoordinateRun run(WeiNorman chart, Hamiltonian h, double t0, double t1, double tol) {
        return chart.integrate(h, t0, t1, tol, new double[0], (f, c) -> true);
    }

    static void assertClose(Complex expected, Complex actual, double tol, String what) {
        assertTrue(expected.subtract(actual).abs() <= tol, what + ": expected " + expected + ", got " + actual
                + " (|diff| = " + expected.subtract(actual).abs() + ")");
    }

    /** H = (Δ/2)σz + Ω cos(ωt) σx. */
    static Hamiltonian linearDrive(double delta, double omega, double w) {
        return Hamiltonian.builder(2).term(delta / 2, SZ).term(Pauli.x(), Drive.cosine(omega, w, 0)).build();
    }

    @Test
    void riccatiFormForSigmaLadderMatchesHandDerivation() {
        // By hand from [σz, σ±] = ±2σ±, [σ+, σ−] = σz (J. Wei, E. Norman, J. Math. Phys. 4 (1963) 575, product
        // ansatz): with A = aσ+ + bσz + cσ−, g1' = a + 2b g1 − c g1², g2' = b − c g1, g3' = c e^{2 g2}.
        WeiNorman chart = WeiNorman.of(List.of(SP, SZ, SM));
        Hamiltonian h = linearDrive(0.8, 0.6, 1.3);
        WeiNormanEquations eq = chart.equations(h);
        Random r = new Random(11);
        for (int trial = 0; trial < 20; trial++) {
            double t = 3 * r.nextDouble();
            Complex[] g = {new Complex(r.nextGaussian(), r.nextGaussian()), new Complex(r.nextGaussian(),
                    r.nextGaussian()), new Complex(r.nextGaussian(), r.nextGaussian())};
            Complex a = new Complex(0, -0.6 * Math.cos(1.3 * t)), c = a, b = new Complex(0, -0.4);
            Complex[] d = eq.derivative(t, g);
            Complex e1 = a.add(b.multiply(2).multiply(g[0])).subtract(c.multiply(g[0]).multiply(g[0]));
            Complex e2 = b.subtract(c.multiply(g[0]));
            Complex e3 = c.multiply(g[1].multiply(2).exp());
            // Γ has entries of size |g|² here; the LU solve is backward stable, so 1e-12 relative is ample
            double s = 1e-12 * (1 + g[0].abs() * g[0].abs()) * (1 + g[1].multiply(2).exp().abs());
            assertClose(e1, d[0], s, "g1'");
            assertClose(e2, d[1], s, "g2'");
            assertClose(e3, d[2], s, "g3'");
        }
        assertEquals(Nonlinearity.RICCATI, eq.nonlinearity());
        assertTrue(eq.isRiccati());
        assertEquals(Nonlinearity.RICCATI, eq.nonlinearity(0));
        assertTrue(eq.isQuadrature(1) && eq.isQuadrature(2));
        String text = eq.render();
        assertTrue(text.contains("g1' = a1 + 2 a2 g1 - a3 g1^2"), text);
        assertTrue(text.contains("g2' = a2 - a3 g1"), text);
        assertTrue(text.contains("g3' = a3 exp(2 g2)"), text);
        String tex = eq.renderLatex();
        assertTrue(tex.contains("\\dot g_{1} &= a_{1} + 2 a_{2} g_{1} - a_{3} g_{1}^{2}"), tex);
    }

    @Test
    void riccatiFormForSpinLadder() {
        // By hand from [Jz, J±] = ±J±, [J+, J−] = 2Jz: ġ1 = a+ + a0 g1 − a− g1², ġ2 = a0 − 2 a− g1, ġ3 = a− e^{g2}.
        Spin s = Spin.of(0.5);
        WeiNorman chart = WeiNorman.of(List.of(s.plus(), s.z(), s.minus()));
        WeiNormanEquations eq = chart.equations(Hamiltonian.builder(2).term(1.0, s.x()).build());
        String text = eq.render();
        assertTrue(text.contains("g1' = a1 + a2 g1 - a3 g1^2"), text);
        assertTrue(text.contains("g2' = a2 - 2 a3 g1"), text);
        assertTrue(text.contains("g3' = a3 exp(g2)"), text);
        assertEquals(Complex.ONE.multiply(1.0), chart.structureConstant(1, 0, 0));
        assertEquals(new Complex(2), chart.structureConstant(0, 2, 1));
    }

    @Test
    void constantFieldWorkedCheck() {
        // Closed form for a constant field: U = cos(Et) I − i sin(Et)/E H, g1 = g3 = −iΩ sin(Et)/(2E cos(Et) + iΔ
        // sin(Et)), e^{−g2} = cos(Et) + i(Δ/2E) sin(Et), E = ½√(Δ² + Ω²) (follows from the inverse map g1 = U01/U11,
        // g3 = U10/U11, e^{−g2} = U11 of the product e^{g1σ+}e^{g2σz}e^{g3σ−}); regression values at Δ = 0.7,
        // Ω = 1.3, t = 0.9 computed from that formula.
        double delta = 0.7, omega = 1.3, t = 0.9;
        Hamiltonian h = Hamiltonian.builder(2).term(delta / 2, SZ).term(omega / 2, Pauli.x()).build();
        WeiNorman chart = WeiNorman.of(List.of(SP, SZ, SM));
        CoordinateRun run = run(chart, h, 0, t, 1e-12);
        assertNull(run.failure);
        Complex[] g = run.coordinates.get(run.coordinates.size() - 1);
        Complex g13 = new Complex(-0.22503107373987144, -0.6060328927398829);
        Complex g2 = new Complex(0.17459368890495375, -0.35553893489369576);
        // DP853 at tolerance 1e-12 over one unit of time: global error a few 1e-12
        assertClose(g13, g[0], 1e-10, "g1");
        assertClose(g2, g[1], 1e-10, "g2");
        assertClose(g13, g[2], 1e-10, "g3");
        double e = 0.5 * Math.hypot(delta, omega);
        Operator exact = Operator.identity(2).scale(Math.cos(e * t)).plus(h.at(0).timesI().scale(-Math.sin(e * t) / e));
        assertTrue(chart.propagator(new Complex[]{g13, g2, g13}).distance(exact) < 1e-15 * 10);
        assertTrue(run.propagator.distance(exact) < 1e-10);
        assertEquals(1, run.charts);
    }

    @Test
    void linearlyPolarisedDriveRiccatiCoordinateAtTen() {
        // Reference values: a = U01/U11 for H = (Δ/2)σz + Ω cos(ωt)σx, Δ = 1, Ω = 0.4, ω = 1 at t = 10 (computed
        // offline with mpmath; the factorisation U = exp(aσ+)exp(bσz)exp(cσ−)); |a| grows to about 27 on [0, 10]:
        // a stress test for the chart without re-anchoring.
        Complex aRef = new Complex(-1.1669618917021607, -1.35198811985346795);
        Complex cRef = new Complex(0.0714767501057580067, 1.78453439504659581);
        Hamiltonian h = linearDrive(1, 0.4, 1);
        WeiNorman chart = WeiNorman.of(List.of(SP, SZ, SM));
        WeiNormanEquations eq = chart.equations(h);
        WeiNormanEquations.Workspace ws = eq.workspace();
        // (1) the coordinate equations integrated directly by Commons Math DP853 (no re-anchoring)
        FirstOrderDifferentialEquations ode = new FirstOrderDifferentialEquations() {
            public int getDimension() {
                return 6;
            }

            public void computeDerivatives(double t, double[] y, double[] yDot) {
                assertTrue(eq.derivative(t, y, yDot, ws));
            }
        };
        double[] y = new double[6];
        new DormandPrince853Integrator(1e-12, 1, 1e-13, 1e-13).integrate(ode, 0, new double[6], 10, y);
        // DP853 at 1e-13 through |a| ≈ 27: the reference integration reached 5e-14; allow 1e-9
        assertClose(aRef, new Complex(y[0], y[1]), 1e-9, "a(10)");
        assertClose(cRef, new Complex(y[4], y[5]), 1e-9, "c(10)");
        // (2) the run with automatic re-anchoring gives the same propagator, hence the same a = U01/U11
        CoordinateRun run = run(chart, h, 0, 10, 1e-12);
        assertNull(run.failure);
        Operator u = run.propagator;
        assertClose(new Complex(-0.17942193503183345, -0.454411643739364262), u.get(0, 0), 1e-9, "U00");
        assertClose(new Complex(-0.823737704576317529, -0.287704746785417248), u.get(1, 0), 1e-9, "U10");
        assertClose(aRef, u.get(0, 1).divide(u.get(1, 1)), 1e-8, "U01/U11");
        assertTrue(run.charts > 1, "the run must re-anchor where |a| grows: charts = " + run.charts);
    }
}
