package org.cardwright.report;

import java.util.Locale;
import java.util.Map;
import org.cardwright.lot.LotOutcome;
import org.cardwright.lot.LotStatistics;
import org.cardwright.lot.PartResult;
import org.cardwright.model.Param;

/** The terminal summary of a lot run. */
public final class LotText {
    private LotText() {
    }

    /** A few lines: counts, failures, outliers, the statistics, the datasheet table and the files. */
    public static String render(LotOutcome o) {
        StringBuilder sb = new StringBuilder();
        long ok = o.parts().stream().filter(PartResult::ok).count();
        sb.append(String.format(Locale.ROOT, "lot %s: %d parts, %d fitted, %d failed, %d outliers; %d in the statistics (%.1f s%s)%n",
                o.request().name(), o.parts().size(), ok, o.failed().size(), o.statistics().outliers().size(),
                o.statistics().inliers().size(), o.seconds(), o.reused() > 0 ? ", " + o.reused() + " parts kept from an earlier run" : ""));
        for (String r : o.plan().reasons()) {
            sb.append("  term ").append(r).append(System.lineSeparator());
        }
        for (PartResult r : o.failed()) {
            sb.append("  failed  ").append(r.part()).append(": ").append(r.reason()).append(System.lineSeparator());
        }
        for (Map.Entry<String, String> e : o.statistics().outliers().entrySet()) {
            sb.append("  outlier ").append(e.getKey()).append(": ").append(e.getValue()).append(System.lineSeparator());
        }
        sb.append(String.format(Locale.ROOT, "  %-6s %-7s %5s %12s %12s %12s %12s%n", "param", "space", "n", "mean", "std", "median", "MAD*1.4826"));
        for (Map.Entry<Param, LotStatistics.Summary> e : o.statistics().parameters().entrySet()) {
            LotStatistics.Summary s = e.getValue();
            sb.append(String.format(Locale.ROOT, "  %-6s %-7s %5d %12.5g %12.4g %12.5g %12.4g%n", e.getKey().name(), s.space(), s.n(),
                    s.mean(), s.std(), s.median(), s.mad() * LotStatistics.MAD_TO_SIGMA));
        }
        for (LotOutcome.DatasheetRow r : o.datasheet()) {
            if (r.measured().length == 0) {
                continue;
            }
            double[] m = r.measured().clone();
            java.util.Arrays.sort(m);
            Double typ = r.corners().get("typical");
            sb.append(String.format(Locale.ROOT, "  %s at %s = %.4g %s: measured min %.5g typ %.5g max %.5g %s (%d parts); typical card %s%n",
                    r.quantity().label(), r.quantity().conditionLabel(), r.condition(), r.quantity().conditionUnit(),
                    m[0], m[m.length / 2], m[m.length - 1], r.quantity().unit(), m.length,
                    typ == null ? "-" : String.format(Locale.ROOT, "%.5g %s", typ, r.quantity().unit())));
        }
        for (java.nio.file.Path p : o.cards()) {
            sb.append("  wrote ").append(p).append(System.lineSeparator());
        }
        sb.append("  wrote ").append(o.request().json()).append(", ").append(o.request().html().getFileName())
                .append(", ").append(o.request().partsCsv().getFileName()).append(", ").append(o.request().statisticsCsv().getFileName())
                .append(System.lineSeparator());
        return sb.toString();
    }
}
