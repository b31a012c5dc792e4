package org.liepath.benchmarks;

import org.liepath.algebra.PauliString;
import org.liepath.algebra.PauliCombination;
import org.liepath.core.Operator;

import java.util.ArrayList;
import java.util.List;

/** Generator sets shared by the closure benchmarks. */
final class IsingChains {
    private IsingChains() {
    }

    /** Transverse-field Ising chain with separate terms, open: {X_i} ∪ {Z_iZ_{i+1}}; its algebra is so(2n). */
    static List<PauliCombination> perTerm(int n) {
        List<PauliCombination> g = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            g.add(PauliCombination.of(PauliString.single(n, i, 'X')));
        }
        for (int i = 0; i + 1 < n; i++) {
            g.add(PauliCombination.of(PauliString.identity(n).with(i, 'Z').with(i + 1, 'Z')));
        }
        return g;
    }

    /** The same terms as dense matrices. */
    static List<Operator> dense(List<PauliCombination> sums) {
        List<Operator> d = new ArrayList<>();
        for (PauliCombination s : sums) {
            d.add(s.toOperator());
        }
        return d;
    }
}
