package org.liepath.integrators.internal;

import org.liepath.core.internal.Skew3;

/**
 * Magnus integrators on Gauss–Legendre nodes: X ← exp(Ω) X with one exponential of a truncated Magnus exponent.
 *
 * <ul>
 *   <li>order 4, two nodes, one commutator: Ω = (h/2)(A_1 + A_2) − (√3/12) h² [A_1, A_2] (A. Iserles, S.P. Nørsett,
 *   Phil. Trans. R. Soc. A 357 (1999) 983–1019);</li>
 *   <li>order 6, three nodes, three commutators, in the form of S. Blanes, F. Casas, J. Ros, BIT 40 (2000) 434–450;</li>
 *   <li>order 8, four nodes, ten commutators (the eighth-order method of the same BCR 2000 paper, in the
 *   univariate-integral form).</li>
 * </ul>
 * Adaptive runs use the step doubling of {@link Kernel#trial}.
 *
 * <p>Assembly: every node combination (A_j, α_j, B_j) is a fixed linear combination of the node values
 * A(t_j) = Σ_k c_k(t_j) G_k, so its weights on the generators are formed first (a few multiply–adds per term) and the
 * matrices come from one pass over the generators. When {@link GeneratorPairs#pays} says so, the commutators whose
 * operands are both generator combinations (the single one of order 4, C1 of order 6, Q1, Q2 and the [B0, B2] part
 * of Q3 of order 8) come from the stored [G_k, G_l] instead of a matrix product: the same Ω up to rounding. The
 * {@link #commutators} counter counts the scheme's commutators (1, 3 or 10 per step) whichever route computes
 * them.
 *
 * <p>Three levels: for a Hamiltonian system of dimension 3 the exponent is formed on packed anti-Hermitian
 * matrices ({@link Skew3}: nine reals, brackets of 48 products) and exponentiated packed, the same formulas term by
 * term ({@code fourthPacked}, {@code sixthPacked}, {@code eighthPacked}); the result equals the planar route's to
 * rounding (tested) at about 0.55 of its time per step on a driven three-level system.
 *
 * <p>Mutable and not thread-safe, like every {@link Kernel}: one instance per run or per stepper.
 */
public final class MagnusKernel extends Kernel {
    private final int order;
    private final double[] nodes;
    private final double[][] m6;  // scratch matrices (re, im pairs)
    /** Stored generator commutators when they beat the product route, else null. */
    private final GeneratorPairs pairs;
    /** Node combinations in generator weights (index over {@link LinearSystem#generators()}). */
    private final double[][] beta;
    /** Scratch generator weights of commutator operands. */
    private final double[] x, y;
    /** Selected weights and destinations of one {@link LinearSystem#combineAll} call. */
    private final double[][] selW = new double[4][], selR = new double[4][], selI = new double[4][];
    /** The same selections as node rows s·alpha (the interaction picture combines node matrices instead). */
    private final double[][] selAlpha = new double[4][];
    private final double[] selScale = new double[4];
    /** Addends and destinations of the commutators of one {@link GeneratorPairs#combine} call. */
    private final double[][] addR = new double[3][], addI = new double[3][], pairR = new double[3][],
            pairI = new double[3][];
    /** Packed scratch matrices of the three-level route ({@link Skew3}), else null. */
    private final double[][] pk;
    /** Selected rows and destinations of one {@link #combinePacked} call. */
    private final double[][] pkAlpha = new double[4][], pkOut = new double[4][];
    private final double[] pkScale = new double[4];

    public MagnusKernel(LinearSystem sys, int order) {
        this(sys, order, GeneratorPairs.pays(sys, order));
    }

    /** @param usePairs whether first-level commutators come from stored generator pairs (forced, for tests) */
    MagnusKernel(LinearSystem sys, int order, boolean usePairs) {
        this(sys, order, usePairs, true);
    }

