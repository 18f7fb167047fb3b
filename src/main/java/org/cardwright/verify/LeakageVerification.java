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

/**
 * Reverse leakage below breakdown: the current the card draws at each measured reverse voltage (DC), against
 * the measured current, as a ratio in decades, log10(simulated/measured). Limits: 0.3 decade RMS (a factor of
 * two) and 1 decade at any point (a factor of ten); leakage readings in the picoampere range are seldom better,
 * and a level-1 card carries no surface leakage at all, which these limits are meant to expose (common
 * practice, no source).
 *
 * @param perTemperature verdicts per temperature
 * @param notes          what the user must know
 * @param points         every point with the card's current at its voltage, in the order given (for plots); may be
 *                       empty
 */
public record LeakageVerification(List<Verdict> perTemperature, List<String> notes, List<Simulated> points) {
    /** RMS limit [decades]. */
    public static final double RMS_DECADES = 0.3;
    /** Single-point limit [decades]. */
    public static final double MAX_DECADES = 1.0;

    public LeakageVerification {
        perTemperature = List.copyOf(perTemperature);
        notes = List.copyOf(notes);
        points = List.copyOf(points);
    }

    /** Verdicts and notes without the points. */
    public LeakageVerification(List<Verdict> perTemperature, List<String> notes) {
        this(perTemperature, notes, List.of());
    }

    /**
     * One measured point with the card's current at its voltage.
     *
     * @param point     the measured point
     * @param simulated the card's current at the measured voltage and temperature [A]
     */
    public record Simulated(MeasuredPoint point, double simulated) {
    }

    /**
     * Summary at one temperature.
     *
     * @param temperature device temperature [K]
     * @param points      points
     * @param rmsDecades  RMS of log10(simulated/measured) [decades]
     * @param maxDecades  largest magnitude [decades]
     * @param worst       "file:line" of the largest
     * @param pass        within both limits
     */
    public record Verdict(double temperature, int points, double rmsDecades, double maxDecades, String worst,
                          boolean pass) {
    }

    /** Re-simulates every point at its measured voltage with {@code engine}. */
    public static LeakageVerification of(SimulationEngine engine, CardUnderTest card, List<MeasuredPoint> points)
            throws SimulationException {
        List<Bias> biases = new ArrayList<>();
        for (MeasuredPoint p : points) {
            biases.add(Bias.voltage(p.voltage(), p.temperature()));
        }
        List<OperatingPoint> sim = engine.dc(card, biases);
        Map<Double, List<double[]>> byT = new TreeMap<>();
        Map<Double, List<String>> where = new TreeMap<>();
        double[] sweepOf = SweepTemperatures.labels(points.stream().mapToDouble(MeasuredPoint::temperature).toArray(),
                SweepTemperatures.DEFAULT_GAP);
        for (int i = 0; i < points.size(); i++) {
            double ratio = sim.get(i).current() / points.get(i).current();
            double decades = ratio > 0 ? Math.log10(ratio) : Double.POSITIVE_INFINITY;
            byT.computeIfAbsent(sweepOf[i], k -> new ArrayList<>()).add(new double[] {decades});
            where.computeIfAbsent(sweepOf[i], k -> new ArrayList<>())
                    .add(points.get(i).source() + ":" + points.get(i).line());
        }
        List<Simulated> simulated = new ArrayList<>();
        for (int i = 0; i < points.size(); i++) {
            simulated.add(new Simulated(points.get(i), sim.get(i).current()));
        }
        List<Verdict> out = new ArrayList<>();
        for (Map.Entry<Double, List<double[]>> e : byT.entrySet()) {
            double sum = 0;
            double max = -1;
            String worst = "";
            List<double[]> d = e.getValue();
            for (int i = 0; i < d.size(); i++) {
                double x = d.get(i)[0];
                sum += x * x;
                if (Math.abs(x) > max) {
                    max = Math.abs(x);
                    worst = where.get(e.getKey()).get(i);
                }
            }
            double rms = Math.sqrt(sum / d.size());
            out.add(new Verdict(e.getKey(), d.size(), rms, max, worst, rms <= RMS_DECADES && max <= MAX_DECADES));
        }
        List<String> notes = new ArrayList<>();
        if (out.stream().anyMatch(v -> !v.pass())) {
            notes.add("measured leakage the card does not reproduce is usually surface or shunt leakage, which a level-1 card cannot carry");
        }
        return new LeakageVerification(out, notes, simulated);
    }

    /** True when every temperature passes. */
    public boolean pass() {
        return !perTemperature.isEmpty() && perTemperature.stream().allMatch(Verdict::pass);
    }
}
