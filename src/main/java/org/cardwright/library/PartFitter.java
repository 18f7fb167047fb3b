package org.cardwright.library;

import org.cardwright.data.Sha256;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;
import org.cardwright.card.ShuntedCard;
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
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.workflow.FitOutcome;
import org.cardwright.workflow.FitRequest;
import org.cardwright.workflow.FitWorkflow;
import org.cardwright.workflow.Inputs;
import org.cardwright.workflow.OutputException;
import org.cardwright.workflow.ToolVersion;

/**
 * Fits one part through the fit job ({@link FitWorkflow}) and renders its cards with library provenance: names
 * relative to the device file, the recipe hash, residuals per temperature. The fit job writes its own cards to a
 * private folder, which is deleted; the library's cards are written by the caller, only where they changed.
 */
final class PartFitter {

    /**
     * Residuals of a card at one temperature.
     *
     * @param temperature device temperature [K]
     * @param points      number of points
     * @param rms         RMS residual [V]
     * @param max         largest residual magnitude [V]
     */
    record Residual(double temperature, int points, double rms, double max) {
        static List<Residual> of(FitResult fit) {
            List<Residual> out = new ArrayList<>();
            for (SweepResiduals s : fit.residuals()) {
                out.add(new Residual(s.temperature(), s.points(), s.rms(), s.max()));
            }
            return out;
        }

        static double worstRms(List<Residual> rs) {
            return rs.stream().mapToDouble(Residual::rms).max().orElse(Double.NaN);
        }
    }

    /**
     * One rendered card.
     *
     * @param dialect    its dialect
     * @param file       where it belongs
     * @param text       its text
     * @param parameters the parameters it carries [SI]
     * @param residuals  its residuals per temperature
     * @param leftOut    fitted parameters the dialect cannot carry
     * @param leftOutCost what leaving them out costs, kind by kind ({@link FitResult#costAgainst}); "" when none
     * @param checked    the card re-simulated at every point of every data kind (built-in engine, the verdict rule of
     *                   check), when it was
     */
    record Card(Dialect dialect, Path file, String text, DiodeParameters parameters, List<Residual> residuals,
                List<Param> leftOut, String leftOutCost, Optional<org.cardwright.verify.JunctionVerification> checked) {
    }

    /**
     * The fitted part.
     *
     * @param cards  one per dialect, in the device file's order
     * @param full   the full fit
     * @param points points fitted, every data kind
     * @param notes  what the fit set aside or changed, names relative to the library root
     * @param warnings the fit's warnings (non-identifiable parameters, correlations, no breakdown reached, ...)
     */
    record Fitted(List<Card> cards, FitResult full, int points, List<String> notes, List<String> warnings) {
        Fitted(List<Card> cards, FitResult full, int points, List<String> notes) {
            this(cards, full, points, notes, full.warnings());
        }
    }

    /**
     * What a part's fit read, kept so that each card's check reads nothing again.
     *
     * @param staged its readable files and the conditions the device file gives them
     * @param inputs those files read as the fit and verify jobs read them (every data kind)
     * @param data   {@code inputs} as the fit and verify jobs judge them ({@link FitWorkflow#extractionData}), made
     *               once for every card of the part
     */
    record Read(StagedInputs staged, Inputs inputs, org.cardwright.fit.ExtractionData data) {
        Read(StagedInputs staged, Inputs inputs) {
            this(staged, inputs, FitWorkflow.extractionData(inputs));
        }

        /** Reads the data of {@code part} as verify reads them (the default reading conditions, the device file's). */
        static Read of(DeviceFile part, Path root) throws DeviceFileException, LibraryInputException, IOException {
            StagedInputs staged = StagedInputs.of(part, root);
            try {
                return new Read(staged, Inputs.read(staged.paths(), FitRequest.BenchOptions.DEFAULT.readOptions(staged.temperature()),
                        p -> staged.conditions().getOrDefault(p, org.cardwright.data.GivenConditions.NONE)
                                .orElse(Inputs.commandLine(org.cardwright.fit.CapacitanceOptions.DEFAULT))));
            } catch (DataFileException e) {
                throw new LibraryInputException(staged.displayName(e.getMessage()), e);
            }
        }
    }

