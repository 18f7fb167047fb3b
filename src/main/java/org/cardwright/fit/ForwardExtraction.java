package org.cardwright.fit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.JunctionCurrent;
import org.cardwright.model.SelfHeating;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;

/**
 * Staged extraction of the forward DC parameters from I-V sweeps at one or more temperatures.
 *
 * <ol>
 *   <li>Closed-form start values per sweep ({@link StartValues}).</li>
 *   <li>One global Levenberg-Marquardt fit (Levenberg, Q. Appl. Math. 2 (1944) 164-168; Marquardt, J. SIAM 11
 *       (1963) 431-441; Apache Commons Math implementation after Moré, LNM 630 (1978)) of terminal-voltage
 *       residuals at the measured currents, across all temperatures at once: IS, N, RS, and EG and XTI where
 *       the temperatures determine them. IS, ISR and IKF vary as logarithms.</li>
 *   <li>Optional terms (recombination ISR and NR, high injection IKF, RS temperature coefficient TRS1) are
 *       added one at a time, best first, while the Bayesian information criterion
 *       BIC = n ln(RSS/n) + k ln n (Schwarz, "Estimating the dimension of a model", Ann. Statist. 6 (1978)
 *       461-464) falls by more than 10, "very strong" evidence on the scale of Kass &amp; Raftery, "Bayes
 *       factors", J. Am. Stat. Assoc. 90 (1995) 773-795. RSS/n is floored at (1e-3 sigma)^2 so that data
 *       without noise cannot reward a term for fitting rounding.</li>
 * </ol>
 */
public final class ForwardExtraction {
    /** A term enters the card only if it lowers BIC by more than this [1]. */
    public static final double BIC_THRESHOLD = 10;
    /** Mean squared weighted residual below which fits are indistinguishable [1]. */
    private static final double RESIDUAL_FLOOR_SQUARED = 1e-6;
    /** The widest sweep must span at least this much current [decades]. */
    public static final double MIN_DECADES = 2;
    /** Fewest forward points for a fit of IS, N and RS with a residual to spare. */
    public static final int MIN_POINTS = 5;
    /** Sweeps closer together than this in temperature count as one temperature for EG, XTI and TRS1 [K]. */
    public static final double DISTINCT_TEMPERATURE_STEP = 5;
    /** IKF may lie at most this many times above the largest measured current [1]. */
    public static final double KNEE_REACH = 10;
    /** Recombination must carry at least this share of the smallest measured current [1]. */
    public static final double RECOMBINATION_SHARE = 0.1;
    private final FitSettings settings;
    /**
     * Whether the optional terms' trials may stop once settled far from passing ({@link TermTrial}), and the multi-start
     * screen's runs once settled far from changing its test ({@link #screenRun}).
     */
    private final boolean settleTrials;

    public ForwardExtraction(FitSettings settings) {
        this(settings, true);
    }

    /**
     * With {@code settleTrials} false every trial and screening run goes to its full tolerance, as before
     * {@link TermTrial}: the path the shortcuts are checked against.
     */
    ForwardExtraction(FitSettings settings, boolean settleTrials) {
        this.settings = settings;
        this.settleTrials = settleTrials;
    }

    /** A candidate optional term. */
    private record Term(String name, List<Param> params) {
    }

    private static final Term RECOMBINATION = new Term("recombination current", List.of(Param.ISR, Param.NR));
    private static final Term HIGH_INJECTION = new Term("high injection", List.of(Param.IKF));
    private static final Term RS_TEMPCO = new Term("RS temperature coefficient", List.of(Param.TRS1));
    private static final Term SELF_HEATING = new Term("self-heating", List.of(Param.RTH0));
    /** Self-heating must warm the junction by at least this much at the top current to be observable [K]. */
    public static final double MIN_VISIBLE_RISE = 0.5;

    /**
     * Fits the forward parameters to {@code points}.
     *
     * @throws FitInputException when the data cannot support a fit (the message names file, line and value)
     */
    public FitResult fit(List<FitPoint> points) throws FitInputException {
        Stage st = stage(points);
        return ResultAssembly.assemble(settings, st.blocks(), st.run(), points, st.decisions(), st.warnings(),
                st.start(), this::bounds);
    }

    /** The forward stage's outcome, before assembly into a result. */
    record Stage(Optimiser.Run run, List<ResidualBlock> blocks, List<TermDecision> decisions, List<String> warnings,
                 Map<Param, Double> start) {
    }

    /** Runs the forward stages (start values, global fit, term selection), with no C-V data to follow. */
    Stage stage(List<FitPoint> points) throws FitInputException {
        return stage(points, false);
    }

    /**
     * Runs the forward stages (start values, global fit, term selection).
     *
     * @param capacitanceFollows true when C-V data will be fitted jointly, so that VJ and M of the recombination
     *                           factor come from them rather than from the forward data alone
     */
    Stage stage(List<FitPoint> points, boolean capacitanceFollows) throws FitInputException {
        return stage(points, capacitanceFollows, Map.of());
    }

