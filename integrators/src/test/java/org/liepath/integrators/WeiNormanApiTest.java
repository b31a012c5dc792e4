package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.liepath.algebra.LieAlgebra;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Levels;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;
import org.liepath.integrators.internal.wn.Chart;
import org.liepath.integrators.internal.wn.Symbolic;

import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Chart API: structure constants, closed forms against numerics, ordering proposals, bad input. */
class WeiNormanApiTest {
    static final Operator SP = WeiNormanSu2Test.SP, SM = WeiNormanSu2Test.SM;

    static List<Operator> so5() {
        List<Operator> b = new ArrayList<>();
        for (String s : new String[]{"IX", "IY", "IZ", "XX", "XY", "XZ", "YX", "YY", "YZ", "ZI"}) {
            b.add(Pauli.string(s).timesI().scale(-0.5));
        }
        return b;
    }

    static List<Operator> sl3Ladder() {
        return List.of(Levels.unit(3, 0, 1), Levels.unit(3, 0, 2), Levels.unit(3, 1, 2), Operator.diagonal(1, -1, 0),
                Operator.diagonal(0, 1, -1), Levels.unit(3, 1, 0), Levels.unit(3, 2, 0), Levels.unit(3, 2, 1));
    }

    @Test
    void structureConstantsAreAntisymmetricAndSatisfyJacobi() {
        // Common practice: c_ij^l = −c_ji^l and Σ_l (c_ij^l c_lk^p + c_jk^l c_li^p + c_ki^l c_lj^p) = 0.
        WeiNorman chart = WeiNorman.of(so5());
        int m = chart.dimension();
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                for (int l = 0; l < m; l++) {
                    assertTrue(chart.structureConstant(i, j, l).add(chart.structureConstant(j, i, l)).abs() < 1e-14);
                }
                for (int k = 0; k < m; k++) {
                    for (int p = 0; p < m; p++) {
                        Complex s = Complex.ZERO;
                        for (int l = 0; l < m; l++) {
                            s = s.add(chart.structureConstant(i, j, l).multiply(chart.structureConstant(l, k, p)))
                                    .add(chart.structureConstant(j, k, l).multiply(chart.structureConstant(l, i, p)))
                                    .add(chart.structureConstant(k, i, l).multiply(chart.structureConstant(l, j, p)));
                        }
                        assertTrue(s.abs() < 1e-13);
                    }
                }
            }
        }
        // the bracket itself: [X_i, X_j] = Σ c X_l
        Operator br = chart.basis().get(0).commutator(chart.basis().get(3));
        Operator sum = Operator.zero(4);
        for (int l = 0; l < m; l++) {
            sum = sum.plus(chart.basis().get(l).scale(chart.structureConstant(0, 3, l)));
        }
        assertTrue(br.distance(sum) < 1e-14);
    }

    @Test
    void closedFormInverseOfGammaEqualsTheNumericalSolve() {
        // The printed equations are exact: M(g) from the closed form times a equals the LU solve of Γ(g)ġ = a.
        for (List<Operator> basis : List.of(sl3Ladder(), List.of(SP, Pauli.z(), SM),
                List.of(Spin.of(2).minus(), Spin.of(2).z(), Spin.of(2).plus()))) {
            WeiNorman chart = WeiNorman.of(basis);
            Symbolic s = chart.symbolic();
            assertTrue(s != null && s.solved());
            Chart c = chart.chart();
            Chart.Work w = new Chart.Work(c);
            Random r = new Random(3);
            int m = c.m;
            double[] g = new double[2 * m], aR = new double[m], aI = new double[m], d = new double[2 * m];
            for (int e = 0; e < 2 * m; e++) {
                g[e] = 0.7 * r.nextGaussian();
            }
            for (int k = 0; k < m; k++) {
                aR[k] = r.nextGaussian();
                aI[k] = r.nextGaussian();
            }
            assertTrue(c.solve(g, aR, aI, d, w));
            double[][] inv = s.evalInverse(g);
            for (int k = 0; k < m; k++) {
                double sr = 0, si = 0;
                for (int j = 0; j < m; j++) {
                    sr += inv[0][k * m + j] * aR[j] - inv[1][k * m + j] * aI[j];
                    si += inv[0][k * m + j] * aI[j] + inv[1][k * m + j] * aR[j];
                }
                assertEquals(d[2 * k], sr, 1e-10 * (1 + Math.abs(sr)));
                assertEquals(d[2 * k + 1], si, 1e-10 * (1 + Math.abs(si)));
            }
        }
    }

    @Test
    void orderingProposals() {
        Spin s = Spin.of(1);
        // (Jz, J−, J+) as given: the proposals find a Riccati ordering (raising or lowering first, Jz in between)
        List<WeiNormanOrderings.Proposal> p = WeiNormanOrderings.propose(List.of(s.z(), s.minus(), s.plus()));
        assertEquals(Nonlinearity.RICCATI, p.get(0).nonlinearity());
        assertEquals(0, p.get(0).order()[1]);
        // an anti-Hermitian basis has no polynomial ordering
        List<Operator> anti = List.of(s.x().timesI().scale(-1), s.y().timesI().scale(-1), s.z().timesI().scale(-1));
        List<WeiNormanOrderings.Proposal> q = WeiNormanOrderings.propose(anti);
        assertTrue(q.get(0).nonlinearity().compareTo(Nonlinearity.POLYNOMIAL) > 0, q.toString());
        // sl(3) shuffled: the weight heuristic restores a raising–Cartan–lowering Riccati ordering
        List<Operator> shuffled = new ArrayList<>(sl3Ladder());
        java.util.Collections.shuffle(shuffled, new Random(2));
        List<WeiNormanOrderings.Proposal> r = WeiNormanOrderings.propose(shuffled);
        assertEquals(Nonlinearity.RICCATI, r.get(0).nonlinearity(), r.toString());
    }

    @Test
    void chartFromAlgebra() {
        Hamiltonian h = Hamiltonian.builder(2).term(0.4, Pauli.z()).term(Pauli.x(), Drive.cosine(0.7, 1.2, 0)).build();
        WeiNorman chart = WeiNorman.of(LieAlgebra.generatedBy(h));
        assertEquals(3, chart.dimension());
        Evolution ev = WnTesting.wn(chart, h, 0, 3, 1e-12);
        assertTrue(ev.status().isSuccess());
        assertTrue(WnTesting.maxDiff(WnTesting.reference(h, 0, 3), ev.propagator()) < 1e-9);
        String text = chart.equations(h).render();
        assertTrue(text.contains("implicit"), text);
        assertNotEquals(Nonlinearity.RICCATI, chart.nonlinearity());
    }

    @Test
    void primitiveDerivativeAllocatesNothing() {
        Spin s = Spin.of(0.5);
        WeiNorman chart = WeiNorman.of(List.of(s.plus(), s.z(), s.minus()));
        Hamiltonian h = Hamiltonian.builder(2).term(0.7, s.z()).term(s.x(), Drive.cosine(0.9, 1.1, 0)).build();
        WeiNormanEquations eq = chart.equations(h);
        WeiNormanEquations.Workspace ws = eq.workspace();
        double[] g = {0.1, 0.2, -0.3, 0.1, 0.05, 0.4}, d = new double[6];
        for (int k = 0; k < 20000; k++) {
            eq.derivative(0.01 * k, g, d, ws);
        }
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long before = mx.getThreadAllocatedBytes(Thread.currentThread().getId());
        for (int k = 0; k < 10000; k++) {
            eq.derivative(0.01 * k, g, d, ws);
        }
        long after = mx.getThreadAllocatedBytes(Thread.currentThread().getId());
        // 10 000 calls: any per-call allocation would show as ≥ 160 kB; allow the measuring call's own few bytes
        assertTrue(after - before < 4096, "allocated " + (after - before) + " bytes");
    }

    @Test
    void backwardRunsCancellationAndSamples() {
        Spin s = Spin.of(1);
        WeiNorman chart = WeiNorman.of(List.of(s.plus(), s.z(), s.minus()));
        Hamiltonian h = Hamiltonian.builder(3).term(0.7, s.z()).term(s.x(), Drive.cosine(0.9, 1.1, 0)).build();
        Evolution fwd = WnTesting.wn(chart, h, 0, 2, 1e-12);
        Evolution back = WnTesting.wn(chart, h, 2, 0, 1e-12);
        // U(0, 2) = U(2, 0)^{-1} = U(2, 0)† (common practice)
        assertTrue(WnTesting.maxDiff(fwd.propagator().dagger(), back.propagator()) < 1e-9);
        Evolution cancelled = Evolve.of(h).over(0, 2).scheme(Scheme.weiNorman(chart)).monitor((f, c) -> false).run();
        assertTrue(!cancelled.status().isSuccess());
        // sample times: coordinates and (re-anchored) propagators recorded in order, the end time last
        CoordinateRun run = chart.integrate(h, 0, 2, 1e-12, new double[]{0.5, 1.0, 1.5}, (f, c) -> true);
        assertEquals(4, run.coordinates.size());
        assertEquals(4, run.propagators.size());
        assertEquals(2.0, run.times[3]);
        assertTrue(WnTesting.maxDiff(WnTesting.reference(h, 0, 1.0), run.propagators.get(1)) < 1e-9);
    }

    @Test
    void badInput() {
        // non-closed: −iσx/2, −iσy/2 bracket to −iσz/2
        Operator ax = Pauli.x().timesI().scale(-0.5), ay = Pauli.y().timesI().scale(-0.5);
        InvalidInputException nc = assertThrows(InvalidInputException.class, () -> WeiNorman.of(List.of(ax, ay)));
        assertEquals(Reason.NOT_CLOSED, nc.reason());
        assertTrue(nc.getMessage().contains("orderedBasis") && nc.getMessage().contains("[X1, X2]"), nc.getMessage());
        InvalidInputException dep = assertThrows(InvalidInputException.class,
                () -> WeiNorman.of(List.of(ax, ax.scale(2))));
        assertEquals(Reason.OUT_OF_RANGE, dep.reason());
        assertTrue(dep.getMessage().contains("X2"), dep.getMessage());
        assertEquals(Reason.EMPTY, assertThrows(InvalidInputException.class, () -> WeiNorman.of(List.of())).reason());
        assertEquals(Reason.NULL, assertThrows(InvalidInputException.class,
                () -> WeiNorman.of((List<Operator>) null)).reason());
        InvalidInputException dim = assertThrows(InvalidInputException.class,
                () -> WeiNorman.of(List.of(SP, Spin.of(1).plus())));
        assertEquals(Reason.DIMENSION_MISMATCH, dim.reason());
        assertTrue(dim.getMessage().contains("orderedBasis[1]") && dim.getMessage().contains("3"), dim.getMessage());
        // Hamiltonian outside the span: the Borel chart (σ+, σz) cannot carry σx
        WeiNorman borel = WeiNorman.of(List.of(SP, Pauli.z()));
        InvalidInputException out = assertThrows(InvalidInputException.class,
                () -> borel.equations(Hamiltonian.builder(2).term(0.3, Pauli.z()).term(1.0, Pauli.x()).build()));
        assertEquals(Reason.UNSUPPORTED, out.reason());
        assertTrue(out.getMessage().contains("h:") && out.getMessage().contains("term 1"), out.getMessage());
        WeiNorman chart = WeiNorman.of(List.of(SP, Pauli.z(), SM));
        InvalidInputException hd = assertThrows(InvalidInputException.class,
                () -> chart.equations(Hamiltonian.constant(Spin.of(1).z())));
        assertEquals(Reason.DIMENSION_MISMATCH, hd.reason());
        // coordinate arrays of the wrong length or with non-finite entries
        InvalidInputException len = assertThrows(InvalidInputException.class,
                () -> chart.propagator(new Complex[]{Complex.ZERO, Complex.ONE}));
        assertEquals(Reason.DIMENSION_MISMATCH, len.reason());
        assertTrue(len.getMessage().contains("g") && len.getMessage().contains("2"), len.getMessage());
        InvalidInputException nan = assertThrows(InvalidInputException.class,
                () -> chart.propagator(new Complex[]{Complex.ZERO, Complex.NaN, Complex.ZERO}));
        assertEquals(Reason.NOT_FINITE, nan.reason());
        assertTrue(nan.getMessage().contains("g[1]"), nan.getMessage());
        WeiNormanEquations eq = chart.equations(Hamiltonian.constant(Pauli.x()));
        assertEquals(Reason.DIMENSION_MISMATCH, assertThrows(InvalidInputException.class,
                () -> eq.derivative(0, new Complex[4])).reason());
        assertEquals(Reason.NOT_FINITE, assertThrows(InvalidInputException.class,
                () -> eq.derivative(Double.NaN, new Complex[]{Complex.ZERO, Complex.ZERO, Complex.ZERO})).reason());
        assertEquals(Reason.OUT_OF_RANGE, assertThrows(InvalidInputException.class,
                () -> chart.withReanchorLimits(0.5, 10)).reason());
        assertEquals(Reason.UNSUPPORTED, assertThrows(InvalidInputException.class,
                () -> borel.coordinates(Pauli.x())).reason());
    }
}
