package org.liepath.benchmarks;

import org.liepath.core.internal.Expm;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.openjdk.jmh.runner.options.TimeValue;

import java.util.Collection;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;

/**
 * The Padé increment e^Ω − I of an anti-Hermitian exponent Ω = −iH (H random Hermitian, scaled to ‖Ω‖₁ = norm; 0.5
 * and 1.5, degrees 7 and 9, are the per-step regime of the integrators):
 * {@link #structured} ({@link Expm#computeIncrementAntiHermitian}, half-cost Hermitian / anti-Hermitian products)
 * against its comparator {@link #general} ({@link Expm#computeIncrement} on the same Ω). {@link #main} runs both in
 * one JMH session and prints the ratio general / structured per (n, norm).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class SkewIncrementBenchmark {
    @Param({"3", "8", "16", "64"})
    public int n;

    @Param({"0.5", "1.5"})
    public double norm;

    double[] wr, wi, dr, di;
    Expm ws;

    @Setup
    public void setUp() {
        int len = n * n;
        double[][] w = HermitianExpBenchmark.randomSkew(new Random(5), n, norm);
        wr = w[0];
        wi = w[1];
        dr = new double[len];
        di = new double[len];
        ws = new Expm(n);
    }

    @Benchmark
    public double[] structured() {
        ws.computeIncrementAntiHermitian(1.0, wr, wi, dr, di);
        return dr;
    }

    @Benchmark
    public double[] general() {
        ws.computeIncrement(1.0, wr, wi, dr, di);
        return dr;
    }

    /**
     * Runs the benchmark briefly (1 fork, 3 + 5 iterations of 1 s; optional args: n values, norm values,
     * comma-separated) and prints the times and the ratio general / structured (> 1: the structured path is faster).
     */
    public static void main(String[] args) throws RunnerException {
        OptionsBuilder ob = new OptionsBuilder();
        ob.include(SkewIncrementBenchmark.class.getSimpleName()).forks(1).warmupIterations(3)
                .measurementIterations(5).warmupTime(TimeValue.seconds(1)).measurementTime(TimeValue.seconds(1));
        if (args.length > 0) {
            ob.param("n", args[0].split(","));
        }
        if (args.length > 1) {
            ob.param("norm", args[1].split(","));
        }
        Options opt = ob.build();
        Collection<RunResult> results = new Runner(opt).run();
        Map<String, double[]> rows = new TreeMap<>();
        for (RunResult rr : results) {
            String name = rr.getParams().getBenchmark();
            String key = String.format(Locale.ROOT, "%4d %5s", Integer.parseInt(rr.getParams().getParam("n")),
                    rr.getParams().getParam("norm"));
            double[] row = rows.computeIfAbsent(key, k -> new double[2]);
            row[name.endsWith("structured") ? 0 : 1] = rr.getPrimaryResult().getScore();
        }
        System.out.printf(Locale.ROOT, "%n   n  norm  structured [ns]  general [ns]  general/structured%n");
        rows.forEach((k, v) -> System.out.printf(Locale.ROOT, "%s %16.1f %13.1f %19.2f%n", k, v[0], v[1],
                v[1] / v[0]));
    }
}
