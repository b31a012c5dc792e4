package org.liepath.validation;

import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;

/**
 * Test-only reference propagator, independent of Liepath's integrators: dU/dt = −iH(t)U as a real ODE of 2n²
 * unknowns, integrated by Commons Math's Dormand–Prince 8(5,3) (E. Hairer, S.P. Nørsett, G. Wanner, Solving
 * Ordinary Differential Equations I, 2nd ed., Springer 1993, §II.10) at tolerance 1e-14 per component. Integrates
 * piece by piece between the drives' breakpoints.
 */
final class OdeReference {
    private OdeReference() {
    }

    static Operator propagator(Hamiltonian h, double t0, double t1) {
        int n = h.dim();
        double[] y = new double[2 * n * n];
        for (int i = 0; i < n; i++) {
            y[i * n + i] = 1;
        }
        FirstOrderDifferentialEquations ode = new FirstOrderDifferentialEquations() {
            @Override
            public int getDimension() {
                return 2 * n * n;
            }

            @Override
            public void computeDerivatives(double t, double[] u, double[] du) {
                Operator ht = h.at(t);
                // d(Ur + iUi)/dt = −i(Hr + iHi)(Ur + iUi) = (Hi Ur + Hr Ui) + i(Hi Ui − Hr Ur)
                for (int i = 0; i < n; i++) {
                    for (int j = 0; j < n; j++) {
                        double re = 0, im = 0;
                        for (int k = 0; k < n; k++) {
                            double hr = ht.re(i, k), hi = ht.im(i, k);
                            double ur = u[k * n + j], ui = u[n * n + k * n + j];
                            re += hi * ur + hr * ui;
                            im += hi * ui - hr * ur;
                        }
                        du[i * n + j] = re;
                        du[n * n + i * n + j] = im;
                    }
                }
            }
        };
        DormandPrince853Integrator dp = new DormandPrince853Integrator(1e-12, Math.abs(t1 - t0), 1e-14, 1e-14);
        double[] cuts = h.breakpoints();
        double t = t0;
        for (double b : cuts) {
            if (b > Math.min(t0, t1) && b < Math.max(t0, t1)) {
                dp.integrate(ode, t, y, b, y);
                t = b;
            }
        }
        dp.integrate(ode, t, y, t1, y);
        double[] re = new double[n * n], im = new double[n * n];
        System.arraycopy(y, 0, re, 0, n * n);
        System.arraycopy(y, n * n, im, 0, n * n);
        return Operator.ofPlanar(n, re, im);
    }

    /** log(U) by the Mercator series of log(I + X), X = U − I; valid for ‖X‖₂ well below 1 (here ≤ 0.3). */
    static Operator logNearIdentity(Operator u) {
        int n = u.dim();
        Operator x = u.minus(Operator.identity(n));
        Operator pow = x, sum = Operator.zero(n);
        for (int k = 1; k <= 80; k++) {
            sum = sum.plus(pow.scale((k % 2 == 1 ? 1.0 : -1.0) / k));
            pow = pow.times(x);
        }
        return sum;
    }
}
