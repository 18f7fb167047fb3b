package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.model.SweepTemperatures;

/**
 * Very large forward sweeps are fitted through bins of neighbouring points, a bounded number per sweep, so that
 * the fit's time and memory no longer grow with the number of rows; data sets of up to {@value #FULL_WEIGHT_LIMIT}
 * forward points are fitted point by point, unchanged.
 *
 * <p>Above the limit, each sweep (same file; temperatures grouped into sweeps by
 * {@link SweepTemperatures}, the rule the fit uses) is cut into bins of equal width in ln I,
 * {@value #BINS_PER_DECADE} per decade of the sweep's current (fewer when that would exceed the limit in total),
 * so that every decade of current keeps the same say in the fit, as it has in the point fit. A bin becomes one point:
 * <ul>
 *   <li>its current is exp of the inverse-variance weighted mean of ln I, its temperature the weighted mean of
 *       its points' temperatures (exactly theirs when they share one);</li>
 *   <li>its voltage is the weighted mean of V, corrected for the curvature of V(ln I) within the bin: the mean
 *       of V lies above V(mean ln I) by V''·m2/2, m2 the weighted second moment of ln I about its mean (Taylor
 *       expansion to second order), with V'' taken from the parabola through three neighbouring bins' values (not
 *       its own, so that its noise enters its value once);</li>
 *   <li>its uncertainty is that of a weighted mean whose scale comes from the data's own spread:
 *       sqrt(phi / sum w), w = 1/sigma^2 the stated weights and phi the reduced chi-square of the points about
 *       each bin's local line (slope and curvature), pooled over the bin and its neighbours until it has at least
 *       {@value #POOLED_DEGREES} degrees of freedom. phi = 1 when the stated uncertainties are right, so a bin then
 *       carries exactly its points' combined weight; when the stated uncertainties are a default, the bins carry
 *       what the scatter shows.</li>
 * </ul>
 * For a model quadratic in ln I within each bin, the weighted least-squares normal equations of the bin values
 * equal those of the points to first order in the parameters (grouped data: P. R. Bevington and D. K. Robinson,
 * "Data Reduction and Error Analysis for the Physical Sciences", 3rd ed., McGraw-Hill, 2003, section 4.1,
 * weighted mean and its variance; value recalled). Residual statistics then refer to the bins.
 */
public final class ForwardReduction {
    /**
     * Forward points fitted one by one up to here [points]: 20 times the demo part's 240, more than any bench
     * sweep of a few points per millivolt.
     */
    public static final int FULL_WEIGHT_LIMIT = 5_000;

    /**
     * Bins per decade of current in one sweep [1/decade]: 25 puts bins 0.04 decades (0.09 in ln I, 2.4 mV of
     * an ideal junction's voltage) apart, finer than any feature of the junction equations (the narrowest, the
     * knee of IKF or of RS, spans about a decade), so an 8-decade sweep becomes 200 points.
     */
    public static final int BINS_PER_DECADE = 25;

    /**
     * Degrees of freedom the scatter estimate of a bin's uncertainty pools at the least [1]: with 10 the
     * estimated standard deviation is within about 22 % (one sigma) of the true one (chi-square with 10 degrees of
     * freedom; common practice, no source).
     */
    public static final int POOLED_DEGREES = 10;

    /**
     * Smallest scale of a bin's uncertainty relative to its points' stated one [1]: a bin whose points are all
     * equal (a meter's last digit never moving) claims at most 100 times the precision they state.
     */
    private static final double SMALLEST_SCALE = 1e-2;

    /** Passes of the curvature estimate (see {@link SweepBins#of}) [1]. */
    private static final int CURVATURE_PASSES = 3;

    /**
     * The points to fit and, when they were reduced, what was done.
     *
     * @param points      the points to fit
     * @param description one line for the user, empty when the points are the input unchanged
     */
    public record Reduced(List<FitPoint> points, String description) {
        /** Whether bins replaced the points. */
        public boolean reduced() {
            return !description.isEmpty();
        }
    }

    private record Sweep(String source, double label) {
    }

    private ForwardReduction() {
    }

    /** {@link #reduce(List, double)} with the default sweep gap. */
    public static Reduced reduce(List<FitPoint> points) {
        return reduce(points, SweepTemperatures.DEFAULT_GAP);
    }

