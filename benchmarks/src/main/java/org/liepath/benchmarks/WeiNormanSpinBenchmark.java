package org.liepath.benchmarks;

import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.core.Spin;
import org.liepath.integrators.Evolution;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;
import org.liepath.integrators.WeiNorman;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.openjdk.jmh.runner.options.TimeValue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;

/**
 * Spin j in a time-dependent field H(t) = ω0 Jz + Ω cos(ωt) Jx + Ω' cos(ω't + φ) Jy over [0, T]: the propagator by
 * Wei–Norman coordinates (3 coordinates of the chart exp(g1(−iJz)) exp(g2(−iJy)) exp(g3(−iJx)) integrated by DP853,
 * plus one reconstruction with unitary factors) against full-dimension propagation with the default commutator-free
 * scheme (CF4:3Opt) at the same tolerance. The ratio full / Wei–Norman is printed by {@link #main}.
 *
 * <p>Run: {@code java -cp benchmarks/target/benchmarks.jar org.liepath.benchmarks.WeiNormanSpinBenchmark} (prints the
 * ratios), or through JMH's own main with the regex {@code WeiNormanSpin}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class WeiNormanSpinBenchmark {
    /** Tolerance of both methods. */
    static final double TOL = 1e-8;
    /** Length of the time window. */
    static final double T = 2.0;

    @Param({"5", "25", "100"})
    public double j;

    Hamiltonian h;
    WeiNorman chart;

    @Setup(Level.Trial)
    public void setup() {
        Spin s = Spin.of(j);
        h = Hamiltonian.builder(s.dim()).term(1.0, s.z()).term(s.x(), Drive.cosine(0.6, 1.0, 0))
                .term(s.y(), Drive.cosine(0.3, 0.7, 0.4)).build();
        chart = WeiNorman.of(List.of(s.z().timesI().scale(-1), s.y().timesI().scale(-1), s.x().timesI().scale(-1)));
    }

    @Benchmark
    public Operator weiNorman() {
        return Evolve.of(h).over(0, T).scheme(Scheme.weiNorman(chart)).tolerance(TOL).run().propagator();
    }

    @Benchmark
    public Operator fullCommutatorFree() {
        return Evolve.of(h).over(0, T).scheme(Scheme.commutatorFree4Opt()).tolerance(TOL).run().propagator();
    }

    /**
     * Runs both benchmarks and prints time ratios and the difference of the two propagators per j. j = 5 and 25 run
     * as average-time measurements; j = 100, whose full-dimension run takes minutes, as single shots (one for the
     * full run, three for Wei–Norman).
     */
    public static void main(String[] args) throws Exception {
        String name = WeiNormanSpinBenchmark.class.getSimpleName();
        Options small = new OptionsBuilder().include(name).param("j", "5", "25").forks(1).warmupIterations(2)
                .measurementIterations(3).warmupTime(TimeValue.seconds(1)).measurementTime(TimeValue.seconds(2))
                .build();
        Options bigWn = new OptionsBuilder().include(name + ".weiNorman").param("j", "100").forks(1)
                .mode(Mode.SingleShotTime).warmupIterations(1).measurementIterations(3).build();
        Options bigFull = new OptionsBuilder().include(name + ".fullCommutatorFree").param("j", "100").forks(1)
                .mode(Mode.SingleShotTime).warmupIterations(0).measurementIterations(1).build();
        List<RunResult> results = new ArrayList<>(new Runner(small).run());
        results.addAll(new Runner(bigWn).run());
        results.addAll(new Runner(bigFull).run());
        Map<Double, double[]> byJ = new TreeMap<>();
        for (RunResult r : results) {
            double jj = Double.parseDouble(r.getParams().getParam("j"));
            double score = r.getPrimaryResult().getScore();
            double[] pair = byJ.computeIfAbsent(jj, k -> new double[2]);
            if (r.getParams().getBenchmark().endsWith("weiNorman")) {
                pair[0] = score;
            } else {
                pair[1] = score;
            }
        }
        for (Map.Entry<Double, double[]> e : byJ.entrySet()) {
            WeiNormanSpinBenchmark b = new WeiNormanSpinBenchmark();
            b.j = e.getKey();
            b.setup();
            Evolution w = Evolve.of(b.h).over(0, T).scheme(Scheme.weiNorman(b.chart)).tolerance(TOL).run();
            Evolution f = Evolve.of(b.h).over(0, T).scheme(Scheme.commutatorFree4Opt()).tolerance(TOL).run();
            System.out.printf("j = %s: Wei–Norman %.3f ms, full CF4:3Opt %.1f ms, ratio %.1f×, charts %d, "
                            + "‖U_wn − U_full‖_F = %.2e%n", e.getKey(), e.getValue()[0], e.getValue()[1],
                    e.getValue()[1] / e.getValue()[0], w.stats().charts(),
                    w.propagator().minus(f.propagator()).norm());
        }
    }
}
