package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;

/** The expected structure of a command's JSON: the keys of an object, in order. */
final class JsonShape {

    private JsonShape() {
    }

    /** Asserts that {@code node} is an object with exactly these keys, in this order. */
    static void keys(JsonNode node, String... keys) {
        assertThat(node.isObject()).as("an object: %s", node).isTrue();
        List<String> names = new ArrayList<>();
        node.fieldNames().forEachRemaining(names::add);
        assertThat(names).containsExactly(keys);
    }
}
