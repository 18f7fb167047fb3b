package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.List;
import org.cardwright.testsupport.ReferenceTable;
import org.junit.jupiter.api.Test;

/**
 * Checks of {@link LambertW} against published and independently computed values.
 *
 * <p>Sources named beside each check: the table values are in src/test/resources/reference/lambert-w.csv (40-digit
 * values, each verified by w e^w = x; its header names the source), copied from the project's shared reference
 * notes ("check-values.md", which also give the Banwell and Jayakumar number, section "Diode with series
 * resistance, exact"). Corless et al. (1996) is cited from memory.
 *
 * <p>W is dimensionless, so its tolerances are relative or absolute in units of 1; the diode check is in
 * amperes.
 */
class LambertWTest {
    /** Table values: the references are good to 30 digits; 1e-15 is about 5 ulp of the result [1]. */
    private static final double TABLE_RELATIVE = 1e-15;
    /**
     * x = -0.367879 is 4.4e-7 above -1/e: the decimal input rounds to a double 1.2e-17 away, and dW/dx there is
     * 1.75e3, so the double argument's true W0 already differs from the table by 2.0e-14 relative; a
     * half-ulp input error (2.8e-17) bounds that at 4.9e-14 [1].
     */
    private static final double NEAR_BRANCH_RELATIVE = 5e-14;
    /** The branch point from the double nearest -1/e (check-values.md: "a tolerance of ~1e-7") [1]. */
    private static final double BRANCH_POINT_ABSOLUTE = 1e-7;
    /** One ulp of a double near -1: the finest step w can take next to the branch point [1]. */
    private static final double ULP_NEAR_MINUS_ONE = Math.ulp(1.0);
    /** w0OfExp in log space against w0 on the formed argument: exp adds at most 1 ulp to x, 1e-16 in W [1]. */
    private static final double LOG_SPACE_AGREEMENT_RELATIVE = 1e-14;
    /** Residual of w + ln w = lnX: two roundings in forming it, each 1.1e-16 relative to lnX [1]. */
    private static final double LOG_SPACE_RESIDUAL_RELATIVE = 1e-15;
    /** Against bisection: the bisection root is good to about 1e-16/(1 + w), 6e-16 at worst here [1]. */
    private static final double BISECTION_RELATIVE = 1e-13;
    /** W0 = 10.522460 is given to 6 decimals: half a unit of the last digit [1]. */
    private static final double DIODE_W_DIGITS = 0.5e-6;
    /** COMPUTED current 1.08485174e-03 A is given to 9 significant digits: half a unit of the last [A]. */
    private static final double DIODE_CURRENT_COMPUTED_DIGITS = 0.5e-11;
    /** READ current 1.08485e-3 A is given to 6 significant digits: half a unit of the last [A]. */
    private static final double DIODE_CURRENT_READ_DIGITS = 0.5e-8;
    /**
     * Diode equation residual: an error in I enters the exponent multiplied by I R/(n Vt) = 10.5, so a few
     * ulp in I show as about 1e-14 relative in the residual [1].
     */
    private static final double DIODE_EQUATION_RELATIVE = 1e-13;
    /** The next double above -1/e lies 4.3e-17 above the true branch point: within 1e-16 of it [1]. */
    private static final double NEXT_UP_DISTANCE = 1e-16;
    /** At lnX = 10 ln 1e300 the root sits 8.8 below lnX: more than 8 below shows w is not lnX itself [1]. */
    private static final double ROOT_BELOW_LNX = 8.0;
    /** lnX = 10 ln 1e300, an argument whose exponential overflows a double [1]. */
    private static final double OVERFLOWING_LN_X = Math.log(1e300) * 10;

    /** The table of W values, with its source in its header. */
    private static final String TABLE = "/reference/lambert-w.csv";
    /** The table's argument 4.4e-7 above -1/e. */
    private static final double NEAR_BRANCH_X = -0.367879;

    /** W at x on the branch (0 or -1), from {@link #TABLE}. */
    private static double reference(int branch, double x) {
        return ReferenceTable.rows(TABLE).stream().filter(row -> row[0] == branch && row[1] == x)
                .findFirst().orElseThrow(() -> new AssertionError("no row W" + branch + "(" + x + ") in " + TABLE))[2];
    }

    // ---- published and 40-digit table values -------------------------------------------------------------

