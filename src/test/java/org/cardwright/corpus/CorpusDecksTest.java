package org.cardwright.corpus;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * The committed corpus matches its decks: the forward deck of a wandering-temperature part and of the kilovolt
 * part run again in ngspice 39 give the noise-free voltages written in the files, row by row at each row's own
 * temperature (the deck visits the rows in its own order; each simulated point is matched to the file's row of
 * the same forced current and temperature).
 */
class CorpusDecksTest {
    /** The noise-free files print the voltage with 10 decimals; ngspice repeats itself exactly [V]. */
    private static final double PRINT_RESOLUTION = 1e-10;
    /** How long one deck may run [s]. */
    private static final long TIMEOUT_SECONDS = 120;
    /** Picks the file's row at a visit's current: both print the same decimal current, so only rounding differs [1]. */
    private static final double SAME_CURRENT = 1e-9;

    @Test
    void forwardDecksReproduceTheNoiseFreeFiles() throws Exception {
        Path ngspice = Simulators.requireNgspice();
        for (String name : List.of("alder", "elm")) {
            Path dir = Simulators.projectDir().resolve("fixtures/corpus").resolve(name);
            Path work = Simulators.tempDir("corpus-deck-" + name);
            List<String> deck = Files.readAllLines(dir.resolve("generating-netlist-forward.cir"));
            Files.write(work.resolve("deck.cir"), deck);
            Process p = new ProcessBuilder(ngspice.toString(), "-b", "deck.cir").directory(work.toFile())
                    .redirectErrorStream(true).redirectOutput(work.resolve("log.txt").toFile()).start();
            assertTrue(p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS), name + ": ngspice finished");
            assertEquals(0, p.exitValue(), name + ": ngspice exit code");
            // the deck's order of (temperature, current)
            List<double[]> visits = new ArrayList<>();
            double t = Double.NaN;
            for (String line : deck) {
                if (line.startsWith("alter @df[temp] = ")) {
                    t = Double.parseDouble(line.substring(18).trim());
                } else if (line.startsWith("alter IF dc = ")) {
                    visits.add(new double[] {t, Double.parseDouble(line.substring(14).trim())});
                }
            }
            List<String> simulated = Files.readAllLines(work.resolve("fwd.dat")).stream().filter(l -> !l.isBlank()).toList();
            assertEquals(visits.size(), simulated.size(), name + ": one value per row");
            List<double[]> rows = new ArrayList<>();
            for (String line : Files.readAllLines(dir.resolve("noisefree/forward.csv"))) {
                if (line.isEmpty() || line.startsWith("#") || line.startsWith("V ")) {
                    continue;
                }
                String[] f = line.split(",");
                rows.add(new double[] {Double.parseDouble(f[0]), Double.parseDouble(f[1]), Double.parseDouble(f[2])});
            }
            assertEquals(visits.size(), rows.size(), name + ": the file has one row per visit");
            for (int k = 0; k < visits.size(); k++) {
                double[] v = visits.get(k);
                String[] cols = simulated.get(k).trim().split("\\s+");
                double volts = Double.parseDouble(cols[cols.length - 1]);
                double[] row = rows.stream().filter(r -> r[2] == v[0] && Math.abs(r[1] - v[1]) <= SAME_CURRENT * v[1])
                        .findFirst().orElseThrow(() -> new AssertionError(name + ": no row at " + v[0] + " degC, " + v[1] + " A"));
                assertEquals(volts, row[0], PRINT_RESOLUTION, name + " at " + v[0] + " degC, " + v[1] + " A");
            }
        }
    }
}
