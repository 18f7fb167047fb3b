package org.cardwright.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;
import org.cardwright.verify.CapacitanceVerdict;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.LeakageVerification;
import org.cardwright.verify.RecoveryVerification;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;
import org.cardwright.workflow.ToolVersion;

/**
 * The evidence page of a verification: one self-contained HTML file (no scripts, no external fonts, styles or
 * images) with a header (card, card file, engines, overall verdict), an overview, one section per data kind with
 * inline SVG plots and the per-temperature table, the card's parameters, the data files' SHA-256 and the command
 * (when {@link PageFacts} gives them), and the notes. Plots fill the column (760 px down to a phone) and wide
 * tables scroll inside their own box, so the page never scrolls sideways. The same verification always gives the same
 * bytes: numbers are formatted with {@link Locale#ROOT} and nothing depends on the clock or the machine.
 */
public final class HtmlReport {
    private static final String FORWARD_ID = "forward";
    private static final String BREAKDOWN_ID = "breakdown";
    private static final String CAPACITANCE_ID = "capacitance";
    private static final String RECOVERY_ID = "recovery";
    private static final String LEAKAGE_ID = "leakage";

    /** The page's style sheet, shared with the comparison page. */
    static final String STYLE = String.join("\n",
            "body{margin:0;background:#eceae4;color:#23272b;font:15px/1.5 system-ui,sans-serif}",
            "main{max-width:1000px;margin:0 auto;padding:26px 32px 36px;background:#fdfdfb;"
                    + "border-left:1px solid #d6d3c9;border-right:1px solid #d6d3c9}",
            "@media (max-width:820px){main{padding:16px 12px 28px;border:0}}",
            "header.top{border-bottom:2px solid #23272b;padding-bottom:14px}",
            ".tool{margin:0;font-size:13px;color:#5b6066}",
            "h1{margin:2px 0 10px;font-size:26px;font-weight:650}",
            "h2{font-size:19px;margin:30px 0 6px;padding-top:10px;border-top:1px solid #d6d3c9}",
            "dl.facts{display:grid;grid-template-columns:max-content 1fr;gap:2px 18px;margin:0 0 12px}",
            "dl.facts dt{color:#5b6066}",
            "dl.facts dd{margin:0}",
            "code,.mono{font-family:ui-monospace,monospace;font-size:13.5px;overflow-wrap:anywhere}",
            ".verdict{display:inline-block;margin:2px 0 0;padding:4px 14px;border-radius:3px;font-weight:650}",
            ".pass{background:#e2eee0;color:#1e5527}",
            ".fail{background:#f5dfda;color:#8a2419}",
            "div.wide{overflow-x:auto;max-width:100%}",
            "table{border-collapse:collapse;margin:10px 0 4px;font-size:14px}",
            "th,td{padding:3px 10px;text-align:right;border-bottom:1px solid #e3e0d7}",
            "th{font-weight:600;border-bottom:1.5px solid #8b9095;vertical-align:bottom}",
            "th.text,td.text{text-align:left}",
            "td.result{font-weight:650;text-align:center}",
            "svg.swatch{display:inline-block;width:13px;height:13px;margin-right:6px;vertical-align:-1px}",
            "svg.swatch path{fill:none;stroke-width:1.6}",
            "pre.command{white-space:pre-wrap;overflow-wrap:anywhere;background:#f2f0ea;padding:8px 10px;margin:6px 0;"
                    + "font:13.5px ui-monospace,monospace}",
            "td.hash{font-family:ui-monospace,monospace;font-size:12.5px;overflow-wrap:anywhere;text-align:left}",
            "p.limits{margin:4px 0;color:#3b4045}",
            "ul.notes{margin:6px 0;padding-left:20px;color:#6a4a12}",
            "figure{margin:14px 0 6px}",
            "figcaption{font-size:14px;color:#4b5055}",
            "svg.plot{display:block;width:100%;max-width:100%;height:auto;font:13px system-ui,sans-serif}",
            "svg .area{fill:#fff;stroke:#8b9095}",
            "svg .grid line{stroke:#ebe8e0}",
            "svg .ticks line{stroke:#8b9095}",
            "svg text{fill:#33383d}",
            "svg .axis-label{font-size:14px}",
            "svg .key{fill:#5b6066}",
            "svg .series polyline{fill:none;stroke-width:1.8}",
            "svg.residuals .series polyline{stroke-width:0.9;stroke-opacity:0.55}",
            "svg path.marker{fill:none;stroke-width:1.5;pointer-events:visible}",
            "td.temp{white-space:nowrap}",
            "svg .legend line{stroke-width:1.8}",
            "svg .off-scale{font-style:italic}",
            "svg .zero{stroke:#b3b0a6}",
            "svg line.limit{stroke:#4b5055;stroke-width:1.2}",
            "svg line.limit.rms{stroke-dasharray:7 4}",
            "svg line.limit.max{stroke-dasharray:2 3}",
            "footer{margin-top:30px;padding-top:8px;border-top:1px solid #d6d3c9;font-size:12.5px;color:#5b6066}");

