package org.cardwright.verify;

import java.util.Locale;

/**
 * How far a card's residuals of one sweep lie from the data's own uncertainty: the noise-aware verdict.
 *
 * <p>The uncertainty u of the sweep is either <b>stated</b> (every point carries its own: u is the RMS of the
 * stated values) or <b>estimated</b> from the residuals themselves by the mean square successive difference
 * (von Neumann, Kent, Bellinson and Hart, "The mean square successive difference", Ann. Math. Statist. 12
 * (1941) 153-162): with the points ordered along the sweep, u^2 = sum (r[i+1] - r[i])^2 / (2 (n - 1)). Noise
 * changes from point to point and enters the differences in full, while a card's systematic error changes
 * slowly along a sweep and largely cancels, so the estimate measures the data's scatter, not the card's error.
 * u is floored at the instrument floor of the kind (the best a bench instrument reads it).
 *
 * <p>The card is consistent with the data when RMS^2 / u^2 is at most 1 + 3 s, with s the standard deviation of
 * that ratio for pure noise: s^2 = 2/n for a stated u (chi-square with n degrees of freedom), plus
 * (3n - 4)/(n - 1)^2 for an estimated one (the variance of the successive-difference estimate, same reference).
 * Three standard deviations: about 1 in 700 noise-only sweeps fails (common practice, no source).
 *
 * @param value      the uncertainty u, in the unit of the residuals (V, or % for C-V)
 * @param source     "stated" or "estimated" (successive differences of the residuals), or "none" when a sweep of
 *                   fewer than 3 points without stated uncertainties allows no estimate
 * @param ratio      residual RMS / u [1]
 * @param limitRatio the largest ratio that passes [1]
 * @param pass       ratio within the limit (true when no estimate exists: the fixed limits decide then)
 */
public record DataUncertainty(double value, String source, double ratio, double limitRatio, boolean pass) {

    /** Source of an uncertainty every point states. */
    public static final String STATED = "stated";
    /** Source of an uncertainty estimated from the residuals' successive differences. */
    public static final String ESTIMATED = "estimated";
    /** No uncertainty: too few points and none stated. */
    public static final String NONE = "none";

    /**
     * @param residuals residuals ordered along the sweep (by current or by voltage)
     * @param stated    each point's stated uncertainty in the same unit, NaN where none
     * @param rms       RMS of the residuals
     * @param floor     the instrument floor of u, same unit
     */
    public static DataUncertainty of(double[] residuals, double[] stated, double rms, double floor) {
        int n = residuals.length;
        boolean allStated = n > 0;
        double sumStated = 0;
        for (double s : stated) {
            allStated &= !Double.isNaN(s);
            sumStated += Double.isNaN(s) ? 0 : s * s;
        }
        double u;
        double spread;
        String source;
        if (allStated) {
            u = Math.sqrt(sumStated / n);
            spread = Math.sqrt(2.0 / n);
            source = STATED;
        } else if (n >= 3) {
            double sum = 0;
            for (int i = 0; i + 1 < n; i++) {
                double d = residuals[i + 1] - residuals[i];
                sum += d * d;
            }
            u = Math.sqrt(sum / (2.0 * (n - 1)));
            spread = Math.sqrt(2.0 / n + (3.0 * n - 4) / ((n - 1.0) * (n - 1.0)));
            source = ESTIMATED;
        } else {
            return new DataUncertainty(Double.NaN, NONE, Double.NaN, Double.NaN, true);
        }
        u = Math.max(u, floor);
        double limit = Math.sqrt(1 + 3 * spread);
        double ratio = rms / u;
        return new DataUncertainty(u, source, ratio, limit, ratio <= limit);
    }

    /** "u 0.152 mV (estimated), RMS/u 1.04 (limit 1.41)" style text, with {@code unit} scaling. */
    public String describe(double scale, String unit) {
        if (NONE.equals(source)) {
            return "no uncertainty (too few points, none stated)";
        }
        return String.format(Locale.ROOT, "u %.3g %s (%s), RMS/u %.2f (limit %.2f)", value * scale, unit, source, ratio,
                limitRatio);
    }
}
