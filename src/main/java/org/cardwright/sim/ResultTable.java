package org.cardwright.sim;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;
import org.cardwright.sim.process.SimulationException;

/**
 * Reads the numbers a simulator wrote, strictly: every row has exactly the columns asked for, every field is a
 * plain decimal number ({@code -1.25e-03}; no NaN, no Inf, nothing cut off) that is finite as a double, and there
 * are exactly as many rows as operating points asked for. Anything else is a {@link SimulationException} with one
 * line naming the simulator, the row and the field.
 */
final class ResultTable {
    /** A decimal number as ngspice's wrdata writes it: sign, digits with an optional point, optional exponent. */
    private static final Pattern DECIMAL = Pattern.compile("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?");
    private static final int FIELD_EXCERPT = 40;

    /** Most bytes one result row may take: four 23-character numbers and blanks need about 100. */
    static final int MAX_ROW_BYTES = 400;

    private ResultTable() {
    }

    /**
     * The lines of a result file the simulator wrote, refused unread when it is larger than {@code expectedRows}
     * rows can be (a runaway or hostile writer must not fill the heap).
     */
    static List<String> lines(java.nio.file.Path file, int expectedRows, String what, String kept)
            throws SimulationException {
        try {
            long size = java.nio.file.Files.size(file);
            long most = (long) MAX_ROW_BYTES * (expectedRows + 1);
            if (size > most) {
                throw new SimulationException(what + " wrote " + size + " bytes of results for " + expectedRows
                        + " operating points, more than " + most + kept);
            }
            return java.nio.file.Files.readAllLines(file, java.nio.charset.StandardCharsets.ISO_8859_1);
        } catch (java.io.IOException e) {
            throw new SimulationException(what + " wrote no results" + kept + ": " + e.getMessage(), e);
        }
    }

    /**
     * The rows of {@code lines} (blank lines skipped), each with {@code columns} numbers.
     *
     * @param what e.g. "ngspice", used in messages
     * @param kept e.g. " (netlist kept in /tmp/...)", appended to messages
     */
    static List<double[]> read(List<String> lines, int columns, int expectedRows, String what, String kept)
            throws SimulationException {
        List<double[]> rows = new ArrayList<>(expectedRows);
        for (String line : lines) {
            String t = line.strip();
            if (t.isEmpty()) {
                continue;
            }
            if (rows.size() == expectedRows) {
                throw new SimulationException(what + " returned more rows than the " + expectedRows
                        + " operating points asked for: '" + excerpt(t) + "'" + kept);
            }
            String[] f = t.split("\\s+");
            if (f.length != columns) {
                throw new SimulationException(what + " output row " + (rows.size() + 1) + " has " + f.length
                        + " columns, expected " + columns + ": '" + excerpt(t) + "'" + kept);
            }
            double[] row = new double[columns];
            for (int c = 0; c < columns; c++) {
                row[c] = number(f[c], what, rows.size() + 1, kept);
            }
            rows.add(row);
        }
        if (rows.size() != expectedRows) {
            throw new SimulationException(what + " returned " + rows.size() + " of " + expectedRows
                    + " operating points" + kept);
        }
        return rows;
    }

    /** One field as a finite number, or a SimulationException naming the row and the field. */
    static double number(String field, String what, int row, String kept) throws SimulationException {
        if (DECIMAL.matcher(field).matches()) {
            double v = Double.parseDouble(field);
            if (Double.isFinite(v)) {
                return v;
            }
        }
        throw new SimulationException(what + " output row " + row + " holds '" + excerpt(field)
                + "', not a finite number" + kept);
    }

    /** At most a short, printable excerpt of simulator output for a message. */
    static String excerpt(String text) {
        StringBuilder sb = new StringBuilder();
        int n = Math.min(text.length(), FIELD_EXCERPT);
        for (int i = 0; i < n; i++) {
            char c = text.charAt(i);
            sb.append(c < 0x20 || c > 0x7e ? '?' : c);
        }
        return text.length() > FIELD_EXCERPT ? sb.append("...").toString() : sb.toString();
    }
}
