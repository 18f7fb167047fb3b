package org.cardwright.model;

import java.util.Locale;
import java.util.Optional;

/**
 * The SPICE level-1 junction-diode model parameters that cardwright knows, in the order a card lists them.
 *
 * <p>Values are held in SI units inside the program. The one exception in the card text is TNOM, which a
 * card states in degrees Celsius; {@link #toCardValue(double)} and {@link #fromCardValue(double)} convert.
 * Defaults are those of ngspice 39 (see docs/model.md and the ngspice manual, junction-diode chapter).
 */
public enum Param {
    /** Saturation current [A]. */
    IS("saturation current", "A", 1e-14, false, Scale.LOG),
    /** Emission coefficient (ideality factor) [1]. */
    N("emission coefficient", "", 1.0, false, Scale.LINEAR),
    /** Ohmic series resistance [ohm]. */
    RS("series resistance", "ohm", 0.0, false, Scale.LINEAR),
    /** Recombination saturation current [A]; active only when given. */
    ISR("recombination saturation current", "A", 1e-14, true, Scale.LOG),
    /** Recombination emission coefficient [1]. */
    NR("recombination emission coefficient", "", 1.0, false, Scale.LINEAR),
    /** Forward high-injection knee current [A]; active only when given. */
    IKF("forward knee current", "A", Double.POSITIVE_INFINITY, true, Scale.LOG),
    /** Reverse high-injection knee current [A]; active only when given. */
    IKR("reverse knee current", "A", Double.POSITIVE_INFINITY, true, Scale.LOG),
    /** Activation energy used in the saturation-current temperature law [eV]. */
    EG("activation energy", "eV", 1.11, false, Scale.LINEAR),
    /** Saturation-current temperature exponent [1]. */
    XTI("saturation-current temperature exponent", "", 3.0, false, Scale.LINEAR),
    /** First-order temperature coefficient of RS [1/K]. */
    TRS1("linear temperature coefficient of RS", "1/K", 0.0, false, Scale.LINEAR),
    /** Second-order temperature coefficient of RS [1/K^2]. */
    TRS2("quadratic temperature coefficient of RS", "1/K^2", 0.0, false, Scale.LINEAR),
    /** Zero-bias junction capacitance [F]. */
    CJO("zero-bias junction capacitance", "F", 0.0, false, Scale.LOG),
    /** Junction built-in potential [V]. */
    VJ("junction potential", "V", 1.0, false, Scale.LINEAR),
    /** Grading coefficient [1]. */
    M("grading coefficient", "", 0.5, false, Scale.LINEAR),
    /** Forward-bias depletion-capacitance coefficient [1]. */
    FC("forward-bias depletion capacitance coefficient", "", 0.5, false, Scale.LINEAR),
    /** Transit time [s]. */
    TT("transit time", "s", 0.0, false, Scale.LOG),
    /** Reverse breakdown voltage, a positive number [V]; active only when given. */
    BV("breakdown voltage", "V", Double.POSITIVE_INFINITY, true, Scale.LINEAR),
    /** Current at the breakdown voltage [A]. */
    IBV("current at breakdown voltage", "A", 1e-3, false, Scale.LOG),
    /** Breakdown emission coefficient [1]; defaults to N. */
    NBV("breakdown emission coefficient", "", 1.0, false, Scale.LINEAR),
    /** Temperature coefficient of BV [V/K] (TLEV 0) or [1/K] (TLEV 1). */
    TCV("breakdown-voltage temperature coefficient", "V/K", 0.0, false, Scale.LINEAR),
    /** Temperature-law selector for BV (ngspice TLEV) [1]. */
    TLEV("breakdown temperature law selector", "", 0.0, false, Scale.LINEAR),
    /** Thermal resistance junction to ambient for ngspice self-heating [K/W]; active only when given. */
    RTH0("thermal resistance", "K/W", 0.0, true, Scale.LOG),
    /** Nominal temperature at which the parameters are stated [K]; a card writes it in degrees C. */
    TNOM("nominal temperature", "K", Ngspice39.REFERENCE_TEMPERATURE, false, Scale.LINEAR);

    /** How a fit should see a parameter: positive values spanning decades are fitted as logarithms. */
    public enum Scale { LINEAR, LOG }

    private final String description;
    private final String unit;
    private final double defaultValue;
    private final boolean activeOnlyWhenGiven;
    private final Scale fitScale;

    Param(String description, String unit, double defaultValue, boolean activeOnlyWhenGiven, Scale fitScale) {
        this.description = description;
        this.unit = unit;
        this.defaultValue = defaultValue;
        this.activeOnlyWhenGiven = activeOnlyWhenGiven;
        this.fitScale = fitScale;
    }

    /** Plain-language meaning, for tables and help text. */
    public String description() {
        return description;
    }

    /** SI unit symbol for display; empty for dimensionless parameters. */
    public String unit() {
        return unit;
    }

    /** ngspice 39 default in SI units (TNOM in kelvin). */
    public double defaultValue() {
        return defaultValue;
    }

    /** True for parameters whose mere presence switches a model term on (BV, IKF, IKR, ISR, RTH0). */
    public boolean activeOnlyWhenGiven() {
        return activeOnlyWhenGiven;
    }

    /** The scale on which a fit varies this parameter. */
    public Scale fitScale() {
        return fitScale;
    }

    /** The card keyword, upper case. */
    public String keyword() {
        return name();
    }

    /** Converts an SI value to the number written on a card (only TNOM differs: kelvin to degrees C). */
    public double toCardValue(double siValue) {
        return this == TNOM ? siValue - Ngspice39.CELSIUS_TO_KELVIN : siValue;
    }

    /** Converts a number read from a card to SI (only TNOM differs: degrees C to kelvin). */
    public double fromCardValue(double cardValue) {
        return this == TNOM ? cardValue + Ngspice39.CELSIUS_TO_KELVIN : cardValue;
    }

    /** Looks a parameter up by its canonical keyword, in any letter case. */
    public static Optional<Param> byKeyword(String keyword) {
        String k = keyword.trim().toUpperCase(Locale.ROOT);
        for (Param p : values()) {
            if (p.name().equals(k)) {
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }
}
