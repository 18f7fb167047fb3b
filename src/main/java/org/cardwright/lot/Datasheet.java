package org.cardwright.lot;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.cardwright.data.CvPoint;
import org.cardwright.data.IvPoint;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.workflow.Inputs;

/**
 * The quantities a datasheet states, read off one part's measurements (interpolated between the two points that
 * bracket the condition, never extrapolated) and computed from a card at the same condition.
 */
public final class Datasheet {

    /** A datasheet quantity. */
    public enum Quantity {
        /** Forward voltage at the forward current IF [V]. */
        VF("VF", "V", "IF", "A"),
        /** Reverse leakage current (magnitude) at the reverse voltage VR [A]. */
        IR("IR", "A", "VR", "V"),
        /** Capacitance at the reverse voltage VR [F]. */
        C("C", "F", "VR", "V"),
        /** Breakdown voltage (magnitude) at the reverse current IZ [V]. */
        VZ("VZ", "V", "IZ", "A"),
        /**
         * Temperature coefficient of VZ at IZ [V/K]: measured, the least-squares slope of VZ over the temperatures
         * at which the part's breakdown data bracket IZ (at least two, {@link #MIN_TC_SPAN} apart); from a card, the
         * central difference over the datasheet temperature +- {@link #TC_HALF_SPAN}.
         */
        TCVZ("TCVZ", "V/K", "IZ", "A");

        private final String label;
        private final String unit;
        private final String conditionLabel;
        private final String conditionUnit;

        Quantity(String label, String unit, String conditionLabel, String conditionUnit) {
            this.label = label;
            this.unit = unit;
            this.conditionLabel = conditionLabel;
            this.conditionUnit = conditionUnit;
        }

        /** Its name in tables and JSON. */
        public String label() {
            return label;
        }

        /** Its SI unit. */
        public String unit() {
            return unit;
        }

        /** Name of its condition (IF, VR, IZ). */
        public String conditionLabel() {
            return conditionLabel;
        }

        /** Unit of its condition. */
        public String conditionUnit() {
            return conditionUnit;
        }
    }

    /** Points within this of the datasheet temperature count as taken at it: a bench oven's setpoint band [K]. */
    static final double SAME_TEMPERATURE = 0.5;

    /** Breakdown readings must span at least this much temperature for a measured TC of VZ [K]. */
    static final double MIN_TC_SPAN = 10;
    /**
     * A card's TC of VZ is taken over the datasheet temperature +- this: a bench's usual -20..85 degC span around
     * 25 degC is about 50 K each way, and over it a card's VZ(T) is straight to well within the readings' noise [K].
     */
    static final double TC_HALF_SPAN = 25;

    private Datasheet() {
    }

    /** The measured value of every quantity whose condition the part's data bracket at {@code temperature}. */
    static Map<Quantity, Double> measured(Inputs in, Map<Quantity, Double> conditions, double temperature) {
        Map<Quantity, Double> out = new EnumMap<>(Quantity.class);
        for (Map.Entry<Quantity, Double> e : conditions.entrySet()) {
            double x = e.getValue();
            double v = switch (e.getKey()) {
                case VF -> interpolate(points(in.forward(), temperature), x, true, false);
                case IR -> leakage(points(in.reverse(), temperature), x);
                case C -> capacitance(in.capacitance(), temperature, -x);
                case VZ -> interpolate(points(in.reverse(), temperature), x, true, true);
                case TCVZ -> breakdownSlope(in.reverse(), x);
            };
            if (Double.isFinite(v)) {
                out.put(e.getKey(), v);
            }
        }
        return out;
    }

    /** The value of every quantity computed from the card {@code p} (ngspice 39 equations) [SI]. */
    static Map<Quantity, Double> ofCard(DiodeParameters p, Map<Quantity, Double> conditions, double temperature) {
        DiodeAtTemperature d = TemperatureLaws.at(p, temperature, SimulatorOptions.NGSPICE_DEFAULTS);
        Map<Quantity, Double> out = new EnumMap<>(Quantity.class);
        for (Map.Entry<Quantity, Double> e : conditions.entrySet()) {
            double x = e.getValue();
            double v = switch (e.getKey()) {
                case VF -> DiodeSolver.voltageAtCurrent(d, x);
                case IR -> Math.abs(DiodeSolver.currentAtVoltage(d, -x));
                case C -> JunctionCapacitance.total(d, JunctionCapacitance.junctionVoltage(d, -x));
                case VZ -> d.hasBreakdown() ? Math.abs(DiodeSolver.voltageAtCurrent(d, -x)) : Double.NaN;
                case TCVZ -> {
                    DiodeAtTemperature lo = TemperatureLaws.at(p, temperature - TC_HALF_SPAN, SimulatorOptions.NGSPICE_DEFAULTS);
                    DiodeAtTemperature hi = TemperatureLaws.at(p, temperature + TC_HALF_SPAN, SimulatorOptions.NGSPICE_DEFAULTS);
                    yield d.hasBreakdown() ? (Math.abs(DiodeSolver.voltageAtCurrent(hi, -x)) - Math.abs(DiodeSolver.voltageAtCurrent(lo, -x)))
                            / (2 * TC_HALF_SPAN) : Double.NaN;
                }
            };
            if (Double.isFinite(v)) {
                out.put(e.getKey(), v);
            }
        }
        return out;
    }

