package org.cardwright.data;

import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;

/** Turns data rows into points, checking each and collecting the notices they call for. */
final class RowConverter {
    /**
     * From here up, a T column without a unit (so read as degrees Celsius) more likely holds kelvin: few bench
     * measurements of a diode go to 200 degC, while 200 to 450 is the usual range in kelvin (common practice,
     * no source); the reader then adds a notice, it changes nothing [K].
     */
    private static final double LIKELY_KELVIN_IN_CELSIUS = 473.15;

    /**
     * What the file's settings (and the read options) say about the points beyond the columns.
     *
     * @param voltmeter      accuracy of the V readings of an I-V table; null when not stated
     * @param ammeter        accuracy of the I readings of an I-V table; null when not stated
     * @param leadResistance 2-wire lead resistance of an I-V table, exactly as stated; null when not stated [ohm]
     * @param bench          the bench of a series-resistor log; null for a point table
     */
    record Rules(InstrumentAccuracy voltmeter, InstrumentAccuracy ammeter, BigDecimal leadResistance,
                 SeriesResistorLog.Setup bench) {
    }

    /**
     * Where rows without a T cell take their temperature from.
     *
     * @param kelvin  the temperature, empty when neither the file nor the options give one [K]
     * @param source  the words for messages, e.g. "the given temperature" or "the file's temperature (line 3)"
     */
    record TemperatureFallback(OptionalDouble kelvin, String source) {
    }

    private record Key(double voltage, double measured, double temperature) {
    }

    private record Flagged(int line, String value) {
    }

    private final Path file;
    private final HeaderLayout header;
    private final boolean decimalComma;
    private final TemperatureFallback fallback;
    private final Rules rules;
    private final List<Notice> notices;
    private final List<IvPoint> iv = new ArrayList<>();
    private final List<CvPoint> cv = new ArrayList<>();
    private final Map<Key, Integer> seen = new HashMap<>();
    private final List<Flagged> flagged = new ArrayList<>();
    private boolean warnedKelvinAsCelsius;
    private boolean warnedCapitalMilli;
    private int zeroSigmaLine;
    private double largestLeadDrop;
    private int largestLeadDropLine;
    private double largestMeterShare = -1;
    private int largestMeterShareLine;

    RowConverter(Path file, HeaderLayout header, boolean decimalComma, TemperatureFallback fallback, Rules rules,
                 List<Notice> notices) {
        this.file = file;
        this.header = header;
        this.decimalComma = decimalComma;
        this.fallback = fallback;
        this.rules = rules;
        this.notices = notices;
    }

    void add(int line, String text, List<String> cells) throws DataFileException {
        if (isFlagged(line, cells)) {
            return;
        }
        double temperature = temperature(line, cells);
        if (header.layout() == FileLayout.SERIES_RESISTOR_LOG) {
            addLogRow(line, text, cells, temperature);
        } else if (header.kind() == DataKind.IV) {
            addIvRow(line, text, cells, temperature);
        } else {
            double voltage = value(line, header.required(ColumnRole.VOLTAGE), cells);
            HeaderLayout.Column c = header.required(ColumnRole.CAPACITANCE);
            double capacitance = value(line, c, cells);
            if (!(capacitance > 0)) {
                throw new DataFileException(file, line, "capacitance must be positive in a C-V file ("
                        + c.describe() + ")", cells.get(c.index()));
            }
            checkDuplicate(line, text, voltage, capacitance, temperature, "C");
            cv.add(new CvPoint(voltage, capacitance, temperature, line));
        }
    }

    private boolean isFlagged(int line, List<String> cells) throws DataFileException {
        if (header.column(ColumnRole.FLAG).isEmpty()) {
            return false;
        }
        HeaderLayout.Column f = header.column(ColumnRole.FLAG).get();
        String cell = cells.get(f.index());
        try {
            if (StatusFlag.isFlagged(cell)) {
                flagged.add(new Flagged(line, cell.strip()));
                return true;
            }
            return false;
        } catch (CellProblem e) {
            throw new DataFileException(file, line, e.problem() + " in " + f.describe(), cell);
        }
    }

