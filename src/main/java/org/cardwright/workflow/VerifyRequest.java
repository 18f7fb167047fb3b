package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.cardwright.card.Dialect;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.verify.Tolerance;

/**
 * Everything the verify job needs.
 *
 * @param card        the card file
 * @param data        measurement files
 * @param engine      engine name: builtin or ngspice
 * @param model       which model of a multi-model file, if more than one
 * @param dialect     the dialect to read the card in
 * @param temperature device temperature for files without a T column [K]
 * @param tolerance   pass limits
 * @param json        where to write the machine-readable result, if anywhere
 * @param force       allow replacing an existing JSON file
 * @param capacitance how the C-V readings were taken (stray capacitance, test frequency)
 * @param bench       how bench logs are read (meter resistance, loading correction)
 * @param verdict     what decides pass or fail: the data's own uncertainty or the fixed limits
 * @param conditions  conditions given for single files from outside them (a device file's data entries, a
 *                    per-file temperature), by the path in {@code data}; they come before the command line's
 *                    global ones, after the file's own
 */
public record VerifyRequest(Path card, List<Path> data, String engine, Optional<String> model, Dialect dialect,
                            OptionalDouble temperature, Tolerance tolerance, Optional<Path> json, boolean force,
                            CapacitanceOptions capacitance, FitRequest.BenchOptions bench,
                            org.cardwright.verify.VerdictBasis verdict,
                            java.util.Map<Path, org.cardwright.data.GivenConditions> conditions) {

    /** A request with no conditions given for single files. */
    public VerifyRequest(Path card, List<Path> data, String engine, Optional<String> model, Dialect dialect,
                         OptionalDouble temperature, Tolerance tolerance, Optional<Path> json, boolean force,
                         CapacitanceOptions capacitance, FitRequest.BenchOptions bench,
                         org.cardwright.verify.VerdictBasis verdict) {
        this(card, data, engine, model, dialect, temperature, tolerance, json, force, capacitance, bench, verdict,
                java.util.Map.of());
    }

    /** This request with conditions given for single files (see {@link #conditions}). */
    public VerifyRequest withConditions(java.util.Map<Path, org.cardwright.data.GivenConditions> perFile) {
        return new VerifyRequest(card, data, engine, model, dialect, temperature, tolerance, json, force, capacitance,
                bench, verdict, perFile);
    }

    /** The conditions given for {@code file}: its own from {@link #conditions}, then the command line's. */
    public org.cardwright.data.GivenConditions givenFor(Path file) {
        return conditions.getOrDefault(file, org.cardwright.data.GivenConditions.NONE)
                .orElse(Inputs.commandLine(capacitance));
    }

    /** A request judged by the fixed limits (the uncertainty figures are reported too). */
    public VerifyRequest(Path card, List<Path> data, String engine, Optional<String> model, Dialect dialect,
                         OptionalDouble temperature, Tolerance tolerance, Optional<Path> json, boolean force,
                         CapacitanceOptions capacitance, FitRequest.BenchOptions bench) {
        this(card, data, engine, model, dialect, temperature, tolerance, json, force, capacitance, bench,
                org.cardwright.verify.VerdictBasis.FIXED);
    }

    public VerifyRequest {
        data = List.copyOf(data);
        conditions = java.util.Map.copyOf(conditions);
        if (data.isEmpty()) {
            throw new org.cardwright.failure.UsageException("no data files given");
        }
    }

    /** A request whose C-V readings (if any) were taken at 1 MHz with no stray capacitance. */
    public VerifyRequest(Path card, List<Path> data, String engine, Optional<String> model, Dialect dialect,
                         OptionalDouble temperature, Tolerance tolerance, Optional<Path> json, boolean force) {
        this(card, data, engine, model, dialect, temperature, tolerance, json, force, CapacitanceOptions.DEFAULT,
                FitRequest.BenchOptions.DEFAULT);
    }

    /** The reader options this request implies. */
    public org.cardwright.data.ReadOptions readOptions() {
        return bench.readOptions(temperature);
    }
}
