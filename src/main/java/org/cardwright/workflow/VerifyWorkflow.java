package org.cardwright.workflow;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Function;
import org.cardwright.card.CardReader;
import org.cardwright.card.ParsedCard;
import org.cardwright.data.DataFileException;
import org.cardwright.fit.ExtractionData;
import org.cardwright.fit.ReverseAnalysis;
import org.cardwright.fit.ReversePoint;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.SimulationEngine;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.verify.CapacitanceMeasurement;
import org.cardwright.verify.CapacitanceTolerance;
import org.cardwright.verify.CapacitanceVerification;
import org.cardwright.verify.CapacitanceVerifier;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.LeakageVerification;
import org.cardwright.verify.MeasuredPoint;
import org.cardwright.verify.RecoveryVerification;
import org.cardwright.verify.Tolerance;
import org.cardwright.verify.Verification;
import org.cardwright.verify.Verifier;

/**
 * The verify job: read a card and the data, re-simulate the card at every measured point of every kind,
 * compare each kind in its own unit against its own limits.
 */
public final class VerifyWorkflow {
    /**
     * Breakdown limits as a fraction of the median measured breakdown voltage: 0.5 % RMS, 1 % at any point
     * (common practice, no source: a card within these holds a clamp or reference design's margins) [1].
     */
    public static final double BREAKDOWN_RMS_FRACTION = 0.005;
    /** See {@link #BREAKDOWN_RMS_FRACTION} [1]. */
    public static final double BREAKDOWN_MAX_FRACTION = 0.01;
    /**
     * A breakdown point is reached when the card carries its current within twice its measured voltage; beyond that
     * the card has missed it by 100 % or more, 100 times the breakdown RMS limit, and the point is counted at that
     * edge ({@link Verifier#withReach}) so that no figure runs off to the I/GMIN of a card without breakdown [1].
     */
    public static final double BREAKDOWN_REACH = 2;

    /**
     * The forward I-V section alone, for callers that report only forward residuals; prefer {@link #runAll}.
     *
     * @throws DataFileException when the data hold no forward points
     */
    public Verification run(VerifyRequest request, Function<Verification, String> jsonRenderer)
            throws DataFileException, SimulationException, OutputException, IOException {
        JunctionVerification all = runAll(request, v -> jsonRenderer.apply(v.forward().orElseThrow()));
        if (all.forward().isEmpty()) {
            throw new DataFileException(request.data().get(0), 0, "no forward I-V points (positive current) to verify against", null);
        }
        return all.forward().get();
    }

    /** Runs the job over every data kind; writes the JSON result when asked. */
    public JunctionVerification runAll(VerifyRequest request, Function<JunctionVerification, String> jsonRenderer)
            throws DataFileException, SimulationException, OutputException, IOException {
        if (request.json().isPresent()) {
            new OutputPlan().input("the card", request.card()).inputs("data file", request.data())
                    .output("--json", request.json().get()).check();
            OutputFiles.checkWritable(List.of(request.json().get()), request.force());
        }
        String text = CardReader.readText(request.card(), Inputs.displayName(request.card()));
        return judge(request, text, () -> Inputs.read(request.data(), request.readOptions(), request::givenFor),
                Optional.empty(), jsonRenderer);
    }

    /**
     * {@link #runAll(VerifyRequest, Function)} for a card already in memory and data already read, for a caller that
     * holds both (a library build judges each card it renders against the inputs its fit read): nothing is read
     * again, and no JSON is written ({@code request.json()} must be empty). The result is the one the file-reading
     * entry gives for the same card text and files.
     *
     * @param cardText the card as its file holds it; {@code request.card()} names it in messages
     * @param inputs   {@code request.data()} as {@link Inputs#read} reads them with the request's options and
     *                 conditions
     */
    public JunctionVerification runAll(VerifyRequest request, String cardText, Inputs inputs)
            throws DataFileException, SimulationException, OutputException, IOException {
        if (request.json().isPresent()) {
            throw new IllegalArgumentException("a verification of a card in memory writes no JSON");
        }
        return judge(request, cardText, () -> inputs, Optional.empty(), v -> "");
    }

    /**
     * {@link #runAll(VerifyRequest, String, Inputs)} with {@code data}, which must be
     * {@link FitWorkflow#extractionData FitWorkflow.extractionData(inputs)}, made once by a caller that judges several
     * cards against the same inputs.
     */
    public JunctionVerification runAll(VerifyRequest request, String cardText, Inputs inputs, ExtractionData data)
            throws DataFileException, SimulationException, OutputException, IOException {
        if (request.json().isPresent()) {
            throw new IllegalArgumentException("a verification of a card in memory writes no JSON");
        }
        return judge(request, cardText, () -> inputs, Optional.of(data), v -> "");
    }

    /** Reads the data, when the card has been read: a bad card is reported before the data are opened. */
    @FunctionalInterface
    private interface DataRead {
        Inputs read() throws DataFileException;
    }

