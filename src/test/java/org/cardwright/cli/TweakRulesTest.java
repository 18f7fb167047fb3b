package org.cardwright.cli;

import org.cardwright.testsupport.TestCopies;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, tweak rules: a tweak changes a value the fitted card states and adds no term. Before the fix, ISR=1n on a
 * part without ISR reported "fitted 10f" (a default) and put NR on the card; IKF=1 died with "cannot write a
 * non-finite number: Infinity", exit 2; the gnucap card silently did not take a tweak. Parts: the invented example
 * library (fixtures/library).
 */
class TweakRulesTest {

    @Test
    void aTermTheFitLeftOffIsRefusedNamingItAndHowToAddIt() throws Exception {
        Path dir = TestCopies.libraryFolder("rectifiers", "tweak-absent-term");
        // RB4's fit has no ISR and no IKF (its cards carry IS, N, RS, EG, XTI)
        for (String term : List.of("ISR", "IKF")) {
            CliRun r = CliRun.of("tweak", dir.resolve("RB4.device.yaml").toString(), "--set", term + "=1n");
            assertEquals(ExitCodes.USAGE, r.exitCode(), r.describe());
            assertEquals(1, r.errLines().size(), r.describe());
            String line = r.errLines().get(0);
            assertTrue(line.contains("left " + term + " off the card"), line);
            assertTrue(line.contains("RB4.device.yaml"), line);
            assertTrue(line.contains(term + "=free"), line);
            assertFalse(line.contains("Infinity") || line.contains("non-finite") || line.contains("10f"), line);
            assertEquals("", r.out(), r.describe());
        }
    }

    @Test
    void everyDialectTakesTheTweakOrSaysWhyNot() throws Exception {
        Path dir = TestCopies.libraryFolder("switching", "tweak-dialects");
        // SW1 (ISR, NR, IKF on its ngspice card) in two dialects; gnucap cannot carry ISR
        Path device = dir.resolve("SW1.device.yaml");
        Files.writeString(device, Files.readString(device, StandardCharsets.UTF_8)
                .replace("dialects: [ngspice]", "dialects: [ngspice, gnucap]"), StandardCharsets.UTF_8);
        Path out = dir.resolve("tweaked");
        CliRun r = CliRun.of("tweak", device.toString(), "--set", "ISR=+50%", "--render-only", "--out", out.toString());
        assertEquals(ExitCodes.OK, r.exitCode(), r.describe());
        assertTrue(r.err().contains("note: gnucap cannot carry ISR: its card is the untweaked fit"), r.describe());  // notes on stderr
        String gnucap = Files.readString(out.resolve("SW1.gnucap.lib"), StandardCharsets.UTF_8);
        assertTrue(gnucap.contains("(not taken: gnucap cannot carry ISR: its card is the untweaked fit)"), gnucap);
        String ngspice = Files.readString(out.resolve("SW1.ngspice.lib"), StandardCharsets.UTF_8);
        assertTrue(ngspice.lines().anyMatch(l -> l.startsWith("* tweak: ISR=+50% (render only)") && !l.contains("not taken")), ngspice);
        // the table shows the cost for every data kind SW1 has: forward, recovery and leakage
        for (String kind : List.of("forward", "recovery", "leakage")) {
            assertTrue(r.out().lines().anyMatch(l -> l.trim().startsWith(kind + " ") && l.contains(" -> ")), kind + "\n" + r.out());
        }
        // no term added: the ngspice card states the same keywords as the untweaked card (a tweak by +0 %)
        Path same = dir.resolve("same");
        CliRun zero = CliRun.of("tweak", device.toString(), "--set", "ISR=+0%", "--render-only", "--out", same.toString());
        assertEquals(ExitCodes.OK, zero.exitCode(), zero.describe());
        assertEquals(keywords(Files.readString(same.resolve("SW1.ngspice.lib"), StandardCharsets.UTF_8)), keywords(ngspice));
    }

    @Test
    void aTweakOfAStatedValueReachesEveryDialectThatCarriesIt() throws Exception {
        Path dir = TestCopies.libraryFolder("rectifiers", "tweak-gnucap");
        Path out = dir.resolve("tweaked");
        CliRun r = CliRun.of("tweak", dir.resolve("RB4.device.yaml").toString(), "--set", "RS=0.1", "--render-only",
                "--out", out.toString());
        assertEquals(ExitCodes.OK, r.exitCode(), r.describe());
        for (String d : List.of("ngspice", "gnucap")) {
            String card = Files.readString(out.resolve("RB4." + d + ".lib"), StandardCharsets.UTF_8);
            assertTrue(card.lines().anyMatch(l -> l.equalsIgnoreCase("+ RS=0.1")), d + "\n" + card);
        }
        assertFalse(r.err().contains("note: ") || r.out().contains("note: "), r.describe());
    }

    private static List<String> keywords(String card) {
        return card.lines().filter(l -> l.startsWith("+ ") && l.contains("="))
                .map(l -> l.substring(2, l.indexOf('=')).toUpperCase(java.util.Locale.ROOT)).toList();
    }
}
