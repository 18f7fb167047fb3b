package org.cardwright.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;
import org.apache.commons.math3.exception.ConvergenceException;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Param;
import org.cardwright.model.TemperatureLaws;

/**
 * The parallel conductance (shunt resistor) between the diode's terminals: whether the data show one, and its
 * fit together with the junction. It is decided like the forward stage's optional terms (docs/fitting.md,
 * section 2.5):
 *
 * <ol>
 *   <li>It is tried unless the plain forward stage already fits to the residual floor (then nothing can lower
 *       the criterion), or carries RTH0.</li>
 *   <li>Screening: from several starts for G (fractions of the smallest forward point's I/V, an upper bound of
 *       G; the slope of the reverse leakage the junction does not explain), a Levenberg-Marquardt fit of the
 *       plain stage's free parameters and ln R together against the forward points and the reverse leakage below
 *       breakdown (both see the resistor). That model holds the refined one, so if even it does not lower the
 *       criterion, or its resistor does not act inside the data, the resistor stays out.</li>
 *   <li>Refinement: the forward stage runs again, term selection included, on the junction's share of each
 *       point's current (I − G·V, kept where the junction carries at least {@value #JUNCTION_SHARE} of it), and
 *       the joint fit follows; rounds are kept while the criterion falls.</li>
 *   <li>The shunt goes in when the BIC on the forward points (the same form and floor as the other terms,
 *       with one parameter more) falls by more than the threshold against the plain forward stage, and the
 *       resistor carries at least {@value #CURRENT_SHARE} of the current at some measured forward point (at any
 *       temperature): like every optional term it must act where the data are.</li>
 * </ol>
 */
final class ShuntTerm {
    /** Name of the term in the decisions. */
    static final String TERM = "parallel conductance (shunt resistor)";
    /** The corrected stage keeps points where the junction carries at least this share of the current [1]. */
    static final double JUNCTION_SHARE = 0.2;
    /** The resistor must carry at least this share of the smallest forward current (as recombination must) [1]. */
    static final double CURRENT_SHARE = ForwardExtraction.RECOMBINATION_SHARE;
    /** Physical limits of the resistance [ohm]: a milliohm (a short) to a petaohm (an insulator). */
    static final double[] BOUNDS = {1e-3, 1e15};
    /**
     * The screening fit keeps R below this many times 1/(the smallest forward I/V): there the resistor carries
     * about 1 % of that current, a tenth of what {@link #CURRENT_SHARE} asks, so a fit that runs to this bound has
     * found no resistor in the data, and stops there instead of creeping towards an insulator [1].
     */
    private static final double SCREEN_REACH = 100;
    /** Relative tolerances of the screening fits: they decide and start, the final fits refine [1]. */
    private static final double SCREEN_TOLERANCE = 1e-8;
    /** Relative tolerances of the final fits, as the optimiser's (docs/fitting.md, section 2.2) [1]. */
    private static final double FINAL_TOLERANCE = 1e-13;
    /** Starts for G as fractions of the smallest forward point's I/V (an upper bound of G) [1]. */
    private static final double[] START_FRACTIONS = {0.9, 0.5, 0.2};
    /**
     * The closed-form screen skips the trials only when the leakage data bound G this many times below the least
     * conductance the decision accepts: far beyond a meter's reading noise, so that noise cannot hide a resistor [1].
     */
    static final double LEAKAGE_MARGIN = 2;
    /** Joint rounds at most; each after the first starts from the previous one's G. */
    private static final int ROUNDS = 3;
    /** G has settled when a round moves it by less than this, relative [1]. */
    private static final double SETTLED = 1e-3;
    private static final double RESIDUAL_FLOOR_SQUARED = 1e-6;
    private static final int MAX_EVALUATIONS = 4000;

    private final boolean included;
    private final ForwardExtraction.Stage stage;
    private final TermDecision decision;
    private final double conductance;

    private ShuntTerm(boolean included, ForwardExtraction.Stage stage, TermDecision decision, double conductance) {
        this.included = included;
        this.stage = stage;
        this.decision = decision;
        this.conductance = conductance;
    }

    boolean included() {
        return included;
    }

