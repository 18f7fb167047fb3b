package org.cardwright.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.lot.LotCurves;
import org.cardwright.lot.LotOutcome;
import org.cardwright.lot.LotStatistics;
import org.cardwright.lot.PartResult;
import org.cardwright.model.Param;
import org.cardwright.workflow.ToolVersion;

/**
 * The lot's page: one self-contained HTML file (no scripts, nothing fetched) with a histogram of every fitted
 * parameter in its space (parts in the statistics in grey, outliers in red, the mean and +-1 std marked), a scatter
 * matrix of the main parameters, the typical and forward-voltage corner cards drawn on the measured forward curves
 * of a sample of the parts, the datasheet table, the failed parts and the outliers. Same outcome, same bytes.
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
                .append("svg.hist text{font-size:11px;fill:#23272b}.in{fill:#8d949b}.out{fill:#c0392b}.mean{stroke:#1f5f99;stroke-width:2}\n")
                .append("svg.plot{display:block;width:100%;max-width:100%;height:auto;font:13px system-ui,sans-serif}\n")
                .append("svg.plot text{fill:#33383d}svg .area{fill:#fff;stroke:#8b9095}svg .grid line{stroke:#ebe8e0}\n")
                .append("svg .ticks line{stroke:#8b9095}svg .axis-label{font-size:14px}svg .key{fill:#5b6066}\n")
                .append("svg .series polyline{fill:none;stroke-width:1.8}svg path.marker{fill:none;stroke-width:1.5}\n")
                .append("svg .legend line{stroke-width:1.8}svg .series[data-series=measured] polyline{stroke-width:0.8;stroke-opacity:0.55}\n")
                .append("svg .series[data-series=outliers] polyline{stroke-width:1;stroke-opacity:0.8}\n")
                .append("svg.scatter circle.in{fill:#8d949b;fill-opacity:0.7}svg.scatter circle.out{fill:#c0392b}\n")
                .append("figure.scatter{max-width:")
                .append(SCATTER_MAX_WIDTH).append("px}svg.scatter .cell{fill:#fff;stroke:#8b9095}svg.scatter .name{font-size:15px;font-weight:600}\n")
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
        sb.append("</div>\n");
        sb.append(scatterMatrix(o));
        sb.append(cornerCurves(o));
        sb.append("<h2>Datasheet quantities</h2>\n<table><tr><th>quantity</th><th>condition</th><th>measured min</th>"
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
        sb.append("<figure><svg xmlns=\"http://www.w3.org/2000/svg\" class=\"hist\" width=\"").append(W).append("\" height=\"").append(H)
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

    /** Parameters the scatter matrix shows at most: the first of those every part fitted, in parameter order [1]. */
    static final int SCATTER_PARAMETERS = 5;
    /** Parts drawn in each scatter cell at most, spread evenly over the lot, so a huge lot keeps a small page [1]. */
    static final int SCATTER_PARTS = 400;
    private static final int CELL = 150;
    /** The scatter matrix is drawn at most this wide, so a few parameters do not make it a screen tall [px]. */
    private static final int SCATTER_MAX_WIDTH = 720;
    private static final int S_LEFT = 70;
    private static final int S_BOTTOM = 56;
    private static final int S_TOP = 8;
    private static final int S_RIGHT = 12;

    /**
     * The scatter matrix: below the diagonal each pair of parameters (in their spaces) with the parts in the
     * statistics in grey and outliers in red (an outlier beyond the frame sits on its edge), above it the pair's
     * correlation coefficient, on the diagonal the parameter's name.
     */
    private static String scatterMatrix(LotOutcome o) {
        List<Param> params = o.statistics().common();
        if (params.size() < 2) {
            return "";
        }
        params = params.subList(0, Math.min(SCATTER_PARAMETERS, params.size()));
        int k = params.size();
        List<PartResult> in = spread(o.statistics().inliers(), SCATTER_PARTS);
        List<PartResult> out = new ArrayList<>();
        for (PartResult r : o.parts()) {
            if (r.ok() && o.statistics().outliers().containsKey(r.part())) {
                out.add(r);
            }
        }
        out = spread(out, SCATTER_PARTS);
        double[] lo = new double[k];
        double[] hi = new double[k];
        for (int a = 0; a < k; a++) {
            LotStatistics.Summary s = o.statistics().parameters().get(params.get(a));
            double pad = 0.05 * (s.max() - s.min());
            if (!(pad > 0)) {
                pad = 1e-9 + Math.abs(s.mean()) * 1e-6;
            }
            lo[a] = s.min() - pad;
            hi[a] = s.max() + pad;
        }
        int w = S_LEFT + k * CELL + S_RIGHT;
        int h = S_TOP + k * CELL + S_BOTTOM;
        StringBuilder sb = new StringBuilder();
        sb.append("<h2>Scatter matrix</h2>\n<figure class=\"scatter\"><svg xmlns=\"http://www.w3.org/2000/svg\" class=\"plot scatter\" id=\"scatter-matrix\"")
                .append(" viewBox=\"0 0 ").append(w).append(' ').append(h).append("\" width=\"100%\" preserveAspectRatio=\"xMinYMin meet\"")
                .append(" role=\"img\" aria-label=\"scatter matrix of the lot's main parameters\">\n");
        for (int row = 0; row < k; row++) {
            for (int col = 0; col < k; col++) {
                double x0 = S_LEFT + col * CELL;
                double y0 = S_TOP + row * CELL;
                sb.append(String.format(Locale.ROOT, "<rect class=\"cell\" x=\"%.1f\" y=\"%.1f\" width=\"%d\" height=\"%d\"/>%n", x0, y0, CELL, CELL));
                Param px = params.get(col);
                Param py = params.get(row);
                if (row == col) {
                    sb.append(String.format(Locale.ROOT, "<text class=\"name\" x=\"%.1f\" y=\"%.1f\" text-anchor=\"middle\">%s</text>%n",
                            x0 + CELL / 2.0, y0 + CELL / 2.0, esc(axisName(px))));
                } else if (row < col) {
                    int i = o.statistics().common().indexOf(py);
                    int j = o.statistics().common().indexOf(px);
                    sb.append(String.format(Locale.ROOT, "<text class=\"corr\" data-pair=\"%s-%s\" x=\"%.1f\" y=\"%.1f\" text-anchor=\"middle\">r = %.2f</text>%n",
                            py.name(), px.name(), x0 + CELL / 2.0, y0 + CELL / 2.0 + 5, o.statistics().correlation()[i][j]));
                } else {
                    sb.append("<g data-pair=\"").append(py.name()).append('-').append(px.name()).append("\">");
                    for (int pass = 0; pass < 2; pass++) {
                        for (PartResult r : pass == 0 ? in : out) {
                            if (!r.fitted().contains(px) || !r.fitted().contains(py)) {
                                continue;
                            }
                            double fx = (LotStatistics.toSpace(px, r.values().get(px)) - lo[col]) / (hi[col] - lo[col]);
                            double fy = (LotStatistics.toSpace(py, r.values().get(py)) - lo[row]) / (hi[row] - lo[row]);
                            fx = Math.max(0, Math.min(1, fx));
                            fy = Math.max(0, Math.min(1, fy));
                            sb.append(String.format(Locale.ROOT, "<circle class=\"%s\" cx=\"%.1f\" cy=\"%.1f\" r=\"%s\"/>",
                                    pass == 0 ? "in" : "out", x0 + fx * CELL, y0 + (1 - fy) * CELL, pass == 0 ? "2" : "3"));
                        }
                    }
                    sb.append("</g>\n");
                }
            }
        }
        double bottom = S_TOP + k * CELL;
        for (int a = 0; a < k; a++) {
            double x0 = S_LEFT + a * CELL;
            sb.append(String.format(Locale.ROOT, "<text x=\"%.1f\" y=\"%.1f\" text-anchor=\"start\">%s</text>", x0 + 2, bottom + 16, g3(lo[a])));
            sb.append(String.format(Locale.ROOT, "<text x=\"%.1f\" y=\"%.1f\" text-anchor=\"end\">%s</text>", x0 + CELL - 2, bottom + 34, g3(hi[a])));
            double y0 = S_TOP + a * CELL;
            sb.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%.1f\" text-anchor=\"end\">%s</text>", S_LEFT - 4, y0 + CELL - 2, g3(lo[a])));
            sb.append(String.format(Locale.ROOT, "<text x=\"%d\" y=\"%.1f\" text-anchor=\"end\">%s</text>%n", S_LEFT - 4, y0 + 13, g3(hi[a])));
        }
        sb.append("</svg><figcaption>Each pair of the main parameters (in their spaces: log10 for IS, CJO, ...), ")
                .append(in.size()).append(" parts in the statistics (grey)");
        if (in.size() < o.statistics().inliers().size()) {
            sb.append(", spread evenly over all ").append(o.statistics().inliers().size());
        }
        sb.append(", ").append(out.size()).append(" outliers (red, on the frame when beyond it); above the diagonal the correlation coefficient")
                .append(" over the parts in the statistics. Each axis runs from the lowest to the highest value in the statistics, 5 % padded.</figcaption></figure>\n");
        return sb.toString();
    }

    /** The typical and forward-voltage corner cards over the measured forward curves of a sample of the parts. */
    private static String cornerCurves(LotOutcome o) {
        LotCurves.Curves c = o.curves();
        if (c == null || c.isEmpty()) {
            return "";
        }
        double vmin = Double.POSITIVE_INFINITY;
        double vmax = Double.NEGATIVE_INFINITY;
        for (Map<String, double[]> m : List.of(c.inliers(), c.outliers(), c.corners())) {
            for (double[] v : m.values()) {
                for (double x : v) {
                    if (Double.isFinite(x)) {
                        vmin = Math.min(vmin, x);
                        vmax = Math.max(vmax, x);
                    }
                }
            }
        }
        double[] i = c.currents();
        SvgPlot plot = new SvgPlot("lot-corners", SvgPlot.Kind.CURVE, "forward voltage of the lot's parts and of its corner cards",
                PlotAxis.linear(vmin, vmax, "forward voltage VF [V]"), PlotAxis.log(i[0], i[i.length - 1], "forward current IF", "A"));
        plot.add(new SvgPlot.Series(c.inliers().size() + " parts, measured", "measured", "#8d949b", SvgPlot.Shape.CIRCLE, List.of(), joined(c.inliers(), i)));
        if (!c.outliers().isEmpty()) {
            plot.add(new SvgPlot.Series(c.outliers().size() + " outliers, measured", "outliers", "#c0392b", SvgPlot.Shape.CROSS, List.of(),
                    joined(c.outliers(), i)));
        }
        String[] colours = {"#1f5f99", "#2e7d4f", "#a8560c"};
        SvgPlot.Shape[] shapes = {SvgPlot.Shape.SQUARE, SvgPlot.Shape.TRIANGLE_DOWN, SvgPlot.Shape.TRIANGLE};
        int n = 0;
        for (Map.Entry<String, double[]> e : c.corners().entrySet()) {
            plot.add(new SvgPlot.Series(e.getKey() + " card", e.getKey(), colours[n % 3], shapes[n % 3], List.of(),
                    joined(Map.of(e.getKey(), e.getValue()), i)));
            n++;
        }
        int all = o.statistics().inliers().size();
        return "<h2>Corner cards on the measured curves</h2>\n<figure>" + plot.render() + "<figcaption>Forward current against forward voltage at "
                + plain(o.plan().temperature() - 273.15) + " &deg;C: the measured curves of " + c.inliers().size() + " of the " + all
                + " parts in the statistics (grey, spread evenly over them), " + c.outliers().size()
                + " outliers (red), and the typical card with the forward-voltage corners at " + plain(o.request().cornerSigma())
                + " sigma (cards computed with the ngspice 39 equations), which bound the spread to first order at the datasheet current.</figcaption></figure>\n";
    }

    /** Every curve's (V, I) points in one line, broken between curves and where a curve has no value. */
    private static List<double[]> joined(Map<String, double[]> curves, double[] currents) {
        List<double[]> line = new ArrayList<>();
        for (double[] v : curves.values()) {
            for (int k = 0; k < currents.length; k++) {
                line.add(new double[] {v[k], currents[k]});
            }
            line.add(new double[] {Double.NaN, Double.NaN});
        }
        return line;
    }

    private static <T> List<T> spread(List<T> items, int max) {
        if (items.size() <= max) {
            return items;
        }
        List<T> out = new ArrayList<>();
        for (int i = 0; i < max; i++) {
            out.add(items.get((int) Math.round(i * (items.size() - 1) / (double) (max - 1))));
        }
        return out;
    }

    private static String axisName(Param p) {
        return (LotStatistics.space(p).equals("log10") ? "log10 " : "") + p.name() + (p.unit().isEmpty() ? "" : " [" + p.unit() + "]");
    }

    /** A number in at most 4 significant digits, without trailing zeros. */
    private static String plain(double v) {
        return new java.math.BigDecimal(String.format(Locale.ROOT, "%.4g", v)).stripTrailingZeros().toPlainString();
    }

    private static String g3(double v) {
        return String.format(Locale.ROOT, "%.3g", v);
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
        double typ = org.cardwright.fit.Medians.median(s);
        return "<td>" + g(s[0]) + "</td><td>" + g(typ) + "</td><td>" + g(s[s.length - 1]) + "</td>";
    }

    private static String g(double v) {
        return String.format(Locale.ROOT, "%.5g", v);
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }
}
