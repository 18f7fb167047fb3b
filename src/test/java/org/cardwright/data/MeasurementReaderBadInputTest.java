package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.cardwright.data.BadFixtures.assertRejected;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every bad-input fixture in fixtures/bad, and the failures that need no fixture (missing file, directory,
 * zero-byte file): each must fail with a {@link DataFileException} naming file, line and raw value.
 */
class MeasurementReaderBadInputTest {

    @TempDir
    Path dir;

    @Test
    void missingCurrentColumnIsRejectedAtTheHeader() {
        DataFileException e = assertRejected("missing-current-column.csv", 4, "V,T");
        assertMentions(e.getMessage(), "no I or C column");
    }

    @Test
    void missingVoltageColumnIsRejectedAtTheHeader() {
        DataFileException e = assertRejected("missing-voltage-column.csv", 4, "I [mA],T");
        assertMentions(e.getMessage(), "no V column");
    }

    @Test
    void nonNumericCellIsRejectedWithItsText() {
        DataFileException e = assertRejected("non-numeric-cell.csv", 6, "OVLD");
        assertMentions(e.getMessage(), "not a number in column 2 'I [mA]'");
    }

    @Test
    void nanCellIsRejected() {
        DataFileException e = assertRejected("nan-cell.csv", 7, "NaN");
        assertMentions(e.getMessage(), "not a finite number");
    }

    @Test
    void infiniteCellIsRejected() {
        DataFileException e = assertRejected("infinite-cell.csv", 5, "-Infinity");
        assertMentions(e.getMessage(), "not a finite number in column 1 'V'");
    }

    @Test
    void emptyCellIsRejected() {
        DataFileException e = assertRejected("empty-cell.csv", 5, "");
        assertMentions(e.getMessage(), "empty cell in column 2");
    }

    @Test
    void fileWithOnlyCommentsHasNoHeader() {
        DataFileException e = assertRejected("empty.csv", 0, null);
        assertMentions(e.getMessage(), "no header row");
    }

    @Test
    void zeroByteFileHasNoHeader() throws IOException {
        Path file = Files.write(dir.resolve("zero-bytes.csv"), new byte[0]);
        DataFileException e = assertRejected(file, ReadOptions.defaults(), 0, null);
        assertMentions(e.getMessage(), "empty file");
    }

    @Test
    void headerWithoutDataRowsIsRejected() {
        DataFileException e = assertRejected("header-only.csv", 4, "V,I [mA],T [degC]");
        assertMentions(e.getMessage(), "no data rows");
    }

    @Test
    void duplicateRowNamesBothLines() {
        DataFileException e = assertRejected("duplicate-rows.csv", 9, "0.55,0.081,25");
        assertMentions(e.getMessage(), "duplicate row");
        assertMentions(e.getMessage(), "lines 5 and 9");
    }

    @Test
    void unknownUnitNamesTheHeaderCell() {
        DataFileException e = assertRejected("unknown-unit.csv", 4, "I [amps]");
        assertMentions(e.getMessage(), "unknown unit 'amps'");
    }

    @Test
    void capitalMPrefixIsAmbiguous() {
        DataFileException e = assertRejected("ambiguous-unit.csv", 4, "I [MA]");
        assertMentions(e.getMessage(), "ambiguous unit 'MA'");
    }

    @Test
    void unitWithoutBracketsIsRejected() {
        DataFileException e = assertRejected("malformed-header-cell.csv", 4, "I mA");
        assertMentions(e.getMessage(), "brackets or parentheses");
    }

    @Test
    void rowWithWrongNumberOfCellsIsRejected() {
        DataFileException e = assertRejected("wrong-cell-count.csv", 6, "0.55,0.081");
        assertMentions(e.getMessage(), "row has 2 cells, the header on line 4 has 3");
    }

    @Test
    void zeroCapacitanceIsRejected() {
        DataFileException e = assertRejected("zero-capacitance.csv", 6, "0");
        assertMentions(e.getMessage(), "capacitance must be positive");
    }

    @Test
    void negativeCapacitanceIsRejected() {
        DataFileException e = assertRejected("negative-capacitance.csv", 5, "-0.4");
        assertMentions(e.getMessage(), "capacitance must be positive");
    }

    @Test
    void temperatureBelowAbsoluteZeroIsRejected() {
        DataFileException e = assertRejected("below-absolute-zero.csv", 6, "-300");
        assertMentions(e.getMessage(), "below absolute zero");
    }

    @Test
    void fileWithBothCurrentAndCapacitanceIsRejected() {
        DataFileException e = assertRejected("both-iv-and-cv.csv", 4, "C [pF]");
        assertMentions(e.getMessage(), "both an I and a C column");
    }

