package org.liepath.integrators.internal;

import org.liepath.core.DriveException;

import java.util.Arrays;

/**
 * Drives a {@link Kernel} over an interval: fixed steps on the grid t_k = t0 + k·dt, dt = (t1 − t0)/n (each grid
 * step split at coefficient breakpoints and sample times), or adaptive steps with the kernel's (step-doubling) error
 * estimate and the standard controller h_new = h·min(5, max(0.2, 0.9 (tol/err)^{1/(q+1)})) (E. Hairer, S.P. Nørsett,
 * G. Wanner, Solving Ordinary Differential Equations I, 2nd ed., Springer 1993, §II.4), landing exactly on every
 * breakpoint and sample time.
 *
 * <p>Thread-safety: each call of {@link #run} makes its own runner; the kernel it is given must not be used by
 * another thread meanwhile.
 */
public final class Runner {
    private static final double SAFETY = 0.9, FMIN = 0.2, FMAX = 5.0;

    private final Kernel kernel;
    private final Run.Spec spec;
    private final Run.Result res = new Run.Result();
    private boolean monitorAlive = true, observerAlive = true;

    private Runner(Kernel kernel, Run.Spec spec) {
        this.kernel = kernel;
        this.spec = spec;
    }

    /** Runs the kernel over the spec's interval. */
    public static Run.Result run(Kernel kernel, Run.Spec spec) {
        return new Runner(kernel, spec).go();
    }

    private Run.Result go() {
        long start = System.nanoTime();
        int m = kernel.m, p = spec.p, len = m * p;
        double[] xr = Arrays.copyOf(spec.x0r, len), xi = Arrays.copyOf(spec.x0i, len);
        // an interaction-picture kernel steps the state of its frame, entered once here and left at each sample
        kernel.toFrame(spec.t0, p, xr, xi);
        stateTime = spec.t0;
        if (kernel.inFrame()) {
            outR = new double[len];
            outI = new double[len];
        }
        record(spec.t0, xr, xi);
        res.timeReached = spec.t0;
        if (spec.adaptive) {
            adaptive(xr, xi);
        } else {
            fixed(xr, xi);
        }
        if (kernel.inFrame()) {
            // left at the end of the last step as computed (tk + dt), as the zero-allocation stepper does
            kernel.fromFrame(stateTime, p, xr, xi, outR, outI);
            res.xr = outR.clone();
            res.xi = outI.clone();
            res.record(res.timeReached, outR, outI, len);
        } else {
            res.xr = xr;
            res.xi = xi;
            res.record(res.timeReached, xr, xi, len);
        }
        res.evaluations = kernel.evaluations;
        res.exponentials = kernel.exponentials;
        res.commutators = kernel.commutators;
        res.nanos = System.nanoTime() - start;
        return res;
    }

    /** Scratch for states brought back from the kernel's frame, or null. */
    private double[] outR, outI;
    /** The time of the state as its last step computed it (the frame's exit time). */
    private double stateTime;

    /** Records a sample of the state at time t (in the Hamiltonian's basis). */
    private void record(double t, double[] xr, double[] xi) {
        int len = kernel.m * spec.p;
        if (outR == null) {
            res.record(t, xr, xi, len);
            return;
        }
        kernel.fromFrame(t, spec.p, xr, xi, outR, outI);
        res.record(t, outR, outI, len);
    }

    /** Minimum step length: far below any useful step, far above the spacing of doubles near t. */
    static double minStep(double t0, double t1) {
        return Math.max(1e-14 * Math.abs(t1 - t0), 16 * Math.ulp(Math.max(Math.abs(t0), Math.abs(t1))));
    }

    /** Sorted (in the direction of integration) landing points strictly inside the interval, then t1. */
    static double[] landings(double t0, double t1, double[] breakpoints, double[] samples) {
        double dir = Math.signum(t1 - t0), lo = Math.min(t0, t1), hi = Math.max(t0, t1), tiny = minStep(t0, t1);
        double[] all = new double[breakpoints.length + samples.length + 1];
        int n = 0;
        for (double[] src : new double[][]{breakpoints, samples}) {
            for (double b : src) {
                if (b > lo + tiny && b < hi - tiny) {
                    all[n++] = b;
                }
            }
        }
        double[] in = Arrays.copyOf(all, n);
        Arrays.sort(in);
        double[] out = new double[n + 1];
        int k = 0;
        for (int q = 0; q < n; q++) {
            double b = dir > 0 ? in[q] : in[n - 1 - q];
            double prev = k == 0 ? t0 : out[k - 1];
            if (Math.abs(b - prev) > tiny) {
                out[k++] = b;
            }
        }
        out[k++] = t1;
        return Arrays.copyOf(out, k);
    }

