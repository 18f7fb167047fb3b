package org.cardwright.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.cardwright.card.Dialect;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.FitSettings;
import org.cardwright.fit.ParameterRule;
import org.cardwright.report.FitJson;
import org.cardwright.report.FitText;
import org.cardwright.workflow.FitOutcome;
import org.cardwright.workflow.FitRequest;
import org.cardwright.workflow.FitWorkflow;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright fit}: measurements in, model cards out. */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        header = FitCommand.HEADER,
        description = {FitCommand.DESCRIPTION},
        footerHeading = FitCommand.FOOTER_HEADING,
        footer = {FitCommand.FOOTER_1, FitCommand.FOOTER_2, FitCommand.FOOTER_3, "", FitCommand.FOOTER_5, "", FitCommand.FOOTER_7})
final class FitCommand implements Callable<Integer> {
    // The texts of the command's help, shared by its annotations and by spec() (the model a run builds)
    static final String HEADER = "Fits one diode card to all the data of a part, in every dialect.";
    static final String DESCRIPTION = "Fits one diode card to everything measured on a part, at every temperature at once: forward I-V, "
            + "reverse leakage and breakdown, C-V and reverse-recovery records; series-resistor bench logs are "
            + "corrected for the meter's draw. Writes a card per dialect (default: ngspice and spice3) as "
            + "OUT/NAME.DIALECT.lib. Optional terms (recombination ISR/NR, high injection IKF, TRS1, "
            + "self-heating RTH0) go in only when the data call for them; the summary says which and why. "
            + "The summary goes to standard output, notes about the data to standard error.";
    static final String FOOTER_HEADING = "%nExamples%n";
    static final String FOOTER_1 = "  cardwright fit fixtures/demo/ks1-forward-*.csv --name KS1 --out models";
    static final String FOOTER_2 = "  cardwright fit sweep.csv --temp 25 --name D7 --set RS=0.5 --set IKF=off --json d7.json";
    static final String FOOTER_3 = "  cardwright fit cold.csv hot.csv --name D9 --set N=1..2 --set TNOM=25 --dialect ngspice";
    static final String FOOTER_5 = "Rules for --set: RS=0.5 holds a value; ISR=free forces a term on; IKF=off keeps it out; "
            + "N=1..2 bounds it; IS=1e-12~ gives a start value. Values take SPICE suffixes (2.5n, 10meg).";
    static final String FOOTER_7 = "Data: CSV with columns V and I (units in brackets: I [mA]), optional T [degC]; see README.md and "
            + "docs/formats.md.";
    static final String DATA = "Measurement CSV files.";
    static final String NAME = "Model name on the card.";
    static final String OUT = "Folder for the cards (default: ${DEFAULT-VALUE}).";
    static final String DIALECT = "Card dialect(s), comma-separated: ngspice, spice3, gnucap, xyce (default: ngspice,spice3). Every card but the ngspice one is refitted with its own simulator's equations.";
    static final String SET = "A parameter rule, e.g. RS=0.5, ISR=free, IKF=off, N=1..2. Repeatable.";
    static final String KIND = "Device kind for presets: silicon-pn, schottky, germanium, led, zener, base-emitter (default: ${DEFAULT-VALUE}).";
    static final String JSON = "Also write the result as JSON.";
    static final String HTML = "Also write the evidence page of the first card: its parameters with standard errors, and the card re-simulated at every point by the built-in engine, as verify --html writes it.";
    static final String DIGITS = "Significant digits on the card (default: ${DEFAULT-VALUE}).";
    static final String TEMPLATES = "Folder of card templates overriding the bundled ones.";
    static final String NO_METER_CORRECTION = "Take bench-log currents as (Vsupply - Vmeter)/Rseries, without removing the meter's draw (for comparison only).";
    static final String SELF_HEATING = "When the junction warms itself at high current: fit (carry RTH0 on the card) or exclude "
            + "(leave out the points whose voltage the warming moves by more than 0.1 mV, fit without RTH0). Default: ${DEFAULT-VALUE}.";
    static final String SWEEP_GAP = "Logged temperatures further apart than this start a new sweep; closer ones (a chamber logger's wander) "
            + "form one sweep, each point keeping its own temperature in the model. 0: every distinct temperature is a sweep. Default: ${DEFAULT-VALUE} K.";
    static final String ROBUST = "Fit with a robust loss (Huber weights): points far off the curve count less, and are listed by file and line.";
    static final String FORCE = "Replace existing output files.";

