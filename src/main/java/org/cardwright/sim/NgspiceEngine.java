package org.cardwright.sim;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.model.Ngspice39;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;

/**
 * Re-simulates a card in ngspice (batch mode). The netlist is ours, written from the card's parsed name and numbers
 * only ({@link CardUnderTest#modelStatement}; no card text): one diode driven by a current or voltage source, one
 * {@code op} per bias with the source value changed by {@code alter}, and the terminal voltage (forced current) or
 * the device current (forced voltage) written with 16 digits. After each point's row is written, {@code destroy all}
 * frees the analysis's vectors, so that the run time stays linear in the number of points (without it, every
 * {@code op} adds a plot that later commands walk). The rows are read strictly ({@link ResultTable}). Convergence
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
        sb.append(card.modelStatement());
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
            sb.append("destroy all\n");
        }
        sb.append("quit\n.endc\n.end\n");
        return sb.toString();
    }

    private static String num(double v) {
        return DeckNumbers.format(v);
    }

    @Override
    public List<OperatingPoint> dc(CardUnderTest card, List<Bias> biases) throws SimulationException {
        if (biases.isEmpty()) {
            return List.of();
        }
        SimulatorProcess.Run run = process.runClean(netlist(card, biases), workRoot, biases.size());
        Path dir = run.folder();
        String kept = " (netlist kept in " + dir + ")";
        List<String> lines = ResultTable.lines(dir.resolve("points.dat"), biases.size(), "ngspice", kept);
        List<double[]> rows = ResultTable.read(lines, 4, biases.size(), "ngspice", kept);
        List<OperatingPoint> out = new ArrayList<>(biases.size());
        for (int k = 0; k < biases.size(); k++) {
            Bias b = biases.get(k);
            double[] f = rows.get(k);
            if (b.forcing() == Bias.Forcing.CURRENT) {
                out.add(new OperatingPoint(f[1], f[2]));
            } else {
                // the device current (equal to the terminal current at DC), evaluated by ngspice at the converged
                // junction voltage; i(v1) would carry the cancellation in (v(b) - v(internal))/RS
                // plus the resistor's current beside it, V/R by Ohm's law at the forced voltage
                out.add(new OperatingPoint(b.value(), f[3] + card.shuntConductance() * b.value()));
            }
        }
        SimulatorProcess.discard(dir);
        return out;
    }
}