    private final JunctionVerification all;
    private final String cardFile;
    private final PageFacts facts;
    private final EvidencePlots plots;
    private final StringBuilder out = new StringBuilder();
    private int figure;

    private HtmlReport(JunctionVerification all, String cardFile, PageFacts facts) {
        this.all = all;
        this.cardFile = cardFile;
        this.facts = facts;
        this.plots = new EvidencePlots(EvidencePlots.temperaturesOf(all));
    }

    /**
     * The page, without command, hashes or parameters.
     *
     * @param all      the verification of every data kind
     * @param cardFile the card file as the user named it
     */
    public static String render(JunctionVerification all, String cardFile) {
        return render(all, cardFile, PageFacts.none());
    }

    /**
     * The page.
     *
     * @param all      the verification of every data kind
     * @param cardFile the card file as the user named it
     * @param facts    command, data-file hashes and card parameters to state on the page
     */
    public static String render(JunctionVerification all, String cardFile, PageFacts facts) {
        return new HtmlReport(all, cardFile, facts).page();
    }

    private String page() {
        String name = cardName();
        out.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n")
                .append("<title>").append(Markup.escape(name)).append(": verification evidence</title>\n")
                .append("<style>\n").append(STYLE).append("\n</style>\n</head>\n<body>\n<main>\n");
        header(name);
        overview();
        all.forward().ifPresent(v -> junction(FORWARD_ID, "Forward conduction", v, false));
        all.breakdown().ifPresent(v -> junction(BREAKDOWN_ID, "Reverse breakdown", v, true));
        all.capacitance().ifPresent(this::capacitance);
        all.recovery().ifPresent(this::recovery);
        all.leakage().ifPresent(this::leakage);
        provenance();
        out.append("<section id=\"notes\">\n<h2>Notes</h2>\n");
        if (all.notes().isEmpty()) {
            out.append("<p>None.</p>\n");
        } else {
            notes(all.notes());
        }
        out.append("</section>\n<footer>Written by cardwright ").append(Markup.escape(ToolVersion.get()))
                .append(". This page is self-contained: no scripts and nothing fetched from elsewhere. Hover over a "
                        + "marker to see the file and line it came from.</footer>\n</main>\n</body>\n</html>\n");
        return out.toString();
    }

    private String cardName() {
        return all.forward().map(Verification::cardName)
                .or(() -> all.breakdown().map(Verification::cardName))
                .or(() -> all.capacitance().map(CapacitanceVerification::cardName))
                .orElse("(model name not recorded)");
    }

    private void header(String name) {
        out.append("<header class=\"top\">\n<p class=\"tool\">cardwright verification evidence</p>\n")
                .append("<h1>Card ").append(Markup.escape(name)).append("</h1>\n<dl class=\"facts\">\n")
                .append("<dt>card file</dt><dd><code>").append(Markup.escape(cardFile)).append("</code></dd>\n");
        Map<String, List<String>> engines = new LinkedHashMap<>();
        all.forward().ifPresent(v -> engines.computeIfAbsent(v.engine(), k -> new ArrayList<>()).add("forward"));
        all.breakdown().ifPresent(v -> engines.computeIfAbsent(v.engine(), k -> new ArrayList<>()).add("breakdown"));
        all.capacitance().ifPresent(v -> engines.computeIfAbsent(v.engine(), k -> new ArrayList<>()).add("capacitance"));
        for (Map.Entry<String, List<String>> e : engines.entrySet()) {
            out.append("<dt>engine (").append(String.join(", ", e.getValue())).append(")</dt><dd>")
                    .append(Markup.escape(e.getKey())).append("</dd>\n");
        }
        if (all.recovery().isPresent()) {
            out.append("<dt>engine (recovery)</dt><dd>the card's TT through trr = TT ln(1 + IF/|IR|), no simulator</dd>\n");
        }
        out.append("</dl>\n<p class=\"verdict ").append(all.pass() ? "pass\">The card reproduces the data within the limits"
                : "fail\">The card does NOT reproduce the data within the limits").append("</p>\n</header>\n");
    }

