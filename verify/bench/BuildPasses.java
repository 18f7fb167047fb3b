import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.cardwright.library.LibraryBuilder;

/**
 * Builds fresh copies of one library several times in one JVM and prints the process CPU time of each pass: the
 * first pass pays for class loading and the JIT compilers, the later ones show what a part costs once the code is
 * compiled (docs/performance.md section 8). Also prints the CPU time of the JVM's live threads by kind (the
 * compilers, the collector, the main thread, the part workers of the pass just ended are gone), read from /proc on
 * Linux.
 *
 * <pre>
 * java [JVM options] -cp target/cardwright.jar verify/bench/BuildPasses.java LIB PASSES [JOBS]
 * </pre>
 *
 * LIB is left as it is; pass k builds LIB-passk (replaced if it exists).
 */
public final class BuildPasses {
    public static void main(String[] args) throws Exception {
        if (args.length < 2) {
            System.err.println("usage: BuildPasses LIB PASSES [JOBS]");
            System.exit(2);
        }
        Path source = Path.of(args[0]);
        int passes = Integer.parseInt(args[1]);
        int jobs = args.length > 2 ? Integer.parseInt(args[2]) : 1;
        for (int p = 0; p < passes; p++) {
            Path tree = Path.of(args[0] + "-pass" + p);
            copy(source, tree);
            long wall = System.nanoTime();
            long cpu = processCpu();
            int parts = new LibraryBuilder(false).build(tree, line -> { }, jobs, (d, t, o) -> { }).size();
            System.out.printf(Locale.ROOT, "pass %d: %d parts on %d jobs, wall %.2f s, process CPU %.2f s (%.1f ms a part); %s%n",
                    p, parts, jobs, (System.nanoTime() - wall) / 1e9, (processCpu() - cpu) / 1e9,
                    (processCpu() - cpu) / 1e6 / parts, threads());
        }
    }

    private static long processCpu() {
        return ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean()).getProcessCpuTime();
    }

    /** CPU seconds of this JVM's live threads, grouped by kind; empty where /proc is missing. */
    private static String threads() {
        Map<String, Long> ticks = new TreeMap<>();
        try (Stream<Path> tasks = Files.list(Path.of("/proc/self/task"))) {
            for (Path t : tasks.toList()) {
                String stat = Files.readString(t.resolve("stat"));
                String name = stat.substring(stat.indexOf('(') + 1, stat.lastIndexOf(')'));
                String[] f = stat.substring(stat.lastIndexOf(')') + 2).split(" ");
                String kind = name.startsWith("C2") ? "C2" : name.startsWith("C1") ? "C1" : name.contains("GC") ? "GC"
                        : name.startsWith("cardwright-part") ? "workers" : name.equals("java") ? "main" : "other";
                ticks.merge(kind, Long.parseLong(f[11]) + Long.parseLong(f[12]), Long::sum);
            }
        } catch (Exception e) {
            return "";
        }
        StringBuilder sb = new StringBuilder("live threads' CPU [s]:");
        ticks.forEach((k, v) -> sb.append(' ').append(k).append('=').append(String.format(Locale.ROOT, "%.1f", v / 100.0)));
        return sb.toString();
    }

    private static void copy(Path from, Path to) throws Exception {
        if (Files.exists(to)) {
            try (Stream<Path> w = Files.walk(to)) {
                for (Path p : w.sorted(Comparator.reverseOrder()).toList()) {
                    Files.delete(p);
                }
            }
        }
        try (Stream<Path> w = Files.walk(from)) {
            for (Path p : w.toList()) {
                Path t = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(t);
                } else {
                    Files.copy(p, t);
                }
            }
        }
    }
}
