package org.liepath.core;

import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

import java.util.Arrays;

/**
 * A composite Hilbert space C^{d_0} ⊗ C^{d_1} ⊗ … with subsystem 0 the leftmost (slowest-varying) Kronecker factor,
 * the same order as Pauli strings.
 *
 * <p>Immutable and thread-safe. The total dimension is limited to {@value #MAX_DIM}.
 */
public final class HilbertSpace {
    /** Largest total dimension accepted for dense operators. */
    public static final int MAX_DIM = 4096;

    private final int[] dims;
    private final int total;

    private HilbertSpace(int[] dims, int total) {
        this.dims = dims;
        this.total = total;
    }

    /**
     * @param dims the subsystem dimensions, each ≥ 1, product ≤ {@value #MAX_DIM}
     * @return the composite space
     */
    public static HilbertSpace of(int... dims) {
        Require.nonNull(dims, "dims");
        if (dims.length == 0) {
            throw InvalidInputException.of(Reason.EMPTY, "dims", "at least one subsystem dimension", "none");
        }
        long t = 1;
        for (int k = 0; k < dims.length; k++) {
            if (dims[k] < 1) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "dims", "positive dimensions",
                        dims[k] + " at position " + k);
            }
            t *= dims[k];
            if (t > MAX_DIM) {
                throw InvalidInputException.of(Reason.LIMIT_EXCEEDED, "dims", "a total dimension ≤ " + MAX_DIM,
                        Arrays.toString(dims));
            }
        }
        return new HilbertSpace(dims.clone(), (int) t);
    }

    /** @return the total dimension Π d_k */
    public int dim() {
        return total;
    }

    /** @return the number of subsystems */
    public int size() {
        return dims.length;
    }

    /**
     * @param k the index
     * @return the dimension of subsystem k
     */
    public int dim(int k) {
        return dims[Require.index(k, dims.length, "k")];
    }

    /**
     * @param op the operator
     * @param k the index
     * @return I ⊗ … ⊗ op (at position k) ⊗ … ⊗ I
     */
    public Operator embed(Operator op, int k) {
        Require.nonNull(op, "op");
        Require.index(k, dims.length, "k");
        Require.sameDim(dims[k], op.dim(), "op");
        Operator out = null;
        for (int s = 0; s < dims.length; s++) {
            Operator f = s == k ? op : Operator.identity(dims[s]);
            out = out == null ? f : out.kron(f);
        }
        return out;
    }

    /**
     * @param a the operator
     * @param i the index
     * @param b the other operator
     * @param j the index
     * @return a ⊗ b acting on subsystems i and j (i ≠ j), identity elsewhere
     */
    public Operator embed(Operator a, int i, Operator b, int j) {
        Require.nonNull(a, "a");
        Require.nonNull(b, "b");
        Require.index(i, dims.length, "i");
        Require.index(j, dims.length, "j");
        if (i == j) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "j", "a subsystem different from i = " + i, j);
        }
        Require.sameDim(dims[i], a.dim(), "a");
        Require.sameDim(dims[j], b.dim(), "b");
        Operator out = null;
        for (int s = 0; s < dims.length; s++) {
            Operator f = s == i ? a : s == j ? b : Operator.identity(dims[s]);
            out = out == null ? f : out.kron(f);
        }
        return out;
    }

    /**
     * @param ops the operators
     * @return the Kronecker product of one operator per subsystem, in order
     */
    public Operator product(Operator... ops) {
        Require.nonNull(ops, "ops");
        if (ops.length != dims.length) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "ops", dims.length + " operators", ops.length);
        }
        Operator out = null;
        for (int s = 0; s < ops.length; s++) {
            Require.nonNull(ops[s], "ops[" + s + "]");
            Require.sameDim(dims[s], ops[s].dim(), "ops[" + s + "]");
            out = out == null ? ops[s] : out.kron(ops[s]);
        }
        return out;
    }

    /**
     * @param levels the number of levels of each subsystem
     * @return the product basis vector |k_0 k_1 …⟩
     */
    public StateVector basis(int... levels) {
        Require.nonNull(levels, "levels");
        if (levels.length != dims.length) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "levels", dims.length + " levels", levels.length);
        }
        int idx = 0;
        for (int s = 0; s < dims.length; s++) {
            Require.index(levels[s], dims[s], "levels[" + s + "]");
            idx = idx * dims[s] + levels[s];
        }
        return StateVector.unit(total, idx);
    }

    @Override
    public String toString() {
        return "HilbertSpace" + Arrays.toString(dims) + " (dimension " + total + ")";
    }

    // ------------------------------------------------------------------ added conveniences

    /** @return the subsystem dimensions (a copy) */
    public int[] dims() {
        return dims.clone();
    }

    /**
     * The partial trace over the listed subsystems: for ρ on this space, the operator on the remaining subsystems (in
     * their original order) with ⟨k|tr_S ρ|l⟩ = Σ_s ⟨k s|ρ|l s⟩. Tracing out every subsystem gives the 1×1 operator
     * (tr ρ). Works for any operator, not only density matrices: tr_S(A ⊗ B) = A·tr B. Cost O(dim²).
     *
     * @param op     an operator of dimension {@link #dim()}
     * @param traced distinct subsystem indices to trace out (none: op is returned unchanged)
     * @return the partial trace over the listed subsystems
     * @throws InvalidInputException for a null or wrongly sized operator, or an index out of range or repeated
     */
    public Operator partialTrace(Operator op, int... traced) {
        Require.nonNull(op, "op");
        Require.nonNull(traced, "traced");
        Require.sameDim(total, op.dim(), "op");
        boolean[] out = distinct(traced, "traced");
        int keptDim = 1;
        for (int s = 0; s < dims.length; s++) {
            if (!out[s]) {
                keptDim *= dims[s];
            }
        }
        int[] gone = new int[total], kept = new int[total];
        split(traced, out, gone, kept);
        double[] re = new double[keptDim * keptDim], im = new double[keptDim * keptDim];
        for (int r = 0; r < total; r++) {
            for (int c = 0; c < total; c++) {
                if (gone[r] == gone[c]) {
                    int dst = kept[r] * keptDim + kept[c];
                    re[dst] += op.re[r * total + c];
                    im[dst] += op.im[r * total + c];
                }
            }
        }
        return new Operator(keptDim, re, im);
    }

    /**
     * Embeds an operator acting jointly on several subsystems, listed in the order of its own Kronecker factors:
     * {@code embed(cnot, 2, 0)} applies a two-qubit gate with control on subsystem 2 and target on subsystem 0, and
     * the identity elsewhere. With the subsystems in ascending order and a product operator this equals the
     * Kronecker product of the factors in place. Cost O(dim²).
     *
     * @param op         an operator of dimension Π d_s over the listed subsystems
     * @param subsystems distinct subsystem indices, at least one
     * @return the operator on the whole space
     * @throws InvalidInputException for a null or wrongly sized operator, or indices that are missing, out of range
     *                               or repeated
     */
    public Operator embed(Operator op, int... subsystems) {
        Require.nonNull(op, "op");
        Require.nonNull(subsystems, "subsystems");
        if (subsystems.length == 0) {
            throw InvalidInputException.of(Reason.EMPTY, "subsystems", "at least one subsystem index", "none");
        }
        boolean[] used = distinct(subsystems, "subsystems");
        int opDim = 1;
        for (int q : subsystems) {
            opDim *= dims[q];
        }
        Require.sameDim(opDim, op.dim(), "op");
        int[] inner = new int[total], outer = new int[total];
        split(subsystems, used, inner, outer);
        double[] re = new double[total * total], im = new double[total * total];
        for (int r = 0; r < total; r++) {
            for (int c = 0; c < total; c++) {
                if (outer[r] == outer[c]) {
                    int src = inner[r] * opDim + inner[c];
                    re[r * total + c] = op.re[src];
                    im[r * total + c] = op.im[src];
                }
            }
        }
        return new Operator(total, re, im);
    }

    /**
     * Splits every basis index r (mixed radix, subsystem 0 most significant) into listed[r], the index over the
     * subsystems in {@code order} (in that order), and rest[r], the index over the others (in ascending order).
     */
    private void split(int[] order, boolean[] inOrder, int[] listed, int[] rest) {
        int[] digit = new int[dims.length];
        for (int r = 0; r < total; r++) {
            int x = r;
            for (int s = dims.length - 1; s >= 0; s--) {
                digit[s] = x % dims[s];
                x /= dims[s];
            }
            int a = 0, b = 0;
            for (int s : order) {
                a = a * dims[s] + digit[s];
            }
            for (int s = 0; s < dims.length; s++) {
                if (!inOrder[s]) {
                    b = b * dims[s] + digit[s];
                }
            }
            listed[r] = a;
            rest[r] = b;
        }
    }

    /** Checks that the indices are valid and distinct; returns the set as a mask over the subsystems. */
    private boolean[] distinct(int[] indices, String name) {
        boolean[] mask = new boolean[dims.length];
        for (int q = 0; q < indices.length; q++) {
            int s = Require.index(indices[q], dims.length, name + "[" + q + "]");
            if (mask[s]) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, name, "distinct subsystem indices",
                        Arrays.toString(indices) + " (" + s + " repeated)");
            }
            mask[s] = true;
        }
        return mask;
    }
}
