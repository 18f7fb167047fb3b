package org.cardwright.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.cardwright.card.CardReader;
import org.cardwright.card.Dialect;
import org.cardwright.card.ParsedCard;
import org.cardwright.cli.Main;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.sim.BuiltinCapacitance;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.testsupport.Simulators;
import org.cardwright.workflow.Engines;
import org.junit.jupiter.api.Test;

/**
 * compare against ngspice 39: the forward-voltage differences compare reports (built-in engine) agree with
 * ngspice's own simulation of both card files, read by ngspice as written, to 1e-6 V. The ngspice deck here is
 * independent of cardwright's ngspice engine: a logarithmic current sweep by a behavioural source (recipe (a)
 * of shared/reference/diode-model.md), not one operating point per bias.
 */
class CompareAgainstNgspiceTest {
    /** Required agreement of forward-voltage differences with ngspice [V] (the acceptance figure). */
    private static final double AGREEMENT = 1e-6;
    /** Relative agreement of leakage and capacitance between the two engines [1]: both solve the same equations
     * to far better than this; ngspice's tight RELTOL 1e-7 is the larger error. */
    private static final double ENGINE_RELATIVE = 1e-5;
    /**
     * The plan's forward-voltage limit: a difference beyond 5 mV is flagged (an input of this test, not a tolerance)
     * [V].
     */
    private static final double FORWARD_LIMIT_V = 5e-3;
    /** 1 mV: the two invented cards must differ by more than this somewhere, or the comparison proves nothing [V]. */
    private static final double CARDS_DIFFER_V = 1e-3;
    /** Picks the 25 degC row: temperatures are held as kelvin doubles computed the same way [K]. */
    private static final double SAME_TEMPERATURE_K = 1e-9;
    private static final List<Double> CELSIUS = List.of(-40.0, 25.0, 125.0);
    /** Longest ngspice may take [s]. */
    private static final long NGSPICE_TIMEOUT = 60;

    private static final Path FIXTURES = Simulators.projectDir().resolve("fixtures/compare");

    private static ParsedCard read(String file, Dialect d) throws IOException {
        return new CardReader().read(FIXTURES.resolve(file), d);
    }

    private static ComparisonPlan plan() {
        List<Double> k = CELSIUS.stream().map(c -> c + Ngspice39.CELSIUS_TO_KELVIN).toList();
        return new ComparisonPlan(k, 1e-9, 1e-1, List.of(1.0, 5.0, 20.0), List.of(0.0, 1.0, 5.0, 10.0),
                ComparisonPlan.DEFAULT_FREQUENCY, new ComparisonLimits(FORWARD_LIMIT_V, 2, 0.1, 0.02));
    }

