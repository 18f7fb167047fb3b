package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;

/**
 * Acceptance of the library build on a tree of 20 invented parts generated from the built-in engine with seeded
 * noise: deterministic cards, hash-based rebuilds of only what changed, untouched files, timings.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class LibraryBuildTest {
    private static final FileTime LONG_AGO = FileTime.fromMillis(946_684_800_000L); // 2000-01-01

    private Path root;
    private List<PartOutcome> first;
    private double firstSeconds;

    @BeforeAll
    void buildTwentyParts() throws Exception {
        root = Simulators.tempDir("library-build-20");
        for (SyntheticParts.Spec s : SyntheticParts.twenty()) {
            SyntheticParts.write(root, s);
        }
        long t0 = System.nanoTime();
        first = new LibraryBuilder(false).build(root, line -> { });
        firstSeconds = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "library build, 20 parts from scratch: %.2f s%n", firstSeconds);
    }

    @Test
    void firstBuildFitsEveryPartAndWritesOneCardAndRecordEach() throws Exception {
        assertEquals(20, first.size());
        for (PartOutcome o : first) {
            assertEquals(PartOutcome.Status.BUILT, o.status(), o.message());
        }
        assertEquals(20, Trees.contents(root, ".lib").size());
        assertEquals(20, Trees.contents(root, ".state").size());
    }

    @Test
    void anotherBuildOfTheSameInputsWritesByteIdenticalCards() throws Exception {
        Path again = Simulators.tempDir("library-build-20-again");
        for (SyntheticParts.Spec s : SyntheticParts.twenty()) {
            SyntheticParts.write(again, s);
        }
        new LibraryBuilder(false).build(again, line -> { });
        Map<String, byte[]> a = Trees.contents(root, ".lib");
        Map<String, byte[]> b = Trees.contents(again, ".lib");
        assertEquals(a.keySet(), b.keySet());
        for (String k : a.keySet()) {
            assertArrayEquals(a.get(k), b.get(k), k + " differs between two builds of the same inputs");
        }
        assertEquals(Trees.contents(root, ".state").keySet(), Trees.contents(again, ".state").keySet());
        for (Map.Entry<String, byte[]> e : Trees.contents(root, ".state").entrySet()) {
            assertArrayEquals(e.getValue(), Trees.contents(again, ".state").get(e.getKey()), e.getKey());
        }
    }

    @Test
    void rebuildWithoutChangesFitsNothingAndTouchesNothing() throws Exception {
        Path tree = Simulators.tempDir("library-build-20-noop");
        Trees.copy(root, tree);
        Trees.age(tree, LONG_AGO);
        Map<String, byte[]> before = Trees.contents(tree, "");
        long t0 = System.nanoTime();
        List<PartOutcome> again = new LibraryBuilder(false).build(tree, line -> { });
        double seconds = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "library build, 20 parts, nothing changed: %.3f s%n", seconds);
        again.forEach(o -> assertEquals(PartOutcome.Status.UP_TO_DATE, o.status(), o.device()));
        assertEquals(before.keySet(), Trees.contents(tree, "").keySet(), "no file added or removed");
        Trees.times(tree, "").forEach((k, t) -> assertEquals(LONG_AGO, t, k + " was rewritten"));
    }

    @Test
    void touchingAFileWithoutChangingItRefitsNothing() throws Exception {
        Path tree = Simulators.tempDir("library-build-20-touch");
        Trees.copy(root, tree);
        Path data = tree.resolve("group2/data/tp07-forward-25C.csv");
        Files.setLastModifiedTime(data, FileTime.fromMillis(System.currentTimeMillis()));
        List<PartOutcome> again = new LibraryBuilder(false).build(tree, line -> { });
        again.forEach(o -> assertEquals(PartOutcome.Status.UP_TO_DATE, o.status(), o.device()));
    }

    @Test
    void changingOneDataFileRefitsOnlyThatPart() throws Exception {
        Path tree = Simulators.tempDir("library-build-20-one");
        Trees.copy(root, tree);
        Trees.age(tree, LONG_AGO);
        Path data = tree.resolve("group2/data/tp07-forward-25C.csv");
        List<String> lines = new ArrayList<>(Files.readAllLines(data, StandardCharsets.UTF_8));
        int row = lines.size() - 10;
        String[] cells = lines.get(row).split(",");
        // one reading 0.2 mV higher, as a re-measurement might give
        lines.set(row, String.format(Locale.ROOT, "%.7f,%s", Double.parseDouble(cells[0]) + 2e-4, cells[1]));
        Files.write(data, lines, StandardCharsets.UTF_8);
        Files.setLastModifiedTime(data, LONG_AGO);
        Map<String, byte[]> before = Trees.contents(tree, ".lib");

        List<String> progress = new ArrayList<>();
        long t0 = System.nanoTime();
        List<PartOutcome> again = new LibraryBuilder(false).build(tree, progress::add);
        double seconds = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "library build, 20 parts, one data file changed: %.3f s%n", seconds);

        assertEquals(20, progress.size(), "one progress line per part");
        for (PartOutcome o : again) {
            PartOutcome.Status expected = o.model().equals("TP07") ? PartOutcome.Status.BUILT : PartOutcome.Status.UP_TO_DATE;
            assertEquals(expected, o.status(), o.device() + ": " + o.message());
        }
        Map<String, byte[]> after = Trees.contents(tree, ".lib");
        for (String k : before.keySet()) {
            boolean changed = !java.util.Arrays.equals(before.get(k), after.get(k));
            assertEquals(k.equals("group2/TP07.ngspice.lib"), changed, k);
        }
        Trees.times(tree, ".lib").forEach((k, t) -> assertEquals(k.equals("group2/TP07.ngspice.lib"), !t.equals(LONG_AGO), k));
        assertTrue(seconds < firstSeconds, "refitting one part took " + seconds + " s, the full build " + firstSeconds + " s");
    }

    @Test
    void cardsTheBuildWroteReadBackAndRenderToTheSameBytes() throws Exception {
        for (Map.Entry<String, byte[]> e : Trees.contents(root, ".lib").entrySet()) {
            String text = new String(e.getValue(), StandardCharsets.UTF_8);
            assertEquals(text, RoundTrip.rerender(text, org.cardwright.card.Dialect.NGSPICE, DeviceFile.DEFAULT_DIGITS), e.getKey());
        }
    }
}
