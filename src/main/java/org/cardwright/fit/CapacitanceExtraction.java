package org.cardwright.fit;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.JunctionCapacitance;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.TemperatureLaws;

/**
 * Extraction of the junction-capacitance parameters from C-V data at one or more temperatures.
 *
 * <ol>
 *   <li>Closed-form start values of CJ, VJ and M from the reverse-bias points at the temperature nearest TNOM
 *       ({@link CapacitanceStart}), carried to TNOM through ngspice's TLEVC 0 laws.</li>
 *   <li>One global Levenberg-Marquardt fit (Levenberg, Q. Appl. Math. 2 (1944) 164-168; Marquardt, J. SIAM 11
 *       (1963) 431-441) of CJO, VJ and M to every point at every temperature through the same laws, so the
 *       card is right at each measured temperature, not only at one. CJO varies as a logarithm.</li>
 *   <li>FC (only when the data reach FC·VJ(T)) and TT (only when there are forward-bias points and they show
 *       capacitance beyond the depletion law) are added one at a time, best first, while the Bayesian
 *       information criterion (Schwarz, Ann. Statist. 6 (1978) 461-464) falls by more than
 *       {@link ForwardExtraction#BIC_THRESHOLD}.</li>
 * </ol>
 *
 * <p>The DC parameters (IS, N, RS, ISR, ...) are held at the values given: they set the junction voltage under
 * RS and the conductance in TT·g. A known stray capacitance is subtracted from every reading.
 */
public final class CapacitanceExtraction {
    /** Mean squared weighted residual below which fits are indistinguishable [1]. */
    private static final double RESIDUAL_FLOOR_SQUARED = 1e-6;
    /** Distinct reverse-bias voltages needed at one temperature for CJO, VJ and M. */
    public static final int MIN_REVERSE_VOLTAGES = 3;

    private final FitSettings settings;
    private final CapacitanceOptions options;

    /**
     * @param settings user rules for CJO, VJ, M, FC, TT, the nominal temperature and the simulator options
     * @param options  stray capacitance and test frequency of the readings
     */
    public CapacitanceExtraction(FitSettings settings, CapacitanceOptions options) {
        this.settings = settings;
        this.options = options;
    }

    /** An optional term. */
    private enum Term {
        LINEAR_EXTENSION("forward-bias depletion coefficient", Param.FC),
        DIFFUSION("diffusion capacitance", Param.TT);

        final String label;
        final Param param;

        Term(String label, Param param) {
            this.label = label;
            this.param = param;
        }
    }

