package org.liepath.integrators.internal.wn;

/**
 * One level of the block Gauss (LDU) factorisation X = [[I, Z], [0, I]]·[[P, 0], [0, Q]]·[[I, 0], [W, I]] of the
 * solution of X' = B(t)X, X(t0) = I, with B split into blocks of sizes n1 + n2:
 * <pre>
 *   Z' = B12 + B11 Z − Z B22 − Z B21 Z      (matrix Riccati, decoupled)
 *   P' = (B11 − Z B21) P,   Q' = (B22 + B21 Z) Q,   W' = Q⁻¹ B21 P
 * </pre>
 * (Z(t0) = W(t0) = 0, P(t0) = I, Q(t0) = I; the factorisation exists while X22 = Q is invertible.) P and Q obey
 * linear equations of the same kind and are factorised recursively by child nodes, down to leaves that integrate X
 * directly. The matrix Riccati equation and its linear-fractional relation to linear systems: W. T. Reid, Riccati
 * Differential Equations, Academic Press 1972 (from memory); for the Gauss decomposition in Wei–Norman form cf. J.
 * Wei, E. Norman, J. Math. Phys. 4 (1963) 575.
 *
 * <p>State layout in the ODE vector: a leaf holds X planar (re block then im block); a split node holds Z, then W, then
 * its children. Scratch is preallocated: evaluation allocates nothing. Mutable, one run at a time. Not public API.
 */
public final class BlockNode {
    final int s, n1, n2, offset, size;
    final BlockNode p, q;
    // scratch
    private final double[] b11r, b11i, b12r, b12i, b21r, b21i, b22r, b22i;
    private final double[] zr, zi, wr, wi, pr, pi, qr, qi, t1r, t1i, t2r, t2i, t3r, t3i, t4r, t4i, cpr, cpi, cqr, cqi;
    private final double[] luR, luI, colR, colI, invR, invI, xr, xi;
    private final int[] piv;

    /**
     * @param s        size of this block
     * @param split    first-block size n1 (0 for a leaf)
     * @param leafSize children larger than this are split in halves (Integer.MAX_VALUE: children are leaves)
     * @param offset   position of this node's state in the ODE vector
     */
    public BlockNode(int s, int split, int leafSize, int offset) {
        this.s = s;
        this.offset = offset;
        if (split <= 0) {
            n1 = n2 = 0;
            p = q = null;
            size = 2 * s * s;
            b11r = b11i = b12r = b12i = b21r = b21i = b22r = b22i = null;
            zr = zi = wr = wi = pr = pi = qr = qi = t1r = t1i = t2r = t2i = t3r = t3i = t4r = t4i = null;
            cpr = cpi = cqr = cqi = luR = luI = colR = colI = invR = invI = null;
            xr = new double[s * s];
            xi = new double[s * s];
            piv = null;
            return;
        }
        n1 = split;
        n2 = s - split;
        int own = 4 * n1 * n2;
        p = new BlockNode(n1, n1 > leafSize ? n1 / 2 : 0, leafSize, offset + own);
        q = new BlockNode(n2, n2 > leafSize ? n2 / 2 : 0, leafSize, offset + own + p.size);
        size = own + p.size + q.size;
        b11r = new double[n1 * n1];
        b11i = new double[n1 * n1];
        b12r = new double[n1 * n2];
        b12i = new double[n1 * n2];
        b21r = new double[n2 * n1];
        b21i = new double[n2 * n1];
        b22r = new double[n2 * n2];
        b22i = new double[n2 * n2];
        zr = new double[n1 * n2];
        zi = new double[n1 * n2];
        wr = new double[n2 * n1];
        wi = new double[n2 * n1];
        pr = new double[n1 * n1];
        pi = new double[n1 * n1];
        qr = new double[n2 * n2];
        qi = new double[n2 * n2];
        int big = Math.max(n1, n2) * Math.max(n1, n2);
        t1r = new double[big];
        t1i = new double[big];
        t2r = new double[big];
        t2i = new double[big];
        t3r = new double[big];
        t3i = new double[big];
        t4r = new double[big];
        t4i = new double[big];
        cpr = new double[n1 * n1];
        cpi = new double[n1 * n1];
        cqr = new double[n2 * n2];
        cqi = new double[n2 * n2];
        luR = new double[n2 * n2];
        luI = new double[n2 * n2];
        invR = new double[n2 * n2];
        invI = new double[n2 * n2];
        colR = new double[n2];
        colI = new double[n2];
        piv = new int[n2];
        xr = new double[s * s];
        xi = new double[s * s];
    }

