package org.cardwright.lot;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.cardwright.model.Param;

/** The per-part and statistics tables (CSV, numbers in Java's shortest round-trip form, {@code \n} line ends). */
public final class LotTables {
    private LotTables() {
    }

    /** part, status, each parameter [SI] and whether it was fitted, each datasheet quantity measured and from the card, reason. */
    static String parts(LotOutcome o) {
        Set<Param> params = EnumSet.noneOf(Param.class);
        for (PartResult r : o.parts()) {
            params.addAll(r.values().keySet());
        }
        List<Datasheet.Quantity> qs = new ArrayList<>(o.plan().conditions().keySet());
        StringBuilder sb = new StringBuilder("part,status");
        for (Param p : params) {
            sb.append(',').append(p.name()).append(" [").append(p.unit()).append("],").append(p.name()).append(" fitted");
        }
        for (Datasheet.Quantity q : qs) {
            sb.append(',').append(q.label()).append(" measured [").append(q.unit()).append("],")
                    .append(q.label()).append(" card [").append(q.unit()).append(']');
        }
        sb.append(",reason\n");
        Map<String, String> outliers = o.statistics().outliers();
        for (PartResult r : o.parts()) {
            sb.append(cell(r.part())).append(',').append(!r.ok() ? "failed" : outliers.containsKey(r.part()) ? "outlier" : "ok");
            for (Param p : params) {
                Double v = r.values().get(p);
                sb.append(',').append(v == null ? "" : Double.toString(v)).append(',')
                        .append(v == null ? "" : r.fitted().contains(p) ? "yes" : "no");
            }
            for (Datasheet.Quantity q : qs) {
                Double m = r.measured().get(q);
                Double c = r.card().get(q);
                sb.append(',').append(m == null ? "" : Double.toString(m)).append(',').append(c == null ? "" : Double.toString(c));
            }
            sb.append(',').append(cell(r.ok() ? outliers.getOrDefault(r.part(), "") : r.reason())).append('\n');
        }
        return sb.toString();
    }

    /** One row per parameter: space, n, mean, std, median, MAD, min, max (in the space), typical [SI]. */
    static String statistics(LotOutcome o) {
        StringBuilder sb = new StringBuilder("parameter,space,n,mean,std,median,mad,min,max,typical\n");
        for (Map.Entry<Param, LotStatistics.Summary> e : o.statistics().parameters().entrySet()) {
            LotStatistics.Summary s = e.getValue();
            sb.append(e.getKey().name()).append(',').append(s.space()).append(',').append(s.n()).append(',')
                    .append(s.mean()).append(',').append(s.std()).append(',').append(s.median()).append(',')
                    .append(s.mad()).append(',').append(s.min()).append(',').append(s.max()).append(',')
                    .append(s.typical()).append('\n');
        }
        return sb.toString();
    }

    /** A CSV cell: quoted when it holds a comma, a quote or a line break. */
    static String cell(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
