package org.cardwright.report;

import java.util.Locale;
import org.cardwright.verify.CapacitanceVerdict;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.LeakageVerification;
import org.cardwright.verify.RecoveryVerification;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;

/** The verification table for a terminal. */
public final class VerificationText {
    private VerificationText() {
    }

    /** Renders every section, then one verdict line. */
    public static String render(JunctionVerification all) {
        StringBuilder sb = new StringBuilder();
        for (String n : all.notes()) {
            sb.append("note: ").append(n).append('\n');
        }
        all.forward().ifPresent(v -> sb.append(section("Forward I-V", v)));
        all.breakdown().ifPresent(v -> sb.append(section("Reverse breakdown", v)));
        all.capacitance().ifPresent(v -> sb.append(capacitance(v)));
        all.recovery().ifPresent(v -> sb.append(recovery(v)));
        all.leakage().ifPresent(v -> sb.append(leakage(v)));
        sb.append(all.pass() ? "reproduces the data within the limits\n" : "does NOT reproduce the data within the limits\n");
        return sb.toString();
    }

    private static String capacitance(CapacitanceVerification v) {
        StringBuilder sb = new StringBuilder();
        sb.append("C-V: card ").append(v.cardName()).append(" re-simulated with ").append(v.engine()).append('\n');
        sb.append(String.format(Locale.ROOT, "Limits per temperature: RMS %.2f %%, any point %.2f %%; stray %s subtracted, test frequency %s%n",
                v.tolerance().rmsPercent(), v.tolerance().maxPercent(), Units.engineering(v.strayCapacitance(), "F"),
                Units.engineering(v.frequency(), "Hz")));
        String where = where(v.perTemperature().stream().map(CapacitanceVerdict::worstSource));
        sb.append(String.format(Locale.ROOT, "  %8s %6s %9s %9s  %-10s " + where + " %-6s %s%n", "T [degC]", "points", "RMS [%]",
                "max [%]", "largest at", "where", "result", "against the data's uncertainty; fixed limits"));
        for (CapacitanceVerdict t : v.perTemperature()) {
            sb.append(String.format(Locale.ROOT, "  %8s %6d %9.3f %9.3f  %-10s " + where + " %-6s %s; limits %s%n", Units.celsius(t.temperature()),
                    t.points(), t.rmsPercent(), t.maxPercent(), Units.engineering(t.worstVoltage(), "V"), t.worstSource(),
                    t.pass() ? "pass" : "FAIL", t.noise().describe(1, "%"), t.fixedPass() ? "within" : "exceeded"));
        }
        return sb.append('\n').toString();
    }

    private static String recovery(RecoveryVerification v) {
        StringBuilder sb = new StringBuilder("Reverse recovery: trr = TT ln(1 + IF/|IR|) against the records\n");
        sb.append(String.format(Locale.ROOT, "Limits per temperature: RMS %.0f %%, any record %.0f %% of the measured time%n",
                100 * RecoveryVerification.RMS_FRACTION, 100 * RecoveryVerification.MAX_FRACTION));
        String where = where(v.perTemperature().stream().map(RecoveryVerification.Verdict::worst));
        sb.append(String.format(Locale.ROOT, "  %8s %7s %9s %9s  " + where + " %s%n", "T [degC]", "records", "RMS [ns]", "max [ns]",
                "where", "result"));
        for (RecoveryVerification.Verdict t : v.perTemperature()) {
            sb.append(String.format(Locale.ROOT, "  %8s %7d %9.3f %9.3f  " + where + " %s%n", Units.celsius(t.temperature()),
                    t.points(), t.rmsNs(), t.maxNs(), t.worst(), t.pass() ? "pass" : "FAIL"));
        }
        return sb.append('\n').toString();
    }

    private static String leakage(LeakageVerification v) {
        StringBuilder sb = new StringBuilder();
        for (String n : v.notes()) {
            sb.append("note: ").append(n).append('\n');
        }
        sb.append("Reverse leakage below breakdown: current at the measured voltage, log10(simulated/measured)\n");
        sb.append(String.format(Locale.ROOT, "Limits per temperature: RMS %.1f decade, any point %.1f decade%n",
                LeakageVerification.RMS_DECADES, LeakageVerification.MAX_DECADES));
        String where = where(v.perTemperature().stream().map(LeakageVerification.Verdict::worst));
        sb.append(String.format(Locale.ROOT, "  %8s %6s %10s %10s  " + where + " %s%n", "T [degC]", "points", "RMS [dec]", "max [dec]",
                "where", "result"));
        for (LeakageVerification.Verdict t : v.perTemperature()) {
            sb.append(String.format(Locale.ROOT, "  %8s %6d %10.3f %10.3f  " + where + " %s%n", Units.celsius(t.temperature()),
                    t.points(), t.rmsDecades(), t.maxDecades(), t.worst(), t.pass() ? "pass" : "FAIL"));
        }
        return sb.append('\n').toString();
    }

    /** Renders one voltage-residual section. */
    public static String section(String title, Verification v) {
        StringBuilder sb = new StringBuilder();
        for (String n : v.notes()) {
            sb.append("note: ").append(n).append('\n');
        }
        sb.append(title).append(": card ").append(v.cardName()).append(" re-simulated with ").append(v.engine()).append('\n');
        sb.append(String.format(Locale.ROOT, "Limits per temperature: RMS %s mV, any point %s mV%n",
                Units.millivolts(v.tolerance().rms(), 2), Units.millivolts(v.tolerance().max(), 2)));
        String where = where(v.perTemperature().stream().map(TemperatureVerdict::worstSource));
        sb.append(String.format(Locale.ROOT, "  %8s %6s %9s %9s  %-10s " + where + " %-6s %s%n", "T [degC]", "points", "RMS [mV]",
                "max [mV]", "largest at", "where", "result", "against the data's uncertainty; fixed limits"));
        for (TemperatureVerdict t : v.perTemperature()) {
            sb.append(String.format(Locale.ROOT, "  %8s %6d %9s %9s  %-10s " + where + " %-6s %s; limits %s%n", Units.celsius(t.temperature()),
                    t.points(), Units.millivolts(t.rms(), 3), Units.millivolts(t.max(), 3),
                    Units.engineering(t.worstCurrent(), "A"), t.worstSource(), t.pass() ? "pass" : "FAIL",
                    t.noise().describe(1e3, "mV"), t.fixedPass() ? "within" : "exceeded"));
        }
        for (TemperatureVerdict t : v.perTemperature()) {
            if (t.stated() > 0) {
                sb.append(String.format(Locale.ROOT, "  at %s degC, %d of %d points with a stated uncertainty lie beyond three of it%n",
                        Units.celsius(t.temperature()), t.beyondThree(), t.stated()));
            }
        }
        return sb.append('\n').toString();
    }

    /** Narrowest "where" column. */
    private static final int WHERE_WIDTH = 28;

    /**
     * The format of a table's "where" column (file:line of the worst point): as wide as its longest entry, at
     * least {@value #WHERE_WIDTH}, so that the columns after it stay aligned however long the paths are.
     */
    private static String where(java.util.stream.Stream<String> entries) {
        int width = Math.max(WHERE_WIDTH, entries.mapToInt(String::length).max().orElse(0));
        return "%-" + width + "s";
    }
}
