package org.liepath.algebra;

import org.liepath.core.Operator;
import org.liepath.core.Pauli;

import java.util.ArrayList;
import java.util.List;

/** Explicit matrix generators of the classical compact algebras and of qubit-chain terms, for the tests. */
final class Gens {
    private Gens() {
    }

    static Operator unit(int n, int i, int j, double re, double im) {
        double[] r = new double[n * n], m = new double[n * n];
        r[i * n + j] = re;
        m[i * n + j] = im;
        return Operator.ofPlanar(n, r, m);
    }

    /** Anti-Hermitian basis of su(n): E_ij − E_ji, i(E_ij + E_ji) (i < j), i(E_kk − E_{k+1,k+1}). */
    static List<Operator> su(int n) {
        List<Operator> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                out.add(unit(n, i, j, 1, 0).plus(unit(n, j, i, -1, 0)));
                out.add(unit(n, i, j, 0, 1).plus(unit(n, j, i, 0, 1)));
            }
        }
        for (int k = 0; k + 1 < n; k++) {
            out.add(unit(n, k, k, 0, 1).plus(unit(n, k + 1, k + 1, 0, -1)));
        }
        return out;
    }

    /** Real antisymmetric basis of so(n): E_ij − E_ji. */
    static List<Operator> so(int n) {
        List<Operator> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                out.add(unit(n, i, j, 1, 0).plus(unit(n, j, i, -1, 0)));
            }
        }
        return out;
    }

    /**
     * Anti-Hermitian basis of the compact symplectic algebra sp(2m) = {X ∈ u(2m) : XᵀJ + JX = 0},
     * J = [[0, I], [−I, 0]]: matrices [[A, B], [−B̄, Ā]] with A ∈ u(m), B complex symmetric (dimension m(2m+1)).
     */
    static List<Operator> sp(int m) {
        int n = 2 * m;
        List<Operator> out = new ArrayList<>();
        for (int i = 0; i < m; i++) {
            for (int j = i; j < m; j++) {
                if (i < j) {
                    // A = E_ij − E_ji (real): Ā = A
                    out.add(unit(n, i, j, 1, 0).plus(unit(n, j, i, -1, 0))
                            .plus(unit(n, m + i, m + j, 1, 0)).plus(unit(n, m + j, m + i, -1, 0)));
                    // A = i(E_ij + E_ji): Ā = −A
                    out.add(unit(n, i, j, 0, 1).plus(unit(n, j, i, 0, 1))
                            .plus(unit(n, m + i, m + j, 0, -1)).plus(unit(n, m + j, m + i, 0, -1)));
                } else {
                    out.add(unit(n, i, i, 0, 1).plus(unit(n, m + i, m + i, 0, -1)));
                }
                // B = S real symmetric: blocks [[0, S], [−S, 0]]
                Operator s = unit(n, i, m + j, 1, 0).plus(unit(n, m + j, i, -1, 0));
                if (i != j) {
                    s = s.plus(unit(n, j, m + i, 1, 0)).plus(unit(n, m + i, j, -1, 0));
                }
                out.add(s);
                // B = iS: blocks [[0, iS], [iS, 0]]
                Operator t = unit(n, i, m + j, 0, 1).plus(unit(n, m + j, i, 0, 1));
                if (i != j) {
                    t = t.plus(unit(n, j, m + i, 0, 1)).plus(unit(n, m + i, j, 0, 1));
                }
                out.add(t);
            }
        }
        return out;
    }

    /** Hermitian i·X for anti-Hermitian X (so that the DLA convention gives back X). */
    static List<Operator> hermitian(List<Operator> antiHermitian) {
        List<Operator> out = new ArrayList<>();
        for (Operator x : antiHermitian) {
            out.add(x.timesI());
        }
        return out;
    }

    /** The Pauli string with the given letters at the given sites (others I) on n qubits. */
    static Operator pauli(int n, int[] sites, char[] letters) {
        char[] s = new char[n];
        java.util.Arrays.fill(s, 'I');
        for (int k = 0; k < sites.length; k++) {
            s[sites[k]] = letters[k];
        }
        return Pauli.string(new String(s));
    }

    /** Per-bond generators on an open chain: each two-letter word AB puts A on site i and B on site i+1. */
    static List<Operator> perBond(int n, String... words) {
        List<Operator> out = new ArrayList<>();
        for (int i = 0; i + 1 < n; i++) {
            for (String w : words) {
                char[] s = new char[n];
                java.util.Arrays.fill(s, 'I');
                s[i] = w.charAt(0);
                s[i + 1] = w.charAt(1);
                out.add(Pauli.string(new String(s)));
            }
        }
        return out;
    }

    /** X_i, Y_i on every qubit and Z_iZ_j on the given edges. */
    static List<Operator> localXYPlusZZ(int n, int[][] edges) {
        List<Operator> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add(pauli(n, new int[] {i}, new char[] {'X'}));
            out.add(pauli(n, new int[] {i}, new char[] {'Y'}));
        }
        for (int[] e : edges) {
            out.add(pauli(n, e, new char[] {'Z', 'Z'}));
        }
        return out;
    }

    static int[][] path(int n, int edges) {
        int[][] p = new int[edges][];
        for (int i = 0; i < edges; i++) {
            p[i] = new int[] {i, i + 1};
        }
        return p;
    }

    /** Transverse-field Ising terms X_i (each qubit) and Z_iZ_{i+1} (each bond), open chain, separate generators. */
    static List<Operator> ising(int n) {
        List<Operator> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add(pauli(n, new int[] {i}, new char[] {'X'}));
        }
        for (int i = 0; i + 1 < n; i++) {
            out.add(pauli(n, new int[] {i, i + 1}, new char[] {'Z', 'Z'}));
        }
        return out;
    }
}
