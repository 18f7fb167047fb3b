package org.cardwright.sim;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.SelfHeating;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/** Evaluates the ngspice 39 level-1 equations in process: nothing to install. */
public final class BuiltinEngine implements SimulationEngine {
    private final SimulatorOptions options;

    public BuiltinEngine(SimulatorOptions options) {
        this.options = options;
    }

    @Override
    public String name() {
        return "builtin";
    }

    @Override
    public String describe() {
        return "builtin (" + options.flavour().label()
                + " level-1 diode equations, evaluated in process; self-heating when RTH0 is given)";
    }

    @Override
    public List<OperatingPoint> dc(CardUnderTest card, List<Bias> biases) {
        Map<Double, DiodeAtTemperature> scaled = new HashMap<>();
        List<OperatingPoint> out = new ArrayList<>(biases.size());
        boolean thermal = card.parameters().isGiven(org.cardwright.model.Param.RTH0);
        for (Bias b : biases) {
            if (thermal) {
                out.add(b.forcing() == Bias.Forcing.CURRENT
                        ? new OperatingPoint(SelfHeating.voltageAtCurrent(card.parameters(), b.temperature(), b.value(), options), b.value())
                        : new OperatingPoint(b.value(), SelfHeating.currentAtVoltage(card.parameters(), b.temperature(), b.value(), options)));
                continue;
            }
            DiodeAtTemperature d = scaled.computeIfAbsent(b.temperature(),
                    t -> TemperatureLaws.at(card.parameters(), t, options));
            if (b.forcing() == Bias.Forcing.CURRENT) {
                out.add(new OperatingPoint(DiodeSolver.voltageAtCurrent(d, b.value()), b.value()));
            } else {
                out.add(new OperatingPoint(b.value(), DiodeSolver.currentAtVoltage(d, b.value())));
            }
        }
        return out;
    }
}
