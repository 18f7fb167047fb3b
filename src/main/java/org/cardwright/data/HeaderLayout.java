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
 * What a header row says: the file's layout and kind, where each known column stands and in which unit, and
 * which columns the reader ignores.
 *
 * <p>A header with any of Vsupply, Rseries, Vmeter is a series-resistor log and must have all three (and no
 * V, I, C, dV or dI: the reader computes V and I). Otherwise it is a point table: V with I (I-V) or with C
 * (C-V). T (temperature) and a flag column (status or compliance) may stand in either; dV and dI (stated
 * uncertainties) in an I-V table; in a C-V table they are ignored.
 *
 * @param kind    I-V or C-V (a series-resistor log gives I-V)
 * @param layout  point table or series-resistor log
 * @param columns the known columns by role
 * @param ignored the columns that name no role, or no role this kind of file uses, kept to be reported
 * @param width   how many cells the header has; every data row must have as many [1]
 * @param reverseMagnitudes whether the V and I columns were written VR and IR: reverse-bias magnitudes, read as
 *                V = -VR, I = -IR
 */
record HeaderLayout(DataKind kind, FileLayout layout, Map<ColumnRole, Column> columns, List<Column> ignored,
                    int width, boolean reverseMagnitudes) {

    /**
     * One column of the header.
     *
     * @param index 0-based position in the row [1]
     * @param cell  the header cell as written
     * @param unit  the column's unit; null for an ignored column and for the flag column
     */
    record Column(int index, String cell, ColumnUnit unit) {
        /** The column as a user counts: 1-based [1]. */
        int number() {
            return index + 1;
        }

        /** The column for messages: {@code column 2 'I [mA]'}. */
        String describe() {
            return "column " + number() + " '" + cell + "'";
        }
    }

    /** A column name, then optionally a unit in brackets or parentheses. */
    private static final Pattern NAME_AND_REST = Pattern.compile("([^\\s\\[(]+)\\s*(.*)", Pattern.DOTALL);
    private static final Pattern BRACKETED = Pattern.compile("\\[([^\\[\\]]*)\\]|\\(([^()]*)\\)");
    private static final List<ColumnRole> LOG_COLUMNS = List.of(ColumnRole.SUPPLY_VOLTAGE,
            ColumnRole.SERIES_RESISTANCE, ColumnRole.METER_VOLTAGE);
    private static final List<ColumnRole> NOT_IN_LOG = List.of(ColumnRole.VOLTAGE, ColumnRole.CURRENT,
            ColumnRole.CAPACITANCE, ColumnRole.VOLTAGE_SIGMA, ColumnRole.CURRENT_SIGMA);

    HeaderLayout {
        columns = Map.copyOf(columns);
        ignored = List.copyOf(ignored);
    }

    HeaderLayout(DataKind kind, FileLayout layout, Map<ColumnRole, Column> columns, List<Column> ignored, int width) {
        this(kind, layout, columns, ignored, width, false);
    }

    /** The column of a role, when the header has one. */
    Optional<Column> column(ColumnRole role) {
        return Optional.ofNullable(columns.get(role));
    }

    /** The column of a role the layout requires. */
    Column required(ColumnRole role) {
        Column c = columns.get(role);
        if (c == null) {
            throw new IllegalStateException("the layout has no " + role.columnName() + " column");
        }
        return c;
    }

    /** The T column, when there is one. */
    Optional<Column> temperature() {
        return column(ColumnRole.TEMPERATURE);
    }

    /**
     * Reads the header row.
     *
     * @param file    the file, for errors
     * @param line    the header's physical line, for errors [1]
     * @param rawLine the header line as written, for errors that blame no single cell
     * @param cells   the header's cells
     * @throws DataFileException on a malformed cell, an unknown or ambiguous unit, a column given twice, both an
     *                           I and a C column, a missing V, or I and C column, or an incomplete or mixed
     *                           series-resistor log
     */
    static HeaderLayout parse(Path file, int line, String rawLine, List<String> cells) throws DataFileException {
        Map<ColumnRole, Column> found = new EnumMap<>(ColumnRole.class);
        List<Column> ignored = new ArrayList<>();
        for (int index = 0; index < cells.size(); index++) {
            String cell = cells.get(index);
            Matcher m = NAME_AND_REST.matcher(cell.strip());
            Optional<ColumnRole> role = m.matches() ? ColumnRole.ofName(m.group(1)) : Optional.empty();
            if (role.isEmpty()) {
                ignored.add(new Column(index, cell, null));
                continue;
            }
            ColumnRole r = role.get();
            String rest = m.group(2).strip();
            ColumnUnit unit = null;
            if (r.quantity().isPresent()) {
                unit = unitOf(file, line, cell, r, rest);
            } else if (!rest.isEmpty()) {
                throw new DataFileException(file, line, "the " + r.columnName() + " column takes no unit", cell);
            }
            Column column = new Column(index, cell, unit);
            Column earlier = found.putIfAbsent(r, column);
            if (earlier != null) {
                String twice = r == ColumnRole.FLAG ? "a flag column (status or compliance)" : "column " + r.columnName();
                throw new DataFileException(file, line, twice + " appears twice (columns "
                        + earlier.number() + " and " + column.number() + ")", cell);
            }
        }
        String hint = delimiterHint(cells);
        boolean magnitudes = found.containsKey(ColumnRole.REVERSE_VOLTAGE) || found.containsKey(ColumnRole.REVERSE_CURRENT);
        if (magnitudes) {
            reverseColumns(file, line, rawLine, found, hint);
        }
        if (LOG_COLUMNS.stream().anyMatch(found::containsKey)) {
            return seriesResistorLog(file, line, rawLine, found, ignored, cells.size(), hint);
        }
        Column current = found.get(ColumnRole.CURRENT);
        Column capacitance = found.get(ColumnRole.CAPACITANCE);
        if (current != null && capacitance != null) {
            Column later = current.index() > capacitance.index() ? current : capacitance;
            throw new DataFileException(file, line, "both an I and a C column: a file holds either I-V data "
                    + "(columns V and I) or C-V data (columns V and C)", later.cell());
        }
        if (!found.containsKey(ColumnRole.VOLTAGE)) {
            throw new DataFileException(file, line, "no V column in the header" + hint, rawLine);
        }
        if (current == null && capacitance == null) {
            throw new DataFileException(file, line, "no I or C column in the header, so it is neither I-V nor "
                    + "C-V data, nor a series-resistor log (Vsupply, Rseries, Vmeter)" + hint, rawLine);
        }
        DataKind kind = current != null ? DataKind.IV : DataKind.CV;
        if (kind == DataKind.CV) {
            for (ColumnRole sigma : List.of(ColumnRole.VOLTAGE_SIGMA, ColumnRole.CURRENT_SIGMA)) {
                Column c = found.remove(sigma);
                if (c != null) {
                    ignored.add(new Column(c.index(), c.cell(), null));
                }
            }
            ignored.sort((a, b) -> Integer.compare(a.index(), b.index()));
        }
        return new HeaderLayout(kind, FileLayout.POINT_TABLE, found, ignored, cells.size(), magnitudes);
    }

    /** This layout with its V and I read as reverse-bias magnitudes, as VR and IR columns are. */
    HeaderLayout asReverseMagnitudes() {
        return new HeaderLayout(kind, layout, columns, ignored, width, true);
    }

    /**
     * VR and IR: reverse-bias magnitudes, the datasheet habit. Both must be there, with no V, I, C or
     * series-resistor column beside them; they then stand in the V and I places (the rows negate them).
     */
    private static void reverseColumns(Path file, int line, String rawLine, Map<ColumnRole, Column> found,
                                       String hint) throws DataFileException {
        for (ColumnRole r : List.of(ColumnRole.VOLTAGE, ColumnRole.CURRENT, ColumnRole.CAPACITANCE,
                ColumnRole.SUPPLY_VOLTAGE, ColumnRole.SERIES_RESISTANCE, ColumnRole.METER_VOLTAGE)) {
            Column c = found.get(r);
            if (c != null) {
                throw new DataFileException(file, line, "column " + r.columnName() + " beside VR or IR: a file of "
                        + "reverse magnitudes has the columns VR and IR only (read as V = -VR, I = -IR)", c.cell());
            }
        }
        Column vr = found.remove(ColumnRole.REVERSE_VOLTAGE);
        Column ir = found.remove(ColumnRole.REVERSE_CURRENT);
        if (vr == null || ir == null) {
            throw new DataFileException(file, line, "a file of reverse magnitudes needs both VR and IR columns"
                    + hint, rawLine);
        }
        found.put(ColumnRole.VOLTAGE, vr);
        found.put(ColumnRole.CURRENT, ir);
    }

    private static HeaderLayout seriesResistorLog(Path file, int line, String rawLine, Map<ColumnRole, Column> found,
                                                  List<Column> ignored, int width, String hint)
            throws DataFileException {
        for (ColumnRole r : LOG_COLUMNS) {
            if (!found.containsKey(r)) {
                throw new DataFileException(file, line, "series-resistor log without a " + r.columnName()
                        + " column: it needs Vsupply, Rseries and Vmeter" + hint, rawLine);
            }
        }
        for (ColumnRole r : NOT_IN_LOG) {
            Column c = found.get(r);
            if (c != null) {
                throw new DataFileException(file, line, "column " + r.columnName() + " has no place in a "
                        + "series-resistor log (Vsupply, Rseries, Vmeter): the reader computes V and I itself; "
                        + "rename or remove the column", c.cell());
            }
        }
        return new HeaderLayout(DataKind.IV, FileLayout.SERIES_RESISTOR_LOG, found, ignored, width);
    }

    private static ColumnUnit unitOf(Path file, int line, String cell, ColumnRole r, String rest)
            throws DataFileException {
        Quantity q = r.quantity().orElseThrow();
        if (rest.isEmpty()) {
            return ColumnUnit.implicit(q);
        }
        Matcher b = BRACKETED.matcher(rest);
        if (!b.matches()) {
            throw new DataFileException(file, line, "cannot read header cell of column " + r.columnName()
                    + ": write the unit in brackets or parentheses after the name, e.g. '" + r.columnName()
                    + " [" + ColumnUnit.implicit(q).displayName() + "]'", cell);
        }
        String written = b.group(1) != null ? b.group(1) : b.group(2);
        try {
            return ColumnUnit.parse(q, written);
        } catch (CellProblem e) {
            throw new DataFileException(file, line, e.problem() + " in column " + r.columnName(), cell);
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
