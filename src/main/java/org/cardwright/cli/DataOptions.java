package org.cardwright.cli;

import java.util.OptionalDouble;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.model.Ngspice39;
import org.cardwright.workflow.FitRequest;
import picocli.CommandLine.Option;

/** How the measurement files are to be read: options that fit and verify share. */
final class DataOptions {
    @Option(names = "--temp", paramLabel = "DEGC", description = "Device temperature in degC for files without a T column.")
    Double temperature;

    @Option(names = "--stray-capacitance", paramLabel = "C", defaultValue = "0",
            description = "Fixture/stray capacitance included in every C-V reading, subtracted (SPICE suffixes: 1.5p).")
    String stray;

    @Option(names = "--cv-frequency", paramLabel = "HZ", defaultValue = "1meg",
            description = "Test frequency of the C-V readings (default: ${DEFAULT-VALUE}).")
    String cvFrequency;

    @Option(names = "--meter-resistance", paramLabel = "OHMS",
            description = "Input resistance of the voltmeter in a series-resistor bench log, when the file does not state it (e.g. 10meg).")
    String meterResistance;

    /** The device temperature option in kelvin, if given. */
    OptionalDouble temperatureKelvin() {
        return temperature == null ? OptionalDouble.empty() : OptionalDouble.of(temperature + Ngspice39.CELSIUS_TO_KELVIN);
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
