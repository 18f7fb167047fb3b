package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/** Help and version: exit 0, on standard output, and the worked examples name files that exist. */
class CliHelpTest {
    private static final Pattern FIXTURE_ARGUMENT = Pattern.compile("fixtures/[\\w./*-]+\\.csv");

    @Test
    void fitHelpShowsUsageAndExamplesWhoseDemoFilesExist() throws IOException {
        assertHelpExamplesResolve(CliRun.of("fit", "--help"), "Usage: cardwright fit");
    }

    @Test
    void verifyHelpShowsUsageAndExamplesWhoseDemoFilesExist() throws IOException {
        assertHelpExamplesResolve(CliRun.of("verify", "--help"), "Usage: cardwright verify");
    }

    @Test
    void topLevelHelpListsTheExitCodes() {
        CliRun run = CliRun.of("--help");
        assertEquals(ExitCodes.OK, run.exitCode(), run.describe());
        for (int code : new int[] {ExitCodes.OK, ExitCodes.NOT_REPRODUCED, ExitCodes.USAGE, ExitCodes.BAD_INPUT,
                ExitCodes.FIT_FAILED, ExitCodes.SIMULATOR_FAILED, ExitCodes.OUTPUT_REFUSED, ExitCodes.INTERNAL_ERROR}) {
            assertTrue(Pattern.compile("(?m)^\\s*" + code + "  \\S").matcher(run.out()).find(), "exit code " + code + " documented");
        }
    }

    @Test
    void versionNamesTheToolAndTheModel() {
        CliRun run = CliRun.of("--version");
        assertEquals(ExitCodes.OK, run.exitCode(), run.describe());
        assertTrue(run.out().startsWith("cardwright "), run.out());
        assertTrue(run.out().contains("ngspice 39"), run.out());
        assertEquals("", run.err());
    }

    @Test
    void noCommandIsAUsageError() {
        CliRun run = CliRun.of();
        assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
        assertTrue(run.err().contains("name a command: fit, verify, build, tweak, compare, check or lot"), run.err());
    }

    /** Every {@code fixtures/...csv} pattern in the examples matches at least one file of the project. */
    private static void assertHelpExamplesResolve(CliRun run, String usage) throws IOException {
        assertEquals(ExitCodes.OK, run.exitCode(), run.describe());
        assertTrue(run.out().startsWith(usage), run.out());
        assertEquals("", run.err());
        Matcher m = FIXTURE_ARGUMENT.matcher(run.out());
        int examples = 0;
        while (m.find()) {
            examples++;
            PathMatcher glob = FileSystems.getDefault().getPathMatcher("glob:" + m.group());
            Path root = Simulators.projectDir();
            try (Stream<Path> files = Files.walk(root.resolve("fixtures"))) {
                assertTrue(files.anyMatch(f -> glob.matches(root.relativize(f))),
                        "the example '" + m.group() + "' in the help matches no file");
            }
        }
        assertTrue(examples > 0, "the help shows at least one example on the demo data");
    }
}