    private void overview() {
        out.append("<section id=\"overview\">\n<h2>Overview</h2>\n<div class=\"wide\"><table>\n<tr><th class=\"text\">data</th>"
                + "<th class=\"text\">temperatures [\u00b0C]</th><th>points</th><th>result</th></tr>\n");
        all.forward().ifPresent(v -> overviewRow(FORWARD_ID, "Forward conduction",
                v.perTemperature().stream().map(TemperatureVerdict::temperature).toList(),
                v.perTemperature().stream().mapToInt(TemperatureVerdict::points).sum(), v.pass()));
        all.breakdown().ifPresent(v -> overviewRow(BREAKDOWN_ID, "Reverse breakdown",
                v.perTemperature().stream().map(TemperatureVerdict::temperature).toList(),
                v.perTemperature().stream().mapToInt(TemperatureVerdict::points).sum(), v.pass()));
        all.capacitance().ifPresent(v -> overviewRow(CAPACITANCE_ID, "Junction capacitance",
                v.perTemperature().stream().map(CapacitanceVerdict::temperature).toList(),
                v.perTemperature().stream().mapToInt(CapacitanceVerdict::points).sum(), v.pass()));
        all.recovery().ifPresent(v -> overviewRow(RECOVERY_ID, "Reverse recovery",
                v.perTemperature().stream().map(RecoveryVerification.Verdict::temperature).toList(),
                v.perTemperature().stream().mapToInt(RecoveryVerification.Verdict::points).sum(), v.pass()));
        all.leakage().ifPresent(v -> overviewRow(LEAKAGE_ID, "Leakage below breakdown",
                v.perTemperature().stream().map(LeakageVerification.Verdict::temperature).toList(),
                v.perTemperature().stream().mapToInt(LeakageVerification.Verdict::points).sum(), v.pass()));
        out.append("</table></div>\n</section>\n");
    }

    private void overviewRow(String id, String title, List<Double> temperatures, int points, boolean pass) {
        List<String> t = new ArrayList<>();
        new TreeSet<>(temperatures).forEach(k -> t.add(Units.celsius(k)));
        out.append("<tr><td class=\"text\"><a href=\"#").append(id).append("\">").append(title)
                .append("</a></td><td class=\"text\">")
                .append(String.join(", ", t)).append("</td><td>").append(points).append("</td>").append(result(pass))
                .append("</tr>\n");
    }

