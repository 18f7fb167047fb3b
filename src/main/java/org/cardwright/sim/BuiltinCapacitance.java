package org.cardwright.sim;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * Small-signal capacitance from the ngspice 39 level-1 equations, evaluated in process: the junction
 * admittance Y_j = g + j omega C (g and C as ngspice reports them) in series with RS(T), read as a parallel
 * capacitance Im(Y)/omega.
 */
public final class BuiltinCapacitance implements CapacitanceEngine {
    private final SimulatorOptions options;

    /** @param options GMIN and RELTOL of the model */
    public BuiltinCapacitance(SimulatorOptions options) {
        this.options = options;
    }

    @Override
    public String name() {
        return "builtin";
    }

    @Override
    public String describe() {
        return "builtin (ngspice 39 level-1 diode small-signal equations, evaluated in process)";
    }

    @Override
    public List<Double> capacitance(CardUnderTest card, List<Bias> voltageBiases, double frequency) {
        CapacitanceEngine.checkArguments(voltageBiases, frequency);
        Map<Double, DiodeAtTemperature> scaled = new HashMap<>();
        List<Double> out = new ArrayList<>(voltageBiases.size());
        for (Bias b : voltageBiases) {
            DiodeAtTemperature d = scaled.computeIfAbsent(b.temperature(),
                    t -> TemperatureLaws.at(card.parameters(), t, options));
            out.add(parallelCapacitance(d, b.value(), frequency));
        }
        return out;
    }

    /**
     * Parallel capacitance of the terminals at DC terminal voltage {@code voltage} [F]. With Y_j = g + jB and
     * Y = Y_j/(1 + RS Y_j), Im(Y) = B/((1 + RS g)^2 + (RS B)^2).
     *
     * @param d         parameters at the device temperature
     * @param voltage   DC terminal voltage, anode to cathode [V]
     * @param frequency test-signal frequency [Hz]
     */
    public static double parallelCapacitance(DiodeAtTemperature d, double voltage, double frequency) {
        double rs = d.seriesResistance();
        double vd = rs == 0 ? voltage : voltage - rs * DiodeSolver.currentAtVoltage(d, voltage);
        double c = JunctionCapacitance.total(d, vd);
        if (rs == 0) {
            return c;
        }
        double g = JunctionCurrent.reportedConductance(d, vd);
        double omegaC = 2 * Math.PI * frequency * c;
        double real = 1 + rs * g;
        double imag = rs * omegaC;
        return c / (real * real + imag * imag);
    }
}
