package org.liepath.core;

import org.apache.commons.math3.analysis.interpolation.SplineInterpolator;
import org.apache.commons.math3.analysis.polynomials.PolynomialSplineFunction;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

import java.util.Arrays;
import java.util.Locale;
import java.util.TreeSet;

/**
 * A real time-dependent control amplitude c(t), the coefficient of one operator in a control-affine Hamiltonian.
 *
 * <p>Any lambda {@code t -> ...} is a drive. The factories give drives that also know their {@linkplain #name()
 * name} (used in error messages and reports) and their {@linkplain #breakpoints() breakpoints}: times where the drive
 * or its derivatives jump, onto which integrators land exactly. Units: the reciprocal of the time unit (ħ = 1);
 * frequencies are angular.
 *
 * <p>Drives must be pure functions of t and safe to call from several threads at once; all factory drives are
 * immutable.
 */
@FunctionalInterface
public interface Drive {
    /**
     * @param t the time
     * @return the amplitude at time t
     */
    double at(double t);

    /** @return times at which the drive is not smooth, ascending, possibly empty (default: none) */
    default double[] breakpoints() {
        return new double[0];
    }

    /** @return a short human-readable description (default: "drive") */
    default String name() {
        return "drive";
    }

    /** @return whether the drive is constant between consecutive breakpoints (default: false) */
    default boolean isPiecewiseConstant() {
        return false;
    }

    /**
     * @param name the name
     * @return the same function with a new name
     */
    default Drive named(String name) {
        Require.nonNull(name, "name");
        return Drives.wrap(this, name);
    }

    /**
     * @param other the other operand
     * @return c(t) + other(t), breakpoints merged
     */
    default Drive plus(Drive other) {
        Require.nonNull(other, "other");
        Drive self = this;
        boolean pc = isPiecewiseConstant() && other.isPiecewiseConstant();
        return Drives.make(t -> self.at(t) + other.at(t), Drives.merge(breakpoints(), other.breakpoints()),
                "(" + name() + " + " + other.name() + ")", pc);
    }

    /**
     * @param other the other operand
     * @return c(t)·other(t), breakpoints merged
     */
    default Drive times(Drive other) {
        Require.nonNull(other, "other");
        Drive self = this;
        boolean pc = isPiecewiseConstant() && other.isPiecewiseConstant();
        return Drives.make(t -> self.at(t) * other.at(t), Drives.merge(breakpoints(), other.breakpoints()),
                name() + "·" + other.name(), pc);
    }

    /**
     * @param s the factor
     * @return s·c(t)
     */
    default Drive scale(double s) {
        Require.finite(s, "s");
        Drive self = this;
        return Drives.make(t -> s * self.at(t), breakpoints(), fmt(s) + "·" + name(), isPiecewiseConstant());
    }

    /**
     * @param dt the step length
     * @return c(t − dt), breakpoints shifted
     */
    default Drive shift(double dt) {
        Require.finite(dt, "dt");
        Drive self = this;
        double[] b = breakpoints().clone();
        for (int k = 0; k < b.length; k++) {
            b[k] += dt;
        }
        return Drives.make(t -> self.at(t - dt), b, name() + "(t" + signed(-dt) + ")", isPiecewiseConstant());
    }

