package org.liepath.benchmarks;

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
 * One exponential factor of an integrator step applied to a propagator, X ← e^Ω X with Ω = −i·dt·H (H random
 * Hermitian, ‖Ω‖₁ ≈ 0.01 as in a step of dt = 1e-3 on a 16-level system), in the two forms the kernels can use:
 * {@link #increment} (the kernels' form: D = e^Ω − I by {@link Expm#computeIncrement}, then X ← X + D X) against its
 * comparator {@link #full} (E = e^Ω by {@link Expm#compute}, then X ← E X). Both use one Padé approximant and one
 * product, so the ratio should be close to 1; the increment form is kept for its accuracy in long runs.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class IncrementFactorBenchmark {
    @Param({"2", "4", "16"})
    public int n;

    double[] wr, wi, er, ei, xr, xi, yr, yi;
    Expm ws;

    @Setup
    public void setUp() {
        int len = n * n;
        double[][] w = HermitianExpBenchmark.randomSkew(new Random(3), n, 0.01);
        wr = w[0];
        wi = w[1];
        er = new double[len];
        ei = new double[len];
        yr = new double[len];
        yi = new double[len];
        xr = new double[len];
        xi = new double[len];
        Dense.identity(n, xr, xi);
        ws = new Expm(n);
    }

    @Benchmark
    public double[] full() {
        ws.compute(1.0, wr, wi, er, ei);
        Dense.mul(n, er, ei, xr, xi, yr, yi);
        System.arraycopy(yr, 0, xr, 0, n * n);
        System.arraycopy(yi, 0, xi, 0, n * n);
        return xr;
    }

    @Benchmark
    public double[] increment() {
        ws.computeIncrement(1.0, wr, wi, er, ei);
        Dense.mul(n, er, ei, xr, xi, yr, yi);
        int len = n * n;
        for (int k = 0; k < len; k++) {
            xr[k] += yr[k];
            xi[k] += yi[k];
        }
        return xr;
    }
}
