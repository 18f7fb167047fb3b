package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;
import org.cardwright.testsupport.TestCopies;

/**
 * Issue 10, libraries stay inside their root: every case in fixtures/hostile/library, run through the real command
 * line, gives the exit code and the one-line message its case.txt states, no stack trace, never shows the secret
 * kept outside the root (not in the output, not in the JUnit report), and writes nothing outside the root.
 */
class HostileLibraryTest {
    /** Kept in a file outside every library root; no output may show it. */
    private static final String SECRET = "SECRET-91d4-not-for-messages";
    /** The corpus had 20 cases when this test was written; fewer means some went missing. */
    private static final int MIN_CASES = 20;

    @TestFactory
    Stream<DynamicTest> everyHostileLibraryIsRefusedWithItsOwnMessage() throws IOException {
        Path corpus = Simulators.projectDir().resolve("fixtures/hostile/library");
        List<Path> cases;
        try (Stream<Path> s = Files.list(corpus)) {
            cases = s.filter(Files::isDirectory).sorted().toList();
        }
        assertTrue(cases.size() >= MIN_CASES, "only " + cases.size() + " cases in " + corpus);
        return cases.stream().map(c -> DynamicTest.dynamicTest(c.getFileName().toString(), () -> run(c)));
    }

    private static void run(Path caseFolder) throws IOException {
        Map<String, List<String>> spec = spec(caseFolder.resolve("case.txt"));
        Path work = Simulators.tempDir("hostile-library-" + caseFolder.getFileName());
        Path root = Files.createDirectories(work.resolve("a/lib"));
        Path outside = Files.createDirectories(work.resolve("outside"));
        Files.writeString(outside.resolve("secret.csv"), "# " + SECRET + "\nTOKEN=" + SECRET + "\n", StandardCharsets.UTF_8);
        Files.writeString(outside.resolve("outside.device.yaml"), "# " + SECRET + "\nmodel: OUT\ndata:\n  - file: secret.csv\n",
                StandardCharsets.UTF_8);
        TestCopies.copyTree(caseFolder, root);
        Files.delete(root.resolve("case.txt"));
        Path good = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        Files.createDirectories(root.resolve("data"));
        Files.copy(good, root.resolve("data/good.csv"));
        for (String link : spec.getOrDefault("link", List.of())) {
            String[] parts = link.split(" -> ");
            Path at = root.resolve(parts[0]);
            Files.createDirectories(at.getParent());
            Files.createSymbolicLink(at, Path.of(parts[1].replace("@OUTSIDE@", outside.toString())));
        }
        for (String dir : spec.getOrDefault("mkdir", List.of())) {
            Files.createDirectories(root.resolve(dir));
        }
        for (String fifo : spec.getOrDefault("mkfifo", List.of())) {
            Process p = new ProcessBuilder("mkfifo", root.resolve(fifo).toString()).inheritIO().start();
            try {
                assertEquals(0, p.waitFor(), "mkfifo " + fifo);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IOException(e);
            }
        }
        for (String copy : spec.getOrDefault("copy", List.of())) {
            Path to = root.resolve(copy);
            Files.createDirectories(to.getParent());
            Files.copy(good, to);
        }
        for (String pad : spec.getOrDefault("pad", List.of())) {
            String[] parts = pad.split(" ");
            writePadded(root.resolve(parts[0]), Long.parseLong(parts[1]));
        }
        Map<String, byte[]> outsideBefore = snapshot(outside);
        Map<String, byte[]> rootBefore = snapshot(root);

        List<String> args = new ArrayList<>(Arrays.asList(
                spec.get("command").get(0).replace("@ROOT@", root.toString()).split(" ")));
        args.add(1, root.toString());
        Path junit = work.resolve("junit.xml");
        if (args.get(0).equals("check") && !args.contains("--junit")) {
            args.add("--junit");
            args.add(junit.toString());
        }
        long start = System.nanoTime();
        CliRun run = CliRun.of(args.toArray(String[]::new));
        double seconds = (System.nanoTime() - start) / 1e9;

        int code = Integer.parseInt(spec.get("expect-exit").get(0));
        String fragment = spec.get("expect").get(0);
        assertEquals(code, run.exitCode(), run.describe());
        // build and the output check say it in one line on standard error (besides the one progress line per
        // finished part that build and check print there); check reports per card on standard output
        List<String> messages = run.errLines().stream()
                .filter(l -> !l.matches("(build|check): \\d+/\\d+ done: .*")).toList();
        assertTrue(messages.size() <= 1, "at most one line on standard error besides progress: " + run.describe());
        assertTrue(run.out().contains(fragment) || run.err().contains(fragment), "says '" + fragment + "': " + run.describe());
        assertFalse(run.err().contains("\tat ") || run.out().contains("\tat "), "no stack trace: " + run.describe());
        assertFalse(run.err().contains(SECRET) || run.out().contains(SECRET), "secret shown: " + run.describe());
        // the environment as /proc/self/environ would show it
        String path = System.getenv("PATH");
        String environ = "PATH=" + (path == null ? "" : path);
        assertFalse(path != null && (run.out().contains(environ) || run.err().contains(environ)), "environment shown");
        if (Files.exists(junit)) {
            String xml = Files.readString(junit, StandardCharsets.UTF_8);
            assertFalse(xml.contains(SECRET), "secret in the JUnit report");
            assertFalse(path != null && xml.contains(environ), "environment in the JUnit report");
        }
        Map<String, byte[]> outsideAfter = snapshot(outside);
        assertEquals(outsideBefore.keySet(), outsideAfter.keySet(), "nothing written outside the root");
        outsideBefore.forEach((k, v) -> assertArrayEquals(v, outsideAfter.get(k), "outside file changed: " + k));
        assertEquals(Files.exists(junit) ? List.of("a", "junit.xml", "outside") : List.of("a", "outside"), listing(work),
                "nothing new beside the root");
        assertFalse(Files.exists(work.resolve("a/outside")), "nothing written beside the root");
        Map<String, byte[]> rootAfter = snapshot(root);
        rootBefore.forEach((k, v) -> assertArrayEquals(v, rootAfter.get(k), "an input of the library changed: " + k));
        assertTrue(seconds < 60, "took " + seconds + " s");
    }

