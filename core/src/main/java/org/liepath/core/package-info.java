/**
 * Dense complex operators and the physics built on them: the vocabulary every other Liepath module speaks.
 *
 * <h2>Start here</h2>
 * <ul>
 *   <li>{@link org.liepath.core.Operator} — an immutable complex square matrix (Hilbert–Schmidt inner product
 *       tr(A†B), Kronecker products, commutators, {@code exp} by Padé scaling and squaring, {@code expMinusI} for
 *       Hermitian generators by eigendecomposition);</li>
 *   <li>{@link org.liepath.core.StateVector}, {@link org.liepath.core.Pauli}, {@link org.liepath.core.Spin},
 *       {@link org.liepath.core.Levels}, {@link org.liepath.core.HilbertSpace} — states and the standard operator
 *       sets;</li>
 *   <li>{@link org.liepath.core.Drive} and {@link org.liepath.core.Hamiltonian} — control-affine Hamiltonians
 *       H(t) = Σ c_k(t) A_k;</li>
 *   <li>{@link org.liepath.core.Lindbladian} and {@link org.liepath.core.Superoperator} — GKLS generators and maps
 *       in column-stacking convention, with Choi matrices;</li>
 *   <li>{@link org.liepath.core.Krylov} — the action exp(−itH)ψ for dimensions up to a few thousand.</li>
 * </ul>
 *
 * <h2>Conventions</h2>
 * ħ = 1; dU/dt = −iH(t)U. Pauli string "XZI" has X on qubit 0, the leftmost Kronecker factor. Spin bases run
 * m = j, …, −j. vec(AXB) = (Bᵀ ⊗ A) vec(X). Bad input throws {@link org.liepath.core.InvalidInputException}.
 *
 * <h2>Literature</h2>
 * N.J. Higham, "The scaling and squaring method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl.
 * 26 (2005) 1179; Y. Saad, "Analysis of some Krylov subspace approximations to the matrix exponential operator",
 * SIAM J. Numer. Anal. 29 (1992) 209; H.-P. Breuer, F. Petruccione, The Theory of Open Quantum Systems (OUP 2002);
 * M.-D. Choi, Linear Algebra Appl. 10 (1975) 285.
 */
package org.liepath.core;
