package org.cardwright.verify;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.cardwright.sim.Bias;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.OperatingPoint;
import org.cardwright.sim.SimulationEngine;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.model.SweepTemperatures;

/** Re-simulates a card at the measured currents with one engine and compares voltages, per temperature. */
public final class Verifier {
    /**
     * Instrument floor of a voltage uncertainty: 10 uV plus 10 ppm of the reading, about what a 6.5-digit bench
     * meter resolves and holds over a measurement (common practice, no source). As a {@link Tolerance}: rms is
     * the offset [V], max the fraction of the reading [1].
     */
    public static final Tolerance VOLTAGE_FLOOR = new Tolerance(10e-6, 10e-6);

    private final SimulationEngine engine;
    private final Tolerance tolerance;
    private final VerdictBasis basis;
    private final Tolerance floor;

    /** A verifier whose verdict is the fixed limits (the uncertainty figures are computed too). */
    public Verifier(SimulationEngine engine, Tolerance tolerance) {
        this(engine, tolerance, VerdictBasis.FIXED);
    }

    /** A verifier whose verdict is decided by {@code basis}. */
    public Verifier(SimulationEngine engine, Tolerance tolerance, VerdictBasis basis) {
        this.engine = engine;
        this.tolerance = tolerance;
        this.basis = basis;
        this.floor = VOLTAGE_FLOOR;
    }

    /**
     * @param card    the card as written
     * @param forward measured forward points
     * @param notes   notes to carry into the result (e.g. points set aside by the caller)
     */
    public Verification verify(CardUnderTest card, List<MeasuredPoint> forward, List<String> notes)
            throws SimulationException {
        List<Bias> biases = new ArrayList<>(forward.size());
        for (MeasuredPoint p : forward) {
            biases.add(Bias.current(p.current(), p.temperature()));
        }
        List<OperatingPoint> sim = engine.dc(card, biases);
        List<PointResidual> residuals = new ArrayList<>(forward.size());
        Map<Double, List<PointResidual>> byT = new TreeMap<>();
        double[] sweepOf = SweepTemperatures.labels(forward.stream().mapToDouble(MeasuredPoint::temperature).toArray(),
                SweepTemperatures.DEFAULT_GAP);
        for (int i = 0; i < forward.size(); i++) {
            PointResidual r = new PointResidual(forward.get(i), sim.get(i).voltage());
            residuals.add(r);
            byT.computeIfAbsent(sweepOf[i], t -> new ArrayList<>()).add(r);
        }
        List<TemperatureVerdict> verdicts = new ArrayList<>();
        for (Map.Entry<Double, List<PointResidual>> e : byT.entrySet()) {
            double sum = 0;
            PointResidual worst = null;
            int stated = 0;
            int beyond = 0;
            for (PointResidual r : e.getValue()) {
                sum += r.residual() * r.residual();
                if (!Double.isNaN(r.point().sigma())) {
                    stated++;
                    if (Math.abs(r.residual()) > 3 * r.point().sigma()) {
                        beyond++;
                    }
                }
                if (worst == null || Math.abs(r.residual()) > Math.abs(worst.residual())) {
                    worst = r;
                }
            }
            double rms = Math.sqrt(sum / e.getValue().size());
            double max = Math.abs(worst.residual());
            List<PointResidual> along = new ArrayList<>(e.getValue());
            along.sort(java.util.Comparator.comparingDouble(r -> Math.abs(r.point().current())));
            double[] res = along.stream().mapToDouble(PointResidual::residual).toArray();
            double[] sig = along.stream().mapToDouble(r -> r.point().sigma()).toArray();
            double typical = along.stream().mapToDouble(r -> Math.abs(r.point().voltage())).average().orElse(0);
            DataUncertainty noise = DataUncertainty.of(res, sig, rms, floor.rms() + floor.max() * typical);
            boolean fixed = rms <= tolerance.rms() && max <= tolerance.max();
            boolean pass = basis == VerdictBasis.FIXED || noise.source().equals(DataUncertainty.NONE) ? fixed : noise.pass();
            verdicts.add(new TemperatureVerdict(e.getKey(), e.getValue().size(), rms, max, worst.point().current(),
                    worst.point().source() + ":" + worst.point().line(), pass, stated, beyond, noise, fixed));
        }
        return new Verification(card.name(), engine.describe(), tolerance, verdicts, residuals, notes);
    }
}
