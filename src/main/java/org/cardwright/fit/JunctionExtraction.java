package org.cardwright.fit;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.TemperatureLaws;

/**
 * The whole junction in one fit: forward I-V, reverse breakdown, C-V and reverse-recovery records together.
 *
 * <p>Each data kind first gets its own stage with the others held (forward: {@link ForwardExtraction};
 * breakdown: closed-form start from {@link ReverseAnalysis}, then BV, NBV and TCV; C-V:
 * {@link CapacitanceExtraction}; recovery: the charge-control relation, linear in TT). Then one joint
 * Levenberg-Marquardt fit moves every free parameter against every residual at once, each residual divided by
 * its own measurement uncertainty, so that shared parameters (VJ and M in both the recombination current and
 * the capacitance; IS in forward current and in the breakdown knee) serve all the data.
 */
public final class JunctionExtraction {
    /** Fewest breakdown points for a breakdown fit. */
    static final int MIN_BREAKDOWN_POINTS = 3;
    /** Measured leakage this many times the model's is reported [1]. */
    static final double LEAKAGE_EXCESS = 10;

    private final FitSettings settings;
    private final CapacitanceOptions capacitanceOptions;

    public JunctionExtraction(FitSettings settings, CapacitanceOptions capacitanceOptions) {
        this.settings = settings;
        this.capacitanceOptions = capacitanceOptions;
    }

