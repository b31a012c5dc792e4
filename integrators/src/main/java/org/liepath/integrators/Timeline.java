package org.liepath.integrators;

import org.liepath.core.Operator;
import org.liepath.core.StateVector;
import org.liepath.core.Superoperator;
import org.liepath.core.internal.Require;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * The samples of an evolution in the order they were reached: always the start time t0 and the time reached (t1
 * on success), plus the times requested with {@link Evolve#sampleAt} and, with {@link Evolve#sampleEveryStep()}, the
 * end of every accepted step. Sample times are hit exactly (steps land on them), never interpolated.
 *
 * <p>What a sample holds follows the run's mode: a propagator U(t, t0) ({@link #propagator(int)}), a state ψ(t)
 * ({@link #state(int)}), a density ρ(t) ({@link #density(int)}) or a dynamical map ({@link #channel(int)}); the
 * other accessors throw {@link IllegalStateException}.
 *
 * <p>Immutable and thread-safe.
 */
public final class Timeline {
    enum Mode { PROPAGATOR, STATE, DENSITY, CHANNEL }

    private final Mode mode;
    private final int n;
    private final double[] times;
    private final List<double[]> re, im;

    Timeline(Mode mode, int n, List<Double> times, List<double[]> re, List<double[]> im) {
        this.mode = mode;
        this.n = n;
        this.times = new double[times.size()];
        for (int k = 0; k < this.times.length; k++) {
            this.times[k] = times.get(k);
        }
        this.re = Collections.unmodifiableList(new ArrayList<>(re));
        this.im = Collections.unmodifiableList(new ArrayList<>(im));
    }

    /** @return the number of samples */
    public int size() {
        return times.length;
    }

    /** @return the sample times (a copy) */
    public double[] times() {
        return times.clone();
    }

    /**
     * @param k the index
     * @return the time of sample k
     */
    public double time(int k) {
        Require.index(k, times.length, "k");
        return times[k];
    }

    /**
     * @param k the index
     * @return U(t_k, t0)
     */
    public Operator propagator(int k) {
        need(Mode.PROPAGATOR, k);
        return Operator.ofPlanar(n, re.get(k), im.get(k));
    }

    /**
     * @param k the index
     * @return ψ(t_k)
     */
    public StateVector state(int k) {
        need(Mode.STATE, k);
        return StateVector.of(re.get(k), im.get(k));
    }

    /**
     * @param k the index
     * @return ρ(t_k)
     */
    public Operator density(int k) {
        need(Mode.DENSITY, k);
        return unvec(n, re.get(k), im.get(k));
    }

    /**
     * @param k the index
     * @return the dynamical map from t0 to t_k
     */
    public Superoperator channel(int k) {
        need(Mode.CHANNEL, k);
        return Superoperator.ofMatrix(Operator.ofPlanar(n * n, re.get(k), im.get(k)));
    }

    private void need(Mode wanted, int k) {
        Require.index(k, times.length, "k");
        if (mode != wanted) {
            throw new IllegalStateException("this trajectory holds " + mode.name().toLowerCase()
                    + " samples, not " + wanted.name().toLowerCase() + " samples");
        }
    }

    /** ρ from its column-stacked vector. */
    static Operator unvec(int n, double[] vr, double[] vi) {
        double[] r = new double[n * n], i = new double[n * n];
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                r[a * n + b] = vr[a + n * b];
                i[a * n + b] = vi[a + n * b];
            }
        }
        return Operator.ofPlanar(n, r, i);
    }

    /** The column-stacked vector of ρ into (vr, vi). */
    static void vec(Operator rho, double[] vr, double[] vi) {
        int n = rho.dim();
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                vr[a + n * b] = rho.re(a, b);
                vi[a + n * b] = rho.im(a, b);
            }
        }
    }

    @Override
    public String toString() {
        return "Timeline of " + times.length + " " + mode.name().toLowerCase() + " samples";
    }

}
