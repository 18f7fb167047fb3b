package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Locale;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.ShuntedJunction;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.junit.jupiter.api.Test;

/**
 * Issue 9, item 7: a resistor between the terminals is found, fitted with the junction, and not invented where
 * there is none. The family ({@link ShuntedParts}) spans 10 kOhm to 10 MOhm, with and without RS, one to three
 * temperatures (the same sweep at each, the resistor visible only when cold; a wandering logger), with recombination
 * and high injection, with reverse leakage beside the forward data; its data are made by the built-in ngspice 39
 * equations. (The ngspice-made case, the written subcircuit and verify are in workflow/ShuntedCardWorkflowTest.)
 */
class ShuntFitTest {
    /** Issue 9 acceptance: shunt within 2 % from noisy data. */
    private static final double SHUNT_NOISY = 0.02;
    /** Issue 9 acceptance: noise-free variants 10x tighter. */
    private static final double SHUNT_NOISE_FREE = 0.002;
    /** Issue 9 acceptance: forward within 0.3 mV of the generating card over the measured range [V]. */
    private static final double FORWARD_NOISY = 0.3e-3;
    /** Noise-free variants: 10x tighter [V]. */
    private static final double FORWARD_NOISE_FREE = 0.03e-3;
    /**
     * The junction alone is compared where it carries at least half the measured current: below that the data
     * see mostly the resistor, and a junction voltage error there is the current error divided by its small
     * share (common practice, no source) [1].
     */
    private static final double JUNCTION_VISIBLE = 0.5;
    private static final long SEED = 90_7;

    @Test
    void everyShuntOfTheFamilyIsFoundAndFittedFromNoiseFreeData() throws Exception {
        for (ShuntedParts.Part part : ShuntedParts.family()) {
            check(part, false);
        }
    }

    @Test
    void everyShuntOfTheFamilyIsFoundAndFittedFromNoisyData() throws Exception {
        for (ShuntedParts.Part part : ShuntedParts.family()) {
            check(part, true);
        }
    }

    @Test
    void noShuntIsFoundOnThePartsWithoutOne() throws Exception {
        for (ShuntedParts.Part shunted : ShuntedParts.family()) {
            ShuntedParts.Part part = shunted.withoutShunt();
            for (boolean noisy : new boolean[] {false, true}) {
                FitResult r = fit(part, noisy);
                TermDecision d = decision(r);
                System.out.printf(Locale.ROOT, "%-14s noisy=%-5s no shunt: %s%n", part.name(), noisy, d.reason());
                assertTrue(r.shunt().isEmpty(), part.name() + " (noisy " + noisy + ") has no resistor, yet the fit found "
                        + r.shunt());
                assertTrue(!d.included(), "the decision says so: " + d);
            }
        }
    }

    private static void check(ShuntedParts.Part part, boolean noisy) throws Exception {
        FitResult r = fit(part, noisy);
        assertTrue(r.shunt().isPresent(), part.name() + " (noisy " + noisy + "): no shunt found: " + decision(r).reason());
        double got = r.shunt().get().resistance();
        double rel = got / part.shunt() - 1;
        System.out.printf(Locale.ROOT, "%-10s noisy=%-5s R %.6g ohm (truth %.6g, %+.4f %%, stderr %.3g)%n", part.name(),
                noisy, got, part.shunt(), 100 * rel, r.shunt().get().standardError());
        assertEquals(part.shunt(), got, (noisy ? SHUNT_NOISY : SHUNT_NOISE_FREE) * part.shunt(), part.name() + " shunt");
        assertTrue(r.shunt().get().standardError() > 0, "a standard error is given");

        double tolerance = noisy ? FORWARD_NOISY : FORWARD_NOISE_FREE;
        SimulatorOptions o = SimulatorOptions.NGSPICE_DEFAULTS;
        double worstWhole = 0;
        double worstJunction = 0;
        double worstAt = 0;
        for (FitPoint pt : ShuntedParts.forward(part, SEED, false)) {
            DiodeAtTemperature truth = TemperatureLaws.at(part.junction(), pt.temperature(), o);
            DiodeAtTemperature fitted = TemperatureLaws.at(r.parameters(), pt.temperature(), o);
            // the whole part (junction and resistor) at every measured current
            double whole = ShuntedJunction.voltageAtCurrent(fitted, pt.current(), r.shunt().get().conductance())
                    - ShuntedJunction.voltageAtCurrent(truth, pt.current(), 1 / part.shunt());
            if (Math.abs(whole) > worstWhole) {
                worstAt = pt.current();
            }
            worstWhole = Math.max(worstWhole, Math.abs(whole));
            // the junction alone (the plain card) at the current the generating junction carries there
            double junctionCurrent = pt.current() - pt.voltage() / part.shunt();
            if (junctionCurrent >= JUNCTION_VISIBLE * pt.current()) {
                double alone = DiodeSolver.voltageAtCurrent(fitted, junctionCurrent)
                        - DiodeSolver.voltageAtCurrent(truth, junctionCurrent);
                worstJunction = Math.max(worstJunction, Math.abs(alone));
            }
        }
        System.out.printf(Locale.ROOT, "           worst forward error: with resistor %.4f mV (at %.3g A), junction alone %.4f mV%n",
                worstWhole * 1e3, worstAt, worstJunction * 1e3);
        assertTrue(worstWhole <= tolerance, part.name() + ": junction and resistor off by " + worstWhole + " V");
        assertTrue(worstJunction <= tolerance, part.name() + ": the junction alone off by " + worstJunction + " V");
    }

    private static FitResult fit(ShuntedParts.Part part, boolean noisy) throws FitInputException {
        return new JunctionExtraction(FitSettings.defaults(), CapacitanceOptions.DEFAULT)
                .fit(ShuntedParts.data(part, SEED, noisy));
    }

    private static TermDecision decision(FitResult r) {
        List<TermDecision> d = r.terms().stream().filter(t -> t.term().equals(ShuntTerm.TERM)).toList();
        assertEquals(1, d.size(), "one decision about the shunt: " + r.terms());
        return d.get(0);
    }
}
