package org.cardwright.report;

import java.util.List;
import java.util.Map;
import org.cardwright.data.MeasurementFile;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.FittedParameter;
import org.cardwright.fit.KindResiduals;
import org.cardwright.fit.SweepResiduals;
import org.cardwright.fit.TermDecision;
import org.cardwright.workflow.FitOutcome;
import org.cardwright.workflow.Inputs;
import org.cardwright.workflow.ToolVersion;

/**
 * The machine-readable fit result (docs/formats.md). Stable keys, extended freely: {@code parameters} is an
 * object keyed by the upper-case SPICE name, each with {@code value} (SI units), {@code fixed} and, where known,
 * {@code stderr}.
 */
public final class FitJson {
    private FitJson() {
    }

    /** The JSON text for a fit job. */
    public static String write(String name, FitOutcome outcome) {
        Map<String, Object> root = Json.object();
        root.put("tool", "cardwright " + ToolVersion.get());
        root.put("model", name);
        root.put("parameters", parameters(outcome.fit()));
        root.put("fit", statistics(outcome.fit()));
        List<Object> cards = Json.array();
        for (FitOutcome.WrittenCard c : outcome.cards()) {
            Map<String, Object> o = Json.object();
            o.put("dialect", c.dialect().shortName());
            o.put("file", c.file().toString().replace('\\', '/'));
            o.put("left_out", c.leftOut().stream().map(p -> (Object) p.keyword()).toList());
            c.refit().ifPresent(r -> {
                o.put("parameters", parameters(r));
                o.put("worst_rms_residual", r.worstRms());
            });
            cards.add(o);
        }
        root.put("cards", cards);
        List<Object> inputs = Json.array();
        for (MeasurementFile f : outcome.inputs().files()) {
            Map<String, Object> o = Json.object();
            o.put("file", Inputs.displayName(f.file()));
            o.put("sha256", f.sha256());
            o.put("kind", f.kind().name());
            o.put("points", f.iv().size() + f.cv().size());
            inputs.add(o);
        }
        for (org.cardwright.data.RecoveryReader.Records f : outcome.inputs().recovery()) {
            Map<String, Object> o = Json.object();
            o.put("file", Inputs.displayName(f.file()));
            o.put("sha256", f.sha256());
            o.put("kind", "RECOVERY");
            o.put("points", f.records().size());
            inputs.add(o);
        }
        root.put("inputs", inputs);
        root.put("notes", List.copyOf(outcome.inputs().notes()));
        return Json.write(root);
    }

    /** The {@code parameters} object of one result. */
    public static Map<String, Object> parameters(FitResult r) {
        Map<String, Object> out = Json.object();
        for (FittedParameter p : r.fitted()) {
            Map<String, Object> o = Json.object();
            o.put("value", p.value());
            o.put("fixed", !p.fitted());
            if (Double.isFinite(p.standardError())) {
                o.put("stderr", p.standardError());
            }
            o.put("origin", p.origin().name().toLowerCase(java.util.Locale.ROOT));
            o.put("unit", p.param().unit());
            out.put(p.param().keyword(), o);
        }
        return out;
    }

    private static Map<String, Object> statistics(FitResult r) {
        Map<String, Object> o = Json.object();
        o.put("points", r.points());
        o.put("degrees_of_freedom", r.degreesOfFreedom());
        o.put("chi_square", r.chiSquare());
        o.put("reduced_chi_square", r.reducedChiSquare());
        o.put("evaluations", r.evaluations());
        o.put("iterations", r.iterations());
        o.put("stop_reason", r.stopReason());
        List<Object> res = Json.array();
        for (SweepResiduals s : r.residuals()) {
            Map<String, Object> t = Json.object();
            t.put("temperature", s.temperature());
            t.put("points", s.points());
            t.put("low_current", s.lowCurrent());
            t.put("high_current", s.highCurrent());
            t.put("rms_residual", s.rms());
            t.put("max_residual", s.max());
            t.put("worst_current", s.worstCurrent());
            res.add(t);
        }
        o.put("residuals", res);
        List<Object> other = Json.array();
        for (KindResiduals k : r.otherResiduals()) {
            Map<String, Object> t = Json.object();
            t.put("kind", k.kind());
            t.put("temperature", k.temperature());
            t.put("points", k.points());
            t.put("rms_residual", k.rms());
            t.put("max_residual", k.max());
            t.put("unit", k.unit());
            t.put("worst_at", k.worst());
            other.add(t);
        }
        o.put("other_residuals", other);
        List<Object> terms = Json.array();
        for (TermDecision d : r.terms()) {
            Map<String, Object> t = Json.object();
            t.put("term", d.term());
            t.put("parameters", d.params().stream().map(p -> (Object) p.keyword()).toList());
            t.put("included", d.included());
            t.put("delta_bic", d.deltaBic());
            t.put("reason", d.reason());
            terms.add(t);
        }
        o.put("terms", terms);
        r.shunt().ifPresent(sh -> {
            Map<String, Object> t = Json.object();
            t.put("resistance", sh.resistance());
            if (Double.isFinite(sh.standardError())) {
                t.put("stderr", sh.standardError());
            }
            t.put("unit", "ohm");
            o.put("shunt", t);
        });
        Map<String, Object> corr = Json.object();
        var order = r.correlations().order();
        for (int i = 0; i < order.size(); i++) {
            for (int j = i + 1; j < order.size(); j++) {
                corr.put(order.get(i).keyword() + "," + order.get(j).keyword(), r.correlations().matrix()[i][j]);
            }
        }
        o.put("correlations", corr);
        o.put("warnings", List.copyOf(r.warnings()));
        return o;
    }
}
