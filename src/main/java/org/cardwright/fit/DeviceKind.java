package org.cardwright.fit;

import java.util.Locale;

/**
 * Device kinds: the temperature parameters a fit holds when the data cannot determine them, the range the
 * emission coefficient may take, and what the kind leads a user to expect.
 *
 * <p>Sources: EG and XTI for silicon, Schottky and germanium from the ngspice manual's junction-diode
 * parameter table (typical EG 1.11 eV silicon, 0.69 eV Schottky, 0.67 eV germanium; XTI 3 for pn junctions, 2
 * for Schottky), also tabulated in Antognetti &amp; Massobrio (eds.), "Semiconductor Device Modeling with
 * SPICE", 2nd ed., McGraw-Hill 1993 (recalled). Base-emitter junction: the SPICE bipolar-transistor defaults
 * EG 1.11 eV and XTI 3 (ngspice manual, BJT chapter; recalled). LED: the band gap follows the emission
 * wavelength, EG ~ hc/(q lambda) = 1239.84 eV nm / lambda (photon energy; Sze &amp; Ng, "Physics of
 * Semiconductor Devices", 3rd ed., Wiley 2007, recalled); 2.0 eV stands for a mid-visible part and should be
 * replaced by the user's own value when only one temperature was measured. Emission-coefficient ranges are
 * common practice, no source: near 1 for Schottky barriers and base-emitter junctions, up to about 2 for
 * silicon pn junctions with recombination, and higher for heterojunction LEDs.
 */
public enum DeviceKind {
    /** Silicon pn junction: signal and rectifier diodes. */
    SILICON_PN("silicon pn junction", 1.11, 3.0, 4.0, false),
    /** Metal-semiconductor (Schottky) barrier on silicon. */
    SCHOTTKY("Schottky barrier", 0.69, 2.0, 2.5, false),
    /** Germanium pn junction. */
    GERMANIUM("germanium pn junction", 0.67, 3.0, 4.0, false),
    /** Light-emitting diode. */
    LED("light-emitting diode", 2.0, 3.0, 10.0, false),
    /** Zener or avalanche diode: breakdown is part of the job. */
    ZENER("zener or avalanche diode", 1.11, 3.0, 4.0, true),
    /** The base-emitter junction of a bipolar transistor used as a diode. */
    BASE_EMITTER("transistor base-emitter junction", 1.11, 3.0, 2.0, false);

    private final String description;
    private final double activationEnergy;
    private final double temperatureExponent;
    private final double maxEmission;
    private final boolean expectsBreakdown;

    DeviceKind(String description, double activationEnergy, double temperatureExponent, double maxEmission,
               boolean expectsBreakdown) {
        this.description = description;
        this.activationEnergy = activationEnergy;
        this.temperatureExponent = temperatureExponent;
        this.maxEmission = maxEmission;
        this.expectsBreakdown = expectsBreakdown;
    }

    /** Plain name for output. */
    public String description() {
        return description;
    }

    /** Default EG [eV]. */
    public double activationEnergy() {
        return activationEnergy;
    }

    /** Default XTI [1]. */
    public double temperatureExponent() {
        return temperatureExponent;
    }

    /** Upper bound of N and NR for this kind [1]. */
    public double maxEmission() {
        return maxEmission;
    }

    /**
     * The range of N usual for this kind, {lowest, highest} [1]; NR usually stays below twice the highest. A fitted
     * value outside it is flagged as implausible (it is not a bound). Common practice, no source: an ideal
     * diffusion current has N = 1 and recombination in the depletion region N = 2 (Sah, Noyce &amp; Shockley,
     * Proc. IRE 45 (1957) 1228-1243); Schottky barriers stay near 1, base-emitter junctions near 1, and
     * heterojunction emitters reach about 3.
     */
    public double[] typicalEmission() {
        return switch (this) {
            case SCHOTTKY -> new double[] {0.95, 1.5};
            case BASE_EMITTER -> new double[] {0.95, 1.3};
            case LED -> new double[] {1.0, 3.0};
            default -> new double[] {0.95, 2.2};
        };
    }

    /** True when the user will want BV fitted (a warning follows when no breakdown data are given). */
    public boolean expectsBreakdown() {
        return expectsBreakdown;
    }

    /** The option spelling, e.g. {@code silicon-pn}. */
    public String optionName() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** Every option spelling, comma-separated. */
    public static String optionNames() {
        StringBuilder sb = new StringBuilder();
        for (DeviceKind k : values()) {
            sb.append(sb.length() == 0 ? "" : ", ").append(k.optionName());
        }
        return sb.toString();
    }

    /** Parses an option spelling; the error lists the valid ones. */
    public static DeviceKind byOptionName(String text) {
        for (DeviceKind k : values()) {
            if (k.optionName().equalsIgnoreCase(text.trim())) {
                return k;
            }
        }
        throw new IllegalArgumentException("unknown device kind '" + text + "'; choose one of " + optionNames());
    }
}
