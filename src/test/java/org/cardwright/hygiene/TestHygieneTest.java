package org.cardwright.hygiene;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.cardwright.hygiene.TestSourceScanner.Finding;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The guard of two house rules over every test source of the repository (src/test/java and spark/src/test/java):
 * tolerances are named constants, and tests read nothing outside the repository. The rules themselves are in
 * {@link TestSourceScanner}'s javadoc; a failure names file, line, rule and the offending text.
 *
 * <p>The second half proves the scanner can fail: a small source written here breaks each rule once.
 */
class TestHygieneTest {

    /**
     * This package is not scanned: this file holds in-memory sources that break the rules on purpose, and the
     * scanner's javadoc and patterns spell out the paths it looks for.
     */
    private static final String SELF = "/org/cardwright/hygiene/";

    @Test
    void everyTestSourceKeepsTheRules() throws IOException {
        Path root = Simulators.projectDir();
        List<Path> sources = new ArrayList<>();
        for (Path dir : List.of(root.resolve("src/test/java"), root.resolve("spark/src/test/java"))) {
            if (Files.isDirectory(dir)) {
                try (Stream<Path> walk = Files.walk(dir)) {
                    walk.filter(p -> p.toString().endsWith(".java")).sorted().forEach(sources::add);
                }
            }
        }
        assertTrue(sources.size() > 100, "the test sources were found under " + root + ": " + sources.size());
        List<Finding> findings = new ArrayList<>();
        for (Path p : sources) {
            String name = root.relativize(p).toString().replace('\\', '/');
            if (name.contains(SELF)) {
                continue;
            }
            findings.addAll(TestSourceScanner.scan(name, Files.readString(p, StandardCharsets.UTF_8)));
        }
        assertEquals("", findings.stream().map(Finding::toString).collect(Collectors.joining("\n")),
                findings.size() + " finding(s); name each tolerance (a static final constant with its unit and a"
                        + " one-line reason) and keep reference values under src/test/resources");
    }

    @Test
    void aBareDeltaIsAFinding() {
        List<Finding> f = TestSourceScanner.scan("A.java", String.join("\n",
                "class A {",
                "  void t() {",
                "    assertEquals(1.0, x, 1e-6);",
                "    assertEquals(1.0, x, 1e-6 * Math.abs(y), \"msg\");",
                "    assertArrayEquals(a, b, 2 * TOL);",
                "    assertEquals(1e-6, x, 1e-6);",
                "    assertEquals(3.5, x, 3.5 * 1e-15);",
                "  }",
                "}"));
        assertEquals(List.of(3, 4, 5, 6, 7), lines(f), f.toString());
        assertTrue(f.stream().allMatch(x -> x.rule().equals("tolerance")), f.toString());
    }

    @Test
    void namedExactAndMessageArgumentsAreNotFindings() {
        List<Finding> f = TestSourceScanner.scan("A.java", String.join("\n",
                "class A {",
                "  static final double TOL_V = 1e-6; // 1 uV: the reason",
                "  void t() {",
                "    assertEquals(1.0, x, TOL_V);",
                "    assertEquals(1.0, x, TOL_V * Math.abs(y1), \"within 1e-6 of the 2nd\");",
                "    assertEquals(1.0, x, 0.0);",
                "    assertEquals(3.5 / 1.6, x, 3.5 / 1.6 * REL);",
                "    assertEquals(3, list.size(), \"three of 1e-3\");",
                "    assertEquals(3, list.size(), () -> \"n = \" + 1e-3);",
                "    // assertEquals(1.0, x, 1e-6);",
                "  }",
                "}"));
        assertEquals(List.of(), f);
    }

    @Test
    void aBareBoundOnAnAbsoluteDifferenceIsAFinding() {
        List<Finding> f = TestSourceScanner.scan("A.java", String.join("\n",
                "class A {",
                "  void t() {",
                "    assertTrue(Math.abs(a - b) < 1e-3, \"close\");",
                "    assertTrue(0.5e-3 >= Math.abs(a - b));",
                "    boolean near = Math.abs(a - b) <= 2 * LIMIT_V;",
                "    assertTrue(Math.abs(a - b) < LIMIT_V);",
                "    assertTrue(Math.abs(a - b) > 0);",
                "    double d = Math.abs(a - b) * 1e3;",
                "  }",
                "}"));
        assertEquals(List.of(3, 4, 5), lines(f), f.toString());
        assertTrue(f.stream().allMatch(x -> x.rule().equals("abs-bound")), f.toString());
    }

    @Test
    void aBareFloatingBoundInAnAssertedConditionIsAFinding() {
        List<Finding> f = TestSourceScanner.scan("A.java", String.join("\n",
                "class A {",
                "  void t() {",
                "    assertTrue(rms < 0.5e-3, \"rms\");",
                "    assertFalse(ok && v > 0.9 * bv);",
                "    assertTrue(rms < RMS_LIMIT_V && rows > 60, \"0.5e-3\");",
                "    assertTrue(x > 0.0 && seconds < 60);",
                "    if (error > half * (1 + 1e-12)) {",
                "      fail(\"beyond half a unit\");",
                "    }",
                "    if (error > 1e-12) throw new AssertionError(error);",
                "    if (x > 0.5) { y = 1; }",
                "  }",
                "}"));
        assertEquals(List.of(3, 4, 7, 10), lines(f), f.toString());
        assertTrue(f.stream().allMatch(x -> x.rule().equals("condition-bound")), f.toString());
    }

    @Test
    void aPathOutsideTheRepositoryIsAFinding() {
        List<Finding> f = TestSourceScanner.scan("x/A.java", String.join("\n",
                "class A {",
                "  // values from /work/shared/reference/table.md",
                "  Path a = Path.of(\"/home/someone/data.csv\");",
                "  Path b = root.resolve(\"../shared/reference\");",
                "  Path c = root.resolve(\"fixtures/../../elsewhere\");",
                "  String h = System.getProperty(\"user.home\");",
                "  Path d = Path.of(\"/usr/share/data\");",
                "  Path ok = root.resolve(\"src/test/resources/reference/x.tsv\");",
                "  Path proc = Path.of(\"/proc\");",
                "  String refused = \"cards: /tmp/x\"; // " + TestSourceScanner.NOT_A_PATH + ": an input to refuse",
                "}"));
        assertEquals(List.of(2, 3, 4, 5, 6, 7), lines(f), f.toString());
        assertTrue(f.stream().allMatch(x -> x.rule().equals("outside-path")), f.toString());
    }

    @Test
    void onlyTheSimulatorLookupMayNameSystemPrograms() {
        String source = "class S { Path p = Path.of(\"/usr/bin/ngspice\"); }";
        assertEquals(List.of(), TestSourceScanner.scan("src/test/java/org/cardwright/testsupport/Simulators.java", source));
        assertEquals(List.of(1), lines(TestSourceScanner.scan("src/test/java/org/cardwright/cli/X.java", source)));
    }

    private static List<Integer> lines(List<Finding> findings) {
        return findings.stream().map(Finding::line).toList();
    }
}
