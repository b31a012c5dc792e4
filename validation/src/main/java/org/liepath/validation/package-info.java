/**
 * Proving the numbers right: structure checks, the Magnus series, cross-checks against a reference, observed
 * convergence orders, fidelities, and the demo report.
 *
 * <h2>Start here</h2>
 * <ul>
 *   <li>{@link org.liepath.validation.Checks} — unitarity, trace preservation, complete positivity (Choi);</li>
 *   <li>{@link org.liepath.validation.MagnusSeries} — Ω1…Ω4 by nested Gauss–Legendre quadrature and the
 *       convergence indicator ∫‖H‖dt &lt; π;</li>
 *   <li>{@link org.liepath.validation.CrossCheck}, {@link org.liepath.validation.ConvergenceStudy} — schemes
 *       against the reference, observed order;</li>
 *   <li>{@link org.liepath.validation.Fidelity} — average gate fidelity, state fidelity, purity, entropy;</li>
 *   <li>{@link org.liepath.validation.Demo}, {@link org.liepath.validation.Report} — the end-to-end demo.</li>
 * </ul>
 *
 * <h2>Literature</h2>
 * W. Magnus, Comm. Pure Appl. Math. 7 (1954) 649; P.C. Moan, J. Niesen, Found. Comput. Math. 8 (2008) 291;
 * M.A. Nielsen, Phys. Lett. A 303 (2002) 249; M., P., R. Horodecki, Phys. Rev. A 60 (1999) 1888;
 * A. Uhlmann, Rep. Math. Phys. 9 (1976) 273.
 */
package org.liepath.validation;
