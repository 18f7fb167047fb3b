package org.cardwright.corpus;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.DynamicTest.dynamicTest;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.testsupport.Simulators;
import org.cardwright.verify.JunctionVerification;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

/**
 * Issue 9's acceptance on the invented corpus (fixtures/corpus, eighteen parts simulated in ngspice 39 by
 * verify/tools/MakeCorpus.java; the generating cards are the reference): every part is fitted from its noisy
 * and from its noise-free data and compared with its generating card through the built-in engine, which
 * computes ngspice 39's equations (built-in against ngspice: 1e-8 relative, see sim tests); the noisy fit's
 * card is verified with the built-in and the ngspice engine and must pass, and with IS moved by 3 standard
 * errors must fail. The figures of every part are in docs/corpus.md (written by {@link CorpusTable}).
 */
class CorpusAcceptanceTest {
    /** Issue 9: forward voltage of the fitted card within 0.3 mV of the generating card (noisy data) [mV]. */
    private static final double FORWARD_MV = 0.3;
    /** Issue 9: breakdown voltage within 0.05 % at every measured current and temperature [%]. */
    private static final double BREAKDOWN_PCT = 0.05;
    /** Issue 9: capacitance within 1 % at every measured bias and temperature [%]. */
    private static final double CAPACITANCE_PCT = 1.0;
    /** Issue 9: TT within 5 % where the data show it [%]. */
    private static final double TT_PCT = 5.0;
    /** Issue 9: the parallel (shunt) resistor within 2 % [%]. */
    private static final double SHUNT_PCT = 2.0;
    /** Issue 9: noise-free data, every target ten times tighter [1]. */
    private static final double NOISE_FREE_FACTOR = 0.1;

    /**
     * Targets the extraction still misses on this corpus (issue 9 stays open for them): the part's label and the
     * figure that misses, with the figure as last measured. Every other figure of every part is held to the
     * issue's targets; each entry here must still miss its target, so that a fix has to remove its entry (the
     * test fails when a listed figure starts to meet it), and nothing else may slip.
     */
    private static final Map<String, String> KNOWN_OPEN = Map.of(
            // 7 mV of meter jitter on a 6.8 V knee, 60 rows: the fit is the least-squares optimum of the data
            // (BreakdownNoiseFloorTest; IBV trades exactly with BV and TCV there, so it costs nothing), and that
            // optimum is itself 0.072 % off on this draw; about 3 draws in 10 of the same design miss 0.05 %
            "gorse", "BV [%]",
            // 0.3 pF part beside 0.5 pF of fixture stray with 0.02 pF reading noise, a quarter of the smallest
            // reading: the fit equals the least-squares fit of CJO, VJ, M to the readings (4.45 %); fresh draws of the
            // same design give a median worst error of 3.8 % and meet 1 % about once in 75 (noise-free: exact)
            "rowan", "C [%]");

    @TestFactory
    List<DynamicTest> everyCorpusPartIsExtractedAndVerified() throws Exception {
        Simulators.requireNgspice();
        Path project = Simulators.projectDir();
        List<DynamicTest> tests = new ArrayList<>();
        for (CorpusFigures.Part part : CorpusFigures.parts(project)) {
            for (boolean noisy : new boolean[] {true, false}) {
                String label = part.name() + (noisy ? "" : " (noise-free)");
                tests.add(dynamicTest(label, () -> check(part, noisy, label)));
            }
        }
        return tests;
    }

    private static void check(CorpusFigures.Part part, boolean noisy, String label) throws Exception {
        double k = noisy ? 1 : NOISE_FREE_FACTOR;
        Path dir = Simulators.tempDir("corpus-" + part.name() + (noisy ? "" : "-noisefree"));
        CorpusFigures.Figures f = CorpusFigures.of(part, noisy, dir);
        assertNull(f.refused(), label + ": the fit refused the data");
        List<String> failures = new ArrayList<>();
        within(failures, "forward [mV]", f.forwardMv(), FORWARD_MV * k);
        within(failures, "BV [%]", f.breakdownPct(), BREAKDOWN_PCT * k);
        within(failures, "C [%]", f.capacitancePct(), CAPACITANCE_PCT * k);
        within(failures, "TT [%]", f.ttPct(), TT_PCT * k);
        within(failures, "shunt [%]", f.shuntPct(), SHUNT_PCT * k);
        if (noisy) {
            for (String engine : List.of("builtin", "ngspice")) {
                try {
                    JunctionVerification v = CorpusFigures.verify(part, f.card(), engine);
                    if (!v.pass()) {
                        failures.add("verify --engine " + engine + " fails the fitted card");
                    }
                } catch (org.cardwright.sim.process.SimulationException e) {
                    failures.add("verify --engine " + engine + " could not simulate the fitted card: "
                            + String.valueOf(e.getMessage()).lines().findFirst().orElse(""));
                }
            }
            Path moved = CorpusFigures.movedCard(f, dir);
            if (CorpusFigures.verify(part, moved, "builtin").pass()) {
                failures.add("verify passes the card with IS moved by 3 standard errors");
            }
        }
        String open = KNOWN_OPEN.get(label);
        if (open != null) {
            boolean stillMisses = failures.removeIf(miss -> miss.startsWith(open + " "));
            assertTrue(stillMisses, label + ": " + open + " now meets its target; remove the entry from KNOWN_OPEN");
            System.out.println("corpus: " + label + ": known open gap: " + open + " (issue 9)");
        }
        assertTrue(failures.isEmpty(), label + ": " + String.join("; ", failures));
        assertFalse(Files.notExists(f.card()));
    }

    private static void within(List<String> failures, String what, double value, double limit) {
        if (!Double.isNaN(value) && !(value <= limit)) {
            failures.add(String.format(java.util.Locale.ROOT, "%s %.4g beyond %.4g", what, value, limit));
        }
    }
}
