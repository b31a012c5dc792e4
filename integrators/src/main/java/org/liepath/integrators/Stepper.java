package org.liepath.integrators;

import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.integrators.internal.Kernel;

/**
 * A mutable, non-thread-safe single-step engine for control loops: {@link #advance} updates a caller-owned array in
 * place and allocates nothing after the first call.
 *
 * <p><b>Layout</b> of the array {@code u} (in/out): planar, real parts first, then imaginary parts, each row-major.
 * For a propagator (m×m) the length is 2m²: {@code u[i*m + j]} is Re X_ij and {@code u[m*m + i*m + j]} is
 * Im X_ij. For a vector the length is 2m: {@code u[i]} = Re x_i, {@code u[m + i]} = Im x_i. Here m is the
 * Hilbert-space dimension n for a Hamiltonian and n² for a GKLS generator (then the vector is vec(ρ), column
 * stacking: ρ_ij at index i + n j).
 *
 * <p>{@code advance(t, dt, u)} is exactly one step of the fluent tier's fixed-step grid: a run with
 * {@code Evolve...steps(n)} performs {@code advance(t0 + k·dt, dt, u)} for k = 0 … n−1 with dt = (t1 − t0)/n on the
 * same kernel, so the results agree bit for bit. A step that contains a drive breakpoint is split there (as in the
 * fluent tier).
 *
 * <p>A scheme {@link Scheme#inInteractionPicture() in the interaction picture} steps the state of the frame that
 * rotates with the static part. The stepper keeps that state between calls and hands out the laboratory state:
 * when the array passed in is, bit for bit, the one the previous call returned, it goes on from its own copy, so
 * repeated calls enter the frame once (the frame's phases and basis change are never applied step after step,
 * where their rounding would add up coherently) and agree bit for bit with the fluent tier; any other array,
 * including one the caller changed, enters the frame afresh at its t. Leaving the frame costs m sines and
 * cosines and O(m²) per call, plus one m×m product (m×1 for a vector) when the static part is not diagonal.
 *
 * <p>Create one stepper per thread with {@link Scheme#stepper}.
 */
public final class Stepper {
    private final Scheme scheme;
    private final Kernel kernel;
    private final int m;
    private final double[] xr, xi;
    private final boolean liouville;
    /** The last state handed out (real and imaginary planes) when the kernel changes basis, else null; valid if
     * lastP &gt; 0. */
    private final double[] lastR, lastI;
    private int lastP;

    Stepper(Scheme scheme, Kernel kernel, int m, boolean liouville) {
        this.scheme = scheme;
        this.kernel = kernel;
        this.m = m;
        this.xr = new double[m * m];
        this.xi = new double[m * m];
        this.liouville = liouville;
        this.lastR = kernel.inFrame() ? new double[m * m] : null;
        this.lastI = kernel.inFrame() ? new double[m * m] : null;
    }

    /** @return the scheme this stepper runs */
    public Scheme scheme() {
        return scheme;
    }

    /** @return m, the row count of the state (n for a Hamiltonian, n² in Liouville space) */
    public int dim() {
        return m;
    }

    /** @return whether the state lives in Liouville space (a GKLS generator) */
    public boolean isLiouville() {
        return liouville;
    }

    /**
     * Advances u from t to t + dt in place (dt &lt; 0 steps backward).
     *
     * @param t  the start time (finite)
     * @param dt the step (finite, non-zero)
     * @param u  in/out: the state in the layout above, length 2m² (propagator) or 2m (vector)
     * @throws InvalidInputException         for a non-finite t or dt, dt = 0, or a wrong length of u
     * @throws org.liepath.core.DriveException if a drive fails; u is then unchanged
     */
    public void advance(double t, double dt, double[] u) {
        if (!Double.isFinite(t)) {
            throw InvalidInputException.of(Reason.NOT_FINITE, "t", "a finite time", t);
        }
        if (!Double.isFinite(dt) || dt == 0) {
            throw InvalidInputException.of(dt == 0 ? Reason.OUT_OF_RANGE : Reason.NOT_FINITE, "dt",
                    "a finite non-zero step", dt);
        }
        if (u == null) {
            throw InvalidInputException.of(Reason.NULL, "u", "a state array", "null");
        }
        int p;
        if (u.length == 2 * m * m) {
            p = m;
        } else if (u.length == 2 * m) {
            p = 1;
        } else {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "u",
                    "length " + 2 * m * m + " (propagator) or " + 2 * m + " (vector)", "length " + u.length);
        }
        int len = m * p;
        if (lastR != null) {
            advanceInFrame(t, dt, p, u);
            return;
        }
        System.arraycopy(u, 0, xr, 0, len);
        System.arraycopy(u, len, xi, 0, len);
        kernel.advance(t, dt, p, xr, xi);
        System.arraycopy(xr, 0, u, 0, len);
        System.arraycopy(xi, 0, u, len, len);
    }

    /** {@link #advance} for a kernel whose states live in an eigenbasis (see the class comment). */
    private void advanceInFrame(double t, double dt, int p, double[] u) {
        int len = m * p;
        if (p != lastP || !java.util.Arrays.equals(u, 0, len, lastR, 0, len)
                || !java.util.Arrays.equals(u, len, 2 * len, lastI, 0, len)) {
            System.arraycopy(u, 0, xr, 0, len);
            System.arraycopy(u, len, xi, 0, len);
            kernel.toFrame(t, p, xr, xi);
        }
        // a drive failure may leave the eigenbasis copy part-way through a split step: trust it again only after
        // a complete one
        lastP = 0;
        kernel.advance(t, dt, p, xr, xi);
        kernel.fromFrame(t + dt, p, xr, xi, lastR, lastI);
        lastP = p;
        System.arraycopy(lastR, 0, u, 0, len);
        System.arraycopy(lastI, 0, u, len, len);
    }

    @Override
    public String toString() {
        return "Stepper[" + scheme.name() + ", m = " + m + "]";
    }
}
