package org.liepath.algebra.internal;

/**
 * Names of compact simple Lie algebras from dimension, rank and (where these agree for two series) root lengths.
 * The canonical names for the low-dimensional coincidences are: su(2) (= so(3) = sp(2)), so(5) (= sp(4)),
 * su(4) (= so(6)); so(4) is not simple and comes out as su(2) ⊕ su(2). sp(2m) is the compact symplectic algebra of
 * 2m×2m matrices (dimension m(2m+1), rank m). Exceptional algebras are named g2, f4, e6, e7, e8 when dimension and
 * rank (and, for e6 against so(13)/sp(12), equal root lengths) identify them. Not part of the public API.
 *
 * <p>Stateless static helpers: thread-safe.
 */
public final class Names {
    private Names() {
    }

    /** @return the name of a compact simple algebra with this structure, or "unknown(dim d, rank r)" */
    public static String simple(RealStructure s) {
        int d = s.dimension();
        int r = Analysis.rank(s);
        return simple(d, r, () -> Analysis.rootLengths(s));
    }

    /** Root lengths are computed only when dimension and rank leave a choice. */
    public interface Lengths {
        double[] get();
    }

    public static String simple(int d, int r, Lengths lengths) {
        if (r >= 1 && d == r * r + 2 * r) {
            return "su(" + (r + 1) + ")";
        }
        if (r >= 2 && d == 2 * r * r + r) {
            if (r == 2) {
                return "so(5)";
            }
            double[] len = lengths.get();
            if (len == null) {
                return unknown(d, r);
            }
            double min = Double.POSITIVE_INFINITY, max = 0;
            for (double x : len) {
                min = Math.min(min, x);
                max = Math.max(max, x);
            }
            if (max <= 1.05 * min) {
                return r == 6 ? "e6" : unknown(d, r);
            }
            if (Math.abs(max / min - 2) > 0.05) {
                return unknown(d, r);
            }
            int shortPlanes = 0;
            for (double x : len) {
                if (x < 1.5 * min) {
                    shortPlanes++;
                }
            }
            // B_r: short roots ±e_i (r planes); C_r: short roots ±e_i±e_j (r(r−1) planes)
            if (shortPlanes == r) {
                return "so(" + (2 * r + 1) + ")";
            }
            if (shortPlanes == r * (r - 1)) {
                return "sp(" + (2 * r) + ")";
            }
            return unknown(d, r);
        }
        if (r >= 4 && d == 2 * r * r - r) {
            return "so(" + (2 * r) + ")";
        }
        if (d == 14 && r == 2) {
            return "g2";
        }
        if (d == 52 && r == 4) {
            return "f4";
        }
        if (d == 133 && r == 7) {
            return "e7";
        }
        if (d == 248 && r == 8) {
            return "e8";
        }
        return unknown(d, r);
    }

    static String unknown(int d, int r) {
        return "unknown(dim " + d + ", rank " + r + ")";
    }

    /** Complexification of a compact name: su(n) → sl(n,C), so(n) → so(n,C), sp(2m) → sp(2m,C), u(1) → gl(1,C). */
    public static String complexified(String compact) {
        if (compact.startsWith("su(")) {
            return "sl(" + compact.substring(3, compact.length() - 1) + ",C)";
        }
        if (compact.startsWith("so(") || compact.startsWith("sp(")) {
            return compact.substring(0, compact.length() - 1) + ",C)";
        }
        if (compact.equals("u(1)")) {
            return "gl(1,C)";
        }
        if (compact.startsWith("unknown")) {
            return compact;
        }
        return compact + "(C)";
    }
}
