package org.cardwright.lot;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.workflow.Inputs;

/**
 * The forward curves the lot's page draws: VF against IF at the datasheet temperature for a bounded sample of the
 * parts (measured, read again from their files after the fits) and for the typical and forward-voltage corner cards
 * (ngspice 39 equations). The sample is at most {@link #MAX_INLIERS} parts in the statistics, spread evenly over
 * them in part order, and at most {@link #MAX_OUTLIERS} outliers, so the page stays small for any lot size; the
 * same lot gives the same sample.
 */
public final class LotCurves {
    /** Parts in the statistics drawn: enough to show the spread, few enough to keep the page small [1]. */
    static final int MAX_INLIERS = 60;
    /** Outliers drawn [1]. */
    static final int MAX_OUTLIERS = 10;
    /** Currents on the drawn grid, log-spaced over the range the sample covers [1]. */
    static final int GRID = 41;
    /** The corner cards drawn, in this order. */
    static final List<String> DRAWN_CORNERS = List.of("typical", "vf-low", "vf-high");

    /**
     * The curves.
     *
     * @param currents the current grid [A]
     * @param inliers  measured VF by part, parts in the statistics, NaN where the part's data do not bracket the current [V]
     * @param outliers the same for outliers [V]
     * @param corners  VF of the drawn corner cards, by corner suffix [V]
     */
    public record Curves(double[] currents, Map<String, double[]> inliers, Map<String, double[]> outliers,
                         Map<String, double[]> corners) {
        /** No curves (no forward data). */
        public static Curves none() {
            return new Curves(new double[0], Map.of(), Map.of(), Map.of());
        }

        /** True when there is nothing to draw. */
        public boolean isEmpty() {
            return currents.length == 0;
        }
    }

    private LotCurves() {
    }

    static Curves of(List<LotParts.Part> parts, LotStatistics stats, List<LotCards.Corner> corners, LotPlan plan, LotSettings settings) {
        Map<String, LotParts.Part> byName = new HashMap<>();
        for (LotParts.Part p : parts) {
            byName.put(p.name(), p);
        }
        List<String> in = spread(stats.inliers().stream().map(PartResult::part).toList(), MAX_INLIERS);
        List<String> out = spread(new ArrayList<>(stats.outliers().keySet()), MAX_OUTLIERS);
        double temperature = plan.temperature();
        Map<String, List<double[]>> points = new LinkedHashMap<>();
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        for (String name : concat(in, out)) {
            LotParts.Part part = byName.get(name);
            if (part == null) {
                continue;
            }
            Inputs inputs;
            try {
                inputs = Inputs.read(part.files(), settings.read());
            } catch (org.cardwright.data.DataFileException | RuntimeException e) {
                continue; // it was read for its fit; a file changed since is left off the drawing, not the lot
            }
            List<double[]> pts = new ArrayList<>();
            for (Inputs.Located l : inputs.forward()) {
                if (Math.abs(l.point().temperature() - temperature) <= Datasheet.SAME_TEMPERATURE && l.point().current() > 0) {
                    pts.add(new double[] {l.point().current(), l.point().voltage()});
                }
            }
            pts.sort((a, b) -> Double.compare(a[0], b[0]));
            if (pts.size() >= 2) {
                points.put(name, pts);
                lo = Math.min(lo, pts.get(0)[0]);
                hi = Math.max(hi, pts.get(pts.size() - 1)[0]);
            }
        }
        if (points.isEmpty() || !(hi > lo)) {
            return Curves.none();
        }
        double[] grid = new double[GRID];
        for (int k = 0; k < GRID; k++) {
            grid[k] = Math.exp(Math.log(lo) + (Math.log(hi) - Math.log(lo)) * k / (GRID - 1));
        }
        grid[GRID - 1] = hi;
        Map<String, double[]> inCurves = new LinkedHashMap<>();
        Map<String, double[]> outCurves = new LinkedHashMap<>();
        for (Map.Entry<String, List<double[]>> e : points.entrySet()) {
            double[] v = new double[GRID];
            for (int k = 0; k < GRID; k++) {
                v[k] = interpolate(e.getValue(), grid[k]);
            }
            (stats.outliers().containsKey(e.getKey()) ? outCurves : inCurves).put(e.getKey(), v);
        }
        Map<String, double[]> cornerCurves = new LinkedHashMap<>();
        for (String suffix : DRAWN_CORNERS) {
            for (LotCards.Corner c : corners) {
                if (c.suffix().equals(suffix)) {
                    DiodeAtTemperature d = TemperatureLaws.at(c.parameters(), temperature, SimulatorOptions.NGSPICE_DEFAULTS);
                    double[] v = new double[GRID];
                    for (int k = 0; k < GRID; k++) {
                        v[k] = DiodeSolver.voltageAtCurrent(d, grid[k]);
                    }
                    cornerCurves.put(suffix, v);
                }
            }
        }
        return new Curves(grid, inCurves, outCurves, cornerCurves);
    }

    /** At most {@code max} names spread evenly over the list, in its order. */
    static List<String> spread(List<String> names, int max) {
        if (names.size() <= max) {
            return names;
        }
        List<String> out = new ArrayList<>();
        for (int i = 0; i < max; i++) {
            out.add(names.get((int) Math.round(i * (names.size() - 1) / (double) (max - 1))));
        }
        return out;
    }

    private static List<String> concat(List<String> a, List<String> b) {
        List<String> out = new ArrayList<>(a);
        out.addAll(b);
        return out;
    }

    /** V at I, linear in ln I between the bracketing points (sorted by I); NaN outside. */
    private static double interpolate(List<double[]> byCurrent, double current) {
        for (int i = 0; i + 1 < byCurrent.size(); i++) {
            double[] a = byCurrent.get(i);
            double[] b = byCurrent.get(i + 1);
            if (a[0] <= current && current <= b[0] && b[0] > a[0]) {
                return a[1] + Math.log(current / a[0]) / Math.log(b[0] / a[0]) * (b[1] - a[1]);
            }
        }
        return Double.NaN;
    }
}
