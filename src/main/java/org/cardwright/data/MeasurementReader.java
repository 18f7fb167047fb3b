package org.cardwright.data;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Reads a measurement file (CSV with one header row) into SI records.
 *
 * <p>The header names the columns, without regard to case: V and I for I-V data, V and C for C-V data, and
 * optionally T, the device temperature of each row. A unit may follow a name in brackets or parentheses
 * ({@code I [mA]}, {@code C (pF)}, {@code T [degC]}); without one a column is in V, A, F, and degrees Celsius
 * for T. Lines whose first non-blank character is {@code #} are comments; blank lines are skipped; a UTF-8
 * byte-order mark is accepted. Line numbers everywhere are physical 1-based lines of the file, comments and
 * blank lines included.
 *
 * <p>Nothing is dropped or changed silently: anything refused is a {@link DataFileException} naming file, line
 * and raw text, and anything done that the user should know about is a {@link Notice} in the result.
 */
public final class MeasurementReader {
    /** Offset between the Celsius and Kelvin scales, used only to show temperatures in messages [K]. */
    private static final double CELSIUS_ZERO = 273.15;

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
        Objects.requireNonNull(file, "file");
        SourceText source = SourceText.read(file);
        List<String> lines = source.lines();
        CsvLine splitter = new CsvLine(options.delimiter());

        int headerIndex = nextContentLine(lines, 0);
        if (headerIndex < 0) {
            String why = lines.isEmpty() ? "empty file: no header row"
                    : "no header row: the file holds only comments and blank lines";
            throw new DataFileException(file, 0, why, null);
        }
        int headerLine = headerIndex + 1;
        String headerText = lines.get(headerIndex);
        HeaderLayout header = HeaderLayout.parse(file, headerLine, headerText,
                split(splitter, file, headerLine, headerText));

        List<Notice> notices = new ArrayList<>();
        noteIgnoredColumns(file, headerLine, header, notices);
        noteTemperatureSource(file, headerLine, headerText, header, notices);

        RowConverter rows = new RowConverter(file, header, options.defaultTemperature(), notices);
        for (int i = nextContentLine(lines, headerIndex + 1); i >= 0; i = nextContentLine(lines, i + 1)) {
            int line = i + 1;
            String text = lines.get(i);
            List<String> cells = split(splitter, file, line, text);
            if (cells.size() != header.width()) {
                throw new DataFileException(file, line, "row has " + cells.size() + " cells, the header on line "
                        + headerLine + " has " + header.width(), text);
            }
            rows.add(line, text, cells);
        }
        if (rows.count() == 0) {
            throw new DataFileException(file, headerLine, "header but no data rows", headerText);
        }
        return new MeasurementFile(file, source.sha256(), header.kind(), rows.ivPoints(), rows.cvPoints(),
                notices);
    }

    /** Index of the first line at or after {@code from} that is neither blank nor a comment, or -1. */
    private static int nextContentLine(List<String> lines, int from) {
        for (int i = from; i < lines.size(); i++) {
            String stripped = lines.get(i).strip();
            if (!stripped.isEmpty() && !stripped.startsWith("#")) {
                return i;
            }
        }
        return -1;
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

    private void noteTemperatureSource(Path file, int headerLine, String headerText, HeaderLayout header,
                                       List<Notice> notices) throws DataFileException {
        OptionalDouble given = options.defaultTemperature();
        if (header.temperature().isPresent()) {
            if (given.isPresent()) {
                notices.add(new Notice(file, headerLine, "the file has a T column; the given temperature "
                        + kelvinText(given.getAsDouble()) + " is used only for empty T cells"));
            }
            return;
        }
        if (given.isEmpty()) {
            throw new DataFileException(file, headerLine, "no T column and no --temp given", headerText);
        }
        notices.add(new Notice(file, headerLine, "no T column: every point is at the given temperature "
                + kelvinText(given.getAsDouble())));
    }

    /** A temperature for messages, in K and degrees Celsius. */
    static String kelvinText(double kelvin) {
        return kelvin + " K (" + (float) (kelvin - CELSIUS_ZERO) + " degC)";
    }
}
