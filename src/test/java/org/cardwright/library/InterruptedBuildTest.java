package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * A build killed while it writes (the child JVM gets SIGKILL) leaves every card either as it was or as the
 * finished build writes it, never truncated, and the next build completes without taking the half-done work for
 * a hand edit.
 */
class InterruptedBuildTest {
    private static final int PARTS = 6;
    /** Longest a child build may take before the test gives up on it [s]. */
    private static final long CHILD_TIMEOUT_SECONDS = 120;

    /** A tree built with 7 digits, then switched to 8 so that every card changes; and the expected new cards. */
    private record Setup(Path tree, Map<String, byte[]> oldCards, Map<String, byte[]> newCards) {
    }

    private static Setup setup(String name) throws Exception {
        Path tree = Simulators.tempDir(name);
        for (SyntheticParts.Spec s : SyntheticParts.twenty().subList(0, PARTS)) {
            SyntheticParts.write(tree, s);
        }
        new LibraryBuilder(false).build(tree, line -> { });
        Map<String, byte[]> oldCards = Trees.contents(tree, ".lib");
        for (Path device : LibraryPaths.deviceFiles(tree)) {
            Files.writeString(device, Files.readString(device) + "digits: 8\n", StandardCharsets.UTF_8);
        }
        Path reference = Simulators.tempDir(name + "-reference");
        Trees.copy(tree, reference);
        new LibraryBuilder(false).build(reference, line -> { });
        Map<String, byte[]> newCards = Trees.contents(reference, ".lib");
        for (String k : oldCards.keySet()) {
            assertTrue(!java.util.Arrays.equals(oldCards.get(k), newCards.get(k)), k + " must change for the test to mean anything");
        }
        return new Setup(tree, oldCards, newCards);
    }

    /** Starts a JVM whose temporary folders (left behind when it is killed) stay in the test's own folder. */
    private static Process child(Path tree, String mainClass, String... args) throws Exception {
        String classpath = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        Path tmp = Files.createDirectories(tree.resolveSibling(tree.getFileName() + "-tmp"));
        List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-Djava.io.tmpdir=" + tmp, "-cp", classpath, mainClass));
        command.addAll(List.of(args));
        return new ProcessBuilder(command).redirectErrorStream(true).start();
    }

    private static void assertEveryCardOldOrNew(Setup s) throws Exception {
        Map<String, byte[]> now = Trees.contents(s.tree(), ".lib");
        assertEquals(s.oldCards().keySet(), now.keySet());
        for (Map.Entry<String, byte[]> e : now.entrySet()) {
            boolean old = java.util.Arrays.equals(e.getValue(), s.oldCards().get(e.getKey()));
            boolean fresh = java.util.Arrays.equals(e.getValue(), s.newCards().get(e.getKey()));
            assertTrue(old || fresh, e.getKey() + " is neither the old nor the new card: " + e.getValue().length + " bytes");
        }
    }

    private static void assertNextBuildFinishes(Setup s) throws Exception {
        List<PartOutcome> again = new LibraryBuilder(false).build(s.tree(), line -> { });
        for (PartOutcome o : again) {
            assertTrue(o.ok(), o.device() + ": " + o.message());
        }
        Map<String, byte[]> now = Trees.contents(s.tree(), ".lib");
        for (String k : now.keySet()) {
            org.junit.jupiter.api.Assertions.assertArrayEquals(s.newCards().get(k), now.get(k), k);
        }
    }

    @Test
    void killedInTheMiddleOfWritingACard() throws Exception {
        Setup s = setup("library-killed-mid-write");
        Process p = child(s.tree(), InterruptedBuildChild.class.getName(), s.tree().toString(), "3");
        boolean sawMidWrite = false;
        try (BufferedReader r = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(CHILD_TIMEOUT_SECONDS);
            String line;
            while (System.nanoTime() < deadline && (line = r.readLine()) != null) {
                if (line.startsWith("MID-WRITE")) {
                    sawMidWrite = true;
                    p.destroyForcibly();
                    break;
                }
                if (line.equals("DONE")) {
                    break;
                }
            }
        } finally {
            p.destroyForcibly();
            p.waitFor(CHILD_TIMEOUT_SECONDS, TimeUnit.SECONDS);
        }
        if (!sawMidWrite) {
            fail("the child build never reached its third card write");
        }
        Map<String, byte[]> now = Trees.contents(s.tree(), ".lib");
        long fresh = now.entrySet().stream().filter(e -> java.util.Arrays.equals(e.getValue(), s.newCards().get(e.getKey()))).count();
        assertEquals(2, fresh, "two cards were replaced before the kill");
        assertEveryCardOldOrNew(s);
        assertNextBuildFinishes(s);
    }

    @Test
    void killedAtRandomMomentsOfARealBuild() throws Exception {
        Setup s = setup("library-killed-random");
        Random random = new Random(4242);
        for (int round = 0; round < 4; round++) {
            Process p = child(s.tree(), "org.cardwright.cli.Main", "build", s.tree().toString());
            Thread.sleep(300 + random.nextInt(2500));
            p.destroyForcibly();
            p.waitFor(CHILD_TIMEOUT_SECONDS, TimeUnit.SECONDS);
            assertEveryCardOldOrNew(s);
        }
        assertNextBuildFinishes(s);
    }
}
