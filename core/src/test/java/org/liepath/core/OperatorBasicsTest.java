package org.liepath.core;

import org.apache.commons.math3.complex.Complex;
import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.junit.jupiter.api.Test;
import org.liepath.testing.Seeds;

import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Operator, StateVector, HilbertSpace and Levels basics: construction, access, equality, printing, EJML interop. */
class OperatorBasicsTest {

    @Test
    void factoriesCopyTheirInputAndAccessorsCopyTheirOutput() {
        double[][] re = {{1, 2}, {3, 4}}, im = {{0, -1}, {1, 0}};
        Operator a = Operator.of(re, im);
        re[0][0] = 99;
        im[1][0] = 99;
        assertEquals(1.0, a.re(0, 0), 0);
        assertEquals(1.0, a.im(1, 0), 0);
        assertEquals(new Complex(2, -1), a.get(0, 1));
        double[] planar = a.reArray();
        planar[0] = 7;
        assertEquals(1.0, a.re(0, 0), 0);
        assertArrayEquals(new double[]{1, 2, 3, 4}, a.reArray(), 0);
        assertArrayEquals(new double[]{0, -1, 1, 0}, a.imArray(), 0);
        assertArrayEquals(new double[]{3, 4}, a.reRows()[1], 0);
        assertArrayEquals(new double[]{1, 0}, a.imRows()[1], 0);
        double[] outR = new double[5], outI = new double[5];
        a.copyTo(outR, outI);
        assertArrayEquals(new double[]{1, 2, 3, 4, 0}, outR, 0);
        double[] pr = {1, 0, 0, 1};
        Operator p = Operator.ofPlanar(2, pr, new double[4]);
        pr[0] = 5;
        assertEquals(Operator.identity(2), p);
        assertEquals(Operator.real(re).dim(), 2);
    }

    @Test
    void elementaryFactories() {
        assertEquals(Operator.real(new double[][]{{0, 1, 0}, {0, 0, 0}, {0, 0, 0}}), Operator.unit(3, 0, 1));
        assertEquals(Operator.real(new double[][]{{2, 0}, {0, -3}}), Operator.diagonal(2, -3));
        assertEquals(Operator.identity(3), Operator.identity(3).times(Operator.identity(3)));
        assertEquals(Operator.zero(2), Operator.identity(2).minus(Operator.identity(2)));
        StateVector a = StateVector.of(new double[]{1, 0}, new double[]{0, 2}), b = StateVector.real(3, 4);
        // |a⟩⟨b| has entries a_i conj(b_j)
        Operator o = Operator.outer(a, b);
        assertEquals(new Complex(0, 6), o.get(1, 0));
        assertEquals(new Complex(4, 0), o.get(0, 1));
        assertEquals(Operator.unit(2, 1, 1), Levels.projector(2, 1));
        assertEquals(Operator.unit(4, 2, 3), Levels.unit(4, 2, 3));
    }

    @Test
    void scalarFunctionsOnKnownMatrices() {
        Operator a = Operator.of(new double[][]{{1, 2}, {-3, 4}}, new double[][]{{1, 0}, {0, -2}});
        assertEquals(new Complex(5, -1), a.trace());
        // Frobenius: sqrt(1+1 + 4 + 9 + 16+4) = sqrt(35); 1-norm: max(|1+i| + 3, 2 + |4−2i|)
        assertEquals(Math.sqrt(35), a.norm(), 1e-15);
        assertEquals(Math.max(Math.sqrt(2) + 3, 2 + Math.sqrt(20)), a.norm1(), 1e-15);
        assertEquals(Math.sqrt(35), a.distance(Operator.zero(2)), 1e-15);
        assertEquals(new Complex(35, 0), a.inner(a));
        assertEquals(a.scale(new Complex(0, 1)), a.timesI());
        assertEquals(a.scale(new Complex(2, 0)), a.scale(2));
        assertFalse(a.isHermitian(0.1));
        Operator h = a.plus(a.dagger());
        assertTrue(h.isHermitian(0));
        assertEquals(0.0, h.hermitianDefect(), 0);
        // tolerance is relative to max(1, ‖A‖_F): a perturbation of 1e-10 passes at tol 1e-9, fails at 1e-11
        Operator nearly = h.plus(Operator.unit(2, 0, 1).scale(1e-10));
        assertTrue(nearly.isHermitian(1e-9));
        assertFalse(nearly.isHermitian(1e-11));
        assertTrue(h == h.requireHermitian("h"));
    }

