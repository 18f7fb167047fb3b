package org.cardwright.workflow;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.NgspiceEngine;
import org.cardwright.sim.SimulationEngine;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;

/** Engines by name. */
public final class Engines {
    /** Names accepted by {@link #byName}. */
    public static final String NAMES = "builtin, ngspice, gnucap";
    /** Longest an external simulator may run for one verification [s]. */
    private static final Duration TIMEOUT = Duration.ofSeconds(120);

    private Engines() {
    }

    /**
     * A folder for simulator netlists, removed when the JVM exits (each run also deletes its own files on
     * success; a failed run leaves its netlist for the user and says where).
     */
    static Path workFolder() {
        Path work = Path.of(System.getProperty("java.io.tmpdir"), "cardwright-" + ProcessHandle.current().pid());
        work.toFile().deleteOnExit();
        return work;
    }

    /** The engine called {@code name}; ngspice is looked up on the PATH or in CARDWRIGHT_NGSPICE. */
    public static SimulationEngine byName(String name) throws SimulationException {
        return byName(name, org.cardwright.model.Flavour.NGSPICE_39);
    }

    /**
     * The engine called {@code name}; the built-in one evaluates {@code flavour}'s equations (those of the
     * simulator the card was written for).
     */
    public static SimulationEngine byName(String name, org.cardwright.model.Flavour flavour) throws SimulationException {
        switch (name.toLowerCase(Locale.ROOT)) {
            case "builtin":
                return new BuiltinEngine(flavour.options());
            case "gnucap": {
                Path exe = SimulatorProcess.locate(SimulatorProcess.Kind.GNUCAP).orElseThrow(() -> new SimulationException(
                        "gnucap not found on the PATH: install it (Debian/Ubuntu: apt-get install gnucap) or set "
                                + SimulatorProcess.GNUCAP_VARIABLE + " to its path"));
                return new org.cardwright.sim.GnucapEngine(new SimulatorProcess(SimulatorProcess.Kind.GNUCAP, exe, TIMEOUT),
                        workFolder());
            }
            case "ngspice": {
                Path exe = SimulatorProcess.locate(SimulatorProcess.Kind.NGSPICE).orElseThrow(() -> new SimulationException(
                        "ngspice not found on the PATH: install it (Debian/Ubuntu: apt-get install ngspice) or set "
                                + SimulatorProcess.NGSPICE_VARIABLE + " to its path"));
                return new NgspiceEngine(new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, exe, TIMEOUT), workFolder());
            }
            default:
                throw new org.cardwright.failure.UsageException("unknown engine '" + name + "'; choose one of " + NAMES);
        }
    }

    /** The capacitance engine called {@code name}: builtin or ngspice (AC analysis). */
    public static org.cardwright.sim.CapacitanceEngine capacitanceByName(String name) throws SimulationException {
        return capacitanceByName(name, org.cardwright.model.Flavour.NGSPICE_39);
    }

    /** The capacitance engine called {@code name}; gnucap has none, so it falls to the built-in gnucap flavour. */
    public static org.cardwright.sim.CapacitanceEngine capacitanceByName(String name, org.cardwright.model.Flavour flavour)
            throws SimulationException {
        switch (name.toLowerCase(Locale.ROOT)) {
            case "builtin":
            case "gnucap":
                return new org.cardwright.sim.BuiltinCapacitance(flavour.options());
            case "ngspice": {
                Path exe = SimulatorProcess.locate(SimulatorProcess.Kind.NGSPICE).orElseThrow(() -> new SimulationException(
                        "ngspice not found on the PATH: install it (Debian/Ubuntu: apt-get install ngspice) or set "
                                + SimulatorProcess.NGSPICE_VARIABLE + " to its path"));
                return new org.cardwright.sim.NgspiceCapacitance(new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, exe, TIMEOUT),
                        workFolder());
            }
            default:
                throw new org.cardwright.failure.UsageException("unknown engine '" + name + "'; choose one of " + NAMES);
        }
    }
}
