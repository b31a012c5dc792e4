/**
 * Implementation of Wei–Norman charts: adjoint representations, closed-form adjoint exponentials, the coordinate
 * ODE driver with re-anchoring, and the block Riccati hierarchy. Not API.
 */
package org.liepath.integrators.internal.wn;
