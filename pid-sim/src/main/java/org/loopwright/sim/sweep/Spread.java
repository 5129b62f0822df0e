package org.loopwright.sim.sweep;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;

import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.plant.PlantType;

/**
 * How far each plant parameter may stray from its nominal value, as fractions by the parameter's key:
 * a drawn plant's parameter is the nominal one times a factor drawn uniformly from [1 − s, 1 + s],
 * independently per parameter. Each fraction is 0 ≤ s &lt; 1, so every factor stays positive.
 *
 * <p>The keys are the plant type's {@link PlantType#spreadKeys()}: {@code gain}, {@code time-constant}
 * and {@code dead-time} for a linear plant, the file keys of its physical parameters for a nonlinear
 * one. Written on the command line as {@code gain=20%,time-constant=10%,dead-time=30%} or
 * {@code static-friction=30%,inertia=10%}; keys left out do not vary. Example:
 * {@code Spread.parse("gain=20%")} gives a gain factor in [0.8, 1.2].
 *
 * @param fractions the spread of each key named, in the order given
 */
public record Spread(Map<String, Double> fractions) {

    /** No spread: every drawn plant is the nominal plant. */
    public static final Spread NONE = new Spread(Map.of());

    /** Validates the fractions and keeps their order. */
    public Spread {
        fractions.forEach(Spread::check);
        fractions = Collections.unmodifiableMap(new LinkedHashMap<>(fractions));
    }

    private static void check(String key, double fraction) {
        if (!(fraction >= 0.0 && fraction < 1.0)) {
            throw new InputException("--spread " + key + " must be from 0% to below 100%: " + key + "="
                    + percent(fraction));
        }
    }

    /**
     * Reads the text form {@code key=P%[,key=P%...]}; which keys a plant takes is checked by
     * {@link #requireKeysOf}.
     *
     * @throws InputException naming the entry, the value and what is allowed
     */
    public static Spread parse(String text) {
        Map<String, Double> fractions = new LinkedHashMap<>();
        for (String entry : text.split(",", -1)) {
            String trimmed = entry.strip();
            int equals = trimmed.indexOf('=');
            if (equals <= 0) {
                throw new InputException("--spread entries must be key=P% with a plant parameter's key:"
                        + " --spread=" + text);
            }
            String key = trimmed.substring(0, equals).strip();
            if (fractions.put(key, fraction(key, trimmed.substring(equals + 1).strip())) != null) {
                throw new InputException("--spread must name " + key + " once: --spread=" + text);
            }
        }
        return new Spread(fractions);
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

    /**
     * Checks that every key named is one of the plant type's spread keys.
     *
     * @throws InputException naming the key, the plant type and the keys it takes
     */
    public void requireKeysOf(PlantType type) {
        List<String> allowed = type.spreadKeys().stream().map(FileKey::word).toList();
        for (String key : fractions.keySet()) {
            if (!allowed.contains(key)) {
                throw new InputException("--spread key " + key + " is not a parameter of plant type "
                        + type.word() + ": use " + String.join(", ", allowed.subList(0, allowed.size() - 1)) + " or "
                        + allowed.get(allowed.size() - 1));
            }
        }
    }

    /** The spread of one key, 0 when it is not named. */
    public double fraction(String key) {
        return fractions.getOrDefault(key, 0.0);
    }

    /** The text form of the keys named, in their order ({@code gain=20%,dead-time=12.5%}); empty for no spread. */
    public String text() {
        return fractions.entrySet().stream().map(e -> e.getKey() + "=" + percent(e.getValue()))
                .collect(Collectors.joining(","));
    }

    /** The keys with a spread above 0, as a sentence names them: {@code gain ±20%, dead-time ±12.5%}. */
    public List<String> nonZero() {
        List<String> named = new ArrayList<>();
        fractions.forEach((key, fraction) -> {
            if (fraction > 0.0) {
                named.add(key + " ±" + percent(fraction));
            }
        });
        return named;
    }

    private static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.6g", 100.0 * fraction).replaceAll("\\.?0+$", "") + "%";
    }
}