    @Test
    void principalBranchMatchesTable() {
        // src/test/resources/reference/lambert-w.csv (40-digit values, source in its header), principal branch
        // away from the branch point.
        List<double[]> table = ReferenceTable.rows(TABLE).stream()
                .filter(row -> row[0] == 0 && row[1] != NEAR_BRANCH_X && row[1] != 1.0).toList();
        assertEquals(11, table.size(), "rows of " + TABLE);
        double worst = 0;
        for (double[] row : table) {
            worst = Math.max(worst, assertRelative(row[2], LambertW.w0(row[1]), TABLE_RELATIVE, "W0(" + row[1] + ")"));
        }
        System.out.printf("LambertW table W0: max relative error %.2e%n", worst);
    }

    @Test
    void principalBranchNearBranchPointMatchesTable() {
        // lambert-w.csv (COMPUTED): x = -0.367879, looser tolerance, see NEAR_BRANCH_RELATIVE.
        double error = assertRelative(reference(0, NEAR_BRANCH_X), LambertW.w0(NEAR_BRANCH_X),
                NEAR_BRANCH_RELATIVE, "W0(-0.367879)");
        System.out.printf("LambertW W0(-0.367879): relative error %.2e%n", error);
    }

    @Test
    void lowerBranchMatchesTable() {
        // lambert-w.csv: W-1(-0.1) and W-1(-1e-10) (COMPUTED).
        assertRelative(reference(-1, -0.1), LambertW.wm1(-0.1), TABLE_RELATIVE, "W-1(-0.1)");
        assertRelative(reference(-1, -1e-10), LambertW.wm1(-1e-10), TABLE_RELATIVE, "W-1(-1e-10)");
    }

    @Test
    void omegaConstant() {
        // lambert-w.csv: W0(1) = 0.56714329040978387299996866221 (OEIS A030178, READ).
        assertRelative(reference(0, 1.0), LambertW.w0(1.0), TABLE_RELATIVE, "W0(1)");
    }

    @Test
    void identities() {
        // check-values.md identities (Corless et al. 1996, recalled).
        double ln2 = Math.log(2.0);
        assertEquals(0.0, LambertW.w0(0.0), 0.0, "W0(0) = 0");
        assertRelative(1.0, LambertW.w0(Math.E), TABLE_RELATIVE, "W0(e) = 1");
        assertRelative(ln2, LambertW.w0(2.0 * ln2), TABLE_RELATIVE, "W0(2 ln 2) = ln 2");
        assertRelative(-ln2, LambertW.w0(-ln2 / 2.0), TABLE_RELATIVE, "W0(-ln2/2) = -ln 2");
        assertRelative(-2.0 * ln2, LambertW.wm1(-ln2 / 2.0), TABLE_RELATIVE, "W-1(-ln2/2) = -2 ln 2");
        // Branch point: both branches meet at -1 (check-values.md, tolerance ~1e-7 there).
        double minusInverseE = -Math.exp(-1.0);
        assertEquals(-1.0, LambertW.w0(minusInverseE), BRANCH_POINT_ABSOLUTE, "W0(-1/e) = -1");
        assertEquals(-1.0, LambertW.wm1(minusInverseE), BRANCH_POINT_ABSOLUTE, "W-1(-1/e) = -1");
    }

    @Test
    void oneUlpAboveBranchPointFollowsBranchSeries() {
        // Corless et al. (1996) branch-point series W = -1 +/- p - p^2/3 + ..., p = sqrt(2 (e x + 1)) (recalled);
        // the digits of 1/e are from memory. The next double above -1/e is 4.3e-17 above the true branch
        // point, so p = 1.5e-8 and the p^3 term (4e-25) is far below one ulp of w.
        double x = Math.nextUp(-Math.exp(-1.0));
        BigDecimal inverseE = new BigDecimal("0.367879441171442321595523770161460867445811131031767834507837");
        double distance = new BigDecimal(x).add(inverseE).doubleValue();
        assertTrue(distance > 0 && distance < NEXT_UP_DISTANCE, "x is just above -1/e: " + distance);
        double p = Math.sqrt(2.0 * Math.E * distance);
        assertEquals(-1.0 + p - p * p / 3.0, LambertW.w0(x), ULP_NEAR_MINUS_ONE, "W0 one ulp above -1/e");
        assertEquals(-1.0 - p - p * p / 3.0, LambertW.wm1(x), ULP_NEAR_MINUS_ONE, "W-1 one ulp above -1/e");
    }

    // ---- log space -----------------------------------------------------------------------------------------

