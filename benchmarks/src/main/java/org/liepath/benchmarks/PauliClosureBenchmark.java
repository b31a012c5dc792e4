package org.liepath.benchmarks;

import org.liepath.algebra.LieAlgebra;
import org.liepath.algebra.PauliAlgebra;
import org.liepath.algebra.PauliCombination;
import org.liepath.core.Operator;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.openjdk.jmh.runner.options.TimeValue;

import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;

/**
 * Lie closure of the transverse-field Ising chain with separate terms ({X_i} ∪ {Z_iZ_{i+1}}, open; so(2n) of
 * dimension n(2n−1)): the exact Pauli-string backend against the dense backend (LieAlgebra.generatedBy on 2^n × 2^n
 * matrices) at n = 3, 4, 5, and the Pauli backend alone at n = 12, 24, 50.
 *
 * <p>Run with {@code java -jar benchmarks/target/benchmarks.jar PauliClosure -f 1 -wi 3 -i 5 -w 1 -r 1}, or run
 * {@code java -cp benchmarks/target/benchmarks.jar org.liepath.benchmarks.PauliClosureBenchmark} to get the table of
 * dense/Pauli ratios measured in the same run.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class PauliClosureBenchmark {

    /** Sizes where both backends run. */
    @State(Scope.Benchmark)
    public static class Small {
        @Param({"3", "4", "5"})
        public int n;
        List<PauliCombination> sums;
        List<Operator> ops;

        @Setup
        public void setUp() {
            sums = IsingChains.perTerm(n);
            ops = IsingChains.dense(sums);
        }
    }

    /** Sizes for the Pauli backend only (2^n × 2^n matrices are out of reach). */
    @State(Scope.Benchmark)
    public static class Large {
        @Param({"12", "24", "50"})
        public int n;
        List<PauliCombination> sums;

        @Setup
        public void setUp() {
            sums = IsingChains.perTerm(n);
        }
    }

    /**
     * The closure and then the basis as a list of {@link PauliCombination} objects (built on the first call of basis(),
     * one string object and one sum per element): a conservative figure, since the dense closure's result holds its
     * basis as matrices anyway.
     */
    @Benchmark
    public int pauliSmall(Small s) {
        return PauliAlgebra.generatedBy(s.sums).basis().size();
    }

    /** The closure alone (the dimension is known once the closure is done; no list of sums is built). */
    @Benchmark
    public int pauliSmallClosure(Small s) {
        return PauliAlgebra.generatedBy(s.sums).dimension();
    }

    @Benchmark
    public int denseSmall(Small s) {
        return LieAlgebra.generatedBy(s.ops).dimension();
    }

    @Benchmark
    public int pauliLarge(Large s) {
        return PauliAlgebra.generatedBy(s.sums).basis().size();
    }

    /** Also identifies the type (so(2n)) from the exact root system. */
    @Benchmark
    public String pauliLargeWithType(Large s) {
        return PauliAlgebra.generatedBy(s.sums).type();
    }

    /** Runs the benchmark briefly and prints times and the dense / Pauli ratio per n. */
    public static void main(String[] args) throws RunnerException {
        Options opt = new OptionsBuilder().include(PauliClosureBenchmark.class.getSimpleName())
                .forks(1).warmupIterations(3).measurementIterations(5)
                .warmupTime(TimeValue.seconds(1)).measurementTime(TimeValue.seconds(1)).build();
        Collection<RunResult> results = new Runner(opt).run();
        Map<String, Double> us = new TreeMap<>();
        for (RunResult r : results) {
            String name = r.getParams().getBenchmark();
            name = name.substring(name.lastIndexOf('.') + 1) + " n=" + r.getParams().getParam("n");
            us.put(name, r.getPrimaryResult().getScore());
        }
        System.out.println();
        System.out.println("benchmark                      time [µs]");
        us.forEach((k, v) -> System.out.printf("%-28s %12.2f%n", k, v));
        System.out.println();
        System.out.println("n   dense [µs]   Pauli closure [µs]   ratio   closure + list of sums [µs]   ratio");
        for (String n : new String[]{"3", "4", "5"}) {
            Double d = us.get("denseSmall n=" + n), c = us.get("pauliSmallClosure n=" + n),
                p = us.get("pauliSmall n=" + n);
            if (d != null && c != null && p != null) {
                System.out.printf("%-3s %10.1f %20.2f %7.0f %29.2f %7.0f%n", n, d, c, d / c, p, d / p);
            }
        }
    }
}