    /** Fits {@code part} with extra rules (after the device file's, so they win); {@code extraLines} go on the cards. */
    Fitted fit(DeviceFile part, Path root, Recipe recipe, List<ParameterRule> extraRules, List<String> extraLines)
            throws DeviceFileException, LibraryInputException, FitInputException, OutputException, IOException {
        List<ParameterRule> rules = new ArrayList<>(part.rules());
        rules.addAll(extraRules);
        Path scratch = scratchFolder();
        StagedInputs inputs = StagedInputs.of(part, root);
        if (inputs.paths().isEmpty()) {
            throw new DeviceFileException(part.path(), part.data().get(0).line(),
                    "no data file of a kind this version fits (forward, reverse, cv, recovery, bench-log)");
        }
        FitRequest request = new FitRequest(inputs.paths(), part.model(), part.dialects(), scratch, Optional.empty(),
                inputs.temperature(), part.kind(), rules, part.digits(), true, templates(part))
                .withConditions(inputs.conditions());
        FitOutcome outcome;
        try {
            // the fit job's own cards are not written: the library's are rendered below
            outcome = new FitWorkflow().prepare(request);
        } catch (DataFileException e) {
            throw new LibraryInputException(inputs.displayName(e.getMessage()), e);
        } catch (FitInputException e) {
            throw new FitInputException(inputs.displayName(e.getMessage()));
        }
        checkKinds(part, outcome);
        // the fit read every kind with the conditions a verify of the part reads them with: each card is checked
        // against the same inputs, not read again
        Read read = new Read(inputs, outcome.inputs());
        List<Card> cards = new ArrayList<>();
        for (FitOutcome.WrittenCard w : outcome.cards()) {
            FitResult forCard = w.refit().orElse(outcome.fit());
            List<String> lines = new ArrayList<>(extraLines);
            lines.addAll(FitWorkflow.introducedTerms(outcome.fit(), forCard, w.dialect()));
            if (w.shunted().isPresent()) {
                // the plain card is the junction alone; its header says so and what that costs, as fit's does
                w.text().lines().filter(l -> l.startsWith("* junction alone: ")).map(l -> l.substring(2)).forEach(lines::add);
            }
            Card plain = checkedRender(part, read, recipe, part.rules(), w.dialect(), forCard.parameters(),
                    outcome.fit().points(), Residual.of(forCard), w.leftOut(),
                    w.leftOut().isEmpty() ? "" : forCard.costAgainst(outcome.fit()), lines);
            cards.add(plain);
            if (w.shunted().isPresent() && forCard.shunt().isPresent()) {
                cards.add(shunted(part, plain, forCard.shunt().get()));
            }
        }
        List<String> notes = outcome.inputs().notes().stream().map(inputs::displayName).toList();
        List<String> warnings = outcome.fit().warnings().stream().map(inputs::displayName).toList();
        return new Fitted(List.copyOf(cards), outcome.fit(), outcome.fit().points(), notes, warnings);
    }

    private static Path scratch;

    /**
     * The folder the fit job's request names as its output folder: the job writes nothing there (the library renders
     * and writes its own cards), the folder only gives the request a place, so one empty owner-only folder serves
     * every part of a run (made once, removed when the JVM exits) instead of one made, walked and removed per part.
     */
    private static synchronized Path scratchFolder() throws IOException {
        if (scratch == null || !Files.isDirectory(scratch)) {
            scratch = Files.createTempDirectory("cardwright-fit-");
            scratch.toFile().deleteOnExit();
        }
        return scratch;
    }

    /** Renders one card of {@code part} with its provenance (no check of every data kind in its header). */
    static Card render(DeviceFile part, Recipe recipe, List<ParameterRule> rules, Dialect dialect, DiodeParameters parameters,
                       int points, List<Residual> residuals, List<Param> leftOut, String leftOutCost, List<String> extraLines)
            throws IOException {
        return render(part, recipe, rules, dialect, parameters, points, residuals, leftOut, leftOutCost, extraLines,
                Optional.empty());
    }

