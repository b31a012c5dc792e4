package org.liepath.integrators;

import org.junit.jupiter.api.Test;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A Wei–Norman run sampled at given times gives the propagator at each of them, through re-anchorings, equal to the
 * reference integrator's (the exact propagator to its tolerance).
 */
class WeiNormanTrajectoryTest {
    @Test
    void sampledPropagatorsMatchTheReferenceThroughReanchoring() {
        // a resonant rotating drive (ω = ω0 = 0.6, Rabi frequency 0.5) through several π rotations: U11 passes through
        // 0 at 0.5·t = π, 3π, so the (σ+, σz, σ−) chart must re-anchor (I.I. Rabi, Phys. Rev. 51 (1937) 652)
        Hamiltonian h = Hamiltonian.builder(2).term(0.3, Pauli.z()).term(Pauli.x(), Drive.cosine(0.25, 0.6))
                .term(Pauli.y(), Drive.sine(0.25, 0.6, 0.0)).build();
        WeiNorman chart = WeiNorman.of(List.of(Spin.of(0.5).plus(), Spin.of(0.5).z(), Spin.of(0.5).minus()));
        double[] samples = {2.0, 5.0, 9.0, 14.0};
        Evolution wn = Evolve.of(h).over(0, 15).scheme(Scheme.weiNorman(chart)).tolerance(1e-11).sampleAt(samples).run();
        assertTrue(wn.status().isSuccess(), wn.status().toString());
        Timeline traj = wn.timeline();
        assertArrayEquals(new double[]{0.0, 2.0, 5.0, 9.0, 14.0, 15.0}, traj.times(), 0.0);
        assertTrue(traj.propagator(0).distance(Operator.identity(2)) == 0.0);
        for (int k = 1; k < traj.size(); k++) {
            double t = traj.time(k);
            Operator ref = Evolve.of(h).over(0, t).scheme(Scheme.reference()).tolerance(1e-12).run().propagator();
            // both runs are accurate to ~1e-10 at these tolerances (the reference's global error grows ~linearly in t)
            assertTrue(traj.propagator(k).distance(ref) < 1e-8, "t = " + t + ": " + traj.propagator(k).distance(ref));
        }
        assertTrue(wn.stats().charts() > 1, "the run should have re-anchored, charts = " + wn.stats().charts());
    }
}
