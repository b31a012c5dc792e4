package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.testing.Seeds;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.liepath.integrators.WnTesting.maxDiff;
import static org.liepath.integrators.WnTesting.reference;

/** Block Riccati (block Gauss) decomposition against full propagators. */
class BlockRiccatiTest {
    static Hamiltonian twoQubit() {
        return Hamiltonian.builder(4).term(0.5, Pauli.string("ZI")).term(0.35, Pauli.string("IZ"))
                .term(0.25, Pauli.string("ZZ")).term(Pauli.string("XI"), Drive.cosine(0.3, 1.1, 0))
                .term(Pauli.string("IX"), Drive.cosine(0.3, 1.1, 0)).build();
    }

    @Test
    void twoQubitPublishedPropagatorNEquals4() {
        // U(5) for H = 0.5 ZI + 0.35 IZ + 0.25 ZZ + 0.3 cos(1.1t)(XI + IX), computed offline with mpmath (first
        // column confirmed by DP853 at rtol 1e-13 to 7e-15); block sizes 2 + 2.
        double[][] re = {{0.530674990747588, 0.481186936839273, 0.499452790312531, -0.19470272126088},
            {0.0847395910692177, 0.577141612092448, -0.201980647642352, -0.281548089516693},
            {0.435364395239593, -0.194507567847571, -0.463525553992438, -0.0871569166951909},
            {0.0131891994822694, -0.266266807265303, -0.128151068539455, -0.857941807905617}};
        double[][] im = {{0.328334197634917, -0.24939469673859, 0.122288162533346, -0.12052174824172},
            {-0.523540445645144, 0.440868300913766, -0.16440398462542, -0.210174036043005},
            {-0.224534981254047, -0.200513066828178, 0.656024974853693, -0.170827886097358},
            {0.298618892412242, 0.172821935310792, -0.078232091669057, 0.226451464664281}};
        Operator ref = Operator.of(re, im);
        BlockRiccati.Result r = BlockRiccati.of(twoQubit(), 2).withReanchoring().run(0, 5, 1e-12);
        assertTrue(r.isSuccess(), r.toString());
        // the table has 15 digits; the factor integration at 1e-12 over t = 5 adds a few 1e-12
        assertTrue(maxDiff(ref, r.propagator()) <= 1e-10, "error " + maxDiff(ref, r.propagator()));
        // recursive decomposition down to 1×1 blocks agrees as well
        BlockRiccati.Result rr = BlockRiccati.of(twoQubit(), 2).recursive(1).withReanchoring().run(0, 5, 1e-12);
        assertTrue(rr.isSuccess(), rr.toString());
        assertTrue(maxDiff(ref, rr.propagator()) <= 1e-10, "recursive error " + maxDiff(ref, rr.propagator()));
    }

    @Test
    void sixLevelsThreePlusThreeTimeDependent() {
        Random rnd = new Random(5);
        Operator h0 = Seeds.randomHermitian(rnd, 6).scale(0.3), h1 = Seeds.randomHermitian(rnd, 6).scale(0.2);
        Hamiltonian h = Hamiltonian.builder(6).term(1.0, h0).term(h1, Drive.cosine(1.0, 1.3, 0.4)).build();
        Operator ref = reference(h, 0, 2);
        BlockRiccati.Result r = BlockRiccati.of(h, 3).withReanchoring().run(0, 2, 1e-12);
        assertTrue(r.isSuccess(), r.toString());
        assertTrue(maxDiff(ref, r.propagator()) <= 1e-9, "error " + maxDiff(ref, r.propagator()));
        BlockRiccati.Result rr = BlockRiccati.of(h, 3).recursive(1).withReanchoring().run(0, 2, 1e-12);
        assertTrue(rr.isSuccess(), rr.toString());
        assertTrue(maxDiff(ref, rr.propagator()) <= 1e-9, "recursive error " + maxDiff(ref, rr.propagator()));
        // backward run gives the inverse propagator
        BlockRiccati.Result back = BlockRiccati.of(h, 3).withReanchoring().run(2, 0, 1e-12);
        assertTrue(maxDiff(ref.dagger(), back.propagator()) <= 1e-9);
    }

