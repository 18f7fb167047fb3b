package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Set;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "In the code": the fit stages catch their own failure type, never RuntimeException, so a programming
 * error is not read as "could not be fitted". The model's domain checks and Commons Math's numerical failures
 * (IllegalArgumentException, ArithmeticException) become a FitFailedException where the fit evaluates the model; any
 * other exception passes through.
 */
class FitFailureBoundaryTest {
    /** A one-residual block that fails the way it is told to. */
    private record Failing(RuntimeException failure) implements ResidualBlock {
        @Override
        public String label() {
            return "failing";
        }

        @Override
        public int size() {
            return 1;
        }

        @Override
        public Set<Param> dependsOn() {
            return Set.of(Param.IS);
        }

        @Override
        public double[] residuals(DiodeParameters p) {
            throw failure;
        }
    }

    private static void run(RuntimeException failure) {
        Optimiser.run(List.of(new Failing(failure)), DiodeParameters.of(java.util.Map.of(Param.IS, 1e-14)), List.of(Param.IS),
                p -> new double[] {1e-20, 1e-3});
    }

    @Test
    void theModelsDomainFailuresAreFitFailures() {
        FitFailedException a = assertThrows(FitFailedException.class, () -> run(new IllegalArgumentException("IS is NaN")));
        assertTrue(a.getMessage().contains("IS is NaN"), a.getMessage());
        assertThrows(FitFailedException.class, () -> run(new ArithmeticException("overflow")));
        assertThrows(FitFailedException.class, () -> Optimiser.parameters(java.util.Map.of(Param.IS, Double.NaN)));
    }

    @Test
    void aProgrammingErrorIsNotReadAsAFitFailure() {
        assertThrows(IllegalStateException.class, () -> run(new IllegalStateException("a bug")));
        assertThrows(NullPointerException.class, () -> run(new NullPointerException("a bug")));
        assertThrows(IndexOutOfBoundsException.class, () -> run(new IndexOutOfBoundsException("a bug")));
    }
}