    @Test
    void logSpaceAgreesWithFormedArgument() {
        // Cross-method: for lnX <= 1 w0OfExp forms e^lnX itself, so there the two coincide by design; above 1
        // it solves w + ln w = lnX and this compares two independent paths.
        double worst = 0;
        for (int k = -1400; k <= 1400; k++) {
            double lnX = 0.5 * k;
            double expected = LambertW.w0(Math.exp(lnX));
            double error = assertRelative(expected, LambertW.w0OfExp(lnX), LOG_SPACE_AGREEMENT_RELATIVE,
                    "w0OfExp(" + lnX + ")");
            if (lnX > 1.0) {
                worst = Math.max(worst, error);
            }
        }
        System.out.printf("LambertW w0OfExp vs w0(exp), lnX in (1, 700]: max relative difference %.2e%n", worst);
    }

    @Test
    void logSpaceMatchesTableBeyondFormedRange() {
        // lambert-w.csv: W0(1e100), W0(1e300), reached through lnX = 100 ln 10 and 300 ln 10.
        double ln10 = Math.log(10.0);
        assertRelative(reference(0, 1e100), LambertW.w0OfExp(100 * ln10), TABLE_RELATIVE,
                "w0OfExp(ln 1e100)");
        assertRelative(reference(0, 1e300), LambertW.w0OfExp(300 * ln10), TABLE_RELATIVE,
                "w0OfExp(ln 1e300)");
    }

    @Test
    void logSpaceSolvesItsEquationForOverflowingArguments() {
        // Defining equation of W in log space, w + ln w = lnX (Corless et al. 1996, recalled).
        double[] lnXs = {Math.log(1e300) * 10, 1e4, 1e5, 1e10, 1e100, 1e300, Double.MAX_VALUE};
        double worst = 0;
        for (double lnX : lnXs) {
            double w = LambertW.w0OfExp(lnX);
            // w = lnX - ln w + ...; once ln w is below half an ulp of lnX (lnX above about 1e17) w rounds to lnX.
            assertTrue(w > 0 && w <= lnX, "w0OfExp(" + lnX + ") = " + w + " must lie in (0, lnX]");
            double residual = Math.abs(w + Math.log(w) - lnX) / lnX;
            assertTrue(residual <= LOG_SPACE_RESIDUAL_RELATIVE,
                    "w + ln w - lnX relative " + residual + " at lnX = " + lnX);
            worst = Math.max(worst, residual);
        }
        // At lnX = 10 ln 1e300 the root sits 8.8 below lnX, so a w of lnX itself would fail the residual above.
        assertTrue(OVERFLOWING_LN_X - LambertW.w0OfExp(OVERFLOWING_LN_X) > ROOT_BELOW_LNX, "w is not lnX");
        System.out.printf("LambertW w0OfExp log-space residual: max relative %.2e%n", worst);
    }

    // ---- cross-method agreement with a bracketing root finder --------------------------------------------

    @Test
    void principalBranchAgreesWithBisection() {
        double worst = 0;
        for (int k = 0; k < 200; k++) {
            double x = Math.pow(10.0, -12.0 + 24.0 * k / 199.0);
            double reference = bisect(x, 0.0, 1.0 + Math.log1p(x)); // at 1 + ln(1+x), w e^w > 1 + x > x
            worst = Math.max(worst, assertRelative(reference, LambertW.w0(x), BISECTION_RELATIVE, "W0(" + x + ")"));
        }
        double inverseE = Math.exp(-1.0);
        for (int k = 1; k <= 50; k++) {
            double x = -inverseE * k / 51.0;
            double reference = bisect(x, -1.0, 0.0); // w e^w - x is < 0 at -1 and > 0 at 0
            worst = Math.max(worst, assertRelative(reference, LambertW.w0(x), BISECTION_RELATIVE, "W0(" + x + ")"));
        }
        System.out.printf("LambertW W0 vs bisection (250 points): max relative difference %.2e%n", worst);
    }

    @Test
    void lowerBranchAgreesWithBisection() {
        double worst = 0;
        for (int k = 0; k < 50; k++) {
            double x = -Math.pow(10.0, -300.0 + (300.0 + Math.log10(0.36)) * k / 49.0);
            double reference = bisect(x, -1000.0, -1.0); // w e^w - x is > 0 at -1000 and < 0 at -1
            worst = Math.max(worst, assertRelative(reference, LambertW.wm1(x), BISECTION_RELATIVE, "W-1(" + x + ")"));
        }
        System.out.printf("LambertW W-1 vs bisection (50 points): max relative difference %.2e%n", worst);
    }

