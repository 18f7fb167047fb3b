package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.Param;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/**
 * The Jacobians that take dIj/dp by the chain rule over {@link org.cardwright.model.JunctionPartials} against the
 * forms they replaced, on a seeded family of invented parts: the forward block (plain and with a shunt resistor)
 * against its former central differences of the junction current at moved parameter sets (kept here as the
 * reference), and the breakdown block against central differences of its residuals, which solve every point
 * again (what it used before).
 */
class AnalyticJacobianTest {
    /**
     * Forward: agreement relative to the column's largest entry [1]. Both forms are exact up to central
     * differences with a 1e-6 step (of the currents in the reference, of the temperature-scaled quantities in the
     * new form), good to about 1e-9 of a column (common practice, no source); 1e-7 leaves room. Besides, the
     * reference cannot resolve less than the rounding of its two currents over the step, {@code CURRENT_ULPS} units
     * in the last place of the junction current (at 0.1 A, 1e-17 A over a step of 2e-6).
     */
    private static final double FORWARD_AGREEMENT = 1e-7;
    /** Units in the last place of each junction current that the reference's differences may be off by [1]. */
    private static final double CURRENT_ULPS = 4;
    /**
     * Breakdown: the reference differences two solved voltages, each converged to the solver's tolerance, over a
     * 1e-6 step; about 1e-6 of the column (as ForwardBlockSelfHeatingTest's); 2e-5 leaves room. Besides, it cannot
     * resolve less than the rounding of the two voltages over the step, {@code VOLTAGE_ULPS} units in the last place
     * of the terminal voltage (a breakdown voltage of tens of volts has ulps of 1e-14 V).
     */
    private static final double BREAKDOWN_AGREEMENT = 2e-5;
    /** Units in the last place of each solved terminal voltage that the residual differences may be off by [1]. */
    private static final double VOLTAGE_ULPS = 4;
    private static final double STEP = 1e-6;
    private static final int PARTS = 40;

    @Test
    void forwardJacobianMatchesTheCurrentDifferences() {
        Random random = new Random(1214);
        List<Param> free = List.of(Param.IS, Param.N, Param.RS, Param.ISR, Param.NR, Param.IKF, Param.VJ, Param.M,
                Param.EG, Param.XTI, Param.TRS1);
        int compared = 0;
        for (int part = 0; part < PARTS; part++) {
            Map<Param, Double> v = new EnumMap<>(Param.class);
            v.put(Param.IS, Math.pow(10, -16 + 6 * random.nextDouble()));
            v.put(Param.N, 0.98 + 0.9 * random.nextDouble());
            v.put(Param.RS, 0.05 + 2 * random.nextDouble());
            v.put(Param.ISR, Math.pow(10, -13 + 4 * random.nextDouble()));
            v.put(Param.NR, 1.6 + random.nextDouble());
            v.put(Param.IKF, Math.pow(10, -2.5 + 2 * random.nextDouble()));
            v.put(Param.VJ, 0.5 + 0.4 * random.nextDouble());
            v.put(Param.M, 0.25 + 0.5 * random.nextDouble());
            v.put(Param.EG, 1.05 + 0.1 * random.nextDouble());
            v.put(Param.XTI, 2 + 2 * random.nextDouble());
            v.put(Param.TRS1, 4e-3 * random.nextDouble());
            DiodeParameters p = DiodeParameters.of(v);
            List<FitPoint> points = new ArrayList<>();
            for (double celsius : new double[] {-55, 25, 150}) {
                for (int k = 0; k <= 24; k++) {
                    double current = 1e-9 * Math.pow(1e8, k / 24.0);
                    points.add(new FitPoint(current, 0.5, celsius + 273.15, 1e-3, "family", k + 2));
                }
            }
            double shunt = part % 2 == 0 ? 0 : Math.pow(10, -9 + 3 * random.nextDouble());
            ForwardBlock block = new ForwardBlock(points, SimulatorOptions.NGSPICE_DEFAULTS, shunt);
            FreeParameters layout = layout(p, free);
            double[] x = layout.toInternal(p);
            double[][] analytic = block.jacobian(layout, x);
            double[][] resolution = new double[points.size()][free.size()];
            double[][] reference = currentDifferences(points, layout, x, shunt, resolution);
            compared += compare(analytic, reference, FORWARD_AGREEMENT, resolution, "part " + part + " shunt " + shunt);
        }
        assertTrue(compared > PARTS * 75 * 10, "only " + compared + " entries compared");
    }