    /**
     * @param usePairs    whether first-level commutators come from stored generator pairs (forced, for tests)
     * @param allowPacked whether a three-level Hamiltonian system takes the packed route of {@link Skew3} (false:
     *                    the planar route, for tests comparing the two)
     */
    MagnusKernel(LinearSystem sys, int order, boolean usePairs, boolean allowPacked) {
        super(sys, order / 2, allowPacked, true);
        if (order != 4 && order != 6 && order != 8) {
            throw new IllegalArgumentException("order " + order);
        }
        this.order = order;
        this.nodes = order == 4 ? Tables.GAUSS2 : order == 6 ? Tables.GAUSS3 : Tables.GAUSS4;
        int count = order == 4 ? 6 : order == 6 ? 14 : 26;
        m6 = packed() ? null : Scratch.rows(count, m * m);
        // stored generator pairs need fixed generators; in the interaction picture they rotate with the frame
        pk = packed() ? Scratch.rows(16, Skew3.LEN) : null;
        pairs = usePairs && !sys.isInteractionPicture() && !packed() ? new GeneratorPairs(sys, (ar, ai, br, bi, cr, ci) -> bracket(1.0, ar, ai, br, bi, cr, ci))
                : null;
        int n = sys.generators();
        beta = packed() ? null : Scratch.rows(4, n);
        x = pairs != null ? new double[n] : null;
        y = pairs != null ? new double[n] : null;
    }

    /**
     * A kernel with the route of the first-level commutators fixed, for benchmarks of the two routes (the public
     * constructor chooses by {@link GeneratorPairs#pays}).
     *
     * @param storedPairs true for the stored generator pairs, false for matrix products
     */
    public static MagnusKernel withRoute(LinearSystem sys, int order, boolean storedPairs) {
        return new MagnusKernel(sys, order, storedPairs);
    }

    /** @return whether first-level commutators come from stored generator pairs */
    boolean usesPairs() {
        return pairs != null;
    }

    @Override
    public int order() {
        return order;
    }

    @Override
    public void step(double t, double h, int p, double[] xr, double[] xi) {
        evaluate(t, h, nodes);
        if (pk != null) {
            double[] om = pk[15];
            if (order == 4) {
                fourthPacked(h, om);
            } else if (order == 6) {
                sixthPacked(h, om);
            } else {
                eighthPacked(h, om);
            }
            expApplyPacked(om, p, xr, xi);
            return;
        }
        exponent(h);
        expApply(wr, wi, p, xr, xi);
    }

    /** Selects packed destination j of the next {@link #buildPacked}: Σ_k s·alpha_k A(t_k). */
    private void usePacked(int j, double s, double[] alpha, double[] out) {
        pkScale[j] = s;
        pkAlpha[j] = alpha;
        pkOut[j] = out;
    }

    private void buildPacked(int count) {
        combinePacked(count, pkScale, pkAlpha, pkOut);
    }

    /** out = s·[x, y] packed, counted as one of the scheme's commutators. */
    private void commutatorPacked(double s, double[] x, double[] y, double[] out) {
        commutators++;
        Skew3.bracket(s, x, y, out);
    }

    /** out = s·[a·x + b·y, z] packed, counted as one commutator. */
    private void commutatorPacked(double s, double a, double[] x, double b, double[] y, double[] z, double[] out) {
        commutators++;
        Skew3.bracket(s, a, x, b, y, z, out);
    }

    // The packed forms below are the planar fourth, sixth and eighth term by term (same formulas, same sources).

    private void fourthPacked(double h, double[] om) {
        double[] a1 = pk[0], a2 = pk[1], c = pk[2];
        usePacked(0, 1.0, UNIT2[0], a1);
        usePacked(1, 1.0, UNIT2[1], a2);
        buildPacked(2);
        commutatorPacked(-SQRT3_12 * h * h, a1, a2, c);
        Skew3.lin(0.5 * h, a1, 0.5 * h, a2, 1.0, c, om);
    }

    private void sixthPacked(double h, double[] om) {
        double[] a1 = pk[0], a2 = pk[1], a3 = pk[2], c1 = pk[3], t = pk[4], c2 = pk[5], d = pk[6];
        usePacked(0, h, ALPHA1, a1);
        usePacked(1, h * SQRT15_3, ALPHA2, a2);
        usePacked(2, h * 10.0 / 3, ALPHA3, a3);
        buildPacked(3);
        commutatorPacked(1.0, a1, a2, c1);                                  // C1 = [α1, α2]
        Skew3.lin(2.0, a3, 1.0, c1, t);                                     // 2α3 + C1
        commutatorPacked(-1.0 / 60, a1, t, c2);                             // C2 = −[α1, 2α3 + C1]/60
        Skew3.lin(-20.0, a1, -1.0, a3, 1.0, c1, t);                         // −20α1 − α3 + C1
        Skew3.lin(1.0, a2, 1.0, c2, c2);                                    // α2 + C2
        commutatorPacked(1.0 / 240, t, c2, d);                              // [·,·]/240
        Skew3.lin(1.0, a1, 1.0 / 12, a3, 1.0, d, om);                       // Ω^[6]
    }

