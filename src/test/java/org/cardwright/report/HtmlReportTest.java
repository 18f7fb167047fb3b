package org.cardwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import org.cardwright.cli.Main;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.Bias;
import org.cardwright.sim.BuiltinCapacitance;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.testsupport.Simulators;
import org.cardwright.verify.CapacitanceMeasurement;
import org.cardwright.verify.CapacitanceTolerance;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.CapacitanceVerifier;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.LeakageVerification;
import org.cardwright.verify.MeasuredPoint;
import org.cardwright.verify.RecoveryVerification;
import org.cardwright.verify.Tolerance;
import org.cardwright.verify.Verification;
import org.cardwright.verify.Verifier;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * The evidence page: every plot is well-formed SVG, each temperature gets one line and one marker per point,
 * the limits are drawn where they belong, the page is byte-stable and self-contained, and the CLI writes it and
 * refuses to overwrite it without --force. The verification comes from the built-in engine on an invented card
 * and invented "measurements" made by moving the card's own simulation by offsets chosen here.
 */
class HtmlReportTest {
    /** Invented card: a small silicon zener-like junction (no real part). */
    private static final DiodeParameters CARD = DiodeParameters.of(Map.ofEntries(Map.entry(Param.IS, 2e-15),
            Map.entry(Param.N, 1.05), Map.entry(Param.RS, 0.8), Map.entry(Param.BV, 5.6), Map.entry(Param.IBV, 1e-3),
            Map.entry(Param.CJO, 1.2e-10), Map.entry(Param.VJ, 0.75), Map.entry(Param.M, 0.4), Map.entry(Param.TT, 2e-8),
            Map.entry(Param.EG, 1.11), Map.entry(Param.XTI, 3.0)));
    private static final String NAME = "HR1";
    private static final double T25 = 298.15;
    private static final double T85 = 358.15;
    private static final SimulatorOptions OPTIONS = SimulatorOptions.NGSPICE_DEFAULTS;

    /** Forward currents at 25 degC: 100 nA to 100 mA, one a decade [A]. */
    private static final double[] FORWARD_25 = {1e-7, 1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 1e-1};
    /** Offsets added to the card's voltage to make the 25 degC "measurements" [V]; all well inside 2 mV / 5 mV. */
    private static final double[] OFFSET_25 = {0.4e-3, -0.3e-3, 0.2e-3, 0, -0.5e-3, 0.3e-3, -0.1e-3};
    /** Forward currents at 85 degC [A]. */
    private static final double[] FORWARD_85 = {1e-6, 1e-4, 1e-2, 5e-2};
    /** Offsets at 85 degC [V]; the 8 mV one breaks the 5 mV single-point limit, so 85 degC fails. */
    private static final double[] OFFSET_85 = {0.2e-3, 8e-3, -0.4e-3, 0.1e-3};
    /** Reverse currents in breakdown at 25 degC [A]. */
    private static final double[] BREAKDOWN_25 = {-1e-4, -1e-3, -1e-2};
    /** C-V biases at 25 degC [V] and 85 degC. */
    private static final double[] CV_25 = {-4, -2, -1, 0};
    private static final double[] CV_85 = {-3, -1, 0.2};
    /** Relative offsets of the C-V "readings" from the card [1]; all inside 1 % RMS / 3 % max. */
    private static final double CV_OFFSET = 0.004;

