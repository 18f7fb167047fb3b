package org.cardwright.workflow;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.Function;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;
import org.cardwright.card.ShuntedCard;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.compare.CardComparer;
import org.cardwright.compare.CardComparison;
import org.cardwright.compare.ComparisonPlan;
import org.cardwright.data.DataFileException;
import org.cardwright.failure.UsageException;
import org.cardwright.model.Ngspice39;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.Tolerance;

/**
 * The compare job: read two cards, build the comparison plan from the request and the defaults below, simulate
 * both cards with the same engines, and, when data are given, verify each card against every data kind of the data
 * so that a page can overlay both on the measurements.
 *
 * <p>One sign convention for every bias option: a reverse-bias quantity (leakage voltage, capacitance voltage,
 * breakdown current) is given as a positive magnitude, as a datasheet writes VR and IR; a negative value is a usage
 * error (exit 2) that names the option and the value. Forward currents are positive too.
 */
public final class CompareWorkflow {
    /** Device temperatures compared when none are given [degC]: cold, room and hot ends of an industrial range. */
    public static final String DEFAULT_TEMPERATURES = "-40,25,125";
    /** Lowest decade of forward current when none is given. */
    public static final String DEFAULT_FROM = "1n";
    /** Highest decade of forward current when none is given. */
    public static final String DEFAULT_TO = "100m";
    /** Reverse voltages for leakage when none are given, positive magnitudes [V]. */
    public static final String DEFAULT_LEAKAGE = "1,5,20";
    /** Reverse voltages for capacitance when none are given, magnitudes [V]. */
    public static final String DEFAULT_CAPACITANCE = "0,1,5,10";

    /**
     * What the job found.
     *
     * @param comparison the two cards side by side at the plan's conditions
     * @param plan       the plan they were compared on
     * @param cardNotes  what reading each card noticed (unknown parameters and the like)
     * @param overlay    both cards verified against the data, when data were given
     */
    public record Outcome(CardComparison comparison, ComparisonPlan plan, List<String> cardNotes, Optional<Overlay> overlay) {
        public Outcome {
            cardNotes = List.copyOf(cardNotes);
        }
    }

    /**
     * Both cards held to the same measurements, for the overlay page.
     *
     * @param a      card A against every data kind of the data
     * @param b      card B, likewise
     * @param cardA  card A's model name
     * @param cardB  card B's model name
     * @param fileA  card A's file as the user named it
     * @param fileB  card B's file as the user named it
     * @param parametersA card A's parameters as read (ngspice meaning)
     * @param parametersB card B's parameters as read
     */
    public record Overlay(JunctionVerification a, JunctionVerification b, String cardA, String cardB, String fileA,
                          String fileB, org.cardwright.model.DiodeParameters parametersA,
                          org.cardwright.model.DiodeParameters parametersB) {
    }

    /**
     * Runs the job; writes the overlay page with {@code page} when the request asks for one.
     *
     * @throws UsageException when an option's value is wrong (exit 2)
     */
    public Outcome run(CompareRequest request, Function<Outcome, String> page)
            throws IOException, SimulationException, DataFileException, OutputException {
        if (request.html().isPresent()) {
            new OutputPlan().input("card A", request.cardA()).input("card B", request.cardB())
                    .inputs("data file", request.data()).output("--html", request.html().get()).check();
            OutputFiles.checkWritable(List.of(request.html().get()), request.force());
        }
        ComparisonPlan plan = plan(request);
        Dialect da = request.dialectA().orElseGet(() -> inferred(request.cardA()));
        Dialect db = request.dialectB().orElseGet(() -> inferred(request.cardB()));
        Read a = read(request.cardA(), da, request.modelA());
        Read b = read(request.cardB(), db, request.modelB());
        String engine = request.engine().toString();
        // verify's and check's rule: an engine runs only cards of a dialect it speaks, or it judges other equations
        Engines.requireSpeaks(engine, da, Inputs.displayName(request.cardA()));
        Engines.requireSpeaks(engine, db, Inputs.displayName(request.cardB()));
        // the built-in engine evaluates each card with the equations of the simulator it was written for
        CardComparison c = new CardComparer(Engines.byName(engine, da.flavour()), Engines.capacitanceByName(engine, da.flavour()),
                Engines.byName(engine, db.flavour()), Engines.capacitanceByName(engine, db.flavour()))
                .compare(a.card, a.shunt, Inputs.displayName(request.cardA()), b.card, b.shunt,
                        Inputs.displayName(request.cardB()), plan);
        List<String> notes = new ArrayList<>();
        a.card.notices().forEach(n -> notes.add(n));
        b.card.notices().forEach(n -> notes.add(n));
        Optional<Overlay> overlay = Optional.empty();
        if (!request.data().isEmpty()) {
            VerifyWorkflow verify = new VerifyWorkflow();
            JunctionVerification va = verify.runAll(verifyRequest(request, request.cardA(), request.modelA(), da), v -> "");
            JunctionVerification vb = verify.runAll(verifyRequest(request, request.cardB(), request.modelB(), db), v -> "");
            overlay = Optional.of(new Overlay(va, vb, a.card.name(), b.card.name(), Inputs.displayName(request.cardA()),
                    Inputs.displayName(request.cardB()), a.card.parameters(), b.card.parameters()));
        }
        Outcome outcome = new Outcome(c, plan, notes, overlay);
        if (request.html().isPresent()) {
            OutputFiles.writeAtomically(request.html().get(), page.apply(outcome));
        }
        return outcome;
    }

