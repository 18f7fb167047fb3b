package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.failure.FailureKind;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 10, truthful exit codes: every failure kind carries the documented code, and extreme but legal data
 * give a data or fit error that names the file, never a usage error or a bare library message. The data are
 * the invented demo sweep with one thing pushed to an extreme.
 */
class ExitCodeMappingTest {
    private static final Path DEMO = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");

    @Test
    void failureKindsCarryTheDocumentedCodes() {
        assertEquals(ExitCodes.USAGE, FailureKind.USAGE.exitCode());
        assertEquals(ExitCodes.BAD_INPUT, FailureKind.BAD_INPUT.exitCode());
        assertEquals(ExitCodes.FIT_FAILED, FailureKind.FIT.exitCode());
        assertEquals(ExitCodes.SIMULATOR_FAILED, FailureKind.SIMULATOR.exitCode());
        assertEquals(ExitCodes.OUTPUT_REFUSED, FailureKind.OUTPUT.exitCode());
    }

    /** The demo rows with the current multiplied and the temperature cell replaced. */
    private static Path variant(Path dir, String name, double currentFactor, String celsius) throws Exception {
        List<String> out = new ArrayList<>();
        for (String line : Files.readAllLines(DEMO)) {
            if (line.startsWith("#") || line.startsWith("V")) {
                out.add(line);
                continue;
            }
            String[] c = line.split(",");
            out.add(c[0] + "," + String.format(Locale.ROOT, "%.6e", Double.parseDouble(c[1]) * currentFactor) + ","
                    + celsius);
        }
        Path f = dir.resolve(name);
        Files.write(f, out);
        return f;
    }

    private static void assertFitErrorNamingFile(Path data, Path dir) {
        Path out = dir.resolve("out-" + data.getFileName());
        CliRun run = CliRun.of("fit", data.toString(), "--name", "X", "--out", out.toString());
        assertEquals(ExitCodes.FIT_FAILED, run.exitCode(), run.describe());
        assertEquals(1, run.errLines().size(), run.describe());
        assertTrue(run.err().contains(data.toString()), run.describe());
        assertFalse(run.err().contains("\tat "), run.describe());
        assertFalse(Files.exists(out.resolve("X.ngspice.lib")), "no partial output");
    }

    @Test
    void fiveThousandDegreesIsAFitErrorNamingTheFile() throws Exception {
        Path dir = Simulators.tempDir("exit-hot");
        assertFitErrorNamingFile(variant(dir, "hot.csv", 1, "5000"), dir);
    }

    @Test
    void currentsTimesTenToTheMinusThirtyAreAFitErrorNamingTheFile() throws Exception {
        Path dir = Simulators.tempDir("exit-tiny");
        assertFitErrorNamingFile(variant(dir, "tiny.csv", 1e-30, "25"), dir);
    }

    @Test
    void largestDoubleInACellIsReadOrRefusedButNeverAUsageError() throws Exception {
        Path dir = Simulators.tempDir("exit-huge");
        List<String> lines = new ArrayList<>(Files.readAllLines(DEMO));
        lines.add("0.99,1.7976931348623157e308,25.0");
        Path f = dir.resolve("huge.csv");
        Files.write(f, lines);
        CliRun run = CliRun.of("fit", f.toString(), "--name", "X", "--out", dir.resolve("o").toString());
        assertTrue(run.exitCode() == ExitCodes.OK || run.exitCode() == ExitCodes.BAD_INPUT
                || run.exitCode() == ExitCodes.FIT_FAILED, run.describe());
        if (run.exitCode() != ExitCodes.OK) {
            assertTrue(run.err().contains(f.toString()), run.describe());
        }
    }

    /**
     * Issue 11, left open after its second round: an IllegalArgumentException or ArithmeticException from deep in a
     * fit read as exit 4, "the data cannot be fitted". What reaches the command line now: the fit's own failure is
     * exit 4 with its message; any other exception is exit 70, an internal error naming its type.
     */
    @Test
    void onlyTheFitsOwnFailureIsExitFourAndABugIsAnInternalErrorNamingItsType() {
        Object[][] cases = {
            {new org.cardwright.fit.FitFailedException("a.csv: the data cannot be fitted: singular matrix"), ExitCodes.FIT_FAILED,
                "cardwright: a.csv: the data cannot be fitted: singular matrix"},
            {new org.cardwright.fit.FitInputException("a.csv:3: only 2 forward points"), ExitCodes.FIT_FAILED,
                "cardwright: a.csv:3: only 2 forward points"},
            {new IllegalArgumentException("index -1"), ExitCodes.INTERNAL_ERROR,
                "cardwright: internal error (IllegalArgumentException): index -1; please report it with the output of --stack-trace"},
            {new ArithmeticException("/ by zero"), ExitCodes.INTERNAL_ERROR,
                "cardwright: internal error (ArithmeticException): / by zero; please report it with the output of --stack-trace"},
        };
        for (Object[] c : cases) {
            java.io.StringWriter err = new java.io.StringWriter();
            picocli.CommandLine commandLine = Main.commandLine("fit");
            commandLine.setErr(new java.io.PrintWriter(err));
            int code = Main.handle((Exception) c[0], commandLine);
            assertEquals(c[1], code, c[0].toString());
            assertEquals(c[2], err.toString().strip(), c[0].toString());
        }
    }

    @Test
    void aWrongOptionValueIsStillAUsageError() {
        CliRun run = CliRun.of("fit", DEMO.toString(), "--name", "X", "--digits", "99", "--out",
                Simulators.tempDir("exit-usage").toString());
        assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
    }
}
