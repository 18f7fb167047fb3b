package org.cardwright.fit;

import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * Reverse-recovery records: residual (TT ln(1 + IF/IR) - trr)/sigma, the charge-control relation of
 * {@link RecoveryPoint#chargeControlFactor()}.
 */
final class RecoveryBlock implements ResidualBlock {
    private final List<RecoveryPoint> points;

    RecoveryBlock(List<RecoveryPoint> points) {
        this.points = List.copyOf(points);
    }

    @Override
    public String label() {
        return "reverse recovery";
    }

    @Override
    public int size() {
        return points.size();
    }

    @Override
    public Set<Param> dependsOn() {
        return EnumSet.of(Param.TT);
    }

    /** Modelled recovery times [s]. */
    double[] times(DiodeParameters p) {
        double tt = p.get(Param.TT);
        double[] out = new double[points.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = tt * points.get(i).chargeControlFactor();
        }
        return out;
    }

    @Override
    public double[] residuals(DiodeParameters p) {
        double[] t = times(p);
        for (int i = 0; i < t.length; i++) {
            t[i] = (t[i] - points.get(i).recoveryTime()) / points.get(i).sigma();
        }
        return t;
    }

    @Override
    public List<KindResiduals> summary(DiodeParameters p) {
        double[] t = times(p);
        java.util.Map<Double, List<Integer>> byT = org.cardwright.model.SweepTemperatures.groupIndices(
                points.stream().mapToDouble(RecoveryPoint::temperature).toArray(),
                org.cardwright.model.SweepTemperatures.DEFAULT_GAP);
        List<KindResiduals> out = new java.util.ArrayList<>();
        for (var e : byT.entrySet()) {
            double sum = 0;
            double max = -1;
            String worst = "";
            for (int i : e.getValue()) {
                double r = (t[i] - points.get(i).recoveryTime()) * 1e9;
                sum += r * r;
                if (Math.abs(r) > max) {
                    max = Math.abs(r);
                    worst = points.get(i).source() + ":" + points.get(i).line();
                }
            }
            out.add(new KindResiduals(label(), e.getKey(), e.getValue().size(), Math.sqrt(sum / e.getValue().size()),
                    max, "ns", worst));
        }
        return out;
    }

    /** Weighted least-squares TT from the relation alone (it is linear in TT) [s]. */
    static double closedForm(List<RecoveryPoint> points) {
        double num = 0;
        double den = 0;
        for (RecoveryPoint r : points) {
            double w = 1 / (r.sigma() * r.sigma());
            double l = r.chargeControlFactor();
            num += w * l * r.recoveryTime();
            den += w * l * l;
        }
        return num / den;
    }

    List<RecoveryPoint> points() {
        return points;
    }
}
