package org.liepath.core;

import org.apache.commons.math3.complex.Complex;
import org.ejml.data.ZMatrixRMaj;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Dense;
import org.liepath.core.internal.Expm;
import org.liepath.core.internal.HermitianExp;
import org.liepath.core.internal.Require;

import java.util.Locale;

/**
 * An immutable dense complex square matrix: operators on a finite-dimensional Hilbert space, generators, propagators.
 *
 * <p>Storage is planar and row-major (entry (i, j) is {@code re(i,j) + i·im(i,j)}); every operation returns a new
 * operator and never modifies its inputs. Factories copy the caller's arrays. Entries are always finite: factories
 * refuse NaN and infinities with an {@link InvalidInputException}, and the arithmetic methods throw one (reason
 * NOT_FINITE) when a result overflows.
 *
 * <p>Cost: {@link #times} and {@link #commutator} are O(n³) (8n³ flops per product), {@link #exp} is about
 * 6 products and one LU solve plus log₂‖A‖₁ squarings, {@link #kron} is O(n²m²). Intended sizes: 1 … a few hundred.
 *
 * <p>Thread-safety: instances are immutable and safe to share between threads.
 */
public final class Operator {
    /** Largest dimension n whose n² entries fit in one Java array (46340² &lt; 2³¹). */
    public static final int MAX_DIM = 46340;

    final int n;
    final double[] re;
    final double[] im;

    Operator(int n, double[] re, double[] im) {
        this.n = n;
        this.re = re;
        this.im = im;
    }

    // ------------------------------------------------------------------ factories