    private static CardComparison builtin() throws Exception {
        return new CardComparer(new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS),
                new BuiltinCapacitance(SimulatorOptions.NGSPICE_DEFAULTS))
                .compare(read("cmp-a.lib", Dialect.NGSPICE), "cmp-a.lib", read("cmp-b.mod", Dialect.NGSPICE), "cmp-b.mod", plan());
    }

    /** Terminal voltage at 1e-9 .. 1e-1 A per decade, per temperature, as ngspice computes it for the card file as written. */
    private static Map<Double, List<Double>> ngspiceForward(Path ngspice, String cardFile, String model) throws Exception {
        Path dir = Simulators.tempDir("compare-ngspice-" + model.toLowerCase(Locale.ROOT));
        StringBuilder deck = new StringBuilder();
        deck.append("* forward sweep of ").append(cardFile).append(", current forced 1 nA .. 100 mA per decade\n");
        deck.append("Vx x 0 0\nB1 0 a I = pwr(10, V(x))\nD1 a 0 ").append(model).append('\n');
        deck.append(".include ").append(FIXTURES.resolve(cardFile)).append('\n');
        deck.append(".options reltol=1e-7 vntol=1e-10 abstol=1e-16\n.control\nset wr_singlescale\noption numdgt=15\nsave v(a)\n");
        for (int k = 0; k < CELSIUS.size(); k++) {
            deck.append("option temp=").append(CELSIUS.get(k)).append('\n');
            deck.append("dc Vx -9 -1 1\n");
            deck.append("wrdata t").append(k).append(".dat v(a)\n");
        }
        deck.append("quit\n.endc\n.end\n");
        Files.writeString(dir.resolve("deck.cir"), deck.toString(), StandardCharsets.UTF_8);
        Process p = new ProcessBuilder(ngspice.toString(), "-b", "deck.cir").directory(dir.toFile())
                .redirectErrorStream(true).redirectOutput(dir.resolve("ngspice.log").toFile()).start();
        assertTrue(p.waitFor(NGSPICE_TIMEOUT, TimeUnit.SECONDS), "ngspice timed out");
        assertEquals(0, p.exitValue(), Files.readString(dir.resolve("ngspice.log")));
        Map<Double, List<Double>> out = new HashMap<>();
        for (int k = 0; k < CELSIUS.size(); k++) {
            List<Double> v = new ArrayList<>();
            for (String line : Files.readAllLines(dir.resolve("t" + k + ".dat"))) {
                String[] f = line.trim().split("\\s+");
                if (f.length == 2) {
                    v.add(Double.parseDouble(f[1]));
                }
            }
            assertEquals(9, v.size(), "nine decades at " + CELSIUS.get(k) + " degC");
            out.put(CELSIUS.get(k) + Ngspice39.CELSIUS_TO_KELVIN, v);
        }
        return out;
    }

    @Test
    void forwardVoltageDifferencesAgreeWithNgspiceToAMicrovolt() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        CardComparison c = builtin();
        Map<Double, List<Double>> a = ngspiceForward(ngspice, "cmp-a.lib", "CMPA");
        Map<Double, List<Double>> b = ngspiceForward(ngspice, "cmp-b.mod", "cmpB");
        assertEquals(27, c.forward().size());
        double worst = 0;
        for (CardComparison.ForwardRow r : c.forward()) {
            int decade = (int) Math.round(Math.log10(r.current())) + 9;
            double ours = r.difference();
            double theirs = b.get(r.temperature()).get(decade) - a.get(r.temperature()).get(decade);
            worst = Math.max(worst, Math.abs(ours - theirs));
            assertEquals(theirs, ours, AGREEMENT, String.format(Locale.ROOT, "B-A at %.0e A, %.1f K", r.current(), r.temperature()));
        }
        System.out.printf(Locale.ROOT, "compare vs ngspice: largest forward-voltage difference disagreement %.3e V over 27 rows%n", worst);
        assertTrue(c.forward().stream().anyMatch(r -> Math.abs(r.difference()) > CARDS_DIFFER_V), "the cards must differ for the test to mean anything");
    }

    @Test
    void theNgspiceEngineGivesTheSameComparison() throws Exception {
        Simulators.requireNgspice();
        CardComparison ours = builtin();
        CardComparison theirs = new CardComparer(Engines.byName("ngspice"), org.cardwright.workflow.Engines.capacitanceByName("ngspice"))
                .compare(read("cmp-a.lib", Dialect.NGSPICE), "cmp-a.lib", read("cmp-b.mod", Dialect.NGSPICE), "cmp-b.mod", plan());
        for (int k = 0; k < ours.forward().size(); k++) {
            assertEquals(ours.forward().get(k).difference(), theirs.forward().get(k).difference(), AGREEMENT);
        }
        assertEquals(ours.leakage().size(), theirs.leakage().size());
        for (int k = 0; k < ours.leakage().size(); k++) {
            assertEquals(ours.leakage().get(k).a(), theirs.leakage().get(k).a(), ENGINE_RELATIVE * ours.leakage().get(k).a());
            assertEquals(ours.leakage().get(k).b(), theirs.leakage().get(k).b(), ENGINE_RELATIVE * ours.leakage().get(k).b());
        }
        for (int k = 0; k < ours.capacitance().size(); k++) {
            assertEquals(ours.capacitance().get(k).a(), theirs.capacitance().get(k).a(), ENGINE_RELATIVE * ours.capacitance().get(k).a());
            assertEquals(ours.capacitance().get(k).b(), theirs.capacitance().get(k).b(), ENGINE_RELATIVE * ours.capacitance().get(k).b());
        }
        for (int k = 0; k < ours.breakdown().size(); k++) {
            assertEquals(ours.breakdown().get(k).a(), theirs.breakdown().get(k).a(), AGREEMENT);
            assertEquals(ours.breakdown().get(k).b(), theirs.breakdown().get(k).b(), AGREEMENT);
        }
    }

    @Test
    void everySectionIsFilledAndDifferencesAreFlaggedAgainstTheLimits() throws Exception {
        CardComparison c = builtin();
        assertEquals(9, c.leakage().size());
        assertEquals(12, c.capacitance().size());
        assertEquals(3, c.breakdown().size());
        for (CardComparison.ForwardRow r : c.forward()) {
            assertEquals(Math.abs(r.difference()) > FORWARD_LIMIT_V, r.flagged());
        }
        for (CardComparison.BreakdownRow r : c.breakdown()) {
            // BV 110 V against 105 V: about 4.5 % apart, beyond the 2 % limit
            assertTrue(r.flagged(), "breakdown row at " + r.temperature());
            assertTrue(r.a() > 100 && r.b() > 100, r.a() + " " + r.b());
        }
        // zero-bias capacitance at TNOM-like 25 degC: 180 pF against about 170 pF, within 10 %
        CardComparison.CapacitanceRow zero = c.capacitance().stream()
                .filter(r -> r.reverseVoltage() == 0 && Math.abs(r.temperature() - 298.15) < SAME_TEMPERATURE_K).findFirst().orElseThrow();
        assertFalse(zero.flagged(), zero.toString());
    }

    @Test
    void aCardComparedWithItselfShowsNoDifferenceAndExitsZero() {
        StringWriter out = new StringWriter();
        String a = FIXTURES.resolve("cmp-a.lib").toString();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(new StringWriter()), "compare", a, a);
        assertEquals(0, code, out.toString());
        assertTrue(out.toString().contains("no difference beyond the limits"), out.toString());
    }

    @Test
    void theCommandExitsOneWhenDifferencesExceedTheLimits() {
        StringWriter out = new StringWriter();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(new StringWriter()), "compare",
                FIXTURES.resolve("cmp-a.lib").toString(), FIXTURES.resolve("cmp-b.mod").toString());
        assertEquals(1, code, out.toString());
        assertTrue(out.toString().contains("<- beyond limit"), out.toString());
        System.out.println(out);
    }
}