    /**
     * Least-squares slope of VZ at {@code current} over the temperatures of the breakdown data (points within
     * {@link #SAME_TEMPERATURE} of each other form one temperature); NaN with fewer than two temperatures at which the
     * data bracket the current, or when they span less than {@link #MIN_TC_SPAN}.
     */
    static double breakdownSlope(List<Inputs.Located> located, double current) {
        List<Double> temps = new ArrayList<>();
        for (Inputs.Located l : located) {
            temps.add(l.point().temperature());
        }
        temps.sort(Double::compare);
        List<double[]> tv = new ArrayList<>();
        int i = 0;
        while (i < temps.size()) {
            int j = i;
            double sum = 0;
            while (j < temps.size() && temps.get(j) - temps.get(i) <= 2 * SAME_TEMPERATURE) {
                sum += temps.get(j);
                j++;
            }
            double t = sum / (j - i);
            double v = interpolate(points(located, t), current, true, true);
            if (Double.isFinite(v)) {
                tv.add(new double[] {t, v});
            }
            i = j;
        }
        if (tv.size() < 2 || tv.get(tv.size() - 1)[0] - tv.get(0)[0] < MIN_TC_SPAN) {
            return Double.NaN;
        }
        double mt = 0;
        double mv = 0;
        for (double[] p : tv) {
            mt += p[0] / tv.size();
            mv += p[1] / tv.size();
        }
        double sxy = 0;
        double sxx = 0;
        for (double[] p : tv) {
            sxy += (p[0] - mt) * (p[1] - mv);
            sxx += (p[0] - mt) * (p[0] - mt);
        }
        return sxy / sxx;
    }

    /** (|I|, |V|) of the points at the temperature, sorted by |I|. */
    private static List<double[]> points(List<Inputs.Located> located, double temperature) {
        List<double[]> out = new ArrayList<>();
        for (Inputs.Located l : located) {
            IvPoint p = l.point();
            if (Math.abs(p.temperature() - temperature) <= SAME_TEMPERATURE) {
                out.add(new double[] {Math.abs(p.current()), Math.abs(p.voltage())});
            }
        }
        out.sort(Comparator.comparingDouble(a -> a[0]));
        return out;
    }

    /**
     * |V| at |I| = {@code current}, linear in ln|I| between the bracketing points; with {@code fromTop} the
     * bracket nearest the largest current is taken (breakdown: the sweep's top), else the first one.
     */
    private static double interpolate(List<double[]> byCurrent, double current, boolean logCurrent, boolean fromTop) {
        double found = Double.NaN;
        for (int i = 0; i + 1 < byCurrent.size(); i++) {
            double[] a = byCurrent.get(i);
            double[] b = byCurrent.get(i + 1);
            if (a[0] <= current && current <= b[0] && b[0] > a[0]) {
                double t = logCurrent ? Math.log(current / a[0]) / Math.log(b[0] / a[0]) : (current - a[0]) / (b[0] - a[0]);
                found = a[1] + t * (b[1] - a[1]);
                if (!fromTop) {
                    return found;
                }
            }
        }
        return found;
    }

    /** |I| at |V| = {@code volts}, ln|I| linear in |V|, over the points sorted by |V|. */
    private static double leakage(List<double[]> byCurrent, double volts) {
        List<double[]> byV = new ArrayList<>(byCurrent);
        byV.sort(Comparator.comparingDouble(a -> a[1]));
        for (int i = 0; i + 1 < byV.size(); i++) {
            double[] a = byV.get(i);
            double[] b = byV.get(i + 1);
            if (a[1] <= volts && volts <= b[1] && b[1] > a[1]) {
                double t = (volts - a[1]) / (b[1] - a[1]);
                return Math.exp(Math.log(a[0]) + t * (Math.log(b[0]) - Math.log(a[0])));
            }
        }
        return Double.NaN;
    }

    /** C at terminal voltage {@code v}, linear between the bracketing points at the temperature. */
    private static double capacitance(List<Inputs.LocatedCapacitance> located, double temperature, double v) {
        List<CvPoint> pts = new ArrayList<>();
        for (Inputs.LocatedCapacitance l : located) {
            if (Math.abs(l.point().temperature() - temperature) <= SAME_TEMPERATURE) {
                pts.add(l.point());
            }
        }
        pts.sort(Comparator.comparingDouble(CvPoint::voltage));
        for (int i = 0; i + 1 < pts.size(); i++) {
            CvPoint a = pts.get(i);
            CvPoint b = pts.get(i + 1);
            if (a.voltage() <= v && v <= b.voltage() && b.voltage() > a.voltage()) {
                double t = (v - a.voltage()) / (b.voltage() - a.voltage());
                return a.capacitance() + t * (b.capacitance() - a.capacitance());
            }
        }
        return Double.NaN;
    }

    /** The 1-2-5 value nearest {@code x} on a log scale (x > 0). */
    static double nice(double x) {
        double decade = Math.pow(10, Math.floor(Math.log10(x)));
        double best = decade;
        for (double m : new double[] {1, 2, 5, 10}) {
            if (Math.abs(Math.log(m * decade / x)) < Math.abs(Math.log(best / x))) {
                best = m * decade;
            }
        }
        return Double.parseDouble(String.format(java.util.Locale.ROOT, "%.3g", best));
    }

    /** The largest 1-2-5 value not above {@code x} (x > 0). */
    static double niceBelow(double x) {
        double decade = Math.pow(10, Math.floor(Math.log10(x) + 1e-12));
        double best = decade;
        for (double m : new double[] {1, 2, 5}) {
            if (m * decade <= x * (1 + 1e-12)) {
                best = m * decade;
            }
        }
        return Double.parseDouble(String.format(java.util.Locale.ROOT, "%.3g", best));
    }
}
