package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.SelfHeating;

/**
 * The whole-junction fit with a robust loss: iteratively reweighted least squares with Huber's weights
 * (Huber, "Robust estimation of a location parameter", Ann. Math. Statist. 35 (1964) 73-101; the reweighting
 * scheme after Holland &amp; Welsch, "Robust regression using iteratively reweighted least-squares", Commun.
 * Statist. Theory Methods 6 (1977) 813-827; citations recalled). The residual scale is estimated robustly as
 * 1.4826 times the median absolute standardised residual. No point is dropped: a point far off the curve keeps
 * a small weight, and every point beyond {@value #OUTLIER_Z} robust standard deviations is listed by file and
 * line.
 *
 * <p>Forward and breakdown points are reweighted; C-V and recovery records keep their stated weights.
 */
public final class RobustExtraction {
    /** Huber's tuning constant: 95 % efficiency for Gaussian residuals [1]. */
    public static final double HUBER_K = 1.345;
    /** A point this many robust standard deviations off is listed as an outlier [1]. */
    public static final double OUTLIER_Z = 4.0;
    private static final int MAX_ROUNDS = 8;

    private final FitSettings settings;
    private final CapacitanceOptions capacitanceOptions;

    public RobustExtraction(FitSettings settings, CapacitanceOptions capacitanceOptions) {
        this.settings = settings;
        this.capacitanceOptions = capacitanceOptions;
    }

    /** Fits with Huber reweighting; the result's warnings list the outliers. */
    public FitResult fit(ExtractionData data) throws FitInputException {
        JunctionExtraction plain = new JunctionExtraction(settings, capacitanceOptions);
        FitResult result = plain.fit(data);
        ReverseAnalysis.Split split = ReverseAnalysis.split(data.reverse(), settings.sweepGap());
        double[] weights = new double[data.forward().size() + split.breakdown().size()];
        Arrays.fill(weights, 1);
        double[] z = new double[weights.length];
        int rounds = 0;
        for (; rounds < MAX_ROUNDS; rounds++) {
            double[] r = standardised(data.forward(), split.breakdown(), result.parameters());
            double scale = 1.4826 * median(abs(r));
            if (!(scale > 0)) {
                break;
            }
            double change = 0;
            for (int i = 0; i < r.length; i++) {
                z[i] = r[i] / scale;
                double w = Math.abs(z[i]) <= HUBER_K ? 1 : HUBER_K / Math.abs(z[i]);
                change = Math.max(change, Math.abs(w - weights[i]));
                weights[i] = w;
            }
            if (change < 1e-3 && rounds > 0) {
                break;
            }
            result = plain.fit(reweighted(data, split, weights));
        }
        List<String> warnings = new ArrayList<>();
        List<String> outliers = new ArrayList<>();
        int n = data.forward().size();
        for (int i = 0; i < z.length; i++) {
            if (Math.abs(z[i]) > OUTLIER_Z) {
                String where = i < n ? data.forward().get(i).where() : split.breakdown().get(i - n).where();
                outliers.add(String.format(Locale.ROOT, "%s (%+.1f sigma, weight %.2f)", where, z[i], weights[i]));
            }
        }
        warnings.add(String.format(Locale.ROOT,
                "robust fit (Huber weights, %d reweighting rounds): %s", rounds,
                outliers.isEmpty() ? "no outliers beyond " + OUTLIER_Z + " sigma"
                        : outliers.size() + " outliers kept with reduced weight: " + String.join(", ", outliers)));
        warnings.addAll(result.warnings());
        return new FitResult(result.parameters(), result.fitted(), result.correlations(), result.chiSquare(),
                result.reducedChiSquare(), result.points(), result.degreesOfFreedom(), result.evaluations(),
                result.iterations(), result.stopReason(), result.residuals(), result.otherResiduals(), result.terms(),
                warnings);
    }

    /** Residuals divided by the stated uncertainty, forward points first, then breakdown points. */
    private double[] standardised(List<FitPoint> forward, List<ReversePoint> breakdown, DiodeParameters p) {
        double[] out = new double[forward.size() + breakdown.size()];
        for (int i = 0; i < forward.size(); i++) {
            FitPoint pt = forward.get(i);
            out[i] = (SelfHeating.voltageAtCurrent(p, pt.temperature(), pt.current(), settings.options()) - pt.voltage()) / pt.sigma();
        }
        for (int i = 0; i < breakdown.size(); i++) {
            ReversePoint pt = breakdown.get(i);
            out[forward.size() + i] = (SelfHeating.voltageAtCurrent(p, pt.temperature(), pt.current(), settings.options())
                    - pt.voltage()) / pt.sigma();
        }
        return out;
    }

    private static ExtractionData reweighted(ExtractionData data, ReverseAnalysis.Split split, double[] w) {
        List<FitPoint> f = new ArrayList<>();
        for (int i = 0; i < data.forward().size(); i++) {
            FitPoint p = data.forward().get(i);
            f.add(new FitPoint(p.current(), p.voltage(), p.temperature(), p.sigma() / Math.sqrt(w[i]), p.source(), p.line()));
        }
        List<ReversePoint> r = new ArrayList<>(split.leakage());
        int n = data.forward().size();
        for (int i = 0; i < split.breakdown().size(); i++) {
            ReversePoint p = split.breakdown().get(i);
            r.add(new ReversePoint(p.voltage(), p.current(), p.temperature(), p.sigma() / Math.sqrt(w[n + i]), p.source(), p.line()));
        }
        return new ExtractionData(f, r, data.capacitance(), data.recovery());
    }

    private static double[] abs(double[] v) {
        double[] a = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            a[i] = Math.abs(v[i]);
        }
        return a;
    }

    /** The median (the mean of the two middle values for an even count; NaN for none), by Commons Math. */
    static double median(double[] v) {
        return v.length == 0 ? Double.NaN : new org.apache.commons.math3.stat.descriptive.rank.Median().evaluate(v);
    }
}
