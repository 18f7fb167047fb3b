package org.cardwright.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.ToDoubleFunction;
import org.cardwright.compare.CardComparison;
import org.cardwright.compare.ComparisonPlan;
import org.cardwright.model.SweepTemperatures;
import org.cardwright.verify.CapacitanceResidual;
import org.cardwright.verify.CapacitanceVerdict;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.LeakageVerification;
import org.cardwright.verify.PointResidual;
import org.cardwright.verify.RecoveryVerification;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;
import org.cardwright.workflow.CompareWorkflow;
import org.cardwright.workflow.ToolVersion;

/**
 * The page {@code compare --html} writes: both cards overlaid on the same measurements, one section per data kind
 * the data hold (forward, breakdown, C-V, recovery, leakage), each with the measured points as markers, card A as a
 * solid line and card B as a dashed line in the temperature's colour, the residuals of both against the limits, and a
 * per-temperature table with each card's verdict. Then the side-by-side tables of the comparison (what the terminal
 * prints), the parameters of both cards, the data files' SHA-256, the command and the notes. Built from the evidence
 * page's parts (its style, {@link SvgPlot}, {@link PlotAxis}, the colours and marker shapes of {@link EvidencePlots},
 * {@link Units}); self-contained, no script, the same bytes for the same comparison.
 */
public final class ComparePage {
    private static final String STYLE_EXTRA = String.join("\n",
            "svg .series.card-b polyline{stroke-dasharray:7 4}",
            "svg.residuals .series.card-b polyline{stroke-dasharray:5 3;stroke-width:1.4;stroke-opacity:0.85}",
            "p.lines{margin:4px 0;color:#3b4045}",
            "p.lines svg{width:34px;height:10px;vertical-align:middle;margin:0 4px}",
            "p.lines line{stroke:#23272b;stroke-width:1.8}",
            "p.lines line.dashed{stroke-dasharray:7 4}",
            "td.flag{color:#8a2419;font-weight:650}");
    /** Residuals beyond this many single-point limits are left off the residual scale and counted (as on the evidence page) [1]. */
    private static final double OFF_SCALE = 50;
    /** Headroom above the largest residual on a residual plot [1]. */
    private static final double RESIDUAL_HEADROOM = 1.12;
    /** A card's value more than this factor beyond the measured range of a log axis is not drawn [1]. */
    private static final double LOG_REACH = 1e3;

    private final CompareWorkflow.Outcome outcome;
    private final CompareWorkflow.Overlay overlay;
    private final String command;
    private final List<PageFacts.DataFile> dataFiles;
    private final EvidencePlots colours;
    private final StringBuilder out = new StringBuilder();
    private int figure;

    private ComparePage(CompareWorkflow.Outcome outcome, String command, List<PageFacts.DataFile> dataFiles) {
        this.outcome = outcome;
        this.overlay = outcome.overlay().orElseThrow(() -> new IllegalArgumentException("the page needs data to overlay"));
        this.command = command;
        this.dataFiles = List.copyOf(dataFiles);
        java.util.NavigableSet<Double> t = EvidencePlots.temperaturesOf(overlay.a());
        t.addAll(EvidencePlots.temperaturesOf(overlay.b()));
        this.colours = new EvidencePlots(t);
    }

    /**
     * The page.
     *
     * @param outcome   the comparison with both cards verified against the data
     * @param command   the command as run, for a POSIX shell
     * @param dataFiles the data files with their SHA-256
     */
    public static String render(CompareWorkflow.Outcome outcome, String command, List<PageFacts.DataFile> dataFiles) {
        return new ComparePage(outcome, command, dataFiles).page();
    }

    private String page() {
        String title = overlay.cardA() + " and " + overlay.cardB();
        out.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n")
                .append("<title>").append(Markup.escape(title)).append(": two cards on the same data</title>\n")
                .append("<style>\n").append(HtmlReport.STYLE).append('\n').append(STYLE_EXTRA).append("\n</style>\n</head>\n")
                .append("<body>\n<main>\n");
        header();
        overview();
        JunctionVerification a = overlay.a();
        JunctionVerification b = overlay.b();
        if (a.forward().isPresent() && b.forward().isPresent()) {
            junction("forward", "Forward conduction", a.forward().get(), b.forward().get(), false);
        }
        if (a.breakdown().isPresent() && b.breakdown().isPresent()) {
            junction("breakdown", "Reverse breakdown", a.breakdown().get(), b.breakdown().get(), true);
        }
        if (a.capacitance().isPresent() && b.capacitance().isPresent()) {
            capacitance(a.capacitance().get(), b.capacitance().get());
        }
        if (a.recovery().isPresent() && b.recovery().isPresent()) {
            recovery(a.recovery().get(), b.recovery().get());
        }
        if (a.leakage().isPresent() && b.leakage().isPresent()) {
            leakage(a.leakage().get(), b.leakage().get());
        }
        sideBySide();
        parameters();
        files();
        out.append("<section id=\"command\">\n<h2>Command</h2>\n<p class=\"limits\">As run, from the folder it was run in:</p>\n")
                .append("<pre class=\"command\">").append(Markup.escape(command)).append("</pre>\n</section>\n");
        List<String> notes = new ArrayList<>(outcome.cardNotes());
        notes.addAll(outcome.comparison().notes());
        a.notes().forEach(n -> notes.add("card A: " + n));
        b.notes().forEach(n -> notes.add("card B: " + n));
        out.append("<section id=\"notes\">\n<h2>Notes</h2>\n");
        if (notes.isEmpty()) {
            out.append("<p>None.</p>\n");
        } else {
            notes(notes.stream().distinct().toList());
        }
        out.append("</section>\n<footer>Written by cardwright ").append(Markup.escape(ToolVersion.get()))
                .append(". This page is self-contained: no scripts and nothing fetched from elsewhere. Hover over a "
                        + "marker to see the file and line it came from.</footer>\n</main>\n</body>\n</html>\n");
        return out.toString();
    }

