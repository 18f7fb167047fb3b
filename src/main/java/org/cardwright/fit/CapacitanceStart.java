package org.cardwright.fit;

import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * Closed-form start values of the depletion capacitance C = CJ (1 - V/VJ)^(-M) from reverse-bias C-V at one
 * temperature. For a fixed VJ, ln C = ln CJ - M ln(1 - V/VJ) is a straight line in ln(1 - V/VJ), so CJ and M
 * follow from a weighted linear regression (weights (C/sigma)^2, the inverse variance of ln C); VJ is then
 * chosen by scanning a logarithmic grid for the smallest weighted sum of squares and refining by golden-section
 * search (Kiefer, "Sequential minimax search for a maximum", Proc. Am. Math. Soc. 4 (1953) 502-506) between
 * the grid neighbours of the best node. The scan-and-regress procedure itself is common practice, no source.
 */
public final class CapacitanceStart {
    /** Lowest junction potential scanned [V]. */
    static final double LOWEST_POTENTIAL = 0.05;
    /** Highest junction potential scanned [V]. */
    static final double HIGHEST_POTENTIAL = 3.0;
    private static final int GRID_NODES = 160;
    private static final int GOLDEN_STEPS = 80;

    private CapacitanceStart() {
    }

    /**
     * Depletion parameters at the temperature of the points.
     *
     * @param junctionCapacitance CJ at that temperature [F]
     * @param junctionPotential   VJ at that temperature [V]
     * @param gradingCoefficient  M [1]
     * @param rmsLogResidual      RMS of ln C_measured - ln C_line over the points [1]
     * @param points              number of points used
     */
    public record Depletion(double junctionCapacitance, double junctionPotential, double gradingCoefficient,
                            double rmsLogResidual, int points) {
    }

    /**
     * Fits CJ, VJ and M to the reverse-bias points (V &lt;= 0) of {@code points}, which must share one
     * temperature; {@code strayCapacitance} is subtracted from every reading first.
     *
     * @throws IllegalArgumentException when fewer than three distinct reverse voltages remain, or a reading is
     *                                  not above the stray capacitance
     */
    public static Depletion reverse(List<CapacitancePoint> points, double strayCapacitance) {
        int n = 0;
        for (CapacitancePoint p : points) {
            if (p.voltage() <= 0) {
                n++;
            }
        }
        double[] v = new double[n];
        double[] lnC = new double[n];
        double[] w = new double[n];
        int k = 0;
        for (CapacitancePoint p : points) {
            if (p.voltage() > 0) {
                continue;
            }
            double c = p.capacitance() - strayCapacitance;
            if (!(c > 0)) {
                throw new IllegalArgumentException(p.where() + ": capacitance " + p.capacitance()
                        + " F is not above the stray capacitance " + strayCapacitance + " F");
            }
            v[k] = p.voltage();
            lnC[k] = Math.log(c);
            double sLn = p.sigma() / c;
            w[k] = 1 / (sLn * sLn);
            k++;
        }
        if (distinct(v) < 3) {
            throw new IllegalArgumentException("the start of CJO, VJ and M needs reverse-bias C-V points (V <= 0) at "
                    + "three or more voltages; found " + distinct(v));
        }
        double bestVj = Double.NaN;
        double bestSsr = Double.POSITIVE_INFINITY;
        int bestNode = -1;
        double ratio = Math.pow(HIGHEST_POTENTIAL / LOWEST_POTENTIAL, 1.0 / (GRID_NODES - 1));
        for (int i = 0; i < GRID_NODES; i++) {
            double vj = LOWEST_POTENTIAL * Math.pow(ratio, i);
            double ssr = regression(v, lnC, w, vj)[2];
            if (ssr < bestSsr) {
                bestSsr = ssr;
                bestVj = vj;
                bestNode = i;
            }
        }
        // golden-section refinement between the neighbours of the best node
        double a = LOWEST_POTENTIAL * Math.pow(ratio, Math.max(bestNode - 1, 0));
        double b = LOWEST_POTENTIAL * Math.pow(ratio, Math.min(bestNode + 1, GRID_NODES - 1));
        double invPhi = (Math.sqrt(5) - 1) / 2;
        double x1 = b - invPhi * (b - a);
        double x2 = a + invPhi * (b - a);
        double f1 = regression(v, lnC, w, x1)[2];
        double f2 = regression(v, lnC, w, x2)[2];
        for (int it = 0; it < GOLDEN_STEPS; it++) {
            if (f1 < f2) {
                b = x2;
                x2 = x1;
                f2 = f1;
                x1 = b - invPhi * (b - a);
                f1 = regression(v, lnC, w, x1)[2];
            } else {
                a = x1;
                x1 = x2;
                f1 = f2;
                x2 = a + invPhi * (b - a);
                f2 = regression(v, lnC, w, x2)[2];
            }
        }
        double refined = f1 < f2 ? x1 : x2;
        if (Math.min(f1, f2) < bestSsr) {
            bestVj = refined;
        }
        double[] r = regression(v, lnC, w, bestVj);
        double sumW = 0;
        double sumSq = 0;
        for (int i = 0; i < n; i++) {
            double e = lnC[i] - (r[0] - r[1] * Math.log(1 - v[i] / bestVj));
            sumSq += e * e;
            sumW += 1;
        }
        return new Depletion(Math.exp(r[0]), bestVj, r[1], Math.sqrt(sumSq / sumW), n);
    }