    private void junction(String id, String title, Verification v, boolean reverse) {
        out.append("<section id=\"").append(id).append("\">\n<h2>").append(title).append("</h2>\n");
        out.append("<p class=\"limits\">Limits at every temperature: RMS ").append(Units.millivolts(v.tolerance().rms(), 2))
                .append(" mV, any single point ").append(Units.millivolts(v.tolerance().max(), 2)).append(" mV")
                .append(reverse ? " (scaled to the measured breakdown voltage)" : "")
                .append(". The card's terminal voltage was simulated at each measured current.</p>\n");
        notes(v.notes());
        String quantity = reverse ? "|I| against |V|" : "current against voltage";
        figure(plots.junctionCurve(id + "-curve", v, reverse), (reverse ? "Reverse breakdown: " : "Forward ")
                + quantity + ", current on a log axis. Markers: measured points; lines: the card's voltage at "
                + "each measured current, one colour and marker shape per temperature.");
        figure(plots.junctionResiduals(id + "-residuals", v, reverse), "Card minus measured "
                + (reverse ? "|V|" : "voltage") + " at each point, in mV, against " + (reverse ? "|I|" : "current")
                + ". Dashed: \u00b1 the RMS limit; dotted: \u00b1 the single-point limit.");
        boolean stated = v.perTemperature().stream().anyMatch(t -> t.stated() > 0);
        out.append("<div class=\"wide\"><table>\n<tr>").append(temperatureHeads()).append("<th>points</th><th>RMS [mV]</th><th>max [mV]</th>")
                .append("<th>largest at</th><th class=\"text\">where</th>")
                .append(stated ? "<th>beyond 3\u03c3 of stated</th>" : "").append("<th>result</th></tr>\n");
        for (TemperatureVerdict t : v.perTemperature()) {
            out.append("<tr>").append(temperatureCell(t.temperature())).append("<td>").append(t.points()).append("</td><td>")
                    .append(Units.millivolts(t.rms(), 3)).append("</td><td>").append(Units.millivolts(t.max(), 3))
                    .append("</td><td>").append(Units.engineering(t.worstCurrent(), "A")).append("</td><td class=\"text mono\">")
                    .append(Markup.escape(t.worstSource())).append("</td>");
            if (stated) {
                out.append("<td>").append(t.stated() > 0 ? t.beyondThree() + " of " + t.stated() : "\u2013").append("</td>");
            }
            out.append(result(t.pass())).append("</tr>\n");
        }
        out.append("</table></div>\n</section>\n");
    }

    private void capacitance(CapacitanceVerification v) {
        out.append("<section id=\"").append(CAPACITANCE_ID).append("\">\n<h2>Junction capacitance</h2>\n");
        out.append(String.format(Locale.ROOT, "<p class=\"limits\">Limits at every temperature: RMS %.2f %%, any single "
                        + "point %.2f %% of the measured capacitance. Stray capacitance %s taken off every reading; the "
                        + "card's small-signal capacitance was simulated at %s and each measured bias.</p>%n",
                v.tolerance().rmsPercent(), v.tolerance().maxPercent(), Units.engineering(v.strayCapacitance(), "F"),
                Units.engineering(v.frequency(), "Hz")));
        notes(v.notes());
        figure(plots.capacitanceCurve(CAPACITANCE_ID + "-curve", v), "Capacitance against bias. Markers: readings "
                + "minus the stray capacitance; lines: the card's capacitance at each measured bias, one colour and marker "
                + "shape per temperature.");
        if (v.points().stream().filter(r -> r.point().voltage() < 0).count() >= 2) {
            figure(plots.capacitanceLogLog(CAPACITANCE_ID + "-loglog", v), "The same capacitance against reverse bias |V| "
                    + "on log-log axes, where the depletion law CJO/(1 + |V|/VJ)^M straightens into a line of slope "
                    + "\u2212M once |V| is well above VJ.", "points at zero or forward bias cannot be placed on a log axis");
        }
        figure(plots.capacitanceResiduals(CAPACITANCE_ID + "-residuals", v), "Card minus measured capacitance at each "
                + "point, in % of the measured. Dashed: \u00b1 the RMS limit; dotted: \u00b1 the single-point limit.");
        out.append("<div class=\"wide\"><table>\n<tr>").append(temperatureHeads()).append("<th>points</th><th>RMS [%]</th><th>max [%]</th>")
                .append("<th>largest at</th><th class=\"text\">where</th><th>result</th></tr>\n");
        for (CapacitanceVerdict t : v.perTemperature()) {
            out.append("<tr>").append(temperatureCell(t.temperature())).append("<td>").append(t.points())
                    .append(String.format(Locale.ROOT, "</td><td>%.3f</td><td>%.3f</td><td>", t.rmsPercent(), t.maxPercent()))
                    .append(Units.engineering(t.worstVoltage(), "V")).append("</td><td class=\"text mono\">")
                    .append(Markup.escape(t.worstSource())).append("</td>").append(result(t.pass())).append("</tr>\n");
        }
        out.append("</table></div>\n</section>\n");
    }

