package org.cardwright.data;

import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
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

    /**
     * Per-row notices of one kind (zero current, empty T cell) are given one by one up to here; the rest are
     * counted in one notice, so a large file cannot bury the terminal (or the heap) in notices [rows].
     */
    static final int ROW_NOTICES_PER_KIND = 10;
    /** Flagged rows named one by one in the notice; the rest are counted [rows]. */
    static final int LISTED_FLAGGED_ROWS = 50;

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
    private final PointIndex seen = new PointIndex();
    private int zeroCurrentRows;
    private int firstUnlistedZeroCurrent;
    private int emptyTemperatureRows;
    private int firstUnlistedEmptyTemperature;
    private final List<Flagged> flagged = new ArrayList<>();
    private int flaggedRows;
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
            seen.add(cv.size() - 1);
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
                if (flagged.size() < LISTED_FLAGGED_ROWS) {
                    flagged.add(new Flagged(line, cell.strip()));
                }
                flaggedRows++;
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
        if (header.reverseMagnitudes()) {
            for (ColumnRole role : List.of(ColumnRole.VOLTAGE, ColumnRole.CURRENT)) {
                HeaderLayout.Column c = header.required(role);
                if ((role == ColumnRole.VOLTAGE ? voltage : current).signum() < 0) {
                    throw new DataFileException(file, line, "a negative value in " + c.describe() + ": the file "
                            + "holds reverse-bias magnitudes (VR and IR columns, or 'reverse magnitudes = yes'; read as "
                            + "V = -VR, I = -IR); write the magnitude, or use signed values under V and I", cells.get(c.index()));
                }
            }
            voltage = voltage.negate();
            current = current.negate();
        }
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
        if (i == 0 && zeroCurrentRows++ < ROW_NOTICES_PER_KIND) {
            notices.add(new Notice(file, line, "current is exactly zero; the point is kept, but "
                    + "no logarithm of its current exists"));
        } else if (i == 0 && firstUnlistedZeroCurrent == 0) {
            firstUnlistedZeroCurrent = line;
        }
        iv.add(new IvPoint(v, i, temperature, line, voltageSigma, currentSigma, correlation));
        seen.add(iv.size() - 1);
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
        seen.add(iv.size() - 1);
    }

    private void checkDuplicate(int line, String text, double voltage, double measured, double temperature,
                                String y) throws DataFileException {
        int earlier = seen.find(voltage, measured, temperature);
        if (earlier > 0) {
            throw new DataFileException(file, line, "duplicate row: same V, " + y + " and T as line "
                    + earlier + " (lines " + earlier + " and " + line + ")", text);
        }
    }

    /**
     * The points read so far, indexed by (V, I or C, T) for the duplicate check: an open-addressing table of
     * list positions, about 8 bytes a row where a map of boxed keys took some 100.
     */
    private final class PointIndex {
        private int[] slots = new int[64];
        private int used;

        /** The line of an earlier point with exactly these values, or 0 when there is none. */
        int find(double voltage, double measured, double temperature) {
            int mask = slots.length - 1;
            for (int k = hash(voltage, measured, temperature) & mask; slots[k] != 0; k = (k + 1) & mask) {
                int at = slots[k] - 1;
                if (same(at, voltage, measured, temperature)) {
                    return line(at);
                }
            }
            return 0;
        }

        /** Adds the point at this list position (of the I-V or the C-V list, whichever the file fills). */
        void add(int position) {
            if (2 * (used + 1) > slots.length) {
                int[] old = slots;
                slots = new int[old.length * 2];
                for (int s : old) {
                    if (s != 0) {
                        insert(s - 1);
                    }
                }
            }
            insert(position);
            used++;
        }

        private void insert(int position) {
            int mask = slots.length - 1;
            int k = hash(x(position), y(position), t(position)) & mask;
            while (slots[k] != 0) {
                k = (k + 1) & mask;
            }
            slots[k] = position + 1;
        }

        private boolean same(int at, double voltage, double measured, double temperature) {
            return Double.compare(x(at) + 0.0, voltage + 0.0) == 0 && Double.compare(y(at) + 0.0, measured + 0.0) == 0
                    && Double.compare(t(at), temperature) == 0;
        }

        private int hash(double voltage, double measured, double temperature) {
            int h = Double.hashCode(voltage + 0.0);
            h = 31 * h + Double.hashCode(measured + 0.0);
            h = 31 * h + Double.hashCode(temperature);
            return h ^ (h >>> 16);
        }

        private double x(int at) {
            return iv.isEmpty() ? cv.get(at).voltage() : iv.get(at).voltage();
        }

        private double y(int at) {
            return iv.isEmpty() ? cv.get(at).capacitance() : iv.get(at).current();
        }

        private double t(int at) {
            return iv.isEmpty() ? cv.get(at).temperature() : iv.get(at).temperature();
        }

        private int line(int at) {
            return iv.isEmpty() ? cv.get(at).line() : iv.get(at).line();
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
            if (emptyTemperatureRows++ < ROW_NOTICES_PER_KIND) {
                notices.add(new Notice(file, line, "empty T cell: the point is at " + fallback.source() + " "
                        + MeasurementReader.kelvinText(fallback.kelvin().getAsDouble())));
            } else if (firstUnlistedEmptyTemperature == 0) {
                firstUnlistedEmptyTemperature = line;
            }
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
                throw new DataFileException(file, headerLine, "every data row (" + flaggedRows + ") is flagged in "
                        + f.describe() + ", so no point is left", headerText);
            }
            List<String> listed = new ArrayList<>();
            for (Flagged x : flagged) {
                listed.add(x.line() + " (" + x.value() + ")");
            }
            String more = flaggedRows > flagged.size() ? " and " + (flaggedRows - flagged.size()) + " more" : "";
            notices.add(new Notice(file, flagged.get(0).line(), flaggedRows + (flaggedRows == 1 ? " row" : " rows")
                    + " flagged in " + f.describe() + " set aside, not used: line" + (flaggedRows == 1 ? " " : "s ")
                    + String.join(", ", listed) + more));
        }
        if (firstUnlistedZeroCurrent > 0) {
            notices.add(new Notice(file, firstUnlistedZeroCurrent, (zeroCurrentRows - ROW_NOTICES_PER_KIND)
                    + " more rows from here on have a current of exactly zero; they are kept as the first "
                    + ROW_NOTICES_PER_KIND + " were"));
        }
        if (firstUnlistedEmptyTemperature > 0) {
            notices.add(new Notice(file, firstUnlistedEmptyTemperature, (emptyTemperatureRows - ROW_NOTICES_PER_KIND)
                    + " more rows from here on have an empty T cell; they are at " + fallback.source() + " "
                    + MeasurementReader.kelvinText(fallback.kelvin().getAsDouble()) + " as the first "
                    + ROW_NOTICES_PER_KIND + " were"));
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
