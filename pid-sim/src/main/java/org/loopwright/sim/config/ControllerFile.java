package org.loopwright.sim.config;

import static java.util.Map.entry;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.OutputKind;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ControllerForm;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.form.PidGains;
import org.loopwright.pid.form.SeriesGains;

/**
 * The controller file: a YAML mapping of {@link ControllerSettings}, read with every error
 * located at a line and column and named by its file key, and written back so that reading gives
 * the same settings.
 *
 * <pre>
 * form: ideal                 # parallel | ideal | series
 * gain: 2.0                   # Kc, for ideal and series (required)
 * integral-time: 30.0         # Ti in seconds; omit for no integral action
 * derivative-time: 5.0        # Td in seconds; omit for none
 * proportional-gain: 2.0      # Kp, for parallel (required), with integral-gain Ki and derivative-gain Kd
 * sample-period: 0.1          # seconds (required)
 * setpoint-weight-proportional: 1.0    # b, 0–1 (default 1)
 * setpoint-weight-derivative: 0.0      # c, 0–1 (default 0)
 * derivative-filter: 10       # N = Td/Tf (default 10); or derivative-filter-time: Tf in seconds
 * integral-method: tustin     # forward-euler | backward-euler | tustin
 * derivative-method: backward-euler   # backward-euler | tustin | step-invariant | ramp-invariant | forward-euler
 * action: reverse             # reverse | direct
 * output-min: 0.0             # omit for no lower limit
 * output-max: 100.0           # omit for no upper limit
 * windup: back-calculation    # none | clamping | back-calculation | actuator-tracking
 * tracking-time: 12.0         # Tt in seconds, for back-calculation and actuator-tracking
 * output-slew: 50.0           # units per second; omit for none
 * setpoint-slew: 5.0          # units per second; omit for none
 * fault-policy: hold          # hold | safe-output
 * safe-output: 0.0            # required with fault-policy: safe-output, and only there
 * error-deadband: 0.0         # errors smaller than this count as zero
 * wrap-span: 0.0              # span of a circular process variable (360 for degrees); 0 for none
 * output-kind: position       # position | increment
 * </pre>
 * Every key except {@code form}, the form's first gain and {@code sample-period} is optional, with
 * the defaults of {@link ControllerSettings#builder()}. A key of another form, both filter keys,
 * {@code safe-output} without the safe-output policy and {@code tracking-time} without a tracking
 * windup scheme are errors, so that no key in a file is silently ignored.
 *
 * <p>Thread-safe: stateless.
 */
public final class ControllerFile {

    /** The words of {@code form}. */
    public static final Keywords<ControllerForm> FORMS = Keywords.of(
            entry("parallel", ControllerForm.PARALLEL), entry("ideal", ControllerForm.IDEAL),
            entry("series", ControllerForm.SERIES));
    /** The words of {@code integral-method}. */
    public static final Keywords<IntegralMethod> INTEGRAL_METHODS = Keywords.of(
            entry("forward-euler", IntegralMethod.FORWARD_EULER), entry("backward-euler", IntegralMethod.BACKWARD_EULER),
            entry("tustin", IntegralMethod.TUSTIN));
    /** The words of {@code derivative-method}. */
    public static final Keywords<DerivativeMethod> DERIVATIVE_METHODS = Keywords.of(
            entry("backward-euler", DerivativeMethod.BACKWARD_EULER), entry("tustin", DerivativeMethod.TUSTIN),
            entry("step-invariant", DerivativeMethod.STEP_INVARIANT),
            entry("ramp-invariant", DerivativeMethod.RAMP_INVARIANT),
            entry("forward-euler", DerivativeMethod.FORWARD_EULER));
    /** The words of {@code action}. */
    public static final Keywords<Action> ACTIONS = Keywords.of(
            entry("reverse", Action.REVERSE), entry("direct", Action.DIRECT));
    /** The words of {@code windup}. */
    public static final Keywords<WindupProtection> WINDUP = Keywords.of(
            entry("none", WindupProtection.NONE), entry("clamping", WindupProtection.CLAMPING),
            entry("back-calculation", WindupProtection.BACK_CALCULATION),
            entry("actuator-tracking", WindupProtection.ACTUATOR_TRACKING));
    /** The words of {@code fault-policy}. */
    public static final Keywords<FaultPolicy> FAULT_POLICIES = Keywords.of(
            entry("hold", FaultPolicy.HOLD), entry("safe-output", FaultPolicy.SAFE_OUTPUT));
    /** The words of {@code output-kind}. */
    public static final Keywords<OutputKind> OUTPUT_KINDS = Keywords.of(
            entry("position", OutputKind.POSITION), entry("increment", OutputKind.INCREMENT));

