package org.liepath.validation;

import org.liepath.core.Operator;
import org.liepath.core.Superoperator;
import org.liepath.core.internal.Require;
import org.liepath.validation.internal.HermitianSpectrum;

/**
 * Structural checks of propagators and dynamical maps: unitarity, trace preservation, complete positivity and
 * Hermiticity preservation, each as an error measure plus an {@code is…} predicate with a documented tolerance.
 *
 * <p><b>Tolerance policy.</b> Every measure here is zero in exact arithmetic for a correct propagator or channel and
 * grows with rounding. The constants below bound that rounding for the sizes Liepath targets (dimension ≤ 64, up to
 * ~10⁴ steps); each says where it comes from. Each predicate also has an overload with an explicit tolerance.
 *
 * <p>Conventions: Frobenius norms; channels in column stacking; the Choi matrix is the unnormalised
 * J = Σ_ab |a⟩⟨b| ⊗ E(|a⟩⟨b|) of {@link Superoperator#choi()} (trace d for a trace-preserving map; divide eigenvalues
 * by d for the normalised Choi state).
 *
 * <p>Stateless and thread-safe. Costs: unitarity O(n³); trace O(n⁴); Choi eigenvalue O(n⁶) (a Hermitian
 * eigen-decomposition of the n²×n² Choi matrix).
 */
public final class Checks {
    /**
     * Default bound on ‖U†U − I‖_F. A product of two n×n matrices in floating point has an error of order n·ε·‖A‖‖B‖
     * (N.J. Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., SIAM 2002, §3.5); for unitary factors
     * this is ~n·ε per step. With n ≤ 64 and up to ~10⁴ steps the drift stays below 1e-10 (ε ≈ 2.2e-16); observed
     * drifts of Magnus/commutator-free runs here are far smaller (1e-14 to 1e-13). Common practice.
     */
    public static final double UNITARITY_TOLERANCE = 1e-10;

    /**
     * Default bound on the trace defect of a channel (max over input matrix units of |tr E(|a⟩⟨b|) − δ_ab|). A channel
     * computed as exp(tS) by scaling and squaring carries a relative error of a few ε·‖tS‖₁·cond (N.J. Higham,
     * SIAM J. Matrix Anal. Appl. 26 (2005) 1179); 1e-10 covers ‖tS‖₁ up to ~10³ with the same step-count margin as
     * {@link #UNITARITY_TOLERANCE}. Common practice.
     */
    public static final double TRACE_TOLERANCE = 1e-10;

    /**
     * Default relative bound for the smallest eigenvalue of the Choi matrix: E counts as completely positive when
     * λ_min(J) ≥ −tol·‖J‖_F (the test "smallest eigenvalue ≥ −tol·‖J‖" after M.-D. Choi, Linear Algebra Appl. 10
     * (1975) 285). Channels at the edge of the cone (amplitude damping has λ_min = 0 exactly) sit at rounding level,
     * ~n²·ε·‖J‖ for the eigen-solver (backward stable: Higham 2002, §1), so 1e-10 leaves margin. Common practice.
     */
    public static final double POSITIVITY_TOLERANCE = 1e-10;

    /**
     * Default relative bound on ‖J − J†‖_F / max(1, ‖J‖_F): a map preserves Hermiticity iff its Choi matrix is
     * Hermitian (Choi 1975). Rounding of the construction is ~ε per entry; 1e-12 relative. Common practice.
     */
    public static final double HERMITICITY_TOLERANCE = 1e-12;

    private Checks() {
    }

    /**
     * @param u a square operator
     * @return ‖U†U − I‖_F (zero for a unitary)
     */
    public static double unitarityError(Operator u) {
        Require.nonNull(u, "u");
        return u.dagger().times(u).distance(Operator.identity(u.dim()));
    }

    /**
     * @param u the operator
     * @return whether {@link #unitarityError} ≤ {@link #UNITARITY_TOLERANCE}
     */
    public static boolean isUnitary(Operator u) {
        return isUnitary(u, UNITARITY_TOLERANCE);
    }

    /**
     * @param u the operator
     * @param tol the tolerance (positive)
     * @return whether {@link #unitarityError} ≤ tol (tol ≥ 0)
     */
    public static boolean isUnitary(Operator u, double tol) {
        Require.nonNegative(tol, "tol");
        return unitarityError(u) <= tol;
    }

