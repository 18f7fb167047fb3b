package org.cardwright.workflow;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import org.cardwright.card.CardReader;
import org.cardwright.card.ParsedCard;
import org.cardwright.data.DataFileException;
import org.cardwright.data.ReadOptions;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.SimulationEngine;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.verify.MeasuredPoint;
import org.cardwright.verify.Verification;
import org.cardwright.verify.Verifier;

/** The verify job: read a card and the data, re-simulate the card at every measured point, compare. */
public final class VerifyWorkflow {

    /** Runs the job; writes the JSON result when asked. */
    public Verification run(VerifyRequest request, Function<Verification, String> jsonRenderer)
            throws DataFileException, SimulationException, OutputException, IOException {
        if (request.json().isPresent()) {
            OutputFiles.checkWritable(List.of(request.json().get()), request.force());
        }
        String text;
        try {
            text = Files.readString(request.card(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IOException(request.card() + ": cannot read the card (" + e.getMessage() + ")", e);
        }
        ParsedCard parsed = new CardReader().parse(text, Inputs.displayName(request.card()), request.dialect(),
                request.model());
        ReadOptions options = ReadOptions.defaults();
        if (request.temperature().isPresent()) {
            options = options.withDefaultTemperature(request.temperature().getAsDouble());
        }
        Inputs inputs = Inputs.read(request.data(), options);
        List<MeasuredPoint> forward = new ArrayList<>();
        for (Inputs.Located l : inputs.forward()) {
            forward.add(new MeasuredPoint(l.point().voltage(), l.point().current(), l.point().temperature(),
                    l.source(), l.point().line()));
        }
        List<String> notes = new ArrayList<>(parsed.notices());
        notes.addAll(inputs.notes());
        if (forward.isEmpty()) {
            throw new DataFileException(request.data().get(0), 0, "no forward I-V points (positive current) to verify against", "");
        }
        SimulationEngine engine = Engines.byName(request.engine());
        Verification v = new Verifier(engine, request.tolerance())
                .verify(new CardUnderTest(parsed.name(), parsed.parameters(), text), forward, notes);
        if (request.json().isPresent()) {
            OutputFiles.writeAtomically(request.json().get(), jsonRenderer.apply(v));
        }
        return v;
    }
}
