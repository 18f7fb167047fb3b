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

    /** All spellings, for messages. */
    public static String spellings() {
        return Arrays.stream(values()).map(DataKindName::spelling).collect(Collectors.joining(", "));
    }
}