    /**
     * Coordinates are written with 0.1 px resolution, so a distance between two lines is off by at most 0.1 px; on
     * distances of tens of pixels a ratio of distances is good to about 0.5 % [1].
     */
    private static final double PIXEL_RATIO_TOLERANCE = 0.005;
    /** Plot coordinates are written to 0.1 px: a difference of two rounded steps is good to 0.2 px [px]. */
    private static final double TWO_ROUNDINGS_PX = 0.2;
    /** Two distances from zero, each of two coordinates rounded to 0.1 px, differ by at most about 0.1 px [px]. */
    private static final double DISTANCE_ROUNDING_PX = 0.11;
    /** A frame value of 50-200 pF from decimal tick arithmetic: double rounding only, 40 to 150 ulp [F]. */
    private static final double FARAD_ROUNDING = 1e-24;
    /** A nice step of 0.5 from decimal arithmetic: double rounding only, about 9 ulp [1]. */
    private static final double UNIT_STEP_ROUNDING = 1e-15;
    /** A nice step of 2e-3 from decimal arithmetic: double rounding only, about 2 ulp [1]. */
    private static final double MILLI_STEP_ROUNDING = 1e-18;
    /** The top tick is at least the largest residual, less 1 % for the tick label's rounding [1]. */
    private static final double TOP_TICK_FRACTION = 0.99;
    /** A limit line spans more than half the plot's width [1]. */
    private static final double SPAN_FRACTION = 0.5;

    // ---------------------------------------------------------------------------------------------------------

    @Test
    void everyPlotIsWellFormedSvgAndTheWholePageParsesAsXml() throws Exception {
        String page = HtmlReport.render(verification(), "cards/HR1.ngspice.lib");
        List<Element> svgs = svgs(page);
        // forward and breakdown: a curve and a residual plot each; C-V: linear, log-log and residuals; recovery and
        // leakage: a curve each
        assertEquals(9, svgs.size(), "plots on the page");
        // the page as a whole is also well-formed (XHTML-compatible syntax), so any XML tool can read it
        parse(page);
    }

    @Test
    void eachTemperatureHasOneLineAndOneMarkerPerPoint() throws Exception {
        List<Element> svgs = svgs(HtmlReport.render(verification(), "cards/HR1.ngspice.lib"));
        Map<String, List<Integer>> expected = Map.of(
                "forward-curve", List.of(FORWARD_25.length, FORWARD_85.length),
                "forward-residuals", List.of(FORWARD_25.length, FORWARD_85.length),
                "breakdown-curve", List.of(BREAKDOWN_25.length),
                "breakdown-residuals", List.of(BREAKDOWN_25.length),
                "capacitance-curve", List.of(CV_25.length, CV_85.length),
                "capacitance-residuals", List.of(CV_25.length, CV_85.length),
                // log-log: only the points at reverse bias (three at 25 degC, two at 85 degC)
                "capacitance-loglog", List.of(3, 2),
                "recovery-curve", List.of(1),
                "leakage-curve", List.of(1));
        for (Element svg : svgs) {
            String id = svg.getAttribute("id");
            List<Element> series = byClass(svg, "g", "series");
            List<Integer> counts = expected.get(id);
            assertEquals(counts.size(), series.size(), id + ": one series per temperature");
            for (int i = 0; i < series.size(); i++) {
                Element g = series.get(i);
                int n = counts.get(i);
                assertEquals(1, g.getElementsByTagName("polyline").getLength(), id + " " + g.getAttribute("data-series"));
                assertEquals(n, markers(g).size(), id + " " + g.getAttribute("data-series"));
                String points = ((Element) g.getElementsByTagName("polyline").item(0)).getAttribute("points");
                assertEquals(n, points.trim().split("\\s+").length, id + ": line vertices");
            }
            // series in rising temperature, labelled in degC, each in its own colour
            List<String> keys = series.stream().map(g -> g.getAttribute("data-series")).toList();
            assertEquals(counts.size() == 2 ? List.of("25.0", "85.0") : List.of("25.0"), keys, id);
            assertEquals(series.size(), series.stream().map(g -> g.getAttribute("stroke")).distinct().count(), id);
            // and each in its own marker shape, so the temperatures stay apart in greyscale
            assertEquals(series.size(), series.stream().map(g -> markerShape(markers(g).get(0))).distinct().count(),
                    id + ": one marker shape per temperature");
        }
    }

