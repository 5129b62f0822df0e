package org.loopwright.sim.cli;

import java.util.Iterator;

import org.loopwright.sim.config.Keywords;

import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * Reads an option's value by the same words the files use (a {@link Keywords} table), so that the
 * command line and the files never spell one choice two ways; a wrong word is bad input (exit 2)
 * and the message lists the words allowed. It is also the option's {@code completionCandidates},
 * so that the help lists the words ({@code ${COMPLETION-CANDIDATES}}). Subclass it per table, since
 * picocli instantiates converters by class; the tables are in {@link OptionWords}.
 *
 * @param <T> the type of value
 */
abstract class KeywordConverter<T> implements ITypeConverter<T>, Iterable<String> {

    private final Keywords<T> words;

    KeywordConverter(Keywords<T> words) {
        this.words = words;
    }

    @Override
    public T convert(String value) {
        // the message is the rule alone: the handler adds the option and the value
        return words.value(value).orElseThrow(() -> new TypeConversionException("must be " + words.describe()));
    }

    @Override
    public Iterator<String> iterator() {
        return words.words().iterator();
    }
}
