package org.cardwright.report;

import java.util.List;
import java.util.Map;
import org.cardwright.verify.CapacitanceResidual;
import org.cardwright.verify.CapacitanceVerdict;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.LeakageVerification;
import org.cardwright.verify.RecoveryVerification;
import org.cardwright.verify.PointResidual;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;
import org.cardwright.workflow.ToolVersion;

/** The machine-readable verification result (docs/formats.md). */
public final class VerificationJson {
    private VerificationJson() {
    }

    /** The JSON text of a verification of every data kind. */
    public static String write(JunctionVerification all, String cardFile) {
        Map<String, Object> root = Json.object();
        root.put("tool", "cardwright " + ToolVersion.get());
        root.put("card", cardFile);
        root.put("pass", all.pass());
        all.forward().ifPresent(v -> root.put("forward", section(v)));
        all.breakdown().ifPresent(v -> root.put("breakdown", section(v)));
        all.capacitance().ifPresent(v -> root.put("capacitance", capacitance(v)));
        all.recovery().ifPresent(v -> {
            List<Object> temps = Json.array();
            for (RecoveryVerification.Verdict t : v.perTemperature()) {
                Map<String, Object> o = Json.object();
                o.put("temperature", t.temperature());
                o.put("records", t.points());
                o.put("rms_residual_ns", t.rmsNs());
                o.put("max_residual_ns", t.maxNs());
                o.put("worst_at", t.worst());
                o.put("pass", t.pass());
                temps.add(o);
            }
            Map<String, Object> rec = Json.object();
            rec.put("pass", v.pass());
            rec.put("temperatures", temps);
            List<Object> pts = Json.array();
            for (RecoveryVerification.Modelled m : v.records()) {
                Map<String, Object> o = Json.object();
                o.put("source", m.record().where());
                o.put("temperature", m.record().temperature());
                o.put("forward_current", m.record().forwardCurrent());
                o.put("reverse_current", m.record().reverseCurrent());
                o.put("measured_time", m.record().recoveryTime());
                o.put("modelled_time", m.modelled());
                o.put("residual_ns", (m.modelled() - m.record().recoveryTime()) * 1e9);
                pts.add(o);
            }
            rec.put("points", pts);
            root.put("recovery", rec);
        });
        all.leakage().ifPresent(v -> {
            List<Object> temps = Json.array();
            for (LeakageVerification.Verdict t : v.perTemperature()) {
                Map<String, Object> o = Json.object();
                o.put("temperature", t.temperature());
                o.put("points", t.points());
                o.put("rms_residual_decades", t.rmsDecades());
                o.put("max_residual_decades", t.maxDecades());
                o.put("worst_at", t.worst());
                o.put("pass", t.pass());
                temps.add(o);
            }
            Map<String, Object> lk = Json.object();
            lk.put("pass", v.pass());
            lk.put("temperatures", temps);
            lk.put("notes", List.copyOf(v.notes()));
            List<Object> pts = Json.array();
            for (LeakageVerification.Simulated s : v.points()) {
                Map<String, Object> o = Json.object();
                o.put("source", s.point().source() + ":" + s.point().line());
                o.put("temperature", s.point().temperature());
                o.put("voltage", s.point().voltage());
                o.put("measured_current", s.point().current());
                o.put("simulated_current", s.simulated());
                o.put("residual_decades", Math.log10(s.simulated() / s.point().current()));
                pts.add(o);
            }
            lk.put("points", pts);
            root.put("leakage", lk);
        });
        root.put("notes", List.copyOf(all.notes()));
        return Json.write(root);
    }

    private static Map<String, Object> capacitance(CapacitanceVerification v) {
        Map<String, Object> root = Json.object();
        root.put("model", v.cardName());
        root.put("engine", v.engine());
        root.put("pass", v.pass());
        root.put("stray_capacitance", v.strayCapacitance());
        root.put("frequency", v.frequency());
        Map<String, Object> tol = Json.object();
        tol.put("rms_percent", v.tolerance().rmsPercent());
        tol.put("max_percent", v.tolerance().maxPercent());
        root.put("tolerance", tol);
        List<Object> temps = Json.array();
        for (CapacitanceVerdict t : v.perTemperature()) {
            Map<String, Object> o = Json.object();
            o.put("temperature", t.temperature());
            o.put("points", t.points());
            o.put("rms_residual_percent", t.rmsPercent());
            o.put("max_residual_percent", t.maxPercent());
            o.put("worst_voltage", t.worstVoltage());
            o.put("worst_at", t.worstSource());
            o.put("pass", t.pass());
            noise(o, t.noise(), t.fixedPass());
            temps.add(o);
        }
        root.put("temperatures", temps);
        List<Object> pts = Json.array();
        for (CapacitanceResidual r : v.points()) {
            Map<String, Object> o = Json.object();
            o.put("source", r.point().where());
            o.put("temperature", r.point().temperature());
            o.put("voltage", r.point().voltage());
            o.put("measured_capacitance", r.point().capacitance());
            o.put("simulated_capacitance", r.simulated());
            o.put("residual_percent", r.residualPercent());
            pts.add(o);
        }
        root.put("points", pts);
        return root;
    }

    /** The noise-aware figures of one sweep (new keys beside the old ones). */
    private static void noise(Map<String, Object> o, org.cardwright.verify.DataUncertainty u, boolean fixedPass) {
        o.put("uncertainty", Double.isNaN(u.value()) ? null : u.value());
        o.put("uncertainty_source", u.source());
        o.put("rms_over_uncertainty", Double.isNaN(u.ratio()) ? null : u.ratio());
        o.put("rms_over_uncertainty_limit", Double.isNaN(u.limitRatio()) ? null : u.limitRatio());
        o.put("pass_uncertainty", u.pass());
        o.put("pass_fixed_limits", fixedPass);
    }

    /** One voltage-residual section. */
    public static Map<String, Object> section(Verification v) {
        Map<String, Object> root = Json.object();
        root.put("model", v.cardName());
        root.put("engine", v.engine());
        root.put("pass", v.pass());
        Map<String, Object> tol = Json.object();
        tol.put("rms", v.tolerance().rms());
        tol.put("max", v.tolerance().max());
        root.put("tolerance", tol);
        List<Object> temps = Json.array();
        for (TemperatureVerdict t : v.perTemperature()) {
            Map<String, Object> o = Json.object();
            o.put("temperature", t.temperature());
            o.put("points", t.points());
            o.put("rms_residual", t.rms());
            o.put("max_residual", t.max());
            o.put("worst_current", t.worstCurrent());
            o.put("worst_at", t.worstSource());
            o.put("pass", t.pass());
            o.put("points_with_stated_uncertainty", t.stated());
            o.put("beyond_three_sigma", t.beyondThree());
            noise(o, t.noise(), t.fixedPass());
            temps.add(o);
        }
        root.put("temperatures", temps);
        List<Object> pts = Json.array();
        for (PointResidual r : v.points()) {
            Map<String, Object> o = Json.object();
            o.put("source", r.point().source() + ":" + r.point().line());
            o.put("temperature", r.point().temperature());
            o.put("current", r.point().current());
            o.put("measured_voltage", r.point().voltage());
            o.put("simulated_voltage", r.simulated());
            o.put("residual", r.residual());
            if (!Double.isNaN(r.point().sigma())) {
                o.put("stated_sigma", r.point().sigma());
            }
            pts.add(o);
        }
        root.put("points", pts);
        root.put("notes", List.copyOf(v.notes()));
        return root;
    }
}
