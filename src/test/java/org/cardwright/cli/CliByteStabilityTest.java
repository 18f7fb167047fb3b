package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Param;
import org.cardwright.sim.Bias;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 2: "byte-identical output for identical input". The same fit run twice gives the same cards and JSON,
 * byte for byte: in two fresh JVMs working in two different folders with the same relative command line, and
 * twice in one JVM into two sibling folders: the cards name their data relative to their own folder, so they are
 * identical, and the JSON differs only in the output folder's name, which its card list quotes.
 */
class CliByteStabilityTest {
    /** Longest a fresh JVM may take for one fit of 130 points [s]; generous for a loaded 2-core machine. */
    private static final long PROCESS_TIMEOUT_SECONDS = 120;

    private static final DiodeParameters TRUTH = DiodeParameters.of(Map.of(Param.IS, 6e-15, Param.N, 1.03,
            Param.RS, 0.5, Param.ISR, 3e-11, Param.NR, 1.95, Param.IKF, 0.05, Param.EG, 1.11, Param.XTI, 3.0));

    @Test
    void twoFreshProcessesInTwoFoldersWriteIdenticalBytes() throws Exception {
        List<Path> outputs = new ArrayList<>();
        for (String run : List.of("a", "b")) {
            Path work = Simulators.tempDir("stable-process-" + run);
            Files.createDirectories(work.resolve("data"));
            writeData(work.resolve("data"));
            List<String> command = new ArrayList<>(List.of(
                    Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                    "-cp", System.getProperty("surefire.test.class.path", System.getProperty("java.class.path")),
                    Main.class.getName(), "fit"));
            for (Path f : listing(work.resolve("data"))) {
                command.add("data/" + f.getFileName());
            }
            command.addAll(List.of("--name", "ST", "--out", "cards", "--json", "cards/ST.json"));
            Process p = new ProcessBuilder(command).directory(work.toFile())
                    .redirectOutput(work.resolve("stdout.txt").toFile())
                    .redirectError(work.resolve("stderr.txt").toFile()).start();
            assertTrue(p.waitFor(PROCESS_TIMEOUT_SECONDS, TimeUnit.SECONDS), "fit did not finish in " + work);
            assertEquals(0, p.exitValue(), Files.readString(work.resolve("stderr.txt")));
            outputs.add(work.resolve("cards"));
        }
        List<String> names = fileNames(outputs.get(0));
        assertEquals(List.of("ST.json", "ST.ngspice.lib", "ST.spice3.lib"), names);
        assertEquals(names, fileNames(outputs.get(1)));
        for (String n : names) {
            assertArrayEquals(Files.readAllBytes(outputs.get(0).resolve(n)), Files.readAllBytes(outputs.get(1).resolve(n)),
                    n + " differs between two runs of the same command");
        }
    }

    @Test
    void twoRunsInOneProcessDifferOnlyInTheOutputFolderName() throws Exception {
        Path dataDir = Simulators.tempDir("stable-inprocess-data");
        List<Path> data = writeData(dataDir);
        List<Path> outputs = new ArrayList<>();
        for (String run : List.of("first", "second")) {
            Path out = Simulators.tempDir("stable-inprocess-" + run);
            List<String> args = new ArrayList<>(List.of("fit"));
            data.forEach(f -> args.add(f.toString()));
            args.addAll(List.of("--name", "ST", "--out", out.toString(), "--json", out.resolve("ST.json").toString()));
            CliRun r = CliRun.of(args.toArray(String[]::new));
            assertEquals(ExitCodes.OK, r.exitCode(), r.describe());
            outputs.add(out);
        }
        List<String> names = fileNames(outputs.get(0));
        assertEquals(List.of("ST.json", "ST.ngspice.lib", "ST.spice3.lib"), names);
        for (String n : names) {
            String first = Files.readString(outputs.get(0).resolve(n), StandardCharsets.UTF_8);
            String second = Files.readString(outputs.get(1).resolve(n), StandardCharsets.UTF_8);
            if (n.endsWith(".lib")) {
                assertEquals(first, second, n + ": a card must not depend on where its folder is");
                continue;
            }
            assertTrue(first.contains(outputs.get(0).toString()), n + " quotes its folder (see the class comment)");
            assertEquals(second, first.replace(outputs.get(0).toString(), outputs.get(1).toString()),
                    n + ": the second run differs in more than the folder name");
        }
    }

    private static List<Path> writeData(Path dir) throws IOException {
        List<Bias> sweep = ForwardData.currentSweeps(new double[] {0, 75}, 1e-9, 0.1, 8);
        return ForwardData.writePerTemperature(dir, "st", TRUTH, sweep, ForwardData.simulateBuiltin(TRUTH, sweep),
                "Simulated with cardwright's built-in engine");
    }

    private static List<String> fileNames(Path dir) throws IOException {
        return listing(dir).stream().map(p -> p.getFileName().toString()).toList();
    }

    private static List<Path> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.sorted().toList();
        }
    }
}
