package org.loopwright.sim.frequency;

import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The controllable canonical realisation ẋ = Ax + Bu, y = Cx + Du of the rational part N(s)/D(s)
 * (dead time left out): A has −a1…−an in its first row and ones below the diagonal, B = e1,
 * C_i = b_i − a_i·b0, D = b0, with a and b the coefficients divided by D's leading one
 * (Åström &amp; Murray, <i>Feedback Systems</i>, 2nd ed., §6.3, reachable canonical form).
 */
record StateSpace(RealMatrix dynamics, RealVector input, RealVector output, double feedthrough) {

    static StateSpace of(TransferFunction plant) {
        double[] den = plant.denominator();
        double[] num = plant.numerator();
        int n = den.length - 1;
        double lead = den[0];
        double[] b = new double[n + 1];
        System.arraycopy(num, 0, b, n + 1 - num.length, num.length);
        double b0 = b[0] / lead;
        if (n == 0) {
            return new StateSpace(null, null, null, b0);
        }
        RealMatrix a = MatrixUtils.createRealMatrix(n, n);
        RealVector c = new ArrayRealVector(n);
        for (int i = 1; i <= n; i++) {
            double ai = den[i] / lead;
            a.setEntry(0, i - 1, -ai);
            c.setEntry(i - 1, b[i] / lead - ai * b0);
            if (i < n) {
                a.setEntry(i, i - 1, 1.0);
            }
        }
        RealVector bVector = new ArrayRealVector(n);
        bVector.setEntry(0, 1.0);
        return new StateSpace(a, bVector, c, b0);
    }

    int order() {
        return dynamics == null ? 0 : dynamics.getRowDimension();
    }
}
