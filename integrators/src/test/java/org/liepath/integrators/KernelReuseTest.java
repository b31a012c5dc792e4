package org.liepath.integrators;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Small systems reuse their thread's last kernel (Evolve.REUSE_MAX_DIM): a run after another, with the same or a
 * different step, equals a run on a fresh thread-state bit for bit, with the same statistics, and a run nested in a
 * drive of another run does not disturb either.
 */
class KernelReuseTest {
    static List<Scheme> schemes() {
        return Fixtures.steppable();
    }

    private static Hamiltonian ladder(Drive d) {
        Operator x01 = Operator.unit(3, 0, 1).plus(Operator.unit(3, 1, 0));
        Operator x12 = Operator.unit(3, 1, 2).plus(Operator.unit(3, 2, 1));
        return Hamiltonian.builder(3).term(1.0, Operator.diagonal(0, 1, 2.3)).term(x01, d)
                .term(x12, Drive.sine(0.2, 0.7, 0)).build();
    }

    private static void assertSameRun(Evolution a, Evolution b, String what) {
        assertArrayEquals(a.propagator().reArray(), b.propagator().reArray(), 0.0, what);
        assertArrayEquals(a.propagator().imArray(), b.propagator().imArray(), 0.0, what);
        assertEquals(a.stats().acceptedSteps(), b.stats().acceptedSteps(), what + " steps");
        assertEquals(a.stats().rejectedSteps(), b.stats().rejectedSteps(), what + " rejected");
        assertEquals(a.stats().evaluations(), b.stats().evaluations(), what + " evaluations");
        assertEquals(a.stats().exponentials(), b.stats().exponentials(), what + " exponentials");
        assertEquals(a.stats().commutators(), b.stats().commutators(), what + " commutators");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void repeatedRunsEqualTheFirstBitForBit(Scheme s) {
        Hamiltonian h = ladder(Drive.cosine(0.3, 1.1));
        // the first run of each kind builds its kernel; the later ones reuse it, in another order of step sizes
        Evolution fixed = Evolve.of(h).over(0, 2).scheme(s).steps(17).run();
        Evolution other = Evolve.of(h).over(0, 2).scheme(s).steps(5).run();
        Evolution adaptive = Evolve.of(h).over(0, 2).scheme(s).tolerance(1e-9).run();
        for (int k = 0; k < 2; k++) {
            assertSameRun(fixed, Evolve.of(h).over(0, 2).scheme(s).steps(17).run(), s.name() + " fixed");
            assertSameRun(adaptive, Evolve.of(h).over(0, 2).scheme(s).tolerance(1e-9).run(), s.name() + " adaptive");
            assertSameRun(other, Evolve.of(h).over(0, 2).scheme(s).steps(5).run(), s.name() + " 5 steps");
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void repeatedOpenSystemRunsEqualTheFirstBitForBit(Scheme s) {
        if (s.isInteractionPicture()) {
            return; // Lindbladians are refused in the interaction picture (tested elsewhere)
        }
        // a decaying driven qubit: Liouville dimension 4, within the reuse bound
        Operator x = Operator.unit(2, 0, 1).plus(Operator.unit(2, 1, 0));
        Hamiltonian h = Hamiltonian.builder(2).term(1.0, Operator.diagonal(0, 1)).term(x, Drive.cosine(0.3, 1.1)).build();
        Lindbladian l = Lindbladian.builder(h).jump(0.2, Operator.unit(2, 0, 1)).build();
        Evolution first = Evolve.of(l).over(0, 2).scheme(s).steps(13).run();
        for (int k = 0; k < 2; k++) {
            Evolution again = Evolve.of(l).over(0, 2).scheme(s).steps(13).run();
            assertArrayEquals(first.channel().matrix().reArray(), again.channel().matrix().reArray(), 0.0, s.name());
            assertArrayEquals(first.channel().matrix().imArray(), again.channel().matrix().imArray(), 0.0, s.name());
            assertEquals(first.stats().exponentials(), again.stats().exponentials(), s.name());
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void aRunNestedInADriveLeavesBothRunsIntact(Scheme s) {
        Hamiltonian inner = ladder(Drive.cosine(0.3, 1.1));
        Evolution innerAlone = Evolve.of(inner).over(0, 1).scheme(s).steps(4).run();
        double[] seen = new double[1];
        // a drive that runs an evolution of another Hamiltonian with the same scheme each time it is evaluated
        Drive nesting = t -> {
            seen[0] = Evolve.of(inner).over(0, 1).scheme(s).steps(4).run().propagator().reArray()[0];
            return 0.3 * Math.cos(1.1 * t);
        };
        Hamiltonian outer = ladder(nesting);
        Evolution plain = Evolve.of(ladder(Drive.cosine(0.3, 1.1))).over(0, 2).scheme(s).steps(9).run();
        Evolution nested = Evolve.of(outer).over(0, 2).scheme(s).steps(9).run();
        assertArrayEquals(plain.propagator().reArray(), nested.propagator().reArray(), 0.0, s.name());
        assertEquals(innerAlone.propagator().reArray()[0], seen[0], 0.0, s.name() + " inner");
        assertSameRun(innerAlone, Evolve.of(inner).over(0, 1).scheme(s).steps(4).run(), s.name() + " inner after");
    }
}
