/**
 * Implementation of the integrators: coefficient tables, the generic stepping engine on planar arrays, step-size
 * control, the real-vectorised reference equation. Not API.
 */
package org.liepath.integrators.internal;
