package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 10, header hint lines: the {@code verify} command a card header suggests is pasted into a POSIX shell
 * ({@code /bin/sh}, with {@code cardwright} standing for a function that prints its arguments). Data files named
 * with {@code ;}, {@code $(...)}, backquotes, a quote and a leading dash must arrive as one argument each, exactly
 * as named, and run nothing (the canaries never appear). Single quotes stop every expansion in a POSIX shell
 * (IEEE Std 1003.1, Shell Command Language, 2.2.2 "Single-Quotes"; recalled).
 */
class VerifyHintQuotingTest {

    @Test
    void pastedHintLinePassesEveryFileNameAsOneWordAndRunsNothing() throws IOException, InterruptedException {
        Path sh = Path.of("/bin/sh");
        if (!Files.isExecutable(sh)) {
            // as Simulators.require...: skipped with its reason on a laptop without one, a failure under CI=true
            org.junit.jupiter.api.Assertions.assertFalse("true".equalsIgnoreCase(System.getenv("CI")), "CI needs /bin/sh");
            org.junit.jupiter.api.Assumptions.abort("needs a POSIX shell at /bin/sh");
        }
        Path dir = Simulators.tempDir("verify-hint-quoting");
        Path good = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        List<String> names = List.of("a;touch canary1;.csv", "$(touch canary2).csv", "`touch canary3`.csv",
                "it's here.csv", "-rf.csv", "~home*.csv");
        List<String> args = new java.util.ArrayList<>(List.of("fit"));
        for (String n : names) {
            Files.copy(good, dir.resolve(n));
            args.add(dir.resolve(n).toString());
        }
        args.addAll(List.of("--name", "Q1", "--dialect", "ngspice", "--out", dir.toString()));
        CliRun run = CliRun.of(args.toArray(String[]::new));
        assertEquals(ExitCodes.OK, run.exitCode(), run.describe());
        String hint = Files.readAllLines(dir.resolve("Q1.ngspice.lib"), StandardCharsets.UTF_8).stream()
                .filter(l -> l.startsWith("* verify, from this card's folder: ")).findFirst().orElseThrow()
                .substring("* verify, from this card's folder: ".length());

        Process p = new ProcessBuilder(sh.toString(), "-c", "cardwright() { for a in \"$@\"; do printf '%s\\n' \"$a\"; done; }\n" + hint)
                .directory(dir.toFile()).redirectErrorStream(true).start();
        assertTrue(p.waitFor(30, TimeUnit.SECONDS), "the shell finished");
        List<String> printed = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).lines().toList();
        assertEquals(0, p.exitValue(), String.join("\n", printed));
        List<String> expected = new java.util.ArrayList<>(List.of("verify", "Q1.ngspice.lib"));
        for (String n : names) {
            expected.add(n.startsWith("-") ? "./" + n : n);
        }
        assertEquals(expected, printed, "hint: " + hint);
        for (String canary : List.of("canary1", "canary2", "canary3")) {
            assertFalse(Files.exists(dir.resolve(canary)), canary + " was created: the hint ran a command");
        }
    }
}
