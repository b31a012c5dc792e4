package org.liepath.integrators.internal;

/**
 * The commutators C_kl = [G_k, G_l] (k &lt; l) of a system's generators, so that a commutator of two generator
 * combinations X = Σ x_k G_k, Y = Σ y_l G_l comes from bilinearity as [X, Y] = Σ_{k&lt;l} (x_k y_l − x_l y_k) C_kl:
 * one pass of real multiply–adds over the stored pairs instead of a complex matrix product (an exact rearrangement,
 * so the result differs from the product route by rounding only). Entries are stored pair-innermost, so up to three
 * outputs are summed in one pass with their running sums in registers. The constant part G_0, when present, is generator number
 * {@code terms} with weight w0.
 *
 * <p>For an anti-Hermitian system each C_kl comes from the same P − P† route as every other commutator, so it is
 * exactly anti-Hermitian; only its upper triangle is stored (packed row by row) and combined with real weights, and the
 * lower triangle is written as the negated conjugate, so every combined result is exactly anti-Hermitian too.
 *
 * <p>Worth it only when the P = n(n−1)/2 pairs cost less than the products they replace: see {@link #pays}. The
 * table is built once per kernel (P commutators at construction).
 * Mutable scratch inside, so one instance per kernel; not thread-safe.
 */
final class GeneratorPairs {
    /**
     * Largest memory (bytes) the stored pairs may take: a few megabytes keep the table near the caches it is read
     * from every step, and bound the set-up cost for large Liouville-space systems.
     */
    static final long MAX_BYTES = 4L << 20;
    /**
     * Cost of one multiply–add of the pair pass relative to one of core's dense product (register-blocked, so it
     * does more work per memory access). Fitted roughly to where the two routes of the eighth-order exponent break
     * even on this machine (m = 6, 8, 9, 16 with 1 to 21 pairs, anti-Hermitian and general systems; timings within
     * ±10 % on a loaded machine).
     */
    static final double AXPY_WEIGHT = 1.25;
    /**
     * Up to this dimension the unrolled 2×2 and 3×3 products of core cost no more than the call and loop overheads of
     * the pair pass: measured within ±10 % either way, so the product route stays.
     */
    static final int MIN_DIM = 4;

    private final int m, size, pairs;
    private final boolean skew;
    private final int[] first, second;
    /**
     * Entry q of pair p at [q·pairs + p]: the weights of all pairs meet one entry at a time, so each output entry is a
     * short dot product kept in a register (one load per multiply–add, no store in between).
     */
    private final double[] tr, ti;
    /** Pair weights of up to three outputs, and their packed sums. */
    private final double[][] gamma = new double[3][], sumR = new double[3][], sumI = new double[3][];

    /**
     * @param sys the system
     * @param bracket computes [G_k, G_l] exactly as the kernel's commutator does (P − P† for an anti-Hermitian system)
     */
    GeneratorPairs(LinearSystem sys, Bracket bracket) {
        m = sys.m;
        skew = sys.skewHermitian;
        size = skew ? m * (m + 1) / 2 : m * m;
        int n = sys.generators();
        int[] f = new int[n * (n - 1) / 2], s = new int[f.length];
        double[][] r = new double[f.length][], im = new double[f.length][];
        double[] cr = new double[m * m], ci = new double[m * m];
        int count = 0;
        for (int k = 0; k < n; k++) {
            for (int l = k + 1; l < n; l++) {
                bracket.of(sys.generatorRe(k), sys.generatorIm(k), sys.generatorRe(l), sys.generatorIm(l), cr, ci);
                double[] packedR = new double[size], packedI = new double[size];
                if (!pack(cr, ci, packedR, packedI)) {
                    continue;  // commuting generators add nothing to any commutator
                }
                f[count] = k;
                s[count] = l;
                r[count] = packedR;
                im[count] = packedI;
                count++;
            }
        }
        pairs = count;
        first = java.util.Arrays.copyOf(f, count);
        second = java.util.Arrays.copyOf(s, count);
        tr = new double[size * count];
        ti = new double[size * count];
        for (int p = 0; p < count; p++) {
            for (int q = 0; q < size; q++) {
                tr[q * count + p] = r[p][q];
                ti[q * count + p] = im[p][q];
            }
        }
        for (int j = 0; j < 3; j++) {
            gamma[j] = new double[count];
            sumR[j] = new double[size];
            sumI[j] = new double[size];
        }
    }

    /** The kernel's commutator on raw planar matrices (without touching its counters). */
    @FunctionalInterface
    interface Bracket {
        void of(double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci);
    }

