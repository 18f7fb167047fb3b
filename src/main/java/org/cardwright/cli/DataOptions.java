package org.cardwright.cli;

import java.util.OptionalDouble;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.model.Ngspice39;
import org.cardwright.workflow.FitRequest;
import picocli.CommandLine.Option;

/** How the measurement files are to be read: options that fit and verify share. */
final class DataOptions {
    // the options' help texts, shared by the annotations (verify's mixin) and spec() (fit's model, built in code)
    static final String TEMP = "Device temperature in degC for files without a T column.";
    static final String TEMP_FOR = "Device temperature in degC for one data file without a T column or temperature setting, e.g. --temp-for cold.csv=-40. Repeatable; it comes before --temp.";
    static final String STRAY = "Fixture/stray capacitance included in every C-V reading, subtracted (SPICE suffixes: 1.5p), for C-V files that do not state it (a '# stray capacitance = ...' line in the file wins).";
    static final String CV_FREQUENCY = "Test frequency of the C-V readings, for C-V files that do not state it ('# test frequency = ...'); default: ${DEFAULT-VALUE}.";
    static final String METER_RESISTANCE = "Input resistance of the voltmeter in a series-resistor bench log, when the file does not state it (e.g. 10meg).";

    /** These options as a picocli mixin built in code (no annotation read), bound to {@code target}'s fields. */
    static picocli.CommandLine.Model.CommandSpec spec(DataOptions target) {
        picocli.CommandLine.Model.CommandSpec spec = picocli.CommandLine.Model.CommandSpec.wrapWithoutInspection(target);
        spec.addOption(CommandModel.option(target, "temperature", Double.class, "--temp", "DEGC", TEMP).build());
        spec.addOption(CommandModel.option(target, "temperatureFor", java.util.List.class, "--temp-for", "FILE=DEGC", TEMP_FOR)
                .auxiliaryTypes(String.class).build());
        spec.addOption(CommandModel.option(target, "stray", String.class, "--stray-capacitance", "C", STRAY).defaultValue("0").build());
        spec.addOption(CommandModel.option(target, "cvFrequency", String.class, "--cv-frequency", "HZ", CV_FREQUENCY)
                .defaultValue("1meg").build());
        spec.addOption(CommandModel.option(target, "meterResistance", String.class, "--meter-resistance", "OHMS", METER_RESISTANCE)
                .build());
        return spec;
    }

    @Option(names = "--temp", paramLabel = "DEGC", description = TEMP)
    Double temperature;

    @Option(names = "--temp-for", paramLabel = "FILE=DEGC",
            description = TEMP_FOR)
    java.util.List<String> temperatureFor = new java.util.ArrayList<>();

    @Option(names = "--stray-capacitance", paramLabel = "C", defaultValue = "0",
            description = STRAY)
    String stray;

    @Option(names = "--cv-frequency", paramLabel = "HZ", defaultValue = "1meg",
            description = CV_FREQUENCY)
    String cvFrequency;

    @Option(names = "--meter-resistance", paramLabel = "OHMS",
            description = METER_RESISTANCE)
    String meterResistance;

    /** The device temperature option in kelvin, if given. */
    OptionalDouble temperatureKelvin() {
        return temperature == null ? OptionalDouble.empty() : OptionalDouble.of(temperature + Ngspice39.CELSIUS_TO_KELVIN);
    }

    /**
     * The per-file temperatures of {@code --temp-for}, by data file; each FILE must be one of {@code data} (the same
     * file, however written).
     *
     * @throws IllegalArgumentException for a malformed entry, a file not among the data or a file named twice
     */
    java.util.Map<java.nio.file.Path, org.cardwright.data.GivenConditions> perFile(java.util.List<java.nio.file.Path> data) {
        java.util.Map<java.nio.file.Path, org.cardwright.data.GivenConditions> out = new java.util.LinkedHashMap<>();
        for (String entry : temperatureFor) {
            int eq = entry.lastIndexOf('=');
            if (eq <= 0 || eq == entry.length() - 1) {
                throw new IllegalArgumentException("--temp-for takes FILE=DEGC, e.g. cold.csv=-40; got '" + entry + "'");
            }
            java.nio.file.Path named = java.nio.file.Path.of(entry.substring(0, eq).trim());
            java.nio.file.Path match = null;
            for (java.nio.file.Path d : data) {
                if (d.toAbsolutePath().normalize().equals(named.toAbsolutePath().normalize())) {
                    match = d;
                }
            }
            if (match == null) {
                throw new IllegalArgumentException("--temp-for names '" + named + "', which is not among the data files");
            }
            if (out.containsKey(match)) {
                throw new IllegalArgumentException("--temp-for names '" + named + "' twice");
            }
            double kelvin = org.cardwright.data.Condition.TEMPERATURE.parse(entry.substring(eq + 1));
            out.put(match, org.cardwright.data.GivenConditions.NONE.with(org.cardwright.data.Condition.TEMPERATURE, kelvin,
                    "--temp-for " + entry.strip()));
        }
        return out;
    }

    /** The C-V reading conditions. */
    CapacitanceOptions capacitance() {
        return new CapacitanceOptions(SpiceNumbers.parse(stray), SpiceNumbers.parse(cvFrequency));
    }

    /** The bench-log reading options. */
    FitRequest.BenchOptions bench(boolean correctLoading) {
        return new FitRequest.BenchOptions(meterResistance == null ? Double.NaN : SpiceNumbers.parse(meterResistance),
                correctLoading);
    }
}
