package org.cardwright.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Junction capacitance and ngspice's reported conductance at the junction voltage, against ngspice 39's own
 * device vectors ({@code @d1[vd]}, {@code @d1[gd]}, {@code @d1[cd]} of a DC sweep), plus the invariants of the
 * depletion formula.
 */
class CapacitanceModelTest {
    /** Issue 3 acceptance: 1e-6 relative. */
    private static final double RELATIVE_TOLERANCE = 1e-6;
    /** Continuity at FC·VJ holds to rounding [1]. */
    private static final double ROUNDING = 1e-13;
    /**
     * The slip between the exact derivative and ngspice's gd must exceed the tolerance a thousandfold to be told apart
     * [1].
     */
    private static final double SLIP_VISIBLE_FACTOR = 1e3;

    /** Invented set with recombination (ISR, so the conductance slip shows), IKF, TT and TNOM != 27. */
    private static final Map<Param, Double> SET = Map.ofEntries(Map.entry(Param.IS, 2e-15), Map.entry(Param.N, 1.03),
            Map.entry(Param.ISR, 8e-11), Map.entry(Param.NR, 2.2), Map.entry(Param.IKF, 5e-3),
            Map.entry(Param.TT, 12e-9), Map.entry(Param.CJO, 9e-12), Map.entry(Param.VJ, 0.66),
            Map.entry(Param.M, 0.44), Map.entry(Param.FC, 0.55), Map.entry(Param.TNOM, 273.15 + 45));

    @Test
    void reportedConductanceAndCapacitanceMatchNgspiceDeviceVectors() throws Exception {
        DiodeParameters p = DiodeParameters.of(SET);
        StringBuilder card = new StringBuilder(".model dut D(");
        for (Map.Entry<Param, Double> e : p.givenValues().entrySet()) {
            card.append(' ').append(e.getKey().keyword()).append('=')
                    .append(String.format(Locale.ROOT, "%.17g", e.getKey().toCardValue(e.getValue())));
        }
        card.append(")\n");
        double[] celsius = {-55, 27, 150};
        StringBuilder net = new StringBuilder("* device vectors of a DC sweep\nV1 a 0 DC 0\nD1 a 0 dut\n").append(card)
                .append(".control\nset wr_singlescale\noption numdgt=15\nset appendwrite\nsave @d1[vd] @d1[gd] @d1[cd]\n");
        for (double c : celsius) {
            net.append("option temp=").append(c).append('\n')
                    .append("dc V1 -15 0.9 0.05\nwrdata sweep.dat @d1[vd] @d1[gd] @d1[cd]\n");
        }
        net.append("quit\n.endc\n.end\n");
        Path dir = Simulators.tempDir("cap-device-vectors");
        SimulatorProcess.Result run = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60)).run(net.toString(), dir);
        assertTrue(run.warnings().isEmpty(), run.warnings().toString());
        List<String> lines = Files.readAllLines(dir.resolve("sweep.dat")).stream().filter(l -> !l.isBlank()).toList();
        int perSweep = lines.size() / celsius.length;
        assertEquals(perSweep * celsius.length, lines.size());
        double worstG = 0;
        double worstC = 0;
        double largestSlip = 0;
        for (int i = 0; i < lines.size(); i++) {
            String[] f = lines.get(i).trim().split("\\s+");
            double vd = Double.parseDouble(f[1]);
            double gd = Double.parseDouble(f[2]);
            double cd = Double.parseDouble(f[3]);
            DiodeAtTemperature d = TemperatureLaws.at(p, celsius[i / perSweep] + 273.15, SimulatorOptions.NGSPICE_DEFAULTS);
            double g = JunctionCurrent.reportedConductance(d, vd);
            double c = JunctionCapacitance.total(d, vd);
            assertEquals(gd, g, RELATIVE_TOLERANCE * Math.abs(gd), "gd at vd = " + vd);
            assertEquals(cd, c, RELATIVE_TOLERANCE * cd, "cd at vd = " + vd);
            worstG = Math.max(worstG, Math.abs(g / gd - 1));
            worstC = Math.max(worstC, Math.abs(c / cd - 1));
            largestSlip = Math.max(largestSlip, Math.abs(JunctionCurrent.conductance(d, vd) / gd - 1));
        }
        System.out.printf(Locale.ROOT, "device vectors: worst relative gd %.2e, cd %.2e over %d points; "
                + "the exact derivative differs from ngspice's gd by up to %.2e%n", worstG, worstC, lines.size(), largestSlip);
        // the slip must be visible in this set, else the test would not tell the two conductances apart
        assertTrue(largestSlip > SLIP_VISIBLE_FACTOR * RELATIVE_TOLERANCE, "slip " + largestSlip);
    }

    @Test
    void depletionCapacitanceIsContinuousAtFcVj() {
        for (double t : new double[] {218.15, 300.15, 423.15}) {
            DiodeAtTemperature d = TemperatureLaws.at(DiodeParameters.of(SET), t, SimulatorOptions.NGSPICE_DEFAULTS);
            double threshold = d.forwardCoefficient() * d.junctionPotential();
            double below = JunctionCapacitance.depletion(d, Math.nextDown(threshold));
            double at = JunctionCapacitance.depletion(d, threshold);
            assertEquals(below, at, ROUNDING * at, "at T = " + t);
            // and the value there is CJ (1 - FC)^-M, the power law's own value
            double expected = d.junctionCapacitance() * Math.pow(1 - d.forwardCoefficient(), -d.gradingCoefficient());
            assertEquals(expected, at, ROUNDING * expected);
        }
    }

    @Test
    void noCapacitanceWithoutCjoOrTt() {
        DiodeAtTemperature d = TemperatureLaws.at(DiodeParameters.of(Map.of(Param.IS, 1e-14)), 300.15,
                SimulatorOptions.NGSPICE_DEFAULTS);
        assertEquals(0.0, JunctionCapacitance.total(d, -3));
        assertEquals(0.0, JunctionCapacitance.total(d, 0.7));
    }
}
