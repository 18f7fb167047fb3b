package org.cardwright.data;

import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The settings a file states before its header row, read into SI values: quantities in V, A, ohm and K,
 * percentages as fractions, accuracies with their counts multiplied out. Keys the reader does not know are
 * kept as comments and listed in one notice.
 */
final class FileSettings {
    private static final String NUMBER = "[+-]?(?:\\d++(?:[.,]\\d*+)?|[.,]\\d++)(?:[eE][+-]?\\d++)?";
    private static final Pattern NUMBER_AND_UNIT = Pattern.compile("(" + NUMBER + ")\\s*(\\S.*)");
    private static final Pattern PERCENT = Pattern.compile("(" + NUMBER + ")\\s*%");
    private static final Pattern PERCENT_OF_READING = Pattern.compile("(" + NUMBER
            + ")\\s*%(?:\\s*of\\s+(?:the\\s+)?reading)?", Pattern.CASE_INSENSITIVE);
    private static final Pattern COUNTS = Pattern.compile("(" + NUMBER + ")\\s*(?:counts?|digits?|cts)",
            Pattern.CASE_INSENSITIVE);
    /** A plus sign joining terms, not the sign of an exponent. */
    private static final Pattern TERM_JOIN = Pattern.compile("(?<![eE])\\+");
    private static final BigDecimal HUNDRED = BigDecimal.valueOf(100);

    private final Path file;
    private final Map<SettingKey, Preamble.Line> lines;
    private final Map<SettingKey, BigDecimal> values;
    private final Map<SettingKey, InstrumentAccuracy> accuracies;

    private FileSettings(Path file, Map<SettingKey, Preamble.Line> lines, Map<SettingKey, BigDecimal> values,
                         Map<SettingKey, InstrumentAccuracy> accuracies) {
        this.file = file;
        this.lines = lines;
        this.values = values;
        this.accuracies = accuracies;
    }

    /**
     * Reads the setting lines.
     *
     * @param decimalComma whether values may use a decimal comma (the file is not comma-separated)
     * @param notices      receives one notice listing the keys not read
     * @throws DataFileException on a key given twice, a value that cannot be read, or a value out of range
     */
    static FileSettings read(Path file, List<Preamble.Line> settingLines, boolean decimalComma,
                             List<Notice> notices) throws DataFileException {
        Map<SettingKey, Preamble.Line> lines = new EnumMap<>(SettingKey.class);
        Map<SettingKey, BigDecimal> values = new EnumMap<>(SettingKey.class);
        Map<SettingKey, ParsedAccuracy> parsed = new EnumMap<>(SettingKey.class);
        List<String> unknown = new ArrayList<>();
        int firstUnknown = 0;
        for (Preamble.Line l : settingLines) {
            Optional<SettingKey> known = l.known();
            if (known.isEmpty()) {
                if (unknown.isEmpty()) {
                    firstUnknown = l.line();
                }
                unknown.add("'" + l.key() + "' (line " + l.line() + ")");
                continue;
            }
            SettingKey key = known.get();
            Preamble.Line earlier = lines.putIfAbsent(key, l);
            if (earlier != null) {
                throw new DataFileException(file, l.line(), "setting '" + key.key() + "' is given twice (lines "
                        + earlier.line() + " and " + l.line() + ")", l.value());
            }
            try {
                switch (key.form()) {
                    case QUANTITY -> values.put(key, checked(key, exactQuantity(l.value(), key.quantity(), decimalComma)));
                    case PERCENT -> values.put(key, BigDecimal.valueOf(percent(l.value(), decimalComma)));
                    case ACCURACY -> parsed.put(key, accuracy(l.value(), key.quantity(), decimalComma));
                    case YES_NO -> values.put(key, yesNo(l.value()) ? BigDecimal.ONE : BigDecimal.ZERO);
                }
            } catch (CellProblem e) {
                throw new DataFileException(file, l.line(), "cannot read setting '" + key.key() + "': "
                        + e.problem(), l.value());
            }
        }
        if (!unknown.isEmpty()) {
            notices.add(new Notice(file, firstUnknown, (unknown.size() == 1 ? "setting " : "settings ")
                    + String.join(", ", unknown) + " not read: not a key cardwright knows (see docs/bench-logs.md); "
                    + "kept as a comment"));
        }
        Map<SettingKey, InstrumentAccuracy> accuracies = new EnumMap<>(SettingKey.class);
        for (Map.Entry<SettingKey, ParsedAccuracy> e : parsed.entrySet()) {
            SettingKey key = e.getKey();
            SettingKey resolutionKey = resolutionOf(key);
            ParsedAccuracy a = e.getValue();
            double absolute = a.absolute;
            if (a.counts > 0) {
                BigDecimal count = values.get(resolutionKey);
                if (count == null) {
                    Preamble.Line l = lines.get(key);
                    throw new DataFileException(file, l.line(), "setting '" + key.key() + "' counts in counts, "
                            + "but the file does not say what one count is: add '# " + resolutionKey.key()
                            + " = ...'", l.value());
                }
                absolute += a.counts * count.doubleValue();
            }
            accuracies.put(key, new InstrumentAccuracy(a.fraction, absolute, lines.get(key).value()));
        }
        for (SettingKey key : List.of(SettingKey.SUPPLY_RESOLUTION, SettingKey.VOLTMETER_RESOLUTION,
                SettingKey.AMMETER_RESOLUTION)) {
            SettingKey accuracyKey = accuracyOf(key);
            if (values.containsKey(key) && (!parsed.containsKey(accuracyKey) || parsed.get(accuracyKey).counts == 0)) {
                notices.add(new Notice(file, lines.get(key).line(), "setting '" + key.key() + "' not used: it only "
                        + "gives the size of a count for '" + accuracyKey.key() + "', which counts none"));
            }
        }
        return new FileSettings(file, lines, values, accuracies);
    }

