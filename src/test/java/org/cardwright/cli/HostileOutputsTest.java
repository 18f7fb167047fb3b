package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;
import org.cardwright.testsupport.TestCopies;

/**
 * Issue 10, lost outputs: an output path that leads (after symbolic links) to an input of the same command or to a
 * library's own card is refused before anything is written, with exit 6, and one that leads to another output of the
 * same command with exit 2 (one file named twice); one line naming both, whether or not {@code --force} is given;
 * the inputs keep their bytes.
 */
class HostileOutputsTest {

    private static Path data(Path dir) throws IOException {
        Path d = dir.resolve("data.csv");
        Files.copy(Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv"), d);
        return d;
    }

    /** Exit 6, one line holding {@code fragment}, no stack trace; every file under {@code dir} as it was. */
    private static void refused(CliRun run, String fragment, Path dir, Map<String, byte[]> before) throws IOException {
        refused(run, ExitCodes.OUTPUT_REFUSED, fragment, dir, before);
    }

    /** Exit {@code code} (6 for an input, 2 for one file named twice), as {@link #refused(CliRun, String, Path, Map)}. */
    private static void refused(CliRun run, int code, String fragment, Path dir, Map<String, byte[]> before) throws IOException {
        assertEquals(code, run.exitCode(), run.describe());
        assertEquals(1, run.errLines().size(), run.describe());
        assertTrue(run.errLines().get(0).startsWith("cardwright: ") && run.err().contains(fragment),
                "says '" + fragment + "': " + run.describe());
        assertFalse(run.err().contains("\tat "), run.describe());
        Map<String, byte[]> after = snapshot(dir);
        assertEquals(before.keySet(), after.keySet(), "no file added or removed");
        before.forEach((k, v) -> assertArrayEquals(v, after.get(k), "changed: " + k));
    }

    @Test
    void fitRefusesJsonOverItsOwnCard() throws IOException {
        Path dir = Simulators.tempDir("hostile-out-fit-json-card");
        Path data = data(dir);
        Map<String, byte[]> before = snapshot(dir);
        CliRun run = CliRun.of("fit", data.toString(), "--name", "A", "--dialect", "ngspice", "--out", dir.resolve("o2").toString(),
                "--json", dir.resolve("o2/A.ngspice.lib").toString());
        refused(run, ExitCodes.USAGE, "the ngspice card and --json name the same file", dir, before);
    }

    @Test
    void fitRefusesJsonOverItsDataEvenWithForce() throws IOException {
        Path dir = Simulators.tempDir("hostile-out-fit-json-data");
        Path data = data(dir);
        Map<String, byte[]> before = snapshot(dir);
        CliRun run = CliRun.of("fit", data.toString(), "--name", "A", "--out", dir.resolve("o").toString(),
                "--json", data.toString(), "--force");
        refused(run, "--json would overwrite data file " + data, dir, before);
    }

    @Test
    void fitRefusesACardPathThatIsALinkToItsData() throws IOException {
        Path dir = Simulators.tempDir("hostile-out-fit-link");
        Path data = data(dir);
        Path out = Files.createDirectories(dir.resolve("o"));
        Files.createSymbolicLink(out.resolve("A.ngspice.lib"), data);
        Map<String, byte[]> before = snapshot(dir);
        CliRun run = CliRun.of("fit", data.toString(), "--name", "A", "--dialect", "ngspice", "--out", out.toString(), "--force");
        refused(run, "the ngspice card would overwrite data file", dir, before);
    }

    @Test
    void verifyRefusesJsonOverItsDataOrCardEvenWithForce() throws IOException {
        Path dir = Simulators.tempDir("hostile-out-verify");
        Path data = data(dir);
        Path card = dir.resolve("SW1.ngspice.lib");
        Files.copy(Simulators.projectDir().resolve("fixtures/library/switching/SW1.ngspice.lib"), card);
        Map<String, byte[]> before = snapshot(dir);
        refused(CliRun.of("verify", card.toString(), data.toString(), "--json", data.toString(), "--force"),
                "--json would overwrite data file", dir, before);
        refused(CliRun.of("verify", card.toString(), data.toString(), "--json", card.toString(), "--force"),
                "--json would overwrite the card", dir, before);
        refused(CliRun.of("verify", card.toString(), data.toString(), "--html", dir.resolve("./data.csv").toString(), "--force"),
                "--html would overwrite data file", dir, before);
        Path hardLink = Files.createLink(dir.resolve("result.json"), data);
        Map<String, byte[]> withLink = snapshot(dir);
        refused(CliRun.of("verify", card.toString(), data.toString(), "--json", hardLink.toString(), "--force"),
                "--json would overwrite data file", dir, withLink);
        Files.delete(hardLink);
        Path report = dir.resolve("report.out");
        refused(CliRun.of("verify", card.toString(), data.toString(), "--json", report.toString(), "--html", report.toString()),
                ExitCodes.USAGE, "--json and --html name the same file", dir, before);
    }

    @Test
    void tweakNeverWritesIntoTheLibraryThroughALinkEvenWithForce() throws IOException {
        Path dir = Simulators.tempDir("hostile-out-tweak");
        Path lib = dir.resolve("lib");
        TestCopies.copyTree(Simulators.projectDir().resolve("fixtures/library/rectifiers"), lib);
        Path link = Files.createSymbolicLink(dir.resolve("elsewhere"), lib.resolve("cards"));
        Map<String, byte[]> before = snapshot(dir);
        CliRun run = CliRun.of("tweak", lib.resolve("RB4.device.yaml").toString(), "--set", "RS=+10%", "--render-only",
                "--out", link.toString(), "--force");
        refused(run, "is the library's card folder", dir, before);
        // a folder of its own that holds a link to one library card: that card is protected too
        Path own = Files.createDirectories(dir.resolve("own"));
        Files.createSymbolicLink(own.resolve("RB4.ngspice.lib"), lib.resolve("cards/RB4.ngspice.lib"));
        Map<String, byte[]> again = snapshot(dir);
        refused(CliRun.of("tweak", lib.resolve("RB4.device.yaml").toString(), "--set", "RS=+10%", "--render-only",
                "--out", own.toString(), "--force"), "would overwrite the library's own RB4.ngspice.lib", dir, again);
    }

    private static Map<String, byte[]> snapshot(Path dir) throws IOException {
        Map<String, byte[]> out = new TreeMap<>();
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.filter(p -> Files.isRegularFile(p, java.nio.file.LinkOption.NOFOLLOW_LINKS)).toList()) {
                out.put(dir.relativize(p).toString(), Files.readAllBytes(p));
            }
        }
        return out;
    }
}