    private void eighthPacked(double h, double[] om) {
        double[] b0 = pk[0], b1 = pk[1], b2 = pk[2], b3 = pk[3], q1 = pk[4], q2 = pk[5], q3 = pk[6], q4 = pk[7];
        double[] q5 = pk[8], q6 = pk[9], x = pk[10], y = pk[11], u = pk[12];
        usePacked(0, 1.0, ROW_B0, b0);
        usePacked(1, 1.0, ROW_B1, b1);
        usePacked(2, 1.0, ROW_B2, b2);
        usePacked(3, 1.0, ROW_B3, b3);
        buildPacked(4);
        // Q1 = [−38 B0/5 + 24 B2, B3]
        commutatorPacked(1.0, -38.0 / 5, b0, 24.0, b2, b3, q1);
        // Q2 = [63 B0/5 − 84 B2, −5 B1/28 + B3]
        Skew3.lin(-5.0 / 28, b1, 1.0, b3, y);
        commutatorPacked(1.0, 63.0 / 5, b0, -84.0, b2, y, q2);
        // Q3 = [19 B0/28 − 15 B2/7, [B0, B2 + h(61 Q1/588 − Q2/12)]]
        Skew3.lin(1.0, b2, 61.0 / 588 * h, q1, -h / 12, q2, x);
        commutatorPacked(1.0, b0, x, y);
        commutatorPacked(1.0, 19.0 / 28, b0, -15.0 / 7, b2, y, q3);
        // Q4 = [B3, 20 Q1/7 + 10 Q2] = −[20 Q1/7 + 10 Q2, B3]
        commutatorPacked(-1.0, 20.0 / 7, q1, 10.0, q2, b3, q4);
        // Q5 = [−6025 B0/4116 + 2875 B2/343, [B2, Q1]]
        commutatorPacked(1.0, b2, q1, y);
        commutatorPacked(1.0, -6025.0 / 4116, b0, 2875.0 / 343, b2, y, q5);
        // Q6 = [B3, 20(Q3 + Q4)/7 + 820 h Q5/189]
        Skew3.lin(20.0 / 7, q3, 20.0 / 7, q4, 820.0 * h / 189, q5, x);
        commutatorPacked(1.0, b3, x, q6);
        // Q7 = −[B0, [B0, Q3 − Q4/3 + h Q5]]/42
        Skew3.lin(1.0, q3, -1.0 / 3, q4, h, q5, x);
        commutatorPacked(1.0, b0, x, y);
        commutatorPacked(1.0, b0, y, u);
        double h2 = h * h, h3 = h2 * h, h4 = h3 * h, h5 = h4 * h;
        double c7 = -h5 / 42;
        for (int q = 0; q < Skew3.LEN; q++) {
            om[q] = h * b0[q] + h2 * (q1[q] + q2[q]) + h3 * (q3[q] + q4[q]) + h4 * (q5[q] + q6[q]) + c7 * u[q];
        }
    }

    /** beta[j] = generator weights of Σ_k s·alpha_k A(t_k), G_0's last (as {@link #combineNodes} would pass on). */
    private void weights(int j, double s, double[] alpha) {
        if (inFrame()) {
            return;
        }
        double[] b = beta[j];
        double w0 = nodeWeights(s, alpha, b);
        if (b.length > sys.terms) {
            b[sys.terms] = w0;
        }
    }

    /** out = a·u + b·v on generator weights. */
    private static void mix(double a, double[] u, double b, double[] v, double[] out) {
        for (int k = 0; k < out.length; k++) {
            out[k] = a * u[k] + b * v[k];
        }
    }

    /**
     * Selects destination j of the next {@link #build}: Σ_k s·alpha_k A(t_k), whose generator weights are w (from
     * {@link #weights} or {@link #eighthWeights}).
     */
    private void use(int j, double s, double[] alpha, double[] w, double[] re, double[] im) {
        selW[j] = w;
        selScale[j] = s;
        selAlpha[j] = alpha;
        selR[j] = re;
        selI[j] = im;
    }

