package org.liepath.algebra.internal;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The two namers of compact simple algebras — {@link Names#simple(int, int, Names.Lengths)} (dense algebras:
 * dimension, rank and numerical root lengths) and {@code StringTypes.name} (string algebras: exact positive roots
 * with integer squared lengths) — against the root systems of every simple type, built here from their standard
 * coordinates (N. Bourbaki, Lie Groups and Lie Algebras, Ch. 4–6, Plates I–IX: A_r ⊂ R^{r+1} as e_i − e_j; B_r as
 * ±e_i, ±e_i ± e_j; C_r as ±2e_i, ±e_i ± e_j; D_r as ±e_i ± e_j; G2 in the plane x+y+z = 0; F4 as ±e_i, ±e_i ± e_j,
 * ½(±1, ±1, ±1, ±1); E8 as ±e_i ± e_j and ½(±1, …, ±1) with an even number of minus signs). E7 and E6 are the roots
 * of E8 orthogonal to one root, and to the two simple roots of an A2 (their centralisers in E8: common practice, e.g.
 * J.E. Humphreys, Introduction to Lie Algebras and Representation Theory, Springer 1972, §12 for the root counts
 * 126 and 72). Dimension = rank + number of roots. The exceptional algebras f4, e6, e7, e8 are recognised here from
 * their root data; no matrix realisation of them is built (g2 is checked end to end elsewhere).
 */
class RootSystemNamesTest {

