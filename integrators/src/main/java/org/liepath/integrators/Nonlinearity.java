package org.liepath.integrators;

/**
 * How nonlinear a system of Wei–Norman coordinate equations is, in increasing order of difficulty.
 *
 * <p>Each equation ġ_k = F_k(g, a(t)) is classified by how F_k depends on the coordinates that are coupled to g_k
 * (those g_i that g_k depends on and that depend on g_k, through chains of equations); dependence on coordinates
 * solved earlier in the hierarchy only enters as known functions of time. An equation that does not depend on its own
 * block is a quadrature, counted as {@link #LINEAR}. The classification of a whole system is the worst of its
 * equations. For the ordering (J+, Jz, J−) of su(2) the system is {@link #RICCATI}: one scalar Riccati equation and two
 * quadratures (J. Wei, E. Norman, J. Math. Phys. 4 (1963) 575).
 *
 * <p>Enum constants: immutable and thread-safe.
 */
public enum Nonlinearity {
    /** Linear in the coupled coordinates (or a quadrature). */
    LINEAR,
    /** Quadratic in the coupled coordinates: a (matrix) Riccati equation. */
    RICCATI,
    /** Polynomial of degree three or more. */
    POLYNOMIAL,
    /** Exponentials of the coupled coordinates appear. */
    EXPONENTIAL,
    /** No closed form is known to the library: Γ(g) has no unit determinant or no closed-form adjoint action. */
    GENERAL
}
