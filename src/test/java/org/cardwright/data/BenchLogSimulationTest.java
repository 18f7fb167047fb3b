package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The simulated series-resistor bench log in fixtures/bench: its committed generating netlist is run again in
 * ngspice 39, and the currents the reader derives from the log are compared with the diode current ngspice
 * computed (@d1[id]) at every point. With the meter-loading correction they must agree within 0.1 %; without
 * it the top decade of series resistance (10 Mohm, as large as the meter's own input resistance) must be off
 * by several percent, which is what the correction is for.
 */
class BenchLogSimulationTest {
    /** The acceptance bound of issue 4 for corrected currents: 0.1 % of the true diode current [1]. */
    private static final double CORRECTED_TOLERANCE = 1e-3;
    /**
     * "Several percent": the least error the uncorrected currents must show somewhere in the top decade. With
     * a 10 Mohm meter and a 10 Mohm series resistor the meter draws Vd/(Vsupply - Vd) of the resistor current,
     * about 5 % at 10 V and more at lower supplies (common practice, no source); 3 % is a floor below that [1].
     */
    private static final double UNCORRECTED_TOP_DECADE_FLOOR = 0.03;
    /** The log writes the meter reading rounded to 1 uV; half a count is the most it may differ [V]. */
    private static final double METER_ROUNDING = 0.5e-6;
    /** Series resistance of the top decade in the log [ohm]. */
    private static final double TOP_DECADE = 10e6;
    /** Slack on METER_ROUNDING for the double rounding of the comparison itself (1 pV) [V]. */
    private static final double COMPARISON_ROUNDING_V = 1e-12;
    /** The truth file writes 16 significant digits: equal to the simulated value within 1e-15 relative [1]. */
    private static final double SIXTEEN_DIGITS = 1e-15;
    /** Time limit for the 28 operating points, which take well under a second here. */
    private static final Duration TIMEOUT = Duration.ofSeconds(60);

    private static Path bench() {
        return Simulators.projectDir().resolve("fixtures").resolve("bench");
    }

    @Test
    void correctedCurrentsMatchTheSimulatedDiodeAndUncorrectedOnesDoNot() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        Path work = Simulators.tempDir("bench-log");
        String netlist = Files.readString(bench().resolve("generating-netlist.cir"), StandardCharsets.UTF_8);
        SimulatorProcess.Result result = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, ngspice, TIMEOUT)
                .run(netlist, work);
        assertEquals(List.of(), result.warnings(), "the generating netlist runs cleanly");
        List<double[]> sim = readDat(work.resolve("bench.dat"));

        Path log = bench().resolve("simulated-meter-loading.csv");
        MeasurementFile corrected = new MeasurementReader(ReadOptions.defaults()).read(log);
        MeasurementFile raw = new MeasurementReader(ReadOptions.defaults().withoutMeterLoadingCorrection()).read(log);
        assertEquals(FileLayout.SERIES_RESISTOR_LOG, corrected.layout());
        assertEquals(DataKind.IV, corrected.kind());
        assertEquals(sim.size(), corrected.iv().size(), "one point per operating point");
        List<Double> series = seriesResistances(log);

        double worstCorrected = 0;
        double worstRawTop = 0;
        double worstRawElsewhere = 0;
        List<String> topDecade = new ArrayList<>();
        for (int k = 0; k < sim.size(); k++) {
            double trueVoltage = sim.get(k)[1];
            double trueCurrent = sim.get(k)[2];
            IvPoint c = corrected.iv().get(k);
            IvPoint r = raw.iv().get(k);
            assertTrue(Math.abs(c.voltage() - trueVoltage) <= METER_ROUNDING + COMPARISON_ROUNDING_V,
                    "line " + c.line() + ": the log's Vmeter is the simulated v(d) rounded to 1 uV");
            double errCorrected = Math.abs(c.current() / trueCurrent - 1);
            double errRaw = Math.abs(r.current() / trueCurrent - 1);
            worstCorrected = Math.max(worstCorrected, errCorrected);
            assertTrue(errCorrected <= CORRECTED_TOLERANCE, "line " + c.line() + ": corrected current "
                    + c.current() + " A vs true " + trueCurrent + " A, off by " + 100 * errCorrected + " %");
            if (series.get(k) == TOP_DECADE) {
                worstRawTop = Math.max(worstRawTop, errRaw);
                topDecade.add(String.format(java.util.Locale.ROOT, "line %d: %.1f %%", r.line(), 100 * errRaw));
            } else {
                worstRawElsewhere = Math.max(worstRawElsewhere, errRaw);
            }
        }
        System.out.printf("bench log vs ngspice @d1[id], %d points: corrected max error %.2e %%; uncorrected max "
                        + "error %.2f %% at 10 Mohm, %.3f %% below%n", sim.size(), 100 * worstCorrected,
                100 * worstRawTop, 100 * worstRawElsewhere);
        System.out.println("uncorrected error in the top decade, by supply 1, 2, 5, 10 V: " + topDecade);
        assertTrue(worstRawTop >= UNCORRECTED_TOP_DECADE_FLOOR, "uncorrected currents in the top decade are off "
                + "by only " + 100 * worstRawTop + " %; the test bench no longer shows meter loading");
        assertTrue(corrected.notices().stream().anyMatch(n -> n.message().startsWith("meter loading corrected")),
                corrected.notices().toString());
        assertTrue(raw.notices().stream().anyMatch(n -> n.message().startsWith("meter loading NOT corrected")),
                raw.notices().toString());
    }

    @Test
    void truthFileHoldsTheSimulatedDiodePoints() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        Path work = Simulators.tempDir("bench-truth");
        String netlist = Files.readString(bench().resolve("generating-netlist.cir"), StandardCharsets.UTF_8);
        new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, ngspice, TIMEOUT).run(netlist, work);
        List<double[]> sim = readDat(work.resolve("bench.dat"));
        MeasurementFile truth = new MeasurementReader(ReadOptions.defaults())
                .read(bench().resolve("simulated-meter-loading-truth.csv"));
        assertEquals(sim.size(), truth.iv().size());
        for (int k = 0; k < sim.size(); k++) {
            // written with 16 significant digits: equal to the simulated value within 1e-15 relative
            assertEquals(sim.get(k)[1], truth.iv().get(k).voltage(), SIXTEEN_DIGITS * Math.abs(sim.get(k)[1]));
            assertEquals(sim.get(k)[2], truth.iv().get(k).current(), SIXTEEN_DIGITS * Math.abs(sim.get(k)[2]));
        }
    }

    /** Rows of bench.dat as {v(s), v(d), @d1[id], @r1[i], @rm[i]} (the scale column dropped). */
    private static List<double[]> readDat(Path file) throws Exception {
        List<double[]> rows = new ArrayList<>();
        for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
            String t = line.strip();
            if (t.isEmpty()) {
                continue;
            }
            String[] cells = t.split("\\s+");
            assertEquals(6, cells.length, "bench.dat row: " + line);
            double[] row = new double[5];
            for (int i = 0; i < 5; i++) {
                row[i] = Double.parseDouble(cells[i + 1]);
            }
            rows.add(row);
        }
        return rows;
    }

    /** The Rseries column of the log in SI units, read independently of the reader (SPICE suffixes k, meg). */
    private static List<Double> seriesResistances(Path log) throws Exception {
        List<Double> r = new ArrayList<>();
        boolean header = false;
        for (String line : Files.readAllLines(log, StandardCharsets.UTF_8)) {
            if (line.startsWith("#") || line.isBlank()) {
                continue;
            }
            if (!header) {
                header = true;
                continue;
            }
            String cell = line.split(",")[1];
            double scale = cell.endsWith("meg") ? 1e6 : cell.endsWith("k") ? 1e3 : 1;
            r.add(Double.parseDouble(cell.replace("meg", "").replace("k", "")) * scale);
        }
        return r;
    }
}
