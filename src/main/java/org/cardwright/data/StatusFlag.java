package org.cardwright.data;

import java.util.List;
import java.util.Locale;

/**
 * The vocabulary of a {@code status} or {@code compliance} column, compared without regard to case. A row
 * whose flag says the instrument was at its compliance limit, overloaded or in error is set aside (listed in a
 * notice, never used); any value outside the vocabulary stops the read, so a new instrument code cannot slip
 * through as "good".
 */
final class StatusFlag {
    /** Values of a good row; an empty cell is good too. */
    static final List<String> GOOD = List.of("ok", "0", "no", "false", "normal");
    /** Values of a flagged row: C for compliance, 1 for a set flag bit, OVL for overload, ERR for error. */
    static final List<String> FLAGGED = List.of("c", "1", "yes", "true", "compliance", "limit", "ovl",
            "overload", "err", "error", "fail");

    private StatusFlag() {
    }

    /**
     * Whether the cell flags the row.
     *
     * @throws CellProblem when the value is not in the vocabulary
     */
    static boolean isFlagged(String cell) throws CellProblem {
        String v = cell.strip().toLowerCase(Locale.ROOT);
        if (v.isEmpty() || GOOD.contains(v)) {
            return false;
        }
        if (FLAGGED.contains(v)) {
            return true;
        }
        throw new CellProblem("unknown status value; good rows: empty, OK, 0, no, false, normal; flagged rows: "
                + "C, 1, yes, true, compliance, limit, OVL, overload, ERR, error, fail");
    }
}
