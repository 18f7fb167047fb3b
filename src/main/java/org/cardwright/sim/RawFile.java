package org.cardwright.sim;

import java.util.HashMap;
import java.util.Map;
import org.cardwright.sim.process.SimulationException;

/**
 * Reads the one operating point of an ngspice raw file written as text ({@code set filetype=ascii}, then
 * {@code write}), strictly: the header states the number of variables and one point, every variable is listed once
 * with its index, and the values section holds exactly that many plain decimal numbers, each finite. Anything else
 * is a {@link SimulationException} with one line naming the simulator and what was wrong.
 */
final class RawFile {
    /** Most bytes a variable may take in the file: its line in the list and its value, about 60 at most. */
    private static final int MAX_BYTES_PER_VARIABLE = 200;
    /** Bytes for the header lines (title, date, plot name, flags, counts). */
    private static final int HEADER_BYTES = 4096;

    private RawFile() {
    }

    /**
     * The values of the file's variables by name (lower case, as ngspice writes them: {@code v(a1)},
     * {@code i(@d1[id])}), refused unread when larger than {@code mostVariables} variables can be.
     */
    static Map<String, Double> read(java.nio.file.Path file, int mostVariables, String what, String kept)
            throws SimulationException {
        java.util.List<String> lines;
        try {
            long size = java.nio.file.Files.size(file);
            long most = (long) MAX_BYTES_PER_VARIABLE * mostVariables + HEADER_BYTES;
            if (size > most) {
                throw new SimulationException(what + " wrote " + size + " bytes of results, more than " + most + kept);
            }
            lines = java.nio.file.Files.readAllLines(file, java.nio.charset.StandardCharsets.ISO_8859_1);
        } catch (java.io.IOException e) {
            throw new SimulationException(what + " wrote no results" + kept + ": " + e.getMessage(), e);
        }
        int count = -1;
        int k = 0;
        for (; k < lines.size(); k++) {
            String line = lines.get(k);
            if (line.startsWith("No. Variables:")) {
                count = count(line, what, kept);
            } else if (line.startsWith("No. Points:") && count(line, what, kept) != 1) {
                throw new SimulationException(what + " wrote more than one point: '" + ResultTable.excerpt(line) + "'" + kept);
            } else if (line.equals("Variables:")) {
                k++;
                break;
            }
        }
        if (count < 1 || count > mostVariables) {
            throw new SimulationException(what + " wrote no variable count, or more than " + mostVariables + kept);
        }
        String[] names = new String[count];
        for (int v = 0; v < count; v++, k++) {
            String[] f = k < lines.size() ? lines.get(k).strip().split("\\s+") : new String[0];
            if (f.length < 2 || !f[0].equals(Integer.toString(v))) {
                throw new SimulationException(what + " listed variable " + v + " wrongly: '"
                        + ResultTable.excerpt(k < lines.size() ? lines.get(k) : "(end of file)") + "'" + kept);
            }
            names[v] = f[1];
        }
        if (k >= lines.size() || !lines.get(k).equals("Values:")) {
            throw new SimulationException(what + " wrote no values after its " + count + " variables" + kept);
        }
        k++;
        Map<String, Double> values = new HashMap<>(count * 2);
        int v = 0;
        for (; k < lines.size(); k++) {
            String t = lines.get(k).strip();
            if (t.isEmpty()) {
                continue;
            }
            String[] f = t.split("\\s+");
            // the first value follows the point's index, 0
            String field = v == 0 && f.length == 2 && f[0].equals("0") ? f[1] : f.length == 1 ? f[0] : null;
            if (field == null || v == count) {
                throw new SimulationException(what + " wrote an unexpected value line: '" + ResultTable.excerpt(t) + "'" + kept);
            }
            if (values.put(names[v], ResultTable.number(field, what, v + 1, kept)) != null) {
                throw new SimulationException(what + " listed variable " + ResultTable.excerpt(names[v]) + " twice" + kept);
            }
            v++;
        }
        if (v != count) {
            throw new SimulationException(what + " wrote " + v + " values of its " + count + kept);
        }
        return values;
    }

    /** The value of {@code name}, which the file must hold. */
    static double value(Map<String, Double> values, String name, String what, String kept) throws SimulationException {
        Double v = values.get(name);
        if (v == null) {
            throw new SimulationException(what + " wrote no value of " + name + kept);
        }
        return v;
    }

    private static int count(String line, String what, String kept) throws SimulationException {
        String n = line.substring(line.indexOf(':') + 1).strip();
        if (!n.matches("\\d{1,9}")) {
            throw new SimulationException(what + " wrote a bad count: '" + ResultTable.excerpt(line) + "'" + kept);
        }
        return Integer.parseInt(n);
    }
}