    @Parameters(arity = "1..*", paramLabel = "DATA", description = DATA)
    List<Path> data;

    @Option(names = "--name", required = true, paramLabel = "NAME", description = NAME)
    String name;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = ".", description = OUT)
    Path out;

    @Option(names = "--dialect", split = ",", paramLabel = "D",
            description = DIALECT)
    List<String> dialects;

    @Option(names = "--set", paramLabel = "RULE", description = SET)
    List<String> rules = new ArrayList<>();

    @Option(names = "--kind", paramLabel = "KIND", defaultValue = "silicon-pn",
            description = KIND)
    String kind;

    @Option(names = "--json", paramLabel = "FILE", description = JSON)
    Path json;

    @Option(names = "--html", paramLabel = "FILE",
            description = HTML)
    Path html;

    @Option(names = "--digits", paramLabel = "N", defaultValue = "7", description = DIGITS)
    int digits;

    @Option(names = "--templates", paramLabel = "DIR", description = TEMPLATES)
    Path templates;

    @Option(names = "--no-meter-correction",
            description = NO_METER_CORRECTION)
    boolean noMeterCorrection;

    @Option(names = "--self-heating", paramLabel = "HOW", defaultValue = "fit", converter = OptionConverters.SelfHeating.class,
            description = SELF_HEATING)
    FitSettings.SelfHeatingRemedy selfHeating;

    @Option(names = "--sweep-gap", paramLabel = "KELVIN", defaultValue = "1",
            description = SWEEP_GAP)
    double sweepGap;

    @Option(names = "--robust",
            description = ROBUST)
    boolean robust;

    @Option(names = "--force", description = FORCE)
    boolean force;

    @picocli.CommandLine.Mixin
    DataOptions reading = new DataOptions();

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    /**
     * The evidence page of the first card written: verified against the same data by the built-in engine with the
     * default limits, with the parameters' standard errors from its fit (the refit's, for a dialect that was refitted).
     */
    private void writePage(FitOutcome outcome) throws Exception {
        FitOutcome.WrittenCard card = outcome.cards().get(0);
        org.cardwright.fit.FitResult fit = card.refit().orElse(outcome.fit());
        java.util.Map<org.cardwright.model.Param, Double> errors = new java.util.EnumMap<>(org.cardwright.model.Param.class);
        for (org.cardwright.fit.FittedParameter p : fit.fitted()) {
            if (p.origin() == org.cardwright.fit.FittedParameter.Origin.FITTED && Double.isFinite(p.standardError())) {
                errors.put(p.param(), p.standardError());
            }
        }
        org.cardwright.workflow.VerifyRequest request = new org.cardwright.workflow.VerifyRequest(card.file(), data,
                "builtin", Optional.of(name), card.dialect(), reading.temperatureKelvin(),
                org.cardwright.verify.Tolerance.DEFAULT, Optional.empty(), force, reading.capacitance(),
                reading.bench(!noMeterCorrection)).withConditions(reading.perFile(data));
        org.cardwright.verify.JunctionVerification v = new org.cardwright.workflow.VerifyWorkflow().runAll(request, r -> "");
        var parsed = new org.cardwright.card.CardReader().parse(card.text(),
                org.cardwright.workflow.Inputs.displayName(card.file()), card.dialect(), Optional.of(name));
        org.cardwright.report.PageFacts facts = new org.cardwright.report.PageFacts(
                org.cardwright.report.PageFacts.command("cardwright", spec.commandLine().getParseResult().originalArgs()),
                org.cardwright.report.PageFacts.hash(data),
                org.cardwright.report.PageFacts.parametersOf(parsed.parameters(), errors));
        org.cardwright.workflow.OutputFiles.writeAtomically(html, org.cardwright.report.HtmlReport.render(v,
                org.cardwright.workflow.Inputs.displayName(card.file()), facts));
    }

    @Override
    public Integer call() throws Exception {
        FitRequest request = Main.option(this::request);
        if (html != null) {
            org.cardwright.workflow.OutputPlan plan = new org.cardwright.workflow.OutputPlan().inputs("data file", data)
                    .output("--html", html);
            if (json != null) {
                plan.output("--json", json);
            }
            plan.check();
            org.cardwright.workflow.OutputFiles.checkWritable(List.of(html), force);
        }
        FitOutcome outcome = new FitWorkflow().run(request, o -> FitJson.write(name, o));
        if (html != null) {
            writePage(outcome);
        }
        Terminal.print(spec, FitText.render(name, outcome));
        return ExitCodes.OK;
    }

    /**
     * The command's picocli model, built in code (no annotation read): the same options, texts and order as the
     * annotations above declare ({@code CommandModelTest} holds the two to each other), bound to {@code command}'s fields.
     */
    static CommandSpec spec(FitCommand command) {
        CommandSpec spec = CommandSpec.wrapWithoutInspection(command);
        spec.name("fit");
        spec.usageMessage().sortOptions(false).header(HEADER).description(DESCRIPTION).footerHeading(FOOTER_HEADING)
                .footer(FOOTER_1, FOOTER_2, FOOTER_3, "", FOOTER_5, "", FOOTER_7);
        CommandModel.FieldAccess data = new CommandModel.FieldAccess(command, "data");
        spec.addPositional(CommandLine.Model.PositionalParamSpec.builder().arity("1..*").required(true).paramLabel("DATA").description(DATA)
                .type(List.class).auxiliaryTypes(Path.class).getter(data).setter(data).descriptionKey("").initialValue(data.get()).build());
        spec.addOption(CommandModel.option(command, "name", String.class, "--name", "NAME", NAME).required(true).build());
        spec.addOption(CommandModel.option(command, "out", Path.class, "--out", "DIR", OUT).defaultValue(".").build());
        spec.addOption(CommandModel.option(command, "dialects", List.class, "--dialect", "D", DIALECT)
                .auxiliaryTypes(String.class).splitRegex(",").build());
        spec.addOption(CommandModel.option(command, "rules", List.class, "--set", "RULE", SET).auxiliaryTypes(String.class).build());
        spec.addOption(CommandModel.option(command, "kind", String.class, "--kind", "KIND", KIND).defaultValue("silicon-pn").build());
        spec.addOption(CommandModel.option(command, "json", Path.class, "--json", "FILE", JSON).build());
        spec.addOption(CommandModel.option(command, "html", Path.class, "--html", "FILE", HTML).build());
        spec.addOption(CommandModel.option(command, "digits", int.class, "--digits", "N", DIGITS).defaultValue("7").build());
        spec.addOption(CommandModel.option(command, "templates", Path.class, "--templates", "DIR", TEMPLATES).build());
        spec.addOption(CommandModel.flag(command, "noMeterCorrection", "--no-meter-correction", NO_METER_CORRECTION));
        spec.addOption(CommandModel.option(command, "selfHeating", FitSettings.SelfHeatingRemedy.class, "--self-heating", "HOW",
                SELF_HEATING).defaultValue("fit").converters(new OptionConverters.SelfHeating()).build());
        spec.addOption(CommandModel.option(command, "sweepGap", double.class, "--sweep-gap", "KELVIN", SWEEP_GAP)
                .defaultValue("1").build());
        spec.addOption(CommandModel.flag(command, "robust", "--robust", ROBUST));
        spec.addOption(CommandModel.flag(command, "force", "--force", FORCE));
        spec.addMixin("reading", DataOptions.spec(command.reading));
        CommandModel.addStandardHelp(spec);
        command.spec = spec;
        return spec;
    }

    /** The request the options describe; a wrong value is a wrong command line. */
    private FitRequest request() {
        List<Dialect> ds = new ArrayList<>();
        for (String d : dialects == null ? List.of("ngspice", "spice3") : dialects) {
            Dialect dialect = Dialect.byName(d.trim());
            if (!ds.contains(dialect)) {
                ds.add(dialect);
            }
        }
        List<ParameterRule> parsed = new ArrayList<>();
        for (String r : rules) {
            parsed.add(ParameterRule.parse(r, SpiceNumbers::parse));
        }
        return new FitRequest(data, name, ds, out, Optional.ofNullable(json),
                reading.temperatureKelvin(),
                DeviceKind.byOptionName(kind), parsed, digits, force, Optional.ofNullable(templates),
                reading.capacitance(),
                reading.bench(!noMeterCorrection),
                selfHeating, robust, sweepGap).withConditions(reading.perFile(data));
    }
}
