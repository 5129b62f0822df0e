package org.loopwright.pid.multiloop;

/**
 * K/(T·s + 1) stepped exactly under a zero-order hold: y(k+1) = a·y(k) + K·(1 − a)·u(k), a = e^(−h/T)
 * (Åström &amp; Wittenmark 1997, ch. 2, the sampled first-order system).
 */
final class FirstOrderLag {

    private final double pole;
    private final double inputGain;
    private double output;

    FirstOrderLag(double gain, double timeConstantSeconds, double periodSeconds) {
        pole = Math.exp(-periodSeconds / timeConstantSeconds);
        inputGain = gain * (1.0 - pole);
    }

    /** The output now, then one period on under a held input. */
    double step(double input) {
        double now = output;
        output = pole * output + inputGain * input;
        return now;
    }

    double output() {
        return output;
    }
}