    @Test
    void normsNeitherOverflowNorUnderflow() {
        // a plain sum of squares overflows above ~1e154 and underflows below ~1e-154 (Higham 2002, §27.8 [M]);
        // the expected values are exact up to the rounding of √2
        double r2 = Math.sqrt(2);
        assertEquals(r2 * 1e200, Operator.diagonal(1e200, 1e200).norm(), 1e-15 * r2 * 1e200);
        assertEquals(r2 * 1e-200, Operator.diagonal(1e-200, -1e-200).norm(), 1e-15 * r2 * 1e-200);
        assertEquals(5e-170, Operator.of(new double[][]{{3e-170}}, new double[][]{{4e-170}}).norm(), 1e-15 * 5e-170);
        assertEquals(0.0, Operator.zero(3).norm(), 0);
        assertEquals(2 * r2 * 1e200, Operator.diagonal(1e200, 1e200).distance(Operator.diagonal(-1e200, -1e200)),
                1e-15 * 2 * r2 * 1e200);
        assertEquals(2e300, Operator.diagonal(1e300).distance(Operator.diagonal(-1e300)), 1e285);
        // ‖A − A†‖_F for huge entries, and a huge non-Hermitian matrix is not reported Hermitian
        Operator upper = Operator.unit(2, 0, 1).scale(1e300);
        assertEquals(r2 * 1e300, upper.hermitianDefect(), 1e-15 * r2 * 1e300);
        assertFalse(upper.isHermitian(1e-3));
        StateVector tiny = StateVector.real(1e-200, 1e-200);
        assertEquals(r2 * 1e-200, tiny.norm(), 1e-15 * r2 * 1e-200);
        StateVector unit = StateVector.real(3e-320, 4e-320).normalized(); // subnormal input
        assertEquals(1.0, unit.norm(), 1e-2, "subnormal components carry few digits");
        assertEquals(r2 * 1e200, StateVector.real(1e200, 0).distance(StateVector.real(0, -1e200)), 1e-15 * r2 * 1e200);
    }

    @Test
    void powerOnAKnownMatrix() {
        // [[1,1],[0,1]]^k = [[1,k],[0,1]] and N_3^3 = 0 for the nilpotent Jordan block
        Operator j = Operator.real(new double[][]{{1, 1}, {0, 1}});
        assertEquals(Operator.real(new double[][]{{1, 37}, {0, 1}}), j.power(37));
        assertEquals(Operator.identity(2), j.power(0));
        assertEquals(j, j.power(1));
        Operator n3 = Operator.real(new double[][]{{0, 1, 0}, {0, 0, 1}, {0, 0, 0}});
        assertEquals(Operator.unit(3, 0, 2), n3.power(2));
        assertEquals(Operator.zero(3), n3.power(3));
        // e^{iθσx} power: (iσx)^2 = −I
        assertEquals(Operator.identity(2).scale(-1), Pauli.x().timesI().power(2));
    }

    @Test
    void equalityIsNumericAndHashConsistent() {
        Operator z = Operator.zero(2), negZ = Operator.zero(2).scale(-1);
        // −1·0 = −0.0 entrywise; numerically the same operator (Arrays.equals would say otherwise)
        assertEquals(z, negZ);
        assertEquals(z.hashCode(), negZ.hashCode());
        assertNotEquals(Operator.zero(2), Operator.zero(3));
        assertNotEquals(Operator.identity(2), Pauli.z());
        assertNotEquals(Pauli.x(), Pauli.x().timesI(), "differs in the imaginary part only");
        assertFalse(Pauli.x().equals("X"));
        Set<Operator> set = new HashSet<>(List.of(Pauli.x(), Pauli.y(), Pauli.z(), Levels.gellMann(2).get(0)));
        assertEquals(3, set.size());
        StateVector s = StateVector.real(0, 1), negS = StateVector.real(-0.0, 1);
        assertEquals(s, negS);
        assertEquals(s.hashCode(), negS.hashCode());
        assertNotEquals(StateVector.unit(2, 0), StateVector.unit(3, 0));
    }

