package org.loopwright.sim.replay;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;

/**
 * The built-in replay demo, bundled as resources: a water bath heater's controller file and a
 * logged trace with a manual-to-auto switch, a setpoint step and sensor dropouts. Invented demo
 * data, made by {@code make_water_bath_trace.py} beside the resources.
 *
 * <p>Thread-safe: stateless.
 */
public final class ReplayDemo {

    /** How messages name the demo's controller file. */
    public static final String CONTROLLER_NAME = "demo/water-bath-controller.yaml";
    /** How messages name the demo's trace. */
    public static final String TRACE_NAME = "demo/water-bath-trace.csv";

    private ReplayDemo() {
    }

    /** The demo controller file's text. */
    public static String controllerText() {
        return resource("water-bath-controller.yaml");
    }

    /** The demo trace's text. */
    public static String traceText() {
        return resource("water-bath-trace.csv");
    }

    private static String resource(String name) {
        try (InputStream in = ReplayDemo.class.getResourceAsStream("demo/" + name)) {
            if (in == null) {
                throw new IllegalStateException("demo resource missing from the build: " + name);
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
