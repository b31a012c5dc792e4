package org.liepath.integrators.internal;

import org.junit.jupiter.api.Test;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;

import java.util.stream.IntStream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The systems of the last Hamiltonian are shared between runs; sharing never mixes up two Hamiltonians. */
class LinearSystemSharingTest {
    private static Hamiltonian ladder(double e2) {
        Operator x01 = Operator.unit(3, 0, 1).plus(Operator.unit(3, 1, 0));
        return Hamiltonian.builder(3).term(1.0, Operator.diagonal(0, 1, e2)).term(x01, Drive.cosine(0.3, 1.1)).build();
    }

    @Test
    void theSameHamiltonianSharesItsSystemsAndAnotherGetsItsOwn() {
        Hamiltonian a = ladder(2.3), b = ladder(2.3);
        assertSame(LinearSystem.of(a), LinearSystem.of(a));
        assertSame(LinearSystem.interaction(a), LinearSystem.interaction(a));
        // equal but distinct Hamiltonians are keyed by identity: no equality test per run
        assertNotSame(LinearSystem.of(a), LinearSystem.of(b));
        assertNotSame(LinearSystem.of(a), LinearSystem.interaction(a));
    }

    @Test
    void largeSystemsAreNotKept() {
        // a Liouville-space system beyond SHARE_MAX_DIM is rebuilt per run rather than held
        Operator z = Operator.diagonal(java.util.stream.IntStream.range(0, 9).mapToDouble(i -> i).toArray());
        org.liepath.core.Lindbladian l = org.liepath.core.Lindbladian.builder(Hamiltonian.builder(9).term(1.0, z).build())
                .jump(0.1, Operator.unit(9, 0, 1)).build();
        assertTrue(LinearSystem.of(l).dim() > LinearSystem.SHARE_MAX_DIM);
        assertNotSame(LinearSystem.of(l), LinearSystem.of(l));
    }

    @Test
    void alternatingHamiltoniansGiveTheirOwnPropagators() {
        // runs of two Hamiltonians interleaved (each evicting the other's shared system) equal runs of each alone
        Hamiltonian a = ladder(2.3), b = ladder(0.7);
        Scheme s = Scheme.magnus6().inInteractionPicture();
        Operator ua = Evolve.of(a).over(0, 3).scheme(s).steps(40).run().propagator();
        Operator ub = Evolve.of(b).over(0, 3).scheme(s).steps(40).run().propagator();
        for (int k = 0; k < 3; k++) {
            assertArrayEquals(ua.reArray(), Evolve.of(a).over(0, 3).scheme(s).steps(40).run().propagator().reArray(), 0.0);
            assertArrayEquals(ub.reArray(), Evolve.of(b).over(0, 3).scheme(s).steps(40).run().propagator().reArray(), 0.0);
        }
        // and from many threads at once, with the cache contended, bit for bit
        double[][] got = IntStream.range(0, 64).parallel()
                .mapToObj(i -> Evolve.of(i % 2 == 0 ? a : b).over(0, 3).scheme(s).steps(40).run().propagator().imArray())
                .toArray(double[][]::new);
        for (int i = 0; i < got.length; i++) {
            assertArrayEquals((i % 2 == 0 ? ua : ub).imArray(), got[i], 0.0, "run " + i);
        }
    }

    @Test
    void aPackedOnlyFrameRefusesPlanarCombinations() {
        LinearSystem sys = LinearSystem.interaction(ladder(2.3));
        InteractionFrame f = new InteractionFrame(sys, 2, true, true);
        f.phases(0.1, Tables.GAUSS2);
        double[][] coef = {{1.0}, {1.0}};
        assertThrows(IllegalStateException.class,
                () -> f.combination(1.0, new double[]{1, 1}, coef, new double[9], new double[9]));
    }
}
