package org.liepath.integrators.internal;

import org.liepath.core.internal.Dense;

/**
 * Exact stepping for a generator that is constant on the step: X ← exp(h A(t + h/2)) X. Exact (to the rounding of
 * the exponential) whenever no breakpoint lies inside the step; the caller guarantees that.
 *
 * <p>For a Hamiltonian the exponential is unitary to rounding for any step (eigen route). For a GKLS generator
 * (Padé) long steps are cut into k equal pieces with ‖(h/k)A‖₁ ≤ {@value #MAX_NORM} and the one exponential applied k
 * times: each squaring in scaling and squaring roughly doubles the departure from unitarity, so capping the scaling
 * at four squarings (θ_13 · 2⁴ ≈ 86, N.J. Higham, SIAM J. Matrix Anal. Appl. 26 (2005) 1179–1193) keeps long
 * constant segments unitary to rounding.
 *
 * <p>Mutable and not thread-safe, like every {@link Kernel}: one instance per run or per stepper.
 */
public final class PiecewiseKernel extends Kernel {
    static final double MAX_NORM = 86.0;

    public PiecewiseKernel(LinearSystem sys) {
        super(sys, 1);
        if (sys.isInteractionPicture()) {
            // P exp(hA_1) P is not exp(h(A_0 + A_1)): exact stepping needs the whole generator
            throw new IllegalArgumentException("sys: a system in the Schrödinger picture for exact stepping");
        }
    }

    @Override
    public int order() {
        return Integer.MAX_VALUE;
    }

    @Override
    public void step(double t, double h, int p, double[] xr, double[] xi) {
        evaluate(t, h, Tables.MIDPOINT);
        combineNodes(h, Tables.MIDPOINT_TABLE[0], wr, wi);
        double norm = Dense.norm1(m, wr, wi);
        long pieces = !unitaryExponentials() && Double.isFinite(norm) && norm > MAX_NORM ? (long) Math.ceil(norm / MAX_NORM) : 1;
        if (pieces == 1) {
            expApply(wr, wi, p, xr, xi);
            return;
        }
        // the same factor is applied many times, so its rounding would add coherently: increment form
        increment(1.0 / pieces, wr, wi, er, ei);
        for (long k = 0; k < pieces; k++) {
            addLeft(p, er, ei, xr, xi);
        }
    }

    @Override
    public double trial(double t, double h, int p, double[] xr, double[] xi, double[] yr, double[] yi) {
        int len = m * p;
        System.arraycopy(xr, 0, yr, 0, len);
        System.arraycopy(xi, 0, yi, 0, len);
        step(t, h, p, yr, yi);
        return 0.0;
    }
}