    /**
     * The input unchanged at or below {@link #FULL_WEIGHT_LIMIT} points, else its bins (see the class).
     *
     * @param points   forward points
     * @param sweepGap logged temperatures further apart than this start a new sweep [K]
     */
    public static Reduced reduce(List<FitPoint> points, double sweepGap) {
        if (points.size() <= FULL_WEIGHT_LIMIT) {
            return new Reduced(points, "");
        }
        double[] temperatures = new double[points.size()];
        for (int i = 0; i < temperatures.length; i++) {
            temperatures[i] = points.get(i).temperature();
        }
        double[] labels = SweepTemperatures.labels(temperatures, sweepGap);
        Map<Sweep, List<FitPoint>> sweeps = new LinkedHashMap<>();
        for (int i = 0; i < labels.length; i++) {
            FitPoint p = points.get(i);
            sweeps.computeIfAbsent(new Sweep(p.source(), labels[i]), k -> new ArrayList<>()).add(p);
        }
        double decadesInAll = 0;
        for (List<FitPoint> sweep : sweeps.values()) {
            decadesInAll += decades(sweep);
        }
        // at most FULL_WEIGHT_LIMIT bins in all: a single bin per sweep is the floor
        double perDecade = Math.min(BINS_PER_DECADE,
                Math.max(0, FULL_WEIGHT_LIMIT - sweeps.size()) / Math.max(decadesInAll, 1e-300));
        List<FitPoint> out = new ArrayList<>();
        double widest = 0;
        double smallestScale = Double.POSITIVE_INFINITY;
        double largestScale = 0;
        for (List<FitPoint> sweep : sweeps.values()) {
            int bins = Math.max(1, (int) Math.ceil(decades(sweep) * perDecade));
            SweepBins b = SweepBins.of(sweep, bins);
            out.addAll(b.points);
            widest = Math.max(widest, b.widest / Math.log(10));
            smallestScale = Math.min(smallestScale, b.smallestScale);
            largestScale = Math.max(largestScale, b.largestScale);
        }
        String description = String.format(Locale.ROOT, "%d forward points are more than the %d fitted one by one: "
                + "each sweep was cut into bins of equal width in ln I (%.3g per decade), each fitted as one point at "
                + "its weighted mean of ln I with its mean voltage corrected for curvature, %d bins in all, the widest "
                + "holding points over %.3g decades of current; each bin's uncertainty is scaled by the scatter of its "
                + "points about the local curve (x%.3g to x%.3g of the stated values); residual statistics refer to "
                + "the bins", points.size(), FULL_WEIGHT_LIMIT, perDecade, out.size(), widest,
                smallestScale, largestScale);
        return new Reduced(out, description);
    }