    @Test
    void breakdownJacobianMatchesDifferencesOfTheResiduals() {
        Random random = new Random(1215);
        List<Param> free = List.of(Param.BV, Param.IBV, Param.NBV, Param.TCV, Param.RS, Param.IS, Param.N,
                Param.IKR, Param.TRS1);
        int compared = 0;
        for (int part = 0; part < PARTS; part++) {
            Map<Param, Double> v = new EnumMap<>(Param.class);
            v.put(Param.IS, Math.pow(10, -15 + 5 * random.nextDouble()));
            v.put(Param.N, 1 + 0.5 * random.nextDouble());
            v.put(Param.RS, 0.2 + 5 * random.nextDouble());
            double bv = 3 + 80 * random.nextDouble();
            v.put(Param.BV, bv);
            v.put(Param.IBV, Math.pow(10, -6 + 3 * random.nextDouble()));
            v.put(Param.NBV, 0.8 + 3 * random.nextDouble());
            v.put(Param.TCV, 1e-3 * bv * (random.nextDouble() - 0.3) / 10);
            v.put(Param.IKR, Math.pow(10, -2 + 2 * random.nextDouble()));
            v.put(Param.TRS1, 3e-3 * random.nextDouble());
            DiodeParameters p = DiodeParameters.of(v);
            List<ReversePoint> points = new ArrayList<>();
            for (double celsius : new double[] {-55, 25, 150}) {
                for (int k = 0; k <= 15; k++) {
                    double current = -1e-6 * Math.pow(1e5, k / 15.0);
                    points.add(new ReversePoint(-bv, current, celsius + 273.15, 5e-3, "family", k + 2));
                }
            }
            BreakdownBlock block = new BreakdownBlock(points, SimulatorOptions.NGSPICE_DEFAULTS);
            FreeParameters layout = layout(p, free);
            double[] x = layout.toInternal(p);
            double[][] analytic = block.jacobian(layout, x);
            double[][] reference = residualDifferences(block).jacobian(layout, x);
            // the finest change of a weighted residual the reference resolves, per row and column
            double[] voltages = block.voltages(p);
            double[][] resolution = new double[points.size()][free.size()];
            for (int i = 0; i < points.size(); i++) {
                for (int j = 0; j < free.size(); j++) {
                    double span = 2 * (layout.isLog(j) ? STEP : STEP * Math.max(Math.abs(x[j]), 1e-3));
                    resolution[i][j] = VOLTAGE_ULPS * Math.ulp(voltages[i]) / span / points.get(i).sigma();
                }
            }
            compared += compare(analytic, reference, BREAKDOWN_AGREEMENT, resolution, "part " + part);
        }
        assertTrue(compared > PARTS * 48 * 8, "only " + compared + " entries compared");
    }

    private static FreeParameters layout(DiodeParameters p, List<Param> free) {
        List<double[]> bounds = new ArrayList<>();
        for (Param q : free) {
            double[] b = ForwardExtraction.defaultBounds(q);
            bounds.add(q == Param.TRS1 || q == Param.TCV ? new double[] {-1, 1} : b);
        }
        return new FreeParameters(p, free, bounds);
    }

