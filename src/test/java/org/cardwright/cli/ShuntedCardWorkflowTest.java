package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.card.Dialect;
import org.cardwright.card.ShuntedCard;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Issue 9, item 7, end to end: data of an invented small diode with a 150 kOhm leakage path, simulated in
 * ngspice 39 from a netlist of a diode and a resistor (noise-free), go through {@code cardwright fit}. Every
 * dialect gets its plain card and a subcircuit file; the subcircuit loads in ngspice with no warning and
 * reproduces the data; {@code verify} passes it with the built-in engine, ngspice and gnucap, and fails the plain
 * card, which is the junction alone.
 */
class ShuntedCardWorkflowTest {
    /** The generating card: an invented small signal junction. */
    private static final String TRUTH = ".model TRUTH D(IS=2e-15 N=1.03 RS=0.9)";
    /** The generating resistor [ohm]. */
    private static final double SHUNT = 150e3;
    /** Issue 9 acceptance, noise-free: shunt within 0.2 % [1]. */
    private static final double SHUNT_NOISE_FREE = 0.002;
    /**
     * Noise-free data: the subcircuit in ngspice must reproduce them far inside verify's 2 mV RMS limit; 10 uV
     * leaves room for the card's 7-digit rounding (as CardsLoadInNgspiceTest) [V].
     */
    private static final double NOISE_FREE_MAX_RESIDUAL = 10e-6;
    private static final Duration TIMEOUT = Duration.ofSeconds(60);

    private static Path dir;
    private static Path out;
    private static double[] forwardCurrents;
    private static double[] forwardVolts;

    @BeforeAll
    static void simulateAndFit() throws Exception {
        Simulators.requireNgspice();
        dir = Simulators.tempDir("shunted-card");
        List<Double> currents = new ArrayList<>();
        for (int k = 0; k <= 40; k++) {
            currents.add(1e-6 * Math.pow(10, k / 8.0));
        }
        List<Double> reverse = List.of(-1e-6, -3e-6, -1e-5, -3e-5, -6e-5);
        List<Double> all = new ArrayList<>(currents);
        all.addAll(reverse);
        double[] volts = simulate(all);
        forwardCurrents = currents.stream().mapToDouble(Double::doubleValue).toArray();
        forwardVolts = java.util.Arrays.copyOf(volts, currents.size());
        write(dir.resolve("shx-forward.csv"), currents, forwardVolts);
        write(dir.resolve("shx-reverse.csv"), reverse, java.util.Arrays.copyOfRange(volts, currents.size(), volts.length));
        out = dir.resolve("cards");
        CliRun fit = CliRun.of("fit", dir.resolve("shx-forward.csv").toString(), dir.resolve("shx-reverse.csv").toString(),
                "--name", "SHX", "--out", out.toString(), "--dialect", "ngspice,spice3,gnucap,xyce", "--force");
        System.out.println(fit.out());
        assertEquals(ExitCodes.OK, fit.exitCode(), fit.describe());
    }

    /** Forced currents into a diode with the resistor beside it, in ngspice 39; returns the terminal voltages. */
    private static double[] simulate(List<Double> currents) throws Exception {
        StringBuilder sb = new StringBuilder("* invented test part: diode and 150k resistor\nI1 0 a DC 0\nD1 a 0 TRUTH\n");
        sb.append("R1 a 0 ").append(SHUNT).append('\n').append(TRUTH).append('\n');
        sb.append(".options reltol=1e-9 vntol=1e-12 abstol=1e-20\n.control\nset wr_singlescale\noption numdgt=15\nset appendwrite\n");
        for (double i : currents) {
            sb.append(String.format(Locale.ROOT, "alter i1 dc = %.17g%nop%nwrdata points.dat v(a)%n", i));
        }
        sb.append("quit\n.endc\n.end\n");
        return run(sb.toString(), currents.size(), "shunted-truth");
    }

