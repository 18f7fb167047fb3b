package org.cardwright.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.DataInputStream;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Browser;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The evidence page in a real browser (Debian's chromium, headless), for every kind of page: forward I-V only; a
 * zener with forward, breakdown, C-V, recovery and leakage; forward with leakage (each written by {@code verify --html}
 * from the invented demo data and the invented card that generated it); and the page {@code fit --html} writes for
 * the card it fits to the forward data, and for the gnucap card it fits to the zener's data of every kind (a card
 * without breakdown: its breakdown points are reported not reached). Each is rendered at 1400 and 760 px.
 * The screenshots stay in {@code target/page-screens/} for a person to look at. A copy of each page with a small
 * probe script (the page itself has no script) records what the browser laid out, and the test asserts on it: no
 * horizontal scrolling, every plot as wide as its column, no plot text smaller than a reader reads comfortably, and
 * every part of the page present.
 */
class PageInBrowserTest {
    /** The two window widths of the issue: a desktop window and the narrow column the plots must still fit [px]. */
    static final int[] WIDTHS = {1400, 760};
    /** Window height for the DOM probe; the page scrolls vertically, which is fine [px]. */
    static final int PROBE_HEIGHT = 1000;
    /**
     * Smallest rendered size of any text inside a plot [px]: below about 11 px, sans-serif labels on a screen need
     * effort to read (common practice, no source).
     */
    static final double MIN_PLOT_FONT_PX = 11.0;
    /** A plot fills its column: at least this share of the figure's width (the rest is rounding) [1]. */
    static final double MIN_FILL = 0.98;
    /** Tallest screenshot taken; a longer page is cut there, which is still enough to look at [px]. */
    static final int MAX_SHOT_HEIGHT = 16000;

    /** What the probe script records, as "key=value;" pairs in a pre element it appends. */
    static final String PROBE = "<script>(function(){var d=document.documentElement,out=[];"
            + "out.push('scrollWidth='+d.scrollWidth,'innerWidth='+window.innerWidth,'height='+d.scrollHeight);"
            + "var minFont=1e9,minFill=1e9;document.querySelectorAll('svg.plot').forEach(function(s){"
            + "var w=s.getBoundingClientRect().width,col=s.parentElement.clientWidth;minFill=Math.min(minFill,w/col);"
            + "var k=w/s.viewBox.baseVal.width;s.querySelectorAll('text').forEach(function(t){"
            + "minFont=Math.min(minFont,parseFloat(getComputedStyle(t).fontSize)*k);});});"
            + "out.push('minFont='+minFont,'minFill='+minFill);"
            + "var p=document.createElement('pre');p.id='probe';p.textContent=out.join(';');document.body.appendChild(p);"
            + "})();</script>";

    /**
     * A kind of page; {@code card} null for the page {@code fit --html} writes for the card it fits; {@code cardB}
     * given for the page {@code compare --html} writes (both cards overlaid on the data).
     */
    private record Kind(String name, String card, List<String> data, List<String> plots, List<String> sections,
                        String cardB, List<String> fitOptions) {
        Kind(String name, String card, List<String> data, List<String> plots, List<String> sections) {
            this(name, card, data, plots, sections, null, List.of("--name", "KS1", "--dialect", "ngspice"));
        }

        Kind(String name, String card, List<String> data, List<String> plots, List<String> sections, String cardB) {
            this(name, card, data, plots, sections, cardB, List.of());
        }
    }