    private boolean isSample(double t) {
        for (double s : spec.samples) {
            if (s == t) {
                return true;
            }
        }
        return false;
    }

    private void fixed(double[] xr, double[] xi) {
        int n = spec.steps, p = spec.p, len = kernel.m * p;
        double t0 = spec.t0, t1 = spec.t1, dt = (t1 - t0) / n;
        double[] stops = landings(t0, t1, new double[0], spec.samples);
        double[] br = new double[len], bi = new double[len];
        int next = 0;
        for (int k = 0; k < n; k++) {
            double tk = t0 + k * dt, tEnd = k == n - 1 ? t1 : t0 + (k + 1) * dt;
            System.arraycopy(xr, 0, br, 0, len);
            System.arraycopy(xi, 0, bi, 0, len);
            long before = kernel.steps;
            try {
                // sample times strictly inside this grid step split it; without them the call is exactly
                // kernel.advance(tk, dt), the same as the zero-allocation stepper
                double cur = tk;
                while (next < stops.length - 1 && (stops[next] - cur) * dt > 0 && (tEnd - stops[next]) * dt > 0) {
                    kernel.advance(cur, stops[next] - cur, p, xr, xi);
                    cur = stops[next];
                    record(cur, xr, xi);
                    next++;
                }
                if (cur == tk) {
                    kernel.advance(tk, dt, p, xr, xi);
                    stateTime = tk + dt;
                } else {
                    kernel.advance(cur, tk + dt - cur, p, xr, xi);
                    stateTime = cur + (tk + dt - cur);
                }
            } catch (DriveException e) {
                System.arraycopy(br, 0, xr, 0, len);
                System.arraycopy(bi, 0, xi, 0, len);
                stateTime = tk;
                fail(Run.Outcome.DRIVE_FAILED, e.getMessage());
                return;
            }
            if (!Kernel.finite(len, xr, xi)) {
                System.arraycopy(br, 0, xr, 0, len);
                System.arraycopy(bi, 0, xi, 0, len);
                stateTime = tk;
                fail(Run.Outcome.NON_FINITE, "the state became non-finite in the step from t = " + tk
                        + " of length " + dt);
                return;
            }
            res.accepted += kernel.steps - before;
            res.timeReached = k == n - 1 ? t1 : tk + dt;
            if (next < stops.length - 1 && stops[next] == tEnd) {
                next++;
                record(res.timeReached, xr, xi);
            }
            if (spec.everyStep) {
                record(res.timeReached, xr, xi);
            }
            observe(res.timeReached, dt, Double.NaN);
            if (!report(k == n - 1 ? 1.0 : Math.abs((res.timeReached - t0) / (t1 - t0)), k + 1, k == n - 1)) {
                return;
            }
        }
    }

