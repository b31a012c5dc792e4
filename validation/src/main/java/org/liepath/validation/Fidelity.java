package org.liepath.validation;

import org.apache.commons.math3.complex.Complex;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;
import org.liepath.core.Superoperator;
import org.liepath.core.internal.Require;
import org.liepath.integrators.Timeline;
import org.liepath.validation.internal.HermitianSpectrum;

import java.util.ArrayList;
import java.util.List;

/**
 * Gate and state fidelities, purity and von Neumann entropy.
 *
 * <p>Gate fidelities compare a target unitary U (d×d) with an implementation, averaged over Haar-random pure input
 * states: F̄ = ∫dψ ⟨ψ|U† E(|ψ⟩⟨ψ|) U|ψ⟩. For a unitary implementation V this is (|tr U†V|² + d)/(d(d+1))
 * (M.A. Nielsen, Phys. Lett. A 303 (2002) 249); for a channel, F̄ = (d F_e + 1)/(d + 1) with the entanglement
 * fidelity F_e = tr(S_U† S)/d² (M., P., R. Horodecki, Phys. Rev. A 60 (1999) 1888), S_U = conj(U) ⊗ U.
 *
 * <p>State fidelity is Uhlmann's, in the squared convention: F(ρ, σ) = (tr √(√ρ σ √ρ))², which is |⟨ψ|φ⟩|² for pure
 * states (A. Uhlmann, Rep. Math. Phys. 9 (1976) 273; volume and page from memory). Entropy is in nats: S(ρ) = −Σ λ ln λ.
 *
 * <p><b>Unitarity assumption.</b> A target must be unitary: {@link #averageGate(Operator, Operator)} and
 * {@link #averageGate(Operator, Superoperator)} throw {@link InvalidInputException} (reason OUT_OF_RANGE, argument
 * "target") when ‖U†U − I‖_F exceeds {@link #UNITARY_TARGET_TOLERANCE}. The implementation V may be any operator:
 * the general formula (tr(M M†) + |tr M|²)/(d(d+1)), M = U†V, is used, which is the exact Haar average of
 * ⟨ψ|U† V|ψ⟩⟨ψ|V† U|ψ⟩ for any V (it is Nielsen's formula when V is unitary and gives the leakage-aware value of
 * L.H. Pedersen, N.M. Møller, K. Mølmer, Phys. Lett. A 367 (2007) 47 when V is not).
 *
 * <p>Stateless and thread-safe. Costs: gate fidelity O(d³) (unitary) or O(d⁴) (channel); mixed-state fidelity
 * and entropy O(d³) with a Hermitian eigen-decomposition.
 */
public final class Fidelity {
    /**
     * How far from unitary a target may be, in ‖U†U − I‖_F. Targets are usually exact gates or high-accuracy
     * reference propagators, unitary to ~1e-13; 1e-8 catches a wrong argument (a generator or a non-normalised
     * matrix) while accepting propagators from any validated run. Common practice.
     */
    public static final double UNITARY_TARGET_TOLERANCE = 1e-8;

    /**
     * How far from a density matrix a state may be: bound on |tr ρ − 1| and on the Hermitian defect ‖ρ − ρ†‖_F
     * (rounding of propagated states is far smaller; positivity is not checked). Common practice.
     */
    public static final double DENSITY_TOLERANCE = 1e-8;

    private Fidelity() {
    }

    /**
     * Average gate fidelity between a target unitary and an implemented operator V.
     *
     * @param target the target unitary U (checked, see class comment)
     * @param actual the implemented operator V, same dimension (any operator; unitary in the usual case)
     * @return (tr(MM†) + |tr M|²)/(d(d+1)) with M = U†V; (|tr U†V|² + d)/(d(d+1)) when V is unitary
     */
    public static double averageGate(Operator target, Operator actual) {
        requireUnitaryTarget(target);
        Require.nonNull(actual, "actual");
        Require.sameDim(target.dim(), actual.dim(), "actual");
        int d = target.dim();
        Operator m = target.dagger().times(actual);
        double trMM = m.norm() * m.norm();
        Complex tr = m.trace();
        double abs2 = tr.getReal() * tr.getReal() + tr.getImaginary() * tr.getImaginary();
        return (trMM + abs2) / (d * (d + 1.0));
    }

