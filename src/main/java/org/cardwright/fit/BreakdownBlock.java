package org.cardwright.fit;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
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

    List<ReversePoint> points() {
        return points;
    }
}
