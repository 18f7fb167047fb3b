package org.cardwright.notation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "In the code": one SPICE-suffix table. The powers are the ngspice 39 scale factors (Ngspice User's
 * Manual, version 39, chapter 2, "Ngspice scale factors"; recalled), and no other source file spells the table out
 * again.
 */
class SpiceSuffixTest {

    @Test
    void theTableHoldsTheNgspiceScaleFactors() {
        // Ngspice User's Manual 39, chapter 2 (recalled): T G Meg K m u n p f; M is milli
        String[][] expected = {{"t", "12"}, {"g", "9"}, {"meg", "6"}, {"k", "3"}, {"m", "-3"}, {"u", "-6"}, {"n", "-9"},
            {"p", "-12"}, {"f", "-15"}};
        assertEquals(expected.length, SpiceSuffix.values().length);
        for (String[] e : expected) {
            SpiceSuffix s = SpiceSuffix.of(e[0].toUpperCase(java.util.Locale.ROOT)).orElseThrow();
            assertEquals(Integer.parseInt(e[1]), s.power(), e[0]);
            assertEquals(Double.parseDouble("1e" + e[1]), SpiceNumbers.parse("1" + e[0]), e[0]);
        }
        assertEquals(SpiceSuffix.M, SpiceSuffix.leading("MA").orElseThrow(), "capital M is milli, as in ngspice");
        assertEquals(SpiceSuffix.MEG, SpiceSuffix.leading("Megohm").orElseThrow());
        assertTrue(SpiceSuffix.leading("V").isEmpty(), "a unit is no suffix");
    }

    /** A line that lists suffix letters with their powers, as the three copies of the table did. */
    private static final Pattern TABLE_LINE = Pattern.compile("\"meg\"\\s*(->|:|,)|case\\s+'[TGKMUNPF]'\\s*->\\s*number");

    @Test
    void noOtherSourceFileHoldsASuffixTable() throws Exception {
        Path main = Simulators.projectDir().resolve("src/main/java");
        List<String> found = new ArrayList<>();
        try (Stream<Path> files = Files.walk(main)) {
            for (Path f : files.filter(f -> f.toString().endsWith(".java")).toList()) {
                if (f.endsWith(Path.of("notation/SpiceSuffix.java"))) {
                    continue;
                }
                List<String> lines = Files.readAllLines(f);
                for (int i = 0; i < lines.size(); i++) {
                    if (TABLE_LINE.matcher(lines.get(i)).find()) {
                        found.add(main.relativize(f) + ":" + (i + 1) + ": " + lines.get(i).trim());
                    }
                }
            }
        }
        assertEquals(List.of(), found, "SPICE suffixes spelled out outside notation/SpiceSuffix");
    }
}
