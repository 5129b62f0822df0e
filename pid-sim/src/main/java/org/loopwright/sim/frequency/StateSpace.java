package org.loopwright.sim.frequency;

import org.loopwright.sim.plant.TransferFunction;

/**
 * The controllable canonical realisation ẋ = Ax + Bu, y = Cx + Du of the rational part N(s)/D(s)
 * (dead time left out): A has −a1…−an in its first row and ones below the diagonal, B = e1,
 * C_i = b_i − a_i·b0, D = b0, with a and b the coefficients divided by D's leading one
 * (Åström &amp; Murray, <i>Feedback Systems</i>, 2nd ed., §6.3, reachable canonical form).
 * A is held row-major in plain arrays, for the exact sampling's array arithmetic; a static gain has
 * order 0 and empty arrays.
 *
 * @param order       n, the number of states
 * @param dynamics    A, n×n row-major
 * @param input       B
 * @param output      C
 * @param feedthrough D
 */
record StateSpace(int order, double[] dynamics, double[] input, double[] output, double feedthrough) {

    static StateSpace of(TransferFunction plant) {
        double[] den = plant.denominator();
        double[] num = plant.numerator();
        int n = den.length - 1;
        double lead = den[0];
        double[] b = new double[n + 1];
        System.arraycopy(num, 0, b, n + 1 - num.length, num.length);
        double b0 = b[0] / lead;
        double[] a = new double[n * n];
        double[] c = new double[n];
        for (int i = 1; i <= n; i++) {
            double ai = den[i] / lead;
            a[i - 1] = -ai;
            c[i - 1] = b[i] / lead - ai * b0;
            if (i < n) {
                a[i * n + i - 1] = 1.0;
            }
        }
        double[] bVector = new double[n];
        if (n > 0) {
            bVector[0] = 1.0;
        }
        return new StateSpace(n, a, bVector, c, b0);
    }
}
