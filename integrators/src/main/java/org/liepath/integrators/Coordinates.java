package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.internal.Require;

import java.util.ArrayList;
import java.util.List;

/**
 * Wei–Norman coordinates g(t) recorded by a run with {@link Scheme#weiNorman}: one vector per sample time (the
 * requested sample times and the time reached, last), each in the chart active at that time (a chart that turned
 * singular is re-anchored; see {@link Stats#charts()}).
 *
 * <p>Immutable and thread-safe; accessors return copies.
 */
public final class Coordinates {
    private final double[] times;
    private final List<Complex[]> values;

    Coordinates(double[] times, List<Complex[]> values) {
        this.times = times.clone();
        this.values = new ArrayList<>();
        for (Complex[] g : values) {
            this.values.add(g.clone());
        }
    }

    /** @return the number of recorded coordinate vectors */
    public int size() {
        return times.length;
    }

    /** @return the recording times (a copy) */
    public double[] times() {
        return times.clone();
    }

    /**
     * @param k the index
     * @return the coordinates at recording k (a copy)
     */
    public Complex[] at(int k) {
        Require.index(k, times.length, "k");
        return values.get(k).clone();
    }

    /** @return the coordinates at the time reached (a copy) */
    public Complex[] last() {
        return at(times.length - 1);
    }

    @Override
    public String toString() {
        return "Wei–Norman coordinates at " + times.length + " times";
    }
}