    @Test
    void toStringIsReadable() {
        assertEquals("Operator 2x2\n[[0, -1i]\n [1i, 0]]", Pauli.y().toString());
        assertEquals("Operator 2x2\n[[0.5000, 1 + 2i]\n [-0.2500 - 0.1000i, -3]]",
                Operator.of(new double[][]{{0.5, 1}, {-0.25, -3}}, new double[][]{{0, 2}, {-0.1, 0}}).toString());
        // a matrix of tiny numbers still shows them; rounding noise next to O(1) entries prints as 0
        assertTrue(Operator.identity(2).scale(1e-20).toString().contains("1.000e-20"),
                Operator.identity(2).scale(1e-20).toString());
        assertEquals("Operator 1x1\n[[1]]", Operator.real(new double[][]{{1 + 1e-17}}).plus(
                Operator.of(new double[][]{{0}}, new double[][]{{1e-17}})).toString());
        String big = Operator.identity(10).toString();
        assertTrue(big.contains("…") && big.contains("(2 more rows)"), big);
        assertEquals(10, big.split("\n").length, "header, 8 rows, summary");
        assertEquals("StateVector 2 [0.7071, 0.7071i]", StateVector.of(new double[]{Math.sqrt(0.5), 0},
                new double[]{0, Math.sqrt(0.5)}).toString());
        assertTrue(StateVector.unit(20, 0).toString().endsWith(", … (4 more)]"));
        assertEquals("HilbertSpace[2, 3] (dimension 6)", HilbertSpace.of(2, 3).toString());
    }

    @Test
    void ejmlRoundTripAndProductsAgree() {
        // EJML (a general-purpose library) as the independent reference for the complex product and inverse
        Random r = new Random(3);
        for (int n : new int[]{1, 2, 3, 7}) {
            Operator a = Seeds.randomMatrix(r, n), b = Seeds.randomMatrix(r, n);
            ZMatrixRMaj ea = a.toEjml(), eb = b.toEjml();
            assertEquals(a, Operator.fromEjml(ea), "round trip");
            assertEquals(a.get(n - 1, 0).getImaginary(), ea.getImag(n - 1, 0), 0);
            ZMatrixRMaj prod = new ZMatrixRMaj(n, n);
            CommonOps_ZDRM.mult(ea, eb, prod);
            assertTrue(Operator.fromEjml(prod).distance(a.times(b)) <= 1e-14 * a.norm() * b.norm());
            ZMatrixRMaj inv = new ZMatrixRMaj(n, n);
            assertTrue(CommonOps_ZDRM.invert(ea, inv));
            // A·A⁻¹ = I through our product (conditioning of a random 7×7 is modest: tolerance 1e-10)
            assertTrue(a.times(Operator.fromEjml(inv)).distance(Operator.identity(n)) <= 1e-10);
            // EJML's conjugate transpose equals dagger
            ZMatrixRMaj h = new ZMatrixRMaj(n, n);
            CommonOps_ZDRM.transposeConjugate(ea, h);
            assertEquals(a.dagger(), Operator.fromEjml(h));
        }
        // fromEjml copies
        ZMatrixRMaj m = new ZMatrixRMaj(1, 1);
        m.set(0, 0, 2, 3);
        Operator o = Operator.fromEjml(m);
        m.set(0, 0, 0, 0);
        assertEquals(new Complex(2, 3), o.get(0, 0));
    }

