package org.cardwright.data;

import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * Reads a measurement file (CSV with one header row) into SI records.
 *
 * <p>The header names the columns, without regard to case: V and I for I-V data, V and C for C-V data, or
 * Vsupply, Rseries and Vmeter for a series-resistor bench log (read as I-V points, corrected for the meter's
 * draw by Kirchhoff's current law); optionally T, the device temperature of each row, dV and dI, stated 1-sigma
 * uncertainties, and a status or compliance flag column whose flagged rows are set aside. A unit may follow a
 * name in brackets or parentheses ({@code I [mA]}, {@code C (pF)}, {@code T [degC]}, {@code Rseries [kohm]});
 * without one a column is in V, A, F, ohm, and degrees Celsius for T. Cells may carry a SPICE suffix
 * ({@code 1.2m}, {@code 10meg}).
 *
 * <p>Cells are separated by commas, semicolons or tabs, detected from the header row unless the options fix
 * the delimiter; where it is not a comma, a decimal comma is read. Before the header row, {@code # key = value}
 * comment lines and plain {@code key: value} lines state settings (temperature, instrument accuracy, meter
 * input resistance, lead resistance, ...; docs/bench-logs.md lists them). Lines whose first non-blank
 * character is {@code #} are comments; blank lines are skipped; a UTF-8 byte-order mark is accepted. Line
 * numbers everywhere are physical 1-based lines of the file, comments and blank lines included.
 *
 * <p>Nothing is dropped or changed silently: anything refused is a {@link DataFileException} naming file, line
 * and raw text, and anything done that the user should know about is a {@link Notice} in the result.
 */
public final class MeasurementReader {
    /** Offset between the Celsius and Kelvin scales, used only to show temperatures in messages [K]. */
    private static final double CELSIUS_ZERO = 273.15;

    private static final Set<SettingKey> USED_BY_IV_TABLE = EnumSet.of(SettingKey.TEMPERATURE,
            SettingKey.VOLTMETER_ACCURACY, SettingKey.AMMETER_ACCURACY, SettingKey.LEAD_RESISTANCE,
            SettingKey.REVERSE_MAGNITUDES);
    private static final Set<SettingKey> USED_BY_CV_TABLE = EnumSet.of(SettingKey.TEMPERATURE,
            SettingKey.STRAY_CAPACITANCE, SettingKey.TEST_FREQUENCY);
    private static final Set<SettingKey> USED_BY_LOG = EnumSet.of(SettingKey.TEMPERATURE,
            SettingKey.METER_INPUT_RESISTANCE, SettingKey.METER_INPUT_RESISTANCE_TOLERANCE,
            SettingKey.SUPPLY_SOURCE_RESISTANCE, SettingKey.RESISTOR_TOLERANCE, SettingKey.SUPPLY_ACCURACY,
            SettingKey.VOLTMETER_ACCURACY);

    private final ReadOptions options;

    /** A reader that applies the given options to every file it reads. */
    public MeasurementReader(ReadOptions options) {
        this.options = Objects.requireNonNull(options, "options");
    }

    /**
     * Reads one file.
     *
     * @param file the file; messages name it exactly as given here
     * @return the file's points in file order, its SHA-256 and the notices
     * @throws DataFileException when the file cannot be read or anything in it is wrong; the first problem
     *                           found, in file order
     */
    public MeasurementFile read(Path file) throws DataFileException {
        return read(file, GivenConditions.NONE);
    }

    /**
     * Reads one file with conditions given for it from outside (a device file, the command line). A condition
     * the file states itself wins; a given one that differs is named in a notice as not used. The given
     * temperature and meter input resistance take the place of the options' ones.
     *
     * @param file  the file; messages name it exactly as given here
     * @param given conditions for this file from outside it
     */
    public MeasurementFile read(Path file, GivenConditions given) throws DataFileException {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(given, "given");
        try (LineSource source = LineSource.open(file)) {
            return read(file, source, given);
        }
    }

    private MeasurementFile read(Path file, LineSource source, GivenConditions given) throws DataFileException {
        // the lines before the header: only the settings are kept
        List<Preamble.Line> settingLines = new ArrayList<>();
        String headerText = null;
        boolean anyLine = false;
        for (String text = source.next(); text != null; text = source.next()) {
            anyLine = true;
            String stripped = text.strip();
            if (stripped.isEmpty()) {
                continue;
            }
            Optional<Preamble.Line> setting = Preamble.setting(source.lineNumber(), stripped);
            if (setting.isPresent()) {
                settingLines.add(setting.get());
            } else if (!stripped.startsWith("#")) {
                headerText = text;
                break;
            }
        }
        if (headerText == null) {
            String why = !anyLine ? "empty file: no header row"
                    : "no header row: the file holds only comments, settings and blank lines";
            throw new DataFileException(file, 0, why, null);
        }
        int headerLine = source.lineNumber();
        Preamble preamble = new Preamble(headerLine - 1, settingLines);
        String header0 = headerText;
        char delimiter = options.delimiter().orElseGet(() -> detectDelimiter(header0));
        boolean decimalComma = delimiter != ReadOptions.COMMA;
        CsvLine splitter = new CsvLine(delimiter);
        HeaderLayout header = HeaderLayout.parse(file, headerLine, headerText,
                split(splitter, file, headerLine, headerText));

        List<Notice> notices = new ArrayList<>();
        noteIgnoredColumns(file, headerLine, header, notices);
        if (header.reverseMagnitudes()) {
            notices.add(new Notice(file, headerLine, "columns VR and IR hold reverse-bias magnitudes: read as "
                    + "V = -VR, I = -IR"));
        }
        if (options.delimiter().isEmpty() && delimiter != ReadOptions.COMMA) {
            notices.add(new Notice(file, headerLine, "cells separated by " + (delimiter == '\t' ? "tabs" : "semicolons")
                    + " (detected from the header row); a decimal comma is read"));
        }
        FileSettings settings = FileSettings.read(file, preamble.settings(), decimalComma, notices);
        java.util.Map<Condition, ConditionValue> used = new java.util.EnumMap<>(Condition.class);
        RowConverter.TemperatureFallback fallback = temperatureSource(file, headerLine, headerText, header,
                settings, notices, given, used);
        header = reverseConvention(file, headerLine, header, settings, notices, given, used);
        RowConverter.Rules rules = rules(file, headerLine, headerText, header, settings, notices, given, used);
        if (header.kind() == DataKind.CV) {
            capacitanceConditions(file, headerLine, settings, notices, given, used);
        }

        RowConverter rows = new RowConverter(file, header, decimalComma, fallback, rules, notices);
        for (String text = source.next(); text != null; text = source.next()) {
            int line = source.lineNumber();
            String stripped = text.strip();
            if (stripped.isEmpty()) {
                continue;
            }
            if (stripped.startsWith("#")) {
                noteLateSetting(file, line, stripped, notices);
                continue;
            }
            List<String> cells = split(splitter, file, line, text);
            if (cells.size() != header.width()) {
                throw new DataFileException(file, line, "row has " + cells.size() + " cells, the header on line "
                        + headerLine + " has " + header.width(), text);
            }
            rows.add(line, text, cells);
        }
        rows.finish(headerLine, headerText);
        if (rows.count() == 0) {
            throw new DataFileException(file, headerLine, "header but no data rows", headerText);
        }
        noteUncertaintySources(file, headerLine, header, settings, notices);
        return new MeasurementFile(file, source.sha256(), header.kind(), rows.ivPoints(), rows.cvPoints(),
                notices, header.layout(), used);
    }

    /** The delimiter a header row uses: tab if it holds one, else semicolon if it holds one, else comma. */
    static char detectDelimiter(String headerText) {
        String unquoted = headerText.replaceAll("\"[^\"]*\"", "");
        if (unquoted.indexOf('\t') >= 0) {
            return '\t';
        }
        if (unquoted.indexOf(';') >= 0) {
            return ';';
        }
        return ReadOptions.COMMA;
    }

    private static List<String> split(CsvLine splitter, Path file, int line, String text) throws DataFileException {
        try {
            return splitter.split(text);
        } catch (CellProblem e) {
            throw new DataFileException(file, line, e.problem(), text);
        }
    }

    private static void noteIgnoredColumns(Path file, int headerLine, HeaderLayout header, List<Notice> notices) {
        if (header.ignored().isEmpty()) {
            return;
        }
        List<String> names = new ArrayList<>();
        for (HeaderLayout.Column c : header.ignored()) {
            names.add("'" + c.cell() + "' (column " + c.number() + ")");
        }
        String columns = header.ignored().size() == 1 ? "1 extra column" : header.ignored().size() + " extra columns";
        notices.add(new Notice(file, headerLine, "ignoring " + columns + ": " + String.join(", ", names)));
    }

    /** A known setting written as a comment after the header row is not read; say so. */
    private static void noteLateSetting(Path file, int line, String stripped, List<Notice> notices) {
        Optional<Preamble.Line> late = Preamble.commentSetting(line, stripped);
        if (late.isPresent() && late.get().known().isPresent()) {
            notices.add(new Notice(file, line, "setting '" + late.get().known().get().key() + "' after the header "
                    + "row is not read; settings go above the header row"));
        }
    }

    private RowConverter.TemperatureFallback temperatureSource(Path file, int headerLine, String headerText,
                                                               HeaderLayout header, FileSettings settings,
                                                               List<Notice> notices, GivenConditions conditions,
                                                               java.util.Map<Condition, ConditionValue> used)
            throws DataFileException {
        Optional<ConditionValue> fromOutside = conditions.get(Condition.TEMPERATURE);
        OptionalDouble given = fromOutside.isPresent() ? OptionalDouble.of(fromOutside.get().value())
                : options.defaultTemperature();
        String givenWords = fromOutside.isPresent() ? "the temperature given by " + fromOutside.get().source()
                : "the given temperature";
        OptionalDouble stated = settings.value(SettingKey.TEMPERATURE);
        if (stated.isPresent()) {
            int at = settings.line(SettingKey.TEMPERATURE);
            String source = "the file's temperature (line " + at + ")";
            used.put(Condition.TEMPERATURE, ConditionValue.inFile(stated.getAsDouble(), at));
            if (given.isPresent() && given.getAsDouble() != stated.getAsDouble()) {
                notices.add(new Notice(file, at, "the file states its temperature " + kelvinText(stated.getAsDouble())
                        + "; " + givenWords + " " + kelvinText(given.getAsDouble()) + " is not used"));
            }
            if (header.temperature().isPresent()) {
                notices.add(new Notice(file, headerLine, "the file has a T column; its temperature setting "
                        + kelvinText(stated.getAsDouble()) + " (line " + at + ") is used only for empty T cells"));
            } else {
                notices.add(new Notice(file, headerLine, "no T column: every point is at " + source + " "
                        + kelvinText(stated.getAsDouble())));
            }
            return new RowConverter.TemperatureFallback(stated, source);
        }
        if (header.temperature().isPresent()) {
            if (given.isPresent()) {
                notices.add(new Notice(file, headerLine, "the file has a T column; " + givenWords + " "
                        + kelvinText(given.getAsDouble()) + " is used only for empty T cells"));
            }
            return new RowConverter.TemperatureFallback(given, givenWords);
        }
        if (given.isEmpty()) {
            throw new DataFileException(file, headerLine, "no T column and no --temp given (nor a '# temperature "
                    + "= ...' line above the header)", headerText);
        }
        used.put(Condition.TEMPERATURE, fromOutside.orElse(new ConditionValue(given.getAsDouble(), "--temp")));
        notices.add(new Notice(file, headerLine, "no T column: every point is at " + givenWords + " "
                + kelvinText(given.getAsDouble())));
        return new RowConverter.TemperatureFallback(given, givenWords);
    }

    private RowConverter.Rules rules(Path file, int headerLine, String headerText, HeaderLayout header,
                                     FileSettings settings, List<Notice> notices, GivenConditions given,
                                     java.util.Map<Condition, ConditionValue> used) throws DataFileException {
        if (header.layout() == FileLayout.POINT_TABLE) {
            if (header.kind() == DataKind.CV) {
                settings.noteUnused(USED_BY_CV_TABLE, "a C-V file", notices);
                return new RowConverter.Rules(null, null, null, null);
            }
            settings.noteUnused(USED_BY_IV_TABLE, "an I-V point table", notices);
            BigDecimal lead = settings.exact(SettingKey.LEAD_RESISTANCE).orElse(null);
            Optional<ConditionValue> givenLead = given.get(Condition.LEAD_RESISTANCE);
            if (lead != null) {
                used.put(Condition.LEAD_RESISTANCE, ConditionValue.inFile(lead.doubleValue(),
                        settings.line(SettingKey.LEAD_RESISTANCE)));
                double stated = lead.doubleValue();
                givenLead.filter(g -> g.value() != stated).ifPresent(g -> notices.add(notUsed(file,
                        settings.line(SettingKey.LEAD_RESISTANCE), Condition.LEAD_RESISTANCE, stated, g)));
            } else if (givenLead.isPresent()) {
                lead = new BigDecimal(Double.toString(givenLead.get().value()));
                used.put(Condition.LEAD_RESISTANCE, givenLead.get());
                notices.add(new Notice(file, headerLine, "lead resistance " + Condition.LEAD_RESISTANCE.text(
                        givenLead.get().value()) + " from " + givenLead.get().source() + " (the file states none)"));
            }
            return new RowConverter.Rules(settings.accuracy(SettingKey.VOLTMETER_ACCURACY).orElse(null),
                    settings.accuracy(SettingKey.AMMETER_ACCURACY).orElse(null), lead, null);
        }
        if (settings.has(SettingKey.LEAD_RESISTANCE)) {
            throw new DataFileException(file, settings.line(SettingKey.LEAD_RESISTANCE), "'lead resistance' is for "
                    + "2-wire V-I exports; in a series-resistor log the meter reads across the diode, and a "
                    + "resistance in series with Rseries belongs in 'supply source resistance'",
                    settings.written(SettingKey.LEAD_RESISTANCE));
        }
        settings.noteUnused(USED_BY_LOG, "a series-resistor log", notices);
        OptionalDouble meter = settings.value(SettingKey.METER_INPUT_RESISTANCE);
        Optional<ConditionValue> fromOutside = given.get(Condition.METER_INPUT_RESISTANCE);
        OptionalDouble givenMeter = fromOutside.isPresent() ? OptionalDouble.of(fromOutside.get().value())
                : options.meterResistance();
        String givenWords = fromOutside.isPresent() ? "the one given by " + fromOutside.get().source() : "the given";
        if (meter.isPresent() && givenMeter.isPresent() && meter.getAsDouble() != givenMeter.getAsDouble()) {
            notices.add(new Notice(file, settings.line(SettingKey.METER_INPUT_RESISTANCE), "the file states its meter "
                    + "input resistance " + RowConverter.fmt(meter.getAsDouble()) + " ohm; " + givenWords + " "
                    + RowConverter.fmt(givenMeter.getAsDouble()) + " ohm is not used"));
        }
        if (meter.isPresent()) {
            used.put(Condition.METER_INPUT_RESISTANCE, ConditionValue.inFile(meter.getAsDouble(),
                    settings.line(SettingKey.METER_INPUT_RESISTANCE)));
        } else if (givenMeter.isPresent()) {
            meter = givenMeter;
            used.put(Condition.METER_INPUT_RESISTANCE, fromOutside.orElse(
                    new ConditionValue(givenMeter.getAsDouble(), "--meter-resistance")));
            if (fromOutside.isPresent()) {
                notices.add(new Notice(file, headerLine, "meter input resistance " + Condition.METER_INPUT_RESISTANCE
                        .text(givenMeter.getAsDouble()) + " from " + fromOutside.get().source() + " (the file states none)"));
            }
        }
        if (meter.isEmpty() && options.meterLoadingCorrection()) {
            throw new DataFileException(file, headerLine, "series-resistor log without the meter input resistance: "
                    + "add '# meter input resistance = 10 Mohm' (your meter's value) above the header row, or "
                    + "give --meter-resistance", headerText);
        }
        SeriesResistorLog.Setup setup = new SeriesResistorLog.Setup(meter.orElse(Double.NaN),
                settings.value(SettingKey.METER_INPUT_RESISTANCE_TOLERANCE).orElse(0),
                settings.value(SettingKey.SUPPLY_SOURCE_RESISTANCE).orElse(0),
                settings.value(SettingKey.RESISTOR_TOLERANCE).orElse(0),
                settings.accuracy(SettingKey.SUPPLY_ACCURACY).orElse(null),
                settings.accuracy(SettingKey.VOLTMETER_ACCURACY).orElse(null),
                options.meterLoadingCorrection());
        return new RowConverter.Rules(null, null, null, setup);
    }

    /** The notice for a condition given from outside that the file's own statement overrides. */
    private static Notice notUsed(Path file, int line, Condition c, double stated, ConditionValue given) {
        return new Notice(file, line, "the file states its " + c.key() + " " + c.text(stated) + "; "
                + c.text(given.value()) + " given by " + given.source() + " is not used");
    }

    /**
     * The stated convention for reverse data written as positive magnitudes under V and I headers
     * ({@code # reverse magnitudes = yes}, or given from outside): the header then reads as VR and IR would.
     */
    private static HeaderLayout reverseConvention(Path file, int headerLine, HeaderLayout header, FileSettings settings,
                                                  List<Notice> notices, GivenConditions given,
                                                  java.util.Map<Condition, ConditionValue> used)
            throws DataFileException {
        Optional<ConditionValue> outside = given.get(Condition.REVERSE_MAGNITUDES);
        ConditionValue value;
        if (settings.has(SettingKey.REVERSE_MAGNITUDES)) {
            int at = settings.line(SettingKey.REVERSE_MAGNITUDES);
            value = ConditionValue.inFile(settings.value(SettingKey.REVERSE_MAGNITUDES).orElse(0), at);
            if (outside.isPresent() && outside.get().value() != value.value()) {
                notices.add(notUsed(file, at, Condition.REVERSE_MAGNITUDES, value.value(), outside.get()));
            }
        } else if (outside.isPresent()) {
            value = outside.get();
        } else {
            return header;
        }
        if (header.kind() != DataKind.IV || header.layout() != FileLayout.POINT_TABLE) {
            // a data-file line here is already named as not applying; one from outside is refused where it is given
            return header;
        }
        used.put(Condition.REVERSE_MAGNITUDES, value);
        if (value.value() == 0 || header.reverseMagnitudes()) {
            return header;
        }
        notices.add(new Notice(file, headerLine, "reverse magnitudes = yes (" + value.source() + "): V and I hold "
                + "reverse-bias magnitudes, read as V = -V, I = -I"));
        return header.asReverseMagnitudes();
    }

    /** The C-V file's stray capacitance and test frequency: the file's own, else given, else the defaults. */
    private static void capacitanceConditions(Path file, int headerLine, FileSettings settings, List<Notice> notices,
                                              GivenConditions given, java.util.Map<Condition, ConditionValue> used) {
        List<String> said = new ArrayList<>();
        for (Condition c : List.of(Condition.STRAY_CAPACITANCE, Condition.TEST_FREQUENCY)) {
            Optional<ConditionValue> outside = given.get(c);
            ConditionValue v;
            if (settings.has(c.setting())) {
                int at = settings.line(c.setting());
                v = ConditionValue.inFile(settings.value(c.setting()).orElseThrow(), at);
                if (outside.isPresent() && outside.get().value() != v.value()) {
                    notices.add(notUsed(file, at, c, v.value(), outside.get()));
                }
            } else if (outside.isPresent()) {
                v = outside.get();
            } else {
                v = new ConditionValue(c == Condition.STRAY_CAPACITANCE ? 0 : Condition.DEFAULT_TEST_FREQUENCY,
                        "the default");
            }
            used.put(c, v);
            if (!v.source().equals("the default")) {
                said.add(c.key() + " " + c.text(v.value()) + " (" + v.source() + ")");
            }
        }
        if (!said.isEmpty()) {
            notices.add(new Notice(file, headerLine, "C-V readings taken with " + String.join(", ", said)
                    + "; the stray capacitance is subtracted from every reading"));
        }
    }

    /** One notice saying where the points' uncertainties come from, when any does. */
    private static void noteUncertaintySources(Path file, int headerLine, HeaderLayout header,
                                               FileSettings settings, List<Notice> notices) {
        if (header.kind() != DataKind.IV) {
            return;
        }
        final String rule = "; stated bounds are read as uniform, 1 sigma = bound / sqrt(3) (GUM 4.3.7)";
        if (header.layout() == FileLayout.SERIES_RESISTOR_LOG) {
            List<String> used = new ArrayList<>();
            List<String> missing = new ArrayList<>();
            for (SettingKey k : List.of(SettingKey.RESISTOR_TOLERANCE, SettingKey.VOLTMETER_ACCURACY,
                    SettingKey.SUPPLY_ACCURACY, SettingKey.METER_INPUT_RESISTANCE_TOLERANCE)) {
                if (settings.has(k)) {
                    used.add(k.key() + " '" + settings.written(k) + "' (line " + settings.line(k) + ")");
                } else {
                    missing.add(k.key());
                }
            }
            if (used.isEmpty()) {
                notices.add(new Notice(file, headerLine, "no tolerance stated (" + String.join(", ", missing)
                        + "), so the points carry no uncertainty; see docs/bench-logs.md"));
            } else {
                notices.add(new Notice(file, headerLine, "per-point uncertainty propagated from " + String.join(", ", used)
                        + (missing.isEmpty() ? "" : "; not stated, taken as exact: " + String.join(", ", missing))
                        + rule));
            }
            return;
        }
        String v = source(header, ColumnRole.VOLTAGE_SIGMA, settings, SettingKey.VOLTMETER_ACCURACY);
        String i = source(header, ColumnRole.CURRENT_SIGMA, settings, SettingKey.AMMETER_ACCURACY);
        if (v == null && i == null) {
            return;
        }
        notices.add(new Notice(file, headerLine, "per-point uncertainty: V from " + (v == null ? "nothing (unknown)" : v)
                + "; I from " + (i == null ? "nothing (unknown)" : i)
                + (settings.has(SettingKey.VOLTMETER_ACCURACY) || settings.has(SettingKey.AMMETER_ACCURACY) ? rule : "")));
    }

    private static String source(HeaderLayout header, ColumnRole column, FileSettings settings, SettingKey accuracy) {
        String c = header.column(column).map(x -> "the " + column.columnName() + " column").orElse(null);
        String a = settings.has(accuracy) ? accuracy.key() + " '" + settings.written(accuracy) + "' (line "
                + settings.line(accuracy) + ")" : null;
        if (c != null && a != null) {
            return c + ", and " + a + " where its cell is empty";
        }
        return c != null ? c : a;
    }

    /** A temperature for messages, in K and degrees Celsius. */
    static String kelvinText(double kelvin) {
        return (float) kelvin + " K (" + (float) (kelvin - CELSIUS_ZERO) + " degC)";
    }
}
