package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.cardwright.card.SpiceNumbers;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "Conditions travel with the data": a C-V fixture's stray capacitance (and the other conditions that
 * shape a measurement) stated in the data file or in the device file is read the same way by fit, verify, build
 * and check; conflicts are settled by one order and reported. The reference is the card that generated the demo
 * zener's data in ngspice 39 (fixtures/demo/README.md): CJO = 160 pF, VJ = 0.8 V, M = 0.38.
 */
class ConditionsTest {
    /** Generating card of fixtures/demo/ksz6-*.csv (fixtures/demo/README.md) [F]. */
    private static final double CJO = 1.6e-10;
    /** See {@link #CJO} [V]. */
    private static final double VJ = 0.8;
    /** See {@link #CJO} [1]. */
    private static final double M = 0.38;
    /**
     * The fit of the unshifted demo data lands within 0.2 % (CJO), 1.8 % (VJ) and 0.8 % (M) of the generating card
     * (0.5 % reading noise, measured); these bounds hold that with room and still fail the fit that absorbs a
     * 20 pF stray (CJO +12 %, VJ -8 %, M -18 %, measured) [1].
     */
    private static final double CJO_RELATIVE = 0.01;
    /** See {@link #CJO_RELATIVE} [1]. */
    private static final double VJ_RELATIVE = 0.03;
    /** See {@link #CJO_RELATIVE} [1]. */
    private static final double M_RELATIVE = 0.03;
    /** The fixture's stray capacitance added to every reading (invented) [pF]. */
    private static final double STRAY_PF = 20;

    private static final Path DEMO = Simulators.projectDir().resolve("fixtures/demo");

    /** The demo zener's C-V file at {@code celsius} with {@value #STRAY_PF} pF added to every reading. */
    private static Path shiftedCv(Path dir, String celsius, String statement) throws IOException {
        List<String> out = new ArrayList<>();
        out.add("# invented test data: the demo zener's C-V readings with a " + STRAY_PF + " pF fixture added");
        if (statement != null) {
            out.add(statement);
        }
        boolean header = false;
        for (String l : Files.readAllLines(DEMO.resolve("ksz6-cv-" + celsius + "C.csv"), StandardCharsets.UTF_8)) {
            if (l.startsWith("#")) {
                continue;
            }
            if (!header) {
                assertEquals("V [V],C [pF],T [degC]", l);
                out.add(l);
                header = true;
                continue;
            }
            String[] c = l.split(",");
            out.add(c[0] + "," + String.format(Locale.ROOT, "%.5f", Double.parseDouble(c[1]) + STRAY_PF) + "," + c[2]);
        }
        Path f = dir.resolve("cv" + celsius + ".csv");
        Files.write(f, out, StandardCharsets.UTF_8);
        return f;
    }

    private static List<String> ivFiles() {
        List<String> files = new ArrayList<>();
        for (String k : List.of("forward", "reverse")) {
            for (String t : List.of("minus20", "25", "85")) {
                files.add(DEMO.resolve("ksz6-" + k + "-" + t + "C.csv").toString());
            }
        }
        return files;
    }

    private static double cardValue(Path card, String keyword) throws IOException {
        String line = Files.readAllLines(card, StandardCharsets.UTF_8).stream()
                .filter(l -> l.startsWith("+ " + keyword + "=")).findFirst().orElseThrow(() -> new AssertionError(keyword));
        return SpiceNumbers.parse(line.substring(line.indexOf('=') + 1).trim());
    }

    private static void assertJunction(Path card) throws IOException {
        assertEquals(CJO, cardValue(card, "CJO"), CJO_RELATIVE * CJO, card.toString());
        assertEquals(VJ, cardValue(card, "VJ"), VJ_RELATIVE * VJ, card.toString());
        assertEquals(M, cardValue(card, "M"), M_RELATIVE * M, card.toString());
    }

    private static CliRun run(List<String> args) {
        return CliRun.of(args.toArray(new String[0]));
    }

