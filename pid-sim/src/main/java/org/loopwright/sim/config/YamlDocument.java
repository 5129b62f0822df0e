package org.loopwright.sim.config;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.MissingNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.fasterxml.jackson.dataformat.yaml.YAMLParser;

/**
 * A YAML file read into a Jackson {@link JsonNode} tree, with the line and column of every node
 * kept by its JSON pointer, so that a check made long after parsing can still say where in the
 * file the problem is. Nodes are addressed by JSON pointer ({@code ""} is the root,
 * {@code "/controller/gain"} a nested key, {@code "/steps/2"} the third list item).
 *
 * <p>The typed readers check a value and raise {@link InputFileException} naming the file, the
 * line and column, the key, the value as written and what is allowed, for example
 * {@code bath.yaml:3:1: sample-period must be finite and > 0: sample-period=-0.1}. The position of an
 * object member is where its key starts; of a list item or the root, where the value starts. Keys
 * are named in messages by their path: {@code gain}, {@code controller.gain}, {@code steps[2].time}.
 *
 * <p>A key written twice in one object is an error (YAML forbids it; Jackson would keep the last).
 *
 * <p>Thread-safe: immutable after parsing.
 */
public final class YamlDocument {

    /** The most characters in a controller or scenario file (1 MiB): a few hundred lines are plenty. */
    public static final int MAX_CHARS = 1 << 20;

    private static final YAMLFactory YAML = YAMLFactory.builder().build();
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

    private final String fileName;
    private final JsonNode root;
    private final Map<String, TextPosition> positions;
    private final Map<String, String> sourceText;

    private YamlDocument(String fileName, JsonNode root, Map<String, TextPosition> positions,
            Map<String, String> sourceText) {
        this.fileName = fileName;
        this.root = root;
        this.positions = positions;
        this.sourceText = sourceText;
    }

    /**
     * Reads and parses a file; the file is named in messages as given.
     *
     * @throws InputFileException when the file cannot be read or is not valid YAML
     */
    public static YamlDocument read(Path file) {
        return parse(file.toString(), InputText.read(file));
    }

    /**
     * Parses YAML text.
     *
     * @param fileName how messages name the source
     * @param text     the YAML text; an empty text is an empty mapping
     * @throws InputFileException when the text is not valid YAML, holds more than one document,
     *                            repeats a key in one mapping, uses an anchor or alias, or is longer
     *                            than {@link #MAX_CHARS}
     */
    public static YamlDocument parse(String fileName, String text) {
        if (text.length() > MAX_CHARS) {
            throw InputFileException.whole(fileName, "has " + text.length()
                    + " characters; the limit for a controller or scenario file is " + MAX_CHARS);
        }
        Map<String, TextPosition> positions = new HashMap<>();
        Map<String, String> sourceText = new HashMap<>();
        try (JsonParser parser = YAML.createParser(new StringReader(text))) {
            TreeBuilder builder = new TreeBuilder(fileName, parser, positions, sourceText);
            JsonToken first = parser.nextToken();
            JsonNode root;
            if (first == null) {
                root = NODES.objectNode();
                positions.put("", TextPosition.START);
            } else {
                positions.put("", positionOf(parser.currentTokenLocation()));
                root = builder.value("");
                if (parser.nextToken() != null) {
                    TextPosition at = positionOf(parser.currentTokenLocation());
                    throw InputFileException.at(fileName, at.line(), at.column(),
                            "a second YAML document starts here; one document is allowed");
                }
            }
            return new YamlDocument(fileName, root, Map.copyOf(positions), Map.copyOf(sourceText));
        } catch (JsonProcessingException e) {
            TextPosition at = e.getLocation() == null ? TextPosition.START : positionOf(e.getLocation());
            String reason = e.getOriginalMessage().lines().findFirst().orElse("syntax error");
            throw InputFileException.at(fileName, at.line(), at.column(), "not valid YAML: " + reason);
        } catch (IOException e) {
            throw InputFileException.whole(fileName, "cannot be read (" + e + ")", e);
        }
    }

    /** Builds the tree from the token stream, recording positions and the source text of scalars. */
    private static final class TreeBuilder {
        private final String fileName;
        private final JsonParser parser;
        private final Map<String, TextPosition> positions;
        private final Map<String, String> sourceText;

        TreeBuilder(String fileName, JsonParser parser, Map<String, TextPosition> positions,
                Map<String, String> sourceText) {
            this.fileName = fileName;
            this.parser = parser;
            this.positions = positions;
            this.sourceText = sourceText;
        }

