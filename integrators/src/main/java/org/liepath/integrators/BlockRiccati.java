package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.DriveException;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.internal.Require;
import org.liepath.integrators.internal.wn.BlockNode;
import org.liepath.integrators.internal.wn.Driver;

import java.util.List;

/**
 * Block Riccati (block Gauss / LDU) decomposition of the propagator of dU/dt = A(t)U, A = −iH(t), for H split into
 * 2×2 blocks of sizes n = split and N − n:
 * <pre>
 *   U = [[I, Z], [0, I]] · [[P, 0], [0, Q]] · [[I, 0], [W, I]] = [[P + ZQW, ZQ], [QW, Q]]
 *   Z' = A12 + A11 Z − Z A22 − Z A21 Z      (matrix Riccati equation for the off-diagonal block, decoupled)
 *   P' = (A11 − Z A21) P,  Q' = (A22 + A21 Z) Q,  W' = Q⁻¹ A21 P,   Z(t0) = W(t0) = 0, P(t0) = I, Q(t0) = I
 * </pre>
 * The scalar case N = 2, n = 1 is the Riccati chart (σ+, σz, σ−) of su(2) (J. Wei, E. Norman, J. Math. Phys. 4
 * (1963) 575). With {@link #recursive(int)} the diagonal factors P and Q are decomposed the same way, recursively,
 * down to blocks of a given size. The factorisation exists while the block U22 = Q is invertible: a run stops with a
 * failure naming the time when κ₁(Q) exceeds {@link #MAX_CONDITION}, unless {@link #withReanchoring()} is set, in
 * which case U(t) = U_blocks(t)·U(t_b) is frozen and the factors restart from the identity
 * (when ‖U‖₁‖U22⁻¹‖₁ exceeds {@link #REANCHOR_CONDITION}).
 *
 * <p>Integration: Dormand–Prince 8(5,3) (Commons Math) on all factors, tolerance tol (absolute and relative).
 * Immutable and thread-safe; each run allocates its own workspace.
 */
public final class BlockRiccati {
    /**
     * Largest ‖U‖₁‖U22⁻¹‖₁ tolerated before a run without re-anchoring declares the decomposition broken down (the
     * factors then reach about this size).
     */
    public static final double MAX_CONDITION = 1e8;
    /**
     * Limit of ‖U‖₁‖U22⁻¹‖₁ at which a run with re-anchoring restarts the factors: the reconstruction P + ZQW loses
     * about log10 of the square of this many digits to cancellation, so it is kept small.
     */
    public static final double REANCHOR_CONDITION = 1e3;
    private static final long MAX_EVALUATIONS = 20_000_000L;

    private final Hamiltonian h;
    private final int split, leafSize;
    private final boolean reanchor;

    private BlockRiccati(Hamiltonian h, int split, int leafSize, boolean reanchor) {
        this.h = h;
        this.split = split;
        this.leafSize = leafSize;
        this.reanchor = reanchor;
    }

