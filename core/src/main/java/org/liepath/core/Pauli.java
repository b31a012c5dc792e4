package org.liepath.core;

import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

/**
 * Pauli matrices and Pauli strings as dense operators.
 *
 * <p>Convention: in {@code string("XZI")} the first letter acts on qubit 0, which is the leftmost (most significant)
 * Kronecker factor: {@code X ⊗ Z ⊗ I}. Letters are I, X, Y, Z (upper or lower case). σz = diag(1, −1), so |0⟩ is
 * its +1 eigenvector.
 *
 * <p>Cost: a string of q letters builds a dense 2^q × 2^q matrix; at most {@value #MAX_QUBITS} qubits. For many
 * qubits use the exact Pauli-string algebra of the algebra module. Thread-safety: stateless.
 */
public final class Pauli {
    /** Largest number of qubits for which a dense Pauli string is built. */
    public static final int MAX_QUBITS = 12;

    private Pauli() {
    }

    /** @return the 2×2 identity */
    public static Operator i() {
        return Operator.identity(2);
    }

    /** @return σx */
    public static Operator x() {
        return Operator.real(new double[][]{{0, 1}, {1, 0}});
    }

    /** @return σy */
    public static Operator y() {
        return Operator.of(new double[][]{{0, 0}, {0, 0}}, new double[][]{{0, -1}, {1, 0}});
    }

    /** @return σz */
    public static Operator z() {
        return Operator.diagonal(1, -1);
    }

    /**
     * @param c the letter I, X, Y or Z
     * @return the 2×2 Pauli matrix for one letter I, X, Y or Z
     */
    public static Operator letter(char c) {
        switch (Character.toUpperCase(c)) {
            case 'I': return i();
            case 'X': return x();
            case 'Y': return y();
            case 'Z': return z();
            default:
                throw InvalidInputException.of(Reason.SYNTAX, "letter", "one of I, X, Y, Z", "'" + c + "'");
        }
    }

    /**
     * The dense Kronecker product of the letters of {@code s}, leftmost letter = qubit 0 = leftmost factor.
     *
     * @param s the Pauli letters, leftmost = qubit 0
     * @return the dense Kronecker product of the letters of {@code s}, leftmost letter = qubit 0 = leftmost factor
     * @throws InvalidInputException for an empty string, a letter other than I/X/Y/Z (the message gives its
     *                               position), or more than {@value #MAX_QUBITS} letters
     */
    public static Operator string(String s) {
        Require.nonNull(s, "s");
        if (s.isEmpty()) {
            throw InvalidInputException.of(Reason.EMPTY, "s", "a Pauli string of letters I, X, Y, Z", "\"\"");
        }
        if (s.length() > MAX_QUBITS) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "s", "at most " + MAX_QUBITS + " letters for a dense operator",
                    s.length() + " letters");
        }
        for (int k = 0; k < s.length(); k++) {
            char c = Character.toUpperCase(s.charAt(k));
            if (c != 'I' && c != 'X' && c != 'Y' && c != 'Z') {
                throw InvalidInputException.of(Reason.SYNTAX, "s", "letters I, X, Y, Z",
                        "'" + s.charAt(k) + "' at position " + k + " of \"" + s + "\"");
            }
        }
        // a Pauli string is a monomial matrix: row r has one entry at column r XOR xmask with a phase
        int q = s.length(), dim = 1 << q;
        int xmask = 0, zmask = 0, ny = 0;
        for (int k = 0; k < q; k++) {
            char c = Character.toUpperCase(s.charAt(k));
            int bit = 1 << (q - 1 - k);
            if (c == 'X' || c == 'Y') {
                xmask |= bit;
            }
            if (c == 'Z' || c == 'Y') {
                zmask |= bit;
            }
            if (c == 'Y') {
                ny++;
            }
        }
        double[] re = new double[dim * dim], im = new double[dim * dim];
        for (int col = 0; col < dim; col++) {
            int row = col ^ xmask;
            // Y = i X Z: entry = i^ny * (-1)^{popcount(col & zmask)}
            int sign = (Integer.bitCount(col & zmask) & 1) == 0 ? 1 : -1;
            int phase = ny & 3;
            double pr = phase == 0 ? 1 : phase == 2 ? -1 : 0;
            double pi = phase == 1 ? 1 : phase == 3 ? -1 : 0;
            re[row * dim + col] = sign * pr;
            im[row * dim + col] = sign * pi;
        }
        return new Operator(dim, re, im);
    }
}