    /**
     * Fits everything in {@code data}.
     *
     * @throws FitInputException when the data cannot support a fit (the message names file, line and value)
     */
    public FitResult fit(ExtractionData data) throws FitInputException {
        if (data.isEmpty()) {
            throw new FitInputException("no data to fit");
        }
        ForwardExtraction forward = new ForwardExtraction(settings);
        List<ResidualBlock> blocks = new ArrayList<>();
        List<TermDecision> decisions = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        List<String> stagePlausibility = new ArrayList<>();
        Set<Param> free = new LinkedHashSet<>();
        Map<Param, Double> start = new EnumMap<>(Param.class);
        DiodeParameters params;
        Optimiser.Run lastRun = null;
        ShuntTerm shunt = null;
        ShuntResistance shuntResult = null;

        if (!data.forward().isEmpty()) {
            // VJ and M of the recombination factor are the depletion VJ and M: with C-V data the forward stage
            // starts from the C-V data's values rather than the defaults (the joint fit then refines them)
            Map<Param, Double> factor = data.capacitance().isEmpty() ? Map.of()
                    : new CapacitanceExtraction(settings, capacitanceOptions).depletionStart(data.capacitance());
            ForwardExtraction.Stage st = forward.stage(data.forward(), !data.capacitance().isEmpty(), factor);
            if (settings.selfHeating() == FitSettings.SelfHeatingRemedy.EXCLUDE && st.run().parameters().isGiven(Param.RTH0)) {
                // the remedy the user chose: leave out the heated points and fit the rest without RTH0
                DiodeParameters heated = st.run().parameters();
                List<FitPoint> kept = new ArrayList<>();
                List<String> dropped = new ArrayList<>();
                DiodeParameters isothermal = heated.without(Param.RTH0);
                for (FitPoint pt : data.forward()) {
                    double rise = org.cardwright.model.SelfHeating.riseAtCurrent(heated, pt.temperature(), pt.current(), settings.options());
                    double shift = org.cardwright.model.SelfHeating.voltageAtCurrent(heated, pt.temperature(), pt.current(), settings.options())
                            - org.cardwright.model.SelfHeating.voltageAtCurrent(isothermal, pt.temperature(), pt.current(), settings.options());
                    if (Math.abs(shift) > FitSettings.SelfHeatingRemedy.EXCLUDE_SHIFT) {
                        dropped.add(String.format(Locale.ROOT, "%s (%.2f K, %+.2f mV)", pt.where(), rise, shift * 1e3));
                    } else {
                        kept.add(pt);
                    }
                }
                warnings.add(String.format(Locale.ROOT,
                        "self-heating: %d forward points left out because warming moved their voltage by more than %.1f mV (RTH0 %s K/W): %s",
                        dropped.size(), FitSettings.SelfHeatingRemedy.EXCLUDE_SHIFT * 1e3, num(heated.get(Param.RTH0)), String.join(", ", dropped)));
                List<ParameterRule> rules = new ArrayList<>(settings.rules().values());
                rules.add(new ParameterRule(Param.RTH0, ParameterRule.Kind.OFF, Double.NaN,
                        Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
                FitSettings cooler = settings.withRules(rules).withSelfHeating(FitSettings.SelfHeatingRemedy.FIT);
                ExtractionData rest = new ExtractionData(kept, data.reverse(), data.capacitance(), data.recovery());
                FitResult r = new JunctionExtraction(cooler, capacitanceOptions).fit(rest);
                List<String> all = new ArrayList<>(warnings);
                all.addAll(r.warnings());
                return new FitResult(r.parameters(), r.fitted(), r.correlations(), r.chiSquare(), r.reducedChiSquare(),
                        r.points(), r.degreesOfFreedom(), r.evaluations(), r.iterations(), r.stopReason(), r.residuals(),
                        r.otherResiduals(), r.terms(), all, r.shunt());
            }
            // the stage's plausibility warnings judge its own parameters; the final ones are judged again below
            forward.plausibility(st.run().parameters(), stagePlausibility);
            // a resistor between the terminals (surface leakage, a cell's shunt) is decided like the optional terms
            shunt = ShuntTerm.consider(settings, forward, st, data.forward(), ReverseAnalysis.split(data.reverse()).leakage());
            st = shunt.stage();
            blocks.addAll(st.blocks());
            decisions.addAll(st.decisions());
            decisions.add(shunt.decision());
            warnings.addAll(st.warnings());
            warnings.removeAll(stagePlausibility);
            start.putAll(st.start());
            free.addAll(st.run().layout().free());
            params = st.run().parameters();
            lastRun = st.run();
        } else {
            params = DiodeParameters.defaults().with(Param.TNOM, settings.nominalTemperature());
            for (ParameterRule r : settings.rules().values()) {
                if (r.kind() == ParameterRule.Kind.FIXED) {
                    params = params.with(r.param(), r.value());
                }
            }
            warnings.add("no forward I-V data: IS, N and RS keep their " + (settings.rules().isEmpty() ? "defaults" : "given values")
                    + ", and the card describes only what the other data determine");
        }

        // ---- reverse: breakdown fit and leakage check ----------------------------------------------------
        ReverseAnalysis.Split split = ReverseAnalysis.split(data.reverse(), settings.sweepGap());
        ParameterRule bvRule = settings.rule(Param.BV);
        boolean bvOff = bvRule != null && bvRule.kind() == ParameterRule.Kind.OFF;
        if (!data.reverse().isEmpty() && split.breakdown().size() < MIN_BREAKDOWN_POINTS && !bvOff) {
            ReversePoint deepest = data.reverse().stream()
                    .min(java.util.Comparator.comparingDouble(ReversePoint::current)).orElseThrow();
            warnings.add(String.format(Locale.ROOT,
                    "%s: the reverse data never reach breakdown (largest current %s A at %s V; the current must rise faster than |V|^%.0f); BV is not fitted",
                    deepest.where(), num(-deepest.current()), num(deepest.voltage()), ReverseAnalysis.BREAKDOWN_EXPONENT));
        }
        if (split.breakdown().size() >= MIN_BREAKDOWN_POINTS && !bvOff) {
            long temps = org.cardwright.model.SweepTemperatures.group(split.breakdown(), ReversePoint::temperature,
                    settings.sweepGap()).size();
            boolean tempco = temps >= 2 && isVariable(Param.TCV);
            double[] s = ReverseAnalysis.start(split.breakdown(), params.get(Param.RS), settings.nominalTemperature(), tempco,
                    settings.sweepGap());
            params = put(params, start, Param.BV, s[0]);
            params = put(params, start, Param.NBV, s[1]);
            params = put(params, start, Param.IBV, s[2]);
            List<Param> stageFree = new ArrayList<>();
            for (Param p : List.of(Param.BV, Param.NBV)) {
                if (isVariable(p)) {
                    stageFree.add(p);
                }
            }
            if (tempco) {
                params = put(params, start, Param.TCV, s[3]);
                stageFree.add(Param.TCV);
            } else if (temps >= 2) {
                warnings.add("TCV held by your rule although breakdown was measured at " + temps + " temperatures");
            }
            if (isFreedByUser(Param.IBV)) {
                stageFree.add(Param.IBV);
                warnings.add("IBV was set free: with BV free as well the two are nearly interchangeable (the data fix the voltage at a current, not both); expect a strong correlation");
            }
            BreakdownBlock block = new BreakdownBlock(split.breakdown(), settings.options());
            Optimiser.Run run = Optimiser.run(List.of(block), params, stageFree, forward::bounds);
            String ibvNote = String.format(Locale.ROOT, "IBV held at %s A, where the data lie", num(run.parameters().get(Param.IBV)));
            if (settings.rule(Param.IBV) == null && isVariable(Param.BV)) {
                IbvDecision d = decideIbv(block, run, stageFree, forward);
                ibvNote = d.note();
                if (d.run() != null) {
                    run = d.run();
                    stageFree.add(Param.IBV);
                }
            }
            params = run.parameters();
            // the readings scatter more than their stated sigma (a jittery meter on a near-vertical knee): the
            // breakdown points are weighted by their own scatter in the joint fit (sigma scaled by the Birge ratio
            // sqrt(chi2/dof), R. T. Birge, Phys. Rev. 40 (1932) 207-227), so that they cannot pull the parameters
            // shared with the forward data (RS) by more than their real uncertainty allows
            int dof = split.breakdown().size() - stageFree.size();
            double birge = dof > 0 ? Math.sqrt(run.rss() / dof) : 1;
            if (birge > BIRGE_LIMIT) {
                List<ReversePoint> scaled = new ArrayList<>();
                for (ReversePoint q : split.breakdown()) {
                    scaled.add(new ReversePoint(q.voltage(), q.current(), q.temperature(), q.sigma() * birge, q.source(), q.line()));
                }
                block = new BreakdownBlock(scaled, settings.options());
            }
            blocks.add(block);
            free.addAll(stageFree);
            decisions.add(new TermDecision("breakdown", List.of(Param.BV, Param.IBV, Param.NBV), true, Double.NaN,
                    String.format(Locale.ROOT, "%d points in breakdown at %d temperature(s); %s",
                            split.breakdown().size(), temps, ibvNote)));
        }

        if (settings.kind().expectsBreakdown() && !decisions.stream().anyMatch(d -> d.term().equals("breakdown") && d.included())) {
            warnings.add("the device kind is " + settings.kind().description()
                    + ", but no reverse data reach breakdown: the card carries no BV");
        }
        if (settings.kind() == DeviceKind.LED && !free.contains(Param.EG) && settings.rule(Param.EG) == null) {
            warnings.add(String.format(Locale.ROOT,
                    "EG held at the LED preset %.2f eV; set it from the emission wavelength, EG = 1239.84/lambda[nm] eV (--set EG=...)",
                    params.get(Param.EG)));
        }

        // ---- C-V ----------------------------------------------------------------------------------------------
        if (!data.capacitance().isEmpty() && !data.recovery().isEmpty() && isVariable(Param.TT)) {
            // recovery records give TT directly; the C-V stage then evaluates TT·g with it at every bias
            params = put(params, start, Param.TT, RecoveryBlock.closedForm(data.recovery()));
        }
        if (!data.capacitance().isEmpty()) {
            CapacitanceFit cf = new CapacitanceExtraction(settings, capacitanceOptions).fit(data.capacitance(), params);
            for (FittedParameter fp : cf.fitted()) {
                if (fp.fitted()) {
                    params = put(params, start, fp.param(), fp.value());
                    free.add(fp.param());
                }
            }
            warnings.addAll(cf.warnings());
            decisions.addAll(cf.terms());
            blocks.add(new CapacitanceBlock(data.capacitance(), capacitanceOptions.strayCapacitance(),
                    capacitanceOptions.frequency(), settings.options()));
        }

        // ---- recovery ---------------------------------------------------------------------------------------
        if (!data.recovery().isEmpty()) {
            RecoveryBlock block = new RecoveryBlock(data.recovery());
            if (isVariable(Param.TT)) {
                double tt = RecoveryBlock.closedForm(data.recovery());
                params = put(params, start, Param.TT, tt);
                free.add(Param.TT);
            }
            blocks.add(block);
        }

        // ---- the joint fit ------------------------------------------------------------------------------------
        Optimiser.Run joint;
        if (shunt != null && shunt.included()) {
            ShuntTerm.Joint j = ShuntTerm.fit(blocks, params, new ArrayList<>(free), forward::bounds, shunt.conductance());
            joint = j.run();
            blocks = ShuntTerm.atShunt(blocks, j.conductance());
            shuntResult = new ShuntResistance(1 / j.conductance(), j.resistanceError());
        } else if (blocks.size() == 1 && lastRun != null) {
            joint = lastRun;
        } else {
            joint = Optimiser.run(blocks, params, new ArrayList<>(free), forward::bounds);
        }
        leakageCheck(split.leakage(), joint.parameters(), shuntResult == null ? 0 : shuntResult.conductance(), warnings);
        for (ParameterRule r : settings.rules().values()) {
            boolean varies = r.kind() == ParameterRule.Kind.FREE || r.kind() == ParameterRule.Kind.BOUNDED;
            if (varies && !joint.layout().free().contains(r.param())) {
                warnings.add(String.format(Locale.ROOT,
                        "your rule %s had no effect: none of the data given determine %s, so it was not fitted",
                        r.text(), r.param()));
            }
        }
        if (!data.forward().isEmpty()) {
            // judged on the parameters written (after the shunt is taken out and the joint fit), not the stage's
            forward.plausibility(joint.parameters(), warnings);
        }
        selfHeatingNote(data.forward(), joint.parameters(), warnings);
        FitResult result = ResultAssembly.assemble(settings, blocks, joint, data.forward(), decisions, warnings, start, forward::bounds);
        return shuntResult == null ? result : result.withShunt(shuntResult);
    }

    /** Whether the data determine IBV: the run with IBV free (null when held) and the note for the decision. */
    record IbvDecision(Optimiser.Run run, String note) {
    }

    /** Breakdown readings scattering by more than this multiple of their stated sigma are reweighted [1]. */
    private static final double BIRGE_LIMIT = 1.5;
    /** Decades on either side of the chosen IBV from which the free-IBV trial starts (1 decade apart). */
    private static final int IBV_START_DECADES = 3;

    /**
     * IBV as a term the data may determine, by the criterion of the other terms. At one temperature, or wherever
     * ngspice's knee iteration runs (IBV above IS(T)·BV/Vt), the breakdown current is IBV·exp((|V| - BV(T))/(NBV
     * Vt)) and BV and IBV trade off exactly; where IS(T) reaches IBV·Vt/BV (a leaky junction at its top temperature)
     * the knee is not adjusted and the current follows IS(T) instead, so across temperatures the data fix IBV.
     * The stage is refitted with IBV free from starts a decade apart around the chosen value (the knee condition
     * makes the residuals kinked in IBV, so one start is not enough), and the best run by the sum of squares goes
     * in only if it lowers the BIC of the breakdown residuals by more than {@link ForwardExtraction#BIC_THRESHOLD}
     * (Schwarz, Ann. Statist. 6 (1978) 461-464; Kass &amp; Raftery, J. Am. Stat. Assoc. 90 (1995) 773-795).
     * Where the trial can only confirm the held run ({@link #tradesOffExactly}: every breakdown point at one
     * temperature) it is not run, and the decision is the one it would reach.
     */
    private IbvDecision decideIbv(BreakdownBlock block, Optimiser.Run held, List<Param> stageFree, ForwardExtraction forward) {
        if (tradesOffExactly(block, held, forward::bounds, settings.options())) {
            return heldByTradeOff(block, held);
        }
        return ibvTrial(block, held, stageFree, forward);
    }

    /** How far every breakdown current must exceed what the reverse region below the knee carries [1]. */
    static final double BREAKDOWN_CURRENT_MARGIN = 100;

    /**
     * True when freeing IBV cannot lower the breakdown stage's sum of squares, so that the trial of
     * {@link #ibvTrial} would only confirm the held run. That is so when every breakdown point was measured at one
     * and the same temperature: there the model sees BV and IBV only through the effective breakdown voltage of the
     * knee adjustment (and BV(T) through it), and the junction voltage at a breakdown current, -(BV_eff + NBV Vt
     * ln(|I|/IS(T))) with IKR's and GMIN's small corrections, is linear in BV_eff and NBV: the stage is a linear
     * least-squares problem in them with one minimum. A held run whose BV converged strictly inside its bounds has
     * reached that minimum (its gradient in BV, and so in BV_eff, is zero), and no choice of IBV reaches a lower one.
     * The argument needs every breakdown point in the breakdown branch whatever BV_eff is, that is each |I| far above
     * what the reverse region below the knee can carry (IS(T) times at most 1 + e^-3, plus GMIN |V|): at least
     * {@link #BREAKDOWN_CURRENT_MARGIN} times that. A leaky junction near its knee, a BV at a bound, or points at two
     * temperatures (or a logger's wander of a tenth of a kelvin) run the trial.
     */
    static boolean tradesOffExactly(BreakdownBlock block, Optimiser.Run held,
                                    java.util.function.Function<Param, double[]> bounds,
                                    org.cardwright.model.SimulatorOptions options) {
        List<ReversePoint> points = block.points();
        double t = points.get(0).temperature();
        for (ReversePoint r : points) {
            if (Double.compare(r.temperature(), t) != 0) {
                return false;
            }
        }
        DiodeParameters p = held.parameters();
        double bv = p.get(Param.BV);
        double[] b = bounds.apply(Param.BV);
        if (!(bv > b[0] && bv < b[1])) {
            return false;
        }
        DiodeAtTemperature d = TemperatureLaws.at(p, t, options);
        double belowKnee = d.saturationCurrent() * (1 + Math.exp(-3));
        for (ReversePoint r : points) {
            double carried = belowKnee + d.gmin() * Math.abs(r.voltage());
            if (!(Math.abs(r.current()) >= BREAKDOWN_CURRENT_MARGIN * carried)) {
                return false;
            }
        }
        return true;
    }

    /**
     * The held decision where IBV trades off exactly ({@link #tradesOffExactly}): the sum of squares with IBV free
     * is the held one, so the BIC changes by the penalty of one more parameter alone (the note of
     * {@link #ibvTrial}).
     */
    static IbvDecision heldByTradeOff(BreakdownBlock block, Optimiser.Run held) {
        int n = block.size();
        double chosen = held.parameters().get(Param.IBV);
        double bicHeld = ForwardExtraction.bic(held.rss(), n, held.layout().size());
        double delta = ForwardExtraction.bic(held.rss(), n, held.layout().size() + 1) - bicHeld;
        return new IbvDecision(null, heldNote(chosen, delta));
    }

    private static String heldNote(double chosen, double delta) {
        return String.format(Locale.ROOT, "IBV held at %s A, where the data lie (freeing it changed BIC by %+.1f; needs below -%.0f)",
                num(chosen), delta, ForwardExtraction.BIC_THRESHOLD);
    }

    /** The stage refitted with IBV free from starts a decade apart, and the decision by BIC (see {@link #decideIbv}). */
    static IbvDecision ibvTrial(BreakdownBlock block, Optimiser.Run held, List<Param> stageFree, ForwardExtraction forward) {
        int n = block.size();
        double chosen = held.parameters().get(Param.IBV);
        double bicHeld = ForwardExtraction.bic(held.rss(), n, held.layout().size());
        List<Param> f = new ArrayList<>(stageFree);
        f.add(Param.IBV);
        Optimiser.Run best = null;
        for (int k = -IBV_START_DECADES; k <= IBV_START_DECADES; k++) {
            try {
                Optimiser.Run r = Optimiser.run(List.of(block), Optimiser.with(held.parameters(), Param.IBV, chosen * Math.pow(10, k)),
                        f, forward::bounds);
                if (best == null || r.rss() < best.rss()) {
                    best = r;
                }
            } catch (FitFailedException e) {
                // a start that does not converge is not a candidate
            }
        }
        if (best == null) {
            return new IbvDecision(null, String.format(Locale.ROOT,
                    "IBV held at %s A, where the data lie (a fit with IBV free did not converge)", num(chosen)));
        }
        double delta = ForwardExtraction.bic(best.rss(), n, best.layout().size()) - bicHeld;
        if (delta < -ForwardExtraction.BIC_THRESHOLD) {
            return new IbvDecision(best, String.format(Locale.ROOT,
                    "IBV determined by the data across temperatures (%s A): BIC fell by %.1f (threshold %.0f)",
                    num(best.parameters().get(Param.IBV)), -delta, ForwardExtraction.BIC_THRESHOLD));
        }
        return new IbvDecision(null, heldNote(chosen, delta));
    }

    private DiodeParameters put(DiodeParameters p, Map<Param, Double> start, Param q, double value) {
        ParameterRule r = settings.rule(q);
        if (r != null && r.kind() == ParameterRule.Kind.OFF) {
            // switched off (by the user, or because the target dialect cannot carry it): not given at all
            return p.without(q);
        }
        double v = r != null && Double.isFinite(r.value()) ? r.value() : value;
        start.put(q, v);
        return p.with(q, v);
    }

    /** True unless the user fixed or switched off {@code p}. */
    private boolean isVariable(Param p) {
        ParameterRule r = settings.rule(p);
        return r == null || r.kind() == ParameterRule.Kind.FREE || r.kind() == ParameterRule.Kind.BOUNDED;
    }

    private boolean isFreedByUser(Param p) {
        ParameterRule r = settings.rule(p);
        return r != null && (r.kind() == ParameterRule.Kind.FREE || r.kind() == ParameterRule.Kind.BOUNDED);
    }

    /** Warns when measured leakage far exceeds what the card predicts (surface or shunt leakage). */
    private void leakageCheck(List<ReversePoint> leakage, DiodeParameters p, double shunt, List<String> warnings) {
        ReversePoint worst = null;
        double worstRatio = LEAKAGE_EXCESS;
        double worstModel = 0;
        for (ReversePoint r : leakage) {
            DiodeAtTemperature d = TemperatureLaws.at(p, r.temperature(), settings.options());
            if (r.voltage() > -3 * d.emissionCoefficient() * Ngspice39.thermalVoltage(r.temperature())) {
                continue;
            }
            double model = -JunctionCurrent.current(d, r.voltage()) - shunt * r.voltage();
            double ratio = -r.current() / model;
            if (ratio > worstRatio) {
                worstRatio = ratio;
                worst = r;
                worstModel = model;
            }
        }
        if (worst != null) {
            warnings.add(String.format(Locale.ROOT,
                    "%s: measured leakage %s A at %s V is %.0f times what the card predicts (%s A, IS plus GMIN%s): surface or shunt leakage that a level-1 card cannot carry",
                    worst.where(), num(-worst.current()), num(worst.voltage()), worstRatio, num(worstModel),
                    shunt > 0 ? " plus the fitted shunt resistor" : ""));
        }
    }

    /** Says how hot the junction ran when the card carries RTH0, and how to use the card. */
    private void selfHeatingNote(List<FitPoint> forward, DiodeParameters p, List<String> warnings) {
        if (!p.isGiven(Param.RTH0) || forward.isEmpty()) {
            return;
        }
        FitPoint hottest = null;
        double rise = 0;
        for (FitPoint pt : forward) {
            double r = org.cardwright.model.SelfHeating.riseAtCurrent(p, pt.temperature(), pt.current(), settings.options());
            if (r > rise) {
                rise = r;
                hottest = pt;
            }
        }
        warnings.add(0, String.format(Locale.ROOT,
                "self-heating: the junction ran %.1f K above the stated temperature at %s A (%s), RTH0 = %s K/W; "
                        + "the ngspice card carries RTH0, which acts only on an instance with a thermal node: D1 anode cathode tj NAME thermal. "
                        + "To fit without the heated points instead, pass --self-heating exclude. "
                        + "Caution: a part that warms itself this much is hot to the touch at those currents; let it cool before handling it",
                rise, num(hottest.current()), hottest.where(), num(p.get(Param.RTH0))));
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }
}
