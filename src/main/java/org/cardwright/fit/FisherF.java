package org.cardwright.fit;

/**
 * The upper tail of Fisher's F distribution, for {@link StartValues#regionalLinesDiffer}: P(F &gt; f) with d1 and d2
 * degrees of freedom is the regularized incomplete beta function I_x(d2/2, d1/2) at x = d2/(d2 + d1 f) (Abramowitz
 * &amp; Stegun, "Handbook of Mathematical Functions", NBS 1964, 26.6.2 and 26.5.1; recalled), evaluated by its
 * continued fraction with the modified Lentz method and ln Gamma by the Lanczos approximation (Press, Teukolsky,
 * Vetterling &amp; Flannery, "Numerical Recipes in C", 2nd ed., Cambridge University Press 1992, sections 6.1 and 6.4,
 * betacf and gammln; Lanczos, "A precision approximation of the gamma function", J. SIAM Numer. Anal. B 1 (1964)
 * 86-96; both recalled). Written here
 * rather than taken from Commons Math's distributions, whose first use in a short command loads and verifies a
 * dozen classes (about 15 ms, docs/performance.md section 11); {@code FisherFTest} holds the two to 1e-7 relative.
 */
final class FisherF {
    /** Relative change of the continued fraction at which it has converged [1]. */
    private static final double EPSILON = 1e-15;
    /** A number near the smallest positive double, to keep the Lentz recursion away from 0 [1]. */
    private static final double TINY = 1e-300;
    /** Terms of the continued fraction before it is taken as converged anyway (it converges in O(sqrt(max(a, b)))). */
    private static final int MAX_TERMS = 100_000;
    /** Lanczos coefficients for g = 5, n = 6 (Numerical Recipes, section 6.1): ln Gamma to about 2e-10 relative. */
    private static final double[] LANCZOS = {76.18009172947146, -86.50532032941677, 24.01409824083091,
        -1.231739572450155, 0.1208650973866179e-2, -0.5395239384953e-5};

    private FisherF() {
    }

    /** P(F &gt; f) for Fisher's F distribution with {@code d1} and {@code d2} degrees of freedom [1]. */
    static double upperTail(double f, double d1, double d2) {
        if (!(d1 > 0) || !(d2 > 0)) {
            throw new IllegalArgumentException("degrees of freedom must be positive, got " + d1 + " and " + d2);
        }
        if (Double.isNaN(f)) {
            return Double.NaN;
        }
        if (f <= 0) {
            return 1;
        }
        if (f == Double.POSITIVE_INFINITY) {
            return 0;
        }
        return regularizedBeta(d2 / (d2 + d1 * f), d2 / 2, d1 / 2);
    }

    /** The regularized incomplete beta function I_x(a, b), 0 &lt;= x &lt;= 1 [1]. */
    static double regularizedBeta(double x, double a, double b) {
        if (x <= 0) {
            return 0;
        }
        if (x >= 1) {
            return 1;
        }
        double front = Math.exp(lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) + b * Math.log1p(-x));
        // the fraction converges fast below the mean (a + 1)/(a + b + 2); above it, the symmetry I_x(a,b) = 1 - I_1-x(b,a)
        if (x < (a + 1) / (a + b + 2)) {
            return front * fraction(x, a, b) / a;
        }
        return 1 - front * fraction(1 - x, b, a) / b;
    }

    /** The continued fraction of I_x(a, b) by the modified Lentz method (Numerical Recipes, section 6.4, betacf). */
    private static double fraction(double x, double a, double b) {
        double qab = a + b;
        double qap = a + 1;
        double qam = a - 1;
        double c = 1;
        double d = 1 - qab * x / qap;
        d = 1 / (Math.abs(d) < TINY ? TINY : d);
        double h = d;
        for (int m = 1; m <= MAX_TERMS; m++) {
            int m2 = 2 * m;
            double aa = m * (b - m) * x / ((qam + m2) * (a + m2));
            d = 1 + aa * d;
            d = 1 / (Math.abs(d) < TINY ? TINY : d);
            c = 1 + aa / c;
            c = Math.abs(c) < TINY ? TINY : c;
            h *= d * c;
            aa = -(a + m) * (qab + m) * x / ((a + m2) * (qap + m2));
            d = 1 + aa * d;
            d = 1 / (Math.abs(d) < TINY ? TINY : d);
            c = 1 + aa / c;
            c = Math.abs(c) < TINY ? TINY : c;
            double del = d * c;
            h *= del;
            if (Math.abs(del - 1) < EPSILON) {
                break;
            }
        }
        return h;
    }

    /** ln Gamma(z) for z &gt; 0 by the Lanczos approximation (Numerical Recipes, section 6.1, gammln). */
    static double lnGamma(double z) {
        double y = z;
        double tmp = z + 5.5;
        tmp -= (z + 0.5) * Math.log(tmp);
        double ser = 1.000000000190015;
        for (double c : LANCZOS) {
            ser += c / ++y;
        }
        return -tmp + Math.log(2.5066282746310005 * ser / z);
    }
}
