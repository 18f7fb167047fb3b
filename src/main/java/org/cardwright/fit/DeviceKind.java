package org.cardwright.fit;

import java.util.Locale;

/**
 * Device kinds and the defaults a fit holds when the data cannot determine a temperature parameter.
 * Values: ngspice manual, junction-diode chapter (typical EG 1.11 eV silicon, 0.69 eV Schottky, 0.67 eV
 * germanium; XTI 3 for pn junctions, 2 for Schottky), as also tabulated in Antognetti &amp; Massobrio (eds.),
 * "Semiconductor Device Modeling with SPICE", 2nd ed., McGraw-Hill 1993 (recalled).
 */
public enum DeviceKind {
    /** Silicon pn junction. */
    SILICON_PN("silicon pn junction", 1.11, 3.0),
    /** Metal-semiconductor (Schottky) barrier on silicon. */
    SCHOTTKY("Schottky barrier", 0.69, 2.0),
    /** Germanium pn junction. */
    GERMANIUM("germanium pn junction", 0.67, 3.0);

    private final String description;
    private final double activationEnergy;
    private final double temperatureExponent;

    DeviceKind(String description, double activationEnergy, double temperatureExponent) {
        this.description = description;
        this.activationEnergy = activationEnergy;
        this.temperatureExponent = temperatureExponent;
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

    /** The option spelling, e.g. {@code silicon-pn}. */
    public String optionName() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** Parses an option spelling; the error lists the valid ones. */
    public static DeviceKind byOptionName(String text) {
        for (DeviceKind k : values()) {
            if (k.optionName().equalsIgnoreCase(text.trim())) {
                return k;
            }
        }
        StringBuilder sb = new StringBuilder();
        for (DeviceKind k : values()) {
            sb.append(sb.length() == 0 ? "" : ", ").append(k.optionName());
        }
        throw new IllegalArgumentException("unknown device kind '" + text + "'; choose one of " + sb);
    }
}
