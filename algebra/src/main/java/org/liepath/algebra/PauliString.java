package org.liepath.algebra;

import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.internal.Require;

import org.liepath.algebra.internal.Texts;

import java.util.Arrays;

/**
 * An immutable tensor product of single-qubit Pauli matrices on any number of qubits, without a phase: the Hermitian
 * operator σ_{a_0} ⊗ σ_{a_1} ⊗ … with a_q ∈ {I, X, Y, Z}.
 *
 * <p>Convention: letter 0 (the leftmost letter of {@link #toString()}) acts on qubit 0, the leftmost Kronecker factor,
 * exactly as {@link Pauli#string(String)}.
 *
 * <p>Storage is bit-packed: qubit q is bit {@code q % 64} of word {@code q / 64} of two masks x and z, with
 * I = (0,0), X = (1,0), Z = (0,1), Y = (1,1); as an operator the string equals i^{|x∧z|} X^x Z^z. Products, the
 * commutation test, equality and hashing therefore cost O(q/64) word operations.
 *
 * <p>Canonical order ({@link #compareTo}): strings of fewer qubits first, then lexicographic on the letters from
 * qubit 0, with I &lt; X &lt; Y &lt; Z.
 *
 * <p>Thread-safety: immutable.
 */
public final class PauliString implements Comparable<PauliString> {
    private final int qubits;
    private final long[] x;
    private final long[] z;
    /** 0 until first asked for (a benign race: every thread computes the same value); closures build many strings
     * that are never hashed */
    private int hash;

    PauliString(int qubits, long[] x, long[] z) {
        this.qubits = qubits;
        this.x = x;
        this.z = z;
    }

    static int words(int qubits) {
        return (qubits + 63) >>> 6;
    }

    // ------------------------------------------------------------------ factories

    /**
     * Parses letters I, X, Y, Z (upper or lower case), leftmost = qubit 0.
     *
     * @param letters the Pauli letters, one per qubit
     * @return the Pauli string
     * @throws InvalidInputException SYNTAX naming the position of the first bad letter; EMPTY for ""
     */
    public static PauliString of(String letters) {
        Require.nonNull(letters, "letters");
        if (letters.isEmpty()) {
            throw InvalidInputException.of(Reason.EMPTY, "letters", "a Pauli string of letters I, X, Y, Z", "\"\"");
        }
        int q = letters.length();
        long[] x = new long[words(q)], z = new long[words(q)];
        for (int k = 0; k < q; k++) {
            char c = letters.charAt(k);
            int code = letterCode(c);
            if (code < 0) {
                throw InvalidInputException.of(Reason.SYNTAX, "letters", "letters I, X, Y, Z",
                        "'" + c + "' at position " + k + " of \"" + Texts.clip(letters, k) + "\"");
            }
            setLetter(x, z, k, code);
        }
        return new PauliString(q, x, z);
    }

    /**
     * @param qubits the number of qubits
     * @return the identity string on {@code qubits} qubits
     */
    public static PauliString identity(int qubits) {
        Require.positive(qubits, "qubits");
        return new PauliString(qubits, new long[words(qubits)], new long[words(qubits)]);
    }

    /**
     * @param qubits the number of qubits
     * @param qubit the qubit index (0 is the leftmost factor)
     * @param letter the Pauli letter, one of I, X, Y, Z
     * @return the string with {@code letter} on {@code qubit} and I elsewhere, e.g. {@code single(5, 2, 'Z')} = IIZII
     * @throws InvalidInputException for a non-positive size, a qubit outside [0, qubits) or a bad letter
     */
    public static PauliString single(int qubits, int qubit, char letter) {
        return identity(qubits).with(qubit, letter);
    }

