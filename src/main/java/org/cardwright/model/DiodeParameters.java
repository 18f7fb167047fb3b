package org.cardwright.model;

import java.util.Collections;
import java.util.EnumMap;
import java.util.Map;
import java.util.Set;

/**
 * An immutable set of junction-diode model parameters: the values a card gives, in SI units, with ngspice 39
 * defaults for the rest.
 *
 * <p>"Given" matters: BV, IKF, IKR, ISR and RTH0 switch their model terms on only when given, exactly as in
 * ngspice. NBV defaults to N when not given.
 */
public final class DiodeParameters {
    private final EnumMap<Param, Double> given;

    private DiodeParameters(EnumMap<Param, Double> given) {
        this.given = given;
        for (Map.Entry<Param, Double> e : given.entrySet()) {
            validate(e.getKey(), e.getValue());
        }
    }

    /**
     * A set from a map whose every entry is valid already (a copy of a valid set with one entry changed and checked,
     * or one removed): {@link #with} runs in every residual evaluation of a fit, once per free parameter, and
     * checking the whole set again each time made it quadratic in the parameters.
     */
    private DiodeParameters(EnumMap<Param, Double> given, boolean checked) {
        this.given = given;
        assert checked;
    }

    /** A parameter set with nothing given: every value is the ngspice default. */
    public static DiodeParameters defaults() {
        return new DiodeParameters(new EnumMap<>(Param.class));
    }

    /** A parameter set holding exactly the given values [SI]. */
    public static DiodeParameters of(Map<Param, Double> values) {
        EnumMap<Param, Double> copy = new EnumMap<>(Param.class);
        copy.putAll(values);
        return new DiodeParameters(copy);
    }

    private static void validate(Param p, double v) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(p + " must be a finite number, got " + v);
        }
        switch (p) {
            case IS, N, NR, ISR, IKF, IKR, BV, IBV, NBV, VJ, RTH0 -> {
                if (!(v > 0)) {
                    throw new IllegalArgumentException(p + " must be positive, got " + v);
                }
            }
            case RS, CJO, TT -> {
                if (v < 0) {
                    throw new IllegalArgumentException(p + " must not be negative, got " + v);
                }
            }
            case TNOM -> {
                if (!(v > 0)) {
                    throw new IllegalArgumentException("TNOM must be above absolute zero, got " + v + " K");
                }
            }
            case M -> {
                if (!(v >= 0 && v < 1)) {
                    throw new IllegalArgumentException("M must lie in [0, 1), got " + v);
                }
            }
            case FC -> {
                if (!(v >= 0 && v < 1)) {
                    throw new IllegalArgumentException("FC must lie in [0, 1), got " + v);
                }
            }
            default -> {
                // sign-free coefficients (EG, XTI, TRS1, TRS2, TCV, TLEV) need no further check
            }
        }
    }

    /** The value in force for {@code p}: the given value or the ngspice default [SI]. */
    public double get(Param p) {
        Double v = given.get(p);
        if (v != null) {
            return v;
        }
        if (p == Param.NBV) {
            return get(Param.N);
        }
        return p.defaultValue();
    }

    /** True when the card states {@code p} explicitly. */
    public boolean isGiven(Param p) {
        return given.containsKey(p);
    }

    /** The explicitly given parameters, in card order. */
    public Set<Param> givenParameters() {
        return Collections.unmodifiableSet(given.keySet());
    }

    /** The explicitly given values, in card order [SI]. */
    public Map<Param, Double> givenValues() {
        return Collections.unmodifiableMap(given);
    }

    /** A copy with {@code p} set to {@code value} [SI]. */
    public DiodeParameters with(Param p, double value) {
        validate(p, value);
        EnumMap<Param, Double> copy = new EnumMap<>(given);
        copy.put(p, value);
        return new DiodeParameters(copy, true);
    }

    /**
     * A copy with each of {@code params} set to the value at the same index of {@code values} [SI]: the set
     * {@link #with} would give applied one after another, built with one copy.
     */
    public DiodeParameters with(java.util.List<Param> params, double[] values) {
        if (params.size() != values.length) {
            throw new IllegalArgumentException(params.size() + " parameters but " + values.length + " values");
        }
        EnumMap<Param, Double> copy = new EnumMap<>(given);
        for (int j = 0; j < values.length; j++) {
            validate(params.get(j), values[j]);
            copy.put(params.get(j), values[j]);
        }
        return new DiodeParameters(copy, true);
    }

    /** A copy with {@code p} no longer given (its default, or its term switched off). */
    public DiodeParameters without(Param p) {
        EnumMap<Param, Double> copy = new EnumMap<>(given);
        copy.remove(p);
        return new DiodeParameters(copy, true);
    }

    /** Nominal temperature TNOM [K]. */
    public double nominalTemperature() {
        return get(Param.TNOM);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof DiodeParameters other && given.equals(other.given);
    }

    @Override
    public int hashCode() {
        return given.hashCode();
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder("DiodeParameters{");
        String sep = "";
        for (Map.Entry<Param, Double> e : given.entrySet()) {
            sb.append(sep).append(e.getKey()).append('=').append(e.getValue());
            sep = ", ";
        }
        return sb.append('}').toString();
    }
}
