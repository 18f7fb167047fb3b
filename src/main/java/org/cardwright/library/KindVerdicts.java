package org.cardwright.library;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.cardwright.verify.CapacitanceVerdict;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.DataUncertainty;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.LeakageVerification;
import org.cardwright.verify.RecoveryVerification;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;

/**
 * Every data kind of one verification ({@code VerifyWorkflow.runAll}), reduced to its worst temperature: what check,
 * build, the card header and tweak print, so that no command reports forward I-V alone. The verdict of each kind is
 * the one verify gives (against the data's own uncertainty or the fixed limits, as the request asked); nothing is
 * judged again here.
 */
final class KindVerdicts {
    private KindVerdicts() {
    }

    /**
     * The worst temperature of one data kind.
     *
     * @param kind        "forward", "breakdown", "C-V", "recovery" or "leakage"
     * @param pass        the kind's verdict (every temperature)
     * @param temperature the worst temperature [K]
     * @param rms         RMS residual there, in {@code unit}
     * @param max         largest residual there, in {@code unit}
     * @param unit        "mV", "%", "ns" or "dec"
     * @param limits      the fixed limits in words, e.g. "2.000/5.000 mV"
     * @param noise       the residuals against the data's own uncertainty in words, or "" for kinds judged by
     *                    fixed limits alone (recovery, leakage)
     * @param note        what the user must know about this kind (e.g. the card carries no breakdown), or ""
     */
    record Kind(String kind, boolean pass, double temperature, double rms, double max, String unit, String limits,
                String noise, String note) {
        Kind(String kind, boolean pass, double temperature, double rms, double max, String unit, String limits,
             String noise) {
            this(kind, pass, temperature, rms, max, unit, limits, noise, "");
        }

        /** "breakdown FAIL at 25 degC: RMS 53.1 mV, max 120 mV (limits 31.2/62.4 mV; u 2.1 mV (estimated), ...)". */
        String text() {
            return String.format(Locale.ROOT, "%s %s at %s degC: RMS %s %s, max %s %s (limits %s%s)", kind,
                    pass ? "pass" : "FAIL", DeviceFile.celsiusText(temperature), number(rms), unit, number(max), unit,
                    limits, noise.isEmpty() ? "" : "; " + noise) + (note.isEmpty() ? "" : " (" + note + ")");
        }
    }

    /** One entry per data kind present, in the order forward, breakdown, C-V, recovery, leakage. */
    static List<Kind> of(JunctionVerification v) {
        List<Kind> out = new ArrayList<>();
        v.forward().ifPresent(f -> out.add(voltage("forward", f)));
        v.breakdown().ifPresent(b -> out.add(voltage("breakdown", b)));
        v.capacitance().ifPresent(c -> out.add(capacitance(c)));
        v.recovery().ifPresent(r -> out.add(recovery(r)));
        v.leakage().ifPresent(l -> out.add(leakage(l)));
        return out;
    }

    /** Every kind on one line, separated by "; ". */
    static String summary(JunctionVerification v) {
        List<Kind> kinds = of(v);
        return kinds.isEmpty() ? "no points" : kinds.stream().map(Kind::text).collect(Collectors.joining("; "));
    }

    /** The kinds that fail, by name, e.g. "breakdown, leakage"; empty when all pass. */
    static String failing(JunctionVerification v) {
        return of(v).stream().filter(k -> !k.pass()).map(Kind::kind).collect(Collectors.joining(", "));
    }

    private static Kind voltage(String kind, Verification v) {
        TemperatureVerdict w = null;
        for (TemperatureVerdict t : v.perTemperature()) {
            if (w == null || (!t.pass() && w.pass()) || (t.pass() == w.pass() && t.rms() > w.rms())) {
                w = t;
            }
        }
        String limits = PartFitter.mv(v.tolerance().rms()) + "/" + PartFitter.mv(v.tolerance().max()) + " mV";
        if (w == null) {
            return new Kind(kind, v.pass(), Double.NaN, Double.NaN, Double.NaN, "mV", limits, "");
        }
        return new Kind(kind, v.pass(), w.temperature(), w.rms() * 1e3, w.max() * 1e3, "mV", limits,
                noise(w.noise(), 1e3, "mV"), String.join("; ", v.notes()));
    }

    private static Kind capacitance(CapacitanceVerification v) {
        CapacitanceVerdict w = null;
        for (CapacitanceVerdict t : v.perTemperature()) {
            if (w == null || (!t.pass() && w.pass()) || (t.pass() == w.pass() && t.rmsPercent() > w.rmsPercent())) {
                w = t;
            }
        }
        String limits = number(v.tolerance().rmsPercent()) + "/" + number(v.tolerance().maxPercent()) + " %";
        if (w == null) {
            return new Kind("C-V", v.pass(), Double.NaN, Double.NaN, Double.NaN, "%", limits, "");
        }
        return new Kind("C-V", v.pass(), w.temperature(), w.rmsPercent(), w.maxPercent(), "%", limits,
                noise(w.noise(), 1, "%"));
    }

    private static Kind recovery(RecoveryVerification v) {
        RecoveryVerification.Verdict w = null;
        for (RecoveryVerification.Verdict t : v.perTemperature()) {
            if (w == null || (!t.pass() && w.pass()) || (t.pass() == w.pass() && t.rmsNs() > w.rmsNs())) {
                w = t;
            }
        }
        String limits = String.format(Locale.ROOT, "%.0f/%.0f %% of the measured time",
                100 * RecoveryVerification.RMS_FRACTION, 100 * RecoveryVerification.MAX_FRACTION);
        return w == null ? new Kind("recovery", v.pass(), Double.NaN, Double.NaN, Double.NaN, "ns", limits, "")
                : new Kind("recovery", v.pass(), w.temperature(), w.rmsNs(), w.maxNs(), "ns", limits, "");
    }

    private static Kind leakage(LeakageVerification v) {
        LeakageVerification.Verdict w = null;
        for (LeakageVerification.Verdict t : v.perTemperature()) {
            if (w == null || (!t.pass() && w.pass()) || (t.pass() == w.pass() && t.rmsDecades() > w.rmsDecades())) {
                w = t;
            }
        }
        String limits = number(LeakageVerification.RMS_DECADES) + "/" + number(LeakageVerification.MAX_DECADES) + " dec";
        return w == null ? new Kind("leakage", v.pass(), Double.NaN, Double.NaN, Double.NaN, "dec", limits, "")
                : new Kind("leakage", v.pass(), w.temperature(), w.rmsDecades(), w.maxDecades(), "dec", limits, "");
    }

    private static String noise(DataUncertainty u, double scale, String unit) {
        return DataUncertainty.NONE.equals(u.source()) ? "" : u.describe(scale, unit);
    }

    /** Three decimals, as the forward residuals have always been printed; three digits when that is too wide. */
    static String number(double x) {
        if (Double.isNaN(x)) {
            return "-";
        }
        return String.format(Locale.ROOT, Math.abs(x) < 1e5 ? "%.3f" : "%.3g", x);
    }
}