    /** The forward stage to continue with: the shunted one when the shunt went in, else the plain one. */
    ForwardExtraction.Stage stage() {
        return stage;
    }

    TermDecision decision() {
        return decision;
    }

    /** The conductance the decision found, 0 when the shunt stays out [S]. */
    double conductance() {
        return conductance;
    }

    /** Decides on the shunt after the plain forward stage {@code plain}; see the class comment. */
    static ShuntTerm consider(FitSettings settings, ForwardExtraction forward, ForwardExtraction.Stage plain,
                              List<FitPoint> points, List<ReversePoint> leakage) {
        DiodeParameters p0 = plain.run().parameters();
        boolean forced = settings.shunt() == FitSettings.ShuntChoice.ON;
        if (settings.shunt() == FitSettings.ShuntChoice.OFF) {
            return no(plain, Double.NaN, "not tried: the full fit found none (this is a dialect refit)");
        }
        if (p0.isGiven(Param.RTH0)) {
            return no(plain, Double.NaN, "not tried beside self-heating (RTH0): the resistor is evaluated isothermally");
        }
        int n = points.size();
        int k0 = plain.run().layout().size();
        double bic0 = bic(plain.run().rss(), n, k0);
        if (!forced && plain.run().rss() / n <= RESIDUAL_FLOOR_SQUARED) {
            return no(plain, Double.NaN, "the forward data are fitted to the residual floor without it");
        }
        // G is at most the smallest forward point's I/V: the junction carries the rest of that current
        double ceiling = Double.POSITIVE_INFINITY;
        for (FitPoint pt : points) {
            if (pt.voltage() > 0) {
                ceiling = Math.min(ceiling, pt.current() / pt.voltage());
            }
        }
        if (!(ceiling > 0) || !Double.isFinite(ceiling)) {
            return no(plain, Double.NaN, "no forward point at a positive voltage to start from");
        }
        // closed-form screen before any fit: the leakage data bound G from above (see leakageCeiling); when that bound
        // is far below the least conductance the decision could accept, no trial can end with the resistor in
        if (!forced) {
            String quiet = quietLeakage(points, leakage);
            if (quiet != null) {
                return no(plain, Double.NaN, quiet);
            }
        }
        // several principled starts, each taken one round, the best by the fit's own cost then refined: the
        // leakage's slope; the smallest forward point's I/V (an upper bound of G, met where the resistor carries
        // nearly all of that current), and fractions of it for a resistor the junction shares that point with
        List<Double> starts = new ArrayList<>();
        double fromLeakage = leakageSlope(leakage, p0, settings);
        if (Double.isFinite(fromLeakage) && fromLeakage > 0) {
            starts.add(Math.min(fromLeakage, START_FRACTIONS[0] * ceiling));
        }
        for (double f : START_FRACTIONS) {
            starts.add(f * ceiling);
        }
        // screening: the plain stage's terms with the resistor added, from every start (no new term selection, so
        // it is cheap). That model holds the refined one below (same or more terms), so if even it cannot lower the
        // criterion, or its resistor does not act inside the data, the resistor stays out
        Joint screen = null;
        for (double start : starts) {
            try {
                DiodeParameters p0Now = p0;
                double reach = forced ? BOUNDS[1] : SCREEN_REACH / ceiling;
                Joint j = Optimiser.guarded(() -> fit(shuntBlocks(points, leakage, settings, start), p0Now, plain.run().layout().free(),
                        forward::bounds, start, reach, SCREEN_TOLERANCE));
                if (screen == null || j.run().rss() < screen.run().rss()) {
                    screen = j;
                }
            } catch (FitFailedException e) {
                // this start does not converge; the others may
            }
        }
        if (screen == null) {
            return no(plain, Double.NaN, "could not be fitted to this data");
        }
        if (!forced) {
            double delta = forwardBic(screen, points, settings) - bic0;
            String outside = outside(screen.conductance(), points);
            if (outside != null) {
                return no(plain, delta, outside);
            }
            if (!(delta < -ForwardExtraction.BIC_THRESHOLD)) {
                return no(plain, delta, String.format(Locale.ROOT,
                        "not warranted: BIC changed by %+.1f (needs below -%.0f)", delta, ForwardExtraction.BIC_THRESHOLD));
            }
        }
        // refinement: the terms chosen again on the junction's share of the current, then the joint fit, while the
        // criterion falls
        Joint joint = screen;
        ForwardExtraction.Stage corrected = plain;
        double g = screen.conductance();
        for (int round = 0; round < ROUNDS; round++) {
            ForwardExtraction.Stage c = correctedStage(forward, points, g, plain);
            Joint j;
            try {
                double gNow = g;
                j = Optimiser.guarded(() -> fit(shuntBlocks(points, leakage, settings, gNow), c.run().parameters(), c.run().layout().free(),
                        forward::bounds, gNow));
            } catch (FitFailedException e) {
                break;
            }
            if (!(forwardBic(j, points, settings) < forwardBic(joint, points, settings))) {
                break;
            }
            boolean settled = Math.abs(Math.log(j.conductance() / g)) < SETTLED;
            joint = j;
            corrected = c;
            g = j.conductance();
            if (settled) {
                break;
            }
        }
        DiodeParameters p = joint.run().parameters();
        double[] rf = new ForwardBlock(points, settings.options(), g).residuals(p);
        double rssForward = 0;
        for (double x : rf) {
            rssForward += x * x;
        }
        double delta = bic(rssForward, n, joint.run().layout().size() + 1) - bic0;
        double resistance = 1 / g;
        String outside = outside(g, points);
        if (!forced && outside != null) {
            return no(plain, delta, outside);
        }
        if (!forced && !(delta < -ForwardExtraction.BIC_THRESHOLD)) {
            return no(plain, delta, String.format(Locale.ROOT,
                    "not warranted: BIC changed by %+.1f (needs below -%.0f)", delta, ForwardExtraction.BIC_THRESHOLD));
        }
        List<ResidualBlock> blocks = new ArrayList<>();
        blocks.add(new ForwardBlock(points, settings.options(), g));
        if (!leakage.isEmpty()) {
            blocks.add(new ShuntLeakageBlock(leakage, settings.options(), g));
        }
        ForwardExtraction.Stage shunted = new ForwardExtraction.Stage(joint.run(), blocks, corrected.decisions(),
                corrected.warnings(), corrected.start());
        TermDecision d = new TermDecision(TERM, List.of(), true, delta, String.format(Locale.ROOT,
                "%s; %s ohm between the terminals, fitted with %d forward and %d leakage points",
                forced ? "carried because the full fit found it (this is a dialect refit)"
                        : String.format(Locale.ROOT, "BIC fell by %.1f (threshold %.0f)", -delta, ForwardExtraction.BIC_THRESHOLD),
                num(resistance), n, leakage.size()));
        return new ShuntTerm(true, shunted, d, g);
    }

