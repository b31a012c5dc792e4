/**
 * Time evolution of finite-dimensional quantum systems: propagators U(t1, t0) of time-dependent Hamiltonians and
 * dynamical maps of GKLS generators.
 *
 * <p>Start with {@link org.liepath.integrators.Evolve}:
 * <pre>{@code
 * Evolution ev = Evolve.of(hamiltonian).over(0, 10).tolerance(1e-10).run();
 * Operator u = ev.propagator();          // U(10, 0)
 * System.out.println(ev.stats());        // work done, as a table
 * }</pre>
 * The problem (a {@link org.liepath.core.Hamiltonian} or {@link org.liepath.core.Lindbladian}), the algorithm
 * ({@link org.liepath.integrators.Scheme}) and the outcome ({@link org.liepath.integrators.Evolution}: status,
 * result, trajectory, statistics, error estimate, scheme) are separate immutable values. Control loops that need many
 * short propagations use the zero-allocation {@link org.liepath.integrators.Stepper} from
 * {@link org.liepath.integrators.Scheme#stepper}, which gives the same bits as fixed-step runs.
 *
 * <p>All schemes work on X' = A(t) X with A(t) = Σ c_k(t) G_k (+ a constant dissipator): G_k = −iA_k for a
 * Hamiltonian (every exponential factor unitary to rounding), the Liouville-space pieces (column stacking) for a
 * GKLS generator. Schemes: exponential midpoint; Magnus integrators of orders 4, 6, 8 on Gauss–Legendre nodes
 * (A. Iserles, S.P. Nørsett, Phil. Trans. R. Soc. A 357 (1999) 983–1019; S. Blanes, F. Casas, J. Ros, BIT 40 (2000)
 * 434–450; review: S. Blanes, F. Casas, J.A. Oteo, J. Ros, Phys. Rep. 470 (2009) 151–238); commutator-free schemes
 * (S. Blanes, P.C. Moan, Appl. Numer. Math. 56 (2006) 1519–1537; A. Alvermann, H. Fehske, J. Comput. Phys. 230
 * (2011) 5930–5956); exact stepping of piecewise-constant Hamiltonians; a Dormand–Prince reference (Apache Commons
 * Math) for validation; and integration in Wei–Norman coordinates (J. Wei, E. Norman, J. Math. Phys. 4 (1963) 575).
 *
 * <p>Misuse throws {@link org.liepath.core.InvalidInputException} before any step; numerical trouble (step limit,
 * step-size underflow, non-finite values, a failing drive, cancellation) ends a run with a non-success
 * {@link org.liepath.integrators.Status}.
 */
package org.liepath.integrators;