    private static double[] run(String netlist, int rows, String work) throws Exception {
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(), TIMEOUT);
        assertTrue(ngspice.version().startsWith("ngspice-39"), "reference simulator: " + ngspice.version());
        // runClean fails on any warning ngspice prints about the netlist or the card
        SimulatorProcess.Run run = ngspice.runClean(netlist, Simulators.tempDir(work));
        List<String> lines = Files.readAllLines(run.folder().resolve("points.dat")).stream()
                .filter(l -> !l.isBlank()).toList();
        assertEquals(rows, lines.size(), "one row per operating point");
        double[] v = new double[rows];
        for (int k = 0; k < rows; k++) {
            v[k] = Double.parseDouble(lines.get(k).trim().split("\\s+")[1]);
        }
        return v;
    }

    private static void write(Path file, List<Double> currents, double[] volts) throws Exception {
        StringBuilder sb = new StringBuilder("# Invented test data, not a measurement: a diode with a 150 kOhm resistor beside it,\n"
                + "# simulated in ngspice 39 (" + TRUTH + ", R 150k; reltol 1e-9), no noise.\nV [V],I [A],T [degC]\n");
        for (int k = 0; k < volts.length; k++) {
            sb.append(String.format(Locale.ROOT, "%.12g,%.12g,27%n", volts[k], currents.get(k)));
        }
        Files.writeString(file, sb.toString(), StandardCharsets.UTF_8);
    }

    @Test
    void everyDialectGetsASubcircuitFileWithTheResistor() throws Exception {
        for (Dialect d : Dialect.values()) {
            Path file = out.resolve(ShuntedCard.fileName("SHX", d));
            assertTrue(Files.exists(file), file + " written");
            ShuntedCard.Read r = ShuntedCard.read(Files.readString(file), file.toString(), d);
            System.out.printf(Locale.ROOT, "%s: R %.7g ohm (truth %.7g, %+.4f %%)%n", d.shortName(), r.shuntResistance(),
                    SHUNT, 100 * (r.shuntResistance() / SHUNT - 1));
            assertEquals(SHUNT, r.shuntResistance(), SHUNT_NOISE_FREE * SHUNT, d.shortName() + " resistor");
            String plain = Files.readString(out.resolve("SHX." + d.shortName() + ".lib"));
            assertTrue(plain.contains("* junction alone: the data show ") && plain.contains("leaving it out costs forward worst RMS")
                    && plain.contains("reverse leakage RMS"), "the plain card states what leaving the resistor out costs:\n" + plain);
        }
    }

    @Test
    void theSubcircuitLoadsInNgspiceWithoutWarningAndReproducesTheData() throws Exception {
        String file = Files.readString(out.resolve("SHX.shunted.ngspice.lib"));
        StringBuilder sb = new StringBuilder("* the written subcircuit, verbatim, fed by a current source\nI1 0 a DC 0\n");
        sb.append("X1 a 0 ").append(ShuntedCard.subcircuitName("SHX")).append('\n').append(file);
        sb.append(".options reltol=1e-9 vntol=1e-12 abstol=1e-20\n.control\nset wr_singlescale\noption numdgt=15\nset appendwrite\n");
        for (double i : forwardCurrents) {
            sb.append(String.format(Locale.ROOT, "alter i1 dc = %.17g%nop%nwrdata points.dat v(a)%n", i));
        }
        sb.append("quit\n.endc\n.end\n");
        double[] v = run(sb.toString(), forwardCurrents.length, "shunted-load");
        double worst = 0;
        for (int k = 0; k < v.length; k++) {
            worst = Math.max(worst, Math.abs(v[k] - forwardVolts[k]));
        }
        System.out.printf(Locale.ROOT, "subcircuit in ngspice vs data: worst %.3g V over %d points%n", worst, v.length);
        assertTrue(worst < NOISE_FREE_MAX_RESIDUAL, "worst " + worst + " V");
    }

    @Test
    void theGnucapSubcircuitLoadsInGnucapWithoutWarningAndReproducesTheData() throws Exception {
        SimulatorProcess gnucap = new SimulatorProcess(SimulatorProcess.Kind.GNUCAP, Simulators.requireGnucap(), TIMEOUT);
        String file = Files.readString(out.resolve("SHX.shunted.gnucap.lib"));
        String title = "the written gnucap subcircuit, verbatim";
        StringBuilder sb = new StringBuilder(title).append("\nI1 0 a dc 0\nX1 a 0 ")
                .append(ShuntedCard.subcircuitName("SHX")).append('\n').append(file);
        sb.append(".options numdgt=15 reltol=1e-6 vntol=1e-9 abstol=1e-16 floor=1e-99 vfloor=1e-99\n.print op v(a)\n");
        for (double i : forwardCurrents) {
            sb.append(String.format(Locale.ROOT, ".modify I1=%.17g%n.op 27%n", i));
        }
        sb.append(".end\n");
        // runClean fails on any warning gnucap prints; every line after the title is a header or a result row
        SimulatorProcess.Run run = gnucap.runClean(sb.toString(), Simulators.tempDir("shunted-gnucap"));
        List<String> lines = run.result().stdout().lines().map(String::strip).toList();
        List<Double> v = new ArrayList<>();
        for (String line : lines.subList(lines.indexOf(title) + 1, lines.size())) {
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            String[] f = line.split("\\s+");
            assertEquals(2, f.length, "a result row, not a message: " + line);
            v.add(Double.parseDouble(f[1]));
        }
        assertEquals(forwardCurrents.length, v.size(), "one row per operating point");
        double worst = 0;
        for (int k = 0; k < v.size(); k++) {
            worst = Math.max(worst, Math.abs(v.get(k) - forwardVolts[k]));
        }
        System.out.printf(Locale.ROOT, "gnucap subcircuit vs ngspice data: worst %.3g V over %d points%n", worst, v.size());
        assertTrue(worst < NOISE_FREE_MAX_RESIDUAL, "worst " + worst + " V");
    }

    @Test
    void verifyPassesTheSubcircuitWithEveryEngineAndFailsTheJunctionAlone() throws Exception {
        Simulators.requireGnucap();
        String fwd = dir.resolve("shx-forward.csv").toString();
        String rev = dir.resolve("shx-reverse.csv").toString();
        for (String engine : List.of("builtin", "ngspice")) {
            CliRun v = CliRun.of("verify", out.resolve("SHX.shunted.ngspice.lib").toString(), fwd, rev, "--engine", engine);
            System.out.println(v.out());
            assertEquals(ExitCodes.OK, v.exitCode(), engine + ": " + v.describe());
        }
        CliRun g = CliRun.of("verify", out.resolve("SHX.shunted.gnucap.lib").toString(), fwd, rev, "--engine", "gnucap");
        assertEquals(ExitCodes.OK, g.exitCode(), "gnucap: " + g.describe());
        CliRun plain = CliRun.of("verify", out.resolve("SHX.ngspice.lib").toString(), fwd, rev);
        assertEquals(ExitCodes.NOT_REPRODUCED, plain.exitCode(), "the plain card is the junction alone: " + plain.describe());
    }

    @Test
    void compareSimulatesTheResistorOfASubcircuitFile() throws Exception {
        String sub = out.resolve("SHX.shunted.ngspice.lib").toString();
        CliRun same = CliRun.of("compare", sub, sub, "--temp", "27");
        assertEquals(ExitCodes.OK, same.exitCode(), same.describe());
        assertTrue(same.out().contains("R(shunt)"), "the resistor is listed beside the parameters:\n" + same.out());
        CliRun alone = CliRun.of("compare", out.resolve("SHX.ngspice.lib").toString(), sub, "--temp", "27");
        assertEquals(ExitCodes.NOT_REPRODUCED, alone.exitCode(),
                "the junction alone and the subcircuit differ where the resistor carries the current: " + alone.describe());
    }

    @Test
    void theOutputIsByteStable() throws Exception {
        Path again = dir.resolve("cards-again");
        CliRun fit = CliRun.of("fit", dir.resolve("shx-forward.csv").toString(), dir.resolve("shx-reverse.csv").toString(),
                "--name", "SHX", "--out", again.toString(), "--dialect", "ngspice,spice3,gnucap,xyce", "--force");
        assertEquals(ExitCodes.OK, fit.exitCode(), fit.describe());
        for (Dialect d : Dialect.values()) {
            for (String name : List.of(ShuntedCard.fileName("SHX", d), "SHX." + d.shortName() + ".lib")) {
                assertEquals(Files.readString(out.resolve(name)), Files.readString(again.resolve(name)), name);
            }
        }
    }
}
