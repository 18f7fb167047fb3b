package org.cardwright.cli;

import java.time.Duration;
import java.util.Optional;
import org.cardwright.workflow.Engines;
import picocli.CommandLine.Option;

/** The {@code --sim-timeout} option of the commands that run an external simulator (verify, compare, check). */
final class SimulatorTimeLimit {
    @Option(names = "--sim-timeout", paramLabel = "SECONDS",
            description = "Longest one ngspice or gnucap run may take before it is killed with everything it started "
                    + "(default: 30 s plus 20 ms per simulated point).")
    Double seconds;

    /** Sets the limit for this command's runs (or the default when the option is not given). */
    void apply() {
        if (seconds == null) {
            Engines.setTimeLimit(Optional.empty());
            return;
        }
        if (!(seconds > 0) || seconds > Duration.ofDays(1).toSeconds()) {
            throw new org.cardwright.failure.UsageException("--sim-timeout must be a number of seconds above 0 and at most one day, got "
                    + seconds);
        }
        Engines.setTimeLimit(Optional.of(Duration.ofNanos(Math.round(seconds * 1e9))));
    }
}