    @Test
    void everyPageKindRendersAtBothWidthsWithoutOverflowAndWithAllItsParts() throws Exception {
        Browser browser = Browser.require();
        Path project = Simulators.projectDir();
        Path screens = project.resolve("target").resolve("page-screens");
        Files.createDirectories(screens);
        Path work = Simulators.tempDir("page-in-browser");
        String demo = "fixtures/demo/";
        List<String> forwardFiles = List.of("ks1-forward-minus40C.csv", "ks1-forward-25C.csv", "ks1-forward-85C.csv", "ks1-forward-125C.csv");
        List<String> zenerFiles = List.of("ksz6-forward-minus20C.csv", "ksz6-forward-25C.csv", "ksz6-forward-85C.csv",
                "ksz6-reverse-minus20C.csv", "ksz6-reverse-25C.csv", "ksz6-reverse-85C.csv",
                "ksz6-cv-25C.csv", "ksz6-cv-85C.csv", "ksz6-recovery-25C.csv");
        List<String> zenerPlots = List.of("forward-curve", "forward-residuals", "breakdown-curve", "breakdown-residuals",
                "capacitance-curve", "capacitance-loglog", "capacitance-residuals", "recovery-curve",
                "leakage-curve");
        List<String> everyKind = List.of("forward", "breakdown", "capacitance", "recovery", "leakage");
        List<Kind> kinds = List.of(
                new Kind("forward", demo + "generating-card.lib", forwardFiles,
                        List.of("forward-curve", "forward-residuals"), List.of("forward")),
                new Kind("zener", demo + "ksz6-generating-card.lib", zenerFiles, zenerPlots, everyKind),
                new Kind("leakage", demo + "generating-card.lib",
                        List.of("ks1-forward-25C.csv", "ks1-reverse-25C.csv"),
                        List.of("forward-curve", "forward-residuals", "leakage-curve"), List.of("forward", "leakage")),
                new Kind("fit", null, forwardFiles,
                        List.of("forward-curve", "forward-residuals"), List.of("forward")),
                new Kind("compare", demo + "ksz6-generating-card.lib", zenerFiles,
                        List.of("forward-curve", "forward-residuals", "breakdown-curve", "breakdown-residuals",
                                "capacitance-curve", "capacitance-residuals", "recovery-curve", "leakage-curve"), everyKind,
                        "fixtures/compare/ksz6-variant.lib"),
                // fit --html of a part with every data kind, in a dialect without breakdown (gnucap): the page of the
                // gnucap card, whose breakdown points are not reached (counted at twice their measured voltage, so the
                // plots keep the data's own range; before, at about 5e10 V)
                new Kind("fit-zener-gnucap", null, zenerFiles, zenerPlots, everyKind, null,
                        List.of("--name", "KSZ6", "--kind", "zener", "--dialect", "gnucap")));
        List<String> problems = new ArrayList<>();
        for (Kind kind : kinds) {
            Path page = work.resolve(kind.name() + ".html");
            List<String> args = new ArrayList<>(kind.card() == null ? List.of("fit")
                    : kind.cardB() != null ? List.of("compare", project.resolve(kind.card()).toString(),
                            project.resolve(kind.cardB()).toString(), "--data")
                    : List.of("verify", project.resolve(kind.card()).toString()));
            kind.data().forEach(f -> args.add(project.resolve(demo + f).toString()));
            if (kind.card() == null) {
                args.addAll(kind.fitOptions());
                args.addAll(List.of("--out", work.resolve("fitted-" + kind.name()).toString()));
            }
            args.addAll(List.of("--html", page.toString()));
            int code = run(args);
            assertTrue(code == 0 || code == 1, kind.name() + ": the command exits 0 or 1 (a verdict), got " + code);
            String html = Files.readString(page, StandardCharsets.UTF_8);
            Files.copy(page, screens.resolve(kind.name() + ".html"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            Path probe = work.resolve(kind.name() + ".probe.html");
            Files.writeString(probe, html.replace("</body>", PROBE + "\n</body>"), StandardCharsets.UTF_8);
            for (int width : WIDTHS) {
                String where = kind.name() + " at " + width + " px";
                String dom = browser.dumpDom(probe, width, PROBE_HEIGHT);
                Map<String, Double> measured = probe(dom, where);
                System.out.println(where + ": " + measured);
                if (measured.get("scrollWidth") > measured.get("innerWidth")) {
                    problems.add(where + ": scrolls sideways (content " + measured.get("scrollWidth") + " px in a "
                            + measured.get("innerWidth") + " px window)");
                }
                if (measured.get("minFill") < MIN_FILL) {
                    problems.add(where + ": a plot fills only " + measured.get("minFill") + " of its column");
                }
                if (measured.get("minFont") < MIN_PLOT_FONT_PX) {
                    problems.add(where + ": plot text as small as " + measured.get("minFont") + " px");
                }
                assertParts(dom, kind, where);
                int height = (int) Math.min(MAX_SHOT_HEIGHT, Math.ceil(measured.get("height")));
                Path png = screens.resolve(kind.name() + "-" + width + ".png");
                browser.screenshot(page, width, height, png);
                assertEquals(width, pngWidth(png), where + ": screenshot width");
            }
        }
        System.out.println("evidence page screenshots: " + screens);
        assertTrue(problems.isEmpty(), String.join("\n", problems));
    }

    /** Every part of a page of this kind is in the DOM the browser built. */
    private static void assertParts(String dom, Kind kind, String where) throws Exception {
        for (String plot : kind.plots()) {
            assertTrue(Pattern.compile("<svg[^>]*class=\"plot[^\"]*\"[^>]*id=\"" + plot + "\"").matcher(dom).find(),
                    where + ": plot " + plot);
        }
        int plots = count(dom, "<svg[^>]*class=\"plot ");
        assertEquals(kind.plots().size(), plots, where + ": number of plots");
        for (String section : kind.sections()) {
            String body = between(dom, "<section id=\"" + section + "\">", "</section>", where);
            assertTrue(body.contains("<table>"), where + ": " + section + " has its table");
            assertTrue(body.contains("class=\"result"), where + ": " + section + " has its verdicts");
        }
        String parameters = between(dom, "<section id=\"parameters\">", "</section>", where);
        for (String keyword : List.of(">IS<", ">N<", ">RS<", ">EG<", ">XTI<")) {
            assertTrue(parameters.contains(keyword), where + ": parameter " + keyword);
        }
        String files = between(dom, "<section id=\"data-files\">", "</section>", where);
        for (String f : kind.data()) {
            // FIPS 180-4 SHA-256 of the file's bytes, from the JDK's digest
            Path file = Simulators.projectDir().resolve("fixtures/demo/" + f);
            String digest = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
            assertTrue(files.contains(digest), where + ": SHA-256 of " + f);
        }
        String command = between(dom, "<section id=\"command\">", "</section>", where);
        if (kind.cardB() != null) {
            // the overlay: every curve carries card A (solid) and card B (dashed) for every temperature it plots
            for (String plot : kind.plots()) {
                String svg = between(dom, "id=\"" + plot + "\"", "</svg>", where);
                assertEquals(count(svg, "class=\"series\""), count(svg, "class=\"series card-b\""),
                        where + ": " + plot + " has a card B line for each card A line");
                assertTrue(count(svg, "class=\"series card-b\"") > 0, where + ": " + plot + " has card B's lines");
            }
            assertTrue(between(dom, "<section id=\"side-by-side\">", "</section>", where).contains("B/A"),
                    where + ": the side-by-side tables");
            assertTrue(command.contains("cardwright compare ") && command.contains(kind.cardB()) && command.contains("--html "),
                    where + ": the command, " + command);
            return;
        }
        assertTrue(command.contains(kind.card() == null ? "cardwright fit " : "cardwright verify ")
                && command.contains(kind.card() == null ? String.join(" ", kind.fitOptions()) : kind.card())
                && command.contains("--html "), where + ": the command, " + command);
        if (kind.sections().contains("breakdown") && kind.card() == null) {
            // the gnucap card carries no breakdown: the page says the points are not reached, with figures in range
            String breakdown = between(dom, "<section id=\"breakdown\">", "</section>", where);
            assertTrue(breakdown.contains("36 of 36 points not reached"), where + ": the not-reached note");
            // the note may quote the simulator's own voltage (up to 5.00e+10 V); the tables and plots may not
            String figures = breakdown.replaceAll("(?s)<li>.*?</li>", "");
            assertTrue(!Pattern.compile("[0-9]e\\+?(1[0-9]|[2-9][0-9])").matcher(figures).find(),
                    where + ": no figure of 1e10 or more in the breakdown section's tables and plots");
        }
        if (kind.card() == null) {
            // a fit's page carries the standard errors of the fitted parameters
            assertTrue(parameters.contains("<th>standard error</th>"), where + ": standard-error column");
            assertTrue(Pattern.compile("<td class=\"text\">IS</td><td>[^<]+</td><td class=\"text\">A</td><td>\u00b1 ")
                    .matcher(parameters).find(), where + ": IS with its standard error");
        }
    }

    static Map<String, Double> probe(String dom, String where) {
        Matcher m = Pattern.compile("<pre id=\"probe\">([^<]*)</pre>").matcher(dom);
        assertTrue(m.find(), where + ": the probe script ran");
        Map<String, Double> out = new LinkedHashMap<>();
        for (String pair : m.group(1).split(";")) {
            String[] kv = pair.split("=", 2);
            out.put(kv[0], Double.parseDouble(kv[1]));
        }
        return out;
    }

    static int count(String text, String regex) {
        Matcher m = Pattern.compile(regex).matcher(text);
        int n = 0;
        while (m.find()) {
            n++;
        }
        return n;
    }

    static String between(String text, String start, String end, String where) {
        int a = text.indexOf(start);
        assertTrue(a >= 0, where + ": missing " + start);
        return text.substring(a, text.indexOf(end, a));
    }

    /** Width from a PNG's header (the IHDR chunk, PNG specification, ISO/IEC 15948). */
    private static int pngWidth(Path png) throws Exception {
        try (InputStream in = Files.newInputStream(png); DataInputStream data = new DataInputStream(in)) {
            byte[] head = new byte[16];
            data.readFully(head);
            return data.readInt();
        }
    }

    private static int run(List<String> args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        try (PrintWriter o = new PrintWriter(out); PrintWriter e = new PrintWriter(err)) {
            return Main.execute(o, e, args.toArray(String[]::new));
        }
    }
}
