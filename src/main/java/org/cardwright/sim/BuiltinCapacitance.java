package org.cardwright.sim;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.JunctionCapacitance;
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
        return "builtin (" + options.flavour().label() + " level-1 diode small-signal equations, evaluated in process)";
    }

    @Override
    public List<Double> capacitance(CardUnderTest card, List<Bias> voltageBiases, double frequency) {
        CapacitanceEngine.checkArguments(voltageBiases, frequency);
        Map<Double, DiodeAtTemperature> scaled = new HashMap<>();
        List<Double> out = new ArrayList<>(voltageBiases.size());
        for (Bias b : voltageBiases) {
            DiodeAtTemperature d = scaled.computeIfAbsent(b.temperature(),
                    t -> TemperatureLaws.at(card.parameters(), t, options));
            out.add(JunctionCapacitance.terminalParallel(d, b.value(), frequency));
        }
        return out;
    }
}
