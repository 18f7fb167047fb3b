package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.List;
import org.cardwright.fit.FitFailedException;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.Bias;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.NgspiceCapacitance;
import org.cardwright.sim.process.SimulationException;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * A card that does not evaluate across its measured range is refused: the family of cards with a low VJ, at
 * temperatures where VJ(T) falls to or below zero, is checked against ngspice 39 itself, which prints NaN for
 * their capacitance (issue 11: "the card gives NaN capacitance at 125 degC, inside the measured range").
 */
class CardRangeTest {
    private static final double CELSIUS_TO_KELVIN = 273.15;
    /** The test frequency of the C-V check, 1 MHz (common practice, no source) [Hz]. */
    private static final double FREQUENCY = 1e6;

    @Test
    void refusesExactlyTheCardsNgspiceCannotEvaluate() throws Exception {
        SimulatorProcess process = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60));
        int refused = 0;
        int accepted = 0;
        for (double vj : new double[] {0.15, 0.25, 0.4, 0.8}) {
            DiodeParameters p = DiodeParameters.defaults().with(Param.IS, 3e-15).with(Param.N, 1.01).with(Param.RS, 1.5)
                    .with(Param.CJO, 1.6e-10).with(Param.VJ, vj).with(Param.M, 0.38).with(Param.TT, 4e-8);
            for (double celsius : new double[] {25, 85, 125}) {
                double kelvin = celsius + CELSIUS_TO_KELVIN;
                CardRange range = new CardRange(List.of(kelvin), -5, 0, Double.NaN, Double.NaN);
                boolean ours;
                try {
                    range.check("card VJ=" + vj, p, SimulatorOptions.NGSPICE_DEFAULTS, FREQUENCY);
                    ours = true;
                } catch (FitFailedException e) {
                    ours = false;
                    assertTrue(e.getMessage().contains(String.format(java.util.Locale.ROOT, "at %.2f degC", celsius)),
                            e.getMessage());
                    assertTrue(e.getMessage().contains("VJ(T) = "), e.getMessage());
                }
                boolean theirs;
                try {
                    List<Double> c = new NgspiceCapacitance(process, Simulators.tempDir("card-range"))
                            .capacitance(CardUnderTest.ngspice("T", p), List.of(Bias.voltage(-1, kelvin)), FREQUENCY);
                    theirs = c.stream().allMatch(Double::isFinite);
                } catch (SimulationException e) {
                    theirs = false;
                }
                assertEquals(theirs, ours, "VJ = " + vj + " V at " + celsius + " degC: ngspice evaluates the card: " + theirs);
                if (ours) {
                    accepted++;
                } else {
                    refused++;
                }
            }
        }
        assertTrue(refused > 0 && accepted > 0, "the family holds both kinds: refused " + refused + ", accepted " + accepted);
    }
}
