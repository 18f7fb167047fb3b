package org.cardwright.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * One axis of an evidence plot: its scale (linear, or logarithmic in whole decades), its range, its ticks and its
 * label. Ranges snap outward to tick positions so a plot's frame sits on ticks; tick labels are formatted with
 * {@link Locale#ROOT} so the same data always give the same text.
 */
final class PlotAxis {
    /** How values map to positions. */
    enum Scale { LINEAR, LOG }

    /**
     * A tick mark.
     *
     * @param value where it sits, in the axis's unit
     * @param label its text; empty for an unlabelled tick
     * @param major true for a tick that also draws a grid line
     */
    record Tick(double value, String label, boolean major) {
    }

    /** About how many labelled ticks a linear axis aims for [1]. */
    private static final double LINEAR_TICKS = 6;
    /** Most decade labels a log axis shows before it labels only every second (third, ...) decade [1]. */
    private static final int MAX_DECADE_LABELS = 9;
    /** A log axis of at most this many decades also labels its 2 and 5 ticks, so a short axis has enough labels [1]. */
    private static final int LABELLED_MINOR_DECADES = 2;
    /** SI prefixes from femto to giga, as {@link Units} writes them. */
    private static final String[] PREFIX = {"f", "p", "n", "u", "m", "", "k", "M", "G"};
    /**
     * Share of the data span added on each side of a linear axis before snapping, so no marker is cut by the frame:
     * 1 % of a plot's width is about 5 px, more than a marker's radius [1].
     */
    private static final double PAD_FRACTION = 0.01;

    private final Scale scale;
    private final double low;
    private final double high;
    private final String label;
    private final List<Tick> ticks;

    private PlotAxis(Scale scale, double low, double high, String label, List<Tick> ticks) {
        this.scale = scale;
        this.low = low;
        this.high = high;
        this.label = label;
        this.ticks = List.copyOf(ticks);
    }

    /** A linear axis covering {@code min..max} (finite, any order), padded a little and snapped to 1-2-5 steps. */
    static PlotAxis linear(double min, double max, String label) {
        double lo = Math.min(min, max);
        double hi = Math.max(min, max);
        if (!Double.isFinite(lo) || !Double.isFinite(hi)) {
            throw new IllegalArgumentException("a plot axis needs finite limits, got " + min + " and " + max);
        }
        double span = hi - lo;
        if (span == 0) {
            span = lo == 0 ? 1 : Math.abs(lo) * 0.1;
            lo -= span / 2;
            hi += span / 2;
        }
        // pad, but never across zero: data that start at 0 V keep their axis starting at 0
        lo = lo >= 0 ? Math.max(0, lo - PAD_FRACTION * span) : lo - PAD_FRACTION * span;
        hi = hi <= 0 ? Math.min(0, hi + PAD_FRACTION * span) : hi + PAD_FRACTION * span;
        return snapped(lo, hi, label);
    }

    /** A linear axis from 0 to {@code max} (positive, finite), padded at the top and snapped to 1-2-5 steps. */
    static PlotAxis fromZero(double max, String label) {
        if (!(max > 0) || !Double.isFinite(max)) {
            throw new IllegalArgumentException("an axis from zero needs a positive finite top, got " + max);
        }
        return snapped(0, max * (1 + PAD_FRACTION), label);
    }

    /** A linear axis from {@code -extent} to {@code +extent}, snapped outward to 1-2-5 steps; for residuals. */
    static PlotAxis symmetric(double extent, String label) {
        double e = extent > 0 && Double.isFinite(extent) ? extent : 1;
        return snapped(-e, e, label);
    }

    /**
     * A logarithmic axis covering the positive values {@code min..max}, from and to 1, 2 or 5 times a power of ten,
     * its decades labelled with an SI prefix and {@code unit} ("100 nA", "1 mA"); with {@code unit} null, plain numbers
     * ("0.1", "10"). Minor ticks at 2..9 times each decade; on an axis of at most {@link #LABELLED_MINOR_DECADES}
     * decades the 2 and 5 ticks are labelled too.
     */
    static PlotAxis log(double min, double max, String label, String unit) {
        double lo = Math.min(min, max);
        double hi = Math.max(min, max);
        if (!(lo > 0) || !Double.isFinite(hi)) {
            throw new IllegalArgumentException("a log axis needs positive finite limits, got " + min + " and " + max);
        }
        // the frame sits on 1, 2 or 5 times a power of ten just outside the data, so no decade is left empty
        double bottom = snapDown(lo);
        double top = snapUp(hi);
        if (!(top > bottom)) {
            top = snapUp(bottom * 1.5);
        }
        int first = (int) Math.floor(Math.log10(bottom) + 1e-9);
        int last = (int) Math.ceil(Math.log10(top) - 1e-9);
        int every = (Math.max(1, last - first) + MAX_DECADE_LABELS - 1) / MAX_DECADE_LABELS;
        boolean labelMinor = Math.log10(top / bottom) <= LABELLED_MINOR_DECADES + 1e-9;
        List<Tick> ticks = new ArrayList<>();
        for (int d = first; d <= last; d++) {
            for (int m = 1; m <= 9; m++) {
                double v = m * Math.pow(10, d);
                if (v < bottom * (1 - 1e-9) || v > top * (1 + 1e-9)) {
                    continue;
                }
                boolean labelled = m == 1 ? Math.floorMod(d - first, every) == 0 : labelMinor && (m == 2 || m == 5);
                ticks.add(new Tick(v, labelled ? prefixed(m, d, unit) : "", m == 1));
            }
        }
        return new PlotAxis(Scale.LOG, bottom, top, label, ticks);
    }

    /** The largest 1, 2 or 5 times a power of ten at or below {@code x} (positive). */
    private static double snapDown(double x) {
        double decade = Math.pow(10, Math.floor(Math.log10(x) + 1e-12));
        double m = x / decade;
        return (m >= 5 - 1e-9 ? 5 : m >= 2 - 1e-9 ? 2 : 1) * decade;
    }

    /** The smallest 1, 2 or 5 times a power of ten at or above {@code x} (positive). */
    private static double snapUp(double x) {
        double decade = Math.pow(10, Math.floor(Math.log10(x) + 1e-12));
        double m = x / decade;
        return (m <= 1 + 1e-9 ? 1 : m <= 2 + 1e-9 ? 2 : m <= 5 + 1e-9 ? 5 : 10) * decade;
    }

    /**
     * {@code mantissa} times 10^exponent with an SI prefix and {@code unit}: "1 fA", "20 pF", "500 mV", "1 kV"; the
     * same prefixes as the page's tables ({@link Units#engineering}, "u" for micro). With {@code unit} null a plain
     * number: "0.02", "1", "500", and 1e-7 style beyond six decades either side.
     */
    static String prefixed(int mantissa, int exponent, String unit) {
        if (unit == null) {
            if (exponent < -6 || exponent > 6) {
                return mantissa + "e" + exponent;
            }
            return new java.math.BigDecimal(mantissa).scaleByPowerOfTen(exponent).stripTrailingZeros().toPlainString();
        }
        int group = Math.floorDiv(exponent, 3);
        if (group < -5 || group > 3) {
            return mantissa + "e" + exponent + " " + unit;
        }
        long scaled = Math.round(mantissa * Math.pow(10, exponent - 3 * group));
        return scaled + " " + PREFIX[group + 5] + unit;
    }

    private static PlotAxis snapped(double lo, double hi, String label) {
        double step = niceStep((hi - lo) / LINEAR_TICKS);
        long firstIndex = (long) Math.floor(lo / step + 1e-9);
        long lastIndex = (long) Math.ceil(hi / step - 1e-9);
        int decimals = Math.max(0, (int) -Math.floor(Math.log10(step) + 1e-9));
        List<Tick> ticks = new ArrayList<>();
        for (long i = firstIndex; i <= lastIndex; i++) {
            double v = i * step;
            ticks.add(new Tick(v, number(v, decimals), true));
        }
        return new PlotAxis(Scale.LINEAR, firstIndex * step, lastIndex * step, label, ticks);
    }

    /** The 1, 2 or 5 times a power of ten nearest above {@code raw}. */
    static double niceStep(double raw) {
        double magnitude = Math.pow(10, Math.floor(Math.log10(raw)));
        double norm = raw / magnitude;
        double nice = norm <= 1 ? 1 : norm <= 2 ? 2 : norm <= 5 ? 5 : 10;
        return nice * magnitude;
    }

    /** {@code value} with {@code decimals} decimals; never "-0". */
    private static String number(double value, int decimals) {
        String s = String.format(Locale.ROOT, "%." + decimals + "f", value);
        return s.matches("-0(\\.0*)?") ? s.substring(1) : s;
    }

    /** Position of {@code value} along the axis, 0 at the low end and 1 at the high end [1]. */
    double fraction(double value) {
        if (scale == Scale.LOG) {
            return (Math.log10(value) - Math.log10(low)) / (Math.log10(high) - Math.log10(low));
        }
        return (value - low) / (high - low);
    }

    /** True when {@code value} can be placed on this axis (finite, and positive on a log axis). */
    boolean accepts(double value) {
        return Double.isFinite(value) && (scale == Scale.LINEAR || value > 0);
    }

    Scale scale() {
        return scale;
    }

    double low() {
        return low;
    }

    double high() {
        return high;
    }

    String label() {
        return label;
    }

    List<Tick> ticks() {
        return ticks;
    }
}
