package org.liepath.benchmarks;

import org.liepath.algebra.LieAlgebra;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * Dense Lie closure of X_i, Y_i (every qubit) and Z_iZ_{i+1} (open chain), which generate su(2^n): dimension 63 for
 * n = 3 and 255 for n = 4 (F. Albertini, D. D'Alessandro, Linear Algebra Appl. 350, 213 (2002)).
 *
 * <p>{@code libraryClosure} is {@link LieAlgebra#generatedBy}; its comparator {@code plainDenseClosure} runs the same
 * bracket strategy (new element × generators) with plain dense {@link Operator} arithmetic and modified Gram–Schmidt
 * (two passes), as a straightforward implementation would. The ratio plain/library, read from the two scores of one
 * run, is the gain of the library's sparse-aware kernels.
 *
 * <p>Run: {@code java -jar benchmarks/target/benchmarks.jar DenseClosure -f 1 -wi 3 -i 5 -w 1 -r 1}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class DenseClosureBenchmark {
    @Param({"3", "4"})
    public int qubits;

    private List<Operator> gens;

    @Setup
    public void setup() {
        gens = new ArrayList<>();
        for (int i = 0; i < qubits; i++) {
            gens.add(Pauli.string(word(i, -1, 'X')));
            gens.add(Pauli.string(word(i, -1, 'Y')));
        }
        for (int i = 0; i + 1 < qubits; i++) {
            gens.add(Pauli.string(word(i, i + 1, 'Z')));
        }
        int d = 1 << qubits;
        if (libraryClosure() != d * d - 1 || plainDenseClosure() != d * d - 1) {
            throw new IllegalStateException("closure is not su(" + d + ")");
        }
    }

    private String word(int i, int j, char c) {
        char[] s = new char[qubits];
        Arrays.fill(s, 'I');
        s[i] = c;
        if (j >= 0) {
            s[j] = c;
        }
        return new String(s);
    }

    @Benchmark
    public int libraryClosure() {
        return LieAlgebra.generatedBy(gens).dimension();
    }

    @Benchmark
    public int plainDenseClosure() {
        List<Operator> basis = new ArrayList<>();
        for (Operator g : gens) {
            addIfNew(basis, g.timesI().scale(-1 / g.norm()));
        }
        int k0 = basis.size();
        for (int idx = 0; idx < basis.size(); idx++) {
            for (int g = 0; g < k0; g++) {
                addIfNew(basis, basis.get(g).commutator(basis.get(idx)));
            }
        }
        return basis.size();
    }

    private static void addIfNew(List<Operator> basis, Operator c) {
        for (int pass = 0; pass < 2; pass++) {
            for (Operator e : basis) {
                c = c.minus(e.scale(e.inner(c).getReal()));
            }
        }
        double r = c.norm();
        if (r > 1e-10) {
            basis.add(c.scale(1 / r));
        }
    }
}