    private void header() {
        long flagged = outcome.comparison().flaggedCount();
        out.append("<header class=\"top\">\n<p class=\"tool\">cardwright comparison of two cards</p>\n<h1>")
                .append(Markup.escape(overlay.cardA())).append(" and ").append(Markup.escape(overlay.cardB()))
                .append(" on the same data</h1>\n<dl class=\"facts\">\n")
                .append("<dt>card A (solid lines)</dt><dd><code>").append(Markup.escape(overlay.fileA())).append("</code>, model ")
                .append(Markup.escape(overlay.cardA())).append(passText(overlay.a().pass())).append("</dd>\n")
                .append("<dt>card B (dashed lines)</dt><dd><code>").append(Markup.escape(overlay.fileB())).append("</code>, model ")
                .append(Markup.escape(overlay.cardB())).append(passText(overlay.b().pass())).append("</dd>\n")
                .append("<dt>engine</dt><dd>").append(Markup.escape(outcome.comparison().engine())).append("</dd>\n")
                .append("</dl>\n<p class=\"verdict ").append(flagged == 0 ? "pass\">The two cards agree within the limits"
                        : "fail\">" + flagged + (flagged == 1 ? " difference" : " differences")
                        + " between the cards beyond the limits").append("</p>\n")
                .append(lineKey()).append("</header>\n");
    }

    private static String passText(boolean pass) {
        return pass ? "; reproduces the data within the limits" : "; does NOT reproduce the data within the limits";
    }

    private static String lineKey() {
        return "<p class=\"lines\">Markers: measured points, one colour and shape per temperature. Card A:"
                + "<svg viewBox=\"0 0 34 10\" aria-hidden=\"true\"><line x1=\"0\" y1=\"5\" x2=\"34\" y2=\"5\"/></svg>"
                + "solid. Card B:<svg viewBox=\"0 0 34 10\" aria-hidden=\"true\"><line class=\"dashed\" x1=\"0\" y1=\"5\" "
                + "x2=\"34\" y2=\"5\"/></svg>dashed.</p>\n";
    }

    private void overview() {
        out.append("<section id=\"overview\">\n<h2>Overview</h2>\n<div class=\"wide\"><table>\n<tr><th class=\"text\">data</th>"
                + "<th class=\"text\">temperatures [\u00b0C]</th><th>points</th><th>card A</th><th>card B</th></tr>\n");
        JunctionVerification a = overlay.a();
        JunctionVerification b = overlay.b();
        a.forward().ifPresent(v -> overviewRow("forward", "Forward conduction", v.perTemperature().stream()
                .map(TemperatureVerdict::temperature).toList(), v.points().size(), v.pass(), b.forward().map(Verification::pass)));
        a.breakdown().ifPresent(v -> overviewRow("breakdown", "Reverse breakdown", v.perTemperature().stream()
                .map(TemperatureVerdict::temperature).toList(), v.points().size(), v.pass(), b.breakdown().map(Verification::pass)));
        a.capacitance().ifPresent(v -> overviewRow("capacitance", "Junction capacitance", v.perTemperature().stream()
                .map(CapacitanceVerdict::temperature).toList(), v.points().size(), v.pass(),
                b.capacitance().map(CapacitanceVerification::pass)));
        a.recovery().ifPresent(v -> overviewRow("recovery", "Reverse recovery", v.perTemperature().stream()
                .map(RecoveryVerification.Verdict::temperature).toList(), v.records().size(), v.pass(),
                b.recovery().map(RecoveryVerification::pass)));
        a.leakage().ifPresent(v -> overviewRow("leakage", "Leakage below breakdown", v.perTemperature().stream()
                .map(LeakageVerification.Verdict::temperature).toList(), v.points().size(), v.pass(),
                b.leakage().map(LeakageVerification::pass)));
        out.append("</table></div>\n</section>\n");
    }

