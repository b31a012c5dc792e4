/**
 * The engine behind {@link org.liepath.integrators.Evolve} (not part of the public API): the linear system
 * X' = A(t) X ({@code LinearSystem}), step kernels with their workspaces ({@code Kernel} and subclasses, coefficient
 * {@code Tables}), the fixed/adaptive step driver ({@code Runner}) and the Commons Math reference
 * ({@code ReferenceRunner}). Kernels are mutable and single-threaded; every run builds its own.
 */
package org.liepath.integrators.internal;
