package org.liepath.integrators.internal;

import org.liepath.core.DriveException;

/**
 * An error estimate for a run on a fixed grid of n steps, made after the run from a sample of its steps: for up to
 * {@link #SAMPLES} grid steps spread evenly over the interval, the local error of one step is estimated by step
 * doubling ({@link Kernel#trial}, the estimate adaptive runs use, scaled to the error of the full step that the run
 * took), each piece between coefficient breakpoints on its
 * own, and the mean over the sample, times n, estimates the sum of the local errors of all steps: the quantity an
 * adaptive run reports (a bound on the global error under linear accumulation of local errors).
 *
 * <p>Probe: the local errors are measured on the run's initial state. For a propagator of a Hamiltonian run that is
 * the identity, and since the Frobenius norm is unitarily invariant, ‖(Φ_h − Φ_{h/2}Φ_{h/2}) U‖ = ‖Φ_h −
 * Φ_{h/2}Φ_{h/2}‖ for every unitary U: the estimate of each sampled step is then exactly the one an adaptive run
 * would make there. For state vectors and GKLS runs the initial state stands in for the state reached.
 *
 * <p>Cost: three steps per sample (at most {@code 3·SAMPLES} steps), on a kernel of its own, so the run's counters
 * are untouched. Stateless; thread-safe as long as each call gets its own kernel.
 */
public final class FixedStepError {
    /** Grid steps sampled (all of them when the run has fewer). */
    public static final int SAMPLES = 8;

    private FixedStepError() {
    }

    /**
     * @param kernel a fresh kernel of the run's scheme on the run's system
     * @param spec the run's specification (fixed steps)
     * @return the estimate, or NaN if a drive fails or a value is not finite at a sampled step
     */
    public static double estimate(Kernel kernel, Run.Spec spec) {
        int n = spec.steps, p = spec.p, len = kernel.m * p;
        if (n <= 0) {
            return Double.NaN;
        }
        int samples = Math.min(n, SAMPLES);
        double dt = (spec.t1 - spec.t0) / n;
        double[] yr = new double[len], yi = new double[len];
        double sum = 0;
        try {
            for (int j = 0; j < samples; j++) {
                int k = (int) ((j + 0.5) * n / samples);
                double tk = spec.t0 + k * dt, end = k == n - 1 ? spec.t1 : spec.t0 + (k + 1) * dt;
                sum += kernel.trialPieces(tk, end - tk, p, spec.x0r, spec.x0i, yr, yi);
            }
        } catch (DriveException e) {
            return Double.NaN;
        }
        // trial() estimates the error of the two half steps, d/(2^p − 1); the run took the full step, whose error is
        // 2^p times that (d = ‖Φ_h − Φ_{h/2}Φ_{h/2}‖ ≈ (2^p − 1)·err(Φ_{h/2}²), err(Φ_h) ≈ 2^p·err(Φ_{h/2}²))
        double est = Math.scalb(sum, kernel.order()) * n / samples;
        return Double.isFinite(est) ? est : Double.NaN;
    }
}