    /**
     * Average gate fidelity between a target unitary and a channel, by the Horodecki relation.
     *
     * @param target  the target unitary U (checked)
     * @param channel the implemented dynamical map on d×d operators
     * @return (d F_e + 1)/(d + 1) with F_e = {@link #entanglement(Operator, Superoperator)}
     */
    public static double averageGate(Operator target, Superoperator channel) {
        double fe = entanglement(target, channel);
        int d = target.dim();
        return (d * fe + 1) / (d + 1.0);
    }

    /**
     * Entanglement (process) fidelity F_e = tr(S_U† S)/d² between a target unitary and a channel (real part; the
     * imaginary part vanishes for Hermiticity-preserving maps).
     *
     * @param target the target unitary
     * @param channel the channel (a superoperator, column stacking)
     * @return the entanglement fidelity F_e
     */
    public static double entanglement(Operator target, Superoperator channel) {
        requireUnitaryTarget(target);
        Require.nonNull(channel, "channel");
        Require.sameDim(target.dim(), channel.dim(), "channel");
        int d = target.dim();
        Operator su = target.conjugate().kron(target);
        return su.inner(channel.matrix()).getReal() / ((double) d * d);
    }

    /**
     * @param psi the state
     * @param phi the second state
     * @return |⟨ψ|φ⟩|² / (‖ψ‖²‖φ‖²) for pure states (normalisation divided out)
     */
    public static double state(StateVector psi, StateVector phi) {
        Require.nonNull(psi, "psi");
        Require.nonNull(phi, "phi");
        Require.sameDim(psi.dim(), phi.dim(), "phi");
        Complex ov = psi.inner(phi);
        double n2 = psi.norm() * psi.norm() * phi.norm() * phi.norm();
        if (!(n2 > 0)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "psi", "non-zero state vectors", "zero norm");
        }
        return (ov.getReal() * ov.getReal() + ov.getImaginary() * ov.getImaginary()) / n2;
    }

    /**
     * @param psi the state
     * @param rho the density matrix
     * @return ⟨ψ|ρ|ψ⟩/‖ψ‖², the fidelity of a pure state with a density matrix
     */
    public static double state(StateVector psi, Operator rho) {
        Require.nonNull(psi, "psi");
        requireDensity(rho, "rho");
        Require.sameDim(rho.dim(), psi.dim(), "psi");
        double n2 = psi.norm() * psi.norm();
        if (!(n2 > 0)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "psi", "a non-zero state vector", "zero norm");
        }
        return psi.expectation(rho).getReal() / n2;
    }

    /**
     * Uhlmann fidelity (tr √(√ρ σ √ρ))² of two density matrices, in [0, 1]; symmetric in its arguments.
     *
     * @param rho the density matrix
     * @param sigma the second density matrix
     * @return the fidelity, in [0, 1]
     * @throws InvalidInputException if either is not a density matrix within {@link #DENSITY_TOLERANCE}
     */
    public static double state(Operator rho, Operator sigma) {
        requireDensity(rho, "rho");
        requireDensity(sigma, "sigma");
        Require.sameDim(rho.dim(), sigma.dim(), "sigma");
        Operator sq = HermitianSpectrum.of(rho).apply(x -> Math.sqrt(Math.max(x, 0)));
        double[] lam = HermitianSpectrum.of(sq.times(sigma).times(sq)).values();
        double s = 0;
        for (double l : lam) {
            s += Math.sqrt(Math.max(l, 0));
        }
        return Math.min(1.0, s * s);
    }

    /**
     * @param rho the density matrix
     * @return the purity tr ρ² (1 for pure states, 1/d for the maximally mixed state)
     */
    public static double purity(Operator rho) {
        requireDensity(rho, "rho");
        return rho.inner(rho).getReal();
    }

    /**
     * @param rho the density matrix
     * @return the von Neumann entropy −Σ λ ln λ in nats (0 for pure states, ln d at most)
     */
    public static double entropy(Operator rho) {
        requireDensity(rho, "rho");
        double s = 0;
        for (double l : HermitianSpectrum.of(rho).values()) {
            // eigenvalues at rounding level below zero carry no entropy (x ln x → 0)
            if (l > 0) {
                s -= l * Math.log(l);
            }
        }
        return s;
    }

    /**
     * @param trajectory the trajectory
     * @return {@link #purity} of each density matrix of a trajectory, in order
     */
    public static double[] purity(List<Operator> trajectory) {
        Require.nonNull(trajectory, "trajectory");
        double[] out = new double[trajectory.size()];
        for (int k = 0; k < out.length; k++) {
            out[k] = purity(Require.nonNull(trajectory.get(k), "trajectory[" + k + "]"));
        }
        return out;
    }

    /**
     * @param trajectory the trajectory
     * @return {@link #entropy} of each density matrix of a trajectory, in order
     */
    public static double[] entropy(List<Operator> trajectory) {
        Require.nonNull(trajectory, "trajectory");
        double[] out = new double[trajectory.size()];
        for (int k = 0; k < out.length; k++) {
            out[k] = entropy(Require.nonNull(trajectory.get(k), "trajectory[" + k + "]"));
        }
        return out;
    }

    /**
     * Purity of each sample of a density-mode trajectory ({@code Evolve.of(l)…density(rho0).sampleAt(…)}). Samples
     * are symmetrised, (ρ + ρ†)/2, so that integration round-off in the Hermitian part does not count as misuse.
     *
     * @param trajectory the trajectory
     * @return the purity of each sample, in order
     * @throws IllegalStateException if the trajectory does not hold densities (from {@link Timeline#density})
     */
    public static double[] purity(Timeline trajectory) {
        return purity(densities(trajectory));
    }

    /**
     * Entropy of each sample of a density-mode trajectory, as {@link #purity(Timeline)}.
     *
     * @param trajectory the trajectory
     * @return the entropy of each sample, in order
     */
    public static double[] entropy(Timeline trajectory) {
        return entropy(densities(trajectory));
    }

    private static List<Operator> densities(Timeline trajectory) {
        Require.nonNull(trajectory, "trajectory");
        List<Operator> out = new ArrayList<>(trajectory.size());
        for (int k = 0; k < trajectory.size(); k++) {
            Operator r = trajectory.density(k);
            out.add(r.plus(r.dagger()).scale(0.5));
        }
        return out;
    }

    private static void requireUnitaryTarget(Operator target) {
        Require.nonNull(target, "target");
        double e = Checks.unitarityError(target);
        if (!(e <= UNITARY_TARGET_TOLERANCE)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, "target",
                    "a unitary operator (‖U†U − I‖_F ≤ " + UNITARY_TARGET_TOLERANCE + ")", "‖U†U − I‖_F = " + e);
        }
    }

    private static void requireDensity(Operator rho, String name) {
        Require.nonNull(rho, name);
        double h = rho.hermitianDefect();
        if (!(h <= DENSITY_TOLERANCE)) {
            throw InvalidInputException.of(Reason.NOT_HERMITIAN, name, "a Hermitian density matrix",
                    "‖ρ − ρ†‖_F = " + h);
        }
        double t = Checks.densityTraceError(rho);
        if (!(t <= DENSITY_TOLERANCE)) {
            throw InvalidInputException.of(Reason.OUT_OF_RANGE, name, "a density matrix with trace 1",
                    "trace " + rho.trace());
        }
    }
}
