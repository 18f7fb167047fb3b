package org.cardwright.sim;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.model.Ngspice39;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;

/**
 * Re-simulates a card in gnucap 2017.10.03 (batch mode, {@code gnucap -b}). The card must be a gnucap card (the
 * gnucap dialect); its {@code .model} statement is written from the card's parsed name and numbers only
 * ({@link CardUnderTest#modelStatement}; no card text reaches gnucap).
 *
 * <p>The netlist is ours: one diode fed by a current source (forced current) and a second fed by a voltage
 * source (forced voltage), each bias set by {@code .modify} and solved by its own {@code .op T}, because gnucap
 * takes the temperature as the argument of the analysis command. Each {@code .op} prints one row with 15 digits.
 *
 * <p>What the engine returns, and why:
 * <ul>
 *   <li>forced current: the terminal voltage v(a) (RS included; gnucap's {@code vj()} would be the junction
 *       voltage inside RS) and the forced current. gnucap shunts every node to ground with GMIN (1e-12 S by
 *       default); that current flows in the simulator, not in the card's diode, and is left as gnucap has it.</li>
 *   <li>forced voltage: v(a) and the diode's current {@code i()}. A gnucap voltage source has a small internal
 *       resistance (option {@code short}, 10 micro-ohm by default); the netlist sets it to 1e-9 ohm, and the
 *       voltage returned is the node voltage gnucap solved, not the nominal one.</li>
 * </ul>
 * Tolerances are RELTOL 1e-6, VNTOL 1e-9 V, ABSTOL 1e-16 A: tighter ones made gnucap 2017 print "did not
 * converge" at 1 nA and -40 degC, while these converged everywhere we tried (4 cards, -40 to 125 degC, 1 nA to
 * 100 mA) with the terminal voltage within 5e-8 V of gnucap's own equations solved exactly. The print floors are
 * lowered so that small values are not printed as 0. Any line gnucap prints that is not a result ("did not
 * converge", a "bad parameter" warning, "no match", a model it cannot find) fails the run.
 */
public final class GnucapEngine implements SimulationEngine {
    /** The options line of every netlist: tolerances, print digits and floors, source resistance. */
    static final String OPTIONS =
            ".options numdgt=15 reltol=1e-6 vntol=1e-9 abstol=1e-16 floor=1e-99 vfloor=1e-99 short=1e-9";

    private static final String TITLE_PREFIX = "cardwright gnucap re-simulation of model ";

    private final SimulatorProcess process;
    private final Path workRoot;

    /**
     * @param process  the gnucap process runner (kind {@link SimulatorProcess.Kind#GNUCAP})
     * @param workRoot folder for netlists and outputs (each run uses a fresh subfolder)
     */
    public GnucapEngine(SimulatorProcess process, Path workRoot) {
        if (process == null || workRoot == null) {
            throw new IllegalArgumentException("a gnucap engine needs a process runner and a work folder");
        }
        if (process.kind() != SimulatorProcess.Kind.GNUCAP) {
            throw new IllegalArgumentException("the gnucap engine needs a gnucap process runner, got "
                    + process.kind().command());
        }
        this.process = process;
        this.workRoot = workRoot;
    }

    @Override
    public String name() {
        return "gnucap";
    }

    @Override
    public String describe() throws SimulationException {
        return "gnucap (" + process.version() + ", " + process.executable() + ")";
    }

    /** The netlist that {@link #dc} runs; public so tests and users can inspect and rerun it. */
    public static String netlist(CardUnderTest card, List<Bias> biases) {
        Instances d = Instances.avoiding(card.name());
        StringBuilder sb = new StringBuilder();
        sb.append(TITLE_PREFIX).append(card.name()).append('\n');
        sb.append("* forced current into ").append(d.currentDiode).append(", forced voltage across ")
                .append(d.voltageDiode).append('\n');
        sb.append(d.currentSource).append(" 0 a dc 0\n");
        sb.append(d.currentDiode).append(" a 0 ").append(card.name()).append('\n');
        sb.append(d.voltageSource).append(" b 0 dc 0\n");
        sb.append(d.voltageDiode).append(" b 0 ").append(card.name()).append('\n');
        if (card.hasShunt()) {
            // the resistor a subcircuit card carries beside its diode, between the same two nodes
            sb.append(d.currentResistor).append(" a 0 ").append(num(card.shuntResistance())).append('\n');
            sb.append(d.voltageResistor).append(" b 0 ").append(num(card.shuntResistance())).append('\n');
        }
        sb.append(card.modelStatement());
        sb.append(OPTIONS).append('\n');
        sb.append(".print op v(a) v(b) i(").append(d.voltageDiode).append(")\n");
        for (Bias b : biases) {
            boolean current = b.forcing() == Bias.Forcing.CURRENT;
            sb.append(".modify ").append(d.currentSource).append('=').append(current ? num(b.value()) : "0")
                    .append(' ').append(d.voltageSource).append('=').append(current ? "0" : num(b.value()))
                    .append('\n');
            sb.append(".op ").append(num(b.temperature() - Ngspice39.CELSIUS_TO_KELVIN)).append('\n');
        }
        sb.append(".end\n");
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
        SimulatorProcess.Result result = run.result();
        Path dir = run.folder();
        List<double[]> rows = rows(result.stdout(), TITLE_PREFIX + card.name(), dir);
        if (rows.size() != biases.size()) {
            throw new SimulationException("gnucap returned " + rows.size() + " of " + biases.size()
                    + " operating points (netlist kept in " + dir + ")");
        }
        List<OperatingPoint> out = new ArrayList<>(biases.size());
        for (int k = 0; k < biases.size(); k++) {
            Bias b = biases.get(k);
            double[] row = rows.get(k);
            out.add(b.forcing() == Bias.Forcing.CURRENT
                    ? new OperatingPoint(row[0], b.value())
                    // plus the resistor's current beside the diode, v(b)/R by Ohm's law at the solved node voltage
                    : new OperatingPoint(row[1], row[2] + card.shuntConductance() * row[1]));
        }
        SimulatorProcess.discard(dir);
        return out;
    }

