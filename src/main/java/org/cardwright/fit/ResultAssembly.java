package org.cardwright.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.function.Function;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * Turns the optimiser's final state into a {@link FitResult}: standard errors from the curvature matrix
 * scaled by the reduced chi-square, correlations, residual statistics, and the warnings a user must see.
 */
final class ResultAssembly {
    private ResultAssembly() {
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }

    static FitResult assemble(FitSettings settings, List<ResidualBlock> blocks, Optimiser.Run best,
                              List<FitPoint> points, List<TermDecision> decisions, List<String> warningsIn,
                              Map<Param, Double> start, Function<Param, double[]> bounds) {
        List<String> warnings = new ArrayList<>(warningsIn);
        double[] sweepOf = org.cardwright.model.SweepTemperatures.labels(
                points.stream().mapToDouble(FitPoint::temperature).toArray(), settings.sweepGap());
        Map<Double, List<FitPoint>> sweeps = new TreeMap<>();
        for (int i = 0; i < points.size(); i++) {
            sweeps.computeIfAbsent(sweepOf[i], t -> new ArrayList<>()).add(points.get(i));
        }
        FreeParameters layout = best.layout();
        JointProblem model = new JointProblem(blocks, layout);
        // a shunted fit reports the residuals of the diode with its resistor, as the subcircuit card carries them
        ForwardBlock forward = blocks.stream()
                .filter(b -> b instanceof ForwardBlock f && f.shunt() > 0 && f.size() == points.size())
                .map(b -> (ForwardBlock) b).findFirst().orElse(new ForwardBlock(points, settings.options()));
        int n = model.rows();
        int k = layout.size();
        int dof = n - k;
        double chi2 = best.rss();
        double reduced = dof > 0 ? chi2 / dof : Double.NaN;

        Uncertainty u = Uncertainty.of(model, best, reduced);
        double[] se = u.standardErrors();
        double[][] corr = u.correlations();
        if (u.singular()) {
            warnings.add("the fitted parameters are not all independent for this data (the curvature matrix is singular); standard errors are not available");
        }

        List<FittedParameter> fitted = new ArrayList<>();
        DiodeParameters p = best.parameters();
        for (Param q : p.givenParameters()) {
            int idx = layout.free().indexOf(q);
            FittedParameter.Origin origin;
            ParameterRule rule = settings.rule(q);
            if (idx >= 0) {
                origin = FittedParameter.Origin.FITTED;
            } else if (rule != null && rule.kind() == ParameterRule.Kind.FIXED) {
                origin = FittedParameter.Origin.FIXED_BY_USER;
            } else if (q == Param.IBV) {
                origin = FittedParameter.Origin.CHOSEN;
            } else {
                origin = FittedParameter.Origin.PRESET;
            }
            fitted.add(new FittedParameter(q, p.get(q), idx >= 0 ? se[idx] : Double.NaN, origin,
                    idx >= 0 ? start.getOrDefault(q, Double.NaN) : Double.NaN));
            if (idx >= 0) {
                double rel = layout.isLog(idx) ? se[idx] / p.get(q) : se[idx] / Math.max(Math.abs(p.get(q)), 1e-30);
                boolean undetermined = layout.isLog(idx) ? rel > 1.0 : (q == Param.TRS1 || q == Param.XTI
                        ? se[idx] > Math.max(Math.abs(p.get(q)), q == Param.TRS1 ? 1e-3 : 1.0) : rel > 0.5);
                if (undetermined) {
                    warnings.add(String.format(Locale.ROOT,
                            "%s is not determined by this data: %s +/- %s; pin it (%s=value) or add data that exercises it",
                            q, num(q.toCardValue(p.get(q))), num(se[idx]), q));
                }
                if (layout.atBound(idx, best.x()[idx])) {
                    double[] b = bounds.apply(q);
                    warnings.add(String.format(Locale.ROOT, "%s stopped at its bound (%s .. %s): the data pull it further than the model allows",
                            q, num(b[0]), num(b[1])));
                }
            }
        }
        u.addCorrelationWarnings(layout, warnings);


        double[] v = forward.voltages(p);
        List<SweepResiduals> residuals = new ArrayList<>();
        for (Map.Entry<Double, List<FitPoint>> e : sweeps.entrySet()) {
            double sum = 0;
            double max = 0;
            double worstI = Double.NaN;
            double lo = Double.POSITIVE_INFINITY;
            double hi = 0;
            int count = 0;
            for (int i = 0; i < points.size(); i++) {
                FitPoint pt = points.get(i);
                if (sweepOf[i] != e.getKey()) {
                    continue;
                }
                double r = v[i] - pt.voltage();
                sum += r * r;
                count++;
                if (Math.abs(r) >= max) {
                    max = Math.abs(r);
                    worstI = pt.current();
                }
                lo = Math.min(lo, pt.current());
                hi = Math.max(hi, pt.current());
            }
            residuals.add(new SweepResiduals(e.getKey(), count, lo, hi, Math.sqrt(sum / count), max, worstI));
        }
        List<KindResiduals> other = new ArrayList<>();
        for (ResidualBlock b : blocks) {
            other.addAll(b.summary(p));
        }
        return new FitResult(p, fitted, new Correlations(layout.free(), corr), chi2, reduced, n, dof,
                best.evaluations(), best.iterations(), best.stopReason(), residuals, other, decisions, warnings);
    }
}
