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
    /**
     * Instrument floor of a capacitance uncertainty: 0.05 % of the reading, the basic accuracy of a good bench
     * LCR meter (common practice, no source) [%].
     */
    public static final double FLOOR_PERCENT = 0.05;

    private final CapacitanceEngine engine;
    private final CapacitanceTolerance tolerance;
    private final VerdictBasis basis;

    /** A verifier whose verdict is the fixed limits (the uncertainty figures are computed too). */
    public CapacitanceVerifier(CapacitanceEngine engine, CapacitanceTolerance tolerance) {
        this(engine, tolerance, VerdictBasis.FIXED);
    }

    /** A verifier whose verdict is decided by {@code basis}. */
    public CapacitanceVerifier(CapacitanceEngine engine, CapacitanceTolerance tolerance, VerdictBasis basis) {
        this.engine = engine;
        this.tolerance = tolerance;
        this.basis = basis;
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
            List<CapacitanceResidual> along = new ArrayList<>(e.getValue());
            along.sort(java.util.Comparator.comparingDouble(r -> r.point().voltage()));
            double[] res = along.stream().mapToDouble(CapacitanceResidual::residualPercent).toArray();
            double[] none = new double[res.length];
            java.util.Arrays.fill(none, Double.NaN);
            DataUncertainty noise = DataUncertainty.of(res, none, rms, FLOOR_PERCENT);
            boolean fixed = rms <= tolerance.rmsPercent() && max <= tolerance.maxPercent();
            boolean pass = basis == VerdictBasis.FIXED || noise.source().equals(DataUncertainty.NONE) ? fixed : noise.pass();
            verdicts.add(new CapacitanceVerdict(e.getKey(), e.getValue().size(), rms, max, worst.point().voltage(),
                    worst.point().where(), pass, noise, fixed));
        }
        return new CapacitanceVerification(card.name(), engine.describe(), tolerance, strayCapacitance, frequency,
                verdicts, residuals, notes);
    }
}
