package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Series-resistor logs as files: detected from their columns, with temperature per row, flags, units and
 * export quirks, forward and reverse. Expected currents are Kirchhoff's current law written out in the test.
 */
class BenchLogReadingTest {
    /** A few double operations: rounding only [1]. */
    private static final double ROUNDING = 1e-14;

    @TempDir
    Path dir;

    @Test
    void aLogInAnExportWithTemperaturePerRowAndFlags() throws Exception {
        Path file = Files.writeString(dir.resolve("log.csv"), String.join("\n",
                "Instrument: invented bench",
                "meter input resistance: 1 Gohm",
                "# supply source resistance = 0,1 ohm",
                "Vsupply [V];Rseries [kohm];Vmeter [mV];T [degC];status",
                "5;1;713,48;25;OK",
                "5;10;650,2;85;",
                "5;100;;25;OVL",
                "-5;1000;-4500;25;OK", ""), StandardCharsets.UTF_8);
        MeasurementFile f = new MeasurementReader(ReadOptions.defaults()).read(file);
        assertEquals(FileLayout.SERIES_RESISTOR_LOG, f.layout());
        assertEquals(DataKind.IV, f.kind());
        List<IvPoint> p = f.iv();
        assertEquals(3, p.size(), f.notices().toString());
        assertRelative((5 - 0.71348) / 1000.1 - 0.71348 / 1e9, p.get(0).current(), "forward, 1 kohm");
        assertEquals(0.71348, p.get(0).voltage());
        assertEquals(298.15, p.get(0).temperature());
        assertRelative((5 - 0.6502) / 10000.1 - 0.6502 / 1e9, p.get(1).current(), "forward, 10 kohm");
        assertEquals(358.15, p.get(1).temperature());
        assertRelative((-5 + 4.5) / 1000000.1 + 4.5 / 1e9, p.get(2).current(), "reverse, 1000 kohm");
        assertEquals(List.of(5, 6, 8), p.stream().map(IvPoint::line).toList());
        assertTrue(f.notices().stream().anyMatch(n -> n.message().startsWith("1 row flagged in column 5 'status'")),
                f.notices().toString());
        assertTrue(f.notices().stream().anyMatch(n -> n.message().startsWith("meter loading corrected")),
                f.notices().toString());
        assertTrue(f.notices().stream().anyMatch(n -> n.message().contains("no tolerance stated")),
                f.notices().toString());
    }

    @Test
    void aSpiceSuffixUnderAPrefixedUnitIsRefused() throws IOException {
        Path file = Files.writeString(dir.resolve("suffix.csv"), String.join("\n",
                "# meter input resistance = 10 Mohm",
                "# temperature = 25 degC",
                "Vsupply,Rseries [kohm],Vmeter",
                "-5,1meg,-4.5", ""), StandardCharsets.UTF_8);
        DataFileException e = BadFixtures.assertRejected(file, ReadOptions.defaults(), 4, "1meg");
        assertMentions(e.getMessage(), "SPICE suffix 'meg' in a column whose unit 'kohm' has a prefix already");
    }

    @Test
    void aReverseLogGivesNegativeCurrentsAndVoltages() throws Exception {
        Path file = Files.writeString(dir.resolve("reverse.csv"), String.join("\n",
                "# meter input resistance = 10 Mohm",
                "# temperature = 25 degC",
                "Vsupply,Rseries,Vmeter",
                "-5,1meg,-4.5", ""), StandardCharsets.UTF_8);
        IvPoint p = new MeasurementReader(ReadOptions.defaults()).read(file).iv().get(0);
        // I = (-5 + 4.5)/1e6 - (-4.5)/1e7 = -5e-7 + 4.5e-7
        assertRelative(-5e-8, p.current(), "reverse current");
        assertEquals(-4.5, p.voltage());
    }

    @Test
    void theMeterShareIsReportedWithItsLine() throws Exception {
        Path file = Files.writeString(dir.resolve("share.csv"), String.join("\n",
                "# meter input resistance = 10 Mohm",
                "# temperature = 25 degC",
                "Vsupply,Rseries,Vmeter",
                "5,1k,0.71348",
                "5,10meg,0.461941", ""), StandardCharsets.UTF_8);
        MeasurementFile f = new MeasurementReader(ReadOptions.defaults()).read(file);
        Notice n = f.notices().stream().filter(x -> x.message().startsWith("meter loading corrected")).findFirst()
                .orElseThrow();
        // meter 0.461941/1e7 over diode (5 - 0.461941)/1e7 - 0.461941/1e7: 11.3 % (docs/bench-logs.md)
        assertMentions(n.message(), "the correction is at most 11.3 % of the diode current (line 5)");
    }

    private static void assertRelative(double expected, double actual, String what) {
        assertTrue(Math.abs(actual - expected) <= ROUNDING * Math.abs(expected),
                what + ": expected " + expected + ", got " + actual);
    }
}
