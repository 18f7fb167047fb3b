package org.cardwright.fit;

import java.util.ArrayList;
import java.util.List;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * The map between the optimiser's vector and a diode parameter set: which parameters vary, on which scale
 * (natural logarithm for positive values that span decades, linear otherwise), and within which bounds. The
 * parameters that do not vary come from {@code base}.
 */
public final class FreeParameters {
    private final DiodeParameters base;
    private final List<Param> free;
    private final boolean[] logScale;
    private final double[] lower;
    private final double[] upper;

    FreeParameters(DiodeParameters base, List<Param> free, List<double[]> bounds) {
        this.base = base;
        this.free = List.copyOf(free);
        int k = free.size();
        this.logScale = new boolean[k];
        this.lower = new double[k];
        this.upper = new double[k];
        for (int j = 0; j < k; j++) {
            Param p = free.get(j);
            logScale[j] = p.fitScale() == Param.Scale.LOG;
            double lo = bounds.get(j)[0];
            double hi = bounds.get(j)[1];
            lower[j] = logScale[j] ? Math.log(Math.max(lo, Double.MIN_NORMAL)) : lo;
            upper[j] = logScale[j] ? Math.log(hi) : hi;
        }
    }

    public List<Param> free() {
        return free;
    }

    public int size() {
        return free.size();
    }

    DiodeParameters base() {
        return base;
    }

    public boolean isLog(int j) {
        return logScale[j];
    }

    /** The optimiser's vector for the given parameter values. */
    double[] toInternal(DiodeParameters p) {
        double[] x = new double[free.size()];
        for (int j = 0; j < x.length; j++) {
            double v = p.get(free.get(j));
            x[j] = logScale[j] ? Math.log(v) : v;
        }
        return x;
    }

    /** The parameter set for the optimiser's vector {@code x}. */
    public DiodeParameters toParameters(double[] x) {
        // one copy of the base's values, and only the free values checked (the base's were when it was made)
        double[] values = new double[x.length];
        for (int j = 0; j < x.length; j++) {
            values[j] = value(j, x[j]);
        }
        return base.with(x.length == free.size() ? free : free.subList(0, x.length), values);
    }

    double value(int j, double internal) {
        return logScale[j] ? Math.exp(internal) : internal;
    }

    /** Clamps the vector into the bounds, in place; returns it. */
    double[] clamp(double[] x) {
        for (int j = 0; j < x.length; j++) {
            x[j] = Math.min(upper[j], Math.max(lower[j], x[j]));
        }
        return x;
    }

    /**
     * The two points of a central difference in coordinate {@code j}, kept inside the bounds (one-sided at a
     * bound, so that a parameter at its limit, RS at 0 say, is never evaluated outside it): {low, high}.
     */
    double[] differencePoints(int j, double internal, double step) {
        double lo = Math.max(internal - step, lower[j]);
        double hi = Math.min(internal + step, upper[j]);
        return new double[] {lo, hi};
    }

    /** True when {@code x[j]} sits on (or within a hair of) one of its bounds. */
    boolean atBound(int j, double internal) {
        double span = Math.max(1e-12, 1e-9 * Math.max(1, Math.abs(internal)));
        return (Double.isFinite(lower[j]) && internal - lower[j] <= span)
                || (Double.isFinite(upper[j]) && upper[j] - internal <= span);
    }

    /** The list of (value-space) bounds of {@code free}, ordered as {@code free}. */
    static List<double[]> boundsOf(List<Param> free, java.util.function.Function<Param, double[]> boundOf) {
        List<double[]> out = new ArrayList<>();
        for (Param p : free) {
            out.add(boundOf.apply(p));
        }
        return out;
    }
}
