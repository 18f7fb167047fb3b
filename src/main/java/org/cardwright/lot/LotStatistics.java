package org.cardwright.lot;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.model.Param;

/**
 * Statistics of the fitted parameters of a lot, each in the space where it is roughly normal: log10 for the
 * parameters a fit varies on a log scale (IS, ISR, IKF, IBV, CJO, TT, ...), linear for the rest (N, RS, ...).
 *
 * <p><b>Outliers.</b> A fitted part is an outlier when any of its parameters lies far from the lot by the
 * modified z-score M = 0.6745 (x - median) / MAD, with the median absolute deviation MAD (F. R. Hampel, "The
 * influence curve and its role in robust estimation", J. Amer. Statist. Assoc. 69(346) (1974) 383-393) and the
 * modified z-score of B. Iglewicz and D. C. Hoaglin, "How to Detect and Handle Outliers", ASQC Basic References in
 * Quality Control vol. 16, ASQC Quality Press 1993 (both recalled). Their limit |M| &gt; 3.5 is meant for one
 * variable of a modest sample; a lot judges n parts on k parameters, n k values, and at 3.5 a normal lot of 200
 * parts and 6 parameters would lose a good part in about two runs of three. The limit is therefore raised with a
 * Bonferroni correction so that a lot without outliers loses no part with probability 1 - {@value #FALSE_ALARM}:
 * |M| &gt; max(3.5, z), P(|Z| &gt; z) = {@value #FALSE_ALARM} / (n k) for standard normal Z (C. E. Bonferroni,
 * "Teoria statistica delle classi e calcolo delle probabilita", Pubblicazioni del R. Istituto Superiore di Scienze
 * Economiche e Commerciali di Firenze 8 (1936) 3-62; recalled). The rule uses only medians, so a few wild parts
 * cannot hide each other by inflating the spread. Outliers are named and left out of the statistics and the cards;
 * the rest of the lot keeps every part.
 *
 * <p><b>Spread and correlation.</b> Over the remaining parts: mean, standard deviation (n - 1), median, MAD (raw,
 * and scaled by 1.4826 to estimate sigma for a normal lot), and the Pearson correlation of every pair of the
 * parameters fitted in every part.
 *
 * <p><b>Principal components.</b> The correlation matrix R = W Lambda W^T (standardised variables, so that log10 IS
 * and RS in ohms weigh alike); with D = diag(std), L = D W Lambda^1/2 gives theta = mean + L xi, xi standard normal,
 * the lot's own mean and covariance (L L^T = D R D). I. T. Jolliffe, "Principal Component Analysis", 2nd ed.,
 * Springer 2002, chapters 1-2 (recalled).
 *
 * @param parameters per fitted parameter, its statistics (in {@link Param} order)
 * @param outliers   outlier part names with their reasons, in part order
 * @param common     parameters fitted in every part that is not an outlier, in {@link Param} order
 * @param correlation correlation matrix over {@code common}
 * @param mean       mean of {@code common} in their spaces
 * @param std        standard deviation of {@code common} in their spaces
 * @param components eigen-decomposition of {@code correlation}
 * @param inliers    the parts the statistics are made of, in part order
 */
