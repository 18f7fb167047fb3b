package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.cardwright.card.Dialect;
import org.cardwright.data.ReadOptions;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.FitSettings;
import org.cardwright.fit.ParameterRule;

/**
 * Everything the fit job needs.
 *
 * @param data        measurement files
 * @param name        model name for the card
 * @param dialects    dialects to write, in order
 * @param outDir      folder for the cards
 * @param json        where to write the machine-readable result, if anywhere
 * @param temperature device temperature for files without a T column [K]
 * @param kind        device kind
 * @param rules       user rules per parameter (TNOM among them)
 * @param digits      significant digits on the card
 * @param force       allow replacing existing files
 * @param templates   folder of user templates overriding the bundled ones
 * @param capacitance how the C-V readings were taken (stray capacitance, test frequency)
 * @param bench       bench-log reading: meter input resistance [ohm] when not in the file, and whether to
 *                    correct for the meter's draw (NaN resistance: none given)
 * @param selfHeating what to do when forward data show self-heating
 * @param robust      fit with Huber weights and list the outliers
 * @param sweepGap    logged temperatures further apart than this start a new sweep [K]
 * @param conditions  conditions given for single files from outside them (a device file's data entries), by
 *                    the path in {@code data}; they come before the command line's, after the file's own
 */
public record FitRequest(List<Path> data, String name, List<Dialect> dialects, Path outDir, Optional<Path> json,
                         OptionalDouble temperature, DeviceKind kind, List<ParameterRule> rules, int digits,
                         boolean force, Optional<Path> templates,
                         CapacitanceOptions capacitance, BenchOptions bench,
                         FitSettings.SelfHeatingRemedy selfHeating, boolean robust, double sweepGap,
                         java.util.Map<Path, org.cardwright.data.GivenConditions> conditions) {

    /** A request with no conditions given for single files. */
    public FitRequest(List<Path> data, String name, List<Dialect> dialects, Path outDir, Optional<Path> json,
                      OptionalDouble temperature, DeviceKind kind, List<ParameterRule> rules, int digits,
                      boolean force, Optional<Path> templates, CapacitanceOptions capacitance, BenchOptions bench,
                      FitSettings.SelfHeatingRemedy selfHeating, boolean robust, double sweepGap) {
        this(data, name, dialects, outDir, json, temperature, kind, rules, digits, force, templates, capacitance, bench,
                selfHeating, robust, sweepGap, java.util.Map.of());
    }

    /** This request with conditions given for single files (see {@link #conditions}). */
    public FitRequest withConditions(java.util.Map<Path, org.cardwright.data.GivenConditions> perFile) {
        return new FitRequest(data, name, dialects, outDir, json, temperature, kind, rules, digits, force, templates,
                capacitance, bench, selfHeating, robust, sweepGap, perFile);
    }

    /** The conditions given for {@code file}: its own from {@link #conditions}, then the command line's. */
    public org.cardwright.data.GivenConditions givenFor(Path file) {
        return conditions.getOrDefault(file, org.cardwright.data.GivenConditions.NONE)
                .orElse(Inputs.commandLine(capacitance));
    }

    /** A request with the default sweep gap ({@link org.cardwright.model.SweepTemperatures#DEFAULT_GAP}). */
    public FitRequest(List<Path> data, String name, List<Dialect> dialects, Path outDir, Optional<Path> json,
                      OptionalDouble temperature, DeviceKind kind, List<ParameterRule> rules, int digits,
                      boolean force, Optional<Path> templates, CapacitanceOptions capacitance, BenchOptions bench,
                      FitSettings.SelfHeatingRemedy selfHeating, boolean robust) {
        this(data, name, dialects, outDir, json, temperature, kind, rules, digits, force, templates, capacitance, bench,
                selfHeating, robust, org.cardwright.model.SweepTemperatures.DEFAULT_GAP);
    }

    public FitRequest {
        data = List.copyOf(data);
        dialects = List.copyOf(dialects);
        rules = List.copyOf(rules);
        conditions = java.util.Map.copyOf(conditions);
        if (data.isEmpty()) {
            throw new org.cardwright.failure.UsageException("no data files given");
        }
        if (dialects.isEmpty()) {
            throw new org.cardwright.failure.UsageException("no dialect given");
        }
        if (!(sweepGap >= 0) || !Double.isFinite(sweepGap)) {
            throw new IllegalArgumentException("--sweep-gap must be 0 or more kelvin, got " + sweepGap);
        }
        if (digits < 4 || digits > 15) {
            throw new org.cardwright.failure.UsageException("--digits must lie in 4..15, got " + digits);
        }
    }

    /** A request that fits RTH0 when the data show self-heating. */
    public FitRequest(List<Path> data, String name, List<Dialect> dialects, Path outDir, Optional<Path> json,
                      OptionalDouble temperature, DeviceKind kind, List<ParameterRule> rules, int digits,
                      boolean force, Optional<Path> templates, CapacitanceOptions capacitance, BenchOptions bench) {
        this(data, name, dialects, outDir, json, temperature, kind, rules, digits, force, templates, capacitance, bench,
                FitSettings.SelfHeatingRemedy.FIT, false);
    }

    /** A request whose C-V readings (if any) were taken at 1 MHz with no stray capacitance. */
    public FitRequest(List<Path> data, String name, List<Dialect> dialects, Path outDir, Optional<Path> json,
                      OptionalDouble temperature, DeviceKind kind, List<ParameterRule> rules, int digits,
                      boolean force, Optional<Path> templates) {
        this(data, name, dialects, outDir, json, temperature, kind, rules, digits, force, templates,
                CapacitanceOptions.DEFAULT, BenchOptions.DEFAULT);
    }

    /**
     * How bench logs are read.
     *
     * @param meterResistance meter input resistance when the file does not state it [ohm]; NaN when not given
     * @param correctLoading  apply Kirchhoff's current law for the meter's draw
     */
    public record BenchOptions(double meterResistance, boolean correctLoading) {
        /** No meter resistance given; correction on. */
        public static final BenchOptions DEFAULT = new BenchOptions(Double.NaN, true);

        /** Reader options for these bench settings and a device temperature for files without one [K]. */
        public ReadOptions readOptions(OptionalDouble temperature) {
            ReadOptions o = ReadOptions.defaults();
            if (temperature.isPresent()) {
                o = o.withDefaultTemperature(temperature.getAsDouble());
            }
            if (Double.isFinite(meterResistance)) {
                o = o.withMeterResistance(meterResistance);
            }
            if (!correctLoading) {
                o = o.withoutMeterLoadingCorrection();
            }
            return o;
        }
    }

    /** The reader options this request implies. */
    public ReadOptions readOptions() {
        return bench.readOptions(temperature);
    }

    /** The card file for {@code d}: {@code OUT/NAME.DIALECT.lib}. */
    public Path cardPath(Dialect d) {
        return outDir.resolve(name + "." + d.shortName() + ".lib");
    }
}
