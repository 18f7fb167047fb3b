package org.cardwright.sim.process;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Reads a simulator's console output for the lines that report problems. The patterns come from running the
 * installed ngspice 39 and gnucap 2017.10.03 on faulty netlists (see SimulatorProcessTest); they are not taken
 * from any documentation.
 */
final class OutputScan {
    /** ngspice: "Error on line 3 ...", "Error: Transient op failed, timestep too small". */
    private static final Pattern NGSPICE_ERROR = Pattern.compile(
            "^\\s*(Error|ERROR)\\b"
                    + "|no such command available"
                    + "|simulation\\(s\\) aborted"
                    + "|Simulation interrupted due to error");
    /** ngspice: "Warning: ...", "unrecognized parameter (tbv1) - ignored", "Warning: can't parse 'a': ignored". */
    private static final Pattern NGSPICE_WARNING = Pattern.compile(
            "warning|Warning|unrecognized parameter|ignored");
    /**
     * ngspice's reports on its own way to an operating point, not on the card: "Warning: Further gmin increment",
     * "Warning: Dynamic gmin stepping failed", "Supplies reduced to 100.0000% Warning: source stepping failed",
     * "Note: Transient op started". Seen with ngspice 39 on a 1 kV card at its breakdown knee, where the direct
     * Newton iteration and gmin stepping give up and source stepping or the transient op then finds the point. When
     * every aid fails, ngspice reports an error ("simulation(s) aborted") and writes no row, and the run fails on
     * that; these lines alone are not a fault of the card.
     */
    private static final Pattern NGSPICE_CONVERGENCE_AID = Pattern.compile(
            "gmin stepping|gmin step failed|gmin increment|source stepping|Supplies reduced|Trying gmin|Transient op");
    /** gnucap exits with 0 even on these: "D1: can't find: nomodel", "x.ckt:No such file or directory",
     *  "tried everything, still doesn't work, giving up". */
    private static final Pattern GNUCAP_ERROR = Pattern.compile(
            "can't find|No such file or directory|giving up");
    /** gnucap: "^ ? dmod: bad parameter ikf ignored", "^ ? no match", "^ ? what's this?". */
    private static final Pattern GNUCAP_WARNING = Pattern.compile(
            "bad parameter|no match|ignored|what's this\\?|not specified, using default");
    /** The caret and question mark gnucap puts under the echoed input line; meaningless on its own. */
    private static final Pattern GNUCAP_CARET = Pattern.compile("^\\^\\s*\\?\\s*");

    private OutputScan() {
    }

    /** Distinct problem lines, trimmed, in order of first appearance (stdout first, then stderr). */
    static List<String> warnings(SimulatorProcess.Kind kind, String stdout, String stderr) {
        Pattern pattern = kind == SimulatorProcess.Kind.NGSPICE ? NGSPICE_WARNING : GNUCAP_WARNING;
        Set<String> found = new LinkedHashSet<>();
        for (String text : List.of(stdout, stderr)) {
            for (String line : text.split("\\R")) {
                if (pattern.matcher(line).find()
                        && !(kind == SimulatorProcess.Kind.NGSPICE && NGSPICE_CONVERGENCE_AID.matcher(line).find())) {
                    found.add(clean(kind, line));
                }
            }
        }
        return List.copyOf(found);
    }

    /** The first line that reports an error, trimmed, if any. */
    static Optional<String> firstError(SimulatorProcess.Kind kind, String stdout, String stderr) {
        Pattern pattern = kind == SimulatorProcess.Kind.NGSPICE ? NGSPICE_ERROR : GNUCAP_ERROR;
        List<String> errors = new ArrayList<>();
        for (String text : List.of(stdout, stderr)) {
            for (String line : text.split("\\R")) {
                if (pattern.matcher(line).find()) {
                    errors.add(clean(kind, line));
                }
            }
        }
        return errors.stream().findFirst();
    }

    /** The last non-blank line of a text, trimmed, or an empty string. */
    static String lastLine(String text) {
        String[] lines = text.split("\\R");
        for (int i = lines.length - 1; i >= 0; i--) {
            if (!lines[i].isBlank()) {
                return lines[i].trim();
            }
        }
        return "";
    }

    private static String clean(SimulatorProcess.Kind kind, String line) {
        String trimmed = line.trim();
        return kind == SimulatorProcess.Kind.GNUCAP ? GNUCAP_CARET.matcher(trimmed).replaceFirst("") : trimmed;
    }
}
