package org.cardwright.data;

import java.util.Collections;
import java.util.EnumMap;
import java.util.Map;
import java.util.Optional;

/**
 * Conditions given for a data file from outside it (a device file, the command line), each with where it came
 * from. The reader uses one only where the file states none; where the file states another value, the file's
 * is used and a notice says which value was not.
 *
 * @param values the conditions given, by condition
 */
public record GivenConditions(Map<Condition, ConditionValue> values) {
    /** Nothing given. */
    public static final GivenConditions NONE = new GivenConditions(Map.of());

    public GivenConditions {
        EnumMap<Condition, ConditionValue> copy = new EnumMap<>(Condition.class);
        copy.putAll(values);
        values = Collections.unmodifiableMap(copy);
    }

    /** These conditions with {@code c} given as {@code value} (replacing any earlier one). */
    public GivenConditions with(Condition c, double value, String source) {
        EnumMap<Condition, ConditionValue> copy = new EnumMap<>(Condition.class);
        copy.putAll(values);
        copy.put(c, new ConditionValue(value, source));
        return new GivenConditions(copy);
    }

    /** The value given for {@code c}, if any. */
    public Optional<ConditionValue> get(Condition c) {
        return Optional.ofNullable(values.get(c));
    }

    /** These conditions, and those of {@code fallback} for the conditions these do not give. */
    public GivenConditions orElse(GivenConditions fallback) {
        EnumMap<Condition, ConditionValue> copy = new EnumMap<>(Condition.class);
        copy.putAll(fallback.values);
        copy.putAll(values);
        return new GivenConditions(copy);
    }
}
