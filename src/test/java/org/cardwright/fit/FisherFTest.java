package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.distribution.FDistribution;
import org.junit.jupiter.api.Test;

/** The F distribution's upper tail of the regional-starts test against Commons Math and against printed tables. */
class FisherFTest {
    /**
     * Agreement with Commons Math's independent implementation: the Lanczos ln Gamma (about 2e-10) on arguments
     * near 1e5 costs about 1e-9 of the tail; a 5 % test needs far less [1].
     */
    private static final double AGREEMENT = 1e-7;
    /** Below this tail the comparison is absolute: 1 - cdf in the reference loses its relative digits there [1]. */
    private static final double SMALL_TAIL = 1e-6;
    /** Absolute agreement where even that floor is met only to rounding [1]. */
    private static final double ROUNDING = 1e-15;
    /** The closed form and the continued fraction agree to rounding of a few dozen operations [1]. */
    private static final double CLOSED_FORM = 1e-12;
    /** Printed critical values have 3 or 4 significant digits: the tail there is 0.05 to within this [1]. */
    private static final double TABLE_TAIL = 5e-4;

    @Test
    void agreesWithCommonsMathOverAWideGrid() {
        double[] d1s = {1, 2, 3, 4, 7, 20, 150};
        double[] d2s = {1, 3, 5, 11, 35, 229, 5000, 200_000};
        double[] fs = {1e-4, 0.05, 0.5, 1, 1.7, 2.6, 4, 9, 30, 400};
        for (double d1 : d1s) {
            for (double d2 : d2s) {
                FDistribution reference = new FDistribution(null, d1, d2, 1e-12);
                for (double f : fs) {
                    double expected = 1 - reference.cumulativeProbability(f);
                    double got = FisherF.upperTail(f, d1, d2);
                    assertEquals(expected, got, AGREEMENT * Math.max(expected, SMALL_TAIL) + ROUNDING,
                            "P(F > " + f + ") with " + d1 + " and " + d2 + " degrees of freedom");
                }
            }
        }
    }

    @Test
    void printedFivePercentPointsHaveATailOfFivePercent() {
        // upper 5 % points of F from the usual printed tables (values from memory): F(2,10) = 4.103, F(4,20) = 2.866,
        // F(4,60) = 2.525, F(1,30) = 4.171, F(10,120) = 1.910
        double[][] table = {{2, 10, 4.103}, {4, 20, 2.866}, {4, 60, 2.525}, {1, 30, 4.171}, {10, 120, 1.910}};
        for (double[] row : table) {
            assertEquals(0.05, FisherF.upperTail(row[2], row[0], row[1]), TABLE_TAIL, "F(" + row[0] + "," + row[1] + ")");
        }
    }

    @Test
    void edges() {
        assertEquals(1, FisherF.upperTail(0, 4, 30));
        assertEquals(0, FisherF.upperTail(Double.POSITIVE_INFINITY, 4, 30));
        // F(2, d2) has the closed-form tail (1 + 2f/d2)^(-d2/2) (a fact of the distribution)
        assertEquals(Math.pow(1 + 2 * 3.0 / 17, -17 / 2.0), FisherF.upperTail(3.0, 2, 17), CLOSED_FORM);
    }
}
