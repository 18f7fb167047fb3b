package org.cardwright.fit;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.SweepTemperatures;
import org.cardwright.model.TemperatureLaws;

/**
 * C-V: capacitance residuals (C_model + C_stray - C_measured)/sigma at the measured terminal voltages, at every
 * measured temperature through ngspice's TLEVC 0 laws for CJ(T) and VJ(T).
 *
 * <p>The model value is the parallel capacitance an LCR meter reads at the test frequency
 * ({@link JunctionCapacitance#terminalParallel}): the junction capacitance (depletion, and TT·g diffusion) at the
 * junction voltage vd, which equals the terminal voltage in reverse and small forward bias and otherwise is
 * solved from it through RS(T); RS then lowers the reading by (1 + RS g)^2 + (RS omega C)^2, a negligible
 * factor except in strong forward bias. So the residuals depend on CJO, VJ, M, FC, TT and, through vd and g,
 * on the DC parameters. Derivatives are central differences on the optimiser's scale (the interface default).
 */
public final class CapacitanceBlock implements ResidualBlock {
    private static final Set<Param> DEPENDS = EnumSet.of(Param.CJO, Param.VJ, Param.M, Param.FC, Param.TT,
            Param.IS, Param.N, Param.RS, Param.ISR, Param.NR, Param.IKF, Param.IKR, Param.EG, Param.XTI,
            Param.TRS1, Param.TRS2, Param.BV, Param.IBV, Param.NBV, Param.TCV);

    private final CapacitancePoint[] points;
    private final double[] temperatures;
    private final int[] group;
    private final double strayCapacitance;
    private final double frequency;
    private final SimulatorOptions options;

    /**
     * @param points           the measurements
     * @param strayCapacitance known fixture/stray capacitance in parallel with the device, included in every
     *                         reading [F]
     * @param frequency        test-signal frequency of the readings, positive [Hz]
     * @param options          GMIN and RELTOL of the model
     */
    public CapacitanceBlock(List<CapacitancePoint> points, double strayCapacitance, double frequency,
                            SimulatorOptions options) {
        if (!Double.isFinite(strayCapacitance)) {
            throw new IllegalArgumentException("stray capacitance must be finite, got " + strayCapacitance + " F");
        }
        if (!(frequency > 0) || !Double.isFinite(frequency)) {
            throw new IllegalArgumentException("test frequency must be positive, got " + frequency + " Hz");
        }
        this.points = points.toArray(new CapacitancePoint[0]);
        this.strayCapacitance = strayCapacitance;
        this.frequency = frequency;
        this.options = options;
        TemperatureGroups groups = TemperatureGroups.of(this.points, CapacitancePoint::temperature);
        this.temperatures = groups.temperatures();
        this.group = groups.group();
    }

    @Override
    public String label() {
        return "C-V";
    }

    @Override
    public int size() {
        return points.length;
    }

    @Override
    public Set<Param> dependsOn() {
        return DEPENDS;
    }

    /** Model capacitance of the device alone (no stray) at each measured point, for parameters {@code p} [F]. */
    public double[] capacitances(DiodeParameters p) {
        DiodeAtTemperature[] at = new DiodeAtTemperature[temperatures.length];
        for (int k = 0; k < at.length; k++) {
            at[k] = TemperatureLaws.at(p, temperatures[k], options);
        }
        double[] c = new double[points.length];
        for (int i = 0; i < c.length; i++) {
            c[i] = JunctionCapacitance.terminalParallel(at[group[i]], points[i].voltage(), frequency);
        }
        return c;
    }

    @Override
    public double[] residuals(DiodeParameters p) {
        double[] c = capacitances(p);
        for (int i = 0; i < c.length; i++) {
            c[i] = (c[i] + strayCapacitance - points[i].capacitance()) / points[i].sigma();
        }
        return c;
    }

    /**
     * Residual statistics per temperature, ascending, in % of the measured device capacitance (reading minus
     * stray), for parameters {@code p}.
     */
    @Override
    public List<KindResiduals> summary(DiodeParameters p) {
        List<KindResiduals> out = new java.util.ArrayList<>();
        for (CapacitanceResiduals r : statistics(p)) {
            out.add(new KindResiduals(label(), r.temperature(), r.points(), r.rmsPercent(), r.maxPercent(), "%",
                    r.worstSource()));
        }
        return out;
    }

    public List<CapacitanceResiduals> statistics(DiodeParameters p) {
        double[] c = capacitances(p);
        List<CapacitanceResiduals> out = new ArrayList<>();
        double[] pointTemperatures = new double[points.length];
        for (int i = 0; i < points.length; i++) {
            pointTemperatures[i] = points[i].temperature();
        }
        // one row per sweep (logged temperatures that wander form one sweep), not per distinct temperature
        for (Map.Entry<Double, List<Integer>> e : SweepTemperatures.groupIndices(pointTemperatures,
                SweepTemperatures.DEFAULT_GAP).entrySet()) {
            double sum = 0;
            double max = -1;
            int count = 0;
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            CapacitancePoint worst = null;
            for (int i : e.getValue()) {
                CapacitancePoint pt = points[i];
                double device = pt.capacitance() - strayCapacitance;
                double r = 100 * (c[i] - device) / device;
                sum += r * r;
                count++;
                if (Math.abs(r) > max) {
                    max = Math.abs(r);
                    worst = pt;
                }
                lo = Math.min(lo, pt.voltage());
                hi = Math.max(hi, pt.voltage());
            }
            out.add(new CapacitanceResiduals(e.getKey(), count, lo, hi, Math.sqrt(sum / count), max,
                    worst.voltage(), worst.where()));
        }
        return out;
    }

    /** The measurements, in the order of the residuals. */
    public List<CapacitancePoint> points() {
        return List.of(points);
    }

    /** Distinct temperatures of the points, ascending [K]. */
    public double[] temperatures() {
        return temperatures.clone();
    }

    /** Stray capacitance included in every reading [F]. */
    public double strayCapacitance() {
        return strayCapacitance;
    }

    /** Test-signal frequency [Hz]. */
    public double frequency() {
        return frequency;
    }
}
