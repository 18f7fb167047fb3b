package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.TemperatureLaws;

/**
 * Closed-form start values from the right region of one forward sweep, before the global fit.
 *
 * <ul>
 *   <li>Shockley regression on the most exponential window: where the local ideality
 *       n(I) = (1/Vt) dV/d(ln I) is lowest, recombination (low current) and series resistance (high current)
 *       are weakest, and ln I against V is a straight line of slope 1/(n Vt) and intercept ln IS
 *       (Shockley, Bell Syst. Tech. J. 28 (1949) 435-489).</li>
 *   <li>Series resistance after Cheung &amp; Cheung, "Extraction of Schottky diode parameters from forward
 *       current-voltage characteristics", Appl. Phys. Lett. 49 (1986) 85-87: dV/d(ln I) = n Vt + I RS, a
 *       straight line in I whose slope is RS.</li>
 *   <li>Recombination current: the excess of the lowest-current points over the Shockley line, regressed the
 *       same way for ISR and NR.</li>
 * </ul>
 */
final class StartValues {
    /** Half-width of the Shockley window around the ideality minimum [decades of current]. */
    private static final double WINDOW_HALF_DECADES = 0.75;

    private StartValues() {
    }

    /** Shockley-line estimate of one sweep: IS at the sweep temperature [A], N [1], and where it was taken. */
    record Shockley(double saturationCurrent, double emission, double lowCurrent, double highCurrent) {
    }

    /** Points of one temperature, sorted by current. */
    static List<FitPoint> sorted(List<FitPoint> sweep) {
        List<FitPoint> s = new ArrayList<>(sweep);
        s.sort(Comparator.comparingDouble(FitPoint::current));
        return s;
    }

    /** Local ideality factors by central differences (ends copied from neighbours) [1]. */
    static double[] localIdeality(List<FitPoint> s, double vt) {
        int n = s.size();
        double[] out = new double[n];
        for (int i = 1; i < n - 1; i++) {
            double dv = s.get(i + 1).voltage() - s.get(i - 1).voltage();
            double dl = Math.log(s.get(i + 1).current() / s.get(i - 1).current());
            out[i] = dl > 0 ? dv / dl / vt : Double.NaN;
        }
        if (n >= 3) {
            out[0] = out[1];
            out[n - 1] = out[n - 2];
        }
        return out;
    }

    /** Shockley regression on the most exponential window of {@code sweep}. */
    static Shockley shockley(List<FitPoint> sweep) {
        List<FitPoint> s = sorted(sweep);
        double vt = Ngspice39.thermalVoltage(s.get(0).temperature());
        double[] n = localIdeality(s, vt);
        // smooth with a running median of five so that noise does not pick the window
        double best = Double.POSITIVE_INFINITY;
        int at = s.size() / 2;
        for (int i = 0; i < s.size(); i++) {
            double m = median(n, Math.max(0, i - 2), Math.min(s.size(), i + 3));
            if (m > 0.3 && m < best) {
                best = m;
                at = i;
            }
        }
        double centre = Math.log10(s.get(at).current());
        List<FitPoint> window = new ArrayList<>();
        double half = WINDOW_HALF_DECADES;
        while (window.size() < 4 && half < 20) {
            window.clear();
            for (FitPoint p : s) {
                if (Math.abs(Math.log10(p.current()) - centre) <= half) {
                    window.add(p);
                }
            }
            half *= 1.5;
        }
        double[] fit = regress(window, p -> p.voltage(), p -> Math.log(p.current()));
        // ln I = a + b V  =>  n = 1/(b Vt), IS = exp(a)
        double emission = 1 / (fit[1] * vt);
        double is = Math.exp(fit[0]);
        if (!(emission > 0.3) || !Double.isFinite(is)) {
            emission = best;
            is = s.get(at).current() / Math.exp(s.get(at).voltage() / (emission * vt));
        }
        return new Shockley(is, emission, window.get(0).current(), window.get(window.size() - 1).current());
    }

    /** Saturation current of a sweep with the emission coefficient held at {@code emission} [A]. */
    static double saturationCurrentAt(List<FitPoint> sweep, double emission, double lowCurrent, double highCurrent) {
        double vt = Ngspice39.thermalVoltage(sweep.get(0).temperature());
        double sum = 0;
        int count = 0;
        for (FitPoint p : sweep) {
            if (p.current() >= lowCurrent && p.current() <= highCurrent) {
                sum += Math.log(p.current()) - p.voltage() / (emission * vt);
                count++;
            }
        }
        if (count == 0) {
            for (FitPoint p : sweep) {
                sum += Math.log(p.current()) - p.voltage() / (emission * vt);
                count++;
            }
        }
        return Math.exp(sum / count);
    }