    /**
     * An operator from real and imaginary parts given as square arrays of rows.
     *
     * @param re the real parts, one array per row
     * @param im the imaginary parts, one array per row
     * @return an operator from real and imaginary parts given as square arrays of rows
     * @throws InvalidInputException if an array is null, empty, ragged, not square, of different sizes or holds a
     *                               non-finite number
     */
    public static Operator of(double[][] re, double[][] im) {
        int n = Require.squareFinite(re, "re");
        int m = Require.squareFinite(im, "im");
        if (m != n) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "im", "a " + n + "x" + n + " array like re",
                    m + "x" + m);
        }
        double[] r = new double[n * n], i = new double[n * n];
        for (int a = 0; a < n; a++) {
            System.arraycopy(re[a], 0, r, a * n, n);
            System.arraycopy(im[a], 0, i, a * n, n);
        }
        return new Operator(n, r, i);
    }

    /**
     * A real operator (zero imaginary part).
     *
     * @param re the real parts, one array per row
     * @return a real operator (zero imaginary part)
     */
    public static Operator real(double[][] re) {
        int n = Require.squareFinite(re, "re");
        double[] r = new double[n * n];
        for (int a = 0; a < n; a++) {
            System.arraycopy(re[a], 0, r, a * n, n);
        }
        return new Operator(n, r, new double[n * n]);
    }

    /**
     * An operator from planar row-major arrays of length n² (copied).
     *
     * @param n the dimension
     * @param re the real parts
     * @param im the imaginary parts
     * @return an operator from planar row-major arrays of length n² (copied)
     * @throws InvalidInputException if lengths differ from n², or an entry is not finite
     */
    public static Operator ofPlanar(int n, double[] re, double[] im) {
        checkDim(n, "n");
        Require.nonNull(re, "re");
        Require.nonNull(im, "im");
        if (re.length != n * n) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "re", "length " + n * n, "length " + re.length);
        }
        if (im.length != n * n) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "im", "length " + n * n, "length " + im.length);
        }
        Require.finite(re, "re");
        Require.finite(im, "im");
        return new Operator(n, re.clone(), im.clone());
    }

    /**
     * The n×n identity.
     *
     * @param n the dimension
     * @return the n×n identity
     */
    public static Operator identity(int n) {
        checkDim(n, "n");
        double[] r = new double[n * n];
        for (int i = 0; i < n; i++) {
            r[i * n + i] = 1;
        }
        return new Operator(n, r, new double[n * n]);
    }

    /**
     * The n×n zero operator.
     *
     * @param n the dimension
     * @return the n×n zero operator
     */
    public static Operator zero(int n) {
        checkDim(n, "n");
        return new Operator(n, new double[n * n], new double[n * n]);
    }

    /**
     * A real diagonal operator with the given diagonal.
     *
     * @param d the diagonal entries (finite)
     * @return a real diagonal operator with the given diagonal
     */
    public static Operator diagonal(double... d) {
        Require.nonNull(d, "d");
        if (d.length == 0) {
            throw InvalidInputException.of(Reason.EMPTY, "d", "at least one diagonal entry", "none");
        }
        Require.finite(d, "d");
        int n = d.length;
        double[] r = new double[n * n];
        for (int i = 0; i < n; i++) {
            r[i * n + i] = d[i];
        }
        return new Operator(n, r, new double[n * n]);
    }

    /**
     * The matrix unit |i⟩⟨j| of dimension n (a single 1 at row i, column j).
     *
     * @param n the dimension
     * @param i the index
     * @param j the index
     * @return the matrix unit |i⟩⟨j| of dimension n (a single 1 at row i, column j)
     */
    public static Operator unit(int n, int i, int j) {
        checkDim(n, "n");
        Require.index(i, n, "i");
        Require.index(j, n, "j");
        double[] r = new double[n * n];
        r[i * n + j] = 1;
        return new Operator(n, r, new double[n * n]);
    }

    /**
     * The outer product |a⟩⟨b|.
     *
     * @param a the ket |a⟩
     * @param b the other state
     * @return the outer product |a⟩⟨b|
     */
    public static Operator outer(StateVector a, StateVector b) {
        Require.nonNull(a, "a");
        Require.nonNull(b, "b");
        Require.sameDim(a.dim(), b.dim(), "b");
        int n = a.dim();
        double[] r = new double[n * n], im = new double[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                // a_i conj(b_j)
                r[i * n + j] = a.re[i] * b.re[j] + a.im[i] * b.im[j];
                im[i * n + j] = a.im[i] * b.re[j] - a.re[i] * b.im[j];
            }
        }
        return new Operator(n, r, im);
    }

    /**
     * Converts an EJML complex row-major matrix (copied).
     *
     * @param m the EJML matrix (square, finite)
     * @return the operator
     */
    public static Operator fromEjml(ZMatrixRMaj m) {
        Require.nonNull(m, "m");
        if (m.numRows != m.numCols || m.numRows == 0) {
            throw InvalidInputException.of(Reason.NOT_SQUARE, "m", "a non-empty square matrix",
                    m.numRows + "x" + m.numCols);
        }
        int n = m.numRows;
        double[] r = new double[n * n], i = new double[n * n];
        double[] d = m.data;
        for (int k = 0; k < n * n; k++) {
            r[k] = d[2 * k];
            i[k] = d[2 * k + 1];
        }
        Require.finite(r, "m (real part)");
        Require.finite(i, "m (imaginary part)");
        return new Operator(n, r, i);
    }

    // ------------------------------------------------------------------ access

    /** @return the dimension n */
    public int dim() {
        return n;
    }

    /**
     * @param i the index
     * @param j the index
     * @return Re of entry (i, j)
     */
    public double re(int i, int j) {
        return re[idx(i, j)];
    }

    /**
     * @param i the index
     * @param j the index
     * @return Im of entry (i, j)
     */
    public double im(int i, int j) {
        return im[idx(i, j)];
    }

    /**
     * @param i the index
     * @param j the index
     * @return entry (i, j)
     */
    public Complex get(int i, int j) {
        int k = idx(i, j);
        return new Complex(re[k], im[k]);
    }

    private int idx(int i, int j) {
        Require.index(i, n, "i");
        Require.index(j, n, "j");
        return i * n + j;
    }

    /**
     * Copies the planar row-major entries into the caller's arrays (each of length ≥ n²).
     *
     * @param reOut output: the real parts (length ≥ n²)
     * @param imOut output: the imaginary parts (length ≥ n²)
     */
    public void copyTo(double[] reOut, double[] imOut) {
        Require.nonNull(reOut, "reOut");
        Require.nonNull(imOut, "imOut");
        if (reOut.length < n * n || imOut.length < n * n) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "reOut/imOut", "length >= " + n * n,
                    reOut.length + "/" + imOut.length);
        }
        System.arraycopy(re, 0, reOut, 0, n * n);
        System.arraycopy(im, 0, imOut, 0, n * n);
    }

    /** @return a copy of the real parts, planar row-major */
    public double[] reArray() {
        return re.clone();
    }

    /** @return a copy of the imaginary parts, planar row-major */
    public double[] imArray() {
        return im.clone();
    }

    /** @return the real parts as rows (a copy) */
    public double[][] reRows() {
        double[][] out = new double[n][n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(re, i * n, out[i], 0, n);
        }
        return out;
    }

    /** @return the imaginary parts as rows (a copy) */
    public double[][] imRows() {
        double[][] out = new double[n][n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(im, i * n, out[i], 0, n);
        }
        return out;
    }

    /**
     * Converts to an EJML complex row-major matrix (a copy).
     *
     * @return a new EJML matrix holding a copy of the entries
     */
    public ZMatrixRMaj toEjml() {
        ZMatrixRMaj m = new ZMatrixRMaj(n, n);
        for (int k = 0; k < n * n; k++) {
            m.data[2 * k] = re[k];
            m.data[2 * k + 1] = im[k];
        }
        return m;
    }

    // ------------------------------------------------------------------ algebra

    private void same(Operator b, String name) {
        Require.nonNull(b, name);
        Require.sameDim(n, b.n, name);
    }

    /**
     * @param b the other operator
     * @return this + b
     */
    public Operator plus(Operator b) {
        same(b, "b");
        double[] r = new double[n * n], i = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            r[k] = re[k] + b.re[k];
            i[k] = im[k] + b.im[k];
        }
        return checked(n, r, i, "b", "sum");
    }

    /**
     * @param b the other operator
     * @return this − b
     */
    public Operator minus(Operator b) {
        same(b, "b");
        double[] r = new double[n * n], i = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            r[k] = re[k] - b.re[k];
            i[k] = im[k] - b.im[k];
        }
        return checked(n, r, i, "b", "difference");
    }

    /**
     * @param b the other operator
     * @return the matrix product this·b
     */
    public Operator times(Operator b) {
        same(b, "b");
        double[] r = new double[n * n], i = new double[n * n];
        Dense.mul(n, re, im, b.re, b.im, r, i);
        return checked(n, r, i, "b", "product");
    }

    /**
     * @param s the factor
     * @return s·this
     */
    public Operator scale(double s) {
        Require.finite(s, "s");
        double[] r = new double[n * n], i = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            r[k] = s * re[k];
            i[k] = s * im[k];
        }
        return checked(n, r, i, "s", "multiple");
    }

    /**
     * @param z the factor
     * @return z·this
     */
    public Operator scale(Complex z) {
        Require.nonNull(z, "z");
        double zr = Require.finite(z.getReal(), "z (real part)"), zi = Require.finite(z.getImaginary(), "z (imaginary part)");
        double[] r = new double[n * n], i = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            r[k] = zr * re[k] - zi * im[k];
            i[k] = zr * im[k] + zi * re[k];
        }
        return checked(n, r, i, "z", "multiple");
    }

    /** @return i·this (exact, no rounding) */
    public Operator timesI() {
        double[] r = new double[n * n], i = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            r[k] = -im[k];
            i[k] = re[k];
        }
        return new Operator(n, r, i);
    }

    /** @return the conjugate transpose */
    public Operator dagger() {
        double[] r = new double[n * n], i = new double[n * n];
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                r[b * n + a] = re[a * n + b];
                i[b * n + a] = -im[a * n + b];
            }
        }
        return new Operator(n, r, i);
    }

    /** @return the transpose (no conjugation) */
    public Operator transpose() {
        double[] r = new double[n * n], i = new double[n * n];
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                r[b * n + a] = re[a * n + b];
                i[b * n + a] = im[a * n + b];
            }
        }
        return new Operator(n, r, i);
    }

    /** @return the entrywise complex conjugate */
    public Operator conjugate() {
        double[] i = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            i[k] = -im[k];
        }
        return new Operator(n, re.clone(), i);
    }

    /**
     * @param b the other operator
     * @return the commutator [this, b] = this·b − b·this
     */
    public Operator commutator(Operator b) {
        same(b, "b");
        double[] r1 = new double[n * n], i1 = new double[n * n], r2 = new double[n * n], i2 = new double[n * n];
        Dense.mul(n, re, im, b.re, b.im, r1, i1);
        Dense.mul(n, b.re, b.im, re, im, r2, i2);
        for (int k = 0; k < n * n; k++) {
            r1[k] -= r2[k];
            i1[k] -= i2[k];
        }
        return checked(n, r1, i1, "b", "commutator");
    }

    /**
     * @param b the other operator
     * @return the anticommutator {this, b} = this·b + b·this
     */
    public Operator anticommutator(Operator b) {
        same(b, "b");
        double[] r1 = new double[n * n], i1 = new double[n * n], r2 = new double[n * n], i2 = new double[n * n];
        Dense.mul(n, re, im, b.re, b.im, r1, i1);
        Dense.mul(n, b.re, b.im, re, im, r2, i2);
        for (int k = 0; k < n * n; k++) {
            r1[k] += r2[k];
            i1[k] += i2[k];
        }
        return checked(n, r1, i1, "b", "anticommutator");
    }

    /** @return the trace */
    public Complex trace() {
        double r = 0, i = 0;
        for (int k = 0; k < n; k++) {
            r += re[k * n + k];
            i += im[k * n + k];
        }
        return new Complex(r, i);
    }

    /**
     * @param b the other operator
     * @return the Hilbert–Schmidt inner product ⟨this, b⟩ = tr(this† b)
     */
    public Complex inner(Operator b) {
        same(b, "b");
        double r = 0, i = 0;
        for (int k = 0; k < n * n; k++) {
            // conj(a_k) b_k
            r += re[k] * b.re[k] + im[k] * b.im[k];
            i += re[k] * b.im[k] - im[k] * b.re[k];
        }
        return new Complex(r, i);
    }

    /** @return the Frobenius (Hilbert–Schmidt) norm sqrt(tr(A†A)) */
    public double norm() {
        return safeNorm(re, im);
    }

    /** @return the matrix 1-norm (maximum column sum of moduli) */
    public double norm1() {
        return Dense.norm1(n, re, im);
    }

    /**
     * @param b the other operator
     * @return the Frobenius distance ‖this − b‖_F, the approximate-equality measure used throughout Liepath
     */
    public double distance(Operator b) {
        same(b, "b");
        double s = 0;
        for (int k = 0; k < n * n; k++) {
            double dr = re[k] - b.re[k], di = im[k] - b.im[k];
            s += dr * dr + di * di;
        }
        if (inRange(s)) {
            return Math.sqrt(s);
        }
        Ssq q = new Ssq();
        for (int k = 0; k < n * n; k++) {
            q.add(0.5 * re[k] - 0.5 * b.re[k]);
            q.add(0.5 * im[k] - 0.5 * b.im[k]);
        }
        return 2 * q.value();
    }

    /**
     * Whether ‖A − A†‖_F ≤ tol·max(1, ‖A‖_F).
     *
     * @param tol relative tolerance, non-negative
     * @return whether ‖A − A†‖_F ≤ tol·max(1, ‖A‖_F)
     */
    public boolean isHermitian(double tol) {
        Require.nonNegative(tol, "tol");
        return hermitianDefect() <= tol * Math.max(1.0, norm());
    }

    /** @return ‖A − A†‖_F */
    public double hermitianDefect() {
        double s = 0;
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                double dr = re[a * n + b] - re[b * n + a];
                double di = im[a * n + b] + im[b * n + a];
                s += dr * dr + di * di;
            }
        }
        if (inRange(s)) {
            return Math.sqrt(s);
        }
        Ssq q = new Ssq();
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                q.add(0.5 * re[a * n + b] - 0.5 * re[b * n + a]);
                q.add(0.5 * im[a * n + b] + 0.5 * im[b * n + a]);
            }
        }
        return 2 * q.value();
    }

    /**
     * @param b the other operator
     * @return the Kronecker product this ⊗ b (this is the left, slower-varying factor)
     */
    public Operator kron(Operator b) {
        Require.nonNull(b, "b");
        if ((long) n * b.n > MAX_DIM) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "b", "a product dimension ≤ " + MAX_DIM,
                    n + " × " + b.n + " = " + (long) n * b.n);
        }
        int m = b.n, nm = n * m;
        double[] r = new double[nm * nm], i = new double[nm * nm];
        for (int a1 = 0; a1 < n; a1++) {
            for (int a2 = 0; a2 < n; a2++) {
                double xr = re[a1 * n + a2], xi = im[a1 * n + a2];
                if (xr == 0 && xi == 0) {
                    continue;
                }
                for (int b1 = 0; b1 < m; b1++) {
                    int row = (a1 * m + b1) * nm + a2 * m;
                    for (int b2 = 0; b2 < m; b2++) {
                        double yr = b.re[b1 * m + b2], yi = b.im[b1 * m + b2];
                        r[row + b2] = xr * yr - xi * yi;
                        i[row + b2] = xr * yi + xi * yr;
                    }
                }
            }
        }
        return checked(nm, r, i, "b", "Kronecker product");
    }

    /**
     * The matrix exponential e^A by scaling and squaring with Padé approximants (Higham 2005). Works for any square
     * matrix, normal or not; 2×2 matrices use a closed form. Relative accuracy near 1e-15·cond for well-conditioned
     * problems.
     *
     * @return the matrix exponential e^A by scaling and squaring with Padé approximants (Higham 2005)
     * @throws InvalidInputException with reason NOT_FINITE if the result overflows
     */
    public Operator exp() {
        double[] r = new double[n * n], i = new double[n * n];
        Expm.exp(n, re, im, r, i);
        for (int k = 0; k < n * n; k++) {
            if (!Double.isFinite(r[k]) || !Double.isFinite(i[k])) {
                throw InvalidInputException.of(Reason.NOT_FINITE, "this", "an operator whose exponential is finite",
                        "overflow (‖A‖₁ = " + norm1() + ")");
            }
        }
        return new Operator(n, r, i);
    }

    /**
     * exp(−i t H) for this operator H, which must be Hermitian; computed from a Hermitian eigendecomposition so the
     * result is unitary to rounding for any t.
     *
     * @param t the time
     * @return exp(−i t H)
     * @throws InvalidInputException if this is not Hermitian (relative tolerance 1e-12) or t is not finite
     */
    public Operator expMinusI(double t) {
        Require.finite(t, "t");
        requireHermitian("this");
        double[] r = new double[n * n], i = new double[n * n];
        HermitianExp.expMinusI(n, re, im, t, r, i);
        return new Operator(n, r, i);
    }

    /**
     * Throws unless this operator is Hermitian to a relative tolerance of 1e-12.
     *
     * @param name the name
     * @return this operator
     */
    public Operator requireHermitian(String name) {
        double d = hermitianDefect();
        if (d > 1e-12 * Math.max(1.0, norm())) {
            throw InvalidInputException.of(Reason.NOT_HERMITIAN, name, "a Hermitian operator",
                    "‖A − A†‖_F = " + String.format(Locale.ROOT, "%.3g", d));
        }
        return this;
    }

    // ------------------------------------------------------------------ object

    /** Exact entrywise equality (use {@link #distance} for approximate comparison). */
    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof Operator)) {
            return false;
        }
        Operator b = (Operator) o;
        // entries are finite, so == is numeric equality; Arrays.equals would tell 0.0 from −0.0 (e.g. zero vs −1·zero)
        if (n != b.n) {
            return false;
        }
        for (int k = 0; k < n * n; k++) {
            if (re[k] != b.re[k] || im[k] != b.im[k]) {
                return false;
            }
        }
        return true;
    }

    @Override
    public int hashCode() {
        return 31 * (31 * n + zeroSafeHash(re)) + zeroSafeHash(im);
    }

    /** A hash consistent with numeric equality: 0.0 and −0.0 hash alike. */
    static int zeroSafeHash(double[] a) {
        int h = 1;
        for (double v : a) {
            long bits = Double.doubleToLongBits(v + 0.0);
            h = 31 * h + (int) (bits ^ (bits >>> 32));
        }
        return h;
    }

    /**
     * A readable matrix, one row per line, entries to 4 significant digits; large operators are abbreviated. Parts
     * below 1e-14 of the largest entry modulus print as 0 (rounding noise), so a matrix of tiny numbers still prints
     * its values.
     */
    @Override
    public String toString() {
        double tiny = noiseFloor(re, im);
        StringBuilder sb = new StringBuilder();
        sb.append("Operator ").append(n).append('x').append(n);
        int shown = Math.min(n, 8);
        for (int a = 0; a < shown; a++) {
            sb.append('\n').append(a == 0 ? "[[" : " [");
            for (int b = 0; b < shown; b++) {
                if (b > 0) {
                    sb.append(", ");
                }
                sb.append(formatEntry(re[a * n + b], im[a * n + b], tiny));
            }
            if (shown < n) {
                sb.append(", …");
            }
            sb.append(a == n - 1 ? "]]" : "]");
        }
        if (shown < n) {
            sb.append("\n  … (").append(n - shown).append(" more rows)]");
        }
        return sb.toString();
    }

    /** 1e-14 times the largest entry modulus: parts below it are shown as 0 by {@link #formatEntry}. */
    static double noiseFloor(double[] re, double[] im) {
        double max = 0;
        for (int k = 0; k < re.length; k++) {
            max = Math.max(max, Math.max(Math.abs(re[k]), Math.abs(im[k])));
        }
        return 1e-14 * max;
    }

    static String formatEntry(double r, double i, double tiny) {
        boolean hasR = Math.abs(r) > tiny, hasI = Math.abs(i) > tiny;
        if (!hasR && !hasI) {
            return "0";
        }
        if (!hasI) {
            return fmt(r);
        }
        if (!hasR) {
            return fmt(i) + "i";
        }
        return fmt(r) + (i < 0 ? " - " : " + ") + fmt(Math.abs(i)) + "i";
    }

    private static String fmt(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e6) {
            return Long.toString((long) v);
        }
        return String.format(Locale.ROOT, "%.4g", v);
    }

    // ------------------------------------------------------------------ added conveniences

    /**
     * The matrix power A^k for k ≥ 0 (A⁰ = I) by repeated squaring: about 2·log₂k products, each O(n³).
     *
     * @param k the index
     * @return the matrix power A^k for k ≥ 0 (A⁰ = I) by repeated squaring
     * @throws InvalidInputException if k is negative, or with reason NOT_FINITE if the result overflows
     */
    public Operator power(int k) {
        if (k < 0) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "k", "a non-negative exponent", k);
        }
        int len = n * n;
        double[] rr = new double[len], ri = new double[len], br = re.clone(), bi = im.clone();
        double[] tr = new double[len], ti = new double[len];
        for (int q = 0; q < n; q++) {
            rr[q * n + q] = 1;
        }
        for (int e = k; e > 0; e >>= 1) {
            if ((e & 1) != 0) {
                Dense.mul(n, rr, ri, br, bi, tr, ti);
                System.arraycopy(tr, 0, rr, 0, len);
                System.arraycopy(ti, 0, ri, 0, len);
            }
            if (e > 1) {
                Dense.mul(n, br, bi, br, bi, tr, ti);
                System.arraycopy(tr, 0, br, 0, len);
                System.arraycopy(ti, 0, bi, 0, len);
            }
        }
        for (int q = 0; q < len; q++) {
            if (!Double.isFinite(rr[q]) || !Double.isFinite(ri[q])) {
                throw InvalidInputException.of(Reason.NOT_FINITE, "k", "a power whose entries are finite",
                        k + " (overflow, ‖A‖₁ = " + norm1() + ")");
            }
        }
        return new Operator(n, rr, ri);
    }

    /**
     * Wraps a result after checking it is finite: finite inputs can still overflow, and the class promises finite
     * entries (an O(n²) scan, small next to the work that produced the result).
     */
    private static Operator checked(int n, double[] r, double[] i, String argument, String what) {
        for (int k = 0; k < r.length; k++) {
            if (!Double.isFinite(r[k]) || !Double.isFinite(i[k])) {
                throw InvalidInputException.of(Reason.NOT_FINITE, argument, "operands whose " + what + " is finite",
                        "an overflow at entry (" + k / n + ", " + k % n + ")");
            }
        }
        return new Operator(n, r, i);
    }

    /**
     * Whether a plain sum of squares can be trusted: finite (no overflow) and large enough that its dominant terms
     * were normal numbers (entries below ~1e-154 square to subnormals or zero).
     */
    static boolean inRange(double sumOfSquares) {
        // a zero sum may hide non-zero entries whose squares underflowed, so it takes the scaled pass too
        return sumOfSquares < Double.POSITIVE_INFINITY && sumOfSquares > 1e-290;
    }

    /**
     * sqrt(Σ re² + im²) without overflow or underflow: the plain sum when it is in range, else a scaled pass
     * (the scale-and-sum update of the reference BLAS dnrm2; S. J. Hammarling, 1979 — common practice).
     */
    static double safeNorm(double[] re, double[] im) {
        double s = 0;
        for (int k = 0; k < re.length; k++) {
            s += re[k] * re[k] + im[k] * im[k];
        }
        if (inRange(s)) {
            return Math.sqrt(s);
        }
        Ssq q = new Ssq();
        for (int k = 0; k < re.length; k++) {
            q.add(re[k]);
            q.add(im[k]);
        }
        return q.value();
    }

    /** Scaled sum of squares: value() = scale·sqrt(sum) = sqrt(Σ x²) for the numbers added. */
    static final class Ssq {
        private double scale = 0, sum = 1;

        void add(double x) {
            if (x != 0) {
                double a = Math.abs(x);
                if (scale < a) {
                    double r = scale / a;
                    sum = 1 + sum * r * r;
                    scale = a;
                } else {
                    double r = a / scale;
                    sum += r * r;
                }
            }
        }

        double value() {
            return scale * Math.sqrt(sum);
        }
    }

    private static void checkDim(int n, String name) {
        Require.positive(n, name);
        if (n > MAX_DIM) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, name, "a dimension ≤ " + MAX_DIM, n);
        }
    }
}
