package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11: "compare can write a page that overlays both cards on the data". {@code compare --html FILE --data ...}
 * writes one page with a section for every data kind the data hold, each card's verdict against the data, and the
 * comparison's own tables; the page refuses to overwrite a file or to land on an input, as every output does. (The
 * page in a real browser: report/PageInBrowserTest.)
 */
class ComparePageTest {
    private static final Path PROJECT = Simulators.projectDir();
    private static final String CARD_A = PROJECT.resolve("fixtures/demo/ksz6-generating-card.lib").toString();
    private static final String CARD_B = PROJECT.resolve("fixtures/compare/ksz6-variant.lib").toString();

    private static List<String> zenerData() {
        List<String> out = new ArrayList<>();
        for (String f : List.of("ksz6-forward-minus20C.csv", "ksz6-forward-25C.csv", "ksz6-reverse-25C.csv",
                "ksz6-cv-25C.csv", "ksz6-recovery-25C.csv")) {
            out.add(PROJECT.resolve("fixtures/demo/" + f).toString());
        }
        return out;
    }

    private static CliRun compare(Path page, String... more) {
        List<String> args = new ArrayList<>(List.of("compare", CARD_A, CARD_B, "--temp", "25", "--data"));
        args.addAll(zenerData());
        args.addAll(List.of("--html", page.toString()));
        args.addAll(List.of(more));
        return CliRun.of(args.toArray(String[]::new));
    }

    @Test
    void thePageOverlaysBothCardsOnEveryDataKind() throws Exception {
        Path page = Simulators.tempDir("compare-page").resolve("a-vs-b.html");
        CliRun r = compare(page);
        // the generating card and its older variant differ beyond the limits: a verdict, exit 1
        assertEquals(ExitCodes.NOT_REPRODUCED, r.exitCode(), r.describe());
        String html = Files.readString(page, StandardCharsets.UTF_8);
        for (String section : List.of("overview", "forward", "breakdown", "capacitance", "recovery", "leakage",
                "side-by-side", "parameters", "data-files", "command", "notes")) {
            assertTrue(html.contains("<section id=\"" + section + "\">"), "section " + section);
        }
        assertTrue(html.contains("KSZ6 and KSZ6OLD on the same data"), "both cards named");
        assertTrue(html.contains("class=\"series card-b\""), "card B's dashed lines");
        // card A generated the data: it reproduces them; the variant does not
        String overview = html.substring(html.indexOf("<section id=\"overview\">"), html.indexOf("</section>",
                html.indexOf("<section id=\"overview\">")));
        assertTrue(overview.contains("<td class=\"result pass\">pass</td><td class=\"result fail\">FAIL</td>"), overview);
        assertFalse(html.contains("<script"), "the page runs no script");
        assertEquals(html, Files.readString(page, StandardCharsets.UTF_8));
        // the same comparison gives the same bytes
        CliRun again = compare(page, "--force");
        assertEquals(ExitCodes.NOT_REPRODUCED, again.exitCode(), again.describe());
        assertEquals(html.replace(page.toString(), ""), Files.readString(page, StandardCharsets.UTF_8).replace(page.toString(), "")
                .replace(" --force", ""), "byte-stable apart from the command line");
    }

    @Test
    void aPageNeedsDataAndNeverOverwritesOrLandsOnAnInput() throws Exception {
        Path dir = Simulators.tempDir("compare-page-refusals");
        Path page = dir.resolve("page.html");
        CliRun noData = CliRun.of("compare", CARD_A, CARD_B, "--html", page.toString());
        assertEquals(ExitCodes.USAGE, noData.exitCode(), noData.describe());
        assertEquals(1, noData.errLines().size(), noData.describe());
        assertTrue(noData.err().contains("--html") && noData.err().contains("--data"), noData.err());
        assertFalse(Files.exists(page));

        Files.writeString(page, "mine", StandardCharsets.UTF_8);
        CliRun exists = compare(page);
        assertEquals(ExitCodes.OUTPUT_REFUSED, exists.exitCode(), exists.describe());
        assertEquals("mine", Files.readString(page, StandardCharsets.UTF_8));

        Path copy = dir.resolve("card-b.lib");
        Files.copy(Path.of(CARD_B), copy);
        CliRun onInput = CliRun.of("compare", CARD_A, copy.toString(), "--data", zenerData().get(0), "--html", copy.toString(),
                "--force");
        assertEquals(ExitCodes.OUTPUT_REFUSED, onInput.exitCode(), onInput.describe());
        assertEquals(Files.readString(Path.of(CARD_B)), Files.readString(copy), "card B is untouched");
    }
}
