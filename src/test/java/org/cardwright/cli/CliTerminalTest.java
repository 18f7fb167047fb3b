package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * Issue 11, "The page and the terminal": the help a user meets (one whole sentence per command in the list, text
 * wrapped by picocli, a short answer to a wrong command line), notes on standard error and results on standard
 * output, and tables whose columns stay aligned with long paths.
 */
class CliTerminalTest {
    /** picocli's default usage width [characters]; the help is laid out for it. */
    private static final int HELP_WIDTH = 80;
    private static final List<String> COMMANDS = List.of("fit", "verify", "build", "tweak", "compare", "check", "lot");

    @Test
    void everyCommandHasAOneSentenceSummaryThatFitsTheCommandList() {
        CliRun run = CliRun.of("--help");
        assertEquals(ExitCodes.OK, run.exitCode(), run.describe());
        List<String> lines = run.out().lines().toList();
        int list = lines.indexOf("Commands:");
        assertTrue(list > 0, run.out());
        for (String command : COMMANDS) {
            String line = lines.stream().filter(l -> l.startsWith("  " + command + " ")).findFirst().orElseThrow(
                    () -> new AssertionError(command + " is not in the command list:\n" + run.out()));
            int at = lines.indexOf(line);
            String summary = line.substring(2 + command.length()).trim();
            assertTrue(summary.matches("[A-Z][^.]*\\."), "a whole sentence: '" + summary + "'");
            assertTrue(line.length() <= HELP_WIDTH, "fits one line of the list: " + line);
            assertTrue(!lines.get(at + 1).startsWith("   "), "no continuation line after: " + line);
        }
        for (String l : lines) {
            assertTrue(l.length() <= HELP_WIDTH, "wider than the help: " + l);
        }
    }

    @Test
    void descriptionsAreParagraphsThatPicocliWraps() {
        CommandLine cl = Main.commandLine("--help");
        for (Map.Entry<String, CommandLine> e : cl.getSubcommands().entrySet()) {
            if (e.getKey().equals("help")) {
                continue;  // picocli's own
            }
            CommandLine.Model.UsageMessageSpec usage = e.getValue().getCommandSpec().usageMessage();
            List<String> text = new ArrayList<>(List.of(usage.description()));
            for (String f : usage.footer()) {
                if (!f.startsWith("  cardwright ")) {  // an example command stays one line of its own
                    text.add(f);
                }
            }
            for (String paragraph : text) {
                // a sentence cut into two array elements ends without punctuation
                assertTrue(paragraph.isEmpty() || paragraph.matches("(?s).*[.:;)]$"),
                        e.getKey() + ": a line break inside a sentence: '" + paragraph + "'");
            }
            CliRun help = CliRun.of(e.getKey(), "--help");
            assertEquals(ExitCodes.OK, help.exitCode(), help.describe());
            assertTrue(help.out().startsWith("Usage: cardwright " + e.getKey()), help.out());
            for (String l : help.out().lines().toList()) {
                assertTrue(l.length() <= HELP_WIDTH, e.getKey() + " --help: wider than the help: " + l);
            }
        }
    }

    @Test
    void aMissingRequiredArgumentPrintsOneLineAndWhereTheHelpIs() {
        for (String command : COMMANDS) {
            CliRun run = CliRun.of(command);
            assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
            assertEquals("", run.out(), command);
            List<String> err = run.errLines();
            assertEquals(2, err.size(), command + ": " + run.err());
            assertTrue(err.get(0).startsWith("cardwright: Missing required"), err.get(0));
            assertEquals("see 'cardwright " + command + " --help'", err.get(1));
        }
        CliRun mistyped = CliRun.of("fit", "a.csv", "--name", "X", "--robsut");
        assertEquals(ExitCodes.USAGE, mistyped.exitCode(), mistyped.describe());
        assertTrue(mistyped.err().startsWith("cardwright: Unknown option: '--robsut'"), mistyped.err());
        assertTrue(mistyped.err().contains("--robust"), "picocli's suggestion is kept: " + mistyped.err());
        assertFalse(mistyped.err().contains("Usage:"), mistyped.err());
    }