    /**
     * The trace-preservation error of a channel: max over matrix units |a⟩⟨b| of |tr E(|a⟩⟨b|) − δ_ab|, i.e. the
     * largest entry of tr_out J − I.
     *
     * @param channel a dynamical map in column stacking
     * @return the trace-preservation error of a channel
     */
    public static double traceError(Superoperator channel) {
        Require.nonNull(channel, "channel");
        return channel.traceDefect();
    }

    /**
     * @param channel the channel (a superoperator, column stacking)
     * @return whether {@link #traceError} ≤ {@link #TRACE_TOLERANCE}
     */
    public static boolean isTracePreserving(Superoperator channel) {
        return isTracePreserving(channel, TRACE_TOLERANCE);
    }

    /**
     * @param channel the channel (a superoperator, column stacking)
     * @param tol the tolerance (positive)
     * @return whether {@link #traceError} ≤ tol
     */
    public static boolean isTracePreserving(Superoperator channel, double tol) {
        Require.nonNegative(tol, "tol");
        return traceError(channel) <= tol;
    }

    /**
     * The smallest eigenvalue of the (unnormalised) Choi matrix J. If the map does not preserve Hermiticity, J is not
     * Hermitian; this method then uses the Hermitian part (J + J†)/2 — check {@link #hermiticityError} first when that
     * matters. Examples: any unitary or amplitude-damping channel gives 0 (rank-deficient J); the transpose map on a
     * qubit, not completely positive, gives −1 (J is the swap operator).
     *
     * @param channel a dynamical map in column stacking
     * @return the smallest eigenvalue of the (unnormalised) Choi matrix J
     */
    public static double choiMinEigenvalue(Superoperator channel) {
        Require.nonNull(channel, "channel");
        return HermitianSpectrum.of(channel.choi()).min();
    }

    /**
     * @param channel the channel (a superoperator, column stacking)
     * @return whether λ_min(J) ≥ −{@link #POSITIVITY_TOLERANCE}·‖J‖_F
     */
    public static boolean isCompletelyPositive(Superoperator channel) {
        return isCompletelyPositive(channel, POSITIVITY_TOLERANCE);
    }

    /**
     * @param channel the channel (a superoperator, column stacking)
     * @param tol the tolerance (positive)
     * @return whether λ_min(J) ≥ −tol·‖J‖_F (tol ≥ 0, relative)
     */
    public static boolean isCompletelyPositive(Superoperator channel, double tol) {
        Require.nonNegative(tol, "tol");
        Require.nonNull(channel, "channel");
        Operator j = channel.choi();
        return HermitianSpectrum.of(j).min() >= -tol * j.norm();
    }

    /**
     * @param channel a linear map in column stacking
     * @return ‖J − J†‖_F of its Choi matrix: zero iff the map sends Hermitian operators to Hermitian operators
     */
    public static double hermiticityError(Superoperator channel) {
        Require.nonNull(channel, "channel");
        return channel.choi().hermitianDefect();
    }

    /**
     * @param channel the channel (a superoperator, column stacking)
     * @return whether ‖J − J†‖_F ≤ {@link #HERMITICITY_TOLERANCE}·max(1, ‖J‖_F)
     */
    public static boolean isHermiticityPreserving(Superoperator channel) {
        return isHermiticityPreserving(channel, HERMITICITY_TOLERANCE);
    }

    /**
     * @param channel the channel (a superoperator, column stacking)
     * @param tol the tolerance (positive)
     * @return whether ‖J − J†‖_F ≤ tol·max(1, ‖J‖_F)
     */
    public static boolean isHermiticityPreserving(Superoperator channel, double tol) {
        Require.nonNegative(tol, "tol");
        Require.nonNull(channel, "channel");
        return channel.choi().isHermitian(tol);
    }

    /**
     * @param rho a density matrix candidate
     * @return |tr ρ − 1|
     */
    public static double densityTraceError(Operator rho) {
        Require.nonNull(rho, "rho");
        return Math.hypot(rho.trace().getReal() - 1, rho.trace().getImaginary());
    }
}
