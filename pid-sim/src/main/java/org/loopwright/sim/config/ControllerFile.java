package org.loopwright.sim.config;

import static java.util.Map.entry;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import java.util.function.Predicate;

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

    /** {@code form}: which gains the file gives. */
    public static final FileKey<ControllerForm> FORM = FileKey.choice("form", "gains", FORMS);
    /** {@code gain}: Kc of the ideal and series forms. */
    public static final FileKey<Double> GAIN = FileKey.number("gain", "gain", NumberRule.ANY);
    /** {@code integral-time}: Ti in seconds; absent for no integral action. */
    public static final FileKey<Double> INTEGRAL_TIME = FileKey.number("integral-time", "integralTime", NumberRule.ANY)
            .orElse(Double.POSITIVE_INFINITY);
    /** {@code derivative-time}: Td in seconds. */
    public static final FileKey<Double> DERIVATIVE_TIME = FileKey.number("derivative-time", "derivativeTime",
            NumberRule.ANY).orElse(0.0);
    /** {@code proportional-gain}: Kp of the parallel form. */
    public static final FileKey<Double> PROPORTIONAL_GAIN = FileKey.number("proportional-gain", "proportionalGain",
            NumberRule.ANY);
    /** {@code integral-gain}: Ki of the parallel form. */
    public static final FileKey<Double> INTEGRAL_GAIN = FileKey.number("integral-gain", "integralGain", NumberRule.ANY)
            .orElse(0.0);
    /** {@code derivative-gain}: Kd of the parallel form. */
    public static final FileKey<Double> DERIVATIVE_GAIN = FileKey.number("derivative-gain", "derivativeGain",
            NumberRule.ANY).orElse(0.0);
    /** {@code sample-period}: h in seconds. */
    public static final FileKey<Double> SAMPLE_PERIOD = FileKey.number("sample-period", "samplePeriodSeconds",
            NumberRule.ANY);
    /** {@code setpoint-weight-proportional}: b. */
    public static final FileKey<Double> PROPORTIONAL_WEIGHT = FileKey.number("setpoint-weight-proportional",
            "proportionalSetpointWeight", NumberRule.ANY).orElse(1.0);
    /** {@code setpoint-weight-derivative}: c. */
    public static final FileKey<Double> DERIVATIVE_WEIGHT = FileKey.number("setpoint-weight-derivative",
            "derivativeSetpointWeight", NumberRule.ANY).orElse(0.0);
    /** {@code derivative-filter}: N = Td/Tf. */
    public static final FileKey<Double> FILTER_RATIO = FileKey.number("derivative-filter", "derivativeFilterRatio",
            NumberRule.ANY).orElse(ControllerSettings.DEFAULT_DERIVATIVE_FILTER_RATIO);
    /** {@code derivative-filter-time}: Tf in seconds, instead of N. */
    public static final FileKey<Double> FILTER_TIME = FileKey.number("derivative-filter-time",
            "derivativeFilterTimeSeconds", NumberRule.ANY).optional();
    /** {@code integral-method}. */
    public static final FileKey<IntegralMethod> INTEGRAL_METHOD = FileKey.choice("integral-method", "integralMethod",
            INTEGRAL_METHODS).orElse(IntegralMethod.TUSTIN);
    /** {@code derivative-method}. */
    public static final FileKey<DerivativeMethod> DERIVATIVE_METHOD = FileKey.choice("derivative-method",
            "derivativeMethod", DERIVATIVE_METHODS).orElse(DerivativeMethod.BACKWARD_EULER);
    /** {@code action}. */
    public static final FileKey<Action> ACTION = FileKey.choice("action", "action", ACTIONS).orElse(Action.REVERSE);
    /** {@code output-min}: absent for no lower limit. */
    public static final FileKey<Double> OUTPUT_MIN = FileKey.number("output-min", "outputMin", NumberRule.ANY)
            .orElse(Double.NEGATIVE_INFINITY);
    /** {@code output-max}: absent for no upper limit. */
    public static final FileKey<Double> OUTPUT_MAX = FileKey.number("output-max", "outputMax", NumberRule.ANY)
            .orElse(Double.POSITIVE_INFINITY);
    /** {@code windup}. */
    public static final FileKey<WindupProtection> WINDUP_PROTECTION = FileKey.choice("windup", "windupProtection",
            WINDUP).orElse(WindupProtection.BACK_CALCULATION);
    /** {@code tracking-time}: Tt in seconds; absent for the rule of thumb. */
    public static final FileKey<Double> TRACKING_TIME = FileKey.number("tracking-time", "trackingTimeSeconds",
            NumberRule.ANY).optional();
    /** {@code output-slew}: units per second; absent for none. */
    public static final FileKey<Double> OUTPUT_SLEW = FileKey.number("output-slew", "outputSlewPerSecond",
            NumberRule.ANY).orElse(Double.POSITIVE_INFINITY);
    /** {@code setpoint-slew}: units per second; absent for none. */
    public static final FileKey<Double> SETPOINT_SLEW = FileKey.number("setpoint-slew", "setpointSlewPerSecond",
            NumberRule.ANY).orElse(Double.POSITIVE_INFINITY);
    /** {@code fault-policy}. */
    public static final FileKey<FaultPolicy> FAULT_POLICY = FileKey.choice("fault-policy", "faultPolicy",
            FAULT_POLICIES).orElse(FaultPolicy.HOLD);
    /** {@code safe-output}: required with the safe-output policy, and only there. */
    public static final FileKey<Double> SAFE_OUTPUT = FileKey.number("safe-output", "safeOutput", NumberRule.ANY)
            .optional();
    /** {@code error-deadband}. */
    public static final FileKey<Double> ERROR_DEADBAND = FileKey.number("error-deadband", "errorDeadband",
            NumberRule.ANY).orElse(0.0);
    /** {@code wrap-span}: 0 for a process variable that is not circular. */
    public static final FileKey<Double> WRAP_SPAN = FileKey.number("wrap-span", "wrapSpan", NumberRule.ANY)
            .orElse(0.0);
    /** {@code output-kind}. */
    public static final FileKey<OutputKind> OUTPUT_KIND = FileKey.choice("output-kind", "outputKind", OUTPUT_KINDS)
            .orElse(OutputKind.POSITION);

    /**
     * How each key is written from settings, in file order: when it applies and its value. The
     * order, the allowed keys and the field-to-key map all come from this list.
     */
    private static final List<Written<?>> WRITTEN = List.of(
            written(FORM, s -> true, s -> s.gains().form()),
            written(GAIN, ControllerFile::timeForm, s -> timeGains(s)[0]),
            written(INTEGRAL_TIME, ControllerFile::timeForm, s -> timeGains(s)[1]),
            written(DERIVATIVE_TIME, ControllerFile::timeForm, s -> timeGains(s)[2]),
            written(PROPORTIONAL_GAIN, s -> !timeForm(s), s -> s.parallelGains().proportionalGain()),
            written(INTEGRAL_GAIN, s -> !timeForm(s), s -> s.parallelGains().integralGain()),
            written(DERIVATIVE_GAIN, s -> !timeForm(s), s -> s.parallelGains().derivativeGain()),
            written(SAMPLE_PERIOD, s -> true, ControllerSettings::samplePeriodSeconds),
            written(PROPORTIONAL_WEIGHT, s -> true, ControllerSettings::proportionalSetpointWeight),
            written(DERIVATIVE_WEIGHT, s -> true, ControllerSettings::derivativeSetpointWeight),
            written(FILTER_RATIO, ControllerFile::filterFromRatio, ControllerSettings::derivativeFilterRatio),
            written(FILTER_TIME, s -> !filterFromRatio(s), ControllerSettings::derivativeFilterTimeSeconds),
            written(INTEGRAL_METHOD, s -> true, ControllerSettings::integralMethod),
            written(DERIVATIVE_METHOD, s -> true, ControllerSettings::derivativeMethod),
            written(ACTION, s -> true, ControllerSettings::action),
            written(OUTPUT_MIN, s -> true, ControllerSettings::outputMin),
            written(OUTPUT_MAX, s -> true, ControllerSettings::outputMax),
            written(WINDUP_PROTECTION, s -> true, ControllerSettings::windupProtection),
            written(TRACKING_TIME, s -> tracks(s.windupProtection()), ControllerSettings::trackingTimeSeconds),
            written(OUTPUT_SLEW, s -> true, ControllerSettings::outputSlewPerSecond),
            written(SETPOINT_SLEW, s -> true, ControllerSettings::setpointSlewPerSecond),
            written(FAULT_POLICY, s -> true, ControllerSettings::faultPolicy),
            written(SAFE_OUTPUT, s -> s.faultPolicy() == FaultPolicy.SAFE_OUTPUT, ControllerSettings::safeOutput),
            written(ERROR_DEADBAND, s -> true, ControllerSettings::errorDeadband),
            written(WRAP_SPAN, s -> true, ControllerSettings::wrapSpan),
            written(OUTPUT_KIND, s -> true, ControllerSettings::outputKind));

    /** Every key a controller mapping may hold, in the order {@link #toYaml} writes them. */
    public static final List<FileKey<?>> KEYS = WRITTEN.stream().<FileKey<?>>map(Written::key).toList();

    private static final List<FileKey<?>> TIME_GAIN_KEYS = List.of(GAIN, INTEGRAL_TIME, DERIVATIVE_TIME);
    private static final List<FileKey<?>> PARALLEL_GAIN_KEYS = List.of(PROPORTIONAL_GAIN, INTEGRAL_GAIN,
            DERIVATIVE_GAIN);

    /**
     * One key's writing rule.
     *
     * @param key     the key
     * @param applies whether the key is written for these settings
     * @param value   its value
     * @param <T>     the value type
     */
    private record Written<T>(FileKey<T> key, Predicate<ControllerSettings> applies,
            Function<ControllerSettings, T> value) {

        String text(ControllerSettings settings) {
            return key.text(value.apply(settings));
        }
    }

    private static <T> Written<T> written(FileKey<T> key, Predicate<ControllerSettings> applies,
            Function<ControllerSettings, T> value) {
        return new Written<>(key, applies, value);
    }

    private ControllerFile() {
    }

    /**
     * Reads a controller file.
     *
     * @param file the file
     * @return the settings
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static ControllerSettings read(Path file) {
        return read(YamlDocument.read(file), "");
    }

    /**
     * Reads the controller mapping at a JSON pointer of a document ({@code ""} for the whole
     * document, {@code "/controller"} for one embedded in a scenario file).
     *
     * @param doc     the document
     * @param pointer the mapping's pointer
     * @return the settings
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static ControllerSettings read(YamlDocument doc, String pointer) {
        return read(doc, pointer, List.of());
    }

    /**
     * Reads the controller mapping at a pointer that may also hold keys another reader reads (a
     * scenario's {@code schedule}).
     *
     * @param doc         the document
     * @param pointer     the mapping's pointer
     * @param alsoAllowed the other keys the mapping may hold, left to their reader
     * @return the settings
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static ControllerSettings read(YamlDocument doc, String pointer, List<FileKey<?>> alsoAllowed) {
        List<FileKey<?>> keys = new ArrayList<>(KEYS);
        keys.addAll(alsoAllowed);
        FileMapping file = new FileMapping(doc, pointer, keys, "");
        return file.build(() -> settings(file));
    }

    private static ControllerSettings settings(FileMapping file) {
        ControllerSettings.Builder builder = ControllerSettings.builder()
                .gains(gains(file, file.get(FORM)))
                .samplePeriodSeconds(file.get(SAMPLE_PERIOD))
                .setpointWeights(file.get(PROPORTIONAL_WEIGHT), file.get(DERIVATIVE_WEIGHT))
                .integralMethod(file.get(INTEGRAL_METHOD))
                .derivativeMethod(file.get(DERIVATIVE_METHOD))
                .action(file.get(ACTION))
                .outputRange(file.get(OUTPUT_MIN), file.get(OUTPUT_MAX))
                .outputSlewPerSecond(file.get(OUTPUT_SLEW))
                .setpointSlewPerSecond(file.get(SETPOINT_SLEW))
                .errorDeadband(file.get(ERROR_DEADBAND))
                .wrapSpan(file.get(WRAP_SPAN))
                .outputKind(file.get(OUTPUT_KIND));
        derivativeFilter(file, builder);
        windup(file, builder);
        faultPolicy(file, builder);
        return builder.build();
    }

    private static PidGains gains(FileMapping file, ControllerForm form) {
        List<FileKey<?>> own = form == ControllerForm.PARALLEL ? PARALLEL_GAIN_KEYS : TIME_GAIN_KEYS;
        List<FileKey<?>> foreign = form == ControllerForm.PARALLEL ? TIME_GAIN_KEYS : PARALLEL_GAIN_KEYS;
        String formWord = FORMS.word(form);
        for (FileKey<?> key : foreign) {
            if (file.has(key)) {
                throw file.error(key, file.name(key) + " does not belong to form " + formWord + "; form " + formWord
                        + " takes " + String.join(", ", FileMapping.words(own)));
            }
        }
        if (!file.has(own.get(0))) {
            throw file.error(FORM, "missing key '" + own.get(0).word() + "' for form " + formWord + " ("
                    + NumberRule.NON_NEGATIVE.describeNumber() + ")");
        }
        return switch (form) {
            case PARALLEL -> new ParallelGains(file.get(PROPORTIONAL_GAIN), file.get(INTEGRAL_GAIN),
                    file.get(DERIVATIVE_GAIN));
            case IDEAL -> new IdealGains(file.get(GAIN), file.get(INTEGRAL_TIME), file.get(DERIVATIVE_TIME));
            case SERIES -> new SeriesGains(file.get(GAIN), file.get(INTEGRAL_TIME), file.get(DERIVATIVE_TIME));
        };
    }

    private static void derivativeFilter(FileMapping file, ControllerSettings.Builder builder) {
        if (file.has(FILTER_RATIO) && file.has(FILTER_TIME)) {
            YamlDocument doc = file.doc();
            FileKey<Double> later = doc.position(FILTER_RATIO.pointer(file.pointer())).line()
                    > doc.position(FILTER_TIME.pointer(file.pointer())).line() ? FILTER_RATIO : FILTER_TIME;
            throw file.error(later, "derivative-filter and derivative-filter-time exclude each other;"
                    + " give derivative-filter (N = Td/Tf) or derivative-filter-time (Tf in seconds)");
        }
        builder.derivativeFilterRatio(file.get(FILTER_RATIO));
        file.find(FILTER_TIME).ifPresent(builder::derivativeFilterTimeSeconds);
    }

    private static void windup(FileMapping file, ControllerSettings.Builder builder) {
        WindupProtection windup = file.get(WINDUP_PROTECTION);
        builder.windupProtection(windup);
        if (file.has(TRACKING_TIME) && !tracks(windup)) {
            throw file.error(TRACKING_TIME, file.name(TRACKING_TIME)
                    + " applies only to windup: back-calculation or actuator-tracking (windup is "
                    + WINDUP.word(windup) + ")");
        }
        file.find(TRACKING_TIME).ifPresent(builder::trackingTimeSeconds);
    }

    private static void faultPolicy(FileMapping file, ControllerSettings.Builder builder) {
        FaultPolicy policy = file.get(FAULT_POLICY);
        if (policy == FaultPolicy.SAFE_OUTPUT && !file.has(SAFE_OUTPUT)) {
            throw file.error(FAULT_POLICY, "missing key 'safe-output' for fault-policy safe-output ("
                    + NumberRule.FINITE.describeNumber() + ")");
        }
        if (policy != FaultPolicy.SAFE_OUTPUT && file.has(SAFE_OUTPUT)) {
            throw file.error(SAFE_OUTPUT, file.name(SAFE_OUTPUT)
                    + " applies only to fault-policy: safe-output (fault-policy is " + FAULT_POLICIES.word(policy)
                    + ")");
        }
        builder.faultPolicy(policy, file.find(SAFE_OUTPUT).orElse(0.0));
    }

    private static boolean tracks(WindupProtection windup) {
        return windup == WindupProtection.BACK_CALCULATION || windup == WindupProtection.ACTUATOR_TRACKING;
    }

    private static boolean timeForm(ControllerSettings settings) {
        return settings.gains().form() != ControllerForm.PARALLEL;
    }

    /** Kc, Ti, Td of an ideal or series gain set, as written. */
    private static double[] timeGains(ControllerSettings settings) {
        PidGains gains = settings.gains();
        if (gains instanceof SeriesGains s) {
            return new double[] {s.gain(), s.integralTime(), s.derivativeTime()};
        }
        IdealGains i = (IdealGains) gains;
        return new double[] {i.gain(), i.integralTime(), i.derivativeTime()};
    }

    /** Whether the filter is written as N (the settings' filter time is Td/N) rather than as Tf. */
    private static boolean filterFromRatio(ControllerSettings settings) {
        ParallelGains parallel = settings.parallelGains();
        return parallel.derivativeGain() == 0.0
                || settings.derivativeFilterTimeSeconds() == parallel.derivativeGain() / parallel.proportionalGain()
                        / settings.derivativeFilterRatio();
    }

    /**
     * The settings in full, every key that applies with its value as a file writes it, defaults
     * and derived values included (the tracking time of the rule of thumb, an unlimited output as
     * {@code .inf}): what a report shows so that nothing is left to a default the reader must know.
     *
     * @param settings the settings
     * @return key word to value text, in file order
     */
    public static Map<String, String> resolved(ControllerSettings settings) {
        Map<String, String> all = new LinkedHashMap<>();
        for (Written<?> w : WRITTEN) {
            if (w.applies().test(settings)) {
                all.put(w.key().word(), w.text(settings));
            }
        }
        return all;
    }

    /**
     * Writes settings as a controller file that {@link #read} turns back into the same settings.
     * Unlimited values (no output limit, no slew limit, no integral action) are left out.
     *
     * @param settings the settings
     * @return the YAML text
     */
    public static String toYaml(ControllerSettings settings) {
        StringBuilder yaml = new StringBuilder("# Loopwright controller settings\n");
        resolved(settings).forEach((key, value) -> {
            if (!value.endsWith(".inf")) {
                yaml.append(key).append(": ").append(value).append('\n');
            }
        });
        return yaml.toString();
    }
}