    // ---- the reason cardwright needs W ----------------------------------------------------------------------

    @Test
    void diodeWithSeriesResistanceWorkedNumber() {
        // Banwell & Jayakumar, Electron. Lett. 36(4) (2000) 291-292, doi:10.1049/el:20000301; worked number
        // from check-values.md "Diode with series resistance, exact": READ 1.08485e-3 A (as reproduced in the
        // Boost.Math examples), COMPUTED 1.08485174e-03 A with W0 = 10.522460.
        double saturationCurrent = 25e-15;
        double emissionCoefficient = 1.0;
        double seriesResistance = 249.3;
        double voltage = 0.9;
        double thermalVoltage = 0.0257025;
        double nVt = emissionCoefficient * thermalVoltage;
        double isROverNVt = saturationCurrent * seriesResistance / nVt;
        double exponent = (voltage + saturationCurrent * seriesResistance) / nVt;

        double w = LambertW.w0(isROverNVt * Math.exp(exponent));
        double current = nVt / seriesResistance * w - saturationCurrent;
        assertEquals(10.522460, w, DIODE_W_DIGITS, "W0 of the Banwell-Jayakumar argument (COMPUTED)");
        assertEquals(1.08485174e-3, current, DIODE_CURRENT_COMPUTED_DIGITS, "diode current (COMPUTED) [A]");
        assertEquals(1.08485e-3, current, DIODE_CURRENT_READ_DIGITS, "diode current (READ) [A]");

        // The same current through the log-space entry, as the model uses it at large forward bias.
        double wLog = LambertW.w0OfExp(Math.log(isROverNVt) + exponent);
        double currentLog = nVt / seriesResistance * wLog - saturationCurrent;
        assertEquals(1.08485174e-3, currentLog, DIODE_CURRENT_COMPUTED_DIGITS, "diode current via w0OfExp [A]");

        // Invariant: the explicit current satisfies the implicit diode equation I = Is (exp((V - I R)/(n Vt)) - 1)
        // (Shockley equation with series resistance, common practice, no source).
        double implicit = saturationCurrent * Math.expm1((voltage - current * seriesResistance) / nVt);
        assertRelative(implicit, current, DIODE_EQUATION_RELATIVE, "diode equation residual");
    }

    // ---- outside the domain --------------------------------------------------------------------------------

    @Test
    void notANumberOutsideTheDomain() {
        // Definition of the real branches (Corless et al. 1996, recalled): W0 on [-1/e, inf), W-1 on [-1/e, 0).
        double belowBranchPoint = Math.nextDown(-Math.exp(-1.0));
        for (double x : new double[] {belowBranchPoint, -0.368, -0.4, -1.0, -1e300, Double.NEGATIVE_INFINITY,
            Double.NaN}) {
            assertTrue(Double.isNaN(LambertW.w0(x)), "W0(" + x + ") must be NaN");
            assertTrue(Double.isNaN(LambertW.wm1(x)), "W-1(" + x + ") must be NaN");
        }
        for (double x : new double[] {0.0, -0.0, Double.MIN_VALUE, 1e-300, 0.5, 1.0, 1e300,
            Double.POSITIVE_INFINITY}) {
            assertTrue(Double.isNaN(LambertW.wm1(x)), "W-1(" + x + ") must be NaN");
        }
        assertTrue(Double.isNaN(LambertW.w0OfExp(Double.NaN)), "w0OfExp(NaN) must be NaN");
    }

    // ---- helpers --------------------------------------------------------------------------------------------

    /** Asserts |actual - expected| <= tolerance |expected| and returns the relative error. */
    private static double assertRelative(double expected, double actual, double tolerance, String what) {
        double error = Math.abs(actual - expected) / Math.abs(expected);
        assertTrue(error <= tolerance, what + ": expected " + expected + ", got " + actual + ", relative error "
                + error + " > " + tolerance);
        return error;
    }

    /**
     * Root of w e^w - x between lo and hi (the function changes sign there), by plain bisection to the last
     * representable midpoint. Independent of the code under test.
     */
    private static double bisect(double x, double lo, double hi) {
        boolean lowIsNegative = lo * Math.exp(lo) - x < 0;
        while (true) {
            double mid = 0.5 * (lo + hi);
            if (mid <= Math.min(lo, hi) || mid >= Math.max(lo, hi)) {
                return mid;
            }
            double value = mid * Math.exp(mid) - x;
            if (value == 0) {
                return mid;
            }
            if ((value < 0) == lowIsNegative) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
    }
}
