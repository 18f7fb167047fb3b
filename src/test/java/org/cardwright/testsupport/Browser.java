package org.cardwright.testsupport;

import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * A headless browser for the tests of the evidence page: Debian's chromium, found through CARDWRIGHT_CHROMIUM or
 * on the PATH (chromium, chromium-browser). Like {@link Simulators}: a test that needs it is skipped, with the reason
 * printed, on a machine without it, and fails when {@code CI=true} (.ci/run installs it).
 */
public final class Browser {
    /** A page render that takes longer than this has hung [s]. */
    private static final long TIME_LIMIT_SECONDS = 120;

    private final Path executable;
    private final Path profile;

    private Browser(Path executable, Path profile) {
        this.executable = executable;
        this.profile = profile;
    }

    /** The browser; skips the test (or fails it under CI=true) when there is none. */
    public static Browser require() {
        Optional<Path> found = locate();
        if (found.isPresent()) {
            return new Browser(found.get(), Simulators.tempDir("chromium-profile"));
        }
        String reason = "chromium is not installed (not on the PATH and CARDWRIGHT_CHROMIUM not set to an executable)";
        if ("true".equals(System.getenv("CI"))) {
            fail("CI=true but " + reason + ": .ci/run must install it");
        }
        System.out.println("skipped: " + reason + "; browser test of the evidence page not run");
        Assumptions.abort(reason + "; browser test skipped");
        throw new AssertionError("unreachable: Assumptions.abort always throws");
    }

    private static Optional<Path> locate() {
        String configured = System.getenv("CARDWRIGHT_CHROMIUM");
        if (configured != null && !configured.isBlank()) {
            Path p = Path.of(configured);
            return Files.isExecutable(p) ? Optional.of(p) : Optional.empty();
        }
        String path = System.getenv("PATH");
        for (String dir : path == null ? new String[0] : path.split(java.io.File.pathSeparator)) {
            for (String name : List.of("chromium", "chromium-browser")) {
                Path p = Path.of(dir.isEmpty() ? "." : dir, name);
                if (Files.isExecutable(p) && !Files.isDirectory(p)) {
                    return Optional.of(p);
                }
            }
        }
        return Optional.empty();
    }

    /** The DOM after the page has loaded (and its scripts have run), in a window {@code width} x {@code height}. */
    public String dumpDom(Path page, int width, int height) throws IOException, InterruptedException {
        return run(page, width, height, "--dump-dom");
    }

    /** A PNG of the window {@code width} x {@code height} showing the page from its top. */
    public void screenshot(Path page, int width, int height, Path png) throws IOException, InterruptedException {
        Files.deleteIfExists(png);
        run(page, width, height, "--screenshot=" + png.toAbsolutePath());
        if (!Files.isRegularFile(png)) {
            fail("chromium wrote no screenshot " + png);
        }
    }

    private String run(Path page, int width, int height, String what) throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of(executable.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--hide-scrollbars", "--no-first-run", "--disable-extensions", "--force-device-scale-factor=1",
                "--user-data-dir=" + profile.toAbsolutePath(), "--window-size=" + width + "," + height, what,
                page.toAbsolutePath().toUri().toString()));
        Path out = Files.createTempFile(profile, "out", ".txt");
        Path err = Files.createTempFile(profile, "err", ".txt");
        Process p = new ProcessBuilder(command).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        if (!p.waitFor(TIME_LIMIT_SECONDS, TimeUnit.SECONDS)) {
            p.destroyForcibly();
            fail("chromium did not finish within " + TIME_LIMIT_SECONDS + " s on " + page);
        }
        if (p.exitValue() != 0) {
            fail("chromium exited with " + p.exitValue() + " on " + page + ": " + Files.readString(err, StandardCharsets.UTF_8));
        }
        return Files.readString(out, StandardCharsets.UTF_8);
    }
}
