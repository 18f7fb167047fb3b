package org.cardwright.sim.process;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

/**
 * Runs an external batch circuit simulator (ngspice or gnucap) on one netlist: writes the netlist into a fresh
 * private work folder ({@link Files#createTempDirectory}, owner-only), starts the simulator there with standard
 * input closed, drains standard output and standard error concurrently, and kills the whole process tree when the
 * time limit passes. The tree is tracked while the simulator runs (its descendants are sampled every
 * {@link #TREE_SAMPLE} and remembered), so that a grandchild that left the process group with {@code setsid}, or
 * whose parent already exited, is killed too; after every run, finished or not, nothing it started is left
 * running. The time limit of a run is a fixed part plus a part per operating point ({@link #runClean(String, Path,
 * int)}).
 *
 * <p>A run fails with a {@link SimulationException} when the executable is missing, the time limit passes, the
 * process exits with a non-zero code, or the simulator prints an error line (gnucap exits with 0 even after
 * errors, so its output is the only sign). Lines that report lesser problems are returned as
 * {@link Result#warnings()}.
 *
 * <p>ngspice 39 quirk: {@code ngspice -b} exits with code 1 after a {@code .control} block unless the block
 * ends with {@code quit}; the failure message then says so.
 */
public final class SimulatorProcess {
    /** Environment variable that overrides where ngspice is found. */
    public static final String NGSPICE_VARIABLE = "CARDWRIGHT_NGSPICE";
    /** Environment variable that overrides where gnucap is found. */
    public static final String GNUCAP_VARIABLE = "CARDWRIGHT_GNUCAP";

    /** How long to wait for the output readers after the process has ended or was killed. */
    private static final Duration DRAIN_GRACE = Duration.ofSeconds(5);
    /** How often the process tree is sampled while the simulator runs. */
    static final Duration TREE_SAMPLE = Duration.ofMillis(50);
    /** Versions already asked for, by executable: {@code ngspice -v} runs once per executable and JVM. */
    private static final java.util.concurrent.ConcurrentMap<String, String> VERSIONS =
            new java.util.concurrent.ConcurrentHashMap<>();

    /** The simulators this class knows how to start. */
    public enum Kind {
        NGSPICE("ngspice", NGSPICE_VARIABLE, "circuit.cir"),
        GNUCAP("gnucap", GNUCAP_VARIABLE, "circuit.ckt");

        private final String command;
        private final String variable;
        private final String netlistFile;

        Kind(String command, String variable, String netlistFile) {
            this.command = command;
            this.variable = variable;
            this.netlistFile = netlistFile;
        }

        /** The executable's usual name, also used in messages. */
        public String command() {
            return command;
        }

        /** Environment variable that overrides the executable's location. */
        public String environmentVariable() {
            return variable;
        }

        /** Name of the netlist file written into the work folder. */
        public String netlistFile() {
            return netlistFile;
        }
    }

    /**
     * What one finished run produced.
     *
     * @param exitCode process exit code (0 here, since other codes fail the run)
     * @param stdout   everything the simulator wrote to standard output
     * @param stderr   everything the simulator wrote to standard error
     * @param warnings distinct lines reporting problems, trimmed, in order of first appearance
     * @param elapsed  wall-clock time from start to exit [s]
     */
    public record Result(int exitCode, String stdout, String stderr, List<String> warnings, Duration elapsed) {
        public Result {
            Objects.requireNonNull(stdout, "stdout");
            Objects.requireNonNull(stderr, "stderr");
            warnings = List.copyOf(warnings);
            Objects.requireNonNull(elapsed, "elapsed");
        }
    }

    private final Kind kind;
    private final Path executable;
    private final Duration timeout;
    private final Duration perPoint;

    /**
     * @param kind       which simulator the executable is
     * @param executable path of the simulator executable
     * @param timeout    time limit for one run, positive [s]
     */
    public SimulatorProcess(Kind kind, Path executable, Duration timeout) {
        this(kind, executable, timeout, Duration.ZERO);
    }

    /**
     * @param kind       which simulator the executable is
     * @param executable path of the simulator executable
     * @param timeout    fixed part of the time limit of one run, positive [s]
     * @param perPoint   added to the time limit for each operating point of the run, not negative [s]
     */
    public SimulatorProcess(Kind kind, Path executable, Duration timeout, Duration perPoint) {
        this.kind = Objects.requireNonNull(kind, "kind");
        this.executable = Objects.requireNonNull(executable, "executable");
        this.timeout = Objects.requireNonNull(timeout, "timeout");
        this.perPoint = Objects.requireNonNull(perPoint, "perPoint");
        if (timeout.isNegative() || timeout.isZero()) {
            throw new IllegalArgumentException(kind.command() + " timeout must be positive, got " + timeout);
        }
        if (perPoint.isNegative()) {
            throw new IllegalArgumentException(kind.command() + " time per point must not be negative, got " + perPoint);
        }
    }

