package org.cardwright.docs;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "Safety and docs": cautions stand where the danger is, the figures in them are right, and the user
 * documentation uses our own words for the library's state ("state file", "inputs", "outdated"), not a fab's
 * "recipe" or make's "stale" and "build record".
 */
class DocsSafetyAndWordsTest {
    /** The power figure in bench-logs.md is given to 0.1 W [W]. */
    private static final double POWER_ROUNDING = 0.05;
    /** The current in the caution is given to 3 decimals of an ampere: half a unit of the last [A]. */
    private static final double CURRENT_ROUNDING_A = 0.0005;

    private static String read(String file) throws Exception {
        return Files.readString(Simulators.projectDir().resolve(file));
    }

    /** The text of the section of {@code doc} that starts with {@code heading}, up to the next heading of any level. */
    private static String section(String doc, String heading) {
        int start = doc.indexOf(heading);
        assertTrue(start >= 0, "no section " + heading);
        Matcher next = Pattern.compile("(?m)^#+ ").matcher(doc);
        int end = next.find(start + heading.length()) ? next.start() : doc.length();
        return doc.substring(start, end);
    }

    @Test
    void theSeriesResistorCautionStatesThePowerOfTheBundledLog() throws Exception {
        String caution = section(read("docs/bench-logs.md"), "## 6. Series-resistor logs");
        assertTrue(caution.contains("Caution"), caution);
        // the row it names: Vsupply, Rseries, Vmeter; the file states the supply's source resistance
        Path log = Simulators.projectDir().resolve("fixtures/bench/simulated-meter-loading.csv");
        List<String> lines = Files.readAllLines(log);
        Matcher line = Pattern.compile("simulated-meter-loading.csv`,\\s+line (\\d+)\\)").matcher(caution);
        assertTrue(line.find(), caution);
        String[] row = lines.get(Integer.parseInt(line.group(1)) - 1).split(",");
        double supply = Double.parseDouble(row[0]);
        double resistor = Double.parseDouble(row[1]);
        double diode = Double.parseDouble(row[2]);
        double source = 0.05;  // "# supply source resistance = 0.05 ohm" in the file's header
        assertTrue(lines.stream().anyMatch(l -> l.startsWith("#") && l.contains("0.05 ohm")), "source resistance stated");
        double current = (supply - diode) / (resistor + source);
        double power = current * current * resistor;
        Matcher m = Pattern.compile("dissipates I²R = ([0-9.]+)² × ([0-9]+) ohm ≈ ([0-9.]+) W").matcher(caution);
        assertTrue(m.find(), caution);
        assertEquals(current, Double.parseDouble(m.group(1)), CURRENT_ROUNDING_A, "the current in the caution");
        assertEquals(resistor, Double.parseDouble(m.group(2)));
        assertEquals(power, Double.parseDouble(m.group(3)), POWER_ROUNDING, "the power in the caution");
        assertTrue(caution.contains(String.format(Locale.ROOT, "%.0f V drives", supply)), caution);
        assertTrue(caution.contains("local electrical codes"), caution);
    }

    @Test
    void cautionsStandWhereTheDangerIs() throws Exception {
        String readme = read("README.md");
        String safety = section(readme, "## Bench safety");
        assertTrue(safety.contains("frost") && safety.contains("condensation"), "cold chambers");
        assertTrue(safety.contains("licensed practice"), "defers to licensed practice");
        assertTrue(section(readme, "#### Reverse leakage and breakdown").contains("**Caution:** breakdown sweeps put high voltage"));
        assertTrue(section(readme, "#### Reverse-recovery records").contains("**Caution:**"));
        String fitting = read("docs/fitting.md");
        assertTrue(section(fitting, "## 3. Reverse stage").contains("Caution: high voltage"));
        assertTrue(section(fitting, "## 5. Recovery stage").contains("Caution"));
        String warning = read("src/main/java/org/cardwright/fit/JunctionExtraction.java");
        assertTrue(warning.contains("Caution: a part that warms itself this much is hot to the touch"), "the self-heating warning");
    }

    @Test
    void userDocsUseOurOwnWordsForTheLibraryState() throws Exception {
        Path root = Simulators.projectDir();
        List<Path> docs = new ArrayList<>(List.of(root.resolve("README.md"), root.resolve("fixtures/library/README.md")));
        try (Stream<Path> files = Files.list(root.resolve("docs"))) {
            files.filter(f -> f.toString().endsWith(".md") && !f.endsWith("bibliography.md")).forEach(docs::add);
        }
        List<String> found = new ArrayList<>();
        Pattern words = Pattern.compile("(?i)\\brecipes?\\b|\\bstale\\b|build records?");
        for (Path d : docs) {
            List<String> lines = Files.readAllLines(d);
            for (int i = 0; i < lines.size(); i++) {
                if (words.matcher(lines.get(i).replaceAll("`[^`]*`", "")).find()) {  // a quoted old keyword may be named
                    found.add(root.relativize(d) + ":" + (i + 1) + ": " + lines.get(i).trim());
                }
            }
        }
        assertEquals(List.of(), found);
    }
}