    /** The plan: the request's values where given, the defaults above elsewhere; bad values name their option. */
    public static ComparisonPlan plan(CompareRequest request) {
        List<Double> kelvin = new ArrayList<>();
        List<Double> celsius = request.temperatures().isEmpty() ? numbers("--temp", List.of(DEFAULT_TEMPERATURES.split(",")))
                : request.temperatures();
        for (double t : celsius) {
            if (!(t + Ngspice39.CELSIUS_TO_KELVIN > 0) || Double.isInfinite(t)) {
                throw new UsageException("--temp: '" + format(t) + "' degC is at or below absolute zero");
            }
            kelvin.add(t + Ngspice39.CELSIUS_TO_KELVIN);
        }
        double from = positive("--from", request.from(), "a forward current");
        double to = positive("--to", request.to(), "a forward current");
        if (to < from) {
            throw new UsageException("--to: '" + request.to() + "' is below --from '" + request.from() + "'");
        }
        List<Double> leakage = magnitudes("--leakage-at", request.leakageAt().isEmpty()
                ? List.of(DEFAULT_LEAKAGE.split(",")) : request.leakageAt(), false);
        List<Double> capacitance = magnitudes("--capacitance-at", request.capacitanceAt().isEmpty()
                ? List.of(DEFAULT_CAPACITANCE.split(",")) : request.capacitanceAt(), true);
        double breakdown = request.breakdownAt().map(s -> positive("--breakdown-at", s, "a reverse current")).orElse(Double.NaN);
        return new ComparisonPlan(kelvin, from, to, leakage, capacitance, breakdown, ComparisonPlan.DEFAULT_FREQUENCY,
                request.limits());
    }

    /** Reverse-bias magnitudes: a negative value (or zero where zero is not allowed) is a usage error. */
    private static List<Double> magnitudes(String option, List<String> given, boolean zeroAllowed) {
        List<Double> out = new ArrayList<>();
        for (String s : given) {
            double v = number(option, s);
            if (v < 0) {
                throw new UsageException(option + ": '" + s.trim() + "' is negative; reverse voltages are given as positive "
                        + "magnitudes (write " + s.trim().substring(1) + " for " + s.trim().substring(1) + " V reverse)");
            }
            if (v == 0 && !zeroAllowed) {
                throw new UsageException(option + ": '" + s.trim() + "' is zero; leakage is compared at a reverse voltage above 0");
            }
            out.add(v);
        }
        return out;
    }

    private static double positive(String option, String text, String what) {
        double v = number(option, text);
        if (v < 0) {
            throw new UsageException(option + ": '" + text.trim() + "' is negative; " + what + " is given as a positive "
                    + "magnitude (write " + text.trim().substring(1) + ")");
        }
        if (!(v > 0)) {
            throw new UsageException(option + ": '" + text.trim() + "' is zero; " + what + " above 0 is needed");
        }
        return v;
    }

    private static List<Double> numbers(String option, List<String> given) {
        List<Double> out = new ArrayList<>();
        given.forEach(s -> out.add(number(option, s)));
        return out;
    }

    private static double number(String option, String text) {
        try {
            double v = SpiceNumbers.parse(text.trim());
            if (Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new UsageException(option + ": '" + text.trim() + "' is not a number");
    }

    private static String format(double v) {
        return String.format(Locale.ROOT, "%s", v);
    }

    /** The dialect a card file's name states (NAME.DIALECT.lib), else ngspice. */
    static Dialect inferred(Path card) {
        String file = card.getFileName().toString().toLowerCase(Locale.ROOT);
        for (Dialect d : Dialect.values()) {
            if (file.endsWith("." + d.shortName() + ".lib")) {
                return d;
            }
        }
        return Dialect.NGSPICE;
    }

    private record Read(ParsedCard card, double shunt) {
    }

    /** A card file: one .model, or a subcircuit file (NAME.shunted.DIALECT.lib) with the resistor beside it. */
    private static Read read(Path file, Dialect d, Optional<String> model) throws IOException {
        String source = file.toString();
        String text = CardReader.readText(file, source);
        ShuntedCard.Either either = ShuntedCard.readEither(text, source, d, model);
        return new Read(either.card(), either.subcircuit().map(ShuntedCard.Read::shuntResistance).orElse(Double.POSITIVE_INFINITY));
    }

    private static VerifyRequest verifyRequest(CompareRequest request, Path card, Optional<String> model, Dialect d) {
        return new VerifyRequest(card, request.data(), request.engine().toString(), model, d, OptionalDouble.empty(),
                Tolerance.DEFAULT, Optional.empty(), false);
    }
}