    private void addIvRow(int line, String text, List<String> cells, double temperature) throws DataFileException {
        BigDecimal voltage = exact(line, header.required(ColumnRole.VOLTAGE), cells);
        BigDecimal current = exact(line, header.required(ColumnRole.CURRENT), cells);
        double i = current.doubleValue();
        double voltageSigma = stated(line, ColumnRole.VOLTAGE_SIGMA, cells, rules.voltmeter(),
                voltage.doubleValue());
        double currentSigma = stated(line, ColumnRole.CURRENT_SIGMA, cells, rules.ammeter(), i);
        double correlation = 0;
        if (rules.leadResistance() != null) {
            // 2-wire: the meter reads the diode plus the leads, V = Vmeasured - I * Rlead, exactly in decimal
            BigDecimal drop = current.multiply(rules.leadResistance());
            voltage = voltage.subtract(drop);
            double r = rules.leadResistance().doubleValue();
            if (Math.abs(drop.doubleValue()) > largestLeadDrop || largestLeadDropLine == 0) {
                largestLeadDrop = Math.abs(drop.doubleValue());
                largestLeadDropLine = line;
            }
            if (!Double.isNaN(voltageSigma) && !Double.isNaN(currentSigma) && r > 0) {
                // u(V)^2 = u(Vmeasured)^2 + (Rlead u(I))^2 and cov(V, I) = -Rlead u(I)^2 (GUM 5.1.2, 5.2.2)
                double combined = Math.hypot(voltageSigma, r * currentSigma);
                correlation = Math.max(-1, -r * currentSigma / combined);
                voltageSigma = combined;
            }
        }
        double v = voltage.doubleValue();
        checkDuplicate(line, text, v, i, temperature, "I");
        if (i == 0) {
            notices.add(new Notice(file, line, "current is exactly zero; the point is kept, but "
                    + "no logarithm of its current exists"));
        }
        iv.add(new IvPoint(v, i, temperature, line, voltageSigma, currentSigma, correlation));
    }

    /** The stated uncertainty of a row: its dV or dI cell, else the instrument accuracy, else NaN. */
    private double stated(int line, ColumnRole role, List<String> cells, InstrumentAccuracy accuracy,
                          double reading) throws DataFileException {
        if (header.column(role).isPresent()) {
            HeaderLayout.Column c = header.column(role).get();
            String cell = cells.get(c.index());
            if (!cell.isBlank()) {
                double sigma = value(line, c, cells);
                if (!(sigma > 0)) {
                    throw new DataFileException(file, line, "a stated uncertainty must be positive ("
                            + c.describe() + "); leave the cell empty when it is unknown", cell);
                }
                return sigma;
            }
        }
        return accuracySigma(line, accuracy, reading);
    }

    private double accuracySigma(int line, InstrumentAccuracy accuracy, double reading) {
        if (accuracy == null) {
            return Double.NaN;
        }
        double sigma = accuracy.standardUncertainty(reading);
        if (sigma > 0) {
            return sigma;
        }
        if (zeroSigmaLine == 0) {
            zeroSigmaLine = line;
        }
        return Double.NaN;
    }