    private void overviewRow(String id, String title, List<Double> temperatures, int points, boolean a,
                             java.util.Optional<Boolean> b) {
        List<String> t = new ArrayList<>();
        new java.util.TreeSet<>(temperatures).forEach(k -> t.add(Units.celsius(k)));
        out.append("<tr><td class=\"text\"><a href=\"#").append(id).append("\">").append(title).append("</a></td><td class=\"text\">")
                .append(String.join(", ", t)).append("</td><td>").append(points).append("</td>").append(result(a))
                .append(b.map(ComparePage::result).orElse("<td>\u2013</td>")).append("</tr>\n");
    }

    // ---- sections per data kind ----

    private void junction(String id, String title, Verification a, Verification b, boolean reverse) {
        requireSame(a.points().size(), b.points().size(), title);
        out.append("<section id=\"").append(id).append("\">\n<h2>").append(title).append("</h2>\n");
        out.append("<p class=\"limits\">Each card's terminal voltage simulated at each measured current. Limits at every "
                        + "temperature: RMS ").append(Units.millivolts(a.tolerance().rms(), 2)).append(" mV, any single point ")
                .append(Units.millivolts(a.tolerance().max(), 2)).append(" mV")
                .append(reverse ? " (scaled to the measured breakdown voltage)" : "").append(".</p>\n");
        List<Overlaid> pts = new ArrayList<>();
        for (int k = 0; k < a.points().size(); k++) {
            PointResidual pa = a.points().get(k);
            PointResidual pb = b.points().get(k);
            double i = Math.abs(pa.point().current());
            pts.add(new Overlaid(pa.point().temperature(), volts(pa.point().voltage(), reverse), i,
                    volts(pa.simulated(), reverse), i, volts(pb.simulated(), reverse), i, i,
                    residual(pa, reverse), residual(pb, reverse),
                    pa.point().source() + ":" + pa.point().line() + ", " + EvidencePlots.celsius(pa.point().temperature())
                            + ": I " + Units.engineering(pa.point().current(), "A") + ", measured "
                            + String.format(Locale.ROOT, "%.4f V, card A %.4f V, card B %.4f V", pa.point().voltage(),
                            pa.simulated(), pb.simulated())));
        }
        String vLabel = reverse ? "|V|, reverse voltage [V]" : "forward voltage [V]";
        String iLabel = reverse ? "|I|, reverse current" : "forward current";
        PlotAxis x = linearAxis(pts, vLabel);
        PlotAxis y = PlotAxis.log(min(pts, Overlaid::markerY), max(pts, Overlaid::markerY), iLabel, "A");
        figure(curve(id + "-curve", (reverse ? "Breakdown" : "Forward") + " current against voltage, measured and both cards",
                x, y, pts), (reverse ? "Reverse breakdown" : "Forward") + " current against voltage, current on a log axis. "
                + "Markers: measured points; solid lines: card A's voltage at each measured current; dashed: card B's.");
        PlotAxis rx = PlotAxis.log(min(pts, Overlaid::markerY), max(pts, Overlaid::markerY), iLabel, "A");
        figure(residuals(id + "-residuals", (reverse ? "Breakdown" : "Forward") + " voltage residuals of both cards",
                rx, pts, a.tolerance().rms() * 1e3, a.tolerance().max() * 1e3, "mV",
                "card \u2212 measured " + (reverse ? "|V|" : "V") + " [mV]", p -> p.markerY),
                "Card minus measured " + (reverse ? "|V|" : "voltage") + " at each point, in mV: card A solid with markers, "
                        + "card B dashed. Dashed grey: \u00b1 the RMS limit; dotted: \u00b1 the single-point limit.");
        table(List.of("RMS [mV]", "max [mV]"), a.perTemperature().size(), k -> a.perTemperature().get(k).temperature(),
                k -> a.perTemperature().get(k).points(),
                k -> new String[] {Units.millivolts(a.perTemperature().get(k).rms(), 3), Units.millivolts(a.perTemperature().get(k).max(), 3)},
                k -> a.perTemperature().get(k).pass(),
                k -> new String[] {Units.millivolts(b.perTemperature().get(k).rms(), 3), Units.millivolts(b.perTemperature().get(k).max(), 3)},
                k -> b.perTemperature().get(k).pass(), b.perTemperature().size());
        out.append("</section>\n");
    }