    /** BIC of a joint fit on the forward points alone, with the resistor counted as a parameter. */
    private static double forwardBic(Joint j, List<FitPoint> points, FitSettings settings) {
        double[] rf = new ForwardBlock(points, settings.options(), j.conductance()).residuals(j.run().parameters());
        double rss = 0;
        for (double x : rf) {
            rss += x * x;
        }
        return bic(rss, points.size(), j.run().layout().size() + 1);
    }

    /**
     * The closed-form screen (docs/fitting.md, section 2.5): in reverse bias the junction's own current flows the same
     * way as the resistor's, so every leakage point bounds G from above by |I|/|V|; the largest of these ratios is a
     * bound with the points' noise on the generous side. The decision needs G of at least {@link #CURRENT_SHARE} of
     * the smallest I/V of the forward points ({@link #outside}); when the bound lies below that by more than
     * {@link #LEAKAGE_MARGIN}, the trials are skipped and the reason is returned; null when the leakage data leave
     * room for such a resistor, or there are none to judge by.
     */
    private static String quietLeakage(List<FitPoint> points, List<ReversePoint> leakage) {
        double bound = 0;
        int used = 0;
        for (ReversePoint r : leakage) {
            if (r.voltage() < 0 && r.current() < 0) {
                bound = Math.max(bound, r.current() / r.voltage());
                used++;
            }
        }
        if (used < 2) {
            return null;
        }
        // the decision needs the resistor to carry CURRENT_SHARE of the current at some forward point, at any
        // temperature ({@link #outside}): the least conductance that does is set by the smallest I/V of all
        FitPoint low = null;
        for (FitPoint pt : points) {
            if (pt.voltage() > 0 && (low == null || pt.current() / pt.voltage() < low.current() / low.voltage())) {
                low = pt;
            }
        }
        if (low == null) {
            return null;
        }
        double least = CURRENT_SHARE * low.current() / low.voltage();
        if (LEAKAGE_MARGIN * bound >= least) {
            return null;
        }
        return String.format(Locale.ROOT,
                "not tried: the leakage data allow at most %s S (largest |I|/|V| of %d points), below the %s S it would need to carry %.0f %% of the current at any forward point (at most %s A at %s V)",
                num(bound), used, num(least), 100 * CURRENT_SHARE, num(low.current()), num(low.voltage()));
    }

