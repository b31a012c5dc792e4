package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.Operator;

import java.util.List;

/**
 * The outcome of integrating Wei–Norman coordinates over an interval (package-private hand-over from
 * {@link WeiNorman} to {@link Evolution}).
 */
final class CoordinateRun {
    /** U(t1, t0) in the chart's own representation, or null if the run failed. */
    final Operator propagator;
    /** Coordinates g at each sample time (and at t1 last), in the chart active at that time. */
    final List<Complex[]> coordinates;
    /** Times of {@link #coordinates}. */
    final double[] times;
    /** Number of charts used (1 + number of re-anchorings). */
    final int charts;
    /** Right-hand-side evaluations of the coordinate ODE. */
    final long evaluations;
    /** Accepted steps of the coordinate integrator. */
    final long steps;
    /** Null on success, otherwise a description of what went wrong (with the time). */
    final String failure;
    /** True if the run was cancelled by the monitor. */
    final boolean cancelled;
    /**
     * U(t, t0) in the chart's own representation at each time of {@link #times} (empty if not available; on success
     * the last entry is {@link #propagator}).
     */
    final List<Operator> propagators;

    CoordinateRun(Operator propagator, List<Complex[]> coordinates, double[] times, int charts, long evaluations,
                  long steps, String failure, boolean cancelled) {
        this(propagator, coordinates, times, charts, evaluations, steps, failure, cancelled, List.of());
    }

    CoordinateRun(Operator propagator, List<Complex[]> coordinates, double[] times, int charts, long evaluations,
                  long steps, String failure, boolean cancelled, List<Operator> propagators) {
        this.propagators = propagators;
        this.propagator = propagator;
        this.coordinates = coordinates;
        this.times = times;
        this.charts = charts;
        this.evaluations = evaluations;
        this.steps = steps;
        this.failure = failure;
        this.cancelled = cancelled;
    }
}