    @Test
    void markersFollowTheData() throws Exception {
        Element curve = svg(HtmlReport.render(verification(), "c.lib"), "forward-curve");
        // 25 degC: current rises with each point, so on a log axis drawn upwards every marker sits higher (smaller y)
        // the coldest temperature's markers are circles, whose path starts at the left edge, level with the centre
        List<Element> circles = markers(byClass(curve, "g", "series").get(0));
        for (int i = 1; i < circles.size(); i++) {
            assertTrue(markerY(circles.get(i)) < markerY(circles.get(i - 1)), "marker " + i + " above marker " + (i - 1));
        }
        // one decade a point: equal vertical steps on a log axis (within the 0.1 px rounding, twice)
        double step = markerY(circles.get(0)) - markerY(circles.get(1));
        for (int i = 2; i < circles.size(); i++) {
            assertEquals(step, markerY(circles.get(i - 1)) - markerY(circles.get(i)), TWO_ROUNDINGS_PX, "decade step " + i);
        }
        // each marker names the file and line it came from
        assertTrue(circles.get(0).getTextContent().startsWith("fwd-25.csv:1,"), circles.get(0).getTextContent());
    }

    @Test
    void residualPlotsDrawBothLimitsOnEachSideOfZero() throws Exception {
        String page = HtmlReport.render(verification(), "c.lib");
        Verification forward = verification().forward().orElseThrow();
        assertLimits(svg(page, "forward-residuals"), forward.tolerance().rms(), forward.tolerance().max());
        // the legend names the limits in the plot's unit
        assertTrue(svg(page, "forward-residuals").getTextContent().contains("RMS limit \u00b12.00 mV"));
        assertTrue(svg(page, "capacitance-residuals").getTextContent().contains("point limit \u00b13.00 %"));
    }

    @Test
    void residualAxesScaleToTheResidualsNotToTheLimits() throws Exception {
        String page = HtmlReport.render(verification(), "c.lib");
        // breakdown residuals of 5, 3 and 2 mV against limits of 30 and 60 mV; C-V residuals of 0.4 % against 1 % / 3 %
        for (String id : List.of("breakdown-residuals", "capacitance-residuals")) {
            Element svg = svg(page, id);
            double zero = y(byClass(svg, "line", "zero").get(0), "y1");
            List<Element> ticks = elements(byClass(svg, "g", "ticks").get(0), "text");
            double top = ticks.stream().filter(t -> Double.parseDouble(t.getAttribute("y")) < zero)
                    .mapToDouble(t -> Double.parseDouble(t.getTextContent())).max().orElseThrow();
            double largest = id.startsWith("breakdown") ? 5 : 100 * CV_OFFSET;
            double rmsLimit = id.startsWith("breakdown") ? 30 : CapacitanceTolerance.DEFAULT.rmsPercent();
            assertTrue(top >= largest * TOP_TICK_FRACTION && top < rmsLimit, id + ": top tick " + top + " between the largest residual "
                    + largest + " and the RMS limit " + rmsLimit);
            assertEquals(0, byClass(svg, "line", "limit rms").stream().filter(l -> !inLegend(l)).count(),
                    id + ": a limit beyond the scale is not drawn");
            assertTrue(svg.getTextContent().contains("above this scale"), id + ": the key says where the limit is");
        }
        assertTrue(page.contains("a limit beyond it is named in the key"), "the caption says so");
    }