    /** Every key a controller mapping may hold, in the order {@link #toYaml} writes them. */
    public static final List<String> KEYS = List.of("form", "gain", "integral-time", "derivative-time",
            "proportional-gain", "integral-gain", "derivative-gain", "sample-period", "setpoint-weight-proportional",
            "setpoint-weight-derivative", "derivative-filter", "derivative-filter-time", "integral-method",
            "derivative-method", "action", "output-min", "output-max", "windup", "tracking-time", "output-slew",
            "setpoint-slew", "fault-policy", "safe-output", "error-deadband", "wrap-span", "output-kind");

    private static final List<String> IDEAL_GAIN_KEYS = List.of("gain", "integral-time", "derivative-time");
    private static final List<String> PARALLEL_GAIN_KEYS = List.of("proportional-gain", "integral-gain",
            "derivative-gain");

    /** Builder and gain field names (as {@link InvalidSettingException#field()} gives them) to file keys. */
    private static final Map<String, String> KEY_BY_FIELD = Map.ofEntries(
            entry("gain", "gain"), entry("integralTime", "integral-time"), entry("derivativeTime", "derivative-time"),
            entry("proportionalGain", "proportional-gain"), entry("integralGain", "integral-gain"),
            entry("derivativeGain", "derivative-gain"), entry("samplePeriodSeconds", "sample-period"),
            entry("proportionalSetpointWeight", "setpoint-weight-proportional"),
            entry("derivativeSetpointWeight", "setpoint-weight-derivative"),
            entry("derivativeFilterRatio", "derivative-filter"),
            entry("derivativeFilterTimeSeconds", "derivative-filter-time"),
            entry("outputMin", "output-min"), entry("outputMax", "output-max"),
            entry("trackingTimeSeconds", "tracking-time"), entry("outputSlewPerSecond", "output-slew"),
            entry("setpointSlewPerSecond", "setpoint-slew"), entry("safeOutput", "safe-output"),
            entry("errorDeadband", "error-deadband"), entry("wrapSpan", "wrap-span"));
    private static final Pattern FIELD_NAME = Pattern.compile("\\b[a-z][A-Za-z]*\\b");

    private ControllerFile() {
    }

    /**
     * Reads a controller file.
     *
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static ControllerSettings read(Path file) {
        return read(YamlDocument.read(file), "");
    }

    /**
     * Reads the controller mapping at a JSON pointer of a document ({@code ""} for the whole
     * document, {@code "/controller"} for one embedded in a scenario file).
     *
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static ControllerSettings read(YamlDocument doc, String pointer) {
        Reader reader = new Reader(doc, pointer);
        try {
            return reader.settings();
        } catch (InvalidSettingException e) {
            throw reader.located(e);
        }
    }

    /** Reads one controller mapping; keeps the document and the mapping's pointer for messages. */
    private static final class Reader {
        private final YamlDocument doc;
        private final String pointer;

        Reader(YamlDocument doc, String pointer) {
            this.doc = doc;
            this.pointer = pointer;
        }

        private String at(String key) {
            return YamlDocument.child(pointer, key);
        }

        private boolean has(String key) {
            return doc.has(at(key));
        }

        ControllerSettings settings() {
            doc.requireKeys(pointer, KEYS);
            ControllerForm form = doc.requiredChoice(at("form"), FORMS);
            ControllerSettings.Builder builder = ControllerSettings.builder()
                    .gains(gains(form))
                    .samplePeriodSeconds(doc.requiredNumber(at("sample-period"), NumberRule.ANY))
                    .setpointWeights(doc.optionalNumber(at("setpoint-weight-proportional"), NumberRule.ANY, 1.0),
                            doc.optionalNumber(at("setpoint-weight-derivative"), NumberRule.ANY, 0.0))
                    .integralMethod(doc.optionalChoice(at("integral-method"), INTEGRAL_METHODS, IntegralMethod.TUSTIN))
                    .derivativeMethod(doc.optionalChoice(at("derivative-method"), DERIVATIVE_METHODS,
                            DerivativeMethod.BACKWARD_EULER))
                    .action(doc.optionalChoice(at("action"), ACTIONS, Action.REVERSE))
                    .outputRange(doc.optionalNumber(at("output-min"), NumberRule.ANY, Double.NEGATIVE_INFINITY),
                            doc.optionalNumber(at("output-max"), NumberRule.ANY, Double.POSITIVE_INFINITY))
                    .outputSlewPerSecond(doc.optionalNumber(at("output-slew"), NumberRule.ANY, Double.POSITIVE_INFINITY))
                    .setpointSlewPerSecond(
                            doc.optionalNumber(at("setpoint-slew"), NumberRule.ANY, Double.POSITIVE_INFINITY))
                    .errorDeadband(doc.optionalNumber(at("error-deadband"), NumberRule.ANY, 0.0))
                    .wrapSpan(doc.optionalNumber(at("wrap-span"), NumberRule.ANY, 0.0))
                    .outputKind(doc.optionalChoice(at("output-kind"), OUTPUT_KINDS, OutputKind.POSITION));
            derivativeFilter(builder);
            windup(builder);
            faultPolicy(builder);
            return builder.build();
        }