    /**
     * Runs the forward stages with some parameters held at values known from other data ({@code held}: VJ and M
     * of the recombination factor from the C-V data); a user rule for the same parameter wins.
     */
    Stage stage(List<FitPoint> points, boolean capacitanceFollows, Map<Param, Double> held) throws FitInputException {
        Map<Double, List<FitPoint>> sweeps = checkInput(points);
        double tnom = settings.nominalTemperature();
        List<String> warnings = new ArrayList<>();
        List<TermDecision> decisions = new ArrayList<>();

        // ---- stage 1: closed-form start values -------------------------------------------------------
        List<FitPoint> reference = referenceSweep(sweeps, tnom);
        StartValues.Shockley sh = StartValues.shockley(reference);
        double n0 = ruleValue(Param.N, sh.emission());
        double tRef = reference.get(0).temperature();
        int nTemps = sweeps.size();
        // temperatures closer than this count as one for what they can determine: a 25.0 and a 25.3 degC sweep
        // cannot separate EG from IS (common practice, no source)
        int distinctTemps = distinctTemperatures(sweeps.keySet(), DISTINCT_TEMPERATURE_STEP);

        boolean egFree = freeByData(Param.EG, distinctTemps >= 2, warnings,
                "EG held at " + settings.kind().activationEnergy() + " eV (" + settings.kind().description()
                        + "): a single temperature (or sweeps less than 5 K apart) cannot determine it");
        boolean xtiFree = freeByData(Param.XTI, distinctTemps >= 3, warnings,
                "XTI held at " + settings.kind().temperatureExponent() + " (" + settings.kind().description()
                        + "): separating XTI from EG needs three or more temperatures at least 5 K apart");
        double eg = ruleValue(Param.EG, settings.kind().activationEnergy());
        double xti = ruleValue(Param.XTI, settings.kind().temperatureExponent());
        double isNom;
        if (egFree && nTemps >= 2) {
            double[] temps = new double[nTemps];
            double[] sats = new double[nTemps];
            int k = 0;
            for (List<FitPoint> s : sweeps.values()) {
                temps[k] = s.get(0).temperature();
                sats[k] = StartValues.saturationCurrentAt(s, n0, sh.lowCurrent(), sh.highCurrent());
                k++;
            }
            double[] r = StartValues.activationEnergy(temps, sats, n0, xti, tnom);
            isNom = r[0];
            if (r[1] > 0.1 && r[1] < 5) {
                eg = r[1];
            }
            isNom = StartValues.toNominal(
                    StartValues.saturationCurrentAt(reference, n0, sh.lowCurrent(), sh.highCurrent()),
                    tRef, tnom, n0, eg, xti);
        } else {
            isNom = StartValues.toNominal(sh.saturationCurrent(), tRef, tnom, n0, eg, xti);
        }
        double rs = Math.max(StartValues.seriesResistance(reference, sh), 1e-6);

        EnumMap<Param, Double> start = new EnumMap<>(Param.class);
        start.put(Param.IS, isNom);
        start.put(Param.N, n0);
        start.put(Param.RS, rs);
        start.put(Param.EG, eg);
        start.put(Param.XTI, xti);
        start.put(Param.TNOM, tnom);
        for (ParameterRule r : settings.rules().values()) {
            if (r.kind() == ParameterRule.Kind.FIXED || (r.kind() == ParameterRule.Kind.FREE && !Double.isNaN(r.value()))) {
                start.put(r.param(), r.value());
            }
        }
        held.forEach((p, v) -> {
            if (settings.rule(p) == null) {
                start.put(p, v);
            }
        });
        // terms the user forced on start from their closed-form values
        List<Param> free = new ArrayList<>();
        for (Param p : List.of(Param.IS, Param.N, Param.RS)) {
            if (isFree(p)) {
                free.add(p);
            }
        }
        if (egFree) {
            free.add(Param.EG);
        }
        if (xtiFree) {
            free.add(Param.XTI);
        }
        List<Term> candidates = new ArrayList<>();
        for (Term term : List.of(RECOMBINATION, HIGH_INJECTION, RS_TEMPCO, SELF_HEATING)) {
            Param key = term.params().get(0);
            ParameterRule rule = settings.rule(key);
            if (rule != null && rule.kind() == ParameterRule.Kind.OFF) {
                decisions.add(new TermDecision(term.name(), term.params(), false, Double.NaN, "switched off by the user"));
                continue;
            }
            boolean forced = rule != null;
            for (Param p : term.params()) {
                ParameterRule r = settings.rule(p);
                if (r != null && r.kind() != ParameterRule.Kind.OFF) {
                    forced = true;
                }
            }
            if (term == RS_TEMPCO && (distinctTemps < 2)) {
                if (forced) {
                    warnings.add("TRS1 was asked for but one temperature cannot determine it; held at 0");
                }
                decisions.add(new TermDecision(term.name(), term.params(), false, Double.NaN,
                        "needs sweeps at two or more temperatures"));
                continue;
            }
            if (forced) {
                termStart(term, start, reference, sh, tRef, tnom, eg, xti);
                for (Param p : term.params()) {
                    if (isFree(p)) {
                        free.add(p);
                    }
                }
                decisions.add(new TermDecision(term.name(), term.params(), true, Double.NaN, "set by the user"));
            } else {
                candidates.add(term);
            }
        }

        // ---- stage 2: global fit of the base model ------------------------------------------------------
        List<ResidualBlock> blocks = List.of(new ForwardBlock(points, settings.options()));
        ScreenOnce screened = new ScreenOnce();
        Optimiser.Run best;
        try {
            best = run(blocks, Optimiser.parameters(start), free);
        } catch (FitFailedException e) {
            if (!free.contains(Param.ISR) && !free.contains(Param.NR)) {
                throw e;
            }
            best = null;
        }
        if (free.contains(Param.ISR) || free.contains(Param.NR)) {
            // recombination forced on by a rule: the base fit already has both exponential terms
            best = multiStart(best, blocks, start, free, reference, screened);
            if (best == null) {
                throw new FitFailedException("the fit with the recombination term you asked for did not converge from any start");
            }
        }
        int n = points.size();
        double bestBic = bic(best.rss(), n, best.layout().size());

        // ---- stage 3: optional terms, best first, while BIC falls by more than the threshold --------------
        Map<Term, Double> lastDelta = new LinkedHashMap<>();
        Map<Term, String> unobservable = new LinkedHashMap<>();
        List<Term> accepted = new ArrayList<>();
        while (!candidates.isEmpty()) {
            Term chosen = null;
            Optimiser.Run chosenRun = null;
            double chosenBic = Double.POSITIVE_INFINITY;
            for (Term term : candidates) {
                if (term == SELF_HEATING && !unobservable.containsKey(term)) {
                    double bound = heatingScoreBound(points, best);
                    if (bound > -BIC_THRESHOLD) {
                        lastDelta.put(term, Double.NaN);
                        unobservable.put(term, String.format(Locale.ROOT,
                                "no sign of it in the residuals: at best BIC would change by %+.1f (score test; needs below -%.0f)", bound, BIC_THRESHOLD));
                        continue;
                    }
                }
                if (term == SELF_HEATING && unobservable.containsKey(term) && unobservable.get(term).startsWith("no sign")) {
                    continue;
                }
                EnumMap<Param, Double> trial = new EnumMap<>(Param.class);
                trial.putAll(best.parameters().givenValues());
                termStart(term, trial, reference, sh, tRef, tnom,
                        best.parameters().get(Param.EG), best.parameters().get(Param.XTI));
                List<Param> trialFree = new ArrayList<>(best.layout().free());
                trialFree.addAll(term.params());
                Optimiser.Run r;
                try {
                    // stopped early where the trial settles far from passing; a term it could take in runs to the end
                    r = settleTrials ? TermTrial.run(blocks, Optimiser.parameters(trial), trialFree, this::bounds, n, bestBic)
                            : run(blocks, Optimiser.parameters(trial), trialFree);
                } catch (FitFailedException e) {
                    // a trial term the data cannot carry (no convergence, parameters leaving the model's domain)
                    r = null;
                }
                if (term == RECOMBINATION) {
                    r = multiStart(r, blocks, trial, trialFree, reference, screened);
                }
                if (r == null) {
                    lastDelta.put(term, Double.NaN);
                    continue;
                }
                double b = bic(r.rss(), n, r.layout().size());
                lastDelta.put(term, b - bestBic);
                String outside = actsOutsideData(term, r.parameters(), points);
                if (outside != null) {
                    unobservable.put(term, outside);
                    continue;
                }
                unobservable.remove(term);
                if (b < chosenBic) {
                    chosenBic = b;
                    chosen = term;
                    chosenRun = r;
                }
            }
            if (chosen == null || chosenBic - bestBic > -BIC_THRESHOLD) {
                break;
            }
            decisions.add(new TermDecision(chosen.name(), chosen.params(), true, chosenBic - bestBic,
                    String.format(Locale.ROOT, "BIC fell by %.1f (threshold %.0f)", bestBic - chosenBic, BIC_THRESHOLD)));
            candidates.remove(chosen);
            accepted.add(chosen);
            best = chosenRun;
            bestBic = chosenBic;
        }
        // backward check: a term taken early (self-heating standing in for a knee not yet added, say) must still
        // earn its place once the others are in; one that no longer lowers BIC by the threshold is taken out
        // VJ and M of the recombination factor come last: a term taken as a stand-in for them (TRS1, say) is then
        // checked like the others
        Optimiser.Run beforeFactor = best;
        best = recombinationFactor(best, blocks, n, capacitanceFollows, decisions);
        boolean factorFreed = best != beforeFactor;
        if (factorFreed) {
            bestBic = bic(best.rss(), n, best.layout().size());
        }
        if (accepted.size() > 1 || (factorFreed && !accepted.isEmpty())) {
            // the last term taken was judged with every other one already in; the earlier ones need the check
            for (Term term : new ArrayList<>(accepted.subList(0, accepted.size() - (factorFreed ? 0 : 1)))) {
                if (factorFreed && term == RECOMBINATION) {
                    continue;
                }
                List<Param> without = new ArrayList<>(best.layout().free());
                without.removeAll(term.params());
                DiodeParameters reduced = best.parameters();
                for (Param p : term.params()) {
                    reduced = reduced.without(p);
                }
                Optimiser.Run r;
                try {
                    r = run(blocks, reduced, without);
                } catch (FitFailedException e) {
                    // a trial term the data cannot carry (no convergence, parameters leaving the model's domain)
                    continue;
                }
                double b = bic(r.rss(), n, r.layout().size());
                if (b - bestBic < BIC_THRESHOLD) {
                    accepted.remove(term);
                    for (int k = 0; k < decisions.size(); k++) {
                        if (decisions.get(k).term().equals(term.name())) {
                            decisions.set(k, new TermDecision(term.name(), term.params(), false, b - bestBic,
                                    String.format(Locale.ROOT,
                                            "taken out again once the other terms were in: without it BIC rises by only %+.1f (needs %.0f)",
                                            b - bestBic, BIC_THRESHOLD)));
                        }
                    }
                    best = r;
                    bestBic = b;
                }
            }
        }
        for (Term term : candidates) {
            double d = lastDelta.getOrDefault(term, Double.NaN);
            if (unobservable.containsKey(term)) {
                decisions.add(new TermDecision(term.name(), term.params(), false, d, unobservable.get(term)));
                continue;
            }
            decisions.add(new TermDecision(term.name(), term.params(), false, d,
                    Double.isNaN(d) ? "could not be fitted to this data"
                            : String.format(Locale.ROOT, "not warranted: BIC changed by %+.1f (needs below -%.0f)", d, BIC_THRESHOLD)));
        }

        plausibility(best.parameters(), warnings);
        return new Stage(best, blocks, decisions, warnings, start);
    }

