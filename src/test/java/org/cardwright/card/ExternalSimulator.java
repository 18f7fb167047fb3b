package org.cardwright.card;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * Runs an installed simulator in batch mode for the card tests. Missing simulator: the test is skipped on a
 * workstation and fails when the environment variable CI is "true".
 */
final class ExternalSimulator {
    /** Longest a single batch run may take before the test fails [s]; a card loads in well under a second. */
    private static final long TIMEOUT_SECONDS = 60;

    private final String executable;

    private ExternalSimulator(String executable) {
        this.executable = executable;
    }

    static ExternalSimulator ngspice() {
        return require("ngspice");
    }

    static ExternalSimulator gnucap() {
        return require("gnucap");
    }

    private static ExternalSimulator require(String name) {
        boolean found = isOnPath(name);
        if (!found && "true".equals(System.getenv("CI"))) {
            fail(name + " is not installed, and CI=true requires it");
        }
        Assumptions.assumeTrue(found, name + " is not installed; simulator test skipped outside CI");
        return new ExternalSimulator(name);
    }

    private static boolean isOnPath(String name) {
        String path = System.getenv("PATH");
        if (path == null) {
            return false;
        }
        for (String dir : path.split(File.pathSeparator)) {
            Path candidate = Path.of(dir, name);
            if (Files.isRegularFile(candidate) && Files.isExecutable(candidate)) {
                return true;
            }
        }
        return false;
    }

    /** Runs {@code <executable> -b netlist} in the netlist's folder; returns stdout and stderr together. */
    String runBatch(Path netlist) throws IOException, InterruptedException {
        Path log = netlist.resolveSibling(netlist.getFileName() + ".log");
        Process process = new ProcessBuilder(List.of(executable, "-b", netlist.getFileName().toString()))
                .directory(netlist.getParent().toFile())
                .redirectErrorStream(true)
                .redirectOutput(log.toFile())
                .start();
        boolean finished = process.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS);
        if (!finished) {
            process.destroyForcibly();
            fail(executable + " did not finish within " + TIMEOUT_SECONDS + " s on " + netlist);
        }
        String output = Files.readString(log, StandardCharsets.UTF_8);
        assertTrue(process.exitValue() == 0,
                () -> executable + " exited with " + process.exitValue() + " on " + netlist + ":\n" + output);
        return output;
    }

    /** Fails when the output holds any of {@code words} (compared without letter case). */
    static void assertNoneOf(String output, List<String> words, String context) {
        String lower = output.toLowerCase(Locale.ROOT);
        for (String w : words) {
            assertFalse(lower.contains(w.toLowerCase(Locale.ROOT)),
                    () -> context + ": simulator output contains '" + w + "':\n" + output);
        }
    }
}
