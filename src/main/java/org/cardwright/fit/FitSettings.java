package org.cardwright.fit;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;

/**
 * How to fit: the user's rules per parameter, the device kind whose presets fill in what the data cannot
 * determine, the nominal temperature the card is stated at, and the simulator options of the model.
 *
 * @param rules       user rules, at most one per parameter
 * @param kind        device kind
 * @param nominalTemperature TNOM [K]
 * @param options     GMIN and RELTOL of the model
 */
public record FitSettings(Map<Param, ParameterRule> rules, DeviceKind kind, double nominalTemperature,
                          SimulatorOptions options) {
    public FitSettings {
        rules = Map.copyOf(rules);
        if (!(nominalTemperature > 0)) {
            throw new IllegalArgumentException("TNOM must be above 0 K, got " + nominalTemperature);
        }
    }

    /** Silicon pn, TNOM 27 degrees C, ngspice defaults, no rules. */
    public static FitSettings defaults() {
        return new FitSettings(Map.of(), DeviceKind.SILICON_PN, Ngspice39.REFERENCE_TEMPERATURE,
                SimulatorOptions.NGSPICE_DEFAULTS);
    }

    /** These settings with the given rules (a later rule for the same parameter wins; TNOM rules set TNOM). */
    public FitSettings withRules(List<ParameterRule> list) {
        Map<Param, ParameterRule> m = new EnumMap<>(Param.class);
        m.putAll(rules);
        double tnom = nominalTemperature;
        for (ParameterRule r : list) {
            if (r.param() == Param.TNOM) {
                if (r.kind() != ParameterRule.Kind.FIXED) {
                    throw new IllegalArgumentException("TNOM is where the card is stated, not a fitted value; write TNOM=25");
                }
                tnom = r.value();
            } else {
                m.put(r.param(), r);
            }
        }
        return new FitSettings(m, kind, tnom, options);
    }

    /** This with another device kind. */
    public FitSettings withKind(DeviceKind k) {
        return new FitSettings(rules, k, nominalTemperature, options);
    }

    /** The rule for {@code p}, or null. */
    public ParameterRule rule(Param p) {
        return rules.get(p);
    }
}
