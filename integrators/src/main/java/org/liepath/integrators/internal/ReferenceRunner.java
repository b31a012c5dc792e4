package org.liepath.integrators.internal;

import org.apache.commons.math3.exception.MaxCountExceededException;
import org.apache.commons.math3.exception.NumberIsTooSmallException;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.apache.commons.math3.ode.sampling.StepHandler;
import org.apache.commons.math3.ode.sampling.StepInterpolator;
import org.liepath.core.DriveException;

import java.util.Arrays;

/**
 * The reference integrator: Apache Commons Math's {@link DormandPrince853Integrator} (J.R. Dormand, P.J. Prince,
 * J. Comput. Appl. Math. 6 (1980) 19–26; as implemented after Hairer–Nørsett–Wanner's DOP853) on the real
 * vectorised equation d/dt [Re X; Im X] = [Re(AX); Im(AX)], with scalar absolute and relative tolerance tol, segment
 * by segment between breakpoints and sample times.
 *
 * <p>Not structure preserving: nothing re-unitarises the result, so its unitarity or trace drift is visible.
 *
 * <p>Stateless static helpers: thread-safe.
 */
public final class ReferenceRunner {
    private ReferenceRunner() {
    }

    private static final class Cancelled extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Cancelled() {
            super(null, null, false, false);
        }
    }

    private static final class NonFiniteTime extends RuntimeException {
        private static final long serialVersionUID = 1L;

        NonFiniteTime(double t) {
            super("the reference integrator asked for the generator at t = " + t, null, false, false);
        }
    }

    /** Runs the reference integrator (spec.adaptive must be true). */
    public static Run.Result run(LinearSystem sys, Run.Spec spec) {
        long start = System.nanoTime();
        Run.Result res = new Run.Result();
        int m = sys.m, p = spec.p, len = m * p;
        double[] y = new double[2 * len];
        System.arraycopy(spec.x0r, 0, y, 0, len);
        System.arraycopy(spec.x0i, 0, y, len, len);
        double[] ar = new double[m * m], ai = new double[m * m], c = new double[sys.terms];
        long[] evals = {0};
        FirstOrderDifferentialEquations ode = new FirstOrderDifferentialEquations() {
            @Override
            public int getDimension() {
                return 2 * len;
            }

            @Override
            public void computeDerivatives(double t, double[] yy, double[] dot) {
                if (!Double.isFinite(t)) {
                    // Commons Math's initial step guess degenerates for tolerances far below double precision
                    throw new NonFiniteTime(t);
                }
                sys.coefficients(t, c);
                evals[0]++;
                sys.combine(c, 1.0, ar, ai);
                Arrays.fill(dot, 0.0);
                for (int i = 0; i < m; i++) {
                    for (int k = 0; k < m; k++) {
                        double a = ar[i * m + k], b = ai[i * m + k];
                        if (a == 0 && b == 0) {
                            continue;
                        }
                        for (int j = 0; j < p; j++) {
                            double xr = yy[k * p + j], xi = yy[len + k * p + j];
                            dot[i * p + j] += a * xr - b * xi;
                            dot[len + i * p + j] += a * xi + b * xr;
                        }
                    }
                }
            }
        };
        double tol = spec.tolerance, span = Math.abs(spec.t1 - spec.t0);
        double[] stops = Runner.landings(spec.t0, spec.t1, sys.breakpoints, spec.samples);
        boolean[] monitorAlive = {true};
        res.record(spec.t0, y, Arrays.copyOfRange(y, len, 2 * len), len);
        res.timeReached = spec.t0;
        double t = spec.t0;
        long stepBudget = spec.maxSteps;
        try {
            for (double stop : stops) {
                boolean finalSegment = stop == spec.t1;
                DormandPrince853Integrator dp = new DormandPrince853Integrator(Runner.minStep(spec.t0, spec.t1),
                        span, tol, tol);
                dp.setMaxEvaluations((int) Math.min(Integer.MAX_VALUE, 16 * Math.max(stepBudget - res.accepted, 1)));
                dp.addStepHandler(new StepHandler() {
                    @Override
                    public void init(double t0, double[] y0, double t1) {
                    }

                    @Override
                    public void handleStep(StepInterpolator in, boolean isLast) {
                        res.accepted++;
                        double tc = in.getCurrentTime();
                        if (spec.everyStep) {
                            in.setInterpolatedTime(tc);
                            double[] s = in.getInterpolatedState();
                            res.record(tc, s, Arrays.copyOfRange(s, len, 2 * len), len);
                        }
                        if (spec.observer != null && res.observerFailure == null) {
                            try {
                                spec.observer.accepted(tc, tc - in.getPreviousTime(), Double.NaN);
                            } catch (RuntimeException e) {
                                res.observerFailure = "step observer threw " + e + " at t = " + tc
                                        + "; it was not called again";
                            }
                        }
                        if (monitorAlive[0]) {
                            boolean go;
                            try {
                                go = spec.monitor.onProgress(Math.abs(tc - spec.t0) / span, res.accepted);
                            } catch (RuntimeException e) {
                                monitorAlive[0] = false;
                                res.monitorFailure = "progress listener threw " + e + " after step " + res.accepted
                                        + "; it was not called again";
                                go = true;
                            }
                            if (!go && !(isLast && finalSegment)) {
                                res.timeReached = tc;
                                throw new Cancelled();
                            }
                        }
                        if (res.accepted >= stepBudget && !isLast) {
                            throw new MaxCountExceededException(stepBudget);
                        }
                    }
                });
                double[] out = new double[2 * len];
                dp.integrate(ode, t, y, stop, out);
                y = out;
                t = stop;
                res.timeReached = t;
                res.record(t, y, Arrays.copyOfRange(y, len, 2 * len), len);
                if (!Double.isFinite(Kernel.norm(2 * len, y, y))) {
                    res.outcome = Run.Outcome.NON_FINITE;
                    res.message = "the state became non-finite before t = " + t;
                    break;
                }
            }
        } catch (Cancelled e) {
            res.outcome = Run.Outcome.CANCELLED;
            res.message = "cancelled by the progress listener at t = " + res.timeReached;
        } catch (NonFiniteTime e) {
            res.outcome = Run.Outcome.NON_FINITE;
            res.message = e.getMessage() + " after t = " + t + " (tolerance " + tol
                    + " is below what double precision can deliver?)";
        } catch (DriveException e) {
            res.outcome = Run.Outcome.DRIVE_FAILED;
            res.message = e.getMessage();
        } catch (MaxCountExceededException e) {
            res.outcome = Run.Outcome.STEP_LIMIT;
            res.message = "step limit of " + spec.maxSteps + " steps reached after t = " + t;
        } catch (NumberIsTooSmallException e) {
            res.outcome = Run.Outcome.STEP_UNDERFLOW;
            res.message = "reference integrator: " + e.getMessage() + " after t = " + t;
        } catch (RuntimeException e) {
            if (!(e instanceof org.apache.commons.math3.exception.MathIllegalStateException
                    || e instanceof org.apache.commons.math3.exception.MathIllegalArgumentException)) {
                throw e;
            }
            res.outcome = Run.Outcome.FAILED;
            res.message = "reference integrator failed after t = " + t + ": " + e.getMessage();
        }
        // on failure the state is the last completed segment's end
        res.xr = Arrays.copyOf(y, len);
        res.xi = Arrays.copyOfRange(y, len, 2 * len);
        if (res.outcome != Run.Outcome.SUCCESS) {
            res.timeReached = t;
        }
        res.record(res.timeReached, res.xr, res.xi, len);
        res.evaluations = evals[0];
        res.rejected = -1;
        res.nanos = System.nanoTime() - start;
        return res;
    }
}
