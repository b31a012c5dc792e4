package org.liepath.testing;

import org.liepath.core.Operator;

import java.util.Random;
import java.util.stream.LongStream;
import java.util.stream.Stream;

/**
 * Seeded random cases for property tests (we write properties as JUnit parameterized tests, not with a property
 * framework). Use as {@code @ParameterizedTest(name = "seed {0}") @MethodSource("org.liepath.testing.Seeds#cases")}:
 * the seed is part of the test name, so a failure prints it, and {@code new Random(seed)} reproduces the case.
 *
 * <p>The number of cases is {@code -Dliepath.cases=N} (default 200; the soak profile raises it).
 */
public final class Seeds {
    private Seeds() {
    }

    /** @return the configured number of cases (system property liepath.cases, default 200) */
    public static int count() {
        return Integer.getInteger("liepath.cases", 200);
    }

    /** @return seeds 1 … count(), spread by a fixed odd multiplier */
    public static Stream<Long> cases() {
        return LongStream.rangeClosed(1, count()).mapToObj(k -> k * 0x9E3779B97F4A7C15L);
    }

    /** @return a smaller set (count()/10, at least 20) for expensive properties */
    public static Stream<Long> fewCases() {
        return LongStream.rangeClosed(1, Math.max(20, count() / 10)).mapToObj(k -> k * 0x9E3779B97F4A7C15L);
    }

    /** @return a random complex n×n matrix with independent standard normal entries */
    public static Operator randomMatrix(Random r, int n) {
        double[] re = new double[n * n], im = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            re[k] = r.nextGaussian();
            im[k] = r.nextGaussian();
        }
        return Operator.ofPlanar(n, re, im);
    }

    /** @return a random Hermitian n×n matrix (A + A†)/2 with A as in {@link #randomMatrix} */
    public static Operator randomHermitian(Random r, int n) {
        Operator a = randomMatrix(r, n);
        return a.plus(a.dagger()).scale(0.5);
    }
}
