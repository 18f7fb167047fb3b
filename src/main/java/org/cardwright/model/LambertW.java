package org.cardwright.model;

/**
 * The real branches of the Lambert W function, the inverse of {@code w -> w e^w}, in double precision.
 *
 * <p><b>Why cardwright needs it.</b> A junction diode with an ohmic series resistance obeys the implicit
 * equation {@code I = Is (exp((V - I R)/(n Vt)) - 1)}. Banwell and Jayakumar showed that it has the exact
 * explicit solution
 * <pre>
 *     I = (n Vt / R) W0[(Is R / (n Vt)) exp((V + Is R) / (n Vt))] - Is
 * </pre>
 * so the forward characteristic, including the region where the series resistance dominates, is computed
 * without a Newton loop on the current and without its convergence questions. At large forward bias the
 * argument of W0 overflows a double (already near V = 20 V with n Vt = 26 mV); {@link #w0OfExp(double)}
 * takes the logarithm of the argument, {@code ln(Is R/(n Vt)) + (V + Is R)/(n Vt)}, and never forms it.
 *
 * <p><b>Method.</b> A starting value from a closed form, then a few steps of an iteration of third order or
 * better until the correction is far below the double-precision spacing:
 * <ul>
 *   <li>Near the branch point {@code -1/e} (both branches, {@code x < -0.3}): the branch-point series in
 *       {@code p = sqrt(2 (e x + 1))} of Corless et al., Section 4, gives the start; the root is then
 *       polished by Newton's method on {@code 1 + w e^(1+w) = e x + 1} written as a power series in
 *       {@code t = 1 + w}. With {@code e x + 1} formed from a two-part constant for {@code 1/e}, this keeps
 *       full relative precision in {@code 1 + w}, which the usual residual {@code w e^w - x} loses there.</li>
 *   <li>Elsewhere on W0: Winitzki's uniform approximation {@code ln(1+x) (1 - ln(1 + ln(1+x))/(2 + ln(1+x)))}
 *       as the start; for {@link #w0OfExp(double)} above {@code lnX = 1}, and on W-1 away from the branch
 *       point, the asymptotic expansion {@code L1 - L2 + L2/L1 + ...} with {@code L1 = ln x},
 *       {@code L2 = ln ln x} (Corless et al., Section 4).</li>
 *   <li>Refinement by the iteration of Fritsch, Shafer and Crowley, which works on {@code ln(x/w) - w} and so
 *       runs unchanged in log space ({@code lnX - ln w - w}) when x itself is not representable.</li>
 * </ul>
 *
 * <p>References:
 * <ul>
 *   <li>R. M. Corless, G. H. Gonnet, D. E. G. Hare, D. J. Jeffrey, D. E. Knuth, "On the Lambert W function",
 *       Adv. Comput. Math. 5 (1996) 329-359 (citation recalled).</li>
 *   <li>F. N. Fritsch, R. E. Shafer, W. P. Crowley, "Algorithm 443: Solution of the transcendental equation
 *       w e^w = x", Commun. ACM 16(2) (1973) 123-124 (citation recalled).</li>
 *   <li>S. Winitzki, "Uniform approximations for transcendental functions", Computational Science and Its
 *       Applications - ICCSA 2003, Lecture Notes in Computer Science 2667 (2003) 780-789 (citation recalled).</li>
 *   <li>T. C. Banwell, A. Jayakumar, "Exact analytical solution for current flow through diode with series
 *       resistance", Electron. Lett. 36(4) (2000) 291-292, doi:10.1049/el:20000301.</li>
 * </ul>
 */
public final class LambertW {
    /** 1/e rounded to the nearest double; -INV_E_HI is the double nearest the branch point [1]. */
    private static final double INV_E_HI = 0.36787944117144233;
    /** 1/e - INV_E_HI, so that INV_E_HI + INV_E_LO carries 1/e to about 1e-33 [1]. */
    private static final double INV_E_LO = -1.2428753672788363e-17;
    /**
     * Below this x both branches use the branch-point method; chosen where the errors of the two methods
     * cross (measured: about 3e-16 relative either side) [1].
     */
    private static final double BRANCH_REGION = -0.3;
    /** Below this |x|, W0(x) = x - x^2 + ... rounds to x [1]. */
    private static final double W0_IS_IDENTITY = 0x1p-54;
    /** At or below this lnX, w0OfExp forms e^lnX <= e directly; above it works in log space [1]. */
    private static final double LOG_SPACE_FROM = 1.0;
    /** Below this |x|, x/w may underflow, so ln(x/w) is taken as a difference of logarithms [1]. */
    private static final double SMALL_ARGUMENT = 0x1p-1000;
    /** A correction below this relative size leaves an error far under one ulp after it is applied [1]. */
    private static final double CONVERGED = 1e-9;
    /** Iteration cap; convergence takes two or three steps from the starting values used here. */
    private static final int MAX_STEPS = 8;

    private LambertW() {
    }

    /**
     * Principal branch W0(x) for x >= -1/e; NaN below -1/e. The double nearest -1/e (which lies 1.2e-17
     * below the true branch point) is taken as the branch point and gives -1. W0(+inf) = +inf.
     */
    public static double w0(double x) {
        if (Double.isNaN(x) || x < -INV_E_HI) {
            return Double.NaN;
        }
        if (x == Double.POSITIVE_INFINITY) {
            return x;
        }
        if (Math.abs(x) < W0_IS_IDENTITY) {
            return x;
        }
        if (x < BRANCH_REGION) {
            return nearBranchPoint(x, true);
        }
        double l = Math.log1p(x);
        double w = l * (1.0 - Math.log1p(l) / (2.0 + l)); // Winitzki (2003), uniform start value
        for (int i = 0; i < MAX_STEPS; i++) {
            double eps = fritschCorrection(w, logRatio(x, w) - w);
            w += w * eps;
            if (Math.abs(eps) < CONVERGED) {
                break;
            }
        }
        return w;
    }

