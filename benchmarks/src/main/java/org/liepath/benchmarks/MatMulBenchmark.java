package org.liepath.benchmarks;

import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.liepath.core.internal.Dense;
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
 * Complex n×n matrix product c = a·b (8n³ flops): our planar kernel {@link Dense#mul} against EJML 0.46.1
 * {@code CommonOps_ZDRM.mult} on its interleaved {@code ZMatrixRMaj} (conversion not counted, which favours EJML),
 * EJML including the planar↔interleaved conversion that using it inside {@code Dense} would cost, and the plain
 * i-k-j kernel this one replaced. Ratios and GFLOP/s: {@link KernelReport}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class MatMulBenchmark {
    @Param({"2", "4", "8", "16", "64", "256"})
    public int n;

    double[] ar, ai, br, bi, cr, ci;
    ZMatrixRMaj a, b, c;

    @Setup
    public void setUp() {
        Random r = new Random(1);
        int len = n * n;
        ar = new double[len];
        ai = new double[len];
        br = new double[len];
        bi = new double[len];
        cr = new double[len];
        ci = new double[len];
        for (int k = 0; k < len; k++) {
            ar[k] = r.nextGaussian();
            ai[k] = r.nextGaussian();
            br[k] = r.nextGaussian();
            bi[k] = r.nextGaussian();
        }
        a = toEjml(n, ar, ai);
        b = toEjml(n, br, bi);
        c = new ZMatrixRMaj(n, n);
    }

    static ZMatrixRMaj toEjml(int n, double[] re, double[] im) {
        ZMatrixRMaj m = new ZMatrixRMaj(n, n);
        for (int k = 0; k < n * n; k++) {
            m.data[2 * k] = re[k];
            m.data[2 * k + 1] = im[k];
        }
        return m;
    }

    @Benchmark
    public double[] liepath() {
        Dense.mul(n, ar, ai, br, bi, cr, ci);
        return cr;
    }

    @Benchmark
    public ZMatrixRMaj ejml() {
        CommonOps_ZDRM.mult(a, b, c);
        return c;
    }

    @Benchmark
    public double[] ejmlWithConversion() {
        int len = n * n;
        double[] ad = a.data, bd = b.data;
        for (int k = 0; k < len; k++) {
            ad[2 * k] = ar[k];
            ad[2 * k + 1] = ai[k];
            bd[2 * k] = br[k];
            bd[2 * k + 1] = bi[k];
        }
        CommonOps_ZDRM.mult(a, b, c);
        double[] cd = c.data;
        for (int k = 0; k < len; k++) {
            cr[k] = cd[2 * k];
            ci[k] = cd[2 * k + 1];
        }
        return cr;
    }

    @Benchmark
    public double[] previousKernel() {
        previous(n, ar, ai, br, bi, cr, ci);
        return cr;
    }

    /** The plain i-k-j planar kernel Dense.mul used before (kept here as a baseline). */
    static void previous(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        java.util.Arrays.fill(cr, 0, n * n, 0.0);
        java.util.Arrays.fill(ci, 0, n * n, 0.0);
        for (int i = 0; i < n; i++) {
            int in = i * n;
            for (int k = 0; k < n; k++) {
                double xr = ar[in + k], xi = ai[in + k];
                if (xr == 0.0 && xi == 0.0) {
                    continue;
                }
                int kn = k * n;
                for (int j = 0; j < n; j++) {
                    double yr = br[kn + j], yi = bi[kn + j];
                    cr[in + j] += xr * yr - xi * yi;
                    ci[in + j] += xr * yi + xi * yr;
                }
            }
        }
    }
}
