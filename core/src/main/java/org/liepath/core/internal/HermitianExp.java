package org.liepath.core.internal;

/**
 * exp(−i t H) for Hermitian H. (Provisional: Padé scaling and squaring; to be replaced by the eigendecomposition.)
 * Not part of the public API.
 */
public final class HermitianExp {
    private HermitianExp() {
    }

    public static void expMinusI(int n, double[] hr, double[] hi, double t, double[] outRe, double[] outIm) {
        int len = n * n;
        double[] ar = new double[len], ai = new double[len];
        for (int k = 0; k < len; k++) {
            ar[k] = t * hi[k];
            ai[k] = -t * hr[k];
        }
        Expm.exp(n, ar, ai, outRe, outIm);
    }
}
