package org.cardwright.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.cardwright.card.Dialect;
import org.cardwright.report.HtmlReport;
import org.cardwright.report.VerificationJson;
import org.cardwright.report.VerificationText;
import org.cardwright.verify.Tolerance;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.workflow.Engines;
import org.cardwright.workflow.Inputs;
import org.cardwright.workflow.OutputFiles;
import org.cardwright.workflow.OutputPlan;
import org.cardwright.workflow.VerifyRequest;
import org.cardwright.workflow.VerifyWorkflow;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright verify}: does this card reproduce these measurements? */
@Command(name = "verify", mixinStandardHelpOptions = true, sortOptions = false,
        header = "Re-simulates a card at every measured point and judges it.",
        description = {
            "Re-simulates a card at every measured point and compares, per data kind and temperature: forward and "
                    + "breakdown I-V by terminal voltage at the measured current (mV), C-V by capacitance (%%), "
                    + "recovery records by time (ns), leakage by current (decades). Exits 0 when every kind at every "
                    + "temperature is within its limits, 1 when not."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright verify models/KS1.ngspice.lib fixtures/demo/ks1-forward-*.csv",
            "  cardwright verify models/KS1.ngspice.lib fixtures/demo/ks1-*.csv --engine ngspice --json check.json",
            "  cardwright verify models/KS1.ngspice.lib fixtures/demo/ks1-*.csv --html KS1-evidence.html",
            "  cardwright verify vendor.lib bench.csv --temp 25 --model D7 --limit-rms 5 --limit-max 15",
            "  cardwright verify lib/parts/Z1.ngspice.lib --device lib/parts/Z1.device.yaml",
            "  cardwright verify Z1.lib hot.csv cold.csv --temp-for hot.csv=85 --temp-for cold.csv=-40"})
