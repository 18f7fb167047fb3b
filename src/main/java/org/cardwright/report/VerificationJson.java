package org.cardwright.report;

import java.util.List;
import java.util.Map;
import org.cardwright.verify.PointResidual;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;
import org.cardwright.workflow.ToolVersion;

/** The machine-readable verification result (docs/formats.md). */
public final class VerificationJson {
    private VerificationJson() {
    }

    /** The JSON text of a verification. */
    public static String write(Verification v, String cardFile) {
        Map<String, Object> root = Json.object();
        root.put("tool", "cardwright " + ToolVersion.get());
        root.put("card", cardFile);
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
            pts.add(o);
        }
        root.put("points", pts);
        root.put("notes", List.copyOf(v.notes()));
        return Json.write(root);
    }
}
