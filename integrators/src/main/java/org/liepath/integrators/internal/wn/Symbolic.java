package org.liepath.integrators.internal.wn;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Closed-form Wei–Norman equations ġ = M(g)·a with the entries of M = Γ(g)⁻¹ written as exponential polynomials
 * Σ c·Π g_i^{p_i}·exp(Σ μ_i g_i). Γ(g) is built from the closed forms of exp(g_k ad X_k) ({@link ExpForm#terms()})
 * and inverted by Gauss–Jordan elimination that only divides by units (single exponential monomials), so the result
 * is exact whenever det Γ is a unit (as for ladder orderings of su(n) and solvable algebras; Wei and Norman, Proc.
 * AMS 15 (1964) 327). Otherwise only Γ(g) is available ({@link #solved()} false) and the equations are printed in the
 * implicit form Γ(g)ġ = a. Not part of the public API.
 */
public final class Symbolic {
    /** Per-equation classification, ordered by increasing difficulty. */
    public enum Kind { QUADRATURE, LINEAR, RICCATI, POLYNOMIAL, EXPONENTIAL, GENERAL }

    private static final int MAX_TERMS = 4000;

    /** A monomial Π g_i^{p_i} exp(Σ μ_i g_i). */
    static final class Mono {
        final int[] pow;
        final double[] er, ei;
        private final int hash;

        Mono(int[] pow, double[] er, double[] ei) {
            this.pow = pow;
            this.er = er;
            this.ei = ei;
            for (int k = 0; k < er.length; k++) {
                er[k] = round(er[k]);
                ei[k] = round(ei[k]);
            }
            this.hash = 31 * (31 * Arrays.hashCode(pow) + Arrays.hashCode(er)) + Arrays.hashCode(ei);
        }

        static double round(double x) {
            double r = Math.rint(x * 1e9) / 1e9;
            return r == 0 ? 0.0 : r;
        }

        Mono times(Mono o) {
            int m = pow.length;
            int[] p = new int[m];
            double[] r = new double[m], i = new double[m];
            for (int k = 0; k < m; k++) {
                p[k] = pow[k] + o.pow[k];
                r[k] = er[k] + o.er[k];
                i[k] = ei[k] + o.ei[k];
            }
            return new Mono(p, r, i);
        }

        int degree() {
            int d = 0;
            for (int p : pow) {
                d += p;
            }
            return d;
        }

        boolean hasExp() {
            for (int k = 0; k < er.length; k++) {
                if (er[k] != 0 || ei[k] != 0) {
                    return true;
                }
            }
            return false;
        }

        boolean dependsOn(int k) {
            return pow[k] != 0 || er[k] != 0 || ei[k] != 0;
        }

        @Override
        public boolean equals(Object o) {
            if (!(o instanceof Mono)) {
                return false;
            }
            Mono x = (Mono) o;
            return hash == x.hash && Arrays.equals(pow, x.pow) && Arrays.equals(er, x.er) && Arrays.equals(ei, x.ei);
        }

        @Override
        public int hashCode() {
            return hash;
        }
    }

    /** An exponential polynomial: monomial → complex coefficient {re, im}. */
    static final class Expr {
        final Map<Mono, double[]> t = new LinkedHashMap<>();

        void add(Mono mo, double cr, double ci) {
            if (cr == 0 && ci == 0) {
                return;
            }
            double[] c = t.computeIfAbsent(mo, k -> new double[2]);
            c[0] += cr;
            c[1] += ci;
        }

        Expr times(Expr o) {
            Expr r = new Expr();
            for (Map.Entry<Mono, double[]> a : t.entrySet()) {
                for (Map.Entry<Mono, double[]> b : o.t.entrySet()) {
                    double[] x = a.getValue(), y = b.getValue();
                    r.add(a.getKey().times(b.getKey()), x[0] * y[0] - x[1] * y[1], x[0] * y[1] + x[1] * y[0]);
                }
            }
            return r;
        }

        void addScaled(Expr o, double sr, double si) {
            for (Map.Entry<Mono, double[]> b : o.t.entrySet()) {
                double[] y = b.getValue();
                add(b.getKey(), sr * y[0] - si * y[1], sr * y[1] + si * y[0]);
            }
        }

        void clean(double tol) {
            t.values().removeIf(c -> Math.hypot(c[0], c[1]) <= tol);
            for (double[] c : t.values()) {
                c[0] = snap(c[0]);
                c[1] = snap(c[1]);
            }
        }

        boolean isZero() {
            return t.isEmpty();
        }

        boolean isUnit() {
            return t.size() == 1 && t.keySet().iterator().next().degree() == 0;
        }
    }

    static double snap(double x) {
        double r = Math.rint(x);
        if (Math.abs(x - r) <= 1e-11 * Math.max(1, Math.abs(x))) {
            return r == 0 ? 0.0 : r;
        }
        return x;
    }

    private final int m;
    private final Expr[][] gamma;
    private final Expr[][] inverse; // null if not solved
    private final Kind[] kinds;

    private Symbolic(int m, Expr[][] gamma, Expr[][] inverse, Kind[] kinds) {
        this.m = m;
        this.gamma = gamma;
        this.inverse = inverse;
        this.kinds = kinds;
    }

    /** @return the symbolic equations of the chart, or null if some ad X_k has no closed form */
    public static Symbolic of(Chart c) {
        int m = c.m;
        if (!c.allClosedForm()) {
            return null;
        }
        Expr[][] tm = identity(m);
        Expr[][] gam = new Expr[m][m];
        for (int k = 0; k < m; k++) {
            for (int i = 0; i < m; i++) {
                gam[i][k] = copy(tm[i][k]);
            }
            if (k == m - 1) {
                break;
            }
            // E_k = Σ_terms z^p e^{zλ} M
            Expr[][] e = new Expr[m][m];
            for (Expr[] row : e) {
                for (int j = 0; j < m; j++) {
                    row[j] = new Expr();
                }
            }
            for (ExpForm.Term term : c.adExp[k].terms()) {
                int[] p = new int[m];
                double[] er = new double[m], ei = new double[m];
                p[k] = term.power;
                er[k] = term.lamRe;
                ei[k] = term.lamIm;
                Mono mo = new Mono(p, er, ei);
                for (int i = 0; i < m; i++) {
                    for (int j = 0; j < m; j++) {
                        e[i][j].add(mo, term.re[i * m + j], term.im[i * m + j]);
                    }
                }
            }
            Expr[][] next = new Expr[m][m];
            for (int i = 0; i < m; i++) {
                for (int j = 0; j < m; j++) {
                    Expr s = new Expr();
                    for (int l = 0; l < m; l++) {
                        if (!tm[i][l].isZero() && !e[l][j].isZero()) {
                            s.addScaled(tm[i][l].times(e[l][j]), 1, 0);
                        }
                    }
                    s.clean(1e-12);
                    if (s.t.size() > MAX_TERMS) {
                        return new Symbolic(m, null, null, general(m));
                    }
                    next[i][j] = s;
                }
            }
            tm = next;
        }
        Expr[][] inv = invert(gam, m);
        Kind[] kinds = inv == null ? general(m) : classify(inv, m);
        return new Symbolic(m, gam, inv, kinds);
    }

    private static Kind[] general(int m) {
        Kind[] k = new Kind[m];
        Arrays.fill(k, Kind.GENERAL);
        return k;
    }

    private static Expr[][] identity(int m) {
        Expr[][] t = new Expr[m][m];
        int[] p0 = new int[m];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                t[i][j] = new Expr();
                if (i == j) {
                    t[i][j].add(new Mono(p0.clone(), new double[m], new double[m]), 1, 0);
                }
            }
        }
        return t;
    }

    private static Expr copy(Expr e) {
        Expr r = new Expr();
        r.addScaled(e, 1, 0);
        return r;
    }

    /** Gauss–Jordan with unit pivots only; null if at some column no unit pivot exists. */
    private static Expr[][] invert(Expr[][] g, int m) {
        Expr[][] a = new Expr[m][];
        for (int i = 0; i < m; i++) {
            a[i] = new Expr[m];
            for (int j = 0; j < m; j++) {
                a[i][j] = copy(g[i][j]);
            }
        }
        Expr[][] b = identity(m);
        for (int c = 0; c < m; c++) {
            int piv = -1;
            for (int r = c; r < m; r++) {
                if (a[r][c].isUnit()) {
                    piv = r;
                    break;
                }
            }
            if (piv < 0) {
                return null;
            }
            Expr[] s = a[c];
            a[c] = a[piv];
            a[piv] = s;
            s = b[c];
            b[c] = b[piv];
            b[piv] = s;
            Map.Entry<Mono, double[]> u = a[c][c].t.entrySet().iterator().next();
            Mono um = u.getKey();
            double ur = u.getValue()[0], ui = u.getValue()[1], den = ur * ur + ui * ui;
            double[] zr = new double[m], zi = new double[m];
            for (int k = 0; k < m; k++) {
                zr[k] = -um.er[k];
                zi[k] = -um.ei[k];
            }
            Expr inv = new Expr();
            inv.add(new Mono(new int[m], zr, zi), ur / den, -ui / den);
            for (int j = 0; j < m; j++) {
                a[c][j] = a[c][j].times(inv);
                a[c][j].clean(1e-12);
                b[c][j] = b[c][j].times(inv);
                b[c][j].clean(1e-12);
            }
            for (int r = 0; r < m; r++) {
                if (r == c || a[r][c].isZero()) {
                    continue;
                }
                Expr f = a[r][c];
                for (int j = 0; j < m; j++) {
                    if (!a[c][j].isZero()) {
                        Expr na = copy(a[r][j]);
                        na.addScaled(f.times(a[c][j]), -1, 0);
                        na.clean(1e-12);
                        a[r][j] = na;
                    }
                    if (!b[c][j].isZero()) {
                        Expr nb = copy(b[r][j]);
                        nb.addScaled(f.times(b[c][j]), -1, 0);
                        nb.clean(1e-12);
                        if (nb.t.size() > MAX_TERMS) {
                            return null;
                        }
                        b[r][j] = nb;
                    }
                }
            }
        }
        return b;
    }

    private static Kind[] classify(Expr[][] inv, int m) {
        boolean[][] dep = new boolean[m][m];
        for (int k = 0; k < m; k++) {
            for (int j = 0; j < m; j++) {
                for (Mono mo : inv[k][j].t.keySet()) {
                    for (int i = 0; i < m; i++) {
                        if (mo.dependsOn(i)) {
                            dep[k][i] = true;
                        }
                    }
                }
            }
        }
        // transitive closure: reach[k][i] = the right-hand side of k depends on g_i through a chain
        boolean[][] reach = new boolean[m][m];
        for (int k = 0; k < m; k++) {
            reach[k] = dep[k].clone();
        }
        for (int l = 0; l < m; l++) {
            for (int k = 0; k < m; k++) {
                if (reach[k][l]) {
                    for (int i = 0; i < m; i++) {
                        reach[k][i] |= reach[l][i];
                    }
                }
            }
        }
        Kind[] kinds = new Kind[m];
        for (int k = 0; k < m; k++) {
            boolean[] block = new boolean[m];
            for (int i = 0; i < m; i++) {
                block[i] = (i == k || reach[i][k]) && reach[k][i];
            }
            Kind kind = Kind.QUADRATURE;
            for (int j = 0; j < m; j++) {
                for (Mono mo : inv[k][j].t.keySet()) {
                    int deg = 0;
                    boolean ex = false, any = false;
                    for (int i = 0; i < m; i++) {
                        if (block[i] && mo.dependsOn(i)) {
                            any = true;
                            deg += mo.pow[i];
                            ex |= mo.er[i] != 0 || mo.ei[i] != 0;
                        }
                    }
                    if (!any) {
                        continue;
                    }
                    Kind here = ex ? Kind.EXPONENTIAL : deg <= 1 ? Kind.LINEAR : deg == 2 ? Kind.RICCATI
                            : Kind.POLYNOMIAL;
                    if (here.compareTo(kind) > 0) {
                        kind = here;
                    }
                }
            }
            kinds[k] = kind;
        }
        return kinds;
    }

    /** @return true if the equations are available in the solved form ġ = M(g)a */
    public boolean solved() {
        return inverse != null;
    }

    /** @return the classification of equation k */
    public Kind kind(int k) {
        return kinds[k];
    }

    /** @return the number of coordinates */
    public int size() {
        return m;
    }

    // ------------------------------------------------------------------ printing

    /** Prints the equations, one per line; latex selects LaTeX (an aligned environment body). */
    public List<String> lines(boolean latex) {
        List<String> out = new ArrayList<>();
        if (gamma == null) {
            out.add(latex ? "\\text{(closed form too large to print)}" : "(closed form too large to print)");
            return out;
        }
        if (inverse != null) {
            for (int k = 0; k < m; k++) {
                List<Object[]> terms = new ArrayList<>();
                for (int j = 0; j < m; j++) {
                    for (Map.Entry<Mono, double[]> e : inverse[k][j].t.entrySet()) {
                        terms.add(new Object[]{j, e.getKey(), e.getValue()});
                    }
                }
                terms.sort(Comparator.<Object[]>comparingInt(o -> ((Mono) o[1]).degree())
                        .thenComparing(o -> ((Mono) o[1]).hasExp())
                        .thenComparingInt(o -> (Integer) o[0]));
                StringBuilder sb = new StringBuilder();
                sb.append(latex ? "\\dot g_{" + (k + 1) + "} &= " : "g" + (k + 1) + "' = ");
                appendSum(sb, terms, latex);
                out.add(sb.toString());
            }
        } else {
            for (int i = 0; i < m; i++) {
                List<Object[]> terms = new ArrayList<>();
                for (int k = 0; k < m; k++) {
                    for (Map.Entry<Mono, double[]> e : gamma[i][k].t.entrySet()) {
                        terms.add(new Object[]{-(k + 1), e.getKey(), e.getValue()});
                    }
                }
                StringBuilder sb = new StringBuilder();
                appendSum(sb, terms, latex);
                sb.append(latex ? " &= a_{" + (i + 1) + "}" : " = a" + (i + 1));
                out.add(sb.toString());
            }
        }
        return out;
    }

    /** Term symbol: j ≥ 0 means a_{j+1}; j < 0 means ġ_{−j}. */
    private static void appendSum(StringBuilder sb, List<Object[]> terms, boolean latex) {
        if (terms.isEmpty()) {
            sb.append('0');
            return;
        }
        boolean first = true;
        for (Object[] o : terms) {
            int j = (Integer) o[0];
            Mono mo = (Mono) o[1];
            double[] c = (double[]) o[2];
            String sym = j >= 0 ? (latex ? "a_{" + (j + 1) + "}" : "a" + (j + 1))
                    : (latex ? "\\dot g_{" + (-j) + "}" : "g" + (-j) + "'");
            String body = sym + monoText(mo, latex);
            boolean real = c[1] == 0, imag = c[0] == 0;
            String coef;
            boolean negative;
            if (real) {
                negative = c[0] < 0;
                coef = num(Math.abs(c[0]));
                coef = coef.equals("1") ? "" : coef + " ";
            } else if (imag) {
                negative = c[1] < 0;
                String v = num(Math.abs(c[1]));
                coef = (v.equals("1") ? "" : v + " ") + "i ";
            } else {
                negative = false;
                coef = "(" + num(c[0]) + (c[1] < 0 ? " - " : " + ") + num(Math.abs(c[1])) + " i) ";
            }
            if (first) {
                sb.append(negative ? "-" : "");
            } else {
                sb.append(negative ? " - " : " + ");
            }
            sb.append(coef).append(body);
            first = false;
        }
    }

    private static String monoText(Mono mo, boolean latex) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < mo.pow.length; i++) {
            if (mo.pow[i] > 0) {
                sb.append(' ').append(latex ? "g_{" + (i + 1) + "}" : "g" + (i + 1));
                if (mo.pow[i] > 1) {
                    sb.append(latex ? "^{" + mo.pow[i] + "}" : "^" + mo.pow[i]);
                }
            }
        }
        if (mo.hasExp()) {
            StringBuilder ex = new StringBuilder();
            boolean first = true;
            for (int i = 0; i < mo.er.length; i++) {
                double r = mo.er[i], im = mo.ei[i];
                if (r == 0 && im == 0) {
                    continue;
                }
                String g = latex ? "g_{" + (i + 1) + "}" : "g" + (i + 1);
                String coef;
                boolean neg;
                if (im == 0) {
                    neg = r < 0;
                    coef = num(Math.abs(r));
                    coef = coef.equals("1") ? "" : coef + " ";
                } else if (r == 0) {
                    neg = im < 0;
                    String v = num(Math.abs(im));
                    coef = (v.equals("1") ? "" : v + " ") + "i ";
                } else {
                    neg = false;
                    coef = "(" + num(r) + (im < 0 ? " - " : " + ") + num(Math.abs(im)) + " i) ";
                }
                ex.append(first ? (neg ? "-" : "") : (neg ? " - " : " + ")).append(coef).append(g);
                first = false;
            }
            sb.append(latex ? " e^{" + ex + "}" : " exp(" + ex + ")");
        }
        return sb.toString();
    }

    /** Formats a complex number compactly ("2", "-0.5 i", "(1 + 2 i)"). */
    public static String complex(double re, double im) {
        re = snap(re);
        im = snap(im);
        if (im == 0) {
            return num(re);
        }
        if (re == 0) {
            return (im < 0 ? "-" : "") + (Math.abs(im) == 1 ? "" : num(Math.abs(im)) + " ") + "i";
        }
        return "(" + num(re) + (im < 0 ? " - " : " + ") + num(Math.abs(im)) + " i)";
    }

    static String num(double x) {
        if (x < 0) {
            return "-" + num(-x);
        }
        if (x == Math.rint(x) && Math.abs(x) < 1e15) {
            return Long.toString((long) x);
        }
        String s = String.format(java.util.Locale.ROOT, "%.10g", x);
        if (s.contains("e")) {
            return s;
        }
        if (s.contains(".")) {
            s = s.replaceAll("0+$", "");
            s = s.replaceAll("\\.$", "");
        }
        return s;
    }

    /** Evaluates M(g) = Γ(g)⁻¹ from the closed form (tests compare it with the numerical solve). */
    public double[][] evalInverse(double[] g) {
        if (inverse == null) {
            return null;
        }
        double[] mr = new double[m * m], mi = new double[m * m];
        for (int k = 0; k < m; k++) {
            for (int j = 0; j < m; j++) {
                double[] v = eval(inverse[k][j], g);
                mr[k * m + j] = v[0];
                mi[k * m + j] = v[1];
            }
        }
        return new double[][]{mr, mi};
    }

    private static double[] eval(Expr e, double[] g) {
        double sr = 0, si = 0;
        for (Map.Entry<Mono, double[]> t : e.t.entrySet()) {
            Mono mo = t.getKey();
            double vr = t.getValue()[0], vi = t.getValue()[1];
            double xr = 0, xi = 0;
            for (int k = 0; k < mo.pow.length; k++) {
                double gr = g[2 * k], gi = g[2 * k + 1];
                for (int p = 0; p < mo.pow[k]; p++) {
                    double u = vr * gr - vi * gi;
                    vi = vr * gi + vi * gr;
                    vr = u;
                }
                xr += mo.er[k] * gr - mo.ei[k] * gi;
                xi += mo.er[k] * gi + mo.ei[k] * gr;
            }
            double ex = Math.exp(xr), cr = ex * Math.cos(xi), ci = ex * Math.sin(xi);
            sr += vr * cr - vi * ci;
            si += vr * ci + vi * cr;
        }
        return new double[]{sr, si};
    }
}
