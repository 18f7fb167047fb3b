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
 * limits, one colour and one marker shape per temperature (the same temperature looks the same on every plot of a
 * page). The colours are the colour-blind-safe set of Okabe and Ito, "Color Universal Design (CUD): how to make
 * figures and presentations that are friendly to colorblind people", J*FLY, 2008 [OkabeIto2008]; the shapes keep
 * the temperatures apart in greyscale too.
 */
final class EvidencePlots {
    /**
     * Okabe and Ito's colour-blind-safe set [OkabeIto2008] without its yellow (too pale on white), ordered cold to
     * hot: blue, sky blue, bluish green, orange, vermillion, reddish purple, black. Spread over the temperatures of a
     * page so that the coldest is always blue and the hottest (of up to seven) always black.
     */
    private static final String[] PALETTE = {"#0072b2", "#56b4e9", "#009e73", "#e69f00", "#d55e00", "#cc79a7", "#000000"};
    /** Headroom above the largest residual on a residual plot, so no marker touches the frame [1]. */
    private static final double RESIDUAL_HEADROOM = 1.12;
    /**
     * A residual plot reaches at most this many single-point limits either side of zero; a card that misses by more
     * fails anyway, and a wider scale would flatten the limits into the zero line. Residuals beyond it are left out
     * and counted in the caption [1].
     */
    private static final double OFF_SCALE = 50;
    /**
     * The leakage plot's current axis reaches the card's values up to this factor beyond the measured currents; a
     * card further off fails by far more than the 1-decade point limit and is counted as off the scale [1].
     */
    private static final double LEAKAGE_DECADES_SHOWN = 1e3;

    /**
     * One drawn plot.
     *
     * @param svg       the {@code <svg>} element
     * @param cutOff    points that could not be drawn: simulated value not finite or far beyond the measured range,
     *                  or residual beyond the residual scale
     */
    record Figure(String svg, int cutOff, boolean limitsOffScale) {
        Figure(String svg, int cutOff) {
            this(svg, cutOff, false);
        }
    }

    private final Map<Double, String> colours = new TreeMap<>();
    private final Map<Double, SvgPlot.Shape> shapes = new TreeMap<>();

    /** @param temperatures every temperature the page plots [K] */
    EvidencePlots(NavigableSet<Double> temperatures) {
        int n = temperatures.size();
        int i = 0;
        for (double t : temperatures) {
            int index = n <= PALETTE.length
                    ? (n == 1 ? 0 : (int) Math.round(i * (PALETTE.length - 1) / (double) (n - 1)))
                    : i % PALETTE.length;
            colours.put(t, PALETTE[index]);
            shapes.put(t, SvgPlot.Shape.of(i));
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

    /** The temperatures a page plots, from every section with points [K]. */
    static NavigableSet<Double> temperaturesOf(org.cardwright.verify.JunctionVerification all) {
        List<Verification> junctions = new ArrayList<>();
        all.forward().ifPresent(junctions::add);
        all.breakdown().ifPresent(junctions::add);
        NavigableSet<Double> t = temperaturesOf(junctions, all.capacitance().stream().toList());
        all.leakage().ifPresent(l -> l.points().forEach(p -> t.add(p.point().temperature())));
        all.recovery().ifPresent(r -> r.records().forEach(p -> t.add(p.record().temperature())));
        return t;
    }

    private SvgPlot.Series series(double temperature, List<SvgPlot.Marker> markers, List<double[]> line) {
        return new SvgPlot.Series(celsius(temperature), Units.celsius(temperature), colour(temperature),
                shape(temperature), markers, line);
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

    /** Marker shape of a temperature of this page [K]. */
    SvgPlot.Shape shape(double temperature) {
        colour(temperature);
        return shapes.get(temperature);
    }

    /** Marker shape of a temperature when this page plots it [K]. */
    java.util.Optional<SvgPlot.Shape> plottedShape(double temperature) {
        return java.util.Optional.ofNullable(shapes.get(temperature));
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
        PlotAxis y = PlotAxis.log(currents[0], currents[1], reverse ? "|I|, reverse current" : "forward current", "A");
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
            plot.add(series(e.getKey(), markers, line));
        }
        plot.explain("markers: measured").explain("lines: card");
        return new Figure(plot.render(), cut);
    }

    /** Card minus measured voltage (|V| for breakdown) in mV against |I| on a log axis, with the limits. */
    Figure junctionResiduals(String id, Verification v, boolean reverse) {
        Map<Double, List<PointResidual>> byT = byTemperature(v.points());
        double[] currents = range(v.points().stream().mapToDouble(r -> Math.abs(r.point().current())).toArray());
        double limit = v.tolerance().max() * 1e3;
        double extent = 0;
        int cut = 0;
        for (PointResidual r : v.points()) {
            double mv = residualMillivolts(r, reverse);
            if (onScale(mv, limit)) {
                extent = Math.max(extent, Math.abs(mv));
            } else {
                cut++;
            }
        }
        PlotAxis x = PlotAxis.log(currents[0], currents[1], reverse ? "|I|, reverse current" : "forward current", "A");
        PlotAxis y = PlotAxis.symmetric(residualExtent(extent, v.tolerance().rms() * 1e3), reverse ? "card \u2212 measured |V| [mV]"
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
            plot.add(series(e.getKey(), markers, line));
        }
        plot.explain("markers: measured points");
        return new Figure(plot.render(), cut, plot.levelsOffScale());
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
            plot.add(series(e.getKey(), markers, line));
        }
        plot.explain("markers: measured").explain("lines: card");
        return new Figure(plot.render(), cut);
    }

    /** Card minus measured capacitance in % of the measured, against bias voltage, with the limits. */
    Figure capacitanceResiduals(String id, CapacitanceVerification v) {
        Map<Double, List<CapacitanceResidual>> byT = SweepTemperatures.group(v.points(), r -> r.point().temperature(),
                SweepTemperatures.DEFAULT_GAP);
        double[] volts = range(v.points().stream().mapToDouble(r -> r.point().voltage()).toArray());
        double limit = v.tolerance().maxPercent();
        double extent = 0;
        int cut = 0;
        for (CapacitanceResidual r : v.points()) {
            if (onScale(r.residualPercent(), limit)) {
                extent = Math.max(extent, Math.abs(r.residualPercent()));
            } else {
                cut++;
            }
        }
        PlotAxis x = PlotAxis.linear(volts[0], volts[1], "bias voltage [V]");
        PlotAxis y = PlotAxis.symmetric(residualExtent(extent, v.tolerance().rmsPercent()), "card \u2212 measured [%]");
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
            plot.add(series(e.getKey(), markers, line));
        }
        plot.explain("markers: measured points");
        return new Figure(plot.render(), cut, plot.levelsOffScale());
    }

