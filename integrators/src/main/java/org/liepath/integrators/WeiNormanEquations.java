package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.internal.Require;
import org.liepath.integrators.internal.wn.Chart;
import org.liepath.integrators.internal.wn.Symbolic;

import java.util.List;

/**
 * The Wei–Norman coordinate equations Γ(g)ġ = a(t) of one chart for one Hamiltonian (J. Wei, E. Norman, J. Math.
 * Phys. 4 (1963) 575): a(t) holds the coordinates of −iH(t) = Σ_k a_k(t) X_k in the chart's basis, and column k of
 * Γ(g) is the basis element X_k transported by Ad(exp(g_1X_1)…exp(g_{k−1}X_{k−1})), computed in the m×m adjoint
 * representation with closed-form exp(g·ad X) where ad X is nilpotent or diagonalisable.
 *
 * <p>Coordinates are complex. The fluent {@link #derivative(double, Complex[])} allocates; the primitive
 * {@link #derivative(double, double[], double[], Workspace)} works on interleaved arrays (g[2k] = Re g_k, g[2k+1] =
 * Im g_k) in a caller-owned {@link Workspace} and allocates nothing: cost m small exponentials and products of m×m
 * matrices plus one LU solve, independent of the representation size N.
 *
 * <p>Immutable and thread-safe (each thread uses its own workspace).
 */
public final class WeiNormanEquations {
    private final WeiNorman chart;
    private final Chart c;
    private final Hamiltonian h;
    private final double[][] alphaR, alphaI; // [k][term]

    WeiNormanEquations(WeiNorman chart, Hamiltonian h) {
        this.chart = chart;
        this.c = chart.chart();
        this.h = h;
        int terms = h.size(), m = c.m;
        alphaR = new double[m][terms];
        alphaI = new double[m][terms];
        double[] cr = new double[m], ci = new double[m];
        List<Operator> ops = h.operators();
        for (int j = 0; j < terms; j++) {
            Operator a = ops.get(j);
            // −iA = −i(re + i im) = im − i re
            double[] yr = a.imArray(), yi = a.reArray();
            for (int e = 0; e < yi.length; e++) {
                yi[e] = -yi[e];
            }
            double res = c.coordinates(yr, yi, cr, ci);
            double nrm = a.norm();
            if (res > Chart.SPAN_TOL * nrm && res > 0) {
                throw InvalidInputException.of(Reason.UNSUPPORTED, "h",
                        "a Hamiltonian whose −iH(t) lies in the span of the chart's basis",
                        "term " + j + " (drive " + h.drives().get(j).name() + ") with −iA_" + j
                                + " having a component of relative norm " + res / nrm + " outside the span");
            }
            for (int k = 0; k < m; k++) {
                alphaR[k][j] = cr[k];
                alphaI[k][j] = ci[k];
            }
        }
    }

    /** Scratch for {@link #derivative(double, double[], double[], Workspace)}: mutable, one per thread. */
    public static final class Workspace {
        final Chart.Work w;
        final double[] coef, aR, aI;

        Workspace(Chart c, int terms) {
            w = new Chart.Work(c);
            coef = new double[terms];
            aR = new double[c.m];
            aI = new double[c.m];
        }
    }

    /** @return a new workspace for the primitive tier */
    public Workspace workspace() {
        return new Workspace(c, h.size());
    }

    /** @return the chart */
    public WeiNorman chart() {
        return chart;
    }

    /** @return the Hamiltonian */
    public Hamiltonian hamiltonian() {
        return h;
    }

    /** @return the number m of coordinates */
    public int size() {
        return c.m;
    }

    /** @return a(t), the coordinates of −iH(t) in the chart's basis */
    public Complex[] drive(double t) {
        Require.finite(t, "t");
        Workspace ws = workspace();
        fillA(t, ws);
        Complex[] out = new Complex[c.m];
        for (int k = 0; k < c.m; k++) {
            out[k] = new Complex(ws.aR[k], ws.aI[k]);
        }
        return out;
    }

