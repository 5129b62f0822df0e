package org.loopwright.sim.config;

import java.util.Arrays;
import java.util.Objects;
import java.util.Optional;
import java.util.function.BiFunction;
import java.util.function.Function;
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

    /**
     * How a value of one kind is read from a document node and written as YAML text.
     *
     * @param read    reads the value at a pointer, checking it
     * @param text    writes a value as YAML text
     * @param allowed what the value must be, as messages say it
     */
    private record Kind<T>(BiFunction<YamlDocument, String, T> read, Function<T, String> text, String allowed) {
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

    private static <T> FileKey<T> required(String word, String field, Kind<T> kind) {
        return new FileKey<>(word, field, kind, null, true);
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
        return required(word, field, new Kind<>((doc, pointer) -> doc.requiredNumber(pointer, rule),
                FileKey::yamlNumber, rule.describeNumber()));
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
        return required(word, field, new Kind<>((doc, pointer) -> doc.numberList(pointer, rule),
                value -> Arrays.stream(value).mapToObj(FileKey::yamlNumber).collect(Collectors.joining(", ", "[", "]")),
                "a list of numbers" + (rule.description().isEmpty() ? "" : " (" + rule.description() + ")")));
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
        return required(word, field, new Kind<>((doc, pointer) -> doc.wholeNumber(pointer, least, most),
                String::valueOf, YamlDocument.describeWhole(least, most)));
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
        return required(word, field, new Kind<>((doc, pointer) -> doc.requiredChoice(pointer, words), words::word,
                words.describe()));
    }

    /**
     * A required non-empty text.
     *
     * @param word  the file's key
     * @param field the Java field it fills
     * @return the key
     */
    public static FileKey<String> text(String word, String field) {
        return required(word, field, new Kind<>((doc, pointer) -> doc.requiredText(pointer),
                value -> "\"" + value.replace("\\", "\\\\").replace("\"", "\\\"") + "\"", "a text"));
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
        return required(word, field, new Kind<>((doc, pointer) -> pointer, value -> value, allowed));
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
        return kind.text().apply(value);
    }

    /** @return the default as help and README show it: "required", "none" or the value's text */
    public String defaultText() {
        if (required) {
            return "required";
        }
        return absent == null ? "none" : kind.text().apply(absent);
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
            return kind.read().apply(doc, pointer(mapping));
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
        return isIn(doc, mapping) ? Optional.of(kind.read().apply(doc, pointer(mapping))) : Optional.empty();
    }

    /** Double.toString is the shortest text that reads back to the same double; YAML spells infinity its own way. */
    private static String yamlNumber(double value) {
        if (Double.isInfinite(value)) {
            return value > 0 ? ".inf" : "-.inf";
        }
        return Double.toString(value);
    }
}