    private record ParsedAccuracy(double fraction, double absolute, double counts) {
    }

    /** Whether the file states the setting. */
    boolean has(SettingKey key) {
        return lines.containsKey(key);
    }

    /** Every setting the file states. */
    Set<SettingKey> stated() {
        return lines.keySet();
    }

    /** A QUANTITY setting in SI units, or a PERCENT setting as a fraction; empty when not stated. */
    OptionalDouble value(SettingKey key) {
        BigDecimal v = values.get(key);
        return v == null ? OptionalDouble.empty() : OptionalDouble.of(v.doubleValue());
    }

    /** A QUANTITY setting in SI units exactly as the file writes it, for exact decimal arithmetic. */
    Optional<BigDecimal> exact(SettingKey key) {
        return Optional.ofNullable(values.get(key));
    }

    /** An ACCURACY setting with counts multiplied out; empty when not stated. */
    Optional<InstrumentAccuracy> accuracy(SettingKey key) {
        return Optional.ofNullable(accuracies.get(key));
    }

    /** The physical line of a stated setting [1]. */
    int line(SettingKey key) {
        return lines.get(key).line();
    }

    /** The value of a stated setting as written. */
    String written(SettingKey key) {
        return lines.get(key).value();
    }

    /**
     * One notice for the stated settings this kind of file does not use, naming each with its line.
     *
     * @param used what this kind of file reads
     * @param what the kind of file, for the message, e.g. "a C-V file"
     */
    void noteUnused(Set<SettingKey> used, String what, List<Notice> notices) {
        List<String> unused = new ArrayList<>();
        int first = 0;
        List<SettingKey> inFileOrder = new ArrayList<>(lines.keySet());
        inFileOrder.sort((a, b) -> Integer.compare(line(a), line(b)));
        for (SettingKey key : inFileOrder) {
            boolean resolution = key == SettingKey.SUPPLY_RESOLUTION || key == SettingKey.VOLTMETER_RESOLUTION
                    || key == SettingKey.AMMETER_RESOLUTION;
            if (!used.contains(key) && !(resolution && used.contains(accuracyOf(key)))) {
                if (unused.isEmpty()) {
                    first = line(key);
                }
                unused.add("'" + key.key() + "' (line " + line(key) + ")");
            }
        }
        if (!unused.isEmpty()) {
            notices.add(new Notice(file, first, (unused.size() == 1 ? "setting " : "settings ")
                    + String.join(", ", unused) + " not used: " + (unused.size() == 1 ? "it does" : "they do")
                    + " not apply to " + what));
        }
    }

