package org.cardwright.model;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.ToDoubleFunction;

/**
 * Which points form one sweep: the rule that groups logged device temperatures into sweeps.
 *
 * <p>A temperature chamber's logger writes each row's own reading (24.93, 25.07, 25.11 degC within one sweep).
 * The rule sorts the distinct temperatures of one kind of data and starts a new sweep wherever two neighbours
 * lie more than {@code gap} apart; a sweep is labelled by the middle of its range, (lowest + highest) / 2, which
 * is the exact temperature when every row of the sweep has the same one. The grouping decides only what counts
 * as one sweep (the span of its current, its start values, its breakdown points, its table row and verdict);
 * every point keeps its own temperature in the model. A gap of 0 makes every distinct temperature its own sweep.
 */
public final class SweepTemperatures {
    /**
     * Default gap between sweeps [K]: a chamber logger wanders by a few tenths of a kelvin around its set point,
     * while set points of a characterisation lie at least several kelvin apart (common practice, no source).
     */
    public static final double DEFAULT_GAP = 1.0;

    private SweepTemperatures() {
    }

    /** For each of {@code temperatures} [K], the label temperature of its sweep [K], in the same order. */
    public static double[] labels(double[] temperatures, double gap) {
        if (!(gap >= 0) || !Double.isFinite(gap)) {
            throw new IllegalArgumentException("sweep gap must be 0 or more kelvin, got " + gap);
        }
        double[] sorted = temperatures.clone();
        Arrays.sort(sorted);
        TreeMap<Double, Double> labelOf = new TreeMap<>();
        int start = 0;
        for (int i = 1; i <= sorted.length; i++) {
            if (i == sorted.length || sorted[i] - sorted[i - 1] > gap) {
                double label = (sorted[start] + sorted[i - 1]) / 2;
                for (int k = start; k < i; k++) {
                    labelOf.put(sorted[k], label);
                }
                start = i;
            }
        }
        double[] out = new double[temperatures.length];
        for (int i = 0; i < out.length; i++) {
            out[i] = labelOf.get(temperatures[i]);
        }
        return out;
    }

    /** {@code points} grouped into sweeps, ascending by label temperature [K]; each list keeps the input order. */
    public static <T> Map<Double, List<T>> group(Collection<T> points, ToDoubleFunction<T> temperature, double gap) {
        List<T> list = new ArrayList<>(points);
        double[] t = new double[list.size()];
        for (int i = 0; i < t.length; i++) {
            t[i] = temperature.applyAsDouble(list.get(i));
        }
        double[] labels = labels(t, gap);
        Map<Double, List<T>> out = new TreeMap<>();
        for (int i = 0; i < t.length; i++) {
            out.computeIfAbsent(labels[i], k -> new ArrayList<>()).add(list.get(i));
        }
        return out;
    }

    /** Indices 0..n-1 of points grouped into sweeps, ascending by label temperature [K]. */
    public static Map<Double, List<Integer>> groupIndices(double[] temperatures, double gap) {
        double[] labels = labels(temperatures, gap);
        Map<Double, List<Integer>> out = new TreeMap<>();
        for (int i = 0; i < labels.length; i++) {
            out.computeIfAbsent(labels[i], k -> new ArrayList<>()).add(i);
        }
        return out;
    }

    /** The rule in words, for summaries. */
    public static String rule(double gap) {
        return gap == 0 ? "every distinct logged temperature is its own sweep"
                : String.format(Locale.ROOT, "logged temperatures within %.3g K of a neighbour form one sweep"
                        + " (a gap larger than %.3g K starts the next); each point keeps its own temperature", gap, gap);
    }
}
