package org.cardwright.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.cardwright.card.Dialect;
import org.cardwright.compare.ComparisonLimits;
import org.cardwright.compare.ComparisonText;
import org.cardwright.library.DeviceFileReader;
import org.cardwright.library.PartTolerances;
import org.cardwright.report.ComparePage;
import org.cardwright.workflow.CompareRequest;
import org.cardwright.workflow.CompareWorkflow;
import org.cardwright.workflow.EngineChoice;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright compare}: two cards side by side, parameters and behaviour. */
@Command(name = "compare", mixinStandardHelpOptions = true, sortOptions = false,
        header = "Compares two cards, parameter by parameter and in simulation.",
        description = {
            "Compares two diode cards: the parameters side by side, then both cards simulated by the same engine (the "
                    + "built-in engine uses each card's own simulator's equations): forward voltage at each decade of "
                    + "current at each temperature, reverse leakage, capacitance at a few reverse voltages, and the "
                    + "breakdown voltage when a card has BV. Differences beyond the limits (a device file's tolerances, or "
                    + "the options below) are flagged; exits 1 when any is.",
            "Every reverse-bias option takes a positive magnitude, as a datasheet writes VR and IR: --leakage-at 5 and "
                    + "--capacitance-at 5 mean 5 V reverse, --breakdown-at 5m means 5 mA reverse; a negative value is refused "
                    + "(exit 2)."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright compare old/KS1.ngspice.lib new/KS1.ngspice.lib",
            "  cardwright compare vendor.mod RX10.ngspice.lib --dialect-a spice3 --engine ngspice --temp -40,25,125",
            "  cardwright compare a.lib b.lib --device rectifiers/RX10.device.yaml",
            "  cardwright compare a.lib b.lib --data fixtures/demo/ksz6-*.csv --html a-vs-b.html"})
final class CompareCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "CARD_A", description = "The first card file.")
    Path cardA;

    @Parameters(index = "1", paramLabel = "CARD_B", description = "The second card file.")
    Path cardB;

    @Option(names = "--model-a", paramLabel = "NAME", description = "The model name CARD_A must carry (a card file holds one .model).")
    String modelA;

    @Option(names = "--model-b", paramLabel = "NAME", description = "The model name CARD_B must carry (a card file holds one .model).")
    String modelB;

    @Option(names = "--dialect-a", paramLabel = "D", converter = OptionConverters.DialectName.class,
            completionCandidates = OptionConverters.DialectNames.class,
            description = "Dialect of CARD_A: ${COMPLETION-CANDIDATES} (default: from a NAME.DIALECT.lib file name, else ngspice).")
    Dialect dialectA;

    @Option(names = "--dialect-b", paramLabel = "D", converter = OptionConverters.DialectName.class,
            completionCandidates = OptionConverters.DialectNames.class,
            description = "Dialect of CARD_B: ${COMPLETION-CANDIDATES} (default: from a NAME.DIALECT.lib file name, else ngspice).")
    Dialect dialectB;

    @picocli.CommandLine.Mixin
    SimulatorTimeLimit simulatorTimeLimit = new SimulatorTimeLimit();

    @Option(names = "--engine", paramLabel = "E", defaultValue = "builtin", converter = OptionConverters.Engine.class,
            description = "Who simulates: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}). It must read both cards' "
                    + "dialects (ngspice: ngspice and spice3 cards; gnucap: gnucap cards; builtin: all), else exit 2.")
    EngineChoice engine;

    @Option(names = "--temp", split = ",", paramLabel = "DEGC",
            description = "Temperatures in degC (default: " + CompareWorkflow.DEFAULT_TEMPERATURES + ").")
    List<Double> temperatures;

    @Option(names = "--from", paramLabel = "A", defaultValue = CompareWorkflow.DEFAULT_FROM,
            description = "Lowest decade of forward current, positive (default: ${DEFAULT-VALUE}).")
    String from;

    @Option(names = "--to", paramLabel = "A", defaultValue = CompareWorkflow.DEFAULT_TO,
            description = "Highest decade of forward current, positive (default: ${DEFAULT-VALUE}).")
    String to;

    @Option(names = "--leakage-at", split = ",", paramLabel = "VR",
            description = "Reverse voltages for leakage, positive magnitudes (default: " + CompareWorkflow.DEFAULT_LEAKAGE + ").")
    List<String> leakageVoltages;

    @Option(names = "--capacitance-at", split = ",", paramLabel = "VR",
            description = "Reverse voltages for capacitance, magnitudes, 0 for zero bias (default: "
                    + CompareWorkflow.DEFAULT_CAPACITANCE + ").")
    List<String> capacitanceVoltages;

    @Option(names = "--breakdown-at", paramLabel = "IR",
            description = "Breakdown reference current, a positive magnitude: each card's breakdown voltage is where its "
                    + "reverse current exceeds its own leakage below the knee by this much (default: IBV of CARD_A, or of "
                    + "CARD_B when only B has BV).")
    String breakdownCurrent;

    @Option(names = "--device", paramLabel = "FILE", description = "Take the limits from this device file's tolerances.")
    Path device;

    @Option(names = "--limit-mv", paramLabel = "MV", description = "Forward-voltage limit in mV (default: the per-point verify limit, 5).")
    Double limitMillivolts;

    @Option(names = "--data", arity = "1..*", paramLabel = "FILE",
            description = "Measurement files to overlay both cards on in the --html page (every data kind they hold; "
                    + "each file states its temperature in a T column or its header).")
    List<Path> data;

    @Option(names = "--html", paramLabel = "FILE",
            description = "Write a self-contained HTML page that overlays both cards on the --data measurements.")
    Path html;

    @Option(names = "--force", description = "Replace an existing --html file.")
    boolean force;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        simulatorTimeLimit.apply();
        PartTolerances t = device == null ? PartTolerances.DEFAULT : new DeviceFileReader().read(device).tolerances();
        double forwardLimit = limitMillivolts != null ? limitMillivolts * 1e-3 : t.forward().max();
        CompareRequest request = Main.option(() -> new CompareRequest(cardA, cardB, Optional.ofNullable(modelA),
                Optional.ofNullable(modelB), Optional.ofNullable(dialectA), Optional.ofNullable(dialectB), engine,
                temperatures == null ? List.of() : temperatures, from, to,
                leakageVoltages == null ? List.of() : leakageVoltages,
                capacitanceVoltages == null ? List.of() : capacitanceVoltages, Optional.ofNullable(breakdownCurrent),
                new ComparisonLimits(forwardLimit, t.leakageFactor(), t.capacitanceRelative(), t.breakdownRelative()),
                data == null ? List.of() : data, Optional.ofNullable(html), force));
        List<org.cardwright.report.PageFacts.DataFile> hashes = html != null && data != null
                ? org.cardwright.report.PageFacts.hash(data) : List.of();
        CompareWorkflow.Outcome o = new CompareWorkflow().run(request, r -> ComparePage.render(r,
                org.cardwright.report.PageFacts.command("cardwright", spec.commandLine().getParseResult().originalArgs()),
                hashes));
        o.cardNotes().forEach(n -> Terminal.note(spec, n));
        Terminal.print(spec, ComparisonText.render(o.comparison(), o.plan()));
        return o.comparison().flaggedCount() == 0 ? ExitCodes.OK : ExitCodes.NOT_REPRODUCED;
    }
}