        /** The value at the current token; its own position is already recorded. */
        JsonNode value(String pointer) throws IOException {
            JsonToken token = parser.currentToken();
            switch (token) {
                case START_OBJECT:
                    return object(pointer);
                case START_ARRAY:
                    return list(pointer);
                default:
                    if (parser instanceof YAMLParser yaml && yaml.isCurrentAlias()) {
                        TextPosition at = positionOf(parser.currentTokenLocation());
                        throw InputFileException.at(fileName, at.line(), at.column(), "YAML anchors and aliases are"
                                + " not supported; write the value itself: *" + parser.getText());
                    }
                    sourceText.put(pointer, parser.getText());
                    return scalar(token);
            }
        }

        private ObjectNode object(String pointer) throws IOException {
            ObjectNode object = NODES.objectNode();
            while (parser.nextToken() == JsonToken.FIELD_NAME) {
                String key = parser.currentName();
                String member = child(pointer, key);
                TextPosition at = positionOf(parser.currentTokenLocation());
                if (object.has(key)) {
                    TextPosition first = positions.get(member);
                    throw InputFileException.at(fileName, at.line(), at.column(),
                            "duplicate key '" + key + "' (first at line " + first.line() + "); each key may appear once");
                }
                positions.put(member, at);
                parser.nextToken();
                object.set(key, value(member));
            }
            return object;
        }

        private ArrayNode list(String pointer) throws IOException {
            ArrayNode list = NODES.arrayNode();
            int index = 0;
            while (parser.nextToken() != JsonToken.END_ARRAY) {
                String item = child(pointer, index++);
                positions.put(item, positionOf(parser.currentTokenLocation()));
                list.add(value(item));
            }
            return list;
        }

        /** YAML 1.1's .inf, -.inf and .nan, which Jackson tokenises as floats but cannot convert itself. */
        private double floatValue(String text) throws IOException {
            return switch (text) {
                case ".inf", ".Inf", ".INF", "+.inf", "+.Inf", "+.INF" -> Double.POSITIVE_INFINITY;
                case "-.inf", "-.Inf", "-.INF" -> Double.NEGATIVE_INFINITY;
                case ".nan", ".NaN", ".NAN" -> Double.NaN;
                default -> parser.getDoubleValue();
            };
        }

        private JsonNode scalar(JsonToken token) throws IOException {
            return switch (token) {
                case VALUE_NUMBER_INT -> parser.getNumberType() == JsonParser.NumberType.BIG_INTEGER
                        ? NODES.numberNode(parser.getBigIntegerValue())
                        : NODES.numberNode(parser.getLongValue());
                case VALUE_NUMBER_FLOAT -> NODES.numberNode(floatValue(parser.getText()));
                case VALUE_TRUE -> NODES.booleanNode(true);
                case VALUE_FALSE -> NODES.booleanNode(false);
                case VALUE_NULL -> NODES.nullNode();
                default -> NODES.textNode(parser.getText());
            };
        }
    }

    private static TextPosition positionOf(JsonLocation location) {
        return new TextPosition(Math.max(1, location.getLineNr()), Math.max(1, location.getColumnNr()));
    }

    /** The pointer of a key inside the object at {@code pointer}. */
    public static String child(String pointer, String key) {
        return pointer + "/" + key.replace("~", "~0").replace("/", "~1");
    }

    /** The pointer of an item inside the list at {@code pointer}. */
    public static String child(String pointer, int index) {
        return pointer + "/" + index;
    }

    /** The file as messages name it. */
    public String fileName() {
        return fileName;
    }

    /** The whole tree. */
    public JsonNode root() {
        return root;
    }

    /** The node at a pointer, or a missing node. A key written with no value ({@code gain:}) is a null node. */
    public JsonNode node(String pointer) {
        return root.at(pointer);
    }

    /** Whether the pointer names a node (a key written with no value counts). */
    public boolean has(String pointer) {
        return !(node(pointer) instanceof MissingNode);
    }

    /**
     * Where the node starts: its key for an object member, its value otherwise. For a pointer that
     * names nothing, the position of its nearest existing parent.
     */
    public TextPosition position(String pointer) {
        String at = pointer;
        while (!positions.containsKey(at)) {
            at = parentOf(at);
        }
        return positions.get(at);
    }

