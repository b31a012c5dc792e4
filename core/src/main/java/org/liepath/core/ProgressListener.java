package org.liepath.core;

/**
 * Receives progress reports from long computations (Lie closures, long evolutions, sweeps) and may cancel them.
 *
 * <p>Called on the thread doing the work, so it must be quick. A listener that throws does not corrupt the
 * computation: the exception is caught, the listener is not called again, and the work goes on (the caller sees the
 * failure in the result's diagnostics where the computation has any).
 */
@FunctionalInterface
public interface ProgressListener {
    /**
     * @param fraction the fraction done in [0, 1], or NaN when the total is not known (e.g. a closure)
     * @param count    a monotone work counter: accepted steps of an evolution, basis size of a closure, …
     * @return true to continue, false to request cancellation
     */
    boolean onProgress(double fraction, long count);

    /** A listener that ignores every report and never cancels. */
    ProgressListener NONE = (f, c) -> true;
}
