package org.liepath.benchmarks;

import org.liepath.core.internal.Expm;
import org.liepath.core.internal.HermitianEigen;
import org.liepath.core.internal.HermitianExp;
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
 * exp(−itH) for a random Hermitian H (entries of unit variance, so ‖tH‖₁ grows like n at t = 1): the eigen route
 * ({@link HermitianExp}) against Padé scaling and squaring on −itH ({@link Expm}), and the eigendecomposition alone.
 * Ratios and the unitarity defects of both: {@link KernelReport}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class HermitianExpBenchmark {
    @Param({"2", "4", "8", "16", "64", "256"})
    public int n;

    public double t = 1.0;
    double[] hr, hi, ar, ai, or, oi, lambda, vr, vi;
    HermitianExp eigenExp;
    HermitianEigen eigen;
    Expm pade;

    @Setup
    public void setUp() {
        Random r = new Random(3);
        hr = new double[n * n];
        hi = new double[n * n];
        randomHermitian(r, n, hr, hi);
        ar = new double[n * n];
        ai = new double[n * n];
        or = new double[n * n];
        oi = new double[n * n];
        lambda = new double[n];
        vr = new double[n * n];
        vi = new double[n * n];
        eigenExp = new HermitianExp(n);
        eigen = n > 2 ? new HermitianEigen(n) : null;
        pade = new Expm(n);
    }

    /**
     * A step exponent Ω = −i·s·H for a random Hermitian H (as {@link #randomHermitian}), scaled to ‖Ω‖₁ = norm1;
     * exactly anti-Hermitian. Returns {re, im}.
     */
    static double[][] randomSkew(Random r, int n, double norm1) {
        int len = n * n;
        double[] hr = new double[len], hi = new double[len], wr = new double[len], wi = new double[len];
        randomHermitian(r, n, hr, hi);
        double s = norm1 / org.liepath.core.internal.Dense.norm1(n, hr, hi);
        for (int k = 0; k < len; k++) {
            wr[k] = s * hi[k];   // −i·s·H = s·(Im H) − i·s·(Re H)
            wi[k] = -s * hr[k];
        }
        return new double[][]{wr, wi};
    }

    static void randomHermitian(Random r, int n, double[] hr, double[] hi) {
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double x = r.nextGaussian(), y = i == j ? 0 : r.nextGaussian();
                hr[i * n + j] = hr[j * n + i] = x;
                hi[i * n + j] = y;
                hi[j * n + i] = -y;
            }
        }
    }

    @Benchmark
    public double[] eigenRoute() {
        eigenExp.compute(hr, hi, t, or, oi);
        return or;
    }

    @Benchmark
    public double[] padeRoute() {
        int len = n * n;
        for (int k = 0; k < len; k++) {
            ar[k] = t * hi[k];
            ai[k] = -t * hr[k];
        }
        pade.compute(1.0, ar, ai, or, oi);
        return or;
    }

    @Benchmark
    public double[] eigendecompositionOnly() {
        if (eigen != null) {
            eigen.compute(hr, hi, lambda, vr, vi);
        }
        return vr;
    }
}