    private void capacitance(CapacitanceVerification a, CapacitanceVerification b) {
        requireSame(a.points().size(), b.points().size(), "capacitance");
        out.append("<section id=\"capacitance\">\n<h2>Junction capacitance</h2>\n");
        out.append(String.format(Locale.ROOT, "<p class=\"limits\">Each card's small-signal capacitance at %s and each "
                        + "measured bias, against the reading minus the stray capacitance (%s). Limits at every temperature: "
                        + "RMS %.2f %%, any single point %.2f %%.</p>%n", Units.engineering(a.frequency(), "Hz"),
                Units.engineering(a.strayCapacitance(), "F"), a.tolerance().rmsPercent(), a.tolerance().maxPercent()));
        List<Overlaid> pts = new ArrayList<>();
        for (int k = 0; k < a.points().size(); k++) {
            CapacitanceResidual ra = a.points().get(k);
            CapacitanceResidual rb = b.points().get(k);
            double v = ra.point().voltage();
            pts.add(new Overlaid(ra.point().temperature(), v, ra.deviceCapacitance() * 1e12, v, ra.simulated() * 1e12, v,
                    rb.simulated() * 1e12, v, ra.residualPercent(), rb.residualPercent(),
                    ra.point().where() + ", " + EvidencePlots.celsius(ra.point().temperature()) + ": at "
                            + String.format(Locale.ROOT, "%.3f", v) + " V, measured " + Units.engineering(ra.deviceCapacitance(), "F")
                            + ", card A " + Units.engineering(ra.simulated(), "F") + ", card B "
                            + Units.engineering(rb.simulated(), "F")));
        }
        PlotAxis x = PlotAxis.linear(min(pts, Overlaid::markerX), max(pts, Overlaid::markerX), "bias voltage [V]");
        double top = Math.max(max(pts, Overlaid::markerY), 0);
        for (Overlaid p : pts) {
            for (double s : new double[] {p.aY, p.bY}) {
                if (Double.isFinite(s) && s > 0 && s <= 2 * max(pts, Overlaid::markerY)) {
                    top = Math.max(top, s);
                }
            }
        }
        PlotAxis y = PlotAxis.fromZero(top > 0 ? top : 1, "capacitance [pF]");
        figure(curve("capacitance-curve", "Capacitance against bias, measured and both cards", x, y, pts),
                "Capacitance against bias. Markers: readings minus the stray capacitance; solid lines: card A at each "
                        + "measured bias; dashed: card B.");
        figure(residuals("capacitance-residuals", "Capacitance residuals of both cards", x, pts, a.tolerance().rmsPercent(),
                a.tolerance().maxPercent(), "%", "card \u2212 measured [%]", p -> p.markerX),
                "Card minus measured capacitance at each point, in % of the measured: card A solid with markers, card B "
                        + "dashed. Dashed grey: \u00b1 the RMS limit; dotted: \u00b1 the single-point limit.");
        table(List.of("RMS [%]", "max [%]"), a.perTemperature().size(), k -> a.perTemperature().get(k).temperature(),
                k -> a.perTemperature().get(k).points(),
                k -> percent(a.perTemperature().get(k)), k -> a.perTemperature().get(k).pass(),
                k -> percent(b.perTemperature().get(k)), k -> b.perTemperature().get(k).pass(), b.perTemperature().size());
        out.append("</section>\n");
    }

    private void recovery(RecoveryVerification a, RecoveryVerification b) {
        requireSame(a.records().size(), b.records().size(), "recovery");
        out.append("<section id=\"recovery\">\n<h2>Reverse recovery</h2>\n");
        out.append(String.format(Locale.ROOT, "<p class=\"limits\">Each record's recovery time against trr = TT ln(1 + "
                        + "IF/|IR|) with each card's TT. Limits at every temperature: RMS %.0f %%, any single record %.0f %% "
                        + "of the measured time.</p>%n", 100 * RecoveryVerification.RMS_FRACTION,
                100 * RecoveryVerification.MAX_FRACTION));
        if (!a.records().isEmpty()) {
            List<Overlaid> pts = new ArrayList<>();
            for (int k = 0; k < a.records().size(); k++) {
                RecoveryVerification.Modelled ra = a.records().get(k);
                RecoveryVerification.Modelled rb = b.records().get(k);
                double ratio = ra.record().forwardCurrent() / Math.abs(ra.record().reverseCurrent());
                pts.add(new Overlaid(ra.record().temperature(), ratio, ra.record().recoveryTime() * 1e9, ratio,
                        ra.modelled() * 1e9, ratio, rb.modelled() * 1e9, ratio, Double.NaN, Double.NaN,
                        ra.record().where() + ", " + EvidencePlots.celsius(ra.record().temperature()) + ": IF/|IR| "
                                + String.format(Locale.ROOT, "%.3g", ratio) + ", measured "
                                + Units.engineering(ra.record().recoveryTime(), "s") + ", card A "
                                + Units.engineering(ra.modelled(), "s") + ", card B " + Units.engineering(rb.modelled(), "s")));
            }
            PlotAxis x = PlotAxis.log(min(pts, Overlaid::markerX), max(pts, Overlaid::markerX),
                    "IF/|IR|, forward over reverse current", null);
            double top = 0;
            for (Overlaid p : pts) {
                for (double t : new double[] {p.markerY, p.aY, p.bY}) {
                    if (Double.isFinite(t)) {
                        top = Math.max(top, t);
                    }
                }
            }
            PlotAxis y = PlotAxis.fromZero(top > 0 ? top : 1, "recovery time trr [ns]");
            figure(curve("recovery-curve", "Recovery time against current ratio, measured and both cards", x, y, pts),
                    "Recovery time against the ratio of forward to reverse current, on a log axis. Markers: measured "
                            + "records; solid lines: card A's TT ln(1 + IF/|IR|); dashed: card B's.");
        }
        table(List.of("RMS [ns]", "max [ns]"), a.perTemperature().size(), k -> a.perTemperature().get(k).temperature(),
                k -> a.perTemperature().get(k).points(),
                k -> nanoseconds(a.perTemperature().get(k)), k -> a.perTemperature().get(k).pass(),
                k -> nanoseconds(b.perTemperature().get(k)), k -> b.perTemperature().get(k).pass(), b.perTemperature().size());
        out.append("</section>\n");
    }

