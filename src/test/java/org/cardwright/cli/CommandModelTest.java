package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

/**
 * The picocli models {@link Main} builds in code for a short run (the root command, {@code fit} and its data options)
 * against the models picocli reads from the same classes' annotations: every option and parameter alike in every
 * attribute picocli uses, the same usage text, the same values and the same error messages from the same command
 * lines. A change to one declaration that is not made to the other fails here.
 */
class CommandModelTest {

    /** The command line picocli builds from the annotations, with the given subcommands, as Main lays it out. */
    private static CommandLine annotated(List<String> names) {
        CommandLine cl = new CommandLine(new Main());
        for (String name : names) {
            Object command = switch (name) {
                case "fit" -> new FitCommand();
                case "verify" -> new VerifyCommand();
                case "build" -> new BuildCommand();
                case "tweak" -> new TweakCommand();
                case "compare" -> new CompareCommand();
                case "check" -> new CheckCommand();
                case "lot" -> new LotCommand();
                default -> new CommandLine.HelpCommand();
            };
            cl.addSubcommand(name, command);
        }
        for (CommandLine sub : cl.getSubcommands().values()) {
            List<String> sections = new ArrayList<>(sub.getHelpSectionKeys());
            sections.remove(CommandLine.Model.UsageMessageSpec.SECTION_KEY_HEADER_HEADING);
            sections.remove(CommandLine.Model.UsageMessageSpec.SECTION_KEY_HEADER);
            sub.setHelpSectionKeys(sections);
        }
        return cl;
    }

    /** Everything picocli reads of an option or positional parameter, as one comparable line. */
    private static String describe(ArgSpec a) {
        StringBuilder b = new StringBuilder();
        if (a instanceof OptionSpec o) {
            b.append("option ").append(List.of(o.names())).append(" usageHelp=").append(o.usageHelp())
                    .append(" versionHelp=").append(o.versionHelp()).append(" negatable=").append(o.negatable())
                    .append(" order=").append(o.order()).append(" fallback=").append(o.fallbackValue())
                    .append(" descriptionKey=").append(o.descriptionKey());
        } else if (a instanceof CommandLine.Model.PositionalParamSpec p) {
            b.append("positional index=").append(p.index());
        }
        b.append(" label=").append(a.paramLabel()).append(" arity=").append(a.arity()).append(" required=")
                .append(a.required()).append(" type=").append(a.type().getName()).append(" aux=");
        for (Class<?> c : a.auxiliaryTypes()) {
            b.append(c.getName()).append(',');
        }
        b.append(" split=").append(a.splitRegex()).append(" default=").append(a.defaultValue()).append(" hidden=")
                .append(a.hidden()).append(" hideParamSyntax=").append(a.hideParamSyntax()).append(" interactive=")
                .append(a.interactive()).append(" inherited=").append(a.inherited()).append(" scope=").append(a.scopeType())
                .append(" description=").append(List.of(a.description())).append(" converters=");
        for (CommandLine.ITypeConverter<?> c : a.converters()) {
            b.append(c.getClass().getName()).append(',');
        }
        b.append(" initial=").append(a.initialValue()).append(" group=").append(a.group());
        return b.toString();
    }

    private static List<String> describeAll(CommandSpec spec) {
        List<String> out = new ArrayList<>();
        for (ArgSpec a : spec.args()) {
            out.add(describe(a));
        }
        out.add("mixins " + spec.mixins().keySet() + " standardHelp=" + spec.mixinStandardHelpOptions());
        CommandLine.Model.UsageMessageSpec u = spec.usageMessage();
        out.add("usage sort=" + u.sortOptions() + " header=" + List.of(u.header()) + " description=" + List.of(u.description())
                + " footerHeading=" + u.footerHeading() + " footer=" + List.of(u.footer()) + " name=" + spec.name()
                + " version=" + List.of(spec.version()));
        return out;
    }

    @Test
    void theRootAndFitModelsBuiltInCodeEqualTheAnnotatedOnes() {
        CommandLine coded = Main.commandLine("fit", "x.csv", "--name", "N");
        CommandLine annotated = annotated(List.of("fit"));
        assertEquals(List.of("fit"), List.copyOf(coded.getSubcommands().keySet()));
        assertEquals(describeAll(annotated.getCommandSpec()), describeAll(coded.getCommandSpec()));
        CommandSpec fitCoded = coded.getSubcommands().get("fit").getCommandSpec();
        CommandSpec fitAnnotated = annotated.getSubcommands().get("fit").getCommandSpec();
        assertEquals(describeAll(fitAnnotated), describeAll(fitCoded));
        assertEquals(describeAll(fitAnnotated.mixins().get("reading")), describeAll(fitCoded.mixins().get("reading")));
        assertEquals(annotated.getUsageMessage(), coded.getUsageMessage());
        assertEquals(annotated.getSubcommands().get("fit").getUsageMessage(), coded.getSubcommands().get("fit").getUsageMessage());
    }

