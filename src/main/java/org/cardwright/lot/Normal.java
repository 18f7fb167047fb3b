package org.cardwright.lot;

/**
 * The standard normal distribution's upper tail and its inverse, to the precision a statistical limit needs.
 * The complementary error function is the Chebyshev fit of W. H. Press, S. A. Teukolsky, W. T. Vetterling and
 * B. P. Flannery, "Numerical Recipes in C", 2nd ed., Cambridge University Press 1992, section 6.2 ({@code erfcc},
 * fractional error below 1.2e-7 everywhere; recalled); the inverse is found by bisection.
 */
final class Normal {
    private Normal() {
    }

    /** erfc(x). */
    static double erfc(double x) {
        double z = Math.abs(x);
        double t = 1.0 / (1.0 + 0.5 * z);
        double ans = t * Math.exp(-z * z - 1.26551223 + t * (1.00002368 + t * (0.37409196 + t * (0.09678418
                + t * (-0.18628806 + t * (0.27886807 + t * (-1.13520398 + t * (1.48851587
                + t * (-0.82215223 + t * 0.17087277)))))))));
        return x >= 0 ? ans : 2.0 - ans;
    }

    /** P(Z &gt; z) for standard normal Z. */
    static double upperTail(double z) {
        return 0.5 * erfc(z / Math.sqrt(2));
    }

    /** z with P(Z &gt; z) = p, for 0 &lt; p &lt; 0.5. */
    static double upperQuantile(double p) {
        double lo = 0;
        double hi = 40;
        for (int i = 0; i < 200; i++) {
            double mid = 0.5 * (lo + hi);
            if (upperTail(mid) > p) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
