package org.liepath.integrators;

/**
 * Called after every accepted step of an evolution, on the integrating thread (keep it quick). An observer that
 * throws is not called again; the run goes on and records the failure in {@link Stats#observerFailure()} and in the
 * status message.
 */
@FunctionalInterface
public interface StepObserver {
    /**
     * @param t          the time reached by the step
     * @param dt         the signed length of the step
     * @param localError the local error estimate of the step, relative to the Frobenius norm of the state (NaN for
     *                   fixed steps and for the reference integrator)
     */
    void onStep(double t, double dt, double localError);
}
