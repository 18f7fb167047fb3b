package org.cardwright.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.lot.LotOutcome;
import org.cardwright.lot.LotStatistics;
import org.cardwright.lot.PartResult;
import org.cardwright.model.Param;
import org.cardwright.workflow.ToolVersion;

/**
 * The lot's page: one self-contained HTML file (no scripts, nothing fetched) with a histogram of every fitted
 * parameter in its space (parts in the statistics in grey, outliers in red, the mean and +-1 std marked), the
 * datasheet table, the failed parts and the outliers. Same outcome, same bytes.
 */
public final class LotHtml {
    private static final int W = 460;
    private static final int H = 200;
    private static final int PAD_L = 40;
    private static final int PAD_B = 34;
    private static final int PAD_T = 10;
    private static final int PAD_R = 12;

    private LotHtml() {
    }

    /** The page. */
    public static String write(LotOutcome o) {
        StringBuilder sb = new StringBuilder();
        sb.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>lot ")
                .append(esc(o.request().name())).append("</title>\n<style>\n")
                .append("body{margin:0;background:#eceae4;color:#23272b;font:15px/1.5 system-ui,sans-serif}\n")
                .append("main{max-width:1000px;margin:0 auto;padding:24px 30px;background:#fdfdfb}\n")
                .append("h2{font-size:19px;border-top:1px solid #d6d3c9;padding-top:10px}\n")
                .append("table{border-collapse:collapse;font-size:13px}td,th{border-bottom:1px solid #e2dfd6;padding:3px 9px;text-align:right}\n")
                .append("th:first-child,td:first-child{text-align:left}.grid{display:flex;flex-wrap:wrap;gap:14px}\n")
                .append("figure{margin:0}figcaption{font-size:13px;color:#5b6066}\n")
                .append("svg text{font-size:11px;fill:#23272b}.in{fill:#8d949b}.out{fill:#c0392b}.mean{stroke:#1f5f99;stroke-width:2}\n")
                .append(".sd{stroke:#1f5f99;stroke-dasharray:4 3}.axis{stroke:#23272b}\n")
                .append("</style></head><body><main>\n");
        long ok = o.parts().stream().filter(PartResult::ok).count();
        sb.append("<p>cardwright ").append(esc(ToolVersion.get())).append(" &middot; lot</p>\n<h1>").append(esc(o.request().name()))
                .append("</h1>\n<p>").append(o.parts().size()).append(" parts, ").append(ok).append(" fitted, ")
                .append(o.failed().size()).append(" failed, ").append(o.statistics().outliers().size()).append(" outliers; ")
                .append(o.statistics().inliers().size()).append(" in the statistics.</p>\n");
        sb.append("<h2>Distributions</h2>\n<div class=\"grid\">\n");
        for (Map.Entry<Param, LotStatistics.Summary> e : o.statistics().parameters().entrySet()) {
            sb.append(histogram(o, e.getKey(), e.getValue()));
        }
        sb.append("</div>\n<h2>Datasheet quantities</h2>\n<table><tr><th>quantity</th><th>condition</th><th>measured min</th>"
                + "<th>typ</th><th>max</th><th>parts' cards min</th><th>typ</th><th>max</th><th>typical card</th></tr>\n");
        for (LotOutcome.DatasheetRow r : o.datasheet()) {
            double[] m = sorted(r.measured());
            double[] c = sorted(r.cards());
            sb.append("<tr><td>").append(r.quantity().label()).append(" [").append(r.quantity().unit()).append("]</td><td>")
                    .append(r.quantity().conditionLabel()).append(" = ").append(g(r.condition())).append(' ')
                    .append(r.quantity().conditionUnit()).append("</td>")
                    .append(cells(m)).append(cells(c)).append("<td>")
                    .append(r.corners().containsKey("typical") ? g(r.corners().get("typical")) : "&ndash;").append("</td></tr>\n");
        }
        sb.append("</table>\n<h2>Failed parts</h2>\n");
        sb.append(o.failed().isEmpty() ? "<p>none</p>\n" : "<ul>\n");
        for (PartResult r : o.failed()) {
            sb.append("<li><b>").append(esc(r.part())).append("</b>: ").append(esc(r.reason())).append("</li>\n");
        }
        sb.append(o.failed().isEmpty() ? "" : "</ul>\n").append("<h2>Outliers</h2>\n");
        sb.append(o.statistics().outliers().isEmpty() ? "<p>none</p>\n" : "<ul>\n");
        for (Map.Entry<String, String> e : o.statistics().outliers().entrySet()) {
            sb.append("<li><b>").append(esc(e.getKey())).append("</b>: ").append(esc(e.getValue())).append("</li>\n");
        }
        sb.append(o.statistics().outliers().isEmpty() ? "" : "</ul>\n").append("</main></body></html>\n");
        return sb.toString();
    }

