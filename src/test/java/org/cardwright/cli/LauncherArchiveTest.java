package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The launcher {@code ./cardwright} makes a command's start-up archive only from a run that does the command's work:
 * help, the version or a bare launcher load a fraction of the classes, and an archive made from them would be reused by
 * every later run. Checked with a stand-in JVM (a shell script with a {@code release} file, as a JVM's home has) that
 * logs the options it was started with and writes the files a real JVM would, so no JVM version is needed.
 */
class LauncherArchiveTest {
    /** Longest one launcher run with the stand-in JVM may take [s]. */
    private static final long RUN_SECONDS = 30;

    /** A stand-in JVM home of feature version {@code feature}: bin/java logs its arguments, one run per line. */
    private static Path fakeJvm(Path dir, int feature) throws IOException {
        Path home = Files.createDirectories(dir.resolve("jvm" + feature));
        Files.writeString(home.resolve("release"), "JAVA_VERSION=\"" + feature + ".0.1\"\nJAVA_RUNTIME_VERSION=\"" + feature
                + ".0.1+1\"\n", StandardCharsets.UTF_8);
        Path java = Files.createDirectories(home.resolve("bin")).resolve("java");
        Files.writeString(java, String.join("\n",
                "#!/bin/sh",
                "echo \"$*\" >> \"$FAKE_LOG\"",
                "for a in \"$@\"; do",
                "  case \"$a\" in",
                "    -XX:AOTConfiguration=*) conf=\"${a#-XX:AOTConfiguration=}\" ;;",
                "    -XX:AOTCache=*) cache=\"${a#-XX:AOTCache=}\" ;;",
                "    -XX:AOTMode=*) mode=\"${a#-XX:AOTMode=}\" ;;",
                "    -XX:ArchiveClassesAtExit=*) echo archive > \"${a#-XX:ArchiveClassesAtExit=}\" ;;",
                "  esac",
                "done",
                "[ \"$mode\" = record ] && echo classes > \"$conf\"",
                "[ \"$mode\" = create ] && echo cache > \"$cache\"",
                "exit 0",
                ""), StandardCharsets.UTF_8);
        Files.setPosixFilePermissions(java, PosixFilePermissions.fromString("rwx------"));
        return java;
    }

    /** Runs the shipped launcher with {@code args}; returns the stand-in JVM's log lines of this run. */
    private static List<String> launch(Path dir, Path java, String... args) throws Exception {
        Path log = dir.resolve("log.txt");
        Files.deleteIfExists(log);
        List<String> command = new ArrayList<>(List.of("bash", Simulators.projectDir().resolve("cardwright").toString()));
        command.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(command).directory(dir.toFile()).redirectErrorStream(true)
                .redirectOutput(dir.resolve("out.txt").toFile());
        pb.environment().put("CARDWRIGHT_JAVA", java.toString());
        pb.environment().put("CARDWRIGHT_JAR", dir.resolve("cardwright.jar").toString());
        pb.environment().put("CARDWRIGHT_CACHE_DIR", dir.resolve("cache").toString());
        pb.environment().remove("CARDWRIGHT_NO_CACHE");
        pb.environment().put("FAKE_LOG", log.toString());
        Process p = pb.start();
        assertTrue(p.waitFor(RUN_SECONDS, TimeUnit.SECONDS), "launcher timed out: " + String.join(" ", args));
        assertEquals(0, p.exitValue(), Files.readString(dir.resolve("out.txt")));
        return Files.exists(log) ? Files.readAllLines(log) : List.of();
    }

    private static List<String> archives(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir.resolve("cache"))) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void java25MakesTheCacheFromAWorkingRunOnly() throws Exception {
        Path dir = Simulators.tempDir("launcher-archive-25");
        Files.writeString(dir.resolve("cardwright.jar"), "stand-in", StandardCharsets.UTF_8);
        Path java = fakeJvm(dir, 25);
        for (String[] args : List.of(new String[] {"--version"}, new String[] {"fit", "--help"},
                new String[] {"fit", "-h", "a.csv"}, new String[] {"help", "fit"}, new String[] {"build", "-V"})) {
            List<String> runs = launch(dir, java, args);
            assertEquals(1, runs.size(), String.join(" ", args) + ": " + runs);
            assertFalse(runs.get(0).contains("-XX:AOTMode"), String.join(" ", args) + ": " + runs);
            assertEquals(List.of(), archives(dir), String.join(" ", args));
        }
        List<String> runs = launch(dir, java, "fit", "a.csv", "--name", "X");
        assertEquals(2, runs.size(), "a recording run and the cache's assembly: " + runs);
        assertTrue(runs.get(0).contains("-XX:AOTMode=record"), runs.get(0));
        assertTrue(runs.get(1).contains("-XX:AOTMode=create"), runs.get(1));
        List<String> made = archives(dir);
        assertEquals(1, made.size(), made.toString());
        assertTrue(made.get(0).startsWith("cardwright-fit-java25.0.1_1-") && made.get(0).endsWith(".aot"), made.toString());
        // once made, help runs use it too (they do not replace it)
        List<String> help = launch(dir, java, "fit", "--help");
        assertTrue(help.get(0).contains("-XX:AOTCache=") && !help.get(0).contains("-XX:AOTMode"), help.toString());
        assertEquals(made, archives(dir));
    }

    @Test
    void java17MakesTheArchiveFromAWorkingRunOnly() throws Exception {
        Path dir = Simulators.tempDir("launcher-archive-17");
        Files.writeString(dir.resolve("cardwright.jar"), "stand-in", StandardCharsets.UTF_8);
        Path java = fakeJvm(dir, 17);
        List<String> version = launch(dir, java, "--version");
        assertFalse(version.get(0).contains("ArchiveClassesAtExit"), version.toString());
        List<String> help = launch(dir, java, "verify", "--help");
        assertFalse(help.get(0).contains("ArchiveClassesAtExit"), help.toString());
        assertEquals(List.of(), archives(dir));
        List<String> work = launch(dir, java, "verify", "card.lib", "data.csv");
        assertTrue(work.get(0).contains("-XX:ArchiveClassesAtExit="), work.toString());
        List<String> made = archives(dir);
        assertEquals(1, made.size(), made.toString());
        assertTrue(made.get(0).startsWith("cardwright-verify-java17.0.1_1-") && made.get(0).endsWith(".jsa"), made.toString());
        List<String> again = launch(dir, java, "verify", "--help");
        assertTrue(again.get(0).contains("-XX:SharedArchiveFile="), again.toString());
    }
}