    private void leakage(LeakageVerification a, LeakageVerification b) {
        requireSame(a.points().size(), b.points().size(), "leakage");
        out.append("<section id=\"leakage\">\n<h2>Leakage below breakdown</h2>\n");
        out.append(String.format(Locale.ROOT, "<p class=\"limits\">Each card's current at each measured reverse voltage, "
                        + "as log10(card/measured). Limits at every temperature: RMS %.1f decade, any single point %.1f "
                        + "decade.</p>%n", LeakageVerification.RMS_DECADES, LeakageVerification.MAX_DECADES));
        if (!a.points().isEmpty()) {
            List<Overlaid> pts = new ArrayList<>();
            for (int k = 0; k < a.points().size(); k++) {
                LeakageVerification.Simulated pa = a.points().get(k);
                LeakageVerification.Simulated pb = b.points().get(k);
                double v = Math.abs(pa.point().voltage());
                pts.add(new Overlaid(pa.point().temperature(), v, Math.abs(pa.point().current()), v, Math.abs(pa.simulated()),
                        v, Math.abs(pb.simulated()), v, Double.NaN, Double.NaN,
                        pa.point().source() + ":" + pa.point().line() + ", " + EvidencePlots.celsius(pa.point().temperature())
                                + ": at " + String.format(Locale.ROOT, "%.3f", pa.point().voltage()) + " V, measured "
                                + Units.engineering(pa.point().current(), "A") + ", card A "
                                + Units.engineering(pa.simulated(), "A") + ", card B " + Units.engineering(pb.simulated(), "A")));
            }
            double lo = min(pts, Overlaid::markerY);
            double hi = max(pts, Overlaid::markerY);
            double low = lo;
            double high = hi;
            for (Overlaid p : pts) {
                for (double s : new double[] {p.aY, p.bY}) {
                    if (s > 0 && Double.isFinite(s) && s >= lo / LOG_REACH && s <= hi * LOG_REACH) {
                        low = Math.min(low, s);
                        high = Math.max(high, s);
                    }
                }
            }
            PlotAxis x = PlotAxis.linear(min(pts, Overlaid::markerX), max(pts, Overlaid::markerX), "|V|, reverse voltage [V]");
            PlotAxis y = PlotAxis.log(low, high, "|I|, reverse current", "A");
            figure(curve("leakage-curve", "Reverse leakage current against voltage, measured and both cards", x, y, pts),
                    "Reverse current below breakdown against |V|, current on a log axis. Markers: measured points; solid "
                            + "lines: card A's current at each measured voltage; dashed: card B's.");
        }
        table(List.of("RMS [dec]", "max [dec]"), a.perTemperature().size(), k -> a.perTemperature().get(k).temperature(),
                k -> a.perTemperature().get(k).points(),
                k -> decades(a.perTemperature().get(k)), k -> a.perTemperature().get(k).pass(),
                k -> decades(b.perTemperature().get(k)), k -> b.perTemperature().get(k).pass(), b.perTemperature().size());
        out.append("</section>\n");
    }

    // ---- the plots ----

    /**
     * One measured point and both cards' values: the marker at (markerX, markerY), card A's line through (aX, aY),
     * card B's through (bX, bY), ordered along the sweep by {@code order}; the residuals of both in the residual
     * plot's unit (NaN where the kind has no residual plot).
     */
    private record Overlaid(double temperature, double markerX, double markerY, double aX, double aY, double bX, double bY,
                            double order, double residualA, double residualB, String title) {
    }

