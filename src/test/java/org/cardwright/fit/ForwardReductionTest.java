package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** Bin means for very large forward sweeps: untouched below the limit, exact for a model linear in ln I. */
class ForwardReductionTest {
    /** Double rounding of sums of a few thousand terms of order 1 V [V]. */
    private static final double ROUNDING = 1e-12;

    @Test
    void dataUpToTheLimitAreFittedUnchanged() {
        List<FitPoint> points = line(ForwardReduction.FULL_WEIGHT_LIMIT, 1);
        ForwardReduction.Reduced r = ForwardReduction.reduce(points);
        assertFalse(r.reduced());
        assertSame(points, r.points());
    }

    @Test
    void binMeansOfALinearModelLieOnIt() {
        // weighted means of a function linear in ln I lie on it exactly (common practice, no source), so binning
        // changes nothing a straight-line fit would find; the ideality slope here is 1.5 x 25.85 mV per e-fold
        int n = 3 * ForwardReduction.FULL_WEIGHT_LIMIT + 17;
        ForwardReduction.Reduced r = ForwardReduction.reduce(line(n, 2));
        assertTrue(r.reduced());
        assertTrue(r.points().size() <= ForwardReduction.FULL_WEIGHT_LIMIT, r.description());
        assertTrue(r.description().startsWith(n + " forward points"), r.description());
        double weights = 0;
        for (FitPoint p : r.points()) {
            assertEquals(A + B * Math.log(p.current()), p.voltage(), ROUNDING, p.where());
            weights += 1 / (p.sigma() * p.sigma());
        }
        double expected = 0;
        for (FitPoint p : line(n, 2)) {
            expected += 1 / (p.sigma() * p.sigma());
        }
        assertEquals(expected, weights, expected * 1e-12, "the bins carry the points' whole weight");
    }

    private static final double A = 0.9;
    private static final double B = 1.5 * 0.02585;

    /** n points on V = A + B ln I, two sweeps, shuffled, with unequal sigmas. */
    private static List<FitPoint> line(int n, long seed) {
        Random random = new Random(seed);
        List<FitPoint> out = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            double current = 1e-9 * Math.pow(1e8, random.nextDouble());
            double kelvin = k % 2 == 0 ? 298.15 : 358.15;
            out.add(new FitPoint(current, A + B * Math.log(current), kelvin, 1e-3 * (1 + random.nextDouble()),
                    "line.csv", k + 2));
        }
        return out;
    }
}
