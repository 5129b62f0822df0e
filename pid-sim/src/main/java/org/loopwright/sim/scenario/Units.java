package org.loopwright.sim.scenario;

/**
 * The engineering units a scenario names ({@code units: {process: "°C", output: "W"}}), shown on
 * every axis, table header and CSV header. Empty when the scenario names none; then the words
 * {@code PV} and {@code CO} stand in, so that a figure such as IAE still says what it is in ("PV·s").
 *
 * @param process the process variable's unit (and the setpoint's), empty for none
 * @param output  the controller output's unit, empty for none
 */
public record Units(String process, String output) {

    /** No units named. */
    public static final Units NONE = new Units("", "");

    /** @return the process variable's unit, or "PV" when none is named */
    public String processOrWord() {
        return process.isEmpty() ? "PV" : process;
    }

    /** @return the controller output's unit, or "CO" when none is named */
    public String outputOrWord() {
        return output.isEmpty() ? "CO" : output;
    }

    /** @return the unit of an integral of the error over time: "°C·s" */
    public String processSeconds() {
        return processOrWord() + "·s";
    }

    /**
     * An axis title with its unit: "measurement (°C)", or the bare title when no unit is named.
     *
     * @param title the quantity
     * @param unit  its unit, possibly empty
     * @return the title
     */
    public static String axis(String title, String unit) {
        return unit.isEmpty() ? title : title + " (" + unit + ")";
    }
}
