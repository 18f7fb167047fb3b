package org.cardwright.bench;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.sim.Bias;
import org.cardwright.sim.BuiltinEngine;
import org.cardwright.sim.CardUnderTest;
import org.cardwright.sim.OperatingPoint;
import org.cardwright.model.SimulatorOptions;

/**
 * Times {@code cardwright verify CARD DATA --engine ngspice} as a fresh process at several numbers of forward
 * points (default 600 and 6000), to show that the re-simulation stays linear in the number of points. A plain
 * harness, not a timed test. The data are invented: an invented diode simulated by the built-in engine at four
 * temperatures, noise-free, written to a scratch folder.
 *
 * <p>Options: {@code --jar PATH} (default target/cardwright.jar; give an older jar to measure "before"),
 * {@code --points N,N,...}, {@code --runs N} (median of this many runs per size, default 3), {@code --out DIR}.
 * Run it with {@code verify/bench/run-ngspice-points}.
 */
public final class NgspicePointsBenchmark {
    private static final DiodeParameters CARD = DiodeParameters.defaults().with(Param.IS, 4e-9).with(Param.N, 1.7)
            .with(Param.RS, 0.08).with(Param.EG, 1.11).with(Param.XTI, 3.0);
    private static final double[] CELSIUS = {-40, 25, 85, 125};

    private NgspicePointsBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        Path jar = Path.of("target/cardwright.jar");
        int[] sizes = {600, 6000};
        int runs = 3;
        Path out = Path.of("target/bench-ngspice-points");
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--jar" -> jar = Path.of(args[++i]);
                case "--points" -> sizes = Arrays.stream(args[++i].split(",")).mapToInt(Integer::parseInt).toArray();
                case "--runs" -> runs = Integer.parseInt(args[++i]);
                case "--out" -> out = Path.of(args[++i]);
                default -> throw new IllegalArgumentException("unknown option " + args[i]
                        + " (options: --jar PATH, --points N,N, --runs N, --out DIR)");
            }
        }
        Files.createDirectories(out);
        Path card = out.resolve("dbench.lib");
        Files.writeString(card, "* Invented benchmark card, not a model of any real part.\n"
                + ".model dbench D(IS=4n N=1.7 RS=0.08 EG=1.11 XTI=3)\n", StandardCharsets.UTF_8);
        System.out.printf(Locale.ROOT, "jar: %s; %d cores; load average %.2f%n", jar,
                Runtime.getRuntime().availableProcessors(),
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
        System.out.println("points  median [s]  runs [s]");
        for (int n : sizes) {
            Path data = writeData(out, n);
            double[] t = new double[runs];
            for (int r = 0; r < runs; r++) {
                t[r] = timeVerify(jar, card, data, out);
            }
            double[] sorted = t.clone();
            Arrays.sort(sorted);
            System.out.printf(Locale.ROOT, "%6d  %10.2f  %s%n", n, sorted[runs / 2], Arrays.toString(t));
        }
    }

    private static Path writeData(Path dir, int n) throws IOException {
        BuiltinEngine engine = new BuiltinEngine(SimulatorOptions.NGSPICE_DEFAULTS);
        List<Bias> biases = new ArrayList<>();
        int perT = n / CELSIUS.length;
        for (double c : CELSIUS) {
            for (int k = 0; k < perT; k++) {
                biases.add(Bias.current(Math.pow(10, -8 + 7.0 * k / (perT - 1)), c + Ngspice39.CELSIUS_TO_KELVIN));
            }
        }
        List<OperatingPoint> ops = engine.dc(CardUnderTest.ngspice("dbench", CARD), biases);
        StringBuilder sb = new StringBuilder("# Invented benchmark data, built-in engine, noise-free.\nV [V],I [A],T [degC]\n");
        for (int i = 0; i < ops.size(); i++) {
            sb.append(String.format(Locale.ROOT, "%.10g,%.10g,%.2f%n", ops.get(i).voltage(), biases.get(i).value(),
                    biases.get(i).temperature() - Ngspice39.CELSIUS_TO_KELVIN));
        }
        Path f = dir.resolve("points-" + n + ".csv");
        Files.writeString(f, sb.toString(), StandardCharsets.UTF_8);
        return f;
    }

    private static double timeVerify(Path jar, Path card, Path data, Path dir) throws Exception {
        List<String> command = List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-jar",
                jar.toString(), "verify", card.toString(), data.toString(), "--engine", "ngspice");
        long start = System.nanoTime();
        Process p = new ProcessBuilder(command).redirectErrorStream(true)
                .redirectOutput(dir.resolve("last-run.txt").toFile()).start();
        if (!p.waitFor(30, TimeUnit.MINUTES)) {
            p.destroyForcibly();
            throw new IllegalStateException("verify did not finish");
        }
        double seconds = (System.nanoTime() - start) / 1e9;
        if (p.exitValue() != 0) {
            throw new IllegalStateException("verify exited with " + p.exitValue() + ": see " + dir.resolve("last-run.txt"));
        }
        return seconds;
    }
}
