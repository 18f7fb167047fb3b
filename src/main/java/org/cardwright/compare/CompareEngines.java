package org.cardwright.compare;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.BuiltinCapacitance;
import org.cardwright.sim.CapacitanceEngine;
import org.cardwright.sim.NgspiceCapacitance;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;

/** The capacitance engine that goes with a DC engine name (builtin or ngspice). */
public final class CompareEngines {
    /** Longest one ngspice capacitance run may take [s]. */
    private static final Duration TIMEOUT = Duration.ofSeconds(120);

    private CompareEngines() {
    }

    /** The capacitance engine called {@code name}. */
    public static CapacitanceEngine capacitance(String name) throws SimulationException {
        switch (name.toLowerCase(Locale.ROOT)) {
            case "builtin":
                return new BuiltinCapacitance(SimulatorOptions.NGSPICE_DEFAULTS);
            case "ngspice": {
                Path exe = SimulatorProcess.locate(SimulatorProcess.Kind.NGSPICE).orElseThrow(() -> new SimulationException(
                        "ngspice not found on the PATH: install it (Debian/Ubuntu: apt-get install ngspice) or set "
                                + SimulatorProcess.NGSPICE_VARIABLE + " to its path"));
                Path work = Path.of(System.getProperty("java.io.tmpdir"), "cardwright-" + ProcessHandle.current().pid());
                return new NgspiceCapacitance(new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, exe, TIMEOUT), work);
            }
            default:
                throw new IllegalArgumentException("unknown engine '" + name + "'; choose builtin or ngspice");
        }
    }
}
