package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The propagated residual uncertainty against a Monte Carlo propagation of the same errors (JCGM 101:2008, "Evaluation
 * of measurement data - Supplement 1: propagation of distributions using a Monte Carlo method"; citation recalled):
 * correlated Gaussian errors in V and I, pushed through r = dV - s dI/I, the first-order residual at the measured
 * current.
 */
class PointUncertaintyTest {
    private static final int SAMPLES = 200_000;
    /** Relative standard error of a standard deviation estimated from n samples is 1/sqrt(2n), 0.16 % here; five of
     * those [1]. */
    private static final double MONTE_CARLO_RELATIVE = 5 / Math.sqrt(2.0 * SAMPLES);
    /** Double rounding of a difference of two logarithms over their difference [V]. */
    private static final double ROUNDING_VOLTS = 1e-15;

    @Test
    void theFirstOrderFormulaMatchesAMonteCarloPropagation() {
        Random random = new Random(11);
        double current = 2e-3;
        for (double[] c : new double[][] {{1e-3, 1e-5, 0.0, 0.026}, {2e-4, 4e-5, 0.6, 0.05}, {5e-4, 2e-5, -0.8, 0.03},
                {1e-3, 3e-5, 0.9, -0.02}}) {
            double sv = c[0];
            double si = c[1];
            double rho = c[2];
            double slope = c[3];
            double sum = 0;
            double sum2 = 0;
            for (int k = 0; k < SAMPLES; k++) {
                double z1 = random.nextGaussian();
                double z2 = rho * z1 + Math.sqrt(1 - rho * rho) * random.nextGaussian();
                double r = sv * z1 - slope * si * z2 / current;
                sum += r;
                sum2 += r * r;
            }
            double sd = Math.sqrt(sum2 / SAMPLES - (sum / SAMPLES) * (sum / SAMPLES));
            double got = PointUncertainty.residualSigma(sv, current, si, rho, slope, 1e-3);
            assertEquals(sd, got, MONTE_CARLO_RELATIVE * sd, "sv " + sv + ", si " + si + ", rho " + rho + ", s " + slope);
        }
    }

    @Test
    void withoutAStatedCurrentUncertaintyTheVoltageSigmaOrTheDefaultStands() {
        assertEquals(2e-4, PointUncertainty.residualSigma(2e-4, 1e-3, Double.NaN, 0, 0.03, 1e-3), 0);
        assertEquals(1e-3, PointUncertainty.residualSigma(Double.NaN, 1e-3, Double.NaN, 0, 0.03, 1e-3), 0);
    }

    @Test
    void slopesAreTheLocalDerivativeWithinEachSweep() {
        // an exact exponential sweep, V = n Vt ln(I/Is): dV/d(ln I) = n Vt everywhere (Shockley, no source needed)
        double nvt = 0.0257 * 1.3;
        double[] i = {1e-9, 1e-8, 1e-7, 1e-6, 1e-9, 1e-8};
        double[] v = new double[i.length];
        for (int k = 0; k < i.length; k++) {
            v[k] = nvt * Math.log(i[k] / 1e-14) + (k >= 4 ? 0.1 : 0);
        }
        double[] s = PointUncertainty.slopes(i, v, new String[] {"a", "a", "a", "a", "b", "b"});
        assertArrayEquals(new double[] {nvt, nvt, nvt, nvt, nvt, nvt}, s, ROUNDING_VOLTS);
        assertEquals(Double.NaN, PointUncertainty.slopes(new double[] {1e-3}, new double[] {0.7}, new String[] {"x"})[0]);
    }
}
