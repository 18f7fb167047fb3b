package org.cardwright.cli;

import java.io.PrintWriter;
import org.cardwright.card.CardFormatException;
import org.cardwright.card.CardTemplateException;
import org.cardwright.failure.KnownFailure;
import org.cardwright.failure.UsageException;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.workflow.ToolVersion;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * The {@code cardwright} command. {@link #main} calls {@link #execute}, which returns the exit code; the one
 * place that maps failures to exit codes is {@link #handle}.
 */
@Command(name = "cardwright",
        mixinStandardHelpOptions = true,
        versionProvider = Main.Version.class,
        description = {Main.DESCRIPTION, ""},
        footerHeading = Main.FOOTER_HEADING,
        footer = {Main.FOOTER_0, Main.FOOTER_1, Main.FOOTER_2, Main.FOOTER_3, Main.FOOTER_4, Main.FOOTER_5, Main.FOOTER_6,
            Main.FOOTER_70, "", Main.SAFETY})
public final class Main implements Runnable {
    // the root command's help texts, shared by the annotations and by spec() (the model a run builds)
    static final String DESCRIPTION = "Fits SPICE diode .model cards to bench measurements and re-simulates each card against the same data.";
    static final String FOOTER_HEADING = "%nExit codes%n";
    static final String FOOTER_0 = "  0  done; for verify: the card reproduces the data";
    static final String FOOTER_1 = "  1  verify, check: not reproduced; compare: over a limit; lot: not all fitted";
    static final String FOOTER_2 = "  2  wrong command line";
    static final String FOOTER_3 = "  3  an input file is unreadable or malformed";
    static final String FOOTER_4 = "  4  the data cannot support a fit";
    static final String FOOTER_5 = "  5  an external simulator is missing, timed out or failed";
    static final String FOOTER_6 = "  6  an output file exists (use --force) or cannot be written";
    static final String FOOTER_70 = " 70  internal error (please report it, with --stack-trace)";
    static final String SAFETY = "Bench safety: forward sweeps to amperes heat small parts well past touch-safe temperatures, and "
            + "breakdown and surge tests put high voltage on exposed leads. Set current and voltage compliance "
            + "limits before you connect a part, and follow your local codes and licensed practice.";
    static final String STACK_TRACE = "On failure, print the Java stack trace as well as the one-line message.";

    @Option(names = "--stack-trace", scope = CommandLine.ScopeType.INHERIT,
            description = STACK_TRACE)
    boolean stackTrace;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "name a command: fit, verify, build, tweak, compare, check or lot (try --help)");
    }

    public static void main(String[] args) {
        System.exit(execute(args));
    }

    /** Runs the command line and returns the exit code; never calls System.exit. */
    public static int execute(String... args) {
        return execute(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args);
    }

    /** Runs with the given output streams (for tests). */
    public static int execute(PrintWriter out, PrintWriter err, String... args) {
        Preload.start(commandWord(args));
        CommandLine cl = commandLine(args);
        cl.setOut(out);
        cl.setErr(err);
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> handle(ex, commandLine));
        cl.setParameterExceptionHandler(Main::wrongCommandLine);
        try {
            return cl.execute(args);
        } catch (OutOfMemoryError e) {
            // the work that filled the heap is unreachable once we are here, so there is room to say so
            err.println("cardwright: out of memory (Java heap limit " + (Runtime.getRuntime().maxMemory() >> 20)
                    + " MB); give Java more with -Xmx, or split or thin the data");
            err.flush();
            return ExitCodes.INTERNAL_ERROR;
        } catch (StackOverflowError e) {
            err.println("cardwright: internal error (stack overflow); please report it with the output of --stack-trace");
            err.flush();
            return ExitCodes.INTERNAL_ERROR;
        }
    }

    /** The subcommands, in the order the help lists them. */
    private static final java.util.List<String> COMMANDS = java.util.List.of("fit", "verify", "build", "tweak", "compare",
            "check", "lot", "help");

    /** A new instance of the subcommand {@code name} (a plain switch: no lambdas to link at start-up). */
    private static Object command(String name) {
        switch (name) {
            case "fit": return FitCommand.spec(new FitCommand());
            case "verify": return new VerifyCommand();
            case "build": return new BuildCommand();
            case "tweak": return new TweakCommand();
            case "compare": return new CompareCommand();
            case "check": return new CheckCommand();
            case "lot": return new LotCommand();
            default: return new CommandLine.HelpCommand();
        }
    }

    /**
     * Interprets option values: an {@link IllegalArgumentException} thrown while doing so is a wrong command
     * line (exit 2). Used by the commands around everything that reads their options and nothing else, so that
     * the same exception thrown deeper (by the fit, say) is not taken for a usage error.
     */
    static <T> T option(java.util.function.Supplier<T> interpretation) {
        try {
            return interpretation.get();
        } catch (UsageException e) {
            throw e;
        } catch (IllegalArgumentException e) {
            throw new UsageException(e.getMessage(), e);
        }
    }

    /**
     * The command line for {@code args}. picocli reads the annotations of every subcommand it is given when the
     * command line is built; a run that names one subcommand gets only that one, which saves the reflection over
     * the other five, and a run that only asks for the version gets none. Anything else (no command, help, an
     * unknown word) gets all of them. The root command's and {@code fit}'s models are built in code ({@link #spec},
     * {@link FitCommand#spec}), without reading annotations.
     */
    static CommandLine commandLine(String... args) {
        CommandLine cl = new CommandLine(new Main().spec());
        String named = commandWord(args);
        if (named != null && !named.equals("help") && COMMANDS.contains(named)) {
            cl.addSubcommand(named, command(named));
        } else if (onlyVersion(args)) {
            return cl;  // the version text names no command
        } else {
            for (String name : COMMANDS) {
                cl.addSubcommand(name, command(name));
            }
        }
        // a command's header is its one-sentence summary in the command list; its own help opens with the usage
        for (CommandLine sub : cl.getSubcommands().values()) {
            java.util.List<String> sections = new java.util.ArrayList<>(sub.getHelpSectionKeys());
            sections.remove(CommandLine.Model.UsageMessageSpec.SECTION_KEY_HEADER_HEADING);
            sections.remove(CommandLine.Model.UsageMessageSpec.SECTION_KEY_HEADER);
            sub.setHelpSectionKeys(sections);
        }
        return cl;
    }

    /**
     * The root command's picocli model, built in code (no annotation read): what the annotations above declare
     * ({@code CommandModelTest} holds the two to each other).
     */
    CommandLine.Model.CommandSpec spec() {
        CommandLine.Model.CommandSpec s = CommandLine.Model.CommandSpec.wrapWithoutInspection(this);
        s.name("cardwright");
        s.versionProvider(new Version());
        s.usageMessage().description(DESCRIPTION, "").footerHeading(FOOTER_HEADING).footer(FOOTER_0, FOOTER_1, FOOTER_2,
                FOOTER_3, FOOTER_4, FOOTER_5, FOOTER_6, FOOTER_70, "", SAFETY);
        s.addOption(CommandModel.option(this, "stackTrace", boolean.class, "--stack-trace").description(STACK_TRACE)
                .scopeType(CommandLine.ScopeType.INHERIT).build());
        CommandModel.addStandardHelp(s);
        spec = s;
        return s;
    }

    /** The subcommand {@code args} name before any option but {@code --stack-trace}, or null. */
    private static String commandWord(String... args) {
        for (String a : args) {
            if (!a.startsWith("-")) {
                return a;
            }
            if (!a.equals("--stack-trace")) {
                return null;  // a root option such as --help: it lists every command
            }
        }
        return null;
    }

    /** Whether {@code args} only ask for the version ({@code --version} or {@code -V}, maybe with {@code --stack-trace}). */
    private static boolean onlyVersion(String... args) {
        boolean version = false;
        for (String a : args) {
            if (a.equals("--version") || a.equals("-V")) {
                version = true;
            } else if (!a.equals("--stack-trace")) {
                return false;
            }
        }
        return version;
    }

    /**
     * A command line picocli could not read (a missing or unknown option, a bad value): one line naming the
     * problem, picocli's suggestions for a mistyped option when it has any, and where the help is; never the
     * whole usage text. Exit 2.
     */
    static int wrongCommandLine(CommandLine.ParameterException ex, String[] args) {
        CommandLine commandLine = ex.getCommandLine();
        PrintWriter err = commandLine.getErr();
        err.println("cardwright: " + ex.getMessage());
        CommandLine.UnmatchedArgumentException.printSuggestions(ex, err);
        err.println("see '" + commandLine.getCommandSpec().qualifiedName() + " --help'");
        err.flush();
        return ExitCodes.USAGE;
    }

    /**
     * Maps a failure to its exit code, printing one line (and the stack trace on request). A
     * {@link KnownFailure} carries its own code; the card, simulator and library exceptions, which predate it,
     * are mapped by type; anything else is a bug (exit 70).
     */
    static int handle(Exception ex, CommandLine commandLine) {
        PrintWriter err = commandLine.getErr();
        Main root = commandLine.getCommandSpec().root().userObject() instanceof Main m ? m : null;
        boolean trace = root != null && root.stackTrace;
        int code;
        String message = ex.getMessage();
        if (ex instanceof java.nio.file.NoSuchFileException nf) {
            message = nf.getFile() + ": no such file";
        } else if (ex instanceof java.nio.file.AccessDeniedException ad) {
            message = ad.getFile() + ": permission denied";
        }
        if (ex instanceof KnownFailure known) {
            code = known.kind().exitCode();
        } else if (ex instanceof CardFormatException || ex instanceof java.io.IOException
                || ex instanceof CardTemplateException) {
            code = ExitCodes.BAD_INPUT;
        } else if (ex instanceof SimulationException) {
            code = ExitCodes.SIMULATOR_FAILED;
        } else if (ex instanceof CommandLine.ParameterException) {
            code = ExitCodes.USAGE;
        } else {
            code = ExitCodes.INTERNAL_ERROR;
            message = "internal error (" + ex.getClass().getSimpleName() + "): " + message
                    + "; please report it with the output of --stack-trace";
        }
        err.println("cardwright: " + message);
        if (trace) {
            ex.printStackTrace(err);
        }
        err.flush();
        return code;
    }

    /** Reads the version from the build. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"cardwright " + ToolVersion.get(),
                "diode equations: ngspice 39 level 1; Java " + System.getProperty("java.version")};
        }
    }
}
