package org.cardwright.verify;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.cardwright.sim.Bias;
import org.cardwright.sim.CapacitanceEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.model.SweepTemperatures;

/**
 * Re-simulates a card's small-signal capacitance at the measured C-V voltages with one engine and compares it
 * with the readings minus the stray capacitance, in % per point and per temperature.
 */
public final class CapacitanceVerifier {
    private final CapacitanceEngine engine;
    private final CapacitanceTolerance tolerance;

    public CapacitanceVerifier(CapacitanceEngine engine, CapacitanceTolerance tolerance) {
        this.engine = engine;
        this.tolerance = tolerance;
    }

    /**
     * @param card             the card as written
     * @param points           measured C-V points
     * @param strayCapacitance known stray capacitance included in every reading, subtracted here [F]
     * @param frequency        test-signal frequency of the readings [Hz]
     * @param notes            notes to carry into the result
     * @throws IllegalArgumentException when a reading is not above the stray capacitance (names file and line)
     */
    public CapacitanceVerification verify(CardUnderTest card, List<CapacitanceMeasurement> points, double strayCapacitance,
                                          double frequency, List<String> notes) throws SimulationException {
        List<Bias> biases = new ArrayList<>(points.size());
        for (CapacitanceMeasurement p : points) {
            if (!(p.capacitance() - strayCapacitance > 0)) {
                throw new IllegalArgumentException(p.where() + ": capacitance " + p.capacitance()
                        + " F is not above the stray capacitance " + strayCapacitance + " F");
            }
            biases.add(Bias.voltage(p.voltage(), p.temperature()));
        }
        List<Double> simulated = engine.capacitance(card, biases, frequency);
        List<CapacitanceResidual> residuals = new ArrayList<>(points.size());
        Map<Double, List<CapacitanceResidual>> byT = new TreeMap<>();
        double[] sweepOf = SweepTemperatures.labels(points.stream().mapToDouble(CapacitanceMeasurement::temperature)
                .toArray(), SweepTemperatures.DEFAULT_GAP);
        for (int i = 0; i < points.size(); i++) {
            CapacitanceMeasurement p = points.get(i);
            CapacitanceResidual r = new CapacitanceResidual(p, p.capacitance() - strayCapacitance, simulated.get(i));
            residuals.add(r);
            byT.computeIfAbsent(sweepOf[i], t -> new ArrayList<>()).add(r);
        }
        List<CapacitanceVerdict> verdicts = new ArrayList<>();
        for (Map.Entry<Double, List<CapacitanceResidual>> e : byT.entrySet()) {
            double sum = 0;
            CapacitanceResidual worst = null;
            for (CapacitanceResidual r : e.getValue()) {
                sum += r.residualPercent() * r.residualPercent();
                if (worst == null || Math.abs(r.residualPercent()) > Math.abs(worst.residualPercent())) {
                    worst = r;
                }
            }
            double rms = Math.sqrt(sum / e.getValue().size());
            double max = Math.abs(worst.residualPercent());
            verdicts.add(new CapacitanceVerdict(e.getKey(), e.getValue().size(), rms, max, worst.point().voltage(),
                    worst.point().where(), rms <= tolerance.rmsPercent() && max <= tolerance.maxPercent()));
        }
        return new CapacitanceVerification(card.name(), engine.describe(), tolerance, strayCapacitance, frequency,
                verdicts, residuals, notes);
    }
}