    /**
     * Entry by entry, relative to each column's largest entry, plus the reference's resolution where given;
     * returns the number of entries compared.
     */
    private static int compare(double[][] analytic, double[][] reference, double agreement, double[][] resolution,
                               String what) {
        int n = 0;
        for (int j = 0; j < reference[0].length; j++) {
            double largest = 0;
            for (double[] row : reference) {
                largest = Math.max(largest, Math.abs(row[j]));
            }
            assertTrue(largest > 0, what + ": column " + j + " is all zero");
            for (int i = 0; i < reference.length; i++) {
                double error = Math.abs(analytic[i][j] - reference[i][j]);
                int row = i;
                int col = j;
                double scale = largest;
                double floor = resolution == null ? 0 : resolution[i][j];
                assertTrue(error <= agreement * scale + floor, () -> what + ", row " + row + ", column " + col + ": "
                        + analytic[row][col] + " against " + reference[row][col] + " (column largest " + scale + ")");
                n++;
            }
        }
        return n;
    }

    /**
     * The forward Jacobian as it was computed before: implicit differentiation with dIj/dp at fixed vd by central
     * differences of the junction current at parameter sets moved by the same steps. {@code resolution} receives
     * the finest change of each entry those differences resolve: the rounding of the currents over the step, carried
     * to the weighted voltage by at most 1/g + 2·RS.
     */
    private static double[][] currentDifferences(List<FitPoint> points, FreeParameters layout, double[] x,
                                                 double shunt, double[][] resolution) {
        SimulatorOptions options = SimulatorOptions.NGSPICE_DEFAULTS;
        DiodeParameters p = layout.toParameters(x);
        double[][] jac = new double[points.size()][layout.size()];
        for (int j = 0; j < layout.size(); j++) {
            double h = layout.isLog(j) ? STEP : STEP * Math.max(Math.abs(x[j]), 1e-3);
            double[] span = layout.differencePoints(j, x[j], h);
            Param q = layout.free().get(j);
            DiodeParameters up = p.with(q, layout.value(j, span[1]));
            DiodeParameters down = p.with(q, layout.value(j, span[0]));
            for (int i = 0; i < points.size(); i++) {
                FitPoint pt = points.get(i);
                DiodeAtTemperature d = TemperatureLaws.at(p, pt.temperature(), options);
                DiodeAtTemperature dp = TemperatureLaws.at(up, pt.temperature(), options);
                DiodeAtTemperature dm = TemperatureLaws.at(down, pt.temperature(), options);
                double current = pt.current();
                double vd = shunt == 0 ? DiodeSolver.junctionVoltageAtCurrent(d, current)
                        : ShuntedJunction.junctionVoltageAtCurrent(d, current, shunt);
                double g = JunctionCurrent.conductance(d, vd);
                double dIdp = (JunctionCurrent.current(dp, vd) - JunctionCurrent.current(dm, vd)) / (span[1] - span[0]);
                double dRdp = (dp.seriesResistance() - dm.seriesResistance()) / (span[1] - span[0]);
                double rs = d.seriesResistance();
                double a = 1 + shunt * rs;
                double ij = shunt == 0 ? current : JunctionCurrent.current(d, vd);
                double w = 1 / pt.sigma();
                resolution[i][j] = CURRENT_ULPS * Math.ulp(JunctionCurrent.current(d, vd)) / (span[1] - span[0])
                        * (1 / g + 2 * rs) * w;
                if (shunt == 0) {
                    jac[i][j] = (-dIdp / g + current * dRdp) * w;
                } else {
                    double dvd = -(a * dIdp + shunt * ij * dRdp) / (g * a + shunt);
                    jac[i][j] = (dvd * (1 + rs * g) + rs * dIdp + ij * dRdp) * w;
                }
            }
        }
        return jac;
    }

    /** The block's residuals with the interface's default Jacobian: central differences that solve again. */
    static ResidualBlock residualDifferences(ResidualBlock block) {
        return new ResidualBlock() {
            @Override
            public String label() {
                return block.label();
            }

            @Override
            public int size() {
                return block.size();
            }

            @Override
            public Set<Param> dependsOn() {
                return block.dependsOn();
            }

            @Override
            public double[] residuals(DiodeParameters p) {
                return block.residuals(p);
            }
        };
    }
}
