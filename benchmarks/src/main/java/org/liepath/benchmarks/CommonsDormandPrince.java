package org.liepath.benchmarks;

import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;

import java.util.List;

/**
 * The comparator of the work–precision benchmarks: dU/dt = −i H(t) U written by hand as a real ODE of 2n² components
 * and integrated by Apache Commons Math's adaptive Dormand–Prince 8(5,3) ({@code DormandPrince853Integrator}), the
 * way a user without Liepath would do it. The right-hand side evaluates the drives once per stage and accumulates
 * −i Σ_k c_k(t) A_k U term by term (cost per evaluation ≈ 8 n³ flops per term).
 *
 * <p>Not thread-safe (one instance per thread).
 */
final class CommonsDormandPrince {
    private final Hamiltonian h;
    private final int n;
    private final double[][] re, im;
    private final double[] c;
    private long evaluations;

    CommonsDormandPrince(Hamiltonian h) {
        this.h = h;
        this.n = h.dim();
        List<Operator> ops = h.operators();
        re = new double[ops.size()][];
        im = new double[ops.size()][];
        for (int k = 0; k < ops.size(); k++) {
            re[k] = ops.get(k).reArray();
            im[k] = ops.get(k).imArray();
        }
        c = new double[ops.size()];
    }

    /** Right-hand side evaluations of the last {@link #propagate} call. */
    long evaluations() {
        return evaluations;
    }

    /** U(t1, t0) with relative and absolute tolerance tol. */
    Operator propagate(double t0, double t1, double tol) {
        int nn = n * n;
        double[] y = new double[2 * nn];
        for (int i = 0; i < n; i++) {
            y[i * n + i] = 1;
        }
        evaluations = 0;
        FirstOrderDifferentialEquations ode = new FirstOrderDifferentialEquations() {
            @Override
            public int getDimension() {
                return 2 * nn;
            }

            @Override
            public void computeDerivatives(double t, double[] u, double[] du) {
                evaluations++;
                h.coefficients(t, c);
                java.util.Arrays.fill(du, 0);
                for (int k = 0; k < c.length; k++) {
                    double ck = c[k];
                    if (ck == 0) {
                        continue;
                    }
                    double[] ar = re[k], ai = im[k];
                    // du = −i ck A u:  re(du) += ck (Ar ui + Ai ur),  im(du) += −ck (Ar ur − Ai ui)
                    for (int i = 0; i < n; i++) {
                        for (int l = 0; l < n; l++) {
                            double a = ck * ar[i * n + l], b = ck * ai[i * n + l];
                            if (a == 0 && b == 0) {
                                continue;
                            }
                            for (int j = 0; j < n; j++) {
                                double ur = u[l * n + j], ui = u[nn + l * n + j];
                                du[i * n + j] += a * ui + b * ur;
                                du[nn + i * n + j] -= a * ur - b * ui;
                            }
                        }
                    }
                }
            }
        };
        double span = Math.abs(t1 - t0);
        DormandPrince853Integrator dp = new DormandPrince853Integrator(span * 1e-12, span, tol, tol);
        dp.setMaxEvaluations(Integer.MAX_VALUE);
        dp.integrate(ode, t0, y, t1, y);
        double[] r = new double[nn], i = new double[nn];
        System.arraycopy(y, 0, r, 0, nn);
        System.arraycopy(y, nn, i, 0, nn);
        return Operator.ofPlanar(n, r, i);
    }
}
