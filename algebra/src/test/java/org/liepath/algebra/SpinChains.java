package org.liepath.algebra;

import java.util.ArrayList;
import java.util.List;

/** Generator sets of qubit chains for the closure tests (test support). */
final class SpinChains {
    private SpinChains() {
    }

    /**
     * Per-bond generators: for each two-letter pattern "AB", the string with A on site i and B on site i+1 for every
     * bond separately (i = 0 … n−2, plus the bond (n−1, 0) when periodic); "XI" and "IX" give one-site terms.
     */
    static List<PauliCombination> perBond(int n, boolean periodic, String... patterns) {
        List<PauliCombination> g = new ArrayList<>();
        int bonds = periodic ? n : n - 1;
        for (String ab : patterns) {
            for (int i = 0; i < bonds; i++) {
                PauliString p = PauliString.identity(n).with(i, ab.charAt(0)).with((i + 1) % n, ab.charAt(1));
                g.add(PauliCombination.of(p));
            }
        }
        return g;
    }

    /** Transverse-field Ising chain with separate terms: {X_i} ∪ {Z_i Z_{i+1}} on an open chain. */
    static List<PauliCombination> isingPerTerm(int n) {
        List<PauliCombination> g = new ArrayList<>(perBond(n, false, "ZZ"));
        for (int i = 0; i < n; i++) {
            g.add(PauliCombination.of(PauliString.single(n, i, 'X')));
        }
        return g;
    }

    /** The two translation-invariant sums Σ_i Z_i Z_{i+1} (periodic when asked) and Σ_i X_i. */
    static List<PauliCombination> isingSummed(int n, boolean periodic) {
        PauliCombination zz = PauliCombination.zero(n), x = PauliCombination.zero(n);
        for (PauliCombination s : perBond(n, periodic, "ZZ")) {
            zz = zz.plus(s);
        }
        for (int i = 0; i < n; i++) {
            x = x.plus(PauliCombination.of(PauliString.single(n, i, 'X')));
        }
        return List.of(zz, x);
    }
}
