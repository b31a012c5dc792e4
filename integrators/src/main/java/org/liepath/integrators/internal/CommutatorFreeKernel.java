package org.liepath.integrators.internal;

/**
 * Commutator-free exponential step X ← exp(Ω_s) ··· exp(Ω_1) X with Ω_j = h Σ_k α_jk A(t + c_k h) (Ω_1 acts first).
 * The exponential midpoint rule is the one-row case. Adaptive runs use the step doubling of {@link Kernel#trial}.
 *
 * <p>Mutable and not thread-safe, like every {@link Kernel}: one instance per run or per stepper.
 */
public final class CommutatorFreeKernel extends Kernel {
    private final double[] nodes;
    private final double[][] table;
    private final int order;

    public CommutatorFreeKernel(LinearSystem sys, double[] nodes, double[][] table, int order) {
        super(sys, nodes.length);
        if (inFrame() && table.length > 1) {
            // refused by Scheme.inInteractionPicture for accuracy, not correctness (see its Javadoc)
            throw new IllegalArgumentException("table: one exponential in the interaction picture, got "
                    + table.length);
        }
        this.nodes = nodes;
        this.table = table;
        this.order = order;
    }

    @Override
    public int order() {
        return order;
    }

    @Override
    public void step(double t, double h, int p, double[] xr, double[] xi) {
        evaluate(t, h, nodes);
        for (double[] row : table) {
            combineNodes(h, row, wr, wi);
            expApply(wr, wi, p, xr, xi);
        }
    }
}
