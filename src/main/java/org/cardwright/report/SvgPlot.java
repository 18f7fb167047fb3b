package org.cardwright.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * One inline SVG plot drawn by hand: a framed area with grid, tick labels and axis labels, one group per series
 * (a polyline, broken where a point is missing, and open circle markers with a hover title each), dashed
 * horizontal limit lines and a legend to the right. The output is well-formed XML and depends only on what was
 * added, in the order it was added.
 */
final class SvgPlot {
    /** Drawing size [px]. */
    static final int WIDTH = 760;
    /** Drawing size [px]. */
    static final int HEIGHT = 340;
    private static final int LEFT = 74;
    private static final int RIGHT = 176;
    private static final int TOP = 14;
    private static final int BOTTOM = 50;
    private static final double MARKER_RADIUS = 3.0;

    /** What a plot shows; written as a CSS class so the page can style the two kinds apart. */
    enum Kind {
        /** Measured points and the card's simulation. */
        CURVE("curve"),
        /** Residuals against limits. */
        RESIDUALS("residuals");

        private final String cssClass;

        Kind(String cssClass) {
            this.cssClass = cssClass;
        }
    }

    /**
     * A point to mark.
     *
     * @param x     along the x axis, in its unit
     * @param y     along the y axis, in its unit
     * @param title hover text
     */
    record Marker(double x, double y, String title) {
    }

    /**
     * One data series, drawn in one colour.
     *
     * @param name    legend text
     * @param key     stable identifier written as the group's data-series attribute
     * @param colour  CSS colour
     * @param markers measured points
     * @param line    points joined in the given order, each {x, y}; a point with NaN breaks the line; may be empty
     */
    record Series(String name, String key, String colour, List<Marker> markers, List<double[]> line) {
        Series {
            markers = List.copyOf(markers);
            line = List.copyOf(line);
        }
    }

    /**
     * A horizontal reference line.
     *
     * @param y     where, in the y axis's unit
     * @param kind  CSS class suffix: "rms" or "max"
     * @param label legend text; empty to leave it out of the legend (e.g. the negative twin of a limit)
     */
    record Level(double y, String kind, String label) {
    }

    private final String id;
    private final Kind kind;
    private final String title;
    private final PlotAxis x;
    private final PlotAxis y;
    private final List<Series> series = new ArrayList<>();
    private final List<Level> levels = new ArrayList<>();
    private final List<String> key = new ArrayList<>();
    private boolean zeroLine;

    /**
     * @param id    identifier unique within the page (used for the clip path)
     * @param kind  what it shows
     * @param title what the plot shows, for screen readers
     * @param x     horizontal axis
     * @param y     vertical axis
     */
    SvgPlot(String id, Kind kind, String title, PlotAxis x, PlotAxis y) {
        this.id = id;
        this.kind = kind;
        this.title = title;
        this.x = x;
        this.y = y;
    }

    SvgPlot add(Series s) {
        series.add(s);
        return this;
    }

    SvgPlot level(Level l) {
        levels.add(l);
        return this;
    }

    /** Draws a thin solid line at y = 0. */
    SvgPlot zeroLine() {
        zeroLine = true;
        return this;
    }

    /** Adds a legend line explaining the marker and line styles, e.g. "markers: measured". */
    SvgPlot explain(String text) {
        key.add(text);
        return this;
    }

    private double px(double v) {
        return LEFT + x.fraction(v) * (WIDTH - LEFT - RIGHT);
    }

    private double py(double v) {
        return HEIGHT - BOTTOM - y.fraction(v) * (HEIGHT - TOP - BOTTOM);
    }

