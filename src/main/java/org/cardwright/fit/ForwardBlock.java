package org.cardwright.fit;

import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.JunctionPartials;
import org.cardwright.model.Param;
import org.cardwright.model.SelfHeating;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * Forward I-V: terminal-voltage residuals at the measured currents. Voltage at forced current is the
 * natural log-space residual of an exponential characteristic: every decade of current weighs the same.
 *
 * <p>The derivative of the terminal voltage V = vd(I) + I·RS(T) at fixed current uses implicit
 * differentiation of the junction equation I = Ij(vd; p): dvd/dp = -(dIj/dp at fixed vd)/(dIj/dvd). The
 * explicit dIj/dp is the chain rule sum over the temperature-scaled quantities q of (dIj/dq)(dq/dp), with dIj/dq
 * exact from one evaluation per point ({@link JunctionPartials}); only dq/dp and dRS(T)/dp, once per temperature
 * and parameter, are central differences of the temperature laws. No extra solves; accurate to about 1e-10
 * relative.
 */
final class ForwardBlock implements ResidualBlock {
    /** Central-difference step on the optimiser's scale (log or linear). */
    private static final double STEP = 1e-6;
    /** Below this estimated self-heating the junction is taken as isothermal (far below the 1e-6 V goal) [K]. */
    private static final double NEGLIGIBLE_RISE = 1e-6;
    /** Temperature step of the central difference dF/dT in the self-heating Jacobian [K]. */
    private static final double TEMPERATURE_STEP = 1e-2;
    private static final Set<Param> DEPENDS = EnumSet.of(Param.IS, Param.N, Param.RS, Param.ISR, Param.NR,
            Param.IKF, Param.EG, Param.XTI, Param.TRS1, Param.TRS2, Param.VJ, Param.M, Param.BV, Param.IBV, Param.NBV,
            Param.TCV, Param.RTH0);

    /** Parameters that act only through the series resistance RS(T), never on the junction current. */
    private static final Set<Param> RESISTANCE_ONLY = EnumSet.of(Param.RS, Param.TRS1, Param.TRS2);

    private final FitPoint[] points;
    private final double[] temperatures;
    private final int[] group;
    private final SimulatorOptions options;
    /** Conductance between the terminals (a shunt resistor beside the diode), 0 for none [S]. */
    private final double shunt;
    private DiodeParameters cachedFor;
    private double[] cachedJunctionVoltages;
    /** The measured currents, prepared once for the junction solves of every evaluation. */
    private final DiodeSolver.ForcedCurrent[] forced;
    /** Two doubles the solves work in (a block is used by one thread, as its cache above). */
    private final double[] scratch = new double[2];

    ForwardBlock(List<FitPoint> points, SimulatorOptions options) {
        this(points, options, 0);
    }

    /**
     * Forward residuals of the diode with a conductance {@code shunt} between its terminals
     * ({@link org.cardwright.model.ShuntedJunction}); 0 is the plain diode.
     */
    ForwardBlock(List<FitPoint> points, SimulatorOptions options, double shunt) {
        if (!(shunt >= 0) || !Double.isFinite(shunt)) {
            throw new IllegalArgumentException("shunt conductance must be finite and not negative, got " + shunt);
        }
        this.shunt = shunt;
        this.points = points.toArray(new FitPoint[0]);
        this.options = options;
        TemperatureGroups groups = TemperatureGroups.of(this.points, FitPoint::temperature);
        this.temperatures = groups.temperatures();
        this.group = groups.group();
        this.forced = new DiodeSolver.ForcedCurrent[this.points.length];
        for (int i = 0; i < forced.length; i++) {
            forced[i] = new DiodeSolver.ForcedCurrent(this.points[i].current());
        }
    }

    @Override
    public String label() {
        return "forward I-V";
    }

    @Override
    public int size() {
        return points.length;
    }

    @Override
    public Set<Param> dependsOn() {
        return DEPENDS;
    }