    @Test
    void cardValuesFarOffTheScaleAreLeftOutAndCounted() throws Exception {
        // a card without BV cannot carry breakdown currents: its voltage there is absurd (or not finite)
        CardUnderTest noBreakdown = CardUnderTest.ngspice(NAME, CARD.without(Param.BV));
        BuiltinEngine engine = new BuiltinEngine(OPTIONS);
        List<MeasuredPoint> reverse = shifted(engine, CardUnderTest.ngspice(NAME, CARD), BREAKDOWN_25,
                new double[] {0, 0, 0}, T25, "rev-25.csv");
        Verification bd = new Verifier(engine, new Tolerance(0.03, 0.06)).verify(noBreakdown, reverse, List.of());
        assertFalse(bd.pass(), "precondition: the card without BV fails");
        String page = HtmlReport.render(new JunctionVerification(Optional.empty(), Optional.of(bd), Optional.empty(),
                Optional.empty(), Optional.empty(), List.of()), "c.lib");
        Element curve = svg(page, "breakdown-curve");
        Element g = byClass(curve, "g", "series").get(0);
        assertEquals(BREAKDOWN_25.length, markers(g).size(), "measured points all drawn");
        assertEquals(0, g.getElementsByTagName("polyline").getLength(), "no line through off-scale card values");
        Element residuals = svg(page, "breakdown-residuals");
        assertEquals(0, markers(byClass(residuals, "g", "series").get(0)).size());
        assertEquals(2, page.split(Pattern.quote(BREAKDOWN_25.length + " of the card's values are off the scale"), -1).length - 1,
                "both captions count the values left out");
        assertTrue(page.contains("class=\"verdict fail\""));
    }

    @Test
    void logAxesTickAtDecadesWithUnitPrefixes() throws Exception {
        // SI prefixes with the unit, as a reader of a plot expects (SI brochure), not SPICE suffixes; u for micro as in
        // the page's tables
        assertEquals("1 nA", PlotAxis.prefixed(1, -9, "A"));
        assertEquals("10 nA", PlotAxis.prefixed(1, -8, "A"));
        assertEquals("100 uA", PlotAxis.prefixed(1, -4, "A"));
        assertEquals("1 V", PlotAxis.prefixed(1, 0, "V"));
        assertEquals("20 pF", PlotAxis.prefixed(2, -11, "F"));
        assertEquals("10 kV", PlotAxis.prefixed(1, 4, "V"));
        assertEquals("1 fA", PlotAxis.prefixed(1, -15, "A"));
        assertEquals("0.5", PlotAxis.prefixed(5, -1, null));
        assertEquals("100", PlotAxis.prefixed(1, 2, null));
        // a short log axis labels its 2 and 5 ticks too; minor ticks at 2..9 times each decade
        PlotAxis shortAxis = PlotAxis.log(12e-12, 80e-12, "C", "F");
        assertEquals(List.of("10 pF", "20 pF", "50 pF", "100 pF"), shortAxis.ticks().stream().map(PlotAxis.Tick::label)
                .filter(l -> !l.isEmpty()).toList());
        assertEquals(8, shortAxis.ticks().stream().filter(t -> !t.major()).count(), "minor ticks 20..90 pF");
        // the frame sits on 1-2-5 values just outside the data, so a narrow range does not sit in an empty decade
        PlotAxis tight = PlotAxis.log(70e-12, 160e-12, "C", "F");
        assertEquals(50e-12, tight.low(), FARAD_ROUNDING);
        assertEquals(200e-12, tight.high(), FARAD_ROUNDING);
        assertEquals(List.of("50 pF", "100 pF", "200 pF"), tight.ticks().stream().map(PlotAxis.Tick::label)
                .filter(l -> !l.isEmpty()).toList());
        Element residuals = svg(HtmlReport.render(verification(), "c.lib"), "forward-residuals");
        List<String> labels = elements(byClass(residuals, "g", "ticks").get(0), "text").stream()
                .map(Element::getTextContent).toList();
        // forward currents 100 nA .. 100 mA: decades 100n .. 100m along x, linear mV ticks up the side
        for (String decade : List.of("100 nA", "1 uA", "10 uA", "100 uA", "1 mA", "10 mA", "100 mA")) {
            assertTrue(labels.contains(decade), decade + " in " + labels);
        }
        assertTrue(labels.contains("0"), "zero residual tick in " + labels);
        // linear axes tick at 1-2-5 steps
        assertEquals(0.5, PlotAxis.niceStep(0.37), UNIT_STEP_ROUNDING);
        assertEquals(2e-3, PlotAxis.niceStep(1.2e-3), MILLI_STEP_ROUNDING);
        PlotAxis volts = PlotAxis.linear(0.013, 0.98, "V");
        assertEquals(0.0, volts.low(), 0.0, "an axis of positive data is not padded below zero");
        assertEquals(List.of("0.0", "0.2", "0.4", "0.6", "0.8", "1.0"),
                volts.ticks().stream().map(PlotAxis.Tick::label).toList());
    }

