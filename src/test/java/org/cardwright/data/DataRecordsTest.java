package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

/** The records validate in their constructors, and the exception's message has its one-line form. */
class DataRecordsTest {

    private static final Path FILE = Path.of("sweeps", "d1.csv");
    private static final String HASH = "0".repeat(64);

    @Test
    void ivPointRefusesNonFiniteValuesAndTemperaturesAtOrBelowAbsoluteZero() {
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(Double.NaN, 1e-3, 300, 1));
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(0.5, Double.POSITIVE_INFINITY, 300, 1));
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(0.5, 1e-3, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(0.5, 1e-3, -1, 1));
        assertThrows(IllegalArgumentException.class, () -> new IvPoint(0.5, 1e-3, 300, -1));
        assertEquals(-2e-9, new IvPoint(-5, -2e-9, 300, 0).current());
    }

    @Test
    void cvPointRefusesCapacitanceThatIsNotPositive() {
        assertThrows(IllegalArgumentException.class, () -> new CvPoint(-1, 0, 300, 2));
        assertThrows(IllegalArgumentException.class, () -> new CvPoint(-1, -1e-12, 300, 2));
        assertThrows(IllegalArgumentException.class, () -> new CvPoint(-1, 1e-12, Double.NaN, 2));
        assertEquals(1e-12, new CvPoint(-1, 1e-12, 300, 2).capacitance());
    }

    @Test
    void noticeIsOneLineAndPrintsFileLineMessage() {
        assertEquals(FILE + ":7: current is exactly zero", new Notice(FILE, 7, "current is exactly zero").toString());
        assertEquals(FILE + ":0: whole file", new Notice(FILE, 0, "whole file").toString());
        assertThrows(IllegalArgumentException.class, () -> new Notice(FILE, 1, "two\nlines"));
        assertThrows(IllegalArgumentException.class, () -> new Notice(FILE, 1, " "));
        assertThrows(IllegalArgumentException.class, () -> new Notice(FILE, -1, "x"));
        assertThrows(NullPointerException.class, () -> new Notice(null, 1, "x"));
    }

    @Test
    void measurementFileHoldsOnlyItsKindAndCopiesItsLists() {
        List<IvPoint> iv = new ArrayList<>(List.of(new IvPoint(0.5, 1e-5, 300, 2)));
        MeasurementFile f = new MeasurementFile(FILE, HASH, DataKind.IV, iv, List.of(), List.of());
        iv.clear();
        assertEquals(1, f.iv().size());
        assertThrows(UnsupportedOperationException.class, () -> f.iv().add(new IvPoint(0.6, 1e-4, 300, 3)));
        List<CvPoint> cv = List.of(new CvPoint(-1, 1e-12, 300, 2));
        assertThrows(IllegalArgumentException.class,
                () -> new MeasurementFile(FILE, HASH, DataKind.IV, List.of(), List.of(), List.of()));
        assertThrows(IllegalArgumentException.class,
                () -> new MeasurementFile(FILE, HASH, DataKind.CV, f.iv(), cv, List.of()));
        assertThrows(IllegalArgumentException.class,
                () -> new MeasurementFile(FILE, "ABC", DataKind.CV, List.of(), cv, List.of()));
        assertThrows(IllegalArgumentException.class,
                () -> new MeasurementFile(FILE, "A".repeat(64), DataKind.CV, List.of(), cv, List.of()));
    }

    @Test
    void readOptionsRefuseImpossibleTemperaturesAndDelimiters() {
        assertEquals(new ReadOptions(OptionalDouble.empty(), ','), ReadOptions.defaults().withDelimiter(','));
        assertEquals(Optional.empty(), ReadOptions.defaults().delimiter(), "defaults detect the delimiter");
        assertTrue(ReadOptions.defaults().meterLoadingCorrection());
        assertThrows(IllegalArgumentException.class, () -> ReadOptions.defaults().withMeterResistance(0));
        assertThrows(IllegalArgumentException.class, () -> ReadOptions.defaults().withMeterResistance(-1e7));
        assertThrows(IllegalArgumentException.class,
                () -> ReadOptions.defaults().withMeterResistance(Double.POSITIVE_INFINITY));
        assertEquals(300.0, ReadOptions.defaults().withDefaultTemperature(300).defaultTemperature().getAsDouble());
        assertThrows(IllegalArgumentException.class, () -> ReadOptions.defaults().withDefaultTemperature(0));
        assertThrows(IllegalArgumentException.class, () -> ReadOptions.defaults().withDefaultTemperature(-5));
        assertThrows(IllegalArgumentException.class,
                () -> ReadOptions.defaults().withDefaultTemperature(Double.NaN));
        for (char bad : new char[] {'"', '#', '\n', '.', '-', '5', 'e', ' '}) {
            assertThrows(IllegalArgumentException.class, () -> ReadOptions.defaults().withDelimiter(bad),
                    "delimiter " + (int) bad);
        }
        assertEquals(Optional.of('\t'), ReadOptions.defaults().withDelimiter('\t').delimiter());
        assertEquals(Optional.empty(), ReadOptions.defaults().withDelimiter(';').withDetectedDelimiter().delimiter());
    }

    @Test
    void exceptionMessageIsOneLineWithFileLineAndValue() {
        DataFileException e = new DataFileException(FILE, 12, "not a number in column 2 'I'", "1.2\nx");
        assertEquals(FILE + ":12: not a number in column 2 'I' (value '1.2\\nx')", e.getMessage());
        assertEquals("1.2\nx", e.rawValue());
        assertEquals(12, e.line());
        assertEquals(FILE, e.file());
        DataFileException whole = new DataFileException(FILE, 0, "cannot read: no such file", null);
        assertEquals(FILE + ":0: cannot read: no such file", whole.getMessage());
        assertNull(whole.rawValue());
        assertThrows(IllegalArgumentException.class, () -> new DataFileException(FILE, -1, "x", null));
    }

    @Test
    void longRawValuesAreShortenedInTheMessageOnly() {
        String raw = "9".repeat(200);
        DataFileException e = new DataFileException(FILE, 3, "not a number", raw);
        assertEquals(FILE + ":3: not a number (value '" + "9".repeat(80) + "...')", e.getMessage());
        assertEquals(raw, e.rawValue());
    }
}
