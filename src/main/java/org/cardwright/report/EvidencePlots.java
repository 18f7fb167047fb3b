package org.cardwright.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.NavigableSet;
import java.util.TreeMap;
import java.util.TreeSet;
import org.cardwright.verify.CapacitanceResidual;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.PointResidual;
import org.cardwright.verify.Verification;
import org.cardwright.model.SweepTemperatures;

/**
 * The plots of the evidence page: measured points against the card's simulation, and the residuals against the
 * limits, one colour per temperature (the same temperature has the same colour on every plot of a page).
 */
final class EvidencePlots {
    /**
     * Our palette, cold to hot: slate blue, sea green, moss, ochre, rust, plum. Spread over the temperatures of a
     * page so that the coldest is always blue and the hottest (of up to six) always plum.
     */
    private static final String[] PALETTE = {"#33608c", "#2e8a78", "#6e8b2d", "#c2912a", "#bd5634", "#7b3a6b"};
    /** Headroom above the largest residual or limit on a residual plot [1]. */
    private static final double RESIDUAL_HEADROOM = 1.12;
    /**
     * A residual plot reaches at most this many single-point limits either side of zero; a card that misses by more
     * fails anyway, and a wider scale would flatten the limits into the zero line. Residuals beyond it are left out
     * and counted in the caption [1].
     */
    private static final double OFF_SCALE = 50;

    /**
     * One drawn plot.
     *
     * @param svg       the {@code <svg>} element
     * @param cutOff    points that could not be drawn: simulated value not finite or far beyond the measured range,
     *                  or residual beyond the residual scale
     */
    record Figure(String svg, int cutOff) {
    }

    private final Map<Double, String> colours = new TreeMap<>();

    /** @param temperatures every temperature the page plots [K] */
    EvidencePlots(NavigableSet<Double> temperatures) {
        int n = temperatures.size();
        int i = 0;
        for (double t : temperatures) {
            int index = n <= PALETTE.length
                    ? (n == 1 ? 0 : (int) Math.round(i * (PALETTE.length - 1) / (double) (n - 1)))
                    : i % PALETTE.length;
            colours.put(t, PALETTE[index]);
            i++;
        }
    }

    /** The temperatures a page plots, from its I-V and C-V sections [K]. */
    static NavigableSet<Double> temperaturesOf(List<Verification> junctions, List<CapacitanceVerification> capacitances) {
        List<Double> all = new ArrayList<>();
        junctions.forEach(v -> v.points().forEach(p -> all.add(p.point().temperature())));
        capacitances.forEach(v -> v.points().forEach(p -> all.add(p.point().temperature())));
        NavigableSet<Double> t = new TreeSet<>();
        // one colour per sweep: logged temperatures that wander form one sweep (SweepTemperatures)
        for (double label : SweepTemperatures.labels(all.stream().mapToDouble(Double::doubleValue).toArray(),
                SweepTemperatures.DEFAULT_GAP)) {
            t.add(label);
        }
        return t;
    }

    /** Colour of a temperature of this page [K]. */
    String colour(double temperature) {
        String c = colours.get(temperature);
        if (c == null) {
            // a section's sweep label may differ from the page's by the wander of the rows it lacks
            Map.Entry<Double, String> near = nearest(temperature);
            if (near != null && Math.abs(near.getKey() - temperature) <= SweepTemperatures.DEFAULT_GAP) {
                return near.getValue();
            }
            throw new IllegalArgumentException("temperature " + temperature + " K is not among the page's temperatures");
        }
        return c;
    }

    /** Colour of a temperature when this page plots it [K]. */
    java.util.Optional<String> plottedColour(double temperature) {
        return java.util.Optional.ofNullable(colours.get(temperature));
    }

    /** "25.0 °C". */
    static String celsius(double kelvin) {
        return Units.celsius(kelvin) + " \u00b0C";
    }

