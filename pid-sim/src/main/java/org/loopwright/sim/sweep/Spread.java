package org.loopwright.sim.sweep;

import java.util.Locale;

import org.loopwright.sim.config.InputException;

/**
 * How far each plant parameter may stray from its nominal value, as fractions: a drawn plant's
 * parameter is the nominal one times a factor drawn uniformly from [1 − s, 1 + s], independently per
 * parameter. Each fraction is 0 ≤ s &lt; 1, so every factor stays positive.
 *
 * <p>Written on the command line as {@code gain=20%,time-constant=10%,dead-time=30%}; parameters left
 * out do not vary. Example: {@code Spread.parse("gain=20%")} gives a gain factor in [0.8, 1.2].
 *
 * @param gain         the spread of the process gain
 * @param timeConstant the spread of every time constant (poles and zeros together)
 * @param deadTime     the spread of the dead time
 */
public record Spread(double gain, double timeConstant, double deadTime) {

    /** No spread: every drawn plant is the nominal plant. */
    public static final Spread NONE = new Spread(0.0, 0.0, 0.0);

    /** The keys of the text form, in the order of the record's components. */
    public static final String KEYS = "gain, time-constant or dead-time";

    /** Validates the fractions. */
    public Spread {
        check("gain", gain);
        check("time-constant", timeConstant);
        check("dead-time", deadTime);
    }

    private static void check(String key, double fraction) {
        if (!(fraction >= 0.0 && fraction < 1.0)) {
            throw new InputException("--spread " + key + " must be from 0% to below 100%: " + key + "="
                    + percent(fraction));
        }
    }

    /**
     * Reads the text form {@code key=P%[,key=P%...]} with keys {@value #KEYS}.
     *
     * @throws InputException naming the entry, the value and what is allowed
     */
    public static Spread parse(String text) {
        double[] fractions = {0.0, 0.0, 0.0};
        boolean[] seen = new boolean[3];
        for (String entry : text.split(",", -1)) {
            String trimmed = entry.strip();
            int equals = trimmed.indexOf('=');
            if (equals < 0) {
                throw new InputException("--spread entries must be key=P% with key " + KEYS
                        + ": --spread=" + text);
            }
            String key = trimmed.substring(0, equals).strip();
            String value = trimmed.substring(equals + 1).strip();
            int index = switch (key) {
                case "gain" -> 0;
                case "time-constant" -> 1;
                case "dead-time" -> 2;
                default -> throw new InputException("--spread key must be " + KEYS + ": --spread=" + text);
            };
            if (seen[index]) {
                throw new InputException("--spread must name " + key + " once: --spread=" + text);
            }
            seen[index] = true;
            fractions[index] = fraction(key, value);
        }
        return new Spread(fractions[0], fractions[1], fractions[2]);
    }

    private static double fraction(String key, String value) {
        String number = value.endsWith("%") ? value.substring(0, value.length() - 1).strip() : null;
        double percent;
        try {
            percent = number == null || number.isEmpty() ? Double.NaN : Double.parseDouble(number);
        } catch (NumberFormatException e) {
            percent = Double.NaN;
        }
        if (!(percent >= 0.0 && percent < 100.0)) {
            throw new InputException("--spread " + key + " must be a percentage from 0% to below 100%: "
                    + key + "=" + value);
        }
        return percent / 100.0;
    }

    /** The text form, every key with its percentage. */
    public String text() {
        return "gain=" + percent(gain) + ",time-constant=" + percent(timeConstant) + ",dead-time=" + percent(deadTime);
    }

    private static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.6g", 100.0 * fraction).replaceAll("\\.?0+$", "") + "%";
    }
}
