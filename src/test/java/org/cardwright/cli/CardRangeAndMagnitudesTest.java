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
import org.cardwright.card.SpiceNumbers;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11: a card that gives VJ(T) <= 0 (or NaN, infinity) inside the measured range is an error at fit and
 * tweak time, one line, exit 4; reverse data written as positive magnitudes under V and I headers are read with a
 * stated convention, and refused with file and line without one (never a fit of garbage, never exit 2).
 * The demo zener's generating card (fixtures/demo/README.md) has BV = 6.2 V.
 */
class CardRangeAndMagnitudesTest {
    private static final Path DEMO = Simulators.projectDir().resolve("fixtures/demo");
    /** Generating card of the demo zener (fixtures/demo/README.md) [V]. */
    private static final double BV = 6.2;
    /** The demo fit gives BV within 0.01 % of it (0.02 % reading noise, measured); 0.1 % holds that with room [1]. */
    private static final double BV_RELATIVE = 1e-3;

    private static List<String> files(String kind) {
        List<String> out = new ArrayList<>();
        for (String t : List.of("minus20", "25", "85")) {
            out.add(DEMO.resolve("ksz6-" + kind + "-" + t + "C.csv").toString());
        }
        return out;
    }

    /** The start of device file Z1 in {@code part}, with the three forward files copied there and listed. */
    private static StringBuilder forwardPart(Path part) throws IOException {
        StringBuilder yaml = new StringBuilder("# invented test library\nmodel: Z1\nkind: zener\ndata:\n");
        for (String f : files("forward")) {
            Path src = Path.of(f);
            Files.copy(src, part.resolve(src.getFileName()));
            yaml.append("  - file: ").append(src.getFileName()).append('\n');
        }
        return yaml;
    }

    private static CliRun run(List<String> args) {
        return CliRun.of(args.toArray(new String[0]));
    }

    @Test
    void aFitWhoseCardLosesVjInsideTheRangeIsAnError() {
        Path out = Simulators.tempDir("card-range-fit");
        List<String> args = new ArrayList<>(List.of("fit"));
        args.addAll(files("forward"));
        args.addAll(files("reverse"));
        args.addAll(List.of("--name", "Z", "--out", out.toString(), "--force", "--set", "VJ=0.15", "--set", "ISR=free"));
        CliRun r = run(args);
        assertEquals(ExitCodes.FIT_FAILED, r.exitCode(), r.describe());
        assertEquals(1, r.errLines().size(), r.describe());
        assertTrue(r.err().contains("gives VJ(T) = ") && r.err().contains(" V at 85.00 degC, inside the measured range"),
                r.describe());
        assertFalse(Files.exists(out.resolve("Z.ngspice.lib")), "no card written");
    }

    @Test
    void aTweakThatLosesVjInsideTheRangeIsAnError() throws IOException {
        Path root = Simulators.tempDir("card-range-tweak");
        Path part = Files.createDirectories(root.resolve("z"));
        StringBuilder yaml = forwardPart(part);
        // C-V data, so that VJ is on the card (a tweak changes a stated value; it adds no term)
        for (String t : List.of("25", "85")) {
            Path src = DEMO.resolve("ksz6-cv-" + t + "C.csv");
            Files.copy(src, part.resolve(src.getFileName()));
            yaml.append("  - file: ").append(src.getFileName()).append("\n    kind: cv\n");
        }
        yaml.append("dialects: [ngspice]\n");
        Files.writeString(part.resolve("Z1.device.yaml"), yaml, StandardCharsets.UTF_8);
        CliRun r = CliRun.of("tweak", part.resolve("Z1.device.yaml").toString(), "--set", "VJ=0.15", "--render-only");
        assertEquals(ExitCodes.FIT_FAILED, r.exitCode(), r.describe());
        assertTrue(r.err().contains("with tweak VJ=") && r.err().contains(" gives VJ(T) = ") && r.err().contains("at 85.00 degC"), r.describe());
    }

