package org.liepath.integrators.internal.wn;

import org.apache.commons.math3.exception.MathIllegalArgumentException;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.apache.commons.math3.ode.sampling.StepHandler;
import org.apache.commons.math3.ode.sampling.StepInterpolator;
import org.liepath.core.ProgressListener;
import org.liepath.core.internal.Dense;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Adaptive integration of chart coordinates with automatic re-anchoring: the coordinate ODE is integrated with the
 * Dormand–Prince 8(5,3) method of Commons Math (E. Hairer, S. P. Nørsett, G. Wanner, Solving Ordinary Differential
 * Equations I, 2nd ed., Springer 1993, §II.10); after every accepted step the chart's health is checked, and before it
 * becomes singular the product is frozen into a base point, U(t) = U_chart(g(t))·U(t_b), and the coordinates restart
 * from zero (coordinates of the second kind are local: Wei and Norman, J. Math. Phys. 4 (1963) 575). Breakpoints of
 * the drives are hit exactly. Not part of the public API; one run per instance of the model.
 */
public final class Driver {
    private Driver() {
    }

    /** What the driver integrates. Implementations may keep scratch (a run is single-threaded). */
    public interface Model {
        /** @return the number of real unknowns */
        int size();

        /** @return the size N of the reconstructed matrices */
        int dim();

        /** yDot = f(t, y); false if the chart is singular at y. */
        boolean rhs(double t, double[] y, double[] yDot);

        /** @return a health measure: values above 1 ask for re-anchoring */
        double health(double[] y);

        /** out (planar N×N) = the chart's product at coordinates y (the propagator relative to the chart's base). */
        void reconstruct(double[] y, double[] outR, double[] outI);

        /** @return a description of the breakdown at y, used when health exceeds 1 and re-anchoring is off */
        default String breakdown(double[] y) {
            return "the chart became ill-conditioned";
        }
    }

    /** The outcome. */
    public static final class Result {
        public double[] uRe, uIm;
        public final List<double[]> sampleY = new ArrayList<>();
        public final List<double[][]> sampleU = new ArrayList<>();
        public double[] sampleT;
        public int charts = 1;
        public long evaluations, steps;
        public String failure;
        public boolean cancelled;
    }

