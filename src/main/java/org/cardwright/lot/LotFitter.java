package org.cardwright.lot;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.cardwright.data.DataFileException;
import org.cardwright.fit.ExtractionData;
import org.cardwright.fit.FitFailedException;
import org.cardwright.fit.FitInputException;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.FittedParameter;
import org.cardwright.fit.JunctionExtraction;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.Param;
import org.cardwright.workflow.FitWorkflow;
import org.cardwright.workflow.Inputs;

/**
 * The work on one part, the same in every path that runs a lot (threads here, other engines later): read its files,
 * fit with the lot's settings and term rules, read off the datasheet quantities. Nothing here throws for a bad part:
 * the reason goes into the result.
 */
public final class LotFitter {
    private final LotSettings settings;

    public LotFitter(LotSettings settings) {
        this.settings = settings;
    }

    /** A part's read data and free fit (the lot's term choice looks at these). */
    record Pilot(Inputs inputs, FitResult fit) {
    }

    /** Fits {@code part} with the plan's term rules. */
    public PartResult fit(LotParts.Part part, LotPlan plan) {
        String fingerprint;
        try {
            fingerprint = fingerprint(part, plan);
        } catch (IOException e) {
            return PartResult.failed(part.name(), "-", "cannot read: " + e.getMessage());
        }
        try {
            Pilot p = read(part, plan.rules());
            FitResult r = p.fit();
            Map<Param, Double> values = new EnumMap<>(r.parameters().givenValues());
            Set<Param> fitted = EnumSet.noneOf(Param.class);
            for (FittedParameter f : r.fitted()) {
                if (f.fitted()) {
                    fitted.add(f.param());
                }
            }
            Map<Datasheet.Quantity, Double> measured = Datasheet.measured(p.inputs(), plan.conditions(), plan.temperature());
            Map<Datasheet.Quantity, Double> card = Datasheet.ofCard(r.parameters(), plan.conditions(), plan.temperature());
            return new PartResult(part.name(), fingerprint, null, values, fitted,
                    r.residuals().isEmpty() ? Double.NaN : r.worstRms(), measured, card);
        } catch (Failure f) {
            return PartResult.failed(part.name(), fingerprint, f.getMessage());
        }
    }

    /** Reads and fits {@code part} with the given term rules (none: the fit chooses its own terms). */
    Pilot read(LotParts.Part part, List<ParameterRule> lotRules) throws Failure {
        Inputs inputs;
        org.cardwright.fit.CapacitanceOptions capacitance;
        try {
            inputs = Inputs.read(part.files(), settings.read(), f -> Inputs.commandLine(settings.capacitance()));
            // the C-V conditions the part's files state win over the command line's, as in fit
            capacitance = inputs.capacitanceOptions(settings.capacitance());
        } catch (DataFileException e) {
            throw new Failure("unreadable: " + part.describe(e));
        }
        ExtractionData data = FitWorkflow.extractionData(inputs);
        if (data.isEmpty()) {
            throw new Failure("no I-V or C-V points to fit");
        }
        FitResult r;
        try {
            r = new JunctionExtraction(settings.fitSettings(lotRules), capacitance).fit(data);
        } catch (FitInputException | FitFailedException e) {
            // only the fit's own failures make a part "not fitted"; anything else is a bug and stops the lot (exit 70)
            throw new Failure("fit refused: " + e.getMessage());
        }
        if (r.fitted().stream().noneMatch(FittedParameter::fitted)) {
            throw new Failure("fit refused: the data determine no parameter");
        }
        return new Pilot(inputs, r);
    }

    /** Hash of the part's name, files (names and bytes), the lot's settings and plan. */
    String fingerprint(LotParts.Part part, LotPlan plan) throws IOException {
        Hash.Running h = new Hash.Running().add(part.name()).add(settings.text()).add(plan.toText());
        for (Path f : part.files()) {
            h.add(f.getFileName().toString()).add(Files.readAllBytes(f));
        }
        return h.hex();
    }

    /** Why a part could not be fitted, in one line. */
    static final class Failure extends Exception {
        private static final long serialVersionUID = 1L;

        Failure(String message) {
            super(message == null ? "unknown failure" : message.replace('\n', ' '));
        }
    }
}