    /**
     * Lower branch W-1(x) for -1/e <= x < 0; NaN elsewhere (including x = -0.0, where the branch tends to
     * -infinity). The double nearest -1/e is taken as the branch point and gives -1.
     */
    public static double wm1(double x) {
        if (Double.isNaN(x) || x < -INV_E_HI || x >= 0.0) {
            return Double.NaN;
        }
        if (x < BRANCH_REGION) {
            return nearBranchPoint(x, false);
        }
        double l1 = Math.log(-x);
        double l2 = Math.log(-l1);
        double w = l1 - l2 + l2 / l1; // asymptotic expansion, Corless et al. (1996) Section 4
        for (int i = 0; i < MAX_STEPS; i++) {
            double eps = fritschCorrection(w, logRatio(x, w) - w);
            w += w * eps;
            if (Math.abs(eps) < CONVERGED) {
                break;
            }
        }
        return w;
    }

    /**
     * W0(exp(lnX)) for any lnX, without forming exp(lnX) when that would lose or overflow: for
     * {@code lnX > 1} the equation is solved in log space, {@code w + ln w = lnX}, so arguments far beyond
     * the double range (lnX up to 1e300 and Double.MAX_VALUE) are fine. For {@code lnX <= 1} the argument
     * e^lnX <= e is representable and {@link #w0(double)} is used on it. lnX = -inf gives 0, +inf gives +inf.
     */
    public static double w0OfExp(double lnX) {
        if (Double.isNaN(lnX)) {
            return Double.NaN;
        }
        if (lnX <= LOG_SPACE_FROM) {
            return w0(Math.exp(lnX));
        }
        if (lnX == Double.POSITIVE_INFINITY) {
            return lnX;
        }
        double l1 = lnX;
        double l2 = Math.log(l1);
        // Asymptotic expansion, Corless et al. (1996) Section 4, to the 1/L1^2 term.
        double w = l1 - l2 + l2 / l1 + l2 * (l2 - 2.0) / (2.0 * l1 * l1);
        for (int i = 0; i < MAX_STEPS; i++) {
            double eps = fritschCorrection(w, lnX - Math.log(w) - w);
            w += w * eps;
            if (Math.abs(eps) < CONVERGED) {
                break;
            }
        }
        return w;
    }

    /**
     * One step of Fritsch, Shafer and Crowley (1973): given the current w and z = ln(x/w) - w, the relative
     * correction eps such that w (1 + eps) is the next iterate.
     */
    private static double fritschCorrection(double w, double z) {
        // FSC write q = 2 (1 + w) (1 + w + 2z/3) and eps = z/(1 + w) (q - z)/(q - 2z). Dividing q and z by
        // 2 (1 + w) gives the same eps without forming (1 + w)^2, which overflows for w above 1e154.
        double onePlusW = 1.0 + w;
        double u = z / onePlusW;
        double half = onePlusW + 2.0 * z / 3.0;
        return u * (half - 0.5 * u) / (half - u);
    }

    /** ln(x/w) for x and w of the same sign, safe when x/w would underflow. */
    private static double logRatio(double x, double w) {
        if (Math.abs(x) < SMALL_ARGUMENT) {
            return Math.log(Math.abs(x)) - Math.log(Math.abs(w));
        }
        return Math.log(x / w);
    }

    /**
     * Both branches for -1/e <= x < BRANCH_REGION. Works with t = 1 + w and r = e x + 1, which satisfy
     * excess(t) = 1 + (t - 1) e^t = r exactly; t > 0 on W0 and t < 0 on W-1.
     */
    private static double nearBranchPoint(double x, boolean principal) {
        // x + INV_E_HI is exact here (Sterbenz), so r carries full relative precision however close x is to -1/e.
        double r = Math.E * ((x + INV_E_HI) + INV_E_LO);
        if (r <= 0.0) {
            return -1.0; // only x == -INV_E_HI, the double nearest the branch point
        }
        double p = Math.sqrt(2.0 * r);
        if (!principal) {
            p = -p;
        }
        // Branch-point series W = -1 + p - p^2/3 + 11/72 p^3 - 43/540 p^4 + 769/17280 p^5 - ...,
        // Corless et al. (1996) Section 4; W-1 takes -p.
        double t = p * (1.0 + p * (-1.0 / 3.0 + p * (11.0 / 72.0 + p * (-43.0 / 540.0 + p * (769.0 / 17280.0)))));
        for (int i = 0; i < MAX_STEPS; i++) {
            double step = (excess(t) - r) / (t * Math.exp(t)); // Newton: d excess/dt = t e^t
            t -= step;
            if (Math.abs(step) < CONVERGED * Math.abs(t)) {
                break;
            }
        }
        return t - 1.0;
    }

    /**
     * 1 + (t - 1) e^t = sum over k >= 2 of (k - 1) t^k / k!, summed as a series so that it keeps full
     * relative precision for small t, where the closed form cancels (|t| < 1.1 here).
     */
    private static double excess(double t) {
        double term = 0.5 * t * t; // t^k / k! at k = 2
        double sum = term;
        for (int k = 3; k < 40; k++) {
            term *= t / k;
            double add = (k - 1) * term;
            sum += add;
            if (Math.abs(add) <= 1e-18 * Math.abs(sum)) {
                break;
            }
        }
        return sum;
    }
}
