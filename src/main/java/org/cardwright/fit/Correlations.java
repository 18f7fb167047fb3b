package org.cardwright.fit;

import java.util.List;
import org.cardwright.model.Param;

/**
 * Correlation matrix of the fitted parameters (on the optimiser's scale: logarithm for log-scaled ones).
 *
 * @param order  the fitted parameters, in matrix order
 * @param matrix correlation coefficients [1]
 */
public record Correlations(List<Param> order, double[][] matrix) {
    public Correlations {
        order = List.copyOf(order);
        double[][] copy = new double[matrix.length][];
        for (int i = 0; i < matrix.length; i++) {
            copy[i] = matrix[i].clone();
        }
        matrix = copy;
    }

    /** Correlation of {@code a} and {@code b}; NaN when either was not fitted. */
    public double get(Param a, Param b) {
        int i = order.indexOf(a);
        int j = order.indexOf(b);
        return i < 0 || j < 0 ? Double.NaN : matrix[i][j];
    }

    /** An empty matrix (nothing fitted). */
    public static Correlations none() {
        return new Correlations(List.of(), new double[0][0]);
    }
}
