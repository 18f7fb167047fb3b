package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.SweepTemperatures;

/**
 * Sorting reverse points into breakdown and leakage, and closed-form breakdown start values.
 *
 * <p>A point is in breakdown where the current rises faster than the tenth power of the voltage: the local
 * exponent d ln|I| / d ln|V|, taken between the point and its neighbour at the next smaller current, exceeds 10.
 * Leakage below breakdown (ohmic or generation-like, exponents near 1) stays far below that; an avalanche or
 * zener knee lies far above it (common practice, no source). The rule allows for the noise of the voltage
 * readings (see {@link #split(List, double)}), so that a near-vertical knee read by a meter whose readings jitter
 * by more than the knee's own voltage steps stays breakdown.
 */
public final class ReverseAnalysis {
    /** Local exponent d ln|I| / d ln|V| above which a point counts as breakdown [1]. */
    public static final double BREAKDOWN_EXPONENT = 10;
    /**
     * How many standard uncertainties of the voltage difference between two neighbouring readings still count as
     * jitter: a difference within this many sigma of the steep line is taken as steep, and a fall in voltage
     * with rising current no larger than this is taken as noise on a vertical knee [1] (3 sigma: about 1 in 370
     * pairs of pure noise falls outside; common practice, no source).
     */
    public static final double JITTER_SIGMAS = 3;
    /**
     * The first point of a knee: a point whose step up is steep counts as breakdown already when it rose from
     * the point below it faster than |V|^5 [1]. Leakage rises with exponents of 1 to 3 (ohmic, generation,
     * the cubic reverse form); a soft zener knee reached across a gap in the forced voltages shows a mean exponent
     * just under 10 over the gap (common practice, no source).
     */
    public static final double KNEE_ENTRY_EXPONENT = 5;

    private ReverseAnalysis() {
    }

    /** The two groups. */
    public record Split(List<ReversePoint> breakdown, List<ReversePoint> leakage) {
    }

    /** {@link #split(List, double)} with the default sweep gap. */
    public static Split split(List<ReversePoint> reverse) {
        return split(reverse, SweepTemperatures.DEFAULT_GAP);
    }

    /**
     * Sorts reverse points into breakdown and leakage, sweep by sweep (sweeps as {@link SweepTemperatures}
     * forms them with {@code sweepGap} [K]).
     *
     * <p>Within a sweep the points are ordered by |I| (the forced, accurate quantity in breakdown; in leakage the
     * current rises with |V| too). Point b is compared with its neighbour a at the next smaller current (the
     * first point with its neighbour at the next larger one). With s the standard uncertainty of the difference
     * of the two voltage readings, sqrt(sigma_a^2 + sigma_b^2), the pair is steep, and b is breakdown, when
     *
     * <pre>  -3 s  &lt;=  |V_b| - |V_a|  &lt;=  |V_a| (exp(ln(I_b/I_a) / 10) - 1) + 3 s</pre>
     *
     * that is, when the exponent exceeds 10 once the readings may each move by their noise, and a fall in voltage
     * no larger than the noise counts as a vertical step. A larger fall (current noise reordering flat leakage)
     * is not steep. A point whose step up is steep is breakdown too when its own step from below is steep with
     * an exponent of 5 ({@link #KNEE_ENTRY_EXPONENT}): the first point of a soft knee reached across a gap in
     * voltage. Sweeps of fewer than 3 points are leakage. The last leakage point before a jump into breakdown
     * rose from below with an exponent near 1, so it does not borrow the steep step up.
     */
    public static Split split(List<ReversePoint> reverse, double sweepGap) {
        Map<Double, List<ReversePoint>> byT = SweepTemperatures.group(reverse, ReversePoint::temperature, sweepGap);
        List<ReversePoint> breakdown = new ArrayList<>();
        List<ReversePoint> leakage = new ArrayList<>();
        for (List<ReversePoint> sweep : byT.values()) {
            List<ReversePoint> s = new ArrayList<>(sweep);
            s.sort(Comparator.comparingDouble((ReversePoint r) -> -r.current()).thenComparingDouble(r -> -r.voltage()));
            for (int i = 0; i < s.size(); i++) {
                int a = i > 0 ? i - 1 : 0;
                int b = i > 0 ? i : Math.min(s.size() - 1, 1);
                boolean steep = b > a && steep(s.get(a), s.get(b), BREAKDOWN_EXPONENT);
                if (!steep && i > 0 && i + 1 < s.size()) {
                    // the first point of a soft knee after a gap in voltage: the mean exponent across the gap
                    // understates the local one; the next step up is steep and this one already rose steeply
                    steep = steep(s.get(i), s.get(i + 1), BREAKDOWN_EXPONENT)
                            && steep(s.get(i - 1), s.get(i), KNEE_ENTRY_EXPONENT);
                }
                if (steep && s.size() >= 3) {
                    breakdown.add(s.get(i));
                } else {
                    leakage.add(s.get(i));
                }
            }
        }
        return new Split(breakdown, leakage);
    }

