package org.liepath.benchmarks;

import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.integrators.internal.LinearSystem;
import org.liepath.integrators.internal.MagnusKernel;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

import java.util.Random;
import java.util.concurrent.TimeUnit;

/**
 * One fixed step of the Magnus schemes on a propagator (X ← exp(Ω) X, m×m) for a Hamiltonian of {@code terms} random
 * Hermitian terms with cosine drives, with the first-level commutators from stored generator pairs ({@link #pairs})
 * against its comparator, the matrix-product route ({@link #products}). The ratio products/pairs is what the kernel's
 * cost rule predicts: it picks the pair route where that ratio should exceed one (dimension ≥ 4 and few enough pairs).
 * Run with {@code -f 1 -wi 3 -i 5 -w 1 -r 1}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
public class MagnusPairsBenchmark {
    @Param({"3", "8", "16"})
    public int dim;

    @Param({"5"})
    public int terms;

    @Param({"8"})
    public int order;

    MagnusKernel withPairs, withProducts;
    double[] xr, xi, yr, yi;
    double t;
    static final double H = 0.05;

    @Setup
    public void setUp() {
        Random r = new Random(dim * 100L + terms);
        Hamiltonian.Builder b = Hamiltonian.builder(dim);
        for (int k = 0; k < terms; k++) {
            b.term(BenchProblems.randomHermitian(r, dim, 1.0), Drive.cosine(1.0, 0.5 + 2 * r.nextDouble(),
                    2 * Math.PI * r.nextDouble()));
        }
        LinearSystem sys = LinearSystem.of(b.build());
        withPairs = MagnusKernel.withRoute(sys, order, true);
        withProducts = MagnusKernel.withRoute(sys, order, false);
        double[][] id = {Operator.identity(dim).reArray(), Operator.identity(dim).imArray()};
        xr = id[0].clone();
        xi = id[1].clone();
        yr = id[0].clone();
        yi = id[1].clone();
    }

    @Benchmark
    public double pairs() {
        withPairs.step(t, H, dim, xr, xi);
        t += H;
        return xr[0];
    }

    @Benchmark
    public double products() {
        withProducts.step(t, H, dim, yr, yi);
        t += H;
        return yr[0];
    }
}
