package org.cardwright.library;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.cardwright.card.CardFormatException;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.data.DataFileException;
import org.cardwright.data.Sha256;
import org.cardwright.failure.UsageException;
import org.cardwright.fit.FitInputException;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.verify.MeasuredPoint;
import org.cardwright.verify.TemperatureVerdict;
import org.cardwright.verify.Verification;
import org.cardwright.verify.Verifier;
import org.cardwright.workflow.Inputs;
import org.cardwright.workflow.OutputException;

/**
 * Applies a {@link Tweak} to a part: fits it as the device file says, sets the one parameter, then either fits the
 * others again with it held, or renders the cards again with only that value changed. Reports what the tweak costs
 * in residuals per temperature, card by card, and for every data kind.
 *
 * <p>The rules: a tweak changes a value the fitted card states; it adds no term. A parameter the fit left off the
 * card (ISR, IKF, a temperature coefficient, ... whose default then applies) is refused, with a message that names it
 * and says how to add it (a rule in the device file, then build). Every dialect of the part that carries the parameter
 * takes the tweak; a dialect that cannot carry it keeps its untweaked card, and the report and that card's header say
 * so. A refit keeps the base fit's set of terms.
 */
final class Tweaker {

    /**
     * A part with a tweak applied.
     *
     * @param base        the part as fitted without the tweak
     * @param tweaked     the part with it
     * @param tweak       the tweak
     * @param fittedValue the parameter's fitted value [SI]
     * @param newValue    its value after the tweak [SI]
     * @param notes       cards the tweak could not change, and why
     */
    record Result(PartFitter.Fitted base, PartFitter.Fitted tweaked, Tweak tweak, double fittedValue, double newValue,
                  List<String> notes) {
    }

    /** The cards a build writes for {@code part}: its fit, with the device file's tweak when it has one. */
    PartFitter.Fitted cards(DeviceFile part, Path root, Recipe recipe)
            throws DeviceFileException, LibraryInputException, FitInputException, OutputException, IOException {
        if (part.tweak().isEmpty()) {
            return new PartFitter().fit(part, root, recipe, List.of(), List.of());
        }
        return apply(part, root, recipe, part.tweak().get()).tweaked();
    }