    /**
     * Why {@link #locate} found nothing, in one line: the variable's value when it is set ("CARDWRIGHT_NGSPICE is
     * set to '/opt/x/ngspice', which is not an executable file"), otherwise that the command is not on the PATH.
     */
    public static String notFoundMessage(Kind kind) {
        String override = System.getenv(kind.environmentVariable());
        if (override != null && !override.isBlank()) {
            String value = override.trim();
            String shown = "'" + value.replaceAll("\\p{Cntrl}", "?") + "'";
            return value.contains("/") || value.contains(File.separator)
                    ? kind.environmentVariable() + " is set to " + shown + ", which is not an executable file"
                    : kind.environmentVariable() + " is set to " + shown + ", which is not an executable on the PATH";
        }
        return kind.command() + " not found on the PATH: install it (Debian/Ubuntu: apt-get install " + kind.command()
                + ") or set " + kind.environmentVariable() + " to its path";
    }

    /**
     * Finds the executable: the environment variable {@code CARDWRIGHT_NGSPICE} / {@code CARDWRIGHT_GNUCAP} if
     * it is set (a path, or a bare name looked up on the PATH), else the usual name on the PATH. Empty when
     * nothing executable is found; a variable that is set but wrong is not silently replaced by the PATH.
     */
    public static Optional<Path> locate(Kind kind) {
        String override = System.getenv(kind.environmentVariable());
        if (override != null && !override.isBlank()) {
            String value = override.trim();
            if (value.contains("/") || value.contains(File.separator)) {
                Path path = Path.of(value);
                return isExecutableFile(path) ? Optional.of(path.toAbsolutePath()) : Optional.empty();
            }
            return searchPath(value);
        }
        return searchPath(kind.command());
    }

    private static Optional<Path> searchPath(String name) {
        String path = System.getenv("PATH");
        if (path == null) {
            return Optional.empty();
        }
        boolean windows = System.getProperty("os.name", "").toLowerCase(Locale.ROOT).startsWith("windows");
        for (String directory : path.split(File.pathSeparator)) {
            if (directory.isEmpty()) {
                continue;
            }
            for (String candidate : windows ? List.of(name + ".exe", name) : List.of(name)) {
                Path file = Path.of(directory, candidate);
                if (isExecutableFile(file)) {
                    return Optional.of(file.toAbsolutePath());
                }
            }
        }
        return Optional.empty();
    }

    private static boolean isExecutableFile(Path path) {
        return Files.isRegularFile(path) && Files.isExecutable(path);
    }

    /** Which simulator this runs. */
    public Kind kind() {
        return kind;
    }

    /** The executable this runs. */
    public Path executable() {
        return executable;
    }

    /** Time limit for one run, the fixed part [s]. */
    public Duration timeout() {
        return timeout;
    }

    /** Time limit of a run of {@code points} operating points: the fixed part plus the part per point [s]. */
    public Duration timeout(int points) {
        return timeout.plus(perPoint.multipliedBy(Math.max(0, points)));
    }

    /**
     * Writes {@code netlist} to {@code workDir/circuit.cir} (gnucap: {@code circuit.ckt}), creating the folder
     * if needed, and runs the simulator in batch mode there.
     */
    public Result run(String netlist, Path workDir) throws SimulationException {
        return run(netlist, workDir, timeout);
    }

