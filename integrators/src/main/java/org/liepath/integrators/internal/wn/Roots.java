package org.liepath.integrators.internal.wn;

/**
 * All roots of a complex polynomial by the Weierstrass (Durand–Kerner) simultaneous iteration followed by Newton
 * polishing (common practice; E. Durand 1960, I. Kerner, Numer. Math. 8 (1966) 290). Used for minimal polynomials of
 * small adjoint matrices (degree ≤ m). Not part of the public API.
 */
final class Roots {
    private Roots() {
    }

    /**
     * @param pr real parts of the coefficients p_0..p_d (p_d ≠ 0)
     * @param pi imaginary parts
     * @return {re[], im[]} of the d roots, or null if the iteration did not converge
     */
    static double[][] of(double[] pr, double[] pi) {
        int d = pr.length - 1;
        double lr = pr[d], li = pi[d], den = lr * lr + li * li;
        double[] cr = new double[d + 1], ci = new double[d + 1];
        for (int k = 0; k <= d; k++) {
            cr[k] = (pr[k] * lr + pi[k] * li) / den;
            ci[k] = (pi[k] * lr - pr[k] * li) / den;
        }
        double bound = 0;
        for (int k = 0; k < d; k++) {
            bound = Math.max(bound, Math.hypot(cr[k], ci[k]));
        }
        bound = 1 + bound;
        double[] zr = new double[d], zi = new double[d];
        for (int k = 0; k < d; k++) {
            double ang = 2 * Math.PI * k / d + 0.4;
            zr[k] = 0.5 * bound * Math.cos(ang);
            zi[k] = 0.5 * bound * Math.sin(ang);
        }
        boolean converged = false;
        for (int it = 0; it < 2000 && !converged; it++) {
            double move = 0;
            for (int k = 0; k < d; k++) {
                double[] v = horner(cr, ci, zr[k], zi[k]);
                double qr = 1, qi = 0;
                for (int j = 0; j < d; j++) {
                    if (j != k) {
                        double ur = zr[k] - zr[j], ui = zi[k] - zi[j];
                        double t = qr * ur - qi * ui;
                        qi = qr * ui + qi * ur;
                        qr = t;
                    }
                }
                double qd = qr * qr + qi * qi;
                if (qd == 0) {
                    zr[k] += 1e-8 * bound;
                    continue;
                }
                double sr = (v[0] * qr + v[1] * qi) / qd, si = (v[1] * qr - v[0] * qi) / qd;
                zr[k] -= sr;
                zi[k] -= si;
                move = Math.max(move, Math.hypot(sr, si));
            }
            converged = move <= 1e-15 * bound;
        }
        // Newton polish on the original polynomial
        for (int k = 0; k < d; k++) {
            for (int it = 0; it < 5; it++) {
                double[] v = horner(cr, ci, zr[k], zi[k]);
                double[] dv = hornerDeriv(cr, ci, zr[k], zi[k]);
                double dd = dv[0] * dv[0] + dv[1] * dv[1];
                if (dd == 0) {
                    break;
                }
                zr[k] -= (v[0] * dv[0] + v[1] * dv[1]) / dd;
                zi[k] -= (v[1] * dv[0] - v[0] * dv[1]) / dd;
            }
            if (!Double.isFinite(zr[k]) || !Double.isFinite(zi[k])) {
                return null;
            }
        }
        return new double[][]{zr, zi};
    }

    private static double[] horner(double[] cr, double[] ci, double xr, double xi) {
        int d = cr.length - 1;
        double sr = cr[d], si = ci[d];
        for (int k = d - 1; k >= 0; k--) {
            double t = sr * xr - si * xi + cr[k];
            si = sr * xi + si * xr + ci[k];
            sr = t;
        }
        return new double[]{sr, si};
    }

    private static double[] hornerDeriv(double[] cr, double[] ci, double xr, double xi) {
        int d = cr.length - 1;
        double sr = d * cr[d], si = d * ci[d];
        for (int k = d - 1; k >= 1; k--) {
            double t = sr * xr - si * xi + k * cr[k];
            si = sr * xi + si * xr + k * ci[k];
            sr = t;
        }
        return new double[]{sr, si};
    }
}