    private static Card render(DeviceFile part, Recipe recipe, List<ParameterRule> rules, Dialect dialect,
                               DiodeParameters parameters, int points, List<Residual> residuals, List<Param> leftOut,
                               String leftOutCost, List<String> extraLines,
                               Optional<org.cardwright.verify.JunctionVerification> checked) throws IOException {
        List<String> lines = new ArrayList<>(extraLines);
        checked.ifPresent(v -> KindVerdicts.of(v).forEach(k -> lines.add("verdict: " + k.text())));
        ModelCard card = new ModelCard(part.model(), parameters,
                provenance(part, recipe, rules, dialect, points, residuals, leftOut, leftOutCost, lines));
        String text = new CardWriter(templates(part)).render(card, dialect, part.digits()).text();
        return new Card(dialect, part.cardPath(dialect), text, parameters, List.copyOf(residuals), List.copyOf(leftOut),
                leftOutCost, checked);
    }

    /**
     * Renders one card of {@code part}, re-simulates it at every point of every data kind of the part (the built-in
     * engine in the card's own equations, judged by the rule check uses: {@link LibraryCheck#basis}), and renders it
     * again with one header line per kind, so that the card states what it reproduces and what not.
     */
    static Card checkedRender(DeviceFile part, Path root, Recipe recipe, List<ParameterRule> rules, Dialect dialect,
                              DiodeParameters parameters, int points, List<Residual> residuals, List<Param> leftOut,
                              String leftOutCost, List<String> extraLines)
            throws DeviceFileException, LibraryInputException, IOException {
        return checkedRender(part, Read.of(part, root), recipe, rules, dialect, parameters, points, residuals, leftOut,
                leftOutCost, extraLines);
    }

    /** {@link #checkedRender(DeviceFile, Path, Recipe, List, Dialect, DiodeParameters, int, List, List, String, List)} with the part's data already read. */
    static Card checkedRender(DeviceFile part, Read read, Recipe recipe, List<ParameterRule> rules, Dialect dialect,
                              DiodeParameters parameters, int points, List<Residual> residuals, List<Param> leftOut,
                              String leftOutCost, List<String> extraLines)
            throws LibraryInputException, IOException {
        Card first = render(part, recipe, rules, dialect, parameters, points, residuals, leftOut, leftOutCost, extraLines);
        org.cardwright.verify.JunctionVerification v = check(part, read, dialect, first.text());
        return render(part, recipe, rules, dialect, parameters, points, residuals, leftOut, leftOutCost, extraLines,
                Optional.of(v));
    }

    /**
     * {@code text}, a card of {@code part} in {@code dialect}, re-simulated by the built-in engine at every data kind of
     * {@code read}: the card is parsed from the text as a file of it would be read, and the data are those already read.
     */
    static org.cardwright.verify.JunctionVerification check(DeviceFile part, Read read, Dialect dialect, String text)
            throws LibraryInputException, IOException {
        StagedInputs inputs = read.staged();
        org.cardwright.workflow.VerifyRequest request = new org.cardwright.workflow.VerifyRequest(part.cardPath(dialect),
                inputs.paths(), "builtin", Optional.of(part.model()), dialect, inputs.temperature(), part.tolerances().forward(),
                Optional.empty(), false, org.cardwright.fit.CapacitanceOptions.DEFAULT, FitRequest.BenchOptions.DEFAULT,
                LibraryCheck.basis(part, Optional.empty())).withConditions(inputs.conditions());
        try {
            return new org.cardwright.workflow.VerifyWorkflow().runAll(request, text, read.inputs(), read.data());
        } catch (DataFileException e) {
            throw new LibraryInputException(inputs.displayName(e.getMessage()), e);
        } catch (org.cardwright.sim.process.SimulationException | OutputException e) {
            // the built-in engine runs no process and the request writes no file
            throw new IllegalStateException("the check of the card just written failed: " + e.getMessage(), e);
        }
    }

