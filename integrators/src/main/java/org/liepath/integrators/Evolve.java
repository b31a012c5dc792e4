package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.DriveException;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.ProgressListener;
import org.liepath.core.StateVector;
import org.liepath.core.internal.Require;
import org.liepath.integrators.internal.FixedStepError;
import org.liepath.integrators.internal.Kernel;
import org.liepath.integrators.internal.LinearSystem;
import org.liepath.integrators.internal.PiecewiseKernel;
import org.liepath.integrators.internal.ReferenceRunner;
import org.liepath.integrators.internal.Run;
import org.liepath.integrators.internal.Runner;
import org.liepath.integrators.internal.TighterRunError;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The evolution builder: {@code Evolve.of(h).over(t0, t1).scheme(s).tolerance(tol).run()}.
 *
 * <p>Solves dU/dt = −iH(t)U, U(t0) = I (ħ = 1) for a {@link Hamiltonian}, or dρ/dt = L(t)[ρ] for a
 * {@link Lindbladian} in Liouville space (column stacking). Every call returns a new immutable configuration, so a
 * configuration can be shared between threads and reused; {@link #run()} does the work in a workspace of its own
 * thread, so many threads may run the same configuration at once with identical results. Repeated runs are cheaper
 * than the first: the prepared form of the last generator run (up to 64 levels, in Liouville space for a
 * Lindbladian) is shared by all threads (it is immutable), and for
 * systems of up to 8 levels (Liouville dimension for a Lindbladian) each thread keeps the workspace of its last
 * run for the next run of the same scheme and generator (so it holds a reference to that generator until another
 * run replaces it). A reused workspace gives bit for bit the result of a new one.
 *
 * <p><b>Defaults</b> when a run names neither: scheme {@link Scheme#commutatorFree4Opt()}, adaptive steps with
 * tolerance {@value #DEFAULT_TOLERANCE}, at most {@value #DEFAULT_MAX_STEPS} steps. {@link #tolerance} and
 * {@link #steps} exclude each other: the later call wins.
 *
 * <p><b>Tolerance</b>: an adaptive step is accepted when its local error estimate, relative to the Frobenius norm of
 * the state, is at most tol. Steps always land exactly on the drives' breakpoints and on sample times. A generator
 * that is piecewise constant (in particular time independent) is stepped exactly in adaptive runs, one exponential
 * per constant segment, whatever the scheme (the reference integrator excepted).
 *
 * <p><b>Fixed steps</b> {@code steps(n)}: dt = (t1 − t0)/n and step k starts at t0 + k·dt; a step containing a
 * breakpoint or a sample time is split there. Without sample times this is bit for bit the sequence of
 * {@link Stepper#advance} calls on the same grid.
 *
 * <p><b>Modes</b>: propagator (default for a Hamiltonian), state vector ({@link #state}), dynamical map (default for
 * a Lindbladian, {@link Evolution#channel()}) and density ({@link #density}). Dense exponentials in the propagator
 * and channel modes (sizes up to a few hundred); vector states (ψ, or vec(ρ)) of dimension ≥ 64 get each
 * exponential as a Krylov action (Lanczos or Arnoldi, accuracy 1e-14 per exponential), falling back to the dense
 * exponential if Krylov cannot converge.
 *
 * <p>Bad input throws {@link InvalidInputException} at the call that supplies it, or at {@link #run()} for
 * combinations (no interval, a scheme that cannot serve the problem, sample times outside the interval). Numerical
 * trouble during the run is reported in {@link Evolution#status()}.
 */
public final class Evolve {
    /** Default relative local tolerance of adaptive runs. */
    public static final double DEFAULT_TOLERANCE = 1e-8;
    /** Default step limit of adaptive runs. */
    public static final long DEFAULT_MAX_STEPS = 1_000_000;
    /** Allowed departure of an initial state's norm (or a density's trace) from 1. */
    static final double NORMALISATION_SLACK = 1e-10;

    private final Hamiltonian h;
    private final Lindbladian l;
    private double t0 = Double.NaN, t1 = Double.NaN;
    private Scheme scheme;
    private double tolerance = Double.NaN;
    private int steps;
    private StateVector psi;
    private Operator rho0;
    private ProgressListener monitor = ProgressListener.NONE;
    private double[] samples = new double[0];
    private boolean everyStep;
    private StepObserver observer;
    private long maxSteps = DEFAULT_MAX_STEPS;

    private Evolve(Hamiltonian h, Lindbladian l) {
        this.h = h;
        this.l = l;
    }

    private Evolve copy() {
        Evolve e = new Evolve(h, l);
        e.t0 = t0;
        e.t1 = t1;
        e.scheme = scheme;
        e.tolerance = tolerance;
        e.steps = steps;
        e.psi = psi;
        e.rho0 = rho0;
        e.monitor = monitor;
        e.samples = samples;
        e.everyStep = everyStep;
        e.observer = observer;
        e.maxSteps = maxSteps;
        return e;
    }

    /**
     * @param h the Hamiltonian
     * @return a configuration evolving under the Hamiltonian h (propagator mode until {@link #state} is given)
     */
    public static Evolve of(Hamiltonian h) {
        Require.nonNull(h, "h");
        return new Evolve(h, null);
    }

    /**
     * @param l the GKLS generator
     * @return a configuration evolving under the GKLS generator l (dynamical-map mode until {@link #density})
     */
    public static Evolve of(Lindbladian l) {
        Require.nonNull(l, "l");
        return new Evolve(null, l);
    }

    /**
     * The time interval. t1 &lt; t0 is a legal backward run (it gives the inverse propagator U(t0, t1)⁻¹ = U(t1, t0)).
     *
     * @param t0 the start time
     * @param t1 the end time
     * @return a copy with this setting
     * @throws InvalidInputException for a non-finite time or t0 == t1
     */
    public Evolve over(double t0, double t1) {
        Require.finite(t0, "t0");
        Require.finite(t1, "t1");
        if (t0 == t1) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "t1", "an end time different from t0 = " + t0, t1);
        }
        Evolve e = copy();
        e.t0 = t0;
        e.t1 = t1;
        return e;
    }

    /**
     * @param s the scheme
     * @return a copy using scheme s
     */
    public Evolve scheme(Scheme s) {
        Require.nonNull(s, "scheme");
        Evolve e = copy();
        e.scheme = s;
        return e;
    }

    /**
     * Adaptive steps with relative local tolerance tol (see the class comment); clears {@link #steps}.
     *
     * @param tol the tolerance (positive)
     * @return a copy with this setting
     * @throws InvalidInputException unless 0 &lt; tol &lt; ∞
     */
    public Evolve tolerance(double tol) {
        Require.positive(tol, "tolerance");
        Evolve e = copy();
        e.tolerance = tol;
        e.steps = 0;
        return e;
    }

    /**
     * n fixed steps of equal length (split at breakpoints and sample times); clears {@link #tolerance}.
     *
     * @param n the dimension
     * @return a copy with this setting
     * @throws InvalidInputException unless n ≥ 1
     */
    public Evolve steps(int n) {
        Require.positive(n, "steps");
        Evolve e = copy();
        e.steps = n;
        e.tolerance = Double.NaN;
        return e;
    }

    /**
     * State-vector mode: evolve ψ(t0) = psi instead of the propagator (cost per step O(n²) per exponential applied,
     * plus the exponential itself). The state must be normalised to within {@value #NORMALISATION_SLACK}: an
     * unnormalised state is refused rather than silently rescaled (use {@link StateVector#normalized()}).
     *
     * @param psi the state
     * @return a copy with this setting
     * @throws InvalidInputException for a wrong dimension (DIMENSION_MISMATCH), an unnormalised state
     *                               (OUT_OF_RANGE), or a Lindbladian configuration (UNSUPPORTED: use {@link #density})
     */
    public Evolve state(StateVector psi) {
        Require.nonNull(psi, "psi");
        if (l != null) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "psi", "a density matrix for a GKLS evolution "
                    + "(use density(rho0))", "a state vector");
        }
        Require.sameDim(h.dim(), psi.dim(), "psi");
        double norm = psi.norm();
        if (!(Math.abs(norm - 1) <= NORMALISATION_SLACK)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "psi", "a normalised state (norm 1 ± "
                    + NORMALISATION_SLACK + "; use psi.normalized())", "norm " + norm);
        }
        Evolve e = copy();
        e.psi = psi;
        return e;
    }

    /**
     * Density mode for a GKLS evolution: evolve ρ(t0) = rho0. rho0 must be Hermitian (relative defect ≤ 1e-12) with
     * unit trace (± {@value #NORMALISATION_SLACK}); positivity is not checked.
     *
     * @param rho0 the initial density matrix
     * @return a copy with this setting
     * @throws InvalidInputException for a wrong dimension, a non-Hermitian operator, a trace other than 1, or a
     *                               Hamiltonian configuration (UNSUPPORTED)
     */
    public Evolve density(Operator rho0) {
        Require.nonNull(rho0, "rho0");
        if (l == null) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "rho0", "a state vector for a Hamiltonian evolution "
                    + "(use state(psi), or a Lindbladian without jumps)", "a density matrix");
        }
        Require.sameDim(l.dim(), rho0.dim(), "rho0");
        rho0.requireHermitian("rho0");
        Complex tr = rho0.trace();
        if (!(Math.abs(tr.getReal() - 1) <= NORMALISATION_SLACK)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "rho0", "unit trace (1 ± " + NORMALISATION_SLACK
                    + ")", "trace " + tr.getReal());
        }
        Evolve e = copy();
        e.rho0 = rho0;
        return e;
    }

    /**
     * A progress listener called after every accepted step (for fixed steps: after every grid step) with the
     * fraction of the interval done (1 at the last call) and the number of steps so far; returning false cancels the
     * run (status CANCELLED, the partial state in the trajectory), except at the last call, where nothing is left to
     * cancel. A listener that throws is not called again and the run goes on; the failure is recorded in
     * {@link Stats#monitorFailure()} and the status message.
     *
     * @param listener the progress listener (return false to cancel)
     * @return a copy with this setting
     */
    public Evolve monitor(ProgressListener listener) {
        Require.nonNull(listener, "listener");
        Evolve e = copy();
        e.monitor = listener;
        return e;
    }

    /**
     * An observer called after every accepted step (see {@link StepObserver}; failures handled as for monitors).
     *
     * @param obs the observer
     * @return a copy with this setting
     */
    public Evolve observe(StepObserver obs) {
        Require.nonNull(obs, "observer");
        Evolve e = copy();
        e.observer = obs;
        return e;
    }

    /**
     * Records the result at these times (finite, inside the closed interval, checked at {@link #run()}); steps land on
     * them exactly.
     *
     * @param times the sample times
     * @return a copy with this setting
     */
    public Evolve sampleAt(double... times) {
        Require.finite(times, "times");
        Evolve e = copy();
        e.samples = times.clone();
        return e;
    }

    /**
     * Records the result after every accepted step.
     *
     * @return a copy with this setting
     */
    public Evolve sampleEveryStep() {
        Evolve e = copy();
        e.everyStep = true;
        return e;
    }

    /**
     * The step limit of adaptive runs (attempted steps, accepted or rejected; default {@value #DEFAULT_MAX_STEPS});
     * reaching it ends the run with STEP_LIMIT. Fixed-step runs take exactly their steps. Wei–Norman runs count
     * accepted steps of their coordinate integrator (summed over charts).
     *
     * @param n the step limit (positive)
     * @return a copy with this setting
     */
    public Evolve maxSteps(long n) {
        if (n <= 0) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "maxSteps", "a positive step limit", n);
        }
        Evolve e = copy();
        e.maxSteps = n;
        return e;
    }

    /**
     * Integrates.
     *
     * @return the evolution: its status, result, trajectory and statistics
     * @throws InvalidInputException if no interval was given, a sample time lies outside it, or the scheme cannot
     *                               serve the problem (UNSUPPORTED: piecewise-exact stepping of drives that are not
     *                               piecewise constant, fixed steps with the reference or a Wei–Norman scheme, a
     *                               Wei–Norman scheme for a Lindbladian)
     */
    public Evolution run() {
        if (Double.isNaN(t0)) {
            throw InvalidInputException.of(Reason.NULL, "interval", "an interval set with over(t0, t1)", "none");
        }
        double lo = Math.min(t0, t1), hi = Math.max(t0, t1);
        for (double s : samples) {
            if (s < lo || s > hi) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "times", "sample times in [" + lo + ", " + hi
                        + "]", s);
            }
        }
        Scheme s = scheme == null ? Scheme.commutatorFree4Opt() : scheme;
        Hamiltonian ham = h != null ? h : l.hamiltonian();
        s.requirePiecewise(h != null ? "h" : "l", ham.isPiecewiseConstant());
        boolean adaptive = steps == 0;
        double tol = Double.isNaN(tolerance) ? DEFAULT_TOLERANCE : tolerance;
        if (s.kind == Scheme.Kind.WEI_NORMAN) {
            return weiNorman(s, tol);
        }
        if (s.kind == Scheme.Kind.REFERENCE && !adaptive) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "steps", "an adaptive run for " + s.name()
                    + " (use tolerance(tol))", steps + " fixed steps");
        }
        if (l != null) {
            s.requireHamiltonian("l");
        }
        // exact stepping takes the whole generator, so an adaptive run of piecewise-constant drives stays in the
        // Schrödinger picture whatever the scheme
        boolean exact = adaptive && ham.isPiecewiseConstant();
        LinearSystem sys = h != null ? (exact ? LinearSystem.of(h) : s.system(h)) : LinearSystem.of(l);
        int n = ham.dim(), m = sys.dim();
        Timeline.Mode mode = h != null ? (psi != null ? Timeline.Mode.STATE : Timeline.Mode.PROPAGATOR)
                : (rho0 != null ? Timeline.Mode.DENSITY : Timeline.Mode.CHANNEL);
        Run.Spec spec = new Run.Spec();
        spec.t0 = t0;
        spec.t1 = t1;
        spec.adaptive = adaptive;
        spec.tolerance = tol;
        spec.steps = steps;
        spec.maxSteps = maxSteps;
        spec.samples = samples.clone();
        spec.everyStep = everyStep;
        spec.monitor = monitor;
        StepObserver obs = observer;
        spec.observer = obs == null ? null : obs::onStep;
        if (mode == Timeline.Mode.STATE) {
            spec.p = 1;
            spec.x0r = new double[m];
            spec.x0i = new double[m];
            psi.copyTo(spec.x0r, spec.x0i);
        } else if (mode == Timeline.Mode.DENSITY) {
            spec.p = 1;
            spec.x0r = new double[m];
            spec.x0i = new double[m];
            Timeline.vec(rho0, spec.x0r, spec.x0i);
        } else {
            spec.p = m;
            spec.x0r = new double[m * m];
            spec.x0i = new double[m * m];
            for (int i = 0; i < m; i++) {
                spec.x0r[i * m + i] = 1;
            }
        }
        Run.Result r;
        if (s.kind == Scheme.Kind.REFERENCE) {
            r = ReferenceRunner.run(sys, spec);
            if (r.outcome == Run.Outcome.SUCCESS) {
                Run.Result first = r;
                return wrap(s, mode, n, r, () -> TighterRunError.reference(sys, spec, first));
            }
        } else {
            Kernel k = adaptive && sys.isPiecewiseConstant() ? new PiecewiseKernel(sys) : reusedKernel(s, sys);
            r = Runner.run(k, spec);
            release(s, k);
            if (!adaptive && r.outcome == Run.Outcome.SUCCESS) {
                // made only if asked for, on a kernel of its own (the run's counters stay as they are)
                return wrap(s, mode, n, r, () -> FixedStepError.estimate(s.kernel(sys), spec));
            }
        }
        return wrap(s, mode, n, r, null);
    }

    /**
     * Systems up to this dimension (in Liouville space for a Lindbladian) reuse the workspace of their thread's
     * previous run of the same scheme and system: for a few dozen steps of a three-level system, building a kernel
     * (its scratch, the frame's tables and their node phases) was a tenth of the run. Larger kernels cost little
     * against their steps and would hold more memory per thread.
     */
    static final int REUSE_MAX_DIM = 8;

    /** The kernel released by the thread's last run and its scheme, or null. */
    private static final ThreadLocal<Object[]> LAST_KERNEL = new ThreadLocal<>();

    /**
     * A kernel for a run: the thread's last one if it served the same scheme on the same system (taken, so that a
     * nested run, say from inside a drive, builds its own), else a new one.
     */
    private static Kernel reusedKernel(Scheme s, LinearSystem sys) {
        if (sys.dim() <= REUSE_MAX_DIM) {
            Object[] last = LAST_KERNEL.get();
            if (last != null && ((Kernel) last[1]).system() == sys && last[0].equals(s)) {
                LAST_KERNEL.set(null);
                Kernel k = (Kernel) last[1];
                k.reset();
                return k;
            }
        }
        return s.kernel(sys);
    }

    /** Offers a finished run's kernel for the thread's next run (only after a normal return of the runner). */
    private static void release(Scheme s, Kernel k) {
        if (k.system().dim() <= REUSE_MAX_DIM && !(k instanceof PiecewiseKernel && s.kind != Scheme.Kind.PIECEWISE)) {
            LAST_KERNEL.set(new Object[]{s, k});
        }
    }

    private static Evolution wrap(Scheme s, Timeline.Mode mode, int n, Run.Result r,
                                  java.util.function.DoubleSupplier deferredEstimate) {
        Status status = status(Status.Kind.valueOf(r.outcome.name()), r.message, r.monitorFailure,
                r.observerFailure, r.timeReached);
        Stats stats = new Stats(r.accepted, r.rejected, r.evaluations, r.exponentials, r.commutators, 0, r.nanos,
                r.monitorFailure, r.observerFailure);
        Timeline traj = new Timeline(mode, n, r.sampleTimes, r.sampleRe, r.sampleIm);
        return new Evolution(s, status, mode, n, r.xr, r.xi, traj, stats, r.errorSum, deferredEstimate, null);
    }

    private static Status status(Status.Kind kind, String message, String monitorFailure, String observerFailure,
                                 double time) {
        StringBuilder sb = new StringBuilder(message == null ? "" : message);
        for (String extra : new String[]{monitorFailure, observerFailure}) {
            if (extra != null) {
                sb.append(sb.length() == 0 ? "" : "; ").append(extra);
            }
        }
        return new Status(kind, sb.toString(), time);
    }

    private Evolution weiNorman(Scheme s, double tol) {
        if (l != null) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "scheme", "a scheme for GKLS generators",
                    s.name() + " (Hamiltonians only)");
        }
        if (steps != 0) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "steps", "an adaptive run for " + s.name()
                    + " (use tolerance(tol))", steps + " fixed steps");
        }
        if (everyStep) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "sampleEveryStep", "sampleAt(times) for " + s.name(),
                    "sampleEveryStep()");
        }
        String[] monitorFailure = {null};
        ProgressListener user = monitor;
        long limit = maxSteps;
        boolean[] limitReached = {false};
        ProgressListener guarded = new ProgressListener() {
            private boolean alive = true;

            @Override
            public boolean onProgress(double fraction, long count) {
                // the chart integrator reports every accepted step: the step limit counts those (a stop request at
                // the final step, fraction 1, would be moot)
                if (count >= limit && fraction < 1) {
                    limitReached[0] = true;
                    return false;
                }
                if (!alive) {
                    return true;
                }
                try {
                    return user.onProgress(fraction, count);
                } catch (RuntimeException e) {
                    alive = false;
                    monitorFailure[0] = "progress listener threw " + e + " after step " + count
                            + "; it was not called again";
                    return true;
                }
            }
        };
        long start = System.nanoTime();
        double[] sorted = samples.clone();
        Arrays.sort(sorted);
        if (t1 < t0) {
            for (int i = 0; i < sorted.length / 2; i++) {
                double tmp = sorted[i];
                sorted[i] = sorted[sorted.length - 1 - i];
                sorted[sorted.length - 1 - i] = tmp;
            }
        }
        CoordinateRun cr;
        try {
            cr = s.chart.integrate(h, t0, t1, tol, sorted, guarded);
        } catch (DriveException e) {
            Status st = status(Status.Kind.DRIVE_FAILED, e.getMessage(), monitorFailure[0], null, e.time());
            Stats stats = new Stats(0, 0, 0, 0, 0, 0, System.nanoTime() - start, monitorFailure[0], null);
            Timeline traj = new Timeline(Timeline.Mode.PROPAGATOR, h.dim(), List.of(), List.of(), List.of());
            return new Evolution(s, st, Timeline.Mode.PROPAGATOR, h.dim(), null, null, traj, stats, Double.NaN,
                    null);
        }
        long nanos = System.nanoTime() - start;
        Status.Kind kind = cr.cancelled ? (limitReached[0] ? Status.Kind.STEP_LIMIT : Status.Kind.CANCELLED)
                : cr.failure != null || cr.propagator == null ? Status.Kind.FAILED : Status.Kind.SUCCESS;
        double reached = cr.times.length > 0 ? cr.times[cr.times.length - 1] : t0;
        String msg = kind == Status.Kind.STEP_LIMIT ? "step limit of " + limit + " accepted steps reached before t = "
                + t1
                : cr.cancelled ? "cancelled by the progress listener at t = " + reached
                : cr.failure != null ? cr.failure : cr.propagator == null ? "no propagator returned" : "";
        Status st = status(kind, msg, monitorFailure[0], null, kind == Status.Kind.SUCCESS ? t1 : reached);
        Stats stats = new Stats(cr.steps, 0, cr.evaluations, 0, 0, cr.charts, nanos, monitorFailure[0], null);
        Coordinates coords = new Coordinates(cr.times, cr.coordinates);
        Timeline.Mode mode = psi != null ? Timeline.Mode.STATE : Timeline.Mode.PROPAGATOR;
        List<Double> times = new ArrayList<>();
        List<double[]> re = new ArrayList<>(), im = new ArrayList<>();
        double[] fr = null, fi = null;
        int dim = h.dim();
        if (cr.propagator != null) {
            Operator u = cr.propagator;
            dim = u.dim();
            if (psi != null) {
                StateVector out = psi.apply(u);
                fr = new double[dim];
                fi = new double[dim];
                out.copyTo(fr, fi);
            } else {
                fr = u.reArray();
                fi = u.imArray();
            }
        }
        // the trajectory: t0, every sample time the chart recorded (re-anchoring already composed in), the end
        addSample(times, re, im, t0, Operator.identity(dim), psi);
        if (cr.propagators != null && cr.propagators.size() == cr.times.length) {
            for (int k = 0; k < cr.times.length; k++) {
                if (cr.propagators.get(k) != null && cr.times[k] != t0 && !(k == cr.times.length - 1 && fr != null)) {
                    addSample(times, re, im, cr.times[k], cr.propagators.get(k), psi);
                }
            }
        }
        if (fr != null) {
            times.add(kind == Status.Kind.SUCCESS ? t1 : reached);
            re.add(fr);
            im.add(fi);
        }
        Timeline traj = new Timeline(mode, dim, times, re, im);
        java.util.function.DoubleSupplier deferred = null;
        if (kind == Status.Kind.SUCCESS && fr != null) {
            double[] gr = fr, gi = fi;
            Hamiltonian ham = h;
            StateVector state = psi;
            double from = t0, to = t1;
            deferred = () -> weiNormanEstimate(s, ham, from, to, tol, state, gr, gi);
        }
        return new Evolution(s, st, mode, dim, fr, fi, traj, stats, Double.NaN, deferred, coords);
    }

    /** {@link TighterRunError} for a Wei–Norman run: the chart integrated again at the tighter tolerance. */
    private static double weiNormanEstimate(Scheme s, Hamiltonian h, double t0, double t1, double tol,
                                            StateVector psi, double[] fr, double[] fi) {
        double tight = TighterRunError.tighter(tol);
        if (Double.isNaN(tight)) {
            return Double.NaN;
        }
        CoordinateRun cr;
        try {
            cr = s.chart.integrate(h, t0, t1, tight, new double[0], ProgressListener.NONE);
        } catch (DriveException e) {
            return Double.NaN;
        }
        if (cr.cancelled || cr.failure != null || cr.propagator == null) {
            return Double.NaN;
        }
        Operator u = cr.propagator;
        double[] yr, yi;
        if (psi != null) {
            StateVector out = psi.apply(u);
            yr = new double[out.dim()];
            yi = new double[out.dim()];
            out.copyTo(yr, yi);
        } else {
            yr = u.reArray();
            yi = u.imArray();
        }
        return yr.length != fr.length ? Double.NaN : TighterRunError.relativeDistance(fr.length, fr, fi, yr, yi);
    }

    private static void addSample(List<Double> times, List<double[]> re, List<double[]> im, double t, Operator u,
                                  StateVector psi) {
        times.add(t);
        if (psi != null) {
            StateVector out = psi.apply(u);
            double[] r = new double[out.dim()], i = new double[out.dim()];
            out.copyTo(r, i);
            re.add(r);
            im.add(i);
        } else {
            re.add(u.reArray());
            im.add(u.imArray());
        }
    }

    @Override
    public String toString() {
        return "Evolve[" + (h != null ? h : l) + ", over [" + t0 + ", " + t1 + "], "
                + (scheme == null ? "default scheme" : scheme.name()) + ", "
                + (steps > 0 ? steps + " steps" : "tolerance " + (Double.isNaN(tolerance) ? DEFAULT_TOLERANCE
                : tolerance)) + "]";
    }
}
