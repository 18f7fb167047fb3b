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
import org.cardwright.workflow.VerifyRequest;
import org.cardwright.workflow.VerifyWorkflow;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright verify}: does this card reproduce these measurements? */
@Command(name = "verify", mixinStandardHelpOptions = true, sortOptions = false,
        description = {
            "Re-simulates a card at every measured point and compares, per temperature: forward and breakdown",
            "I-V by terminal voltage at the measured current (mV), C-V by capacitance (%%). Exits 0 when every",
            "kind at every temperature is within its limits, 1 when not."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright verify models/KS1.ngspice.lib fixtures/demo/ks1-forward-*.csv",
            "  cardwright verify models/KS1.ngspice.lib fixtures/demo/ks1-*.csv --engine ngspice --json check.json",
            "  cardwright verify models/KS1.ngspice.lib fixtures/demo/ks1-*.csv --html KS1-evidence.html",
            "  cardwright verify vendor.lib bench.csv --temp 25 --model D7 --limit-rms 5 --limit-max 15"})
final class VerifyCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "CARD", description = "The card file (.lib, .mod, ...).")
    Path card;

    @Parameters(index = "1..*", arity = "1..*", paramLabel = "DATA", description = "Measurement CSV files.")
    List<Path> data;

    @Option(names = "--engine", paramLabel = "E", defaultValue = "builtin",
            description = "Who simulates: " + Engines.NAMES + " (default: ${DEFAULT-VALUE}).")
    String engine;

    @Option(names = "--model", paramLabel = "NAME", description = "Which model, when the file holds several.")
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
        String text = java.nio.file.Files.readString(card, java.nio.charset.StandardCharsets.UTF_8);
        var parsed = new org.cardwright.card.CardReader().parse(text, Inputs.displayName(card), dialectOf(card, dialect),
                Optional.ofNullable(model));
        return new org.cardwright.report.PageFacts(
                org.cardwright.report.PageFacts.command("cardwright", spec.commandLine().getParseResult().originalArgs()),
                org.cardwright.report.PageFacts.hash(data), org.cardwright.report.PageFacts.parametersOf(parsed.parameters()));
    }

    @Override
    public Integer call() throws Exception {
        if (html != null) {
            if (json != null && json.toAbsolutePath().normalize().equals(html.toAbsolutePath().normalize())) {
                throw new IllegalArgumentException("--json and --html both name " + html + "; give them different files");
            }
            OutputFiles.checkWritable(List.of(html), force);
        }
        VerifyRequest request = new VerifyRequest(card, data, engine, Optional.ofNullable(model), dialectOf(card, dialect),
                reading.temperatureKelvin(),
                new Tolerance(limitRms * 1e-3, limitMax * 1e-3), Optional.ofNullable(json), force,
                reading.capacitance(),
                reading.bench(true));
        JunctionVerification v = new VerifyWorkflow().runAll(request, r -> VerificationJson.write(r, Inputs.displayName(card)));
        if (html != null) {
            OutputFiles.writeAtomically(html, HtmlReport.render(v, Inputs.displayName(card), pageFacts()));
        }
        spec.commandLine().getOut().print(VerificationText.render(v));
        spec.commandLine().getOut().flush();
        return v.pass() ? ExitCodes.OK : ExitCodes.NOT_REPRODUCED;
    }
}
