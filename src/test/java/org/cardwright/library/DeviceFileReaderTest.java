package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.cardwright.card.Dialect;
import org.cardwright.fit.DeviceKind;
import org.cardwright.fit.ParameterRule;
import org.cardwright.model.Param;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Device files: the documented example reads to the expected values; every fault names the file, the line and the key or value. */
class DeviceFileReaderTest {
    private static final Path HERE = Path.of("parts/X1.device.yaml");
    /** Kelvin offset of degrees C, exact by definition of the Celsius scale (SI brochure). */
    private static final double ZERO_CELSIUS = 273.15;
    /** Tolerance of a temperature read from text and shifted by 273.15 K [K]: a few ulp. */
    private static final double KELVIN_TOLERANCE = 1e-12;
    /**
     * A number of order 1e-3 to 1e-2 read from the YAML text as a decimal: double rounding only, with room [1, in the
     * value's own unit].
     */
    private static final double DECIMAL_ROUNDING = 1e-15;
    /**
     * 25 degC in kelvin from the device file's temperature: double rounding only, with room (ulp of 298 K is 5.7e-14
     * K) [K].
     */
    private static final double BENCH_LOG_KELVIN_TOLERANCE = 1e-9;

    private static final String GOOD = String.join("\n",
            "# a part",                                 // 1
            "model: X1",                                // 2
            "kind: schottky",                           // 3
            "data:",                                    // 4
            "  - file: data/x1-25C.csv",                // 5
            "    temperature: 25",                      // 6
            "  - file: data/x1-rev.csv",                // 7
            "    kind: reverse",                        // 8
            "  - file: data/x1-log.csv",                // 9
            "    kind: bench-log",                      // 10
            "    temperature: 25",                      // 11
            "rules: [RS=0.5, \"N=1..2\", IKF=off]",     // 12
            "dialects: [ngspice, gnucap]",              // 13
            "digits: 8",                                // 14
            "cards: out",                               // 15
            "tolerance:",                               // 16
            "  forward-rms-mv: 3",                      // 17
            "  leakage-factor: 4",                      // 18
            "tweak:",                                   // 19
            "  set: N=-2%",                             // 20
            "  then: render",                           // 21
            "");

    private static DeviceFile read(String text) throws DeviceFileException {
        return new DeviceFileReader().parse(text, HERE);
    }

    @Test
    void theDocumentedKeysReadToTheirValues() throws Exception {
        DeviceFile d = read(GOOD);
        assertEquals("X1", d.model());
        assertEquals(DeviceKind.SCHOTTKY, d.kind());
        assertEquals(3, d.data().size());
        assertEquals(25 + ZERO_CELSIUS, d.data().get(0).temperature().getAsDouble(), KELVIN_TOLERANCE);
        assertEquals(DataKindName.FORWARD, d.data().get(0).kind());
        assertEquals(DataKindName.REVERSE, d.data().get(1).kind());
        assertEquals(DataKindName.BENCH_LOG, d.data().get(2).kind());
        assertEquals(298.15, d.data().get(2).temperature().getAsDouble(), BENCH_LOG_KELVIN_TOLERANCE);
        assertEquals(7, d.data().get(1).line());
        assertEquals(List.of(Param.RS, Param.N, Param.IKF), d.rules().stream().map(ParameterRule::param).toList());
        assertEquals(ParameterRule.Kind.BOUNDED, d.rules().get(1).kind());
        assertEquals(List.of(Dialect.NGSPICE, Dialect.GNUCAP), d.dialects());
        assertEquals(8, d.digits());
        assertEquals(3e-3, d.tolerances().forward().rms(), DECIMAL_ROUNDING);
        assertEquals(5e-3, d.tolerances().forward().max(), DECIMAL_ROUNDING, "the default per-point limit");
        assertEquals(4, d.tolerances().leakageFactor());
        assertEquals(Tweak.Kind.NUDGE_RELATIVE, d.tweak().orElseThrow().kind());
        assertEquals(-0.02, d.tweak().orElseThrow().amount(), DECIMAL_ROUNDING);
        assertTrue(!d.tweak().orElseThrow().refit());
        assertTrue(d.cardPath(Dialect.GNUCAP).endsWith(Path.of("parts/out/X1.gnucap.lib")));
    }