    /** @return the number of reals this node (with its children) occupies */
    public int size() {
        return size;
    }

    /** @return the number of split nodes (block Riccati equations) in this tree */
    public int splits() {
        return p == null ? 0 : 1 + p.splits() + q.splits();
    }

    /** Writes the initial state X = I. */
    public void init(double[] y) {
        if (p == null) {
            java.util.Arrays.fill(y, offset, offset + size, 0.0);
            for (int k = 0; k < s; k++) {
                y[offset + k * s + k] = 1.0;
            }
            return;
        }
        java.util.Arrays.fill(y, offset, offset + 4 * n1 * n2, 0.0);
        p.init(y);
        q.init(y);
    }

    private void load(double[] y, int at, int len, double[] re, double[] im) {
        System.arraycopy(y, at, re, 0, len);
        System.arraycopy(y, at + len, im, 0, len);
    }

    private void loadFactors(double[] y) {
        int zl = n1 * n2;
        load(y, offset, zl, zr, zi);
        load(y, offset + 2 * zl, zl, wr, wi);
        p.value(y, pr, pi);
        q.value(y, qr, qi);
    }

    /** out (planar s×s) = the reconstructed X of this node. */
    public void value(double[] y, double[] outR, double[] outI) {
        if (p == null) {
            load(y, offset, s * s, outR, outI);
            return;
        }
        loadFactors(y);
        // t1 = Z Q (n1×n2), t2 = t1 W (n1×n1), t3 = Q W (n2×n1)
        Small.mul(n1, n2, n2, zr, zi, qr, qi, t1r, t1i);
        Small.mul(n1, n2, n1, t1r, t1i, wr, wi, t2r, t2i);
        Small.mul(n2, n2, n1, qr, qi, wr, wi, t3r, t3i);
        for (int i = 0; i < n1; i++) {
            for (int j = 0; j < n1; j++) {
                outR[i * s + j] = pr[i * n1 + j] + t2r[i * n1 + j];
                outI[i * s + j] = pi[i * n1 + j] + t2i[i * n1 + j];
            }
            for (int j = 0; j < n2; j++) {
                outR[i * s + n1 + j] = t1r[i * n2 + j];
                outI[i * s + n1 + j] = t1i[i * n2 + j];
            }
        }
        for (int i = 0; i < n2; i++) {
            for (int j = 0; j < n1; j++) {
                outR[(n1 + i) * s + j] = t3r[i * n1 + j];
                outI[(n1 + i) * s + j] = t3i[i * n1 + j];
            }
            for (int j = 0; j < n2; j++) {
                outR[(n1 + i) * s + n1 + j] = qr[i * n2 + j];
                outI[(n1 + i) * s + n1 + j] = qi[i * n2 + j];
            }
        }
    }

