package org.liepath.integrators.internal;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.DriveException;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;
import org.liepath.testing.Seeds;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Folding of constant-drive terms into G_0 by {@link LinearSystem#of(Hamiltonian)}: the generator A(t) must be
 * −i H(t) whatever the mix of constant and driven terms, only the driven terms keep a generator of their own, and a
 * run gives the propagator of the same Hamiltonian written with its static terms summed into one.
 */
class ConstantTermFoldingTest {
    private static final double U = 0x1p-53;

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void generatorIsMinusITimesTheHamiltonian(long seed) {
        // A(t) = Σ_driven c_k(t) G_k + G_0 with G_0 = −i Σ_const c_k A_k must equal −i H(t) entry by entry, up to the
        // rounding of the two sums of at most L terms (≤ L u Σ_k |c_k| |A_k|_ij; bound with the max entry)
        Random r = new Random(seed);
        int n = 2 + r.nextInt(5), terms = 1 + r.nextInt(6);
        Hamiltonian.Builder b = Hamiltonian.builder(n);
        int constants = 0;
        double scale = 0;
        for (int k = 0; k < terms; k++) {
            Operator a = Seeds.randomHermitian(r, n);
            if (r.nextBoolean()) {
                double c = r.nextGaussian();
                b.term(c, a);
                constants++;
                scale += Math.abs(c) * a.norm();
            } else {
                b.term(a, Drive.cosine(r.nextGaussian(), 1 + r.nextDouble(), r.nextDouble()));
                scale += 2 * a.norm();
            }
        }
        Hamiltonian h = b.build();
        LinearSystem sys = LinearSystem.of(h);
        int expectedGenerators = constants >= 2 ? terms - constants + 1 : terms;
        assertEquals(expectedGenerators, sys.generators(), "generators with " + constants + " constant terms");
        double t = 3 * r.nextDouble();
        double[] c = new double[sys.terms()];
        sys.coefficients(t, c);
        double[] re = new double[n * n], im = new double[n * n];
        sys.combine(c, 1.0, re, im);
        Operator want = h.at(t);
        double tol = 4 * terms * U * scale;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                // −i (x + i y) = y − i x
                assertEquals(want.get(i, j).getImaginary(), re[i * n + j], tol);
                assertEquals(-want.get(i, j).getReal(), im[i * n + j], tol);
            }
        }
    }

    @Test
    void runsMatchTheHamiltonianWithItsStaticTermsSummed() {
        // the same H(t) written as three static terms + two drives, and as one static term + two drives (which is
        // not folded): the propagators agree to rounding for every kind of scheme
        Random r = new Random(3);
        int n = 4;
        Operator s1 = Seeds.randomHermitian(r, n), s2 = Seeds.randomHermitian(r, n), s3 = Seeds.randomHermitian(r, n);
        Operator v1 = Seeds.randomHermitian(r, n), v2 = Seeds.randomHermitian(r, n);
        Drive d1 = Drive.cosine(0.4, 1.3, 0.2), d2 = Drive.sine(0.3, 0.7, 0.0);
        Hamiltonian many = Hamiltonian.builder(n).term(1.0, s1).term(v1, d1).term(0.5, s2).term(-2.0, s3)
                .term(v2, d2).build();
        Hamiltonian one = Hamiltonian.builder(n).term(1.0, s1.plus(s2.scale(0.5)).plus(s3.scale(-2.0)))
                .term(v1, d1).term(v2, d2).build();
        assertEquals(3, LinearSystem.of(many).generators());
        for (Scheme s : java.util.List.of(Scheme.magnus4(), Scheme.magnus8(), Scheme.commutatorFree6())) {
            Operator a = Evolve.of(many).over(0, 2).scheme(s).steps(40).run().propagator();
            Operator b = Evolve.of(one).over(0, 2).scheme(s).steps(40).run().propagator();
            assertTrue(a.distance(b) < 1e-13, s.name() + ": " + a.distance(b));
        }
    }

    @Test
    void driveFailuresStillNameTheirOriginalTerm() {
        // after folding terms 0 and 2, the failing drive of term 3 must be reported as term 3
        Operator x = Operator.unit(2, 0, 1).plus(Operator.unit(2, 1, 0)), z = Operator.diagonal(1, -1);
        Drive bad = t -> {
            if (t > 0.5) {
                throw new IllegalStateException("broken");
            }
            return 1.0;
        };
        Hamiltonian h = Hamiltonian.builder(2).term(1.0, z).term(x, Drive.cosine(1, 1)).term(2.0, x)
                .term(z, bad.named("faulty")).build();
        LinearSystem sys = LinearSystem.of(h);
        assertEquals(3, sys.generators());
        double[] c = new double[sys.terms()];
        DriveException e = assertThrows(DriveException.class, () -> sys.coefficients(0.7, c));
        assertTrue(e.getMessage().contains("term 3") && e.getMessage().contains("faulty"), e.getMessage());
    }
}
