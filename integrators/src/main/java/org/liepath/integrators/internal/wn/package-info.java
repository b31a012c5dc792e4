/**
 * Implementation of Wei–Norman charts and the block Riccati decomposition (not API).
 *
 * <p>{@link org.liepath.integrators.internal.wn.Chart} holds a chart's numerical data (Gram matrix, structure
 * constants, closed forms of the adjoint and representation exponentials); {@link
 * org.liepath.integrators.internal.wn.Symbolic} derives the printed closed-form equations and their classification;
 * {@link org.liepath.integrators.internal.wn.Driver} integrates coordinates adaptively (Commons Math DP853) with
 * automatic re-anchoring; {@link org.liepath.integrators.internal.wn.BlockNode} is one level of the block Gauss
 * factorisation. References: J. Wei, E. Norman, J. Math. Phys. 4 (1963) 575 and Proc. AMS 15 (1964) 327.
 */
package org.liepath.integrators.internal.wn;