    private static SettingKey resolutionOf(SettingKey accuracy) {
        return switch (accuracy) {
            case SUPPLY_ACCURACY -> SettingKey.SUPPLY_RESOLUTION;
            case VOLTMETER_ACCURACY -> SettingKey.VOLTMETER_RESOLUTION;
            case AMMETER_ACCURACY -> SettingKey.AMMETER_RESOLUTION;
            default -> throw new IllegalArgumentException(accuracy + " is not an accuracy");
        };
    }

    private static SettingKey accuracyOf(SettingKey resolution) {
        return switch (resolution) {
            case SUPPLY_RESOLUTION -> SettingKey.SUPPLY_ACCURACY;
            case VOLTMETER_RESOLUTION -> SettingKey.VOLTMETER_ACCURACY;
            case AMMETER_RESOLUTION -> SettingKey.AMMETER_ACCURACY;
            default -> throw new IllegalArgumentException(resolution + " is not a resolution");
        };
    }

    /** Range checks of QUANTITY settings, in SI units. */
    private static BigDecimal checked(SettingKey key, BigDecimal exact) throws CellProblem {
        double si = exact.doubleValue();
        switch (key) {
            case METER_INPUT_RESISTANCE -> {
                if (!(si > 0)) {
                    throw new CellProblem("the meter input resistance must be positive, got " + si + " ohm");
                }
            }
            case SUPPLY_SOURCE_RESISTANCE, LEAD_RESISTANCE -> {
                if (!(si >= 0)) {
                    throw new CellProblem("a resistance must not be negative, got " + si + " ohm");
                }
            }
            case SUPPLY_RESOLUTION, VOLTMETER_RESOLUTION, AMMETER_RESOLUTION -> {
                if (!(si > 0)) {
                    throw new CellProblem("the size of a count must be positive, got " + si);
                }
            }
            case TEMPERATURE -> {
                if (!(si > 0)) {
                    throw new CellProblem("temperature at or below absolute zero: " + si + " K");
                }
            }
            case STRAY_CAPACITANCE -> {
                if (!(si >= 0)) {
                    throw new CellProblem("a stray capacitance must not be negative, got " + si + " F");
                }
            }
            case TEST_FREQUENCY -> {
                if (!(si > 0)) {
                    throw new CellProblem("a test frequency must be positive, got " + si + " Hz");
                }
            }
            default -> {
            }
        }
        return exact;
    }

    /**
     * A number with an optional unit of the quantity, in SI units: {@code 10 Mohm}, {@code 10meg},
     * {@code 0.12}, {@code 25 degC}. Without a unit: SI, degrees Celsius for a temperature. A lone capital
     * {@code M} suffix is refused here: a setting is written by hand, where it more likely means mega.
     */
    static double quantity(String text, Quantity q, boolean decimalComma) throws CellProblem {
        return DecimalText.toDouble(exactQuantity(text, q, decimalComma));
    }

