package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 10, bounded work on bad input: control characters, oversized cells and lines, many per-row notices,
 * and the recovery reader on the same path as the measurement reader. Inputs are invented.
 */
class BoundedReadingTest {
    @TempDir
    Path dir;

    private final MeasurementReader plain = new MeasurementReader(ReadOptions.defaults());

    private Path write(String name, String text) throws Exception {
        Path f = dir.resolve(name);
        Files.write(f, text.getBytes(StandardCharsets.UTF_8));
        return f;
    }

    @Test
    void nulInsideACellIsAnErrorWithLineAndColumn() throws Exception {
        Path f = write("nul.csv", "V,I,T\n0.5,1e-5,25\n0.6,1e-\u00004,25\n");
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(f));
        assertEquals(3, e.line());
        assertTrue(e.getMessage().contains("U+0000 in column 2 (character 8 of the line)"), e.getMessage());
        assertTrue(e.getMessage().startsWith(f + ":3: "), e.getMessage());
    }

    @Test
    void nulAtTheEdgeOfACellIsNotTrimmedAway() throws Exception {
        // Commons CSV's trim used to drop it and read 0.6 silently
        Path f = write("nul-edge.csv", "V,I,T\n0.5,1e-5,25\n0.6\u0000,1e-4,25\n");
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(f));
        assertEquals(3, e.line());
        assertTrue(e.getMessage().contains("U+0000 in column 1"), e.getMessage());
    }

    @Test
    void otherControlCharactersAreErrorsToo() throws Exception {
        for (char c : new char[] {'\u0001', '\u001b', '\u007f', '\u0085', '\u000b', '\u000c'}) {
            Path f = write("ctl.csv", "V,I,T\n0.5,1e-5" + c + ",25\n");
            DataFileException e = assertThrows(DataFileException.class, () -> plain.read(f), "U+" + (int) c);
            assertEquals(2, e.line());
            assertTrue(e.getMessage().contains(String.format("U+%04X", (int) c)), e.getMessage());
        }
    }

    @Test
    void overlongNumberIsRefusedNamingTheCell() throws Exception {
        Path f = write("long-number.csv", "V,I,T\n0.5," + "1".repeat(5000) + ",25\n");
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(f));
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("5000 characters where a number is expected"), e.getMessage());
        assertTrue(e.getMessage().contains("column 2"), e.getMessage());
    }

    @Test
    void megabyteCellIsRefusedAsAnOverlongLine() throws Exception {
        Path f = write("megabyte.csv", "V,I,T\n0.5," + "9".repeat(1 << 20) + "x,25\n");
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(f));
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("line longer than"), e.getMessage());
    }

    @Test
    void manyZeroCurrentRowsGiveBoundedNotices() throws Exception {
        StringBuilder s = new StringBuilder("V,I,T\n");
        for (int k = 0; k < 500; k++) {
            s.append(-0.001 * k).append(",0,25\n");
        }
        s.append("0.6,1e-4,25\n");
        MeasurementFile f = plain.read(write("zeros.csv", s.toString()));
        assertEquals(501, f.size());
        assertEquals(RowConverter.ROW_NOTICES_PER_KIND + 1, f.notices().size(), f.notices().toString());
        Notice summary = f.notices().get(RowConverter.ROW_NOTICES_PER_KIND);
        assertEquals(2 + RowConverter.ROW_NOTICES_PER_KIND, summary.line());
        assertTrue(summary.message().startsWith((500 - RowConverter.ROW_NOTICES_PER_KIND) + " more rows"),
                summary.message());
    }

    @Test
    void duplicateRowsAreStillFoundAmongManyRows() throws Exception {
        StringBuilder s = new StringBuilder("V,I,T\n");
        for (int k = 0; k < 5000; k++) {
            s.append(String.format(java.util.Locale.ROOT, "%.4f", 0.3 + 1e-4 * k)).append(',').append(k + 1)
                    .append("e-9,25\n");
        }
        s.append("0.4233,1.234e-6,25\n"); // line 5002 repeats row k = 1233 (line 1235), written otherwise
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(write("dup.csv", s.toString())));
        assertEquals(5002, e.line());
        assertTrue(e.getMessage().contains("same V, I and T as line 1235"), e.getMessage());
    }

    @Test
    void recoveryFilesRefuseWhatMeasurementFilesRefuse() throws Exception {
        RecoveryReader r = new RecoveryReader(OptionalDouble.of(298.15));
        Path nul = write("rec-nul.csv", "IF,IR,trr\n10m,-10m,2\u0000n\n");
        DataFileException e = assertThrows(DataFileException.class, () -> r.read(nul));
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("U+0000 in column 3"), e.getMessage());

        Path latin = dir.resolve("rec-latin1.csv");
        Files.write(latin, new byte[] {'I', 'F', ',', 'I', 'R', ',', 't', 'r', 'r', '\n', '1', ',', '-', '1', ',',
            (byte) 0xB5, '\n'});
        e = assertThrows(DataFileException.class, () -> r.read(latin));
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("not UTF-8"), e.getMessage());

        DataFileException folder = assertThrows(DataFileException.class, () -> r.read(dir));
        assertTrue(folder.getMessage().contains("directory"), folder.getMessage());
    }

    @Test
    void reverseMagnitudesInVrAndIrColumnsAreReadAsNegativeAndSaidSo() throws Exception {
        // the datasheet habit: reverse voltage and leakage written as positive magnitudes (common practice, no source)
        MeasurementFile f = plain.read(write("vr-ir.csv", "VR [V],IR [nA],T\n1,1.5,25\n20,3,25\n"));
        assertEquals(java.util.List.of(new IvPoint(-1, -1.5e-9, 298.15, 2), new IvPoint(-20, -3e-9, 298.15, 3)), f.iv());
        assertTrue(f.notices().stream().anyMatch(n -> n.message().contains("V = -VR, I = -IR")), f.notices().toString());
    }

    @Test
    void negativeValueInAMagnitudeColumnIsAnError() throws Exception {
        Path file = write("vr-negative.csv", "VR,IR,T\n1,1e-9,25\n-20,3e-9,25\n");
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(file));
        assertEquals(3, e.line());
        assertTrue(e.getMessage().contains("reverse-bias magnitudes"), e.getMessage());
    }

    @Test
    void magnitudeColumnsCannotBeMixedWithSignedOnes() throws Exception {
        Path file = write("vr-and-i.csv", "VR,I,T\n1,1e-9,25\n");
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(file));
        assertEquals(1, e.line());
        assertTrue(e.getMessage().contains("beside VR or IR"), e.getMessage());
    }
}
