package org.liepath.algebra.internal;

import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;

import java.util.ArrayList;
import java.util.List;

/**
 * A hand-written scanner for the text form of Pauli sums. Grammar (whitespace allowed between all tokens):
 * <pre>
 *   sum    := [sign] term ( sign term )*
 *   term   := [number ['*']] letters
 *   sign   := '+' | '-' | '−' (U+2212)
 *   number := digits ['.' [digits]] [exponent] | '.' digits [exponent]
 *   exponent := ('e' | 'E') [sign] digits
 *   letters  := one or more of I X Y Z (either case)
 * </pre>
 * It runs in one pass over the text, so it cannot hang; every refusal is a SYNTAX (or NOT_FINITE for a coefficient
 * that overflows) {@link InvalidInputException} naming the 0-based position. Not part of the public API.
 *
 * <p>Thread-safe: {@link #parse} uses a fresh scanner per call; scanners are never shared.
 */
public final class SumSyntax {
    /** One parsed term: its letters, its signed coefficient and where the letters start in the text. */
    public static final class Term {
        public final String letters;
        public final double coefficient;
        public final int position;

        Term(String letters, double coefficient, int position) {
            this.letters = letters;
            this.coefficient = coefficient;
            this.position = position;
        }
    }

    private final String s;
    private int p;

    private SumSyntax(String s) {
        this.s = s;
    }

    /** Parses {@code text}; the list is never empty. */
    public static List<Term> parse(String text) {
        return new SumSyntax(text).sum();
    }

    private List<Term> sum() {
        List<Term> terms = new ArrayList<>();
        skip();
        if (p == s.length()) {
            throw InvalidInputException.of(Reason.EMPTY, "text", "a Pauli sum such as \"0.5 XX + YY - 2 ZI\"",
                    "\"" + Texts.clip(s, 0) + "\"");
        }
        int sign = 1;
        if (isSign(peek())) {
            sign = next() == '+' ? 1 : -1;
            skip();
        }
        terms.add(term(sign));
        skip();
        while (p < s.length()) {
            char c = peek();
            if (!isSign(c)) {
                throw error("'+' or '-' between terms");
            }
            sign = next() == '+' ? 1 : -1;
            skip();
            terms.add(term(sign));
            skip();
        }
        return terms;
    }

    private Term term(int sign) {
        double coef = 1;
        int start = p;
        if (p < s.length() && (Character.isDigit(peek()) || peek() == '.')) {
            coef = number();
            skip();
            if (p < s.length() && peek() == '*') {
                p++;
                skip();
            }
        }
        if (p >= s.length() || code(peek()) < 0) {
            throw error(start == p ? "a coefficient or Pauli letters I, X, Y, Z" : "Pauli letters I, X, Y, Z");
        }
        int from = p;
        while (p < s.length() && code(peek()) >= 0) {
            p++;
        }
        if (p < s.length() && Character.isLetterOrDigit(peek())) {
            throw error("Pauli letters I, X, Y, Z");
        }
        return new Term(s.substring(from, p).toUpperCase(java.util.Locale.ROOT), sign * coef, from);
    }

    private double number() {
        int from = p;
        boolean digits = false;
        while (p < s.length() && Character.isDigit(peek())) {
            p++;
            digits = true;
        }
        if (p < s.length() && peek() == '.') {
            p++;
            while (p < s.length() && Character.isDigit(peek())) {
                p++;
                digits = true;
            }
        }
        if (!digits) {
            throw error("digits in a number");
        }
        if (p < s.length() && (peek() == 'e' || peek() == 'E')) {
            p++;
            if (p < s.length() && (peek() == '+' || peek() == '-')) {
                p++;
            }
            if (p >= s.length() || !Character.isDigit(peek())) {
                throw error("digits of an exponent");
            }
            while (p < s.length() && Character.isDigit(peek())) {
                p++;
            }
        }
        // only ASCII digits reach here (Character.isDigit also admits other scripts; refuse those first)
        String lit = s.substring(from, p);
        for (int k = 0; k < lit.length(); k++) {
            char c = lit.charAt(k);
            if (c > 127) {
                p = from + k;
                throw error("an ASCII digit");
            }
        }
        double v = Double.parseDouble(lit);
        if (!Double.isFinite(v)) {
            throw InvalidInputException.of(Reason.NOT_FINITE, "text", "a finite coefficient",
                    lit + " at position " + from + " of \"" + Texts.clip(s, from) + "\"");
        }
        return v;
    }

    private static int code(char c) {
        return "IXYZixyz".indexOf(c);
    }

    private static boolean isSign(char c) {
        return c == '+' || c == '-' || c == '\u2212';
    }

    private char peek() {
        return s.charAt(p);
    }

    private char next() {
        char c = s.charAt(p++);
        return c == '\u2212' ? '-' : c;
    }

    private void skip() {
        while (p < s.length() && Character.isWhitespace(s.charAt(p))) {
            p++;
        }
    }

    private InvalidInputException error(String expected) {
        String seen = p < s.length() ? "'" + s.charAt(p) + "' at position " + p : "end of text at position " + p;
        return InvalidInputException.of(Reason.SYNTAX, "text", expected, seen + " of \"" + Texts.clip(s, p) + "\"");
    }
}