    /**
     * @param h     the Hamiltonian (dimension N ≥ 2)
     * @param split the size n of the first block, 1 ≤ n ≤ N − 1
     * @return the block Riccati decomposition
     * @throws InvalidInputException NULL, or OUT_OF_RANGE for a split outside [1, N − 1]
     */
    public static BlockRiccati of(Hamiltonian h, int split) {
        Require.nonNull(h, "h");
        if (split < 1 || split > h.dim() - 1) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "split", "a block size in [1, " + (h.dim() - 1)
                    + "] for a Hamiltonian of dimension " + h.dim(), split);
        }
        return new BlockRiccati(h, split, Integer.MAX_VALUE, false);
    }

    /**
     * A copy that also decomposes the diagonal factors, halving blocks until they have at most leafSize rows.
     *
     * @param leafSize the largest block that is not split further
     * @return a copy with this setting
     */
    public BlockRiccati recursive(int leafSize) {
        Require.positive(leafSize, "leafSize");
        return new BlockRiccati(h, split, leafSize, reanchor);
    }

    /**
     * A copy that re-anchors (restarts the factors from the identity) instead of failing when U22 turns singular.
     *
     * @return a copy with this setting
     */
    public BlockRiccati withReanchoring() {
        return new BlockRiccati(h, split, leafSize, true);
    }

    /** @return the first block size n */
    public int split() {
        return split;
    }

    /** @return the Hamiltonian */
    public Hamiltonian hamiltonian() {
        return h;
    }

    /**
     * The right-hand side of the matrix Riccati equation, Z' = A12 + A11 Z − Z A22 − Z A21 Z with A = −iH(t).
     *
     * @param t the time
     * @param z the off-diagonal block, n rows of N − n entries
     * @return Z' as n rows of N − n entries
     */
    public Complex[][] riccatiDerivative(double t, Complex[][] z) {
        Require.finite(t, "t");
        Require.nonNull(z, "z");
        int n = split, n2 = h.dim() - split;
        if (z.length != n) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "z", n + " rows", z.length);
        }
        Operator a = h.at(t).timesI().scale(-1);
        Complex[][] out = new Complex[n][n2];
        for (int i = 0; i < n; i++) {
            Require.nonNull(z[i], "z[" + i + "]");
            if (z[i].length != n2) {
                throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "z[" + i + "]", n2 + " entries", z[i].length);
            }
        }
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n2; j++) {
                Complex s = a.get(i, n + j);
                for (int k = 0; k < n; k++) {
                    s = s.add(a.get(i, k).multiply(z[k][j]));
                }
                for (int k = 0; k < n2; k++) {
                    s = s.subtract(z[i][k].multiply(a.get(n + k, n + j)));
                }
                for (int k = 0; k < n2; k++) {
                    Complex azkj = Complex.ZERO;
                    for (int l = 0; l < n; l++) {
                        azkj = azkj.add(a.get(n + k, l).multiply(z[l][j]));
                    }
                    s = s.subtract(z[i][k].multiply(azkj));
                }
                out[i][j] = s;
            }
        }
        return out;
    }

    /** @return the equations as text */
    public String render() {
        int n = split, n2 = h.dim() - split;
        return "Block Riccati decomposition U = [[I, Z], [0, I]] [[P, 0], [0, Q]] [[I, 0], [W, I]], A = -iH(t), blocks "
                + n + " + " + n2 + ":\n"
                + "  Z' = A12 + A11 Z - Z A22 - Z A21 Z   (" + n + "x" + n2 + ", matrix Riccati)\n"
                + "  P' = (A11 - Z A21) P                 (" + n + "x" + n + ")\n"
                + "  Q' = (A22 + A21 Z) Q                 (" + n2 + "x" + n2 + ")\n"
                + "  W' = Q^-1 A21 P                      (" + n2 + "x" + n + ")\n"
                + "  Z(t0) = 0, W(t0) = 0, P(t0) = I, Q(t0) = I; valid while U22 = Q is invertible\n"
                + (leafSize < Integer.MAX_VALUE ? "  P and Q decomposed recursively down to blocks of size <= "
                + leafSize + "\n" : "");
    }

    /** The outcome of a run. Immutable. */
    public static final class Result {
        private final Operator propagator;
        private final Complex[][] z, p, q, w;
        private final String failure;
        private final int charts;
        private final long steps;

        Result(Operator propagator, Complex[][][] f, String failure, int charts, long steps) {
            this.propagator = propagator;
            this.z = f == null ? null : f[0];
            this.p = f == null ? null : f[1];
            this.q = f == null ? null : f[2];
            this.w = f == null ? null : f[3];
            this.failure = failure;
            this.charts = charts;
            this.steps = steps;
        }

        /** @return true if the run reached t1 */
        public boolean isSuccess() {
            return failure == null;
        }

        /** @return why the run failed (names the time and the singular block), or null */
        public String failure() {
            return failure;
        }

        /** @return U(t1, t0), or null if the run failed */
        public Operator propagator() {
            return propagator;
        }

        /** @return the off-diagonal factor Z at t1 (of the last chart), rows × columns; null on failure */
        public Complex[][] z() {
            return copy(z);
        }

        /** @return the factor P at t1 (of the last chart) */
        public Complex[][] p() {
            return copy(p);
        }

        /** @return the factor Q at t1 (of the last chart) */
        public Complex[][] q() {
            return copy(q);
        }

        /** @return the factor W at t1 (of the last chart) */
        public Complex[][] w() {
            return copy(w);
        }

        /** @return the number of charts (1 + re-anchorings) */
        public int charts() {
            return charts;
        }

        /** @return accepted steps */
        public long steps() {
            return steps;
        }

        private static Complex[][] copy(Complex[][] a) {
            if (a == null) {
                return null;
            }
            Complex[][] c = new Complex[a.length][];
            for (int i = 0; i < a.length; i++) {
                c[i] = a[i].clone();
            }
            return c;
        }

        @Override
        public String toString() {
            return failure == null ? "block Riccati run: success, " + steps + " steps, " + charts + " chart(s)"
                    : "block Riccati run failed: " + failure;
        }
    }

    /**
     * Integrates the factors from t0 to t1 (t1 &lt; t0 allowed) and reconstructs U.
     *
     * @param t0 the start time
     * @param t1 the end time
     * @param tol absolute and relative tolerance of the factor integration (&gt; 0)
     * @return a copy with this setting
     */
    public Result run(double t0, double t1, double tol) {
        Require.finite(t0, "t0");
        Require.finite(t1, "t1");
        Require.positive(tol, "tol");
        int dim = h.dim();
        BlockNode root = new BlockNode(dim, split, leafSize, 0);
        int terms = h.size();
        List<Operator> ops = h.operators();
        double[][] opR = new double[terms][], opI = new double[terms][];
        for (int k = 0; k < terms; k++) {
            // −iA_k
            opR[k] = ops.get(k).imArray();
            opI[k] = ops.get(k).reArray();
            for (int e = 0; e < opI[k].length; e++) {
                opI[k][e] = -opI[k][e];
            }
        }
        double[] coef = new double[terms], aR = new double[dim * dim], aI = new double[dim * dim];
        double[] id = new double[root.size()];
        root.init(id);
        Driver.Model model = new Driver.Model() {
            @Override
            public int size() {
                return root.size();
            }

            @Override
            public int dim() {
                return dim;
            }

            @Override
            public boolean rhs(double t, double[] y, double[] yDot) {
                // the driver starts every chart at y = 0; our state is the offset from the identity factors
                double[] full = shift(y);
                h.coefficients(t, coef);
                java.util.Arrays.fill(aR, 0.0);
                java.util.Arrays.fill(aI, 0.0);
                for (int k = 0; k < terms; k++) {
                    double c = coef[k];
                    for (int e = 0; e < aR.length; e++) {
                        aR[e] += c * opR[k][e];
                        aI[e] += c * opI[k][e];
                    }
                }
                return root.rhs(aR, aI, full, yDot);
            }

            private final double[] buf = new double[root.size()];

            private double[] shift(double[] y) {
                for (int e = 0; e < buf.length; e++) {
                    buf[e] = y[e] + id[e];
                }
                return buf;
            }

            @Override
            public double health(double[] y) {
                return root.worstCondition(shift(y)) / (reanchor ? REANCHOR_CONDITION : MAX_CONDITION);
            }

            @Override
            public String breakdown(double[] y) {
                return "the block decomposition broke down: U22 became singular (condition number "
                        + String.format(java.util.Locale.ROOT, "%.3g", root.worstCondition(shift(y))) + ")";
            }

            @Override
            public void reconstruct(double[] y, double[] outR, double[] outI) {
                root.value(shift(y), outR, outI);
            }
        };
        Driver.Result r;
        try {
            r = Driver.run(model, t0, t1, tol, h.breakpoints(), new double[0], (f, c) -> true, reanchor, 100_000,
                    MAX_EVALUATIONS);
        } catch (DriveException e) {
            return new Result(null, null, e.getMessage(), 1, 0);
        }
        if (r.failure != null) {
            return new Result(null, null, r.failure, r.charts, r.steps);
        }
        double[] yEnd = r.sampleY.get(r.sampleY.size() - 1);
        double[] full = new double[yEnd.length];
        for (int e = 0; e < full.length; e++) {
            full[e] = yEnd[e] + id[e];
        }
        double[][][] f = root.factors(full);
        int n = split, n2 = dim - split;
        Complex[][][] fc = {toComplex(f[0], n, n2), toComplex(f[1], n, n), toComplex(f[2], n2, n2),
            toComplex(f[3], n2, n)};
        return new Result(Operator.ofPlanar(dim, r.uRe, r.uIm), fc, null, r.charts, r.steps);
    }

    private static Complex[][] toComplex(double[][] a, int rows, int cols) {
        Complex[][] c = new Complex[rows][cols];
        for (int i = 0; i < rows; i++) {
            for (int j = 0; j < cols; j++) {
                c[i][j] = new Complex(a[0][i * cols + j], a[1][i * cols + j]);
            }
        }
        return c;
    }
}