    /** Applies {@code tweak} to {@code part}. */
    Result apply(DeviceFile part, Path root, Recipe recipe, Tweak tweak)
            throws DeviceFileException, LibraryInputException, FitInputException, OutputException, IOException {
        PartFitter.Fitted base = new PartFitter().fit(part, root, recipe, List.of(), List.of());
        if (!base.full().parameters().isGiven(tweak.param())) {
            throw absentTerm(part, tweak);
        }
        double fitted = base.full().parameters().get(tweak.param());
        double value = tweak.apply(fitted);
        try {
            DiodeParameters.defaults().with(tweak.param(), value);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("tweak " + tweak.text() + " gives an invalid value: " + e.getMessage());
        }
        String line = "tweak: " + tweak.text() + "; " + tweak.param() + " " + card(tweak, fitted) + " -> " + card(tweak, value);
        List<String> notes = new ArrayList<>();
        if (tweak.refit()) {
            // the refit moves the other parameters around the tweak but keeps the base fit's set of terms, so
            // that no new term (self-heating, say) quietly undoes the margin the tweak was meant to add
            List<ParameterRule> rules = new ArrayList<>(List.of(ParameterRule.fixed(tweak.param(), value)));
            for (Param term : List.of(Param.ISR, Param.IKF, Param.TRS1, Param.RTH0)) {
                if (term != tweak.param() && !base.full().parameters().isGiven(term)) {
                    rules.add(new ParameterRule(term, ParameterRule.Kind.OFF, Double.NaN,
                            Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
                }
            }
            PartFitter.Fitted refitted = new PartFitter().fit(part, root, recipe, rules, List.of(line));
            List<PartFitter.Card> cards = new ArrayList<>();
            for (int i = 0; i < refitted.cards().size(); i++) {
                PartFitter.Card c = refitted.cards().get(i);
                cards.add(c.dialect().carries(tweak.param()) ? c : untweaked(part, root, recipe, base, c, tweak, line, notes));
            }
            return new Result(base, new PartFitter.Fitted(cards, refitted.full(), refitted.points(), refitted.notes(),
                    refitted.warnings()), tweak, fitted, value, notes);
        }
        PartFitter.Read read = PartFitter.Read.of(part, root);
        Inputs all = read.inputs();
        List<MeasuredPoint> points = forwardPoints(all);
        org.cardwright.workflow.CardRange range = org.cardwright.workflow.CardRange.of(read.data());
        double frequency = capacitanceFrequency(part, all);
        List<PartFitter.Card> cards = new ArrayList<>();
        for (int i = 0; i < base.cards().size(); i++) {
            PartFitter.Card c = base.cards().get(i);
            if (!c.dialect().carries(tweak.param())) {
                cards.add(untweaked(part, root, recipe, base, c, tweak, line, notes));
                continue;
            }
            DiodeParameters p = c.parameters().with(tweak.param(), value);
            // the tweaked card must still evaluate across the measured range, as a fitted one must
            range.check("the " + c.dialect().shortName() + " card of " + part.model() + " with tweak " + tweak.text(), p,
                    new SimulatorOptions(SimulatorOptions.NGSPICE_DEFAULTS.gmin(), SimulatorOptions.NGSPICE_DEFAULTS.reltol(),
                            c.dialect().flavour()), frequency);
            cards.add(PartFitter.checkedRender(part, read, recipe, part.rules(), c.dialect(), p, base.points(),
                    residuals(part.model(), p, points), c.leftOut(), c.leftOutCost(), List.of(line)));
        }
        return new Result(base, new PartFitter.Fitted(cards, base.full(), base.points(), base.notes(), base.warnings()),
                tweak, fitted, value, notes);
    }

    /** The refusal of a tweak of a term the fit left off {@code part}'s card (exit 2). */
    static UsageException absentTerm(DeviceFile part, Tweak tweak) {
        String k = tweak.param().keyword();
        return new UsageException("tweak " + tweak.text() + " refused: the fit of "
                + part.model() + " (" + part.path().getFileName() + ") left " + k + " off the card, and a tweak "
                + "changes a value the card states, it adds no term; to add " + k + ", put a rule in the device file "
                + "(rules: - " + k + "=VALUE to fix it, or " + k + "=free to let the fit decide) and run cardwright build");
    }

    /**
     * The refusal of a tweak of an absent term, decided before any fit from the part's built ngspice card (the full
     * fit's card: every other dialect carries a subset of its terms) when that card is up to date: the state file's
     * inputs digest is {@code asBuilt}'s, and build wrote the card as it is (not edited by hand). A tweak adds no term
     * and its refit keeps the base fit's terms, so the built card's terms are the base fit's. Empty when the card
     * does not decide it (no ngspice card, not built, outdated or edited, or the card states the parameter); the
     * check after the base fit then stands.
     *
     * @param asBuilt the part as its device file states it, without the tweak asked for
     */
    static Optional<UsageException> refusedUpFront(DeviceFile asBuilt, Tweak tweak)
            throws DeviceFileException, IOException {
        if (!asBuilt.dialects().contains(Dialect.NGSPICE)) {
            return Optional.empty();
        }
        Path card = asBuilt.cardPath(Dialect.NGSPICE);
        Optional<BuildState> state = BuildState.read(asBuilt.statePath());
        if (state.isEmpty() || !Files.isRegularFile(card)
                || !state.get().wrote(card.getFileName().toString(), Sha256.hex(card))
                || !state.get().recipe().equals(Recipe.of(asBuilt).sha256())) {
            return Optional.empty();
        }
        ParsedCard parsed;
        try {
            String source = card.toString();
            parsed = new CardReader().parse(CardReader.readText(card, source),
                    source, Dialect.NGSPICE, Optional.of(asBuilt.model()));
        } catch (CardFormatException e) {
            return Optional.empty();  // the fit decides, as before
        }
        return parsed.parameters().isGiven(tweak.param()) ? Optional.empty()
                : Optional.of(absentTerm(asBuilt, tweak));
    }

    /**
     * The base card in the place of {@code tweakedCard}, whose dialect cannot carry the tweaked parameter, its header
     * saying so; the note goes to {@code notes}.
     */
    private static PartFitter.Card untweaked(DeviceFile part, Path root, Recipe recipe, PartFitter.Fitted base,
                                             PartFitter.Card tweakedCard, Tweak tweak, String line, List<String> notes)
            throws DeviceFileException, LibraryInputException, IOException {
        PartFitter.Card c = base.cards().stream().filter(b -> b.file().equals(tweakedCard.file())).findFirst()
                .orElse(tweakedCard);
        if (c.file().getFileName().toString().equals(
                org.cardwright.card.ShuntedCard.fileName(part.model(), c.dialect()))) {
            return c;
        }
        String why = c.dialect().shortName() + " cannot carry " + tweak.param().keyword() + ": its card is the untweaked fit";
        notes.add(why);
        return PartFitter.checkedRender(part, root, recipe, part.rules(), c.dialect(), c.parameters(), base.points(),
                c.residuals(), c.leftOut(), c.leftOutCost(), List.of(line + " (not taken: " + why + ")"));
    }

    private static String card(Tweak t, double si) {
        return SpiceNumbers.cardValue(t.param(), t.param().toCardValue(si), 7);
    }

    /** The C-V test frequency the part's files state or are given [Hz]. */
    private static double capacitanceFrequency(DeviceFile part, Inputs read) throws LibraryInputException {
        try {
            return read.capacitanceOptions(org.cardwright.fit.CapacitanceOptions.DEFAULT).frequency();
        } catch (DataFileException e) {
            throw new LibraryInputException(e.getMessage(), e);
        }
    }

    /** The part's forward points, as verify sees them. */
    private static List<MeasuredPoint> forwardPoints(Inputs read) {
        List<MeasuredPoint> out = new ArrayList<>();
        for (Inputs.Located l : read.forward()) {
            out.add(new MeasuredPoint(l.point().voltage(), l.point().current(), l.point().temperature(), l.source(),
                    l.point().line()));
        }
        return out;
    }

    /** Residuals of {@code p} at the points, by the built-in engine (the fit's own model). */
    private static List<PartFitter.Residual> residuals(String model, DiodeParameters p, List<MeasuredPoint> points) {
        Verification v;
        try {
            v = new Verifier(new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS), org.cardwright.verify.Tolerance.DEFAULT)
                    .verify(CardUnderTest.ngspice(model, p), points, List.of());
        } catch (org.cardwright.sim.process.SimulationException e) {
            throw new IllegalStateException("the built-in engine cannot fail: " + e.getMessage(), e);
        }
        List<PartFitter.Residual> out = new ArrayList<>();
        for (TemperatureVerdict t : v.perTemperature()) {
            out.add(new PartFitter.Residual(t.temperature(), t.points(), t.rms(), t.max()));
        }
        return out;
    }
}
