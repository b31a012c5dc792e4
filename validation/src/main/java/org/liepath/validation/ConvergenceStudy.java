package org.liepath.validation;

import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.internal.Require;
import org.liepath.integrators.Evolution;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;
import org.liepath.validation.internal.TextTable;

import java.util.ArrayList;
import java.util.List;
import java.util.function.IntFunction;

/**
 * An observed order of convergence: a fixed-step method is run at step counts n, 2n, 4n, … (halving step sizes),
 * each result is compared with a reference in the Frobenius norm, and the slope of log(error) against log(step size)
 * is fitted over the asymptotic range (common practice; see E. Hairer, S.P. Nørsett, G. Wanner, Solving Ordinary
 * Differential Equations I, 2nd ed., Springer 1993, §II.1 for the order of a one-step method, global error O(hᵖ)).
 *
 * <p><b>Fitted range.</b> Points whose error is below the noise floor {@link #NOISE_FLOOR}·max(1, ‖reference‖_F)
 * are dropped (rounding dominates there). Among the remaining consecutive points, the longest run whose local slopes
 * log₂(e_k/e_{k+1}) (per halving) lie within {@link #SLOPE_SPREAD} of each other is fitted by least squares, the
 * finer run winning ties; pre-asymptotic coarse points, where the slope has not settled, are thereby excluded.
 * {@link #observedOrder()} is NaN when fewer than two points are usable.
 *
 * <p>Build with {@link #of(String, IntFunction, Operator)} (any method that returns an operator for a step count)
 * and {@link Builder#run()}; the result is immutable and thread-safe.
 */
public final class ConvergenceStudy {
    /**
     * Relative error below which points are treated as rounding: ~10³–10⁴ steps of n×n products accumulate a few
     * ·1e-14 to ·1e-13 (N.J. Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM 2002, §3.5); a
     * factor of ten above that. Common practice.
     */
    public static final double NOISE_FLOOR = 1e-12;

    /** Largest spread of local slopes (order units) inside a fitted range. Common practice. */
    public static final double SLOPE_SPREAD = 0.6;

    /** Most halvings a study may do. */
    public static final int MAX_LEVELS = 20;

    /** One run of the study. Immutable and thread-safe. */
    public record Point(int steps, double stepSize, double error, long evaluations, double seconds) {
    }

    /**
     * What a run returns: the result (null if the run failed: the point is then unusable) and, where known, the
     * number of generator evaluations (−1 if unknown). Immutable (operators are immutable) and thread-safe.
     */
    public record Outcome(Operator result, long evaluations) {
    }

    private final String label;
    private final List<Point> points;
    private final int first, last;   // fitted range, inclusive; −1 if none
    private final double order;

    private ConvergenceStudy(String label, List<Point> points, int first, int last, double order) {
        this.label = label;
        this.points = points;
        this.first = first;
        this.last = last;
        this.order = order;
    }

    /**
     * Starts a study of a method given as a function from a step count to its result.
     *
     * @param label     a name for tables and plots
     * @param method    steps ↦ result (e.g. a propagator over a fixed interval); called once per level
     * @param reference the exact or high-accuracy result
     * @return a builder for the study
     */
    public static Builder of(String label, IntFunction<Operator> method, Operator reference) {
        // a null result from the method marks a failed run (unusable point)
        Require.nonNull(method, "method");
        return new Builder(label, n -> new Outcome(method.apply(n), -1), reference);
    }

    /**
     * As {@link #of(String, IntFunction, Operator)} with a method that also reports its evaluation count.
     *
     * @param label the label
     * @param method the method: from a step count to its result and evaluation count
     * @param reference the reference result
     * @return a builder for the study
     */
    public static Builder ofOutcomes(String label, IntFunction<Outcome> method, Operator reference) {
        Require.nonNull(method, "method");
        return new Builder(label, method, reference);
    }

    /**
     * Starts a study of a scheme with fixed steps on a Hamiltonian's propagator over [t0, t1], against the reference
     * integrator at {@link CrossCheck#DEFAULT_REFERENCE_TOLERANCE} (computed here, once). Evaluation counts come
     * from the runs' statistics. A run that does not succeed gives an unusable (NaN) point.
     *
     * @param h the Hamiltonian
     * @param t0 the start time
     * @param t1 the end time
     * @param scheme the scheme
     * @return a builder for the study
     */
    public static Builder of(Hamiltonian h, double t0, double t1, Scheme scheme) {
        Require.nonNull(h, "h");
        Operator ref = Evolve.of(h).over(t0, t1).scheme(Scheme.reference())
                .tolerance(CrossCheck.DEFAULT_REFERENCE_TOLERANCE).run().propagator();
        return of(h, t0, t1, scheme, ref);
    }

    /**
     * As {@link #of(Hamiltonian, double, double, Scheme)} with a given reference propagator (shared between studies).
     *
     * @param h the Hamiltonian
     * @param t0 the start time
     * @param t1 the end time
     * @param scheme the scheme
     * @param reference the reference result
     * @return a builder for the study
     */
    public static Builder of(Hamiltonian h, double t0, double t1, Scheme scheme, Operator reference) {
        Require.nonNull(h, "h");
        Require.nonNull(scheme, "scheme");
        Evolve base = Evolve.of(h).over(t0, t1).scheme(scheme);
        return ofOutcomes(scheme.name(), n -> {
            Evolution e = base.steps(n).run();
            return new Outcome(e.status().isSuccess() ? e.propagator() : null, e.stats().evaluations());
        }, reference).span(Math.abs(t1 - t0));
    }

    /** Mutable builder of a study; not thread-safe. */
    public static final class Builder {
        private final String label;
        private final IntFunction<Outcome> method;
        private final Operator reference;
        private int start = 8, levels = 6;
        private double span = 1;