    @Test
    void factorsReproduceThePropagatorAndTheRiccatiEquation() {
        // Z = U12 U22⁻¹ (the inverse map of the Gauss factorisation); differentiating with U' = AU gives
        // Z' = A12 + A11 Z − Z A22 − Z A21 Z, checked here against U' = AU at the final time (by hand).
        Hamiltonian h = twoQubit();
        double t = 1.2;
        BlockRiccati br = BlockRiccati.of(h, 2);
        BlockRiccati.Result r = br.run(0, t, 1e-12);
        assertTrue(r.isSuccess(), r.toString());
        Operator u = r.propagator();
        Complex[][] z = r.z(), q = r.q();
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                assertTrue(q[i][j].subtract(u.get(2 + i, 2 + j)).abs() <= 1e-14, "Q = U22");
            }
        }
        // Z' from U' = AU: Z' = (U12' − Z U22') U22⁻¹
        Operator du = h.at(t).timesI().scale(-1).times(u);
        Complex[][] dz = br.riccatiDerivative(t, z);
        Complex[][] lhs = new Complex[2][2];
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                Complex s = du.get(i, 2 + j);
                for (int k = 0; k < 2; k++) {
                    s = s.subtract(z[i][k].multiply(du.get(2 + k, 2 + j)));
                }
                lhs[i][j] = s;
            }
        }
        // dz · U22 must equal lhs
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                Complex s = Complex.ZERO;
                for (int k = 0; k < 2; k++) {
                    s = s.add(dz[i][k].multiply(u.get(2 + k, 2 + j)));
                }
                assertTrue(s.subtract(lhs[i][j]).abs() <= 1e-10, "Z' entry " + i + j);
            }
        }
    }

    @Test
    void scalarCaseIsTheSu2RiccatiCoordinate() {
        // N = 2, n = 1: Z is the coordinate g1 of the chart exp(g1σ+)exp(g2σz)exp(g3σ−); constant-field worked
        // check Δ = 0.7, Ω = 1.3, t = 0.9 from g1 = −iΩ sin(Et)/(2E cos(Et) + iΔ sin(Et)).
        Hamiltonian h = Hamiltonian.builder(2).term(0.35, Pauli.z()).term(0.65, Pauli.x()).build();
        BlockRiccati.Result r = BlockRiccati.of(h, 1).run(0, 0.9, 1e-12);
        assertTrue(r.isSuccess());
        Complex z = r.z()[0][0];
        assertTrue(z.subtract(new Complex(-0.22503107373987144, -0.6060328927398829)).abs() <= 1e-10, "" + z);
    }

    @Test
    void breakdownWhenU22TurnsSingularIsReported() {
        // H = (Ω/2) X⊗I flips the first qubit: U22 = cos(Ωt/2) I vanishes at Ωt = π.
        double omega = 1.3, t = 1.5 * Math.PI / omega;
        Hamiltonian h = Hamiltonian.builder(4).term(omega / 2, Pauli.string("XI")).build();
        BlockRiccati.Result r = BlockRiccati.of(h, 2).run(0, t, 1e-12);
        assertFalse(r.isSuccess());
        assertTrue(r.failure().contains("U22") && r.failure().contains("t = "), r.failure());
        assertEquals(null, r.propagator());
        BlockRiccati.Result ok = BlockRiccati.of(h, 2).withReanchoring().run(0, t, 1e-12);
        assertTrue(ok.isSuccess());
        assertTrue(ok.charts() >= 2);
        assertTrue(maxDiff(Pauli.string("XI").expMinusI(omega / 2 * t), ok.propagator()) <= 1e-9);
    }

    @Test
    void badInput() {
        Hamiltonian h = twoQubit();
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> BlockRiccati.of(h, 0));
        assertEquals(InvalidInputException.Reason.OUT_OF_RANGE, e.reason());
        assertTrue(e.getMessage().contains("split") && e.getMessage().contains("0"));
        assertThrows(InvalidInputException.class, () -> BlockRiccati.of(h, 4));
        assertThrows(InvalidInputException.class, () -> BlockRiccati.of(null, 1));
        InvalidInputException t = assertThrows(InvalidInputException.class,
                () -> BlockRiccati.of(h, 2).run(0, Double.NaN, 1e-10));
        assertEquals(InvalidInputException.Reason.NOT_FINITE, t.reason());
        assertThrows(InvalidInputException.class, () -> BlockRiccati.of(h, 2).run(0, 1, 0));
        InvalidInputException d = assertThrows(InvalidInputException.class,
                () -> BlockRiccati.of(h, 2).riccatiDerivative(0, new Complex[3][2]));
        assertEquals(InvalidInputException.Reason.DIMENSION_MISMATCH, d.reason());
        assertTrue(d.getMessage().contains("z") && d.getMessage().contains("3"));
    }
}
