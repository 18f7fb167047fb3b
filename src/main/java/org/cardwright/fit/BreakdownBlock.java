package org.cardwright.fit;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionPartials;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * Reverse breakdown: terminal-voltage residuals at the measured (negative) currents, through ngspice's
 * breakdown equation and knee adjustment. As for forward data, voltage at a measured current is the natural
 * residual of an exponential characteristic.
 */
final class BreakdownBlock implements ResidualBlock {
    private static final Set<Param> DEPENDS = EnumSet.of(Param.BV, Param.IBV, Param.NBV, Param.TCV, Param.RS,
            Param.TRS1, Param.TRS2, Param.IS, Param.N, Param.EG, Param.XTI, Param.IKR);

    private final List<ReversePoint> points;
    private final SimulatorOptions options;
    /** Distinct temperatures of the points [K] and each point's index into them. */
    private final double[] temperatures;
    private final int[] group;
    /** The measured currents, prepared once for the solves of every evaluation. */
    private final DiodeSolver.ForcedCurrent[] forced;
    /** Two doubles the solves work in (a block is used by one thread). */
    private final double[] scratch = new double[2];

    BreakdownBlock(List<ReversePoint> points, SimulatorOptions options) {
        this.points = List.copyOf(points);
        this.options = options;
        TemperatureGroups groups = TemperatureGroups.of(this.points.toArray(new ReversePoint[0]),
                ReversePoint::temperature);
        this.temperatures = groups.temperatures();
        this.group = groups.group();
        this.forced = new DiodeSolver.ForcedCurrent[this.points.size()];
        for (int i = 0; i < forced.length; i++) {
            forced[i] = new DiodeSolver.ForcedCurrent(this.points.get(i).current());
        }
    }

    @Override
    public String label() {
        return "breakdown";
    }

    @Override
    public int size() {
        return points.size();
    }

    @Override
    public Set<Param> dependsOn() {
        return DEPENDS;
    }

    /** Modelled terminal voltages at the measured currents [V]. */
    double[] voltages(DiodeParameters p) {
        // the temperature laws once per temperature, as the points' temperatures were grouped by equality
        DiodeAtTemperature[] at = new DiodeAtTemperature[temperatures.length];
        for (int k = 0; k < at.length; k++) {
            at[k] = TemperatureLaws.at(p, temperatures[k], options);
        }
        double[] v = new double[points.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = DiodeSolver.voltageAtCurrent(at[group[i]], forced[i], scratch);
        }
        return v;
    }

    @Override
    public double[] residuals(DiodeParameters p) {
        double[] v = voltages(p);
        for (int i = 0; i < v.length; i++) {
            v[i] = (v[i] - points.get(i).voltage()) / points.get(i).sigma();
        }
        return v;
    }

    @Override
    public List<KindResiduals> summary(DiodeParameters p) {
        double[] v = voltages(p);
        Map<Double, List<Integer>> byT = org.cardwright.model.SweepTemperatures.groupIndices(
                points.stream().mapToDouble(ReversePoint::temperature).toArray(),
                org.cardwright.model.SweepTemperatures.DEFAULT_GAP);
        List<KindResiduals> out = new ArrayList<>();
        for (Map.Entry<Double, List<Integer>> e : byT.entrySet()) {
            double sum = 0;
            double max = -1;
            String worst = "";
            for (int i : e.getValue()) {
                double r = (v[i] - points.get(i).voltage()) * 1e3;
                sum += r * r;
                if (Math.abs(r) > max) {
                    max = Math.abs(r);
                    worst = points.get(i).where();
                }
            }
            out.add(new KindResiduals(label(), e.getKey(), e.getValue().size(), Math.sqrt(sum / e.getValue().size()),
                    max, "mV", worst));
        }
        return out;
    }

    /**
     * The weighted Jacobian without extra solves: at fixed (measured) current the terminal voltage
     * V = vd + I·RS(T) with Ij(vd; p) = I has dV/dx = -(dIj/dx at fixed vd)/(dIj/dvd) + I·dRS/dx (implicit
     * differentiation), dIj/dx by the chain rule over the temperature-scaled quantities ({@link JunctionPartials}),
     * and dq/dx, dRS/dx as central differences of the temperature laws once per temperature and parameter, on the
     * same steps as the default's differences of the residuals. One solve per point instead of two per parameter.
     */
    @Override
    public double[][] jacobian(FreeParameters layout, double[] x) {
        DiodeParameters p = layout.toParameters(x);
        int n = points.size();
        int nFree = layout.size();
        // the points' temperature groups of the constructor
        int groups = temperatures.length;
        DiodeAtTemperature[] at = new DiodeAtTemperature[groups];
        for (int k = 0; k < groups; k++) {
            at[k] = TemperatureLaws.at(p, temperatures[k], options);
        }
        double[][][] dq = new double[groups][nFree][];
        double[][] dRdx = new double[groups][nFree];
        boolean[] moves = new boolean[nFree];
        for (int j = 0; j < nFree; j++) {
            Param q = layout.free().get(j);
            if (!DEPENDS.contains(q)) {
                continue;
            }
            double h = layout.isLog(j) ? 1e-6 : 1e-6 * Math.max(Math.abs(x[j]), 1e-3);
            double[] span = layout.differencePoints(j, x[j], h);
            if (!(span[1] > span[0])) {
                continue;
            }
            moves[j] = true;
            DiodeParameters up = p.with(q, layout.value(j, span[1]));
            DiodeParameters down = p.with(q, layout.value(j, span[0]));
            for (int k = 0; k < groups; k++) {
                DiodeAtTemperature dp = TemperatureLaws.at(up, temperatures[k], options);
                DiodeAtTemperature dm = TemperatureLaws.at(down, temperatures[k], options);
                dq[k][j] = JunctionPartials.difference(dp, dm, span[1] - span[0]);
                dRdx[k][j] = (dp.seriesResistance() - dm.seriesResistance()) / (span[1] - span[0]);
            }
        }
        double[][] jac = new double[n][nFree];
        double[] partials = new double[JunctionPartials.SIZE];
        for (int i = 0; i < n; i++) {
            ReversePoint r = points.get(i);
            DiodeAtTemperature d = at[group[i]];
            double current = r.current();
            double vd = DiodeSolver.junctionVoltageAtCurrent(d, current);
            JunctionPartials.evaluate(d, vd, partials);
            double g = partials[JunctionPartials.CONDUCTANCE];
            double w = 1 / r.sigma();
            for (int j = 0; j < nFree; j++) {
                if (moves[j]) {
                    double dIdx = JunctionPartials.chain(partials, dq[group[i]][j]);
                    jac[i][j] = (-dIdx / g + current * dRdx[group[i]][j]) * w;
                }
            }
        }
        return jac;
    }

    List<ReversePoint> points() {
        return points;
    }
}
