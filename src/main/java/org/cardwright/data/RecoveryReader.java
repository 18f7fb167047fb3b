package org.cardwright.data;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * Reads reverse-recovery records (docs/formats.md, "Recovery records"): a CSV with one header row and the
 * columns {@code IF}, {@code IR} and {@code trr}, optionally {@code T}; units in brackets or parentheses as in
 * every cardwright file ({@code IF [mA]}, {@code trr (ns)}, {@code T [degC]}). IR is the reverse current during
 * recovery and, like every reverse current here, negative. Comment lines start with {@code #}. Cells may be
 * separated by commas, semicolons or tabs (as the header line shows) and take SPICE suffixes, as in the other
 * measurement files.
 */
public final class RecoveryReader {
    private static final Map<String, Double> CURRENT = Map.of("a", 1.0, "ma", 1e-3, "ua", 1e-6, "\u00b5a", 1e-6,
            "na", 1e-9, "pa", 1e-12);
    private static final Map<String, Double> TIME = Map.of("s", 1.0, "ms", 1e-3, "us", 1e-6, "\u00b5s", 1e-6,
            "ns", 1e-9, "ps", 1e-12);

    private final OptionalDouble defaultTemperature;

    /** @param defaultTemperature temperature for files without a T column [K] */
    public RecoveryReader(OptionalDouble defaultTemperature) {
        this.defaultTemperature = defaultTemperature;
    }

    /**
     * True when the first non-comment line of {@code file} names the recovery columns (IF, IR and trr). Reads
     * no further than that line; a file that cannot be read (missing, not a regular file, not UTF-8) is not
     * taken for recovery records, and the measurement reader then says what is wrong with it.
     */
    public static boolean looksLikeRecovery(Path file) {
        try (LineSource source = LineSource.openUnhashed(file)) {
            for (String line = source.next(); line != null; line = source.next()) {
                String t = line.strip();
                if (t.isEmpty() || t.startsWith("#")) {
                    continue;
                }
                List<String> names = new ArrayList<>();
                for (String cell : new CsvLine(delimiterOf(t)).split(t)) {
                    names.add(name(cell));
                }
                return names.contains("if") && names.contains("ir") && names.contains("trr");
            }
        } catch (DataFileException | CellProblem e) {
            return false;
        }
        return false;
    }

    /** The records of {@code file}, with the file's SHA-256 for provenance. */
    public record Records(Path file, String sha256, List<RecoveryRecord> records) {
        public Records {
            records = List.copyOf(records);
        }
    }

    /**
     * Reads every record; errors name the file, the line and the raw value. The file is read the way every
     * measurement file is (regular files only, size and line limits, strict UTF-8, control characters refused,
     * the same cell splitting and number reading).
     */
    public Records read(Path file) throws DataFileException {
        try (LineSource source = LineSource.open(file)) {
            return read(file, source);
        }
    }

    private Records read(Path file, LineSource source) throws DataFileException {
        int[] col = null;
        double[] scale = null;
        boolean celsius = true;
        List<RecoveryRecord> out = new ArrayList<>();
        char delimiter = ',';
        CsvLine splitter = null;
        int headerLine = 0;
        int width = 0;
        for (String line = source.next(); line != null; line = source.next()) {
            int lineNo = source.lineNumber();
            String t = line.strip();
            if (t.isEmpty() || t.startsWith("#")) {
                continue;
            }
            if (col == null) {
                delimiter = delimiterOf(t);
                splitter = new CsvLine(delimiter);
            }
            String[] cells;
            try {
                cells = splitter.split(line).toArray(new String[0]);
            } catch (CellProblem e) {
                throw new DataFileException(file, lineNo, e.problem(), line);
            }
            if (col == null) {
                headerLine = lineNo;
                width = cells.length;
                col = new int[] {-1, -1, -1, -1};
                scale = new double[] {1, 1, 1, 1};
                String[] wanted = {"if", "ir", "trr", "t"};
                for (int c = 0; c < cells.length; c++) {
                    String n = name(cells[c]);
                    String unit = unit(cells[c]);
                    for (int w = 0; w < wanted.length; w++) {
                        if (n.equals(wanted[w])) {
                            col[w] = c;
                            if (w < 2) {
                                scale[w] = factor(CURRENT, unit, "A", file, lineNo, cells[c]);
                            } else if (w == 2) {
                                scale[w] = factor(TIME, unit, "s", file, lineNo, cells[c]);
                            } else {
                                String u = unit.toLowerCase(Locale.ROOT);
                                if (u.equals("k") || u.equals("kelvin")) {
                                    celsius = false;
                                } else if (!(u.isEmpty() || u.equals("degc") || u.equals("c") || u.equals("\u00b0c"))) {
                                    throw new DataFileException(file, lineNo, "unknown temperature unit; use degC or K", cells[c]);
                                }
                            }
                        }
                    }
                }
                for (int w = 0; w < 3; w++) {
                    if (col[w] < 0) {
                        throw new DataFileException(file, lineNo, "a recovery file needs the columns IF, IR and trr; "
                                + wanted[w] + " is missing", t);
                    }
                }
                if (col[3] < 0 && defaultTemperature.isEmpty()) {
                    throw new DataFileException(file, lineNo, "no T column and no --temp given", t);
                }
                continue;
            }
            if (cells.length < width) {
                throw new DataFileException(file, lineNo, "the row has " + cells.length + " cells, the header on line "
                        + headerLine + " has " + width, t);
            }
            double[] v = new double[4];
            for (int w = 0; w < 4; w++) {
                if (col[w] < 0) {
                    continue;
                }
                String raw = cells[col[w]].trim();
                try {
                    // the same number reading as every other cardwright file: SPICE suffixes, and a decimal
                    // comma when cells are not separated by commas
                    v[w] = DecimalText.toDouble(CellNumber.parse(raw, delimiter != ',').value()) * scale[w];
                } catch (CellProblem e) {
                    throw new DataFileException(file, lineNo, e.problem(), raw);
                }
                if (!Double.isFinite(v[w])) {
                    throw new DataFileException(file, lineNo, "not a finite number", raw);
                }
            }
            double kelvin = col[3] < 0 ? defaultTemperature.getAsDouble() : (celsius ? v[3] + 273.15 : v[3]);
            if (!(v[0] > 0)) {
                throw new DataFileException(file, lineNo, "IF must be a positive forward current", cells[col[0]].trim());
            }
            if (!(v[1] < 0)) {
                throw new DataFileException(file, lineNo,
                        "IR must be negative: it is the reverse current during recovery, anode to cathode", cells[col[1]].trim());
            }
            if (!(v[2] > 0)) {
                throw new DataFileException(file, lineNo, "trr must be a positive time", cells[col[2]].trim());
            }
            if (!(kelvin > 0)) {
                throw new DataFileException(file, lineNo, "temperature below absolute zero", cells[col[3]].trim());
            }
            out.add(new RecoveryRecord(v[0], v[1], v[2], kelvin, lineNo));
        }
        if (out.isEmpty()) {
            throw new DataFileException(file, 0, "no recovery records", null);
        }
        return new Records(file, source.sha256(), out);
    }

    /** Tab, else semicolon, else comma: whichever the header line uses. */
    private static char delimiterOf(String header) {
        return header.indexOf('\t') >= 0 ? '\t' : header.indexOf(';') >= 0 ? ';' : ',';
    }

    private static String name(String cell) {
        String c = cell.trim();
        int cut = indexOfUnit(c);
        return (cut < 0 ? c : c.substring(0, cut)).trim().toLowerCase(Locale.ROOT);
    }

    private static String unit(String cell) {
        String c = cell.trim();
        int cut = indexOfUnit(c);
        if (cut < 0) {
            return "";
        }
        return c.substring(cut + 1).replace("]", "").replace(")", "").trim();
    }

    private static int indexOfUnit(String c) {
        int a = c.indexOf('[');
        int b = c.indexOf('(');
        return a < 0 ? b : (b < 0 ? a : Math.min(a, b));
    }

    private static double factor(Map<String, Double> table, String unit, String si, Path file, int line, String cell)
            throws DataFileException {
        if (unit.isEmpty()) {
            return 1;
        }
        if (unit.length() > 1 && Character.isUpperCase(unit.charAt(0)) && unit.charAt(0) == 'M') {
            throw new DataFileException(file, line, "ambiguous unit: M may mean milli or mega; write m" + si, cell);
        }
        Double f = table.get(unit.toLowerCase(Locale.ROOT));
        if (f == null) {
            throw new DataFileException(file, line, "unknown unit, expected one of " + new java.util.TreeMap<>(table).keySet(), cell);
        }
        return f;
    }
}