    /** Builds the matrices of the selections 0..count−1 (in one pass over the generators, or from node matrices). */
    private void build(int count) {
        if (inFrame()) {
            frame.combinations(count, selScale, selAlpha, coef, selR, selI);
            return;
        }
        sys.combineAll(count, selW, selR, selI);
    }

    /**
     * Selects destination j of the next {@link #pairCommutators}: s·[X, Y] (+ add, may be null) for X, Y given by
     * generator weights.
     */
    private void pair(int j, double s, double[] xw, double[] yw, double[] aR, double[] aI, double[] oR, double[] oI) {
        pairs.weights(j, s, xw, yw);
        addR[j] = aR;
        addI[j] = aI;
        pairR[j] = oR;
        pairI[j] = oI;
    }

    /**
     * The selected first-level commutators from the stored pairs in one pass; counted as the scheme's commutators
     * they stand for (counted of them).
     */
    private void pairCommutators(int count, int counted) {
        commutators += counted;
        pairs.combine(count, addR, addI, pairR, pairI);
    }

    /** Writes Ω to (wr, wi) from the coefficients in coef. */
    private void exponent(double h) {
        if (order == 4) {
            fourth(h);
        } else if (order == 6) {
            sixth(h);
        } else {
            eighth(h);
        }
    }

    private static final double[][] UNIT2 = {{1, 0}, {0, 1}};
    private static final double[] HALF2 = {1, 1};
    private static final double SQRT3_12 = Math.sqrt(3) / 12;

    private void fourth(double h) {
        weights(0, 1.0, UNIT2[0]);
        weights(1, 1.0, UNIT2[1]);
        double c = -SQRT3_12 * h * h;
        if (pairs != null) {
            // Ω lies in the span of generators and their pairs: no m×m product at all
            double[] a1 = beta[0], a2 = beta[1];
            mix(0.5 * h, a1, 0.5 * h, a2, x);
            use(0, 0.5 * h, HALF2, x, wr, wi);
            build(1);
            pair(0, c, a1, a2, wr, wi, wr, wi);
            pairCommutators(1, 1);
            return;
        }
        double[][] s = m6;
        double[] a1r = s[0], a1i = s[1], a2r = s[2], a2i = s[3], cr = s[4], ci = s[5];
        use(0, 1.0, UNIT2[0], beta[0], a1r, a1i);
        use(1, 1.0, UNIT2[1], beta[1], a2r, a2i);
        build(2);
        commutator(c, a1r, a1i, a2r, a2i, cr, ci);
        lin(0.5 * h, a1r, a1i, 0.5 * h, a2r, a2i, 1.0, cr, ci, wr, wi);
    }

    private static final double[] ALPHA1 = {0, 1, 0}, ALPHA2 = {-1, 0, 1}, ALPHA3 = {1, -2, 1};
    private static final double SQRT15_3 = Math.sqrt(15) / 3;

    private void sixth(double h) {
        double[][] s = m6;
        double[] a1r = s[0], a1i = s[1], a2r = s[2], a2i = s[3], a3r = s[4], a3i = s[5];
        double[] c1r = s[6], c1i = s[7], dr = s[8], di = s[9], tr = s[10], ti = s[11], c2r = s[12], c2i = s[13];
        weights(0, h, ALPHA1);
        weights(1, h * SQRT15_3, ALPHA2);
        weights(2, h * 10.0 / 3, ALPHA3);
        use(0, h, ALPHA1, beta[0], a1r, a1i);
        use(1, h * SQRT15_3, ALPHA2, beta[1], a2r, a2i);
        use(2, h * 10.0 / 3, ALPHA3, beta[2], a3r, a3i);
        build(3);
        if (pairs != null) {
            pair(0, 1.0, beta[0], beta[1], null, null, c1r, c1i);           // C1 = [α1, α2]
            pairCommutators(1, 1);
        } else {
            commutator(a1r, a1i, a2r, a2i, c1r, c1i);
        }
        lin(2.0, a3r, a3i, 1.0, c1r, c1i, tr, ti);                           // 2α3 + C1
        commutator(-1.0 / 60, a1r, a1i, tr, ti, c2r, c2i);                   // C2 = −[α1, 2α3 + C1]/60
        int len = m * m;
        for (int q = 0; q < len; q++) {
            tr[q] = -20.0 * a1r[q] - a3r[q] + c1r[q];                        // −20α1 − α3 + C1
            ti[q] = -20.0 * a1i[q] - a3i[q] + c1i[q];
            c2r[q] = a2r[q] + c2r[q];                                        // α2 + C2
            c2i[q] = a2i[q] + c2i[q];
        }
        commutator(1.0 / 240, tr, ti, c2r, c2i, dr, di);                     // [·,·]/240
        lin(1.0, a1r, a1i, 1.0 / 12, a3r, a3i, 1.0, dr, di, wr, wi);          // Ω^[6]
    }

