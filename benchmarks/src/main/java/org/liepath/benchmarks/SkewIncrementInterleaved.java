package org.liepath.benchmarks;

import org.liepath.core.internal.Dense;
import org.liepath.core.internal.Expm;

import java.util.Arrays;
import java.util.Locale;
import java.util.Random;

/**
 * Interleaved A/B timing of the same pair as {@link SkewIncrementBenchmark} (general vs structured Padé increment
 * of one anti-Hermitian exponent): 40 measured rounds, each a batch of the general path directly followed by a
 * batch of the structured one, and the median and quartiles of the per-round ratios. On a shared, loaded machine a
 * ratio taken within each round is steadier than two JMH scores measured seconds apart; the JMH benchmark remains
 * the reference measurement.
 *
 * <p>Run: {@code java -cp benchmarks/target/benchmarks.jar org.liepath.benchmarks.SkewIncrementInterleaved}.
 */
public final class SkewIncrementInterleaved {
    private SkewIncrementInterleaved() {
    }

    public static void main(String[] args) {
        System.out.printf(Locale.ROOT, "   n  norm  general/structured: median (quartiles)%n");
        for (int n : new int[]{3, 8, 16, 64}) {
            for (double norm : new double[]{0.5, 1.5}) {
                int len = n * n;
                double[] hr = new double[len], hi = new double[len];
                HermitianExpBenchmark.randomHermitian(new Random(5), n, hr, hi);
                double s = norm / Dense.norm1(n, hr, hi);
                double[] wr = new double[len], wi = new double[len], dr = new double[len], di = new double[len];
                for (int k = 0; k < len; k++) {
                    wr[k] = s * hi[k];
                    wi[k] = -s * hr[k];
                }
                Expm ws = new Expm(n);
                // a batch of ~1e6 flops of products per path (~1 ms), enough to dwarf the timer's resolution
                int reps = (int) Math.max(20, 5e7 / (50.0 * n * n * n));
                double[] ratios = new double[40];
                double sink = 0;
                for (int round = -10; round < ratios.length; round++) {
                    long t0 = System.nanoTime();
                    for (int q = 0; q < reps; q++) {
                        ws.computeIncrement(1.0, wr, wi, dr, di);
                        sink += dr[0];
                    }
                    long t1 = System.nanoTime();
                    for (int q = 0; q < reps; q++) {
                        ws.computeIncrementAntiHermitian(1.0, wr, wi, dr, di);
                        sink += dr[0];
                    }
                    long t2 = System.nanoTime();
                    if (round >= 0) {
                        ratios[round] = (double) (t1 - t0) / (t2 - t1);
                    }
                }
                Arrays.sort(ratios);
                System.out.printf(Locale.ROOT, "%4d %5.1f  %5.2f (%4.2f – %4.2f)%s%n", n, norm, ratios[20], ratios[10],
                        ratios[30], sink == 0.123 ? " " : "");
            }
        }
    }
}
