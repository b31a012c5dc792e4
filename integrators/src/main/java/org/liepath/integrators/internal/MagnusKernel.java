package org.liepath.integrators.internal;

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
 * <p>Mutable and not thread-safe, like every {@link Kernel}: one instance per run or per stepper.
 */
public final class MagnusKernel extends Kernel {
    private final int order;
    private final double[] nodes;
    private final double[][] m6;  // scratch matrices (re, im pairs)

    public MagnusKernel(LinearSystem sys, int order) {
        super(sys, order / 2);
        if (order != 4 && order != 6 && order != 8) {
            throw new IllegalArgumentException("order " + order);
        }
        this.order = order;
        this.nodes = order == 4 ? Tables.GAUSS2 : order == 6 ? Tables.GAUSS3 : Tables.GAUSS4;
        int count = order == 4 ? 6 : order == 6 ? 14 : 26;
        m6 = new double[count][m * m];
    }

    @Override
    public int order() {
        return order;
    }

    @Override
    public void step(double t, double h, int p, double[] xr, double[] xi) {
        evaluate(t, h, nodes);
        exponent(h);
        expApply(wr, wi, p, xr, xi);
    }

    /** Writes Ω to (wr, wi) from the coefficients in coef. */
    private void exponent(double h) {
        double[][] s = m6;
        if (order == 4) {
            double[] a1r = s[0], a1i = s[1], a2r = s[2], a2i = s[3], cr = s[4], ci = s[5];
            combineNodes(1.0, new1(0), a1r, a1i);
            combineNodes(1.0, new1(1), a2r, a2i);
            commutator(a1r, a1i, a2r, a2i, cr, ci);
            lin(0.5 * h, a1r, a1i, 0.5 * h, a2r, a2i, wr, wi);
            lin(1.0, wr, wi, -Math.sqrt(3) / 12 * h * h, cr, ci, wr, wi);
        } else if (order == 6) {
            sixth(h);
        } else {
            eighth(h);
        }
    }

    private static final double[][] UNIT2 = {{1, 0}, {0, 1}};

    private static double[] new1(int k) {
        return UNIT2[k];
    }

    private static final double[] ALPHA1 = {0, 1, 0}, ALPHA2 = {-1, 0, 1}, ALPHA3 = {1, -2, 1};
    private static final double SQRT15_3 = Math.sqrt(15) / 3;

    private void sixth(double h) {
        double[][] s = m6;
        double[] a1r = s[0], a1i = s[1], a2r = s[2], a2i = s[3], a3r = s[4], a3i = s[5];
        double[] c1r = s[6], c1i = s[7], dr = s[8], di = s[9], tr = s[10], ti = s[11], c2r = s[12], c2i = s[13];
        combineNodes(h, ALPHA1, a1r, a1i);
        combineNodes(h * SQRT15_3, ALPHA2, a2r, a2i);
        combineNodes(h * 10.0 / 3, ALPHA3, a3r, a3i);
        commutator(a1r, a1i, a2r, a2i, c1r, c1i);                 // C1 = [α1, α2]
        lin(2.0, a3r, a3i, 1.0, c1r, c1i, tr, ti);                // 2α3 + C1
        commutator(a1r, a1i, tr, ti, c2r, c2i);
        lin(-1.0 / 60, c2r, c2i, 0.0, c2r, c2i, c2r, c2i);        // C2 = −[α1, 2α3 + C1]/60
        lin(-20.0, a1r, a1i, -1.0, a3r, a3i, tr, ti);
        lin(1.0, tr, ti, 1.0, c1r, c1i, tr, ti);                  // −20α1 − α3 + C1
        lin(1.0, a2r, a2i, 1.0, c2r, c2i, c2r, c2i);              // α2 + C2
        commutator(tr, ti, c2r, c2i, dr, di);
        lin(1.0 / 240, dr, di, 0.0, dr, di, dr, di);              // [·,·]/240
        lin(1.0, a1r, a1i, 1.0 / 12, a3r, a3i, wr, wi);
        lin(1.0, wr, wi, 1.0, dr, di, wr, wi);                    // Ω^[6]
    }

    private static final double W1 = 0.5 - Math.sqrt(5.0 / 6) / 6, W2 = 0.5 + Math.sqrt(5.0 / 6) / 6;
    private static final double V1 = Tables.V1, V2 = Tables.V2;
    private static final double[] B0 = {W1 / 2, W2 / 2, W2 / 2, W1 / 2};
    private static final double[] B1 = {-V1 * W1 / 2, -V2 * W2 / 2, V2 * W2 / 2, V1 * W1 / 2};
    private static final double[] B2 = {V1 * V1 * W1 / 2, V2 * V2 * W2 / 2, V2 * V2 * W2 / 2, V1 * V1 * W1 / 2};
    private static final double[] B3 = {-V1 * V1 * V1 * W1 / 2, -V2 * V2 * V2 * W2 / 2, V2 * V2 * V2 * W2 / 2,
        V1 * V1 * V1 * W1 / 2};

    private void eighth(double h) {
        double[][] s = m6;
        double[] b0r = s[0], b0i = s[1], b1r = s[2], b1i = s[3], b2r = s[4], b2i = s[5], b3r = s[6], b3i = s[7];
        double[] q1r = s[8], q1i = s[9], q2r = s[10], q2i = s[11], q3r = s[12], q3i = s[13], q4r = s[14], q4i = s[15];
        double[] q5r = s[16], q5i = s[17], xr = s[18], xi = s[19], yr = s[20], yi = s[21], ur = s[22], ui = s[23];
        double[] q6r = s[24], q6i = s[25];
        combineNodes(1.0, B0, b0r, b0i);
        combineNodes(1.0, B1, b1r, b1i);
        combineNodes(1.0, B2, b2r, b2i);
        combineNodes(1.0, B3, b3r, b3i);
        lin(-38.0 / 5, b0r, b0i, 24.0, b2r, b2i, xr, xi);
        commutator(xr, xi, b3r, b3i, q1r, q1i);
        lin(63.0 / 5, b0r, b0i, -84.0, b2r, b2i, xr, xi);
        lin(-5.0 / 28, b1r, b1i, 1.0, b3r, b3i, yr, yi);
        commutator(xr, xi, yr, yi, q2r, q2i);
        // Q3 = [19 B0/28 − 15 B2/7, [B0, B2 + h(61 Q1/588 − Q2/12)]]
        lin(61.0 / 588 * h, q1r, q1i, -h / 12, q2r, q2i, xr, xi);
        lin(1.0, b2r, b2i, 1.0, xr, xi, xr, xi);
        commutator(b0r, b0i, xr, xi, yr, yi);
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
        lin(20.0 / 7, q3r, q3i, 20.0 / 7, q4r, q4i, xr, xi);
        lin(1.0, xr, xi, 820.0 * h / 189, q5r, q5i, xr, xi);
        commutator(b3r, b3i, xr, xi, q6r, q6i);
        // Q7 = −[B0, [B0, Q3 − Q4/3 + h Q5]]/42
        lin(1.0, q3r, q3i, -1.0 / 3, q4r, q4i, xr, xi);
        lin(1.0, xr, xi, h, q5r, q5i, xr, xi);
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
