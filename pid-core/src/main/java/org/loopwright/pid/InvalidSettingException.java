package org.loopwright.pid;

/**
 * A setting that is outside what the controller allows. The message has one shape,
 * {@code "<field> <rule>: <field>=<value>"}, for example
 * {@code "integralTime must be > 0 (infinity for no integral action): integralTime=-3.0"}, and the
 * field and value are available to callers that map them back to a file's keys.
 */
public final class InvalidSettingException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    /** The setting's name as in the builder. */
    private final String field;
    private final transient Object value;
    /** What is allowed, phrased to follow the field name. */
    private final String rule;

    /**
     * @param field the setting's name as in the builder (camel case)
     * @param value the rejected value
     * @param rule  what is allowed, phrased to follow the field name ("must be > 0")
     */
    public InvalidSettingException(String field, Object value, String rule) {
        super(field + " " + rule + ": " + field + "=" + value);
        this.field = field;
        this.value = value;
        this.rule = rule;
    }

    /** {@return the setting's name as in the builder} */
    public String field() {
        return field;
    }

    /** {@return the rejected value} */
    public Object value() {
        return value;
    }

    /** {@return what is allowed} */
    public String rule() {
        return rule;
    }
}