    /** As {@link #quantity}, exactly: the SI value in decimal, before rounding to a double. */
    static BigDecimal exactQuantity(String text, Quantity q, boolean decimalComma) throws CellProblem {
        String t = text.strip();
        CellNumber.Reading r = null;
        CellProblem plain = null;
        try {
            r = CellNumber.parse(t, decimalComma);
        } catch (CellProblem e) {
            plain = e;
        }
        if (r != null) {
            if (r.capitalMilli()) {
                throw new CellProblem("a lone M suffix is milli in SPICE but often meant as mega; write meg or M"
                        + (q == Quantity.RESISTANCE ? "ohm" : q.siUnit()) + " for mega, m for milli");
            }
            BigDecimal si = ColumnUnit.implicit(q).toSi(r.value());
            DecimalText.toDouble(si);
            return si;
        }
        Matcher m = NUMBER_AND_UNIT.matcher(t);
        if (!m.matches()) {
            throw plain;
        }
        BigDecimal number = CellNumber.parse(m.group(1), decimalComma).value();
        BigDecimal si = ColumnUnit.parse(q, m.group(2).strip()).toSi(number);
        DecimalText.toDouble(si);
        return si;
    }

    /** A yes/no value: yes, true, on or 1 is yes; no, false, off or 0 is no (any letter case). */
    static boolean yesNo(String text) throws CellProblem {
        String t = text.strip().toLowerCase(java.util.Locale.ROOT);
        return switch (t) {
            case "yes", "true", "on", "1" -> true;
            case "no", "false", "off", "0" -> false;
            default -> throw new CellProblem("write yes or no");
        };
    }

    /**
     * A value as a setting of {@code key} is read, range checks included: a quantity in SI units, a percentage as
     * a fraction, yes/no as 1/0. For settings given outside a file (a device file), so both read alike.
     */
    static double given(SettingKey key, String text) throws CellProblem {
        return switch (key.form()) {
            case QUANTITY -> checked(key, exactQuantity(text, key.quantity(), false)).doubleValue();
            case PERCENT -> percent(text, false);
            case YES_NO -> yesNo(text) ? 1 : 0;
            case ACCURACY -> throw new CellProblem("an accuracy is stated in the data file only");
        };
    }

    /** A percentage as a fraction: {@code 1 %} is 0.01; above 0 and below 100 %. */
    static double percent(String text, boolean decimalComma) throws CellProblem {
        Matcher m = PERCENT.matcher(text.strip());
        if (!m.matches()) {
            throw new CellProblem("write a percentage, e.g. '1 %'");
        }
        BigDecimal p = CellNumber.parse(m.group(1), decimalComma).value();
        if (p.signum() <= 0 || p.compareTo(HUNDRED) >= 0) {
            throw new CellProblem("a tolerance must lie above 0 % and below 100 %; leave the line out when "
                    + "it is unknown");
        }
        return p.divide(HUNDRED).doubleValue();
    }

    private static ParsedAccuracy accuracy(String text, Quantity q, boolean decimalComma) throws CellProblem {
        double fraction = 0;
        double absolute = 0;
        double counts = 0;
        boolean seenPercent = false;
        boolean seenCounts = false;
        boolean seenAbsolute = false;
        for (String term : TERM_JOIN.split(text.strip(), -1)) {
            String t = term.strip();
            Matcher p = PERCENT_OF_READING.matcher(t);
            Matcher c = COUNTS.matcher(t);
            if (t.isEmpty()) {
                throw new CellProblem("an empty term; write e.g. '0.015 % + 2 counts'");
            } else if (p.matches() && !seenPercent) {
                seenPercent = true;
                fraction = CellNumber.parse(p.group(1), decimalComma).value().divide(HUNDRED).doubleValue();
            } else if (c.matches() && !seenCounts) {
                seenCounts = true;
                counts = CellNumber.parse(c.group(1), decimalComma).value().doubleValue();
            } else if (!p.matches() && !c.matches() && !seenAbsolute) {
                seenAbsolute = true;
                absolute = quantity(t, q, decimalComma);
            } else {
                throw new CellProblem("each of '% of reading', 'counts' and a fixed " + q.word()
                        + " may appear once");
            }
        }
        if (fraction < 0 || counts < 0 || absolute < 0) {
            throw new CellProblem("an accuracy has no negative terms");
        }
        if (fraction == 0 && counts == 0 && absolute == 0) {
            throw new CellProblem("an accuracy of zero; leave the line out when it is unknown");
        }
        return new ParsedAccuracy(fraction, absolute, counts);
    }
}
