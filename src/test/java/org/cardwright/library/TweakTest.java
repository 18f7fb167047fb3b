package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.cardwright.cli.Main;
import org.cardwright.model.Param;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Tweaks: the cost is reported per card and temperature, before and after. Checks rest on least squares: the
 * untweaked fit minimises the sum of squared residuals, so any tweak cannot lower it; refitting the others around
 * a pinned value can only do better than leaving them as they were (the render-only card is one of the candidates
 * the refit searches).
 */
class TweakTest {
    /** Slack for the optimiser's stopping tolerance, as a fraction of the sum of squares [1]. */
    private static final double OPTIMISER_SLACK = 1e-6;
    /** The same untweaked fit run twice: deterministic, so only summation rounding may differ [1]. */
    private static final double SAME_FIT_RELATIVE = 1e-12;
    /** The fitted and tweaked values are printed to 7 significant digits: 1e-6 relative covers their rounding [1]. */
    private static final double SEVEN_DIGITS_RELATIVE = 1e-6;
    /** A tweak applied to a value of about 2 ohm: double rounding only, about 2 ulp [ohm]. */
    private static final double TWEAK_ROUNDING_OHM = 1e-15;

    private static Path part() throws Exception {
        Path root = Simulators.tempDir("library-tweak");
        return SyntheticParts.write(root, SyntheticParts.twenty().get(4));
    }

    private static double sumOfSquares(TweakReport r, boolean after) {
        return r.cards().get(0).rows().stream().mapToDouble(x -> x.points() * Math.pow(after ? x.rmsAfter() : x.rmsBefore(), 2)).sum();
    }

    @Test
    void aNudgeCostsResidualAndARefitRecoversPartOfIt() throws Exception {
        Path device = part();
        TweakReport render = TweakReport.run(device, Tweak.parse("RS=+20%", false), Optional.empty(), false);
        TweakReport refit = TweakReport.run(device, Tweak.parse("RS=+20%", true), Optional.empty(), false);
        assertEquals(2, render.cards().get(0).rows().size(), "one row per temperature");
        double base = sumOfSquares(render, false);
        assertEquals(base, sumOfSquares(refit, false), SAME_FIT_RELATIVE * base, "the same untweaked fit before");
        assertTrue(sumOfSquares(render, true) > base, "a nudge away from the fit costs residual");
        assertTrue(sumOfSquares(refit, true) >= base * (1 - OPTIMISER_SLACK), "a refit cannot beat the free fit");
        assertTrue(sumOfSquares(refit, true) <= sumOfSquares(render, true) * (1 + OPTIMISER_SLACK),
                "refitting the others does at least as well as leaving them");
        assertEquals(render.fitted(), refit.fitted());
        double fitted = org.cardwright.card.SpiceNumbers.parse(render.fitted());
        assertEquals(1.2 * fitted, org.cardwright.card.SpiceNumbers.parse(render.value()), SEVEN_DIGITS_RELATIVE * fitted);
        assertTrue(render.text().contains("RMS before"), render.text());
    }

    @Test
    void aPinWritesCardsToAnotherFolderButNeverIntoTheLibrary() throws Exception {
        Path device = part();
        Path out = device.getParent().resolve("try");
        TweakReport r = TweakReport.run(device, Tweak.parse("RS=0.5", true), Optional.of(out), false);
        assertEquals(1, r.written().size());
        assertTrue(Files.readString(out.resolve("TP05.ngspice.lib")).contains("+ RS=0.5\n"));
        Exception e = assertThrows(org.cardwright.workflow.OutputException.class,
                () -> TweakReport.run(device, Tweak.parse("RS=0.5", true), Optional.of(device.getParent()), false));
        assertTrue(e.getMessage().contains("run cardwright build"), e.getMessage());
    }

    @Test
    void theCommandPrintsTheCostPerTemperature() throws Exception {
        Path device = part();
        StringWriter out = new StringWriter();
        int code = Main.execute(new PrintWriter(out), new PrintWriter(new StringWriter()), "tweak", device.toString(),
                "--set", "N+=0.01", "--render-only");
        assertEquals(0, code, out.toString());
        assertTrue(out.toString().matches("(?s).*\\n\\s+25\\s+41\\s.*\\n\\s+85\\s+41\\s.*"), out.toString());
    }

    @Test
    void tweakForms() {
        assertEquals(new Tweak(Param.RS, Tweak.Kind.PIN, 0.6, true), Tweak.parse("RS=0.6", true));
        assertEquals(new Tweak(Param.RS, Tweak.Kind.PIN, 0.05, true), Tweak.parse("rs = 50m", true));
        assertEquals(new Tweak(Param.IS, Tweak.Kind.NUDGE_RELATIVE, -0.05, false), Tweak.parse("IS=-5%", false));
        assertEquals(new Tweak(Param.N, Tweak.Kind.NUDGE_ABSOLUTE, -0.02, true), Tweak.parse("N-=0.02", true));
        assertEquals(1.1 * 2.0, Tweak.parse("RS=+10%", true).apply(2.0), TWEAK_ROUNDING_OHM);
        assertEquals(2.05, Tweak.parse("RS+=50m", true).apply(2.0), TWEAK_ROUNDING_OHM);
        assertThrows(IllegalArgumentException.class, () -> Tweak.parse("TNOM=25", true));
        assertThrows(IllegalArgumentException.class, () -> Tweak.parse("RS=ten", true));
        assertThrows(IllegalArgumentException.class, () -> Tweak.parse("RS", true));
    }
}