    /** Model terminal voltages at the measured currents for parameters {@code p} [V]. */
    double[] voltages(DiodeParameters p) {
        double[] v = new double[points.length];
        DiodeAtTemperature[] at = scaled(p);
        if (p.isGiven(Param.RTH0) && shunt == 0) {
            double rth = p.get(Param.RTH0);
            for (int i = 0; i < v.length; i++) {
                // points whose dissipation cannot warm the junction measurably keep the isothermal shortcut
                double rise = rth * points[i].current() * Math.abs(points[i].voltage());
                v[i] = rise < NEGLIGIBLE_RISE
                        ? DiodeSolver.voltageAtCurrent(at[group[i]], forced[i], scratch)
                        : SelfHeating.voltageAtCurrent(p, points[i].temperature(), points[i].current(), options);
            }
            return v;
        }
        double[] vd = junctionVoltages(p, at);
        for (int i = 0; i < v.length; i++) {
            // with a shunt the diode carries less than the terminal current: V = vd + RS·Ij(vd)
            double diodeCurrent = shunt == 0 ? points[i].current() : JunctionCurrent.current(at[group[i]], vd[i]);
            v[i] = vd[i] + diodeCurrent * at[group[i]].seriesResistance();
        }
        return v;
    }

    /** Junction voltages at the measured currents, kept for the Jacobian that follows at the same point. */
    private double[] junctionVoltages(DiodeParameters p, DiodeAtTemperature[] at) {
        if (p.equals(cachedFor)) {
            return cachedJunctionVoltages;
        }
        double[] vd = new double[points.length];
        for (int i = 0; i < vd.length; i++) {
            vd[i] = shunt == 0 ? DiodeSolver.junctionVoltageAtCurrent(at[group[i]], forced[i], scratch)
                    : ShuntedJunction.junctionVoltageAtCurrent(at[group[i]], points[i].current(), shunt);
        }
        cachedFor = p;
        cachedJunctionVoltages = vd;
        return vd;
    }

