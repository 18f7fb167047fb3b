package org.cardwright.sim;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.model.Ngspice39;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;

/**
 * Re-simulates a card in ngspice (batch mode). The netlist is ours: the card text included verbatim, one
 * diode driven by a current or voltage source, one {@code op} per bias with the source value changed by
 * {@code alter}, and the terminal voltage (forced current) or the device current (forced voltage) written
 * with 16 digits. Convergence
 * options are tight (RELTOL 1e-7, VNTOL 1e-10 V, ABSTOL 1e-20 A) so that the simulator's tolerance stays far
 * below any residual worth reporting; GMIN stays at its default because it is part of the model.
 */
public final class NgspiceEngine implements SimulationEngine {
    /**
     * The options the re-simulation runs with. RELTOL is also the tolerance of ngspice's breakdown-knee
     * iteration, so the effective BV of a card depends on it slightly (a few 1e-5 V in typical cases); compare
     * with the built-in engine at these same options when agreement to 1e-6 matters.
     */
    public static final org.cardwright.model.SimulatorOptions CONVERGENCE =
            new org.cardwright.model.SimulatorOptions(org.cardwright.model.Ngspice39.DEFAULT_GMIN, 1e-7);

    private final SimulatorProcess process;
    private final Path workRoot;

    /**
     * @param process  the ngspice process runner
     * @param workRoot folder for netlists and outputs (each run uses a fresh subfolder)
     */
    public NgspiceEngine(SimulatorProcess process, Path workRoot) {
        this.process = process;
        this.workRoot = workRoot;
    }

    @Override
    public String name() {
        return "ngspice";
    }

    @Override
    public String describe() throws SimulationException {
        return "ngspice (" + process.version() + ", " + process.executable() + ")";
    }

    /** The netlist that {@link #dc} runs; public so tests and users can inspect and rerun it. */
    public static String netlist(CardUnderTest card, List<Bias> biases) {
        StringBuilder sb = new StringBuilder();
        sb.append("* cardwright re-simulation of model ").append(card.name()).append('\n');
        sb.append("I1 0 a DC 0\n");
        sb.append("V1 b 0 DC 0\n");
        // with RTH0 the thermal node and flag make ngspice heat the junction by its own dissipation
        boolean thermal = card.parameters().isGiven(org.cardwright.model.Param.RTH0);
        sb.append("D1 a 0 ").append(thermal ? "t1 " : "").append(card.name()).append(thermal ? " thermal" : "").append('\n');
        sb.append("D2 b 0 ").append(thermal ? "t2 " : "").append(card.name()).append(thermal ? " thermal" : "").append('\n');
        if (card.hasShunt()) {
            // the resistor a subcircuit card carries beside its diode, between the same two nodes
            sb.append("R1 a 0 ").append(num(card.shuntResistance())).append('\n');
            sb.append("R2 b 0 ").append(num(card.shuntResistance())).append('\n');
        }
        sb.append(card.text().endsWith("\n") ? card.text() : card.text() + "\n");
        sb.append(".options reltol=").append(num(CONVERGENCE.reltol())).append(" vntol=1e-10 abstol=1e-20\n");
        sb.append(".control\n");
        sb.append("set wr_singlescale\n");
        sb.append("option numdgt=15\n");
        sb.append("set appendwrite\n");
        sb.append("save v(a) @d1[id] @d2[id]\n");
        double lastT = Double.NaN;
        for (Bias b : biases) {
            if (b.temperature() != lastT) {
                sb.append("option temp=").append(num(b.temperature() - Ngspice39.CELSIUS_TO_KELVIN)).append('\n');
                lastT = b.temperature();
            }
            if (b.forcing() == Bias.Forcing.CURRENT) {
                sb.append("alter i1 dc = ").append(num(b.value())).append('\n');
                sb.append("alter v1 dc = 0\n");
            } else {
                sb.append("alter i1 dc = 0\n");
                sb.append("alter v1 dc = ").append(num(b.value())).append('\n');
            }
            sb.append("op\n");
            sb.append("wrdata points.dat v(a) @d1[id] @d2[id]\n");
        }
        sb.append("quit\n.endc\n.end\n");
        return sb.toString();
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.17g", v);
    }

    @Override
    public List<OperatingPoint> dc(CardUnderTest card, List<Bias> biases) throws SimulationException {
        if (biases.isEmpty()) {
            return List.of();
        }
        SimulatorProcess.Run run = process.runClean(netlist(card, biases), workRoot);
        Path dir = run.folder();
        List<String> lines;
        try {
            lines = Files.readAllLines(dir.resolve("points.dat"));
        } catch (IOException e) {
            throw new SimulationException("ngspice wrote no results (netlist kept in " + dir + "): " + e.getMessage(), e);
        }
        List<OperatingPoint> out = new ArrayList<>();
        for (String line : lines) {
            String t = line.trim();
            if (t.isEmpty()) {
                continue;
            }
            String[] f = t.split("\\s+");
            if (f.length < 4) {
                throw new SimulationException("ngspice output line has " + f.length + " columns, expected 4: " + t);
            }
            Bias b = biases.get(out.size());
            if (b.forcing() == Bias.Forcing.CURRENT) {
                out.add(new OperatingPoint(Double.parseDouble(f[1]), Double.parseDouble(f[2])));
            } else {
                // the device current (equal to the terminal current at DC), evaluated by ngspice at the converged
                // junction voltage; i(v1) would carry the cancellation in (v(b) - v(internal))/RS
                // plus the resistor's current beside it, V/R by Ohm's law at the forced voltage
                out.add(new OperatingPoint(b.value(), Double.parseDouble(f[3]) + card.shuntConductance() * b.value()));
            }
            if (out.size() > biases.size()) {
                break;
            }
        }
        if (out.size() != biases.size()) {
            throw new SimulationException("ngspice returned " + out.size() + " of " + biases.size()
                    + " operating points (netlist kept in " + dir + ")");
        }
        SimulatorProcess.discard(dir);
        return out;
    }
}
