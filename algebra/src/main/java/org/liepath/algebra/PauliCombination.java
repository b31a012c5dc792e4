package org.liepath.algebra;

import org.liepath.algebra.internal.SumSyntax;
import org.liepath.algebra.internal.Texts;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.internal.Require;

import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * An immutable real linear combination H = Σ c_P P of Pauli strings P of one length: a Hermitian operator on
 * {@link #qubits()} qubits, stored sparsely and exactly (no dense matrix).
 *
 * <p>Terms are kept in the canonical order of {@link PauliString#compareTo}; exact zero coefficients are dropped, so
 * two sums are {@link #equals equal} when they have the same strings with bit-identical coefficients. The zero sum
 * remembers its number of qubits.
 *
 * <p>Text form ({@link #parse}, {@link #toString}): {@code "0.5 XXI + YYI - 2 ZII"}; signs, decimals, exponents
 * ({@code 1e-3}), an optional {@code '*'} between coefficient and letters and any whitespace are accepted, repeated
 * strings are added. {@code toString} writes the shortest decimal that reads back to the same double, so
 * {@code parse(s.toString()).equals(s)}.
 *
 * <p>Cost: {@link #plus} and {@link #minus} are linear in the number of terms; {@link #commutator} is
 * O(|A|·|B|·q/64) plus hashing of the products.
 *
 * <p>Thread-safety: immutable.
 */
public final class PauliCombination {
    private final int qubits;
    private final PauliString[] strings;
    private final double[] coefs;

    private PauliCombination(int qubits, PauliString[] strings, double[] coefs) {
        this.qubits = qubits;
        this.strings = strings;
        this.coefs = coefs;
    }

    // ------------------------------------------------------------------ factories

    /**
     * Parses the text form, e.g. {@code "0.5 XXI + YYI - 2 ZII"} or {@code "-1e-3*xz + .5 ZZ"}.
     *
     * @param text the text to parse
     * @return the parsed sum
     * @throws InvalidInputException SYNTAX with the 0-based position of the first error; EMPTY for blank text;
     *                               NOT_FINITE for a coefficient that overflows a double; DIMENSION_MISMATCH if
     *                               strings of different lengths appear (naming the first offender)
     */
    public static PauliCombination parse(String text) {
        Require.nonNull(text, "text");
        List<SumSyntax.Term> terms = SumSyntax.parse(text);
        int q = terms.get(0).letters.length();
        Map<PauliString, Double> acc = new HashMap<>();
        for (SumSyntax.Term t : terms) {
            if (t.letters.length() != q) {
                throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "text",
                        "Pauli strings of one length (" + q + " letters, as the first term)",
                        "\"" + t.letters.substring(0, Math.min(t.letters.length(), 40))
                                + (t.letters.length() > 40 ? "…" : "") + "\" of " + t.letters.length()
                                + " letters at position " + t.position + " of \"" + Texts.clip(text, t.position) + "\"");
            }
            acc.merge(PauliString.of(t.letters), t.coefficient, Double::sum);
        }
        return fromMap(q, acc);
    }

    /**
     * @param p the Pauli string
     * @return the sum 1·P
     */
    public static PauliCombination of(PauliString p) {
        return of(1.0, p);
    }

    /**
     * @param c the coefficient
     * @param p the Pauli string
     * @return the sum c·P
     * @throws InvalidInputException for a null string or a non-finite coefficient
     */
    public static PauliCombination of(double c, PauliString p) {
        Require.nonNull(p, "p");
        Require.finite(c, "c");
        return c == 0 ? zero(p.qubits()) : new PauliCombination(p.qubits(), new PauliString[]{p}, new double[]{c});
    }

    /** 1·P for a string known to be non-null (no checks): the basis elements of string algebras. */
    static PauliCombination unit(PauliString p) {
        return new PauliCombination(p.qubits(), new PauliString[]{p}, UNIT_COEFFICIENT);
    }

    /** Shared by every {@link #unit} sum: coefficient arrays are never written after construction. */
    private static final double[] UNIT_COEFFICIENT = {1.0};

    /**
     * @param p the Pauli letters of the string (coefficient 1)
     * @return the sum 1·P for the letters of {@code p}, e.g. {@code of("XZI")}
     */
    public static PauliCombination of(String p) {
        return of(PauliString.of(p));
    }

    /**
     * The sum Σ c_k P_k of the given terms (repeated strings are added).
     *
     * @param terms the terms
     * @return the sum Σ c_k P_k of the given terms (repeated strings are added)
     * @throws InvalidInputException EMPTY for an empty map, NULL for a null key or value, NOT_FINITE for a NaN or
     *                               infinite coefficient, DIMENSION_MISMATCH for strings of different lengths
     */
    public static PauliCombination of(Map<PauliString, Double> terms) {
        Require.nonNull(terms, "terms");
        if (terms.isEmpty()) {
            throw InvalidInputException.of(Reason.EMPTY, "terms", "at least one term (use zero(qubits) for 0)", "{}");
        }
        int q = -1;
        Map<PauliString, Double> acc = new HashMap<>();
        for (Map.Entry<PauliString, Double> e : terms.entrySet()) {
            PauliString p = Require.nonNull(e.getKey(), "terms key");
            double c = Require.nonNull(e.getValue(), "terms[" + p + "]");
            if (!Double.isFinite(c)) {
                throw InvalidInputException.of(Reason.NOT_FINITE, "terms", "finite coefficients", c + " on " + p);
            }
            if (q < 0) {
                q = p.qubits();
            } else if (p.qubits() != q) {
                throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "terms", "strings on " + q + " qubits",
                        Texts.clip(p.toString(), 0) + " on " + p.qubits() + " qubits");
            }
            acc.merge(p, c, Double::sum);
        }
        return fromMap(q, acc);
    }

    /**
     * @param qubits the number of qubits
     * @return the zero sum on {@code qubits} qubits
     */
    public static PauliCombination zero(int qubits) {
        Require.positive(qubits, "qubits");
        return new PauliCombination(qubits, new PauliString[0], new double[0]);
    }

    /** Builds from a map whose keys have {@code q} qubits and finite values; drops exact zeros and sorts. */
    static PauliCombination fromMap(int q, Map<PauliString, Double> acc) {
        PauliString[] keys = new PauliString[acc.size()];
        int m = 0;
        for (Map.Entry<PauliString, Double> e : acc.entrySet()) {
            if (e.getValue() != 0.0) {
                keys[m++] = e.getKey();
            }
        }
        keys = Arrays.copyOf(keys, m);
        Arrays.sort(keys);
        double[] c = new double[m];
        for (int k = 0; k < m; k++) {
            c[k] = acc.get(keys[k]);
            if (!Double.isFinite(c[k])) {
                throw InvalidInputException.of(Reason.NOT_FINITE, "coefficient", "a finite sum of coefficients",
                        c[k] + " on " + keys[k]);
            }
        }
        return new PauliCombination(q, keys, c);
    }

    // ------------------------------------------------------------------ access

    /** @return the number of qubits of every string in the sum */
    public int qubits() {
        return qubits;
    }

    /** @return the number of terms with a non-zero coefficient */
    public int size() {
        return strings.length;
    }

    /** @return true when no term is left */
    public boolean isZero() {
        return strings.length == 0;
    }

    /** @return the terms as an unmodifiable map in canonical string order */
    public Map<PauliString, Double> terms() {
        Map<PauliString, Double> m = new LinkedHashMap<>();
        for (int k = 0; k < strings.length; k++) {
            m.put(strings[k], coefs[k]);
        }
        return Collections.unmodifiableMap(m);
    }

    /** @return the strings with non-zero coefficient, in canonical order */
    public List<PauliString> strings() {
        return List.of(strings);
    }

    /**
     * @param p the Pauli string
     * @return the coefficient of {@code p} (0 when absent)
     */
    public double coefficient(PauliString p) {
        Require.nonNull(p, "p");
        int k = Arrays.binarySearch(strings, p);
        return k >= 0 ? coefs[k] : 0.0;
    }

    /** @return the k-th string in canonical order */
    PauliString stringAt(int k) {
        return strings[k];
    }

    /** @return the k-th coefficient in canonical order */
    double coefficientAt(int k) {
        return coefs[k];
    }

    /** @return the largest |c_P|, 0 for the zero sum */
    public double maxAbsCoefficient() {
        double m = 0;
        for (double c : coefs) {
            m = Math.max(m, Math.abs(c));
        }
        return m;
    }

    /**
     * @return sqrt(Σ c_P²), the Hilbert–Schmidt norm divided by sqrt(2^q) (Pauli strings are orthogonal with
     * tr(PQ) = 2^q δ_PQ)
     */
    public double norm() {
        double s = 0;
        for (double c : coefs) {
            s += c * c;
        }
        return Math.sqrt(s);
    }

    // ------------------------------------------------------------------ algebra

    /**
     * @param b the other sum
     * @return this + b (exactly cancelling terms vanish)
     */
    public PauliCombination plus(PauliCombination b) {
        return combine(b, 1.0, "b");
    }

    /**
     * @param b the other sum
     * @return this − b
     */
    public PauliCombination minus(PauliCombination b) {
        return combine(b, -1.0, "b");
    }

    private PauliCombination combine(PauliCombination b, double sb, String name) {
        requireSame(b, name);
        PauliString[] ks = new PauliString[strings.length + b.strings.length];
        double[] cs = new double[ks.length];
        int i = 0, j = 0, m = 0;
        while (i < strings.length || j < b.strings.length) {
            int cmp = i == strings.length ? 1 : j == b.strings.length ? -1 : strings[i].compareTo(b.strings[j]);
            double c;
            PauliString k;
            if (cmp < 0) {
                k = strings[i];
                c = coefs[i++];
            } else if (cmp > 0) {
                k = b.strings[j];
                c = sb * b.coefs[j++];
            } else {
                k = strings[i];
                c = coefs[i++] + sb * b.coefs[j++];
            }
            if (c != 0.0) {
                if (!Double.isFinite(c)) {
                    throw InvalidInputException.of(Reason.NOT_FINITE, name, "a sum with finite coefficients",
                            c + " on " + k);
                }
                ks[m] = k;
                cs[m++] = c;
            }
        }
        return new PauliCombination(qubits, Arrays.copyOf(ks, m), Arrays.copyOf(cs, m));
    }

    /**
     * @param s the factor
     * @return s·this
     * @throws InvalidInputException for a non-finite factor or an overflowing product
     */
    public PauliCombination scale(double s) {
        Require.finite(s, "s");
        if (s == 0) {
            return zero(qubits);
        }
        double[] c = new double[coefs.length];
        for (int k = 0; k < c.length; k++) {
            c[k] = s * coefs[k];
            if (!Double.isFinite(c[k])) {
                throw InvalidInputException.of(Reason.NOT_FINITE, "s", "a factor that keeps coefficients finite",
                        s + " (times " + coefs[k] + " on " + strings[k] + ")");
            }
        }
        return new PauliCombination(qubits, strings, c);
    }

    /**
     * The bracket in the convention of dynamical Lie algebras: the Hermitian sum C = −i[A, B] for A = this and
     * B = {@code b}, so that [−iA, −iB] = −iC. Exact string by string: commuting pairs drop out and an anticommuting
     * pair gives [P, Q] = 2PQ = 2 i^k R with k odd, hence a term ±2 a_P b_Q R.
     *
     * @param b the other sum
     * @return the bracket in the convention of dynamical Lie algebras
     */
    public PauliCombination commutator(PauliCombination b) {
        requireSame(b, "b");
        Map<PauliString, Double> acc = new HashMap<>();
        for (int i = 0; i < strings.length; i++) {
            long[] ax = strings[i].xWords(), az = strings[i].zWords();
            for (int j = 0; j < b.strings.length; j++) {
                long[] bx = b.strings[j].xWords(), bz = b.strings[j].zWords();
                if (PauliString.symplectic(ax, az, bx, bz) == 0) {
                    continue;
                }
                // −i·2·i^k: k = 1 gives +2, k = 3 gives −2
                int k = PauliString.phase(ax, az, bx, bz);
                double c = (k == 1 ? 2.0 : -2.0) * coefs[i] * b.coefs[j];
                acc.merge(strings[i].times(b.strings[j]), c, Double::sum);
            }
        }
        return fromMap(qubits, acc);
    }

    private void requireSame(PauliCombination b, String name) {
        Require.nonNull(b, name);
        if (b.qubits != qubits) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, name, "a Pauli sum on " + qubits + " qubits",
                    "a sum on " + b.qubits + " qubits");
        }
    }

    // ------------------------------------------------------------------ conversions

    /**
     * @return the dense Hermitian matrix Σ c_P P (qubit 0 = leftmost Kronecker factor)
     * @throws InvalidInputException LIMIT_EXCEEDED beyond {@link Pauli#MAX_QUBITS} qubits
     */
    public Operator toOperator() {
        if (qubits > Pauli.MAX_QUBITS) {
            throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "this", "at most " + Pauli.MAX_QUBITS
                    + " qubits for a dense operator", qubits + " qubits");
        }
        int dim = 1 << qubits;
        Operator acc = Operator.zero(dim);
        for (int k = 0; k < strings.length; k++) {
            acc = acc.plus(strings[k].toOperator().scale(coefs[k]));
        }
        return acc;
    }

    /**
     * @return the text form accepted by {@link #parse}, e.g. {@code "0.5 XXI + YYI - 2 ZII"}; coefficients ±1 are
     * left out, integers up to 2^53 are written without a decimal point, others in Java's shortest round-trip form;
     * the zero sum is written {@code "0 II…I"}
     */
    @Override
    public String toString() {
        if (strings.length == 0) {
            return "0 " + PauliString.identity(qubits);
        }
        StringBuilder sb = new StringBuilder();
        for (int k = 0; k < strings.length; k++) {
            double c = coefs[k];
            if (k == 0) {
                if (c < 0) {
                    sb.append('-');
                }
            } else {
                sb.append(c < 0 ? " - " : " + ");
            }
            double a = Math.abs(c);
            if (a != 1.0) {
                sb.append(a == Math.rint(a) && a <= 0x1p53 ? Long.toString((long) a) : Double.toString(a)).append(' ');
            }
            sb.append(strings[k]);
        }
        return sb.toString();
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof PauliCombination)) {
            return false;
        }
        PauliCombination s = (PauliCombination) o;
        return s.qubits == qubits && Arrays.equals(s.strings, strings) && Arrays.equals(s.coefs, coefs);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(strings) + Arrays.hashCode(coefs) + qubits;
    }
}