    private JunctionVerification judge(VerifyRequest request, String text, DataRead read, Optional<ExtractionData> madeData,
                                       Function<JunctionVerification, String> jsonRenderer)
            throws DataFileException, SimulationException, OutputException, IOException {
        String cardSource = Inputs.displayName(request.card());
        ParsedCard parsed;
        double shuntResistance = Double.POSITIVE_INFINITY;
        // the text is split once: a subcircuit card or a plain one (with the name asked for), as the first statement says
        org.cardwright.card.ShuntedCard.Either either = org.cardwright.card.ShuntedCard.readEither(text, cardSource,
                request.dialect(), request.model());
        if (either.subcircuit().isPresent()) {
            // a subcircuit card: the diode's .model and the resistor beside it, read strictly
            org.cardwright.card.ShuntedCard.Read sub = either.subcircuit().get();
            if (request.model().isPresent() && !request.model().get().equalsIgnoreCase(sub.card().name())
                    && !request.model().get().equalsIgnoreCase(sub.subcircuit())) {
                throw new org.cardwright.card.CardFormatException(cardSource, 0, "no .model or subcircuit named "
                        + request.model().get() + " (found: " + sub.subcircuit() + " with model " + sub.card().name() + ")", null);
            }
            parsed = sub.card();
            shuntResistance = sub.shuntResistance();
        } else {
            parsed = either.card();
        }
        // the card is read (a malformed card is refused as such), then, before any data are read or anything runs:
        // an engine that does not speak the card's dialect would judge another simulator's equations
        Engines.requireSpeaks(request.engine(), request.dialect(), cardSource);
        Inputs inputs = read.read();
        org.cardwright.fit.CapacitanceOptions capacitanceOptions = inputs.capacitanceOptions(request.capacitance());
        ExtractionData data = madeData.isPresent() ? madeData.get() : FitWorkflow.extractionData(inputs);
        List<String> notes = new ArrayList<>(parsed.notices());
        notes.addAll(inputs.notes());
        if (data.forward().isEmpty() && data.reverse().isEmpty() && data.capacitance().isEmpty() && data.recovery().isEmpty()) {
            throw new DataFileException(request.data().get(0), 0, "no I-V or C-V points to verify against", null);
        }
        CardUnderTest card = Engines.underTest(parsed, request.dialect()).withShunt(shuntResistance);
        SimulationEngine engine = Engines.byName(request.engine(), request.dialect().flavour());

        Optional<Verification> forward = Optional.empty();
        if (!data.forward().isEmpty()) {
            List<MeasuredPoint> pts = new ArrayList<>();
            for (int i = 0; i < data.forward().size(); i++) {
                var p = data.forward().get(i);
                var raw = inputs.forward().get(i).point();
                double sigma = raw.hasVoltageSigma() || raw.hasCurrentSigma() ? p.sigma() : Double.NaN;
                pts.add(new MeasuredPoint(p.voltage(), p.current(), p.temperature(), p.source(), p.line(), sigma));
            }
            forward = Optional.of(new Verifier(engine, request.tolerance(), request.verdict()).verify(card, pts, List.of()));
        }

        Optional<Verification> breakdown = Optional.empty();
        ReverseAnalysis.Split split = ReverseAnalysis.split(data.reverse());
        if (!split.breakdown().isEmpty()) {
            List<MeasuredPoint> pts = new ArrayList<>();
            double[] volts = new double[split.breakdown().size()];
            int k = 0;
            for (ReversePoint p : split.breakdown()) {
                pts.add(new MeasuredPoint(p.voltage(), p.current(), p.temperature(), p.source(), p.line()));
                volts[k++] = -p.voltage();
            }
            double median = org.cardwright.fit.Medians.upperMedian(volts, 0, volts.length);
            Tolerance t = new Tolerance(BREAKDOWN_RMS_FRACTION * median, BREAKDOWN_MAX_FRACTION * median);
            List<String> bdNotes = new ArrayList<>();
            if (!parsed.parameters().isGiven(org.cardwright.model.Param.BV) || !request.dialect().flavour().spiceReverse()) {
                bdNotes.add("the card carries no breakdown (BV), so it cannot reach these reverse currents at any sensible voltage");
            }
            breakdown = Optional.of(new Verifier(engine, t, request.verdict()).withReach(BREAKDOWN_REACH)
                    .verify(card, pts, bdNotes));
        }
        Optional<LeakageVerification> leakage = Optional.empty();
        if (!split.leakage().isEmpty()) {
            List<MeasuredPoint> pts = new ArrayList<>();
            for (ReversePoint p : split.leakage()) {
                pts.add(new MeasuredPoint(p.voltage(), p.current(), p.temperature(), p.source(), p.line()));
            }
            leakage = Optional.of(LeakageVerification.of(engine, card, pts));
        }

        Optional<CapacitanceVerification> capacitance = Optional.empty();
        if (!data.capacitance().isEmpty()) {
            List<CapacitanceMeasurement> pts = new ArrayList<>();
            data.capacitance().forEach(p -> pts.add(new CapacitanceMeasurement(p.voltage(), p.capacitance(),
                    p.temperature(), p.source(), p.line())));
            capacitance = Optional.of(new CapacitanceVerifier(Engines.capacitanceByName(request.engine(), request.dialect().flavour()), CapacitanceTolerance.DEFAULT,
                    request.verdict())
                    .verify(card, pts, capacitanceOptions.strayCapacitance(), capacitanceOptions.frequency(), List.of()));
        }
        Optional<RecoveryVerification> recovery = Optional.empty();
        if (!data.recovery().isEmpty()) {
            List<RecoveryVerification.Record> recs = new ArrayList<>();
            data.recovery().forEach(r -> recs.add(new RecoveryVerification.Record(r.forwardCurrent(), -r.reverseCurrent(),
                    r.recoveryTime(), r.temperature(), r.source() + ":" + r.line())));
            recovery = Optional.of(RecoveryVerification.of(parsed.parameters(), recs));
        }
        JunctionVerification v = new JunctionVerification(forward, breakdown, capacitance, recovery, leakage, notes);
        if (request.json().isPresent()) {
            OutputFiles.writeAtomically(request.json().get(), jsonRenderer.apply(v));
        }
        return v;
    }
}