    /**
     * Weighted line ln C = a - M x with x = ln(1 - V/VJ): returns {a, M, weighted sum of squared residuals}.
     */
    private static double[] regression(double[] v, double[] lnC, double[] w, double vj) {
        double sw = 0;
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (int i = 0; i < v.length; i++) {
            double x = Math.log(1 - v[i] / vj);
            sw += w[i];
            sx += w[i] * x;
            sy += w[i] * lnC[i];
            sxx += w[i] * x * x;
            sxy += w[i] * x * lnC[i];
        }
        double det = sw * sxx - sx * sx;
        double slope = (sw * sxy - sx * sy) / det;
        double intercept = (sy - slope * sx) / sw;
        double ssr = 0;
        for (int i = 0; i < v.length; i++) {
            double e = lnC[i] - intercept - slope * Math.log(1 - v[i] / vj);
            ssr += w[i] * e * e;
        }
        return new double[] {intercept, -slope, ssr};
    }

    private static int distinct(double[] v) {
        return (int) java.util.Arrays.stream(v).distinct().count();
    }

    /**
     * The card values CJO and VJ (at TNOM) that give {@code junctionCapacitance} and {@code junctionPotential}
     * at {@code temperature} through ngspice's TLEVC 0 laws with grading {@code m}. VJ(T) is affine in VJ and
     * CJ(T) is proportional to CJO, so two evaluations of {@link TemperatureLaws} invert them exactly.
     *
     * @param junctionCapacitance CJ at the temperature [F]
     * @param junctionPotential   VJ at the temperature [V]
     * @param m                   grading coefficient [1]
     * @param temperature         temperature of the values [K]
     * @param tnom                nominal temperature of the card [K]
     * @return {CJO [F], VJ [V]}
     */
    public static double[] toNominal(double junctionCapacitance, double junctionPotential, double m,
                                     double temperature, double tnom) {
        if (temperature == tnom) {
            return new double[] {junctionCapacitance, junctionPotential};
        }
        double mm = Math.min(Math.max(m, 0), 0.9);
        // FC = 0 keeps the VJ(T) clamp out of the way
        double vjA = 0.5;
        double vjB = 1.0;
        double atA = probe(1.0, vjA, mm, temperature, tnom).junctionPotential();
        double atB = probe(1.0, vjB, mm, temperature, tnom).junctionPotential();
        double vj = vjA + (junctionPotential - atA) * (vjB - vjA) / (atB - atA);
        if (!(vj > 0)) {
            // the temperature law cannot reach that potential; keep the measured one as a start
            vj = junctionPotential;
        }
        double perFarad = probe(1.0, vj, mm, temperature, tnom).junctionCapacitance();
        return new double[] {junctionCapacitance / perFarad, vj};
    }

    private static DiodeAtTemperature probe(double cjo, double vj, double m, double t, double tnom) {
        return TemperatureLaws.at(DiodeParameters.of(Map.of(Param.CJO, cjo, Param.VJ, vj, Param.M, m, Param.FC, 0.0,
                Param.TNOM, tnom)), t, SimulatorOptions.NGSPICE_DEFAULTS);
    }
}