    private void addLogRow(int line, String text, List<String> cells, double temperature) throws DataFileException {
        HeaderLayout.Column rColumn = header.required(ColumnRole.SERIES_RESISTANCE);
        HeaderLayout.Column mColumn = header.required(ColumnRole.METER_VOLTAGE);
        double supply = value(line, header.required(ColumnRole.SUPPLY_VOLTAGE), cells);
        double series = value(line, rColumn, cells);
        double meter = value(line, mColumn, cells);
        if (!(series > 0)) {
            throw new DataFileException(file, line, "series resistance must be positive (" + rColumn.describe()
                    + ")", cells.get(rColumn.index()));
        }
        if (supply >= 0 && meter > supply) {
            throw new DataFileException(file, line, "meter reading above the supply in a forward log: Vmeter "
                    + meter + " V > Vsupply " + supply + " V; a passive diode cannot do that (swapped columns?)",
                    cells.get(mColumn.index()));
        }
        if (supply < 0 && meter < supply) {
            throw new DataFileException(file, line, "meter reading below the supply in a reverse log: Vmeter "
                    + meter + " V < Vsupply " + supply + " V; a passive diode cannot do that (swapped columns?)",
                    cells.get(mColumn.index()));
        }
        SeriesResistorLog.Point p = SeriesResistorLog.solve(rules.bench(), supply, series, meter);
        if (rules.bench().correctMeterLoading() && supply != 0 && !(p.current() * Math.signum(supply) > 0)) {
            throw new DataFileException(file, line, "after subtracting the meter's draw the diode current is "
                    + fmt(p.current()) + " A, not in the direction the supply drives: the meter input resistance "
                    + fmt(rules.bench().meterResistance()) + " ohm draws all of the " + fmt((supply - meter)
                    / (series + rules.bench().sourceResistance())) + " A; check the meter input resistance",
                    text);
        }
        if (!Double.isNaN(p.meterCurrent()) && p.current() != 0) {
            double share = Math.abs(p.meterCurrent() / p.current());
            if (share > largestMeterShare) {
                largestMeterShare = share;
                largestMeterShareLine = line;
            }
        }
        checkDuplicate(line, text, p.voltage(), p.current(), temperature, "I");
        iv.add(new IvPoint(p.voltage(), p.current(), temperature, line, p.voltageSigma(), p.currentSigma(),
                p.correlation()));
    }

    private void checkDuplicate(int line, String text, double voltage, double measured, double temperature,
                                String y) throws DataFileException {
        Integer earlier = seen.putIfAbsent(new Key(voltage + 0.0, measured + 0.0, temperature), line);
        if (earlier != null) {
            throw new DataFileException(file, line, "duplicate row: same V, " + y + " and T as line "
                    + earlier + " (lines " + earlier + " and " + line + ")", text);
        }
    }

    private double value(int line, HeaderLayout.Column column, List<String> cells) throws DataFileException {
        return exact(line, column, cells).doubleValue();
    }

    /** A cell's value in SI units, exactly; checked to fit a double. */
    private BigDecimal exact(int line, HeaderLayout.Column column, List<String> cells) throws DataFileException {
        String cell = cells.get(column.index());
        try {
            CellNumber.Reading r = CellNumber.parse(cell, decimalComma);
            if (!r.suffix().isEmpty() && column.unit().hasPrefix()) {
                throw new CellProblem("SPICE suffix '" + r.suffix() + "' in a column whose unit '"
                        + column.unit().written() + "' has a prefix already; write one or the other");
            }
            if (r.capitalMilli() && !warnedCapitalMilli) {
                warnedCapitalMilli = true;
                notices.add(new Notice(file, line, "'" + cell.strip() + "' in " + column.describe() + " is read "
                        + "as SPICE reads it: M is milli (1e-3), not mega; write meg for mega"));
            }
            BigDecimal si = column.unit().toSi(r.value());
            DecimalText.toDouble(si);
            return si;
        } catch (CellProblem e) {
            throw new DataFileException(file, line, e.problem() + " in " + column.describe(), cell);
        }
    }

