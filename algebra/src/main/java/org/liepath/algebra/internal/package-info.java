/**
 * Implementation of the algebra module: Gram–Schmidt closure, sparse structure-constant storage, root-system
 * analysis for type identification, bit-packed Pauli arithmetic and elimination. Not API.
 */
package org.liepath.algebra.internal;