        private PidGains gains(ControllerForm form) {
            List<String> own = form == ControllerForm.PARALLEL ? PARALLEL_GAIN_KEYS : IDEAL_GAIN_KEYS;
            List<String> foreign = form == ControllerForm.PARALLEL ? IDEAL_GAIN_KEYS : PARALLEL_GAIN_KEYS;
            String formWord = FORMS.word(form);
            for (String key : foreign) {
                if (has(key)) {
                    throw doc.error(at(key), doc.keyName(at(key)) + " does not belong to form " + formWord
                            + "; form " + formWord + " takes " + String.join(", ", own));
                }
            }
            if (!has(own.get(0))) {
                throw doc.error(at("form"), "missing key '" + own.get(0) + "' for form " + formWord + " ("
                        + NumberRule.NON_NEGATIVE.describeNumber() + ")");
            }
            double first = doc.requiredNumber(at(own.get(0)), NumberRule.ANY);
            return switch (form) {
                case PARALLEL -> new ParallelGains(first,
                        doc.optionalNumber(at("integral-gain"), NumberRule.ANY, 0.0),
                        doc.optionalNumber(at("derivative-gain"), NumberRule.ANY, 0.0));
                case IDEAL -> new IdealGains(first,
                        doc.optionalNumber(at("integral-time"), NumberRule.ANY, Double.POSITIVE_INFINITY),
                        doc.optionalNumber(at("derivative-time"), NumberRule.ANY, 0.0));
                case SERIES -> new SeriesGains(first,
                        doc.optionalNumber(at("integral-time"), NumberRule.ANY, Double.POSITIVE_INFINITY),
                        doc.optionalNumber(at("derivative-time"), NumberRule.ANY, 0.0));
            };
        }

        private void derivativeFilter(ControllerSettings.Builder builder) {
            if (has("derivative-filter") && has("derivative-filter-time")) {
                String later = doc.position(at("derivative-filter")).line()
                        > doc.position(at("derivative-filter-time")).line() ? "derivative-filter" : "derivative-filter-time";
                throw doc.error(at(later), "derivative-filter and derivative-filter-time exclude each other;"
                        + " give derivative-filter (N = Td/Tf) or derivative-filter-time (Tf in seconds)");
            }
            builder.derivativeFilterRatio(doc.optionalNumber(at("derivative-filter"), NumberRule.ANY,
                    ControllerSettings.DEFAULT_DERIVATIVE_FILTER_RATIO));
            doc.optionalNumber(at("derivative-filter-time"), NumberRule.ANY)
                    .ifPresent(builder::derivativeFilterTimeSeconds);
        }

        private void windup(ControllerSettings.Builder builder) {
            WindupProtection windup = doc.optionalChoice(at("windup"), WINDUP, WindupProtection.BACK_CALCULATION);
            builder.windupProtection(windup);
            if (has("tracking-time")) {
                if (windup != WindupProtection.BACK_CALCULATION && windup != WindupProtection.ACTUATOR_TRACKING) {
                    throw doc.error(at("tracking-time"), doc.keyName(at("tracking-time"))
                            + " applies only to windup: back-calculation or actuator-tracking (windup is "
                            + WINDUP.word(windup) + ")");
                }
                builder.trackingTimeSeconds(doc.requiredNumber(at("tracking-time"), NumberRule.ANY));
            }
        }

        private void faultPolicy(ControllerSettings.Builder builder) {
            FaultPolicy policy = doc.optionalChoice(at("fault-policy"), FAULT_POLICIES, FaultPolicy.HOLD);
            if (policy == FaultPolicy.SAFE_OUTPUT && !has("safe-output")) {
                throw doc.error(at("fault-policy"), "missing key 'safe-output' for fault-policy safe-output ("
                        + NumberRule.FINITE.describeNumber() + ")");
            }
            if (policy != FaultPolicy.SAFE_OUTPUT && has("safe-output")) {
                throw doc.error(at("safe-output"), doc.keyName(at("safe-output"))
                        + " applies only to fault-policy: safe-output (fault-policy is " + FAULT_POLICIES.word(policy)
                        + ")");
            }
            builder.faultPolicy(policy, doc.optionalNumber(at("safe-output"), NumberRule.ANY, 0.0));
        }

