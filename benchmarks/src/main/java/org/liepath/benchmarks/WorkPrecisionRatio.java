package org.liepath.benchmarks;

import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.function.Supplier;

/**
 * The work–precision ratios of {@link WorkPrecisionBenchmark} measured interleaved: in every round the Commons Math
 * Dormand–Prince 8(5,3) comparator and each candidate scheme run at their tuned work for error ≈ 1e-10 (the same
 * step counts and tolerance as the JMH benchmark), each timed as the best of at least three runs in thread CPU
 * time, and the round's ratio comparator / scheme is recorded. The median and quartiles over the rounds are
 * printed. On a shared machine whose speed drifts by tens of per cent between minutes, a ratio taken inside each
 * round cancels the drift that separate JMH trials of the two sides do not; the JMH benchmark remains the
 * reference for absolute times.
 *
 * <p>Run: {@code java -cp benchmarks.jar org.liepath.benchmarks.WorkPrecisionRatio [rounds] [problem…]}
 * (default 15 rounds, THREE_LEVEL and SIXTEEN_LEVEL).
 */
public final class WorkPrecisionRatio {
    private WorkPrecisionRatio() {
    }

    static final String[] CANDIDATES = {"magnus6", "magnus8", "magnus6Interaction", "magnus8Interaction"};

    /** Best-of thread CPU time of a task in seconds: at least three runs and at least ~0.1 s. */
    static double best(Supplier<Operator> task) {
        double best = Double.MAX_VALUE;
        long end = WorkPrecision.now() + 100_000_000L;
        int reps = 0;
        do {
            long t = WorkPrecision.now();
            task.get();
            best = Math.min(best, (WorkPrecision.now() - t) * 1e-9);
            reps++;
        } while (reps < 3 || WorkPrecision.now() < end);
        return best;
    }

    public static void main(String[] args) {
        int rounds = 15;
        List<String> problems = new ArrayList<>();
        for (String a : args) {
            if (a.matches("\\d+")) {
                rounds = Integer.parseInt(a);
            } else {
                problems.add(a);
            }
        }
        if (problems.isEmpty()) {
            problems.addAll(List.of("THREE_LEVEL", "SIXTEEN_LEVEL"));
        }
        for (String prob : problems) {
            BenchProblems p = BenchProblems.valueOf(prob);
            Hamiltonian h = p.hamiltonian();
            double tol = WorkPrecisionBenchmark.COMMONS_TOL.get(prob);
            Supplier<Operator> commons = () -> new CommonsDormandPrince(h).propagate(p.t0, p.t1, tol);
            List<Supplier<Operator>> ours = new ArrayList<>();
            for (String c : CANDIDATES) {
                Scheme s = WorkPrecision.SCHEMES.get(c).get();
                int steps = WorkPrecisionBenchmark.STEPS.get(prob).get(c);
                ours.add(() -> Evolve.of(h).over(p.t0, p.t1).scheme(s).steps(steps).run().propagator());
            }
            double[][] ratio = new double[CANDIDATES.length][rounds];
            double[] commonsT = new double[rounds];
            double[][] oursT = new double[CANDIDATES.length][rounds];
            for (int r = -2; r < rounds; r++) { // two warm-up rounds
                double c = best(commons);
                for (int k = 0; k < ours.size(); k++) {
                    double t = best(ours.get(k));
                    if (r >= 0) {
                        ratio[k][r] = c / t;
                        oursT[k][r] = t;
                    }
                }
                if (r >= 0) {
                    commonsT[r] = c;
                }
            }
            System.out.printf(Locale.ROOT, "%n== %s: %d interleaved rounds; Commons DP853 at tol %.1e, median %.1f µs ==%n",
                    prob, rounds, tol, 1e6 * median(commonsT));
            for (int k = 0; k < CANDIDATES.length; k++) {
                double[] q = quartiles(ratio[k]);
                System.out.printf(Locale.ROOT, "%-16s %6d steps  median %9.1f µs   ratio median %6.1f×  (quartiles %.1f–%.1f)%n",
                        CANDIDATES[k], WorkPrecisionBenchmark.STEPS.get(prob).get(CANDIDATES[k]), 1e6 * median(oursT[k]),
                        q[1], q[0], q[2]);
            }
        }
    }

    static double median(double[] x) {
        return quartiles(x)[1];
    }

    /** Lower quartile, median, upper quartile (nearest rank). */
    static double[] quartiles(double[] x) {
        double[] s = x.clone();
        Arrays.sort(s);
        int n = s.length;
        return new double[]{s[(n - 1) / 4], s[(n - 1) / 2], s[(3 * (n - 1)) / 4]};
    }
}
