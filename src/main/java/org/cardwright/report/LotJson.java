package org.cardwright.report;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.cardwright.lot.LotCards;
import org.cardwright.lot.LotOutcome;
import org.cardwright.lot.LotStatistics;
import org.cardwright.lot.PartResult;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.workflow.ToolVersion;

/**
 * The lot's JSON (the contract in the README, "cardwright lot"): {@code failed}, {@code outliers},
 * {@code statistics} keyed by parameter with {@code mean}, {@code std} and {@code space}, {@code correlation} as
 * {@code {P: {Q: r}}}, and more. Byte-stable for the same input.
 */
public final class LotJson {
    private LotJson() {
    }

    /** The JSON text. */
    public static String write(LotOutcome o) {
        Map<String, Object> root = Json.object();
        root.put("name", o.request().name());
        root.put("tool", "cardwright " + ToolVersion.get());
        root.put("parts", o.parts().size());
        root.put("fitted", o.parts().stream().filter(PartResult::ok).count());
        root.put("inStatistics", o.statistics().inliers().size());
        List<Object> failed = Json.array();
        for (PartResult r : o.failed()) {
            Map<String, Object> f = Json.object();
            f.put("part", r.part());
            f.put("reason", r.reason());
            failed.add(f);
        }
        root.put("failed", failed);
        List<Object> outliers = Json.array();
        outliers.addAll(o.statistics().outliers().keySet());
        root.put("outliers", outliers);
        Map<String, Object> why = Json.object();
        why.putAll(o.statistics().outliers());
        root.put("outlierReasons", why);
        root.put("outlierRule", "modified z-score 0.6745 (x - median) / MAD of any fitted parameter in its space beyond "
                + LotStatistics.OUTLIER_LIMIT + " (Iglewicz and Hoaglin 1993)");
        List<Object> terms = Json.array();
        terms.addAll(o.plan().rules().stream().map(org.cardwright.fit.ParameterRule::text).toList());
        root.put("terms", terms);
        List<Object> termReasons = Json.array();
        termReasons.addAll(o.plan().reasons());
        root.put("termReasons", termReasons);

        Map<String, Object> stats = Json.object();
        for (Map.Entry<Param, LotStatistics.Summary> e : o.statistics().parameters().entrySet()) {
            LotStatistics.Summary s = e.getValue();
            Map<String, Object> m = Json.object();
            m.put("mean", s.mean());
            m.put("std", s.std());
            m.put("space", s.space());
            m.put("n", s.n());
            m.put("median", s.median());
            m.put("mad", s.mad());
            m.put("madSigma", s.mad() * LotStatistics.MAD_TO_SIGMA);
            m.put("min", s.min());
            m.put("max", s.max());
            m.put("typical", s.typical());
            stats.put(e.getKey().name(), m);
        }
        root.put("statistics", stats);
        List<Param> common = o.statistics().common();
        Map<String, Object> corr = Json.object();
        for (int i = 0; i < common.size(); i++) {
            Map<String, Object> row = Json.object();
            for (int j = 0; j < common.size(); j++) {
                row.put(common.get(j).name(), o.statistics().correlation()[i][j]);
            }
            corr.put(common.get(i).name(), row);
        }
        root.put("correlation", corr);
        List<Object> pcs = Json.array();
        double total = Arrays.stream(o.statistics().components().values()).map(v -> Math.max(0, v)).sum();
        for (int c = 0; c < common.size(); c++) {
            Map<String, Object> pc = Json.object();
            double v = o.statistics().components().values()[c];
            pc.put("eigenvalue", v);
            pc.put("share", total > 0 ? Math.max(0, v) / total : Double.NaN);
            Map<String, Object> dir = Json.object();
            for (int i = 0; i < common.size(); i++) {
                dir.put(common.get(i).name(), o.statistics().components().vectors()[i][c]);
            }
            pc.put("direction", dir);
            pcs.add(pc);
        }
        root.put("principalComponents", pcs);

        Map<String, Object> ds = Json.object();
        ds.put("temperature", o.plan().temperature() - Ngspice39.CELSIUS_TO_KELVIN);
        List<Object> rows = Json.array();
        for (LotOutcome.DatasheetRow r : o.datasheet()) {
            Map<String, Object> m = Json.object();
            m.put("quantity", r.quantity().label());
            m.put("unit", r.quantity().unit());
            m.put(r.quantity().conditionLabel(), r.condition());
            m.put("measured", spread(r.measured()));
            m.put("cards", spread(r.cards()));
            Map<String, Object> corners = Json.object();
            corners.putAll(r.corners());
            m.put("lotCards", corners);
            rows.add(m);
        }
        ds.put("quantities", rows);
        root.put("datasheet", ds);
        root.put("cornerSigma", o.request().cornerSigma());
        Map<String, Object> cards = Json.object();
        for (LotCards.Corner c : o.corners()) {
            Map<String, Object> m = Json.object();
            m.put("model", c.modelName());
            Map<String, Object> values = Json.object();
            for (Map.Entry<Param, Double> e : c.parameters().givenValues().entrySet()) {
                values.put(e.getKey().name(), e.getKey().toCardValue(e.getValue()));
            }
            m.put("parameters", values);
            cards.put(c.suffix(), m);
        }
        root.put("lotCards", cards);
        List<Object> files = Json.array();
        files.addAll(o.cards().stream().map(p -> p.getFileName().toString()).toList());
        root.put("cardFiles", files);
        Map<String, Object> partCards = Json.object();
        boolean written = o.request().writesPartCards(o.parts().size());
        partCards.put("rule", o.request().partCards().name().toLowerCase(java.util.Locale.ROOT));
        partCards.put("written", written);
        partCards.put("folder", written ? o.request().partCardDir().getFileName().toString() : null);
        partCards.put("cards", written ? o.parts().stream().filter(PartResult::ok).count() * o.request().dialects().size() : 0);
        root.put("partCards", partCards);
        return Json.write(root);
    }

    private static Map<String, Object> spread(double[] x) {
        Map<String, Object> m = Json.object();
        m.put("n", x.length);
        if (x.length > 0) {
            double[] s = x.clone();
            Arrays.sort(s);
            double mean = Arrays.stream(x).sum() / x.length;
            double ss = 0;
            for (double v : x) {
                ss += (v - mean) * (v - mean);
            }
            m.put("min", s[0]);
            m.put("typ", org.cardwright.fit.Medians.median(s));
            m.put("max", s[s.length - 1]);
            m.put("mean", mean);
            m.put("std", x.length > 1 ? Math.sqrt(ss / (x.length - 1)) : Double.NaN);
        }
        return m;
    }

}
