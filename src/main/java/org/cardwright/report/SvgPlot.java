package org.cardwright.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * One inline SVG plot drawn by hand: a framed area with grid, tick labels and axis labels, one group per series
 * (a polyline, broken where a point is missing, and open markers of the series' own shape with a hover title each),
 * dashed horizontal limit lines and a legend to the right. The drawing scales with its column (a view box, width
 * 100 %), so its font sizes are in drawing units chosen to stay legible down to a 760 px window. The output is
 * well-formed XML and depends only on what was added, in the order it was added.
 */
final class SvgPlot {
    /** Drawing size [px]. */
    static final int WIDTH = 760;
    /** Drawing size [px]. */
    static final int HEIGHT = 340;
    private static final int LEFT = 74;
    private static final int RIGHT = 190;
    private static final int TOP = 14;
    private static final int BOTTOM = 50;
    /** Half the size of a marker [px of the drawing]. */
    private static final double MARKER_RADIUS = 3.8;

    /**
     * Marker shapes, one per series, so that series stay apart without colour (greyscale print, colour vision
     * deficiency): open circle, square, triangle, diamond, downward triangle, plus, cross.
     */
    enum Shape {
        CIRCLE, SQUARE, TRIANGLE, DIAMOND, TRIANGLE_DOWN, PLUS, CROSS;

        /** The shape for the {@code index}-th series, repeating after seven. */
        static Shape of(int index) {
            return values()[Math.floorMod(index, values().length)];
        }

        /** SVG path data of this shape centred on (cx, cy), about 2r across. */
        String path(double cx, double cy, double r) {
            return switch (this) {
                case CIRCLE -> "M" + n(cx - r) + "," + n(cy) + "a" + n(r) + "," + n(r) + " 0 1,0 " + n(2 * r) + ",0a" + n(r)
                        + "," + n(r) + " 0 1,0 " + n(-2 * r) + ",0Z";
                case SQUARE -> poly(cx, cy, new double[] {-0.9, -0.9, 0.9, -0.9, 0.9, 0.9, -0.9, 0.9}, r);
                case TRIANGLE -> poly(cx, cy, new double[] {0, -1.2, 1.1, 0.8, -1.1, 0.8}, r);
                case DIAMOND -> poly(cx, cy, new double[] {0, -1.25, 1.15, 0, 0, 1.25, -1.15, 0}, r);
                case TRIANGLE_DOWN -> poly(cx, cy, new double[] {0, 1.2, 1.1, -0.8, -1.1, -0.8}, r);
                case PLUS -> "M" + n(cx - 1.2 * r) + "," + n(cy) + "H" + n(cx + 1.2 * r) + "M" + n(cx) + "," + n(cy - 1.2 * r)
                        + "V" + n(cy + 1.2 * r);
                case CROSS -> "M" + n(cx - r) + "," + n(cy - r) + "L" + n(cx + r) + "," + n(cy + r) + "M" + n(cx - r) + ","
                        + n(cy + r) + "L" + n(cx + r) + "," + n(cy - r);
            };
        }

        private static String poly(double cx, double cy, double[] xy, double r) {
            StringBuilder sb = new StringBuilder();
            for (int i = 0; i < xy.length; i += 2) {
                sb.append(i == 0 ? "M" : "L").append(n(cx + xy[i] * r)).append(',').append(n(cy + xy[i + 1] * r));
            }
            return sb.append('Z').toString();
        }
    }

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
     * @param shape   marker shape
     * @param markers measured points
     * @param line    points joined in the given order, each {x, y}; a point with NaN breaks the line; may be empty
     * @param style   an extra CSS class of the series' group (e.g. a dashed second card); empty for none. A series with
     *                an empty name has no legend entry (a second line of a temperature already in the legend).
     */
    record Series(String name, String key, String colour, Shape shape, List<Marker> markers, List<double[]> line,
                  String style) {
        Series {
            markers = List.copyOf(markers);
            line = List.copyOf(line);
            if (!style.matches("[a-z-]*")) {
                throw new IllegalArgumentException("a series style is a CSS class name, got '" + style + "'");
            }
        }

        /** A series in the plain style. */
        Series(String name, String key, String colour, Shape shape, List<Marker> markers, List<double[]> line) {
            this(name, key, colour, shape, markers, line, "");
        }
    }

    /**
     * A horizontal reference line.
     *
     * @param y     where, in the y axis's unit
     * @param kind  CSS class suffix: "rms" or "max"
     * @param label legend text; empty to leave it out of the legend (e.g. the negative twin of a limit). A level
     *              beyond the vertical axis is not drawn, and its legend entry says so.
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
                .append("\" viewBox=\"0 0 ").append(WIDTH).append(' ').append(HEIGHT).append("\" width=\"100%\"")
                .append(" preserveAspectRatio=\"xMinYMin meet\" role=\"img\" aria-label=\"").append(Markup.escape(title))
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
        // reference lines and the card's lines, clipped to the frame
        String clip = "<g clip-path=\"url(#" + Markup.escape(id) + "-area)\">";
        sb.append(clip).append('\n');
        if (zeroLine && y.accepts(0) && y.low() <= 0 && y.high() >= 0) {
            sb.append(line(LEFT, py(0), right, py(0), "zero")).append('\n');
        }
        for (Level l : levels) {
            if (onAxis(l)) {
                sb.append(line(LEFT, py(l.y()), right, py(l.y()), "limit " + l.kind())).append('\n');
            }
        }
        sb.append("</g>\n");
        for (Series s : series) {
            sb.append("<g class=\"series").append(s.style().isEmpty() ? "" : " " + s.style()).append("\" data-series=\"").append(Markup.escape(s.key())).append("\" stroke=\"")
                    .append(s.colour()).append("\">\n").append(clip);
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
            sb.append("</g>\n");
            // markers are not clipped: the axes always cover the measured points, and a marker on the frame stays whole
            for (Marker m : s.markers()) {
                if (x.accepts(m.x()) && y.accepts(m.y()) && inside(m)) {
                    sb.append("<path class=\"marker\" d=\"").append(s.shape().path(px(m.x()), py(m.y()), MARKER_RADIUS))
                            .append("\"><title>").append(Markup.escape(m.title())).append("</title></path>\n");
                }
            }
            sb.append("</g>\n");
        }
        legend(sb, right + 16);
        return sb.append("</svg>").toString();
    }

    private void legend(StringBuilder sb, double left) {
        sb.append("<g class=\"legend\">");
        double row = TOP + 10;
        for (Series s : series) {
            if (s.name().isEmpty()) {
                continue;
            }
            sb.append("<g stroke=\"").append(s.colour()).append("\">");
            if (!s.line().isEmpty()) {
                sb.append(line(left, row, left + 22, row, null));
            }
            sb.append("<path class=\"marker\" d=\"").append(s.shape().path(left + 11, row, MARKER_RADIUS)).append("\"/></g>");
            sb.append(text(left + 30, row + 4.5, "start", s.name()));
            row += 20;
        }
        for (Level l : levels) {
            if (!l.label().isEmpty()) {
                row += 4;
                sb.append(line(left, row, left + 22, row, "limit " + l.kind()));
                sb.append(text(left + 30, row + 4.5, "start", l.label()));
                row += 20;
                if (!onAxis(l)) {
                    sb.append("<text class=\"key off-scale\" x=\"").append(n(left + 30)).append("\" y=\"").append(n(row))
                            .append("\">").append(l.y() > y.high() ? "above this scale" : "below this scale").append("</text>");
                    row += 18;
                }
            }
        }
        row += 4;
        for (String k : key) {
            sb.append("<text class=\"key\" x=\"").append(n(left)).append("\" y=\"").append(n(row + 4)).append("\">")
                    .append(Markup.escape(k)).append("</text>");
            row += 18;
        }
        sb.append("</g>\n");
    }

    /** True when a marker lies within both axes' ranges (within rounding). */
    private boolean inside(Marker m) {
        double fx = x.fraction(m.x());
        double fy = y.fraction(m.y());
        return fx >= -1e-9 && fx <= 1 + 1e-9 && fy >= -1e-9 && fy <= 1 + 1e-9;
    }

    /** True when a level lies within the vertical axis, so it is drawn. */
    private boolean onAxis(Level l) {
        return y.accepts(l.y()) && l.y() >= y.low() && l.y() <= y.high();
    }

    /** True when some level lies beyond the vertical axis. */
    boolean levelsOffScale() {
        return levels.stream().anyMatch(l -> !onAxis(l));
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