    @Test
    void headerTablesAndVerdictSayWhatFailed() throws Exception {
        String page = HtmlReport.render(verification(), "cards/<HR1>&.lib");
        assertTrue(page.contains("<h1>Card HR1</h1>"), "card name");
        assertTrue(page.contains("cards/&lt;HR1&gt;&amp;.lib"), "card file, escaped");
        assertTrue(page.contains(new BuiltinEngine(OPTIONS).describe()), "engine");
        assertTrue(page.contains(new BuiltinCapacitance(OPTIONS).describe()), "capacitance engine");
        assertTrue(page.contains("class=\"verdict fail\""), "overall verdict: 85 degC forward fails");
        String forward = between(page, "<section id=\"forward\">", "</section>");
        assertEquals(1, rows(forward, "85.0").stream().filter(r -> r.contains(">FAIL<")).count(), "85 degC row fails");
        assertEquals(1, rows(forward, "25.0").stream().filter(r -> r.contains(">pass<")).count(), "25 degC row passes");
        assertTrue(rows(forward, "85.0").get(0).contains("fwd-85.csv:2"), "largest residual at the 8 mV point");
        for (String id : List.of("breakdown", "capacitance", "recovery", "leakage")) {
            assertTrue(page.contains("<section id=\"" + id + "\">"), id);
        }
        assertTrue(page.contains("<li>invented note with &lt;markup&gt; &amp; an ampersand</li>"), "notes, escaped");
    }

    @Test
    void sameInputGivesTheSameBytesWhateverTheDefaultLocale() throws Exception {
        Locale saved = Locale.getDefault();
        String first;
        String second;
        try {
            Locale.setDefault(Locale.US);
            first = HtmlReport.render(verification(), "c.lib");
            Locale.setDefault(Locale.GERMANY); // decimal comma: any locale-dependent formatting would differ here
            second = HtmlReport.render(verification(), "c.lib");
        } finally {
            Locale.setDefault(saved);
        }
        assertEquals(first, second);
        assertEquals(first, HtmlReport.render(verification(), "c.lib"), "a third render, in the default locale");
    }

    @Test
    void pageIsSelfContained() throws Exception {
        String page = HtmlReport.render(verification(), "c.lib");
        assertFalse(page.toLowerCase(Locale.ROOT).contains("<script"), "no scripts");
        assertFalse(page.toLowerCase(Locale.ROOT).contains("<link"), "no linked resources");
        assertFalse(page.contains("<img"), "no images");
        assertFalse(page.contains("@import"), "no imported style sheets");
        // the only address on the page is the SVG namespace name, which is never fetched
        Matcher m = Pattern.compile("(https?:)?//[^\"\\s)]+").matcher(page.replace(" // ", " "));
        while (m.find()) {
            assertEquals("http://www.w3.org/2000/svg", m.group(), "external reference");
        }
        Matcher url = Pattern.compile("url\\(([^)]*)\\)").matcher(page);
        while (url.find()) {
            assertTrue(url.group(1).startsWith("#"), "only in-page url() references: " + url.group());
        }
    }

