package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Good input: what a valid file turns into. Conversions are compared exactly (no tolerance), because the
 * reader converts in decimal and rounds once, so the result must be the double nearest the exact SI value,
 * which is what the Java literal on the left denotes.
 */
class MeasurementReaderTest {

    /**
     * Zero degrees Celsius, by definition of the Celsius scale (SI Brochure, 9th edition, BIPM 2019:
     * t/degC = T/K - 273.15) [K].
     */
    private static final double ICE_POINT = 273.15;

    @TempDir
    Path dir;

    private final MeasurementReader plain = new MeasurementReader(ReadOptions.defaults());

    @Test
    void unitsConvertExactlyToSi() throws Exception {
        MeasurementFile f = plain.read(write("units.csv", "V [mV],I [mA],T [degC]\n700,1,25\n"));
        IvPoint p = f.iv().get(0);
        assertEquals(0.7, p.voltage());
        assertEquals(1e-3, p.current());
        assertEquals(298.15, p.temperature());
    }

    @Test
    void kelvinStaysKelvin() throws Exception {
        MeasurementFile f = plain.read(write("kelvin.csv", "V,I,T [K]\n0.6,1e-4,300\n"));
        assertEquals(300.0, f.iv().get(0).temperature());
    }

    @Test
    void columnsWithoutUnitAreSiAndCelsius() throws Exception {
        MeasurementFile f = plain.read(write("plain.csv", "V,I,T\n0.65,2.5e-3,0\n"));
        IvPoint p = f.iv().get(0);
        assertEquals(0.65, p.voltage());
        assertEquals(2.5e-3, p.current());
        assertEquals(ICE_POINT, p.temperature());
    }

    @Test
    void capacitanceFileInPicofarads() throws Exception {
        MeasurementFile f = plain.read(write("cv.csv", "V,C (pF),T (K)\n-1,3.9,300\n-5,2.1,300\n0,5.6,300\n"));
        assertEquals(DataKind.CV, f.kind());
        assertTrue(f.iv().isEmpty());
        assertEquals(List.of(new CvPoint(-1, 3.9e-12, 300, 2), new CvPoint(-5, 2.1e-12, 300, 3),
                new CvPoint(0, 5.6e-12, 300, 4)), f.cv());
    }

    @Test
    void headerNamesAndUnitsIgnoreCaseAndColumnOrder() throws Exception {
        MeasurementFile f = plain.read(write("order.csv", "t [CELSIUS], i (ma), v [mv]\n25, 2, 650\n"));
        assertEquals(List.of(new IvPoint(0.65, 2e-3, 298.15, 2)), f.iv());
    }

    @Test
    void capitalMVoltIsAmbiguous() throws IOException {
        Path file = write("mv.csv", "V [MV],I,T\n650,2e-3,25\n");
        DataFileException e = assertThrows(DataFileException.class, () -> plain.read(file));
        assertMentions(e.getMessage(), "ambiguous unit 'MV'");
    }

    @Test
    void byteOrderMarkIsAccepted() throws Exception {
        byte[] text = "V,I [uA],T\n0.55,12,25\n".getBytes(StandardCharsets.UTF_8);
        byte[] bytes = new byte[text.length + 3];
        bytes[0] = (byte) 0xEF;
        bytes[1] = (byte) 0xBB;
        bytes[2] = (byte) 0xBF;
        System.arraycopy(text, 0, bytes, 3, text.length);
        MeasurementFile f = plain.read(Files.write(dir.resolve("bom.csv"), bytes));
        assertEquals(List.of(new IvPoint(0.55, 12e-6, 298.15, 2)), f.iv());
        assertEquals(sha256(bytes), f.sha256());
    }

    @Test
    void commentsAndBlankLinesKeepPhysicalLineNumbers() throws Exception {
        String text = String.join("\n",
                "# invented sweep",            // 1
                "",                             // 2
                "   # indented comment",        // 3
                "V,I,T",                        // 4
                "0.50,1e-5,25",                 // 5
                "",                             // 6
                "\t# another comment",          // 7
                "0.60,1e-4,25",                 // 8
                "   ",                          // 9
                "0.70,1e-3,25",                 // 10
                "# trailing comment");          // 11
        MeasurementFile f = plain.read(write("comments.csv", text));
        assertEquals(List.of(5, 8, 10), f.iv().stream().map(IvPoint::line).toList());
    }

    @Test
    void windowsAndOldMacLineEndsCountAsOneLineEach() throws Exception {
        MeasurementFile crlf = plain.read(write("crlf.csv", "# c\r\nV,I,T\r\n\r\n0.5,1e-5,25\r\n0.6,1e-4,25\r\n"));
        assertEquals(List.of(4, 5), crlf.iv().stream().map(IvPoint::line).toList());
        MeasurementFile cr = plain.read(write("cr.csv", "# c\rV,I,T\r\r0.5,1e-5,25\r0.6,1e-4,25\r"));
        assertEquals(List.of(4, 5), cr.iv().stream().map(IvPoint::line).toList());
    }

    @Test
    void temperaturePerRowGivesSeveralTemperaturesInOneFile() throws Exception {
        MeasurementFile f = plain.read(write("multi.csv",
                "V,I,T [degC]\n0.60,1e-4,-40\n0.60,3e-4,25\n0.60,9e-4,125\n"));
        assertEquals(List.of(233.15, 298.15, 398.15), f.iv().stream().map(IvPoint::temperature).toList());
    }

