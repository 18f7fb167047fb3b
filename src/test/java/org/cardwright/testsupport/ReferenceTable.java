package org.cardwright.testsupport;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * A table of reference values kept with the tests under {@code src/test/resources} (read from the class path,
 * never from outside the repository). The file's comment lines ({@code #}) name its source; every other
 * non-blank line is one row of comma-separated numbers.
 */
public final class ReferenceTable {
    private ReferenceTable() {
    }

    /** The rows of the resource {@code name} (e.g. {@code "/reference/lambert-w.csv"}). */
    public static List<double[]> rows(String name) {
        InputStream in = ReferenceTable.class.getResourceAsStream(name);
        if (in == null) {
            throw new IllegalStateException("no test resource " + name);
        }
        List<double[]> rows = new ArrayList<>();
        try (BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            String line;
            while ((line = r.readLine()) != null) {
                String s = line.strip();
                if (s.isEmpty() || s.startsWith("#")) {
                    continue;
                }
                String[] cells = s.split(",");
                double[] row = new double[cells.length];
                for (int i = 0; i < cells.length; i++) {
                    row[i] = Double.parseDouble(cells[i].strip());
                }
                rows.add(row);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        if (rows.isEmpty()) {
            throw new IllegalStateException("test resource " + name + " holds no rows");
        }
        return rows;
    }
}
