package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "every data kind, everywhere" and "check does what it says": a zener part of the invented demo data
 * (fixtures/demo/ksz6-*: forward, reverse with leakage and breakdown, C-V, recovery) built in four dialects. Before
 * the fix, check printed forward I-V alone (the spice3 card missed breakdown and check said nothing) and ran gnucap
 * and Xyce cards in ngspice, where the Xyce card ended in a cut-off "Model issue on line 6 :".
 */
class CheckEveryKindTest {
    /** The kinds the part's data hold, as check names them. */
    private static final List<String> KINDS = List.of("forward", "breakdown", "C-V", "recovery", "leakage");

    private static Path root;
    private static CliRun build;

    @BeforeAll
    static void buildTheLibrary() throws Exception {
        root = Simulators.tempDir("check-every-kind");
        Path data = Files.createDirectories(root.resolve("z/data"));
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        StringBuilder entries = new StringBuilder();
        for (String f : List.of("forward-25C", "forward-85C", "forward-minus20C", "reverse-25C", "reverse-85C",
                "reverse-minus20C", "cv-25C", "recovery-25C")) {
            Files.copy(demo.resolve("ksz6-" + f + ".csv"), data.resolve(f + ".csv"));
            String kind = f.substring(0, f.indexOf('-'));
            entries.append("  - file: data/").append(f).append(".csv\n    kind: ").append(kind).append('\n');
        }
        Files.writeString(root.resolve("z/Z6.device.yaml"), "# invented test part (the demo zener's data)\n"
                + "model: Z6\nkind: zener\ndata:\n" + entries + "dialects: [ngspice, spice3, gnucap, xyce]\n",
                StandardCharsets.UTF_8);
        build = CliRun.of("build", root.toString());
        assertEquals(ExitCodes.OK, build.exitCode(), build.describe());
    }

    @Test
    void buildAndTheCardHeaderStateEveryKindAndTheFitsWarnings() throws Exception {
        String line = build.out().lines().filter(l -> l.contains("z/Z6.device.yaml (Z6): built")).findFirst().orElseThrow();
        assertTrue(line.contains("; ngspice: every kind passes (worst RMS: forward "), line);
        assertTrue(line.matches(".*; spice3: FAILS [a-z, -]*breakdown.*"), line);
        for (String kind : KINDS) {
            assertTrue(line.contains(kind + " "), kind + " in " + line);
        }
        // the fit's warnings reach the user for every part, without --notes
        assertTrue(build.out().lines().anyMatch(l -> l.startsWith("warning: z/Z6.device.yaml: ")), build.out());
        String card = Files.readString(root.resolve("z/Z6.spice3.lib"), StandardCharsets.UTF_8);
        assertTrue(card.contains("* verdict: breakdown FAIL at "), card);
        for (String kind : KINDS) {
            assertTrue(card.contains("* verdict: " + kind + " "), kind + " in\n" + card);
        }
        // what leaving out ISR, NR, NBV, TCV costs, kind by kind
        assertTrue(card.lines().anyMatch(l -> l.startsWith("* spice3 cannot carry ") && l.contains("breakdown ")
                && l.contains("with every term")), card);
    }