    /**
     * The printed rows {v(a), v(b), i(voltage diode)} in order. gnucap echoes the title, then prints for each
     * {@code .op} a header line starting with {@code #} and one row: the temperature and the three values. Any
     * other line after the title is a message about the netlist and fails the run.
     */
    static List<double[]> rows(String stdout, String title, Path dir) throws SimulationException {
        List<String> lines = stdout.lines().map(String::strip).toList();
        int start = lines.indexOf(title.strip());
        if (start < 0) {
            throw new SimulationException("gnucap did not echo the netlist title; output ends with: "
                    + lastLine(lines) + " (netlist kept in " + dir + ")");
        }
        List<double[]> rows = new ArrayList<>();
        boolean expectRow = false;
        for (int i = start + 1; i < lines.size(); i++) {
            String line = lines.get(i);
            if (line.isEmpty()) {
                continue;
            }
            if (line.startsWith("#")) {
                expectRow = true;
                continue;
            }
            String[] f = line.split("\\s+");
            double[] row = expectRow && f.length == 4 ? numbers(f) : null;
            if (row == null) {
                // "did not converge", or any other message gnucap prints between the results
                throw new SimulationException("gnucap: " + ResultTable.excerpt(line) + " (at operating point " + (rows.size() + 1)
                        + "; netlist kept in " + dir + ")");
            }
            rows.add(row);
            expectRow = false;
        }
        return rows;
    }

    /** The three values after the temperature column, or null when one of the four fields is not a number. */
    private static double[] numbers(String[] fields) {
        try {
            parseNumber(fields[0]);
            return new double[] {parseNumber(fields[1]), parseNumber(fields[2]), parseNumber(fields[3])};
        } catch (NumberFormatException e) {
            return null;
        }
    }

    /**
     * A number as gnucap prints it: plain ({@code 0.00244980226335}), with an exponent ({@code 10.E+12}) or
     * with a scale letter ({@code 999.972950837p}, {@code 1.K}, {@code 2.5G}); {@code Meg} is 1e6 and
     * {@code m} 1e-3, as everywhere in SPICE.
     *
     * @throws NumberFormatException when the text is not such a number
     */
    static double parseNumber(String text) {
        int end = text.length();
        while (end > 0 && Character.isLetter(text.charAt(end - 1))) {
            end--;
        }
        String mantissa = text.substring(0, end);
        String suffix = text.substring(end);
        // "10.E+12": the letters stripped above were none; an 'E' inside stays with the mantissa
        if (!mantissa.matches("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?")) {
            throw new NumberFormatException("not a gnucap number: '" + text + "'");
        }
        double value = Double.parseDouble(mantissa) * scale(suffix, text);
        if (!Double.isFinite(value)) {
            throw new NumberFormatException("not a finite gnucap number: '" + text + "'");
        }
        return value;
    }

    private static double scale(String suffix, String text) {
        if (suffix.isEmpty()) {
            return 1;
        }
        if (suffix.equalsIgnoreCase("a")) {
            return 1e-18;  // gnucap prints atto, which SPICE decks do not use
        }
        org.cardwright.notation.SpiceSuffix s = org.cardwright.notation.SpiceSuffix.of(suffix).orElseThrow(
                () -> new NumberFormatException("unknown scale letter in gnucap number '" + text + "'"));
        return Double.parseDouble("1e" + s.power());
    }

    private static String lastLine(List<String> lines) {
        for (int i = lines.size() - 1; i >= 0; i--) {
            if (!lines.get(i).isEmpty()) {
                return lines.get(i);
            }
        }
        return "(nothing)";
    }

    /**
     * Element names that differ from the model name in any letter case (gnucap names are case-blind, and a
     * diode named like its model makes gnucap refuse the model).
     */
    private record Instances(String currentSource, String currentDiode, String voltageSource, String voltageDiode,
                             String currentResistor, String voltageResistor) {
        static Instances avoiding(String modelName) {
            String tag = "cw";
            while (List.of("i" + tag + "f", "d" + tag + "f", "v" + tag + "r", "d" + tag + "r", "r" + tag + "f", "r" + tag + "r")
                    .contains(modelName.toLowerCase(Locale.ROOT))) {
                tag = tag + "x";
            }
            return new Instances("I" + tag + "f", "D" + tag + "f", "V" + tag + "r", "D" + tag + "r", "R" + tag + "f",
                    "R" + tag + "r");
        }
    }
}
