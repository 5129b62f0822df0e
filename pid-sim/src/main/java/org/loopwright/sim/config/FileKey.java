package org.loopwright.sim.config;

import java.util.Arrays;
import java.util.Objects;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * One key of an input file, declared once: the word the file uses, the Java field it fills (as
 * {@link org.loopwright.pid.InvalidSettingException#field()} names it, so a model's complaint is
 * mapped back to this key), what its value must be, and its default. Reading, writing, the list of
 * allowed keys, the defaults shown in help and the located error messages all come from it.
 *
 * <p>Example: {@code FileKey.number("sample-period", "samplePeriodSeconds", NumberRule.ANY)} is a
 * required number; {@code FileKey.choice("action", "action", ACTIONS).orElse(Action.REVERSE)} an
 * optional word with its default.
 *
 * <p>Thread-safe: immutable.
 *
 * @param <T> the type of the value read
 */
public final class FileKey<T> {

    /** How a value of one kind is read from a document node and written as YAML text. */
    private interface Kind<T> {
        T read(YamlDocument doc, String pointer);

        String text(T value);

        String allowed();
    }

    private final String word;
    private final String field;
    private final Kind<T> kind;
    private final T absent;
    private final boolean required;

    private FileKey(String word, String field, Kind<T> kind, T absent, boolean required) {
        this.word = Objects.requireNonNull(word, "word");
        this.field = Objects.requireNonNull(field, "field");
        this.kind = kind;
        this.absent = absent;
        this.required = required;
    }

    /**
     * A required number.
     *
     * @param word  the file's key
     * @param field the Java field it fills
     * @param rule  what the number must satisfy when read (models check the rest)
     * @return the key
     */
    public static FileKey<Double> number(String word, String field, NumberRule rule) {
        return new FileKey<>(word, field, new Kind<>() {
            @Override
            public Double read(YamlDocument doc, String pointer) {
                return doc.requiredNumber(pointer, rule);
            }

            @Override
            public String text(Double value) {
                return yamlNumber(value);
            }

            @Override
            public String allowed() {
                return rule.describeNumber();
            }
        }, null, true);
    }

    /**
     * A required list of numbers.
     *
     * @param word  the file's key
     * @param field the Java field it fills
     * @param rule  what each number must satisfy
     * @return the key
     */
    public static FileKey<double[]> numbers(String word, String field, NumberRule rule) {
        return new FileKey<>(word, field, new Kind<>() {
            @Override
            public double[] read(YamlDocument doc, String pointer) {
                return doc.numberList(pointer, rule);
            }

            @Override
            public String text(double[] value) {
                return Arrays.stream(value).mapToObj(FileKey::yamlNumber).collect(Collectors.joining(", ", "[", "]"));
            }

            @Override
            public String allowed() {
                return "a list of numbers" + (rule.description().isEmpty() ? "" : " (" + rule.description() + ")");
            }
        }, null, true);
    }

    /**
     * A required whole number from a range.
     *
     * @param word  the file's key
     * @param field the Java field it fills
     * @param least the smallest value allowed
     * @param most  the largest value allowed
     * @return the key
     */
    public static FileKey<Long> whole(String word, String field, long least, long most) {
        return new FileKey<>(word, field, new Kind<>() {
            @Override
            public Long read(YamlDocument doc, String pointer) {
                return doc.wholeNumber(pointer, least, most);
            }

            @Override
            public String text(Long value) {
                return value.toString();
            }

            @Override
            public String allowed() {
                return YamlDocument.describeWhole(least, most);
            }
        }, null, true);
    }

    /**
     * A required word from a table.
     *
     * @param word  the file's key
     * @param field the Java field it fills
     * @param words the words allowed and the values they stand for
     * @param <E>   the type of value
     * @return the key
     */
    public static <E> FileKey<E> choice(String word, String field, Keywords<E> words) {
        return new FileKey<>(word, field, new Kind<>() {
            @Override
            public E read(YamlDocument doc, String pointer) {
                return doc.requiredChoice(pointer, words);
            }

            @Override
            public String text(E value) {
                return words.word(value);
            }

            @Override
            public String allowed() {
                return words.describe();
            }
        }, null, true);
    }

    /**
     * A required section: a nested mapping or list (or a file's path) that its own reader reads;
     * reading it gives the section's pointer.
     *
     * @param word    the file's key
     * @param field   the Java field it fills
     * @param allowed what the section holds, as messages say it ("a plant mapping")
     * @return the key
     */
    public static FileKey<String> section(String word, String field, String allowed) {
        return new FileKey<>(word, field, new Kind<>() {
            @Override
            public String read(YamlDocument doc, String pointer) {
                return pointer;
            }

            @Override
            public String text(String value) {
                return value;
            }

            @Override
            public String allowed() {
                return allowed;
            }
        }, null, true);
    }

    /**
     * This key made optional, with the value it takes when the file leaves it out.
     *
     * @param value the default
     * @return the optional key
     */
    public FileKey<T> orElse(T value) {
        return new FileKey<>(word, field, kind, Objects.requireNonNull(value, "value"), false);
    }

    /**
     * This key made optional with no fixed default (the reader decides, or the key means "none"
     * when absent).
     *
     * @return the optional key
     */
    public FileKey<T> optional() {
        return new FileKey<>(word, field, kind, null, false);
    }

    /** @return the word the file uses */
    public String word() {
        return word;
    }

    /** @return the Java field the key fills */
    public String field() {
        return field;
    }

    /** @return whether a file must give the key */
    public boolean required() {
        return required;
    }

    /** @return the default, when the key is optional and has one */
    public Optional<T> defaultValue() {
        return Optional.ofNullable(absent);
    }

    /** @return what the value must be, as messages and help say it: "a number (finite and &gt; 0)" */
    public String allowed() {
        return kind.allowed();
    }

    /**
     * The value as a YAML file writes it: numbers in their shortest exact form, words from the table.
     *
     * @param value the value
     * @return the text
     */
    public String text(T value) {
        return kind.text(value);
    }

    /** @return the default as help and README show it: "required", "none" or the value's text */
    public String defaultText() {
        if (required) {
            return "required";
        }
        return absent == null ? "none" : kind.text(absent);
    }

    /**
     * Whether the mapping at a pointer gives this key.
     *
     * @param doc     the document
     * @param mapping the mapping's pointer
     * @return true when the key is written (even with no value)
     */
    public boolean isIn(YamlDocument doc, String mapping) {
        return doc.has(pointer(mapping));
    }

    /**
     * The key's pointer inside a mapping.
     *
     * @param mapping the mapping's pointer
     * @return the key's pointer
     */
    public String pointer(String mapping) {
        return YamlDocument.child(mapping, word);
    }

    /**
     * The value as given, or the default.
     *
     * @param doc     the document
     * @param mapping the mapping's pointer
     * @return the value
     * @throws InputFileException when the key is required and absent, or its value is not allowed
     * @throws IllegalStateException when the key is optional without a default and absent (read it
     *                               with {@link #find} instead)
     */
    public T read(YamlDocument doc, String mapping) {
        if (isIn(doc, mapping)) {
            return kind.read(doc, pointer(mapping));
        }
        if (required) {
            throw doc.missing(pointer(mapping), kind.allowed());
        }
        if (absent == null) {
            throw new IllegalStateException(word + " has no default; read it with find");
        }
        return absent;
    }

    /**
     * The value as given, or empty when the key is absent.
     *
     * @param doc     the document
     * @param mapping the mapping's pointer
     * @return the value given
     * @throws InputFileException when the value is not allowed
     */
    public Optional<T> find(YamlDocument doc, String mapping) {
        return isIn(doc, mapping) ? Optional.of(kind.read(doc, pointer(mapping))) : Optional.empty();
    }

    /** Double.toString is the shortest text that reads back to the same double; YAML spells infinity its own way. */
    private static String yamlNumber(double value) {
        if (Double.isInfinite(value)) {
            return value > 0 ? ".inf" : "-.inf";
        }
        return Double.toString(value);
    }
}