    /** The value as written in the file: a scalar ("2.50", "tustin"), a list ("[1, 2.5]"); "(empty)" for a key with no value. */
    public String sourceText(String pointer) {
        JsonNode value = node(pointer);
        if (value.isArray()) {
            List<String> items = new ArrayList<>();
            for (int i = 0; i < value.size(); i++) {
                items.add(sourceText(child(pointer, i)));
            }
            return "[" + String.join(", ", items) + "]";
        }
        String text = value.isNull() ? "" : sourceText.getOrDefault(pointer, value.toString());
        return text.isBlank() ? "(empty)" : text;
    }

    /** How messages name the node: {@code gain}, {@code controller.gain}, {@code steps[2].time}; "the document" for the root. */
    public String keyName(String pointer) {
        if (pointer.isEmpty()) {
            return "the document";
        }
        StringBuilder name = new StringBuilder();
        String parent = "";
        for (String token : pointer.substring(1).split("/", -1)) {
            String key = token.replace("~1", "/").replace("~0", "~");
            if (node(parent).isArray()) {
                name.append('[').append(key).append(']');
            } else {
                name.append(name.length() == 0 ? "" : ".").append(key);
            }
            parent = parent + "/" + token;
        }
        return name.toString();
    }

    /** An error located at the node (or its nearest existing parent), with the given text after the location. */
    public InputFileException error(String pointer, String detail) {
        TextPosition at = position(pointer);
        return InputFileException.at(fileName, at.line(), at.column(), detail);
    }

    /**
     * Requires a mapping at the pointer whose keys are all allowed.
     *
     * @param allowedKeys the keys allowed, in the order the message lists them
     * @throws InputFileException "unknown key 'foo'; allowed: a, b, c" at the first unknown key, or
     *                            when the node is not a mapping
     */
    public void requireKeys(String pointer, Collection<String> allowedKeys) {
        requireKeys(pointer, allowedKeys, "");
    }

    /**
     * Requires a mapping at the pointer whose keys are all allowed, naming the mapping's kind in the
     * message: "unknown key 'foo' for plant type tank; allowed: a, b, c".
     *
     * @param context how the message names the mapping ("for plant type tank"), or empty for
     *                "in &lt;key&gt;"
     * @throws InputFileException at the first unknown key, or when the node is not a mapping
     */
    public void requireKeys(String pointer, Collection<String> allowedKeys, String context) {
        JsonNode object = node(pointer);
        if (!object.isObject()) {
            throw error(pointer, keyName(pointer) + " must be a mapping of keys to values: "
                    + keyName(pointer) + "=" + sourceText(pointer));
        }
        Iterator<String> keys = object.fieldNames();
        while (keys.hasNext()) {
            String key = keys.next();
            if (!allowedKeys.contains(key)) {
                String where = !context.isEmpty() ? " " + context : pointer.isEmpty() ? "" : " in " + keyName(pointer);
                throw error(child(pointer, key), "unknown key '" + key + "'" + where + "; allowed: "
                        + String.join(", ", allowedKeys));
            }
        }
    }

    /** An error for a required key that is absent, at its parent's position. */
    public InputFileException missing(String pointer, String whatIsAllowed) {
        String parent = parentOf(pointer);
        String key = lastKey(pointer);
        String where = parent.isEmpty() ? "" : " in " + keyName(parent);
        return error(parent, "missing key '" + key + "'" + where + " (" + whatIsAllowed + ")");
    }

    /**
     * A required number.
     *
     * @throws InputFileException when the key is absent, not a number, or breaks the rule
     */
    public double requiredNumber(String pointer, NumberRule rule) {
        if (!has(pointer)) {
            throw missing(pointer, rule.describeNumber());
        }
        return number(pointer, rule);
    }

    /**
     * An optional number; empty when the key is absent.
     *
     * @throws InputFileException when the key is present but not a number, or breaks the rule
     */
    public OptionalDouble optionalNumber(String pointer, NumberRule rule) {
        return has(pointer) ? OptionalDouble.of(number(pointer, rule)) : OptionalDouble.empty();
    }

    /** An optional number with a value for when the key is absent. */
    public double optionalNumber(String pointer, NumberRule rule, double absent) {
        return optionalNumber(pointer, rule).orElse(absent);
    }

