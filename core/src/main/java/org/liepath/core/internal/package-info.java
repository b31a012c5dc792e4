/**
 * Kernels behind the core API (planar row-major complex arrays, workspaces that allocate nothing per call):
 * products, LU solves, the Padé matrix exponential, the Hermitian eigensolver, Krylov workspaces and argument
 * checks. Not API: used by the other Liepath modules and free to change.
 */
package org.liepath.core.internal;
