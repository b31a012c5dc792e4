package org.liepath.integrators.internal;

import org.liepath.core.ProgressListener;

import java.util.ArrayList;
import java.util.List;

/**
 * The input and the outcome of one integration in the engine's own terms (planar state m×p; times; counters).
 * Mutable value holders filled by {@link Runner} and {@link ReferenceRunner}; not thread-safe, not shared.
 */
public final class Run {
    private Run() {
    }

    /** How a run ended. */
    public enum Outcome { SUCCESS, STEP_LIMIT, STEP_UNDERFLOW, NON_FINITE, DRIVE_FAILED, CANCELLED, FAILED }

    /** Called after every accepted step. */
    @FunctionalInterface
    public interface StepCallback {
        void accepted(double t, double dt, double localError);
    }

    /** What to integrate and how. */
    public static final class Spec {
        public double t0, t1;
        /** Columns of the state: m for a propagator, 1 for a vector. */
        public int p;
        /** Initial state, m×p planar (not modified). */
        public double[] x0r, x0i;
        public boolean adaptive;
        public double tolerance;
        public int steps;
        public long maxSteps;
        /** Sample times inside [t0, t1] (any order; duplicates allowed). */
        public double[] samples = new double[0];
        public boolean everyStep;
        public ProgressListener monitor = ProgressListener.NONE;
        public StepCallback observer;
    }

    /** What came out. */
    public static final class Result {
        public Outcome outcome = Outcome.SUCCESS;
        public String message = "";
        public double timeReached;
        public double[] xr, xi;
        public final List<Double> sampleTimes = new ArrayList<>();
        public final List<double[]> sampleRe = new ArrayList<>();
        public final List<double[]> sampleIm = new ArrayList<>();
        public long accepted, rejected = 0, evaluations, exponentials, commutators;
        public double errorSum = Double.NaN;
        public String monitorFailure, observerFailure;
        public long nanos;

        void record(double t, double[] re, double[] im, int len) {
            int last = sampleTimes.size() - 1;
            if (last >= 0 && sampleTimes.get(last) == t) {
                return;
            }
            sampleTimes.add(t);
            sampleRe.add(java.util.Arrays.copyOf(re, len));
            sampleIm.add(java.util.Arrays.copyOf(im, len));
        }
    }
}
