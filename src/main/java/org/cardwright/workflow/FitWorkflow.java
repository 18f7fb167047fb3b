package org.cardwright.workflow;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;
import org.cardwright.card.CardWriter;
import org.cardwright.card.Dialect;
import org.cardwright.card.ModelCard;
import org.cardwright.data.DataFileException;
import org.cardwright.data.IvPoint;
import org.cardwright.data.MeasurementFile;
import org.cardwright.data.ReadOptions;
import org.cardwright.data.RecoveryReader;
import org.cardwright.data.RecoveryRecord;
import org.cardwright.fit.FitInputException;
import org.cardwright.fit.CapacitancePoint;
import org.cardwright.fit.ExtractionData;
import org.cardwright.fit.FitPoint;
import org.cardwright.fit.JunctionExtraction;
import org.cardwright.fit.RecoveryPoint;
import org.cardwright.fit.ReversePoint;
import org.cardwright.fit.RobustExtraction;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.FitSettings;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * The fit job: read the data, fit, write one card per dialect (refitting without the terms a dialect cannot
 * carry, and saying what that costs), and the JSON result. Nothing is written unless everything succeeded.
 */
public final class FitWorkflow {
    /**
     * Voltage uncertainty assumed for points without a stated one [V]: one millivolt, a typical 4.5-digit meter
     * on its 2 V range (common practice, no source). Uniform weights make the fitted values independent of it;
     * the standard errors are scaled by the reduced chi-square.
     */
    public static final double DEFAULT_VOLTAGE_SIGMA = 1e-3;

    /** Runs the job; see the class comment. */
    public FitOutcome run(FitRequest request, java.util.function.Function<FitOutcome, String> jsonRenderer)
            throws DataFileException, FitInputException, OutputException {
        FitOutcome outcome = prepare(request);
        java.util.Map<Path, String> files = new java.util.LinkedHashMap<>();
        for (FitOutcome.WrittenCard c : outcome.cards()) {
            files.put(c.file(), c.text());
            c.shunted().ifPresent(f -> files.put(f.file(), f.text()));
        }
        request.json().ifPresent(j -> files.put(j, jsonRenderer.apply(outcome)));
        OutputFiles.writeAllAtomically(files);
        return outcome;
    }

