package org.cardwright.sim;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.model.Ngspice39;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;

/**
 * Re-simulates a card in ngspice (batch mode). The netlist is ours, written from the card's parsed name and numbers
 * only ({@link CardUnderTest#modelStatement}; no card text): one diode per operating point, each driven by its own
 * current or voltage source and given its own device temperature (the instance's {@code temp}, which ngspice 39
 * uses wherever the circuit temperature would be used for that diode), all solved by one {@code op}. The points do
 * not touch each other (each has its own nodes), so the one solution is each point's own; ngspice starts once, parses
 * once and writes one result file ({@code write}, raw format as text), so the run time grows with the number of
 * points only by the solve of a larger sparse system (600 to 6000 points: 0.02 to 0.3 s of ngspice's CPU on the
 * development machine, against 0.4 to 4 s for an {@code op} per point in a control loop). The terminal voltage
 * (forced current) and the device current ({@code @D[id]}) are read strictly by name ({@link RawFile}). Convergence
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

    /** The file the deck writes its operating points to (ngspice's raw format, as text). */
    static final String RESULT_FILE = "points.raw";
    /** Device currents named per {@code save} line, to keep the deck's lines short. */
    private static final int SAVES_PER_LINE = 50;

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
        // with RTH0 the thermal node and flag make ngspice heat the junction by its own dissipation
        boolean thermal = card.parameters().isGiven(org.cardwright.model.Param.RTH0);
        for (int k = 1; k <= biases.size(); k++) {
            Bias b = biases.get(k - 1);
            String node = "a" + k;
            if (b.forcing() == Bias.Forcing.CURRENT) {
                sb.append("I").append(k).append(" 0 ").append(node).append(" DC ").append(num(b.value())).append('\n');
            } else {
                sb.append("V").append(k).append(' ').append(node).append(" 0 DC ").append(num(b.value())).append('\n');
            }
            sb.append("D").append(k).append(' ').append(node).append(" 0 ").append(thermal ? "t" + k + " " : "")
                    .append(card.name()).append(" temp=").append(num(b.temperature() - Ngspice39.CELSIUS_TO_KELVIN))
                    .append(thermal ? " thermal" : "").append('\n');
            if (card.hasShunt()) {
                // the resistor a subcircuit card carries beside its diode, between the same two nodes
                sb.append("R").append(k).append(' ').append(node).append(" 0 ").append(num(card.shuntResistance())).append('\n');
            }
        }
        sb.append(card.modelStatement());
        sb.append(".options reltol=").append(num(CONVERGENCE.reltol())).append(" vntol=1e-10 abstol=1e-20\n");
        sb.append(".control\n");
        sb.append("set filetype=ascii\n");
        sb.append("save all\n");
        for (int k = 1; k <= biases.size(); k++) {
            sb.append(k % SAVES_PER_LINE == 1 ? "save" : "").append(" @d").append(k).append("[id]");
            if (k % SAVES_PER_LINE == 0 || k == biases.size()) {
                sb.append('\n');
            }
        }
        sb.append("op\n");
        sb.append("write ").append(RESULT_FILE).append('\n');
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
        java.util.Map<String, Double> values = RawFile.read(dir.resolve(RESULT_FILE), 4 * biases.size() + 16, "ngspice", kept);
        List<OperatingPoint> out = new ArrayList<>(biases.size());
        for (int k = 1; k <= biases.size(); k++) {
            Bias b = biases.get(k - 1);
            double id = RawFile.value(values, "i(@d" + k + "[id])", "ngspice", kept);
            if (b.forcing() == Bias.Forcing.CURRENT) {
                out.add(new OperatingPoint(RawFile.value(values, "v(a" + k + ")", "ngspice", kept), id));
            } else {
                // the device current (equal to the terminal current at DC), evaluated by ngspice at the converged
                // junction voltage; i(v1) would carry the cancellation in (v(b) - v(internal))/RS
                // plus the resistor's current beside it, V/R by Ohm's law at the forced voltage
                out.add(new OperatingPoint(b.value(), id + card.shuntConductance() * b.value()));
            }
        }
        SimulatorProcess.discard(dir);
        return out;
    }
}
