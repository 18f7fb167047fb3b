package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The uncertainty of one point's voltage residual, propagated from the measurement's own voltage and current
 * uncertainties: r = V - Vmodel(I) at the measured current, so
 * sigma_r^2 = sigma_V^2 + (s sigma_I/I)^2 - 2 rho sigma_V s sigma_I/I, where s = dV/d(ln I) is the local slope of the
 * measured sweep (first-order propagation, JCGM 100:2008 "Guide to the expression of uncertainty in measurement",
 * section 5; citation recalled). The extraction weights each residual by it.
 */
public final class PointUncertainty {
    /** The propagated sigma never falls below this share of the voltage sigma (a correlation near 1 would cancel it) [1]. */
    private static final double FLOOR_OF_VOLTAGE_VARIANCE = 0.01;

    private PointUncertainty() {
    }

    /**
     * sigma of the voltage residual at the measured current [V].
     *
     * @param voltageSigma        the point's stated voltage uncertainty, NaN when none [V]
     * @param current             the measured current [A]
     * @param currentSigma        the point's stated current uncertainty, NaN when none [A]
     * @param correlation         correlation of the voltage and current errors, in [-1, 1] [1]
     * @param slope               dV/d(ln |I|) of the sweep at the point, NaN when unknown [V]
     * @param defaultVoltageSigma the voltage uncertainty assumed when none is stated [V]
     */
    public static double residualSigma(double voltageSigma, double current, double currentSigma, double correlation,
                                       double slope, double defaultVoltageSigma) {
        double sv = Double.isNaN(voltageSigma) ? defaultVoltageSigma : voltageSigma;
        if (Double.isNaN(currentSigma) || !Double.isFinite(slope)) {
            return sv;
        }
        double si = Math.abs(slope) * currentSigma / Math.abs(current);
        double var = sv * sv + si * si - 2 * correlation * sv * si * Math.signum(slope);
        return Math.sqrt(Math.max(var, FLOOR_OF_VOLTAGE_VARIANCE * sv * sv));
    }

    /**
     * Local dV/d(ln |I|) of each point within its sweep, by differences to its neighbours in current [V]; NaN where a
     * sweep has fewer than two points.
     *
     * @param currents measured currents [A]
     * @param voltages measured voltages [V]
     * @param sweeps   each point's sweep (file and temperature); points with equal keys form one sweep
     */
    public static double[] slopes(double[] currents, double[] voltages, String[] sweeps) {
        int n = currents.length;
        if (voltages.length != n || sweeps.length != n) {
            throw new IllegalArgumentException("currents, voltages and sweeps must be as many");
        }
        double[] out = new double[n];
        java.util.Arrays.fill(out, Double.NaN);
        Map<String, List<Integer>> groups = new HashMap<>();
        for (int i = 0; i < n; i++) {
            groups.computeIfAbsent(sweeps[i], k -> new ArrayList<>()).add(i);
        }
        for (List<Integer> g : groups.values()) {
            g.sort(Comparator.comparingDouble(i -> Math.abs(currents[i])));
            for (int k = 0; k < g.size(); k++) {
                int a = g.get(Math.max(0, k - 1));
                int b = g.get(Math.min(g.size() - 1, k + 1));
                if (a == b) {
                    continue;
                }
                double dl = Math.log(Math.abs(currents[b] / currents[a]));
                double dv = voltages[b] - voltages[a];
                if (dl != 0) {
                    out[g.get(k)] = dv / dl;
                }
            }
        }
        return out;
    }
}
