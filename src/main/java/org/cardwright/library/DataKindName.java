package org.cardwright.library;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/** What a data file listed in a device file holds, as the device file names it. */
public enum DataKindName {
    /** Forward I-V sweep (positive current), CSV with V and I columns. */
    FORWARD("forward", true),
    /** Reverse I-V: leakage and breakdown (negative current), CSV with V and I columns. */
    REVERSE("reverse", true),
    /** Capacitance against reverse voltage, CSV with V and C columns. */
    CV("cv", true),
    /** Reverse-recovery records. */
    RECOVERY("recovery", true),
    /** Bench log: supply, series resistor and meter readings. */
    BENCH_LOG("bench-log", true);

    private final String spelling;
    private final boolean readable;

    DataKindName(String spelling, boolean readable) {
        this.spelling = spelling;
        this.readable = readable;
    }

    /** The spelling in device files, e.g. {@code bench-log}. */
    public String spelling() {
        return spelling;
    }

    /** True when this version reads files of this kind (as CSV measurement files). */
    public boolean readable() {
        return readable;
    }

    /** The kind spelled {@code text}, any letter case; empty when there is none. */
    public static java.util.Optional<DataKindName> bySpelling(String text) {
        String t = text.trim().toLowerCase(Locale.ROOT);
        return Arrays.stream(values()).filter(k -> k.spelling.equals(t)).findFirst();
    }

    /**
     * The conditions a data entry of this kind may state in its {@code options} (the entry's {@code temperature}
     * key gives the temperature): lead resistance for I-V tables, reverse magnitudes for reverse I-V, stray
     * capacitance and test frequency for C-V, the meter input resistance for bench logs.
     */
    public java.util.Set<org.cardwright.data.Condition> conditions() {
        return switch (this) {
            case FORWARD -> java.util.EnumSet.of(org.cardwright.data.Condition.LEAD_RESISTANCE);
            case REVERSE -> java.util.EnumSet.of(org.cardwright.data.Condition.LEAD_RESISTANCE,
                    org.cardwright.data.Condition.REVERSE_MAGNITUDES);
            case CV -> java.util.EnumSet.of(org.cardwright.data.Condition.STRAY_CAPACITANCE,
                    org.cardwright.data.Condition.TEST_FREQUENCY);
            case BENCH_LOG -> java.util.EnumSet.of(org.cardwright.data.Condition.METER_INPUT_RESISTANCE);
            case RECOVERY -> java.util.EnumSet.noneOf(org.cardwright.data.Condition.class);
        };
    }

    /** All spellings, for messages. */
    public static String spellings() {
        return Arrays.stream(values()).map(DataKindName::spelling).collect(Collectors.joining(", "));
    }
}
