package org.cardwright.lot;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
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
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.cardwright.card.Dialect;
import org.cardwright.cli.Main;
import org.cardwright.data.ReadOptions;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.fit.DeviceKind;
import org.cardwright.report.LotJson;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;

/**
 * The lot job's promises on a small invented lot ({@link LotGenerator}, forward I-V only): the same bytes for any
 * number of threads, after a killed run resumed, and from a long table as from a folder; the JSON contract of
 * DESIGN.md; the exit codes.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class LotJobTest {
    private static final int PARTS = 16;
    /**
     * A drawn lot's mean scatters about the stated mean by std/sqrt(n): three standard errors hold it (common
     * practice, no source) [1].
     */
    private static final double STANDARD_ERRORS = 3;
    private Path dir;
    private LotGenerator.Lot lot;

    @BeforeAll
    void makeLot() throws Exception {
        dir = Simulators.tempDir("lot-job");
        lot = LotGenerator.write(dir.resolve("parts"), PARTS, 77L, false, false);
    }

    private static int lot(Path out, String... extra) {
        List<String> args = new ArrayList<>(List.of("lot"));
        args.addAll(List.of(extra));
        args.addAll(List.of("--name", "LOTJ", "--out", out.toString(), "--no-progress"));
        return Main.execute(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()), args.toArray(String[]::new));
    }

    /** Every output file (not the state folder; the per-part cards too) by relative name, with its bytes. */
    private static Map<String, byte[]> outputs(Path out) throws Exception {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(out)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                String name = out.relativize(p).toString();
                if (!name.contains(".lot-state")) {
                    m.put(name, Files.readAllBytes(p));
                }
            }
        }
        return m;
    }

    private static void assertSameOutputs(Map<String, byte[]> a, Map<String, byte[]> b) {
        assertEquals(a.keySet(), b.keySet());
        for (String k : a.keySet()) {
            assertArrayEquals(a.get(k), b.get(k), k + " differs");
        }
    }

    @Test
    void oneThreadAndTwoThreadsWriteTheSameBytesAndFollowTheContract() throws Exception {
        String parts = dir.resolve("parts").toString();
        assertEquals(0, lot(dir.resolve("one"), parts, "--jobs", "1"), "every part fitted: exit 0");
        assertEquals(0, lot(dir.resolve("two"), parts, "--jobs", "2"));
        Map<String, byte[]> one = outputs(dir.resolve("one"));
        assertSameOutputs(one, outputs(dir.resolve("two")));

        // the contract of DESIGN.md, "cardwright lot"
        assertTrue(one.containsKey("LOTJ.typical.ngspice.lib"), one.keySet().toString());
        JsonNode json = new ObjectMapper().readTree(one.get("LOTJ.lot.json"));
        assertTrue(json.get("failed").isArray() && json.get("failed").isEmpty());
        assertTrue(json.get("outliers").isArray());
        for (String p : List.of("IS", "N", "RS")) {
            JsonNode s = json.get("statistics").get(p);
            assertTrue(s.get("mean").isNumber() && s.get("std").isNumber(), p);
            assertEquals(p.equals("IS") ? "log10" : "linear", s.get("space").asText());
            assertEquals(1.0, json.get("correlation").get(p).get(p).asDouble(), 0.0, "a parameter's correlation with itself is 1");
        }
        assertEquals(json.get("correlation").get("IS").get("N").asDouble(), json.get("correlation").get("N").get("IS").asDouble(), 0.0);

        // a lot of at most 1000 parts gets one card per part by default, byte-identical like the rest (above)
        assertEquals(PARTS, one.keySet().stream().filter(k -> k.startsWith("LOTJ.parts/") && k.endsWith(".ngspice.lib")).count(), one.keySet().toString());
        assertTrue(json.get("partCards").get("written").asBoolean());

        assertEquals(6, lot(dir.resolve("one"), parts), "a finished lot is not overwritten without --force");
    }

    @Test
    void aKilledRunResumesWhereItStoppedWithTheSameBytes() throws Exception {
        Path full = dir.resolve("full");
        assertEquals(0, lot(full, dir.resolve("parts").toString(), "--jobs", "2"));
        Map<String, byte[]> expected = outputs(full);

        // a run killed part-way: no outputs yet, some parts' results stored, one of them cut off mid-write
        Path killed = dir.resolve("killed");
        assertEquals(0, lot(killed, dir.resolve("parts").toString(), "--jobs", "2"));
        for (String name : outputs(killed).keySet()) {
            Files.delete(killed.resolve(name));
        }
        Path stateParts = killed.resolve("LOTJ.lot-state/parts");
        List<Path> stored;
        try (Stream<Path> s = Files.list(stateParts)) {
            stored = s.sorted().toList();
        }
        for (int i = 0; i < stored.size(); i += 2) {
            Files.delete(stored.get(i));
        }
        String cut = Files.readString(stored.get(1), StandardCharsets.UTF_8);
        Files.writeString(stored.get(1), cut.substring(0, cut.length() / 2), StandardCharsets.UTF_8);
        int kept = stored.size() / 2 - 1;

        LotOutcome resumed = new LotJob().run(request(killed, 2, false), LotJson::write, org.cardwright.report.LotHtml::write, LotProgress.NONE);
        assertEquals(kept, resumed.reused(), "the intact stored results are taken, the cut one is fitted again");
        assertSameOutputs(expected, outputs(killed));

        // a changed part file makes its stored result stale
        Path file = dir.resolve("parts").resolve(lot.normal().get(3)).resolve("forward.csv");
        String text = Files.readString(file, StandardCharsets.UTF_8);
        try {
            Files.writeString(file, text + "# a comment added later\n", StandardCharsets.UTF_8);
            LotOutcome again = new LotJob().run(request(killed, 2, true), LotJson::write, org.cardwright.report.LotHtml::write, LotProgress.NONE);
            assertEquals(PARTS - 1, again.reused());
        } finally {
            Files.writeString(file, text, StandardCharsets.UTF_8);
        }
    }

    private LotRequest request(Path out, int jobs, boolean force) {
        LotSettings settings = new LotSettings(ReadOptions.defaults(), DeviceKind.SILICON_PN, List.of(), CapacitanceOptions.DEFAULT);
        return new LotRequest(List.of(dir.resolve("parts")), "LOTJ", out, List.of(Dialect.NGSPICE), jobs, settings, 3.0,
                Map.of(), OptionalDouble.empty(), 7, force, java.util.Optional.empty());
    }

    @Test
    void aLongTableGivesThePartsOfAFolderAndNamesItsOwnLineForABadRow() throws Exception {
        Path folderOut = dir.resolve("from-folder");
        assertEquals(0, lot(folderOut, dir.resolve("parts").toString(), "--jobs", "2"));
        // the same parts as one long table: part, V, I, T; one row of the fourth part broken
        StringBuilder table = new StringBuilder("# invented test data: the LotJobTest lot as one table\npart,V [V],I [A],T [degC]\n");
        int line = 2;
        int badLine = -1;
        String badPart = lot.normal().get(3);
        for (String part : lot.normal()) {
            List<String> rows = Files.readAllLines(dir.resolve("parts").resolve(part).resolve("forward.csv"));
            for (String row : rows) {
                if (row.startsWith("#") || row.startsWith("V")) {
                    continue;
                }
                line++;
                if (part.equals(badPart) && badLine < 0 && line > 10) {
                    badLine = line;
                    row = row.replaceFirst(",", ",x");
                }
                table.append(part).append(',').append(row).append('\n');
            }
        }
        Path csv = dir.resolve("lot-table.csv");
        Files.writeString(csv, table.toString(), StandardCharsets.UTF_8);
        Path tableOut = dir.resolve("from-table");
        assertEquals(1, lot(tableOut, csv.toString(), "--jobs", "2"), "a part failed: exit 1");
        JsonNode json = new ObjectMapper().readTree(tableOut.resolve("LOTJ.lot.json").toFile());
        assertEquals(1, json.get("failed").size());
        assertEquals(badPart, json.get("failed").get(0).get("part").asText());
        String reason = json.get("failed").get(0).get("reason").asText();
        assertTrue(reason.contains("lot-table.csv:" + badLine + ":"), reason);

        // every other part: the same fitted parameters as from the folder
        Map<String, String> fromFolder = rows(folderOut.resolve("LOTJ.parts.csv"));
        Map<String, String> fromTable = rows(tableOut.resolve("LOTJ.parts.csv"));
        int compared = 0;
        for (String part : lot.normal()) {
            if (!part.equals(badPart)) {
                assertEquals(fromFolder.get(part).replaceAll(",(ok|outlier),", ","), fromTable.get(part).replaceAll(",(ok|outlier),", ","), part);
                compared++;
            }
        }
        assertEquals(PARTS - 1, compared);
    }

    @Test
    void theReadmeExampleLotRecoversItsGeneratingDistribution() throws Exception {
        // fixtures/lot: 24 invented parts simulated in ngspice 39 from a stated distribution (verify/tools/MakeLot.java),
        // part LT1-17 with four times the RS
        Path out = dir.resolve("readme-example");
        Path table = Simulators.projectDir().resolve("fixtures/lot/lt1-lot-forward.csv");
        assertEquals(0, lot(out, table.toString(), "--jobs", "2"));
        JsonNode json = new ObjectMapper().readTree(out.resolve("LOTJ.lot.json").toFile());
        List<String> outliers = new ArrayList<>();
        json.get("outliers").forEach(o -> outliers.add(o.asText()));
        assertTrue(outliers.contains("LT1-17"), outliers.toString());
        // the page: one histogram per summarised parameter, the outlier named
        String html = Files.readString(out.resolve("LOTJ.lot.html"), StandardCharsets.UTF_8);
        assertEquals(json.get("statistics").size(), html.split("class=\"hist\"", -1).length - 1);
        assertTrue(html.contains("<b>LT1-17</b>"), "the outlier is listed on the page");
        // stated means of MakeLot (log10 IS, N, RS); a drawn lot of ~22 parts scatters by std/sqrt(n): three standard errors
        Map<String, Double> stated = Map.of("IS", -14.3, "N", 1.03, "RS", 0.9);
        for (Map.Entry<String, Double> e : stated.entrySet()) {
            JsonNode s = json.get("statistics").get(e.getKey());
            double se = s.get("std").asDouble() / Math.sqrt(s.get("n").asDouble());
            assertEquals(e.getValue(), s.get("mean").asDouble(), STANDARD_ERRORS * se, e.getKey());
        }
    }

    /**
     * Each part's own card, simulated in ngspice 39 at the datasheet's IF, gives the part's measured VF there (the
     * shipped lot: 24 parts simulated in ngspice with 0.2 mV noise) and the VF the lot computed from it; with
     * {@code --part-cards off} no card folder is written.
     */
    @Test
    void perPartCardsReproduceEachPartInNgspiceAndCanBeTurnedOff() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        Path out = dir.resolve("part-cards");
        Path table = Simulators.projectDir().resolve("fixtures/lot/lt1-lot-forward.csv");
        assertEquals(0, lot(out, table.toString(), "--jobs", "2"));
        JsonNode json = new ObjectMapper().readTree(out.resolve("LOTJ.lot.json").toFile());
        JsonNode vfRow = null;
        for (JsonNode q : json.get("datasheet").get("quantities")) {
            if (q.get("quantity").asText().equals("VF")) {
                vfRow = q;
            }
        }
        assertTrue(vfRow != null, json.get("datasheet").toString());
        double current = vfRow.get("IF").asDouble();
        List<String> lines = Files.readAllLines(out.resolve("LOTJ.parts.csv"));
        List<String> header = List.of(lines.get(0).split(","));
        StringBuilder deck = new StringBuilder("* every part's own card at IF\n");
        List<String[]> rows = new ArrayList<>();
        for (String l : lines.subList(1, lines.size())) {
            String[] f = l.split(",", -1);
            int k = rows.size() + 1;
            Path card = out.resolve("LOTJ.parts").resolve(f[0] + ".ngspice.lib");
            assertTrue(Files.isRegularFile(card), card.toString());
            deck.append(".include ").append(card.toAbsolutePath()).append('\n');
            deck.append("I").append(k).append(" 0 a").append(k).append(" DC ").append(current).append('\n');
            deck.append("D").append(k).append(" a").append(k).append(" 0 LOTJ_").append(f[0]).append('\n');
            rows.add(f);
        }
        deck.append(".temp ").append(json.get("datasheet").get("temperature").asDouble()).append("\n.control\nop\n");
        for (int k = 1; k <= rows.size(); k++) {
            deck.append("let vv = v(a").append(k).append(")\necho PARTVF ").append(k).append(" $&vv\n");
        }
        deck.append("quit\n.endc\n.end\n");
        Path cir = out.resolve("part-cards.cir");
        Files.writeString(cir, deck.toString(), StandardCharsets.US_ASCII);
        // stderr kept apart: ngspice's progress lines there must not interleave with the values echoed on stdout
        Path err = out.resolve("part-cards.err");
        Process p = new ProcessBuilder(ngspice.toString(), "-b", cir.toString())
                .redirectError(ProcessBuilder.Redirect.to(err.toFile())).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(120, java.util.concurrent.TimeUnit.SECONDS) && p.exitValue() == 0, text);
        int measuredCol = header.indexOf("VF measured [V]");
        int cardCol = header.indexOf("VF card [V]");
        int checked = 0;
        for (String line : text.split("\n")) {
            if (line.startsWith("PARTVF ")) {
                String[] f = line.trim().split("\\s+");
                String[] row = rows.get(Integer.parseInt(f[1]) - 1);
                double vf = Double.parseDouble(f[2]);
                assertEquals(Double.parseDouble(row[measuredCol]), vf, PART_CARD_VF_TOLERANCE, row[0] + ": ngspice VF of its card against its measured VF");
                assertEquals(Double.parseDouble(row[cardCol]), vf, ENGINE_AGREEMENT, row[0] + ": ngspice VF of its card against the lot's own");
                checked++;
            }
        }
        assertEquals(rows.size(), checked, text);

        Path off = dir.resolve("part-cards-off");
        assertEquals(0, lot(off, table.toString(), "--jobs", "2", "--part-cards", "off"));
        assertTrue(!Files.exists(off.resolve("LOTJ.parts")), "--part-cards off writes no card folder");
        assertTrue(!new ObjectMapper().readTree(off.resolve("LOTJ.lot.json").toFile()).get("partCards").get("written").asBoolean());
        assertEquals(2, lot(dir.resolve("part-cards-bad"), table.toString(), "--part-cards", "sometimes"), "a wrong value is a usage error");
    }

    /**
     * A part's card at IF against the part's VF measured there: five times the fixture's 0.2 mV voltage noise, since
     * one interpolated reading is compared with the fitted curve [V].
     */
    private static final double PART_CARD_VF_TOLERANCE = 1e-3;
    /** The built-in engine's VF against ngspice 39's for the same card: both solve the same equations [V]. */
    private static final double ENGINE_AGREEMENT = 1e-5;

    /** part name to the IS..RS cells of its row (status and later columns left out). */
    private static Map<String, String> rows(Path csv) throws Exception {
        Map<String, String> m = new TreeMap<>();
        List<String> lines = Files.readAllLines(csv);
        for (String l : lines.subList(1, lines.size())) {
            String[] f = l.split(",", -1);
            m.put(f[0], String.join(",", List.of(f).subList(2, 8)));
        }
        return m;
    }
}