    private static double decades(List<FitPoint> sweep) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        for (FitPoint p : sweep) {
            lo = Math.min(lo, p.current());
            hi = Math.max(hi, p.current());
        }
        return Math.log10(hi / lo);
    }

    /** The bins of one sweep, with the figures the description reports. */
    private static final class SweepBins {
        final List<FitPoint> points = new ArrayList<>();
        /** Widest span of ln I inside one bin [1]. */
        double widest;
        double smallestScale = Double.POSITIVE_INFINITY;
        double largestScale = 0;

        static SweepBins of(List<FitPoint> sweep, int bins) {
            FitPoint[] sorted = sweep.toArray(new FitPoint[0]);
            Arrays.sort(sorted, Comparator.comparingDouble(FitPoint::current));
            int n = sorted.length;
            double[] lnI = new double[n];
            for (int i = 0; i < n; i++) {
                lnI[i] = Math.log(sorted[i].current());
            }
            double lo = lnI[0];
            double width = (lnI[n - 1] - lo) / bins;
            // runs of the sorted points, one per non-empty bin
            List<int[]> runs = new ArrayList<>();
            int from = 0;
            while (from < n) {
                int bin = width > 0 ? Math.min(bins - 1, (int) ((lnI[from] - lo) / width)) : 0;
                int to = from + 1;
                while (to < n && (width > 0 ? Math.min(bins - 1, (int) ((lnI[to] - lo) / width)) : 0) == bin) {
                    to++;
                }
                runs.add(new int[] {from, to});
                from = to;
            }
            int m = runs.size();
            double[] weight = new double[m];
            double[] centre = new double[m];
            double[] meanV = new double[m];
            double[] moment2 = new double[m];
            double[] slope = new double[m];
            for (int k = 0; k < m; k++) {
                int[] run = runs.get(k);
                double sw = 0;
                double su = 0;
                double sv = 0;
                for (int i = run[0]; i < run[1]; i++) {
                    FitPoint p = sorted[i];
                    double w = 1 / (p.sigma() * p.sigma());
                    sw += w;
                    su += w * lnI[i];
                    sv += w * p.voltage();
                }
                weight[k] = sw;
                centre[k] = su / sw;
                meanV[k] = sv / sw;
                double suu = 0;
                double suv = 0;
                for (int i = run[0]; i < run[1]; i++) {
                    FitPoint p = sorted[i];
                    double w = 1 / (p.sigma() * p.sigma());
                    double u = lnI[i] - centre[k];
                    suu += w * u * u;
                    suv += w * u * (p.voltage() - meanV[k]);
                }
                moment2[k] = suu / sw;
                slope[k] = suu > 0 ? suv / suu : 0;
            }
            // V'' from the parabola through three neighbouring bin values, not the bin's own (whose noise would
            // then enter its corrected value a twelfth more strongly, and its uncertainty would understate that);
            // the values are the means corrected by the previous pass's V'', which takes out of V'' what the
            // bins' unequal second moments put into the plain means (two passes leave a hundredth of it)
            double[] curvature = new double[m];
            double[] value = meanV.clone();
            for (int pass = 0; pass < CURVATURE_PASSES && m >= 3; pass++) {
                for (int k = 0; k < m; k++) {
                    int[] o = others(k, m);
                    curvature[k] = secondDerivative(centre[o[0]], value[o[0]], centre[o[1]], value[o[1]],
                            centre[o[2]], value[o[2]]);
                }
                for (int k = 0; k < m; k++) {
                    value[k] = meanV[k] - 0.5 * curvature[k] * moment2[k];
                }
            }
            // chi-square of each bin's points about its local curve, and its degrees of freedom
            double[] chi = new double[m];
            int[] dof = new int[m];
            for (int k = 0; k < m; k++) {
                int[] run = runs.get(k);
                for (int i = run[0]; i < run[1]; i++) {
                    FitPoint p = sorted[i];
                    double u = lnI[i] - centre[k];
                    double r = p.voltage() - meanV[k] - slope[k] * u - 0.5 * curvature[k] * (u * u - moment2[k]);
                    chi[k] += r * r / (p.sigma() * p.sigma());
                }
                dof[k] = Math.max(0, run[1] - run[0] - 2);
            }
            SweepBins out = new SweepBins();
            for (int k = 0; k < m; k++) {
                double scale = pooledScale(chi, dof, k);
                out.smallestScale = Math.min(out.smallestScale, Math.sqrt(scale));
                out.largestScale = Math.max(out.largestScale, Math.sqrt(scale));
                int[] run = runs.get(k);
                FitPoint first = sorted[run[0]];
                double t = first.temperature();
                double dt = 0;
                for (int i = run[0]; i < run[1]; i++) {
                    FitPoint p = sorted[i];
                    dt += (p.temperature() - first.temperature()) / (p.sigma() * p.sigma());
                }
                FitPoint middle = sorted[(run[0] + run[1] - 1) / 2];
                if (run[1] - run[0] == 1) {
                    out.points.add(new FitPoint(first.current(), first.voltage(), first.temperature(),
                            first.sigma() * Math.sqrt(scale), first.source(), first.line()));
                } else {
                    out.points.add(new FitPoint(Math.exp(centre[k]), value[k],
                            t + dt / weight[k], Math.sqrt(scale / weight[k]), middle.source(), middle.line()));
                }
                out.widest = Math.max(out.widest, lnI[run[1] - 1] - lnI[run[0]]);
            }
            return out;
        }

        /**
         * Three bins near bin {@code k} of {@code m}, ascending, other than {@code k} itself when m is 4 or more:
         * its two neighbours and the next one out (at an end, the nearest three).
         */
        private static int[] others(int k, int m) {
            if (m < 4) {
                return new int[] {0, 1, 2};
            }
            if (k == 0) {
                return new int[] {1, 2, 3};
            }
            if (k == m - 1) {
                return new int[] {m - 4, m - 3, m - 2};
            }
            return k + 2 < m ? new int[] {k - 1, k + 1, k + 2} : new int[] {k - 2, k - 1, k + 1};
        }

        /** Second derivative of the parabola through three points with distinct abscissae. */
        private static double secondDerivative(double x0, double y0, double x1, double y1, double x2, double y2) {
            double d01 = (y1 - y0) / (x1 - x0);
            double d12 = (y2 - y1) / (x2 - x1);
            return 2 * (d12 - d01) / (x2 - x0);
        }

        /**
         * Reduced chi-square about the local curves of bin {@code k} and its nearest neighbours, widened one bin
         * each side until {@value #POOLED_DEGREES} degrees of freedom or the whole sweep; 1 (the stated
         * uncertainties) when the sweep has no degree of freedom; never below {@code SMALLEST_SCALE}^2.
         */
        private static double pooledScale(double[] chi, int[] dof, int k) {
            double c = chi[k];
            int f = dof[k];
            for (int j = 1; f < POOLED_DEGREES && (k - j >= 0 || k + j < chi.length); j++) {
                if (k - j >= 0) {
                    c += chi[k - j];
                    f += dof[k - j];
                }
                if (k + j < chi.length) {
                    c += chi[k + j];
                    f += dof[k + j];
                }
            }
            if (f == 0) {
                return 1;
            }
            return Math.max(c / f, SMALLEST_SCALE * SMALLEST_SCALE);
        }
    }
}