    @Test
    void everyCardIsJudgedOnEveryDataKindItsPartHas() {
        CliRun r = CliRun.of("check", root.toString());
        // the spice3 card cannot carry NBV or TCV: its breakdown misses the data, and check now says so
        assertEquals(ExitCodes.NOT_REPRODUCED, r.exitCode(), r.describe());
        for (String dialect : List.of("ngspice", "spice3", "gnucap", "xyce")) {
            String line = r.out().lines().filter(l -> l.startsWith("z/Z6." + dialect + ".lib: ")).findFirst().orElseThrow();
            for (String kind : KINDS) {
                assertTrue(line.contains(kind + " pass at ") || line.contains(kind + " FAIL at "), kind + " in " + line);
            }
        }
        String spice3 = r.out().lines().filter(l -> l.startsWith("z/Z6.spice3.lib: ")).findFirst().orElseThrow();
        assertTrue(spice3.contains("breakdown FAIL at "), spice3);
        assertTrue(spice3.startsWith("z/Z6.spice3.lib: fail: does not reproduce its "), spice3);
        String ngspice = r.out().lines().filter(l -> l.startsWith("z/Z6.ngspice.lib: ")).findFirst().orElseThrow();
        assertTrue(ngspice.startsWith("z/Z6.ngspice.lib: pass: "), ngspice);
        // the table has a row per card and kind
        long rows = r.out().lines().filter(l -> l.matches(".*\\s(forward|breakdown|C-V|recovery|leakage)\\s+(pass|FAIL)\\s+-?[0-9]+\\s.*")).count();
        assertEquals(4 * KINDS.size(), rows, r.out());
    }

    @Test
    void aCardInADialectTheEngineDoesNotReadIsNotCheckableNeitherPassNorFailure() throws Exception {
        Simulators.requireNgspice();
        Path junit = root.resolve("check.xml");
        CliRun r = CliRun.of("check", root.toString(), "--engine", "ngspice", "--junit", junit.toString());
        assertTrue(r.out().contains("z/Z6.gnucap.lib: not checkable: with ngspice: ngspice does not read gnucap cards"), r.describe());
        assertTrue(r.out().contains("z/Z6.xyce.lib: not checkable: with ngspice: ngspice does not read xyce cards"), r.describe());
        assertFalse(r.out().contains("Model issue"), r.describe());
        assertTrue(r.out().contains("4 cards: 1 passed, 1 not, 2 not checkable with this engine"), r.out());
        // ngspice, the reference simulator, agrees with the built-in engine: the spice3 card misses breakdown
        String spice3 = r.out().lines().filter(l -> l.startsWith("z/Z6.spice3.lib: ")).findFirst().orElseThrow();
        assertTrue(spice3.contains("breakdown FAIL at "), spice3);
        assertEquals(ExitCodes.NOT_REPRODUCED, r.exitCode(), r.describe());
        String xml = Files.readString(junit, StandardCharsets.UTF_8);
        assertTrue(xml.contains("skipped=\"2\""), xml);
        assertTrue(xml.contains("<skipped message=\"with ngspice: ngspice does not read xyce cards"), xml);
    }

    @Test
    void gnucapChecksTheGnucapCardAlone() throws Exception {
        Simulators.requireGnucap();
        CliRun r = CliRun.of("check", root.toString(), "--engine", "gnucap");
        for (String d : List.of("ngspice", "spice3", "xyce")) {
            assertTrue(r.out().contains("z/Z6." + d + ".lib: not checkable: with gnucap"), r.describe());
        }
        String gnucap = r.out().lines().filter(l -> l.startsWith("z/Z6.gnucap.lib: ")).findFirst().orElseThrow();
        for (String kind : KINDS) {
            assertTrue(gnucap.contains(kind + " pass at ") || gnucap.contains(kind + " FAIL at "), kind + " in " + gnucap);
        }
    }

    @Test
    void verifyRefusesTheXyceCardInNgspiceAsCheckReportsItNotCheckable() throws Exception {
        // verify used to run the Xyce card in ngspice, which warned "Model issue on line ... unrecognized parameter
        // (tbv1)"; it now applies check's rule before anything runs (that a simulator's warning reaches the user whole
        // is FakeSimulatorTest's "two-line-warning")
        CliRun r = CliRun.of("verify", root.resolve("z/Z6.xyce.lib").toString(), "--engine", "ngspice",
                root.resolve("z/data/forward-25C.csv").toString());
        assertEquals(ExitCodes.USAGE, r.exitCode(), r.describe());
        assertTrue(r.err().contains("xyce card not checkable with engine ngspice"), r.describe());
        assertFalse(r.err().contains("Model issue"), r.describe());
    }
}