    /**
     * @param qubit the qubit index (0 is the leftmost factor)
     * @param letter the Pauli letter, one of I, X, Y, Z
     * @return a copy of this string with {@code letter} on {@code qubit}
     * @throws InvalidInputException for a qubit outside [0, qubits()) or a letter other than I, X, Y, Z
     */
    public PauliString with(int qubit, char letter) {
        Require.index(qubit, qubits, "qubit");
        int code = letterCode(letter);
        if (code < 0) {
            throw InvalidInputException.of(Reason.SYNTAX, "letter", "one of I, X, Y, Z", "'" + letter + "'");
        }
        long[] nx = x.clone(), nz = z.clone();
        setLetter(nx, nz, qubit, code);
        return new PauliString(qubits, nx, nz);
    }

    /** Letter code: I=0, X=1, Y=2, Z=3, or −1 for anything else. */
    static int letterCode(char c) {
        switch (c) {
            case 'I': case 'i': return 0;
            case 'X': case 'x': return 1;
            case 'Y': case 'y': return 2;
            case 'Z': case 'z': return 3;
            default: return -1;
        }
    }

    private static void setLetter(long[] x, long[] z, int q, int code) {
        long bit = 1L << (q & 63);
        int w = q >>> 6;
        x[w] &= ~bit;
        z[w] &= ~bit;
        if (code == 1 || code == 2) {
            x[w] |= bit;
        }
        if (code == 2 || code == 3) {
            z[w] |= bit;
        }
    }

    // ------------------------------------------------------------------ access

    /** @return the number of qubits (letters) */
    public int qubits() {
        return qubits;
    }

    /**
     * @param qubit the qubit index (0 is the leftmost factor)
     * @return the letter I, X, Y or Z on {@code qubit}
     */
    public char letter(int qubit) {
        Require.index(qubit, qubits, "qubit");
        return "IXYZ".charAt(code(qubit));
    }

    private int code(int q) {
        int w = q >>> 6, b = q & 63;
        int xb = (int) (x[w] >>> b) & 1, zb = (int) (z[w] >>> b) & 1;
        return xb == 0 ? (zb == 0 ? 0 : 3) : (zb == 0 ? 1 : 2);
    }

    /** @return the number of non-identity letters */
    public int weight() {
        int w = 0;
        for (int k = 0; k < x.length; k++) {
            w += Long.bitCount(x[k] | z[k]);
        }
        return w;
    }

    /** @return the qubits carrying a non-identity letter, in increasing order */
    public int[] support() {
        int[] s = new int[weight()];
        int m = 0;
        for (int k = 0; k < x.length; k++) {
            long bits = x[k] | z[k];
            while (bits != 0) {
                s[m++] = (k << 6) + Long.numberOfTrailingZeros(bits);
                bits &= bits - 1;
            }
        }
        return s;
    }

    /** @return true for the all-identity string */
    public boolean isIdentity() {
        for (int k = 0; k < x.length; k++) {
            if ((x[k] | z[k]) != 0) {
                return false;
            }
        }
        return true;
    }

    // ------------------------------------------------------------------ algebra

    /**
     * @param b the other string
     * @return true if this string and {@code b} commute (an even number of qubits where both letters are
     * non-identity and different)
     * @throws InvalidInputException if the strings have different lengths
     */
    public boolean commutes(PauliString b) {
        requireSame(b);
        return symplectic(x, z, b.x, b.z) == 0;
    }

    /**
     * @param b the other string
     * @return true if this string and {@code b} anticommute; see {@link #commutes}
     */
    public boolean anticommutes(PauliString b) {
        return !commutes(b);
    }

    /** The symplectic form ⟨a, b⟩ mod 2: 0 if the strings commute, 1 if they anticommute. */
    static int symplectic(long[] ax, long[] az, long[] bx, long[] bz) {
        long acc = 0;
        for (int k = 0; k < ax.length; k++) {
            acc ^= (ax[k] & bz[k]) ^ (az[k] & bx[k]);
        }
        return Long.bitCount(acc) & 1;
    }