    /**
     * Current on a log axis against voltage: measured markers and the card's voltage at each measured current as a
     * line; for breakdown ({@code reverse}) magnitudes |V| and |I|.
     */
    Figure junctionCurve(String id, Verification v, boolean reverse) {
        Map<Double, List<PointResidual>> byT = byTemperature(v.points());
        double[] measured = range(v.points().stream().mapToDouble(r -> volts(r.point().voltage(), reverse)).toArray());
        double span = Math.max(measured[1] - measured[0], 1e-3);
        double lowX = measured[0];
        double highX = measured[1];
        for (PointResidual r : v.points()) {
            double s = volts(r.simulated(), reverse);
            if (Double.isFinite(s) && s >= measured[0] - span && s <= measured[1] + span) {
                lowX = Math.min(lowX, s);
                highX = Math.max(highX, s);
            }
        }
        int cut = 0;
        double[] currents = range(v.points().stream().mapToDouble(r -> Math.abs(r.point().current())).toArray());
        PlotAxis x = PlotAxis.linear(lowX, highX, reverse ? "|V|, reverse voltage [V]" : "forward voltage [V]");
        PlotAxis y = PlotAxis.log(currents[0], currents[1], reverse ? "|I|, reverse current [A]" : "forward current [A]");
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.CURVE,
                (reverse ? "Breakdown" : "Forward") + " current against voltage, measured and card", x, y);
        for (Map.Entry<Double, List<PointResidual>> e : byT.entrySet()) {
            List<SvgPlot.Marker> markers = new ArrayList<>();
            for (PointResidual r : e.getValue()) {
                markers.add(new SvgPlot.Marker(volts(r.point().voltage(), reverse), Math.abs(r.point().current()),
                        pointTitle(r, e.getKey())));
            }
            List<PointResidual> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(r -> Math.abs(r.point().current())));
            List<double[]> line = new ArrayList<>();
            for (PointResidual r : sorted) {
                double s = volts(r.simulated(), reverse);
                boolean shown = s >= x.low() && s <= x.high();
                cut += shown ? 0 : 1;
                line.add(new double[] {shown ? s : Double.NaN, Math.abs(r.point().current())});
            }
            plot.add(new SvgPlot.Series(celsius(e.getKey()), Units.celsius(e.getKey()), colour(e.getKey()), markers, line));
        }
        plot.explain("\u25cb measured").explain("\u2014 card");
        return new Figure(plot.render(), cut);
    }

    /** Card minus measured voltage (|V| for breakdown) in mV against |I| on a log axis, with the limits. */
    Figure junctionResiduals(String id, Verification v, boolean reverse) {
        Map<Double, List<PointResidual>> byT = byTemperature(v.points());
        double[] currents = range(v.points().stream().mapToDouble(r -> Math.abs(r.point().current())).toArray());
        double limit = v.tolerance().max() * 1e3;
        double extent = limit;
        int cut = 0;
        for (PointResidual r : v.points()) {
            double mv = residualMillivolts(r, reverse);
            if (onScale(mv, limit)) {
                extent = Math.max(extent, Math.abs(mv));
            } else {
                cut++;
            }
        }
        PlotAxis x = PlotAxis.log(currents[0], currents[1], reverse ? "|I|, reverse current [A]" : "forward current [A]");
        PlotAxis y = PlotAxis.symmetric(extent * RESIDUAL_HEADROOM, reverse ? "card \u2212 measured |V| [mV]"
                : "card \u2212 measured V [mV]");
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.RESIDUALS,
                (reverse ? "Breakdown" : "Forward") + " voltage residuals against current, with limits", x, y);
        plot.zeroLine();
        limits(plot, v.tolerance().rms() * 1e3, v.tolerance().max() * 1e3, "mV", 2);
        for (Map.Entry<Double, List<PointResidual>> e : byT.entrySet()) {
            List<PointResidual> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(r -> Math.abs(r.point().current())));
            List<SvgPlot.Marker> markers = new ArrayList<>();
            List<double[]> line = new ArrayList<>();
            for (PointResidual r : sorted) {
                double mv = onScale(residualMillivolts(r, reverse), limit) ? residualMillivolts(r, reverse) : Double.NaN;
                markers.add(new SvgPlot.Marker(Math.abs(r.point().current()), mv, pointTitle(r, e.getKey())));
                line.add(new double[] {Math.abs(r.point().current()), mv});
            }
            plot.add(new SvgPlot.Series(celsius(e.getKey()), Units.celsius(e.getKey()), colour(e.getKey()), markers, line));
        }
        plot.explain("\u25cb one measured point");
        return new Figure(plot.render(), cut);
    }

    /** Device capacitance (reading minus stray) and the card's capacitance in pF against bias voltage. */
    Figure capacitanceCurve(String id, CapacitanceVerification v) {
        Map<Double, List<CapacitanceResidual>> byT = SweepTemperatures.group(v.points(), r -> r.point().temperature(),
                SweepTemperatures.DEFAULT_GAP);
        double[] volts = range(v.points().stream().mapToDouble(r -> r.point().voltage()).toArray());
        double[] pf = range(v.points().stream().mapToDouble(r -> r.deviceCapacitance() * 1e12).toArray());
        double span = Math.max(pf[1] - pf[0], Math.abs(pf[1]) * 0.01);
        double low = pf[0];
        double high = pf[1];
        for (CapacitanceResidual r : v.points()) {
            double s = r.simulated() * 1e12;
            if (Double.isFinite(s) && s >= pf[0] - span && s <= pf[1] + span) {
                low = Math.min(low, s);
                high = Math.max(high, s);
            }
        }
        int cut = 0;
        PlotAxis x = PlotAxis.linear(volts[0], volts[1], "bias voltage [V]");
        PlotAxis y = low > 0 ? PlotAxis.fromZero(high, "capacitance [pF]") : PlotAxis.linear(low, high, "capacitance [pF]");
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.CURVE, "Capacitance against bias, measured and card", x, y);
        for (Map.Entry<Double, List<CapacitanceResidual>> e : byT.entrySet()) {
            List<SvgPlot.Marker> markers = new ArrayList<>();
            for (CapacitanceResidual r : e.getValue()) {
                markers.add(new SvgPlot.Marker(r.point().voltage(), r.deviceCapacitance() * 1e12,
                        capacitanceTitle(r, e.getKey())));
            }
            List<CapacitanceResidual> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(r -> r.point().voltage()));
            List<double[]> line = new ArrayList<>();
            for (CapacitanceResidual r : sorted) {
                double s = r.simulated() * 1e12;
                boolean shown = s >= y.low() && s <= y.high();
                cut += shown ? 0 : 1;
                line.add(new double[] {r.point().voltage(), shown ? s : Double.NaN});
            }
            plot.add(new SvgPlot.Series(celsius(e.getKey()), Units.celsius(e.getKey()), colour(e.getKey()), markers, line));
        }
        plot.explain("\u25cb measured \u2212 stray").explain("\u2014 card");
        return new Figure(plot.render(), cut);
    }

    /** Card minus measured capacitance in % of the measured, against bias voltage, with the limits. */
    Figure capacitanceResiduals(String id, CapacitanceVerification v) {
        Map<Double, List<CapacitanceResidual>> byT = SweepTemperatures.group(v.points(), r -> r.point().temperature(),
                SweepTemperatures.DEFAULT_GAP);
        double[] volts = range(v.points().stream().mapToDouble(r -> r.point().voltage()).toArray());
        double limit = v.tolerance().maxPercent();
        double extent = limit;
        int cut = 0;
        for (CapacitanceResidual r : v.points()) {
            if (onScale(r.residualPercent(), limit)) {
                extent = Math.max(extent, Math.abs(r.residualPercent()));
            } else {
                cut++;
            }
        }
        PlotAxis x = PlotAxis.linear(volts[0], volts[1], "bias voltage [V]");
        PlotAxis y = PlotAxis.symmetric(extent * RESIDUAL_HEADROOM, "card \u2212 measured [%]");
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.RESIDUALS, "Capacitance residuals against bias, with limits", x, y);
        plot.zeroLine();
        limits(plot, v.tolerance().rmsPercent(), v.tolerance().maxPercent(), "%", 2);
        for (Map.Entry<Double, List<CapacitanceResidual>> e : byT.entrySet()) {
            List<CapacitanceResidual> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(r -> r.point().voltage()));
            List<SvgPlot.Marker> markers = new ArrayList<>();
            List<double[]> line = new ArrayList<>();
            for (CapacitanceResidual r : sorted) {
                double percent = onScale(r.residualPercent(), limit) ? r.residualPercent() : Double.NaN;
                markers.add(new SvgPlot.Marker(r.point().voltage(), percent, capacitanceTitle(r, e.getKey())));
                line.add(new double[] {r.point().voltage(), percent});
            }
            plot.add(new SvgPlot.Series(celsius(e.getKey()), Units.celsius(e.getKey()), colour(e.getKey()), markers, line));
        }
        plot.explain("\u25cb one measured point");
        return new Figure(plot.render(), cut);
    }

    private static void limits(SvgPlot plot, double rms, double max, String unit, int decimals) {
        String f = "%." + decimals + "f";
        plot.level(new SvgPlot.Level(rms, "rms", "RMS limit \u00b1" + String.format(Locale.ROOT, f, rms) + " " + unit));
        plot.level(new SvgPlot.Level(-rms, "rms", ""));
        plot.level(new SvgPlot.Level(max, "max", "point limit \u00b1" + String.format(Locale.ROOT, f, max) + " " + unit));
        plot.level(new SvgPlot.Level(-max, "max", ""));
    }

    /** True when a residual is finite and within {@link #OFF_SCALE} single-point limits of zero. */
    private static boolean onScale(double residual, double pointLimit) {
        return Double.isFinite(residual) && Math.abs(residual) <= OFF_SCALE * pointLimit;
    }

    private static double volts(double v, boolean reverse) {
        return reverse ? Math.abs(v) : v;
    }

    private static double residualMillivolts(PointResidual r, boolean reverse) {
        double d = reverse ? Math.abs(r.simulated()) - Math.abs(r.point().voltage()) : r.residual();
        return d * 1e3;
    }

    private static Map<Double, List<PointResidual>> byTemperature(List<PointResidual> points) {
        return SweepTemperatures.group(points, r -> r.point().temperature(), SweepTemperatures.DEFAULT_GAP);
    }

    private Map.Entry<Double, String> nearest(double temperature) {
        TreeMap<Double, String> m = (TreeMap<Double, String>) colours;
        Map.Entry<Double, String> lo = m.floorEntry(temperature);
        Map.Entry<Double, String> hi = m.ceilingEntry(temperature);
        if (lo == null || (hi != null && hi.getKey() - temperature < temperature - lo.getKey())) {
            return hi;
        }
        return lo;
    }

    /** {min, max} of finite values; {1, 1} when none. */
    private static double[] range(double[] values) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double d : values) {
            if (Double.isFinite(d)) {
                lo = Math.min(lo, d);
                hi = Math.max(hi, d);
            }
        }
        return lo <= hi ? new double[] {lo, hi} : new double[] {1, 1};
    }

    private static String pointTitle(PointResidual r, double temperature) {
        return r.point().source() + ":" + r.point().line() + ", " + celsius(temperature) + ": I "
                + Units.engineering(r.point().current(), "A") + ", measured "
                + String.format(Locale.ROOT, "%.4f", r.point().voltage()) + " V, card "
                + String.format(Locale.ROOT, "%.4f", r.simulated()) + " V";
    }

    private static String capacitanceTitle(CapacitanceResidual r, double temperature) {
        return r.point().where() + ", " + celsius(temperature) + ": at " + String.format(Locale.ROOT, "%.3f", r.point().voltage())
                + " V, measured " + Units.engineering(r.deviceCapacitance(), "F") + ", card "
                + Units.engineering(r.simulated(), "F") + String.format(Locale.ROOT, " (%+.2f %%)", r.residualPercent());
    }
}