    private void adaptive(double[] xr, double[] xi) {
        int p = spec.p, len = kernel.m * p;
        double t0 = spec.t0, t1 = spec.t1, span = Math.abs(t1 - t0), dir = Math.signum(t1 - t0);
        double tol = spec.tolerance, hMin = minStep(t0, t1);
        double[] stops = landings(t0, t1, kernel.sys.breakpoints, spec.samples);
        double[] yr = new double[len], yi = new double[len];
        double expo = 1.0 / (Math.min(kernel.estimateOrder(), 1000) + 1);
        double h;
        try {
            h = initialStep(t0, span, tol, expo);
        } catch (DriveException e) {
            fail(Run.Outcome.DRIVE_FAILED, e.getMessage());
            return;
        }
        double t = t0, errSum = 0;
        int next = 0;
        long attempts = 0;
        boolean lastRejected = false;
        while (true) {
            double target = stops[next], dist = Math.abs(target - t);
            boolean lands = h >= dist * (1 - 1e-12) || dist - h < hMin;
            double hTry = lands ? dist : h;
            if (attempts >= spec.maxSteps) {
                fail(Run.Outcome.STEP_LIMIT, "step limit of " + spec.maxSteps + " steps reached at t = " + t);
                break;
            }
            attempts++;
            double err;
            try {
                err = kernel.trial(t, dir * hTry, p, xr, xi, yr, yi);
            } catch (DriveException e) {
                fail(Run.Outcome.DRIVE_FAILED, e.getMessage());
                break;
            }
            if (!Kernel.finite(len, yr, yi)) {
                fail(Run.Outcome.NON_FINITE, "the state became non-finite in a step from t = " + t
                        + " of length " + dir * hTry);
                break;
            }
            if (Double.isNaN(err)) {
                err = Double.POSITIVE_INFINITY;
            }
            double fac = err == 0 ? FMAX : SAFETY * Math.pow(tol / err, expo);
            if (err <= tol) {
                System.arraycopy(yr, 0, xr, 0, len);
                System.arraycopy(yi, 0, xi, 0, len);
                double tNew = lands ? target : t + dir * hTry;
                res.accepted++;
                errSum += err;
                res.timeReached = tNew;
                stateTime = tNew;
                double prev = t;
                t = tNew;
                if (lands) {
                    next++;
                    if (isSample(t)) {
                        record(t, xr, xi);
                    }
                }
                if (spec.everyStep) {
                    record(t, xr, xi);
                }
                observe(t, t - prev, err);
                boolean done = next == stops.length;
                if (!report(done ? 1.0 : Math.abs(t - t0) / span, res.accepted, done) || done) {
                    break;
                }
                double hNew = hTry * Math.min(lastRejected ? 1.0 : FMAX, Math.max(FMIN, fac));
                // a step shortened to land on a breakpoint says nothing against the step proposed before
                h = lands ? Math.max(hNew, Math.min(h, span)) : hNew;
                lastRejected = false;
            } else {
                res.rejected++;
                lastRejected = true;
                h = hTry * Math.max(FMIN, Math.min(1.0, fac));
                if (h < hMin) {
                    fail(Run.Outcome.STEP_UNDERFLOW, "step size " + h + " fell below the minimum " + hMin
                            + " at t = " + t + " (local error estimate " + err + " > tolerance " + tol + ")");
                    break;
                }
            }
        }
        res.errorSum = errSum;
    }

    private double initialStep(double t0, double span, double tol, double expo) {
        if (kernel.order() == Integer.MAX_VALUE) {
            return span;
        }
        LinearSystem sys = kernel.sys;
        double[] c = new double[sys.terms];
        sys.coefficients(t0, c);
        kernel.evaluations++;
        double[] ar = new double[kernel.m * kernel.m], ai = new double[ar.length];
        sys.combine(c, 1.0, ar, ai);
        double norm = Kernel.norm(ar.length, ar, ai);
        if (norm == 0) {
            return span;
        }
        return Math.min(span, 0.5 * Math.pow(tol, expo) / norm);
    }

    private void fail(Run.Outcome outcome, String message) {
        res.outcome = outcome;
        res.message = message;
    }

    private void observe(double t, double dt, double err) {
        if (spec.observer == null || !observerAlive) {
            return;
        }
        try {
            spec.observer.accepted(t, dt, err);
        } catch (RuntimeException e) {
            observerAlive = false;
            res.observerFailure = "step observer threw " + e + " at t = " + t + "; it was not called again";
        }
    }

    /**
     * @param last whether the run has reached its end (a request to cancel is then moot and ignored)
     * @return false if the monitor asked to cancel (the outcome is then set)
     */
    private boolean report(double fraction, long count, boolean last) {
        if (!monitorAlive) {
            return true;
        }
        boolean go;
        try {
            go = spec.monitor.onProgress(fraction, count);
        } catch (RuntimeException e) {
            monitorAlive = false;
            res.monitorFailure = "progress listener threw " + e + " after step " + count
                    + "; it was not called again";
            return true;
        }
        if (!go && !last) {
            fail(Run.Outcome.CANCELLED, "cancelled by the progress listener at t = " + res.timeReached
                    + " after " + count + " steps");
        }
        return go || last;
    }
}
