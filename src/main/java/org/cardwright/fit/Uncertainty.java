package org.cardwright.fit;

import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;

/**
 * Standard errors and correlations of the free parameters at the optimum, from the curvature matrix JᵀJ of
 * the weighted residuals. Commons Math's covariance (JᵀJ)⁻¹ is unscaled, so it is multiplied by the reduced
 * chi-square, the convention Hipparchus's EvaluationTest.testComputeSigma also shows.
 *
 * @param standardErrors one standard error per free parameter, in value units (log-scaled ones converted) [SI]
 * @param correlations   correlation matrix on the optimiser's scale [1]
 * @param singular       true when JᵀJ cannot be inverted reliably (condition number above 1e15)
 */
record Uncertainty(double[] standardErrors, double[][] correlations, boolean singular) {
    /** A correlation beyond this is reported [1]. */
    static final double STRONG_CORRELATION = 0.995;

    /** The uncertainties at {@code best} of {@code model}, scaled by {@code reducedChiSquare}. */
    static Uncertainty of(JointProblem model, Optimiser.Run best, double reducedChiSquare) {
        FreeParameters layout = best.layout();
        int k = layout.size();
        double[] se = new double[k];
        double[][] corr = new double[k][k];
        if (k == 0) {
            return new Uncertainty(se, corr, false);
        }
        RealMatrix j = model.jacobian(best.x());
        SingularValueDecomposition svd = new SingularValueDecomposition(curvature(j));
        RealMatrix cov = svd.getSolver().getInverse();
        double scale = Double.isFinite(reducedChiSquare) ? reducedChiSquare : 1;
        boolean singular = svd.getConditionNumber() > 1e15;
        for (int a = 0; a < k; a++) {
            double sx = singular ? Double.POSITIVE_INFINITY : Math.sqrt(Math.max(cov.getEntry(a, a) * scale, 0));
            se[a] = layout.isLog(a) ? layout.value(a, best.x()[a]) * sx : sx;
            for (int b = 0; b < k; b++) {
                corr[a][b] = cov.getEntry(a, b) / Math.sqrt(cov.getEntry(a, a) * cov.getEntry(b, b));
            }
        }
        return new Uncertainty(se, corr, singular);
    }

    /**
     * JᵀJ, summed as Commons Math's {@code j.transpose().multiply(j)} sums it (each entry from zero over the rows in
     * order, so the same numbers to the bit) without its per-entry index checks and the transposed copy; the matrix
     * is symmetric, so each pair is summed once.
     */
    static RealMatrix curvature(RealMatrix j) {
        double[][] rows = j instanceof Array2DRowRealMatrix a ? a.getDataRef() : j.getData();
        int k = j.getColumnDimension();
        double[][] out = new double[k][k];
        for (int a = 0; a < k; a++) {
            for (int b = a; b < k; b++) {
                double sum = 0;
                for (double[] row : rows) {
                    sum += row[a] * row[b];
                }
                out[a][b] = sum;
                out[b][a] = sum;
            }
        }
        return new Array2DRowRealMatrix(out, false);
    }

    /** Adds a plain warning for every pair of free parameters correlated beyond {@link #STRONG_CORRELATION}. */
    void addCorrelationWarnings(FreeParameters layout, List<String> warnings) {
        for (int a = 0; a < correlations.length; a++) {
            for (int b = a + 1; b < correlations.length; b++) {
                if (Math.abs(correlations[a][b]) > STRONG_CORRELATION) {
                    warnings.add(String.format(Locale.ROOT,
                            "%s and %s are strongly correlated (r = %.4f): the data fix a combination of them better than each alone",
                            layout.free().get(a), layout.free().get(b), correlations[a][b]));
                }
            }
        }
    }
}
