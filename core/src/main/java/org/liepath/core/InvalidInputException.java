package org.liepath.core;

import java.util.Objects;

/**
 * The exception every Liepath entry point throws for input it cannot accept.
 *
 * <p>It is an {@link IllegalArgumentException}, so callers that do not care about Liepath can catch the JDK type.
 * The {@link #reason()} is a stable enum that tests and programs can branch on; the message always names the
 * argument, the form that was expected and the value that was seen, for example
 * {@code "re: expected a finite number at (0, 1), got NaN"}.
 *
 * <p>Immutable and thread-safe.
 */
public class InvalidInputException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    /** Why an input was refused. */
    public enum Reason {
        /** A required argument was {@code null}. */
        NULL,
        /** A number was NaN or infinite. */
        NOT_FINITE,
        /** Arrays or operators have incompatible sizes. */
        DIMENSION_MISMATCH,
        /** A two-dimensional array has rows of different lengths or is not square. */
        NOT_SQUARE,
        /** An operator must be Hermitian and is not. */
        NOT_HERMITIAN,
        /** A number lies outside its allowed range (negative rate, non-positive tolerance, bad index...). */
        OUT_OF_RANGE,
        /** A list or array that must not be empty is empty. */
        EMPTY,
        /** A textual input (Pauli string, Pauli sum) does not parse. */
        SYNTAX,
        /** A basis claimed to be closed under the bracket is not. */
        NOT_CLOSED,
        /** A computation would exceed a documented size limit. */
        LIMIT_EXCEEDED,
        /** The combination of inputs is not supported (e.g. a scheme that cannot serve a problem). */
        UNSUPPORTED
    }

    /** Why the input was refused. */
    private final Reason reason;
    /** The name of the refused argument. */
    private final String argument;

    /**
     * @param reason   why the input was refused
     * @param argument the name of the offending argument
     * @param message  the full message (should name the argument, expected form and value seen)
     */
    public InvalidInputException(Reason reason, String argument, String message) {
        super(message);
        this.reason = Objects.requireNonNull(reason, "reason");
        this.argument = argument;
    }

    /**
     * Builds the standard message {@code "<argument>: expected <expected>, got <seen>"}.
     *
     * @param reason why the input was refused
     * @param argument the name of the offending argument
     * @param expected the form that was expected
     * @param seen the value seen
     * @return an exception with the standard message {@code "<argument>: expected <expected>, got <seen>"}
     */
    public static InvalidInputException of(Reason reason, String argument, String expected, Object seen) {
        return new InvalidInputException(reason, argument, argument + ": expected " + expected + ", got " + seen);
    }

    /** @return the stable reason code */
    public Reason reason() {
        return reason;
    }

    /** @return the name of the argument that was refused */
    public String argument() {
        return argument;
    }
}