    @Test
    void layoutCommentsAndQuotingDoNotChangeTheCanonicalSettings() throws Exception {
        String reordered = String.join("\n",
                "dialects:", "  - ngspice", "  - gnucap", "model: 'X1'   # same part", "kind: schottky", "digits: 8",
                "cards: out", "rules:", "  - RS=500m", "  - N=1..2", "  - IKF=off",
                "tweak: {then: render, set: \"N=-2%\"}",
                "tolerance: {leakage-factor: 4, forward-rms-mv: 3.0}",
                "data:", "  - {file: data/x1-25C.csv, kind: forward, temperature: 25.0}",
                "  - {file: data/x1-rev.csv, kind: reverse}",
                "  - {file: data/x1-log.csv, kind: bench-log, temperature: 25}", "");
        assertEquals(read(GOOD).canonicalSettings(), read(reordered).canonicalSettings());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "unknown top-level key | model: X1\\ndata: [{file: a.csv}]\\ncolour: red\\n | 3 | unknown key 'colour'",
        "unknown key in a data entry | model: X1\\ndata:\\n  - file: a.csv\\n    temprature: 25\\n | 4 | unknown key 'temprature' under 'data[1]'",
        "unknown key in tolerance | model: X1\\ndata: [{file: a.csv}]\\ntolerance:\\n  forward-rms: 2\\n | 4 | unknown key 'forward-rms' under 'tolerance'",
        "unknown key in tweak | model: X1\\ndata: [{file: a.csv}]\\ntweak:\\n  set: RS=1\\n  afterwards: refit\\n | 5 | unknown key 'afterwards'",
        "repeated key | model: X1\\nmodel: X2\\ndata: [{file: a.csv}]\\n | 2 | Duplicate field 'model'",
        "bad rule | model: X1\\ndata: [{file: a.csv}]\\nrules:\\n  - RS=0.5\\n  - XX=3\\n | 5 | 'XX' in 'XX=3' is not a diode parameter",
        "two rules for one parameter | model: X1\\ndata: [{file: a.csv}]\\nrules: [RS=1, RS=2]\\n | 3 | a second rule for RS",
        "bad data kind | model: X1\\ndata:\\n  - file: a.csv\\n    kind: sideways\\n | 4 | unknown data kind 'sideways'",
        "option on forward data | model: X1\\ndata:\\n  - file: a.csv\\n    options: {speed: 3}\\n | 4 | unknown option 'speed' for forward data",
        "bad temperature | model: X1\\ndata:\\n  - file: a.csv\\n    temperature: warm\\n | 4 | temperature is not a number: 'warm'",
        "bad dialect | model: X1\\ndata: [{file: a.csv}]\\ndialects: [ngspice, hspiceish]\\n | 3 | unknown dialect 'hspiceish'",
        "bad digits | model: X1\\ndata: [{file: a.csv}]\\ndigits: 30\\n | 3 | digits must lie in 4..15",
        "bad model name | model: 9X\\ndata: [{file: a.csv}]\\n | 1 | model name is not a SPICE identifier",
        "data not a list | model: X1\\ndata: a.csv\\n | 2 | wrong form for key 'data': expected a list",
        "missing model | data: [{file: a.csv}]\\n | 1 | missing key 'model'",
        "missing data | model: X1\\n | 1 | missing key 'data'",
        "bad tweak | model: X1\\ndata: [{file: a.csv}]\\ntweak: {set: RS=10%}\\n | 3 | a percentage nudge needs a sign",
        "absolute cards folder | model: X1\\ndata: [{file: a.csv}]\\ncards: /tmp/x\\n | 3 | cards must be a folder relative to the device file", // hygiene: not a path (an input to refuse)
        "YAML syntax | model: X1\\ndata: [{file: a.csv}\\n | 3 | YAML syntax: while parsing a flow sequence; expected ',' or ']', but got <stream end>",
        "YAML tab indentation | model: X1\\n\tdata: [{file: a.csv}]\\n | 2 | YAML syntax: while scanning for the next token; found character",
        "YAML indentation | model: X1\\ndata:\\n  - file: a.csv\\n   kind: cv\\n | 4 | YAML syntax: while parsing a block collection; expected <block end>",
        "YAML mapping in a value | model: X1: X2\\ndata: [{file: a.csv}]\\n | 1 | YAML syntax: mapping values are not allowed here",
        "option of another kind | model: X1\\ndata:\\n  - file: a.csv\\n    kind: cv\\n    options: {lead-resistance: 1}\\n | 5 | unknown option 'lead-resistance' for cv data: this kind takes stray-capacitance, test-frequency",
        "option value | model: X1\\ndata:\\n  - file: a.csv\\n    kind: cv\\n    options: {stray-capacitance: -2p}\\n | 5 | option 'stray-capacitance': cannot read stray capacitance '-2p': a stray capacitance must not be negative",
        "option unit | model: X1\\ndata:\\n  - file: a.csv\\n    kind: cv\\n    options:\\n      test-frequency: 1 MV\\n | 6 | unknown unit 'MV' for frequency",
        "temperature as option | model: X1\\ndata:\\n  - file: a.csv\\n    options: {temperature: 25}\\n | 4 | (the entry's own key 'temperature' gives it)",
    })
    void everyFaultNamesFileLineAndWhat(String fault, String text, int line, String words) {
        DeviceFileException e = assertThrows(DeviceFileException.class, () -> read(text.replace("\\n", "\n")), fault);
        assertEquals(line, e.line(), fault + ": " + e.getMessage());
        assertTrue(e.getMessage().startsWith("parts/X1.device.yaml:" + line + ": "), e.getMessage());
        assertTrue(e.getMessage().contains(words.strip()), fault + ": " + e.getMessage());
    }

    @Test
    void theExampleLibrarysDeviceFilesAllRead() throws Exception {
        List<Path> files = LibraryPaths.deviceFiles(Simulators.projectDir().resolve("fixtures/library"));
        assertEquals(3, files.size());
        for (Path p : files) {
            assertTrue(new DeviceFileReader().read(p).data().size() >= 1, p.toString());
        }
    }
}
