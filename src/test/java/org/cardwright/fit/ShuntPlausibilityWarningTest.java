package org.cardwright.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.junit.jupiter.api.Test;

/**
 * The plausibility warnings (an emission coefficient outside the device kind's usual range, NR below N) judge the
 * parameters that are written: on a shunted part the forward stage first describes the resistor's straight line with
 * a steep N or NR, and those values are gone once the shunt is fitted jointly. Over the shunted family
 * ({@link ShuntedParts}) every such warning of the result must hold for the final parameters, and every condition of
 * the final parameters must be warned about.
 */
class ShuntPlausibilityWarningTest {
    private static final long SEED = 4242;
    /** How much lower than the family's own the deeper sweeps start [1]. */
    private static final double DEEPER = 300;

    @Test
    void warningsComeFromTheFinalParameters() throws Exception {
        StringBuilder failures = new StringBuilder();
        int shuntsFound = 0;
        List<ShuntedParts.Part> parts = new ArrayList<>();
        for (ShuntedParts.Part p : ShuntedParts.family()) {
            parts.add(p);
            // the sweep started deeper, where the resistor carries all but a few per mille of the current: the
            // forward stage then bends N and NR furthest before the shunt is taken out
            parts.add(new ShuntedParts.Part(p.name() + "-deep", p.junction(), p.shunt(), p.celsius(),
                    p.lowCurrent() / DEEPER, p.highCurrent(), p.wanders()));
        }
        for (ShuntedParts.Part part : parts) {
            FitSettings settings = FitSettings.defaults();
            FitResult fit = new JunctionExtraction(settings, new CapacitanceOptions(0, 1e6))
                    .fit(ShuntedParts.data(part, SEED, true));
            shuntsFound += fit.shunt().isPresent() ? 1 : 0;
            List<String> got = fit.warnings().stream().filter(ShuntPlausibilityWarningTest::plausibility).toList();
            List<String> expected = expected(fit.parameters(), settings);
            System.out.printf(Locale.ROOT, "%s: shunt %s, %s%n  plausibility warnings %s%n", part.name(),
                    fit.shunt().map(s -> String.format(Locale.ROOT, "%.4g ohm", s.resistance())).orElse("none"),
                    fit.parameters().givenValues(), got);
            for (String w : got) {
                // every value a warning quotes is the value written (independent of the rule that raised it)
                java.util.regex.Matcher m = java.util.regex.Pattern.compile("\\b(NR|N) = (\\d+\\.\\d{3})").matcher(w);
                while (m.find()) {
                    String written = String.format(Locale.ROOT, "%.3f", fit.parameters().get(Param.valueOf(m.group(1))));
                    if (!written.equals(m.group(2))) {
                        failures.append(String.format(Locale.ROOT, " %s: a warning quotes %s = %s, the card has %s;",
                                part.name(), m.group(1), m.group(2), written));
                    }
                }
            }
            if (!got.equals(expected)) {
                failures.append(String.format(Locale.ROOT, " %s: warned %s, the written parameters call for %s;",
                        part.name(), got, expected));
            }
        }
        assertEquals(parts.size(), shuntsFound, "the family's shunts must be found for the test to mean anything");
        assertEquals("", failures.toString());
    }

    private static boolean plausibility(String warning) {
        return warning.contains("is outside the range usual for") || warning.contains("is below N =");
    }

    /** The plausibility conditions of {@code p}, in the words of the warnings (the rule of DeviceKind). */
    private static List<String> expected(DiodeParameters p, FitSettings settings) {
        List<String> out = new ArrayList<>();
        new ForwardExtraction(settings).plausibility(p, out);
        return out;
    }
}
