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
    /**
     * A point is reached when the simulated voltage's magnitude is at most this many times the measured one's;
     * infinite (every point reached) unless {@link #withReach} sets it [1].
     */
    private final double reach;

    /** A verifier whose verdict is the fixed limits (the uncertainty figures are computed too). */
    public Verifier(SimulationEngine engine, Tolerance tolerance) {
        this(engine, tolerance, VerdictBasis.FIXED);
    }

    /** A verifier whose verdict is decided by {@code basis}. */
    public Verifier(SimulationEngine engine, Tolerance tolerance, VerdictBasis basis) {
        this(engine, tolerance, basis, Double.POSITIVE_INFINITY);
    }

    private Verifier(SimulationEngine engine, Tolerance tolerance, VerdictBasis basis, double reach) {
        this.engine = engine;
        this.tolerance = tolerance;
        this.basis = basis;
        this.floor = VOLTAGE_FLOOR;
        this.reach = reach;
    }

    /**
     * This verifier with a reach: a point whose simulated voltage is not finite or lies beyond {@code factor} times
     * its measured voltage (in magnitude) is not reached by the card. Such a point fails its temperature whatever the
     * basis, a note says how many and where, and its simulated voltage is counted at the edge of the reach (so its
     * residual is ({@code factor} - 1) times the measured voltage, a lower bound of the true miss): every figure of
     * the verdict stays finite and in the data's own range. A card without breakdown (a gnucap card; BV not given)
     * carries a breakdown current only through GMIN, at about I/GMIN (5e10 V for 50 mA), which is no figure a reader
     * can use.
     *
     * @param factor at least 1 [1]
     */
    public Verifier withReach(double factor) {
        if (!(factor >= 1)) {
            throw new IllegalArgumentException("reach factor must be at least 1, got " + factor);
        }
        return new Verifier(engine, tolerance, basis, factor);
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
        Map<Double, Integer> unreached = new TreeMap<>();
        double farthest = 0;
        PointResidual firstUnreached = null;
        for (int i = 0; i < forward.size(); i++) {
            MeasuredPoint m = forward.get(i);
            double simulated = sim.get(i).voltage();
            double edge = reach * Math.abs(m.voltage());
            if (!(Math.abs(simulated) <= edge)) {
                unreached.merge(sweepOf[i], 1, Integer::sum);
                farthest = Double.isFinite(simulated) ? Math.max(farthest, Math.abs(simulated)) : Double.POSITIVE_INFINITY;
                simulated = Math.copySign(edge, m.voltage());
                if (firstUnreached == null) {
                    firstUnreached = new PointResidual(m, simulated);
                }
            }
            PointResidual r = new PointResidual(m, simulated);
            residuals.add(r);
            byT.computeIfAbsent(sweepOf[i], t -> new ArrayList<>()).add(r);
        }
        if (!unreached.isEmpty()) {
            int n = unreached.values().stream().mapToInt(Integer::intValue).sum();
            notes = new ArrayList<>(notes);
            notes.add(String.format(java.util.Locale.ROOT, "%d of %d points not reached: the card carries their current "
                    + "only beyond %s times their measured voltage (%s), first at %s; each is counted at that edge, so its "
                    + "residual, %s, is a lower bound of the miss", n, forward.size(), plain(reach),
                    Double.isFinite(farthest) ? String.format(java.util.Locale.ROOT, "up to %.3g V", farthest) : "not at all",
                    firstUnreached.point().source() + ":" + firstUnreached.point().line(),
                    reach == 2 ? "the measured voltage itself" : plain(reach - 1) + " times the measured voltage"));
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
            boolean allReached = !unreached.containsKey(e.getKey());
            boolean fixed = rms <= tolerance.rms() && max <= tolerance.max() && allReached;
            boolean pass = (basis == VerdictBasis.FIXED || noise.source().equals(DataUncertainty.NONE) ? fixed : noise.pass())
                    && allReached;
            verdicts.add(new TemperatureVerdict(e.getKey(), e.getValue().size(), rms, max, worst.point().current(),
                    worst.point().source() + ":" + worst.point().line(), pass, stated, beyond, noise, fixed));
        }
        return new Verification(card.name(), engine.describe(), tolerance, verdicts, residuals, notes);
    }

    private static String plain(double x) {
        return x == Math.rint(x) && Math.abs(x) < 1e6 ? Long.toString((long) x) : String.valueOf(x);
    }
}
