package org.liepath.benchmarks;

import org.ejml.data.ZMatrixRMaj;
import org.liepath.core.internal.Dense;
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

import java.util.Random;
import java.util.concurrent.TimeUnit;

/**
 * exp(A) of a random complex matrix with ‖A‖₁ = 10 (degree 13, one squaring): our {@link Expm} workspace against
 * the same algorithm written with EJML operations ({@link EjmlPade}). Ratios: {@link KernelReport}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class ExpmBenchmark {
    @Param({"2", "4", "8", "16", "64", "256"})
    public int n;

    double[] ar, ai, or, oi;
    Expm ours;
    EjmlPade theirs;
    ZMatrixRMaj a, out;

    @Setup
    public void setUp() {
        Random r = new Random(2);
        int len = n * n;
        ar = new double[len];
        ai = new double[len];
        or = new double[len];
        oi = new double[len];
        for (int k = 0; k < len; k++) {
            ar[k] = r.nextGaussian();
            ai[k] = r.nextGaussian();
        }
        double s = 10 / Dense.norm1(n, ar, ai);
        for (int k = 0; k < len; k++) {
            ar[k] *= s;
            ai[k] *= s;
        }
        ours = new Expm(n);
        theirs = new EjmlPade(n);
        a = MatMulBenchmark.toEjml(n, ar, ai);
        out = new ZMatrixRMaj(n, n);
    }

    @Benchmark
    public double[] liepath() {
        ours.compute(1.0, ar, ai, or, oi);
        return or;
    }

    @Benchmark
    public ZMatrixRMaj ejmlPade() {
        theirs.compute(a, out);
        return out;
    }
}
