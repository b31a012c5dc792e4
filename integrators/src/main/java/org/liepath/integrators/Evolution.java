package org.liepath.integrators;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;
import org.liepath.core.Superoperator;

/**
 * The outcome of {@link Evolve#run()}: the status, the result in the run's mode, the timeline, the work done, an
 * error estimate and the scheme used.
 *
 * <p>Modes: a Hamiltonian run gives {@link #propagator()} U(t1, t0), or with {@link Evolve#state} the state
 * {@link #state()} ψ(t1); a GKLS run gives {@link #channel()} (the dynamical map from t0 to t1), or with
 * {@link Evolve#density} the density {@link #density()} ρ(t1). The accessor of another mode throws
 * {@link IllegalStateException}.
 *
 * <p><b>Failed runs</b>: when {@link #status()} is not a success, the result accessors throw
 * {@link IllegalStateException} naming the status, so that a partial result is never mistaken for the answer. The
 * state reached before the failure is the last sample of {@link #timeline()}, at time {@code status().time()}.
 *
 * <p>Immutable and thread-safe.
 */
public final class Evolution {
    private final Scheme scheme;
    private final Status status;
    private final Timeline.Mode mode;
    private final int n;
    private final double[] re, im;
    private final Timeline timeline;
    private final Stats stats;
    /** The estimate, or NaN until a deferred estimate has been made (a benign race: every thread gets the same). */
    private volatile double errorEstimate;
    /** Makes the estimate on first request (fixed-step runs), else null. */
    private final java.util.function.DoubleSupplier deferredEstimate;
    private final Coordinates coordinates;

    Evolution(Scheme scheme, Status status, Timeline.Mode mode, int n, double[] re, double[] im,
              Timeline timeline, Stats stats, double errorEstimate, Coordinates coordinates) {
        this(scheme, status, mode, n, re, im, timeline, stats, errorEstimate, null, coordinates);
    }

    Evolution(Scheme scheme, Status status, Timeline.Mode mode, int n, double[] re, double[] im,
              Timeline timeline, Stats stats, double errorEstimate,
              java.util.function.DoubleSupplier deferredEstimate, Coordinates coordinates) {
        this.deferredEstimate = deferredEstimate;
        this.scheme = scheme;
        this.status = status;
        this.mode = mode;
        this.n = n;
        this.re = re;
        this.im = im;
        this.timeline = timeline;
        this.stats = stats;
        this.errorEstimate = errorEstimate;
        this.coordinates = coordinates;
    }

    /** @return how the run ended */
    public Status status() {
        return status;
    }

    /** @return the scheme that was requested for the run */
    public Scheme scheme() {
        return scheme;
    }

    /** @return U(t1, t0) of a Hamiltonian run in propagator mode (or a Wei–Norman run) */
    public Operator propagator() {
        need(Timeline.Mode.PROPAGATOR, "propagator()");
        return Operator.ofPlanar(n, re, im);
    }

    /** @return ψ(t1) of a Hamiltonian run started with {@link Evolve#state} */
    public StateVector state() {
        need(Timeline.Mode.STATE, "state()");
        return StateVector.of(re, im);
    }

    /** @return ρ(t1) of a GKLS run started with {@link Evolve#density} */
    public Operator density() {
        need(Timeline.Mode.DENSITY, "density()");
        return Timeline.unvec(n, re, im);
    }

    /** @return the dynamical map from t0 to t1 of a GKLS run without an initial density (column stacking) */
    public Superoperator channel() {
        need(Timeline.Mode.CHANNEL, "channel()");
        return Superoperator.ofMatrix(Operator.ofPlanar(n * n, re, im));
    }

    /**
     * Positivity of an open-system result: the smallest eigenvalue of ρ(t1) (density mode) or of the Choi matrix of
     * the map (channel mode; ≥ 0 up to rounding for a completely positive map). Computed from the real symmetric
     * 2k×2k embedding [[Re, −Im], [Im, Re]] of the Hermitian part with Commons Math (each eigenvalue appears twice).
     *
     * @return the smallest eigenvalue (negative values show a loss of positivity)
     * @throws IllegalStateException for a closed-system run or a failed run
     */
    public double minEigenvalue() {
        if (mode == Timeline.Mode.DENSITY) {
            return minEigenvalue(density());
        }
        if (mode == Timeline.Mode.CHANNEL) {
            return minEigenvalue(channel().choi());
        }
        throw new IllegalStateException("minEigenvalue() needs an open-system run; this run gave a "
                + mode.name().toLowerCase());
    }

