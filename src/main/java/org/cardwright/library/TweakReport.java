package org.cardwright.library;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.workflow.OutputException;
import org.cardwright.workflow.OutputFiles;

/**
 * What a tweak costs, card by card and temperature by temperature: RMS and largest residual before and after.
 *
 * @param model       model name
 * @param tweak       the tweak, as text
 * @param parameter   the parameter's keyword
 * @param fitted      its fitted value, as the card writes it
 * @param value       its value after the tweak, as the card writes it
 * @param cards       per card, the residuals before and after
 * @param notes       cards the tweak could not change, and why
 * @param written     cards written, if any
 */
public record TweakReport(String model, String tweak, String parameter, String fitted, String value, List<CardCost> cards,
                          List<String> notes, List<Path> written) {

    /**
     * @param dialect the card's dialect
     * @param rows    one per temperature (forward I-V)
     * @param kinds   one per data kind of the part (forward, breakdown, C-V, recovery, leakage), at its worst temperature
     */
    public record CardCost(String dialect, List<Row> rows, List<KindCost> kinds) {
        /** A cost without the data kinds. */
        public CardCost(String dialect, List<Row> rows) {
            this(dialect, rows, List.of());
        }
    }

    /**
     * What the tweak costs one data kind of one card: the worst temperature's RMS residual and the verdict (the rule
     * check uses), before and after.
     *
     * @param kind       "forward", "breakdown", "C-V", "recovery" or "leakage"
     * @param unit       the residuals' unit: mV, %, ns or dec
     * @param rmsBefore  worst RMS residual without the tweak, in {@code unit}
     * @param rmsAfter   with it
     * @param passBefore verdict without the tweak
     * @param passAfter  with it
     */
    public record KindCost(String kind, String unit, double rmsBefore, double rmsAfter, boolean passBefore,
                           boolean passAfter) {
    }

    /**
     * @param temperature device temperature [K]
     * @param points      number of points
     * @param rmsBefore   RMS residual without the tweak [V]
     * @param rmsAfter    with it [V]
     * @param maxBefore   largest residual without the tweak [V]
     * @param maxAfter    with it [V]
     */
    public record Row(double temperature, int points, double rmsBefore, double rmsAfter, double maxBefore, double maxAfter) {
    }

    /**
     * Applies {@code tweak} to the part in {@code deviceFile} and, when {@code out} is given, writes the tweaked cards
     * there (never into the library's own card folder: the library's cards are made by build).
     */
    public static TweakReport run(Path deviceFile, Tweak tweak, Optional<Path> out, boolean force) throws Exception {
        return run(deviceFile, tweak, out, force, Optional.empty(), false);
    }

    /**
     * As {@link #run(Path, Tweak, Optional, boolean)}, with the paths of the device file confined to {@code root}
     * (default: the device file's folder; {@code libraryRootOption}) unless {@code allowOutsideRoot}. The tweaked cards are checked, after
     * symbolic links are resolved, against every file the tweak reads and against the library's own cards and
     * build record, which no {@code --out} folder and no {@code --force} may replace.
     */
    public static TweakReport run(Path deviceFile, Tweak tweak, Optional<Path> out, boolean force, Optional<Path> libraryRootOption,
                                  boolean allowOutsideRoot) throws Exception {
        Path libraryRoot = libraryRootOption.orElseGet(() -> {
            Path parent = deviceFile.toAbsolutePath().normalize().getParent();
            return parent == null ? Path.of("/") : parent;
        });
        DeviceFile asBuilt = new DeviceFileReader(libraryRoot, allowOutsideRoot).read(deviceFile);
        // a tweak of a term the built card leaves off is refused before any fit (the fit would leave it off again)
        java.util.Optional<org.cardwright.failure.UsageException> refused = Tweaker.refusedUpFront(asBuilt, tweak);
        if (refused.isPresent()) {
            throw refused.get();
        }
        DeviceFile part = asBuilt.withTweak(Optional.of(tweak));
        Path root = part.folder();
        if (out.isPresent() && org.cardwright.workflow.OutputPlan.located(out.get())
                .equals(org.cardwright.workflow.OutputPlan.located(part.cardFolder()))) {
            throw new OutputException(out.get() + " is the library's card folder, whose cards build makes; to keep the tweak, "
                    + "add it to " + deviceFile.getFileName() + " (tweak: set: " + tweak.text().replaceAll(" \\(.*", "")
                    + ") and run cardwright build, or choose another --out folder");
        }
        if (out.isPresent()) {
            org.cardwright.workflow.OutputPlan plan = new org.cardwright.workflow.OutputPlan().input("the device file", deviceFile);
            part.data().forEach(s -> plan.input("data file", s.resolve(part.folder())));
            LibraryInventory.templates(part).forEach(t -> plan.input("template", t));
            LibraryInventory.outputs(part).forEach(p -> plan.protect("the library's own " + p.getFileName(), p));
            for (org.cardwright.card.Dialect d : part.dialects()) {
                plan.output("the tweaked " + d.shortName() + " card", out.get().resolve(part.cardPath(d).getFileName()));
            }
            plan.check();
        }
        Tweaker.Result r = new Tweaker().apply(part, root, Recipe.of(part), tweak);
        List<CardCost> costs = new ArrayList<>();
        for (int i = 0; i < r.base().cards().size(); i++) {
            PartFitter.Card before = r.base().cards().get(i);
            PartFitter.Card after = r.tweaked().cards().get(i);
            List<Row> rows = new ArrayList<>();
            for (PartFitter.Residual b : before.residuals()) {
                PartFitter.Residual a = after.residuals().stream().filter(x -> x.temperature() == b.temperature()).findFirst()
                        .orElseThrow(() -> new IllegalStateException("temperature lost in the tweak"));
                rows.add(new Row(b.temperature(), b.points(), b.rms(), a.rms(), b.max(), a.max()));
            }
            List<KindCost> kinds = new ArrayList<>();
            if (before.checked().isPresent() && after.checked().isPresent()) {
                List<KindVerdicts.Kind> b = KindVerdicts.of(before.checked().get());
                List<KindVerdicts.Kind> a = KindVerdicts.of(after.checked().get());
                for (KindVerdicts.Kind k : b) {
                    a.stream().filter(x -> x.kind().equals(k.kind())).findFirst().ifPresent(x ->
                            kinds.add(new KindCost(k.kind(), k.unit(), k.rms(), x.rms(), k.pass(), x.pass())));
                }
            }
            costs.add(new CardCost(before.dialect().shortName(), rows, kinds));
        }
        List<Path> written = new ArrayList<>();
        if (out.isPresent()) {
            List<Path> targets = new ArrayList<>();
            for (PartFitter.Card c : r.tweaked().cards()) {
                targets.add(out.get().resolve(c.file().getFileName()));
            }
            OutputFiles.checkWritable(targets, force);
            for (int i = 0; i < targets.size(); i++) {
                OutputFiles.writeAtomically(targets.get(i), r.tweaked().cards().get(i).text());
                written.add(targets.get(i));
            }
        }
        return new TweakReport(part.model(), tweak.text(), tweak.param().keyword(),
                SpiceNumbers.cardValue(tweak.param(), tweak.param().toCardValue(r.fittedValue()), 7),
                SpiceNumbers.cardValue(tweak.param(), tweak.param().toCardValue(r.newValue()), 7), costs, r.notes(), written);
    }

    /** The report as terminal text. */
    public String text() {
        StringBuilder sb = new StringBuilder();
        sb.append("Tweak of ").append(model).append(": ").append(tweak).append('\n');
        sb.append(parameter).append(": fitted ").append(fitted).append(", now ").append(value).append('\n');
        for (CardCost c : cards) {
            sb.append('\n').append(c.dialect()).append(" card: residuals, model minus measured terminal voltage\n");
            sb.append(String.format(Locale.ROOT, "  %8s %6s %10s %10s %10s %10s %10s%n", "T [degC]", "points",
                    "RMS before", "RMS after", "max before", "max after", "RMS cost"));
            for (Row r : c.rows()) {
                sb.append(String.format(Locale.ROOT, "  %8s %6d %10s %10s %10s %10s %+10.3f%n",
                        DeviceFile.celsiusText(r.temperature()), r.points(), PartFitter.mv(r.rmsBefore()),
                        PartFitter.mv(r.rmsAfter()), PartFitter.mv(r.maxBefore()), PartFitter.mv(r.maxAfter()),
                        (r.rmsAfter() - r.rmsBefore()) * 1e3));
            }
            sb.append("  (all in mV)\n");
            if (!c.kinds().isEmpty()) {
                sb.append("  every data kind, worst temperature (verdict by the rule of cardwright check):\n");
                sb.append(String.format(Locale.ROOT, "  %-9s %10s %10s %-4s  %s%n", "kind", "RMS before", "RMS after", "unit",
                        "verdict before -> after"));
                for (KindCost k : c.kinds()) {
                    sb.append(String.format(Locale.ROOT, "  %-9s %10s %10s %-4s  %s -> %s%n", k.kind(),
                            KindVerdicts.number(k.rmsBefore()), KindVerdicts.number(k.rmsAfter()), k.unit(),
                            k.passBefore() ? "pass" : "FAIL", k.passAfter() ? "pass" : "FAIL"));
                }
            }
        }
        notes.forEach(n -> sb.append("note: ").append(n).append('\n'));
        written.forEach(w -> sb.append("wrote ").append(w.toString().replace('\\', '/')).append('\n'));
        return sb.toString();
    }
}
