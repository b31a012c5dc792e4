package org.liepath.core;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.ThrowingSupplier;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Seeded fuzzing of every factory of Operator, StateVector, Hamiltonian, Lindbladian and Superoperator with random
 * arrays: ragged, empty, null rows, NaN and infinities sprinkled in, wrong and huge sizes. The only allowed outcomes
 * are success (with finite entries) or an {@link InvalidInputException} whose message names its argument (common
 * practice for robust library front doors).
 */
class FactoryFuzzTest {
    /** Counts outcomes so that a test can check the fuzzer exercises both paths. */
    static final class Tally {
        int accepted, refused;
    }

    static <T> T attempt(Tally t, String what, ThrowingSupplier<T> call) {
        try {
            T v = call.get();
            t.accepted++;
            return v;
        } catch (InvalidInputException e) {
            assertNotNull(e.reason(), what);
            assertNotNull(e.argument(), what + ": " + e.getMessage());
            assertTrue(e.getMessage().contains(e.argument()), what + ": " + e.getMessage());
            t.refused++;
            return null;
        } catch (Throwable other) {
            throw new AssertionError(what + ": only InvalidInputException may escape, got " + other, other);
        }
    }

    static double randomEntry(Random r) {
        return switch (r.nextInt(40)) {
            case 0 -> Double.NaN;
            case 1 -> Double.POSITIVE_INFINITY;
            case 2 -> Double.NEGATIVE_INFINITY;
            case 3 -> Double.MAX_VALUE;
            case 4 -> -0.0;
            case 5 -> Double.MIN_VALUE;
            default -> r.nextGaussian();
        };
    }

    static int randomSize(Random r) {
        return switch (r.nextInt(20)) {
            case 0 -> 0;
            case 1 -> -1 - r.nextInt(3);
            case 2 -> Integer.MAX_VALUE;
            case 3 -> Operator.MAX_DIM + 1;
            case 4 -> Integer.MIN_VALUE;
            default -> 1 + r.nextInt(4);
        };
    }

    /** A random rows-of-arrays matrix, usually n×n and clean, sometimes ragged, empty, with null rows or bad entries. */
    static double[][] randomRows(Random r, int n) {
        int kind = r.nextInt(10);
        if (kind == 0) {
            return null;
        }
        int rows = kind == 1 ? r.nextInt(4) : n;
        double[][] a = new double[rows][];
        boolean dirty = r.nextInt(4) == 0;
        for (int i = 0; i < rows; i++) {
            if (kind == 2 && r.nextInt(3) == 0) {
                continue;                                   // null row
            }
            int len = kind == 3 ? r.nextInt(n + 2) : n;     // ragged
            a[i] = new double[len];
            for (int j = 0; j < len; j++) {
                a[i][j] = dirty ? randomEntry(r) : r.nextGaussian();
            }
        }
        return a;
    }

    static double[] randomFlat(Random r, int len) {
        if (r.nextInt(12) == 0) {
            return null;
        }
        double[] a = new double[Math.max(0, len + (r.nextInt(5) == 0 ? r.nextInt(3) - 1 : 0))];
        boolean dirty = r.nextInt(4) == 0;
        for (int k = 0; k < a.length; k++) {
            a[k] = dirty ? randomEntry(r) : r.nextGaussian();
        }
        return a;
    }

    static void finite(Operator a, String what) {
        for (double v : a.reArray()) {
            assertTrue(Double.isFinite(v), what);
        }
        for (double v : a.imArray()) {
            assertTrue(Double.isFinite(v), what);
        }
    }

    /** Random operators (null, wrong sizes, non-Hermitian) through every Operator and StateVector factory. */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void operatorAndStateFactoriesAcceptOrRefuse(long seed) {
        Random r = new Random(seed);
        Tally t = new Tally();
        assertTimeoutPreemptively(Duration.ofSeconds(20), () -> {
            for (int rep = 0; rep < 10; rep++) {
                int n = 1 + r.nextInt(4);
                Operator a = attempt(t, "of", () -> Operator.of(randomRows(r, n), randomRows(r, n)));
                if (a != null) {
                    finite(a, "of");
                }
                attempt(t, "real", () -> Operator.real(randomRows(r, n)));
                int m = randomSize(r);
                attempt(t, "ofPlanar", () -> Operator.ofPlanar(m, randomFlat(r, Math.max(0, n * n)),
                        randomFlat(r, Math.max(0, n * n))));
                attempt(t, "ofPlanar n", () -> Operator.ofPlanar(n, randomFlat(r, n * n), randomFlat(r, n * n)));
                int big = r.nextInt(3) == 0 ? randomSize(r) : n;
                attempt(t, "identity", () -> Operator.identity(big));
                attempt(t, "zero", () -> Operator.zero(big));
                attempt(t, "unit", () -> Operator.unit(big, r.nextInt(7) - 2, r.nextInt(7) - 2));
                attempt(t, "diagonal", () -> Operator.diagonal(randomFlat(r, r.nextInt(4))));
                attempt(t, "basis", () -> StateVector.unit(big, r.nextInt(7) - 2));
                StateVector s = attempt(t, "state of", () -> StateVector.of(randomFlat(r, n), randomFlat(r, n)));
                attempt(t, "state real", () -> StateVector.real(randomFlat(r, n)));
                StateVector u = attempt(t, "state of", () -> StateVector.of(randomFlat(r, n), randomFlat(r, n)));
                attempt(t, "outer", () -> Operator.outer(s, u));
                if (a != null) {
                    attempt(t, "apply", () -> (s == null ? StateVector.unit(n, 0) : s).apply(a));
                    attempt(t, "fromEjml", () -> Operator.fromEjml(a.toEjml()));
                }
            }
        });
        assertTrue(t.accepted > 0 && t.refused > 0, "the fuzzer should hit both outcomes: " + t.accepted + " accepted, "
                + t.refused + " refused");
    }