    /**
     * Half-height of a residual axis: the largest drawn residual with headroom, so the residuals' own shape shows
     * however far inside the limits they lie; the limit lines are drawn when they fall inside and named "beyond this
     * scale" otherwise. With no residual (or only zeros) the RMS limit sets the scale.
     */
    private static double residualExtent(double largest, double rmsLimit) {
        return (largest > 0 ? largest : rmsLimit) * RESIDUAL_HEADROOM;
    }

    /**
     * Device capacitance and the card's capacitance against reverse voltage, both on log axes, for the points at
     * reverse bias (V &lt; 0); points at zero or forward bias cannot be placed and are counted in {@code cutOff}. On
     * these axes the depletion capacitance CJO/(1 + |V|/VJ)^M bends into a straight line of slope -M once |V| is well
     * above VJ.
     */
    Figure capacitanceLogLog(String id, CapacitanceVerification v) {
        Map<Double, List<CapacitanceResidual>> byT = new TreeMap<>();
        v.points().forEach(r -> byT.computeIfAbsent(r.point().temperature(), k -> new ArrayList<>()).add(r));
        List<CapacitanceResidual> reverse = v.points().stream().filter(r -> r.point().voltage() < 0).toList();
        double[] volts = range(reverse.stream().mapToDouble(r -> -r.point().voltage()).toArray());
        double[] farads = range(reverse.stream().mapToDouble(CapacitanceResidual::deviceCapacitance)
                .filter(c -> c > 0).toArray());
        PlotAxis x = PlotAxis.log(volts[0], volts[1], "|V|, reverse bias", "V");
        PlotAxis y = PlotAxis.log(farads[0], farads[1], "capacitance", "F");
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.CURVE, "Capacitance against reverse bias, log-log, measured and card",
                x, y);
        int cut = v.points().size() - reverse.size();
        for (Map.Entry<Double, List<CapacitanceResidual>> e : byT.entrySet()) {
            List<SvgPlot.Marker> markers = new ArrayList<>();
            List<double[]> line = new ArrayList<>();
            List<CapacitanceResidual> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(r -> -r.point().voltage()));
            for (CapacitanceResidual r : sorted) {
                if (r.point().voltage() >= 0) {
                    continue;
                }
                markers.add(new SvgPlot.Marker(-r.point().voltage(), r.deviceCapacitance(), capacitanceTitle(r, e.getKey())));
                boolean shown = r.simulated() >= y.low() / 10 && r.simulated() <= y.high() * 10;
                line.add(new double[] {-r.point().voltage(), shown ? r.simulated() : Double.NaN});
            }
            plot.add(series(e.getKey(), markers, line));
        }
        plot.explain("markers: measured").explain("lines: card");
        return new Figure(plot.render(), cut);
    }

    /** |I| on a log axis against |V| below breakdown: measured markers and the card's current at each measured voltage. */
    Figure leakageCurve(String id, org.cardwright.verify.LeakageVerification v) {
        Map<Double, List<org.cardwright.verify.LeakageVerification.Simulated>> byT = new TreeMap<>();
        v.points().forEach(p -> byT.computeIfAbsent(p.point().temperature(), k -> new ArrayList<>()).add(p));
        double[] volts = range(v.points().stream().mapToDouble(p -> Math.abs(p.point().voltage())).toArray());
        double[] amps = range(v.points().stream().mapToDouble(p -> Math.abs(p.point().current())).toArray());
        double low = amps[0];
        double high = amps[1];
        for (var p : v.points()) {
            double s = Math.abs(p.simulated());
            if (s > 0 && Double.isFinite(s) && s >= amps[0] / LEAKAGE_DECADES_SHOWN && s <= amps[1] * LEAKAGE_DECADES_SHOWN) {
                low = Math.min(low, s);
                high = Math.max(high, s);
            }
        }
        PlotAxis x = PlotAxis.linear(volts[0], volts[1], "|V|, reverse voltage [V]");
        PlotAxis y = PlotAxis.log(low, high, "|I|, reverse current", "A");
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.CURVE, "Reverse leakage current against voltage, measured and card", x, y);
        int cut = 0;
        for (var e : byT.entrySet()) {
            List<SvgPlot.Marker> markers = new ArrayList<>();
            List<double[]> line = new ArrayList<>();
            List<org.cardwright.verify.LeakageVerification.Simulated> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(p -> Math.abs(p.point().voltage())));
            for (var p : sorted) {
                double vv = Math.abs(p.point().voltage());
                markers.add(new SvgPlot.Marker(vv, Math.abs(p.point().current()), p.point().source() + ":" + p.point().line()
                        + ", " + celsius(e.getKey()) + ": at " + String.format(Locale.ROOT, "%.3f", p.point().voltage())
                        + " V, measured " + Units.engineering(p.point().current(), "A") + ", card "
                        + Units.engineering(p.simulated(), "A")));
                double s = Math.abs(p.simulated());
                boolean shown = s >= y.low() && s <= y.high();
                cut += shown ? 0 : 1;
                line.add(new double[] {vv, shown ? s : Double.NaN});
            }
            plot.add(series(e.getKey(), markers, line));
        }
        plot.explain("markers: measured").explain("lines: card");
        return new Figure(plot.render(), cut);
    }

    /**
     * Measured recovery time against IF/|IR| on a log axis, and the card's trr = TT ln(1 + IF/|IR|) at each record's
     * ratio.
     */
    Figure recoveryCurve(String id, org.cardwright.verify.RecoveryVerification v) {
        Map<Double, List<org.cardwright.verify.RecoveryVerification.Modelled>> byT = new TreeMap<>();
        v.records().forEach(r -> byT.computeIfAbsent(r.record().temperature(), k -> new ArrayList<>()).add(r));
        double[] ratios = range(v.records().stream().mapToDouble(EvidencePlots::ratio).toArray());
        double[] times = range(v.records().stream().flatMapToDouble(r -> java.util.stream.DoubleStream.of(
                r.record().recoveryTime(), r.modelled())).filter(t -> t > 0).map(t -> t * 1e9).toArray());
        PlotAxis x = PlotAxis.log(ratios[0], ratios[1], "IF/|IR|, forward over reverse current", null);
        PlotAxis y = PlotAxis.linear(Math.min(0, times[0]), times[1], "recovery time trr [ns]");
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.CURVE, "Recovery time against current ratio, measured and card", x, y);
        for (var e : byT.entrySet()) {
            List<SvgPlot.Marker> markers = new ArrayList<>();
            List<double[]> line = new ArrayList<>();
            List<org.cardwright.verify.RecoveryVerification.Modelled> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(EvidencePlots::ratio));
            for (var r : sorted) {
                markers.add(new SvgPlot.Marker(ratio(r), r.record().recoveryTime() * 1e9, r.record().where() + ", "
                        + celsius(e.getKey()) + ": IF " + Units.engineering(r.record().forwardCurrent(), "A") + ", IR "
                        + Units.engineering(r.record().reverseCurrent(), "A") + ", measured "
                        + Units.engineering(r.record().recoveryTime(), "s") + ", card " + Units.engineering(r.modelled(), "s")));
                line.add(new double[] {ratio(r), r.modelled() * 1e9});
            }
            plot.add(series(e.getKey(), markers, line));
        }
        plot.explain("markers: measured").explain("lines: card");
        return new Figure(plot.render(), 0);
    }

    private static double ratio(org.cardwright.verify.RecoveryVerification.Modelled r) {
        return r.record().forwardCurrent() / Math.abs(r.record().reverseCurrent());
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