    /**
     * Series resistance by Cheung &amp; Cheung (1986), Eq. (5): dV/d(ln I) against I over the points above
     * the Shockley window; falls back to the excess voltage of the top points when the line is unusable [ohm].
     */
    static double seriesResistance(List<FitPoint> sweep, Shockley sh) {
        List<FitPoint> s = sorted(sweep);
        double vt = Ngspice39.thermalVoltage(s.get(0).temperature());
        List<double[]> xy = new ArrayList<>();
        for (int i = 1; i < s.size() - 1; i++) {
            if (s.get(i).current() < sh.highCurrent()) {
                continue;
            }
            double dv = s.get(i + 1).voltage() - s.get(i - 1).voltage();
            double dl = Math.log(s.get(i + 1).current() / s.get(i - 1).current());
            if (dl > 0) {
                // abscissa: the secant of I over the same difference, dI/d(ln I) = I taken consistently with the
                // finite difference of V, so the I·RS part is differenced exactly (a plain I_i would bias RS by
                // sinh(h)/h, 0.2 % at 20 points per decade)
                double di = s.get(i + 1).current() - s.get(i - 1).current();
                xy.add(new double[] {di / dl, dv / dl});
            }
        }
        if (xy.size() >= 3) {
            double[] fit = regressPairs(xy);
            if (fit[1] > 0 && Double.isFinite(fit[1])) {
                return fit[1];
            }
        }
        // excess voltage over the Shockley line at the top points
        double best = 0;
        for (int i = Math.max(0, s.size() - 3); i < s.size(); i++) {
            FitPoint p = s.get(i);
            double vj = sh.emission() * vt * Math.log(p.current() / sh.saturationCurrent() + 1);
            best = Math.max(best, (p.voltage() - vj) / p.current());
        }
        return best;
    }

    /**
     * Recombination start (ISR at the sweep temperature [A], NR [1]) from the excess current of the points
     * below the Shockley window; null when there is no measurable excess.
     */
    static double[] recombination(List<FitPoint> sweep, Shockley sh) {
        double vt = Ngspice39.thermalVoltage(sweep.get(0).temperature());
        List<double[]> xy = new ArrayList<>();
        for (FitPoint p : sweep) {
            if (p.current() >= sh.lowCurrent()) {
                continue;
            }
            double ideal = sh.saturationCurrent() * Math.expm1(p.voltage() / (sh.emission() * vt));
            double excess = p.current() - ideal;
            if (excess > 0.05 * p.current()) {
                xy.add(new double[] {p.voltage(), Math.log(excess)});
            }
        }
        if (xy.size() >= 3) {
            double[] fit = regressPairs(xy);
            double nr = 1 / (fit[1] * vt);
            if (nr > sh.emission() && nr < 20) {
                return new double[] {Math.exp(fit[0]), nr};
            }
        }
        return null;
    }

    /**
     * Shockley lines of the low-, mid- and high-current thirds of a sweep (by decades of current), each a least-squares
     * line ln I = a + b (V - RS I) through the points of its third, with RS the start value: {IS at the sweep
     * temperature [A], N [1]} per region, or null for a region with fewer than 3 points or no usable slope. These are
     * the regional starts of the multi-start forward fit: in a sweep carried by two exponential terms, one region or
     * another shows each term nearly alone.
     */
    static double[][] regionalLines(List<FitPoint> sweep, double seriesResistance) {
        List<FitPoint> s = sorted(sweep);
        double vt = Ngspice39.thermalVoltage(s.get(0).temperature());
        double lo = Math.log(s.get(0).current());
        double hi = Math.log(s.get(s.size() - 1).current());
        double[][] out = new double[3][];
        for (int r = 0; r < 3; r++) {
            double from = lo + r * (hi - lo) / 3;
            double to = lo + (r + 1) * (hi - lo) / 3;
            List<double[]> xy = new ArrayList<>();
            for (FitPoint p : s) {
                double l = Math.log(p.current());
                if (l >= from - 1e-12 && l <= to + 1e-12) {
                    xy.add(new double[] {p.voltage() - seriesResistance * p.current(), l});
                }
            }
            if (xy.size() < 3) {
                continue;
            }
            double[] fit = regressPairs(xy);
            double n = 1 / (fit[1] * vt);
            if (n > 0.3 && n < 100 && Double.isFinite(fit[0])) {
                out[r] = new double[] {Math.exp(fit[0]), n};
            }
        }
        return out;
    }

