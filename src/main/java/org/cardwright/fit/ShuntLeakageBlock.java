package org.cardwright.fit;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * Reverse leakage below breakdown, fitted only when the fit carries a shunt: the terminal voltage of the diode
 * with a conductance G between its terminals ({@link ShuntedJunction}) at the measured (negative) current, minus
 * the measured voltage, divided by the point's uncertainty. Without a shunt a level-1 junction carries about IS
 * plus GMIN·|V| in reverse, and its voltage at a measured leakage current is not determined by the data, so
 * this block exists only beside a shunt.
 */
final class ShuntLeakageBlock implements ResidualBlock {
    private static final Set<Param> DEPENDS = EnumSet.of(Param.IS, Param.N, Param.RS, Param.ISR, Param.NR,
            Param.IKF, Param.IKR, Param.EG, Param.XTI, Param.TRS1, Param.TRS2, Param.VJ, Param.M, Param.BV,
            Param.IBV, Param.NBV, Param.TCV);

    /**
     * Relative uncertainty of a leakage current reading when the data state none: 0.5 %, the conservative end of a
     * source-measure unit's reading accuracy on its nA to µA ranges (common practice, no source), as conservative
     * as the forward default of 1 mV against a meter's 0.1 mV count [1].
     */
    static final double LEAKAGE_CURRENT_SIGMA = 5e-3;

    private final List<ReversePoint> points;
    private final SimulatorOptions options;
    private final double shunt;

    ShuntLeakageBlock(List<ReversePoint> points, SimulatorOptions options, double shunt) {
        if (!(shunt > 0) || !Double.isFinite(shunt)) {
            throw new IllegalArgumentException("a leakage block needs a positive shunt conductance, got " + shunt);
        }
        this.points = List.copyOf(points);
        this.options = options;
        this.shunt = shunt;
    }

    ShuntLeakageBlock withShunt(double conductance) {
        return new ShuntLeakageBlock(points, options, conductance);
    }

    @Override
    public String label() {
        return "reverse leakage";
    }

    @Override
    public int size() {
        return points.size();
    }

    @Override
    public Set<Param> dependsOn() {
        return DEPENDS;
    }

    /** Model terminal voltages at the measured currents [V]. */
    double[] voltages(DiodeParameters p) {
        double[] v = new double[points.size()];
        java.util.Map<Double, DiodeAtTemperature> at = new java.util.HashMap<>();
        for (int i = 0; i < v.length; i++) {
            ReversePoint r = points.get(i);
            DiodeAtTemperature d = at.computeIfAbsent(r.temperature(), t -> TemperatureLaws.at(p, t, options));
            v[i] = ShuntedJunction.voltageAtCurrent(d, r.current(), shunt);
        }
        return v;
    }

    @Override
    public double[] residuals(DiodeParameters p) {
        double[] v = voltages(p);
        java.util.Map<Double, DiodeAtTemperature> at = new java.util.HashMap<>();
        for (int i = 0; i < v.length; i++) {
            ReversePoint r = points.get(i);
            DiodeAtTemperature d = at.computeIfAbsent(r.temperature(), t -> TemperatureLaws.at(p, t, options));
            v[i] = (v[i] - r.voltage()) / effectiveSigma(d, r, v[i]);
        }
        return v;
    }

    /**
     * The uncertainty of the voltage residual of a leakage row, whose source forces the voltage and reads the
     * current: the current reading's uncertainty seen through the slope of the curve, σ_I/(dI/dV), added in
     * quadrature to the voltage's (effective variance; J. Orear, "Least squares when both variables have errors",
     * Am. J. Phys. 50 (1982) 912). Along a resistive line dI/dV is about G, so a small relative current error is a
     * large voltage one; with the voltage σ alone, a few leakage rows would outweigh every forward point [V].
     */
    private double effectiveSigma(DiodeAtTemperature d, ReversePoint r, double v) {
        double step = Math.max(1e-3, 1e-6 * Math.abs(v));
        double slope = (ShuntedJunction.currentAtVoltage(d, v + step, shunt)
                - ShuntedJunction.currentAtVoltage(d, v - step, shunt)) / (2 * step);
        double fromCurrent = slope > 0 ? LEAKAGE_CURRENT_SIGMA * Math.abs(r.current()) / slope : 0;
        return Math.hypot(r.sigma(), fromCurrent);
    }

    @Override
    public List<KindResiduals> summary(DiodeParameters p) {
        double[] v = voltages(p);
        java.util.Map<Double, List<Integer>> byT = new java.util.TreeMap<>();
        for (int i = 0; i < v.length; i++) {
            byT.computeIfAbsent(points.get(i).temperature(), t -> new ArrayList<>()).add(i);
        }
        List<KindResiduals> out = new ArrayList<>();
        for (var e : byT.entrySet()) {
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
            out.add(new KindResiduals("leakage", e.getKey(), e.getValue().size(), Math.sqrt(sum / e.getValue().size()),
                    max, "mV", worst));
        }
        return out;
    }
}
