package org.liepath.benchmarks;

import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Supplier;

/**
 * Work–precision study (not JMH: whole-run thread CPU time, best of several repetitions after warm-up): for every problem
 * of {@link BenchProblems}, every fixed-step scheme over a doubling sweep of step counts and the Commons Math
 * Dormand–Prince 8(5,3) comparator over a sweep of tolerances, prints error against wall time with the unitarity
 * defect, then the time each needs for error 1e-10 (log–log interpolation between the bracketing runs) and the ratio
 * of the best Liepath scheme to the comparator.
 *
 * <p>Errors are max-entry distances to a reference propagator: magnus8 with many steps, cross-checked against the
 * comparator at tolerance 1e-14 (the agreement is printed). Run: {@code java -cp benchmarks.jar
 * org.liepath.benchmarks.WorkPrecision [problem…]}. Rough on a shared 2-core machine.
 */
public final class WorkPrecision {
    static final double TARGET = 1e-10;

    private WorkPrecision() {
    }

    /** Schemes in the study, by name. */
    static final Map<String, Supplier<Scheme>> SCHEMES = new LinkedHashMap<>();

    static {
        SCHEMES.put("exponentialMidpoint", Scheme::exponentialMidpoint);
        SCHEMES.put("magnus4", Scheme::magnus4);
        SCHEMES.put("magnus6", Scheme::magnus6);
        SCHEMES.put("magnus8", Scheme::magnus8);
        SCHEMES.put("commutatorFree4", Scheme::commutatorFree4);
        SCHEMES.put("commutatorFree4Opt", Scheme::commutatorFree4Opt);
        SCHEMES.put("commutatorFree6", Scheme::commutatorFree6);
        SCHEMES.put("magnus4Interaction", () -> Scheme.magnus4().inInteractionPicture());
        SCHEMES.put("magnus6Interaction", () -> Scheme.magnus6().inInteractionPicture());
        SCHEMES.put("magnus8Interaction", () -> Scheme.magnus8().inInteractionPicture());
    }

    /** One measured run. */
    record Point(double work, double seconds, double error, double unitarity) {
    }

    private static final java.lang.management.ThreadMXBean THREADS = java.lang.management.ManagementFactory.getThreadMXBean();

    /** CPU time of the current thread in ns (wall time if the JVM cannot measure it). */
    static long now() {
        return THREADS.isCurrentThreadCpuTimeSupported() ? THREADS.getCurrentThreadCpuTime() : System.nanoTime();
    }

    /**
     * Best-of thread CPU time of a task in seconds: warm up for ~0.2 s, then repeat until ~0.3 s are spent (at least
     * 3 runs). CPU time rather than wall time, because these machines are shared (load averages far above the core
     * count are common) and a descheduled thread must not count; the minimum discards runs disturbed by GC or caches.
     */
    static double time(Supplier<Operator> task) {
        long warmEnd = now() + 200_000_000L;
        int warm = 0;
        do {
            task.get();
            warm++;
        } while (now() < warmEnd && warm < 20);
        double best = Double.MAX_VALUE;
        long end = now() + 300_000_000L;
        int reps = 0;
        do {
            long t = now();
            task.get();
            best = Math.min(best, (now() - t) * 1e-9);
            reps++;
        } while (reps < 3 || (now() < end && reps < 50));
        return best;
    }

    static double unitarity(Operator u) {
        return u.dagger().times(u).distance(Operator.identity(u.dim()));
    }

    static double error(Operator u, Operator ref) {
        double m = 0;
        for (int i = 0; i < u.dim(); i++) {
            for (int j = 0; j < u.dim(); j++) {
                m = Math.max(m, u.get(i, j).subtract(ref.get(i, j)).abs());
            }
        }
        return m;
    }

    /** Wall time at error {@link #TARGET}, interpolated log–log between the runs that bracket it (NaN if none). */
    static double timeAtTarget(List<Point> pts) {
        for (int k = 1; k < pts.size(); k++) {
            Point a = pts.get(k - 1), b = pts.get(k);
            if (a.error >= TARGET && b.error <= TARGET) {
                if (a.error == b.error) {
                    return b.seconds;
                }
                double f = (Math.log(TARGET) - Math.log(a.error)) / (Math.log(b.error) - Math.log(a.error));
                return Math.exp(Math.log(a.seconds) + f * (Math.log(b.seconds) - Math.log(a.seconds)));
            }
        }
        return pts.isEmpty() || pts.get(0).error > TARGET ? Double.NaN : pts.get(0).seconds;
    }

