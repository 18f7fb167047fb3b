package org.cardwright.cli;

import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.cardwright.library.Tweak;
import org.cardwright.library.TweakReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code cardwright tweak}: pin or nudge one parameter of a part and see what it costs. */
@Command(name = "tweak", mixinStandardHelpOptions = true, sortOptions = false,
        header = "Sets one parameter of a library part and shows what it costs.",
        description = {
            "Fits the part of a device file, sets one parameter (pinned, or nudged from its fitted value), then "
                    + "refits the others around it (default) or only renders the card again, and prints what that "
                    + "costs in residuals, per card and temperature. Writes the tweaked cards only with --out; to "
                    + "keep a tweak in the library, add it to the device file (tweak: set: ...) and run build."},
        footerHeading = "%nExamples%n",
        footer = {
            "  cardwright tweak fixtures/library/switching/SW1.device.yaml --set RS=+10%%",
            "  cardwright tweak rectifiers/RB4.device.yaml --set N=1.9 --render-only --out try",
            "",
            "Forms: RS=0.6 pins RS at 0.6; RS=+10%% or RS=-5%% nudges the fitted value by a percentage; "
                    + "RS+=50m or RS-=0.05 nudges it by an amount. Values take SPICE suffixes."})
final class TweakCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "DEVICE_FILE", description = "The part's device file.")
    Path device;

    @Option(names = "--set", required = true, paramLabel = "TWEAK", description = "The tweak, e.g. RS=0.6, RS=+10%%, RS+=50m.")
    String tweak;

    @Option(names = "--render-only", description = "Do not refit the other parameters; only change this one.")
    boolean renderOnly;

    @Option(names = "--out", paramLabel = "DIR", description = "Write the tweaked cards to this folder.")
    Path out;

    @Option(names = "--root", paramLabel = "DIR",
            description = "The library root the device file's paths must stay inside (default: the device file's folder).")
    Path root;

    @Option(names = "--allow-outside-root",
            description = "Let device files name data files, card folders and template folders outside the library root "
                    + "(after symbolic links are resolved). Without it such paths are refused; see docs/security.md.")
    boolean allowOutsideRoot;

    @Option(names = "--force", description = "Replace existing cards in the --out folder.")
    boolean force;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        TweakReport r = TweakReport.run(device, Main.option(() -> Tweak.parse(tweak, !renderOnly)), Optional.ofNullable(out), force,
                Optional.ofNullable(root), allowOutsideRoot);
        Terminal.print(spec, r.text());
        return ExitCodes.OK;
    }
}
