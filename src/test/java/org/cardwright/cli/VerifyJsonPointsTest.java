package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 11, "Docs match behaviour": verify's JSON gives the residual at every point for every section, as the README
 * says, recovery records and leakage included (they had per-temperature summaries only). Checked with Jackson
 * through {@link MiniJson}.
 */
class VerifyJsonPointsTest {

    @Test
    void everySectionListsEveryPoint() throws Exception {
        Path root = Simulators.projectDir();
        Path out = Simulators.tempDir("verify-json-points");
        List<String> args = new ArrayList<>(List.of("verify", root.resolve("fixtures/demo/ksz6-generating-card.lib").toString()));
        try (var files = Files.list(root.resolve("fixtures/demo"))) {
            files.filter(f -> f.getFileName().toString().matches("ksz6-.*\\.csv")).sorted().forEach(f -> args.add(f.toString()));
        }
        args.addAll(List.of("--json", out.resolve("v.json").toString()));
        CliRun run = CliRun.of(args.toArray(String[]::new));
        assertTrue(run.exitCode() == ExitCodes.OK || run.exitCode() == ExitCodes.NOT_REPRODUCED, run.describe());
        Object json = MiniJson.parse(Files.readString(out.resolve("v.json")));
        for (String section : List.of("forward", "breakdown", "capacitance", "recovery", "leakage")) {
            Object s = MiniJson.at(json, section);
            int counted = 0;
            for (Object t : (List<?>) MiniJson.at(s, "temperatures")) {
                Map<?, ?> m = (Map<?, ?>) t;
                counted += ((Double) (m.containsKey("records") ? m.get("records") : m.get("points"))).intValue();
            }
            List<?> points = (List<?>) MiniJson.at(s, "points");
            assertEquals(counted, points.size(), section + ": one entry per point");
            assertTrue(counted > 0, section);
            for (Object p : points) {
                String source = (String) MiniJson.at(p, "source");
                assertTrue(source.matches(".*ksz6-.*\\.csv:\\d+"), section + ": " + source);
                assertTrue(((Map<?, ?>) p).keySet().stream().anyMatch(k -> k.toString().startsWith("residual")), section + ": " + p);
            }
        }
    }
}
