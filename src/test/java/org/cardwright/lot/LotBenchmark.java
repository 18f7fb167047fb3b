package org.cardwright.lot;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.stream.Stream;
import org.cardwright.card.Dialect;
import org.cardwright.data.ReadOptions;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.fit.DeviceKind;
import org.cardwright.report.LotJson;

/**
 * The lot benchmark (a measurement, not a test): parts per second of the whole lot job on 1 and 2 threads, and the
 * wall time of a 1000-part forward-only lot on 2 threads (goal: under 30 s on a 2-core machine). The lot is invented
 * ({@link LotGenerator}, forward I-V only, 38 points a part, seeded). Each timing is a fresh lot folder, so nothing
 * is resumed; the JVM is warmed up by a small lot first.
 *
 * <p>Run: {@code verify/bench/run-lot [--parts N] [--warmup N]}.
 */
public final class LotBenchmark {
    private LotBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        int parts = 1000;
        int warmup = 60;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--parts" -> parts = Integer.parseInt(args[++i]);
                case "--warmup" -> warmup = Integer.parseInt(args[++i]);
                case "--write" -> {
                    // only write the acceptance-style lot (C-V, outliers, two unreadable files) for other tools to time
                    LotGenerator.Lot lot = LotGenerator.write(Path.of(args[++i]), parts, 20261203L, true, true);
                    System.out.println("wrote " + (lot.normal().size() + lot.outliers().size() + lot.unreadable().size()) + " parts");
                    return;
                }
                default -> throw new IllegalArgumentException("unknown option " + args[i] + " (--parts N, --warmup N, --write DIR)");
            }
        }
        Path root = Files.createTempDirectory("cardwright-lot-bench-");
        try {
            LotGenerator.write(root.resolve("warm"), warmup, 5L, false, false);
            LotGenerator.write(root.resolve("lot"), parts, 6L, false, false);
            System.out.printf(Locale.ROOT, "cores %d, load average %.2f, Java %s%n", Runtime.getRuntime().availableProcessors(),
                    java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(),
                    System.getProperty("java.version"));
            run(root, "warm", 2, "warm-up");
            for (int jobs : new int[] {1, 2}) {
                run(root, "lot", jobs, "measured");
            }
        } finally {
            try (Stream<Path> s = Files.walk(root)) {
                for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                    Files.deleteIfExists(p);
                }
            }
        }
    }

    private static void run(Path root, String lot, int jobs, String what) throws Exception {
        LotSettings settings = new LotSettings(ReadOptions.defaults(), DeviceKind.SILICON_PN, List.of(), CapacitanceOptions.DEFAULT);
        Path out = root.resolve("out-" + lot + "-" + jobs);
        LotRequest request = new LotRequest(List.of(root.resolve(lot)), "BENCH", out, List.of(Dialect.NGSPICE), jobs, settings,
                3.0, Map.of(), OptionalDouble.empty(), 7, false, java.util.Optional.empty());
        var os = (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        long c0 = os.getProcessCpuTime();
        long t0 = System.nanoTime();
        LotOutcome o = new LotJob().run(request, LotJson::write, LotProgress.NONE);
        double s = (System.nanoTime() - t0) * 1e-9;
        double cpu = (os.getProcessCpuTime() - c0) * 1e-9;
        System.out.printf(Locale.ROOT, "%-8s %5d parts, %d thread(s): %7.2f s wall, %6.1f parts/s, %7.2f s CPU (%.1f ms a part), load %.1f; %d fitted, %d outliers, IS mean log10 %.4f, N mean %.4f%n",
                what, o.parts().size(), jobs, s, o.parts().size() / s, cpu, 1e3 * cpu / o.parts().size(), os.getSystemLoadAverage(), o.parts().stream().filter(PartResult::ok).count(),
                o.statistics().outliers().size(), o.statistics().parameters().get(org.cardwright.model.Param.IS).mean(),
                o.statistics().parameters().get(org.cardwright.model.Param.N).mean());
    }
}
