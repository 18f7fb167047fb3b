package org.cardwright.fit;

import java.util.List;
import java.util.function.Function;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.optim.ConvergenceChecker;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;

/**
 * The Levenberg-Marquardt run of an optional term's trial ({@link ForwardExtraction}), which may stop as soon as its
 * outcome is settled: the term is judged by the information criterion alone, so once the sum of squares has stopped
 * moving and is still far above what the term would need, the remaining iterations (the last digits of a fit that
 * will not be kept) change nothing that is decided.
 *
 * <p>The run is {@link Optimiser#run} to the same tolerance, step for step: Commons Math's optimiser asks a convergence
 * checker only after an accepted step and the tolerance enters only its stopping tests, so the iterates are the same
 * as without the checker, and a run the checker does not stop ends where {@link Optimiser#run} ends, to the bit. The
 * checker stops the run after an accepted step that lowered the sum of squares by at most {@link #SETTLED} of itself,
 * when the criterion of the term then still lies {@link #MARGIN} above the threshold the term must pass. A run the term
 * could pass with goes on to the full tolerance, so every term taken in is fitted as before; a stopped run is a
 * prefix of the full one, whose sum of squares is at most that much lower (a step of relative decrease
 * {@value #SETTLED} is where the full run has ten or so steps of ever smaller decrease left).
 */
final class TermTrial {
    /** An accepted step that lowers the sum of squares by at most this share of it shows the cost has settled [1]. */
    static final double SETTLED = 1e-7;
    /**
     * How far above the term's threshold (BIC change above {@code -BIC_THRESHOLD}) a settled run must lie to be
     * stopped: 1 in BIC is a relative fall of the sum of squares of 1/n, some seven decades beyond what a settled run
     * has left to fall [1].
     */
    static final double MARGIN = 1;
    /** How the stop reason of a run the checker stopped begins. */
    static final String SETTLED_STOP = "settled:";

    private TermTrial() {
    }

    /** The convergence checker of {@link #run}: whether the run has settled far from passing (class comment). */
    private static final class Settled implements ConvergenceChecker<LeastSquaresProblem.Evaluation> {
        private final double share;
        private final java.util.function.DoublePredicate far;
        private double last = Double.NaN;
        private boolean stopped;

        Settled(double share, java.util.function.DoublePredicate far) {
            this.share = share;
            this.far = far;
        }

        @Override
        public boolean converged(int iteration, LeastSquaresProblem.Evaluation previous,
                                 LeastSquaresProblem.Evaluation current) {
            // the current point's cost only: the model keeps its residuals, so this costs no evaluation
            double cost = current.getCost();
            double rss = cost * cost;
            stopped = last - rss <= share * rss && far.test(rss);
            last = rss;
            return stopped;
        }
    }

    /**
     * Minimises as {@link Optimiser#run(List, DiodeParameters, List, Function)} does, stopped early once settled
     * (class comment): {@code n} residuals, compared with {@code bicWithout}, the criterion without the term.
     *
     * @throws FitFailedException when the optimiser does not converge, as {@link Optimiser#run}
     */
    static Optimiser.Run run(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                             Function<Param, double[]> bounds, int n, double bicWithout) {
        int k = free.size();  // the run's layout holds the free parameters as listed
        return run(blocks, start, free, bounds, Optimiser.TOLERANCE, SETTLED, rss -> farFromPassing(rss, n, k, bicWithout));
    }

    /**
     * The general form: minimises as {@link Optimiser#run(List, DiodeParameters, List, Function, double)} does to
     * {@code tolerance}, and stops after an accepted step that lowered the sum of squares by at most {@code settled}
     * of itself when {@code far} holds for the sum of squares reached.
     */
    static Optimiser.Run run(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                             Function<Param, double[]> bounds, double tolerance, double settled,
                             java.util.function.DoublePredicate far) {
        return Optimiser.guarded(() -> unguarded(blocks, start, free, bounds, tolerance, settled, far));
    }

    /** Whether a run at sum of squares {@code rss} with {@code k} free parameters is far from passing (class comment). */
    static boolean farFromPassing(double rss, int n, int k, double bicWithout) {
        return ForwardExtraction.bic(rss, n, k) - bicWithout > -ForwardExtraction.BIC_THRESHOLD + MARGIN;
    }

    private static Optimiser.Run unguarded(List<ResidualBlock> blocks, DiodeParameters start, List<Param> free,
                                           Function<Param, double[]> bounds, double tolerance, double settledShare,
                                           java.util.function.DoublePredicate far) {
        Settled settled = new Settled(settledShare, far);
        Optimiser.Run run = Optimiser.run(blocks, start, free, bounds, tolerance, settled);
        if (!settled.stopped) {
            return run;
        }
        return new Optimiser.Run(run.parameters(), run.layout(), run.x(), run.rss(), run.evaluations(),
                run.iterations(), SETTLED_STOP + " stopped once its sum of squares stopped moving, far from changing what is"
                        + " decided, after " + run.iterations() + " iterations");
    }
}