    @Test
    void cliWritesThePageAndRefusesToOverwriteWithoutForce() throws Exception {
        Path dir = Simulators.tempDir("html-report-cli");
        Path card = dir.resolve("HR1.ngspice.lib");
        Files.writeString(card, "* Invented card for a test, not a real part.\n"
                + ".model HR1 D(IS=2e-15 N=1.05 RS=0.8 EG=1.11 XTI=3)\n", StandardCharsets.UTF_8);
        Path data = dir.resolve("hr1-forward.csv");
        StringBuilder csv = new StringBuilder("# Invented data for a test: the card's own simulation, not a measurement.\n"
                + "V [V],I [A],T [degC]\n");
        List<Bias> biases = new ArrayList<>();
        for (double i : FORWARD_25) {
            biases.add(Bias.current(i, T25));
        }
        var ops = new BuiltinEngine(OPTIONS).dc(CardUnderTest.ngspice(NAME, CARD), biases);
        for (int k = 0; k < ops.size(); k++) {
            csv.append(String.format(Locale.ROOT, "%.7f,%.6e,25.0%n", ops.get(k).voltage(), FORWARD_25[k]));
        }
        Files.writeString(data, csv.toString(), StandardCharsets.UTF_8);
        Path html = dir.resolve("out").resolve("HR1-evidence.html");

        Run first = run("verify", card.toString(), data.toString(), "--html", html.toString());
        assertEquals(0, first.code, first.err);
        String written = Files.readString(html, StandardCharsets.UTF_8);
        assertTrue(written.startsWith("<!DOCTYPE html>"), "an HTML page");
        assertTrue(written.contains("<h1>Card HR1</h1>") && written.contains("class=\"verdict pass\""), "header");
        assertEquals(2, svgs(written).size(), "forward curve and residuals");
        // the page states what it was made from: the command as run, the data file's SHA-256 (FIPS 180-4, here from
        // the JDK's own digest over the file's bytes) and the card's parameters
        String digest = java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256")
                .digest(Files.readAllBytes(data)));
        assertTrue(between(written, "<section id=\"data-files\">", "</section>").contains(digest), "data file hash");
        assertTrue(written.contains("<pre class=\"command\">cardwright verify " + card + " " + data + " --html " + html
                + "</pre>"), "the exact command");
        String parameters = between(written, "<section id=\"parameters\">", "</section>");
        for (String p : List.of(">IS<", ">2.00000e-15<", ">N<", ">1.05000<", ">RS<", ">EG<", ">XTI<")) {
            assertTrue(parameters.contains(p), p + " in " + parameters);
        }

        Run again = run("verify", card.toString(), data.toString(), "--html", html.toString());
        assertEquals(6, again.code, "exit code 6 (output refused): " + again.err);
        assertTrue(again.err.contains(html.toString()) && again.err.contains("--force"), again.err);
        assertEquals(written, Files.readString(html, StandardCharsets.UTF_8), "the page is left as it was");

        Files.writeString(html, "stale", StandardCharsets.UTF_8);
        Run forced = run("verify", card.toString(), data.toString(), "--html", html.toString(), "--force");
        assertEquals(0, forced.code, forced.err);
        assertEquals(written.replace(" --html " + html + "</pre>", " --html " + html + " --force</pre>"),
                Files.readString(html, StandardCharsets.UTF_8), "replaced, and byte-identical to the first but for --force");

