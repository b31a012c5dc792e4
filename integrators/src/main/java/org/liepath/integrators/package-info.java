/**
 * Time evolution: propagators, states and density matrices of H(t) = Σ c_k(t) A_k, with the group structure kept
 * by construction.
 *
 * <h2>Start here</h2>
 * <pre>{@code
 * Evolution ev = Evolve.of(hamiltonian).over(0, 10).run();          // CF4:3Opt, adaptive, tolerance 1e-8
 * Operator u = ev.propagator();
 * Evolution fixed = Evolve.of(hamiltonian).over(0, 10).scheme(Scheme.magnus6()).steps(200).run();
 * Evolution open = Evolve.of(lindbladian).over(0, 5).density(rho0).run();
 * }</pre>
 * <ul>
 *   <li>{@link org.liepath.integrators.Scheme} — Magnus (orders 4, 6, 8), commutator-free (orders 4 and 6),
 *       exponential midpoint, exact piecewise-constant stepping, a Dormand–Prince reference, and Wei–Norman
 *       coordinates; {@code stepper(h)} gives the zero-allocation tier for control loops;</li>
 *   <li>{@link org.liepath.integrators.Evolve} and {@link org.liepath.integrators.Evolution} — configure, run, and
 *       read status, statistics, trajectories and error estimates;</li>
 *   <li>{@link org.liepath.integrators.WeiNorman} and {@link org.liepath.integrators.BlockRiccati} — evolve a few
 *       coordinates instead of the full matrix.</li>
 * </ul>
 *
 * <h2>Literature</h2>
 * S. Blanes, F. Casas, J.A. Oteo, J. Ros, "The Magnus expansion and some of its applications", Phys. Rep. 470
 * (2009) 151; S. Blanes, F. Casas, J. Ros, BIT 40 (2000) 434; A. Alvermann, H. Fehske, J. Comput. Phys. 230 (2011)
 * 5930; S. Blanes, P.C. Moan, Appl. Numer. Math. 56 (2006) 1519; J. Wei, E. Norman, J. Math. Phys. 4 (1963) 575;
 * E. Hairer, S.P. Nørsett, G. Wanner, Solving Ordinary Differential Equations I (Springer, 2nd ed. 1993),
 * §II.10 (the 8(5,3) Dormand–Prince pair behind the reference scheme).
 */
package org.liepath.integrators;
