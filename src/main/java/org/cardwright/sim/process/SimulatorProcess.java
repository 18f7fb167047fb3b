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
 * Runs an external batch circuit simulator (ngspice or gnucap) on one netlist: writes the netlist into a work
 * folder, starts the simulator there with standard input closed, drains standard output and standard error
 * concurrently, and kills the whole process tree when the time limit passes.
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

    /**
     * @param kind       which simulator the executable is
     * @param executable path of the simulator executable
     * @param timeout    time limit for one run, positive [s]
     */
    public SimulatorProcess(Kind kind, Path executable, Duration timeout) {
        this.kind = Objects.requireNonNull(kind, "kind");
        this.executable = Objects.requireNonNull(executable, "executable");
        this.timeout = Objects.requireNonNull(timeout, "timeout");
        if (timeout.isNegative() || timeout.isZero()) {
            throw new IllegalArgumentException(kind.command() + " timeout must be positive, got " + timeout);
        }
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

    /** Time limit for one run [s]. */
    public Duration timeout() {
        return timeout;
    }

    /**
     * Writes {@code netlist} to {@code workDir/circuit.cir} (gnucap: {@code circuit.ckt}), creating the folder
     * if needed, and runs the simulator in batch mode there.
     */
    public Result run(String netlist, Path workDir) throws SimulationException {
        Objects.requireNonNull(netlist, "netlist");
        Objects.requireNonNull(workDir, "workDir");
        Path netlistPath = workDir.resolve(kind.netlistFile());
        try {
            Files.createDirectories(workDir);
            Files.writeString(netlistPath, netlist, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new SimulationException(kind.command() + ": cannot write netlist " + netlistPath + ": " + e, e);
        }
        Result result = execute(List.of(executable.toString(), "-b", kind.netlistFile()), workDir);
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
        Path cwd = Path.of(System.getProperty("java.io.tmpdir"));
        List<String> command = kind == Kind.NGSPICE
                ? List.of(executable.toString(), "-v")
                : List.of(executable.toString(), "--version");
        Result result = execute(command, cwd);
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

    private Result execute(List<String> command, Path cwd) throws SimulationException {
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
            boolean finished = process.waitFor(timeout.toNanos(), TimeUnit.NANOSECONDS);
            if (!finished) {
                killTree(process.toHandle());
                joinQuietly(outThread);
                joinQuietly(errThread);
                throw new SimulationException(kind.command() + " did not finish within " + seconds(timeout)
                        + " and was killed [" + cwd.resolve(kind.netlistFile()) + "]");
            }
            outThread.join(DRAIN_GRACE.toMillis());
            errThread.join(DRAIN_GRACE.toMillis());
        } catch (InterruptedException e) {
            killTree(process.toHandle());
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

    /** Takes a snapshot of all descendants while the parent still lives, then kills the parent and each of them. */
    private static void killTree(ProcessHandle root) {
        List<ProcessHandle> descendants = root.descendants().toList();
        root.destroyForcibly();
        descendants.forEach(ProcessHandle::destroyForcibly);
        try {
            root.onExit().get(DRAIN_GRACE.toMillis(), TimeUnit.MILLISECONDS);
        } catch (Exception stillDying) {
            // the operating system will reap it; the run has failed either way
        }
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
     * simulator prints about the card is a failure, since a card must load without one.
     */
    public Run runClean(String netlist, Path workRoot) throws SimulationException {
        Path dir;
        try {
            java.nio.file.Files.createDirectories(workRoot);
            dir = java.nio.file.Files.createTempDirectory(workRoot, kind.command() + "-");
        } catch (java.io.IOException e) {
            throw new SimulationException(kind.command() + ": cannot create a work folder under " + workRoot + ": "
                    + e.getMessage(), e);
        }
        Result result = run(netlist, dir);
        if (!result.warnings().isEmpty()) {
            throw new SimulationException(kind.command() + " warned about the card: " + result.warnings().get(0)
                    + " (netlist kept in " + dir + ")");
        }
        return new Run(result, dir);
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