    /** Why a resistor of conductance {@code g} does not act inside the data, or null when it does. */
    private static String outside(double g, List<FitPoint> points) {
        // the largest share over every point: at several temperatures the same smallest current may be carried
        // mostly by the resistor when cold and mostly by the junction when hot; it acts where it carries enough
        FitPoint best = null;
        double share = 0;
        for (FitPoint pt : points) {
            double s = g * pt.voltage() / pt.current();
            if (best == null || s > share) {
                best = pt;
                share = s;
            }
        }
        if (best == null || share >= CURRENT_SHARE) {
            return null;
        }
        return String.format(Locale.ROOT,
                "the fitted resistor (%s ohm) would carry at most %.1f %% of a measured current (%s A at %s degC): too little to determine it",
                num(1 / g), 100 * share, num(best.current()), num(best.temperature() - 273.15));
    }

    private static List<ResidualBlock> shuntBlocks(List<FitPoint> points, List<ReversePoint> leakage, FitSettings settings,
                                                   double g) {
        List<ResidualBlock> blocks = new ArrayList<>();
        blocks.add(new ForwardBlock(points, settings.options(), g));
        if (!leakage.isEmpty()) {
            blocks.add(new ShuntLeakageBlock(leakage, settings.options(), g));
        }
        return blocks;
    }

    private static ShuntTerm no(ForwardExtraction.Stage plain, double delta, String reason) {
        return new ShuntTerm(false, plain, new TermDecision(TERM, List.of(), false, delta, reason), 0);
    }

    /**
     * The forward stage on the junction's share of the current, I − G·V, at points where that share is at least
     * {@link #JUNCTION_SHARE}; the plain stage when too little is left for a stage of its own.
     */
    private static ForwardExtraction.Stage correctedStage(ForwardExtraction forward, List<FitPoint> points, double g,
                                                          ForwardExtraction.Stage plain) {
        List<FitPoint> kept = new ArrayList<>();
        for (FitPoint pt : points) {
            double junction = pt.current() - g * pt.voltage();
            if (junction >= JUNCTION_SHARE * pt.current()) {
                kept.add(new FitPoint(junction, pt.voltage(), pt.temperature(), pt.sigma(), pt.source(), pt.line()));
            }
        }
        try {
            ForwardExtraction.Stage s = forward.stage(kept);
            return s.run().parameters().isGiven(Param.RTH0) ? plain : s;
        } catch (FitInputException | FitFailedException e) {
            return plain;
        }
    }

    /**
     * The slope of the leakage current the junction does not explain, through the origin: sum(ΔI·V)/sum(V²) with
     * ΔI = I − Ij(V) at the plain stage's parameters [S]; NaN with fewer than 2 leakage points.
     */
    private static double leakageSlope(List<ReversePoint> leakage, DiodeParameters p, FitSettings settings) {
        if (leakage.size() < 2) {
            return Double.NaN;
        }
        double sxy = 0;
        double sxx = 0;
        java.util.Map<Double, DiodeAtTemperature> at = new java.util.HashMap<>();
        for (ReversePoint r : leakage) {
            DiodeAtTemperature d = at.computeIfAbsent(r.temperature(), t -> TemperatureLaws.at(p, t, settings.options()));
            double excess = r.current() - DiodeSolver.currentAtVoltage(d, r.voltage());
            sxy += excess * r.voltage();
            sxx += r.voltage() * r.voltage();
        }
        return sxx > 0 ? sxy / sxx : Double.NaN;
    }