    private void recovery(RecoveryVerification v) {
        out.append("<section id=\"").append(RECOVERY_ID).append("\">\n<h2>Reverse recovery</h2>\n");
        out.append(String.format(Locale.ROOT, "<p class=\"limits\">Each record's recovery time against trr = TT ln(1 + "
                        + "IF/|IR|) with the card's TT. Limits at every temperature: RMS %.0f %%, any single record %.0f %% "
                        + "of the measured time.</p>%n",
                100 * RecoveryVerification.RMS_FRACTION, 100 * RecoveryVerification.MAX_FRACTION));
        if (!v.records().isEmpty()) {
            figure(plots.recoveryCurve(RECOVERY_ID + "-curve", v), "Recovery time against the ratio of forward to reverse "
                    + "current, on a log axis. Markers: measured records; line: the card's TT ln(1 + IF/|IR|) at each "
                    + "record's ratio, one colour and marker shape per temperature.");
        }
        out.append("<div class=\"wide\"><table>\n<tr>").append(temperatureHeads()).append("<th>records</th><th>RMS [ns]</th><th>max [ns]</th>")
                .append("<th class=\"text\">where</th><th>result</th></tr>\n");
        for (RecoveryVerification.Verdict t : v.perTemperature()) {
            out.append("<tr>").append(temperatureCell(t.temperature())).append("<td>").append(t.points())
                    .append(String.format(Locale.ROOT, "</td><td>%.3f</td><td>%.3f</td>", t.rmsNs(), t.maxNs()))
                    .append("<td class=\"text mono\">").append(Markup.escape(t.worst())).append("</td>")
                    .append(result(t.pass())).append("</tr>\n");
        }
        out.append("</table></div>\n</section>\n");
    }

    private void leakage(LeakageVerification v) {
        out.append("<section id=\"").append(LEAKAGE_ID).append("\">\n<h2>Leakage below breakdown</h2>\n");
        out.append(String.format(Locale.ROOT, "<p class=\"limits\">The card's current at each measured reverse voltage "
                        + "against the measured current, as log10(card/measured). Limits at every temperature: RMS %.1f "
                        + "decade, any single point %.1f decade.</p>%n", LeakageVerification.RMS_DECADES,
                LeakageVerification.MAX_DECADES));
        notes(v.notes());
        if (!v.points().isEmpty()) {
            figure(plots.leakageCurve(LEAKAGE_ID + "-curve", v), "Reverse current below breakdown against |V|, current on "
                    + "a log axis. Markers: measured points; line: the card's current at each measured voltage, one colour "
                    + "and marker shape per temperature.");
        }
        out.append("<div class=\"wide\"><table>\n<tr>").append(temperatureHeads()).append("<th>points</th><th>RMS [decades]</th>")
                .append("<th>max [decades]</th><th class=\"text\">where</th><th>result</th></tr>\n");
        for (LeakageVerification.Verdict t : v.perTemperature()) {
            out.append("<tr>").append(temperatureCell(t.temperature())).append("<td>").append(t.points())
                    .append(String.format(Locale.ROOT, "</td><td>%.3f</td><td>%.3f</td>", t.rmsDecades(), t.maxDecades()))
                    .append("<td class=\"text mono\">").append(Markup.escape(t.worst())).append("</td>")
                    .append(result(t.pass())).append("</tr>\n");
        }
        out.append("</table></div>\n</section>\n");
    }

    private void figure(EvidencePlots.Figure f, String caption) {
        figure(f, caption, null);
    }

    /** A figure; {@code cutReason} says why points were left out, null for the card values' usual reason. */
    private void figure(EvidencePlots.Figure f, String caption, String cutReason) {
        figure++;
        out.append("<figure>\n").append(f.svg()).append("\n<figcaption>Figure ").append(figure).append(". ")
                .append(Markup.escape(caption));
        if (f.limitsOffScale()) {
            out.append(" The scale follows the residuals: a limit beyond it is named in the key, not drawn.");
        }
        if (f.cutOff() > 0 && cutReason != null) {
            out.append(' ').append(f.cutOff()).append(f.cutOff() == 1 ? " point is" : " points are")
                    .append(" not drawn: ").append(Markup.escape(cutReason)).append('.');
        } else if (f.cutOff() > 0) {
            out.append(' ').append(f.cutOff()).append(f.cutOff() == 1 ? " of the card's values is" : " of the card's values are")
                    .append(" off the scale and not drawn: not finite, or far outside the measured range (see the table).");
        }
        out.append("</figcaption>\n</figure>\n");
    }