    /**
     * Everything {@link #run} does except writing: the fit and the text of each card (at the paths the
     * request names). Fails early when an output exists and the request does not allow replacing it.
     */
    public FitOutcome prepare(FitRequest request) throws DataFileException, FitInputException, OutputException {
        List<Path> targets = new ArrayList<>();
        request.dialects().forEach(d -> targets.add(request.cardPath(d)));
        request.json().ifPresent(targets::add);
        OutputPlan plan = new OutputPlan().inputs("data file", request.data());
        for (Dialect d : request.dialects()) {
            request.templates().ifPresent(t -> plan.input("template", t.resolve(d.templateFileName())));
            plan.output("the " + d.shortName() + " card", request.cardPath(d));
        }
        request.json().ifPresent(j -> plan.output("--json", j));
        plan.check();
        OutputFiles.checkWritable(targets, request.force());

        ReadOptions options = request.readOptions();
        Inputs inputs = Inputs.read(request.data(), options, request::givenFor).withSweepNote(request.sweepGap());
        // the C-V conditions the files state (or are given) decide the stray capacitance and test frequency
        org.cardwright.fit.CapacitanceOptions capacitance = inputs.capacitanceOptions(request.capacitance());
        ExtractionData data = extractionData(inputs);
        org.cardwright.fit.ForwardReduction.Reduced forward = org.cardwright.fit.ForwardReduction.reduce(data.forward(),
                request.sweepGap());
        if (forward.reduced()) {
            // time and memory stay those of FULL_WEIGHT_LIMIT points; said in a note, as every change to the data
            data = new ExtractionData(forward.points(), data.reverse(), data.capacitance(), data.recovery());
            List<String> notes = new ArrayList<>(inputs.notes());
            notes.add("forward I-V: " + forward.description());
            inputs = new Inputs(inputs.files(), inputs.forward(), inputs.reverse(), inputs.capacitance(),
                    inputs.recovery(), notes);
        }
        if (data.isEmpty()) {
            throw new FitInputException(request.data().stream().map(Inputs::displayName).collect(Collectors.joining(", "))
                    + ": no I-V or C-V points to fit");
        }
        FitSettings settings = FitSettings.defaults().withKind(request.kind()).withRules(request.rules())
                .withSelfHeating(request.selfHeating()).withSweepGap(request.sweepGap());
        FitResult full = extract(settings, request, capacitance, data);
        if (data.forward().isEmpty() && full.fitted().stream().noneMatch(org.cardwright.fit.FittedParameter::fitted)) {
            // e.g. leakage without breakdown: a card of defaults would describe nothing the data determine
            throw new FitInputException(noForwardPoints(inputs));
        }

        // every card must evaluate across the measured temperatures and biases (VJ(T) > 0, nothing NaN or infinite)
        CardRange range = CardRange.of(data);
        range.check("the fitted card of " + request.name(), full.parameters(), settings.options(), capacitance.frequency());
        CardWriter writer = new CardWriter(request.templates());
        List<FitOutcome.WrittenCard> cards = new ArrayList<>();
        for (Dialect d : request.dialects()) {
            List<Param> leftOut = new ArrayList<>();
            for (Param p : full.parameters().givenParameters()) {
                if (!d.carries(p) && full.parameters().get(p) != defaultOf(full.parameters(), p)) {
                    leftOut.add(p);
                }
            }
            FitResult forCard = full;
            Optional<FitResult> refit = Optional.empty();
            boolean otherEquations = d.flavour() != settings.options().flavour();
            if (!leftOut.isEmpty() || otherEquations) {
                List<ParameterRule> rules = new ArrayList<>(request.rules());
                for (Param p : Param.values()) {
                    // "off": whatever the dialect cannot carry stays out of its refit, including terms the refit
                    // might otherwise reach for in place of the ones it lost (not only those the full fit used)
                    if (!d.carries(p) && p != Param.TNOM) {
                        rules.add(new ParameterRule(p, ParameterRule.Kind.OFF, Double.NaN,
                                Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
                    }
                }
                // the card is fitted with the equations of the simulator that will read it
                FitSettings target = settings.withRules(rules).withOptions(
                        new org.cardwright.model.SimulatorOptions(settings.options().gmin(), settings.options().reltol(), d.flavour()))
                        // the full fit decided the resistor between the terminals; a refit carries it or not alike
                        .withShunt(full.shunt().isPresent() ? FitSettings.ShuntChoice.ON : FitSettings.ShuntChoice.OFF);
                forCard = extract(target, request, capacitance, data);
                range.check("the " + d.shortName() + " card of " + request.name(), forCard.parameters(),
                        target.options(), capacitance.frequency());
                refit = Optional.of(forCard);
            }
            List<String> provenance = provenance(request, inputs, full, forCard, d, leftOut);
            provenance.addAll(provenance.size() - 1, introducedTerms(full, forCard, d));
            if (forCard.shunt().isPresent()) {
                // the plain card is the junction alone: say so, and what leaving the resistor out costs
                provenance.add(provenance.size() - 1, ShuntOutput.costLine(request, d, forCard, data));
            }
            ModelCard card = new ModelCard(request.name(), forCard.parameters(), provenance);
            CardWriter.Rendered rendered = writer.render(card, d, request.digits());
            Optional<FitOutcome.ShuntedFile> shunted = forCard.shunt().isEmpty() ? Optional.empty()
                    : Optional.of(new FitOutcome.ShuntedFile(ShuntOutput.path(request, d),
                            ShuntOutput.render(request, d, forCard, rendered.text(), provenance)));
            cards.add(new FitOutcome.WrittenCard(d, request.cardPath(d), rendered.text(), leftOut, refit, shunted));
        }
        List<Path> shuntedTargets = new ArrayList<>();
        cards.forEach(c -> c.shunted().ifPresent(f -> shuntedTargets.add(f.file())));
        OutputFiles.checkWritable(shuntedTargets, request.force());

        return new FitOutcome(full, cards, inputs);
    }

    /** The one-line error for data that determine no parameter: names the first I-V point's file, line and current. */
    private static String noForwardPoints(Inputs inputs) {
        for (MeasurementFile f : inputs.files()) {
            if (!f.iv().isEmpty()) {
                org.cardwright.data.IvPoint first = f.iv().get(0);
                return String.format(Locale.ROOT,
                        "%s:%d: nothing to fit: no forward I-V points (positive current), and the %d points with I <= 0 determine no parameter; the first has I = %.4g A",
                        Inputs.displayName(f.file()), first.line(), f.iv().size(), first.current());
            }
        }
        return inputs.files().stream().map(f -> Inputs.displayName(f.file())).collect(Collectors.joining(", "))
                + ":0: nothing to fit: no forward I-V points, and the other data determine no parameter";
    }

    /**
     * One extraction. Its own failures become fit failures (exit 4) that name the data files: a stage that did not
     * converge, and the model's own checks (a start value or parameter that is no longer finite, a singular
     * matrix), which the fit itself turns into {@link org.cardwright.fit.FitFailedException} where it evaluates the
     * model ({@code Optimiser.guarded}). Any other exception (an IllegalArgumentException or ArithmeticException
     * thrown anywhere else) is a programming error and passes through, to be reported as an internal error (exit 70)
     * naming its type, never as "the data cannot be fitted".
     */
    private static FitResult extract(FitSettings settings, FitRequest request,
                                     org.cardwright.fit.CapacitanceOptions capacitance, ExtractionData data)
            throws FitInputException {
        return extracting(request.data(), () -> request.robust()
                ? new RobustExtraction(settings, capacitance).fit(data)
                : new JunctionExtraction(settings, capacitance).fit(data));
    }

    /** An extraction to run: the fit's own failure types only, checked or not. */
    @FunctionalInterface
    interface Extraction {
        FitResult run() throws FitInputException;
    }

    /**
     * Runs {@code extraction}; a {@link org.cardwright.fit.FitFailedException} becomes one that names {@code files}
     * (exit 4), a {@link FitInputException} passes as it is (exit 4, it names its file), anything else passes
     * untouched (a bug: exit 70 naming its type).
     */
    static FitResult extracting(List<java.nio.file.Path> files, Extraction extraction) throws FitInputException {
        try {
            return extraction.run();
        } catch (org.cardwright.fit.FitFailedException e) {
            throw new org.cardwright.fit.FitFailedException(files.stream().map(Inputs::displayName)
                    .collect(Collectors.joining(", ")) + ": the data cannot be fitted: " + e.getMessage());
        }
    }

    /**
     * Voltage uncertainty assumed for reverse points without a stated one: 1 mV + 0.02 % of reading, a bench
     * meter on a range that holds the breakdown voltage (common practice, no source) [V].
     */
    public static double defaultReverseSigma(double volts) {
        return 1e-3 + 2e-4 * Math.abs(volts);
    }

    /**
     * Uncertainty assumed for a recovery time without a stated one: 3 % of reading + 0.2 ns, reading a
     * current trace's zero crossing and recovery point on an oscilloscope (common practice, no source) [s].
     */
    public static double defaultRecoverySigma(double seconds) {
        return 0.03 * seconds + 0.2e-9;
    }

    /**
     * The points of every kind, with their uncertainties, for the extraction.
     *
     * <p>A stated or derived uncertainty of a point becomes the uncertainty of its voltage residual at the
     * measured current, propagated in fit/ ({@link org.cardwright.fit.PointUncertainty}). Without a stated
     * voltage uncertainty the default below stands in.
     */
    public static ExtractionData extractionData(Inputs inputs) {
        List<FitPoint> forward = new ArrayList<>();
        double[] fs = slopes(inputs.forward());
        for (int i = 0; i < fs.length; i++) {
            Inputs.Located l = inputs.forward().get(i);
            forward.add(new FitPoint(l.point().current(), l.point().voltage(), l.point().temperature(),
                    residualSigma(l.point(), fs[i], DEFAULT_VOLTAGE_SIGMA), l.source(), l.point().line()));
        }
        List<ReversePoint> reverse = new ArrayList<>();
        double[] rs = slopes(inputs.reverse());
        for (int i = 0; i < rs.length; i++) {
            Inputs.Located l = inputs.reverse().get(i);
            reverse.add(new ReversePoint(l.point().voltage(), l.point().current(), l.point().temperature(),
                    residualSigma(l.point(), rs[i], defaultReverseSigma(l.point().voltage())), l.source(), l.point().line()));
        }
        List<CapacitancePoint> cv = new ArrayList<>();
        for (Inputs.LocatedCapacitance l : inputs.capacitance()) {
            cv.add(CapacitancePoint.withDefaultSigma(l.point().voltage(), l.point().capacitance(),
                    l.point().temperature(), l.source(), l.point().line()));
        }
        List<RecoveryPoint> recovery = new ArrayList<>();
        for (RecoveryReader.Records f : inputs.recovery()) {
            for (RecoveryRecord r : f.records()) {
                recovery.add(new RecoveryPoint(r.forwardCurrent(), -r.reverseCurrent(), r.recoveryTime(), r.temperature(),
                        defaultRecoverySigma(r.recoveryTime()), Inputs.displayName(f.file()), r.line()));
            }
        }
        return new ExtractionData(forward, reverse, cv, recovery);
    }

    /** sigma of the voltage residual at the measured current, propagated by {@link org.cardwright.fit.PointUncertainty} [V]. */
    static double residualSigma(IvPoint p, double slope, double defaultVoltageSigma) {
        return org.cardwright.fit.PointUncertainty.residualSigma(p.hasVoltageSigma() ? p.voltageSigma() : Double.NaN,
                p.current(), p.hasCurrentSigma() ? p.currentSigma() : Double.NaN, p.voltageCurrentCorrelation(), slope,
                defaultVoltageSigma);
    }

    /**
     * Lines that name every term a dialect's refit brings onto its card although the full fit weighed and rejected
     * it (TRS1 "not warranted", say), with the refit's own reason: with the dialect's equations the term may follow
     * the data where the ngspice equations did not need it, but the card must say so. Empty when there is none.
     */
    public static List<String> introducedTerms(FitResult full, FitResult refit, Dialect d) {
        List<String> out = new ArrayList<>();
        for (org.cardwright.fit.TermDecision t : full.terms()) {
            if (t.included()) {
                continue;
            }
            List<Param> brought = t.params().stream()
                    .filter(p -> p != Param.TNOM && !full.parameters().isGiven(p) && refit.parameters().isGiven(p)
                            && d.carries(p))
                    .toList();
            if (brought.isEmpty()) {
                continue;
            }
            String why = refit.terms().stream().filter(r -> r.included() && r.term().equals(t.term()))
                    .map(org.cardwright.fit.TermDecision::reason).findFirst().orElse("");
            out.add(d.shortName() + " refit brings in " + brought.stream().map(d::keyword).collect(Collectors.joining(" "))
                    + " (" + t.term() + "), which the full fit rejected (" + t.reason() + ")"
                    + (why.isEmpty() ? "" : "; with " + d.flavour().label() + "'s equations: " + why));
        }
        return out;
    }

    /** Local dV/d(ln |I|) of each point within its file and sweep ({@link org.cardwright.fit.PointUncertainty#slopes}) [V]. */
    static double[] slopes(List<Inputs.Located> pts) {
        double[] currents = new double[pts.size()];
        double[] voltages = new double[pts.size()];
        for (int i = 0; i < pts.size(); i++) {
            currents[i] = pts.get(i).point().current();
            voltages[i] = pts.get(i).point().voltage();
        }
        return org.cardwright.fit.PointUncertainty.slopes(currents, voltages, Inputs.sweepKeys(pts));
    }

    private static double defaultOf(DiodeParameters p, Param q) {
        return q == Param.NBV ? p.get(Param.N) : q.defaultValue();
    }

    private static List<String> provenance(FitRequest request, Inputs inputs, FitResult full, FitResult forCard,
                                           Dialect d, List<Param> leftOut) {
        List<String> lines = new ArrayList<>();
        lines.add("model " + request.name() + ": junction diode for " + d.simulator() + ", written by cardwright "
                + ToolVersion.get());
        lines.add("device kind: " + request.kind().description());
        // paths in a card's header are relative to the card's own folder, so a card and its data can move
        // together (and stay byte-identical) wherever the tree is checked out
        Path home = request.outDir();
        for (MeasurementFile f : inputs.files()) {
            lines.add("data: " + relative(home, f.file()) + " sha256 " + f.sha256());
        }
        for (RecoveryReader.Records f : inputs.recovery()) {
            lines.add("data: " + relative(home, f.file()) + " sha256 " + f.sha256());
        }
        lines.add(String.format(Locale.ROOT, "fit: %d points fitted, read from %d forward I-V%s; forward worst RMS residual %s mV",
                full.points(), inputs.forward().size(), otherKinds(inputs, forCard.shunt().isPresent()), mv(forCard.worstRms(), 3)));
        if (!request.rules().isEmpty()) {
            lines.add("rules: " + request.rules().stream().map(ParameterRule::text).collect(Collectors.joining(" ")));
        }
        conditionsLine(inputs).ifPresent(lines::add);
        if (d.flavour() != org.cardwright.model.Flavour.NGSPICE_39) {
            lines.add("fitted with " + d.flavour().label() + "'s own equations (constants"
                    + (d.flavour().xyceKnee() ? ", high-injection law" : "")
                    + (d.flavour().spiceReverse() ? "" : ", reverse bias without breakdown") + "); see docs/dialects.md");
        }
        if (!leftOut.isEmpty()) {
            lines.add(d.shortName() + " cannot carry " + leftOut.stream().map(Param::keyword).collect(Collectors.joining(" "))
                    + ": refitted without; worst RMS residual " + forCard.costAgainst(full));
        }
        // every file name shell-quoted: a data file called "x;rm -rf ~" or "$(...)" runs nothing when pasted
        lines.add("verify, from this card's folder: cardwright verify " + ShellWords.quote(request.cardPath(d).getFileName().toString()) + " "
                + request.data().stream().map(p -> ShellWords.quote(relative(home, p))).collect(Collectors.joining(" "))
                + verifyOptions(request, d));
        return lines;
    }

    /**
     * The C-V conditions the fit used, with where each came from, when either is not the default: e.g.
     * "C-V conditions: stray capacitance 20 pF (cv25.csv, line 2 of the file), test frequency 1 MHz (the default)".
     */
    static Optional<String> conditionsLine(Inputs inputs) {
        for (MeasurementFile f : inputs.files()) {
            if (f.kind() != org.cardwright.data.DataKind.CV) {
                continue;
            }
            List<String> parts = new ArrayList<>();
            boolean stated = false;
            for (org.cardwright.data.Condition c : List.of(org.cardwright.data.Condition.STRAY_CAPACITANCE,
                    org.cardwright.data.Condition.TEST_FREQUENCY)) {
                Optional<org.cardwright.data.ConditionValue> v = f.condition(c);
                if (v.isEmpty()) {
                    continue;
                }
                stated |= !v.get().source().equals("the default");
                parts.add(c.key() + " " + c.text(v.get().value()) + " (" + (v.get().line() > 0
                        ? f.file().getFileName() + ", " : "") + v.get().source() + ")");
            }
            return stated ? Optional.of("C-V conditions: " + String.join(", ", parts)) : Optional.empty();
        }
        return Optional.empty();
    }

    /**
     * The options a verify of this card needs to read the card and the data as the fit did: the dialect, stated
     * even where the file name would give it (a renamed card still reads right), and the reading conditions. Every
     * value in a form the option takes ({@code --temp} is a plain number).
     */
    private static String verifyOptions(FitRequest request, Dialect d) {
        StringBuilder sb = new StringBuilder();
        if (d != Dialect.NGSPICE) {
            sb.append(" --dialect ").append(d.shortName());
        }
        request.temperature().ifPresent(t -> sb.append(" --temp ").append(
                org.cardwright.card.SpiceNumbers.plain(t - org.cardwright.model.Ngspice39.CELSIUS_TO_KELVIN, 6)));
        if (request.capacitance().strayCapacitance() != 0) {
            sb.append(" --stray-capacitance ").append(org.cardwright.card.SpiceNumbers.format(request.capacitance().strayCapacitance(), 6));
        }
        if (request.capacitance().frequency() != org.cardwright.fit.CapacitanceOptions.DEFAULT_FREQUENCY) {
            sb.append(" --cv-frequency ").append(org.cardwright.card.SpiceNumbers.format(request.capacitance().frequency(), 6));
        }
        if (Double.isFinite(request.bench().meterResistance())) {
            sb.append(" --meter-resistance ").append(org.cardwright.card.SpiceNumbers.format(request.bench().meterResistance(), 6));
        }
        return sb.toString();
    }

    /** {@code file} relative to {@code folder}, with forward slashes. */
    static String relative(Path folder, Path file) {
        Path a = folder.toAbsolutePath().normalize();
        Path b = file.toAbsolutePath().normalize();
        String r = a.getRoot() != null && a.getRoot().equals(b.getRoot()) ? a.relativize(b).toString() : b.toString();
        return r.replace('\\', '/');
    }

    private static String mv(double volts, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", volts * 1e3);
    }

    private static String otherKinds(Inputs inputs, boolean shunted) {
        StringBuilder sb = new StringBuilder();
        if (!inputs.reverse().isEmpty()) {
            sb.append(", ").append(inputs.reverse().size()).append(shunted
                    ? " reverse I-V (leakage below breakdown fitted with the shunt resistor)"
                    : " reverse I-V (leakage below breakdown is compared, not fitted)");
        }
        if (!inputs.capacitance().isEmpty()) {
            sb.append(", ").append(inputs.capacitance().size()).append(" C-V");
        }
        int records = inputs.recovery().stream().mapToInt(r -> r.records().size()).sum();
        if (records > 0) {
            sb.append(", ").append(records).append(" recovery records");
        }
        return sb.toString();
    }

    private static String temperatures(FitResult r) {
        return r.residuals().stream().map(s -> org.cardwright.model.Celsius.oneDecimal(s.temperature()))
                .collect(Collectors.joining(", "));
    }
}