    /**
     * Multi-start for the two exponential terms (IS, N and ISR, NR): a sum of two exponentials has a second
     * minimum where the terms trade places or share one region, so one start is not enough. The starts are the
     * start given ({@code trial}) and, for every ordered pair of the low-, mid- and high-current thirds of the
     * reference sweep, the main term from one third's Shockley line and the recombination term from another's
     * ({@link StartValues#regionalLines}), the swapped assignments included; these regional starts only when the thirds
     * follow different lines ({@link StartValues#regionalLinesDiffer} at {@link #REGION_TEST_LEVEL}): on one line every
     * pair start is that line split in two, a start the trial already stands for. Each is refined on the reference
     * sweep alone (EG and XTI held, which is cheap), the best of them by the sum of squared weighted residuals is
     * fitted on all the data, and of that run and {@code first} (the global run from {@code trial}) the one with
     * the smaller sum of squares is kept: the same criterion as every fit here. Returns null only when no start
     * converged.
     */
    private Optimiser.Run multiStart(Optimiser.Run first, List<ResidualBlock> blocks, Map<Param, Double> trial,
                                     List<Param> free, List<FitPoint> reference, ScreenOnce screened) {
        boolean firstCall = screened.trial == null;
        if (firstCall) {
            // the screen is made once per stage, from the first call's start (it is made lazily, but as then)
            screened.trial = new EnumMap<>(trial);
            screened.free = new ArrayList<>(free);
        }
        double refRss = Double.NaN;
        double refFloor = reference.size() * RESIDUAL_FLOOR_SQUARED;
        if (first != null) {
            double[] r = new ForwardBlock(reference, settings.options()).residuals(first.parameters());
            refRss = 0;
            for (double x : r) {
                refRss += x * x;
            }
            // at the residual floor on the reference sweep the test below passes whatever the screened starts
            // reach (their sum of squares is not negative), so they need not be run: the same result, sooner
            if (refRss <= refFloor) {
                return first;
            }
        }
        // a screened run may stop once settled at a sum of squares the factor-2 test below cannot be passed by
        // (infinite: none may, when there is no global run to keep)
        double stopAbove = first == null || !settleTrials ? Double.POSITIVE_INFINITY
                : SCREEN_MARGIN * Math.max(refRss - refFloor, 0) / 2;
        if (screened.screen != null && screened.screen.stoppedAt() < stopAbove) {
            // a run of it stopped where this call's test could still take it: made again, as then, for this one
            screened.screen = screenStarts(screened.trial, screened.free, reference, stopAbove);
        }
        if (screened.screen == null) {
            if (firstCall && first != null && onlyRepeats(first, blocks, trial, free, reference)) {
                // the screen would hold the trial start alone, refined as the global run already was (left unmade:
                // a later call from another start makes it as then)
                return first;
            }
            screened.screen = screenStarts(screened.trial, screened.free, reference, stopAbove);
        }
        Screen screen = screened.screen;
        if (screen.best() == null) {
            return first;
        }
        // the global run from the start given is already in the best basin when it fits the reference sweep
        // about as well as the best screened start does there: another basin shows as a multiple of the sum of
        // squares, the same basin within a factor of 2 (the global run also serves the other temperatures)
        if (first != null && refRss <= 2 * screen.rss() + refFloor) {
            return first;
        }
        DiodeParameters pick = screen.best();
        EnumMap<Param, Double> alt = new EnumMap<>(Param.class);
        alt.putAll(trial);
        for (Param p : TWO_TERMS) {
            if (free.contains(p) && pick.isGiven(p)) {
                alt.put(p, pick.get(p));
            }
        }
        Optimiser.Run second;
        try {
            second = run(blocks, Optimiser.parameters(alt), free);
        } catch (FitFailedException e) {
            return first;
        }
        return first == null || second.rss() < first.rss() ? second : first;
    }

