package org.loopwright.sim.plant;

/** Polynomials for tests, as descending coefficient arrays (highest power first, as transfer functions take them). */
public final class DescendingPolynomials {

    private DescendingPolynomials() {
    }

    /** The descending coefficients of p(s)·(s − root). */
    public static double[] timesLinear(double[] p, double root) {
        double[] product = new double[p.length + 1];
        for (int i = 0; i < p.length; i++) {
            product[i] += p[i];
            product[i + 1] -= root * p[i];
        }
        return product;
    }
}
