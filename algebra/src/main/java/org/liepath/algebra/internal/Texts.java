package org.liepath.algebra.internal;

/**
 * Helpers for error messages that quote user text. Not part of the public API.
 *
 * <p>Stateless static helpers: thread-safe.
 */
public final class Texts {
    private static final int WINDOW = 60;

    private Texts() {
    }

    /**
     * @return {@code s} itself when short, else a window of about 60 characters around {@code pos} with "…" marking
     * the cut ends, so that a message quoting a 10 000-letter input stays readable
     */
    public static String clip(String s, int pos) {
        if (s.length() <= WINDOW) {
            return s;
        }
        int from = Math.max(0, Math.min(pos - WINDOW / 2, s.length() - WINDOW));
        int to = Math.min(s.length(), from + WINDOW);
        return (from > 0 ? "…" : "") + s.substring(from, to) + (to < s.length() ? "…" : "");
    }
}