    /**
     * Fits the capacitance parameters to {@code points}.
     *
     * @param points       C-V measurements (readings as taken, stray included)
     * @param dcParameters the DC parameters of the part (a forward fit's result, or a card); their TNOM must be
     *                     the settings' TNOM when given
     * @throws FitInputException when the data cannot support a fit (the message names file, line and value)
     */
    public CapacitanceFit fit(List<CapacitancePoint> points, DiodeParameters dcParameters) throws FitInputException {
        double stray = options.strayCapacitance();
        Map<Double, List<CapacitancePoint>> byT = checkInput(points, stray);
        double tnom = settings.nominalTemperature();
        if (dcParameters.isGiven(Param.TNOM) && dcParameters.nominalTemperature() != tnom) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "the DC parameters are stated at TNOM = %.2f degC but the fit at %.2f degC",
                    dcParameters.nominalTemperature() - Ngspice39.CELSIUS_TO_KELVIN, tnom - Ngspice39.CELSIUS_TO_KELVIN));
        }
        DiodeParameters base = dcParameters.isGiven(Param.TNOM) || tnom == Ngspice39.REFERENCE_TEMPERATURE
                ? dcParameters : dcParameters.with(Param.TNOM, tnom);
        List<String> warnings = new ArrayList<>();
        List<TermDecision> decisions = new ArrayList<>();

        // ---- stage 1: closed-form start from the reverse-bias points nearest TNOM -------------------------
        List<CapacitancePoint> reference = referenceSweep(byT, tnom);
        double tRef = reference.get(0).temperature();
        CapacitanceStart.Depletion dep = CapacitanceStart.reverse(reference, stray);
        double m0 = clampInto(Param.M, dep.gradingCoefficient());
        double[] nominal = CapacitanceStart.toNominal(dep.junctionCapacitance(), dep.junctionPotential(), m0, tRef, tnom);
        EnumMap<Param, Double> start = new EnumMap<>(Param.class);
        start.putAll(base.givenValues());
        putStart(start, Param.CJO, clampInto(Param.CJO, nominal[0]));
        putStart(start, Param.VJ, clampInto(Param.VJ, nominal[1]));
        putStart(start, Param.M, m0);
        for (Param p : List.of(Param.FC, Param.TT)) {
            ParameterRule r = settings.rule(p);
            if (r != null && r.kind() == ParameterRule.Kind.OFF) {
                start.remove(p);
            } else if (r != null && Double.isFinite(r.value())) {
                start.put(p, r.value());
            }
        }
        List<Param> free = new ArrayList<>();
        for (Param p : List.of(Param.CJO, Param.VJ, Param.M)) {
            ParameterRule r = settings.rule(p);
            if (r != null && r.kind() == ParameterRule.Kind.OFF) {
                throw new FitInputException(p + "=off cannot be used with C-V data: the depletion capacitance needs it");
            }
            if (r == null || r.kind() != ParameterRule.Kind.FIXED) {
                free.add(p);
            }
        }
        DiodeParameters startCard = DiodeParameters.of(start);
        Map<Param, Double> initial = new EnumMap<>(Param.class);
        initial.putAll(start);

        // ---- stage 2: global fit of the depletion law at every temperature --------------------------------
        CapacitanceBlock block = new CapacitanceBlock(points, stray, options.frequency(), settings.options());
        List<ResidualBlock> blocks = List.of(block);
        Optimiser.Run best = run(blocks, startCard, free);
        int n = points.size();
        double bestBic = bic(best.rss(), n, best.layout().size());

        // ---- stage 3: FC and TT where the data determine them ---------------------------------------------
        List<Term> candidates = new ArrayList<>();
        for (Term term : Term.values()) {
            ParameterRule r = settings.rule(term.param);
            if (r != null && r.kind() == ParameterRule.Kind.OFF) {
                decisions.add(new TermDecision(term.label, List.of(term.param), false, Double.NaN, "switched off by the user"));
            } else if (r != null && r.kind() == ParameterRule.Kind.FIXED) {
                decisions.add(new TermDecision(term.label, List.of(term.param), true, Double.NaN, "held by the user"));
            } else if (r != null) {
                double v = term == Term.DIFFUSION ? diffusionStart(block, startCard, best.parameters()) : Double.NaN;
                DiodeParameters withTerm = best.parameters().with(term.param, Double.isFinite(r.value()) ? r.value()
                        : Double.isFinite(v) && v > 0 ? clampInto(term.param, v) : best.parameters().get(term.param));
                List<Param> f = new ArrayList<>(best.layout().free());
                f.add(term.param);
                best = run(blocks, withTerm, f);
                bestBic = bic(best.rss(), n, best.layout().size());
                initial.put(term.param, withTerm.get(term.param));
                decisions.add(new TermDecision(term.label, List.of(term.param), true, Double.NaN, "set free by the user"));
            } else {
                String why = eligibility(term, block, best.parameters(), byT);
                if (why == null) {
                    candidates.add(term);
                } else {
                    decisions.add(new TermDecision(term.label, List.of(term.param), false, Double.NaN, why));
                }
            }
        }
        Map<Term, Double> lastDelta = new LinkedHashMap<>();
        while (!candidates.isEmpty()) {
            Term chosen = null;
            Optimiser.Run chosenRun = null;
            double chosenBic = Double.POSITIVE_INFINITY;
            double chosenStart = Double.NaN;
            for (Term term : candidates) {
                double v0 = term == Term.DIFFUSION
                        ? diffusionStart(block, startCard, best.parameters()) : best.parameters().get(Param.FC);
                if (!(v0 > 0)) {
                    lastDelta.put(term, Double.NaN);
                    continue;
                }
                v0 = clampInto(term.param, v0);
                List<Param> f = new ArrayList<>(best.layout().free());
                f.add(term.param);
                Optimiser.Run r;
                try {
                    r = run(blocks, Optimiser.with(best.parameters(), term.param, v0), f);
                } catch (FitFailedException e) {
                    // a trial term the data cannot carry (no convergence, parameters leaving the model's domain)
                    lastDelta.put(term, Double.NaN);
                    continue;
                }
                double b = bic(r.rss(), n, r.layout().size());
                lastDelta.put(term, b - bestBic);
                if (b < chosenBic) {
                    chosenBic = b;
                    chosen = term;
                    chosenRun = r;
                    chosenStart = v0;
                }
            }
            if (chosen == null || chosenBic - bestBic > -ForwardExtraction.BIC_THRESHOLD) {
                break;
            }
            decisions.add(new TermDecision(chosen.label, List.of(chosen.param), true, chosenBic - bestBic,
                    String.format(Locale.ROOT, "BIC fell by %.1f (threshold %.0f)", bestBic - chosenBic,
                            ForwardExtraction.BIC_THRESHOLD)));
            initial.put(chosen.param, chosenStart);
            candidates.remove(chosen);
            best = chosenRun;
            bestBic = chosenBic;
        }
        for (Term term : candidates) {
            double d = lastDelta.getOrDefault(term, Double.NaN);
            decisions.add(new TermDecision(term.label, List.of(term.param), false, d, Double.isNaN(d)
                    ? "the data show nothing for it to describe"
                    : String.format(Locale.ROOT, "not warranted: BIC changed by %+.1f (needs below -%.0f)", d,
                    ForwardExtraction.BIC_THRESHOLD)));
        }
        if (best.layout().free().contains(Param.TT) && !base.isGiven(Param.IS)) {
            warnings.add("TT was fitted to forward-bias capacitance without fitted DC parameters (IS, N): the diffusion "
                    + "capacitance TT·g used the default IS and N; fit forward I-V together with the C-V data");
        }
        return summarise(block, best, byT, decisions, warnings, initial);
    }

    /**
     * VJ and M at TNOM from the C-V data alone, in closed form ({@link CapacitanceStart}: the reverse-bias points
     * of the sweep nearest TNOM, carried to TNOM through the TLEVC 0 laws), for the forward stage to start from
     * before the joint fit: they are the VJ and M of the recombination factor too, and a junction whose forward
     * voltage exceeds the default VJ of 1 V (a wide-gap junction) is otherwise fitted with a factor of the wrong
     * shape. Empty when the data cannot give them (too few reverse voltages, a reading not above the stray) or a
     * user rule sets VJ or M.
     */
    Map<Param, Double> depletionStart(List<CapacitancePoint> points) {
        if (settings.rule(Param.VJ) != null || settings.rule(Param.M) != null) {
            return Map.of();
        }
        try {
            double stray = options.strayCapacitance();
            double tnom = settings.nominalTemperature();
            List<CapacitancePoint> reference = referenceSweep(checkInput(points, stray), tnom);
            // the closed form's own numerical refusals become a fit failure (Optimiser.guarded), nothing wider
            double[] vjAndM = Optimiser.guarded(() -> {
                CapacitanceStart.Depletion dep = CapacitanceStart.reverse(reference, stray);
                double grading = clampInto(Param.M, dep.gradingCoefficient());
                double[] nominal = CapacitanceStart.toNominal(dep.junctionCapacitance(), dep.junctionPotential(), grading,
                        reference.get(0).temperature(), tnom);
                return new double[] {clampInto(Param.VJ, nominal[1]), grading};
            });
            double vj = vjAndM[0];
            double m = vjAndM[1];
            if (!Double.isFinite(vj) || !Double.isFinite(m)) {
                return Map.of();
            }
            return Map.of(Param.VJ, vj, Param.M, m);
        } catch (FitInputException | FitFailedException e) {
            // the C-V stage itself reports what is wrong with the data
            return Map.of();
        }
    }

    // ---------------------------------------------------------------------------------------------------

    private Map<Double, List<CapacitancePoint>> checkInput(List<CapacitancePoint> points, double stray)
            throws FitInputException {
        if (points.isEmpty()) {
            throw new FitInputException("no C-V points to fit");
        }
        for (CapacitancePoint p : points) {
            if (!(p.capacitance() - stray > 0)) {
                throw new FitInputException(String.format(Locale.ROOT,
                        "%s: capacitance %s F is not above the stray capacitance %s F given for subtraction",
                        p.where(), num(p.capacitance()), num(stray)));
            }
        }
        Map<Double, List<CapacitancePoint>> byT = org.cardwright.model.SweepTemperatures.group(points, CapacitancePoint::temperature,
                settings.sweepGap());
        return byT;
    }

    /** The points at the temperature nearest TNOM that has enough distinct reverse-bias voltages. */
    private static List<CapacitancePoint> referenceSweep(Map<Double, List<CapacitancePoint>> byT, double tnom)
            throws FitInputException {
        List<CapacitancePoint> best = null;
        double bestDistance = Double.POSITIVE_INFINITY;
        int most = 0;
        for (List<CapacitancePoint> s : byT.values()) {
            int k = (int) s.stream().filter(p -> p.voltage() <= 0).mapToDouble(CapacitancePoint::voltage).distinct().count();
            most = Math.max(most, k);
            double d = Math.abs(s.get(0).temperature() - tnom);
            if (k >= MIN_REVERSE_VOLTAGES && d < bestDistance) {
                bestDistance = d;
                best = s;
            }
        }
        if (best == null) {
            CapacitancePoint first = byT.values().iterator().next().get(0);
            throw new FitInputException(String.format(Locale.ROOT,
                    "%s: C-V data need reverse-bias points (V <= 0) at %d or more voltages at one temperature to "
                            + "determine CJO, VJ and M; the most at any temperature is %d",
                    first.source(), MIN_REVERSE_VOLTAGES, most));
        }
        return best;
    }

    /** Null when the term can be tried, else the reason why not. */
    private String eligibility(Term term, CapacitanceBlock block, DiodeParameters p,
                               Map<Double, List<CapacitancePoint>> byT) {
        if (term == Term.LINEAR_EXTENSION) {
            double highest = Double.NEGATIVE_INFINITY;
            double highestT = Double.NaN;
            for (Map.Entry<Double, List<CapacitancePoint>> e : byT.entrySet()) {
                DiodeAtTemperature d = TemperatureLaws.at(p, e.getKey(), settings.options());
                for (CapacitancePoint pt : e.getValue()) {
                    double ratio = JunctionCapacitance.junctionVoltage(d, pt.voltage())
                            / (d.forwardCoefficient() * d.junctionPotential());
                    if (ratio > highest) {
                        highest = ratio;
                        highestT = e.getKey();
                    }
                }
            }
            return highest >= 1 ? null : String.format(Locale.ROOT,
                    "the data stay below FC·VJ(T) (at most %.0f %% of it, at %.2f degC), where FC has no effect",
                    100 * highest, highestT - Ngspice39.CELSIUS_TO_KELVIN);
        }
        // TT·g acts at every bias, in reverse and at 0 V too, where a leaky junction's conductance at high
        // temperature makes it a visible share of C; the data decide through the BIC. Without forward-bias points,
        // g must come from fitted DC parameters, or TT would only measure the defaults
        boolean forward = block.points().stream().anyMatch(pt -> pt.voltage() > 0);
        return forward || p.isGiven(Param.IS) ? null
                : "no forward-bias points and no fitted DC parameters to give the conductance in TT·g";
    }

    /**
     * Least-squares TT from the excess over the depletion law, TT = sum(w e g)/sum(w g^2) over every point (TT·g
     * acts at every bias, with g from the DC parameters as ngspice computes it): first over the start card
     * (fitted to the reverse-bias points nearest TNOM, so the excess a depletion-only fit has not yet absorbed
     * elsewhere shows), else over the current fit. NaN when neither shows a positive excess.
     */
    private double diffusionStart(CapacitanceBlock block, DiodeParameters startCard, DiodeParameters current) {
        for (DiodeParameters p : List.of(startCard, current)) {
            double[] model = block.capacitances(p);
            Map<Double, DiodeAtTemperature> at = new TreeMap<>();
            double num = 0;
            double den = 0;
            List<CapacitancePoint> pts = block.points();
            for (int i = 0; i < pts.size(); i++) {
                CapacitancePoint pt = pts.get(i);
                DiodeAtTemperature d = at.computeIfAbsent(pt.temperature(), t -> TemperatureLaws.at(p, t, settings.options()));
                double g = JunctionCurrent.reportedConductance(d, JunctionCapacitance.junctionVoltage(d, pt.voltage()));
                double excess = pt.capacitance() - block.strayCapacitance() - model[i];
                double w = 1 / (pt.sigma() * pt.sigma());
                num += w * excess * g;
                den += w * g * g;
            }
            double tt = p.get(Param.TT) + num / den;
            if (den > 0 && tt > 0) {
                return tt;
            }
        }
        return Double.NaN;
    }

    private void putStart(Map<Param, Double> start, Param p, double value) {
        ParameterRule r = settings.rule(p);
        start.put(p, r != null && Double.isFinite(r.value()) ? r.value() : value);
    }

    private double clampInto(Param p, double v) {
        double[] b = bounds(p);
        return Math.min(b[1], Math.max(b[0], v));
    }

    private double[] bounds(Param p) {
        double[] d = defaultBounds(p);
        ParameterRule r = settings.rule(p);
        if (r != null && r.kind() == ParameterRule.Kind.BOUNDED) {
            return new double[] {Math.max(r.lower(), d[0]), Math.min(r.upper(), d[1])};
        }
        return d;
    }

    /**
     * Physical limits of the capacitance parameters. M stops at 0.9, where ngspice 39 clamps it with a warning;
     * FC at 0.95, the largest value in use in SPICE models (common practice, no source).
     */
    static double[] defaultBounds(Param p) {
        return switch (p) {
            case CJO -> new double[] {1e-18, 1e-6};
            case VJ -> new double[] {CapacitanceStart.LOWEST_POTENTIAL, CapacitanceStart.HIGHEST_POTENTIAL};
            case M -> new double[] {0.01, Ngspice39.GRADING_MAX};
            case FC -> new double[] {0.01, 0.95};
            case TT -> new double[] {1e-15, 1e-2};
            default -> ForwardExtraction.defaultBounds(p);
        };
    }

    private Optimiser.Run run(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free) {
        return Optimiser.run(blocks, start, free, this::bounds);
    }

    private static double bic(double rss, int n, int k) {
        return n * Math.log(Math.max(rss / n, RESIDUAL_FLOOR_SQUARED)) + k * Math.log(n);
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }

    private CapacitanceFit summarise(CapacitanceBlock block, Optimiser.Run best,
                                     Map<Double, List<CapacitancePoint>> byT, List<TermDecision> decisions,
                                     List<String> warnings, Map<Param, Double> initial) {
        FreeParameters layout = best.layout();
        JointProblem model = new JointProblem(List.of(block), layout);
        int n = model.rows();
        int k = layout.size();
        int dof = n - k;
        double chi2 = best.rss();
        double reduced = dof > 0 ? chi2 / dof : Double.NaN;
        DiodeParameters p = best.parameters();

        Uncertainty u = Uncertainty.of(model, best, reduced);
        double[] se = u.standardErrors();
        double[][] corr = u.correlations();
        if (u.singular()) {
            warnings.add("the capacitance parameters are not all independent for this data (the curvature matrix "
                    + "is singular); standard errors are not available");
        }

        List<FittedParameter> fitted = new ArrayList<>();
        for (Param q : List.of(Param.CJO, Param.VJ, Param.M, Param.FC, Param.TT)) {
            if (!p.isGiven(q)) {
                continue;
            }
            int idx = layout.free().indexOf(q);
            ParameterRule rule = settings.rule(q);
            FittedParameter.Origin origin = idx >= 0 ? FittedParameter.Origin.FITTED
                    : rule != null && rule.kind() == ParameterRule.Kind.FIXED
                    ? FittedParameter.Origin.FIXED_BY_USER : FittedParameter.Origin.PRESET;
            fitted.add(new FittedParameter(q, p.get(q), idx >= 0 ? se[idx] : Double.NaN, origin,
                    idx >= 0 ? initial.getOrDefault(q, Double.NaN) : Double.NaN));
            if (idx < 0) {
                continue;
            }
            double rel = se[idx] / Math.abs(p.get(q));
            if (layout.isLog(idx) ? rel > 1.0 : rel > 0.5) {
                warnings.add(String.format(Locale.ROOT,
                        "%s is not determined by this C-V data: %s +/- %s; pin it (%s=value) or measure over a wider bias range",
                        q, num(p.get(q)), num(se[idx]), q));
            }
            if (layout.atBound(idx, best.x()[idx])) {
                double[] b = bounds(q);
                warnings.add(String.format(Locale.ROOT,
                        "%s stopped at its bound (%s .. %s): the data pull it further than the model allows",
                        q, num(b[0]), num(b[1])));
            }
        }
        u.addCorrelationWarnings(layout, warnings);
        List<Double> checkTemperatures = new ArrayList<>(byT.keySet());
        checkTemperatures.add(Ngspice39.REFERENCE_TEMPERATURE);
        for (double t : checkTemperatures) {
            if (TemperatureLaws.at(p, t, settings.options()).potentialClamped()) {
                warnings.add(String.format(Locale.ROOT,
                        "FC·VJ(T) exceeds 1 V at %.2f degC: ngspice limits VJ(T) to 1/FC there and warns", t
                                - Ngspice39.CELSIUS_TO_KELVIN));
            }
        }

        List<CapacitanceResiduals> residuals = block.statistics(p);
        return new CapacitanceFit(p, fitted, new Correlations(layout.free(), corr), chi2, reduced, n, dof,
                best.evaluations(), best.iterations(), best.stopReason(), residuals, decisions, warnings, options);
    }
}