    /**
     * Whether the pair route is cheaper for this system and scheme, and its table small enough. Multiply–adds: the
     * product route does 4m³ per commutator (anti-Hermitian, one product) or 8m³ (two products); the pair pass
     * 2 per stored entry, pair and output, i.e. P·m(m+1) or P·2m² per output. The eighth-order exponent computes
     * three outputs in the pass to save two products (its third output is the [B0, B2] part of a commutator whose
     * other part still needs a product); orders 4 and 6 compute one to save one.
     *
     * @param order the Magnus order (4, 6 or 8)
     */
    static boolean pays(LinearSystem sys, int order) {
        int m = sys.m, n = sys.generators();
        if (m < MIN_DIM) {
            return false;
        }
        long p = (long) n * (n - 1) / 2;
        boolean skew = sys.skewHermitian;
        double size = skew ? m * (m + 1) / 2.0 : (double) m * m;
        if (p * size * 16 > MAX_BYTES) {
            return false;
        }
        double product = (skew ? 4.0 : 8.0) * m * m * m;
        int outputs = order == 8 ? 3 : 1, saved = order == 8 ? 2 : 1;
        return AXPY_WEIGHT * outputs * p * 2 * size < saved * product;
    }

    /** Packs C into (r, i) (upper triangle if anti-Hermitian); false if C is exactly zero. */
    private boolean pack(double[] cr, double[] ci, double[] r, double[] i) {
        boolean any = false;
        if (skew) {
            int q = 0;
            for (int row = 0; row < m; row++) {
                for (int col = row; col < m; col++, q++) {
                    r[q] = cr[row * m + col];
                    i[q] = ci[row * m + col];
                    any |= r[q] != 0.0 || i[q] != 0.0;
                }
            }
        } else {
            System.arraycopy(cr, 0, r, 0, size);
            System.arraycopy(ci, 0, i, 0, size);
            for (int q = 0; q < size && !any; q++) {
                any = r[q] != 0.0 || i[q] != 0.0;
            }
        }
        return any;
    }

    /** @return the number of stored (non-commuting) pairs */
    int pairs() {
        return pairs;
    }

    /** Sets the pair weights of output j to s·(x_k y_l − x_l y_k), the bilinear form of [X, Y]. */
    void weights(int j, double s, double[] x, double[] y) {
        double[] g = gamma[j];
        for (int p = 0; p < pairs; p++) {
            int k = first[p], l = second[p];
            g[p] = s * (x[k] * y[l] - x[l] * y[k]);
        }
    }

    /**
     * Writes the commutators of the weights set for outputs 0..count−1 (count ≤ 3) to (outR[j], outI[j]), plus
     * (addR[j], addI[j]) where addR[j] is not null (the addend may alias the output). One pass over the table.
     */
    void combine(int count, double[][] addR, double[][] addI, double[][] outR, double[][] outI) {
        int np = pairs;
        if (count == 1) {
            double[] g = gamma[0], r = sumR[0], im = sumI[0];
            for (int q = 0; q < size; q++) {
                int base = q * np;
                double a = 0, b = 0;
                for (int p = 0; p < np; p++) {
                    a += g[p] * tr[base + p];
                    b += g[p] * ti[base + p];
                }
                r[q] = a;
                im[q] = b;
            }
            unpack(r, im, addR[0], addI[0], outR[0], outI[0]);
            return;
        }
        double[] g0 = gamma[0], g1 = gamma[count > 1 ? 1 : 0], g2 = gamma[count > 2 ? 2 : 0];
        double[] r0 = sumR[0], i0 = sumI[0], r1 = sumR[1], i1 = sumI[1], r2 = sumR[2], i2 = sumI[2];
        for (int q = 0; q < size; q++) {
            int base = q * np;
            double a0 = 0, b0 = 0, a1 = 0, b1 = 0, a2 = 0, b2 = 0;
            for (int p = 0; p < np; p++) {
                double cr = tr[base + p], ci = ti[base + p];
                a0 += g0[p] * cr;
                b0 += g0[p] * ci;
                a1 += g1[p] * cr;
                b1 += g1[p] * ci;
                a2 += g2[p] * cr;
                b2 += g2[p] * ci;
            }
            r0[q] = a0;
            i0[q] = b0;
            r1[q] = a1;
            i1[q] = b1;
            r2[q] = a2;
            i2[q] = b2;
        }
        for (int j = 0; j < count; j++) {
            unpack(sumR[j], sumI[j], addR[j], addI[j], outR[j], outI[j]);
        }
    }

    private void unpack(double[] r, double[] im, double[] addR, double[] addI, double[] outR, double[] outI) {
        if (!skew) {
            for (int q = 0; q < size; q++) {
                outR[q] = addR == null ? r[q] : addR[q] + r[q];
                outI[q] = addI == null ? im[q] : addI[q] + im[q];
            }
            return;
        }
        int q = 0;
        for (int row = 0; row < m; row++) {
            int d = row * m + row;
            // an anti-Hermitian diagonal is imaginary: the real part stays an exact zero
            outR[d] = addR == null ? 0.0 : addR[d];
            outI[d] = addI == null ? im[q] : addI[d] + im[q];
            q++;
            for (int col = row + 1; col < m; col++, q++) {
                int ij = row * m + col, ji = col * m + row;
                if (addR == null) {
                    outR[ij] = r[q];
                    outI[ij] = im[q];
                    outR[ji] = -r[q];
                    outI[ji] = im[q];
                } else {
                    outR[ij] = addR[ij] + r[q];
                    outI[ij] = addI[ij] + im[q];
                    outR[ji] = addR[ji] - r[q];
                    outI[ji] = addI[ji] + im[q];
                }
            }
        }
    }
}
