package org.cardwright.sim;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The built-in evaluator against ngspice 39 itself (the outside reference): terminal voltage at forced
 * currents from 1 nA to 1 A, -55 to 150 degC, for invented parameter sets that between them exercise every
 * forward term (IS, N, RS, ISR/NR with VJ and M, IKF, GMIN, TRS1/TRS2, EG/XTI, TNOM, BV knee).
 */
class BuiltinAgainstNgspiceTest {
    /** Issue 2 acceptance: 1e-6 relative in terminal voltage. */
    private static final double RELATIVE_TOLERANCE = 1e-6;
    /** Below this the relative test is meaningless (voltages near zero at tiny currents) [V]. */
    private static final double ABSOLUTE_FLOOR = 1e-9;

    static Stream<Arguments> parameterSets() {
        return Stream.of(
                Arguments.of("plain Shockley", Map.of(Param.IS, 1e-14, Param.N, 1.0)),
                Arguments.of("rectifier with RS", Map.of(Param.IS, 2.5e-9, Param.N, 1.8, Param.RS, 0.05)),
                Arguments.of("recombination", Map.of(Param.IS, 4e-15, Param.N, 1.02, Param.RS, 0.8,
                        Param.ISR, 2e-11, Param.NR, 2.1, Param.VJ, 0.7, Param.M, 0.4)),
                Arguments.of("high injection", Map.of(Param.IS, 1e-13, Param.N, 1.05, Param.RS, 0.2,
                        Param.IKF, 0.03)),
                Arguments.of("temperature laws", Map.of(Param.IS, 3e-12, Param.N, 1.3, Param.RS, 1.5,
                        Param.TRS1, 4e-3, Param.TRS2, 1e-5, Param.EG, 0.72, Param.XTI, 2.2,
                        Param.TNOM, 273.15 + 40)),
                Arguments.of("everything", Map.ofEntries(Map.entry(Param.IS, 8e-15), Map.entry(Param.N, 1.1),
                        Map.entry(Param.RS, 0.35), Map.entry(Param.ISR, 5e-12), Map.entry(Param.NR, 1.9),
                        Map.entry(Param.IKF, 0.2), Map.entry(Param.EG, 1.15), Map.entry(Param.XTI, 3.5),
                        Map.entry(Param.TRS1, 2e-3), Map.entry(Param.VJ, 0.8), Map.entry(Param.M, 0.35),
                        Map.entry(Param.BV, 75.0), Map.entry(Param.IBV, 1e-4), Map.entry(Param.NBV, 1.5),
                        Map.entry(Param.TNOM, 273.15 + 25))));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("parameterSets")
    void terminalVoltageAtForcedCurrentMatchesNgspice(String label, Map<Param, Double> values) throws Exception {
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60));
        DiodeParameters p = DiodeParameters.of(values);
        CardUnderTest card = CardUnderTest.ngspice("dut", p);
        List<Bias> biases = new ArrayList<>();
        for (double celsius : new double[] {-55, 27, 85, 150}) {
            for (int k = 0; k <= 18; k++) {
                biases.add(Bias.current(1e-9 * Math.pow(10, k / 2.0), celsius + 273.15));
            }
        }
        List<OperatingPoint> reference = new NgspiceEngine(ngspice, Simulators.tempDir("ngspice-vs-builtin")).dc(card, biases);
        List<OperatingPoint> ours = new BuiltinEngine(org.cardwright.model.SimulatorOptions.NGSPICE_DEFAULTS).dc(card, biases);
        double worst = 0;
        for (int i = 0; i < biases.size(); i++) {
            double ref = reference.get(i).voltage();
            double rel = Math.abs(ours.get(i).voltage() - ref) / Math.max(Math.abs(ref), ABSOLUTE_FLOOR);
            worst = Math.max(worst, rel);
            assertEquals(ref, ours.get(i).voltage(), RELATIVE_TOLERANCE * Math.max(Math.abs(ref), ABSOLUTE_FLOOR),
                    label + " at " + biases.get(i));
        }
        System.out.printf("builtin vs ngspice, %s: worst relative voltage difference %.2e over %d points%n",
                label, worst, biases.size());
        assertTrue(worst < RELATIVE_TOLERANCE);
    }

    /** A plain ngspice card written here independently of the card package, so the check stands alone. */
    static String ngspiceCard(String name, DiodeParameters p) {
        StringBuilder sb = new StringBuilder(".model ").append(name).append(" D(");
        for (Map.Entry<Param, Double> e : p.givenValues().entrySet()) {
            sb.append(' ').append(e.getKey().keyword()).append('=')
                    .append(String.format(java.util.Locale.ROOT, "%.17g", e.getKey().toCardValue(e.getValue())));
        }
        return sb.append(")\n").toString();
    }
}
