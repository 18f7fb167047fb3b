package org.cardwright.sim;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.model.Ngspice39;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;

/**
 * Small-signal capacitance by ngspice AC analysis (batch mode). The netlist is ours, written from the card's parsed
 * name and numbers only ({@link CardUnderTest#modelStatement}; no card text): one diode driven by a voltage source {@code V1 a 0 DC v AC 1}, and per bias an {@code alter} of
 * the DC value followed by a one-frequency {@code ac} run. The anode current is -Y for a unit AC source, so
 * the parallel capacitance is C = -Im(I(V1))/(2 pi f), written with 16 digits. Convergence options are tight
 * (RELTOL 1e-7, VNTOL 1e-10 V, ABSTOL 1e-16 A) so that the operating point under RS is solved far below any
 * residual worth reporting; GMIN stays at its default because it is part of the model. Any warning from
 * ngspice fails the run: a card the simulator complains about is not proven.
 */
public final class NgspiceCapacitance implements CapacitanceEngine {
    private static final String OUTPUT = "capacitance.dat";

    private final SimulatorProcess process;
    private final Path workRoot;

    /**
     * @param process  the ngspice process runner
     * @param workRoot folder for netlists and outputs (each run uses a fresh subfolder)
     */
    public NgspiceCapacitance(SimulatorProcess process, Path workRoot) {
        if (process.kind() != SimulatorProcess.Kind.NGSPICE) {
            throw new IllegalArgumentException("NgspiceCapacitance needs an ngspice process, got " + process.kind().command());
        }
        this.process = process;
        this.workRoot = workRoot;
    }

    @Override
    public String name() {
        return "ngspice";
    }

    @Override
    public String describe() throws SimulationException {
        return "ngspice AC analysis (" + process.version() + ", " + process.executable() + ")";
    }

    /** The netlist that {@link #capacitance} runs; public so tests and users can inspect and rerun it. */
    public static String netlist(CardUnderTest card, List<Bias> voltageBiases, double frequency) {
        CapacitanceEngine.checkArguments(voltageBiases, frequency);
        StringBuilder sb = new StringBuilder();
        sb.append("* cardwright small-signal capacitance of model ").append(card.name()).append('\n');
        sb.append("V1 a 0 DC 0 AC 1\n");
        sb.append("D1 a 0 ").append(card.name()).append('\n');
        sb.append(card.modelStatement());
        sb.append(".options reltol=1e-7 vntol=1e-10 abstol=1e-16\n");
        sb.append(".control\n");
        sb.append("set wr_singlescale\n");
        sb.append("option numdgt=15\n");
        sb.append("set appendwrite\n");
        double lastT = Double.NaN;
        String f = num(frequency);
        for (Bias b : voltageBiases) {
            if (b.temperature() != lastT) {
                sb.append("option temp=").append(num(b.temperature() - Ngspice39.CELSIUS_TO_KELVIN)).append('\n');
                lastT = b.temperature();
            }
            sb.append("alter v1 dc = ").append(num(b.value())).append('\n');
            sb.append("ac lin 1 ").append(f).append(' ').append(f).append('\n');
            sb.append("let cpar = -imag(i(v1)) / (2 * pi * real(frequency))\n");
            sb.append("wrdata ").append(OUTPUT).append(" cpar\n");
            sb.append("destroy all\n");
        }
        sb.append("quit\n.endc\n.end\n");
        return sb.toString();
    }

    private static String num(double v) {
        return DeckNumbers.format(v);
    }

    @Override
    public List<Double> capacitance(CardUnderTest card, List<Bias> voltageBiases, double frequency)
            throws SimulationException {
        String netlist = netlist(card, voltageBiases, frequency);
        if (voltageBiases.isEmpty()) {
            return List.of();
        }
        SimulatorProcess.Run run = process.runClean(netlist, workRoot, voltageBiases.size());
        Path dir = run.folder();
        String kept = " (netlist kept in " + dir + ")";
        List<String> lines = ResultTable.lines(dir.resolve(OUTPUT), voltageBiases.size(), "ngspice", kept);
        // two columns: the frequency, the capacitance
        List<Double> out = new ArrayList<>(voltageBiases.size());
        for (double[] row : ResultTable.read(lines, 2, voltageBiases.size(), "ngspice", kept)) {
            out.add(row[1]);
        }
        SimulatorProcess.discard(dir);
        return out;
    }
}