    private double number(String pointer, NumberRule rule) {
        JsonNode value = node(pointer);
        String key = keyName(pointer);
        if (!value.isNumber()) {
            throw error(pointer, key + " must be " + rule.describeNumber() + ": " + key + "=" + sourceText(pointer));
        }
        double number = value.doubleValue();
        if (!rule.accepts(number)) {
            String allowed = rule.description().isEmpty() ? rule.describeNumber() : rule.description();
            throw error(pointer, key + " must be " + allowed + ": " + key + "=" + sourceText(pointer));
        }
        return number;
    }

    /**
     * A list of numbers, each checked by the rule.
     *
     * @throws InputFileException when the key is absent, not a list, or an item is not an allowed number
     */
    public double[] numberList(String pointer, NumberRule rule) {
        List<String> items = items(pointer);
        double[] numbers = new double[items.size()];
        for (int i = 0; i < numbers.length; i++) {
            numbers[i] = number(items.get(i), rule);
        }
        return numbers;
    }

    /**
     * The pointers of a list's items, for loaders that read lists of objects.
     *
     * @throws InputFileException when the key is absent or not a list
     */
    public List<String> items(String pointer) {
        if (!has(pointer)) {
            throw missing(pointer, "a list");
        }
        JsonNode list = node(pointer);
        String key = keyName(pointer);
        if (!list.isArray()) {
            throw error(pointer, key + " must be a list: " + key + "=" + sourceText(pointer));
        }
        List<String> items = new ArrayList<>(list.size());
        for (int i = 0; i < list.size(); i++) {
            items.add(child(pointer, i));
        }
        return items;
    }

    /**
     * A whole number from a range (a seed, a count of samples).
     *
     * @throws InputFileException when the value is not a whole number in the range
     */
    public long wholeNumber(String pointer, long least, long most) {
        JsonNode value = node(pointer);
        String key = keyName(pointer);
        if (!value.isIntegralNumber() || !value.canConvertToLong() || value.longValue() < least
                || value.longValue() > most) {
            throw error(pointer, key + " must be " + describeWhole(least, most) + ": " + key + "="
                    + sourceText(pointer));
        }
        return value.longValue();
    }

    /** "a whole number", with its bounds where they are narrower than a long's: "a whole number &gt;= 0". */
    static String describeWhole(long least, long most) {
        String lower = least == Long.MIN_VALUE ? "" : " >= " + least;
        String upper = most == Long.MAX_VALUE ? "" : (lower.isEmpty() ? " <= " : " and <= ") + most;
        return "a whole number" + lower + upper;
    }

    /**
     * A required word from a table.
     *
     * @throws InputFileException when the key is absent or its value is not one of the words
     */
    public <T> T requiredChoice(String pointer, Keywords<T> words) {
        if (!has(pointer)) {
            throw missing(pointer, words.describe());
        }
        return choice(pointer, words);
    }

    /** An optional word from a table, with a value for when the key is absent. */
    public <T> T optionalChoice(String pointer, Keywords<T> words, T absent) {
        return has(pointer) ? choice(pointer, words) : absent;
    }

    private <T> T choice(String pointer, Keywords<T> words) {
        JsonNode value = node(pointer);
        String key = keyName(pointer);
        return (value.isTextual() ? words.value(value.textValue()) : Optional.<T>empty())
                .orElseThrow(() -> error(pointer, key + " must be " + words.describe() + ": " + key + "="
                        + sourceText(pointer)));
    }

    /**
     * A required non-empty text value.
     *
     * @throws InputFileException when the key is absent, or its value is not a text or is empty
     */
    public String requiredText(String pointer) {
        if (!has(pointer)) {
            throw missing(pointer, "a text");
        }
        JsonNode value = node(pointer);
        String key = keyName(pointer);
        if (!value.isValueNode() || value.isNull() || value.asText().isBlank()) {
            throw error(pointer, key + " must be a non-empty text: " + key + "=" + sourceText(pointer));
        }
        return value.asText();
    }

    /**
     * An optional non-empty text value, with a value for when the key is absent.
     *
     * @throws InputFileException when the key is present but its value is not a text or is empty
     */
    public String optionalText(String pointer, String absent) {
        return has(pointer) ? requiredText(pointer) : absent;
    }

    private static String parentOf(String pointer) {
        return pointer.isEmpty() ? "" : pointer.substring(0, pointer.lastIndexOf('/'));
    }

    private static String lastKey(String pointer) {
        return pointer.substring(pointer.lastIndexOf('/') + 1).replace("~1", "/").replace("~0", "~");
    }
}