    @Override
    public double[] residuals(DiodeParameters p) {
        double[] v = voltages(p);
        for (int i = 0; i < v.length; i++) {
            v[i] = (v[i] - points[i].voltage()) / points[i].sigma();
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
    public double[][] jacobian(FreeParameters layout, double[] x) {
        DiodeParameters p = layout.toParameters(x);
        if (p.isGiven(Param.RTH0) && shunt == 0) {
            return selfHeatingJacobian(layout, x, p);
        }
        DiodeAtTemperature[] at = scaled(p);
        int nFree = layout.size();
        DiodeAtTemperature[][] plus = new DiodeAtTemperature[nFree][];
        DiodeAtTemperature[][] minus = new DiodeAtTemperature[nFree][];
        double[] steps = new double[nFree];
        for (int j = 0; j < nFree; j++) {
            if (!DEPENDS.contains(layout.free().get(j))) {
                continue;
            }
            double h = layout.isLog(j) ? STEP : STEP * Math.max(Math.abs(x[j]), 1e-3);
            double[] span = layout.differencePoints(j, x[j], h);
            if (!(span[1] > span[0])) {
                continue;
            }
            // steps[j] is half the span, as the central-difference formula below divides by 2·steps[j]
            steps[j] = 0.5 * (span[1] - span[0]);
            // p with the one coordinate moved: the set layout.toParameters gives for x moved in j, built from p
            Param q = layout.free().get(j);
            plus[j] = scaled(p.with(q, layout.value(j, span[1])));
            minus[j] = scaled(p.with(q, layout.value(j, span[0])));
        }
        boolean[] resistanceOnly = new boolean[nFree];
        for (int j = 0; j < nFree; j++) {
            resistanceOnly[j] = RESISTANCE_ONLY.contains(layout.free().get(j));
        }
        // per temperature and parameter: dq_k/dx of the quantities the current depends on, and dRS/dx
        double[][][] dq = new double[at.length][nFree][];
        double[][] dRdx = new double[at.length][nFree];
        for (int k = 0; k < at.length; k++) {
            for (int j = 0; j < nFree; j++) {
                if (plus[j] == null) {
                    continue;
                }
                DiodeAtTemperature dp = plus[j][k];
                DiodeAtTemperature dm = minus[j][k];
                dRdx[k][j] = (dp.seriesResistance() - dm.seriesResistance()) / (2 * steps[j]);
                // RS and its temperature coefficients leave the junction current as it is
                if (!resistanceOnly[j]) {
                    dq[k][j] = JunctionPartials.difference(dp, dm, 2 * steps[j]);
                }
            }
        }
        double[][] jac = new double[points.length][nFree];
        double[] vds = junctionVoltages(p, at);
        double[] partials = new double[JunctionPartials.SIZE];
        for (int i = 0; i < points.length; i++) {
            int k = group[i];
            DiodeAtTemperature d = at[k];
            double current = points[i].current();
            double w = 1 / points[i].sigma();
            double vd = vds[i];
            // one evaluation: Ij, g = dIj/dvd and dIj/dq at fixed vd; dIj/dx = sum over q of dIj/dq dq/dx
            JunctionPartials.evaluate(d, vd, partials);
            double g = partials[JunctionPartials.CONDUCTANCE];
            // with a shunt G: F = Ij(vd)(1 + G·RS) + G·vd - I = 0 at fixed I gives dvd/dp, then
            // dV/dp = dvd/dp (1 + RS·g) + RS·dIj/dp + Ij·dRS/dp; with G = 0 this is -dIj/dp/g + I·dRS/dp
            double rs = d.seriesResistance();
            double a = 1 + shunt * rs;
            double ij = shunt == 0 ? current : partials[JunctionPartials.CURRENT];
            for (int j = 0; j < nFree; j++) {
                if (plus[j] == null) {
                    continue;
                }
                double dIdp = JunctionPartials.chain(partials, dq[k][j]);
                double dRdp = dRdx[k][j];
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

    /**
     * The Jacobian with self-heating: each point's junction sits at its own temperature T = T0 + RTH0·I·V, so
     * V = F(p, T) with the isothermal terminal voltage F, and differentiating the steady state at fixed current
     * gives dV/dp = (dF/dp + dF/dT·I·V·[p = RTH0]) / (1 - RTH0·I·dF/dT). dF/dp at fixed T is the isothermal form
     * of {@link #jacobian} (implicit differentiation of the junction equation, explicit derivatives by central
     * differences of the temperature laws) and dF/dT = -(dIj/dT at fixed vd)/g + I·dRS/dT likewise, so each point
     * costs one solve for its rise and no solve per parameter. Points whose rise the residuals take as 0
     * ({@code NEGLIGIBLE_RISE}) have the isothermal derivatives and none with respect to RTH0, as there.
     */
    private double[][] selfHeatingJacobian(FreeParameters layout, double[] x, DiodeParameters p) {
        int nFree = layout.size();
        DiodeParameters[] plus = new DiodeParameters[nFree];
        DiodeParameters[] minus = new DiodeParameters[nFree];
        double[] span = new double[nFree];
        for (int j = 0; j < nFree; j++) {
            if (!DEPENDS.contains(layout.free().get(j))) {
                continue;
            }
            double h = layout.isLog(j) ? STEP : STEP * Math.max(Math.abs(x[j]), 1e-3);
            double[] at = layout.differencePoints(j, x[j], h);
            if (!(at[1] > at[0])) {
                continue;
            }
            span[j] = at[1] - at[0];
            double[] xp = x.clone();
            xp[j] = at[1];
            double[] xm = x.clone();
            xm[j] = at[0];
            plus[j] = layout.toParameters(xp);
            minus[j] = layout.toParameters(xm);
        }
        double rth = p.get(Param.RTH0);
        double[][] jac = new double[points.length][nFree];
        double[] partials = new double[JunctionPartials.SIZE];
        for (int i = 0; i < points.length; i++) {
            FitPoint pt = points[i];
            double current = pt.current();
            boolean heated = rth * current * Math.abs(pt.voltage()) >= NEGLIGIBLE_RISE;
            double t = pt.temperature() + (heated ? SelfHeating.riseAtCurrent(p, pt.temperature(), current, options) : 0);
            DiodeAtTemperature d = TemperatureLaws.at(p, t, options);
            double vd = DiodeSolver.junctionVoltageAtCurrent(d, current);
            JunctionPartials.evaluate(d, vd, partials);
            double g = partials[JunctionPartials.CONDUCTANCE];
            double v = vd + current * d.seriesResistance();
            double dFdT = 0;
            if (heated) {
                DiodeAtTemperature hot = TemperatureLaws.at(p, t + TEMPERATURE_STEP, options);
                DiodeAtTemperature cold = TemperatureLaws.at(p, t - TEMPERATURE_STEP, options);
                dFdT = (-(JunctionCurrent.current(hot, vd) - JunctionCurrent.current(cold, vd)) / g
                        + current * (hot.seriesResistance() - cold.seriesResistance())) / (2 * TEMPERATURE_STEP);
            }
            double denominator = 1 - rth * current * dFdT;
            double w = 1 / pt.sigma();
            for (int j = 0; j < nFree; j++) {
                if (plus[j] == null) {
                    continue;
                }
                double dFdx;
                double dRthdx = 0;
                if (layout.free().get(j) == Param.RTH0) {
                    dFdx = 0;
                    dRthdx = (plus[j].get(Param.RTH0) - minus[j].get(Param.RTH0)) / span[j];
                } else {
                    DiodeAtTemperature dp = TemperatureLaws.at(plus[j], t, options);
                    DiodeAtTemperature dm = TemperatureLaws.at(minus[j], t, options);
                    double dIdx = RESISTANCE_ONLY.contains(layout.free().get(j)) ? 0
                            : JunctionPartials.chain(partials, JunctionPartials.difference(dp, dm, span[j]));
                    double dRdx = (dp.seriesResistance() - dm.seriesResistance()) / span[j];
                    dFdx = -dIdx / g + current * dRdx;
                }
                jac[i][j] = heated ? (dFdx + dFdT * current * v * dRthdx) / denominator * w : dFdx * w;
            }
        }
        return jac;
    }

    /**
     * d(weighted residual)/d(ln R) of every point, R = 1/G the resistor between the terminals: at fixed current,
     * dvd/dG = -V/(g·(1 + G·RS) + G) and dV/dG = dvd/dG·(1 + RS·g); d/d(ln R) = -G·d/dG.
     */
    double[] shuntColumn(DiodeParameters p) {
        DiodeAtTemperature[] at = scaled(p);
        double[] vds = junctionVoltages(p, at);
        double[] out = new double[points.length];
        for (int i = 0; i < out.length; i++) {
            DiodeAtTemperature d = at[group[i]];
            double vd = vds[i];
            double g = JunctionCurrent.conductance(d, vd);
            double rs = d.seriesResistance();
            double v = vd + rs * JunctionCurrent.current(d, vd);
            double dvdG = -v / (g * (1 + shunt * rs) + shunt) * (1 + rs * g);
            out[i] = -shunt * dvdG / points[i].sigma();
        }
        return out;
    }

    /** The conductance between the terminals, 0 for none [S]. */
    double shunt() {
        return shunt;
    }

    /** The same points with another conductance between the terminals [S]. */
    ForwardBlock withShunt(double conductance) {
        return new ForwardBlock(List.of(points), options, conductance);
    }

    /** Distinct temperatures of the points, ascending [K]. */
    double[] temperatures() {
        return temperatures.clone();
    }

    List<FitPoint> points() {
        return List.of(points);
    }
}
