package org.cardwright.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;

/**
 * The acceptance on an invented lot ({@link LotGenerator}): 194 parts from a stated multivariate normal
 * distribution, 4 deliberate outliers and 2 unreadable files, 200 entries in all, every part simulated in ngspice 39
 * (forward I-V and C-V, all parts in one deck, {@link NgspiceLot}) with seeded noise added. The statistics must recover the
 * stated means within 2 standard errors and the stated correlations within 0.1; exactly the outliers and the
 * unreadable files are named; nothing else is dropped. Then ngspice 39 runs the Monte Carlo card 500 times and the
 * forward-voltage corners, against the lot's measured VF at IF.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class LotAcceptanceTest {
    /** Parts drawn from the distribution (the 200 entries less 4 outliers and 2 unreadable files). */
    private static final int NORMAL_PARTS = 194;
    /** The tolerance on each correlation coefficient [1]. */
    private static final double CORRELATION_TOLERANCE = 0.1;
    /** The tolerance on each mean, in standard errors of the mean [1]. */
    private static final double MEAN_STANDARD_ERRORS = 2;
    /** Monte Carlo runs the issue asks for [1]. */
    private static final int MC_RUNS = 500;
    /**
     * Agreement of Monte Carlo and measurement, in combined standard errors: three leave a 0.3 % chance of a false
     * alarm for two normal samples (common practice, no source) [1].
     */
    private static final double SAMPLING_STANDARD_ERRORS = 3;

    private Path dir;
    private LotGenerator.Lot lot;
    private JsonNode json;
    private int exitCode;
    private String output;

    @BeforeAll
    void runLot() throws Exception {
        dir = Simulators.tempDir("lot-acceptance");
        lot = LotGenerator.write(dir.resolve("parts"), NORMAL_PARTS, 20261203L, true, true, Simulators.requireNgspice());
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        exitCode = Main.execute(new PrintWriter(out), new PrintWriter(err), "lot", dir.resolve("parts").toString(),
                "--name", "LOTA", "--out", dir.resolve("out").toString(), "--jobs", "2", "--no-progress");
        output = out + err.toString();
        json = new ObjectMapper().readTree(dir.resolve("out/LOTA.lot.json").toFile());
    }

    @Test
    void unreadableFilesAreNamedAndTheRunSaysSomeFailed() {
        assertEquals(1, exitCode, output);
        Set<String> failed = new HashSet<>();
        for (JsonNode f : json.get("failed")) {
            failed.add(f.get("part").asText());
            assertTrue(f.get("reason").asText().startsWith("unreadable: "), f.toString());
        }
        assertEquals(new HashSet<>(lot.unreadable()), failed);
        assertEquals(lot.normal().size() + lot.outliers().size() + lot.unreadable().size(), json.get("parts").asInt());
    }

    @Test
    void exactlyTheDeliberateOutliersAreNamedAndNothingElseIsDropped() {
        Set<String> outliers = new HashSet<>();
        json.get("outliers").forEach(o -> outliers.add(o.asText()));
        assertEquals(new HashSet<>(lot.outliers()), outliers, json.get("outlierReasons").toString());
        assertEquals(NORMAL_PARTS, json.get("inStatistics").asInt());
        for (Param4 p : Param4.values()) {
            assertEquals(NORMAL_PARTS, json.get("statistics").get(p.key).get("n").asInt(), p.key);
        }
    }

    @Test
    void statisticsRecoverTheStatedMeansWithinTwoStandardErrors() {
        for (Param4 p : Param4.values()) {
            JsonNode s = json.get("statistics").get(p.key);
            double stated = LotGenerator.MEAN[p.ordinal()];
            double se = s.get("std").asDouble() / Math.sqrt(s.get("n").asDouble());
            double mean = s.get("mean").asDouble();
            assertEquals(p.space, s.get("space").asText());
            assertTrue(Math.abs(mean - stated) <= MEAN_STANDARD_ERRORS * se, String.format(Locale.ROOT,
                    "%s: mean %.6g, stated %.6g, standard error %.3g", p.key, mean, stated, se));
        }
    }

    @Test
    void statisticsRecoverTheStatedCorrelationsWithinTolerance() {
        for (Param4 a : Param4.values()) {
            for (Param4 b : Param4.values()) {
                double r = json.get("correlation").get(a.key).get(b.key).asDouble();
                double stated = LotGenerator.CORRELATION[a.ordinal()][b.ordinal()];
                assertEquals(stated, r, CORRELATION_TOLERANCE, a.key + "-" + b.key);
            }
        }
    }

    @Test
    void ngspiceMonteCarloReproducesTheMeasuredForwardVoltageSpread() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        JsonNode vf = forwardVoltageRow();
        double current = vf.get("IF").asDouble();
        double temperature = json.get("datasheet").get("temperature").asDouble();
        Path deck = dir.resolve("mc.cir");
        int components = json.get("principalComponents").size();
        StringBuilder draw = new StringBuilder();
        for (int c = 1; c <= components; c++) {
            draw.append("  alterparam ").append(LotCards.parameterPrefix("LOTA")).append("_z").append(c).append(" = agauss(0,1,1)\n");
        }
        Files.writeString(deck, String.join("\n",
                "* lot Monte Carlo check: VF at IF, " + MC_RUNS + " parts drawn by the lot card",
                ".include " + dir.resolve("out/LOTA.montecarlo.ngspice.lib").toAbsolutePath(),
                ".temp " + temperature,
                "I1 0 a DC " + current,
                "D1 a 0 LOTA",
                ".control",
                "set rndseed=4711",
                "let k = 0",
                "dowhile k < " + MC_RUNS,
                draw + "  reset",
                "  op",
                "  let vfk = v(a)",
                "  echo VFRUN $&vfk",
                "  let k = k + 1",
                "end",
                "quit",
                ".endc",
                ".end", ""), StandardCharsets.US_ASCII);
        List<Double> runs = new ArrayList<>();
        for (String line : run(ngspice, deck)) {
            if (line.startsWith("VFRUN ")) {
                runs.add(Double.parseDouble(line.substring(6).trim()));
            }
        }
        assertEquals(MC_RUNS, runs.size());
        double mcMean = runs.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        double mcStd = Math.sqrt(runs.stream().mapToDouble(v -> (v - mcMean) * (v - mcMean)).sum() / (MC_RUNS - 1));
        JsonNode measured = vf.get("measured");
        int n = measured.get("n").asInt();
        double mean = measured.get("mean").asDouble();
        double std = measured.get("std").asDouble();
        double seMean = Math.sqrt(std * std / n + mcStd * mcStd / MC_RUNS);
        // standard error of a normal sample's standard deviation: s / sqrt(2 (n - 1)) (common practice, no source)
        double seStd = Math.sqrt(std * std / (2.0 * (n - 1)) + mcStd * mcStd / (2.0 * (MC_RUNS - 1)));
        String report = String.format(Locale.ROOT, "VF at %.3g A: measured mean %.6f V std %.3f mV (n %d); Monte Carlo mean %.6f V std %.3f mV",
                current, mean, std * 1e3, n, mcMean, mcStd * 1e3);
        System.out.println(report);
        assertEquals(NORMAL_PARTS, n, "every part in the statistics has a measured VF");
        assertTrue(Math.abs(mcMean - mean) <= SAMPLING_STANDARD_ERRORS * seMean, report);
        assertTrue(Math.abs(mcStd - std) <= SAMPLING_STANDARD_ERRORS * seStd, report);
    }

    @Test
    void ngspiceForwardVoltageCornersBracketTheStatedShare() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        JsonNode vf = forwardVoltageRow();
        double current = vf.get("IF").asDouble();
        double temperature = json.get("datasheet").get("temperature").asDouble();
        double[] corner = new double[2];
        String[] names = {"vf-low", "vf-high"};
        String[] models = {"LOTA_VFLO", "LOTA_VFHI"};
        for (int c = 0; c < 2; c++) {
            Path deck = dir.resolve("corner-" + names[c] + ".cir");
            Files.writeString(deck, String.join("\n",
                    "* lot corner check",
                    ".include " + dir.resolve("out/LOTA." + names[c] + ".ngspice.lib").toAbsolutePath(),
                    ".temp " + temperature,
                    "I1 0 a DC " + current,
                    "D1 a 0 " + models[c],
                    ".control", "op", "let vfk = v(a)", "echo VFCORNER $&vfk", "quit", ".endc", ".end", ""), StandardCharsets.US_ASCII);
            for (String line : run(ngspice, deck)) {
                if (line.startsWith("VFCORNER ")) {
                    corner[c] = Double.parseDouble(line.substring(9).trim());
                }
            }
        }
        List<String> lines = Files.readAllLines(dir.resolve("out/LOTA.parts.csv"));
        List<String> header = List.of(lines.get(0).split(","));
        int col = header.indexOf("VF measured [V]");
        int inside = 0;
        int total = 0;
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",", -1);
            if (!f[1].equals("ok")) {
                continue;
            }
            double v = Double.parseDouble(f[col]);
            total++;
            if (v >= corner[0] && v <= corner[1]) {
                inside++;
            }
        }
        double sigma = json.get("cornerSigma").asDouble();
        double share = 1 - 2 * Normal.upperTail(sigma);
        // binomial allowance: the share of n parts inside scatters by sqrt(p (1 - p) / n); three of them (common practice, no source)
        double allowance = SAMPLING_STANDARD_ERRORS * Math.sqrt(share * (1 - share) / total);
        String report = String.format(Locale.ROOT, "corners %.6f V .. %.6f V hold %d of %d parts (%.2f %%); stated share %.2f %% at %.1f sigma",
                corner[0], corner[1], inside, total, 100.0 * inside / total, 100 * share, sigma);
        System.out.println(report);
        assertEquals(NORMAL_PARTS, total);
        assertTrue(corner[0] < corner[1], report);
        assertTrue((double) inside / total >= share - allowance, report);
    }

    private JsonNode forwardVoltageRow() {
        for (JsonNode q : json.get("datasheet").get("quantities")) {
            if (q.get("quantity").asText().equals("VF")) {
                return q;
            }
        }
        throw new AssertionError("no VF in the datasheet table: " + json.get("datasheet"));
    }

    private static List<String> run(Path ngspice, Path deck) throws Exception {
        // stderr to its own file: ngspice's progress lines ("Reference value : ...") on stderr must not interleave
        // with the values echoed on stdout
        Path err = Files.createTempFile(deck.getParent(), "ngspice-", ".err");
        Process p = new ProcessBuilder(ngspice.toString(), "-b", deck.toString())
                .redirectError(ProcessBuilder.Redirect.to(err.toFile())).start();
        byte[] out = p.getInputStream().readAllBytes();
        assertTrue(p.waitFor(120, TimeUnit.SECONDS));
        String text = new String(out, StandardCharsets.UTF_8);
        String all = text + Files.readString(err, StandardCharsets.UTF_8);
        assertEquals(0, p.exitValue(), all);
        assertTrue(!all.toLowerCase(Locale.ROOT).contains("error"), all);
        return List.of(text.split("\n"));
    }

    /** The generator's four parameters, their JSON keys and spaces. */
    private enum Param4 {
        IS("IS", "log10"), N("N", "linear"), RS("RS", "linear"), CJO("CJO", "log10");

        final String key;
        final String space;

        Param4(String key, String space) {
            this.key = key;
            this.space = space;
        }
    }
}
