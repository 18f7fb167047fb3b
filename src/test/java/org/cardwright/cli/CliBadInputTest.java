package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.sim.Bias;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

/**
 * Issue 2, bad input through the command line: every bad-input fixture gives the documented exit code, one line
 * on standard error naming file, line and value, no usage text, and no card, JSON or temporary file in the
 * output folder. Also: output files are never replaced without {@code --force}, and usage errors exit 2.
 */
class CliBadInputTest {
    /** Header line 3 of a data fixture in fixtures/bad (the data package's convention). */
    private static final Pattern DATA_EXPECTED =
            Pattern.compile("# Expected: DataFileException at line (\\d+)(, value '(.*)')?\\.");
    /** Header line 3 of a fit-level fixture in fixtures/bad-fit. */
    private static final Pattern FIT_EXPECTED =
            Pattern.compile("# Expected: exit 4, lines? (\\d+)(?: and (\\d+))?, values? (\\S+?)(?: and (\\S+?))?\\.");
    /**
     * A fit-level error quotes currents in SI with 4 significant digits; a quoted value matches the fixture's
     * when it agrees to 1e-3 relative (4-digit rounding leaves at most 5e-4).
     */
    private static final double QUOTED_VALUE_RELATIVE = 1e-3;
    /** The data package's fixture set had 21 files when this test was written; fewer means fixtures went missing. */
    private static final int MIN_DATA_FIXTURES = 20;
    private static final Pattern NUMBER = Pattern.compile("-?\\d+(?:\\.\\d+)?(?:[eE][-+]?\\d+)?");

    @TestFactory
    Stream<DynamicTest> everyDataFixtureExitsThreeWithOneLineNamingFileLineAndValue() throws IOException {
        List<Path> fixtures = csvFiles(Simulators.projectDir().resolve("fixtures").resolve("bad"));
        assertTrue(fixtures.size() >= MIN_DATA_FIXTURES, "found only " + fixtures.size() + " fixtures in fixtures/bad");
        return fixtures.stream().map(f -> DynamicTest.dynamicTest(f.getFileName().toString(), () -> {
            List<String> head = Files.readAllLines(f, StandardCharsets.ISO_8859_1).subList(0, 3);
            Matcher m = DATA_EXPECTED.matcher(head.get(2));
            assertTrue(m.matches(), f + ": header line 3 does not say where reading fails: " + head.get(2));
            int line = Integer.parseInt(m.group(1));
            String raw = m.group(3);
            // the one fixture about a missing temperature is read, as its header says, without a default one
            boolean withoutTemperature = head.get(1).contains("without a default temperature");
            Path out = Simulators.tempDir("cli-bad-" + stem(f));
            CliRun run = withoutTemperature
                    ? CliRun.of("fit", f.toString(), "--name", "X", "--out", out.toString())
                    : CliRun.of("fit", f.toString(), "--name", "X", "--out", out.toString(), "--temp", "25");

            assertEquals(ExitCodes.BAD_INPUT, run.exitCode(), run.describe());
            String message = oneErrorLine(run);
            assertTrue(message.startsWith("cardwright: " + f + ":" + line + ": "), "file and line: " + message);
            if (raw != null) {
                assertTrue(message.endsWith(" (value '" + raw + "')"), "value '" + raw + "': " + message);
            }
            assertNothingWritten(out);
        }));
    }

    @TestFactory
    Stream<DynamicTest> everyFitLevelFixtureExitsFourWithOneLineNamingFileLineAndValue() throws IOException {
        List<Path> fixtures = csvFiles(Simulators.projectDir().resolve("fixtures").resolve("bad-fit"));
        assertEquals(List.of("narrow-current-span.csv", "reverse-only.csv", "too-few-points.csv"),
                fixtures.stream().map(p -> p.getFileName().toString()).toList());
        return fixtures.stream().map(f -> DynamicTest.dynamicTest(f.getFileName().toString(), () -> {
            List<String> head = Files.readAllLines(f, StandardCharsets.UTF_8).subList(0, 3);
            assertTrue(head.get(0).contains("invented") && head.get(1).startsWith("# Tests: "), f + ": " + head);
            Matcher m = FIT_EXPECTED.matcher(head.get(2));
            assertTrue(m.matches(), f + ": header line 3 does not say where the fit fails: " + head.get(2));
            Path out = Simulators.tempDir("cli-badfit-" + stem(f));
            Path json = out.resolve("X.json");
            CliRun run = CliRun.of("fit", f.toString(), "--name", "X", "--out", out.toString(), "--temp", "25",
                    "--json", json.toString());

            assertEquals(ExitCodes.FIT_FAILED, run.exitCode(), run.describe());
            String message = oneErrorLine(run);
            assertTrue(message.startsWith("cardwright: " + f + ":"), "file: " + message);
            for (int g : new int[] {1, 2}) {
                if (m.group(g) != null) {
                    String n = m.group(g);
                    assertTrue(message.contains(f + ":" + n + ":") || message.contains("line " + n + " ")
                            || message.contains("line " + n + ","), "line " + n + ": " + message);
                }
            }
            for (int g : new int[] {3, 4}) {
                if (m.group(g) != null) {
                    assertQuotesValue(message, Double.parseDouble(m.group(g)));
                }
            }
            assertNothingWritten(out);
        }));
    }

