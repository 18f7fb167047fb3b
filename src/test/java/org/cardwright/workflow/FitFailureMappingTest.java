package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.util.List;
import org.cardwright.fit.FitFailedException;
import org.cardwright.fit.FitInputException;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "In the code", left open after its second round: FitWorkflow turned every IllegalArgumentException and
 * ArithmeticException of an extraction into exit 4, "the data cannot be fitted", so a programming error read as a
 * verdict on the user's data. The fit itself turns the model's domain checks into its own failure type where it
 * evaluates the model (Optimiser.guarded, FitFailureBoundaryTest); the workflow maps only the fit's own types.
 */
class FitFailureMappingTest {
    private static final List<Path> FILES = List.of(Path.of("a.csv"), Path.of("b.csv"));

    @Test
    void theFitsOwnFailureNamesTheDataFiles() {
        FitFailedException e = assertThrows(FitFailedException.class, () -> FitWorkflow.extracting(FILES, () -> {
            throw new FitFailedException("no convergence after 200 iterations");
        }));
        assertEquals("a.csv, b.csv: the data cannot be fitted: no convergence after 200 iterations", e.getMessage());
    }

    @Test
    void anInputFailurePassesAsItIs() {
        FitInputException input = new FitInputException("a.csv:12: only 2 forward points");
        assertSame(input, assertThrows(FitInputException.class, () -> FitWorkflow.extracting(FILES, () -> {
            throw input;
        })));
    }

    @Test
    void aProgrammingErrorIsNotReadAsAFitFailure() {
        for (RuntimeException bug : List.of(new IllegalArgumentException("index -1"), new ArithmeticException("/ by zero"),
                new IllegalStateException("a bug"), new NullPointerException("a bug"))) {
            RuntimeException thrown = assertThrows(RuntimeException.class, () -> FitWorkflow.extracting(FILES, () -> {
                throw bug;
            }));
            assertSame(bug, thrown, "passes untouched: " + bug);
        }
    }
}
