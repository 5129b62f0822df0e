package org.loopwright.sim.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.loopwright.sim.report.JsonOutput;

/**
 * JSON trees of the commands that are not records yet, on {@link JsonOutput}'s mapper: numbers that are
 * not finite (none, not applicable) become null.
 */
final class Json {

    private static final ObjectMapper MAPPER = JsonOutput.mapper();

    private Json() {
    }

    static ObjectNode object() {
        return MAPPER.createObjectNode();
    }

    static ArrayNode array() {
        return MAPPER.createArrayNode();
    }

    /** Puts {@code value}, or null when it is NaN or infinite. */
    static ObjectNode number(ObjectNode node, String key, double value) {
        if (Double.isFinite(value)) {
            node.put(key, value);
        } else {
            node.putNull(key);
        }
        return node;
    }

    static String pretty(Object node) {
        try {
            return MAPPER.writerWithDefaultPrettyPrinter().writeValueAsString(node);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a JSON tree always serialises", e);
        }
    }
}
