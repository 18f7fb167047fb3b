package org.cardwright.bench;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.cardwright.fit.FitPoint;
import org.cardwright.fit.FitResult;
import org.cardwright.fit.FitSettings;
import org.cardwright.fit.ForwardExtraction;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * The issue 2 benchmark (a harness, not a timed unit test; run it with {@code verify/bench/run}):
 * <ol>
 *   <li>the in-process forward fit of 240 points at 4 temperatures, after warm-up: median and 90th percentile of
 *       30 runs (goal: at most 50 ms);</li>
 *   <li>the whole {@code cardwright fit} command as a fresh JVM ({@code java -jar target/cardwright.jar fit ...}) on
 *       the same data as CSV files: median of 10 runs (goal: at most 1.5 s).</li>
 * </ol>
 * Data: an invented diode with recombination (ISR, NR) and high injection (IKF), evaluated with the built-in
 * ngspice 39 equations from 1 nA to 100 mA, 60 points per temperature, with seeded instrument noise of issue 2
 * (0.15 mV + 0.02 % on voltage, 0.1 % on current, one sigma).
 *
 * <p>Options: {@code --jar PATH} (default target/cardwright.jar), {@code --warmup N} (20), {@code --runs N} (30),
 * {@code --process-runs N} (10; 0 skips the whole-command part), {@code --seed N} (240).
 */
public final class FitBenchmark {
    /** Issue 2 goal for the in-process fit [ms]. */
    private static final double IN_PROCESS_GOAL_MS = 50;
    /** Issue 2 goal for the whole command [ms]. */
    private static final double COMMAND_GOAL_MS = 1500;
    private static final double[] CELSIUS = {-40, 25, 85, 125};
    private static final int POINTS_PER_TEMPERATURE = 60;
    private static final double LOW_CURRENT = 1e-9;
    private static final double HIGH_CURRENT = 0.1;
    /** An invented small-signal silicon diode with every forward term of issue 2. */
    private static final DiodeParameters TRUTH = DiodeParameters.of(Map.of(Param.IS, 5e-15, Param.N, 1.04,
            Param.RS, 0.55, Param.ISR, 3e-11, Param.NR, 1.95, Param.IKF, 0.06, Param.EG, 1.11, Param.XTI, 3.1));

    private FitBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        Path jar = Path.of("target", "cardwright.jar");
        int warmup = 20;
        int runs = 30;
        int processRuns = 10;
        long seed = 240;
        for (int i = 0; i < args.length; i++) {
            String value = i + 1 < args.length ? args[i + 1] : null;
            switch (args[i]) {
                case "--jar" -> jar = Path.of(require(args[i], value));
                case "--warmup" -> warmup = Integer.parseInt(require(args[i], value));
                case "--runs" -> runs = Integer.parseInt(require(args[i], value));
                case "--process-runs" -> processRuns = Integer.parseInt(require(args[i], value));
                case "--seed" -> seed = Long.parseLong(require(args[i], value));
                default -> throw new IllegalArgumentException("unknown option " + args[i]
                        + "; options: --jar PATH --warmup N --runs N --process-runs N --seed N");
            }
            i++;
        }
        System.out.printf(Locale.ROOT, "cardwright fit benchmark: Java %s, %d processors, %s %s, load average %.2f%n",
                System.getProperty("java.version"), Runtime.getRuntime().availableProcessors(),
                System.getProperty("os.name"), System.getProperty("os.arch"),
                ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());

