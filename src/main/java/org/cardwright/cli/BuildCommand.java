package org.cardwright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.cardwright.library.LibraryBuilder;
import org.cardwright.library.PartOutcome;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright build}: fit every part of a model library whose inputs changed. */
@Command(name = "build", mixinStandardHelpOptions = true, sortOptions = false,
        header = "Fits every part of a model library whose inputs have changed.",
        description = {
            "Walks a folder tree for device files (*.device.yaml), fits each part whose settings, data or "
                    + "templates changed since its cards were made (by SHA-256, not time stamps), and writes its "
                    + "cards and its ledger (MODEL.state). Cards whose text comes out the same are left untouched. "
                    + "A card changed by hand is not replaced unless --replace-edited is given. One line per part, "
                    + "in order, on standard output; parts are fitted in parallel (--jobs), and standard error says "
                    + "as each one finishes."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright build fixtures/library",
            "  cardwright build models --replace-edited",
            "",
            "Device files: docs/device-files.md. Builds and ledgers: docs/library.md."})
final class BuildCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "ROOT", description = "The library folder.")
    Path root;

    @Option(names = "--replace-edited", description = "Overwrite cards that were changed by hand since they were built.")
    boolean replaceEdited;

    @Option(names = "--allow-outside-root",
            description = "Let device files name data files, card folders and template folders outside the library root "
                    + "(after symbolic links are resolved). Without it such paths are refused; see docs/security.md.")
    boolean allowOutsideRoot;

    @Option(names = "--notes", description = "Also print what each fit set aside or changed in the data.")
    boolean notes;

    @Option(names = "--jobs", paramLabel = "N",
            description = "Parts fitted at once (default: one per processor). The cards and lines are the same for any N.")
    Integer jobs;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        PartProgress progress = new PartProgress("build", out, err, PartProgress.onTerminal());
        List<PartOutcome> parts;
        try {
            parts = new LibraryBuilder(replaceEdited, allowOutsideRoot).build(root, progress::result, PartProgress.jobs(jobs),
                    (done, total, o) -> progress.finished(done, total, o.device(), status(o)));
        } finally {
            progress.close();
        }
        for (PartOutcome p : parts) {
            p.warnings().forEach(w -> out.println("warning: " + p.device() + ": " + w));
        }
        if (notes) {
            for (PartOutcome p : parts) {
                p.notes().forEach(n -> err.println(Terminal.NOTE + p.device() + ": " + n));
            }
        }
        long built = parts.stream().filter(p -> p.status() == PartOutcome.Status.BUILT).count();
        long current = parts.stream().filter(p -> p.status() == PartOutcome.Status.UP_TO_DATE).count();
        long bad = parts.size() - built - current;
        out.println(parts.size() + " parts: " + built + " built, " + current + " up to date, " + bad + " not built");
        out.flush();
        if (parts.isEmpty()) {
            err.println("cardwright: no device files (*.device.yaml) under " + root);
            err.flush();
            return ExitCodes.BAD_INPUT;
        }
        int code = ExitCodes.OK;
        for (PartOutcome p : parts) {
            int c = switch (p.status()) {
                case UP_TO_DATE, BUILT -> ExitCodes.OK;
                case BAD_INPUT -> ExitCodes.BAD_INPUT;
                case FIT_FAILED -> ExitCodes.FIT_FAILED;
                case REFUSED_EDITED, WRITE_FAILED -> ExitCodes.OUTPUT_REFUSED;
            };
            if (code == ExitCodes.OK) {
                code = c;
            }
        }
        if (code != ExitCodes.OK) {
            err.println("cardwright: " + bad + " of " + parts.size() + " parts not built; see the lines above");
            err.flush();
        }
        return code;
    }

    private static String status(PartOutcome o) {
        return o.status().name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ');
    }
}