    /** One histogram: bins over all fitted values (sqrt(n) bins, 5 to 30; common practice, no source). */
    private static String histogram(LotOutcome o, Param p, LotStatistics.Summary s) {
        List<Double> in = new ArrayList<>();
        List<Double> out = new ArrayList<>();
        for (PartResult r : o.parts()) {
            if (r.ok() && r.fitted().contains(p)) {
                double x = LotStatistics.toSpace(p, r.values().get(p));
                (o.statistics().outliers().containsKey(r.part()) ? out : in).add(x);
            }
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double x : in) {
            lo = Math.min(lo, x);
            hi = Math.max(hi, x);
        }
        for (double x : out) {
            lo = Math.min(lo, x);
            hi = Math.max(hi, x);
        }
        if (!(hi > lo)) {
            hi = lo + 1e-12 + Math.abs(lo) * 1e-9;
        }
        int bins = Math.max(5, Math.min(30, (int) Math.round(Math.sqrt(in.size() + out.size()))));
        int[] nin = new int[bins];
        int[] nout = new int[bins];
        double width = (hi - lo) / bins;
        for (double x : in) {
            nin[Math.min(bins - 1, (int) ((x - lo) / width))]++;
        }
        for (double x : out) {
            nout[Math.min(bins - 1, (int) ((x - lo) / width))]++;
        }
        int max = 1;
        for (int i = 0; i < bins; i++) {
            max = Math.max(max, nin[i] + nout[i]);
        }
        double pw = W - PAD_L - PAD_R;
        double ph = H - PAD_T - PAD_B;
        StringBuilder sb = new StringBuilder();
        sb.append("<figure><svg xmlns=\"http://www.w3.org/2000/svg\" width=\"").append(W).append("\" height=\"").append(H)
                .append("\" viewBox=\"0 0 ").append(W).append(' ').append(H).append("\">\n");
        for (int i = 0; i < bins; i++) {
            double x = PAD_L + pw * i / bins;
            double bw = pw / bins - 1;
            double hIn = ph * nin[i] / max;
            double hOut = ph * nout[i] / max;
            if (nin[i] > 0) {
                sb.append(rect(x, PAD_T + ph - hIn, bw, hIn, "in"));
            }
            if (nout[i] > 0) {
                sb.append(rect(x, PAD_T + ph - hIn - hOut, bw, hOut, "out"));
            }
        }
        double finalLo = lo;
        double finalHi = hi;
        java.util.function.DoubleUnaryOperator xOf = v -> PAD_L + pw * (v - finalLo) / (finalHi - finalLo);
        for (double[] m : new double[][] {{s.mean(), 0}, {s.mean() - s.std(), 1}, {s.mean() + s.std(), 1}}) {
            double x = xOf.applyAsDouble(m[0]);
            if (x >= PAD_L && x <= PAD_L + pw) {
                sb.append(String.format(Locale.ROOT, "<line class=\"%s\" x1=\"%.1f\" y1=\"%d\" x2=\"%.1f\" y2=\"%.1f\"/>%n",
                        m[1] == 0 ? "mean" : "sd", x, PAD_T, x, PAD_T + ph));
            }
        }
        sb.append(String.format(Locale.ROOT, "<line class=\"axis\" x1=\"%d\" y1=\"%.1f\" x2=\"%.1f\" y2=\"%.1f\"/>%n",
                PAD_L, PAD_T + ph, PAD_L + pw, PAD_T + ph));
        sb.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%.1f\" text-anchor=\"start\">%s</text>%n", PAD_L, PAD_T + ph + 14, g(lo)));
        sb.append(String.format(Locale.ROOT, "<text x=\"%.1f\" y=\"%.1f\" text-anchor=\"end\">%s</text>%n", PAD_L + pw, PAD_T + ph + 14, g(hi)));
        sb.append(String.format(Locale.ROOT, "<text x=\"%.1f\" y=\"%.1f\" text-anchor=\"middle\">%s%s</text>%n", PAD_L + pw / 2, PAD_T + ph + 28,
                s.space().equals("log10") ? "log10 " : "", p.name() + (p.unit().isEmpty() ? "" : " [" + p.unit() + "]")));
        sb.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%d\" text-anchor=\"end\">%d</text>%n", PAD_L - 4, PAD_T + 10, max));
        sb.append("</svg><figcaption>").append(p.name()).append(": ").append(in.size()).append(" parts (grey), ")
                .append(out.size()).append(" outliers (red); mean ").append(g(s.mean())).append(", std ").append(g(s.std()))
                .append(" (").append(s.space()).append(")</figcaption></figure>\n");
        return sb.toString();
    }

    private static String rect(double x, double y, double w, double h, String cls) {
        return String.format(Locale.ROOT, "<rect class=\"%s\" x=\"%.1f\" y=\"%.1f\" width=\"%.1f\" height=\"%.1f\"/>%n", cls, x, y, w, h);
    }

    private static double[] sorted(double[] x) {
        double[] s = x.clone();
        java.util.Arrays.sort(s);
        return s;
    }

    private static String cells(double[] s) {
        if (s.length == 0) {
            return "<td>&ndash;</td><td>&ndash;</td><td>&ndash;</td>";
        }
        double typ = s.length % 2 == 1 ? s[s.length / 2] : 0.5 * (s[s.length / 2 - 1] + s[s.length / 2]);
        return "<td>" + g(s[0]) + "</td><td>" + g(typ) + "</td><td>" + g(s[s.length - 1]) + "</td>";
    }

    private static String g(double v) {
        return String.format(Locale.ROOT, "%.5g", v);
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }
}
