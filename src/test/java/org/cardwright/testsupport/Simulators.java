package org.cardwright.testsupport;

import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.cardwright.sim.process.SimulatorProcess;
import org.junit.jupiter.api.Assumptions;

/**
 * Test access to the external simulators and to the project's folders.
 *
 * <p>A simulator test calls {@link #requireNgspice()} or {@link #requireGnucap()}. When the simulator is
 * missing the test is skipped with the reason on a developer's machine, but fails when the environment
 * variable {@code CI} is {@code true}: the CI script must install the simulators, so a missing one there is a
 * broken build, never a silently skipped check.
 */
public final class Simulators {
    private Simulators() {
    }

    /** Path of the ngspice executable; skips the test (or fails it under CI=true) when there is none. */
    public static Path requireNgspice() {
        return require(SimulatorProcess.Kind.NGSPICE);
    }

    /** Path of the gnucap executable; skips the test (or fails it under CI=true) when there is none. */
    public static Path requireGnucap() {
        return require(SimulatorProcess.Kind.GNUCAP);
    }

    private static Path require(SimulatorProcess.Kind kind) {
        var found = SimulatorProcess.locate(kind);
        if (found.isPresent()) {
            return found.get();
        }
        String name = kind.command();
        if ("true".equals(System.getenv("CI"))) {
            fail("CI=true but " + name + " is not installed: .ci/run must install it");
        }
        Assumptions.abort(name + " is not installed (not on the PATH and " + kind.environmentVariable()
                + " not set to an executable); simulator test skipped");
        throw new AssertionError("unreachable: Assumptions.abort always throws");
    }

    /** The project's root folder: CARDWRIGHT_PROJECT_DIR (set by surefire in the pom), else the working folder. */
    public static Path projectDir() {
        String configured = System.getenv("CARDWRIGHT_PROJECT_DIR");
        Path dir = configured != null && !configured.isBlank()
                ? Path.of(configured)
                : Path.of("").toAbsolutePath();
        return dir.toAbsolutePath().normalize();
    }

    /**
     * A fresh, empty folder {@code target/test-work/NAME} under the project, for a test's netlists and outputs.
     * Anything left there by an earlier run is deleted first.
     */
    public static Path tempDir(String name) {
        if (name == null || name.isBlank() || name.contains("..") || name.contains("/") || name.contains("\\")) {
            throw new IllegalArgumentException("test folder name must be a plain name, got '" + name + "'");
        }
        Path dir = projectDir().resolve("target").resolve("test-work").resolve(name);
        try {
            if (Files.exists(dir)) {
                try (var paths = Files.walk(dir)) {
                    for (Path path : paths.sorted(java.util.Comparator.reverseOrder()).toList()) {
                        Files.delete(path);
                    }
                }
            }
            return Files.createDirectories(dir);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot prepare test folder " + dir + ": " + e.getMessage(), e);
        }
    }
}