    /**
     * Whether the screen of this first call would only repeat {@code first}: no regional starts
     * ({@link StartValues#regionalLinesDiffer}), so the trial start alone; the data are the reference sweep alone and
     * every free parameter is one the screen refines, so screening the trial start is the global run again on the same
     * points and parameters from the same start, stopped at the looser tolerance (a larger or equal sum of squares: the
     * test in {@link #multiStart} keeps {@code first}); and {@code first} has its terms in order (NR not below N), so
     * {@link #inOrder} would not swap them.
     */
    private boolean onlyRepeats(Optimiser.Run first, List<ResidualBlock> blocks, Map<Param, Double> trial, List<Param> free,
                                List<FitPoint> reference) {
        int rows = 0;
        for (ResidualBlock b : blocks) {
            rows += b.size();
        }
        DiodeParameters p = first.parameters();
        if (rows != reference.size() || !TWO_TERMS.containsAll(free) || !p.isGiven(Param.ISR) || p.get(Param.NR) < p.get(Param.N)) {
            return false;
        }
        return !StartValues.regionalLinesDiffer(reference, trial.getOrDefault(Param.RS, 0.0), REGION_TEST_LEVEL);
    }

    /** The decision's name for VJ and M in the recombination factor. */
    static final String RECOMBINATION_FACTOR = "recombination factor (VJ, M)";

    /**
     * VJ and M of the recombination current's factor ((1 - vd/VJ)^2 + 0.005)^(M/2) (diode-model.md section 4):
     * with C-V data they are the depletion VJ and M and come from those; otherwise, when the card carries the
     * recombination term, freeing both is tried on the forward data (from the values in the card, the ngspice
     * defaults unless a rule sets them) and kept only if BIC falls by more than {@value #BIC_THRESHOLD}, the
     * criterion of the other terms. Either way a decision says what was assumed.
     */
    private Optimiser.Run recombinationFactor(Optimiser.Run best, List<ResidualBlock> blocks, int n,
                                              boolean capacitanceFollows, List<TermDecision> decisions) {
        List<Param> params = List.of(Param.VJ, Param.M);
        DiodeParameters p = best.parameters();
        if (!p.isGiven(Param.ISR)) {
            return best;
        }
        if (settings.rule(Param.VJ) != null || settings.rule(Param.M) != null) {
            decisions.add(new TermDecision(RECOMBINATION_FACTOR, params, true, Double.NaN,
                    "VJ and M as your rules give them"));
            return best;
        }
        if (capacitanceFollows) {
            decisions.add(new TermDecision(RECOMBINATION_FACTOR, params, true, Double.NaN,
                    "VJ and M come from the C-V data, fitted jointly with the forward data"));
            return best;
        }
        String held = String.format(Locale.ROOT, "VJ = %.3g V and M = %.3g assumed (%s)", p.get(Param.VJ),
                p.get(Param.M), p.isGiven(Param.VJ) || p.isGiven(Param.M) ? "as given" : "the ngspice defaults");
        double bound = factorScoreBound(best, params, (ForwardBlock) blocks.get(0));
        if (bound > -BIC_THRESHOLD) {
            decisions.add(new TermDecision(RECOMBINATION_FACTOR, params, false, Double.NaN, String.format(Locale.ROOT,
                    "%s: no sign of them in the residuals, at best BIC would change by %+.1f (score test; needs below -%.0f)",
                    held, bound, BIC_THRESHOLD)));
            return best;
        }
        List<Param> f = new ArrayList<>(best.layout().free());
        f.addAll(params);
        Optimiser.Run r;
        try {
            r = run(blocks, p, f);
        } catch (FitFailedException e) {
            decisions.add(new TermDecision(RECOMBINATION_FACTOR, params, false, Double.NaN,
                    held + "; a fit with them free did not converge"));
            return best;
        }
        double delta = bic(r.rss(), n, r.layout().size()) - bic(best.rss(), n, best.layout().size());
        if (delta < -BIC_THRESHOLD) {
            decisions.add(new TermDecision(RECOMBINATION_FACTOR, params, true, delta, String.format(Locale.ROOT,
                    "fitted from the forward data (no C-V data): BIC fell by %.1f (threshold %.0f)", -delta, BIC_THRESHOLD)));
            return r;
        }
        decisions.add(new TermDecision(RECOMBINATION_FACTOR, params, false, delta, String.format(Locale.ROOT,
                "%s: freeing them changed BIC by %+.1f (needs below -%.0f); give C-V data to determine them",
                held, delta, BIC_THRESHOLD)));
        return best;
    }

