package org.cardwright.fit;

import java.util.List;
import java.util.function.Function;
import org.apache.commons.math3.exception.ConvergenceException;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * One Levenberg-Marquardt minimisation (Levenberg, Q. Appl. Math. 2 (1944) 164-168; Marquardt, J. SIAM 11
 * (1963) 431-441; the Commons Math implementation follows Moré, LNM 630 (1978)) of stacked residual blocks,
 * with bounds kept by clamping the optimiser's vector.
 */
final class Optimiser {
    private static final int MAX_EVALUATIONS = 4000;

    private Optimiser() {
    }

    /** Outcome of one least-squares run. */
    record Run(DiodeParameters parameters, FreeParameters layout, double[] x, double rss, int evaluations,
               int iterations, String stopReason) {
    }

    /**
     * Minimises the stacked weighted residuals of {@code blocks} over the {@code free} parameters, starting
     * from {@code start}, within {@code bounds}.
     *
     * @throws FitFailedException when the optimiser does not converge
     */
    static Run run(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                   Function<Param, double[]> bounds) {
        return run(blocks, start, free, bounds, TOLERANCE);
    }

    /**
     * {@code start} with every free parameter brought inside its bounds (a log-scaled one that is not positive
     * goes to its lower bound): start values outside the bounds are moved before a fit starts.
     */
    static DiodeParameters clampedStart(DiodeParameters start, List<Param> free, Function<Param, double[]> bounds) {
        DiodeParameters clamped = start;
        for (Param p : free) {
            double[] b = bounds.apply(p);
            double v = start.get(p);
            double c = Math.min(b[1], Math.max(b[0], v));
            if (p.fitScale() == Param.Scale.LOG && c <= 0) {
                c = b[0];
            }
            if (c != v) {
                clamped = clamped.with(p, c);
            }
        }
        return clamped;
    }

    /** Relative change of cost and parameters at which a fit stops [1]. */
    static final double TOLERANCE = 1e-13;

    /**
     * The same with another stopping tolerance: a looser one finds the basin of a start at a fraction of the cost,
     * for comparing starts (the chosen one is then fitted to {@link #TOLERANCE}).
     */
    static Run run(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                   Function<Param, double[]> bounds, double tolerance) {
        return guarded(() -> unguarded(blocks, start, free, bounds, tolerance, null));
    }

    /**
     * The same, with a convergence checker that Commons Math asks after each accepted step besides its own tests
     * (it changes no step, only where the run may stop; {@link TermTrial}); {@code null} for none.
     */
    static Run run(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                   Function<Param, double[]> bounds, double tolerance,
                   org.apache.commons.math3.optim.ConvergenceChecker<LeastSquaresProblem.Evaluation> checker) {
        return guarded(() -> unguarded(blocks, start, free, bounds, tolerance, checker));
    }

    /**
     * The one place where the model's own domain checks (a parameter or voltage no longer finite, a value the model
     * refuses) and Commons Math's numerical failures (a singular matrix, an overflow), thrown as
     * {@link IllegalArgumentException} or {@link ArithmeticException} while a fit evaluates the model, become a
     * {@link FitFailedException}. The stages catch only that, so a programming error elsewhere in a stage is never
     * read as "could not be fitted".
     */
    static <T> T guarded(java.util.function.Supplier<T> numerics) {
        try {
            return numerics.get();
        } catch (FitFailedException e) {
            throw e;
        } catch (IllegalArgumentException | ArithmeticException e) {
            throw new FitFailedException("the fit broke down: " + e.getMessage());
        }
    }

    /** Start values from a map, as a fit failure when the model refuses them (see {@link #guarded}). */
    static DiodeParameters parameters(java.util.Map<Param, Double> values) {
        return guarded(() -> DiodeParameters.of(values));
    }

    /** {@code p} with one value changed, as a fit failure when the model refuses it (see {@link #guarded}). */
    static DiodeParameters with(DiodeParameters p, Param q, double value) {
        return guarded(() -> p.with(q, value));
    }

    private static Run unguarded(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                                 Function<Param, double[]> bounds, double tolerance,
                                 org.apache.commons.math3.optim.ConvergenceChecker<LeastSquaresProblem.Evaluation> checker) {
        DiodeParameters clamped = clampedStart(start, free, bounds);
        FreeParameters layout = new FreeParameters(clamped, free, FreeParameters.boundsOf(free, bounds));
        JointProblem model = new JointProblem(blocks, layout);
        double[] x0 = layout.toInternal(clamped);
        if (free.isEmpty()) {
            double rss = model.chiSquare(clamped);
            return new Run(clamped, layout, x0, rss, 1, 0, "nothing to fit: every parameter is held");
        }
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .model(model)
                .target(new double[model.rows()])
                .start(x0)
                .parameterValidator(v -> new ArrayRealVector(layout.clamp(v.toArray()), false))
                .maxEvaluations(MAX_EVALUATIONS)
                .maxIterations(MAX_EVALUATIONS)
                .lazyEvaluation(true)  // no Jacobian for a rejected step (JointProblem)
                .checker(checker)
                .build();
        LevenbergMarquardtOptimizer lm = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(tolerance)
                .withParameterRelativeTolerance(tolerance)
                .withOrthoTolerance(tolerance);
        String stop;
        double[] x;
        int evals;
        int iters;
        try {
            LeastSquaresOptimizer.Optimum opt = lm.optimize(problem);
            x = layout.clamp(opt.getPoint().toArray());
            evals = opt.getEvaluations();
            iters = opt.getIterations();
            stop = "converged: relative change of cost and parameters below "
                    + String.format(java.util.Locale.ROOT, "%.0e", tolerance) + " after " + iters + " iterations";
        } catch (TooManyEvaluationsException | TooManyIterationsException e) {
            throw new FitFailedException("the fit did not converge within " + MAX_EVALUATIONS + " evaluations");
        } catch (ConvergenceException e) {
            throw new FitFailedException("the fit stopped: " + e.getMessage());
        } catch (IllegalArgumentException | ArithmeticException e) {
            // the model left its domain (a parameter or voltage no longer finite) or a matrix became singular
            throw new FitFailedException("the fit broke down: " + e.getMessage());
        }
        DiodeParameters result = layout.toParameters(x);
        return new Run(result, layout, x, model.chiSquare(result), evals, iters, stop);
    }

}