    static Operator ours(Hamiltonian h, BenchProblems p, Scheme s, int steps) {
        return Evolve.of(h).over(p.t0, p.t1).scheme(s).steps(steps).run().propagator();
    }

    /** Runs the study for one problem and returns (best Liepath time, comparator time) at the target error. */
    static double[] study(BenchProblems p) {
        Hamiltonian h = p.hamiltonian();
        System.out.printf(Locale.ROOT, "%n== %s (dim %d, [%g, %g]) ==%n", p, h.dim(), p.t0, p.t1);
        int refSteps = p.referenceSteps;
        Operator ref = ours(h, p, Scheme.magnus8(), refSteps);
        Operator refHalf = ours(h, p, Scheme.magnus8(), refSteps / 2);
        Operator cm = new CommonsDormandPrince(h).propagate(p.t0, p.t1, 1e-14);
        System.out.printf(Locale.ROOT, "reference: magnus8 with %d steps; vs %d steps %.1e; vs Commons DP853 at tol 1e-14 %.1e%n",
                refSteps, refSteps / 2, error(refHalf, ref), error(cm, ref));
        System.out.printf(Locale.ROOT, "%-22s %10s %12s %12s %12s%n", "method", "steps/tol", "cpu seconds", "error", "‖U†U−I‖");
        double best = Double.NaN;
        String bestName = "";
        for (Map.Entry<String, Supplier<Scheme>> e : SCHEMES.entrySet()) {
            Scheme s = e.getValue().get();
            List<Point> pts = new ArrayList<>();
            for (int steps = 2; steps <= 1 << 16; steps *= 2) {
                int n = steps;
                Operator u = ours(h, p, s, n);
                double err = error(u, ref);
                double sec = time(() -> ours(h, p, s, n));
                pts.add(new Point(n, sec, err, unitarity(u)));
                System.out.printf(Locale.ROOT, "%-22s %10d %12.3e %12.3e %12.3e%n", e.getKey(), n, sec, err, unitarity(u));
                if (err < 1e-12 || sec > 2) {
                    break;
                }
            }
            double t = timeAtTarget(pts);
            System.out.printf(Locale.ROOT, "%-22s time at error %.0e: %.3e s%n", e.getKey(), TARGET, t);
            if (!Double.isNaN(t) && !(t >= best)) {
                best = t;
                bestName = e.getKey();
            }
        }
        List<Point> pts = new ArrayList<>();
        for (double tol = 1e-6; tol >= 1e-14; tol /= 10) {
            double tl = tol;
            CommonsDormandPrince dp = new CommonsDormandPrince(h);
            Operator u = dp.propagate(p.t0, p.t1, tl);
            double err = error(u, ref);
            double sec = time(() -> new CommonsDormandPrince(h).propagate(p.t0, p.t1, tl));
            pts.add(new Point(tl, sec, err, unitarity(u)));
            System.out.printf(Locale.ROOT, "%-22s %10.0e %12.3e %12.3e %12.3e  (%d evaluations)%n", "CommonsDP853", tl, sec, err,
                    unitarity(u), dp.evaluations());
            if (err < 1e-12 || sec > 5) {
                break;
            }
        }
        double cmT = timeAtTarget(pts);
        System.out.printf(Locale.ROOT, "%-22s time at error %.0e: %.3e s%n", "CommonsDP853", TARGET, cmT);
        System.out.printf(Locale.ROOT, "RATIO %s: Commons DP853 / best Liepath (%s) at error %.0e = %.1f×%n", p, bestName,
                TARGET, cmT / best);
        return new double[]{best, cmT};
    }

    public static void main(String[] args) {
        List<BenchProblems> problems = new ArrayList<>();
        for (String a : args) {
            problems.add(BenchProblems.valueOf(a));
        }
        if (problems.isEmpty()) {
            problems.addAll(List.of(BenchProblems.values()));
        }
        for (BenchProblems p : problems) {
            study(p);
        }
    }
}
