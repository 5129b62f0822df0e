package org.loopwright.pid.tuning;

/**
 * Test plant g/(s+1)³ stepped exactly under a zero-order hold: with the chain x1' = −x1 + u,
 * x2' = −x2 + x1, x3' = −x3 + x2 and y = g·x3, e^(Ah) = e^(−h)·[[1,0,0],[h,1,0],[h²/2,h,1]] and
 * Γ = [1 − e^(−h), 1 − e^(−h)(1 + h), 1 − e^(−h)(1 + h + h²/2)] (the matrix exponential of a
 * Jordan block, Åström &amp; Wittenmark 1997, ch. 2).
 */
final class ThirdOrderLag {

    private final double gain;
    private final double decay;
    private final double h;
    private final double gamma1;
    private final double gamma2;
    private final double gamma3;
    private double x1;
    private double x2;
    private double x3;

    ThirdOrderLag(double gain, double h) {
        this.gain = gain;
        this.h = h;
        decay = Math.exp(-h);
        gamma1 = 1.0 - decay;
        gamma2 = 1.0 - decay * (1.0 + h);
        gamma3 = 1.0 - decay * (1.0 + h + h * h / 2.0);
    }

    /** Applies u for one period and returns the output at its end. */
    double step(double u) {
        double n1 = decay * x1 + gamma1 * u;
        double n2 = decay * (h * x1 + x2) + gamma2 * u;
        double n3 = decay * (h * h / 2.0 * x1 + h * x2 + x3) + gamma3 * u;
        x1 = n1;
        x2 = n2;
        x3 = n3;
        return gain * x3;
    }

    double output() {
        return gain * x3;
    }
}
