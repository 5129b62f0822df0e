package org.loopwright.sim.config;

import java.util.List;
import java.util.Optional;
import java.util.function.Supplier;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.loopwright.pid.InvalidSettingException;

/**
 * One mapping of a file read through its declared keys: every key written must be declared, values
 * are read by their declaration, and a model's {@link InvalidSettingException} (naming a Java
 * field) is reported at the file key that fills the field, in the file's words.
 *
 * <p>Example: {@code bath.yaml:4:1: sample-period must be finite and > 0: sample-period=-0.1}, from
 * {@code samplePeriodSeconds must be finite and > 0} thrown by the settings' builder.
 *
 * <p>Not thread-safe: one reader uses it.
 */
public final class FileMapping {

    private static final Pattern FIELD_NAME = Pattern.compile("\\b[a-z][A-Za-z]*\\b");

    private final YamlDocument doc;
    private final String pointer;
    private final List<FileKey<?>> keys;

    /**
     * Checks that the mapping at a pointer holds only declared keys.
     *
     * @param doc     the document
     * @param pointer the mapping's JSON pointer ("" for the whole document)
     * @param keys    the keys it may hold, in the order messages list them
     * @param context how a message names the mapping's kind when a key is unknown ("plant type tank"),
     *                or empty for the plain message
     * @throws InputFileException when the node is not a mapping or holds an undeclared key
     */
    public FileMapping(YamlDocument doc, String pointer, List<FileKey<?>> keys, String context) {
        this.doc = doc;
        this.pointer = pointer;
        this.keys = List.copyOf(keys);
        doc.requireKeys(pointer, words(keys), context);
    }

    /**
     * The words of some keys, in order.
     *
     * @param keys the keys
     * @return their words
     */
    public static List<String> words(List<FileKey<?>> keys) {
        return keys.stream().map(FileKey::word).toList();
    }

    /** @return the document */
    public YamlDocument doc() {
        return doc;
    }

    /** @return the mapping's pointer */
    public String pointer() {
        return pointer;
    }

    /**
     * The value given, or the key's default.
     *
     * @param key a declared key
     * @param <T> its value type
     * @return the value
     * @throws InputFileException when a required key is absent or a value is not allowed
     */
    public <T> T get(FileKey<T> key) {
        return key.read(doc, pointer);
    }

    /**
     * The value given, or empty.
     *
     * @param key a declared key
     * @param <T> its value type
     * @return the value given
     * @throws InputFileException when the value is not allowed
     */
    public <T> Optional<T> find(FileKey<T> key) {
        return key.find(doc, pointer);
    }

    /**
     * Whether the file gives a key.
     *
     * @param key a declared key
     * @return true when it is written
     */
    public boolean has(FileKey<?> key) {
        return key.isIn(doc, pointer);
    }

    /**
     * An error at a key (or at the mapping when the key is absent).
     *
     * @param key    the key the problem is about
     * @param detail what is wrong and what is allowed
     * @return the exception to throw
     */
    public InputFileException error(FileKey<?> key, String detail) {
        return doc.error(key.pointer(pointer), detail);
    }

    /**
     * How messages name a key: its path from the document's root ({@code controller.gain}).
     *
     * @param key the key
     * @return the name
     */
    public String name(FileKey<?> key) {
        return doc.keyName(key.pointer(pointer));
    }

    /**
     * Makes a model from values read here; its {@link InvalidSettingException} becomes an error at
     * the key that fills the field named.
     *
     * @param make builds the model
     * @param <T>  the model's type
     * @return the model
     * @throws InputFileException for the model's complaint, in file terms
     */
    public <T> T build(Supplier<T> make) {
        try {
            return make.get();
        } catch (InvalidSettingException e) {
            throw located(e);
        }
    }

    /**
     * Whether a field is filled by one of this mapping's keys.
     *
     * @param field the Java field
     * @return true when a key declares it
     */
    public boolean declares(String field) {
        return keyFor(field).isPresent();
    }

    /**
     * A model's complaint in file terms, at the key it is about (or the mapping, for a key not
     * written). Field names inside the rule ("must be &lt;= outputMax") become keys too.
     *
     * @param e the complaint
     * @return the exception to throw
     */
    public InputFileException located(InvalidSettingException e) {
        Optional<FileKey<?>> key = keyFor(e.field());
        String rule = fileTerms(e.rule());
        if (key.isEmpty()) {
            return doc.error(pointer, e.field() + " " + rule + ": " + e.field() + "=" + e.value());
        }
        String name = name(key.get());
        if (has(key.get())) {
            return doc.error(key.get().pointer(pointer), name + " " + rule + ": " + name + "="
                    + doc.sourceText(key.get().pointer(pointer)));
        }
        return doc.error(pointer, name + " " + rule + " (" + key.get().word() + " is not given)");
    }

    private Optional<FileKey<?>> keyFor(String field) {
        return keys.stream().filter(k -> k.field().equals(field)).findFirst();
    }

    private String fileTerms(String rule) {
        Matcher words = FIELD_NAME.matcher(rule);
        StringBuilder out = new StringBuilder();
        while (words.find()) {
            String word = words.group();
            words.appendReplacement(out, Matcher.quoteReplacement(keyFor(word).map(FileKey::word).orElse(word)));
        }
        words.appendTail(out);
        return out.toString();
    }
}
