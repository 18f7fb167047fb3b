package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Very large forward sweeps are fitted through the means of narrow bins of neighbouring points, so that a fit
 * of a million rows takes the time and memory of one of {@value #FULL_WEIGHT_LIMIT}; smaller data sets are
 * fitted point by point, unchanged.
 *
 * <p>Above the limit, each sweep (same file and temperature) is sorted by current and cut into runs of m
 * neighbouring points, m the same for every sweep, the smallest that brings the total to the limit or below.
 * A run becomes one point at its inverse-variance weighted mean of ln I and of V, with uncertainty
 * {@code 1/sqrt(sum 1/sigma^2)}: for a model linear within the bin, the weighted least-squares normal
 * equations of the means equal those of the points (the standard result for grouped data; e.g. P. R. Bevington
 * and D. K. Robinson, "Data Reduction and Error Analysis for the Physical Sciences", 3rd ed., McGraw-Hill, 2003,
 * section 4.1, weighted mean; value recalled). The model is not linear: within a bin of width d in ln I the mean
 * of V moves from V(mean ln I) by about V''·d²/24, with V'' = d²V/d(ln I)², which the description states
 * through the widest bin so the user can judge it. Residual statistics then refer to the bins.
 */
public final class ForwardReduction {
    /**
     * Forward points fitted one by one up to here [points]: 20 times the demo part's 240, more than any bench
     * sweep of a few points per millivolt; at a million rows it makes bins of 200 points, whose curvature error
     * (under 1 uV for the benchmark diode) stays far below their noise.
     */
    public static final int FULL_WEIGHT_LIMIT = 5_000;

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

    private record Sweep(String source, double temperature) {
    }

    private ForwardReduction() {
    }

    /** The input unchanged at or below {@link #FULL_WEIGHT_LIMIT} points, else its bin means (see the class). */
    public static Reduced reduce(List<FitPoint> points) {
        if (points.size() <= FULL_WEIGHT_LIMIT) {
            return new Reduced(points, "");
        }
        Map<Sweep, List<FitPoint>> sweeps = new LinkedHashMap<>();
        for (FitPoint p : points) {
            sweeps.computeIfAbsent(new Sweep(p.source(), p.temperature()), k -> new ArrayList<>()).add(p);
        }
        int m = 1;
        while (binCount(sweeps, m) > FULL_WEIGHT_LIMIT) {
            m++;
        }
        List<FitPoint> out = new ArrayList<>(binCount(sweeps, m));
        double widest = 0;
        for (List<FitPoint> sweep : sweeps.values()) {
            sweep.sort(Comparator.comparingDouble(FitPoint::current));
            for (int from = 0; from < sweep.size(); from += m) {
                int to = Math.min(sweep.size(), from + m);
                double weights = 0;
                double lnI = 0;
                double v = 0;
                for (int i = from; i < to; i++) {
                    FitPoint p = sweep.get(i);
                    double w = 1 / (p.sigma() * p.sigma());
                    weights += w;
                    lnI += w * Math.log(p.current());
                    v += w * p.voltage();
                }
                FitPoint middle = sweep.get((from + to - 1) / 2);
                out.add(new FitPoint(Math.exp(lnI / weights), v / weights, middle.temperature(),
                        1 / Math.sqrt(weights), middle.source(), middle.line()));
                widest = Math.max(widest, Math.log10(sweep.get(to - 1).current() / sweep.get(from).current()));
            }
        }
        String description = String.format(Locale.ROOT, "%d forward points are more than the %d fitted one by one: "
                + "each sweep's points were merged, in order of current, into bins of %d neighbours (weighted means "
                + "of ln I and V, uncertainty combined), %d bins in all, the widest spanning %.3g decades of current; "
                + "residual statistics refer to the bins", points.size(), FULL_WEIGHT_LIMIT, m, out.size(), widest);
        return new Reduced(out, description);
    }

    private static int binCount(Map<Sweep, List<FitPoint>> sweeps, int m) {
        int n = 0;
        for (List<FitPoint> s : sweeps.values()) {
            n += (s.size() + m - 1) / m;
        }
        return n;
    }
}
