package org.loopwright.sim.cli;

import org.loopwright.sim.config.Keywords;

import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * Reads an option's value by the same words the files use (a {@link Keywords} table), so that the
 * command line and the files never spell one choice two ways; a wrong word is bad input (exit 2)
 * and the message lists the words allowed. Subclass it per table, since picocli instantiates
 * converters by class.
 *
 * @param <T> the type of value
 */
abstract class KeywordConverter<T> implements ITypeConverter<T> {

    private final Keywords<T> words;

    KeywordConverter(Keywords<T> words) {
        this.words = words;
    }

    @Override
    public T convert(String value) {
        return words.value(value).orElseThrow(() -> new TypeConversionException("must be " + words.describe() + ": " + value));
    }
}
