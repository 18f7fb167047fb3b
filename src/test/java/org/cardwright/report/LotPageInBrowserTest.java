package org.cardwright.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Browser;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The lot's page in a real browser (Debian's chromium, headless), made by {@code cardwright lot} from the shipped
 * invented lot (fixtures/lot: 24 parts simulated in ngspice 39, one deliberate outlier), at the evidence page's two
 * window widths. A copy of the page with a small probe script records what the browser laid out: no sideways
 * scrolling, every plot as wide as its column, no plot text too small to read, and every part of the page there:
 * one histogram per summarised parameter, the scatter matrix with every pair and its correlation, the corner cards
 * over the measured curves, the datasheet table and the outlier. The same command run again writes the same bytes.
 * Screenshots stay in {@code target/page-screens/}.
 */
class LotPageInBrowserTest {
    // widths, probe script and limits: the evidence page's (PageInBrowserTest), so every page is held to the same
    private static final int[] WIDTHS = PageInBrowserTest.WIDTHS;
    private static final int PROBE_HEIGHT = PageInBrowserTest.PROBE_HEIGHT;
    private static final double MIN_PLOT_FONT_PX = PageInBrowserTest.MIN_PLOT_FONT_PX;
    private static final double MIN_FILL = PageInBrowserTest.MIN_FILL;
    private static final int MAX_SHOT_HEIGHT = PageInBrowserTest.MAX_SHOT_HEIGHT;
    private static final String PROBE = PageInBrowserTest.PROBE;

    @Test
    void theLotPageRendersAtBothWidthsWithAllItsPartsAndTheSameBytesTwice() throws Exception {
        Browser browser = Browser.require();
        Path project = Simulators.projectDir();
        Path work = Simulators.tempDir("lot-page-in-browser");
        Path screens = project.resolve("target").resolve("page-screens");
        Files.createDirectories(screens);
        String table = project.resolve("fixtures/lot/lt1-lot-forward.csv").toString();
        assertEquals(0, run("lot", table, "--name", "LT1", "--out", work.resolve("a").toString(), "--jobs", "2", "--no-progress"));
        assertEquals(0, run("lot", table, "--name", "LT1", "--out", work.resolve("b").toString(), "--jobs", "1", "--no-progress"));
        Path page = work.resolve("a/LT1.lot.html");
        assertArrayEquals(Files.readAllBytes(page), Files.readAllBytes(work.resolve("b/LT1.lot.html")), "same lot, same page bytes");
        JsonNode json = new ObjectMapper().readTree(work.resolve("a/LT1.lot.json").toFile());
        String html = Files.readString(page, StandardCharsets.UTF_8);
        Files.copy(page, screens.resolve("lot.html"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        Path probe = work.resolve("lot.probe.html");
        Files.writeString(probe, html.replace("</body>", PROBE + "\n</body>"), StandardCharsets.UTF_8);
        List<String> problems = new ArrayList<>();
        for (int width : WIDTHS) {
            String where = "lot page at " + width + " px";
            String dom = browser.dumpDom(probe, width, PROBE_HEIGHT);
            Map<String, Double> measured = PageInBrowserTest.probe(dom, where);
            System.out.println(where + ": " + measured);
            if (measured.get("scrollWidth") > measured.get("innerWidth")) {
                problems.add(where + ": scrolls sideways (" + measured.get("scrollWidth") + " px in " + measured.get("innerWidth") + " px)");
            }
            if (measured.get("minFill") < MIN_FILL) {
                problems.add(where + ": a plot fills only " + measured.get("minFill") + " of its column");
            }
            if (measured.get("minFont") < MIN_PLOT_FONT_PX) {
                problems.add(where + ": plot text as small as " + measured.get("minFont") + " px");
            }
            assertParts(dom, json, where);
            Path png = screens.resolve("lot-" + width + ".png");
            browser.screenshot(page, width, (int) Math.min(MAX_SHOT_HEIGHT, Math.ceil(measured.get("height"))), png);
            assertTrue(Files.size(png) > 0, where + ": screenshot");
        }
        assertTrue(problems.isEmpty(), String.join("\n", problems));
    }

    private static void assertParts(String dom, JsonNode json, String where) {
        assertEquals(json.get("statistics").size(), PageInBrowserTest.count(dom, "<svg[^>]*class=\"hist\""), where + ": one histogram per parameter");
        // the scatter matrix: a cell of points below the diagonal and the coefficient above it for every pair
        int k = Math.min(LotHtml.SCATTER_PARAMETERS, json.get("correlation").size());
        assertTrue(Pattern.compile("<svg[^>]*class=\"plot scatter\"[^>]*id=\"scatter-matrix\"").matcher(dom).find(), where + ": scatter matrix");
        assertEquals(k * (k - 1) / 2, PageInBrowserTest.count(dom, "<g data-pair=\""), where + ": scatter cells");
        List<String> keys = new ArrayList<>();
        json.get("correlation").fieldNames().forEachRemaining(keys::add);
        for (int i = 0; i < k; i++) {
            for (int j = i + 1; j < k; j++) {
                double r = json.get("correlation").get(keys.get(i)).get(keys.get(j)).asDouble();
                String text = String.format(java.util.Locale.ROOT, "data-pair=\"%s-%s\"[^>]*>r = %.2f<", keys.get(i), keys.get(j), r);
                assertTrue(Pattern.compile(text).matcher(dom).find(), where + ": correlation " + text);
            }
        }
        // the outlier LT1-17 (RS four times the lot's) is drawn red in the scatter matrix
        assertTrue(dom.contains("<circle class=\"out\""), where + ": an outlier in the scatter matrix");
        // the corners on the measured curves
        String corners = PageInBrowserTest.between(dom, "id=\"lot-corners\"", "</svg>", where);
        for (String series : List.of("measured", "outliers", "typical", "vf-low", "vf-high")) {
            assertTrue(corners.contains("data-series=\"" + series + "\""), where + ": series " + series);
        }
        assertTrue(PageInBrowserTest.count(corners, "<polyline ") >= 20 + 3, where + ": a curve for each drawn part and card");
        String datasheet = PageInBrowserTest.between(dom, "<h2>Datasheet quantities</h2>", "</table>", where);
        assertTrue(datasheet.contains("<td>VF [V]</td>"), where + ": VF in the datasheet table");
        assertTrue(dom.contains("<b>LT1-17</b>"), where + ": the outlier listed");
    }

    private static int run(String... args) {
        try (PrintWriter o = new PrintWriter(new StringWriter()); PrintWriter e = new PrintWriter(new StringWriter())) {
            return Main.execute(o, e, args);
        }
    }
}
