/**
 * Validation of Liepath results: structural checks, the Magnus series, cross-checks, convergence orders, fidelities,
 * and a report with plots.
 *
 * <ul>
 *   <li>{@link org.liepath.validation.Checks}: ‖U†U − I‖_F, a channel's trace error, the smallest eigenvalue of its
 *       Choi matrix (complete positivity, M.-D. Choi, Linear Algebra Appl. 10 (1975) 285) and Hermiticity
 *       preservation, each with a named default tolerance and an {@code is…} predicate.</li>
 *   <li>{@link org.liepath.validation.MagnusSeries}: Ω1 … Ω4 of dU/dt = −iH(t)U by Gauss–Legendre quadrature of the
 *       nested commutator integrals (W. Magnus, Comm. Pure Appl. Math. 7 (1954) 649; S. Blanes, F. Casas, J.A. Oteo,
 *       J. Ros, Phys. Rep. 470 (2009) 151), truncated propagators, and the convergence indicator ∫‖H‖₂ against π
 *       (P.C. Moan, J. Niesen, Found. Comput. Math. 8 (2008) 291).</li>
 *   <li>{@link org.liepath.validation.CrossCheck}: one problem through several schemes and the reference integrator,
 *       as a table (text, Markdown, CSV).</li>
 *   <li>{@link org.liepath.validation.ConvergenceStudy}: the observed order with its fitted range.</li>
 *   <li>{@link org.liepath.validation.Fidelity}: average gate fidelity (M.A. Nielsen, Phys. Lett. A 303 (2002) 249;
 *       M., P., R. Horodecki, Phys. Rev. A 60 (1999) 1888), Uhlmann state fidelity, purity, von Neumann entropy.</li>
 *   <li>{@link org.liepath.validation.Report} and {@link org.liepath.validation.Demo}: a Markdown summary with PNG
 *       plots (XChart), and an invented end-to-end scenario that writes one.</li>
 * </ul>
 *
 * <p>Example (JShell, with the start-up file {@code validation/src/main/jshell/liepath-startup.jsh}):
 * <pre>{@code
 * var h = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), Drive.cosine(0.3, 1.0)).build();
 * System.out.println(CrossCheck.of(h).over(0, 10).scheme(Scheme.magnus4(), 100).scheme(Scheme.magnus6(), 50).run());
 * System.out.println(ConvergenceStudy.of(h, 0, 10, Scheme.magnus4()).steps(8, 6).run());
 * MagnusSeries ms = MagnusSeries.of(h, 0, 1);
 * double err = Checks.unitarityError(ms.propagator(4));
 * }</pre>
 * Everything here is immutable and thread-safe except the builders, and prints nothing; only
 * {@link org.liepath.validation.Demo#main} writes to the console.
 */
package org.liepath.validation;