    /**
     * Whether the low-, mid- and high-current thirds of a sweep (by decades of current, as in {@link #regionalLines})
     * follow different Shockley lines, by Chow's test of equal regression coefficients across groups (Chow, "Tests of
     * equality between sets of coefficients in two linear regressions", Econometrica 28 (1960) 591-605): one weighted
     * least-squares line V - RS I = a + b ln I (weights 1/sigma^2) through the points of every third, against one line
     * per third; with m points in g thirds, F = ((RSS_1 - RSS_g) / (2 (g - 1))) / (RSS_g / (m - 2 g)) follows Fisher's F
     * distribution with 2 (g - 1) and m - 2 g degrees of freedom when the thirds share one line and the residuals are
     * independent Gaussian noise. The lines differ when F exceeds that distribution's (1 - {@code level}) quantile ({@link FisherF}).
     * Each point belongs to one third; a third with fewer than 3 points is left out. The test is scale-free (the ratio
     * of two sums of squares), as the information criterion of the term selection is. True (cannot tell them apart
     * from noise, so assume they differ) when fewer than two thirds remain, no degree of freedom is left, or the
     * per-third lines fit exactly while the common line does not.
     *
     * @param level the test's size: the chance of calling one line two when the noise alone differs [1]
     */
    static boolean regionalLinesDiffer(List<FitPoint> sweep, double seriesResistance, double level) {
        List<FitPoint> s = sorted(sweep);
        double lo = Math.log(s.get(0).current());
        double hi = Math.log(s.get(s.size() - 1).current());
        List<List<double[]>> groups = new ArrayList<>();
        for (int r = 0; r < 3; r++) {
            groups.add(new ArrayList<>());
        }
        for (FitPoint p : s) {
            double l = Math.log(p.current());
            int r = hi > lo ? (int) Math.min(2, Math.floor(3 * (l - lo) / (hi - lo))) : 0;
            groups.get(r).add(new double[] {l, p.voltage() - seriesResistance * p.current(), 1 / (p.sigma() * p.sigma())});
        }
        List<double[]> all = new ArrayList<>();
        double separate = 0;
        int g = 0;
        for (List<double[]> grp : groups) {
            if (grp.size() < 3) {
                continue;
            }
            g++;
            all.addAll(grp);
            separate += weightedLineRss(grp);
        }
        int m = all.size();
        int numerator = 2 * (g - 1);
        int denominator = m - 2 * g;
        if (g < 2 || denominator < 1) {
            return true;
        }
        double common = weightedLineRss(all);
        if (!(separate > 0)) {
            return common > 0;
        }
        double f = Math.max(common - separate, 0) / numerator / (separate / denominator);
        return FisherF.upperTail(f, numerator, denominator) < level;
    }

    /** Weighted residual sum of squares of the least-squares line y = a + b x through {x, y, weight} triples. */
    private static double weightedLineRss(List<double[]> xyw) {
        double sw = 0;
        double mx = 0;
        double my = 0;
        for (double[] p : xyw) {
            sw += p[2];
            mx += p[2] * p[0];
            my += p[2] * p[1];
        }
        mx /= sw;
        my /= sw;
        double sxx = 0;
        double sxy = 0;
        for (double[] p : xyw) {
            sxx += p[2] * (p[0] - mx) * (p[0] - mx);
            sxy += p[2] * (p[0] - mx) * (p[1] - my);
        }
        double b = sxx > 0 ? sxy / sxx : 0;
        // the residuals themselves, not syy - sxy^2/sxx, which cancels to rounding for a sweep close to its line
        double rss = 0;
        for (double[] p : xyw) {
            double r = p[1] - my - b * (p[0] - mx);
            rss += p[2] * r * r;
        }
        return rss;
    }

    /**
     * Activation energy and IS at Tnom from per-temperature saturation currents at a common N, with XTI held:
     * ln IS(T) - (XTI/N) ln(T/Tnom) = ln IS + EG (T/Tnom - 1)/(N Vt(T)). Returns {IS(Tnom) [A], EG [eV]}.
     */
    static double[] activationEnergy(double[] temperatures, double[] saturation, double emission, double xti,
                                     double tnom) {
        List<double[]> xy = new ArrayList<>();
        for (int k = 0; k < temperatures.length; k++) {
            double t = temperatures[k];
            double vt = Ngspice39.thermalVoltage(t);
            xy.add(new double[] {(t / tnom - 1) / (emission * vt),
                Math.log(saturation[k]) - xti / emission * Math.log(t / tnom)});
        }
        double[] fit = regressPairs(xy);
        return new double[] {Math.exp(fit[0]), fit[1]};
    }

    /** IS at Tnom from IS at T by the SPICE law with the given EG and XTI [A]. */
    static double toNominal(double isAtT, double t, double tnom, double emission, double eg, double xti) {
        double factor = TemperatureLaws.saturationCurrentAt(1.0, emission, eg, xti, t, tnom);
        return isAtT / factor;
    }

    /** The upper median of the finite values of {@code v[from..to)} ({@link Medians#upperMedian}). */
    private static double median(double[] v, int from, int to) {
        return Medians.upperMedian(v, from, to);
    }

    private static double[] regress(List<FitPoint> pts, java.util.function.ToDoubleFunction<FitPoint> fx,
                                    java.util.function.ToDoubleFunction<FitPoint> fy) {
        List<double[]> xy = new ArrayList<>();
        for (FitPoint p : pts) {
            xy.add(new double[] {fx.applyAsDouble(p), fy.applyAsDouble(p)});
        }
        return regressPairs(xy);
    }

    /** Ordinary least-squares line y = a + b x; returns {a, b}. */
    static double[] regressPairs(List<double[]> xy) {
        int n = xy.size();
        double mx = 0;
        double my = 0;
        for (double[] p : xy) {
            mx += p[0];
            my += p[1];
        }
        mx /= n;
        my /= n;
        double sxx = 0;
        double sxy = 0;
        for (double[] p : xy) {
            sxx += (p[0] - mx) * (p[0] - mx);
            sxy += (p[0] - mx) * (p[1] - my);
        }
        double b = sxx > 0 ? sxy / sxx : 0;
        return new double[] {my - b * mx, b};
    }
}