    /** The {@code <svg>} element. */
    String render() {
        StringBuilder sb = new StringBuilder();
        double right = WIDTH - RIGHT;
        double bottom = HEIGHT - BOTTOM;
        sb.append("<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"plot ").append(kind.cssClass)
                .append("\" id=\"").append(Markup.escape(id))
                .append("\" viewBox=\"0 0 ").append(WIDTH).append(' ').append(HEIGHT).append("\" width=\"").append(WIDTH)
                .append("\" height=\"").append(HEIGHT).append("\" role=\"img\" aria-label=\"").append(Markup.escape(title))
                .append("\">\n");
        sb.append("<defs><clipPath id=\"").append(Markup.escape(id)).append("-area\"><rect x=\"").append(LEFT)
                .append("\" y=\"").append(TOP).append("\" width=\"").append(WIDTH - LEFT - RIGHT).append("\" height=\"")
                .append(HEIGHT - TOP - BOTTOM).append("\"/></clipPath></defs>\n");
        sb.append("<rect class=\"area\" x=\"").append(LEFT).append("\" y=\"").append(TOP).append("\" width=\"")
                .append(WIDTH - LEFT - RIGHT).append("\" height=\"").append(HEIGHT - TOP - BOTTOM).append("\"/>\n");
        // grid and ticks
        sb.append("<g class=\"grid\">");
        for (PlotAxis.Tick t : x.ticks()) {
            double p = px(t.value());
            if (t.major()) {
                sb.append(line(p, TOP, p, bottom, null));
            }
        }
        for (PlotAxis.Tick t : y.ticks()) {
            double p = py(t.value());
            if (t.major()) {
                sb.append(line(LEFT, p, right, p, null));
            }
        }
        sb.append("</g>\n<g class=\"ticks\">");
        for (PlotAxis.Tick t : x.ticks()) {
            double p = px(t.value());
            sb.append(line(p, bottom, p, bottom + (t.major() ? 5 : 3), null));
            if (!t.label().isEmpty()) {
                sb.append(text(p, bottom + 18, "middle", t.label()));
            }
        }
        for (PlotAxis.Tick t : y.ticks()) {
            double p = py(t.value());
            sb.append(line(LEFT - (t.major() ? 5 : 3), p, LEFT, p, null));
            if (!t.label().isEmpty()) {
                sb.append(text(LEFT - 8, p + 4, "end", t.label()));
            }
        }
        sb.append("</g>\n");
        sb.append("<text class=\"axis-label\" x=\"").append(n((LEFT + right) / 2)).append("\" y=\"").append(HEIGHT - 10)
                .append("\" text-anchor=\"middle\">").append(Markup.escape(x.label())).append("</text>\n");
        double midY = (TOP + bottom) / 2;
        sb.append("<text class=\"axis-label\" x=\"16\" y=\"").append(n(midY))
                .append("\" text-anchor=\"middle\" transform=\"rotate(-90 16 ")
                .append(n(midY)).append(")\">").append(Markup.escape(y.label())).append("</text>\n");
        // data, clipped to the frame
        sb.append("<g clip-path=\"url(#").append(Markup.escape(id)).append("-area)\">\n");
        if (zeroLine && y.accepts(0) && y.low() <= 0 && y.high() >= 0) {
            sb.append(line(LEFT, py(0), right, py(0), "zero")).append('\n');
        }
        for (Level l : levels) {
            sb.append(line(LEFT, py(l.y()), right, py(l.y()), "limit " + l.kind())).append('\n');
        }
        for (Series s : series) {
            sb.append("<g class=\"series\" data-series=\"").append(Markup.escape(s.key())).append("\" stroke=\"")
                    .append(s.colour()).append("\">\n");
            // a point the axes cannot place (NaN, or not positive on a log axis) breaks the line in two
            StringBuilder points = new StringBuilder();
            for (double[] p : s.line()) {
                if (x.accepts(p[0]) && y.accepts(p[1])) {
                    points.append(points.length() == 0 ? "" : " ").append(n(px(p[0]))).append(',').append(n(py(p[1])));
                } else if (points.length() > 0) {
                    sb.append("<polyline points=\"").append(points).append("\"/>\n");
                    points.setLength(0);
                }
            }
            if (points.length() > 0) {
                sb.append("<polyline points=\"").append(points).append("\"/>\n");
            }
            for (Marker m : s.markers()) {
                if (x.accepts(m.x()) && y.accepts(m.y())) {
                    sb.append("<circle cx=\"").append(n(px(m.x()))).append("\" cy=\"").append(n(py(m.y())))
                            .append("\" r=\"").append(n(MARKER_RADIUS)).append("\"><title>").append(Markup.escape(m.title()))
                            .append("</title></circle>\n");
                }
            }
            sb.append("</g>\n");
        }
        sb.append("</g>\n");
        legend(sb, right + 16);
        return sb.append("</svg>").toString();
    }

    private void legend(StringBuilder sb, double left) {
        sb.append("<g class=\"legend\">");
        double row = TOP + 10;
        for (Series s : series) {
            sb.append("<g stroke=\"").append(s.colour()).append("\">");
            if (!s.line().isEmpty()) {
                sb.append(line(left, row, left + 22, row, null));
            }
            sb.append("<circle cx=\"").append(n(left + 11)).append("\" cy=\"").append(n(row)).append("\" r=\"")
                    .append(n(MARKER_RADIUS)).append("\"/></g>");
            sb.append(text(left + 30, row + 4, "start", s.name()));
            row += 18;
        }
        for (Level l : levels) {
            if (!l.label().isEmpty()) {
                row += 4;
                sb.append(line(left, row, left + 22, row, "limit " + l.kind()));
                sb.append(text(left + 30, row + 4, "start", l.label()));
                row += 18;
            }
        }
        row += 4;
        for (String k : key) {
            sb.append("<text class=\"key\" x=\"").append(n(left)).append("\" y=\"").append(n(row + 4)).append("\">")
                    .append(Markup.escape(k)).append("</text>");
            row += 16;
        }
        sb.append("</g>\n");
    }

    private static String line(double x1, double y1, double x2, double y2, String cssClass) {
        return "<line" + (cssClass == null ? "" : " class=\"" + cssClass + "\"") + " x1=\"" + n(x1) + "\" y1=\"" + n(y1)
                + "\" x2=\"" + n(x2) + "\" y2=\"" + n(y2) + "\"/>";
    }

    private static String text(double x, double y, String anchor, String content) {
        return "<text x=\"" + n(x) + "\" y=\"" + n(y) + "\" text-anchor=\"" + anchor + "\">" + Markup.escape(content) + "</text>";
    }

    /** A coordinate with one decimal [px]. */
    private static String n(double v) {
        String s = String.format(Locale.ROOT, "%.1f", v);
        return s.equals("-0.0") ? "0.0" : s;
    }
}
