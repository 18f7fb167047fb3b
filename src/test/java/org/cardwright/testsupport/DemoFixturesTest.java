package org.cardwright.testsupport;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.sim.process.SimulatorProcess;
import org.junit.jupiter.api.Test;

/**
 * The invented demo data in fixtures/demo/ must be what its header says: the committed generating netlist,
 * run again in ngspice, reproduces every row within the stated noise, and the noise has the stated size.
 */
class DemoFixturesTest {
    /** Voltage noise of the demo data, 1 sigma: offset [V] (stated in the CSV headers). */
    private static final double VOLTAGE_NOISE_OFFSET = 0.15e-3;
    /** Voltage noise of the demo data, 1 sigma: fraction of reading [1] (stated in the CSV headers). */
    private static final double VOLTAGE_NOISE_FRACTION = 2e-4;
    /** Current noise of the demo data, 1 sigma: fraction of reading [1] (stated in the CSV headers). */
    private static final double CURRENT_NOISE_FRACTION = 1e-3;
    /** No single Gaussian draw of the ~300 is expected beyond 5 sigma (chance about 2e-4 for all of them). */
    private static final double MAX_STANDARD_SCORE = 5.0;
    /** RMS of ~300 standard scores is 1 within about 0.04 (1 sigma); 0.8..1.2 is a 5-sigma band. */
    private static final double RMS_SCORE_LOW = 0.8;
    private static final double RMS_SCORE_HIGH = 1.2;
    /** Time limit for the generating netlist, which runs in well under a second here. */
    private static final Duration TIMEOUT = Duration.ofSeconds(60);

    private static final String[] FORWARD = {"minus40C", "25C", "85C", "125C"};
    private static final int[] FORWARD_CELSIUS = {-40, 25, 85, 125};

    private record Row(double voltage, double current, double celsius) {
    }

    @Test
    void demoDataIsTheGeneratingCardPlusTheStatedNoise() throws Exception {
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        Path ngspice = Simulators.requireNgspice();
        Path work = Simulators.tempDir("demo-fixtures");
        String netlist = Files.readString(demo.resolve("generating-netlist.cir"), StandardCharsets.UTF_8);
        SimulatorProcess.Result result = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, ngspice, TIMEOUT)
                .run(netlist, work);
        assertEquals(List.of(), result.warnings(), "the generating netlist runs cleanly");

        List<Double> scores = new ArrayList<>();
        for (int k = 0; k < FORWARD.length; k++) {
            List<Row> rows = readCsv(demo.resolve("ks1-forward-" + FORWARD[k] + ".csv"));
            List<double[]> sim = readDat(work.resolve("fwd_T" + FORWARD_CELSIUS[k] + ".dat"), true);
            assertEquals(sim.size(), rows.size(), "rows in " + FORWARD[k]);
            for (int i = 0; i < rows.size(); i++) {
                // columns: exponent, v(a), @d1[vd], @d1[id]
                compare(rows.get(i), sim.get(i)[1], sim.get(i)[3], FORWARD_CELSIUS[k], scores,
                        FORWARD[k] + " row " + (i + 1));
            }
        }
        List<Row> reverse = readCsv(demo.resolve("ks1-reverse-25C.csv"));
        List<double[]> sim = readDat(work.resolve("rev.dat"), false);
        assertEquals(sim.size(), reverse.size(), "rows in reverse");
        for (int i = 0; i < reverse.size(); i++) {
            // columns: scale, v(k), @d2[vd], @d2[id]; the anode voltage is -v(k)
            compare(reverse.get(i), -sim.get(i)[1], sim.get(i)[3], 25, scores, "reverse row " + (i + 1));
            assertTrue(reverse.get(i).current() < 0, "reverse current is negative, row " + (i + 1));
        }

        double rms = Math.sqrt(scores.stream().mapToDouble(s -> s * s).average().orElseThrow());
        assertTrue(rms > RMS_SCORE_LOW && rms < RMS_SCORE_HIGH,
                "noise has the stated size: RMS standard score " + rms + " over " + scores.size() + " draws");
    }

    @Test
    void everyDemoFileSaysItIsInvented() throws IOException {
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        try (var files = Files.list(demo)) {
            List<Path> csvs = files.filter(p -> p.toString().endsWith(".csv")).sorted().toList();
            assertEquals(5, csvs.size(), "four forward files and one reverse file: " + csvs);
            for (Path csv : csvs) {
                String first = Files.readAllLines(csv, StandardCharsets.UTF_8).get(0);
                assertEquals("# Invented demo data, not a measurement.", first, csv.toString());
            }
        }
    }

    /** Standard scores of the noise; the %.7f / %.6e rounding of the CSV is far below the noise. */
    private static void compare(Row row, double voltage, double current, double celsius, List<Double> scores,
            String where) {
        assertEquals(celsius, row.celsius(), 0.0, where + ": temperature column");
        double voltageScore = (row.voltage() - voltage)
                / (VOLTAGE_NOISE_OFFSET + VOLTAGE_NOISE_FRACTION * Math.abs(voltage));
        double currentScore = (row.current() / current - 1.0) / CURRENT_NOISE_FRACTION;
        assertTrue(Math.abs(voltageScore) < MAX_STANDARD_SCORE, where + ": voltage " + row.voltage()
                + " V against simulated " + voltage + " V is " + voltageScore + " sigma");
        assertTrue(Math.abs(currentScore) < MAX_STANDARD_SCORE, where + ": current " + row.current()
                + " A against simulated " + current + " A is " + currentScore + " sigma");
        scores.add(voltageScore);
        scores.add(currentScore);
    }

    private static List<Row> readCsv(Path file) throws IOException {
        List<Row> rows = new ArrayList<>();
        boolean header = true;
        for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
            if (line.startsWith("#")) {
                continue;
            }
            if (header) {
                assertEquals("V [V],I [A],T [degC]", line, file + ": column header");
                header = false;
                continue;
            }
            String[] f = line.split(",");
            rows.add(new Row(Double.parseDouble(f[0]), Double.parseDouble(f[1]), Double.parseDouble(f[2])));
        }
        return rows;
    }

    private static List<double[]> readDat(Path file, boolean header) throws IOException {
        List<double[]> rows = new ArrayList<>();
        List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        for (int i = header ? 1 : 0; i < lines.size(); i++) {
            if (lines.get(i).isBlank()) {
                continue;
            }
            String[] f = lines.get(i).trim().split("\\s+");
            double[] row = new double[f.length];
            for (int c = 0; c < f.length; c++) {
                row[c] = Double.parseDouble(f[c]);
            }
            rows.add(row);
        }
        return rows;
    }
}
