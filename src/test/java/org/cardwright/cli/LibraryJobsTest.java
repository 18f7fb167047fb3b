package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import org.cardwright.testsupport.Simulators;
import org.cardwright.testsupport.TestCopies;
import org.junit.jupiter.api.Test;

/**
 * {@code --jobs} of {@code build} and {@code check} on the invented example library: the same standard output
 * for one job and for several, one progress line per part on standard error, and a usage error (exit 2) for a
 * job count below one.
 */
class LibraryJobsTest {

    private static Path exampleLibrary(String name) throws Exception {
        Path from = Simulators.projectDir().resolve("fixtures/library");
        Path to = Simulators.tempDir(name);
        TestCopies.copyTree(from, to, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.COPY_ATTRIBUTES);
        return to;
    }

    @Test
    void buildAndCheckPrintTheSameForOneJobAndForSeveral() throws Exception {
        Path root = exampleLibrary("library-jobs");
        CliRun one = CliRun.of("build", root.toString(), "--jobs", "1");
        CliRun three = CliRun.of("build", root.toString(), "--jobs", "3");
        assertEquals(ExitCodes.OK, one.exitCode(), one.describe());
        assertEquals(one.out(), three.out());
        List<String> progress = three.errLines();
        assertEquals(3, progress.size(), three.describe());
        progress.forEach(l -> assertTrue(l.matches("build: [1-3]/3 done: \\S+\\.device\\.yaml: up to date"), l));

        CliRun checkOne = CliRun.of("check", root.toString(), "--jobs", "1");
        CliRun checkTwo = CliRun.of("check", root.toString(), "--jobs", "2");
        assertEquals(ExitCodes.OK, checkOne.exitCode(), checkOne.describe());
        assertEquals(checkOne.out(), checkTwo.out());
        assertEquals(3, checkTwo.errLines().size(), checkTwo.describe());
    }

    @Test
    void fewerThanOneJobIsAUsageError() throws Exception {
        Path root = exampleLibrary("library-jobs-zero");
        for (String command : List.of("build", "check")) {
            CliRun r = CliRun.of(command, root.toString(), "--jobs", "0");
            assertEquals(ExitCodes.USAGE, r.exitCode(), r.describe());
            assertEquals(List.of("cardwright: --jobs must be at least 1, not 0"), r.errLines());
        }
    }
}
