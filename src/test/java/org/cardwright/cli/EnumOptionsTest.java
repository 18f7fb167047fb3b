package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "enum-typed options instead of hand mapping": --verdict (verify, check) and --self-heating (fit) are read
 * by picocli through the enum's own names, in any case; an unknown name is a usage error (exit 2) whose first line
 * names the option, the value and the valid names.
 */
class EnumOptionsTest {
    private static final Path DEMO = Simulators.projectDir().resolve("fixtures/demo");

    @Test
    void unknownNamesAreUsageErrorsListingTheValidOnes() {
        String card = DEMO.resolve("generating-card.lib").toString();
        String data = DEMO.resolve("ks1-forward-25C.csv").toString();
        for (List<String> args : List.of(
                List.of("verify", card, data, "--verdict", "loose"),
                List.of("check", DEMO.toString(), "--verdict", "loose"),
                List.of("fit", data, "--name", "X", "--self-heating", "ignore"))) {
            CliRun r = CliRun.of(args.toArray(String[]::new));
            assertEquals(ExitCodes.USAGE, r.exitCode(), r.describe());
            String first = r.errLines().get(0);
            String bad = args.get(args.size() - 1);
            assertTrue(first.contains(args.get(args.size() - 2)) && first.contains("'" + bad + "'"), r.describe());
            assertTrue(first.contains(bad.equals("ignore") ? "fit, exclude" : "noise, fixed"), r.describe());
        }
    }

    @Test
    void namesAreReadInAnyCase() {
        String card = DEMO.resolve("generating-card.lib").toString();
        String data = DEMO.resolve("ks1-forward-25C.csv").toString();
        CliRun upper = CliRun.of("verify", card, data, "--verdict", "FIXED");
        CliRun lower = CliRun.of("verify", card, data, "--verdict", "fixed");
        assertEquals(lower.exitCode(), upper.exitCode(), upper.describe());
        assertEquals(lower.out(), upper.out());
        assertTrue(upper.exitCode() == ExitCodes.OK || upper.exitCode() == ExitCodes.NOT_REPRODUCED, upper.describe());
    }
}
