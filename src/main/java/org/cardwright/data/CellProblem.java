package org.cardwright.data;

/**
 * What is wrong with one piece of text, before the reader knows or adds where it stands; the reader turns it
 * into a {@link DataFileException} with file, line and raw value.
 */
final class CellProblem extends Exception {
    private static final long serialVersionUID = 1L;

    CellProblem(String problem) {
        super(problem, null, false, false);
    }

    String problem() {
        return getMessage();
    }
}