    @Test
    void strayStatedInTheDataFileReachesFitAndVerify() throws IOException {
        Path dir = Simulators.tempDir("conditions-data-file");
        Path cv25 = shiftedCv(dir, "25", "# stray capacitance = " + (int) STRAY_PF + " pF");
        Path cv85 = shiftedCv(dir, "85", "# stray capacitance = 20p");
        List<String> fit = new ArrayList<>(List.of("fit"));
        fit.addAll(ivFiles());
        fit.addAll(List.of(cv25.toString(), cv85.toString(), "--name", "Z", "--out", dir.resolve("out").toString(),
                "--dialect", "ngspice", "--force"));
        CliRun r = run(fit);
        assertEquals(0, r.exitCode(), r.describe());
        assertTrue(r.describe().contains("cv25.csv:3: C-V readings taken with stray capacitance 20 pF (line 2 of the file)"),
                r.describe());
        Path card = dir.resolve("out/Z.ngspice.lib");
        assertJunction(card);
        assertTrue(Files.readString(card).contains("* C-V conditions: stray capacitance 20 pF (cv25.csv, line 2 of the file), "
                + "test frequency 1 MHz (the default)"), "the card says which stray capacitance it was fitted with");

        List<String> verify = new ArrayList<>(List.of("verify", card.toString(), cv25.toString(), cv85.toString()));
        CliRun v = run(verify);
        assertEquals(0, v.exitCode(), v.describe());
        assertTrue(v.out().contains("stray 20.0 pF subtracted"), v.describe());

        // the same readings without the statement: the fit absorbs the stray into CJO, VJ and M (the reported bug)
        Path bare = Files.createDirectories(dir.resolve("bare"));
        Path b25 = shiftedCv(bare, "25", null);
        Path b85 = shiftedCv(bare, "85", null);
        List<String> fitBare = new ArrayList<>(List.of("fit"));
        fitBare.addAll(ivFiles());
        fitBare.addAll(List.of(b25.toString(), b85.toString(), "--name", "Z", "--out", bare.resolve("out").toString(),
                "--dialect", "ngspice", "--force"));
        assertEquals(0, run(fitBare).exitCode());
        double m = cardValue(bare.resolve("out/Z.ngspice.lib"), "M");
        assertTrue(Math.abs(m - M) > M_RELATIVE * M, "without the statement M = " + m + " should be off");
        // and the stated card does not reproduce the unstated readings: the stray is not silently assumed
        CliRun v2 = run(List.of("verify", card.toString(), b25.toString(), "--verdict", "fixed"));
        assertEquals(ExitCodes.NOT_REPRODUCED, v2.exitCode(), v2.describe());
    }

    @Test
    void strayInTheDeviceFileReachesBuildCheckAndVerifyDevice() throws IOException {
        Path root = Simulators.tempDir("conditions-device-file");
        Path part = Files.createDirectories(root.resolve("z"));
        Path data = Files.createDirectories(part.resolve("data"));
        shiftedCv(data, "25", null);
        shiftedCv(data, "85", null);
        StringBuilder yaml = new StringBuilder("# invented test library\nmodel: Z1\nkind: zener\ndata:\n");
        for (String f : ivFiles()) {
            Path src = Path.of(f);
            Files.copy(src, data.resolve(src.getFileName()));
            yaml.append("  - file: data/").append(src.getFileName()).append('\n')
                    .append("    kind: ").append(f.contains("reverse") ? "reverse" : "forward").append('\n');
        }
        yaml.append("  - file: data/cv25.csv\n    kind: cv\n    options: {stray-capacitance: 20 pF, test-frequency: 1 MHz}\n");
        yaml.append("  - file: data/cv85.csv\n    kind: cv\n    options:\n      stray capacitance: 20p\n");
        yaml.append("dialects: [ngspice]\n");
        Path device = part.resolve("Z1.device.yaml");
        Files.writeString(device, yaml, StandardCharsets.UTF_8);

        CliRun b = CliRun.of("build", root.toString());
        assertEquals(0, b.exitCode(), b.describe());
        Path card = part.resolve("Z1.ngspice.lib");
        assertJunction(card);
        assertTrue(Files.readString(card).contains("* data: data/cv25.csv (cv, stray-capacitance 20 pF, test-frequency 1 MHz) sha256 "),
                "the card says which conditions its files were read with");
        CliRun c = CliRun.of("check", root.toString());
        assertEquals(0, c.exitCode(), c.describe());

        CliRun v = CliRun.of("verify", card.toString(), "--device", device.toString());
        assertEquals(0, v.exitCode(), v.describe());
        assertTrue(v.describe().contains("stray capacitance 20 pF (device file " + device.toString().replace('\\', '/')
                + " (data entry at line"), v.describe());
        assertTrue(v.out().contains("C-V:"), v.describe());
        // the same card and files without the device file's conditions: the C-V readings hold the stray
        CliRun plain = CliRun.of("verify", card.toString(), data.resolve("cv25.csv").toString(), "--verdict", "fixed");
        assertEquals(ExitCodes.NOT_REPRODUCED, plain.exitCode(), plain.describe());
    }

    @Test
    void theFileOwnStatementWinsAndTheOtherValueIsNamed() throws IOException {
        Path dir = Simulators.tempDir("conditions-order");
        Path cv25 = shiftedCv(dir, "25", "# stray capacitance = 20 pF");
        CliRun v = CliRun.of("verify", DEMO.resolve("generating-card.lib").toString(), cv25.toString(),
                "--stray-capacitance", "5p", "--model", "KS1");
        assertTrue(v.describe().contains("cv25.csv:2: the file states its stray capacitance 20 pF; 5 pF given by "
                + "--stray-capacitance is not used"), v.describe());
    }