    /**
     * @param start the start of the window
     * @param end the end of the window
     * @return c(t) on [start, end), zero elsewhere (a window with breakpoints at both ends)
     */
    default Drive window(double start, double end) {
        Require.finite(start, "start");
        Require.finite(end, "end");
        if (!(end > start)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "end", "end > start = " + start, end);
        }
        Drive self = this;
        // the drive is zero outside the window, so breakpoints outside it are not breakpoints of the result
        double[] inside = Arrays.stream(breakpoints()).filter(b -> b > start && b < end).toArray();
        return Drives.make(t -> t >= start && t < end ? self.at(t) : 0.0,
                Drives.merge(inside, new double[]{start, end}),
                name() + " on [" + fmt(start) + ", " + fmt(end) + ")", isPiecewiseConstant());
    }

    // ------------------------------------------------------------------ factories

    /**
     * @param c the coefficient
     * @return the constant drive c
     */
    static Drive constant(double c) {
        Require.finite(c, "c");
        return Drives.make(t -> c, new double[0], fmt(c), true);
    }

    /**
     * @param amplitude the amplitude
     * @param omega the angular frequency
     * @param phase the phase (radians)
     * @return a cos(ω t + φ)
     */
    static Drive cosine(double amplitude, double omega, double phase) {
        Require.finite(amplitude, "amplitude");
        Require.finite(omega, "omega");
        Require.finite(phase, "phase");
        return Drives.make(t -> amplitude * Math.cos(omega * t + phase), new double[0],
                fmt(amplitude) + "·cos(" + fmt(omega) + "t" + signed(phase) + ")", false);
    }

    /**
     * @param amplitude the amplitude
     * @param omega the angular frequency
     * @return a cos(ω t)
     */
    static Drive cosine(double amplitude, double omega) {
        return cosine(amplitude, omega, 0.0);
    }

    /**
     * @param amplitude the amplitude
     * @param omega the angular frequency
     * @param phase the phase (radians)
     * @return a sin(ω t + φ)
     */
    static Drive sine(double amplitude, double omega, double phase) {
        Require.finite(amplitude, "amplitude");
        Require.finite(omega, "omega");
        Require.finite(phase, "phase");
        return Drives.make(t -> amplitude * Math.sin(omega * t + phase), new double[0],
                fmt(amplitude) + "·sin(" + fmt(omega) + "t" + signed(phase) + ")", false);
    }

    /**
     * @param amplitude the amplitude
     * @param center the time of the peak
     * @param sigma the width σ (positive)
     * @return a exp(−(t − t0)²/(2σ²))
     */
    static Drive gaussian(double amplitude, double center, double sigma) {
        Require.finite(amplitude, "amplitude");
        Require.finite(center, "center");
        Require.positive(sigma, "sigma");
        return Drives.make(t -> {
            double u = (t - center) / sigma;
            return amplitude * Math.exp(-0.5 * u * u);
        }, new double[0], fmt(amplitude) + "·gauss(" + fmt(center) + ", " + fmt(sigma) + ")", false);
    }

    /**
     * A piecewise-constant drive: value {@code values[k]} on [times[k], times[k+1]), and 0 before times[0] and from
     * times[n] on. Every time is a breakpoint, so exact piecewise stepping takes one exponential per segment.
     *
     * @param times  n+1 strictly increasing finite times
     * @param values n finite values
     * @return a piecewise-constant drive
     */
    static Drive piecewiseConstant(double[] times, double[] values) {
        Require.nonNull(times, "times");
        Require.nonNull(values, "values");
        Require.finite(times, "times");
        Require.finite(values, "values");
        if (values.length == 0) {
            throw InvalidInputException.of(Reason.EMPTY, "values", "at least one segment value", "none");
        }
        if (times.length != values.length + 1) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "times", "values.length + 1 = " + (values.length + 1)
                    + " increasing times (values non-empty)", times.length + " times");
        }
        for (int k = 1; k < times.length; k++) {
            if (!(times[k] > times[k - 1])) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "times", "strictly increasing times",
                        times[k - 1] + " then " + times[k] + " at index " + k);
            }
        }
        double[] tt = times.clone(), vv = values.clone();
        return Drives.make(t -> {
            if (t < tt[0] || t >= tt[tt.length - 1]) {
                return 0.0;
            }
            int k = Arrays.binarySearch(tt, t);
            if (k < 0) {
                k = -k - 2;
            }
            return vv[Math.min(k, vv.length - 1)];
        }, tt, "piecewise(" + vv.length + " segments)", true);
    }

    /**
     * Equally spaced piecewise-constant samples: value {@code values[k]} on [t0 + k·dt, t0 + (k+1)·dt).
     *
     * @param t0 the start time
     * @param dt the step length
     * @param values the values
     * @return the piecewise-constant drive
     */
    static Drive samples(double t0, double dt, double... values) {
        Require.finite(t0, "t0");
        Require.positive(dt, "dt");
        Require.nonNull(values, "values");
        double[] times = new double[values.length + 1];
        for (int k = 0; k <= values.length; k++) {
            times[k] = t0 + k * dt;
        }
        return piecewiseConstant(times, values);
    }

    /**
     * A natural cubic spline through (times[k], values[k]) (Apache Commons Math {@code SplineInterpolator}); constant
     * extrapolation outside [times[0], times[n−1]]. Knots are breakpoints (the third derivative jumps there).
     *
     * @param times at least 3 strictly increasing finite times
     * @param values the values
     * @return a natural cubic spline through (times[k], values[k]) (Apache Commons Math {@code SplineInterpolator})
     */
    static Drive spline(double[] times, double[] values) {
        Require.nonNull(times, "times");
        Require.nonNull(values, "values");
        Require.finite(times, "times");
        Require.finite(values, "values");
        if (times.length < 3) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "times", "at least 3 knots",
                    times.length + " times");
        }
        if (values.length != times.length) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "values",
                    "as many values as times (" + times.length + ")", values.length + " values");
        }
        for (int k = 1; k < times.length; k++) {
            if (!(times[k] > times[k - 1])) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "times", "strictly increasing times",
                        times[k - 1] + " then " + times[k] + " at index " + k);
            }
        }
        PolynomialSplineFunction f = new SplineInterpolator().interpolate(times.clone(), values.clone());
        double lo = times[0], hi = times[times.length - 1], vlo = values[0], vhi = values[values.length - 1];
        return Drives.make(t -> t <= lo ? vlo : t >= hi ? vhi : f.value(t), times.clone(),
                "spline(" + times.length + " knots)", false);
    }

    /** " + v" or " − |v|" (empty for 0), so that names read "cos(2t − 0.5000)" rather than "cos(2t + -0.5000)". */
    private static String signed(double v) {
        return v == 0 ? "" : (v > 0 ? " + " : " − ") + fmt(Math.abs(v));
    }

    private static String fmt(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e6 ? Long.toString((long) v) : String.format(Locale.ROOT, "%.4g", v);
    }
}