    @Test
    void missingTemperatureWithoutDefaultIsRejected() {
        DataFileException e = assertRejected("no-temperature.csv", 4, "V,I [mA]");
        assertMentions(e.getMessage(), "no T column and no --temp given");
    }

    @Test
    void columnGivenTwiceIsRejected() {
        DataFileException e = assertRejected("duplicate-column.csv", 4, "V [mV]");
        assertMentions(e.getMessage(), "column V appears twice (columns 1 and 3)");
    }

    @Test
    void unterminatedQuoteIsRejected() {
        DataFileException e = assertRejected("unterminated-quote.csv", 6, "0.55,\"0.081,25");
        assertMentions(e.getMessage(), "quot");
    }

    @Test
    void latin1BytesAreRejectedAtTheirLine() {
        DataFileException e = assertRejected("not-utf8.csv", 4, "\\xB5");
        assertMentions(e.getMessage(), "not UTF-8");
    }

    @Test
    void missingFileIsRejectedAtLineZero() {
        Path file = dir.resolve("no-such-file.csv");
        DataFileException e = assertRejected(file, ReadOptions.defaults(), 0, null);
        assertMentions(e.getMessage(), "no such file");
    }

    @Test
    void directoryIsRejectedAtLineZero() {
        DataFileException e = assertRejected(dir, ReadOptions.defaults(), 0, null);
        assertMentions(e.getMessage(), "directory");
    }

    @Test
    void emptyTemperatureCellWithoutDefaultIsRejected() throws IOException {
        Path file = write("empty-t.csv", "V,I,T\n0.5,1e-3,25\n0.6,2e-3,\n");
        DataFileException e = assertRejected(file, ReadOptions.defaults(), 3, "");
        assertMentions(e.getMessage(), "empty T cell and no --temp given");
    }

    @Test
    void unitOfAnotherQuantityIsNamedAsSuch() throws IOException {
        Path file = write("mv-current.csv", "V,I [mV],T\n0.5,1,25\n");
        DataFileException e = assertRejected(file, ReadOptions.defaults(), 1, "I [mV]");
        assertMentions(e.getMessage(), "it is a voltage unit");
    }

    @Test
    void numberBeyondDoubleRangeIsRejected() throws IOException {
        Path file = write("huge.csv", "V,I,T\n0.5,1e400,25\n");
        DataFileException e = assertRejected(file, ReadOptions.defaults(), 2, "1e400");
        assertMentions(e.getMessage(), "too large");
    }

    @Test
    void semicolonFileReadWithForcedCommasGetsAHint() throws IOException {
        Path file = write("semicolons.csv", "V;I;T\n0.5;1e-3;25\n");
        DataFileException e = assertRejected(file, ReadOptions.defaults().withDelimiter(','), 1, "V;I;T");
        assertMentions(e.getMessage(), "separated by semicolons?");
    }

    /**
     * Every fixture says in its header that it is invented, what it tests and where reading it fails; this
     * holds each to its word, so a fixture cannot drift from its description or sit there untested.
     */
    @Test
    void everyFixtureHasAProvenanceHeaderAndFailsWhereItSays() throws IOException {
        Pattern expected = Pattern.compile("# Expected: DataFileException at line (\\d+)(, value '(.*)')?\\.");
        List<Path> fixtures = new ArrayList<>();
        try (Stream<Path> listing = Files.list(BadFixtures.folder())) {
            listing.filter(p -> p.toString().endsWith(".csv")).sorted().forEach(fixtures::add);
        }
        assertTrue(fixtures.size() >= 20, "expected the full set of bad fixtures, found " + fixtures.size());
        for (Path fixture : fixtures) {
            List<String> head = Files.readAllLines(fixture, StandardCharsets.ISO_8859_1).subList(0, 3);
            assertTrue(head.get(0).startsWith("# ") && head.get(0).contains("invented"), fixture + ": " + head);
            assertTrue(head.get(1).startsWith("# Tests: "), fixture + ": " + head);
            Matcher m = expected.matcher(head.get(2));
            assertTrue(m.matches(), fixture + ": " + head.get(2));
            int line = Integer.parseInt(m.group(1));
            String raw = m.group(3);
            DataFileException e = assertRejected(fixture, ReadOptions.defaults(), line, raw);
            assertFalse(e.problem().isBlank(), fixture.toString());
        }
        assertEquals(fixtures.size(), fixtures.stream().distinct().count());
    }

    private Path write(String name, String content) throws IOException {
        return Files.writeString(dir.resolve(name), content, StandardCharsets.UTF_8);
    }
}
