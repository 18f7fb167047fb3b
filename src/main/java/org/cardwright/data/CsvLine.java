package org.cardwright.data;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Splits one physical line into cells: the delimiter from the read options or the header row, double quotes
 * around a cell that holds the delimiter ({@code ""} inside quotes is one quote, RFC 4180 section 2), blanks
 * around cells dropped. One splitter serves a whole file; it keeps no state between lines, and its work is
 * linear in the length of the line.
 *
 * <p>Lines are split one at a time so that every cell keeps its physical line number; a quoted cell cannot
 * run over a line break, which a measurement file has no use for.
 *
 * <p>A control character inside a line (NUL, escape, DEL, the C1 controls; anything but the tab) is refused
 * with its cell and character position: such a byte is a sign of a binary or damaged file, and dropping it
 * would change a value silently.
 */
final class CsvLine {
    private static final char QUOTE = '"';

    private final char delimiter;

    CsvLine(char delimiter) {
        this.delimiter = delimiter;
    }

    /**
     * The cells of one line, in order.
     *
     * @throws CellProblem when the line's quoting is broken or it holds a control character
     */
    List<String> split(String line) throws CellProblem {
        checkControls(line);
        List<String> cells = new ArrayList<>();
        int n = line.length();
        int i = 0;
        while (true) {
            while (i < n && line.charAt(i) != delimiter && Character.isWhitespace(line.charAt(i))) {
                i++;
            }
            String cell;
            if (i < n && line.charAt(i) == QUOTE) {
                StringBuilder s = new StringBuilder();
                i++;
                while (true) {
                    if (i >= n) {
                        throw new CellProblem("broken quoting: a quote is not closed, or text follows a closing quote");
                    }
                    char c = line.charAt(i++);
                    if (c == QUOTE) {
                        if (i < n && line.charAt(i) == QUOTE) {
                            s.append(QUOTE);
                            i++;
                            continue;
                        }
                        break;
                    }
                    s.append(c);
                }
                while (i < n && line.charAt(i) != delimiter) {
                    if (!Character.isWhitespace(line.charAt(i))) {
                        throw new CellProblem("broken quoting: a quote is not closed, or text follows a closing quote");
                    }
                    i++;
                }
                cell = s.toString().trim();
            } else {
                int start = i;
                while (i < n && line.charAt(i) != delimiter) {
                    i++;
                }
                cell = line.substring(start, i).trim();
            }
            cells.add(cell);
            if (i >= n) {
                return cells;
            }
            i++; // the delimiter
        }
    }

    /** Refuses a control character other than the tab, naming its cell and character position. */
    private void checkControls(String line) throws CellProblem {
        int cell = 1;
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (c == QUOTE) {
                quoted = !quoted;
            } else if (c == delimiter && !quoted) {
                cell++;
            } else if (isControl(c)) {
                throw new CellProblem(String.format(Locale.ROOT, "control character U+%04X in column %d "
                        + "(character %d of the line); the file may be binary or damaged", (int) c, cell, i + 1));
            }
        }
    }

    /** Whether a character is a control character that has no place in a text cell (the tab excepted). */
    static boolean isControl(char c) {
        return c != '\t' && (c < 0x20 || (c >= 0x7F && c <= 0x9F));
    }
}