    static Stream<Arguments> systems() {
        List<Arguments> a = new ArrayList<>();
        for (int r = 1; r <= 7; r++) {
            a.add(Arguments.of("A" + r, typeA(r), r, "su(" + (r + 1) + ")"));
        }
        for (int r = 3; r <= 7; r++) {
            a.add(Arguments.of("B" + r, typeBC(r, 1), r, "so(" + (2 * r + 1) + ")"));
            a.add(Arguments.of("C" + r, typeBC(r, 2), r, "sp(" + (2 * r) + ")"));
        }
        for (int r = 4; r <= 7; r++) {
            a.add(Arguments.of("D" + r, typeD(r), r, "so(" + (2 * r) + ")"));
        }
        a.add(Arguments.of("B2 = C2", typeBC(2, 1), 2, "so(5)"));
        a.add(Arguments.of("G2", g2(), 2, "g2"));
        a.add(Arguments.of("F4", f4(), 4, "f4"));
        List<double[]> e8 = e8();
        a.add(Arguments.of("E8", e8, 8, "e8"));
        double[] alpha = e8.get(0);
        List<double[]> e7 = orthogonal(e8, alpha);
        a.add(Arguments.of("E7", e7, 7, "e7"));
        double[] beta = null;
        for (double[] r : e8) {
            if (Math.abs(dot(r, alpha) + 1) < 1e-12) {
                beta = r;
                break;
            }
        }
        a.add(Arguments.of("E6", orthogonal(e7, beta), 6, "e6"));
        return a.stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("systems")
    void denseNamerNamesEveryType(String label, List<double[]> roots, int rank, String expected) {
        assertEquals(rank, spanDimension(roots), label + ": rank of the constructed system");
        List<double[]> positive = positive(roots);
        double[] lengths = new double[positive.size()];
        for (int k = 0; k < lengths.length; k++) {
            lengths[k] = dot(positive.get(k), positive.get(k));
        }
        assertEquals(expected, Names.simple(rank + roots.size(), rank, () -> lengths), label);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("systems")
    void stringNamerNamesEveryType(String label, List<double[]> roots, int rank, String expected) {
        int[] lengths = integerLengths(roots);
        String got = StringTypes.name(all(lengths.length), lengths, rank);
        // the string namer gives the low-rank coincidences their classical names from the series (A1 = su(2),
        // B2 as so(5) via the B series needs k ≥ 2 and 2k short roots)
        assertEquals(expected, got, label);
    }

    @ParameterizedTest(name = "{0} with one root length perturbed")
    @MethodSource("systems")
    void threeLengthsAreNoRootSystem(String label, List<double[]> roots, int rank, String expected) {
        int[] lengths = integerLengths(roots);
        if (lengths.length < 2) {
            return;
        }
        int lo = Integer.MAX_VALUE, hi = 0;
        for (int l : lengths) {
            lo = Math.min(lo, l);
            hi = Math.max(hi, l);
        }
        // a third length (or, for one-length systems, a second one in a ratio no root system has)
        lengths[0] = lo == hi ? 5 * lo : lo + hi;
        assertNull(StringTypes.name(all(lengths.length), lengths, rank), label);
    }

    /** Squared lengths of the positive roots, doubled: every system here has squared lengths in ½ℤ. */
    private static int[] integerLengths(List<double[]> roots) {
        List<double[]> positive = positive(roots);
        int[] lengths = new int[positive.size()];
        for (int k = 0; k < lengths.length; k++) {
            lengths[k] = (int) Math.round(2 * dot(positive.get(k), positive.get(k)));
        }
        return lengths;
    }

    private static List<Integer> all(int n) {
        List<Integer> comp = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            comp.add(k);
        }
        return comp;
    }

    // ------------------------------------------------------------------ root systems

    private static List<double[]> typeA(int r) {
        List<double[]> out = new ArrayList<>();
        for (int i = 0; i <= r; i++) {
            for (int j = 0; j <= r; j++) {
                if (i != j) {
                    double[] v = new double[r + 1];
                    v[i] = 1;
                    v[j] = -1;
                    out.add(v);
                }
            }
        }
        return out;
    }

    /** B_r (short = 1: ±e_i) or C_r (short = 2: ±2e_i), plus ±e_i ± e_j. */
    private static List<double[]> typeBC(int r, double single) {
        List<double[]> out = typeD(r);
        for (int i = 0; i < r; i++) {
            for (int s = -1; s <= 1; s += 2) {
                double[] v = new double[r];
                v[i] = s * single;
                out.add(v);
            }
        }
        return out;
    }

    private static List<double[]> typeD(int r) {
        List<double[]> out = new ArrayList<>();
        for (int i = 0; i < r; i++) {
            for (int j = i + 1; j < r; j++) {
                for (int s = -1; s <= 1; s += 2) {
                    for (int t = -1; t <= 1; t += 2) {
                        double[] v = new double[r];
                        v[i] = s;
                        v[j] = t;
                        out.add(v);
                    }
                }
            }
        }
        return out;
    }

    private static List<double[]> g2() {
        List<double[]> out = new ArrayList<>();
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                if (i != j) {
                    double[] v = new double[3];
                    v[i] = 1;
                    v[j] = -1;
                    out.add(v);
                }
            }
            for (int s = -1; s <= 1; s += 2) {
                double[] v = {-s, -s, -s};
                v[i] = 2 * s;
                out.add(v);
            }
        }
        return out;
    }

    private static List<double[]> f4() {
        List<double[]> out = typeBC(4, 1);
        for (int m = 0; m < 16; m++) {
            double[] v = new double[4];
            for (int i = 0; i < 4; i++) {
                v[i] = ((m >> i) & 1) == 0 ? 0.5 : -0.5;
            }
            out.add(v);
        }
        return out;
    }

    private static List<double[]> e8() {
        List<double[]> out = typeD(8);
        for (int m = 0; m < 256; m++) {
            if (Integer.bitCount(m) % 2 == 0) {
                double[] v = new double[8];
                for (int i = 0; i < 8; i++) {
                    v[i] = ((m >> i) & 1) == 0 ? 0.5 : -0.5;
                }
                out.add(v);
            }
        }
        return out;
    }

    private static List<double[]> orthogonal(List<double[]> roots, double[] a) {
        List<double[]> out = new ArrayList<>();
        for (double[] r : roots) {
            if (Math.abs(dot(r, a)) < 1e-12) {
                out.add(r);
            }
        }
        return out;
    }

    /** Positive roots: first non-zero coordinate (after a generic tilt) positive, i.e. one of each ± pair. */
    private static List<double[]> positive(List<double[]> roots) {
        List<double[]> out = new ArrayList<>();
        for (double[] r : roots) {
            double s = 0;
            for (int i = 0; i < r.length; i++) {
                s += r[i] * Math.pow(Math.PI, -i);
            }
            if (s > 0) {
                out.add(r);
            }
        }
        assertEquals(roots.size(), 2 * out.size(), "roots come in ± pairs");
        return out;
    }

    private static int spanDimension(List<double[]> roots) {
        int n = roots.get(0).length;
        List<double[]> basis = new ArrayList<>();
        for (double[] r : roots) {
            double[] v = r.clone();
            for (double[] b : basis) {
                double f = dot(v, b) / dot(b, b);
                for (int i = 0; i < n; i++) {
                    v[i] -= f * b[i];
                }
            }
            if (Math.sqrt(dot(v, v)) > 1e-9) {
                basis.add(v);
            }
        }
        return basis.size();
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }
}