        /** The builder's complaint in file terms, at the key it is about (or the mapping, for a key not written). */
        InputFileException located(InvalidSettingException e) {
            String key = KEY_BY_FIELD.getOrDefault(e.field(), e.field());
            String rule = fileTerms(e.rule());
            String name = doc.keyName(at(key));
            if (has(key)) {
                return doc.error(at(key), name + " " + rule + ": " + name + "=" + doc.sourceText(at(key)));
            }
            return doc.error(pointer, name + " " + rule + " (" + key + " is not given)");
        }

        private static String fileTerms(String rule) {
            Matcher words = FIELD_NAME.matcher(rule);
            StringBuilder out = new StringBuilder();
            while (words.find()) {
                words.appendReplacement(out, Matcher.quoteReplacement(
                        KEY_BY_FIELD.getOrDefault(words.group(), words.group())));
            }
            words.appendTail(out);
            return out.toString();
        }
    }

    /**
     * Writes settings as a controller file that {@link #read} turns back into the same settings.
     * Unlimited values (no output limit, no slew limit) and keys that do not apply are left out.
     */
    public static String toYaml(ControllerSettings settings) {
        StringBuilder yaml = new StringBuilder("# Loopwright controller settings\n");
        PidGains gains = settings.gains();
        line(yaml, "form", FORMS.word(gains.form()));
        if (gains instanceof ParallelGains p) {
            number(yaml, "proportional-gain", p.proportionalGain());
            number(yaml, "integral-gain", p.integralGain());
            number(yaml, "derivative-gain", p.derivativeGain());
        } else if (gains instanceof IdealGains i) {
            timeGains(yaml, i.gain(), i.integralTime(), i.derivativeTime());
        } else if (gains instanceof SeriesGains s) {
            timeGains(yaml, s.gain(), s.integralTime(), s.derivativeTime());
        }
        number(yaml, "sample-period", settings.samplePeriodSeconds());
        number(yaml, "setpoint-weight-proportional", settings.proportionalSetpointWeight());
        number(yaml, "setpoint-weight-derivative", settings.derivativeSetpointWeight());
        ParallelGains parallel = settings.parallelGains();
        boolean filterFromRatio = parallel.derivativeGain() == 0.0
                || settings.derivativeFilterTimeSeconds() == parallel.derivativeGain() / parallel.proportionalGain()
                        / settings.derivativeFilterRatio();
        if (filterFromRatio) {
            number(yaml, "derivative-filter", settings.derivativeFilterRatio());
        } else {
            number(yaml, "derivative-filter-time", settings.derivativeFilterTimeSeconds());
        }
        line(yaml, "integral-method", INTEGRAL_METHODS.word(settings.integralMethod()));
        line(yaml, "derivative-method", DERIVATIVE_METHODS.word(settings.derivativeMethod()));
        line(yaml, "action", ACTIONS.word(settings.action()));
        finiteNumber(yaml, "output-min", settings.outputMin());
        finiteNumber(yaml, "output-max", settings.outputMax());
        WindupProtection windup = settings.windupProtection();
        line(yaml, "windup", WINDUP.word(windup));
        if (windup == WindupProtection.BACK_CALCULATION || windup == WindupProtection.ACTUATOR_TRACKING) {
            number(yaml, "tracking-time", settings.trackingTimeSeconds());
        }
        finiteNumber(yaml, "output-slew", settings.outputSlewPerSecond());
        finiteNumber(yaml, "setpoint-slew", settings.setpointSlewPerSecond());
        line(yaml, "fault-policy", FAULT_POLICIES.word(settings.faultPolicy()));
        if (settings.faultPolicy() == FaultPolicy.SAFE_OUTPUT) {
            number(yaml, "safe-output", settings.safeOutput());
        }
        number(yaml, "error-deadband", settings.errorDeadband());
        number(yaml, "wrap-span", settings.wrapSpan());
        line(yaml, "output-kind", OUTPUT_KINDS.word(settings.outputKind()));
        return yaml.toString();
    }

    private static void timeGains(StringBuilder yaml, double gain, double integralTime, double derivativeTime) {
        number(yaml, "gain", gain);
        finiteNumber(yaml, "integral-time", integralTime);
        number(yaml, "derivative-time", derivativeTime);
    }

    private static void finiteNumber(StringBuilder yaml, String key, double value) {
        if (Double.isFinite(value)) {
            number(yaml, key, value);
        }
    }

    /** Double.toString is the shortest text that reads back to the same double, and YAML reads it as a float. */
    private static void number(StringBuilder yaml, String key, double value) {
        line(yaml, key, Double.toString(value));
    }

    private static void line(StringBuilder yaml, String key, String value) {
        yaml.append(key).append(": ").append(value).append('\n');
    }
}