    /** The demo zener's reverse files as positive magnitudes under V and I, with {@code statement} above the header. */
    private static List<String> magnitudes(Path dir, String statement) throws IOException {
        List<String> out = new ArrayList<>();
        for (String f : files("reverse")) {
            List<String> lines = new ArrayList<>(List.of("# invented test data: the demo zener's reverse data as magnitudes"));
            if (statement != null) {
                lines.add(statement);
            }
            for (String l : Files.readAllLines(Path.of(f), StandardCharsets.UTF_8)) {
                if (!l.startsWith("#")) {
                    // the V and I cells' leading minus only: exponents and the T cell keep theirs
                    String[] c = l.split(",");
                    lines.add(l.startsWith("V") ? l : c[0].replaceFirst("^-", "") + "," + c[1].replaceFirst("^-", "") + "," + c[2]);
                }
            }
            Path p = dir.resolve(Path.of(f).getFileName());
            Files.write(p, lines, StandardCharsets.UTF_8);
            out.add(p.toString());
        }
        return out;
    }

    private static double bv(Path card) throws IOException {
        String l = Files.readAllLines(card).stream().filter(x -> x.startsWith("+ BV=")).findFirst().orElseThrow();
        return SpiceNumbers.parse(l.substring(5));
    }

    @Test
    void positiveReverseMagnitudesWithoutAStatementAreRefusedWithFileAndLine() throws IOException {
        Path dir = Simulators.tempDir("magnitudes-unstated");
        List<String> args = new ArrayList<>(List.of("fit"));
        args.addAll(files("forward"));
        args.addAll(magnitudes(dir, null));
        args.addAll(List.of("--name", "Z", "--out", dir.resolve("out").toString(), "--force"));
        CliRun r = run(args);
        assertEquals(ExitCodes.BAD_INPUT, r.exitCode(), r.describe());
        assertEquals(1, r.errLines().size(), r.describe());
        // line 1 comment, line 2 header, rows 3-5 leakage, row 6 the first breakdown point (10 uA at 5.9 V)
        assertTrue(r.err().contains("ksz6-reverse-minus20C.csv:6: ") && r.err().contains("reverse magnitudes = yes"),
                r.describe());
        assertFalse(r.err().contains("IS must be positive"), r.describe());
    }

    @Test
    void positiveReverseMagnitudesWithAStatementAreFitted() throws IOException {
        Path dir = Simulators.tempDir("magnitudes-stated");
        List<String> args = new ArrayList<>(List.of("fit"));
        args.addAll(files("forward"));
        args.addAll(magnitudes(dir, "# reverse magnitudes = yes"));
        args.addAll(List.of("--name", "Z", "--out", dir.resolve("out").toString(), "--force", "--dialect", "ngspice"));
        CliRun r = run(args);
        assertEquals(0, r.exitCode(), r.describe());
        assertEquals(BV, bv(dir.resolve("out/Z.ngspice.lib")), BV_RELATIVE * BV);
    }

    @Test
    void aDeviceFileStatesTheConventionForAReverseEntry() throws IOException {
        Path root = Simulators.tempDir("magnitudes-device");
        Path part = Files.createDirectories(root.resolve("z"));
        StringBuilder yaml = forwardPart(part);
        for (String f : magnitudes(Files.createDirectories(part.resolve("rev")), null)) {
            yaml.append("  - file: rev/").append(Path.of(f).getFileName()).append('\n')
                    .append("    kind: reverse\n    options: {reverse-magnitudes: yes}\n");
        }
        yaml.append("dialects: [ngspice]\n");
        Files.writeString(part.resolve("Z1.device.yaml"), yaml, StandardCharsets.UTF_8);
        CliRun b = CliRun.of("build", root.toString());
        assertEquals(0, b.exitCode(), b.describe());
        assertEquals(BV, bv(part.resolve("Z1.ngspice.lib")), BV_RELATIVE * BV);
    }
}