    @Test
    void notesGoToStandardErrorAndResultsToStandardOutput() throws Exception {
        Path root = Simulators.projectDir();
        Path out = Simulators.tempDir("terminal-notes");
        String log = root.resolve("fixtures/bench/simulated-meter-loading.csv").toString();
        CliRun fit = CliRun.of("fit", log, "--name", "NB", "--dialect", "ngspice", "--out", out.toString());
        assertEquals(ExitCodes.OK, fit.exitCode(), fit.describe());
        assertResultsAndNotesApart(fit, "meter loading corrected", "Model NB:");

        CliRun verify = CliRun.of("verify", out.resolve("NB.ngspice.lib").toString(), log);
        assertEquals(ExitCodes.OK, verify.exitCode(), verify.describe());
        assertResultsAndNotesApart(verify, "meter loading corrected", "Forward I-V: card NB");

        // a card keyword that cardwright does not model is a note in compare
        Path odd = out.resolve("odd.lib");
        Files.writeString(odd, ".model NB D(IS=1e-14 N=1 RS=1 KF=1e-16)\n");
        CliRun compare = CliRun.of("compare", out.resolve("NB.ngspice.lib").toString(), odd.toString(), "--temp", "25");
        assertResultsAndNotesApart(compare, "KF", "Forward voltage");
    }

    private static void assertResultsAndNotesApart(CliRun run, String note, String result) {
        assertTrue(run.err().lines().anyMatch(l -> l.startsWith("note: ") && l.contains(note)), run.describe());
        assertFalse(run.out().contains("note: "), "a note on standard output: " + run.describe());
        assertTrue(run.out().contains(result), run.describe());
    }

    @Test
    void verifyTablesStayAlignedWithA120CharacterPath() throws Exception {
        Path root = Simulators.projectDir();
        Path base = Simulators.tempDir("terminal-long-paths");
        Path deep = base;
        while (deep.toString().length() < 120) {
            deep = deep.resolve("folder-" + "x".repeat(12));
        }
        Files.createDirectories(deep);
        List<String> args = new ArrayList<>(List.of("verify", root.resolve("fixtures/demo/ksz6-generating-card.lib").toString()));
        try (var files = Files.list(root.resolve("fixtures/demo"))) {
            for (Path f : files.filter(f -> f.getFileName().toString().startsWith("ksz6-")
                    && f.getFileName().toString().endsWith(".csv")).toList()) {
                Path copy = deep.resolve(f.getFileName());
                Files.copy(f, copy);
                args.add(copy.toString());
            }
        }
        assertTrue(deep.toString().length() >= 120, deep.toString());
        CliRun run = CliRun.of(args.toArray(String[]::new));
        assertTrue(run.exitCode() == ExitCodes.OK || run.exitCode() == ExitCodes.NOT_REPRODUCED, run.describe());
        List<String> lines = run.out().lines().toList();
        int tables = 0;
        for (int i = 0; i < lines.size(); i++) {
            String header = lines.get(i);
            if (!header.startsWith("  T [degC]")) {
                continue;
            }
            tables++;
            int result = header.indexOf(" result") + 1;
            for (int j = i + 1; j < lines.size() && !lines.get(j).isBlank() && !lines.get(j).startsWith("  at "); j++) {
                String row = lines.get(j);
                assertTrue(row.contains(deep.toString()), "the row names the long path: " + row);
                String verdict = row.substring(result, result + 4);
                assertTrue(verdict.equals("pass") || verdict.equals("FAIL"),
                        "the result column is out of line under a 120-character path:\n" + header + "\n" + row);
            }
        }
        assertEquals(5, tables, "forward, breakdown, C-V, recovery and leakage tables: " + run.out());
    }
}