    @Test
    void defaultTemperatureIsUsedWithoutTColumnAndNoted() throws Exception {
        MeasurementReader reader = new MeasurementReader(ReadOptions.defaults().withDefaultTemperature(310.0));
        MeasurementFile f = reader.read(write("no-t.csv", "V,I\n0.5,1e-5\n0.6,1e-4\n"));
        assertEquals(List.of(310.0, 310.0), f.iv().stream().map(IvPoint::temperature).toList());
        assertEquals(1, f.notices().size());
        assertEquals(1, f.notices().get(0).line());
        assertMentions(f.notices().get(0).message(), "no T column");
    }

    @Test
    void defaultTemperatureBesideTColumnIsNotedAndFillsOnlyEmptyCells() throws Exception {
        MeasurementReader reader = new MeasurementReader(ReadOptions.defaults().withDefaultTemperature(310.0));
        MeasurementFile f = reader.read(write("t-and-default.csv", "V,I,T\n0.5,1e-5,25\n0.6,1e-4,\n"));
        assertEquals(List.of(298.15, 310.0), f.iv().stream().map(IvPoint::temperature).toList());
        List<Notice> n = f.notices();
        assertEquals(2, n.size(), n.toString());
        assertEquals(1, n.get(0).line());
        assertMentions(n.get(0).message(), "used only for empty T cells");
        assertEquals(3, n.get(1).line());
        assertMentions(n.get(1).message(), "empty T cell");
    }

    @Test
    void sha256IsThatOfTheRawBytes() throws Exception {
        Path file = write("hash.csv", "# x\nV,I,T\n0.5,1e-5,25\n");
        MeasurementFile f = plain.read(file);
        assertEquals(sha256(Files.readAllBytes(file)), f.sha256());
    }

    @Test
    void reversePointsAreKeptInFileOrder() throws Exception {
        MeasurementFile f = plain.read(write("reverse.csv",
                "V,I [nA],T\n-10,-2.5,25\n0.5,12000,25\n-1,-1.5,25\n-20,-3,25\n"));
        assertEquals(List.of(new IvPoint(-10, -2.5e-9, 298.15, 2), new IvPoint(0.5, 1.2e-5, 298.15, 3),
                new IvPoint(-1, -1.5e-9, 298.15, 4), new IvPoint(-20, -3e-9, 298.15, 5)), f.iv());
        assertTrue(f.notices().isEmpty(), f.notices().toString());
    }

    @Test
    void extraColumnsAreIgnoredAndListedOnce() throws Exception {
        MeasurementFile f = plain.read(write("extra.csv",
                "time (s),V,I,T,range\n0,0.5,1e-5,25,auto\n1,0.6,1e-4,25,auto\n"));
        assertEquals(2, f.iv().size());
        assertEquals(1, f.notices().size(), f.notices().toString());
        Notice n = f.notices().get(0);
        assertEquals(1, n.line());
        assertMentions(n.message(), "'time (s)' (column 1)");
        assertMentions(n.message(), "'range' (column 5)");
    }

    @Test
    void zeroCurrentRowsAreKeptAndNoted() throws Exception {
        MeasurementFile f = plain.read(write("zero.csv", "V,I,T\n0,0,25\n0.5,1e-5,25\n-1,0,25\n"));
        assertEquals(List.of(0.0, 1e-5, 0.0), f.iv().stream().map(IvPoint::current).toList());
        assertEquals(List.of(2, 4), f.notices().stream().map(Notice::line).toList());
        assertMentions(f.notices().get(0).message(), "current is exactly zero");
    }

    @Test
    void quotedCellsAreRead() throws Exception {
        MeasurementFile f = plain.read(write("quoted.csv", "\"V\",\"I [mA]\",\"T\"\n\"0.5\",\"1.5\",25\n"));
        assertEquals(List.of(new IvPoint(0.5, 1.5e-3, 298.15, 2)), f.iv());
    }

    @Test
    void unitlessTemperatureThatLooksLikeKelvinIsNoted() throws Exception {
        MeasurementFile f = plain.read(write("kelvin-as-celsius.csv", "V,I,T\n0.5,1e-5,300\n0.6,1e-4,300\n"));
        assertEquals(573.15, f.iv().get(0).temperature());
        assertEquals(1, f.notices().size(), f.notices().toString());
        assertEquals(2, f.notices().get(0).line());
        assertMentions(f.notices().get(0).message(), "write 'T [K]'");
    }

    @Test
    void anotherDelimiterCanBePassedInTheOptions() throws Exception {
        MeasurementReader reader = new MeasurementReader(ReadOptions.defaults().withDelimiter(';'));
        MeasurementFile f = reader.read(write("semicolon.csv", "V;I [mA];T\n0.5;1.5;25\n"));
        assertEquals(List.of(new IvPoint(0.5, 1.5e-3, 298.15, 2)), f.iv());
    }

    @Test
    void noticesPrintAsFileLineMessage() throws Exception {
        Path file = write("notice.csv", "V,I,T,x\n0.5,1e-5,25,1\n");
        Notice n = plain.read(file).notices().get(0);
        assertEquals(file + ":1: ignoring 1 extra column: 'x' (column 4)", n.toString());
    }

    private Path write(String name, String content) throws IOException {
        return Files.writeString(dir.resolve(name), content, StandardCharsets.UTF_8);
    }

    private static String sha256(byte[] bytes) throws NoSuchAlgorithmException {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }
}
