package org.cardwright.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.compare.CardComparer;
import org.cardwright.compare.CardComparison;
import org.cardwright.compare.ComparisonLimits;
import org.cardwright.compare.ComparisonPlan;
import org.cardwright.compare.ComparisonText;
import org.cardwright.library.DeviceFile;
import org.cardwright.library.DeviceFileReader;
import org.cardwright.library.PartTolerances;
import org.cardwright.model.Ngspice39;
import org.cardwright.workflow.Engines;
import org.cardwright.workflow.Inputs;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright compare}: two cards side by side, parameters and behaviour. */
@Command(name = "compare", mixinStandardHelpOptions = true, sortOptions = false,
        header = "Compares two cards, parameter by parameter and in simulation.",
        description = {
            "Compares two diode cards: the parameters side by side, then both cards simulated (the built-in "
                    + "engine uses each card's own simulator's equations): forward voltage at each decade of current "
                    + "at each temperature, reverse leakage, capacitance at a few biases, and the breakdown voltage "
                    + "when a card has BV. Differences beyond the limits (a device file's tolerances, or the options "
                    + "below) are flagged; exits 1 when any is."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright compare old/KS1.ngspice.lib new/KS1.ngspice.lib",
            "  cardwright compare vendor.mod RX10.ngspice.lib --dialect-a spice3 --engine ngspice --temp -40,25,125",
            "  cardwright compare a.lib b.lib --device rectifiers/RX10.device.yaml"})
final class CompareCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "CARD_A", description = "The first card file.")
    Path cardA;

    @Parameters(index = "1", paramLabel = "CARD_B", description = "The second card file.")
    Path cardB;

    @Option(names = "--model-a", paramLabel = "NAME", description = "The model name CARD_A must carry (a card file holds one .model).")
    String modelA;

    @Option(names = "--model-b", paramLabel = "NAME", description = "The model name CARD_B must carry (a card file holds one .model).")
    String modelB;

    @Option(names = "--dialect-a", paramLabel = "D", description = "Dialect of CARD_A (default: from a NAME.DIALECT.lib file name, else ngspice).")
    String dialectA;

    @Option(names = "--dialect-b", paramLabel = "D", description = "Dialect of CARD_B (default: from a NAME.DIALECT.lib file name, else ngspice).")
    String dialectB;

    @picocli.CommandLine.Mixin
    SimulatorTimeLimit simulatorTimeLimit = new SimulatorTimeLimit();

    @Option(names = "--engine", paramLabel = "E", defaultValue = "builtin",
            description = "Who simulates: " + Engines.NAMES + " (default: ${DEFAULT-VALUE}).")
    String engine;

    @Option(names = "--temp", split = ",", paramLabel = "DEGC", description = "Temperatures in degC (default: -40,25,125).")
    List<Double> temperatures;

    @Option(names = "--from", paramLabel = "A", defaultValue = "1n", description = "Lowest decade of forward current (default: ${DEFAULT-VALUE}).")
    String from;

    @Option(names = "--to", paramLabel = "A", defaultValue = "100m", description = "Highest decade of forward current (default: ${DEFAULT-VALUE}).")
    String to;

    @Option(names = "--leakage-at", split = ",", paramLabel = "V", description = "Reverse voltages for leakage, positive (default: 1,5,20).")
    List<String> leakageVoltages;

    @Option(names = "--capacitance-at", split = ",", paramLabel = "V", description = "Biases for capacitance (default: 0,-1,-5,-10).")
    List<String> capacitanceBiases;

    @Option(names = "--device", paramLabel = "FILE", description = "Take the limits from this device file's tolerances.")
    Path device;

    @Option(names = "--limit-mv", paramLabel = "MV", description = "Forward-voltage limit in mV (default: the per-point verify limit, 5).")
    Double limitMillivolts;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        simulatorTimeLimit.apply();
        CardReader reader = new CardReader();
        Dialect da = Main.option(() -> VerifyCommand.dialectOf(cardA, dialectA));
        Dialect db = Main.option(() -> VerifyCommand.dialectOf(cardB, dialectB));
        // a subcircuit file (NAME.shunted.DIALECT.lib) gives its .model and the resistor beside it, read strictly
        double[] shunt = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
        ParsedCard a = read(reader, cardA, da, modelA, shunt, 0);
        ParsedCard b = read(reader, cardB, db, modelB, shunt, 1);
        PartTolerances t = device == null ? PartTolerances.DEFAULT : new DeviceFileReader().read(device).tolerances();
        double forwardLimit = limitMillivolts != null ? limitMillivolts * 1e-3 : t.forward().max();
        List<Double> kelvin = new ArrayList<>();
        for (double c : temperatures == null ? List.of(-40.0, 25.0, 125.0) : temperatures) {
            kelvin.add(c + Ngspice39.CELSIUS_TO_KELVIN);
        }
        ComparisonPlan plan = Main.option(() -> new ComparisonPlan(kelvin, SpiceNumbers.parse(from), SpiceNumbers.parse(to),
                numbers(leakageVoltages, List.of("1", "5", "20")), numbers(capacitanceBiases, List.of("0", "-1", "-5", "-10")),
                ComparisonPlan.DEFAULT_FREQUENCY,
                new ComparisonLimits(forwardLimit, t.leakageFactor(), t.capacitanceRelative(), t.breakdownRelative())));
        // the built-in engine evaluates each card with the equations of the simulator it was written for
        CardComparison c = new CardComparer(Engines.byName(engine, da.flavour()), Engines.capacitanceByName(engine, da.flavour()),
                Engines.byName(engine, db.flavour()), Engines.capacitanceByName(engine, db.flavour()))
                .compare(a, shunt[0], Inputs.displayName(cardA), b, shunt[1], Inputs.displayName(cardB), plan);
        a.notices().forEach(n -> Terminal.note(spec, n.toString()));
        b.notices().forEach(n -> Terminal.note(spec, n.toString()));
        Terminal.print(spec, ComparisonText.render(c, plan));
        return c.flaggedCount() == 0 ? ExitCodes.OK : ExitCodes.NOT_REPRODUCED;
    }

    private static ParsedCard read(CardReader reader, java.nio.file.Path file, Dialect d, String model, double[] shunt,
                                   int slot) throws java.io.IOException {
        String text = java.nio.file.Files.readString(file, java.nio.charset.StandardCharsets.UTF_8);
        String source = file.toString();
        if (!org.cardwright.card.ShuntedCard.isSubcircuit(text, source)) {
            return reader.parse(text, source, d, Optional.ofNullable(model));
        }
        org.cardwright.card.ShuntedCard.Read r = org.cardwright.card.ShuntedCard.read(text, source, d);
        shunt[slot] = r.shuntResistance();
        return r.card();
    }

    private static List<Double> numbers(List<String> given, List<String> defaults) {
        List<Double> out = new ArrayList<>();
        for (String s : given == null ? defaults : given) {
            try {
                out.add(SpiceNumbers.parse(s.trim()));
            } catch (NumberFormatException e) {
                throw new org.cardwright.failure.UsageException("'" + s + "' is not a number");
            }
        }
        return out;
    }
}