    private void fillA(double t, Workspace ws) {
        h.coefficients(t, ws.coef);
        for (int k = 0; k < c.m; k++) {
            double sr = 0, si = 0;
            double[] ar = alphaR[k], ai = alphaI[k];
            for (int j = 0; j < ws.coef.length; j++) {
                sr += ws.coef[j] * ar[j];
                si += ws.coef[j] * ai[j];
            }
            ws.aR[k] = sr;
            ws.aI[k] = si;
        }
    }

    /**
     * ġ = Γ(g)⁻¹ a(t).
     *
     * @throws InvalidInputException for a wrong length or non-finite entries; OUT_OF_RANGE where Γ(g) is singular
     */
    public Complex[] derivative(double t, Complex[] g) {
        Require.finite(t, "t");
        double[] y = chart.interleave(g, "g");
        double[] d = new double[y.length];
        if (!derivative(t, y, d, workspace())) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "g", "coordinates where the chart is regular",
                    "a point where Γ(g) is singular");
        }
        Complex[] out = new Complex[c.m];
        for (int k = 0; k < c.m; k++) {
            out[k] = new Complex(d[2 * k], d[2 * k + 1]);
        }
        return out;
    }

    /**
     * Primitive tier: gDot = Γ(g)⁻¹ a(t) on interleaved arrays of length 2m; g is not modified. Allocates nothing;
     * does not validate (hot loop).
     *
     * @return false (and gDot unspecified) where Γ(g) is singular
     */
    public boolean derivative(double t, double[] g, double[] gDot, Workspace ws) {
        fillA(t, ws);
        return c.solve(g, ws.aR, ws.aI, gDot, ws.w);
    }

    /** @return κ₁(Γ(g)) */
    public double condition(Complex[] g) {
        return chart.condition(g);
    }

    /** @return the nonlinearity of the whole system (see {@link Nonlinearity}) */
    public Nonlinearity nonlinearity() {
        return chart.nonlinearity();
    }

    /** @return the nonlinearity of equation k (0-based) */
    public Nonlinearity nonlinearity(int k) {
        Require.index(k, c.m, "k");
        Symbolic s = chart.symbolic();
        return s == null ? Nonlinearity.GENERAL : map(s.kind(k));
    }

    /** @return true if equation k (0-based) is a quadrature: its right-hand side does not involve g_k's block */
    public boolean isQuadrature(int k) {
        Require.index(k, c.m, "k");
        Symbolic s = chart.symbolic();
        return s != null && s.kind(k) == Symbolic.Kind.QUADRATURE;
    }

    /** @return true if the system is at most quadratic (Riccati) */
    public boolean isRiccati() {
        return chart.isRiccati();
    }

    static Nonlinearity map(Symbolic.Kind k) {
        switch (k) {
            case QUADRATURE:
            case LINEAR:
                return Nonlinearity.LINEAR;
            case RICCATI:
                return Nonlinearity.RICCATI;
            case POLYNOMIAL:
                return Nonlinearity.POLYNOMIAL;
            case EXPONENTIAL:
                return Nonlinearity.EXPONENTIAL;
            default:
                return Nonlinearity.GENERAL;
        }
    }

    /**
     * The equations as text: the product ansatz, ġ_k in closed form (solved form ġ = Γ(g)⁻¹a when det Γ is a single
     * exponential, else the implicit form Γ(g)ġ = a), the coefficients a_k(t) in terms of the drives, and the
     * classification. For (σ+, σz, σ−) it shows {@code g1' = a1 + 2 a2 g1 - a3 g1^2}.
     */
    public String render() {
        return render(false);
    }

    /** The same as {@link #render()} in LaTeX (an {@code aligned} environment plus definitions). */
    public String renderLatex() {
        return render(true);
    }

    private String render(boolean latex) {
        int m = c.m;
        StringBuilder sb = new StringBuilder();
        String nl = latex ? " \\\\\n" : "\n";
        if (latex) {
            sb.append("U(t) = ");
            for (int k = 0; k < m; k++) {
                sb.append("e^{g_{").append(k + 1).append("} X_{").append(k + 1).append("}}");
            }
            sb.append(",\\quad g(t_0) = 0,\\quad -iH(t) = ");
            for (int k = 0; k < m; k++) {
                sb.append(k == 0 ? "" : " + ").append("a_{").append(k + 1).append("}(t) X_{").append(k + 1)
                        .append('}');
            }
            sb.append("\n\\begin{aligned}\n");
        } else {
            sb.append("Wei–Norman equations for U(t) = ");
            for (int k = 0; k < m; k++) {
                sb.append(k == 0 ? "" : " ").append("exp(g").append(k + 1).append(" X").append(k + 1).append(')');
            }
            sb.append(", g(t0) = 0,\nwhere -iH(t) = ");
            for (int k = 0; k < m; k++) {
                sb.append(k == 0 ? "" : " + ").append('a').append(k + 1).append("(t) X").append(k + 1);
            }
            sb.append(":\n");
        }
        Symbolic s = chart.symbolic();
        if (s == null) {
            sb.append(latex ? "\\Gamma(g)\\,\\dot g &= a(t)" : "  Gamma(g) g' = a(t)  (no closed form: Γ is computed "
                    + "numerically from exp(g_k ad X_k))");
            sb.append(latex ? "\n" : "\n");
        } else {
            List<String> lines = s.lines(latex);
            for (int k = 0; k < lines.size(); k++) {
                sb.append(latex ? "" : "  ").append(lines.get(k)).append(k == lines.size() - 1 && latex ? "\n" : nl);
            }
            if (!s.solved()) {
                sb.append(latex ? "" : "  (implicit form Γ(g) g' = a: det Γ(g) is not a single exponential)\n");
            }
        }
        if (latex) {
            sb.append("\\end{aligned}\n");
        }
        sb.append(latex ? "\\text{with } " : "with\n");
        for (int k = 0; k < m; k++) {
            StringBuilder line = new StringBuilder();
            boolean any = false;
            for (int j = 0; j < h.size(); j++) {
                double ar = alphaR[k][j], ai = alphaI[k][j];
                if (Math.hypot(ar, ai) <= 1e-14) {
                    continue;
                }
                line.append(any ? " + " : "").append(Symbolic.complex(ar, ai)).append(latex ? "\\," : " ")
                        .append(driveName(j, latex));
                any = true;
            }
            if (!any) {
                line.append('0');
            }
            sb.append(latex ? "a_{" + (k + 1) + "}(t) = " : "  a" + (k + 1) + "(t) = ").append(line)
                    .append(latex ? (k == m - 1 ? "" : ",\\; ") : "\n");
        }
        if (latex) {
            sb.append("\\quad (c_{k}(t)\\text{: the drive of term } k \\text{ of } H)\n");
        }
        if (!latex) {
            sb.append("nonlinearity: ").append(nonlinearity());
            if (s != null) {
                sb.append(" (");
                for (int k = 0; k < m; k++) {
                    sb.append(k == 0 ? "" : ", ").append('g').append(k + 1).append(": ")
                            .append(s.kind(k).name().toLowerCase(java.util.Locale.ROOT));
                }
                sb.append(')');
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private String driveName(int j, boolean latex) {
        String name = h.drives().get(j).name();
        if (name == null || name.isEmpty()) {
            name = "c" + (j + 1);
        }
        if (latex) {
            return "c_{" + (j + 1) + "}(t)";
        }
        // a bare number reads as a factor only when it is non-negative ("2 0.5"); "2 -0.02" would read as a difference
        return name.matches("\\+?[0-9][0-9.eE+-]*") ? name : "(" + name + ")";
    }

    @Override
    public String toString() {
        return render();
    }
}