/** Implementation helpers for {@link Drive} factories (package-private). */
final class Drives {
    private Drives() {
    }

    static Drive make(java.util.function.DoubleUnaryOperator f, double[] breakpoints, String name, boolean pc) {
        return new Named(f, breakpoints, name, pc);
    }

    static Drive wrap(Drive d, String name) {
        return new Named(d::at, d.breakpoints(), name, d.isPiecewiseConstant());
    }

    static double[] merge(double[] a, double[] b) {
        TreeSet<Double> s = new TreeSet<>();
        // + 0.0 maps −0.0 to 0.0: TreeSet orders them as distinct values, which would make a zero-length segment
        for (double x : a) {
            s.add(x + 0.0);
        }
        for (double x : b) {
            s.add(x + 0.0);
        }
        double[] out = new double[s.size()];
        int k = 0;
        for (double x : s) {
            out[k++] = x;
        }
        return out;
    }

    private static final class Named implements Drive {
        private final java.util.function.DoubleUnaryOperator f;
        private final double[] breakpoints;
        private final String name;
        private final boolean pc;

        Named(java.util.function.DoubleUnaryOperator f, double[] breakpoints, String name, boolean pc) {
            this.f = f;
            this.breakpoints = breakpoints;
            this.name = name;
            this.pc = pc;
        }

        @Override
        public double at(double t) {
            return f.applyAsDouble(t);
        }

        @Override
        public double[] breakpoints() {
            return breakpoints.clone();
        }

        @Override
        public String name() {
            return name;
        }

        @Override
        public boolean isPiecewiseConstant() {
            return pc;
        }

        @Override
        public String toString() {
            return name;
        }
    }
}
