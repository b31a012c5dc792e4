package org.liepath.integrators;

import org.liepath.core.Operator;
import org.liepath.core.StateVector;

import java.util.Random;

/**
 * Closed-form reference objects and independent matrix arithmetic for the integrator tests. Everything here is
 * computed from textbook formulas on plain arrays, so that a test does not check the library against itself.
 */
final class Exact {
    private Exact() {
    }

    /**
     * exp(−i t (a0 I + ax σx + ay σy + az σz)) in closed form: e^{−i a0 t} [cos(|a| t) I − i sin(|a| t) (â·σ)]
     * (Euler's formula for Pauli vectors; e.g. J. J. Sakurai, Modern Quantum Mechanics, eq. (3.2.44)).
     */
    static Operator su2Exp(double a0, double ax, double ay, double az, double t) {
        double r = Math.sqrt(ax * ax + ay * ay + az * az);
        double c = Math.cos(r * t);
        double s = r == 0 ? 0 : Math.sin(r * t) / r;          // sin(|a|t)/|a|, times a gives sin·â
        // cos I − i s (a·σ);  a·σ = [[az, ax − i ay], [ax + i ay, −az]]
        double[] re = {c, -s * ay, s * ay, c};
        double[] im = {-s * az, -s * ax, -s * ax, s * az};
        Operator m = Operator.ofPlanar(2, re, im);
        return m.scale(new org.apache.commons.math3.complex.Complex(Math.cos(a0 * t), -Math.sin(a0 * t)));
    }

    /**
     * A random unitary as a product of complex Givens rotations and diagonal phases: exactly unitary to rounding and
     * built without any matrix function (common practice for test matrices).
     */
    static Operator randomUnitary(Random r, int n) {
        Operator u = Operator.identity(n);
        for (int sweep = 0; sweep < 3; sweep++) {
            for (int p = 0; p < n; p++) {
                for (int q = p + 1; q < n; q++) {
                    double th = 2 * Math.PI * r.nextDouble(), ph = 2 * Math.PI * r.nextDouble();
                    double[] re = new double[n * n], im = new double[n * n];
                    for (int k = 0; k < n; k++) {
                        re[k * n + k] = 1;
                    }
                    double c = Math.cos(th), s = Math.sin(th);
                    re[p * n + p] = c;
                    re[q * n + q] = c;
                    re[p * n + q] = -s * Math.cos(ph);
                    im[p * n + q] = -s * Math.sin(ph);
                    re[q * n + p] = s * Math.cos(ph);
                    im[q * n + p] = -s * Math.sin(ph);
                    u = Operator.ofPlanar(n, re, im).times(u);
                }
            }
        }
        return u;
    }

    /** V diag(e^{−i d_k t}) V† — the exact exponential of the constant Hamiltonian V diag(d) V†. */
    static Operator spectralExp(Operator v, double[] d, double t) {
        int n = d.length;
        double[] re = new double[n * n], im = new double[n * n];
        for (int k = 0; k < n; k++) {
            re[k * n + k] = Math.cos(d[k] * t);
            im[k * n + k] = -Math.sin(d[k] * t);
        }
        return v.times(Operator.ofPlanar(n, re, im)).times(v.dagger());
    }

    /** max_{ij} |a_ij − b_ij| computed on the raw entries. */
    static double maxDiff(Operator a, Operator b) {
        double[] ar = a.reArray(), ai = a.imArray(), br = b.reArray(), bi = b.imArray();
        double m = 0;
        for (int k = 0; k < ar.length; k++) {
            m = Math.max(m, Math.hypot(ar[k] - br[k], ai[k] - bi[k]));
        }
        return m;
    }

    /** max_i |a_i − b_i| of two state vectors. */
    static double maxDiff(StateVector a, StateVector b) {
        double m = 0;
        for (int k = 0; k < a.dim(); k++) {
            m = Math.max(m, Math.hypot(a.re(k) - b.re(k), a.im(k) - b.im(k)));
        }
        return m;
    }

    /** Frobenius norm of U†U − I, computed entry by entry on plain arrays. */
    static double unitarityDefect(Operator u) {
        int n = u.dim();
        double[] re = u.reArray(), im = u.imArray();
        double s = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double pr = 0, pi = 0;                     // (U†U)_ij = Σ_k conj(U_ki) U_kj
                for (int k = 0; k < n; k++) {
                    double ar = re[k * n + i], ai = -im[k * n + i], br = re[k * n + j], bi = im[k * n + j];
                    pr += ar * br - ai * bi;
                    pi += ar * bi + ai * br;
                }
                if (i == j) {
                    pr -= 1;
                }
                s += pr * pr + pi * pi;
            }
        }
        return Math.sqrt(s);
    }

    /** Operator from row-major complex entries given as {re, im} pairs. */
    static Operator fromPairs(int n, double[][] entries) {
        double[] re = new double[n * n], im = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            re[k] = entries[k][0];
            im[k] = entries[k][1];
        }
        return Operator.ofPlanar(n, re, im);
    }

    /** True when both operators have bit-identical entries. */
    static boolean sameBits(Operator a, Operator b) {
        return java.util.Arrays.equals(a.reArray(), b.reArray()) && java.util.Arrays.equals(a.imArray(), b.imArray());
    }
}
