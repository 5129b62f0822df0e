package org.loopwright.sim.identify;

/**
 * The samples of one step test: the process input (controller output, in manual) and the process
 * output over time. The arrays are shared, not copied: treat them as read-only.
 *
 * @param fileName     how messages name the source
 * @param timesSeconds strictly increasing sample times
 * @param inputs       the input at each time
 * @param outputs      the output at each time
 * @param rowsInFile   the data rows the file had
 * @param keptEvery    1 when every row was kept; k when a long record was thinned to every k-th row
 */
public record StepTest(String fileName, double[] timesSeconds, double[] inputs, double[] outputs, long rowsInFile,
        int keptEvery) {

    /** Every row of a record of this length kept. */
    public StepTest(String fileName, double[] timesSeconds, double[] inputs, double[] outputs) {
        this(fileName, timesSeconds, inputs, outputs, timesSeconds.length, 1);
    }

    /** Checks that the three arrays have one length. */
    public StepTest {
        if (timesSeconds.length != inputs.length || inputs.length != outputs.length) {
            throw new IllegalArgumentException("time, input and output must have one length: "
                    + timesSeconds.length + ", " + inputs.length + ", " + outputs.length);
        }
    }

    /** The number of samples. */
    public int length() {
        return timesSeconds.length;
    }
}
