package org.cardwright.fit;

import java.util.Map;
import java.util.TreeMap;

/**
 * The distinct temperatures of a list of points, ascending, and each point's index into them, so that a block
 * updates the temperature laws once per temperature rather than once per point.
 *
 * @param temperatures distinct temperatures, ascending [K]
 * @param group        for each point, the index of its temperature in {@code temperatures}
 */
record TemperatureGroups(double[] temperatures, int[] group) {

    /** Groups {@code points} by the temperature {@code temperature} gives for each [K]. */
    static <T> TemperatureGroups of(T[] points, java.util.function.ToDoubleFunction<T> temperature) {
        double[] ts = new double[points.length];
        for (int i = 0; i < ts.length; i++) {
            ts[i] = temperature.applyAsDouble(points[i]);
        }
        return of(ts);
    }

    /** Groups points by their temperature [K], given in point order. */
    static TemperatureGroups of(double[] pointTemperatures) {
        TreeMap<Double, Integer> index = new TreeMap<>();
        for (double t : pointTemperatures) {
            index.putIfAbsent(t, 0);
        }
        double[] temperatures = new double[index.size()];
        int k = 0;
        for (Map.Entry<Double, Integer> e : index.entrySet()) {
            temperatures[k] = e.getKey();
            e.setValue(k++);
        }
        int[] group = new int[pointTemperatures.length];
        for (int i = 0; i < group.length; i++) {
            group[i] = index.get(pointTemperatures[i]);
        }
        return new TemperatureGroups(temperatures, group);
    }
}