    private static final double W1 = 0.5 - Math.sqrt(5.0 / 6) / 6, W2 = 0.5 + Math.sqrt(5.0 / 6) / 6;
    private static final double V1 = Tables.V1, V2 = Tables.V2;
    /**
     * Rows of the node weights of B0…B3 (B_i = Σ_j row_ij A(t_j)): B0 = (E0, E1, E1, E0), B1 = (−O0, −O1, O1, O0),
     * B2 = (E2, E3, E3, E2), B3 = (−O2, −O3, O3, O2), with E = w/2 · v^{2i}, O = w/2 · v^{2i+1} for the Gauss weights
     * w and node offsets v from the midpoint.
     */
    private static final double E0 = W1 / 2, E1 = W2 / 2, O0 = V1 * W1 / 2, O1 = V2 * W2 / 2;
    private static final double E2 = V1 * V1 * W1 / 2, E3 = V2 * V2 * W2 / 2;
    private static final double O2 = V1 * V1 * V1 * W1 / 2, O3 = V2 * V2 * V2 * W2 / 2;
    /** The same rows as node weights, for the node matrices of the interaction picture. */
    private static final double[] ROW_B0 = {E0, E1, E1, E0}, ROW_B1 = {-O0, -O1, O1, O0},
            ROW_B2 = {E2, E3, E3, E2}, ROW_B3 = {-O2, -O3, O3, O2};

    /**
     * The weights of B0…B3 from the node symmetry: the rows of B0 and B2 are even in the node order, those of B1 and
     * B3 odd, so each term needs two sums and two differences of node values and eight products instead of sixteen.
     * G_0's weights are the row sums: exactly zero for the odd rows.
     */
    private void eighthWeights() {
        if (inFrame()) {
            return;
        }
        double[] c0 = coef[0], c1 = coef[1], c2 = coef[2], c3 = coef[3];
        double[] b0 = beta[0], b1 = beta[1], b2 = beta[2], b3 = beta[3];
        int terms = sys.terms;
        for (int l = 0; l < terms; l++) {
            double s03 = c0[l] + c3[l], s12 = c1[l] + c2[l], d03 = c3[l] - c0[l], d12 = c2[l] - c1[l];
            b0[l] = E0 * s03 + E1 * s12;
            b1[l] = O0 * d03 + O1 * d12;
            b2[l] = E2 * s03 + E3 * s12;
            b3[l] = O2 * d03 + O3 * d12;
        }
        if (b0.length > terms) {
            b0[terms] = E0 * 2 + E1 * 2;
            b1[terms] = 0.0;
            b2[terms] = E2 * 2 + E3 * 2;
            b3[terms] = 0.0;
        }
    }

