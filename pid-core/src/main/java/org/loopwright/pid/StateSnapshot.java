package org.loopwright.pid;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * The whole dynamic state of a {@link PidController}, for a warm restart, with a text form that
 * can be written to a file. The text form is one {@code key=value} per line, lines starting with
 * {@code #} ignored, numbers in Java's shortest round-trip form:
 * <pre>
 * loopwright-state=1
 * action=reverse
 * output-kind=position
 * output-min=0.0
 * output-max=100.0
 * wrap-span=0.0
 * mode=automatic
 * started=true
 * integral=41.7
 * ...
 * </pre>
 * The first five keys describe the configuration the state belongs to: a snapshot restores only
 * into a controller with the same action, output kind, output range and wrap span.
 *
 * <p>Built only by {@link PidController#snapshot()} and {@link #parse(String)}, so a snapshot is
 * always valid (every number finite) and a restore never brings in a state the controller could not
 * have reached; a state field added later breaks no caller. Immutable and thread-safe.
 */
public final class StateSnapshot {

    /** The state itself; the field names are those of the controller. */
    record Values(Action action, OutputKind outputKind, double outputMin, double outputMax,
            double wrapSpan, Mode mode, boolean started, double integral, double derivativeState,
            double previousError, double previousSetpoint, double previousMeasurement, double previousUnlimited,
            double previousOutput, double previousFeedforward, boolean feedforwardApplied, double manualValue,
            long faultCount) {
    }

    private final Values values;

    StateSnapshot(Values values) {
        this.values = values;
    }

    /** The state, for the controller that restores it and for tests in this package. */
    Values values() {
        return values;
    }

    /** The version of the text form written by {@link #toText()}. */
    public static final int TEXT_FORMAT_VERSION = 1;
    private static final String HEADER = "loopwright-state";

    void requireCompatibleWith(ControllerSettings s) {
        // named as in the text form, which is what the user has in front of them
        mismatch("action", word(values.action()), word(s.action()));
        mismatch("output-kind", word(values.outputKind()), word(s.outputKind()));
        mismatch("output-min", values.outputMin(), s.outputMin());
        mismatch("output-max", values.outputMax(), s.outputMax());
        mismatch("wrap-span", values.wrapSpan(), s.wrapSpan());
    }

    private static void mismatch(String field, Object saved, Object current) {
        if (!saved.equals(current)) {
            throw new IllegalArgumentException("snapshot taken under another configuration: " + field + "=" + saved
                    + " in the snapshot, " + field + "=" + current + " in this controller");
        }
    }

    /** {@return the text form described in the class comment} */
    public String toText() {
        StringBuilder text = new StringBuilder();
        fields().forEach((key, value) -> text.append(key).append('=').append(value).append('\n'));
        return text.toString();
    }

    private Map<String, String> fields() {
        Values v = values;
        Map<String, String> f = new LinkedHashMap<>();
        f.put(HEADER, Integer.toString(TEXT_FORMAT_VERSION));
        f.put("action", word(v.action()));
        f.put("output-kind", word(v.outputKind()));
        f.put("output-min", Double.toString(v.outputMin()));
        f.put("output-max", Double.toString(v.outputMax()));
        f.put("wrap-span", Double.toString(v.wrapSpan()));
        f.put("mode", word(v.mode()));
        f.put("started", Boolean.toString(v.started()));
        f.put("integral", Double.toString(v.integral()));
        f.put("derivative-state", Double.toString(v.derivativeState()));
        f.put("previous-error", Double.toString(v.previousError()));
        f.put("previous-setpoint", Double.toString(v.previousSetpoint()));
        f.put("previous-measurement", Double.toString(v.previousMeasurement()));
        f.put("previous-unlimited", Double.toString(v.previousUnlimited()));
        f.put("previous-output", Double.toString(v.previousOutput()));
        f.put("previous-feedforward", Double.toString(v.previousFeedforward()));
        f.put("feedforward-applied", Boolean.toString(v.feedforwardApplied()));
        f.put("manual-value", Double.toString(v.manualValue()));
        f.put("fault-count", Long.toString(v.faultCount()));
        return f;
    }

    /** Equal when every state value is equal (doubles compared as {@link Double#equals}). */
    @Override
    public boolean equals(Object other) {
        return other instanceof StateSnapshot that && values.equals(that.values);
    }

    @Override
    public int hashCode() {
        return values.hashCode();
    }

    /** The text form, on one line. */
    @Override
    public String toString() {
        return toText().replace('\n', ' ').strip();
    }

    private static String word(Enum<?> value) {
        return value.name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /**
     * Reads the text form.
     *
     * @param text the text form, as {@link #toText()} writes it
     * @return the snapshot the text describes
     * @throws IllegalArgumentException naming the line and key of the first problem
     */
    public static StateSnapshot parse(String text) {
        Map<String, String> values = new LinkedHashMap<>();
        Map<String, Integer> lines = new LinkedHashMap<>();
        String[] rows = text.split("\\R");
        for (int i = 0; i < rows.length; i++) {
            String row = rows[i].strip();
            if (row.isEmpty() || row.startsWith("#")) {
                continue;
            }
            int eq = row.indexOf('=');
            if (eq < 0) {
                throw new IllegalArgumentException("state line " + (i + 1) + ": expected key=value, found '" + row + "'");
            }
            String key = row.substring(0, eq).strip();
            if (values.put(key, row.substring(eq + 1).strip()) != null) {
                throw new IllegalArgumentException("state line " + (i + 1) + ": key '" + key + "' given twice");
            }
            lines.put(key, i + 1);
        }
        Reader r = new Reader(values, lines);
        String version = r.text(HEADER);
        if (!version.equals(Integer.toString(TEXT_FORMAT_VERSION))) {
            throw new IllegalArgumentException(r.where(HEADER) + "format version must be " + TEXT_FORMAT_VERSION
                    + ": " + HEADER + "=" + version);
        }
        StateSnapshot snapshot = new StateSnapshot(new Values(r.choice("action", Action.class),
                r.choice("output-kind", OutputKind.class), r.number("output-min"), r.number("output-max"),
                r.number("wrap-span"), r.choice("mode", Mode.class), r.flag("started"), r.finite("integral"),
                r.finite("derivative-state"), r.finite("previous-error"), r.finite("previous-setpoint"),
                r.finite("previous-measurement"), r.finite("previous-unlimited"), r.finite("previous-output"),
                r.finite("previous-feedforward"), r.flag("feedforward-applied"), r.finite("manual-value"),
                r.count("fault-count")));
        values.keySet().removeAll(snapshot.fields().keySet());
        if (!values.isEmpty()) {
            String key = values.keySet().iterator().next();
            throw new IllegalArgumentException(r.where(key) + "unknown key '" + key + "'");
        }
        return snapshot;
    }

    private record Reader(Map<String, String> values, Map<String, Integer> lines) {

        String where(String key) {
            Integer line = lines.get(key);
            return line == null ? "state: " : "state line " + line + ": ";
        }

        String text(String key) {
            String value = values.get(key);
            if (value == null) {
                throw new IllegalArgumentException("state: key '" + key + "' is missing");
            }
            return value;
        }

        double number(String key) {
            String value = text(key);
            try {
                double parsed = Double.parseDouble(value);
                if (Double.isNaN(parsed)) {
                    throw new NumberFormatException();
                }
                return parsed;
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException(where(key) + key + " must be a number: " + key + "=" + value, e);
            }
        }

        double finite(String key) {
            double value = number(key);
            if (!Double.isFinite(value)) {
                throw new IllegalArgumentException(where(key) + key + " must be finite: " + key + "=" + value);
            }
            return value;
        }

        long count(String key) {
            String value = text(key);
            try {
                long parsed = Long.parseLong(value);
                if (parsed < 0) {
                    throw new NumberFormatException();
                }
                return parsed;
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException(where(key) + key + " must be a whole number >= 0: " + key + "=" + value, e);
            }
        }

        boolean flag(String key) {
            String value = text(key);
            if (!value.equals("true") && !value.equals("false")) {
                throw new IllegalArgumentException(where(key) + key + " must be true or false: " + key + "=" + value);
            }
            return Boolean.parseBoolean(value);
        }

        <E extends Enum<E>> E choice(String key, Class<E> type) {
            String value = text(key);
            for (E constant : type.getEnumConstants()) {
                if (word(constant).equals(value)) {
                    return constant;
                }
            }
            StringBuilder allowed = new StringBuilder();
            for (E constant : type.getEnumConstants()) {
                allowed.append(allowed.length() == 0 ? "" : " | ").append(word(constant));
            }
            throw new IllegalArgumentException(where(key) + key + " must be one of " + allowed + ": " + key + "=" + value);
        }
    }
}
