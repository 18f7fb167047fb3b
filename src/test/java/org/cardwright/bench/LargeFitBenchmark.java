package org.cardwright.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.model.DiodeAtTemperature;
import org.cardwright.model.DiodeParameters;
import org.cardwright.model.DiodeSolver;
import org.cardwright.model.Ngspice39;
import org.cardwright.model.Param;
import org.cardwright.model.SimulatorOptions;
import org.cardwright.model.TemperatureLaws;

/**
 * The issue 10/12 large-data benchmark (a harness, not a timed unit test): writes one forward I-V file of N rows
 * (default 10^5 and 10^6) and runs the whole {@code cardwright fit} command on it in a child JVM with a fixed
 * heap (default {@code -Xmx512m}), reporting wall time, the child's CPU time, its peak resident memory (VmHWM, polled from
 * /proc on Linux), the peak Java heap occupancy before a collection (from the child's GC log), the exit code and
 * the fit's summary line.
 *
 * <p>Data: an invented small-signal diode (the parameters of {@link FitBenchmark}), evaluated with the built-in
 * ngspice 39 equations at four temperatures (-40, 25, 85, 125 degC; a T column), currents log-spaced from 1 nA to
 * 100 mA, seeded noise of 0.15 mV + 0.02 % on the voltage and 0.1 % on the current (one sigma).
 *
 * <p>Run: {@code java -cp target/test-classes:target/classes org.cardwright.bench.LargeFitBenchmark [--rows
 * 100000,1000000] [--heap 512m] [--jar target/cardwright.jar] [--work DIR] [--seed N]} after
 * {@code mvn -o package} (or {@code verify/bench/run-large}); {@code --java-option OPTION} (repeatable) passes an
 * option to the child JVM, e.g. {@code -XX:+UseSerialGC}, the collector the {@code ./cardwright} launcher uses.
 */
public final class LargeFitBenchmark {
    private static final double[] CELSIUS = {-40, 25, 85, 125};
    private static final double LOW_CURRENT = 1e-9;
    private static final double HIGH_CURRENT = 0.1;
    private static final DiodeParameters TRUTH = DiodeParameters.of(Map.of(Param.IS, 5e-15, Param.N, 1.04,
            Param.RS, 0.55, Param.ISR, 3e-11, Param.NR, 1.95, Param.IKF, 0.06, Param.EG, 1.11, Param.XTI, 3.1));
    private static final Pattern GC_BEFORE = Pattern.compile("(\\d+)M->(\\d+)M\\((\\d+)M\\)");

