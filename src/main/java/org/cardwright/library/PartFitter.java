package org.cardwright.library;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.cardwright.card.CardWriter;
import org.cardwright.card.Dialect;
import org.cardwright.card.ModelCard;
import org.cardwright.data.DataFileException;
import org.cardwright.data.DataKind;
import org.cardwright.data.MeasurementFile;
import org.cardwright.fit.FitInputException;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.ParameterRule;
import org.cardwright.fit.SweepResiduals;
import org.cardwright.model.Param;
import org.cardwright.workflow.FitOutcome;
import org.cardwright.workflow.FitRequest;
import org.cardwright.workflow.FitWorkflow;
import org.cardwright.workflow.OutputException;
import org.cardwright.workflow.ToolVersion;

/**
 * Fits one part through the fit job ({@link FitWorkflow}) and renders its cards with library provenance: names
 * relative to the device file, the recipe hash, residuals per temperature. The fit job writes its own cards to a
 * private folder, which is deleted; the library's cards are written by the caller, only where they changed.
 */
final class PartFitter {

    /**
     * One rendered card.
     *
     * @param dialect  its dialect
     * @param file     where it belongs
     * @param text     its text
     * @param fit      the fit whose parameters it carries (the refit when the dialect left terms out)
     * @param leftOut  fitted parameters the dialect cannot carry
     */
    record Card(Dialect dialect, Path file, String text, FitResult fit, List<Param> leftOut) {
    }

    /**
     * The fitted part.
     *
     * @param cards one per dialect, in the device file's order
     * @param full  the full fit
     * @param notes what the fit set aside or changed, names relative to the library root
     */
    record Fitted(List<Card> cards, FitResult full, List<String> notes) {
    }

    /** Fits {@code part} with extra rules (appended after the device file's, so they win). */
    Fitted fit(DeviceFile part, Path root, Recipe recipe, List<ParameterRule> extraRules)
            throws DeviceFileException, LibraryInputException, FitInputException, OutputException, IOException {
        List<ParameterRule> rules = new ArrayList<>(part.rules());
        rules.addAll(extraRules);
        Path scratch = Files.createTempDirectory("cardwright-fit-");
        try (StagedInputs inputs = StagedInputs.of(part, root)) {
            if (inputs.paths().isEmpty()) {
                throw new DeviceFileException(part.path(), part.data().get(0).line(),
                        "no data file of a kind this version fits (forward, reverse, cv)");
            }
            FitRequest request = new FitRequest(inputs.paths(), part.model(), part.dialects(), scratch, Optional.empty(),
                    inputs.temperature(), part.kind(), rules, part.digits(), true, templates(part));
            FitOutcome outcome;
            try {
                outcome = new FitWorkflow().run(request, o -> "");
            } catch (DataFileException e) {
                throw new LibraryInputException(inputs.displayName(e.getMessage()), e);
            } catch (FitInputException e) {
                throw new FitInputException(inputs.displayName(e.getMessage()));
            }
            checkKinds(part, outcome);
            CardWriter writer = new CardWriter(templates(part));
            List<Card> cards = new ArrayList<>();
            for (FitOutcome.WrittenCard w : outcome.cards()) {
                FitResult forCard = w.refit().orElse(outcome.fit());
                ModelCard card = new ModelCard(part.model(), forCard.parameters(),
                        provenance(part, recipe, extraRules, outcome.fit(), forCard, w));
                String text = writer.render(card, w.dialect(), part.digits()).text();
                cards.add(new Card(w.dialect(), part.cardPath(w.dialect()), text, forCard, w.leftOut()));
            }
            List<String> notes = outcome.inputs().notes().stream().map(inputs::displayName).toList();
            return new Fitted(List.copyOf(cards), outcome.fit(), notes);
        } finally {
            deleteTree(scratch);
        }
    }

    private static Optional<Path> templates(DeviceFile part) {
        return part.templates().map(t -> part.folder().resolve(t));
    }

    /** The device file says what each file holds; the reader tells I-V from C-V by its columns: they must agree. */
    private static void checkKinds(DeviceFile part, FitOutcome outcome) throws DeviceFileException {
        List<DataSource> readable = part.data().stream().filter(s -> s.kind().readable()).toList();
        List<MeasurementFile> files = outcome.inputs().files();
        for (int i = 0; i < readable.size() && i < files.size(); i++) {
            DataSource s = readable.get(i);
            boolean cv = s.kind() == DataKindName.CV;
            if (cv != (files.get(i).kind() == DataKind.CV)) {
                throw new DeviceFileException(part.path(), s.line(), "'" + s.file() + "' is listed as "
                        + s.kind().spelling() + " data but holds " + (cv ? "I-V (columns V and I)" : "C-V (columns V and C)")
                        + " data");
            }
        }
    }

    private static List<String> provenance(DeviceFile part, Recipe recipe, List<ParameterRule> extraRules,
                                           FitResult full, FitResult forCard, FitOutcome.WrittenCard w) throws IOException {
        List<String> lines = new ArrayList<>();
        lines.add("model " + part.model() + ": junction diode for " + w.dialect().simulator() + ", written by cardwright "
                + ToolVersion.get() + " (library build)");
        lines.add("device file: " + part.path().getFileName());
        lines.add("device kind: " + part.kind().description());
        for (DataSource s : part.data()) {
            StringBuilder sb = new StringBuilder("data: ").append(s.file()).append(" (").append(s.kind().spelling());
            s.temperature().ifPresent(t -> sb.append(", ").append(DeviceFile.celsiusText(t)).append(" degC"));
            if (!s.kind().readable()) {
                sb.append("; not read by this version");
            }
            sb.append(") sha256 ").append(Hashes.sha256(s.resolve(part.folder())));
            lines.add(sb.toString());
        }
        List<ParameterRule> all = new ArrayList<>(part.rules());
        all.addAll(extraRules);
        if (!all.isEmpty()) {
            lines.add("rules: " + all.stream().map(ParameterRule::text).collect(Collectors.joining(" ")));
        }
        lines.add(String.format(Locale.ROOT, "fit: %d forward points; worst RMS residual %s mV", full.points(),
                mv(forCard.worstRms())));
        for (SweepResiduals r : forCard.residuals()) {
            lines.add(String.format(Locale.ROOT, "residual at %s degC: RMS %s mV, max %s mV (%d points)",
                    DeviceFile.celsiusText(r.temperature()), mv(r.rms()), mv(r.max()), r.points()));
        }
        if (!w.leftOut().isEmpty()) {
            lines.add(String.format(Locale.ROOT, "%s cannot carry %s: refitted without; worst RMS residual %s mV instead of %s mV",
                    w.dialect().shortName(), w.leftOut().stream().map(Param::keyword).collect(Collectors.joining(" ")),
                    mv(forCard.worstRms()), mv(full.worstRms())));
        }
        lines.add("recipe sha256 " + recipe.sha256());
        lines.add("check: cardwright check <library root>");
        return lines;
    }

    static String mv(double volts) {
        return String.format(Locale.ROOT, "%.3f", volts * 1e3);
    }

    private static void deleteTree(Path dir) {
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        } catch (IOException e) {
            // a leftover temporary folder is harmless
        }
    }
}
