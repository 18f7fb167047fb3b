package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "medians from Commons Math": the start values' running median (fit/StartValues) and the lot statistics'
 * median and MAD (lot/LotStatistics) now come from Commons Math's Percentile. They must give exactly what the
 * sort-and-index code they replace gave, so that no card, corpus figure or lot output changes by a byte (checked
 * besides on the demo, corpus, library and lot outputs, which are byte-identical before and after). The references
 * below are the textbook definitions written out (common practice, no source): the middle of the sorted values, the
 * mean of the two middle ones for an even count, or the upper of the two.
 */
class MediansTest {
    /** Random samples drawn. */
    private static final int SAMPLES = 40_000;
    /** Largest sample size drawn; the running window has 3 to 5 values, the lot up to thousands of parts. */
    private static final int MAX_SIZE = 300;

    private static double sortedMedian(double[] x) {
        double[] s = x.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
    }

    private static double sortedUpperMedian(double[] v, int from, int to) {
        double[] w = Arrays.stream(v, from, to).filter(Double::isFinite).sorted().toArray();
        return w.length == 0 ? Double.NaN : w[w.length / 2];
    }

    /** Equal as numbers, NaN equal to NaN; -0.0 and 0.0 count as equal (their order is the one thing not kept). */
    private static boolean same(double a, double b) {
        return a == b || (Double.isNaN(a) && Double.isNaN(b));
    }

    @Test
    void smallCountsGiveTheDefinitions() {
        assertEquals(20, Medians.median(new double[] {30, 10, 20}));
        assertEquals(25, Medians.median(new double[] {40, 10, 30, 20}));
        assertEquals(30, Medians.upperMedian(new double[] {40, 10, 30, 20}, 0, 4));
        assertEquals(20, Medians.upperMedian(new double[] {30, Double.NaN, 10, 20}, 0, 4));
        assertEquals(10, Medians.upperMedian(new double[] {10}, 0, 1));
        assertTrue(Double.isNaN(Medians.upperMedian(new double[] {Double.NaN, Double.POSITIVE_INFINITY}, 0, 2)));
        assertTrue(Double.isNaN(Medians.median(new double[0])));
    }

    @Test
    void randomSamplesGiveExactlyWhatTheSortedCodeGave() {
        Random r = new Random(20261203);
        int median = 0;
        int upper = 0;
        for (int t = 0; t < SAMPLES; t++) {
            int n = 1 + r.nextInt(t % 2 == 0 ? 7 : MAX_SIZE);
            double[] v = new double[n];
            for (int i = 0; i < n; i++) {
                // repeats (small integers), every magnitude, and an occasional NaN
                v[i] = r.nextInt(4) == 0 ? 1 + r.nextInt(5) : r.nextGaussian() * Math.pow(10, r.nextInt(40) - 20);
                if (r.nextInt(50) == 0) {
                    v[i] = Double.NaN;
                }
            }
            int from = r.nextInt(n);
            int to = from + 1 + r.nextInt(n - from);
            if (!same(sortedUpperMedian(v, from, to), Medians.upperMedian(v, from, to))) {
                upper++;
            }
            double[] finite = Arrays.stream(v).filter(Double::isFinite).toArray();
            if (finite.length > 0 && !same(sortedMedian(finite), Medians.median(finite))) {
                median++;
            }
        }
        assertEquals(0, upper, "upper medians that differ");
        assertEquals(0, median, "medians that differ");
    }
}