    private SvgPlot curve(String id, String title, PlotAxis x, PlotAxis y, List<Overlaid> pts) {
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.CURVE, title, x, y);
        for (Map.Entry<Double, List<Overlaid>> e : byTemperature(pts).entrySet()) {
            double t = e.getKey();
            List<Overlaid> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(Overlaid::order));
            List<SvgPlot.Marker> markers = new ArrayList<>();
            List<double[]> lineA = new ArrayList<>();
            List<double[]> lineB = new ArrayList<>();
            for (Overlaid p : sorted) {
                markers.add(new SvgPlot.Marker(p.markerX, p.markerY, p.title));
                lineA.add(shown(x, y, p.aX, p.aY));
                lineB.add(shown(x, y, p.bX, p.bY));
            }
            plot.add(new SvgPlot.Series(EvidencePlots.celsius(t), Units.celsius(t) + "-a", colours.colour(t), colours.shape(t),
                    markers, lineA));
            plot.add(new SvgPlot.Series("", Units.celsius(t) + "-b", colours.colour(t), colours.shape(t), List.of(), lineB,
                    "card-b"));
        }
        plot.explain("markers: measured").explain("solid: card A").explain("dashed: card B");
        return plot;
    }

    private SvgPlot residuals(String id, String title, PlotAxis x, List<Overlaid> pts, double rms, double max, String unit,
                              String label, ToDoubleFunction<Overlaid> along) {
        double extent = 0;
        for (Overlaid p : pts) {
            for (double r : new double[] {p.residualA, p.residualB}) {
                if (onScale(r, max)) {
                    extent = Math.max(extent, Math.abs(r));
                }
            }
        }
        PlotAxis y = PlotAxis.symmetric((extent > 0 ? extent : rms) * RESIDUAL_HEADROOM, label);
        SvgPlot plot = new SvgPlot(id, SvgPlot.Kind.RESIDUALS, title, x, y);
        plot.zeroLine();
        plot.level(new SvgPlot.Level(rms, "rms", "RMS limit \u00b1" + String.format(Locale.ROOT, "%.2f", rms) + " " + unit));
        plot.level(new SvgPlot.Level(-rms, "rms", ""));
        plot.level(new SvgPlot.Level(max, "max", "point limit \u00b1" + String.format(Locale.ROOT, "%.2f", max) + " " + unit));
        plot.level(new SvgPlot.Level(-max, "max", ""));
        for (Map.Entry<Double, List<Overlaid>> e : byTemperature(pts).entrySet()) {
            double t = e.getKey();
            List<Overlaid> sorted = new ArrayList<>(e.getValue());
            sorted.sort(Comparator.comparingDouble(along));
            List<SvgPlot.Marker> markers = new ArrayList<>();
            List<double[]> lineA = new ArrayList<>();
            List<double[]> lineB = new ArrayList<>();
            for (Overlaid p : sorted) {
                double ra = onScale(p.residualA, max) ? p.residualA : Double.NaN;
                double rb = onScale(p.residualB, max) ? p.residualB : Double.NaN;
                double at = along.applyAsDouble(p);
                markers.add(new SvgPlot.Marker(at, ra, p.title));
                lineA.add(new double[] {at, ra});
                lineB.add(new double[] {at, rb});
            }
            plot.add(new SvgPlot.Series(EvidencePlots.celsius(t), Units.celsius(t) + "-a", colours.colour(t), colours.shape(t),
                    markers, lineA));
            plot.add(new SvgPlot.Series("", Units.celsius(t) + "-b", colours.colour(t), colours.shape(t), List.of(), lineB,
                    "card-b"));
        }
        plot.explain("solid: card A").explain("dashed: card B");
        return plot;
    }

    /** A card's point where the axes hold it, else NaN (a break in the line). */
    private static double[] shown(PlotAxis x, PlotAxis y, double px, double py) {
        boolean in = x.accepts(px) && y.accepts(py) && px >= x.low() && px <= x.high() && py >= y.low() && py <= y.high();
        return new double[] {in ? px : Double.NaN, in ? py : Double.NaN};
    }

    /** A linear voltage axis over the measured points, widened to the cards' values within one measured span. */
    private static PlotAxis linearAxis(List<Overlaid> pts, String label) {
        double lo = min(pts, Overlaid::markerX);
        double hi = max(pts, Overlaid::markerX);
        double span = Math.max(hi - lo, 1e-3);
        double low = lo;
        double high = hi;
        for (Overlaid p : pts) {
            for (double s : new double[] {p.aX, p.bX}) {
                if (Double.isFinite(s) && s >= lo - span && s <= hi + span) {
                    low = Math.min(low, s);
                    high = Math.max(high, s);
                }
            }
        }
        return PlotAxis.linear(low, high, label);
    }

    private static boolean onScale(double residual, double pointLimit) {
        return Double.isFinite(residual) && Math.abs(residual) <= OFF_SCALE * pointLimit;
    }

    private static Map<Double, List<Overlaid>> byTemperature(List<Overlaid> pts) {
        return SweepTemperatures.group(pts, Overlaid::temperature, SweepTemperatures.DEFAULT_GAP);
    }

    private static double min(List<Overlaid> pts, ToDoubleFunction<Overlaid> f) {
        return pts.stream().mapToDouble(f).filter(Double::isFinite).min().orElse(1);
    }

    private static double max(List<Overlaid> pts, ToDoubleFunction<Overlaid> f) {
        return pts.stream().mapToDouble(f).filter(Double::isFinite).max().orElse(1);
    }

    private void figure(SvgPlot plot, String caption) {
        figure++;
        out.append("<figure>\n").append(plot.render()).append("\n<figcaption>Figure ").append(figure).append(". ")
                .append(Markup.escape(caption));
        if (plot.levelsOffScale()) {
            out.append(" The scale follows the residuals: a limit beyond it is named in the key, not drawn.");
        }
        out.append("</figcaption>\n</figure>\n");
    }

    // ---- tables ----

    /** The per-temperature table of a data kind: both cards' figures and verdicts side by side. */
    private void table(List<String> heads, int rows, java.util.function.IntToDoubleFunction temperature,
                       java.util.function.IntUnaryOperator points, java.util.function.IntFunction<String[]> a,
                       java.util.function.IntPredicate passA, java.util.function.IntFunction<String[]> b,
                       java.util.function.IntPredicate passB, int rowsB) {
        requireSame(rows, rowsB, "the per-temperature table");
        out.append("<div class=\"wide\"><table>\n<tr><th class=\"text\">T [\u00b0C]</th><th>points</th>");
        heads.forEach(h -> out.append("<th>A ").append(h).append("</th>"));
        out.append("<th>card A</th>");
        heads.forEach(h -> out.append("<th>B ").append(h).append("</th>"));
        out.append("<th>card B</th></tr>\n");
        for (int k = 0; k < rows; k++) {
            out.append("<tr>").append(temperatureCell(temperature.applyAsDouble(k))).append("<td>")
                    .append(points.applyAsInt(k)).append("</td>");
            for (String s : a.apply(k)) {
                out.append("<td>").append(s).append("</td>");
            }
            out.append(result(passA.test(k)));
            for (String s : b.apply(k)) {
                out.append("<td>").append(s).append("</td>");
            }
            out.append(result(passB.test(k))).append("</tr>\n");
        }
        out.append("</table></div>\n");
    }

    private String temperatureCell(double kelvin) {
        return HtmlReport.temperatureCell(colours, kelvin);
    }

    /** The comparison the terminal prints, as tables: the cards at the plan's conditions, flagged rows marked. */
    private void sideBySide() {
        CardComparison c = outcome.comparison();
        ComparisonPlan plan = outcome.plan();
        out.append("<section id=\"side-by-side\">\n<h2>The cards side by side</h2>\n<p class=\"limits\">Both cards simulated "
                + "at the same conditions, away from the data: differences are B minus A; a row beyond its limit is "
                + "marked. Reverse voltages and currents are positive magnitudes.</p>\n");
        out.append(String.format(Locale.ROOT, "<h3>Forward voltage at each decade of current (limit %.3f mV)</h3>%n",
                plan.limits().forwardVoltage() * 1e3));
        out.append("<div class=\"wide\"><table>\n<tr><th class=\"text\">T [\u00b0C]</th><th>I</th><th>A [V]</th><th>B [V]</th>"
                + "<th>B\u2212A [mV]</th><th></th></tr>\n");
        for (CardComparison.ForwardRow r : c.forward()) {
            out.append("<tr>").append(temperatureCell(r.temperature())).append("<td>").append(Units.engineering(r.current(), "A"))
                    .append(String.format(Locale.ROOT, "</td><td>%.5f</td><td>%.5f</td><td>%.3f</td>", r.a(), r.b(),
                            r.difference() * 1e3)).append(flag(r.flagged())).append("</tr>\n");
        }
        out.append("</table></div>\n");
        if (!c.leakage().isEmpty()) {
            out.append("<h3>Leakage at each reverse voltage VR (B/A: B's current over A's; limit a factor of ")
                    .append(String.format(Locale.ROOT, "%.3g", plan.limits().leakageFactor())).append(" either way)</h3>\n")
                    .append("<div class=\"wide\"><table>\n<tr><th class=\"text\">T [\u00b0C]</th><th>VR [V]</th><th>A</th>"
                            + "<th>B</th><th>B/A</th><th></th></tr>\n");
            for (CardComparison.LeakageRow r : c.leakage()) {
                out.append("<tr>").append(temperatureCell(r.temperature())).append(String.format(Locale.ROOT, "<td>%.3g</td>",
                        r.voltage())).append("<td>").append(Units.engineering(r.a(), "A")).append("</td><td>")
                        .append(Units.engineering(r.b(), "A")).append(String.format(Locale.ROOT, "</td><td>%.4g</td>", r.ratio()))
                        .append(flag(r.flagged())).append("</tr>\n");
            }
            out.append("</table></div>\n");
        }
        if (!c.capacitance().isEmpty()) {
            out.append(String.format(Locale.ROOT, "<h3>Capacitance at each reverse voltage VR, %s (limit %.3g %%)</h3>%n",
                    Units.engineering(plan.frequency(), "Hz"), plan.limits().capacitanceRelative() * 100))
                    .append("<div class=\"wide\"><table>\n<tr><th class=\"text\">T [\u00b0C]</th><th>VR [V]</th><th>A</th>"
                            + "<th>B</th><th>B\u2212A [%]</th><th></th></tr>\n");
            for (CardComparison.CapacitanceRow r : c.capacitance()) {
                out.append("<tr>").append(temperatureCell(r.temperature())).append(String.format(Locale.ROOT, "<td>%.3g</td>",
                        r.reverseVoltage())).append("<td>").append(Units.engineering(r.a(), "F")).append("</td><td>")
                        .append(Units.engineering(r.b(), "F")).append(String.format(Locale.ROOT, "</td><td>%.3f</td>",
                                r.relative() * 100)).append(flag(r.flagged())).append("</tr>\n");
            }
            out.append("</table></div>\n");
        }
        if (!c.breakdown().isEmpty()) {
            out.append(String.format(Locale.ROOT, "<h3>Breakdown: reverse voltage where each card's reverse current exceeds its "
                            + "own leakage below the knee by %s (limit %.3g %%)</h3>%n",
                    Units.engineering(c.breakdown().get(0).current(), "A"), plan.limits().breakdownRelative() * 100))
                    .append("<div class=\"wide\"><table>\n<tr><th class=\"text\">T [\u00b0C]</th><th>A [V]</th><th>B [V]</th>"
                            + "<th>B\u2212A [%]</th><th></th></tr>\n");
            for (CardComparison.BreakdownRow r : c.breakdown()) {
                out.append("<tr>").append(temperatureCell(r.temperature())).append("<td>").append(volts(r.a())).append("</td><td>")
                        .append(volts(r.b())).append("</td><td>").append(Double.isNaN(r.a()) || Double.isNaN(r.b()) ? "\u2013"
                                : String.format(Locale.ROOT, "%.3f", (r.b() - r.a()) / r.a() * 100)).append("</td>")
                        .append(flag(r.flagged())).append("</tr>\n");
            }
            out.append("</table></div>\n");
        }
        out.append("</section>\n");
    }

    private void parameters() {
        out.append("<section id=\"parameters\">\n<h2>Card parameters</h2>\n<p class=\"limits\">Both cards' values in ngspice "
                + "meaning, as the comparison read them; a value in parentheses is the default a card leaves in force, and "
                + "a row that differs is marked.</p>\n<div class=\"wide\"><table>\n<tr><th class=\"text\">parameter</th>"
                + "<th>card A</th><th>card B</th><th></th></tr>\n");
        for (CardComparison.ParameterRow r : outcome.comparison().parameters()) {
            boolean differs = !bare(r.a()).equals(bare(r.b()));
            out.append("<tr><td class=\"text\">").append(Markup.escape(r.keyword())).append("</td><td>")
                    .append(Markup.escape(r.a().isEmpty() ? "\u2013" : r.a())).append("</td><td>")
                    .append(Markup.escape(r.b().isEmpty() ? "\u2013" : r.b())).append("</td>")
                    .append(differs ? "<td class=\"flag\">differs</td>" : "<td></td>").append("</tr>\n");
        }
        out.append("</table></div>\n</section>\n");
    }

    private void files() {
        out.append("<section id=\"data-files\">\n<h2>Data files</h2>\n<p class=\"limits\">SHA-256 of each file as read (FIPS "
                + "180-4); <code>sha256sum FILE</code> prints the same digits.</p>\n<div class=\"wide\"><table>\n"
                + "<tr><th class=\"text\">file</th><th>bytes</th><th class=\"text\">SHA-256</th></tr>\n");
        for (PageFacts.DataFile f : dataFiles) {
            out.append("<tr><td class=\"text mono\">").append(Markup.escape(f.name())).append("</td><td>").append(f.bytes())
                    .append("</td><td class=\"hash\">").append(f.sha256()).append("</td></tr>\n");
        }
        out.append("</table></div>\n</section>\n");
    }

    private void notes(List<String> notes) {
        out.append("<ul class=\"notes\">\n");
        notes.forEach(n -> out.append("<li>").append(Markup.escape(n)).append("</li>\n"));
        out.append("</ul>\n");
    }

    private static String[] percent(CapacitanceVerdict v) {
        return new String[] {String.format(Locale.ROOT, "%.3f", v.rmsPercent()), String.format(Locale.ROOT, "%.3f", v.maxPercent())};
    }

    private static String[] nanoseconds(RecoveryVerification.Verdict v) {
        return new String[] {String.format(Locale.ROOT, "%.3f", v.rmsNs()), String.format(Locale.ROOT, "%.3f", v.maxNs())};
    }

    private static String[] decades(LeakageVerification.Verdict v) {
        return new String[] {String.format(Locale.ROOT, "%.3f", v.rmsDecades()), String.format(Locale.ROOT, "%.3f", v.maxDecades())};
    }

    private static double volts(double v, boolean reverse) {
        return reverse ? Math.abs(v) : v;
    }

    private static double residual(PointResidual r, boolean reverse) {
        return (reverse ? Math.abs(r.simulated()) - Math.abs(r.point().voltage()) : r.residual()) * 1e3;
    }

    private static String volts(double v) {
        return Double.isNaN(v) ? "none" : String.format(Locale.ROOT, "%.4f", v);
    }

    private static String flag(boolean flagged) {
        return flagged ? "<td class=\"flag\">beyond limit</td>" : "<td></td>";
    }

    private static String bare(String cell) {
        return cell.startsWith("(") && cell.endsWith(")") ? cell.substring(1, cell.length() - 1) : cell;
    }

    private static String result(boolean pass) {
        return pass ? "<td class=\"result pass\">pass</td>" : "<td class=\"result fail\">FAIL</td>";
    }

    private static void requireSame(int a, int b, String what) {
        if (a != b) {
            throw new IllegalStateException(what + ": the two cards were verified on different points (" + a + " and " + b + ")");
        }
    }
}
