package org.loopwright.sim.report;

import java.io.IOException;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.PropertyNamingStrategies;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.SerializerProvider;
import com.fasterxml.jackson.databind.module.SimpleModule;
import com.fasterxml.jackson.databind.ser.std.StdSerializer;

/**
 * The one JSON writer of the harness's outputs: results are records serialised by Jackson with
 * snake_case keys ({@code riseTimeSeconds} becomes {@code rise_time_seconds}), a number that is not
 * finite (a figure that does not exist or apply) written as {@code null}, and {@code -0.0} as {@code 0.0}.
 * Enum values are written by the callers as the words the files use (a {@link org.loopwright.sim.config.Keywords}
 * table), never as Java constant names.
 *
 * <p>Thread-safe: the mapper is configured once and only read.
 */
public final class JsonOutput {

    private static final ObjectMapper MAPPER = new ObjectMapper()
            .setPropertyNamingStrategy(PropertyNamingStrategies.SNAKE_CASE)
            .enable(SerializationFeature.INDENT_OUTPUT)
            .registerModule(new SimpleModule("loopwright-numbers")
                    .addSerializer(Double.class, new FiniteOrNull())
                    .addSerializer(double.class, new FiniteOrNull()));

    private JsonOutput() {
    }

    /** @return the configured mapper, for callers that build trees */
    public static ObjectMapper mapper() {
        return MAPPER;
    }

    /**
     * A result as indented JSON text.
     *
     * @param result a record (or a tree)
     * @return the text
     */
    public static String text(Object result) {
        try {
            return MAPPER.writeValueAsString(result);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a result record always serialises: " + result.getClass(), e);
        }
    }

    /** Writes non-finite doubles as null and -0.0 as 0.0. */
    private static final class FiniteOrNull extends StdSerializer<Double> {
        private static final long serialVersionUID = 1L;

        FiniteOrNull() {
            super(Double.class);
        }

        @Override
        public void serialize(Double value, JsonGenerator out, SerializerProvider provider) throws IOException {
            if (value == null || !Double.isFinite(value)) {
                out.writeNull();
            } else {
                out.writeNumber(value == 0.0 ? 0.0 : value);
            }
        }
    }
}
