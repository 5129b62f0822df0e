package org.loopwright.sim.config;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.function.Function;

/**
 * The words a file may use for one setting, each standing for a value, in the order they are
 * listed in error messages. The words are the file format; the values are whatever the program
 * uses, so renaming a Java constant never changes a file.
 *
 * <p>Example: {@code Keywords.of(entry("reverse", Action.REVERSE), entry("direct", Action.DIRECT))}.
 *
 * <p>Thread-safe: immutable.
 *
 * @param <T> the type of value the words stand for
 */
public final class Keywords<T> {

    private final Map<String, T> valueByWord;

    private Keywords(Map<String, T> valueByWord) {
        this.valueByWord = Collections.unmodifiableMap(valueByWord);
    }

    /**
     * The table, in the order given.
     *
     * @throws IllegalArgumentException when a word or a value is listed twice
     */
    @SafeVarargs
    public static <T> Keywords<T> of(Map.Entry<String, T>... entries) {
        Map<String, T> table = new LinkedHashMap<>();
        for (Map.Entry<String, T> entry : entries) {
            Objects.requireNonNull(entry.getValue(), entry.getKey());
            if (table.containsValue(entry.getValue()) || table.put(entry.getKey(), entry.getValue()) != null) {
                throw new IllegalArgumentException("listed twice: " + entry);
            }
        }
        return new Keywords<>(table);
    }

    /**
     * The table of values that carry their own word (an enum whose constants know their file word),
     * in the order given.
     *
     * @param values the values
     * @param word   the word of a value
     * @param <T>    the type of value
     * @return the table
     * @throws IllegalArgumentException when a word is listed twice
     */
    public static <T> Keywords<T> byWord(T[] values, Function<T, String> word) {
        Map<String, T> table = new LinkedHashMap<>();
        for (T value : values) {
            if (table.put(word.apply(value), value) != null) {
                throw new IllegalArgumentException("listed twice: " + word.apply(value));
            }
        }
        return new Keywords<>(table);
    }

    /** The value a word stands for, or empty when the word is not in the table. */
    public Optional<T> value(String word) {
        return Optional.ofNullable(valueByWord.get(word));
    }

    /**
     * The word for a value.
     *
     * @throws IllegalArgumentException when no word stands for the value
     */
    public String word(T value) {
        for (Map.Entry<String, T> entry : valueByWord.entrySet()) {
            if (entry.getValue().equals(value)) {
                return entry.getKey();
            }
        }
        throw new IllegalArgumentException("no word for " + value + "; words: " + String.join(", ", words()));
    }

    /** Every word, in order. */
    public List<String> words() {
        return new ArrayList<>(valueByWord.keySet());
    }

    /** "one of a, b, c", for error messages. */
    public String describe() {
        return "one of " + String.join(", ", valueByWord.keySet());
    }
}
