package org.cardwright.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The statistical pieces of the lot job against closed forms and published table values. */
class LotStatisticsTest {
    /** Tables of the standard normal are printed to 6 or 7 digits [1]. */
    private static final double TABLE_DIGITS = 2e-6;
    /** Jacobi rotations converge to double precision on a 2 x 2 matrix [1]. */
    private static final double EIGEN_TOLERANCE = 1e-12;
    /**
     * z for 3.1e-5 in the upper tail is about 4.0 (normal table, from memory): a band that any correct quantile falls
     * in [1].
     */
    private static final double Z_TABLE_LOW = 3.9;
    /** Upper end of the band around the normal table's 4.0 [1]. */
    private static final double Z_TABLE_HIGH = 4.2;

    @Test
    void normalQuantilesMatchTheTable() {
        // upper 2.5 % point 1.959964 and upper 0.5 % point 2.575829 of the standard normal
        // (any table of the normal distribution, e.g. Abramowitz and Stegun, Handbook of Mathematical Functions, 1964, table 26.5; recalled)
        assertEquals(1.959964, Normal.upperQuantile(0.025), TABLE_DIGITS);
        assertEquals(2.575829, Normal.upperQuantile(0.005), TABLE_DIGITS);
        assertEquals(0.158655, Normal.upperTail(1.0), TABLE_DIGITS);
    }

    @Test
    void jacobiFindsTheClosedFormEigenpairs() {
        // [[2, 1], [1, 2]]: eigenvalues 3 and 1, eigenvectors (1, 1)/sqrt 2 and (1, -1)/sqrt 2 (closed form)
        Eigen e = Eigen.of(new double[][] {{2, 1}, {1, 2}});
        assertEquals(3, e.values()[0], EIGEN_TOLERANCE);
        assertEquals(1, e.values()[1], EIGEN_TOLERANCE);
        assertEquals(Math.sqrt(0.5), e.vectors()[0][0], EIGEN_TOLERANCE);
        assertEquals(Math.sqrt(0.5), e.vectors()[1][0], EIGEN_TOLERANCE);
        assertEquals(Math.sqrt(0.5), Math.abs(e.vectors()[0][1]), EIGEN_TOLERANCE);
        assertEquals(-e.vectors()[0][1], e.vectors()[1][1], EIGEN_TOLERANCE);
    }

    @Test
    void outlierLimitGrowsWithTheLotAndNeverFallsBelowTheModifiedZScoreRule() {
        // one value: Iglewicz and Hoaglin's 3.5 stands; 200 parts x 4 parameters at 5 % family-wise: z(0.05 / 1600)
        assertEquals(LotStatistics.OUTLIER_LIMIT, LotStatistics.outlierLimit(1, 1), 0.0);
        double limit = LotStatistics.outlierLimit(200, 4);
        assertEquals(Normal.upperQuantile(0.05 / 1600), limit, 0.0);
        assertTrue(limit > Z_TABLE_LOW && limit < Z_TABLE_HIGH, "z for 3.1e-5 in the upper tail is about 4.0 (normal table)");
        assertTrue(LotStatistics.outlierLimit(100_000, 6) > limit);
    }
}