        List<FitPoint> points = data(seed);
        inProcess(points, warmup, runs);
        if (processRuns > 0) {
            wholeCommand(points, jar, processRuns);
        }
    }

    private static String require(String option, String value) {
        if (value == null) {
            throw new IllegalArgumentException(option + " needs a value");
        }
        return value;
    }

    /** 60 points per temperature from 1 nA to 100 mA, log-spaced, built-in voltages with seeded noise. */
    static List<FitPoint> data(long seed) {
        Random random = new Random(seed);
        List<FitPoint> points = new ArrayList<>();
        int line = 1;
        for (double c : CELSIUS) {
            double kelvin = c + Ngspice39.CELSIUS_TO_KELVIN;
            DiodeAtTemperature d = TemperatureLaws.at(TRUTH, kelvin, SimulatorOptions.NGSPICE_DEFAULTS);
            for (int k = 0; k < POINTS_PER_TEMPERATURE; k++) {
                double current = LOW_CURRENT * Math.pow(HIGH_CURRENT / LOW_CURRENT, k / (POINTS_PER_TEMPERATURE - 1.0));
                double voltage = DiodeSolver.voltageAtCurrent(d, current);
                voltage += random.nextGaussian() * (0.15e-3 + 2e-4 * Math.abs(voltage));
                current *= 1 + 1e-3 * random.nextGaussian();
                points.add(new FitPoint(current, voltage, kelvin, 1e-3, "bench", ++line));
            }
        }
        return points;
    }

    private static void inProcess(List<FitPoint> points, int warmup, int runs) throws Exception {
        ForwardExtraction extraction = new ForwardExtraction(FitSettings.defaults());
        FitResult result = null;
        for (int i = 0; i < warmup; i++) {
            result = extraction.fit(points);
        }
        double[] ms = new double[runs];
        double[] cpuMs = new double[runs];
        double checksum = 0;
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        for (int i = 0; i < runs; i++) {
            long c0 = threads.getCurrentThreadCpuTime();
            long t0 = System.nanoTime();
            result = extraction.fit(points);
            ms[i] = (System.nanoTime() - t0) / 1e6;
            cpuMs[i] = (threads.getCurrentThreadCpuTime() - c0) / 1e6;
            checksum += result.parameters().get(Param.IS);
        }
        System.out.printf(Locale.ROOT, "%n(a) in-process forward fit, %d points at %d temperatures, %d warm-up runs%n",
                points.size(), CELSIUS.length, warmup);
        System.out.printf(Locale.ROOT, "    terms: %s%n", result.terms().stream()
                .map(t -> t.term() + (t.included() ? " yes" : " no")).toList());
        System.out.printf(Locale.ROOT, "    fitted: IS %.4g A, N %.5f, RS %.4f ohm, ISR %.4g A, NR %.4f, IKF %.4g A, EG %.4f eV, XTI %.3f;"
                        + " %d evaluations, worst RMS residual %.3f mV (check %.3g)%n",
                result.parameters().get(Param.IS), result.parameters().get(Param.N), result.parameters().get(Param.RS),
                result.parameters().get(Param.ISR), result.parameters().get(Param.NR), result.parameters().get(Param.IKF),
                result.parameters().get(Param.EG), result.parameters().get(Param.XTI), result.evaluations(),
                result.worstRms() * 1e3, checksum / runs);
        report(ms, IN_PROCESS_GOAL_MS, true);
        double[] cpu = cpuMs.clone();
        Arrays.sort(cpu);
        // CPU time of the fitting thread: what the fit costs when it has a core to itself, robust to other load
        System.out.printf(Locale.ROOT, "    CPU time of the fitting thread: median %.1f ms, min %.1f ms (wall time above includes waiting for a core)%n",
                median(cpu), cpu[0]);
    }

    private static double median(double[] sorted) {
        return sorted.length % 2 == 1 ? sorted[sorted.length / 2]
                : (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]) / 2;
    }

    private static void wholeCommand(List<FitPoint> points, Path jar, int runs) throws Exception {
        if (!Files.isRegularFile(jar)) {
            throw new IllegalStateException(jar.toAbsolutePath() + " not found: build it with mvn -o package -DskipTests");
        }
        Path dir = Files.createTempDirectory("cardwright-bench-");
        List<String> files = writeCsv(points, dir);
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        double[] ms = new double[runs];
        for (int i = -1; i < runs; i++) { // run -1 is an untimed warm-up of the file cache
            Path out = dir.resolve("out-" + (i + 1));
            List<String> command = new ArrayList<>(List.of(java.toString(), "-jar", jar.toAbsolutePath().toString(), "fit"));
            command.addAll(files);
            command.addAll(List.of("--name", "BENCH", "--out", out.toString()));
            long t0 = System.nanoTime();
            Process p = new ProcessBuilder(command).redirectErrorStream(true)
                    .redirectOutput(dir.resolve("log-" + (i + 1) + ".txt").toFile()).start();
            int code = p.waitFor();
            double elapsed = (System.nanoTime() - t0) / 1e6;
            if (code != 0 || !Files.isRegularFile(out.resolve("BENCH.ngspice.lib"))) {
                throw new IllegalStateException("fit exited " + code + "; see " + dir.resolve("log-" + (i + 1) + ".txt"));
            }
            if (i >= 0) {
                ms[i] = elapsed;
            }
        }
        System.out.printf(Locale.ROOT, "%n(b) whole command in a fresh JVM: java -jar %s fit <4 CSV files> --name BENCH --out DIR%n", jar);
        report(ms, COMMAND_GOAL_MS, false);
        System.out.println("    work folder (delete at will): " + dir);
    }

    private static List<String> writeCsv(List<FitPoint> points, Path dir) throws IOException {
        List<String> files = new ArrayList<>();
        for (double c : CELSIUS) {
            double kelvin = c + Ngspice39.CELSIUS_TO_KELVIN;
            StringBuilder sb = new StringBuilder("# Invented benchmark data, not a measurement of any real device.\n")
                    .append("# Built-in ngspice 39 equations with seeded noise; see org.cardwright.bench.FitBenchmark.\n")
                    .append("V [V],I [A],T [degC]\n");
            for (FitPoint p : points) {
                if (p.temperature() == kelvin) {
                    sb.append(String.format(Locale.ROOT, "%.7g,%.7g,%.2f\n", p.voltage(), p.current(), c));
                }
            }
            Path f = dir.resolve(String.format(Locale.ROOT, "bench-%dC.csv", Math.round(c)));
            Files.writeString(f, sb.toString(), StandardCharsets.UTF_8);
            files.add(f.toString());
        }
        return files;
    }

    private static void report(double[] ms, double goal, boolean withP90) {
        double[] sorted = ms.clone();
        Arrays.sort(sorted);
        double median = median(sorted);
        // 90th percentile by nearest rank
        double p90 = sorted[(int) Math.ceil(0.9 * sorted.length) - 1];
        System.out.printf(Locale.ROOT, "    %d runs: median %.1f ms%s, min %.1f ms, max %.1f ms; goal <= %.0f ms: %s%n",
                sorted.length, median, withP90 ? String.format(Locale.ROOT, ", p90 %.1f ms", p90) : "",
                sorted[0], sorted[sorted.length - 1], goal, median <= goal ? "met" : "NOT met");
    }
}
