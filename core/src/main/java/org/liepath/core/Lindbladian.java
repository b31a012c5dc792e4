package org.liepath.core;

import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * A GKLS (Lindblad) generator L(ρ) = −i[H(t), ρ] + Σ_k γ_k (L_k ρ L_k† − ½{L_k† L_k, ρ}) with a time-dependent
 * Hamiltonian H(t), constant rates γ_k ≥ 0 and constant jump operators L_k.
 *
 * <p>{@link #at(double)} gives the generator as a column-stacking {@link Superoperator}:
 * S = −i(I ⊗ H − Hᵀ ⊗ I) + Σ γ_k [conj(L_k) ⊗ L_k − ½ I ⊗ L_k†L_k − ½ (L_k†L_k)ᵀ ⊗ I]
 * (H.-P. Breuer, F. Petruccione, The Theory of Open Quantum Systems, OUP 2002, ch. 3 — common practice).
 * Rates are in reciprocal time units; a rate γ with L = σz dephases coherences at 2γ (with L = σz/√2 at γ).
 *
 * <p>Immutable and thread-safe. Building the superoperator costs O(n⁴) per call.
 */
public final class Lindbladian {
    private final Hamiltonian h;
    private final List<Double> rates;
    private final List<Operator> jumps;
    private final Operator dissipator;

    private Lindbladian(Hamiltonian h, List<Double> rates, List<Operator> jumps) {
        this.h = h;
        this.rates = rates;
        this.jumps = jumps;
        this.dissipator = buildDissipator();
    }

    /**
     * @param h the Hamiltonian
     * @return a builder around the Hamiltonian part
     */
    public static Builder builder(Hamiltonian h) {
        Require.nonNull(h, "h");
        return new Builder(h);
    }

    /** @return the Hamiltonian part */
    public Hamiltonian hamiltonian() {
        return h;
    }

    /** @return the jump operators L_k */
    public List<Operator> jumps() {
        return jumps;
    }

    /** @return the rates γ_k */
    public List<Double> rates() {
        return rates;
    }

    /** @return the Hilbert-space dimension n */
    public int dim() {
        return h.dim();
    }

    /** @return the time-independent dissipative part Σ γ_k D[L_k] as an n²×n² column-stacking matrix */
    public Superoperator dissipator() {
        return Superoperator.ofMatrix(dissipator);
    }

    /**
     * @param a the operator
     * @return −i(I ⊗ A − Aᵀ ⊗ I): the column-stacking matrix of ρ ↦ −i[A, ρ]
     */
    public static Operator hamiltonianPart(Operator a) {
        Require.nonNull(a, "a");
        Operator id = Operator.identity(a.dim());
        return id.kron(a).minus(a.transpose().kron(id)).timesI().scale(-1.0);
    }

    /**
     * @param t the time
     * @return the generator at time t
     */
    public Superoperator at(double t) {
        Require.finite(t, "t");
        return Superoperator.ofMatrix(hamiltonianPart(h.at(t)).plus(dissipator));
    }

    /** @return whether H is time independent (then the dynamical map is a single exponential) */
    public boolean isTimeIndependent() {
        return h.isTimeIndependent();
    }

    private Operator buildDissipator() {
        int n = h.dim();
        Operator id = Operator.identity(n);
        Operator d = Operator.zero(n * n);
        for (int k = 0; k < jumps.size(); k++) {
            Operator l = jumps.get(k);
            double g = rates.get(k);
            Operator ldl = l.dagger().times(l);
            Operator term = l.conjugate().kron(l).minus(id.kron(ldl).scale(0.5)).minus(ldl.transpose().kron(id).scale(0.5));
            d = d.plus(term.scale(g));
        }
        return d;
    }

    @Override
    public String toString() {
        return "Lindbladian (dimension " + h.dim() + ", " + h.size() + " Hamiltonian terms, " + jumps.size() + " jumps)";
    }

    /**
     * The steady state of a time-independent generator: the unique density matrix ρ with L(ρ) = 0 and tr ρ = 1, found
     * as the null vector of the n²×n² generator (see {@link Superoperator#steadyState()}); the result is made exactly
     * Hermitian by averaging with its adjoint (the exact null state of a GKLS generator is Hermitian). Cost O(n⁶).
     *
     * @return the steady state of a time-independent generator
     * @throws InvalidInputException with reason UNSUPPORTED if H is time dependent or the steady state is not unique
     */
    public Operator steadyState() {
        if (!isTimeIndependent()) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "this", "a time-independent Hamiltonian",
                    "a time-dependent one (" + h.size() + " terms)");
        }
        Operator rho = at(0.0).steadyState();
        return rho.plus(rho.dagger()).scale(0.5);
    }

    /** Mutable builder; not thread-safe. */
    public static final class Builder {
        private final Hamiltonian h;
        private final List<Double> rates = new ArrayList<>();
        private final List<Operator> jumps = new ArrayList<>();

        private Builder(Hamiltonian h) {
            this.h = h;
        }

        /**
         * Adds the dissipator γ D[L].
         *
         * @param rate γ ≥ 0 (finite)
         * @param l    the jump operator, same dimension as H
         * @return this builder
         */
        public Builder jump(double rate, Operator l) {
            String name = "rate of jump " + jumps.size();
            Require.finite(rate, name);
            if (rate < 0) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, name, "a non-negative rate", rate);
            }
            Require.nonNull(l, "jump operator " + jumps.size());
            if (l.dim() != h.dim()) {
                throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "jump operator " + jumps.size(),
                        "dimension " + h.dim(), "dimension " + l.dim());
            }
            rates.add(rate);
            jumps.add(l);
            return this;
        }

        /** @return the generator */
        public Lindbladian build() {
            return new Lindbladian(h, Collections.unmodifiableList(new ArrayList<>(rates)),
                    Collections.unmodifiableList(new ArrayList<>(jumps)));
        }
    }
}
