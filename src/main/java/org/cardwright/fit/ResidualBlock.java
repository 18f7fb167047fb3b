package org.cardwright.fit;

import java.util.Set;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * One kind of data in a fit: its weighted residuals (model minus measurement, each divided by its 1-sigma
 * uncertainty, so that every data kind counts by its measurement uncertainty rather than its row count) and
 * their derivatives with respect to the optimiser's vector.
 */
public interface ResidualBlock {
    /** Plain name for reports, e.g. "forward I-V". */
    String label();

    /** Number of residuals. */
    int size();

    /** The parameters the residuals depend on; derivatives for all others are zero. */
    Set<Param> dependsOn();

    /** Weighted residuals (model - measured)/sigma for parameters {@code p}. */
    double[] residuals(DiodeParameters p);

    /**
     * Weighted Jacobian d residual / d x, one row per residual, one column per free parameter. The default
     * takes central differences of {@link #residuals} on the optimiser's scale; blocks with a cheaper exact
     * form override it.
     *
     * @param layout the free parameters and their scales
     * @param x      the optimiser's vector
     */
    default double[][] jacobian(FreeParameters layout, double[] x) {
        int n = size();
        int k = layout.size();
        double[][] jac = new double[n][k];
        for (int j = 0; j < k; j++) {
            if (!dependsOn().contains(layout.free().get(j))) {
                continue;
            }
            double h = layout.isLog(j) ? 1e-6 : 1e-6 * Math.max(Math.abs(x[j]), 1e-3);
            double[] at = layout.differencePoints(j, x[j], h);
            if (!(at[1] > at[0])) {
                continue;
            }
            double[] xp = x.clone();
            xp[j] = at[1];
            double[] xm = x.clone();
            xm[j] = at[0];
            double[] rp = residuals(layout.toParameters(xp));
            double[] rm = residuals(layout.toParameters(xm));
            for (int i = 0; i < n; i++) {
                jac[i][j] = (rp[i] - rm[i]) / (at[1] - at[0]);
            }
        }
        return jac;
    }

    /** Residual statistics per temperature in this kind's own unit; forward I-V reports separately. */
    default java.util.List<KindResiduals> summary(DiodeParameters p) {
        return java.util.List.of();
    }
}
