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
 * @param selfHeating what to do when the data show self-heating
 * @param shunt       whether a resistor between the terminals is decided by the data, left out or always fitted
 * @param sweepGap    logged temperatures further apart than this start a new sweep
 *                    ({@link org.cardwright.model.SweepTemperatures}) [K]
 */
public record FitSettings(Map<Param, ParameterRule> rules, DeviceKind kind, double nominalTemperature,
                          SimulatorOptions options, SelfHeatingRemedy selfHeating, ShuntChoice shunt, double sweepGap) {

    /** The resistor between the terminals (docs/fitting.md, section 2.5). */
    public enum ShuntChoice {
        /** The data decide, like the optional terms. */
        DECIDE,
        /** Never fitted (a dialect refit of a fit that found none). */
        OFF,
        /** Always fitted (a dialect refit of a fit that found one). */
        ON
    }

    /** Settings whose shunt the data decide, with the default sweep gap. */
    public FitSettings(Map<Param, ParameterRule> rules, DeviceKind kind, double nominalTemperature,
                       SimulatorOptions options, SelfHeatingRemedy selfHeating) {
        this(rules, kind, nominalTemperature, options, selfHeating, ShuntChoice.DECIDE,
                org.cardwright.model.SweepTemperatures.DEFAULT_GAP);
    }

    /** Settings with the default sweep gap ({@link org.cardwright.model.SweepTemperatures#DEFAULT_GAP}). */
    public FitSettings(Map<Param, ParameterRule> rules, DeviceKind kind, double nominalTemperature,
                       SimulatorOptions options, SelfHeatingRemedy selfHeating, ShuntChoice shunt) {
        this(rules, kind, nominalTemperature, options, selfHeating, shunt, org.cardwright.model.SweepTemperatures.DEFAULT_GAP);
    }

    /** Settings whose shunt the data decide, with a stated sweep gap [K]. */
    public FitSettings(Map<Param, ParameterRule> rules, DeviceKind kind, double nominalTemperature,
                       SimulatorOptions options, SelfHeatingRemedy selfHeating, double sweepGap) {
        this(rules, kind, nominalTemperature, options, selfHeating, ShuntChoice.DECIDE, sweepGap);
    }

    /** The two remedies for self-heating in forward data. */
    public enum SelfHeatingRemedy {
        /** Fit RTH0 and carry it on the card (ngspice: used with a thermal node). */
        FIT,
        /**
         * Leave out the points where self-heating moves the voltage by more than {@link #EXCLUDE_SHIFT} and fit
         * the rest without RTH0.
         */
        EXCLUDE;

        /** The remedy a user names, in any case: fit or exclude. */
        public static SelfHeatingRemedy byName(String name) {
            String n = name == null ? "" : name.trim();
            for (SelfHeatingRemedy r : values()) {
                if (r.name().equalsIgnoreCase(n)) {
                    return r;
                }
            }
            throw new IllegalArgumentException("unknown self-heating remedy '" + name + "'; valid names: fit, exclude");
        }

        /**
         * Points whose voltage self-heating moves by more than this are left out by {@link #EXCLUDE}: well under
         * a bench meter's noise, so what stays fits as if isothermal [V].
         */
        public static final double EXCLUDE_SHIFT = 0.1e-3;
    }
    public FitSettings {
        java.util.Objects.requireNonNull(shunt, "shunt");
        rules = Map.copyOf(rules);
        if (!(nominalTemperature > 0)) {
            throw new IllegalArgumentException("TNOM must be above 0 K, got " + nominalTemperature);
        }
        if (!(sweepGap >= 0) || !Double.isFinite(sweepGap)) {
            throw new IllegalArgumentException("sweep gap must be 0 or more kelvin, got " + sweepGap);
        }
    }

    /** Silicon pn, TNOM 27 degrees C, ngspice defaults, no rules. */
    public static FitSettings defaults() {
        return new FitSettings(Map.of(), DeviceKind.SILICON_PN, Ngspice39.REFERENCE_TEMPERATURE,
                SimulatorOptions.NGSPICE_DEFAULTS, SelfHeatingRemedy.FIT);
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
        return new FitSettings(m, kind, tnom, options, selfHeating, shunt, sweepGap);
    }

    /** This with another device kind. */
    public FitSettings withKind(DeviceKind k) {
        return new FitSettings(rules, k, nominalTemperature, options, selfHeating, shunt, sweepGap);
    }

    /** This evaluated with other equations or options (a dialect's flavour). */
    public FitSettings withOptions(SimulatorOptions other) {
        return new FitSettings(rules, kind, nominalTemperature, other, selfHeating, shunt, sweepGap);
    }

    /** This with another self-heating remedy. */
    public FitSettings withSelfHeating(SelfHeatingRemedy remedy) {
        return new FitSettings(rules, kind, nominalTemperature, options, remedy, shunt, sweepGap);
    }

    /** This with another choice about the resistor between the terminals. */
    public FitSettings withShunt(ShuntChoice choice) {
        return new FitSettings(rules, kind, nominalTemperature, options, selfHeating, choice, sweepGap);
    }

    /** This with another gap between sweeps [K]. */
    public FitSettings withSweepGap(double gap) {
        return new FitSettings(rules, kind, nominalTemperature, options, selfHeating, shunt, gap);
    }

    /** The rule for {@code p}, or null. */
    public ParameterRule rule(Param p) {
        return rules.get(p);
    }
}