    private Result run(String netlist, Path workDir, Duration limit) throws SimulationException {
        Objects.requireNonNull(netlist, "netlist");
        Objects.requireNonNull(workDir, "workDir");
        Path netlistPath = workDir.resolve(kind.netlistFile());
        try {
            Files.createDirectories(workDir);
            Files.writeString(netlistPath, netlist, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new SimulationException(kind.command() + ": cannot write netlist " + netlistPath + ": " + e, e);
        }
        Result result = execute(List.of(executable.toString(), "-b", kind.netlistFile()), workDir, limit);
        if (result.exitCode() != 0) {
            String detail = OutputScan.firstError(kind, result.stdout(), result.stderr())
                    .orElseGet(() -> OutputScan.lastLine(result.stderr()));
            String hint = kind == Kind.NGSPICE && hasControlBlockWithoutQuit(netlist)
                    ? " (the .control block does not end with quit)" : "";
            throw new SimulationException(kind.command() + " exited with code " + result.exitCode() + hint
                    + (detail.isEmpty() ? "" : ": " + detail) + " [" + netlistPath + "]");
        }
        Optional<String> error = OutputScan.firstError(kind, result.stdout(), result.stderr());
        if (error.isPresent()) {
            throw new SimulationException(kind.command() + " reported an error: " + error.get()
                    + " [" + netlistPath + "]");
        }
        return result;
    }

    /**
     * The simulator's version as its banner states it: {@code ngspice-39} for ngspice; {@code gnucap} followed
     * by the "main version" of the banner for gnucap (e.g. {@code gnucap master 2017.10.03}).
     */
    public String version() throws SimulationException {
        String key = kind + " " + executable.toAbsolutePath();
        String known = VERSIONS.get(key);
        if (known != null) {
            return known;
        }
        String found = askVersion();
        VERSIONS.put(key, found);
        return found;
    }

    private String askVersion() throws SimulationException {
        Path cwd;
        try {
            cwd = privateFolder(null, kind.command() + "-version-");
        } catch (IOException e) {
            throw new SimulationException(kind.command() + ": cannot create a work folder: " + e.getMessage(), e);
        }
        List<String> command = kind == Kind.NGSPICE
                ? List.of(executable.toString(), "-v")
                : List.of(executable.toString(), "--version");
        Result result = execute(command, cwd, timeout);
        discard(cwd);
        String text = result.stdout() + "\n" + result.stderr();
        for (String line : text.split("\\R")) {
            String stripped = line.replaceAll("^[\\s*]+|[\\s*]+$", "");
            if (kind == Kind.NGSPICE && stripped.startsWith("ngspice")) {
                int colon = stripped.indexOf(" : ");
                return colon > 0 ? stripped.substring(0, colon).trim() : stripped;
            }
            if (kind == Kind.GNUCAP && stripped.startsWith("main version:")) {
                return "gnucap " + stripped.substring("main version:".length()).trim();
            }
        }
        throw new SimulationException(kind.command() + " printed no version banner (exit code "
                + result.exitCode() + ")");
    }

    private static boolean hasControlBlockWithoutQuit(String netlist) {
        String lower = netlist.toLowerCase(Locale.ROOT);
        int start = lower.indexOf(".control");
        if (start < 0) {
            return false;
        }
        int end = lower.indexOf(".endc", start);
        String block = end < 0 ? lower.substring(start) : lower.substring(start, end);
        return block.lines().map(String::trim).noneMatch(l -> l.equals("quit") || l.startsWith("quit "));
    }

    private Result execute(List<String> command, Path cwd, Duration limit) throws SimulationException {
        if (!isExecutableFile(executable)) {
            throw new SimulationException(kind.command() + " executable not found or not executable: "
                    + executable);
        }
        ProcessBuilder builder = new ProcessBuilder(command).directory(cwd.toFile());
        long start = System.nanoTime();
        Process process;
        try {
            process = builder.start();
        } catch (IOException e) {
            throw new SimulationException(kind.command() + " could not be started (" + executable + "): "
                    + e.getMessage(), e);
        }
        ProcessTree tree = new ProcessTree(process.toHandle());
        StreamDrain out = new StreamDrain(process.getInputStream());
        StreamDrain err = new StreamDrain(process.getErrorStream());
        Thread outThread = startDaemon(out, kind.command() + "-stdout");
        Thread errThread = startDaemon(err, kind.command() + "-stderr");
        try {
            process.getOutputStream().close();
        } catch (IOException ignoredBecauseChildMayHaveExited) {
            // closing stdin of a child that already exited can fail; nothing to do
        }
        try {
            long deadline = start + limit.toNanos();
            boolean finished = false;
            while (!finished) {
                tree.sample();
                long left = deadline - System.nanoTime();
                if (left <= 0) {
                    break;
                }
                finished = process.waitFor(Math.min(left, TREE_SAMPLE.toNanos()), TimeUnit.NANOSECONDS);
            }
            if (!finished) {
                tree.killAll(DRAIN_GRACE);
                joinQuietly(outThread);
                joinQuietly(errThread);
                throw new SimulationException(kind.command() + " did not finish within " + seconds(limit)
                        + " and was killed with everything it started [" + cwd.resolve(kind.netlistFile()) + "]");
            }
            // whatever the simulator left running in the background is ours to stop
            tree.killAll(DRAIN_GRACE);
            outThread.join(DRAIN_GRACE.toMillis());
            errThread.join(DRAIN_GRACE.toMillis());
        } catch (InterruptedException e) {
            tree.killAll(Duration.ZERO);
            Thread.currentThread().interrupt();
            throw new SimulationException(kind.command() + " run was interrupted and the process killed", e);
        }
        Duration elapsed = Duration.ofNanos(System.nanoTime() - start);
        for (StreamDrain drain : List.of(out, err)) {
            if (drain.failure() != null) {
                throw new SimulationException(kind.command() + " output could not be read: "
                        + drain.failure().getMessage(), drain.failure());
            }
        }
        String stdout = out.text();
        String stderr = err.text();
        return new Result(process.exitValue(), stdout, stderr, OutputScan.warnings(kind, stdout, stderr), elapsed);
    }

    private static Thread startDaemon(Runnable task, String name) {
        Thread thread = new Thread(task, name);
        thread.setDaemon(true);
        thread.start();
        return thread;
    }

    private static void joinQuietly(Thread thread) throws InterruptedException {
        thread.join(DRAIN_GRACE.toMillis());
    }

    /** "30 s", "2.5 s": the time limit as a person would write it. */
    static String seconds(Duration duration) {
        double value = duration.toNanos() / 1e9;
        String number = value == Math.rint(value)
                ? Long.toString((long) value)
                : String.format(Locale.ROOT, "%.3f", value).replaceAll("0+$", "");
        return number + " s";
    }

    /**
     * The outcome of {@link #runClean}: the run and the folder it ran in (delete it with {@link #discard} once
     * its outputs are read; a failure keeps it for the user, and the message says where).
     *
     * @param result the run
     * @param folder its work folder
     */
    public record Run(Result result, Path folder) {
    }

    /**
     * Runs {@code netlist} in a fresh folder under {@code workRoot} and insists on a clean run: any warning the
     * simulator prints about the card is a failure, since a card must load without one. The time limit is the fixed
     * part alone; prefer {@link #runClean(String, Path, int)}.
     */
    public Run runClean(String netlist, Path workRoot) throws SimulationException {
        return runClean(netlist, workRoot, 0);
    }

    /**
     * Runs {@code netlist}, which solves {@code points} operating points, in a fresh private folder (owner-only)
     * under {@code workRoot} (or under the system's temporary folder when {@code workRoot} is null), within
     * {@link #timeout(int)}, and insists on a clean run: any warning the simulator prints about the card is a
     * failure, since a card must load without one.
     */
    public Run runClean(String netlist, Path workRoot, int points) throws SimulationException {
        Path dir;
        try {
            dir = privateFolder(workRoot, kind.command() + "-");
        } catch (IOException e) {
            throw new SimulationException(kind.command() + ": cannot create a work folder under "
                    + (workRoot == null ? "the temporary folder" : workRoot) + ": " + e.getMessage(), e);
        }
        Result result = run(netlist, dir, timeout(points));
        if (!result.warnings().isEmpty()) {
            // every warning, never the first alone: ngspice puts "Model issue on line 6 :" and the reason on two lines
            throw new SimulationException(kind.command() + " warned about the card: " + String.join(" / ", result.warnings())
                    + " (netlist kept in " + dir + ")");
        }
        return new Run(result, dir);
    }

    /**
     * A fresh folder that only this user can enter ({@code rwx------} where the file system has POSIX permissions),
     * made by {@link Files#createTempDirectory} so its name cannot be guessed or taken over beforehand.
     *
     * @param parent the folder to make it in (created if missing), or null for the system's temporary folder
     */
    public static Path privateFolder(Path parent, String prefix) throws IOException {
        boolean posix = java.nio.file.FileSystems.getDefault().supportedFileAttributeViews().contains("posix");
        java.nio.file.attribute.FileAttribute<?>[] attributes = posix
                ? new java.nio.file.attribute.FileAttribute<?>[] {java.nio.file.attribute.PosixFilePermissions
                        .asFileAttribute(java.nio.file.attribute.PosixFilePermissions.fromString("rwx------"))}
                : new java.nio.file.attribute.FileAttribute<?>[0];
        if (parent == null) {
            return Files.createTempDirectory(prefix, attributes);
        }
        Files.createDirectories(parent);
        return Files.createTempDirectory(parent, prefix, attributes);
    }

    /** Deletes a run's folder; a leftover temporary folder is harmless, so failures are ignored. */
    public static void discard(Path dir) {
        try (var s = java.nio.file.Files.list(dir)) {
            for (Path p : (Iterable<Path>) s::iterator) {
                java.nio.file.Files.deleteIfExists(p);
            }
            java.nio.file.Files.deleteIfExists(dir);
        } catch (java.io.IOException e) {
            // a leftover temporary folder is harmless
        }
    }
}
