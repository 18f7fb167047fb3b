package org.cardwright.workflow;

import java.nio.file.Files;
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
    /**
     * Fixed part of the time limit of one external simulator run [s]: start-up and loading take well under a second
     * (ngspice 39 and gnucap here), so this leaves a wide margin on a busy machine.
     */
    public static final Duration BASE_TIMEOUT = Duration.ofSeconds(30);
    /**
     * Part of the time limit per operating point [s]: ngspice 39 solves a point in about 0.2 ms here
     * (verify/bench/ngspice-points), so this is 100 times that.
     */
    public static final Duration TIMEOUT_PER_POINT = Duration.ofMillis(20);

    /** A time limit for every run, set by the command line's --sim-timeout; null for the scaled default. */
    private static volatile Duration fixedTimeout;
    private static Path workRoot;

    private Engines() {
    }

    /**
     * Sets the time limit of every external simulator run from now on (the command line's {@code --sim-timeout}),
     * or, with an empty value, goes back to the default: {@link #BASE_TIMEOUT} plus {@link #TIMEOUT_PER_POINT} per
     * operating point.
     *
     * @throws IllegalArgumentException when the limit is not positive
     */
    public static void setTimeLimit(java.util.Optional<Duration> limit) {
        if (limit.isPresent() && (limit.get().isZero() || limit.get().isNegative())) {
            throw new IllegalArgumentException("--sim-timeout must be positive, got " + limit.get().toMillis() / 1e3 + " s");
        }
        fixedTimeout = limit.orElse(null);
    }

    private static SimulatorProcess process(SimulatorProcess.Kind kind, Path exe) {
        Duration fixed = fixedTimeout;
        return fixed != null ? new SimulatorProcess(kind, exe, fixed)
                : new SimulatorProcess(kind, exe, BASE_TIMEOUT, TIMEOUT_PER_POINT);
    }

    /**
     * The folder for simulator netlists: made once per JVM by {@link Files#createTempDirectory} with owner-only
     * permissions (never a predictable name), removed when the JVM exits. Each run makes its own private folder in
     * it and deletes it on success; a failed run leaves its netlist for the user and says where.
     */
    static synchronized Path workFolder() throws SimulationException {
        if (workRoot == null || !Files.isDirectory(workRoot)) {
            try {
                workRoot = SimulatorProcess.privateFolder(null, "cardwright-");
            } catch (java.io.IOException e) {
                throw new SimulationException("cannot create a private work folder for the simulator: " + e.getMessage(), e);
            }
            workRoot.toFile().deleteOnExit();
        }
        return workRoot;
    }

    private static Path locate(SimulatorProcess.Kind kind) throws SimulationException {
        return SimulatorProcess.locate(kind).orElseThrow(() -> new SimulationException(
                SimulatorProcess.notFoundMessage(kind)));
    }

    /**
     * The card as the engines take it: its parsed name and parameters, and the values it states in its own dialect
     * (what an external simulator's deck is written from; no card text travels).
     */
    public static org.cardwright.sim.CardUnderTest underTest(org.cardwright.card.ParsedCard card,
            org.cardwright.card.Dialect dialect) {
        java.util.List<org.cardwright.sim.CardUnderTest.Setting> settings = new java.util.ArrayList<>();
        dialect.statedValues(card.parameters())
                .forEach((k, v) -> settings.add(new org.cardwright.sim.CardUnderTest.Setting(k, v)));
        return new org.cardwright.sim.CardUnderTest(card.name(), card.parameters(), settings);
    }

    /**
     * True when the engine called {@code name} reads cards of {@code dialect} as that dialect's simulator does: the
     * built-in engine evaluates every dialect's own equations; ngspice reads ngspice cards and SPICE3f5 cards (its
     * parent's parameter set, every keyword the same); gnucap reads gnucap cards. ngspice does not read a gnucap
     * card as gnucap does (gnucap's XTI is XTI/N, it has no breakdown) nor an Xyce card (TBV1, Xyce's NR default);
     * Xyce itself is not run here.
     */
    public static boolean speaks(String name, org.cardwright.card.Dialect dialect) {
        return switch (name.toLowerCase(Locale.ROOT)) {
            case "builtin" -> true;
            case "ngspice" -> dialect == org.cardwright.card.Dialect.NGSPICE || dialect == org.cardwright.card.Dialect.SPICE3;
            case "gnucap" -> dialect == org.cardwright.card.Dialect.GNUCAP;
            default -> false;
        };
    }

    /** The engines that read cards of {@code dialect} as its simulator does ({@link #speaks}), in {@link #NAMES} order. */
    public static java.util.List<String> speakersOf(org.cardwright.card.Dialect dialect) {
        java.util.List<String> out = new java.util.ArrayList<>();
        for (String n : NAMES.split(",\\s*")) {
            if (speaks(n, dialect)) {
                out.add(n);
            }
        }
        return out;
    }

    /**
     * Refuses to run a card in an engine that does not speak its dialect ({@link #speaks}): the same rule as
     * {@code check}'s "not checkable", as one line naming the card file, its dialect, the engine and the engines
     * that can run it. A usage error (exit 2): the engine chosen on the command line does not fit the card.
     *
     * @throws org.cardwright.failure.UsageException when {@code engine} does not speak {@code dialect}
     */
    public static void requireSpeaks(String engine, org.cardwright.card.Dialect dialect, String cardSource) {
        if (speaks(engine, dialect)) {
            return;
        }
        java.util.List<String> can = speakersOf(dialect);
        throw new org.cardwright.failure.UsageException(cardSource + ": " + dialect.shortName() + " card not checkable with "
                + "engine " + engine.toLowerCase(Locale.ROOT) + ", which does not read " + dialect.shortName() + " cards as "
                + dialect.simulator() + " does; use " + String.join(" or ", can.stream().map(n -> "--engine " + n).toList()));
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
                Path exe = locate(SimulatorProcess.Kind.GNUCAP);
                return new org.cardwright.sim.GnucapEngine(process(SimulatorProcess.Kind.GNUCAP, exe), workFolder());
            }
            case "ngspice": {
                Path exe = locate(SimulatorProcess.Kind.NGSPICE);
                return new NgspiceEngine(process(SimulatorProcess.Kind.NGSPICE, exe), workFolder());
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
                Path exe = locate(SimulatorProcess.Kind.NGSPICE);
                return new org.cardwright.sim.NgspiceCapacitance(process(SimulatorProcess.Kind.NGSPICE, exe), workFolder());
            }
            default:
                throw new org.cardwright.failure.UsageException("unknown engine '" + name + "'; choose one of " + NAMES);
        }
    }
}