    /** A joint fit with the shunt free: the junction's run, the conductance and its standard error. */
    record Joint(Optimiser.Run run, double conductance, double resistanceError) {
    }

    /**
     * One Levenberg-Marquardt fit (as {@link Optimiser}, same tolerances and clamping) of the junction's
     * {@code free} parameters and ln R together. Blocks that carry the shunt (forward, leakage) are evaluated at
     * each trial G; the others do not depend on it. The standard error of R comes from the curvature matrix of
     * the whole vector, scaled by the reduced chi-square (docs/fitting.md, section 8).
     */
    static Joint fit(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                     Function<Param, double[]> bounds, double g0) {
        return fit(blocks, start, free, bounds, g0, BOUNDS[1], FINAL_TOLERANCE);
    }

    /**
     * As {@link #fit(List, DiodeParameters, List, Function, double)}, with R at most {@code maxResistance} [ohm] and
     * the optimiser's relative tolerances at {@code tolerance}.
     */
    static Joint fit(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                     Function<Param, double[]> bounds, double g0, double maxResistance, double tolerance) {
        DiodeParameters clamped = Optimiser.clampedStart(start, free, bounds);
        FreeParameters layout = new FreeParameters(clamped, free, FreeParameters.boundsOf(free, bounds));
        int k = layout.size();
        double lo = Math.log(BOUNDS[0]);
        double hi = Math.log(Math.min(BOUNDS[1], maxResistance));
        double[] x0 = java.util.Arrays.copyOf(layout.toInternal(clamped), k + 1);
        x0[k] = Math.min(hi, Math.max(lo, -Math.log(g0)));
        int rows = blocks.stream().mapToInt(ResidualBlock::size).sum();
        BlockCache cache = new BlockCache(blocks);
        // residuals and Jacobian asked for separately, as in Optimiser: a rejected trial step costs no Jacobian
        LazyModel model = new LazyModel() {
            @Override
            double[] residualsAt(double[] x) {
                return residuals(cache, layout, x, k);
            }

            @Override
            RealMatrix jacobianAt(double[] x) {
                return new JacobianMatrix(jacobian(cache, layout, x, k, rows, lo, hi));
            }
        };
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .model(model)
                .target(new double[rows])
                .start(x0)
                .parameterValidator(v -> {
                    double[] x = v.toArray();
                    double[] head = layout.clamp(java.util.Arrays.copyOf(x, k));
                    System.arraycopy(head, 0, x, 0, k);
                    x[k] = Math.min(hi, Math.max(lo, x[k]));
                    return new ArrayRealVector(x, false);
                })
                .maxEvaluations(MAX_EVALUATIONS)
                .maxIterations(MAX_EVALUATIONS)
                .lazyEvaluation(true)
                .build();
        LevenbergMarquardtOptimizer lm = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(tolerance)
                .withParameterRelativeTolerance(tolerance)
                .withOrthoTolerance(tolerance);
        LeastSquaresOptimizer.Optimum opt;
        try {
            opt = lm.optimize(problem);
        } catch (TooManyEvaluationsException | TooManyIterationsException e) {
            throw new FitFailedException("the fit with a shunt resistor did not converge within " + MAX_EVALUATIONS + " evaluations");
        } catch (ConvergenceException e) {
            throw new FitFailedException("the fit with a shunt resistor stopped: " + e.getMessage());
        }
        double[] x = opt.getPoint().toArray();
        double[] head = layout.clamp(java.util.Arrays.copyOf(x, k));
        x[k] = Math.min(hi, Math.max(lo, x[k]));
        DiodeParameters p = layout.toParameters(head);
        double[] res = residuals(cache, layout, x, k);
        double rss = 0;
        for (double v : res) {
            rss += v * v;
        }
        double resistance = Math.exp(x[k]);
        double se = Double.NaN;
        int dof = rows - (k + 1);
        if (dof > 0) {
            RealMatrix j = new Array2DRowRealMatrix(jacobian(cache, layout, x, k, rows, lo, hi), false);
            SingularValueDecomposition svd = new SingularValueDecomposition(j.transpose().multiply(j));
            if (svd.getConditionNumber() <= 1e15) {
                double var = svd.getSolver().getInverse().getEntry(k, k) * rss / dof;
                se = resistance * Math.sqrt(Math.max(var, 0));
            }
        }
        String stop = "converged: relative change of cost and parameters below " + String.format(Locale.ROOT, "%.0e", tolerance)
                + " after " + opt.getIterations()
                + " iterations";
        Optimiser.Run run = new Optimiser.Run(p, layout, head, rss, opt.getEvaluations(), opt.getIterations(), stop);
        return new Joint(run, 1 / resistance, se);
    }