    @Test
    void cvFilesThatDisagreeAreRefusedNamingFileAndLine() throws IOException {
        Path dir = Simulators.tempDir("conditions-disagree");
        Path cv25 = shiftedCv(dir, "25", "# stray capacitance = 20 pF");
        Path cv85 = shiftedCv(dir, "85", "# stray capacitance = 12 pF");
        List<String> fit = new ArrayList<>(List.of("fit"));
        fit.addAll(ivFiles());
        fit.addAll(List.of(cv25.toString(), cv85.toString(), "--name", "Z", "--out", dir.resolve("out").toString(), "--force"));
        CliRun r = run(fit);
        assertEquals(ExitCodes.BAD_INPUT, r.exitCode(), r.describe());
        assertEquals(1, r.errLines().size(), r.describe());
        assertTrue(r.describe().contains("cv85.csv:2: C-V files with different stray capacitance: 12 pF here"), r.describe());
        assertFalse(Files.exists(dir.resolve("out/Z.ngspice.lib")));
    }

    @Test
    void aDeviceFileOptionForAnotherKindIsRefusedWithFileAndLine() throws IOException {
        Path root = Simulators.tempDir("conditions-wrong-option");
        Path part = Files.createDirectories(root.resolve("p"));
        Files.copy(DEMO.resolve("ks1-forward-25C.csv"), part.resolve("f.csv"));
        Files.writeString(part.resolve("P.device.yaml"), "# invented\nmodel: P\ndata:\n  - file: f.csv\n"
                + "    options: {stray-capacitance: 2p}\n", StandardCharsets.UTF_8);
        CliRun b = CliRun.of("build", root.toString());
        assertEquals(ExitCodes.BAD_INPUT, b.exitCode(), b.describe());
        assertTrue(b.describe().contains("P.device.yaml:5: unknown option 'stray-capacitance' for forward data: this kind "
                + "takes lead-resistance"), b.describe());
    }

    @Test
    void perFileTemperaturesFromTheCommandLine() throws IOException {
        Path dir = Simulators.tempDir("conditions-temp-for");
        List<String> files = new ArrayList<>();
        List<String> temps = new ArrayList<>();
        for (String t : List.of("minus40", "25", "85")) {
            Path f = dir.resolve("fwd-" + t + ".csv");
            List<String> out = new ArrayList<>(List.of("# invented test data: the demo switching diode without its T column"));
            for (String l : Files.readAllLines(DEMO.resolve("ks1-forward-" + t + "C.csv"), StandardCharsets.UTF_8)) {
                if (!l.startsWith("#")) {
                    out.add(l.substring(0, l.lastIndexOf(',')));
                }
            }
            Files.write(f, out, StandardCharsets.UTF_8);
            files.add(f.toString());
            temps.add("--temp-for");
            temps.add(f + "=" + (t.equals("minus40") ? "-40" : t));
        }
        List<String> noTemp = new ArrayList<>(List.of("verify", DEMO.resolve("generating-card.lib").toString()));
        noTemp.addAll(files);
        CliRun bad = run(noTemp);
        assertEquals(ExitCodes.BAD_INPUT, bad.exitCode(), bad.describe());
        assertTrue(bad.describe().contains("no T column and no --temp given"), bad.describe());

        List<String> given = new ArrayList<>(noTemp);
        given.addAll(temps);
        CliRun ok = run(given);
        // the generating card reproduces its own data at the right temperatures (fixtures/demo/README.md)
        assertEquals(0, ok.exitCode(), ok.describe());
        assertTrue(ok.describe().contains("every point is at the temperature given by --temp-for"), ok.describe());

        CliRun unknown = CliRun.of("verify", DEMO.resolve("generating-card.lib").toString(), files.get(0),
                "--temp-for", "elsewhere.csv=25");
        assertEquals(ExitCodes.USAGE, unknown.exitCode(), unknown.describe());
        assertTrue(unknown.describe().contains("--temp-for names 'elsewhere.csv', which is not among the data files"),
                unknown.describe());
    }

    @Test
    void lotRefusesAPerFileTemperatureItWouldNotUse() {
        CliRun r = CliRun.of("lot", DEMO.toString(), "--name", "L", "--out", Simulators.tempDir("conditions-lot").toString(),
                "--temp-for", "a.csv=25");
        assertEquals(ExitCodes.USAGE, r.exitCode(), r.describe());
        assertTrue(r.err().contains("--temp-for is for fit and verify"), r.describe());
    }
}