    /**
     * The subcircuit file beside {@code plain} (card/ShuntedCard): the diode with the plain card's {@code .model}
     * and the resistor between the terminals, under the plain card's provenance.
     */
    private static Card shunted(DeviceFile part, Card plain, org.cardwright.fit.ShuntResistance resistor) {
        List<String> header = new ArrayList<>();
        String sub = ShuntedCard.subcircuitName(part.model());
        header.add("model " + part.model() + " with a resistor between its terminals: subcircuit " + sub + " for "
                + plain.dialect().simulator() + ", written by cardwright " + ToolVersion.get() + " (library build)");
        header.add("ports: " + ShuntedCard.ANODE + " anode, " + ShuntedCard.CATHODE + " cathode; use it as X1 anode cathode " + sub);
        header.add("resistor: " + org.cardwright.card.SpiceNumbers.format(resistor.resistance(), 6) + " ohm, fitted together with the junction");
        List<String> comments = plain.text().lines().takeWhile(l -> l.startsWith("*")).toList();
        for (String c : comments.subList(Math.min(1, comments.size()), comments.size())) {
            String line = c.length() > 1 ? c.substring(c.startsWith("* ") ? 2 : 1) : "";
            if (!line.startsWith("junction alone: ")) {
                header.add(line);
            }
        }
        String text = ShuntedCard.render(part.model(), plain.text(), resistor.resistance(), header, part.digits());
        return new Card(plain.dialect(), part.cardFolder().resolve(ShuntedCard.fileName(part.model(), plain.dialect())),
                text, plain.parameters(), plain.residuals(), plain.leftOut(), plain.leftOutCost(), Optional.empty());
    }

    private static Optional<Path> templates(DeviceFile part) {
        return part.templates().map(t -> part.folder().resolve(t));
    }

    /** The device file says what each file holds; the reader tells I-V from C-V by its columns: they must agree. */
    private static void checkKinds(DeviceFile part, FitOutcome outcome) throws DeviceFileException {
        // recovery records are read apart from the I-V and C-V files, so they have no place in this pairing
        List<DataSource> readable = part.data().stream()
                .filter(s -> s.kind().readable() && s.kind() != DataKindName.RECOVERY).toList();
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

    private static List<String> provenance(DeviceFile part, Recipe recipe, List<ParameterRule> rules, Dialect dialect,
                                           int points, List<Residual> residuals, List<Param> leftOut, String leftOutCost,
                                           List<String> extraLines) throws IOException {
        List<String> lines = new ArrayList<>();
        lines.add("model " + part.model() + ": junction diode for " + dialect.simulator() + ", written by cardwright "
                + ToolVersion.get() + " (library build)");
        lines.add("device file: " + part.path().getFileName());
        lines.add("device kind: " + part.kind().description());
        for (DataSource s : part.data()) {
            StringBuilder sb = new StringBuilder("data: ").append(s.file()).append(" (").append(s.kind().spelling());
            s.temperature().ifPresent(t -> sb.append(", ").append(DeviceFile.celsiusText(t)).append(" degC"));
            s.options().forEach((k, v) -> sb.append(", ").append(k).append(' ').append(v));
            if (!s.kind().readable()) {
                sb.append("; not read by this version");
            }
            String hash = recipe.dataSha256().get(s.file());
            sb.append(") sha256 ").append(hash != null ? hash : Sha256.hex(s.resolve(part.folder())));
            lines.add(sb.toString());
        }
        if (!rules.isEmpty()) {
            lines.add("rules: " + rules.stream().map(ParameterRule::text).collect(Collectors.joining(" ")));
        }
        lines.addAll(extraLines);
        lines.add(String.format(Locale.ROOT, "fit: %d points; forward worst RMS residual %s mV", points,
                mv(Residual.worstRms(residuals))));
        for (Residual r : residuals) {
            lines.add(String.format(Locale.ROOT, "residual at %s degC: RMS %s mV, max %s mV (%d points)",
                    DeviceFile.celsiusText(r.temperature()), mv(r.rms()), mv(r.max()), r.points()));
        }
        if (!leftOut.isEmpty()) {
            lines.add(String.format(Locale.ROOT, "%s cannot carry %s: refitted without; worst RMS residual %s",
                    dialect.shortName(), leftOut.stream().map(Param::keyword).collect(Collectors.joining(" ")),
                    leftOutCost));
        }
        lines.add("inputs sha256 " + recipe.sha256());
        lines.add("check, from the library root: cardwright check .");
        return lines;
    }

    static String mv(double volts) {
        return String.format(Locale.ROOT, "%.3f", volts * 1e3);
    }
}
