package org.cardwright.data;

import static org.cardwright.data.BadFixtures.assertMentions;
import static org.cardwright.data.BadFixtures.assertRejected;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Every malformed series-resistor log in fixtures/bench/bad gives a one-line error naming file, line and raw
 * value, and nothing else: no points are returned.
 */
class BenchLogBadInputTest {
    /** A current of about 4.3 mA from decimal cells: double rounding only, about one ulp (8.7e-19 A) [A]. */
    private static final double CURRENT_ROUNDING_A = 1e-18;

    private static Path folder() {
        Path folder = BadFixtures.folder().getParent().resolve("bench").resolve("bad");
        assertTrue(Files.isDirectory(folder), "fixture folder missing: " + folder.toAbsolutePath());
        return folder;
    }

    /** Each fixture holds itself to its header: it is invented, says what it tests, and fails where it says. */
    @Test
    void everyBadBenchLogFailsWhereItsHeaderSays() throws IOException {
        Pattern expected = Pattern.compile("# Expected: DataFileException at line (\\d+)(, value '(.*)')?\\.");
        List<Path> fixtures = new ArrayList<>();
        try (Stream<Path> listing = Files.list(folder())) {
            listing.filter(p -> p.toString().endsWith(".csv")).sorted().forEach(fixtures::add);
        }
        assertTrue(fixtures.size() >= 18, "expected the full set of bad bench logs, found " + fixtures.size());
        for (Path fixture : fixtures) {
            List<String> head = Files.readAllLines(fixture, StandardCharsets.UTF_8).subList(0, 3);
            assertTrue(head.get(0).contains("invented"), fixture + ": " + head);
            assertTrue(head.get(1).startsWith("# Tests: "), fixture + ": " + head);
            Matcher m = expected.matcher(head.get(2));
            assertTrue(m.matches(), fixture + ": " + head.get(2));
            DataFileException e = assertRejected(fixture, ReadOptions.defaults(), Integer.parseInt(m.group(1)),
                    m.group(3));
            assertFalse(e.problem().isBlank(), fixture.toString());
        }
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "zero-resistance.csv            | series resistance must be positive (column 2 'Rseries')",
            "negative-resistance.csv        | series resistance must be positive",
            "meter-above-supply.csv         | meter reading above the supply in a forward log",
            "meter-below-supply-reverse.csv | meter reading below the supply in a reverse log",
            "missing-meter-resistance.csv   | series-resistor log without the meter input resistance",
            "missing-rseries-column.csv     | series-resistor log without a Rseries column",
            "missing-vmeter-column.csv      | series-resistor log without a Vmeter column",
            "negative-meter-resistance.csv  | the meter input resistance must be positive",
            "zero-meter-resistance.csv      | the meter input resistance must be positive",
            "meter-draws-everything.csv     | check the meter input resistance",
            "ambiguous-meter-resistance.csv | a lone M suffix is milli in SPICE",
            "ambiguous-ohm-unit.csv         | ambiguous unit 'MOHM'",
            "lead-resistance-in-log.csv     | 'lead resistance' is for 2-wire V-I exports",
            "current-column-in-log.csv      | column I has no place in a series-resistor log",
            "counts-without-resolution.csv  | add '# voltmeter resolution = ...'",
            "tolerance-without-percent.csv  | write a percentage",
            "setting-given-twice.csv        | setting 'meter input resistance' is given twice (lines 5 and 6)",
            "non-numeric-meter-reading.csv  | not a number in column 3 'Vmeter [V]'",
    })
    void eachBadBenchLogSaysWhatIsWrong(String name, String fragment) throws IOException {
        Path fixture = folder().resolve(name);
        String expectedLine = Files.readAllLines(fixture, StandardCharsets.UTF_8).get(2);
        Matcher m = Pattern.compile("# Expected: DataFileException at line (\\d+)(, value '(.*)')?\\.")
                .matcher(expectedLine);
        assertTrue(m.matches(), expectedLine);
        DataFileException e = assertRejected(fixture, ReadOptions.defaults(), Integer.parseInt(m.group(1)),
                m.group(3));
        assertMentions(e.getMessage(), fragment);
    }

    @Test
    void meterResistanceFromTheOptionsReplacesAMissingSetting() throws Exception {
        Path fixture = folder().resolve("missing-meter-resistance.csv");
        MeasurementFile f = new MeasurementReader(ReadOptions.defaults().withMeterResistance(10e6)).read(fixture);
        assertEquals(1, f.iv().size());
        // I = (5 - 0.71348) / 1000 - 0.71348 / 1e7, with Rsource 0 as the file states none
        assertEquals(4.28652e-3 - 7.1348e-8, f.iv().get(0).current(), CURRENT_ROUNDING_A);
    }

    @Test
    void withTheCorrectionOffAMissingMeterResistanceIsNoted() throws Exception {
        Path fixture = folder().resolve("missing-meter-resistance.csv");
        MeasurementFile f = new MeasurementReader(ReadOptions.defaults().withoutMeterLoadingCorrection()).read(fixture);
        assertEquals(4.28652e-3, f.iv().get(0).current(), CURRENT_ROUNDING_A);
        assertTrue(f.notices().stream().anyMatch(n -> n.message().contains("meter loading NOT corrected")
                && n.message().contains("not known")), f.notices().toString());
    }
}