        private Builder(String label, IntFunction<Outcome> method, Operator reference) {
            this.label = Require.nonNull(label, "label");
            this.method = method;
            this.reference = Require.nonNull(reference, "reference");
        }

        /**
         * @param startSteps the coarsest step count (≥ 1)
         * @param levels     how many runs (2 … {@value #MAX_LEVELS}); the finest uses startSteps·2^(levels−1)
         * @return this builder
         */
        public Builder steps(int startSteps, int levels) {
            Require.positive(startSteps, "startSteps");
            if (levels < 2 || levels > MAX_LEVELS) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "levels", "2 … " + MAX_LEVELS, levels);
            }
            if ((long) startSteps << (levels - 1) > Integer.MAX_VALUE) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "levels",
                        "a finest step count below 2³¹", startSteps + "·2^" + (levels - 1));
            }
            this.start = startSteps;
            this.levels = levels;
            return this;
        }

        /**
         * @param span the interval length |t1 − t0|, used to report step sizes (default 1)
         * @return this builder
         */
        public Builder span(double span) {
            this.span = Require.positive(span, "span");
            return this;
        }

        /**
         * Runs every level (sequentially, coarsest first) and fits the order.
         *
         * @return a copy with this setting
         */
        public ConvergenceStudy run() {
            List<Point> pts = new ArrayList<>();
            for (int l = 0; l < levels; l++) {
                int n = start << l;
                long t0 = System.nanoTime();
                Outcome o = Require.nonNull(method.apply(n), "method outcome");
                double sec = (System.nanoTime() - t0) * 1e-9;
                Operator r = o.result();
                double err = Double.NaN;
                if (r != null) {
                    Require.sameDim(reference.dim(), r.dim(), "method result");
                    err = r.distance(reference);
                }
                pts.add(new Point(n, span / n, err, o.evaluations(), sec));
            }
            return fit(label, pts, NOISE_FLOOR * Math.max(1, reference.norm()));
        }
    }

    /** Fits the order to given points (step sizes strictly decreasing) with the policy of the class comment. */
    static ConvergenceStudy fit(String label, List<Point> pts, double floor) {
        int m = pts.size();
        double[] slope = new double[Math.max(0, m - 1)];
        boolean[] usable = new boolean[m];
        for (int k = 0; k < m; k++) {
            double e = pts.get(k).error();
            usable[k] = Double.isFinite(e) && e > floor;
        }
        for (int k = 0; k + 1 < m; k++) {
            Point a = pts.get(k), b = pts.get(k + 1);
            slope[k] = Math.log(a.error() / b.error()) / Math.log(a.stepSize() / b.stepSize());
        }
        int bestA = -1, bestB = -1;
        for (int a = 0; a < m; a++) {
            double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            for (int b = a; b < m && usable[b]; b++) {
                if (b > a) {
                    lo = Math.min(lo, slope[b - 1]);
                    hi = Math.max(hi, slope[b - 1]);
                    if (hi - lo > SLOPE_SPREAD) {
                        break;
                    }
                    if (b - a >= bestB - bestA) {
                        bestA = a;
                        bestB = b;
                    }
                }
            }
        }
        double order = Double.NaN;
        if (bestA >= 0) {
            double sx = 0, sy = 0, sxx = 0, sxy = 0;
            int c = bestB - bestA + 1;
            for (int k = bestA; k <= bestB; k++) {
                double x = Math.log(pts.get(k).stepSize()), y = Math.log(pts.get(k).error());
                sx += x;
                sy += y;
                sxx += x * x;
                sxy += x * y;
            }
            order = (c * sxy - sx * sy) / (c * sxx - sx * sx);
        }
        return new ConvergenceStudy(label, List.copyOf(pts), bestA, bestB, order);
    }

    /** @return the label given at construction */
    public String label() {
        return label;
    }

    /** @return the least-squares slope of log(error) vs log(step size) over {@link #fittedRange()}, or NaN */
    public double observedOrder() {
        return order;
    }

    /** @return the fitted points as {first, last} indices into {@link #points()} (inclusive), or an empty array */
    public int[] fittedRange() {
        return first < 0 ? new int[0] : new int[]{first, last};
    }

    /** @return whether at least two points were above the noise floor with a settled slope */
    public boolean isResolved() {
        return first >= 0;
    }

    /** @return all points, coarsest first */
    public List<Point> points() {
        return points;
    }

    private TextTable table() {
        TextTable t = new TextTable("steps", "step size", "error", "local order", "evaluations", "seconds", "fitted");
        for (int k = 0; k < points.size(); k++) {
            Point p = points.get(k);
            double local = k == 0 ? Double.NaN
                    : Math.log(points.get(k - 1).error() / p.error()) / Math.log(points.get(k - 1).stepSize() / p.stepSize());
            t.add(p.steps(), TextTable.sci(p.stepSize()), TextTable.sci(p.error()), TextTable.fixed(local, 2),
                    p.evaluations() < 0 ? "—" : p.evaluations(), TextTable.fixed(p.seconds(), 4),
                    k >= first && k <= last && first >= 0 ? "yes" : "");
        }
        return t;
    }

    /** @return the points as CSV (steps, step size, error, local order, evaluations, seconds, fitted) */
    public String toCsv() {
        return table().csv();
    }

    /** @return the points as a Markdown table */
    public String toMarkdown() {
        return table().markdown();
    }

    @Override
    public String toString() {
        String range = first < 0 ? "no usable range"
                : "fitted on steps " + points.get(first).steps() + " … " + points.get(last).steps();
        return "Convergence of " + label + ": observed order " + TextTable.fixed(order, 2) + " (" + range + ")\n"
                + table().text();
    }
}
