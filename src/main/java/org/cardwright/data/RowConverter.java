package org.cardwright.data;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
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

    private record Key(double voltage, double measured, double temperature) {
    }

    private final Path file;
    private final HeaderLayout header;
    private final OptionalDouble defaultTemperature;
    private final List<Notice> notices;
    private final List<IvPoint> iv = new ArrayList<>();
    private final List<CvPoint> cv = new ArrayList<>();
    private final Map<Key, Integer> seen = new HashMap<>();
    private boolean warnedKelvinAsCelsius;

    RowConverter(Path file, HeaderLayout header, OptionalDouble defaultTemperature, List<Notice> notices) {
        this.file = file;
        this.header = header;
        this.defaultTemperature = defaultTemperature;
        this.notices = notices;
    }

    void add(int line, String text, List<String> cells) throws DataFileException {
        double voltage = value(line, header.voltage(), cells);
        double measured = value(line, header.measured(), cells);
        double temperature = temperature(line, cells);
        HeaderLayout.Column m = header.measured();
        if (header.kind() == DataKind.CV && !(measured > 0)) {
            throw new DataFileException(file, line, "capacitance must be positive in a C-V file (column "
                    + m.number() + " '" + m.cell() + "')", cells.get(m.index()));
        }
        Integer earlier = seen.putIfAbsent(new Key(voltage + 0.0, measured + 0.0, temperature), line);
        if (earlier != null) {
            String y = header.kind() == DataKind.IV ? "I" : "C";
            throw new DataFileException(file, line, "duplicate row: same V, " + y + " and T as line "
                    + earlier + " (lines " + earlier + " and " + line + ")", text);
        }
        if (header.kind() == DataKind.IV) {
            if (measured == 0) {
                notices.add(new Notice(file, line, "current is exactly zero; the point is kept, but "
                        + "no logarithm of its current exists"));
            }
            iv.add(new IvPoint(voltage, measured, temperature, line));
        } else {
            cv.add(new CvPoint(voltage, measured, temperature, line));
        }
    }

    private double value(int line, HeaderLayout.Column column, List<String> cells) throws DataFileException {
        String cell = cells.get(column.index());
        try {
            return DecimalText.toDouble(column.unit().toSi(DecimalText.parse(cell)));
        } catch (CellProblem e) {
            throw new DataFileException(file, line, e.problem() + " in column " + column.number() + " '"
                    + column.cell() + "'", cell);
        }
    }

    private double temperature(int line, List<String> cells) throws DataFileException {
        if (header.temperature().isEmpty()) {
            return defaultTemperature.getAsDouble();
        }
        HeaderLayout.Column t = header.temperature().get();
        String cell = cells.get(t.index());
        if (cell.isBlank()) {
            if (defaultTemperature.isEmpty()) {
                throw new DataFileException(file, line, "empty T cell and no --temp given", cell);
            }
            notices.add(new Notice(file, line, "empty T cell: the point is at the given temperature "
                    + MeasurementReader.kelvinText(defaultTemperature.getAsDouble())));
            return defaultTemperature.getAsDouble();
        }
        double kelvin = value(line, t, cells);
        if (!(kelvin > 0)) {
            throw new DataFileException(file, line, "temperature at or below absolute zero: " + kelvin
                    + " K in column " + t.number() + " '" + t.cell() + "'", cell);
        }
        if (kelvin >= LIKELY_KELVIN_IN_CELSIUS && t.unit().written().isEmpty() && !warnedKelvinAsCelsius) {
            warnedKelvinAsCelsius = true;
            notices.add(new Notice(file, line, "T column has no unit, so " + cell.strip() + " is read as "
                    + "degrees Celsius (" + kelvin + " K); if the column is in kelvin, write 'T [K]'"));
        }
        return kelvin;
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