    /** The case description: key to values, in order; '#' lines are comments. */
    private static Map<String, List<String>> spec(Path file) throws IOException {
        Map<String, List<String>> out = new TreeMap<>();
        for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
            if (line.isBlank() || line.startsWith("#")) {
                continue;
            }
            int colon = line.indexOf(':');
            out.computeIfAbsent(line.substring(0, colon).strip(), k -> new ArrayList<>()).add(line.substring(colon + 1).strip());
        }
        assertTrue(out.containsKey("command") && out.containsKey("expect-exit") && out.containsKey("expect"), file + ": " + out);
        return out;
    }

    private static void writePadded(Path file, long bytes) throws IOException {
        byte[] line = ("# padding " + "x".repeat(88) + "\n").getBytes(StandardCharsets.UTF_8);
        try (OutputStream o = Files.newOutputStream(file)) {
            o.write("model: BIG\ndata:\n  - file: data/good.csv\n".getBytes(StandardCharsets.UTF_8));
            for (long n = 0; n < bytes; n += line.length) {
                o.write(line);
            }
        }
    }

    /** Every regular file below {@code dir} (not following links) with its bytes. */
    private static Map<String, byte[]> snapshot(Path dir) throws IOException {
        Map<String, byte[]> out = new TreeMap<>();
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.filter(p -> Files.isRegularFile(p, java.nio.file.LinkOption.NOFOLLOW_LINKS)).toList()) {
                out.put(dir.relativize(p).toString(), Files.readAllBytes(p));
            }
        }
        return out;
    }

    private static List<String> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }
}