    @Test
    void existingCardIsNotReplacedWithoutForceAndIsWithIt() throws IOException {
        Path data = Simulators.tempDir("cli-overwrite-data");
        List<Path> csv = goodData(data);
        Path out = Simulators.tempDir("cli-overwrite");
        Path card = out.resolve("OW.ngspice.lib");
        byte[] before = "* a card the user wrote by hand; it must survive a fit without --force\n.model OW D(IS=1e-14)\n"
                .getBytes(StandardCharsets.UTF_8);
        Files.write(card, before);

        CliRun refused = CliRun.of("fit", csv.get(0).toString(), csv.get(1).toString(), "--name", "OW",
                "--out", out.toString());
        assertEquals(ExitCodes.OUTPUT_REFUSED, refused.exitCode(), refused.describe());
        String message = oneErrorLine(refused);
        assertTrue(message.contains(card.toString()) && message.contains("--force"), message);
        assertArrayEquals(before, Files.readAllBytes(card), "the existing card must be unchanged byte for byte");
        assertEquals(List.of(card), listing(out), "nothing else written: not even the spice3 card");

        CliRun forced = CliRun.of("fit", csv.get(0).toString(), csv.get(1).toString(), "--name", "OW",
                "--out", out.toString(), "--force");
        assertEquals(ExitCodes.OK, forced.exitCode(), forced.describe());
        String replaced = Files.readString(card, StandardCharsets.UTF_8);
        assertTrue(replaced.startsWith("* model OW: junction diode for ngspice"), replaced);
        assertTrue(replaced.contains(".model OW D("), replaced);
        assertFalse(replaced.contains("by hand"), replaced);
        assertEquals(List.of(card, out.resolve("OW.spice3.lib")), listing(out));
    }

    @Test
    void existingJsonIsNotReplacedWithoutForce() throws IOException {
        Path data = Simulators.tempDir("cli-overwrite-json-data");
        List<Path> csv = goodData(data);
        Path out = Simulators.tempDir("cli-overwrite-json");
        Path json = out.resolve("result.json");
        byte[] before = "{\"kept\": true}\n".getBytes(StandardCharsets.UTF_8);
        Files.write(json, before);

        CliRun refused = CliRun.of("fit", csv.get(0).toString(), csv.get(1).toString(), "--name", "OJ",
                "--out", out.toString(), "--json", json.toString());
        assertEquals(ExitCodes.OUTPUT_REFUSED, refused.exitCode(), refused.describe());
        assertTrue(oneErrorLine(refused).contains(json.toString()), refused.err());
        assertArrayEquals(before, Files.readAllBytes(json));
        assertEquals(List.of(json), listing(out), "no card written when the JSON cannot be");
    }

    @Test
    void brokenUserTemplateForTheSecondDialectLeavesNoCardAtAll() throws IOException {
        Path data = Simulators.tempDir("cli-template-data");
        List<Path> csv = goodData(data);
        Path templates = Simulators.tempDir("cli-template-folder");
        // an unclosed list directive: a FreeMarker syntax error on line 2
        Files.writeString(templates.resolve("spice3.ftl"), "* broken on purpose\n<#list parameters as p>${p.keyword}\n");
        Path out = Simulators.tempDir("cli-template-out");
        CliRun run = CliRun.of("fit", csv.get(0).toString(), csv.get(1).toString(), "--name", "TP",
                "--out", out.toString(), "--templates", templates.toString());
        assertEquals(ExitCodes.BAD_INPUT, run.exitCode(), run.describe());
        assertTrue(oneErrorLine(run).startsWith("cardwright: " + templates.resolve("spice3.ftl") + ":"), run.err());
        assertNothingWritten(out); // the ngspice card rendered first, but nothing is written unless all succeed
    }

    @Test
    void unknownOptionIsAUsageError() throws IOException {
        Path out = Simulators.tempDir("cli-usage-option");
        CliRun run = CliRun.of("fit", "whatever.csv", "--name", "X", "--out", out.toString(), "--colour", "red");
        assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
        assertTrue(run.err().contains("--colour"), run.err());
        assertTrue(run.err().contains("see 'cardwright fit --help'"), "a usage error says where the help is: " + run.err());
        assertNothingWritten(out);
    }

    @Test
    void missingNameIsAUsageError() throws IOException {
        Path out = Simulators.tempDir("cli-usage-name");
        CliRun run = CliRun.of("fit", "whatever.csv", "--out", out.toString());
        assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
        assertTrue(run.err().contains("--name"), run.err());
        assertNothingWritten(out);
    }

    @Test
    void missingDataFileArgumentIsAUsageError() {
        CliRun run = CliRun.of("fit", "--name", "X");
        assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
        assertTrue(run.err().contains("DATA"), run.err());
    }

