package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Instrument exports as they arrive: every fixture in fixtures/exports writes the same eight invented points
 * with one quirk (delimiter, decimal comma, SPICE suffixes, metadata lines, flags, 2-wire leads, kelvin), and
 * each must read to the same points as plain.csv.
 */
class ExportQuirksTest {
    /**
     * Largest relative difference between a quirk file's point and the plain file's: every conversion is done
     * in decimal and rounded once, so the points should agree to the last bit; 1e-15 leaves a few ulps [1].
     */
    private static final double SAME_POINT = 1e-15;

    private static Path folder() {
        String projectDir = System.getenv("CARDWRIGHT_PROJECT_DIR");
        Path root = projectDir == null ? Path.of("") : Path.of(projectDir);
        Path folder = root.resolve("fixtures").resolve("exports");
        assertTrue(Files.isDirectory(folder), "fixture folder missing: " + folder.toAbsolutePath());
        return folder;
    }

    private static MeasurementFile read(String name) throws DataFileException {
        return new MeasurementReader(ReadOptions.defaults()).read(folder().resolve(name));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "semicolon-decimal-comma.csv | cells separated by semicolons (detected from the header row)",
            "tab-separated.tsv           | cells separated by tabs (detected from the header row)",
            "spice-suffixes.csv          | ",
            "metadata-lines.csv          | every point is at the file's temperature (line 3) 298.15 K",
            "status-flags.csv            | 4 rows flagged in column 4 'status' set aside, not used: lines 10 (OVL), 14 (C), 16 (C), 17 (ERR)",
            "compliance-column.csv       | 1 row flagged in column 1 'compliance' set aside, not used: line 14 (1)",
            "two-wire-leads.csv          | 2-wire lead resistance 0.12 ohm subtracted: V = Vmeasured - I * 0.12 ohm; largest change 9.72 mV (line 14)",
    })
    void quirkFileReadsToThePlainPoints(String name, String notice) throws Exception {
        List<IvPoint> plain = read("plain.csv").iv();
        MeasurementFile quirk = read(name);
        assertEquals(plain.size(), quirk.iv().size(), name + ": " + quirk.notices());
        for (int k = 0; k < plain.size(); k++) {
            IvPoint p = plain.get(k);
            IvPoint q = quirk.iv().get(k);
            String where = name + " point " + (k + 1) + " (line " + q.line() + ")";
            assertSame(p.voltage(), q.voltage(), where + " V");
            assertSame(p.current(), q.current(), where + " I");
            assertSame(p.temperature(), q.temperature(), where + " T");
        }
        if (notice != null) {
            assertTrue(quirk.notices().stream().anyMatch(n -> n.message().contains(notice)),
                    "expected a notice containing '" + notice + "' in " + quirk.notices());
        }
    }

    @Test
    void everyQuirkFixtureIsCoveredAndSaysItIsInvented() throws IOException {
        List<String> names;
        try (Stream<Path> s = Files.list(folder())) {
            names = s.map(p -> p.getFileName().toString()).sorted().toList();
        }
        assertEquals(List.of("compliance-column.csv", "metadata-lines.csv", "plain.csv", "semicolon-decimal-comma.csv",
                "spice-suffixes.csv", "status-flags.csv", "tab-separated.tsv", "two-wire-leads.csv"), names);
        for (String n : names) {
            assertMentions(Files.readString(folder().resolve(n)), "# Invented instrument export for cardwright tests, not a measurement");
        }
    }

    @Test
    void flaggedRowsAreCountedAndTheirCellsNotRead() throws Exception {
        MeasurementFile f = read("status-flags.csv");
        Notice n = f.notices().stream().filter(x -> x.message().contains("flagged")).findFirst().orElseThrow();
        assertEquals(10, n.line(), "the notice stands at the first flagged row");
        assertMentions(n.message(), "4 rows flagged");
    }

    @Test
    void metadataLinesWithUnknownKeysAreListedNotDropped() throws Exception {
        MeasurementFile f = read("metadata-lines.csv");
        Notice n = f.notices().stream().filter(x -> x.message().contains("not read")).findFirst().orElseThrow();
        assertEquals(1, n.line());
        assertMentions(n.message(), "'Instrument' (line 1), 'Operator' (line 2), 'ammeter range' (line 8)");
    }

    private static void assertSame(double expected, double actual, String what) {
        double scale = Math.max(Math.abs(expected), Math.abs(actual));
        assertTrue(Math.abs(expected - actual) <= SAME_POINT * scale,
                what + ": expected " + expected + ", got " + actual);
    }
}