    /**
     * The string part of the operator product: this·b = i^k · (this.times(b)) with k = {@link #phaseExponent(PauliString)}.
     *
     * @param b the other string
     * @return the string part of the operator product
     * @throws InvalidInputException if the strings have different lengths
     */
    public PauliString times(PauliString b) {
        requireSame(b);
        long[] nx = new long[x.length], nz = new long[x.length];
        for (int k = 0; k < x.length; k++) {
            nx[k] = x[k] ^ b.x[k];
            nz[k] = z[k] ^ b.z[k];
        }
        return new PauliString(qubits, nx, nz);
    }

    /**
     * The phase of the product: the k in {0, 1, 2, 3} with this·b = i^k · {@link #times}(b), exact for any length.
     * k is odd exactly when the strings anticommute.
     *
     * @param b the other string
     * @return the phase of the product
     * @throws InvalidInputException if the strings have different lengths
     */
    public int phaseExponent(PauliString b) {
        requireSame(b);
        return phase(x, z, b.x, b.z);
    }

    /**
     * Phase exponent of (i^{y_a} X^{xa} Z^{za})(i^{y_b} X^{xb} Z^{zb}): moving Z^{za} past X^{xb} gives
     * (−1)^{|za∧xb|}, and the product's own Y count is divided out: k = y_a + y_b − y_ab + 2|za∧xb| (mod 4).
     */
    static int phase(long[] ax, long[] az, long[] bx, long[] bz) {
        int k = 0;
        for (int w = 0; w < ax.length; w++) {
            long cx = ax[w] ^ bx[w], cz = az[w] ^ bz[w];
            k += Long.bitCount(ax[w] & az[w]) + Long.bitCount(bx[w] & bz[w]) - Long.bitCount(cx & cz)
                    + 2 * Long.bitCount(az[w] & bx[w]);
        }
        return k & 3;
    }

    private void requireSame(PauliString b) {
        Require.nonNull(b, "b");
        if (b.qubits != qubits) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "b", "a Pauli string on " + qubits + " qubits",
                    b.qubits + " qubits (" + Texts.clip(b.toString(), 0) + ")");
        }
    }

    // ------------------------------------------------------------------ package access for the closure kernels

    long[] xWords() {
        return x;
    }

    long[] zWords() {
        return z;
    }

    static PauliString ofWords(int qubits, long[] x, long[] z) {
        return new PauliString(qubits, x, z);
    }

    // ------------------------------------------------------------------ conversions

    /**
     * @return the dense 2^q × 2^q matrix, via {@link Pauli#string(String)}
     * @throws InvalidInputException LIMIT_EXCEEDED beyond {@link Pauli#MAX_QUBITS} qubits
     */
    public Operator toOperator() {
        return Pauli.string(toString());
    }

    /** @return the letters, qubit 0 first, e.g. "XZI" */
    @Override
    public String toString() {
        char[] c = new char[qubits];
        for (int q = 0; q < qubits; q++) {
            c[q] = "IXYZ".charAt(code(q));
        }
        return new String(c);
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof PauliString)) {
            return false;
        }
        PauliString p = (PauliString) o;
        return p.qubits == qubits && Arrays.equals(p.x, x) && Arrays.equals(p.z, z);
    }

    @Override
    public int hashCode() {
        int h = hash;
        if (h == 0) {
            h = 31 * Arrays.hashCode(x) + Arrays.hashCode(z) + qubits * 0x9E3779B9;
            hash = h;
        }
        return h;
    }

    /** Canonical order: fewer qubits first, then letters from qubit 0 with I &lt; X &lt; Y &lt; Z. */
    @Override
    public int compareTo(PauliString b) {
        if (qubits != b.qubits) {
            return Integer.compare(qubits, b.qubits);
        }
        for (int w = 0; w < x.length; w++) {
            long diff = (x[w] ^ b.x[w]) | (z[w] ^ b.z[w]);
            if (diff != 0) {
                int q = (w << 6) + Long.numberOfTrailingZeros(diff);
                return Integer.compare(code(q), b.code(q));
            }
        }
        return 0;
    }
}
