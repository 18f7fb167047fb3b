package org.cardwright.data;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Splits one physical line into cells with Apache Commons CSV: the delimiter from the read options, double
 * quotes around a cell that holds the delimiter, blanks around cells dropped. The only class that sees
 * Commons CSV.
 *
 * <p>Lines are split one at a time so that every cell keeps its physical line number; a quoted cell cannot
 * run over a line break, which a measurement file has no use for.
 */
final class CsvLine {
    private final CSVFormat format;

    CsvLine(char delimiter) {
        this.format = CSVFormat.RFC4180.builder()
                .setDelimiter(delimiter)
                .setQuote('"')
                .setTrim(true)
                .setIgnoreSurroundingSpaces(true)
                .setIgnoreEmptyLines(false)
                .get();
    }

    /**
     * The cells of one line, in order.
     *
     * @throws CellProblem when the line's quoting is broken
     */
    List<String> split(String line) throws CellProblem {
        try (CSVParser parser = CSVParser.parse(line, format)) {
            List<CSVRecord> records = parser.getRecords();
            if (records.size() != 1) {
                throw new CellProblem("a quoted cell runs past the end of the line");
            }
            List<String> cells = new ArrayList<>(records.get(0).size());
            for (String cell : records.get(0)) {
                cells.add(cell);
            }
            return cells;
        } catch (IOException | UncheckedIOException e) {
            throw new CellProblem("broken quoting: a quote is not closed, or text follows a closing quote");
        }
    }
}