    private void notes(List<String> notes) {
        if (notes.isEmpty()) {
            return;
        }
        out.append("<ul class=\"notes\">\n");
        notes.forEach(n -> out.append("<li>").append(Markup.escape(n)).append("</li>\n"));
        out.append("</ul>\n");
    }

    private static String temperatureHeads() {
        return "<th class=\"text\">T [\u00b0C]</th>";
    }

    /** The temperature, with its plot colour and marker shape when the page plots it. */
    private String temperatureCell(double kelvin) {
        return temperatureCell(plots, kelvin);
    }

    /** The temperature, with the colour and marker shape {@code plots} gave it when they plot it (also the compare page). */
    static String temperatureCell(EvidencePlots plots, double kelvin) {
        return "<td class=\"text temp\">" + plots.plottedColour(kelvin)
                .map(c -> "<svg class=\"swatch\" viewBox=\"0 0 12 12\" aria-hidden=\"true\"><path stroke=\"" + c + "\" d=\""
                        + plots.plottedShape(kelvin).orElseThrow().path(6, 6, 4) + "\"/></svg>").orElse("")
                + Units.celsius(kelvin) + "</td>";
    }

    /** The card's parameters, the data files' hashes and the command, as far as the facts give them. */
    private void provenance() {
        if (!facts.parameters().isEmpty()) {
            boolean se = facts.hasStandardErrors();
            out.append("<section id=\"parameters\">\n<h2>Card parameters</h2>\n<p class=\"limits\">")
                    .append(se ? "The values on the card, each with one standard error from the fit (a linearised estimate "
                            + "from the Jacobian at the optimum; see the fit's correlation warnings)."
                            : "The values on the card. A verification reads the card only, so there are no standard errors "
                            + "here; the page a fit writes carries them.").append("</p>\n")
                    .append("<div class=\"wide\"><table>\n<tr><th class=\"text\">parameter</th><th>value</th>")
                    .append("<th class=\"text\">unit</th>").append(se ? "<th>standard error</th><th>relative</th>" : "")
                    .append("</tr>\n");
            for (PageFacts.ParameterValue p : facts.parameters()) {
                out.append("<tr><td class=\"text\">").append(Markup.escape(p.keyword())).append("</td><td>")
                        .append(String.format(Locale.ROOT, "%.6g", p.value())).append("</td><td class=\"text\">")
                        .append(Markup.escape(p.unit())).append("</td>");
                if (se) {
                    if (Double.isFinite(p.standardError())) {
                        out.append(String.format(Locale.ROOT, "<td>\u00b1 %.2g</td><td>%s</td>", p.standardError(),
                                p.value() != 0 ? String.format(Locale.ROOT, "%.2g %%", 100 * p.standardError() / Math.abs(p.value()))
                                        : "\u2013"));
                    } else {
                        out.append("<td>\u2013</td><td>\u2013</td>");
                    }
                }
                out.append("</tr>\n");
            }
            out.append("</table></div>\n</section>\n");
        }
        if (!facts.dataFiles().isEmpty()) {
            out.append("<section id=\"data-files\">\n<h2>Data files</h2>\n<p class=\"limits\">SHA-256 of each file as "
                    + "read (FIPS 180-4); <code>sha256sum FILE</code> prints the same digits.</p>\n")
                    .append("<div class=\"wide\"><table>\n<tr><th class=\"text\">file</th><th>bytes</th>")
                    .append("<th class=\"text\">SHA-256</th></tr>\n");
            for (PageFacts.DataFile f : facts.dataFiles()) {
                out.append("<tr><td class=\"text mono\">").append(Markup.escape(f.name())).append("</td><td>").append(f.bytes())
                        .append("</td><td class=\"hash\">").append(f.sha256()).append("</td></tr>\n");
            }
            out.append("</table></div>\n</section>\n");
        }
        if (!facts.command().isEmpty()) {
            out.append("<section id=\"command\">\n<h2>Command</h2>\n<p class=\"limits\">As run, from the folder it was "
                    + "run in:</p>\n<pre class=\"command\">").append(Markup.escape(facts.command())).append("</pre>\n</section>\n");
        }
    }

    private static String result(boolean pass) {
        return pass ? "<td class=\"result pass\">pass</td>" : "<td class=\"result fail\">FAIL</td>";
    }
}
