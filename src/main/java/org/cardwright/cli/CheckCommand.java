package org.cardwright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.cardwright.library.CardCheck;
import org.cardwright.library.CheckReport;
import org.cardwright.library.LibraryCheck;
import org.cardwright.library.LibraryInventory;
import org.cardwright.workflow.Engines;
import org.cardwright.workflow.OutputFiles;
import org.cardwright.workflow.OutputPlan;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright check}: does every card of a library still reproduce its data? For CI. */
@Command(name = "check", mixinStandardHelpOptions = true, sortOptions = false,
        header = "Re-simulates every card of a library against its part's data.",
        description = {
            "Re-simulates every card of a model library at every measured point of every data kind its part has "
                    + "(forward, breakdown, C-V, recovery, leakage) and judges each kind as verify does. Prints one line "
                    + "per card and a table with a row per card and kind; writes a JUnit XML report on request. A card "
                    + "whose dialect the engine does not read is reported not checkable (neither pass nor failure). "
                    + "Exits 0 when every card that was run passes, 1 when any card fails, is missing, or is out of date "
                    + "(its device file, data, templates or cardwright's version changed since it was made), or when no card could be run."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright check fixtures/library",
            "  cardwright check models --junit target/cardwright-check.xml --engine ngspice"})
final class CheckCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "ROOT", description = "The library folder.")
    Path root;

    @picocli.CommandLine.Mixin
    SimulatorTimeLimit simulatorTimeLimit = new SimulatorTimeLimit();

    @Option(names = "--engine", paramLabel = "E", defaultValue = "builtin",
            description = "Who simulates: " + Engines.NAMES + " (default: ${DEFAULT-VALUE}).")
    String engine;

    @Option(names = "--verdict", paramLabel = "BASIS", converter = OptionConverters.Verdict.class,
            description = "What decides pass or fail for each data kind, as in verify: noise (the residual RMS against the "
                    + "data's own uncertainty) or fixed (the engineering limits). Default: noise, except for a part whose "
                    + "device file sets its own tolerance limits, which is judged by them.")
    org.cardwright.verify.VerdictBasis verdict;

    @Option(names = "--junit", paramLabel = "FILE", description = "Also write a JUnit XML report (replaced if it exists).")
    Path junit;

    @Option(names = "--allow-outside-root",
            description = "Let device files name data files, card folders and template folders outside the library root "
                    + "(after symbolic links are resolved). Without it such paths are refused; see docs/security.md.")
    boolean allowOutsideRoot;

    @Option(names = {"--allow-outdated", "--allow-stale"},
            description = "Let outdated cards (made from older inputs) pass when they reproduce the data; --allow-stale is the earlier name.")
    boolean allowStale;

    @Option(names = "--jobs", paramLabel = "N",
            description = "Parts checked at once (default: one per processor). The lines and report are the same for any N.")
    Integer jobs;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        simulatorTimeLimit.apply();
        Engines.byName(engine);
        java.util.Optional<org.cardwright.verify.VerdictBasis> basis = java.util.Optional.ofNullable(verdict);
        if (junit != null) {
            // the report may replace an old report, never a file of the library
            LibraryInventory inventory = LibraryInventory.of(root, allowOutsideRoot);
            new OutputPlan().inputs("a file of the library", inventory.inputs())
                    .inputs("a card or state file of the library", inventory.outputs())
                    .output("--junit", junit).check();
        }
        PrintWriter out = spec.commandLine().getOut();
        PartProgress progress = new PartProgress("check", out, spec.commandLine().getErr(), PartProgress.onTerminal());
        List<CardCheck> checks;
        try {
            checks = new LibraryCheck(engine, allowStale, allowOutsideRoot).verdict(basis).check(root, progress::result, PartProgress.jobs(jobs),
                    (done, total, cards) -> progress.finished(done, total, cards.isEmpty() ? "" : cards.get(0).device(),
                            cards.stream().map(c -> c.status().name().toLowerCase(java.util.Locale.ROOT).replace('_', ' '))
                                    .distinct().collect(java.util.stream.Collectors.joining(", "))));
        } finally {
            progress.close();
        }
        out.println();
        out.print(CheckReport.table(checks));
        out.flush();
        if (junit != null) {
            OutputFiles.writeAtomically(junit, CheckReport.junitXml("cardwright check " + root.toString().replace('\\', '/'), checks));
        }
        if (checks.isEmpty()) {
            spec.commandLine().getErr().println("cardwright: no device files (*.device.yaml) under " + root);
            spec.commandLine().getErr().flush();
            return ExitCodes.BAD_INPUT;
        }
        if (checks.stream().allMatch(CardCheck::notCheckable)) {
            spec.commandLine().getErr().println("cardwright: no card under " + root + " is checkable with " + engine
                    + "; see the table");
            spec.commandLine().getErr().flush();
            return ExitCodes.NOT_REPRODUCED;
        }
        return checks.stream().allMatch(c -> c.passed() || c.notCheckable()) ? ExitCodes.OK : ExitCodes.NOT_REPRODUCED;
    }
}
