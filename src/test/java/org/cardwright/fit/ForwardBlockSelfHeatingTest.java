package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.junit.jupiter.api.Test;

/**
 * The forward block's self-heating Jacobian (implicit differentiation of the steady state T = T0 + RTH0·I·V)
 * against central differences of the residuals themselves, which solve the thermal steady state point by point
 * (SelfHeating, checked against ngspice's thermal node in the model tests).
 */
class ForwardBlockSelfHeatingTest {
    /**
     * Agreement of the two Jacobians, relative to the column's largest entry [1]: central differences with a
     * 1e-6 step on a steady state converged to 1e-10 K are good to about 1e-6 (common practice, no source).
     */
    private static final double AGREEMENT = 2e-5;

    @Test
    void selfHeatingJacobianMatchesDifferencesOfTheResiduals() {
        DiodeParameters p = DiodeParameters.of(Map.of(Param.IS, 2e-14, Param.N, 1.3, Param.RS, 0.08,
                Param.IKF, 2.0, Param.EG, 1.11, Param.XTI, 3.0, Param.TRS1, 2e-3, Param.RTH0, 60.0));
        List<FitPoint> points = new ArrayList<>();
        for (double kelvin : new double[] {298.15, 373.15}) {
            for (int k = 0; k <= 40; k++) {
                double current = 1e-7 * Math.pow(1e7, k / 40.0);
                // measured voltages near the model's, so that every point above 1 uA is heated measurably
                points.add(new FitPoint(current, 0.4 + 0.05 * Math.log10(current / 1e-7), kelvin, 1e-3, "heat", k + 2));
            }
        }
        ForwardBlock block = new ForwardBlock(points, SimulatorOptions.NGSPICE_DEFAULTS);
        List<Param> free = List.of(Param.IS, Param.N, Param.RS, Param.IKF, Param.EG, Param.XTI, Param.TRS1, Param.RTH0);
        List<double[]> bounds = new ArrayList<>();
        for (Param q : free) {
            bounds.add(ForwardExtraction.defaultBounds(q));
        }
        FreeParameters layout = new FreeParameters(p, free, bounds);
        double[] x = layout.toInternal(p);
        double[][] analytic = block.jacobian(layout, x);
        // the interface's default Jacobian: central differences of the residuals, solving again
        ResidualBlock differences = AnalyticJacobianTest.residualDifferences(block);
        double[][] numeric = differences.jacobian(layout, x);
        for (int j = 0; j < free.size(); j++) {
            double largest = 0;
            for (double[] row : numeric) {
                largest = Math.max(largest, Math.abs(row[j]));
            }
            assertTrue(largest > 0, free.get(j) + " has no effect at all");
            for (int i = 0; i < numeric.length; i++) {
                assertEquals(numeric[i][j], analytic[i][j], AGREEMENT * largest, free.get(j) + " at " + points.get(i));
            }
        }
    }
}
