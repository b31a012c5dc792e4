package org.liepath.integrators.internal;

/**
 * Commutator-free exponential step X ← exp(Ω_s) ··· exp(Ω_1) X with Ω_j = h Σ_k α_jk A(t + c_k h) (Ω_1 acts first).
 * The exponential midpoint rule is the one-row case.
 *
 * <p>With an embedded table on the same (three Gauss) nodes, a trial step propagates with the main table and estimates
 * the error by the difference to the partner (one exponential per partner row) plus the quadrature check of
 * {@link Kernel#quadratureCheck} (two extra evaluations), since both tables share the same quadrature of ∫A; without
 * a partner it uses step doubling.
 */
public final class CommutatorFreeKernel extends Kernel {
    private final double[] nodes;
    private final double[][] table, partner;
    private final int order, partnerOrder;

    /**
     * @param partner embedded table on the same nodes, or null for step doubling
     * @param partnerOrder the order of the partner table (the estimate is of its error)
     */
    public CommutatorFreeKernel(LinearSystem sys, double[] nodes, double[][] table, int order, double[][] partner,
                                int partnerOrder) {
        super(sys, nodes.length);
        this.nodes = nodes;
        this.table = table;
        this.order = order;
        this.partner = partner;
        this.partnerOrder = partnerOrder;
    }

    @Override
    public int order() {
        return order;
    }

    @Override
    public int estimateOrder() {
        return partner == null ? order : partnerOrder;
    }

    @Override
    public void step(double t, double h, int p, double[] xr, double[] xi) {
        evaluate(t, h, nodes);
        apply(table, h, p, xr, xi);
    }

    private void apply(double[][] tab, double h, int p, double[] xr, double[] xi) {
        for (double[] row : tab) {
            combineNodes(h, row, wr, wi);
            expApply(wr, wi, p, xr, xi);
        }
    }

    @Override
    public double trial(double t, double h, int p, double[] xr, double[] xi, double[] yr, double[] yi) {
        if (partner == null) {
            return super.trial(t, h, p, xr, xi, yr, yi);
        }
        int len = m * p;
        evaluate(t, h, nodes);
        System.arraycopy(xr, 0, yr, 0, len);
        System.arraycopy(xi, 0, yi, 0, len);
        System.arraycopy(xr, 0, zr, 0, len);
        System.arraycopy(xi, 0, zi, 0, len);
        apply(table, h, p, yr, yi);
        apply(partner, h, p, zr, zi);
        double ordering = diff(len, yr, yi, zr, zi) / norm(len, yr, yi);
        return ordering + quadratureCheck(t, h, p, yr, yi);
    }
}
