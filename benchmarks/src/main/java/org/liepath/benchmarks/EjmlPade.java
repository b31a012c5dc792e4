package org.liepath.benchmarks;

import org.ejml.data.ZMatrixRMaj;
import org.ejml.dense.row.CommonOps_ZDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_ZDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * The comparator for our exponential: the same scaling-and-squaring Padé algorithm (N.J. Higham, SIAM J. Matrix
 * Anal. Appl. 26 (2005) 1179–1193: degrees 3, 5, 7, 9, 13, the same θ_m and coefficients), written with EJML 0.46.1
 * operations only (interleaved ZMatrixRMaj, CommonOps_ZDRM.mult, an LU solver from LinearSolverFactory_ZDRM).
 * EJML has no exponential of its own. Workspace, not thread-safe.
 */
final class EjmlPade {
    private static final double[] THETA = {1.495585217958292e-2, 2.539398330063230e-1, 9.504178996162932e-1,
        2.097847961257068e0, 5.371920351148152e0};
    private static final double[][] B = {
        {120, 60, 12, 1},
        {30240, 15120, 3360, 420, 30, 1},
        {17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1},
        {17643225600.0, 8821612800.0, 2075673600, 302702400, 30270240, 2162160, 110880, 3960, 90, 1}};
    private static final double[] B13 = {64764752532480000.0, 32382376266240000.0, 7771770303897600.0,
        1187353796428800.0, 129060195264000.0, 10559470521600.0, 670442572800.0, 33522128640.0, 1323241920.0,
        40840800.0, 960960.0, 16380.0, 182.0, 1.0};

    private final int n;
    private final ZMatrixRMaj a, a2, a4, a6, a8, u, v, t, s, p, q, x;
    private final LinearSolverDense<ZMatrixRMaj> lu;

    EjmlPade(int n) {
        this.n = n;
        a = new ZMatrixRMaj(n, n);
        a2 = new ZMatrixRMaj(n, n);
        a4 = new ZMatrixRMaj(n, n);
        a6 = new ZMatrixRMaj(n, n);
        a8 = new ZMatrixRMaj(n, n);
        u = new ZMatrixRMaj(n, n);
        v = new ZMatrixRMaj(n, n);
        t = new ZMatrixRMaj(n, n);
        s = new ZMatrixRMaj(n, n);
        p = new ZMatrixRMaj(n, n);
        q = new ZMatrixRMaj(n, n);
        x = new ZMatrixRMaj(n, n);
        lu = LinearSolverFactory_ZDRM.lu(n);
    }

    /** out = exp(in). */
    void compute(ZMatrixRMaj in, ZMatrixRMaj out) {
        a.setTo(in);
        double norm = norm1(a);
        CommonOps_ZDRM.mult(a, a, a2);
        for (int d = 0; d < 4; d++) {
            if (norm <= THETA[d]) {
                if (d >= 1) {
                    CommonOps_ZDRM.mult(a2, a2, a4);
                }
                if (d >= 2) {
                    CommonOps_ZDRM.mult(a4, a2, a6);
                }
                if (d >= 3) {
                    CommonOps_ZDRM.mult(a4, a4, a8);
                }
                low(B[d], d + 1, out);
                return;
            }
        }
        int sq = 0;
        double ratio = norm / THETA[4];
        if (ratio > 1) {
            sq = Math.getExponent(ratio);
            if (ratio > Math.scalb(1.0, sq)) {
                sq++;
            }
        }
        CommonOps_ZDRM.scale(Math.scalb(1.0, -sq), 0, a);
        CommonOps_ZDRM.mult(a, a, a2);
        CommonOps_ZDRM.mult(a2, a2, a4);
        CommonOps_ZDRM.mult(a4, a2, a6);
        double[] b = B13;
        comb(t, b[13], a6, b[11], a4, b[9], a2, 0);
        CommonOps_ZDRM.mult(a6, t, s);
        addComb(s, b[7], a6, b[5], a4, b[3], a2, b[1]);
        CommonOps_ZDRM.mult(a, s, u);
        comb(t, b[12], a6, b[10], a4, b[8], a2, 0);
        CommonOps_ZDRM.mult(a6, t, v);
        addComb(v, b[6], a6, b[4], a4, b[2], a2, b[0]);
        solve(out);
        for (int k = 0; k < sq; k++) {
            x.setTo(out);
            CommonOps_ZDRM.mult(x, x, out);
        }
    }

    private void low(double[] b, int q4, ZMatrixRMaj out) {
        // s = Σ_{odd k} b_k A^{k−1}, v = Σ_{even k} b_k A^k
        CommonOps_ZDRM.fill(s, 0, 0);
        CommonOps_ZDRM.fill(v, 0, 0);
        ZMatrixRMaj[] pw = {a2, a4, a6, a8};
        for (int i = 0; i < n; i++) {
            s.data[2 * (i * n + i)] = b[1];
            v.data[2 * (i * n + i)] = b[0];
        }
        for (int k = 1; k <= q4; k++) {
            double[] pd = pw[k - 1].data, sd = s.data, vd = v.data;
            for (int e = 0; e < 2 * n * n; e++) {
                sd[e] += b[2 * k + 1] * pd[e];
                vd[e] += b[2 * k] * pd[e];
            }
        }
        CommonOps_ZDRM.mult(a, s, u);
        solve(out);
    }

    private void solve(ZMatrixRMaj out) {
        CommonOps_ZDRM.subtract(v, u, p);
        CommonOps_ZDRM.add(v, u, q);
        if (!lu.setA(p)) {
            CommonOps_ZDRM.fill(out, Double.NaN, Double.NaN);
            return;
        }
        lu.solve(q, out);
    }

    private void comb(ZMatrixRMaj dst, double c6, ZMatrixRMaj m6, double c4, ZMatrixRMaj m4, double c2, ZMatrixRMaj m2,
                      double c0) {
        CommonOps_ZDRM.fill(dst, 0, 0);
        addComb(dst, c6, m6, c4, m4, c2, m2, c0);
    }

    private void addComb(ZMatrixRMaj dst, double c6, ZMatrixRMaj m6, double c4, ZMatrixRMaj m4, double c2,
                         ZMatrixRMaj m2, double c0) {
        double[] d = dst.data, x6 = m6.data, x4 = m4.data, x2 = m2.data;
        for (int e = 0; e < 2 * n * n; e++) {
            d[e] += c6 * x6[e] + c4 * x4[e] + c2 * x2[e];
        }
        for (int i = 0; i < n; i++) {
            d[2 * (i * n + i)] += c0;
        }
    }

    private double norm1(ZMatrixRMaj m) {
        double best = 0;
        for (int j = 0; j < n; j++) {
            double sum = 0;
            for (int i = 0; i < n; i++) {
                sum += Math.hypot(m.data[2 * (i * n + j)], m.data[2 * (i * n + j) + 1]);
            }
            best = Math.max(best, sum);
        }
        return best;
    }
}