    /** Whether the step from a to b (|I_b| >= |I_a|) is steeper than {@code exponent}, allowing for voltage noise. */
    static boolean steep(ReversePoint a, ReversePoint b, double exponent) {
        double va = -a.voltage();
        double vb = -b.voltage();
        double dl = Math.log(b.current() / a.current());
        double jitter = JITTER_SIGMAS * Math.hypot(a.sigma(), b.sigma());
        double rise = vb - va;
        double steepRise = va * Math.expm1(dl / exponent);
        return rise >= -jitter && rise <= steepRise + jitter && dl > 0;
    }

    /** {@link #start(List, double, double, boolean, double)} with the default sweep gap. */
    static double[] start(List<ReversePoint> breakdown, double seriesResistance, double tnom, boolean withTempco) {
        return start(breakdown, seriesResistance, tnom, withTempco, SweepTemperatures.DEFAULT_GAP);
    }

    /**
     * Start values from breakdown points: {BV at Tnom [V], NBV [1], IBV [A], TCV [V/K]}. One line per sweep
     * ({@code sweepGap} [K]), at the sweep's label temperature (a logger's wander of a few tenths of a kelvin
     * moves a start value far less than the fit will).
     */
    static double[] start(List<ReversePoint> breakdown, double seriesResistance, double tnom, boolean withTempco,
                          double sweepGap) {
        Map<Double, List<ReversePoint>> byT = SweepTemperatures.group(breakdown, ReversePoint::temperature, sweepGap);
        double logSum = 0;
        for (ReversePoint r : breakdown) {
            logSum += Math.log(-r.current());
        }
        double ibv = niceCurrent(Math.exp(logSum / breakdown.size()));
        List<double[]> bvAtT = new ArrayList<>();
        double nbvSum = 0;
        for (Map.Entry<Double, List<ReversePoint>> e : byT.entrySet()) {
            List<double[]> xy = new ArrayList<>();
            for (ReversePoint r : e.getValue()) {
                xy.add(new double[] {Math.log(-r.current()), -r.voltage() + seriesResistance * r.current()});
            }
            double vt = Ngspice39.thermalVoltage(e.getKey());
            double[] line = xy.size() >= 2 ? StartValues.regressPairs(xy) : new double[] {xy.get(0)[1], vt};
            double slope = line[1] > 0 ? line[1] : vt;
            nbvSum += slope / vt;
            bvAtT.add(new double[] {e.getKey() - tnom, line[0] + slope * Math.log(ibv)});
        }
        double nbv = nbvSum / byT.size();
        double bv;
        double tcv = 0;
        if (withTempco && bvAtT.size() >= 2) {
            double[] fit = StartValues.regressPairs(bvAtT);
            bv = fit[0];
            tcv = -fit[1];
        } else {
            bv = bvAtT.stream().mapToDouble(x -> x[1]).average().orElseThrow();
        }
        return new double[] {bv, nbv, ibv, tcv};
    }

    /** The nearest value of the 1-2-5 series [A]. */
    static double niceCurrent(double amperes) {
        double decade = Math.pow(10, Math.floor(Math.log10(amperes)));
        double m = amperes / decade;
        double pick = m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10;
        return pick * decade;
    }
}