    @Test
    void theWholeHelpEqualsTheAnnotatedOne() {
        CommandLine coded = Main.commandLine("--help");
        CommandLine annotated = annotated(List.of("fit", "verify", "build", "tweak", "compare", "check", "lot", "help"));
        assertEquals(annotated.getUsageMessage(), coded.getUsageMessage());
        assertTrue(coded.getUsageMessage().contains("Commands:"), coded.getUsageMessage());
    }

    /** The fields a parsed fit command line sets, as one comparable text. */
    private static String values(FitCommand f) {
        return List.of(String.valueOf(f.data), String.valueOf(f.name), String.valueOf(f.out), String.valueOf(f.dialects),
                String.valueOf(f.rules), String.valueOf(f.kind), String.valueOf(f.json), String.valueOf(f.html),
                String.valueOf(f.digits), String.valueOf(f.templates), String.valueOf(f.noMeterCorrection),
                String.valueOf(f.selfHeating), String.valueOf(f.sweepGap), String.valueOf(f.robust), String.valueOf(f.force),
                String.valueOf(f.reading.temperature), String.valueOf(f.reading.temperatureFor), String.valueOf(f.reading.stray),
                String.valueOf(f.reading.cvFrequency), String.valueOf(f.reading.meterResistance)).toString();
    }

    /** What parsing {@code args} gives: the fields set and the root's flag, or picocli's error message. */
    private static String parse(CommandLine cl, String... args) {
        try {
            CommandLine.ParseResult r = cl.parseArgs(args);
            StringBuilder b = new StringBuilder("stack-trace=" + ((Main) cl.getCommandSpec().userObject()).stackTrace);
            if (r.subcommand() != null) {
                b.append(' ').append(values((FitCommand) r.subcommand().commandSpec().userObject()))
                        .append(" help=").append(r.subcommand().isUsageHelpRequested())
                        .append(" version=").append(r.subcommand().isVersionHelpRequested());
            }
            return b.append(" help=").append(r.isUsageHelpRequested()).append(" version=").append(r.isVersionHelpRequested())
                    .toString();
        } catch (CommandLine.ParameterException e) {
            StringWriter suggestions = new StringWriter();
            CommandLine.UnmatchedArgumentException.printSuggestions(e, new PrintWriter(suggestions, true));
            return "error: " + e.getMessage() + " | " + suggestions;
        }
    }

    @Test
    void theSameCommandLinesGiveTheSameValuesAndErrors() {
        List<String[]> lines = List.of(
                new String[] {"fit", "a.csv", "b.csv", "--name", "D1"},
                new String[] {"--stack-trace", "fit", "a.csv", "--name=D1", "--out", "o", "--dialect", "ngspice,xyce",
                    "--dialect", "gnucap", "--set", "RS=0.5", "--set", "IKF=off", "--kind", "zener", "--json", "j.json",
                    "--html", "p.html", "--digits", "9", "--templates", "t", "--no-meter-correction", "--self-heating",
                    "exclude", "--sweep-gap", "0.5", "--robust", "--force", "--temp", "25", "--temp-for", "a.csv=-40",
                    "--stray-capacitance", "1p", "--cv-frequency", "100k", "--meter-resistance", "10meg"},
                new String[] {"fit", "a.csv", "--name", "D1", "--stack-trace"},
                new String[] {"fit", "--help"},
                new String[] {"fit", "-h"},
                new String[] {"fit", "-V"},
                new String[] {"--version"},
                new String[] {"-hV"},
                new String[] {"fit", "a.csv"},
                new String[] {"fit", "--name", "D1"},
                new String[] {"fit", "a.csv", "--name"},
                new String[] {"fit", "a.csv", "--name", "D1", "--digits", "many"},
                new String[] {"fit", "a.csv", "--name", "D1", "--sweep-gap", "x"},
                new String[] {"fit", "a.csv", "--name", "D1", "--self-heating", "cool"},
                new String[] {"fit", "a.csv", "--name", "D1", "--temp", "warm"},
                new String[] {"fit", "a.csv", "--name", "D1", "--nme", "x"},
                new String[] {"fit", "a.csv", "--name", "D1", "--dialcet", "x"},
                new String[] {"fit", "a.csv", "--name", "D1", "--name", "D2"},
                new String[] {"fit", "a.csv", "--name", "D1", "--robust=maybe"},
                new String[] {"--stack-trac", "fit"});
        for (String[] args : lines) {
            String coded = parse(Main.commandLine(args), args);
            String annotated = parse(annotated(List.of("fit")), args);
            assertEquals(annotated, coded, String.join(" ", args));
        }
        assertFalse(parse(Main.commandLine("fit", "a.csv"), "fit", "a.csv").contains("stack-trace"),
                "a missing --name is an error");
    }

    @Test
    void aCodedFitRunsThroughMainAsBefore() {
        CliRun run = CliRun.of("fit", "--name", "D1");
        assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
        assertTrue(run.err().contains("Missing required parameter: 'DATA'"), run.describe());
        assertTrue(run.err().contains("see 'cardwright fit --help'"), run.describe());
    }
}
