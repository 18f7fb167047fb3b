package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;

/**
 * A library built or checked on several threads gives what the same build or check on one thread gives: the
 * same bytes in every card and build record, and the same lines in the same order. The sequential run is the
 * reference; the parallel run must not differ from it in any byte (the per-part build time in a progress line
 * is a measurement, and an error names the tree's own folder: those two are masked).
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class LibraryParallelTest {
    /** More jobs than the test machine has cores, so that parts really finish out of order. */
    private static final int JOBS = 4;
    private static final FileTime LONG_AGO = FileTime.fromMillis(1_000_000_000_000L);

    private Path sequential;
    private Path parallel;
    private List<String> sequentialLines;
    private List<String> parallelLines;
    private List<PartOutcome> sequentialParts;
    private List<PartOutcome> parallelParts;
    private final List<Integer> finishedCounts = Collections.synchronizedList(new ArrayList<>());

    @BeforeAll
    void buildTheSameLibraryBothWays() throws Exception {
        sequential = library("library-parallel-1");
        parallel = library("library-parallel-n");
        sequentialLines = new ArrayList<>();
        sequentialParts = new LibraryBuilder(false).build(sequential, sequentialLines::add, 1, (d, t, o) -> { });
        parallelLines = new ArrayList<>();
        parallelParts = new LibraryBuilder(false).build(parallel, parallelLines::add, JOBS,
                (done, total, o) -> finishedCounts.add(done));
    }

    /** Twenty invented parts and one device file that cannot be read, in the middle of the order. */
    private static Path library(String name) throws Exception {
        Path root = Simulators.tempDir(name);
        for (SyntheticParts.Spec s : SyntheticParts.twenty()) {
            SyntheticParts.write(root, s);
        }
        Files.writeString(root.resolve("group2/BROKEN.device.yaml"), "model: BROKEN\nkind: no-such-kind\n",
                StandardCharsets.UTF_8);
        return root;
    }

    @Test
    void parallelBuildWritesTheSameBytesAsTheSequentialBuild() throws Exception {
        Map<String, byte[]> a = Trees.contents(sequential, "");
        Map<String, byte[]> b = Trees.contents(parallel, "");
        assertEquals(a.keySet(), b.keySet(), "the same files");
        assertEquals(20, Trees.contents(parallel, ".lib").size());
        for (String k : a.keySet()) {
            assertArrayEquals(a.get(k), b.get(k), k + " differs between the sequential and the parallel build");
        }
    }

    @Test
    void parallelBuildPrintsTheSameLinesInTheSameOrder() {
        assertEquals(21, sequentialLines.size());
        assertEquals(masked(sequentialLines, sequential), masked(parallelLines, parallel));
        assertEquals(sequentialParts.stream().map(PartOutcome::status).toList(),
                parallelParts.stream().map(PartOutcome::status).toList());
        assertTrue(parallelParts.stream().anyMatch(p -> p.status() == PartOutcome.Status.BAD_INPUT),
                "the broken device file is reported, and the others are built");
    }

    @Test
    void everyPartIsReportedFinishedOnce() {
        List<Integer> counts = new ArrayList<>(finishedCounts);
        Collections.sort(counts);
        List<Integer> expected = new ArrayList<>();
        for (int i = 1; i <= 21; i++) {
            expected.add(i);
        }
        assertEquals(expected, counts);
    }

    @Test
    void parallelRebuildOfAnUnchangedLibraryTouchesNothing() throws Exception {
        Path tree = Simulators.tempDir("library-parallel-noop");
        Trees.copy(parallel, tree);
        Trees.age(tree, LONG_AGO);
        List<PartOutcome> again = new LibraryBuilder(false).build(tree, l -> { }, JOBS, (d, t, o) -> { });
        assertEquals(20, again.stream().filter(o -> o.status() == PartOutcome.Status.UP_TO_DATE).count());
        Trees.times(tree, "").forEach((k, t) -> assertEquals(LONG_AGO, t, k + " was rewritten"));
    }

    @Test
    void parallelCheckGivesTheSequentialVerdictsAndLines() throws Exception {
        List<String> one = new ArrayList<>();
        List<CardCheck> a = new LibraryCheck("builtin", false).check(sequential, one::add, 1, (d, t, c) -> { });
        List<String> many = new ArrayList<>();
        List<CardCheck> b = new LibraryCheck("builtin", false).check(sequential, many::add, JOBS, (d, t, c) -> { });
        assertEquals(one, many);
        assertEquals(a.stream().map(CardCheck::status).toList(), b.stream().map(CardCheck::status).toList());
        assertEquals(CheckReport.table(a), CheckReport.table(b));
        assertEquals(20, b.stream().filter(c -> c.status() == CardCheck.Status.PASS).count());
    }

    /** The lines with the measured build time of each part and the tree's own folder replaced. */
    private static List<String> masked(List<String> lines, Path root) {
        return lines.stream().map(l -> l.replaceAll("built in [0-9.]+ s", "built in # s")
                .replace(root.toString(), "ROOT")).toList();
    }
}
