package org.cardwright.sim;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Reverse current of the built-in evaluator against ngspice 39 (issue 3 acceptance): through the cubic
 * region and breakdown, including cases where the knee iteration moves BV, -55 to 150 degC, both by forced
 * voltage and by forced current.
 */
class ReverseAgainstNgspiceTest {
    /** Issue 3 acceptance: 1e-6 relative. */
    private static final double RELATIVE_TOLERANCE = 1e-6;

    static Stream<Arguments> parameterSets() {
        return Stream.of(
                // knee moves BV: IBV large against IS*BV/Vt is false here, so the iteration runs
                Arguments.of("avalanche, knee iterates", Map.of(Param.IS, 1e-9, Param.N, 1.0, Param.BV, 10.0,
                        Param.IBV, 1e-6, Param.NBV, 2.0, Param.RS, 0.3)),
                Arguments.of("zener with TCV", Map.of(Param.IS, 2e-14, Param.N, 1.05, Param.BV, 5.6,
                        Param.IBV, 5e-3, Param.NBV, 1.3, Param.TCV, 2.5e-3, Param.RS, 1.2, Param.TNOM, 298.15)),
                Arguments.of("rectifier, TLEV 1", Map.of(Param.IS, 2.5e-9, Param.N, 1.8, Param.BV, 100.0,
                        Param.IBV, 1e-3, Param.NBV, 2.0, Param.TCV, 4e-4, Param.TLEV, 1.0, Param.RS, 10.0)),
                Arguments.of("with IKR", Map.of(Param.IS, 1e-12, Param.BV, 40.0, Param.IBV, 1e-5,
                        Param.IKR, 2e-3, Param.RS, 0.5)));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("parameterSets")
    void reverseCurrentMatchesNgspice(String label, Map<Param, Double> values) throws Exception {
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60));
        DiodeParameters p = DiodeParameters.of(values);
        CardUnderTest card = CardUnderTest.ngspice("dut", p);
        List<Bias> biases = new ArrayList<>();
        double bv = p.get(Param.BV);
        for (double celsius : new double[] {-55, 27, 85, 150}) {
            double t = celsius + Ngspice39.CELSIUS_TO_KELVIN;
            for (int k = 1; k <= 40; k++) {
                biases.add(Bias.voltage(-bv * 1.08 * k / 40.0, t));
            }
            // small reverse voltages: the cubic region near -3 N Vt
            for (double v : new double[] {-0.01, -0.05, -0.08, -0.12, -0.3}) {
                biases.add(Bias.voltage(v, t));
            }
            // forced currents deep in breakdown
            DiodeAtTemperature d = TemperatureLaws.at(p, t, SimulatorOptions.NGSPICE_DEFAULTS);
            for (double i : new double[] {-1e-6, -1e-5, -1e-4, -1e-3, -1e-2}) {
                if (-i > 100 * d.saturationCurrent()) {
                    biases.add(Bias.current(i, t));
                }
            }
        }
        List<OperatingPoint> ref = new NgspiceEngine(ngspice, Simulators.tempDir("reverse-vs-ngspice")).dc(card, biases);
        // same RELTOL as the ngspice run: it is also the breakdown-knee tolerance
        List<OperatingPoint> ours = new BuiltinEngine(NgspiceEngine.CONVERGENCE).dc(card, biases);
        double worst = 0;
        for (int i = 0; i < biases.size(); i++) {
            boolean voltageForced = biases.get(i).forcing() == Bias.Forcing.VOLTAGE;
            double a = voltageForced ? ours.get(i).current() : ours.get(i).voltage();
            double b = voltageForced ? ref.get(i).current() : ref.get(i).voltage();
            double rel = Math.abs(a - b) / Math.abs(b);
            worst = Math.max(worst, rel);
            assertTrue(rel <= RELATIVE_TOLERANCE, label + " at " + biases.get(i) + ": builtin " + a + ", ngspice " + b);
        }
        System.out.printf("reverse, %s: worst relative difference %.2e over %d points%n", label, worst, biases.size());
    }
}
