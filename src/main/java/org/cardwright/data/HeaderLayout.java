package org.cardwright.data;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * What a header row says: the file's kind, where the V, I or C, and T columns stand and in which units, and
 * which columns the reader ignores.
 *
 * @param kind        I-V or C-V
 * @param voltage     the V column
 * @param measured    the I column of an I-V file, the C column of a C-V file
 * @param temperature the T column, when there is one
 * @param ignored     the columns that name no quantity, kept to be reported
 * @param width       how many cells the header has; every data row must have as many [1]
 */
record HeaderLayout(DataKind kind, Column voltage, Column measured, Optional<Column> temperature,
                    List<Column> ignored, int width) {

    /**
     * One column of the header.
     *
     * @param index 0-based position in the row [1]
     * @param cell  the header cell as written
     * @param unit  the column's unit; null for an ignored column
     */
    record Column(int index, String cell, ColumnUnit unit) {
        /** The column as a user counts: 1-based [1]. */
        int number() {
            return index + 1;
        }
    }

    /** A column name, then optionally a unit in brackets or parentheses. */
    private static final Pattern NAME_AND_REST = Pattern.compile("([^\\s\\[(]+)\\s*(.*)", Pattern.DOTALL);
    private static final Pattern BRACKETED = Pattern.compile("\\[([^\\[\\]]*)\\]|\\(([^()]*)\\)");

    HeaderLayout {
        ignored = List.copyOf(ignored);
    }

    /**
     * Reads the header row.
     *
     * @param file    the file, for errors
     * @param line    the header's physical line, for errors [1]
     * @param rawLine the header line as written, for errors that blame no single cell
     * @param cells   the header's cells
     * @throws DataFileException on a malformed cell, an unknown or ambiguous unit, a column given twice, both an
     *                           I and a C column, or a missing V, or I and C column
     */
    static HeaderLayout parse(Path file, int line, String rawLine, List<String> cells) throws DataFileException {
        Map<Quantity, Column> found = new EnumMap<>(Quantity.class);
        List<Column> ignored = new ArrayList<>();
        for (int index = 0; index < cells.size(); index++) {
            String cell = cells.get(index);
            Matcher m = NAME_AND_REST.matcher(cell.strip());
            Optional<Quantity> quantity = m.matches() ? Quantity.ofColumnName(m.group(1)) : Optional.empty();
            if (quantity.isEmpty()) {
                ignored.add(new Column(index, cell, null));
                continue;
            }
            Quantity q = quantity.get();
            ColumnUnit unit = unitOf(file, line, cell, q, m.group(2).strip());
            Column column = new Column(index, cell, unit);
            Column earlier = found.putIfAbsent(q, column);
            if (earlier != null) {
                throw new DataFileException(file, line, "column " + q.columnName() + " appears twice (columns "
                        + earlier.number() + " and " + column.number() + ")", cell);
            }
        }
        Column current = found.get(Quantity.CURRENT);
        Column capacitance = found.get(Quantity.CAPACITANCE);
        if (current != null && capacitance != null) {
            Column later = current.index() > capacitance.index() ? current : capacitance;
            throw new DataFileException(file, line, "both an I and a C column: a file holds either I-V data "
                    + "(columns V and I) or C-V data (columns V and C)", later.cell());
        }
        String hint = delimiterHint(cells);
        Column voltage = found.get(Quantity.VOLTAGE);
        if (voltage == null) {
            throw new DataFileException(file, line, "no V column in the header" + hint, rawLine);
        }
        if (current == null && capacitance == null) {
            throw new DataFileException(file, line, "no I or C column in the header, so it is neither I-V nor "
                    + "C-V data" + hint, rawLine);
        }
        DataKind kind = current != null ? DataKind.IV : DataKind.CV;
        Column measured = current != null ? current : capacitance;
        return new HeaderLayout(kind, voltage, measured, Optional.ofNullable(found.get(Quantity.TEMPERATURE)),
                ignored, cells.size());
    }

    private static ColumnUnit unitOf(Path file, int line, String cell, Quantity q, String rest)
            throws DataFileException {
        if (rest.isEmpty()) {
            return ColumnUnit.implicit(q);
        }
        Matcher b = BRACKETED.matcher(rest);
        if (!b.matches()) {
            throw new DataFileException(file, line, "cannot read header cell of column " + q.columnName()
                    + ": write the unit in brackets or parentheses after the name, e.g. '" + q.columnName()
                    + " [" + ColumnUnit.implicit(q).displayName() + "]'", cell);
        }
        String written = b.group(1) != null ? b.group(1) : b.group(2);
        try {
            return ColumnUnit.parse(q, written);
        } catch (CellProblem e) {
            throw new DataFileException(file, line, e.problem(), cell);
        }
    }

    /** A hint when the header is one cell that holds a semicolon or tab: the file may use another delimiter. */
    private static String delimiterHint(List<String> cells) {
        if (cells.size() == 1) {
            String only = cells.get(0);
            if (only.indexOf(';') >= 0) {
                return " (the header is one cell holding ';': is the file separated by semicolons?)";
            }
            if (only.indexOf('\t') >= 0) {
                return " (the header is one cell holding tabs: is the file separated by tabs?)";
            }
        }
        return "";
    }
}
