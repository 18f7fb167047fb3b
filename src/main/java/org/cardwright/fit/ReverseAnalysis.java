package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.cardwright.model.Ngspice39;

/**
 * Sorting reverse points into breakdown and leakage, and closed-form breakdown start values.
 *
 * <p>A point is in breakdown where the current rises faster than the tenth power of the voltage: the local
 * exponent d ln|I| / d ln|V|, taken between the point and its neighbour at the next smaller voltage, exceeds 10. Leakage below breakdown (ohmic or generation-like, exponents near 1)
 * stays far below that; an avalanche or zener knee lies far above it (common practice, no source).
 */
public final class ReverseAnalysis {
    /** Local exponent d ln|I| / d ln|V| above which a point counts as breakdown [1]. */
    public static final double BREAKDOWN_EXPONENT = 10;

    private ReverseAnalysis() {
    }

    /** The two groups. */
    public record Split(List<ReversePoint> breakdown, List<ReversePoint> leakage) {
    }

    /** Sorts reverse points into breakdown and leakage, sweep by sweep (one sweep per temperature). */
    public static Split split(List<ReversePoint> reverse) {
        Map<Double, List<ReversePoint>> byT = new TreeMap<>();
        for (ReversePoint r : reverse) {
            byT.computeIfAbsent(r.temperature(), t -> new ArrayList<>()).add(r);
        }
        List<ReversePoint> breakdown = new ArrayList<>();
        List<ReversePoint> leakage = new ArrayList<>();
        for (List<ReversePoint> sweep : byT.values()) {
            List<ReversePoint> s = new ArrayList<>(sweep);
            s.sort(Comparator.comparingDouble(r -> -r.voltage()));
            for (int i = 0; i < s.size(); i++) {
                // the exponent toward the next smaller voltage (toward the next larger for the first point): the
                // last leakage point must not borrow the steep step up to the first breakdown point
                int a = i > 0 ? i - 1 : 0;
                int b = i > 0 ? i : Math.min(s.size() - 1, 1);
                double exponent = 0;
                if (b > a) {
                    double dl = Math.log(s.get(b).current() / s.get(a).current());
                    double dv = Math.log(s.get(b).voltage() / s.get(a).voltage());
                    exponent = dv > 0 ? dl / dv : Double.POSITIVE_INFINITY;
                }
                if (exponent > BREAKDOWN_EXPONENT && s.size() >= 3) {
                    breakdown.add(s.get(i));
                } else {
                    leakage.add(s.get(i));
                }
            }
        }
        return new Split(breakdown, leakage);
    }

    /** Start values from breakdown points: {BV at Tnom [V], NBV [1], IBV [A], TCV [V/K]}. */
    static double[] start(List<ReversePoint> breakdown, double seriesResistance, double tnom, boolean withTempco) {
        Map<Double, List<ReversePoint>> byT = new TreeMap<>();
        double logSum = 0;
        for (ReversePoint r : breakdown) {
            byT.computeIfAbsent(r.temperature(), t -> new ArrayList<>()).add(r);
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