    static double minEigenvalue(Operator a) {
        int k = a.dim();
        double[][] e = new double[2 * k][2 * k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                double r = 0.5 * (a.re(i, j) + a.re(j, i)), s = 0.5 * (a.im(i, j) - a.im(j, i));
                e[i][j] = r;
                e[i + k][j + k] = r;
                e[i + k][j] = s;
                e[i][j + k] = -s;
            }
        }
        double[] ev = new EigenDecomposition(new Array2DRowRealMatrix(e, false)).getRealEigenvalues();
        double min = Double.POSITIVE_INFINITY;
        for (double v : ev) {
            min = Math.min(min, v);
        }
        return min;
    }

    /** @return the samples of the run (always including t0 and the time reached) */
    public Timeline timeline() {
        return timeline;
    }

    /**
     * The earlier name of {@link #timeline()}, kept so that scripts written against it still run.
     *
     * @return the same samples as {@link #timeline()}
     * @deprecated renamed to {@link #timeline()}: the samples of one deterministic run, not stochastic trajectories
     */
    @Deprecated
    public Timeline trajectory() {
        return timeline();
    }

    /** @return the work done */
    public Stats stats() {
        return stats;
    }

    /**
     * An estimate of the global error, relative to the Frobenius norm of the state: the sum of the local error
     * estimates of the steps (step doubling), a bound under linear accumulation of local errors.
     * <ul>
     *   <li>Adaptive runs: the sum of the accepted steps' estimates; since the run propagates the two half steps,
     *   the true error is usually smaller.</li>
     *   <li>Fixed-step runs: made on the first call, from up to eight grid steps spread over the interval (three
     *   steps' work each, on the run's initial state; exact for Hamiltonian propagators, whose local errors do not
     *   depend on the unitary they act on) and scaled to all n steps; the local error of the full step is
     *   2^p/(2^p − 1) times the difference of one step and two half steps. NaN if a sampled step fails.</li>
     *   <li>Reference and Wei–Norman runs: made on the first call, by repeating the run (without samples, observer
     *   or listener) at a tolerance 100 times smaller; the estimate is the relative Frobenius distance of the two
     *   results, which estimates the run's own global error when errors are proportional to the tolerance. Costs
     *   about 1.7 times the run (Dormand–Prince 8). NaN if the tolerance cannot be made 10 times smaller (below
     *   1e-14) or the second run fails.</li>
     *   <li>0 for exact piecewise stepping; NaN for failed runs.</li>
     * </ul>
     *
     * @return the estimate of the global error
     */
    public double errorEstimate() {
        double e = errorEstimate;
        if (Double.isNaN(e) && deferredEstimate != null) {
            e = deferredEstimate.getAsDouble();
            errorEstimate = e;
        }
        return e;
    }

    /**
     * @return the Wei–Norman coordinates of a run with {@link Scheme#weiNorman}
     * @throws IllegalStateException for other schemes
     */
    public Coordinates coordinates() {
        if (coordinates == null) {
            throw new IllegalStateException("coordinates() needs a run with Scheme.weiNorman(chart); this run used "
                    + scheme.name());
        }
        return coordinates;
    }

    private void need(Timeline.Mode wanted, String what) {
        if (!status.isSuccess()) {
            throw new IllegalStateException(what + " is not available: the run ended with " + status
                    + " (the state reached is the last sample of timeline())");
        }
        if (mode != wanted) {
            throw new IllegalStateException(what + " is not available: this run computed a "
                    + mode.name().toLowerCase());
        }
    }

    @Override
    public String toString() {
        return "Evolution [" + scheme.name() + ", " + status + "]\n" + stats;
    }
}
