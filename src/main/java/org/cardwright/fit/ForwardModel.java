package org.cardwright.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.util.Pair;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * Weighted terminal voltages of the model at the measured currents, and their derivatives with respect to
 * the free parameters, for the optimiser.
 *
 * <p>The derivative of the terminal voltage V = vd(I) + I·RS(T) at fixed current uses implicit
 * differentiation of the junction equation I = Ij(vd; p): dvd/dp = -(dIj/dp at fixed vd)/(dIj/dvd). Only the
 * explicit dIj/dp and dRS(T)/dp are taken by central differences, which needs no extra solves and is accurate
 * to about 1e-10 relative (checked against whole finite differences in the tests).
 */
final class ForwardModel implements MultivariateJacobianFunction {
    /** Central-difference step on the optimiser's scale (log or linear). */
    private static final double STEP = 1e-6;

    private final FitPoint[] points;
    private final double[] temperatures;
    private final int[] group;
    private final FreeParameters layout;
    private final SimulatorOptions options;

    ForwardModel(List<FitPoint> points, FreeParameters layout, SimulatorOptions options) {
        this.points = points.toArray(new FitPoint[0]);
        this.layout = layout;
        this.options = options;
        TreeMap<Double, Integer> index = new TreeMap<>();
        for (FitPoint pt : points) {
            index.putIfAbsent(pt.temperature(), 0);
        }
        this.temperatures = new double[index.size()];
        int k = 0;
        for (Map.Entry<Double, Integer> e : index.entrySet()) {
            temperatures[k] = e.getKey();
            e.setValue(k++);
        }
        this.group = new int[points.size()];
        for (int i = 0; i < group.length; i++) {
            group[i] = index.get(this.points[i].temperature());
        }
    }

    /** The weighted measured voltages V/sigma, the optimiser's target. */
    double[] target() {
        double[] t = new double[points.length];
        for (int i = 0; i < t.length; i++) {
            t[i] = points[i].voltage() / points[i].sigma();
        }
        return t;
    }

    /** Model terminal voltages at the measured currents for parameters {@code p} [V]. */
    double[] voltages(DiodeParameters p) {
        DiodeAtTemperature[] at = scaled(p);
        double[] v = new double[points.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = DiodeSolver.voltageAtCurrent(at[group[i]], points[i].current());
        }
        return v;
    }

    private DiodeAtTemperature[] scaled(DiodeParameters p) {
        DiodeAtTemperature[] at = new DiodeAtTemperature[temperatures.length];
        for (int k = 0; k < at.length; k++) {
            at[k] = TemperatureLaws.at(p, temperatures[k], options);
        }
        return at;
    }

    @Override
    public Pair<RealVector, RealMatrix> value(RealVector point) {
        double[] x = point.toArray();
        DiodeParameters p = layout.toParameters(x);
        DiodeAtTemperature[] at = scaled(p);
        int nFree = layout.size();
        DiodeAtTemperature[][] plus = new DiodeAtTemperature[nFree][];
        DiodeAtTemperature[][] minus = new DiodeAtTemperature[nFree][];
        double[] steps = new double[nFree];
        for (int j = 0; j < nFree; j++) {
            double h = layout.isLog(j) ? STEP : STEP * Math.max(Math.abs(x[j]), 1e-3);
            steps[j] = h;
            double[] xp = x.clone();
            xp[j] += h;
            double[] xm = x.clone();
            xm[j] -= h;
            plus[j] = scaled(layout.toParameters(xp));
            minus[j] = scaled(layout.toParameters(xm));
        }
        double[] model = new double[points.length];
        double[][] jac = new double[points.length][nFree];
        for (int i = 0; i < points.length; i++) {
            DiodeAtTemperature d = at[group[i]];
            double current = points[i].current();
            double w = 1 / points[i].sigma();
            double vd = DiodeSolver.junctionVoltageAtCurrent(d, current);
            model[i] = (vd + current * d.seriesResistance()) * w;
            double g = JunctionCurrent.conductance(d, vd);
            for (int j = 0; j < nFree; j++) {
                DiodeAtTemperature dp = plus[j][group[i]];
                DiodeAtTemperature dm = minus[j][group[i]];
                double dIdp = (JunctionCurrent.current(dp, vd) - JunctionCurrent.current(dm, vd)) / (2 * steps[j]);
                double dRdp = (dp.seriesResistance() - dm.seriesResistance()) / (2 * steps[j]);
                jac[i][j] = (-dIdp / g + current * dRdp) * w;
            }
        }
        return new Pair<>(new ArrayRealVector(model, false), new Array2DRowRealMatrix(jac, false));
    }

    /** Distinct temperatures of the points, ascending [K]. */
    double[] temperatures() {
        return temperatures.clone();
    }

    List<FitPoint> points() {
        return new ArrayList<>(List.of(points));
    }
}
