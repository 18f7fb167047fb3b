package org.cardwright.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.Bias;
import org.cardwright.sim.BuiltinCapacitance;
import org.cardwright.sim.CapacitanceEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.NgspiceCapacitance;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * C-V verification against readings made by ngspice 39 AC analysis (the outside reference) from an invented
 * card, with a known stray capacitance added to every reading.
 */
class CapacitanceVerifierTest {
    /** Stray capacitance of the invented fixture [F]. */
    private static final double STRAY = 0.7e-12;
    private static final double FREQUENCY = 1e6;
    /** Same card, same equations: the built-in engine agrees with ngspice to 1e-6 relative, i.e. 1e-4 % [%]. */
    private static final double SAME_CARD_PERCENT = 1e-4;
    /** Residuals of a card whose CJO is scaled by s are exactly 100 (s - 1) % (no TT, no RS); rounding only [%]. */
    private static final double SCALED_CARD_PERCENT = 1e-9;
    private static final Map<Param, Double> CARD = Map.of(Param.IS, 1e-14, Param.CJO, 6e-12, Param.VJ, 0.7,
            Param.M, 0.38, Param.TNOM, 273.15 + 30);
    private static final double[] CELSIUS = {-20, 30, 100};

    private static List<CapacitanceMeasurement> readings;

    @BeforeAll
    static void simulateReadings() throws Exception {
        DiodeParameters p = DiodeParameters.of(CARD);
        List<Bias> biases = new ArrayList<>();
        for (double c : CELSIUS) {
            for (double v = -12; v <= 0.3 + 1e-9; v += 0.5) {
                biases.add(Bias.voltage(v, c + 273.15));
            }
        }
        List<Double> c = ngspice().capacitance(card(p), biases, FREQUENCY);
        readings = new ArrayList<>();
        for (int i = 0; i < biases.size(); i++) {
            readings.add(new CapacitanceMeasurement(biases.get(i).value(), c.get(i) + STRAY, biases.get(i).temperature(),
                    "cv.csv", i + 2));
        }
    }

    private static NgspiceCapacitance ngspice() {
        return new NgspiceCapacitance(new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60)), Simulators.tempDir("cap-verify"));
    }

    private static CardUnderTest card(DiodeParameters p) {
        return CardUnderTest.ngspice("dut", p);
    }

    private static CapacitanceVerification verify(CapacitanceEngine engine, DiodeParameters p) throws Exception {
        return new CapacitanceVerifier(engine, CapacitanceTolerance.DEFAULT).verify(card(p), readings, STRAY, FREQUENCY,
                List.of());
    }

    @Test
    void theGeneratingCardPassesWithBothEngines() throws Exception {
        for (CapacitanceEngine engine : List.of(ngspice(), new BuiltinCapacitance(SimulatorOptions.NGSPICE_DEFAULTS))) {
            CapacitanceVerification v = verify(engine, DiodeParameters.of(CARD));
            assertTrue(v.pass(), engine.name());
            assertEquals(CELSIUS.length, v.perTemperature().size());
            for (CapacitanceVerdict t : v.perTemperature()) {
                assertTrue(t.maxPercent() < SAME_CARD_PERCENT, engine.name() + ": " + t);
            }
            System.out.printf(Locale.ROOT, "C-V verification of the generating card with %s: worst %.2e %%%n",
                    engine.name(), v.perTemperature().stream().mapToDouble(CapacitanceVerdict::maxPercent).max().orElseThrow());
        }
    }

    @Test
    void aCardOffByLessThanTheRmsLimitPassesAndOneBeyondItFails() throws Exception {
        BuiltinCapacitance engine = new BuiltinCapacitance(SimulatorOptions.NGSPICE_DEFAULTS);
        CapacitanceVerification inside = verify(engine, DiodeParameters.of(CARD).with(Param.CJO, 6e-12 * 1.008));
        for (CapacitanceVerdict t : inside.perTemperature()) {
            assertEquals(0.8, t.rmsPercent(), SCALED_CARD_PERCENT + SAME_CARD_PERCENT);
        }
        assertTrue(inside.pass());
        CapacitanceVerification outside = verify(engine, DiodeParameters.of(CARD).with(Param.CJO, 6e-12 * 1.02));
        for (CapacitanceVerdict t : outside.perTemperature()) {
            assertEquals(2.0, t.rmsPercent(), SCALED_CARD_PERCENT + SAME_CARD_PERCENT);
            assertEquals(2.0, t.maxPercent(), SCALED_CARD_PERCENT + SAME_CARD_PERCENT);
            assertFalse(t.pass(), "2 % RMS is beyond the 1 % limit");
        }
        assertFalse(outside.pass());
        CapacitanceResidual first = outside.points().get(0);
        assertEquals("cv.csv", first.point().source());
        assertEquals(2.0, first.residualPercent(), SCALED_CARD_PERCENT + SAME_CARD_PERCENT);
    }

    @Test
    void aReadingBelowTheStrayIsAnErrorNamingFileAndLine() {
        List<CapacitanceMeasurement> one = List.of(new CapacitanceMeasurement(-5, 0.5e-12, 300, "cv.csv", 7));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new CapacitanceVerifier(new BuiltinCapacitance(SimulatorOptions.NGSPICE_DEFAULTS),
                        CapacitanceTolerance.DEFAULT).verify(card(DiodeParameters.of(CARD)), one, STRAY, FREQUENCY, List.of()));
        assertTrue(e.getMessage().startsWith("cv.csv:7: capacitance"), e.getMessage());
    }
}
