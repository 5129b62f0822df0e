package org.loopwright.sim.cli;

import java.util.Map;
import java.util.function.Supplier;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.sim.config.InputException;

/**
 * The range checks of option values, in one place, and the translation of a model's refusal (which
 * names its Java field) into the option the user typed. Each failure is an {@link InputException}:
 * {@code --span must be finite and > 0: --span=-1}.
 */
final class OptionChecks {

    private OptionChecks() {
    }

    /**
     * @return {@code value}, or null when the option was not given
     * @throws InputException when given and not finite and &gt; 0
     */
    static Double positive(String option, Double value) {
        if (value != null && !(value > 0.0 && value < Double.POSITIVE_INFINITY)) {
            throw InputException.option(option, value, "must be finite and > 0");
        }
        return value;
    }

    /**
     * @return {@code value}, or null when the option was not given
     * @throws InputException when given and not finite and &gt;= 0
     */
    static Double nonNegative(String option, Double value) {
        if (value != null && !(value >= 0.0 && value < Double.POSITIVE_INFINITY)) {
            throw InputException.option(option, value, "must be finite and >= 0");
        }
        return value;
    }

    /**
     * Builds a model from option values; a value the model refuses is bad input named by its option.
     *
     * @param optionOfField the option that sets each of the model's fields
     * @param build         builds the model
     * @param <T>           the model's type
     * @return the model
     * @throws InputException naming the option, the value and the rule
     */
    static <T> T inOptionTerms(Map<String, String> optionOfField, Supplier<T> build) {
        try {
            return build.get();
        } catch (InvalidSettingException e) {
            String option = optionOfField.getOrDefault(e.field(), e.field());
            throw InputException.option(option, e.value(), e.rule());
        }
    }
}