    private LargeFitBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        List<Integer> rows = List.of(100_000, 1_000_000);
        String heap = "512m";
        Path jar = Path.of("target", "cardwright.jar");
        Path work = Path.of("target", "large-fit-bench");
        long seed = 10;
        List<String> javaOptions = new ArrayList<>();
        for (int i = 0; i < args.length; i++) {
            String value = i + 1 < args.length ? args[i + 1] : null;
            if (value == null) {
                throw new IllegalArgumentException(args[i] + " needs a value");
            }
            switch (args[i]) {
                case "--rows" -> rows = java.util.Arrays.stream(value.split(",")).map(s -> Integer.parseInt(s.trim())).toList();
                case "--heap" -> heap = value;
                case "--jar" -> jar = Path.of(value);
                case "--work" -> work = Path.of(value);
                case "--seed" -> seed = Long.parseLong(value);
                case "--java-option" -> javaOptions.add(value);
                default -> throw new IllegalArgumentException("unknown option " + args[i]
                        + "; options: --rows N,N --heap SIZE --jar PATH --work DIR --seed N --java-option OPTION");
            }
            i++;
        }
        if (!Files.isRegularFile(jar)) {
            throw new IllegalStateException(jar.toAbsolutePath() + " not found: build it with mvn -o package -DskipTests");
        }
        Files.createDirectories(work);
        System.out.printf(Locale.ROOT, "cardwright large fit benchmark: Java %s, %d processors, %s %s, load average %.2f, child heap -Xmx%s%n",
                System.getProperty("java.version"), Runtime.getRuntime().availableProcessors(),
                System.getProperty("os.name"), System.getProperty("os.arch"),
                ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(), heap + (javaOptions.isEmpty() ? ""
                        : " " + String.join(" ", javaOptions)));
        System.out.println("rows      file MB  exit  wall s   CPU s   peak RSS MB  peak heap MB  summary");
        for (int n : rows) {
            Path data = work.resolve("forward-" + n + ".csv");
            write(data, n, seed);
            run(jar, heap, javaOptions, work, data, n);
        }
        System.out.println("work folder (delete at will): " + work.toAbsolutePath());
    }

    /** n rows at four temperatures, a quarter each, log-spaced currents, seeded noise. */
    static void write(Path file, int n, long seed) throws IOException {
        Random random = new Random(seed);
        int perTemperature = n / CELSIUS.length;
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("# Invented benchmark data, not a measurement of any real device.\n");
            w.write("# Built-in ngspice 39 equations with seeded noise; see org.cardwright.bench.LargeFitBenchmark.\n");
            w.write("V [V],I [A],T [degC]\n");
            int written = 0;
            for (int t = 0; t < CELSIUS.length; t++) {
                double c = CELSIUS[t];
                int count = t == CELSIUS.length - 1 ? n - written : perTemperature;
                DiodeAtTemperature d = TemperatureLaws.at(TRUTH, c + Ngspice39.CELSIUS_TO_KELVIN,
                        SimulatorOptions.NGSPICE_DEFAULTS);
                for (int k = 0; k < count; k++) {
                    double current = LOW_CURRENT * Math.pow(HIGH_CURRENT / LOW_CURRENT, k / (count - 1.0));
                    double voltage = DiodeSolver.voltageAtCurrent(d, current);
                    voltage += random.nextGaussian() * (0.15e-3 + 2e-4 * Math.abs(voltage));
                    current *= 1 + 1e-3 * random.nextGaussian();
                    w.write(String.format(Locale.ROOT, "%.9g,%.9g,%.1f%n", voltage, current, c));
                }
                written += count;
            }
        }
    }

    private static void run(Path jar, String heap, List<String> javaOptions, Path work, Path data, int n) throws Exception {
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Path out = work.resolve("out-" + n);
        Path log = work.resolve("log-" + n + ".txt");
        Path gc = work.resolve("gc-" + n + ".log");
        List<String> command = new ArrayList<>(List.of(java.toString(), "-Xmx" + heap, "-Xlog:gc:file=" + gc));
        command.addAll(javaOptions);
        command.addAll(List.of("-jar", jar.toAbsolutePath().toString(), "fit", data.toString(), "--name", "BIG", "--out",
                out.toString(), "--force"));
        long t0 = System.nanoTime();
        Process p = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(log.toFile()).start();
        long peakKb = 0;
        double cpu = 0;
        Path status = Path.of("/proc", Long.toString(p.pid()), "status");
        Path stat = Path.of("/proc", Long.toString(p.pid()), "stat");
        while (p.isAlive()) {
            peakKb = Math.max(peakKb, highWaterMark(status));
            cpu = Math.max(cpu, cpuSeconds(stat));
            Thread.sleep(50);
        }
        int code = p.waitFor();
        double seconds = (System.nanoTime() - t0) / 1e9;
        String summary = Files.readAllLines(log).stream()
                .filter(l -> l.startsWith("Model BIG") || l.startsWith("cardwright:")).findFirst().orElse("(see " + log + ")");
        System.out.printf(Locale.ROOT, "%-9d %7.1f  %4d  %6.1f  %6.1f  %11s  %12d  %s%n", n, Files.size(data) / 1e6, code,
                seconds, cpu,
                peakKb > 0 ? String.format(Locale.ROOT, "%.0f", peakKb / 1024.0) : "n/a", peakHeapMb(gc), summary);
    }

    /** VmHWM of a live process [kB], 0 when it cannot be read (not Linux, or the process just ended). */
    private static long highWaterMark(Path status) {
        try {
            for (String l : Files.readAllLines(status)) {
                if (l.startsWith("VmHWM:")) {
                    return Long.parseLong(l.replaceAll("[^0-9]", ""));
                }
            }
        } catch (IOException | RuntimeException e) {
            return 0;
        }
        return 0;
    }

    /**
     * User plus system CPU time of a live process, all its threads (JIT and GC included) [s], from fields 14 and 15
     * of /proc/PID/stat in clock ticks of 1/100 s (the Linux USER_HZ); 0 when it cannot be read. Polled, so the
     * last 50 ms of a run may be missing.
     */
    private static double cpuSeconds(Path stat) {
        try {
            String s = Files.readString(stat);
            String[] f = s.substring(s.lastIndexOf(')') + 2).split(" ");
            return (Long.parseLong(f[11]) + Long.parseLong(f[12])) / 100.0;
        } catch (IOException | RuntimeException e) {
            return 0;
        }
    }

    /** The largest heap occupancy any collection found on entry, from a -Xlog:gc file [MB]. */
    private static long peakHeapMb(Path gcLog) throws IOException {
        long peak = 0;
        if (!Files.exists(gcLog)) {
            return -1;
        }
        for (String l : Files.readAllLines(gcLog)) {
            Matcher m = GC_BEFORE.matcher(l);
            if (m.find()) {
                peak = Math.max(peak, Long.parseLong(m.group(1)));
            }
        }
        return peak;
    }
}
