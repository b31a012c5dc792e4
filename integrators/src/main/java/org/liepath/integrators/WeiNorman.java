package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.DriveException;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.ProgressListener;
import org.liepath.core.internal.Require;
import org.liepath.algebra.LieAlgebra;
import org.liepath.integrators.internal.wn.Chart;
import org.liepath.integrators.internal.wn.Driver;
import org.liepath.integrators.internal.wn.Symbolic;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * A Wei–Norman chart: coordinates of the second kind U = exp(g_1X_1) exp(g_2X_2) … exp(g_mX_m) on the group of an
 * ordered basis X_1..X_m of a Lie algebra of N×N matrices, with X_1 the leftmost factor and g(t0) = 0.
 *
 * <p><b>Method.</b> J. Wei, E. Norman, "Lie algebraic solution of linear differential equations", J. Math. Phys. 4
 * (1963) 575; "On global representations of the solutions of linear differential equations as a product of
 * exponentials", Proc. Amer. Math. Soc. 15 (1964) 327. For dU/dt = −iH(t)U with −iH(t) = Σ_k a_k(t) X_k the
 * coordinates obey Σ_k ġ_k Ad(exp(g_1X_1)…exp(g_{k−1}X_{k−1})) X_k = −iH(t), i.e. Γ(g)ġ = a(t) in the m×m adjoint
 * representation, where column k of Γ(g) is e^{g_1 ad X_1}…e^{g_{k−1} ad X_{k−1}} e_k. Only m coordinates are
 * integrated, whatever N is: the structure constants of spin-j matrices do not depend on j.
 *
 * <p><b>Basis convention.</b> The elements X_k are used exactly as given; they need not be anti-Hermitian and the
 * coordinates are complex. For the ladder basis (J+, Jz, J−) of su(2) the coordinates of −iH are
 * a = (−i h_+, −i h_z, −i h_−) and the first equation is the scalar Riccati equation
 * ġ_1 = a_1 + a_2 g_1 − a_3 g_1²; for an anti-Hermitian basis (such as −iσ/2 or an orthonormal basis of a dynamical
 * Lie algebra) and Hermitian H the coordinates stay real. A Hamiltonian whose −iH(t) is not in the complex span of the
 * basis is refused by {@link #equations(Hamiltonian)}.
 *
 * <p><b>Singularities.</b> The chart is local: Γ(g) can turn singular at finite time. Runs through
 * {@code Scheme.weiNorman(chart)} monitor κ₁(Γ(g)) and the growth Π‖exp(g_kX_k)‖ of the factors after every step and,
 * before either exceeds its limit ({@link #DEFAULT_MAX_CONDITION}, {@link #DEFAULT_MAX_GROWTH}), re-anchor:
 * U(t) = U_chart(g(t))·U(t_b) with new coordinates from zero at t_b. The number of charts used is reported.
 *
 * <p>Immutable and thread-safe. Construction costs m² brackets of N×N matrices plus small m×m analyses.
 */
public final class WeiNorman {
    /** Default limit of κ₁(Γ(g)) before a run re-anchors (the coordinate solve loses about log10 of it in digits). */
    public static final double DEFAULT_MAX_CONDITION = 1e6;
    /**
     * Default limit of Π_k‖exp(g_kX_k)‖₁ before a run re-anchors: the reconstructed product of non-unitary factors
     * loses about log10 of this many digits to cancellation.
     */
    public static final double DEFAULT_MAX_GROWTH = 1e3;
    /** Upper limit on the number of basis elements. */
    public static final int MAX_DIMENSION = 256;

    private static final int MAX_CHARTS = 100_000;
    private static final long MAX_EVALUATIONS = 50_000_000L;

    private final List<Operator> basis;
    private final Chart chart;
    private final double maxCondition, maxGrowth;
    private volatile Symbolic symbolic;
    private volatile boolean symbolicDone;

    private WeiNorman(List<Operator> basis, Chart chart, double maxCondition, double maxGrowth) {
        this.basis = basis;
        this.chart = chart;
        this.maxCondition = maxCondition;
        this.maxGrowth = maxGrowth;
    }

    /**
     * A chart for an ordered basis of a Lie algebra (real or complex matrices; used as given).
     *
     * @param orderedBasis X_1..X_m, X_1 the leftmost factor; linearly independent over ℂ and closed under brackets
     * @return a chart for an ordered basis of a Lie algebra
     * @throws InvalidInputException NULL or EMPTY; DIMENSION_MISMATCH if the sizes differ; OUT_OF_RANGE if an element
     *                               lies in the span of the others; NOT_CLOSED naming a bracket [X_i, X_j] outside the
     *                               span; LIMIT_EXCEEDED above {@link #MAX_DIMENSION} elements
     */
    public static WeiNorman of(List<Operator> orderedBasis) {
        Require.nonNull(orderedBasis, "orderedBasis");
        if (orderedBasis.isEmpty()) {
            throw InvalidInputException.of(Reason.EMPTY, "orderedBasis", "at least one operator", "an empty list");
        }
        if (orderedBasis.size() > MAX_DIMENSION) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "orderedBasis", "at most " + MAX_DIMENSION
                    + " elements", orderedBasis.size());
        }
        int m = orderedBasis.size();
        List<Operator> copy = new ArrayList<>(m);
        for (int k = 0; k < m; k++) {
            copy.add(Require.nonNull(orderedBasis.get(k), "orderedBasis[" + k + "]"));
        }
        int n = copy.get(0).dim();
        double[][] re = new double[m][], im = new double[m][];
        for (int k = 0; k < m; k++) {
            Operator x = copy.get(k);
            if (x.dim() != n) {
                throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "orderedBasis[" + k + "]",
                        "an operator of dimension " + n + " like orderedBasis[0]", "dimension " + x.dim());
            }
            re[k] = x.reArray();
            im[k] = x.imArray();
        }
        Chart c;
        try {
            c = new Chart(n, re, im);
        } catch (Chart.Defect d) {
            if (d.j < 0) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "orderedBasis",
                        "linearly independent operators", "X" + (d.i + 1) + " (orderedBasis[" + d.i
                                + "]) in the span of the elements before it (relative residual " + d.residual + ")");
            }
            throw InvalidInputException.of(Reason.NOT_CLOSED, "orderedBasis", "a basis closed under the commutator",
                    "[X" + (d.i + 1) + ", X" + (d.j + 1) + "] (orderedBasis[" + d.i + "], orderedBasis[" + d.j
                            + "]) with a relative component " + d.residual + " outside the span");
        }
        return new WeiNorman(Collections.unmodifiableList(copy), c, DEFAULT_MAX_CONDITION, DEFAULT_MAX_GROWTH);
    }

    /**
     * A chart for the basis of an algebra, in the algebra's own order. For a dynamical Lie algebra
     * ({@code LieAlgebra.generatedBy(h)}) the basis is anti-Hermitian and orthonormal, so the coordinates of a Hermitian
     * H stay real; for a ladder ordering with Riccati equations use {@link #of(List)} with the ordering of your choice
     * or one from {@link WeiNormanOrderings}. The structure constants are recomputed from the basis.
     *
     * @param algebra the Lie algebra
     * @return a chart for the basis of an algebra, in the algebra's own order
     * @throws InvalidInputException NULL
     */
    public static WeiNorman of(LieAlgebra algebra) {
        Require.nonNull(algebra, "algebra");
        return of(algebra.basis());
    }

    /**
     * A copy with other re-anchoring limits.
     *
     * @param maxCondition the largest κ₁(Γ(g)) tolerated (&gt; 1; infinity: never on conditioning)
     * @param maxGrowth    the largest Π_k‖exp(g_kX_k)‖₁ tolerated (&gt; 1; infinity: never on growth)
     * @return a copy with this setting
     */
    public WeiNorman withReanchorLimits(double maxCondition, double maxGrowth) {
        if (!(maxCondition > 1)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "maxCondition", "a number > 1", maxCondition);
        }
        if (!(maxGrowth > 1)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "maxGrowth", "a number > 1", maxGrowth);
        }
        return new WeiNorman(basis, chart, maxCondition, maxGrowth);
    }

    /**
     * A copy that never re-anchors (runs fail with a status if the chart turns singular).
     *
     * @return a copy with this setting
     */
    public WeiNorman withoutReanchoring() {
        return new WeiNorman(basis, chart, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    /** @return true if runs re-anchor automatically */
    public boolean reanchors() {
        return maxCondition < Double.POSITIVE_INFINITY || maxGrowth < Double.POSITIVE_INFINITY;
    }

    /** @return the number m of basis elements (coordinates) */
    public int dimension() {
        return chart.m;
    }

    /** @return the size N of the matrices (the chart's own representation) */
    public int representationDim() {
        return chart.n;
    }

    /** @return the ordered basis (unmodifiable) */
    public List<Operator> basis() {
        return basis;
    }

    /**
     * @param i the index
     * @param j the index
     * @param l the index of the result component
     * @return the structure constant c_{ij}^l with [X_i, X_j] = Σ_l c_{ij}^l X_l (0-based indices)
     */
    public Complex structureConstant(int i, int j, int l) {
        int m = chart.m;
        Require.index(i, m, "i");
        Require.index(j, m, "j");
        Require.index(l, m, "l");
        return new Complex(chart.adRe[i][l * m + j], chart.adIm[i][l * m + j]);
    }

    /**
     * @param k the index
     * @return ad X_k as an m×m matrix: column j holds the coordinates of [X_k, X_j]
     */
    public Operator adjoint(int k) {
        Require.index(k, chart.m, "k");
        return Operator.ofPlanar(chart.m, chart.adRe[k].clone(), chart.adIm[k].clone());
    }

    /**
     * Coordinates of an operator in the complex span of the basis.
     *
     * @param y the operator, in the complex span of the basis
     * @return the coordinates c_k with y = Σ c_k X_k
     * @throws InvalidInputException DIMENSION_MISMATCH, or UNSUPPORTED if y is not in the span
     */
    public Complex[] coordinates(Operator y) {
        Require.nonNull(y, "y");
        Require.sameDim(chart.n, y.dim(), "y");
        double[] cr = new double[chart.m], ci = new double[chart.m];
        double res = chart.coordinates(y.reArray(), y.imArray(), cr, ci);
        double nrm = y.norm();
        if (res > Chart.SPAN_TOL * Math.max(nrm, 1e-300) && res > 0) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "y", "an operator in the span of the chart's basis",
                    "a component of relative norm " + res / nrm + " outside it");
        }
        Complex[] out = new Complex[chart.m];
        for (int k = 0; k < chart.m; k++) {
            out[k] = new Complex(cr[k], ci[k]);
        }
        return out;
    }

    /**
     * The coordinate equations Γ(g)ġ = a(t) for dU/dt = −iH(t)U.
     *
     * @param h the Hamiltonian
     * @return the coordinate equations Γ(g)ġ = a(t) for dU/dt = −iH(t)U
     * @throws InvalidInputException DIMENSION_MISMATCH if h acts on another space; UNSUPPORTED naming the term whose
     *                               −iA_k leaves the span of the basis
     */
    public WeiNormanEquations equations(Hamiltonian h) {
        Require.nonNull(h, "h");
        Require.sameDim(chart.n, h.dim(), "h");
        return new WeiNormanEquations(this, h);
    }

    /**
     * U = exp(g_1X_1)…exp(g_mX_m) in the chart's own representation: m exponentials of N×N matrices, each in closed
     * form where X_k is diagonal, a single-band ladder operator (a finite polynomial) or strictly triangular, else by
     * Padé scaling and squaring; m − 1 matrix products.
     *
     * @param g the coordinates g_1 … g_m
     * @return U in the chart's own representation
     * @throws InvalidInputException NULL, DIMENSION_MISMATCH (length ≠ m) or NOT_FINITE
     */
    public Operator propagator(Complex[] g) {
        double[] y = interleave(g, "g");
        int len = chart.n * chart.n;
        double[] ur = new double[len], ui = new double[len];
        chart.reconstruct(y, ur, ui, new Chart.Work(chart));
        return Operator.ofPlanar(chart.n, ur, ui);
    }

    /**
     * @param g the coordinates g_1 … g_m
     * @return κ₁(Γ(g)), the condition number of the coordinate system at g (infinite where the chart is singular)
     */
    public double condition(Complex[] g) {
        return chart.condition(interleave(g, "g"), new Chart.Work(chart));
    }

    /**
     * The nonlinearity of the coordinate equations for a generic a(t) (see {@link Nonlinearity}); for (J+, Jz, J−)
     * of su(2) it is {@link Nonlinearity#RICCATI}.
     *
     * @return the nonlinearity of the coordinate equations for a generic a(t) (see {@link Nonlinearity})
     */
    public Nonlinearity nonlinearity() {
        Symbolic s = symbolic();
        if (s == null) {
            return Nonlinearity.GENERAL;
        }
        Nonlinearity worst = Nonlinearity.LINEAR;
        for (int k = 0; k < chart.m; k++) {
            Nonlinearity v = WeiNormanEquations.map(s.kind(k));
            if (v.compareTo(worst) > 0) {
                worst = v;
            }
        }
        return worst;
    }

    /** @return true if the coordinate equations are at most quadratic (a hierarchy of Riccati equations) */
    public boolean isRiccati() {
        return nonlinearity().compareTo(Nonlinearity.RICCATI) <= 0;
    }

    Symbolic symbolic() {
        if (!symbolicDone) {
            synchronized (this) {
                if (!symbolicDone) {
                    symbolic = Symbolic.of(chart);
                    symbolicDone = true;
                }
            }
        }
        return symbolic;
    }

    Chart chart() {
        return chart;
    }

    double[] interleave(Complex[] g, String name) {
        Require.nonNull(g, name);
        if (g.length != chart.m) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, name, chart.m + " coordinates", g.length);
        }
        double[] y = new double[2 * chart.m];
        for (int k = 0; k < chart.m; k++) {
            Complex z = Require.nonNull(g[k], name + "[" + k + "]");
            if (z.isNaN() || z.isInfinite()) {
                throw InvalidInputException.of(Reason.NOT_FINITE, name + "[" + k + "]", "a finite number", z);
            }
            y[2 * k] = z.getReal();
            y[2 * k + 1] = z.getImaginary();
        }
        return y;
    }

    /**
     * Hook used by {@link Evolve} for {@code Scheme.weiNorman(chart)}: integrates the coordinates of this chart for h
     * from t0 to t1 (t1 &lt; t0 allowed) with relative/absolute tolerance tol, recording coordinates at sampleTimes
     * (may be empty; the end time is always recorded), reporting to monitor (never null; false = cancel).
     */
    CoordinateRun integrate(Hamiltonian h, double t0, double t1, double tol, double[] sampleTimes,
                            ProgressListener monitor) {
        WeiNormanEquations eq = equations(h);
        WeiNormanEquations.Workspace ws = eq.workspace();
        Chart.Work hw = new Chart.Work(chart);
        Chart.Work rw = new Chart.Work(chart);
        Driver.Model model = new Driver.Model() {
            @Override
            public int size() {
                return 2 * chart.m;
            }

            @Override
            public int dim() {
                return chart.n;
            }

            @Override
            public boolean rhs(double t, double[] y, double[] yDot) {
                return eq.derivative(t, y, yDot, ws);
            }

            @Override
            public double health(double[] y) {
                double kappa = maxCondition < Double.POSITIVE_INFINITY ? chart.condition(y, hw) / maxCondition : 0;
                double grow = maxGrowth < Double.POSITIVE_INFINITY ? chart.growth(y) / maxGrowth : 0;
                return Math.max(kappa, grow);
            }

            @Override
            public void reconstruct(double[] y, double[] outR, double[] outI) {
                chart.reconstruct(y, outR, outI, rw);
            }
        };
        double[] samples = sampleTimes == null ? new double[0] : sampleTimes;
        Driver.Result r;
        try {
            r = Driver.run(model, t0, t1, tol, h.breakpoints(), samples, monitor, reanchors(), MAX_CHARTS,
                    MAX_EVALUATIONS);
        } catch (DriveException e) {
            return new CoordinateRun(null, List.of(), new double[0], 1, 0, 0, e.getMessage(), false);
        }
        List<Complex[]> coords = new ArrayList<>();
        List<Operator> props = new ArrayList<>();
        for (int s = 0; s < r.sampleY.size(); s++) {
            double[] y = r.sampleY.get(s);
            Complex[] c = new Complex[chart.m];
            for (int k = 0; k < chart.m; k++) {
                c[k] = new Complex(y[2 * k], y[2 * k + 1]);
            }
            coords.add(c);
            if (s < r.sampleU.size()) {
                props.add(Operator.ofPlanar(chart.n, r.sampleU.get(s)[0], r.sampleU.get(s)[1]));
            }
        }
        Operator u = r.failure == null ? Operator.ofPlanar(chart.n, r.uRe, r.uIm) : null;
        double[] times;
        if (r.failure == null) {
            times = java.util.Arrays.copyOf(r.sampleT, r.sampleT.length + 1);
            times[r.sampleT.length] = t1;
            props.add(u);
        } else {
            times = java.util.Arrays.copyOf(r.sampleT, Math.min(r.sampleT.length, coords.size()));
        }
        return new CoordinateRun(u, Collections.unmodifiableList(coords), times, r.charts, r.evaluations, r.steps,
                r.failure, r.cancelled, Collections.unmodifiableList(props));
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder("WeiNorman chart U = ");
        for (int k = 0; k < chart.m; k++) {
            sb.append(k == 0 ? "" : " ").append("exp(g").append(k + 1).append(" X").append(k + 1).append(')');
        }
        sb.append(", m = ").append(chart.m).append(", N = ").append(chart.n);
        return sb.toString();
    }
}
