package org.loopwright.sim.config;

/**
 * Bad input of any kind: an option's value, a file, a file's content. The message names what was
 * given and what is allowed; the command line turns this exception, and only through its one
 * handler, into exit code 2. {@link InputFileException} is the kind that points into a file.
 */
public class InputException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    /**
     * An input error with its whole message.
     *
     * @param message what is wrong and what is allowed
     * @param cause   the underlying error, or null
     */
    public InputException(String message, Throwable cause) {
        super(message, cause);
    }

    /**
     * An input error found by a command itself, such as two options that exclude each other.
     *
     * @param message what is wrong and what is allowed
     */
    public InputException(String message) {
        super(message);
    }

    /**
     * A bad option value: {@code "--periods must each be finite and > 0: --periods=-1"}.
     *
     * @param option the option as typed, e.g. {@code --periods}
     * @param value  the value given
     * @param rule   what is allowed, e.g. "must be finite and &gt; 0"
     */
    public static InputException option(String option, Object value, String rule) {
        return new InputException(option + " " + rule + ": " + option + "=" + value, null);
    }
}
