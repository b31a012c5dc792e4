package org.liepath.core.internal;

import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;

/**
 * Front-door argument checks shared by all Liepath modules. Every method throws {@link InvalidInputException} with a
 * message naming the argument, the expected form and the value seen. Not part of the public API.
 */
public final class Require {
    private Require() {
    }

    public static <T> T nonNull(T value, String name) {
        if (value == null) {
            throw InvalidInputException.of(Reason.NULL, name, "a non-null value", "null");
        }
        return value;
    }

    public static double finite(double v, String name) {
        if (!Double.isFinite(v)) {
            throw InvalidInputException.of(Reason.NOT_FINITE, name, "a finite number", v);
        }
        return v;
    }

    public static double positive(double v, String name) {
        finite(v, name);
        if (!(v > 0)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, name, "a positive number", v);
        }
        return v;
    }

    public static double nonNegative(double v, String name) {
        finite(v, name);
        if (!(v >= 0)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, name, "a non-negative number", v);
        }
        return v;
    }

    public static int positive(int v, String name) {
        if (v <= 0) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, name, "a positive integer", v);
        }
        return v;
    }

    public static int index(int i, int size, String name) {
        if (i < 0 || i >= size) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, name, "an index in [0, " + size + ")", i);
        }
        return i;
    }

    public static void sameDim(int expected, int seen, String name) {
        if (expected != seen) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, name, "dimension " + expected, "dimension " + seen);
        }
    }

    public static void finite(double[] a, String name) {
        nonNull(a, name);
        for (int i = 0; i < a.length; i++) {
            if (!Double.isFinite(a[i])) {
                throw InvalidInputException.of(Reason.NOT_FINITE, name, "finite entries", a[i] + " at index " + i);
            }
        }
    }

    /** Checks a square, non-ragged, finite matrix given as rows; returns its dimension. */
    public static int squareFinite(double[][] m, String name) {
        nonNull(m, name);
        int n = m.length;
        if (n == 0) {
            throw InvalidInputException.of(Reason.EMPTY, name, "a non-empty square array", "0 rows");
        }
        for (int i = 0; i < n; i++) {
            if (m[i] == null) {
                throw InvalidInputException.of(Reason.NULL, name, "non-null rows", "null row " + i);
            }
            if (m[i].length != n) {
                throw InvalidInputException.of(Reason.NOT_SQUARE, name, "a square " + n + "x" + n + " array",
                        "row " + i + " of length " + m[i].length);
            }
            for (int j = 0; j < n; j++) {
                if (!Double.isFinite(m[i][j])) {
                    throw InvalidInputException.of(Reason.NOT_FINITE, name, "finite entries",
                            m[i][j] + " at (" + i + ", " + j + ")");
                }
            }
        }
        return n;
    }
}
