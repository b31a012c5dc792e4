package org.liepath.integrators;

import org.liepath.core.Hamiltonian;
import org.liepath.core.ProgressListener;

/**
 * Wei–Norman chart (placeholder signature; the full class replaces this file).
 */
public final class WeiNorman {
    private WeiNorman() {
    }

    /**
     * Hook used by {@link Evolve} for {@code Scheme.weiNorman(chart)}: integrates the coordinates of this chart for h
     * from t0 to t1 (t1 &lt; t0 allowed) with relative/absolute tolerance tol, recording coordinates at sampleTimes
     * (may be empty; the end time is always recorded), reporting to monitor (never null; false = cancel).
     */
    CoordinateRun integrate(Hamiltonian h, double t0, double t1, double tol, double[] sampleTimes,
                            ProgressListener monitor) {
        throw new UnsupportedOperationException("Wei–Norman charts are not implemented yet");
    }
}