    /**
     * Right-hand side for X' = B X with B planar s×s (not modified).
     *
     * @return false if X22 = Q is singular
     */
    public boolean rhs(double[] br, double[] bi, double[] y, double[] yDot) {
        if (p == null) {
            load(y, offset, s * s, xr, xi);
            Small.mul(s, s, s, br, bi, xr, xi, t0r(), t0i());
            System.arraycopy(t0r(), 0, yDot, offset, s * s);
            System.arraycopy(t0i(), 0, yDot, offset + s * s, s * s);
            return true;
        }
        for (int i = 0; i < s; i++) {
            for (int j = 0; j < s; j++) {
                double vr = br[i * s + j], vi = bi[i * s + j];
                if (i < n1 && j < n1) {
                    b11r[i * n1 + j] = vr;
                    b11i[i * n1 + j] = vi;
                } else if (i < n1) {
                    b12r[i * n2 + j - n1] = vr;
                    b12i[i * n2 + j - n1] = vi;
                } else if (j < n1) {
                    b21r[(i - n1) * n1 + j] = vr;
                    b21i[(i - n1) * n1 + j] = vi;
                } else {
                    b22r[(i - n1) * n2 + j - n1] = vr;
                    b22i[(i - n1) * n2 + j - n1] = vi;
                }
            }
        }
        loadFactors(y);
        int zl = n1 * n2;
        // Z' = B12 + B11 Z − Z B22 − Z (B21 Z)
        Small.mul(n1, n1, n2, b11r, b11i, zr, zi, t1r, t1i);
        Small.mul(n1, n2, n2, zr, zi, b22r, b22i, t2r, t2i);
        Small.mul(n2, n1, n2, b21r, b21i, zr, zi, t3r, t3i);
        Small.mul(n1, n2, n2, zr, zi, t3r, t3i, t4r, t4i);
        for (int e = 0; e < zl; e++) {
            yDot[offset + e] = b12r[e] + t1r[e] - t2r[e] - t4r[e];
            yDot[offset + zl + e] = b12i[e] + t1i[e] - t2i[e] - t4i[e];
        }
        // child coefficients: Cq = B22 + B21 Z (= B22 + t3), Cp = B11 − Z B21
        for (int e = 0; e < n2 * n2; e++) {
            cqr[e] = b22r[e] + t3r[e];
            cqi[e] = b22i[e] + t3i[e];
        }
        Small.mul(n1, n2, n1, zr, zi, b21r, b21i, t1r, t1i);
        for (int e = 0; e < n1 * n1; e++) {
            cpr[e] = b11r[e] - t1r[e];
            cpi[e] = b11i[e] - t1i[e];
        }
        // W' = Q⁻¹ (B21 P)
        Small.mul(n2, n1, n1, b21r, b21i, pr, pi, t2r, t2i);
        System.arraycopy(qr, 0, luR, 0, n2 * n2);
        System.arraycopy(qi, 0, luI, 0, n2 * n2);
        if (!Small.lu(n2, luR, luI, piv)) {
            return false;
        }
        for (int j = 0; j < n1; j++) {
            for (int i = 0; i < n2; i++) {
                colR[i] = t2r[i * n1 + j];
                colI[i] = t2i[i * n1 + j];
            }
            Small.luSolve(n2, luR, luI, piv, colR, colI);
            for (int i = 0; i < n2; i++) {
                yDot[offset + 2 * zl + i * n1 + j] = colR[i];
                yDot[offset + 3 * zl + i * n1 + j] = colI[i];
            }
        }
        return p.rhs(cpr, cpi, y, yDot) && q.rhs(cqr, cqi, y, yDot);
    }

    private double[] t0r() {
        return leafScratch()[0];
    }

    private double[] t0i() {
        return leafScratch()[1];
    }

    private double[][] leafScratchArr;

    private double[][] leafScratch() {
        if (leafScratchArr == null) {
            leafScratchArr = new double[][]{new double[s * s], new double[s * s]};
        }
        return leafScratchArr;
    }

    /**
     * @return the largest ‖X‖₁‖X22⁻¹‖₁ over the split nodes of this tree (X the node's value; infinite if a block is
     * singular): scale-aware, so a block that shrinks to zero as a multiple of the identity counts as singular
     */
    public double worstCondition(double[] y) {
        if (p == null) {
            return 1;
        }
        value(y, xr, xi);
        double nrm = Small.norm1(s, s, xr, xi);
        q.value(y, qr, qi);
        System.arraycopy(qr, 0, luR, 0, n2 * n2);
        System.arraycopy(qi, 0, luI, 0, n2 * n2);
        double k = Small.invert(n2, luR, luI, piv, invR, invI, colR, colI)
                ? nrm * Small.norm1(n2, n2, invR, invI) : Double.POSITIVE_INFINITY;
        if (Double.isNaN(k)) {
            k = Double.POSITIVE_INFINITY;
        }
        return Math.max(k, Math.max(p.worstCondition(y), q.worstCondition(y)));
    }

    /** Copies the top-level factors: {Z, P, Q, W} as {re, im} planar arrays. */
    public double[][][] factors(double[] y) {
        loadFactors(y);
        return new double[][][]{{zr.clone(), zi.clone()}, {pr.clone(), pi.clone()}, {qr.clone(), qi.clone()},
            {wr.clone(), wi.clone()}};
    }

    /** @return the first-block size n1 */
    public int n1() {
        return n1;
    }
}
