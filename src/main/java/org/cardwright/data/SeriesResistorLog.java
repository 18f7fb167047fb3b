package org.cardwright.data;

/**
 * One row of a series-resistor bench log turned into a diode point: a supply (Vsupply, source resistance
 * Rsource) drives the diode through a series resistor Rseries, and a meter of input resistance Rmeter reads
 * the voltage Vmeter across the diode. Kirchhoff's current law at the diode node gives the diode current
 *
 * <pre>
 *   I = (Vsupply - Vmeter) / (Rseries + Rsource) - Vmeter / Rmeter,     V = Vmeter
 * </pre>
 *
 * and first-order (linear) propagation of the stated standard uncertainties gives its uncertainty. Vmeter
 * enters both terms of I, so its two contributions are added before squaring, and it makes the errors of V
 * and I correlated. The equations, with a worked example, are in docs/bench-logs.md; the propagation is the
 * law of propagation of uncertainty of JCGM 100:2008 (GUM), section 5.1.2, with uncorrelated inputs.
 */
final class SeriesResistorLog {

    /**
     * What the file (or the read options) state about the bench.
     *
     * @param meterResistance          input resistance of the meter; NaN when unknown, allowed only when the
     *                                 correction is off [ohm]
     * @param meterResistanceTolerance tolerance of the meter input resistance, a bound; 0 when not stated [1]
     * @param sourceResistance         output resistance of the supply, in series with Rseries [ohm]
     * @param resistorTolerance        tolerance of every series resistor, a bound; 0 when not stated [1]
     * @param supply                   accuracy of the Vsupply values; null when not stated
     * @param voltmeter                accuracy of the Vmeter readings; null when not stated
     * @param correctMeterLoading      whether to subtract the meter's current (off only for comparisons)
     */
    record Setup(double meterResistance, double meterResistanceTolerance, double sourceResistance,
                 double resistorTolerance, InstrumentAccuracy supply, InstrumentAccuracy voltmeter,
                 boolean correctMeterLoading) {
        Setup {
            if (correctMeterLoading && !(meterResistance > 0 && Double.isFinite(meterResistance))) {
                throw new IllegalArgumentException("meter resistance must be positive to correct for it, got "
                        + meterResistance + " ohm");
            }
            if (!(meterResistanceTolerance >= 0) || !(resistorTolerance >= 0) || !(sourceResistance >= 0)) {
                throw new IllegalArgumentException("tolerances and source resistance must not be negative");
            }
        }
    }

    /**
     * The diode point of one row.
     *
     * @param voltage      diode voltage, the meter reading [V]
     * @param current      diode current [A]
     * @param voltageSigma standard uncertainty of the voltage; NaN when no voltmeter accuracy is stated [V]
     * @param currentSigma standard uncertainty of the current; NaN when no tolerance at all is stated [A]
     * @param correlation  correlation coefficient of the voltage and current errors; 0 when either sigma is NaN [1]
     * @param meterCurrent current drawn by the meter, Vmeter / Rmeter; NaN when Rmeter is unknown [A]
     */
    record Point(double voltage, double current, double voltageSigma, double currentSigma, double correlation,
                 double meterCurrent) {
    }

    private SeriesResistorLog() {
    }

    /**
     * The diode point of one row.
     *
     * @param setup  the bench
     * @param supply the supply voltage [V]
     * @param series the series resistor, positive [ohm]
     * @param meter  the meter reading across the diode [V]
     */
    static Point solve(Setup setup, double supply, double series, double meter) {
        double rm = setup.meterResistance();
        double total = series + setup.sourceResistance();
        double meterCurrent = Double.isNaN(rm) ? Double.NaN : meter / rm;
        double current = (supply - meter) / total - (setup.correctMeterLoading() ? meterCurrent : 0);

        // sensitivity coefficients dI/dx (GUM 5.1.3)
        double bySupply = 1 / total;
        double byMeter = -(1 / total + (setup.correctMeterLoading() ? 1 / rm : 0));
        double byResistor = -(supply - meter) / (total * total);
        double byMeterResistance = setup.correctMeterLoading() ? meter / (rm * rm) : 0;

        // standard uncertainties of the inputs: stated bounds over sqrt(3) (GUM 4.3.7)
        double uSupply = setup.supply() == null ? 0 : setup.supply().standardUncertainty(supply);
        double uMeter = setup.voltmeter() == null ? 0 : setup.voltmeter().standardUncertainty(meter);
        double uResistor = setup.resistorTolerance() * series * InstrumentAccuracy.UNIFORM_SIGMA_PER_HALF_WIDTH;
        double uMeterResistance = Double.isNaN(rm) ? 0
                : setup.meterResistanceTolerance() * rm * InstrumentAccuracy.UNIFORM_SIGMA_PER_HALF_WIDTH;

        double variance = sq(bySupply * uSupply) + sq(byMeter * uMeter) + sq(byResistor * uResistor)
                + sq(byMeterResistance * uMeterResistance);
        double currentSigma = variance > 0 ? Math.sqrt(variance) : Double.NaN;
        double voltageSigma = setup.voltmeter() == null || uMeter == 0 ? Double.NaN : uMeter;
        double correlation = 0;
        if (!Double.isNaN(currentSigma) && !Double.isNaN(voltageSigma)) {
            // cov(V, I) = (dV/dVmeter)(dI/dVmeter) u(Vmeter)^2 = byMeter * uMeter^2
            correlation = byMeter * uMeter * uMeter / (voltageSigma * currentSigma);
            correlation = Math.max(-1, Math.min(1, correlation)); // rounding only: |cov| <= sigmaV sigmaI
        }
        return new Point(meter, current, voltageSigma, currentSigma, correlation, meterCurrent);
    }

    private static double sq(double x) {
        return x * x;
    }
}