final class VerifyCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "CARD", description = "The card file (.lib, .mod, ...).")
    Path card;

    @Parameters(index = "1..*", arity = "0..*", paramLabel = "DATA",
            description = "Measurement CSV files (none with --device, which lists them).")
    List<Path> data = new java.util.ArrayList<>();

    @Option(names = "--device", paramLabel = "FILE",
            description = "A library part's device file: verify against the data files it lists, read with the conditions it states for each (temperature, stray capacitance, ...); the model name defaults to its model.")
    Path device;

    @picocli.CommandLine.Mixin
    SimulatorTimeLimit simulatorTimeLimit = new SimulatorTimeLimit();

    @Option(names = "--engine", paramLabel = "E", defaultValue = "builtin",
            description = "Who simulates: " + Engines.NAMES + " (default: ${DEFAULT-VALUE}). An engine runs only cards of a "
                    + "dialect it reads (ngspice: ngspice and spice3 cards; gnucap: gnucap cards; builtin: all); any other "
                    + "card is refused with exit 2, as check reports it not checkable.")
    String engine;

    @Option(names = "--model", paramLabel = "NAME", description = "The model name the card must carry (a card file holds one .model).")
    String model;

    @Option(names = "--dialect", paramLabel = "D",
            description = "Dialect to read the card in: ngspice, spice3, gnucap, xyce (default: from a NAME.DIALECT.lib file name, else ngspice).")
    String dialect;

    @Option(names = "--limit-rms", paramLabel = "MV", defaultValue = "2",
            description = "Largest RMS residual per temperature, in mV (default: ${DEFAULT-VALUE}).")
    double limitRms;

    @Option(names = "--limit-max", paramLabel = "MV", defaultValue = "5",
            description = "Largest residual at any point, in mV (default: ${DEFAULT-VALUE}).")
    double limitMax;

    @Option(names = "--verdict", paramLabel = "BASIS", defaultValue = "noise", converter = OptionConverters.Verdict.class,
            description = "What decides pass or fail: noise (the residual RMS against the data's own uncertainty, stated or "
                    + "estimated from the residuals' point-to-point scatter) or fixed (the engineering limits). Both figures are printed. Default: ${DEFAULT-VALUE}.")
    org.cardwright.verify.VerdictBasis verdict;

    @Option(names = "--json", paramLabel = "FILE", description = "Also write the result, point by point, as JSON.")
    Path json;

    @Option(names = "--html", paramLabel = "FILE",
            description = "Also write an evidence page: one self-contained HTML file with plots and tables.")
    Path html;

    @Option(names = "--force", description = "Replace an existing JSON or HTML file.")
    boolean force;

    @picocli.CommandLine.Mixin
    DataOptions reading = new DataOptions();

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    /** The --dialect given, else the one a NAME.DIALECT.lib file name names, else ngspice. */
    static Dialect dialectOf(Path card, String option) {
        if (option != null) {
            return Dialect.byName(option);
        }
        String file = card.getFileName().toString().toLowerCase(java.util.Locale.ROOT);
        for (Dialect d : Dialect.values()) {
            if (file.endsWith("." + d.shortName() + ".lib")) {
                return d;
            }
        }
        return Dialect.NGSPICE;
    }

    /** The command as given, the data files' hashes and the card's parameters, for the evidence page. */
    private org.cardwright.report.PageFacts pageFacts() throws Exception {
        String source = Inputs.displayName(card);
        String text = org.cardwright.card.CardReader.readText(card, source);
        Dialect d = dialectOf(card, dialect);
        var parsed = org.cardwright.card.ShuntedCard.readEither(text, source, d, Optional.ofNullable(model)).card();
        return new org.cardwright.report.PageFacts(
                org.cardwright.report.PageFacts.command("cardwright", spec.commandLine().getParseResult().originalArgs()),
                org.cardwright.report.PageFacts.hash(data), org.cardwright.report.PageFacts.parametersOf(parsed.parameters()));
    }

    /** Per file: the device file's conditions first, then those of --temp-for. */
    private static java.util.Map<Path, org.cardwright.data.GivenConditions> merged(
            java.util.Map<Path, org.cardwright.data.GivenConditions> first,
            java.util.Map<Path, org.cardwright.data.GivenConditions> then) {
        java.util.Map<Path, org.cardwright.data.GivenConditions> out = new java.util.LinkedHashMap<>(then);
        first.forEach((p, g) -> out.merge(p, g, (t, d) -> d.orElse(t)));
        return out;
    }

    /** The data files and per-file conditions of {@code --device}, when given; else the DATA files as given. */
    private java.util.Map<Path, org.cardwright.data.GivenConditions> deviceData() throws Exception {
        java.util.Map<Path, org.cardwright.data.GivenConditions> given = new java.util.LinkedHashMap<>();
        if (device == null) {
            return given;
        }
        if (!data.isEmpty()) {
            throw new org.cardwright.failure.UsageException("give either DATA files or --device (which lists the data), not both");
        }
        org.cardwright.library.DeviceFile part = new org.cardwright.library.DeviceFileReader().read(device);
        String shown = Inputs.displayName(device);
        List<Path> listed = new java.util.ArrayList<>();
        for (org.cardwright.library.DataSource s : part.data()) {
            if (!s.kind().readable()) {
                continue;
            }
            // as the user would name it: relative to where the device file was named from
            Path p = (device.getParent() == null ? Path.of("") : device.getParent()).resolve(s.file()).normalize();
            listed.add(p);
            given.put(p, s.given(shown));
        }
        data = listed;
        if (model == null) {
            model = part.model();
        }
        return given;
    }

    @Override
    public Integer call() throws Exception {
        simulatorTimeLimit.apply();
        java.util.Map<Path, org.cardwright.data.GivenConditions> fromDevice = deviceData();
        OutputPlan plan = new OutputPlan().input("the card", card).inputs("data file", data);
        if (json != null) {
            plan.output("--json", json);
        }
        if (html != null) {
            plan.output("--html", html);
        }
        plan.check();
        if (html != null) {
            OutputFiles.checkWritable(List.of(html), force);
        }
        VerifyRequest request = Main.option(() -> new VerifyRequest(card, data, engine, Optional.ofNullable(model),
                dialectOf(card, dialect),
                reading.temperatureKelvin(),
                new Tolerance(limitRms * 1e-3, limitMax * 1e-3), Optional.ofNullable(json), force,
                reading.capacitance(),
                reading.bench(true), verdict).withConditions(merged(fromDevice, reading.perFile(data))));
        JunctionVerification v = new VerifyWorkflow().runAll(request, r -> VerificationJson.write(r, Inputs.displayName(card)));
        if (html != null) {
            OutputFiles.writeAtomically(html, HtmlReport.render(v, Inputs.displayName(card), pageFacts()));
        }
        Terminal.print(spec, VerificationText.render(v));
        return v.pass() ? ExitCodes.OK : ExitCodes.NOT_REPRODUCED;
    }
}