    /**
     * Score (Lagrange-multiplier) test for freeing {@code extra} parameters, as for self-heating (Rao 1948): their
     * residual derivatives H (central differences) are made orthogonal to the Jacobian of the free parameters, and
     * r'H(H'H)^-1 H'r bounds, to first order, how much of the sum of squares freeing them could remove. Returns the
     * best change of BIC that allows.
     */
    private double factorScoreBound(Optimiser.Run best, List<Param> extra, ForwardBlock block) {
        DiodeParameters p = best.parameters();
        double[] r = block.residuals(p);
        int rows = r.length;
        double[][] h = new double[extra.size()][];
        for (int k = 0; k < extra.size(); k++) {
            Param q = extra.get(k);
            double v = p.get(q);
            double step = 1e-6 * Math.max(Math.abs(v), 1e-3);
            double[] up = block.residuals(p.with(q, v + step));
            double[] down = block.residuals(p.with(q, v - step));
            h[k] = new double[rows];
            for (int i = 0; i < rows; i++) {
                h[k][i] = (up[i] - down[i]) / (2 * step);
            }
        }
        double[][] j = block.jacobian(best.layout(), best.x());
        if (j.length > 0 && j[0].length > 0) {
            org.apache.commons.math3.linear.RealMatrix jm = new org.apache.commons.math3.linear.Array2DRowRealMatrix(j, false);
            org.apache.commons.math3.linear.DecompositionSolver solver =
                    new org.apache.commons.math3.linear.QRDecomposition(jm, 1e-14).getSolver();
            for (int k = 0; k < h.length; k++) {
                double[] c = solver.solve(new org.apache.commons.math3.linear.ArrayRealVector(h[k], false)).toArray();
                double[] fit = jm.operate(c);
                for (int i = 0; i < rows; i++) {
                    h[k][i] -= fit[i];
                }
            }
        }
        int m = h.length;
        double[][] hh = new double[m][m];
        double[] hr = new double[m];
        for (int a = 0; a < m; a++) {
            for (int i = 0; i < rows; i++) {
                hr[a] += h[a][i] * r[i];
            }
            for (int b = 0; b < m; b++) {
                for (int i = 0; i < rows; i++) {
                    hh[a][b] += h[a][i] * h[b][i];
                }
            }
        }
        double removable = 0;
        try {
            double[] z = new org.apache.commons.math3.linear.SingularValueDecomposition(
                    new org.apache.commons.math3.linear.Array2DRowRealMatrix(hh, false)).getSolver()
                    .solve(new org.apache.commons.math3.linear.ArrayRealVector(hr, false)).toArray();
            for (int a = 0; a < m; a++) {
                removable += hr[a] * z[a];
            }
        } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
            removable = best.rss();
        }
        double rss = best.rss();
        double reduced = Math.max(rss - Math.max(removable, 0), 0);
        return bic(reduced, rows, best.layout().size() + m) - bic(rss, rows, best.layout().size());
    }

    /**
     * Stopping tolerance of the screening fits: enough to tell one basin from another, at a fraction of the cost of
     * the final fit's 1e-13 [1].
     */
    private static final double SCREENING_TOLERANCE = 1e-6;

    /**
     * Size of the test that decides whether the regional lines differ ({@link StartValues#regionalLinesDiffer}): the
     * chance that a sweep of one line gets the regional starts anyway, a cost only; a small size would risk missing two
     * lines [1]. The conventional 5 % (common practice, no source).
     */
    static final double REGION_TEST_LEVEL = 0.05;

    /** The best start after screening (null when none converged) and its sum of squares on the reference sweep. */
    /** The screened starts of one stage, made at most once, from the first multi-start call's start. */
    private static final class ScreenOnce {
        private Map<Param, Double> trial;
        private List<Param> free;
        private Screen screen;
    }

    /**
     * The screen's best start and its sum of squares; {@code stoppedAt}: the least sum of squares at which one of its
     * runs stopped once settled ({@link #screenRun}), infinite when none did.
     */
    private record Screen(DiodeParameters best, double rss, double stoppedAt) {
    }

    /**
     * A screened run that has settled (an accepted step lowered its sum of squares by at most this share of it) at a
     * sum of squares where the factor-2 test keeps the global run with room to spare stops there [1].
     */
    static final double SCREEN_SETTLED = 1e-4;
    /**
     * The room: a settled run stops only at a sum of squares at least this multiple of the one that would make the
     * test take it, so that it would have to fall by a third more, at a pace of at most {@link #SCREEN_SETTLED} a
     * step, to change the outcome [1].
     */
    static final double SCREEN_MARGIN = 1.5;

    /**
     * One screening run ({@link #SCREENING_TOLERANCE}), stopped once settled at a sum of squares of at least
     * {@code stopAbove} ({@link TermTrial#run(List, DiodeParameters, List, java.util.function.Function, double, double,
     * java.util.function.DoublePredicate)}, the optimiser's run step for step until then). Such a run cannot be the best
     * start when the test takes one: that start's sum of squares lies below {@code stopAbove / SCREEN_MARGIN}.
     */
    private Optimiser.Run screenRun(List<ResidualBlock> one, DiodeParameters start, List<Param> local, double stopAbove) {
        if (stopAbove == Double.POSITIVE_INFINITY) {
            return Optimiser.run(one, start, local, this::bounds, SCREENING_TOLERANCE);
        }
        return TermTrial.run(one, start, local, this::bounds, SCREENING_TOLERANCE, SCREEN_SETTLED, rss -> rss >= stopAbove);
    }

    /** The parameters of the two exponential terms (and RS, which the regional lines share), as multi-started. */
    private static final List<Param> TWO_TERMS = List.of(Param.IS, Param.N, Param.ISR, Param.NR, Param.RS);

    /**
     * Refines every start of {@link #multiStart} on the reference sweep alone and returns the best, or null when
     * none converged.
     */
    private Screen screenStarts(Map<Param, Double> trial, List<Param> free, List<FitPoint> reference, double stopAbove) {
        double tRef = reference.get(0).temperature();
        double tnom = settings.nominalTemperature();
        double eg = trial.getOrDefault(Param.EG, settings.kind().activationEnergy());
        double xti = trial.getOrDefault(Param.XTI, settings.kind().temperatureExponent());
        double rs = trial.getOrDefault(Param.RS, 0.0);
        List<Map<Param, Double>> starts = new ArrayList<>();
        starts.add(trial);
        double[][] lines = StartValues.regionalLines(reference, rs);
        boolean distinct = StartValues.regionalLinesDiffer(reference, rs, REGION_TEST_LEVEL);
        for (int a = 0; a < 3 && distinct; a++) {
            for (int b = 0; b < 3; b++) {
                if (a == b || lines[a] == null || lines[b] == null) {
                    continue;
                }
                EnumMap<Param, Double> s = new EnumMap<>(Param.class);
                s.putAll(trial);
                putIfFree(s, free, Param.N, lines[a][1]);
                putIfFree(s, free, Param.IS, StartValues.toNominal(lines[a][0], tRef, tnom, s.get(Param.N), eg, xti));
                putIfFree(s, free, Param.NR, lines[b][1]);
                putIfFree(s, free, Param.ISR, StartValues.toNominal(lines[b][0], tRef, tnom, s.get(Param.NR), eg, xti));
                starts.add(s);
            }
        }
        List<Param> local = new ArrayList<>();
        for (Param p : TWO_TERMS) {
            if (free.contains(p)) {
                local.add(p);
            }
        }
        List<ResidualBlock> one = List.of(new ForwardBlock(reference, settings.options()));
        DiodeParameters best = null;
        double bestRss = Double.POSITIVE_INFINITY;
        double stoppedAt = Double.POSITIVE_INFINITY;
        for (Map<Param, Double> s : starts) {
            if (!s.containsKey(Param.ISR) || !s.containsKey(Param.NR)) {
                continue;
            }
            try {
                Optimiser.Run r = screenRun(one, Optimiser.parameters(s), local, stopAbove);
                if (r.stopReason().startsWith(TermTrial.SETTLED_STOP)) {
                    if (tradedPlaces(r.parameters(), local)) {
                        // its terms traded places: the swapped refinement starts from the run's end, so the run
                        // goes to that end, as without the stop
                        r = Optimiser.run(one, Optimiser.parameters(s), local, this::bounds, SCREENING_TOLERANCE);
                    } else {
                        stoppedAt = Math.min(stoppedAt, r.rss());
                    }
                }
                r = inOrder(r, one, local);
                if (r.rss() < bestRss) {
                    bestRss = r.rss();
                    best = r.parameters();
                }
            } catch (FitFailedException e) {
                // a start that does not converge is simply not a candidate
            }
        }
        return new Screen(best, bestRss, stoppedAt);
    }

    /**
     * A screened run whose two exponential terms traded places (NR below N: the recombination term carries the
     * high currents) is refined once more from the swapped values (IS with ISR, N with NR); the swapped run
     * replaces it when it converges with the terms in order, even at a larger sum of squares. The swap is not an
     * identity (IKF and the recombination factor f(VJ, M) act on one term only, and VJ and M are fitted only
     * later, from C-V data, see {@link #recombinationFactor}), hence the refinement. A traded pair always fails the
     * recombination term's own test (it must carry the smallest currents), so keeping it would drop the term for
     * certain; the ordered pair is still judged by BIC against the card without it.
     */
    private Optimiser.Run inOrder(Optimiser.Run r, List<ResidualBlock> one, List<Param> local) {
        DiodeParameters p = r.parameters();
        if (!tradedPlaces(p, local)) {
            return r;
        }
        DiodeParameters swapped = p.with(Param.IS, p.get(Param.ISR)).with(Param.ISR, p.get(Param.IS))
                .with(Param.N, p.get(Param.NR)).with(Param.NR, p.get(Param.N));
        try {
            Optimiser.Run s = Optimiser.run(one, swapped, local, this::bounds, SCREENING_TOLERANCE);
            if (s.parameters().isGiven(Param.ISR) && s.parameters().get(Param.NR) >= s.parameters().get(Param.N)) {
                return s;
            }
        } catch (FitFailedException e) {
            // the swapped start did not converge: the traded run stays
        }
        return r;
    }

    /** Whether {@link #inOrder} refines a screened run ending at {@code p} once more from the swapped values. */
    private static boolean tradedPlaces(DiodeParameters p, List<Param> local) {
        return p.isGiven(Param.ISR) && p.isGiven(Param.NR) && !(p.get(Param.NR) >= p.get(Param.N))
                && local.containsAll(List.of(Param.IS, Param.N, Param.ISR, Param.NR));
    }

    private static void putIfFree(Map<Param, Double> start, List<Param> free, Param p, double value) {
        if (free.contains(p) && Double.isFinite(value) && value > 0) {
            start.put(p, value);
        }
    }

    /**
     * Flags a result that is physically implausible for the device kind: an emission coefficient outside the
     * kind's usual range ({@link DeviceKind#typicalEmission}), or a recombination term less steep than the main
     * term (NR below N), which means the two exponential terms have traded places.
     */
    void plausibility(DiodeParameters p, List<String> warnings) {
        double[] range = settings.kind().typicalEmission();
        for (Param q : List.of(Param.N, Param.NR)) {
            if (!p.isGiven(q) || (q == Param.NR && !p.isGiven(Param.ISR))) {
                continue;
            }
            double v = p.get(q);
            double hi = q == Param.NR ? 2 * range[1] : range[1];
            if (v < range[0] || v > hi) {
                warnings.add(String.format(Locale.ROOT,
                        "%s = %.3f is outside the range usual for a %s (%.2f to %.2f): check the device kind (--kind) "
                                + "and the data; the fit may describe the curve without describing the junction",
                        q, v, settings.kind().description(), range[0], hi));
            }
        }
        if (p.isGiven(Param.ISR) && p.get(Param.NR) < p.get(Param.N)) {
            warnings.add(String.format(Locale.ROOT,
                    "NR = %.3f is below N = %.3f: the recombination term carries the high currents and the main term the "
                            + "low ones, the reverse of a junction's physics; the parameters may not describe the junction",
                    p.get(Param.NR), p.get(Param.N)));
        }
    }

    // ---------------------------------------------------------------------------------------------------

    private Map<Double, List<FitPoint>> checkInput(List<FitPoint> points) throws FitInputException {
        if (points.isEmpty()) {
            throw new FitInputException("no forward points (positive current) to fit");
        }
        Map<Double, List<FitPoint>> sweeps = org.cardwright.model.SweepTemperatures.group(points, FitPoint::temperature, settings.sweepGap());
        double widest = 0;
        FitPoint lo = null;
        FitPoint hi = null;
        for (List<FitPoint> s : sweeps.values()) {
            FitPoint a = s.stream().min(Comparator.comparingDouble(FitPoint::current)).orElseThrow();
            FitPoint b = s.stream().max(Comparator.comparingDouble(FitPoint::current)).orElseThrow();
            double decades = Math.log10(b.current() / a.current());
            if (decades >= widest) {
                widest = decades;
                lo = a;
                hi = b;
            }
        }
        if (points.size() < MIN_POINTS) {
            throw new FitInputException(String.format(Locale.ROOT,
                    "%s: only %d forward points, line %d (%s A) to line %d (%s A); at least %d are needed to fit IS, N and RS",
                    lo.source(), points.size(), lo.line(), num(lo.current()), hi.line(), num(hi.current()), MIN_POINTS));
        }
        if (widest < MIN_DECADES) {
            throw new FitInputException(String.format(Locale.ROOT,
                    "%s: forward current spans only %.2f decades (%s A at line %d to %s A at line %d, %d points); "
                            + "at least %.0f decades are needed to tell IS from N",
                    lo.source(), widest, num(lo.current()), lo.line(), num(hi.current()), hi.line(), points.size(),
                    MIN_DECADES));
        }
        return sweeps;
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }

    /** Number of groups of temperatures, each group spanning less than {@code step} [K]. */
    static int distinctTemperatures(java.util.Collection<Double> temperatures, double step) {
        List<Double> t = new ArrayList<>(temperatures);
        java.util.Collections.sort(t);
        int groups = 0;
        double start = Double.NEGATIVE_INFINITY;
        for (double x : t) {
            if (x - start >= step) {
                groups++;
                start = x;
            }
        }
        return groups;
    }

    /** The sweep nearest TNOM among those spanning at least MIN_DECADES (else the widest). */
    private static List<FitPoint> referenceSweep(Map<Double, List<FitPoint>> sweeps, double tnom) {
        List<FitPoint> best = null;
        double bestDistance = Double.POSITIVE_INFINITY;
        for (List<FitPoint> s : sweeps.values()) {
            double lo = s.stream().mapToDouble(FitPoint::current).min().orElseThrow();
            double hi = s.stream().mapToDouble(FitPoint::current).max().orElseThrow();
            if (Math.log10(hi / lo) < MIN_DECADES || s.size() < 5) {
                continue;
            }
            double d = Math.abs(s.get(0).temperature() - tnom);
            if (d < bestDistance) {
                bestDistance = d;
                best = s;
            }
        }
        if (best == null) {
            best = sweeps.values().stream().max(Comparator.comparingInt(List::size)).orElseThrow();
        }
        return StartValues.sorted(best);
    }

    private boolean isFree(Param p) {
        ParameterRule r = settings.rule(p);
        return r == null || r.kind() == ParameterRule.Kind.FREE || r.kind() == ParameterRule.Kind.BOUNDED;
    }

    private double ruleValue(Param p, double otherwise) {
        ParameterRule r = settings.rule(p);
        return r != null && Double.isFinite(r.value()) ? r.value() : otherwise;
    }

    /** Whether EG or XTI varies: the user's rule wins; otherwise the data decides (with a warning). */
    private boolean freeByData(Param p, boolean dataAllows, List<String> warnings, String heldMessage) {
        ParameterRule r = settings.rule(p);
        if (r != null) {
            if (r.kind() == ParameterRule.Kind.FIXED) {
                return false;
            }
            if (!dataAllows) {
                warnings.add(p + " was asked to vary, but the temperatures given cannot determine it well; expect a large standard error");
            }
            return true;
        }
        if (!dataAllows) {
            warnings.add(heldMessage);
        }
        return dataAllows;
    }

    /**
     * Score (Lagrange-multiplier) test for self-heating, so that the costly thermal fit runs only when the
     * residuals show its signature: the column h = dV/dRTH0 at RTH0 = 0, which is (dV/dT)·I·V at each point, is
     * made orthogonal to the columns of the fitted parameters, and (h.r)^2/(h.h) bounds how much chi-square
     * adding RTH0 could remove to first order (Rao, "Large sample tests of statistical hypotheses...", Proc.
     * Cambridge Philos. Soc. 44 (1948) 50-57; citation recalled). Returns the best change of BIC it allows.
     */
    private double heatingScoreBound(List<FitPoint> points, Optimiser.Run best) {
        ForwardBlock block = new ForwardBlock(points, settings.options());
        DiodeParameters p = best.parameters();
        double[] r = block.residuals(p);
        double[][] j = block.jacobian(best.layout(), best.x());
        double[] h = new double[points.size()];
        double dT = 0.01;
        java.util.Map<Double, DiodeAtTemperature[]> at = new java.util.HashMap<>();
        for (int i = 0; i < h.length; i++) {
            FitPoint pt = points.get(i);
            DiodeAtTemperature[] d = at.computeIfAbsent(pt.temperature(), t -> new DiodeAtTemperature[] {
                TemperatureLaws.at(p, t - dT, settings.options()), TemperatureLaws.at(p, t + dT, settings.options())});
            double dvdt = (DiodeSolver.voltageAtCurrent(d[1], pt.current()) - DiodeSolver.voltageAtCurrent(d[0], pt.current())) / (2 * dT);
            h[i] = dvdt * pt.current() * pt.voltage() / pt.sigma();
        }
        double[] hPerp = h;
        if (j.length > 0 && j[0].length > 0) {
            org.apache.commons.math3.linear.RealMatrix jm = new org.apache.commons.math3.linear.Array2DRowRealMatrix(j, false);
            org.apache.commons.math3.linear.RealVector c;
            try {
                c = new org.apache.commons.math3.linear.QRDecomposition(jm, 1e-14)
                        .getSolver().solve(new org.apache.commons.math3.linear.ArrayRealVector(h, false));
            } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
                throw new FitFailedException("the forward fit is degenerate: its Jacobian is singular, so the data do "
                        + "not determine " + best.layout().free() + " (currents too small, too few distinct points, "
                        + "or values beyond double precision)");
            }
            double[] fit = jm.operate(c).toArray();
            hPerp = new double[h.length];
            for (int i = 0; i < h.length; i++) {
                hPerp[i] = h[i] - fit[i];
            }
        }
        double hr = 0;
        double hh = 0;
        for (int i = 0; i < h.length; i++) {
            hr += hPerp[i] * r[i];
            hh += hPerp[i] * hPerp[i];
        }
        int n = points.size();
        double rss = best.rss();
        double reduced = hh > 0 ? Math.max(rss - hr * hr / hh, 0) : rss;
        return bic(reduced, n, best.layout().size() + 1) - bic(rss, n, best.layout().size());
    }

    /**
     * Why ISR and NR are left out when recombination carries only {@code share} of the smallest measured current
     * {@code current} [A]. A share rounded to a hair below 0 (the current without ISR a few ulps above the measured one)
     * reads 0.0 %, not -0.0 %.
     */
    static String recombinationTooSmall(double share, double current) {
        return String.format(Locale.ROOT,
                "recombination would carry only %.1f %% of the smallest measured current (%s A): too little to determine ISR and NR",
                Math.max(0.0, 100 * share), num(current));
    }

    /**
     * A term must act where the data are, or the data cannot be said to determine it: the high-injection knee
     * no more than {@value #KNEE_REACH} times above the largest measured current (there it still lowers that
     * current by a quarter), and the recombination current at least {@value #RECOMBINATION_SHARE} of the
     * current at the smallest measured point. Returns why not, or null when it does.
     */
    private String actsOutsideData(Term term, DiodeParameters p, List<FitPoint> points) {
        if (term == HIGH_INJECTION) {
            double top = points.stream().mapToDouble(FitPoint::current).max().orElseThrow();
            double ikf = p.get(Param.IKF);
            if (ikf > KNEE_REACH * top) {
                return String.format(Locale.ROOT,
                        "the fit puts IKF at %s A, more than %.0f times the largest measured current (%s A): no knee in the data",
                        num(ikf), KNEE_REACH, num(top));
            }
        } else if (term == SELF_HEATING) {
            double worst = 0;
            for (FitPoint pt : points) {
                worst = Math.max(worst, SelfHeating.riseAtCurrent(p, pt.temperature(), pt.current(), settings.options()));
            }
            if (worst < MIN_VISIBLE_RISE) {
                return String.format(Locale.ROOT,
                        "the fit's RTH0 (%s K/W) warms the junction by only %.2f K at the largest current: too little to tell from the data",
                        num(p.get(Param.RTH0)), worst);
            }
        } else if (term == RECOMBINATION) {
            FitPoint low = points.stream().min(Comparator.comparingDouble(FitPoint::current)).orElseThrow();
            DiodeAtTemperature d = TemperatureLaws.at(p, low.temperature(), settings.options());
            DiodeAtTemperature without = TemperatureLaws.at(p.without(Param.ISR), low.temperature(), settings.options());
            double vd = DiodeSolver.junctionVoltageAtCurrent(d, low.current());
            double share = 1 - JunctionCurrent.current(without, vd) / low.current();
            if (share < RECOMBINATION_SHARE) {
                return recombinationTooSmall(share, low.current());
            }
        }
        return null;
    }

    /** Start values of an optional term, written into {@code start} unless the user fixed them. */
    private void termStart(Term term, Map<Param, Double> start, List<FitPoint> reference, StartValues.Shockley sh,
                           double tRef, double tnom, double eg, double xti) {
        if (term == RECOMBINATION) {
            double[] rec = StartValues.recombination(reference, sh);
            double isrT;
            double nr;
            if (rec != null) {
                isrT = rec[0];
                nr = rec[1];
            } else {
                FitPoint low = reference.get(0);
                nr = Math.max(2.0, sh.emission() + 0.5);
                isrT = 0.3 * low.current() / Math.exp(low.voltage() / (nr * Ngspice39.thermalVoltage(tRef)));
            }
            putUnlessFixed(start, Param.NR, nr);
            putUnlessFixed(start, Param.ISR, StartValues.toNominal(isrT, tRef, tnom, nr, eg, xti));
        } else if (term == HIGH_INJECTION) {
            double top = reference.get(reference.size() - 1).current();
            putUnlessFixed(start, Param.IKF, 3 * top);
        } else if (term == RS_TEMPCO) {
            putUnlessFixed(start, Param.TRS1, 0.0);
        } else if (term == SELF_HEATING) {
            // start where the top point warms by 2 K
            FitPoint top = reference.get(reference.size() - 1);
            putUnlessFixed(start, Param.RTH0, 2.0 / (top.current() * Math.max(top.voltage(), 0.1)));
        }
    }

    private void putUnlessFixed(Map<Param, Double> start, Param p, double value) {
        ParameterRule r = settings.rule(p);
        if (r != null && (r.kind() == ParameterRule.Kind.FIXED
                || (r.kind() == ParameterRule.Kind.FREE && !Double.isNaN(r.value())))) {
            start.put(p, r.value());
        } else {
            start.put(p, value);
        }
    }

    double[] bounds(Param p) {
        double[] d = defaultBounds(p);
        if (p == Param.N || p == Param.NR) {
            d = new double[] {d[0], Math.min(d[1], settings.kind().maxEmission() * (p == Param.NR ? 2 : 1))};
        }
        ParameterRule r = settings.rule(p);
        if (r != null && r.kind() == ParameterRule.Kind.BOUNDED) {
            return new double[] {Math.max(r.lower(), d[0]), Math.min(r.upper(), d[1])};
        }
        return d;
    }

    /** Physical limits: beyond them the model is meaningless or numerically hopeless. */
    static double[] defaultBounds(Param p) {
        return switch (p) {
            case IS, ISR -> new double[] {1e-40, 1.0};
            case N, NR -> new double[] {0.3, 20};
            case RS -> new double[] {0, 1e7};
            case IKF -> new double[] {1e-15, 1e6};
            case EG -> new double[] {0.1, 5};
            case XTI -> new double[] {-50, 100};
            case TRS1 -> new double[] {-0.1, 0.1};
            case BV -> new double[] {0.1, 1e5};
            case NBV -> new double[] {0.1, 100};
            case IBV -> new double[] {1e-15, 10};
            case TCV -> new double[] {-1, 1};
            case RTH0 -> new double[] {1e-3, 1e5};
            // the capacitance parameters keep the limits the C-V stage uses, one table for both
            case CJO, VJ, M, FC, TT -> CapacitanceExtraction.defaultBounds(p);
            default -> new double[] {Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY};
        };
    }

    private Optimiser.Run run(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free) {
        return Optimiser.run(blocks, start, free, this::bounds);
    }

    static double bic(double rss, int n, int k) {
        return n * Math.log(Math.max(rss / n, RESIDUAL_FLOOR_SQUARED)) + k * Math.log(n);
    }

}