        Run same = run("verify", card.toString(), data.toString(), "--html", html.toString(), "--json", html.toString(),
                "--force");
        assertEquals(2, same.code, "--json and --html on one file is a usage error: " + same.err);
    }

    // ---------------------------------------------------------------------------------------------------------

    /** A verification of every kind, built from the built-in engine; 85 degC forward fails on purpose. */
    private static JunctionVerification verification() throws Exception {
        CardUnderTest card = CardUnderTest.ngspice(NAME, CARD);
        BuiltinEngine engine = new BuiltinEngine(OPTIONS);
        List<MeasuredPoint> forward = new ArrayList<>();
        forward.addAll(shifted(engine, card, FORWARD_25, OFFSET_25, T25, "fwd-25.csv"));
        forward.addAll(shifted(engine, card, FORWARD_85, OFFSET_85, T85, "fwd-85.csv"));
        Verification fwd = new Verifier(engine, Tolerance.DEFAULT).verify(card, forward, List.of());

        List<MeasuredPoint> reverse = shifted(engine, card, BREAKDOWN_25, new double[] {5e-3, -3e-3, 2e-3}, T25, "rev-25.csv");
        Verification bd = new Verifier(engine, new Tolerance(0.03, 0.06)).verify(card, reverse,
                List.of("invented breakdown note"));

        List<CapacitanceMeasurement> cv = new ArrayList<>();
        cv.addAll(capacitance(card, CV_25, T25, "cv-25.csv"));
        cv.addAll(capacitance(card, CV_85, T85, "cv-85.csv"));
        CapacitanceVerification cap = new CapacitanceVerifier(new BuiltinCapacitance(OPTIONS), CapacitanceTolerance.DEFAULT)
                .verify(card, cv, 0, 1e6, List.of());

        RecoveryVerification rec = RecoveryVerification.of(CARD, List.of(
                new RecoveryVerification.Record(1e-2, -1e-2, 1.4e-8, T25, "trr-25.csv:3")));
        LeakageVerification leak = LeakageVerification.of(engine, card, List.of(
                new MeasuredPoint(-2, -2.1e-15, T25, "rev-25.csv", 9)));
        return new JunctionVerification(Optional.of(fwd), Optional.of(bd), Optional.of(cap), Optional.of(rec),
                Optional.of(leak), List.of("invented note with <markup> & an ampersand"));
    }

    /** Points at the given currents whose voltage is the card's plus {@code offsets}; lines number from 1. */
    private static List<MeasuredPoint> shifted(BuiltinEngine engine, CardUnderTest card, double[] currents,
                                               double[] offsets, double temperature, String file) {
        List<Bias> biases = new ArrayList<>();
        for (double i : currents) {
            biases.add(Bias.current(i, temperature));
        }
        var ops = engine.dc(card, biases);
        List<MeasuredPoint> out = new ArrayList<>();
        for (int k = 0; k < currents.length; k++) {
            out.add(new MeasuredPoint(ops.get(k).voltage() + offsets[k], currents[k], temperature, file, k + 1));
        }
        return out;
    }

    /** C-V readings a little above the card's capacitance, alternately below. */
    private static List<CapacitanceMeasurement> capacitance(CardUnderTest card, double[] volts, double temperature,
                                                            String file) throws Exception {
        List<Bias> biases = new ArrayList<>();
        for (double v : volts) {
            biases.add(Bias.voltage(v, temperature));
        }
        List<Double> c = new BuiltinCapacitance(OPTIONS).capacitance(card, biases, 1e6);
        List<CapacitanceMeasurement> out = new ArrayList<>();
        for (int k = 0; k < volts.length; k++) {
            double sign = k % 2 == 0 ? 1 : -1;
            out.add(new CapacitanceMeasurement(volts[k], c.get(k) * (1 + sign * CV_OFFSET), temperature, file, k + 1));
        }
        return out;
    }

    /**
     * Four dashed limit lines outside the legend: two at +-rms and two at +-max, symmetric about the zero line,
     * with their distances from it in the ratio max/rms.
     */
    private static void assertLimits(Element svg, double rms, double max) {
        String id = svg.getAttribute("id");
        double zero = y(byClass(svg, "line", "zero").get(0), "y1");
        List<Element> rmsLines = byClass(svg, "line", "limit rms").stream().filter(l -> !inLegend(l)).toList();
        List<Element> maxLines = byClass(svg, "line", "limit max").stream().filter(l -> !inLegend(l)).toList();
        assertEquals(2, rmsLines.size(), id + ": RMS limit lines");
        assertEquals(2, maxLines.size(), id + ": max limit lines");
        double rmsUp = zero - y(rmsLines.get(0), "y1");
        double rmsDown = y(rmsLines.get(1), "y1") - zero;
        double maxUp = zero - y(maxLines.get(0), "y1");
        double maxDown = y(maxLines.get(1), "y1") - zero;
        assertTrue(rmsUp > 0 && maxUp > rmsUp, id + ": limits above zero, max beyond RMS");
        assertEquals(rmsUp, rmsDown, DISTANCE_ROUNDING_PX, id + ": RMS lines symmetric about zero");
        assertEquals(maxUp, maxDown, DISTANCE_ROUNDING_PX, id + ": max lines symmetric about zero");
        assertEquals(max / rms, maxUp / rmsUp, PIXEL_RATIO_TOLERANCE * max / rms, id + ": max/RMS distance ratio");
        // the lines are horizontal and span the plot
        for (Element l : List.of(rmsLines.get(0), maxLines.get(0))) {
            assertEquals(y(l, "y1"), y(l, "y2"), 0.0, id);
            assertTrue(y(l, "x2") - y(l, "x1") > SvgPlot.WIDTH * SPAN_FRACTION, id + ": spans the plot");
        }
    }

    /** The marker paths of a series group. */
    private static List<Element> markers(Element g) {
        return byClass(g, "path", "marker");
    }

    /** The vertical position of a circle marker: its path starts "M x,cy". */
    private static double markerY(Element marker) {
        Matcher m = Pattern.compile("^M[-0-9.]+,([-0-9.]+)").matcher(marker.getAttribute("d"));
        assertTrue(m.find(), marker.getAttribute("d"));
        return Double.parseDouble(m.group(1));
    }

    /** A marker's shape as the sequence of its path commands ("MaaZ" for a circle, "MLLLZ" for a square, ...). */
    private static String markerShape(Element marker) {
        return marker.getAttribute("d").replaceAll("[^A-Za-z]", "");
    }

    private static boolean inLegend(Element e) {
        for (org.w3c.dom.Node n = e.getParentNode(); n instanceof Element p; n = p.getParentNode()) {
            if (p.getAttribute("class").equals("legend")) {
                return true;
            }
        }
        return false;
    }

    private static double y(Element e, String attribute) {
        return Double.parseDouble(e.getAttribute(attribute));
    }

    /** Every plot's {@code <svg>...</svg>} fragment of the page (not the table's key swatches), each parsed on its own. */
    private static List<Element> svgs(String page) throws Exception {
        List<Element> out = new ArrayList<>();
        Matcher m = Pattern.compile("<svg\\b[^>]*class=\"plot .*?</svg>", Pattern.DOTALL).matcher(page);
        while (m.find()) {
            out.add(parse(m.group()).getDocumentElement());
        }
        return out;
    }

    private static Element svg(String page, String id) throws Exception {
        return svgs(page).stream().filter(s -> s.getAttribute("id").equals(id)).findFirst()
                .orElseThrow(() -> new AssertionError("no plot " + id));
    }

    private static Document parse(String xml) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        DocumentBuilder b = f.newDocumentBuilder();
        b.setErrorHandler(null);
        return b.parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
    }

    private static List<Element> elements(Element root, String tag) {
        NodeList nodes = root.getElementsByTagName(tag);
        List<Element> out = new ArrayList<>();
        for (int i = 0; i < nodes.getLength(); i++) {
            out.add((Element) nodes.item(i));
        }
        return out;
    }

    private static List<Element> byClass(Element root, String tag, String cssClass) {
        return elements(root, tag).stream().filter(e -> e.getAttribute("class").equals(cssClass)).toList();
    }

    private static String between(String text, String start, String end) {
        int a = text.indexOf(start);
        assertTrue(a >= 0, "missing " + start);
        return text.substring(a, text.indexOf(end, a));
    }

    /** Table rows of {@code html} whose first cell ends with the temperature {@code celsius}. */
    private static List<String> rows(String html, String celsius) {
        List<String> out = new ArrayList<>();
        Matcher m = Pattern.compile("<tr><td class=\"text temp\">(<svg class=\"swatch\".*?</svg>)?" + Pattern.quote(celsius) + "</td>.*?</tr>")
                .matcher(html);
        while (m.find()) {
            out.add(m.group());
        }
        return out;
    }

    private record Run(int code, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code;
        try (PrintWriter o = new PrintWriter(out); PrintWriter e = new PrintWriter(err)) {
            code = Main.execute(o, e, args);
        }
        return new Run(code, err.toString());
    }
}
