package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The closed-form leakage screen of the shunt decision (docs/fitting.md, section 2.5) rests on one fact of the
 * trade (common practice, no source): in reverse bias the junction's own current flows the same way as the
 * resistor's, so every leakage point's |I|/|V| is at least G up to its noise. Checked on the whole shunted family
 * ({@link ShuntedParts}, data from the built-in ngspice 39 equations), noisy and noise-free: the screen's bound,
 * with its margin, never falls below the generating resistor's conductance, so it can never rule out a resistor
 * that is there.
 */
class ShuntScreenTest {
    private static final long SEED = 90_7;

    @Test
    void theLeakageBoundNeverExcludesTheGeneratingResistor() {
        for (ShuntedParts.Part part : ShuntedParts.family()) {
            for (boolean noisy : new boolean[] {false, true}) {
                double bound = 0;
                for (ReversePoint r : ShuntedParts.reverse(part, SEED, noisy)) {
                    if (r.voltage() < 0 && r.current() < 0) {
                        bound = Math.max(bound, r.current() / r.voltage());
                    }
                }
                double g = 1 / part.shunt();
                assertTrue(ShuntTerm.LEAKAGE_MARGIN * bound >= g, part.name() + " (noisy " + noisy + "): leakage bound "
                        + bound + " S times " + ShuntTerm.LEAKAGE_MARGIN + " is below the resistor's " + g + " S");
            }
        }
    }
}