    private void eighth(double h) {
        double[][] s = m6;
        double[] b0r = s[0], b0i = s[1], b1r = s[2], b1i = s[3], b2r = s[4], b2i = s[5], b3r = s[6], b3i = s[7];
        double[] q1r = s[8], q1i = s[9], q2r = s[10], q2i = s[11], q3r = s[12], q3i = s[13], q4r = s[14], q4i = s[15];
        double[] q5r = s[16], q5i = s[17], xr = s[18], xi = s[19], yr = s[20], yi = s[21], ur = s[22], ui = s[23];
        double[] q6r = s[24], q6i = s[25];
        eighthWeights();
        if (pairs != null) {
            // B1 enters only through Q2, a first-level commutator: its matrix is never needed
            use(0, 1.0, ROW_B0, beta[0], b0r, b0i);
            use(1, 1.0, ROW_B2, beta[2], b2r, b2i);
            use(2, 1.0, ROW_B3, beta[3], b3r, b3i);
            build(3);
            double[] w0 = beta[0], w1 = beta[1], w2 = beta[2], w3 = beta[3];
            // Q1, Q2 and the [B0, B2] part of Q3's inner commutator in one pass over the pairs: the last is not one of
            // the scheme's commutators by itself, so two are counted here and one with [B0, B2 + hZ] below
            mix(-38.0 / 5, w0, 24.0, w2, x);
            pair(0, 1.0, x, w3, null, null, q1r, q1i);
            mix(63.0 / 5, w0, -84.0, w2, x);
            mix(-5.0 / 28, w1, 1.0, w3, y);
            pair(1, 1.0, x, y, null, null, q2r, q2i);
            pair(2, 1.0, w0, w2, null, null, ur, ui);
            pairCommutators(3, 2);
            // [B0, B2 + hZ] = [B0, hZ] + [B0, B2]
            lin(61.0 / 588 * h, q1r, q1i, -h / 12, q2r, q2i, xr, xi);
            commutator(b0r, b0i, xr, xi, yr, yi);
            lin(1.0, yr, yi, 1.0, ur, ui, yr, yi);
        } else {
            use(0, 1.0, ROW_B0, beta[0], b0r, b0i);
            use(1, 1.0, ROW_B1, beta[1], b1r, b1i);
            use(2, 1.0, ROW_B2, beta[2], b2r, b2i);
            use(3, 1.0, ROW_B3, beta[3], b3r, b3i);
            build(4);
            lin(-38.0 / 5, b0r, b0i, 24.0, b2r, b2i, xr, xi);
            commutator(xr, xi, b3r, b3i, q1r, q1i);
            lin(63.0 / 5, b0r, b0i, -84.0, b2r, b2i, xr, xi);
            lin(-5.0 / 28, b1r, b1i, 1.0, b3r, b3i, yr, yi);
            commutator(xr, xi, yr, yi, q2r, q2i);
            // Q3 = [19 B0/28 − 15 B2/7, [B0, B2 + h(61 Q1/588 − Q2/12)]]
            lin(1.0, b2r, b2i, 61.0 / 588 * h, q1r, q1i, -h / 12, q2r, q2i, xr, xi);
            commutator(b0r, b0i, xr, xi, yr, yi);
        }
        lin(19.0 / 28, b0r, b0i, -15.0 / 7, b2r, b2i, xr, xi);
        commutator(xr, xi, yr, yi, q3r, q3i);
        // Q4 = [B3, 20 Q1/7 + 10 Q2]
        lin(20.0 / 7, q1r, q1i, 10.0, q2r, q2i, xr, xi);
        commutator(b3r, b3i, xr, xi, q4r, q4i);
        // Q5 = [−6025 B0/4116 + 2875 B2/343, [B2, Q1]]
        commutator(b2r, b2i, q1r, q1i, yr, yi);
        lin(-6025.0 / 4116, b0r, b0i, 2875.0 / 343, b2r, b2i, xr, xi);
        commutator(xr, xi, yr, yi, q5r, q5i);
        // Q6 = [B3, 20(Q3 + Q4)/7 + 820 h Q5/189]
        lin(20.0 / 7, q3r, q3i, 20.0 / 7, q4r, q4i, 820.0 * h / 189, q5r, q5i, xr, xi);
        commutator(b3r, b3i, xr, xi, q6r, q6i);
        // Q7 = −[B0, [B0, Q3 − Q4/3 + h Q5]]/42
        lin(1.0, q3r, q3i, -1.0 / 3, q4r, q4i, h, q5r, q5i, xr, xi);
        commutator(b0r, b0i, xr, xi, yr, yi);
        commutator(b0r, b0i, yr, yi, ur, ui);
        // Ω = h B0 + h²(Q1 + Q2) + h³(Q3 + Q4) + h⁴(Q5 + Q6) − h⁵ Q7'/42
        double h2 = h * h, h3 = h2 * h, h4 = h3 * h, h5 = h4 * h;
        double c7 = -h5 / 42;
        int len = m * m;
        for (int q = 0; q < len; q++) {
            wr[q] = h * b0r[q] + h2 * (q1r[q] + q2r[q]) + h3 * (q3r[q] + q4r[q]) + h4 * (q5r[q] + q6r[q]) + c7 * ur[q];
            wi[q] = h * b0i[q] + h2 * (q1i[q] + q2i[q]) + h3 * (q3i[q] + q4i[q]) + h4 * (q5i[q] + q6i[q]) + c7 * ui[q];
        }
    }
}