public record LotStatistics(Map<Param, Summary> parameters, Map<String, String> outliers, List<Param> common,
                            double[][] correlation, double[] mean, double[] std, Eigen components, List<PartResult> inliers) {

    /** Smallest modified z-score limit: Iglewicz and Hoaglin's 3.5 for one variable [1]. */
    public static final double OUTLIER_LIMIT = 3.5;
    /** Chance that a lot with no outlier loses a good part to the rule (family-wise, all parts and parameters) [1]. */
    public static final double FALSE_ALARM = 0.05;
    /** 0.6745 = the 0.75 quantile of the standard normal, so that M is a z-score for a normal lot [1]. */
    static final double MAD_TO_Z = 0.6745;
    /** 1.4826 = 1/0.6745: MAD times this estimates sigma of a normal lot [1]. */
    public static final double MAD_TO_SIGMA = 1.4826;
    /** A parameter needs this many fitted parts before it is judged or summarised [1]. */
    static final int MIN_PARTS = 3;

    /**
     * One parameter over the lot, in its space.
     *
     * @param space  "log10" or "linear"
     * @param n      parts that fitted it (outliers left out)
     * @param mean   mean
     * @param std    standard deviation (n - 1)
     * @param median median
     * @param mad    median absolute deviation (raw)
     * @param min    smallest value
     * @param max    largest value
     */
    public record Summary(String space, int n, double mean, double std, double median, double mad, double min, double max) {
        /** The mean back in SI (10^mean for log10) [SI]. */
        public double typical() {
            return space.equals("log10") ? Math.pow(10, mean) : mean;
        }
    }

    /** The space a parameter's statistics are kept in. */
    public static String space(Param p) {
        return p.fitScale() == Param.Scale.LOG ? "log10" : "linear";
    }

    /** x in the space of {@code p}. */
    public static double toSpace(Param p, double x) {
        return p.fitScale() == Param.Scale.LOG ? Math.log10(x) : x;
    }

    /** x from the space of {@code p} back to SI. */
    public static double fromSpace(Param p, double x) {
        return p.fitScale() == Param.Scale.LOG ? Math.pow(10, x) : x;
    }

    /** Statistics of the fitted parts {@code ok} (sorted by part name). */
    public static LotStatistics of(List<PartResult> ok) {
        List<Param> fittedParams = new ArrayList<>();
        for (Param p : Param.values()) {
            if (ok.stream().filter(r -> r.fitted().contains(p)).count() >= MIN_PARTS) {
                fittedParams.add(p);
            }
        }
        Map<String, List<String>> why = new LinkedHashMap<>();
        double limit = outlierLimit(ok.size(), fittedParams.size());
        for (Param p : fittedParams) {
            List<PartResult> with = ok.stream().filter(r -> r.fitted().contains(p)).toList();
            double[] x = with.stream().mapToDouble(r -> toSpace(p, r.values().get(p))).toArray();
            double med = median(x);
            double mad = mad(x, med);
            for (int i = 0; i < x.length; i++) {
                double z = mad > 0 ? MAD_TO_Z * (x[i] - med) / mad : (x[i] == med || !Double.isFinite(x[i]) ? 0 : Double.NaN);
                if (!Double.isFinite(x[i]) || !(Math.abs(z) <= limit)) {
                    why.computeIfAbsent(with.get(i).part(), k -> new ArrayList<>()).add(String.format(Locale.ROOT,
                            "%s = %.4g: modified z-score %.1f, limit %.2f (lot median %.4g)", p.name(),
                            with.get(i).values().get(p), z, limit, fromSpace(p, med)));
                }
            }
        }
        Map<String, String> outliers = new LinkedHashMap<>();
        List<PartResult> inliers = new ArrayList<>();
        for (PartResult r : ok) {
            if (why.containsKey(r.part())) {
                outliers.put(r.part(), String.join("; ", why.get(r.part())));
            } else {
                inliers.add(r);
            }
        }
        Map<Param, Summary> summaries = new EnumMap<>(Param.class);
        List<Param> common = new ArrayList<>();
        for (Param p : fittedParams) {
            double[] x = inliers.stream().filter(r -> r.fitted().contains(p)).mapToDouble(r -> toSpace(p, r.values().get(p))).toArray();
            if (x.length < MIN_PARTS) {
                continue;
            }
            double med = median(x);
            summaries.put(p, new Summary(space(p), x.length, mean(x), std(x), med, mad(x, med),
                    Arrays.stream(x).min().orElseThrow(), Arrays.stream(x).max().orElseThrow()));
            if (x.length == inliers.size()) {
                common.add(p);
            }
        }
        int k = common.size();
        double[][] data = new double[k][];
        double[] mean = new double[k];
        double[] std = new double[k];
        for (int i = 0; i < k; i++) {
            Param p = common.get(i);
            data[i] = inliers.stream().mapToDouble(r -> toSpace(p, r.values().get(p))).toArray();
            mean[i] = summaries.get(p).mean();
            std[i] = summaries.get(p).std();
        }
        double[][] corr = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                corr[i][j] = i == j ? 1 : correlation(data[i], mean[i], data[j], mean[j]);
            }
        }
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < i; j++) {
                corr[i][j] = corr[j][i];
            }
        }
        return new LotStatistics(summaries, outliers, List.copyOf(common), corr, mean, std, Eigen.of(corr), List.copyOf(inliers));
    }

    /**
     * The factor L (rows: {@link #common}, columns: principal components, largest first) with L L^T the lot's
     * covariance; components with no variance left out.
     */
    public double[][] loadings() {
        int k = common.size();
        double total = Arrays.stream(components.values()).filter(v -> v > 0).sum();
        int used = 0;
        for (double v : components.values()) {
            if (v > 1e-12 * total) {
                used++;
            }
        }
        double[][] l = new double[k][used];
        for (int i = 0; i < k; i++) {
            for (int c = 0; c < used; c++) {
                l[i][c] = std[i] * components.vectors()[i][c] * Math.sqrt(components.values()[c]);
            }
        }
        return l;
    }

    /** The covariance of {@link #common} in their spaces. */
    public double[][] covariance() {
        int k = common.size();
        double[][] c = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                c[i][j] = correlation[i][j] * std[i] * std[j];
            }
        }
        return c;
    }

    /** The modified z-score limit for {@code parts} parts judged on {@code parameters} parameters (see the class comment). */
    public static double outlierLimit(int parts, int parameters) {
        int m = Math.max(1, parts * parameters);
        return Math.max(OUTLIER_LIMIT, Normal.upperQuantile(FALSE_ALARM / (2.0 * m)));
    }

    static double mean(double[] x) {
        double s = 0;
        for (double v : x) {
            s += v;
        }
        return s / x.length;
    }

    static double std(double[] x) {
        if (x.length < 2) {
            return Double.NaN;
        }
        double m = mean(x);
        double s = 0;
        for (double v : x) {
            s += (v - m) * (v - m);
        }
        return Math.sqrt(s / (x.length - 1));
    }

    /** The median (the mean of the two middle values for an even count), by Commons Math through {@code fit}. */
    static double median(double[] x) {
        return org.cardwright.fit.Medians.median(x);
    }

    static double mad(double[] x, double median) {
        double[] d = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            d[i] = Math.abs(x[i] - median);
        }
        return median(d);
    }

    private static double correlation(double[] a, double ma, double[] b, double mb) {
        double sab = 0;
        double saa = 0;
        double sbb = 0;
        for (int i = 0; i < a.length; i++) {
            sab += (a[i] - ma) * (b[i] - mb);
            saa += (a[i] - ma) * (a[i] - ma);
            sbb += (b[i] - mb) * (b[i] - mb);
        }
        return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : 0;
    }
}