    /** The blocks at the last conductance asked for, so that residuals and Jacobian share their caches. */
    private static final class BlockCache {
        private final List<ResidualBlock> blocks;
        private double g = Double.NaN;
        private List<ResidualBlock> at;

        BlockCache(List<ResidualBlock> blocks) {
            this.blocks = blocks;
        }

        List<ResidualBlock> at(double conductance) {
            if (at == null || conductance != g) {
                at = atShunt(blocks, conductance);
                g = conductance;
            }
            return at;
        }
    }

    /** The blocks with the shunt set to {@code g} where they carry one. */
    static List<ResidualBlock> atShunt(List<ResidualBlock> blocks, double g) {
        List<ResidualBlock> out = new ArrayList<>(blocks.size());
        for (ResidualBlock b : blocks) {
            if (b instanceof ForwardBlock f && f.shunt() > 0) {
                out.add(f.withShunt(g));
            } else if (b instanceof ShuntLeakageBlock l) {
                out.add(l.withShunt(g));
            } else {
                out.add(b);
            }
        }
        return out;
    }

    private static boolean carriesShunt(ResidualBlock b) {
        return (b instanceof ForwardBlock f && f.shunt() > 0) || b instanceof ShuntLeakageBlock;
    }

    private static double[] residuals(BlockCache blocks, FreeParameters layout, double[] x, int k) {
        DiodeParameters p = layout.toParameters(java.util.Arrays.copyOf(x, k));
        List<ResidualBlock> at = blocks.at(Math.exp(-x[k]));
        int rows = at.stream().mapToInt(ResidualBlock::size).sum();
        double[] out = new double[rows];
        int row = 0;
        for (ResidualBlock b : at) {
            double[] r = b.residuals(p);
            System.arraycopy(r, 0, out, row, r.length);
            row += r.length;
        }
        return out;
    }

    private static double[][] jacobian(BlockCache blocks, FreeParameters layout, double[] x, int k, int rows,
                                       double lo, double hi) {
        double[] head = java.util.Arrays.copyOf(x, k);
        DiodeParameters p = layout.toParameters(head);
        double g = Math.exp(-x[k]);
        double step = 1e-6;
        double up = Math.min(hi, x[k] + step);
        double down = Math.max(lo, x[k] - step);
        double[][] jac = new double[rows][k + 1];
        int row = 0;
        for (ResidualBlock b : blocks.at(g)) {
            double[][] part = b.jacobian(layout, head);
            for (int i = 0; i < part.length; i++) {
                System.arraycopy(part[i], 0, jac[row + i], 0, k);
            }
            if (b instanceof ForwardBlock f && f.shunt() > 0 && x[k] > lo && x[k] < hi) {
                double[] col = f.shuntColumn(p);
                for (int i = 0; i < col.length; i++) {
                    jac[row + i][k] = col[i];
                }
            } else if (carriesShunt(b) && up > down) {
                double[] rp = atShunt(List.of(b), Math.exp(-up)).get(0).residuals(p);
                double[] rm = atShunt(List.of(b), Math.exp(-down)).get(0).residuals(p);
                for (int i = 0; i < rp.length; i++) {
                    jac[row + i][k] = (rp[i] - rm[i]) / (up - down);
                }
            }
            row += b.size();
        }
        return jac;
    }

    private static double bic(double rss, int n, int k) {
        return n * Math.log(Math.max(rss / n, RESIDUAL_FLOOR_SQUARED)) + k * Math.log(n);
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }
}