    private static final class Reanchor extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Reanchor() {
            super(null, null, false, false);
        }
    }

    private static final class Breakdown extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Breakdown(String message) {
            super(message, null, false, false);
        }
    }

    private static final class Singular extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Singular() {
            super(null, null, false, false);
        }
    }

    private static final class Cancelled extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Cancelled() {
            super(null, null, false, false);
        }
    }

    /**
     * Integrates from t0 to t1 (either direction).
     *
     * @param stops     times strictly between t0 and t1 where the right-hand side may jump (integration restarts)
     * @param samples   times at which to record coordinates and the propagator (outside [t0, t1] ignored)
     * @param reanchor  whether to re-anchor when {@link Model#health} exceeds 1
     * @param maxCharts the maximum number of charts before the run fails
     */
    public static Result run(Model model, double t0, double t1, double tol, double[] stops, double[] samples,
                             ProgressListener monitor, boolean reanchor, int maxCharts, long maxEvaluations) {
        Result res = new Result();
        int n = model.dim(), len = n * n, sz = model.size();
        double dir = t1 >= t0 ? 1 : -1;
        double span = Math.abs(t1 - t0);
        double[] sTimes = Arrays.stream(samples).filter(s -> (s - t0) * dir >= 0 && (t1 - s) * dir >= 0)
                .map(s -> s * dir).sorted().map(s -> s * dir).toArray();
        double[] stopList = Arrays.stream(stops).filter(s -> (s - t0) * dir > 0 && (t1 - s) * dir > 0)
                .map(s -> s * dir).sorted().map(s -> s * dir).toArray();
        res.sampleT = sTimes;
        double[] baseR = new double[len], baseI = new double[len];
        Dense.identity(n, baseR, baseI);
        double[] wR = new double[len], wI = new double[len], pR = new double[len], pI = new double[len];
        final double[] y = new double[sz];
        final double[] lastY = new double[sz];
        final double[] lastT = {t0};
        final int[] nextSample = {0};
        final long[] counters = {0, 0};
        double t = t0;
        if (span == 0) {
            res.uRe = baseR;
            res.uIm = baseI;
            for (double s : sTimes) {
                res.sampleY.add(y.clone());
                res.sampleU.add(new double[][]{baseR.clone(), baseI.clone()});
            }
            return res;
        }
        FirstOrderDifferentialEquations ode = new FirstOrderDifferentialEquations() {
            @Override
            public int getDimension() {
                return sz;
            }

            @Override
            public void computeDerivatives(double tt, double[] yy, double[] yDot) {
                counters[0]++;
                if (!model.rhs(tt, yy, yDot)) {
                    throw new Singular();
                }
                for (int k = 0; k < sz; k++) {
                    if (!Double.isFinite(yDot[k])) {
                        throw new Singular();
                    }
                }
            }
        };
        final double[][] base = {baseR, baseI};
        final boolean[] baseIsIdentity = {true};
        StepHandler handler = new StepHandler() {
            @Override
            public void init(double tt, double[] yy, double tEnd) {
            }

            @Override
            public void handleStep(StepInterpolator interp, boolean isLast) {
                counters[1]++;
                double tc = interp.getCurrentTime();
                while (nextSample[0] < sTimes.length && (sTimes[nextSample[0]] - tc) * dir <= 0) {
                    interp.setInterpolatedTime(sTimes[nextSample[0]]);
                    double[] ys = interp.getInterpolatedState().clone();
                    res.sampleY.add(ys);
                    double[] ur = new double[len], ui = new double[len];
                    model.reconstruct(ys, pR, pI);
                    times(n, pR, pI, base, baseIsIdentity[0], ur, ui);
                    res.sampleU.add(new double[][]{ur, ui});
                    nextSample[0]++;
                }
                interp.setInterpolatedTime(tc);
                double[] yc = interp.getInterpolatedState();
                System.arraycopy(yc, 0, lastY, 0, sz);
                lastT[0] = tc;
                if (!monitor.onProgress(Math.min(1.0, Math.abs(tc - t0) / span), counters[1])) {
                    throw new Cancelled();
                }
                if (!isLast && model.health(yc) > 1) {
                    if (reanchor) {
                        throw new Reanchor();
                    }
                    throw new Breakdown(model.breakdown(yc) + " at t = " + tc);
                }
            }
        };
        int stopIdx = 0;
        while (true) {
            double target = stopIdx < stopList.length ? stopList[stopIdx] : t1;
            double segSpan = Math.abs(target - t);
            DormandPrince853Integrator dp = new DormandPrince853Integrator(1e-13 * span, span, tol, tol);
            dp.setMaxEvaluations((int) Math.min(Integer.MAX_VALUE, Math.max(1000, maxEvaluations - counters[0])));
            dp.addStepHandler(handler);
            lastT[0] = t;
            System.arraycopy(y, 0, lastY, 0, sz);
            boolean restart = false;
            try {
                if (segSpan > 0) {
                    double[] out = new double[sz];
                    dp.integrate(ode, t, y.clone(), target, out);
                    System.arraycopy(out, 0, y, 0, sz);
                }
                t = target;
                if (target == t1) {
                    break;
                }
                stopIdx++;
            } catch (Reanchor e) {
                restart = true;
            } catch (Singular | MathIllegalStateException | MathIllegalArgumentException e) {
                if (!reanchor || lastT[0] == t) {
                    res.failure = (e instanceof Singular ? "the chart is singular" : "the coordinate integrator failed ("
                            + e.getMessage() + ")") + " at t = " + lastT[0]
                            + (reanchor ? " and re-anchoring made no progress" : " (re-anchoring is off)");
                    break;
                }
                restart = true;
            } catch (Breakdown e) {
                res.failure = e.getMessage();
                break;
            } catch (Cancelled e) {
                res.cancelled = true;
                res.failure = "cancelled by the monitor at t = " + lastT[0];
                break;
            }
            if (restart) {
                model.reconstruct(lastY, pR, pI);
                times(n, pR, pI, base, baseIsIdentity[0], wR, wI);
                baseIsIdentity[0] = false;
                double[] s = base[0];
                base[0] = wR;
                wR = s;
                s = base[1];
                base[1] = wI;
                wI = s;
                t = lastT[0];
                Arrays.fill(y, 0.0);
                res.charts++;
                if (res.charts > maxCharts) {
                    res.failure = "more than " + maxCharts + " charts were needed (re-anchored at t = " + t
                            + "); the chart turns singular too often to help";
                    break;
                }
            }
            if (counters[0] >= maxEvaluations) {
                res.failure = "evaluation limit " + maxEvaluations + " reached at t = " + t;
                break;
            }
        }
        res.evaluations = counters[0];
        res.steps = counters[1];
        if (res.failure == null) {
            model.reconstruct(y, pR, pI);
            double[] ur = new double[len], ui = new double[len];
            times(n, pR, pI, base, baseIsIdentity[0], ur, ui);
            res.uRe = ur;
            res.uIm = ui;
            res.sampleY.add(y.clone());
        }
        return res;
    }

    /** out = p·base, skipping the product while the base is still the identity. */
    private static void times(int n, double[] pR, double[] pI, double[][] base, boolean identity, double[] outR,
                              double[] outI) {
        if (identity) {
            System.arraycopy(pR, 0, outR, 0, n * n);
            System.arraycopy(pI, 0, outI, 0, n * n);
        } else {
            Small.mulLarge(n, pR, pI, base[0], base[1], outR, outI);
        }
    }
}
