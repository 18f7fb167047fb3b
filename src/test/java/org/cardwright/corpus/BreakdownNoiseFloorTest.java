package org.cardwright.corpus;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.data.ReadOptions;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.testsupport.Simulators;
import org.cardwright.workflow.Inputs;
import org.junit.jupiter.api.Test;

/**
 * Why the corpus part gorse misses issue 9's 0.05 % breakdown target (CorpusAcceptanceTest.KNOWN_OPEN): not the
 * extraction but the data. Where IBV is far above IS(T)·BV/Vt (no knee coupling left, diode-model.md section 3), the
 * ngspice 39 breakdown branch with TLEV 0 is, to within IS·BV/Vt, the terminal voltage
 * |V| = BV - TCV·(T - TNOM) + NBV·(k/q)·T·ln(I/IBV) + I·RS: linear in three combinations
 * {1, T - TNOM, (k/q)·T·ln I} (IBV trades exactly with BV and TCV). Ordinary least squares on those three columns is
 * then the best unbiased estimate from Gaussian jitter (Gauss-Markov theorem; e.g. Seber and Lee, "Linear Regression
 * Analysis", 2nd ed., Wiley 2003, section 3.2). This test computes that estimate from gorse's noisy breakdown rows
 * independently of the fit code (with the fit's RS, which the forward data fix to 0.05 %) and requires the fitted
 * card's breakdown voltages to lie on it: the fit is at the optimum, and the optimum itself is 0.07 % off the
 * generating card on this noise draw (7 mV of jitter on 6.8 V, 60 rows). A Monte Carlo of the same design (same
 * rows, fresh 7 mV draws rounded to 1 mV, the same least squares; 4000 draws, run while writing this test and not
 * repeated here) put about 3 draws in 10 beyond 0.05 %, this one at the 93rd percentile.
 */
class BreakdownNoiseFloorTest {
    /** The fitted card within this of the least-squares line at every breakdown row: 2 % of the 7 mV jitter [V]. */
    private static final double ON_THE_OPTIMUM = 0.15e-3;
    /** Picks the rows at a forced breakdown current: the files print the current to better than 0.2 % [1]. */
    private static final double SAME_FORCED_CURRENT = 2e-3;

    @Test
    void gorseBreakdownIsTheLeastSquaresOptimumOfItsData() throws Exception {
        Simulators.requireNgspice();
        Path project = Simulators.projectDir();
        CorpusFigures.Part part = CorpusFigures.parts(project).stream().filter(p -> p.name().equals("gorse"))
                .findFirst().orElseThrow();
        CorpusFigures.Figures f = CorpusFigures.of(part, true, Simulators.tempDir("noise-floor-gorse"));
        DiodeParameters fit = f.outcome().fit().parameters();
        double rs = fit.get(Param.RS);
        double tnom = fit.nominalTemperature();
        List<Double> forced = CorpusFigures.forcedBreakdownCurrents(part);
        List<double[]> rows = new ArrayList<>(); // |I|, T, |V|
        for (Inputs.Located l : Inputs.read(CorpusFigures.files(part, true), ReadOptions.defaults()).reverse()) {
            double i = -l.point().current();
            if (forced.stream().anyMatch(x -> Math.abs(i - x) <= SAME_FORCED_CURRENT * x)) {
                rows.add(new double[] {i, l.point().temperature(), -l.point().voltage()});
            }
        }
        // normal equations of the three-column model
        double[][] a = new double[3][3];
        double[] b = new double[3];
        for (double[] r : rows) {
            double[] x = columns(r[0], r[1], tnom);
            double y = r[2] - r[0] * rs;
            for (int j = 0; j < 3; j++) {
                b[j] += x[j] * y;
                for (int k = 0; k < 3; k++) {
                    a[j][k] += x[j] * x[k];
                }
            }
        }
        double[] c = solve(a, b);
        double worstOff = 0;
        double worstOlsVsTruth = 0;
        for (double[] r : rows) {
            double[] x = columns(r[0], r[1], tnom);
            double ols = c[0] * x[0] + c[1] * x[1] + c[2] * x[2] + r[0] * rs;
            double card = -DiodeSolver.voltageAtCurrent(TemperatureLaws.at(fit, r[1], SimulatorOptions.NGSPICE_DEFAULTS), -r[0]);
            double truth = -DiodeSolver.voltageAtCurrent(
                    TemperatureLaws.at(part.generating(), r[1], SimulatorOptions.NGSPICE_DEFAULTS), -r[0]);
            worstOff = Math.max(worstOff, Math.abs(card - ols));
            worstOlsVsTruth = Math.max(worstOlsVsTruth, Math.abs(ols - truth) / truth);
        }
        System.out.printf(Locale.ROOT, "gorse: %d breakdown rows; fitted card vs least squares %.4f mV; least squares vs"
                + " generating card %.4f %% (fit's figure %.4f %%)%n", rows.size(), worstOff * 1e3, worstOlsVsTruth * 100,
                f.breakdownPct());
        assertTrue(rows.size() >= 50, "the breakdown rows of gorse: " + rows.size());
        assertTrue(worstOff <= ON_THE_OPTIMUM, String.format(Locale.ROOT,
                "the fitted card is %.4f mV off the least-squares optimum of its data", worstOff * 1e3));
    }

    private static double[] columns(double current, double kelvin, double tnom) {
        return new double[] {1, kelvin - tnom, Ngspice39.K_OVER_Q * kelvin * Math.log(current)};
    }

    /** Gaussian elimination with partial pivoting of a small dense system. */
    private static double[] solve(double[][] a0, double[] b0) {
        int n = b0.length;
        double[][] a = new double[n][];
        double[] b = b0.clone();
        for (int i = 0; i < n; i++) {
            a[i] = a0[i].clone();
        }
        for (int col = 0; col < n; col++) {
            int piv = col;
            for (int r = col + 1; r < n; r++) {
                if (Math.abs(a[r][col]) > Math.abs(a[piv][col])) {
                    piv = r;
                }
            }
            double[] t = a[col];
            a[col] = a[piv];
            a[piv] = t;
            double tb = b[col];
            b[col] = b[piv];
            b[piv] = tb;
            for (int r = col + 1; r < n; r++) {
                double f = a[r][col] / a[col][col];
                for (int k = col; k < n; k++) {
                    a[r][k] -= f * a[col][k];
                }
                b[r] -= f * b[col];
            }
        }
        double[] x = new double[n];
        for (int i = n - 1; i >= 0; i--) {
            double s = b[i];
            for (int k = i + 1; k < n; k++) {
                s -= a[i][k] * x[k];
            }
            x[i] = s / a[i][i];
        }
        return x;
    }
}