    static Operator randomOperatorOrNull(Random r, int n) {
        int kind = r.nextInt(10);
        if (kind == 0) {
            return null;
        }
        int dim = kind == 1 ? 1 + r.nextInt(4) : n;
        Operator a = org.liepath.testing.Seeds.randomMatrix(r, dim);
        return kind <= 3 ? a : a.plus(a.dagger());        // mostly Hermitian, sometimes not
    }

    /** Random terms, coefficients, drives, jumps and rates through the Hamiltonian, Lindbladian and Superoperator factories. */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void generatorFactoriesAcceptOrRefuse(long seed) {
        Random r = new Random(seed);
        Tally t = new Tally();
        assertTimeoutPreemptively(Duration.ofSeconds(20), () -> {
            for (int rep = 0; rep < 5; rep++) {
                int n = 1 + r.nextInt(4);
                int dim = r.nextInt(6) == 0 ? randomSize(r) : n;
                Hamiltonian h = attempt(t, "hamiltonian", () -> {
                    Hamiltonian.Builder b = Hamiltonian.builder(dim);
                    int terms = r.nextInt(4);
                    for (int k = 0; k < terms; k++) {
                        Operator op = randomOperatorOrNull(r, n);
                        if (r.nextBoolean()) {
                            b = b.term(randomEntry(r), op);
                        } else {
                            double amp = randomEntry(r);
                            b = b.term(op, r.nextInt(8) == 0 ? null : Drive.cosine(amp, 1.0));
                        }
                    }
                    return b.build();
                });
                if (h != null) {
                    attempt(t, "h.at", () -> h.at(r.nextGaussian()));
                    Lindbladian l = attempt(t, "lindbladian", () -> {
                        Lindbladian.Builder b = Lindbladian.builder(h);
                        for (int k = r.nextInt(3); k > 0; k--) {
                            b = b.jump(randomEntry(r) * (r.nextBoolean() ? 1 : -1), randomOperatorOrNull(r, h.dim()));
                        }
                        return b.build();
                    });
                    if (l != null) {
                        Superoperator g = attempt(t, "l.at", () -> l.at(0.1));
                        if (g != null) {
                            attempt(t, "apply", () -> g.apply(randomOperatorOrNull(r, h.dim())));
                        }
                    }
                }
                attempt(t, "constant", () -> Hamiltonian.constant(randomOperatorOrNull(r, n)));
                attempt(t, "hamiltonianPart", () -> Lindbladian.hamiltonianPart(randomOperatorOrNull(r, n)));
                attempt(t, "ofMatrix", () -> Superoperator.ofMatrix(randomOperatorOrNull(r, r.nextBoolean() ? n * n : n + 1)));
                attempt(t, "ofChoi", () -> Superoperator.ofChoi(randomOperatorOrNull(r, r.nextBoolean() ? n * n : n + 1)));
                attempt(t, "sandwich", () -> Superoperator.sandwich(randomOperatorOrNull(r, n), randomOperatorOrNull(r, n)));
                attempt(t, "unitary", () -> Superoperator.unitary(randomOperatorOrNull(r, n)));
                attempt(t, "identity", () -> Superoperator.identity(dim));
                List<Operator> ks = new ArrayList<>();
                for (int k = r.nextInt(3); k > 0; k--) {
                    ks.add(randomOperatorOrNull(r, n));
                }
                attempt(t, "kraus", () -> Superoperator.kraus(ks));
            }
        });
        assertTrue(t.accepted > 0 && t.refused > 0, "the fuzzer should hit both outcomes: " + t.accepted + " accepted, "
                + t.refused + " refused");
    }

    /** Sizes beyond the documented limits must be refused before any allocation, not fail with an Error. */
    @Test
    void hugeSizesAreRefusedBeforeAllocation() {
        Tally t = new Tally();
        for (int n : new int[]{Operator.MAX_DIM + 1, 65536, Integer.MAX_VALUE}) {
            attempt(t, "identity", () -> Operator.identity(n));
            attempt(t, "zero", () -> Operator.zero(n));
            attempt(t, "unit", () -> Operator.unit(n, 0, 0));
            attempt(t, "ofPlanar", () -> Operator.ofPlanar(n, new double[4], new double[4]));
            attempt(t, "builder", () -> Hamiltonian.builder(n));
            attempt(t, "identity map", () -> Superoperator.identity(n));
        }
        assertEquals(0, t.accepted, "accepted " + t.accepted + " huge sizes");
        attempt(t, "basis", () -> StateVector.unit(Integer.MAX_VALUE, 0));
        attempt(t, "basis", () -> StateVector.unit(StateVector.MAX_DIM + 1, 0));
        assertEquals(0, t.accepted, "accepted a huge state vector");
        double[][] nullRow = new double[3][];
        nullRow[0] = new double[3];
        nullRow[2] = new double[]{1, 2, 3};
        attempt(t, "null row", () -> Operator.real(nullRow));
        assertEquals(21, t.refused);
    }
}
