package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.Random;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;

/**
 * {@link Uncertainty#curvature} gives JᵀJ to the bit as Commons Math's transpose-and-multiply gives it (the standard
 * errors and correlations on every card and report must not move): checked on seeded Jacobians of the sizes a fit
 * produces, with entries spread over many decades as weighted residual derivatives are.
 */
class CurvatureMatrixTest {
    /** The same sums in the same order: equal to the bit, no tolerance [1]. */
    private static final double EXACT = 0.0;

    @Test
    void sameBitsAsCommonsMath() {
        Random rnd = new Random(4242);
        for (int trial = 0; trial < 200; trial++) {
            int n = 1 + rnd.nextInt(300);
            int k = 1 + rnd.nextInt(12);
            double[][] jac = new double[n][k];
            for (double[] row : jac) {
                for (int c = 0; c < k; c++) {
                    row[c] = rnd.nextGaussian() * Math.pow(10, rnd.nextInt(24) - 12);
                }
            }
            RealMatrix j = new Array2DRowRealMatrix(jac, false);
            double[][] expected = j.transpose().multiply(j).getData();
            double[][] got = Uncertainty.curvature(j).getData();
            for (int a = 0; a < k; a++) {
                assertArrayEquals(expected[a], got[a], EXACT, "trial " + trial + ", row " + a);
            }
        }
    }
}
