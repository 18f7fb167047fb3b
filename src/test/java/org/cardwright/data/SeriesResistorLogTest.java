package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import org.cardwright.testsupport.ReferenceTable;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Kirchhoff's current law at the diode node of a series-resistor log, and the first-order propagation of the
 * stated tolerances: against the worked example of docs/bench-logs.md (computed apart from this code, with
 * Python's decimal module at 30 digits, by verify/tools/bench_log_worked_example.py) and against a Monte Carlo of
 * the same tolerances.
 */
class SeriesResistorLogTest {
    /** Double arithmetic against a 30-digit decimal computation: rounding only, well below 1e-12 [1]. */
    private static final double ROUNDING = 1e-12;
    /** A current of 50-450 nA from one division: double rounding only, 2 to 15 ulp [A]. */
    private static final double NANOAMP_ROUNDING_A = 1e-22;
    /** A current of about 4.3 mA from decimal arithmetic: double rounding only, about one ulp (8.7e-19 A) [A]. */
    private static final double MILLIAMP_ROUNDING_A = 1e-18;
    /** Monte Carlo draws per point, as issue 4 asks [1]. */
    private static final int DRAWS = 1000;
    /**
     * Acceptance of issue 4: the propagated sigma within 10 % of the Monte Carlo's. With 1000 draws the sample
     * sigma has a relative standard error of about 1/sqrt(2 * 999) = 2.2 %, so 10 % is 4.5 of those [1].
     */
    private static final double SIGMA_AGREEMENT = 0.10;
    /** A sample correlation of 1000 draws has a standard error of at most 1/sqrt(1000) = 0.032; 0.1 is 3 of them [1]. */
    private static final double CORRELATION_AGREEMENT = 0.10;
    private static final long SEED = 20240;

    /** The bench of fixtures/bench/simulated-meter-loading.csv, as its settings state it. */
    private static final SeriesResistorLog.Setup FIXTURE_BENCH = new SeriesResistorLog.Setup(10e6, 0.01, 0.05,
            0.001, new InstrumentAccuracy(0.0002, 1e-3, "0.02 % + 1 mV"),
            new InstrumentAccuracy(0.000035, 5e-6, "0.0035 % + 5 counts"), true);
    /** A bench where the meter's own error dominates, so V and I errors are strongly correlated. */
    private static final SeriesResistorLog.Setup METER_BOUND_BENCH = new SeriesResistorLog.Setup(10e6, 0.01, 0.05,
            0.0001, new InstrumentAccuracy(0.00001, 0, "0.001 %"), new InstrumentAccuracy(0.005, 0, "0.5 %"), true);

    /** Rows of the fixture spanning the range: (Vsupply [V], Rseries [ohm], Vmeter [V]). */
    private static final double[][] ROWS = {
            {1, 10, 0.766635}, {10, 10, 1.205293}, {5, 1e3, 0.713480}, {5, 1e5, 0.588291},
            {2, 10e6, 0.427678}, {10, 10e6, 0.483408}};

    /**
     * The worked example's I, meter current, u(I), u(V) and correlation, from
     * src/test/resources/reference/bench-log-worked-example.csv (made by verify/tools/bench_log_worked_example.py).
     */
    private static final String WORKED_EXAMPLE = "/reference/bench-log-worked-example.csv";

    private static double[] workedExample() {
        List<double[]> rows = ReferenceTable.rows(WORKED_EXAMPLE);
        assertEquals(1, rows.size(), WORKED_EXAMPLE);
        assertEquals(5, rows.get(0).length, WORKED_EXAMPLE);
        return rows.get(0);
    }

    @Test
    void workedExampleOfTheDocs() {
        SeriesResistorLog.Point p = SeriesResistorLog.solve(FIXTURE_BENCH, 5, 10e6, 0.461941);
        // docs/bench-logs.md, worked example (Python decimal, 30 digits; WORKED_EXAMPLE, source in its header)
        double[] w = workedExample();
        assertRelative(w[0], p.current(), "I");
        assertRelative(w[1], p.meterCurrent(), "meter current");
        assertRelative(w[2], p.currentSigma(), "sigma I");
        assertRelative(w[3], p.voltageSigma(), "sigma V");
        assertRelative(w[4], p.correlation(), "correlation");
        assertEquals(0.461941, p.voltage());
    }

    @Test
    void readerGivesTheWorkedExampleForItsLine() throws Exception {
        Path log = Simulators.projectDir().resolve("fixtures/bench/simulated-meter-loading.csv");
        MeasurementFile f = new MeasurementReader(ReadOptions.defaults()).read(log);
        IvPoint p = f.iv().stream().filter(x -> x.line() == 45).findFirst().orElseThrow();
        double[] w = workedExample();
        assertRelative(w[0], p.current(), "I");
        assertRelative(w[2], p.currentSigma(), "sigma I");
        assertRelative(w[3], p.voltageSigma(), "sigma V");
        assertRelative(w[4], p.voltageCurrentCorrelation(), "correlation");
        assertEquals(298.15, p.temperature());
    }

    @Test
    void propagatedUncertaintiesAgreeWithAMonteCarloOfTheStatedTolerances() {
        Random random = new Random(SEED);
        for (SeriesResistorLog.Setup bench : new SeriesResistorLog.Setup[] {FIXTURE_BENCH, METER_BOUND_BENCH}) {
            for (double[] row : ROWS) {
                double vs = row[0];
                double r = row[1];
                double vm = row[2];
                SeriesResistorLog.Point p = SeriesResistorLog.solve(bench, vs, r, vm);
                double[] i = new double[DRAWS];
                double[] v = new double[DRAWS];
                for (int k = 0; k < DRAWS; k++) {
                    // each input uniform within its stated bound (the reading of GUM 4.3.7), independently
                    double vsDraw = vs + uniform(random) * (bench.supply().fractionOfReading() * vs
                            + bench.supply().absolute());
                    double vmDraw = vm + uniform(random) * (bench.voltmeter().fractionOfReading() * vm
                            + bench.voltmeter().absolute());
                    double rDraw = r * (1 + uniform(random) * bench.resistorTolerance());
                    double rmDraw = bench.meterResistance() * (1 + uniform(random) * bench.meterResistanceTolerance());
                    // Kirchhoff's current law at the diode node, written out here apart from the code under test
                    i[k] = (vsDraw - vmDraw) / (rDraw + bench.sourceResistance()) - vmDraw / rmDraw;
                    v[k] = vmDraw;
                }
                double sdI = sd(i);
                double sdV = sd(v);
                double rho = correlation(v, i);
                String where = String.format(java.util.Locale.ROOT, "%s Vsupply %g V, Rseries %g ohm",
                        bench == FIXTURE_BENCH ? "fixture bench" : "meter-bound bench", vs, r);
                System.out.printf(java.util.Locale.ROOT, "%s: sigma I %.4e A (MC %.4e, ratio %.3f), sigma V %.4e V "
                                + "(MC %.4e, ratio %.3f), correlation %.3f (MC %.3f)%n", where, p.currentSigma(),
                        sdI, p.currentSigma() / sdI, p.voltageSigma(), sdV, p.voltageSigma() / sdV,
                        p.correlation(), rho);
                assertTrue(Math.abs(p.currentSigma() / sdI - 1) <= SIGMA_AGREEMENT, where + ": sigma I");
                assertTrue(Math.abs(p.voltageSigma() / sdV - 1) <= SIGMA_AGREEMENT, where + ": sigma V");
                assertTrue(Math.abs(p.correlation() - rho) <= CORRELATION_AGREEMENT, where + ": correlation");
            }
        }
    }

    @Test
    void withoutTheCorrectionTheMeterCurrentStaysInAndIsStillReported() {
        SeriesResistorLog.Setup off = new SeriesResistorLog.Setup(10e6, 0, 0, 0, null, null, false);
        SeriesResistorLog.Point p = SeriesResistorLog.solve(off, 5, 10e6, 0.5);
        assertEquals(4.5 / 10e6, p.current(), NANOAMP_ROUNDING_A);
        assertEquals(0.5 / 10e6, p.meterCurrent(), NANOAMP_ROUNDING_A);
    }

    @Test
    void withoutAnyToleranceTheUncertaintyIsUnknown() {
        SeriesResistorLog.Setup bare = new SeriesResistorLog.Setup(10e6, 0, 0, 0, null, null, true);
        SeriesResistorLog.Point p = SeriesResistorLog.solve(bare, 5, 1e3, 0.7);
        assertTrue(Double.isNaN(p.currentSigma()));
        assertTrue(Double.isNaN(p.voltageSigma()));
        assertEquals(0.0, p.correlation());
        assertEquals(4.3 / 1e3 - 0.7 / 10e6, p.current(), MILLIAMP_ROUNDING_A);
    }

    @Test
    void onlyTheMeterErrorGivesFullyNegativeCorrelation() {
        SeriesResistorLog.Setup meterOnly = new SeriesResistorLog.Setup(10e6, 0, 0, 0, null,
                new InstrumentAccuracy(0.001, 0, "0.1 %"), true);
        SeriesResistorLog.Point p = SeriesResistorLog.solve(meterOnly, 5, 1e3, 0.7);
        // a meter error moves the point along the load line: dI/dVmeter = -(1/R + 1/Rmeter), correlation -1
        assertEquals(-1.0, p.correlation(), ROUNDING);
        assertRelative((1 / 1e3 + 1 / 10e6) * p.voltageSigma(), p.currentSigma(), "sigma I");
    }

    private static double uniform(Random random) {
        return 2 * random.nextDouble() - 1;
    }

    private static double mean(double[] x) {
        double s = 0;
        for (double d : x) {
            s += d;
        }
        return s / x.length;
    }

    private static double sd(double[] x) {
        double m = mean(x);
        double s = 0;
        for (double d : x) {
            s += (d - m) * (d - m);
        }
        return Math.sqrt(s / (x.length - 1));
    }

    private static double correlation(double[] x, double[] y) {
        double mx = mean(x);
        double my = mean(y);
        double sxy = 0;
        for (int k = 0; k < x.length; k++) {
            sxy += (x[k] - mx) * (y[k] - my);
        }
        return sxy / (x.length - 1) / (sd(x) * sd(y));
    }

    private static void assertRelative(double expected, double actual, String what) {
        assertTrue(Math.abs(actual - expected) <= ROUNDING * Math.abs(expected),
                what + ": expected " + expected + ", got " + actual);
    }
}
