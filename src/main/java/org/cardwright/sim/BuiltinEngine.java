package org.cardwright.sim;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.SelfHeating;
import org.cardwright.model.ShuntedJunction;
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
        double shunt = card.shuntConductance();
        for (Bias b : biases) {
            if (thermal && shunt > 0) {
                out.add(thermalWithShunt(card, b, shunt));
                continue;
            }
            if (thermal) {
                out.add(b.forcing() == Bias.Forcing.CURRENT
                        ? new OperatingPoint(SelfHeating.voltageAtCurrent(card.parameters(), b.temperature(), b.value(), options), b.value())
                        : new OperatingPoint(b.value(), SelfHeating.currentAtVoltage(card.parameters(), b.temperature(), b.value(), options)));
                continue;
            }
            DiodeAtTemperature d = scaled.computeIfAbsent(b.temperature(),
                    t -> TemperatureLaws.at(card.parameters(), t, options));
            if (b.forcing() == Bias.Forcing.CURRENT) {
                out.add(new OperatingPoint(ShuntedJunction.voltageAtCurrent(d, b.value(), shunt), b.value()));
            } else {
                out.add(new OperatingPoint(b.value(), ShuntedJunction.currentAtVoltage(d, b.value(), shunt)));
            }
        }
        return out;
    }

    /**
     * A self-heating diode with a resistor beside it (the resistor's own dissipation does not reach the
     * junction): at a forced voltage the two currents add; at a forced current the terminal voltage is found by
     * bisection, as the total current rises with the voltage.
     */
    private OperatingPoint thermalWithShunt(CardUnderTest card, Bias b, double shunt) {
        java.util.function.DoubleUnaryOperator total = v ->
                SelfHeating.currentAtVoltage(card.parameters(), b.temperature(), v, options) + shunt * v;
        if (b.forcing() == Bias.Forcing.VOLTAGE) {
            return new OperatingPoint(b.value(), total.applyAsDouble(b.value()));
        }
        double lo = Math.min(0, b.value() / shunt);
        double hi = Math.max(0, b.value() / shunt);
        for (int i = 0; i < 200 && hi - lo > 1e-14 * Math.max(1, Math.abs(hi)); i++) {
            double mid = 0.5 * (lo + hi);
            if (total.applyAsDouble(mid) < b.value()) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return new OperatingPoint(0.5 * (lo + hi), b.value());
    }
}
