package org.cardwright.library;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.data.DataFileException;
import org.cardwright.data.ReadOptions;
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
 * in residuals per temperature, card by card.
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
            return new Result(base, refitted, tweak, fitted, value, notes);
        }
        List<MeasuredPoint> points = forwardPoints(part, root);
        List<PartFitter.Card> cards = new ArrayList<>();
        for (PartFitter.Card c : base.cards()) {
            if (!c.dialect().carries(tweak.param())) {
                notes.add(c.dialect().shortName() + " cannot carry " + tweak.param() + ": its card is not tweaked");
                cards.add(PartFitter.render(part, recipe, part.rules(), c.dialect(), c.parameters(), base.points(),
                        c.residuals(), c.leftOut(), c.leftOutCost(), List.of(line + " (not carried by " + c.dialect().shortName() + ")")));
                continue;
            }
            DiodeParameters p = c.parameters().with(tweak.param(), value);
            cards.add(PartFitter.render(part, recipe, part.rules(), c.dialect(), p, base.points(),
                    residuals(part.model(), p, points), c.leftOut(), c.leftOutCost(), List.of(line)));
        }
        return new Result(base, new PartFitter.Fitted(cards, base.full(), base.points(), base.notes()), tweak, fitted,
                value, notes);
    }

    private static String card(Tweak t, double si) {
        return SpiceNumbers.cardValue(t.param(), t.param().toCardValue(si), 7);
    }

    /** The part's forward points, as verify sees them. */
    private static List<MeasuredPoint> forwardPoints(DeviceFile part, Path root)
            throws DeviceFileException, LibraryInputException, IOException {
        try (StagedInputs inputs = StagedInputs.of(part, root)) {
            ReadOptions options = ReadOptions.defaults();
            if (inputs.temperature().isPresent()) {
                options = options.withDefaultTemperature(inputs.temperature().getAsDouble());
            }
            Inputs read;
            try {
                read = Inputs.read(inputs.paths(), options);
            } catch (DataFileException e) {
                throw new LibraryInputException(inputs.displayName(e.getMessage()), e);
            }
            List<MeasuredPoint> out = new ArrayList<>();
            for (Inputs.Located l : read.forward()) {
                out.add(new MeasuredPoint(l.point().voltage(), l.point().current(), l.point().temperature(), l.source(),
                        l.point().line()));
            }
            return out;
        }
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
