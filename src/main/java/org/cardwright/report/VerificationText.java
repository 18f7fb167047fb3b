package org.cardwright.report;

import java.util.Locale;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;

/** The verification table for a terminal. */
public final class VerificationText {
    private VerificationText() {
    }

    /** Renders the table and the verdict line. */
    public static String render(Verification v) {
        StringBuilder sb = new StringBuilder();
        for (String n : v.notes()) {
            sb.append("note: ").append(n).append('\n');
        }
        sb.append("Card ").append(v.cardName()).append(" re-simulated with ").append(v.engine()).append('\n');
        sb.append(String.format(Locale.ROOT, "Limits per temperature: RMS %s mV, any point %s mV%n",
                Units.millivolts(v.tolerance().rms(), 2), Units.millivolts(v.tolerance().max(), 2)));
        sb.append(String.format(Locale.ROOT, "  %8s %6s %9s %9s  %-10s %-28s %s%n", "T [degC]", "points", "RMS [mV]",
                "max [mV]", "largest at", "where", "result"));
        for (TemperatureVerdict t : v.perTemperature()) {
            sb.append(String.format(Locale.ROOT, "  %8s %6d %9s %9s  %-10s %-28s %s%n", Units.celsius(t.temperature()),
                    t.points(), Units.millivolts(t.rms(), 3), Units.millivolts(t.max(), 3),
                    Units.engineering(t.worstCurrent(), "A"), t.worstSource(), t.pass() ? "pass" : "FAIL"));
        }
        sb.append(v.pass() ? "reproduces the data within the limits\n" : "does NOT reproduce the data within the limits\n");
        return sb.toString();
    }
}