    @Test
    void unknownDialectAndBadRuleAreUsageErrorsOnOneLine() throws IOException {
        Path data = Simulators.tempDir("cli-usage-values-data");
        List<Path> csv = goodData(data);
        Path out = Simulators.tempDir("cli-usage-values");
        CliRun dialect = CliRun.of("fit", csv.get(0).toString(), "--name", "X", "--out", out.toString(),
                "--dialect", "nosuchsim");
        assertEquals(ExitCodes.USAGE, dialect.exitCode(), dialect.describe());
        assertTrue(oneErrorLine(dialect).contains("nosuchsim"), dialect.err());
        CliRun rule = CliRun.of("fit", csv.get(0).toString(), "--name", "X", "--out", out.toString(),
                "--set", "RS=plenty");
        assertEquals(ExitCodes.USAGE, rule.exitCode(), rule.describe());
        assertTrue(oneErrorLine(rule).contains("plenty"), rule.err());
        assertNothingWritten(out);
    }

    @Test
    void missingDataFileIsBadInputNamingIt() throws IOException {
        Path out = Simulators.tempDir("cli-missing-file");
        Path absent = out.resolve("no-such-sweep.csv");
        CliRun run = CliRun.of("fit", absent.toString(), "--name", "X", "--out", out.toString(), "--temp", "25");
        assertEquals(ExitCodes.BAD_INPUT, run.exitCode(), run.describe());
        assertTrue(oneErrorLine(run).startsWith("cardwright: " + absent + ":0: "), run.err());
        assertNothingWritten(out);
    }

    @Test
    void unknownVerifyEngineIsAUsageError() throws IOException {
        Path data = Simulators.tempDir("cli-usage-engine-data");
        List<Path> csv = goodData(data);
        Path out = Simulators.tempDir("cli-usage-engine");
        CliRun fit = CliRun.of("fit", csv.get(0).toString(), csv.get(1).toString(), "--name", "EN",
                "--out", out.toString(), "--dialect", "ngspice");
        assertEquals(ExitCodes.OK, fit.exitCode(), fit.describe());
        CliRun run = CliRun.of("verify", out.resolve("EN.ngspice.lib").toString(), csv.get(0).toString(),
                "--engine", "abacus");
        assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
        assertTrue(oneErrorLine(run).contains("abacus"), run.err());
    }

    // ---------------------------------------------------------------------------------------------------

    /** Two temperatures of good forward data from the built-in equations (this class tests the command layer). */
    private static List<Path> goodData(Path dir) throws IOException {
        DiodeParameters truth = DiodeParameters.of(Map.of(Param.IS, 4e-15, Param.N, 1.04, Param.RS, 0.7,
                Param.EG, 1.11, Param.XTI, 3.0));
        List<Bias> biases = ForwardData.currentSweeps(new double[] {25, 85}, 1e-9, 0.1, 8);
        return ForwardData.writePerTemperature(dir, "good", truth, biases, ForwardData.simulateBuiltin(truth, biases),
                "Simulated with cardwright's built-in engine");
    }

    /** The run printed exactly one line on standard error, no usage text and nothing on standard output. */
    private static String oneErrorLine(CliRun run) {
        List<String> lines = run.errLines();
        assertEquals(1, lines.size(), "exactly one line on stderr: " + run.describe());
        assertFalse(run.err().contains("Usage:") || run.out().contains("Usage:"), "no usage text: " + run.describe());
        assertEquals("", run.out(), "nothing on stdout after a failure");
        assertFalse(run.err().contains("\tat "), "no stack trace unless asked: " + run.err());
        return lines.get(0);
    }

    /** The message holds a number equal to {@code expected} to the quoting precision. */
    private static void assertQuotesValue(String message, double expected) {
        Matcher n = NUMBER.matcher(message);
        while (n.find()) {
            double v = Double.parseDouble(n.group());
            if (Math.abs(v - expected) <= QUOTED_VALUE_RELATIVE * Math.abs(expected)) {
                return;
            }
        }
        throw new AssertionError("value " + expected + " not quoted in: " + message);
    }

    /** The output folder holds no file at all: no card, no JSON, no temporary or partial file. */
    private static void assertNothingWritten(Path out) throws IOException {
        assertTrue(Files.isDirectory(out), "the test's output folder is still there: " + out);
        assertEquals(List.of(), listing(out), "files left in the output folder");
    }

    private static List<Path> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.sorted().toList();
        }
    }

    private static List<Path> csvFiles(Path folder) throws IOException {
        assertTrue(Files.isDirectory(folder), "fixture folder missing: " + folder);
        List<Path> files = new ArrayList<>();
        try (Stream<Path> s = Files.list(folder)) {
            s.filter(p -> p.getFileName().toString().endsWith(".csv")).sorted().forEach(files::add);
        }
        return files;
    }

    private static String stem(Path f) {
        String n = f.getFileName().toString();
        return n.substring(0, n.length() - ".csv".length());
    }
}