    private double temperature(int line, List<String> cells) throws DataFileException {
        if (header.temperature().isEmpty()) {
            return fallback.kelvin().getAsDouble();
        }
        HeaderLayout.Column t = header.temperature().get();
        String cell = cells.get(t.index());
        if (cell.isBlank()) {
            if (fallback.kelvin().isEmpty()) {
                throw new DataFileException(file, line, "empty T cell and no --temp given", cell);
            }
            notices.add(new Notice(file, line, "empty T cell: the point is at " + fallback.source() + " "
                    + MeasurementReader.kelvinText(fallback.kelvin().getAsDouble())));
            return fallback.kelvin().getAsDouble();
        }
        double kelvin = value(line, t, cells);
        if (!(kelvin > 0)) {
            throw new DataFileException(file, line, "temperature at or below absolute zero: " + kelvin
                    + " K in " + t.describe(), cell);
        }
        if (kelvin >= LIKELY_KELVIN_IN_CELSIUS && t.unit().written().isEmpty() && !warnedKelvinAsCelsius) {
            warnedKelvinAsCelsius = true;
            notices.add(new Notice(file, line, "T column has no unit, so " + cell.strip() + " is read as "
                    + "degrees Celsius (" + kelvin + " K); if the column is in kelvin, write 'T [K]'"));
        }
        return kelvin;
    }

    /**
     * The notices that sum up the whole file: flagged rows, the lead-resistance and meter-loading corrections.
     *
     * @param headerLine the header's physical line, for the file-wide notices [1]
     * @param headerText the header row as written, for errors
     * @throws DataFileException when every data row was flagged
     */
    void finish(int headerLine, String headerText) throws DataFileException {
        if (!flagged.isEmpty()) {
            HeaderLayout.Column f = header.column(ColumnRole.FLAG).orElseThrow();
            if (count() == 0) {
                throw new DataFileException(file, headerLine, "every data row (" + flagged.size() + ") is flagged in "
                        + f.describe() + ", so no point is left", headerText);
            }
            List<String> listed = new ArrayList<>();
            for (Flagged x : flagged) {
                listed.add(x.line() + " (" + x.value() + ")");
            }
            notices.add(new Notice(file, flagged.get(0).line(), flagged.size() + (flagged.size() == 1 ? " row" : " rows")
                    + " flagged in " + f.describe() + " set aside, not used: line" + (flagged.size() == 1 ? " " : "s ")
                    + String.join(", ", listed)));
        }
        if (zeroSigmaLine > 0) {
            notices.add(new Notice(file, zeroSigmaLine, "the stated accuracy gives no uncertainty for a reading of "
                    + "zero (it has no fixed part); such points carry an unknown uncertainty"));
        }
        if (rules.leadResistance() != null && largestLeadDropLine > 0) {
            notices.add(new Notice(file, headerLine, "2-wire lead resistance " + rules.leadResistance().toPlainString()
                    + " ohm subtracted: V = Vmeasured - I * " + rules.leadResistance().toPlainString()
                    + " ohm; largest change " + fmt(largestLeadDrop * 1e3) + " mV (line " + largestLeadDropLine + ")"));
        }
        if (rules.bench() != null && largestMeterShare >= 0) {
            String share = fmt(largestMeterShare * 100) + " % of the diode current (line " + largestMeterShareLine + ")";
            if (rules.bench().correctMeterLoading()) {
                notices.add(new Notice(file, headerLine, "meter loading corrected: I = (Vsupply - Vmeter) / (Rseries + "
                        + fmt(rules.bench().sourceResistance()) + " ohm) - Vmeter / " + fmt(rules.bench().meterResistance())
                        + " ohm, V = Vmeter; the correction is at most " + share));
            } else {
                notices.add(new Notice(file, headerLine, "meter loading NOT corrected (switched off in the options): "
                        + "I = (Vsupply - Vmeter) / (Rseries + " + fmt(rules.bench().sourceResistance())
                        + " ohm); these currents include the meter's draw, up to " + share));
            }
        } else if (rules.bench() != null && !rules.bench().correctMeterLoading()) {
            notices.add(new Notice(file, headerLine, "meter loading NOT corrected (switched off in the options) and "
                    + "the meter input resistance is not known, so the error of the currents is not known either"));
        }
    }

    /** A number for messages, three significant digits. */
    static String fmt(double x) {
        return String.format(Locale.ROOT, "%.3g", x);
    }

    int count() {
        return iv.size() + cv.size();
    }

    List<IvPoint> ivPoints() {
        return iv;
    }

    List<CvPoint> cvPoints() {
        return cv;
    }
}