    @Test
    void stateVectorBasics() {
        StateVector psi = StateVector.of(new double[]{3, 0}, new double[]{0, 4});
        assertEquals(5.0, psi.norm(), 0);
        assertEquals(new Complex(0, 4), psi.get(1));
        assertEquals(16.0, psi.probability(1), 0);
        assertArrayEquals(new double[]{9, 16}, psi.probabilities(), 0);
        assertEquals(3.0, psi.re(0), 0);
        assertEquals(4.0, psi.im(1), 0);
        // ⟨ψ|φ⟩ is conjugate-linear in ψ: ⟨i e1|e1⟩ = −i
        StateVector ie1 = StateVector.of(new double[2], new double[]{0, 1});
        assertEquals(new Complex(0, -1), ie1.inner(StateVector.unit(2, 1)));
        // ⟨ψ|σz|ψ⟩ = 9 − 16
        assertEquals(new Complex(-7, 0), psi.expectation(Pauli.z()));
        assertEquals(StateVector.unit(2, 1), StateVector.unit(2, 0).apply(Pauli.x()));
        assertEquals(StateVector.of(new double[]{0, -4}, new double[]{3, 0}), psi.scale(new Complex(0, 1)));
        assertEquals(StateVector.real(0, 0, 1, 0), StateVector.unit(2, 1).kron(StateVector.unit(2, 0)));
        assertEquals(5.0, psi.distance(StateVector.real(0, 0)), 0);
        double[] r = new double[3], i = new double[3];
        psi.copyTo(r, i);
        assertArrayEquals(new double[]{3, 0, 0}, r, 0);
        assertArrayEquals(new double[]{0, 4, 0}, i, 0);
        assertEquals(Operator.of(new double[][]{{9, 0}, {0, 16}}, new double[][]{{0, -12}, {12, 0}}), psi.toDensity());
    }

    @Test
    void partialTraceOfAnEntangledState() {
        // Bell state (|00⟩ + |11⟩)/√2: each reduced state is I/2 (Nielsen & Chuang 2000, §2.4.3, eq. (2.184) [M])
        HilbertSpace two = HilbertSpace.of(2, 2);
        StateVector bell = two.basis(0, 0).plus(two.basis(1, 1)).normalized();
        Operator rho = bell.toDensity();
        // (1/√2)² rounds to 0.5 + 1 ulp: a few ulps of tolerance
        assertTrue(two.partialTrace(rho, 0).distance(Operator.identity(2).scale(0.5)) <= 1e-15);
        assertTrue(two.partialTrace(rho, 1).distance(Operator.identity(2).scale(0.5)) <= 1e-15);
        assertEquals(rho, two.partialTrace(rho), "tracing nothing");
        assertTrue(two.partialTrace(rho, 0, 1).distance(Operator.real(new double[][]{{1}})) <= 1e-15);
        // three subsystems: tr over the middle one of A⊗B⊗C is trB·A⊗C
        HilbertSpace hs = HilbertSpace.of(2, 3, 2);
        Random r = new Random(9);
        Operator a = Seeds.randomMatrix(r, 2), b = Seeds.randomMatrix(r, 3), c = Seeds.randomMatrix(r, 2);
        Operator reduced = hs.partialTrace(hs.product(a, b, c), 1);
        assertTrue(reduced.distance(a.kron(c).scale(b.trace())) <= 1e-13 * a.norm() * b.norm() * c.norm());
        assertEquals(4, reduced.dim());
        assertArrayEquals(new int[]{2, 3, 2}, hs.dims());
        assertEquals(3, hs.size());
        assertEquals(3, hs.dim(1));
    }

    @Test
    void harmonicLadderOperator() {
        // a|k⟩ = √k|k−1⟩: a†a = diag(0, 1, …, d−1) and [a, a†] = I − d|d−1⟩⟨d−1| in the truncation (common practice)
        int d = 6;
        Operator a = Levels.annihilation(d);
        double[] diag = new double[d];
        for (int k = 0; k < d; k++) {
            diag[k] = k;
        }
        assertTrue(a.dagger().times(a).distance(Operator.diagonal(diag)) <= 1e-14);
        Operator comm = a.commutator(a.dagger());
        assertTrue(comm.distance(Operator.identity(d).minus(Operator.unit(d, d - 1, d - 1).scale(d))) <= 1e-14);
    }
}
