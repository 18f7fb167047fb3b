package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.maven.plugin.surefire.log.api.NullConsoleLogger;
import org.apache.maven.plugins.surefire.report.ReportTestCase;
import org.apache.maven.plugins.surefire.report.ReportTestSuite;
import org.apache.maven.plugins.surefire.report.TestSuiteXmlParser;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The CI check: exit code, summary table, and a JUnit XML report that a general-purpose consumer reads without
 * error: the parser of the Maven Surefire report plugin (surefire-report-parser 3.5.2, from Maven Central).
 */
class LibraryCheckTest {
    /** Exit codes as documented in the README (0 reproduces, 1 does not). */
    private static final int OK = 0;
    private static final int NOT_REPRODUCED = 1;
    /** A 10 mV shift of every reading: twice the default 5 mV per-point limit, as a drifted part might show. */
    private static final double DRIFT = 10e-3;

    private record Run(int code, String out, String err) {
    }

    private static Run cli(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(err), args);
        return new Run(code, out.toString(), err.toString());
    }

    private static Path builtTree(String name) throws Exception {
        Path root = Simulators.tempDir(name);
        for (SyntheticParts.Spec s : SyntheticParts.twenty().subList(0, 3)) {
            SyntheticParts.write(root, s);
        }
        Run build = cli("build", root.toString());
        assertEquals(OK, build.code(), build.out() + build.err());
        return root;
    }

    private static List<ReportTestSuite> parseJunit(Path xml) throws Exception {
        TestSuiteXmlParser parser = new TestSuiteXmlParser(new NullConsoleLogger());
        List<ReportTestSuite> suites = parser.parse(xml.toString());
        assertTrue(parser.isValid(), "the surefire report parser found the XML invalid");
        return suites;
    }

    /** The parser makes one suite per class name (device file); these are the sums over them. */
    private record Totals(int tests, int failures, int errors, List<ReportTestCase> cases) {
    }

    private static Totals totals(List<ReportTestSuite> suites) {
        List<ReportTestCase> cases = new ArrayList<>();
        suites.forEach(s -> cases.addAll(s.getTestCases()));
        return new Totals(suites.stream().mapToInt(ReportTestSuite::getNumberOfTests).sum(),
                suites.stream().mapToInt(ReportTestSuite::getNumberOfFailures).sum(),
                suites.stream().mapToInt(ReportTestSuite::getNumberOfErrors).sum(), cases);
    }

    @Test
    void aFreshlyBuiltLibraryPassesAndItsReportReadsAsThreePassingTests() throws Exception {
        Path root = builtTree("library-check-pass");
        Path xml = root.resolve("report/check.xml");
        Run r = cli("check", root.toString(), "--junit", xml.toString());
        assertEquals(OK, r.code(), r.out() + r.err());
        assertTrue(r.out().contains("3 cards: 3 passed, 0 not"), r.out());
        Totals s = totals(parseJunit(xml));
        assertEquals(3, s.tests());
        assertEquals(0, s.failures());
        assertEquals(0, s.errors());
        List<String> names = s.cases().stream().map(ReportTestCase::getName).toList();
        assertEquals(List.of("TP01.ngspice.lib", "TP02.ngspice.lib", "TP03.ngspice.lib"), names);
        s.cases().forEach(c -> assertTrue(c.isSuccessful(), c.getFullName()));
        assertEquals("group1.TP01", s.cases().get(0).getFullClassName());
    }

    @Test
    void aCardThatNoLongerReproducesItsDataFailsTheCheck() throws Exception {
        Path root = builtTree("library-check-drift");
        Path data = root.resolve("group1/data/tp02-forward-85C.csv");
        List<String> lines = new ArrayList<>();
        for (String line : Files.readAllLines(data, StandardCharsets.UTF_8)) {
            if (!line.isEmpty() && Character.isDigit(line.charAt(0))) {
                String[] cells = line.split(",");
                line = String.format(Locale.ROOT, "%.7f,%s", Double.parseDouble(cells[0]) + DRIFT, cells[1]);
            }
            lines.add(line);
        }
        Files.write(data, lines, StandardCharsets.UTF_8);
        Path xml = root.resolve("check.xml");
        Run r = cli("check", root.toString(), "--junit", xml.toString());
        assertEquals(NOT_REPRODUCED, r.code(), r.out() + r.err());
        assertTrue(r.out().contains("group1/TP02.ngspice.lib: fail: does not reproduce its forward data: forward FAIL at 85 degC"), r.out());
        Totals s = totals(parseJunit(xml));
        assertEquals(3, s.tests());
        assertEquals(1, s.failures());
        assertEquals(0, s.errors());
        ReportTestCase failed = s.cases().stream().filter(c -> !c.isSuccessful()).findFirst().orElseThrow();
        assertEquals("TP02.ngspice.lib", failed.getName());
        assertTrue(failed.hasFailure());
        assertTrue(failed.getFailureMessage().startsWith("does not reproduce its forward data"), failed.getFailureMessage());
        assertEquals("cardwright.fail", failed.getFailureType());
    }

    @Test
    void aCardEditedByHandIsHeldToItsDataLikeAnyOther() throws Exception {
        Path root = builtTree("library-check-edited");
        Path card = root.resolve("group1/TP01.ngspice.lib");
        Files.writeString(card, Files.readString(card).replaceFirst("(?m)^\\+ N=.*$", "+ N=1.2"), StandardCharsets.UTF_8);
        Run r = cli("check", root.toString());
        assertEquals(NOT_REPRODUCED, r.code(), r.out());
        assertTrue(r.out().contains("(the card was edited by hand)"), r.out());
    }

    @Test
    void anOutdatedCardFailsUnlessOutdatedCardsAreAllowed() throws Exception {
        Path root = builtTree("library-check-stale");
        Path device = root.resolve("group1/TP03.device.yaml");
        Files.writeString(device, Files.readString(device) + "rules:\n  - TNOM=25\n", StandardCharsets.UTF_8);
        Run strict = cli("check", root.toString());
        assertEquals(NOT_REPRODUCED, strict.code(), strict.out());
        assertTrue(strict.out().contains("group1/TP03.ngspice.lib: outdated"), strict.out());
        Run lenient = cli("check", root.toString(), "--allow-outdated");
        assertEquals(OK, lenient.code(), lenient.out());
        Run earlierName = cli("check", root.toString(), "--allow-stale");
        assertEquals(OK, earlierName.code(), "the option's earlier name still works: " + earlierName.out());
    }

    @Test
    void aMissingCardFails() throws Exception {
        Path root = builtTree("library-check-missing");
        Files.delete(root.resolve("group1/TP02.ngspice.lib"));
        Run r = cli("check", root.toString());
        assertEquals(NOT_REPRODUCED, r.code());
        assertTrue(r.out().contains("group1/TP02.ngspice.lib: missing"), r.out());
        assertFalse(r.out().contains("TP01.ngspice.lib: missing"), r.out());
    }
}
