package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

/**
 * Issue 10, simulator faults: small shell scripts stand in for ngspice or gnucap (through CARDWRIGHT_NGSPICE and
 * CARDWRIGHT_GNUCAP) and hang, ignore SIGTERM, start a grandchild that calls setsid, or print garbage, NaN, Inf,
 * cut-off numbers, too many or too few values. Each run of the real command line (a fresh JVM, so the variables
 * apply) must exit 5 with one line on standard error and no stack trace, and every process a script started (each
 * writes its PID to a file) must be gone afterwards.
 */
class FakeSimulatorTest {
    /** The time limit the runs get: long enough for a fake to start, short enough for the test [s]. */
    private static final String SIM_TIMEOUT_SECONDS = "2";
    /** Longest a whole command may take: JVM start, the 2 s limit and the kill [s]. */
    private static final long COMMAND_SECONDS = 60;
    /** Command lines run at once: they mostly wait, so more than the two cores. */
    private static final int PARALLEL_RUNS = 4;
    /** Longest a killed process may take to disappear from the process table [ms]. */
    private static final long REAP_MILLIS = 5000;

    private static final String NGSPICE_HEAD = String.join("\n",
            "#!/bin/sh",
            "# fake ngspice for cardwright tests",
            "if [ \"$1\" = \"-v\" ]; then echo '** ngspice-39 : fake simulator for tests'; exit 0; fi",
            "n=$(grep -c '^D' circuit.cir)",
            "# raw V I EXTRA: a raw file (text) of n points' v(aK) and i(@dK[id]), with EXTRA values more (or fewer)",
            "raw() { echo 'Title: fake'; echo \"No. Variables: $((2*n))\"; echo 'No. Points: 1'; echo 'Variables:';",
            "  i=0; while [ $i -lt \"$n\" ]; do k=$((i+1)); printf '\\t%d\\tv(a%d)\\tvoltage\\n\\t%d\\ti(@d%d[id])\\tcurrent\\n' $((2*i)) $k $((2*i+1)) $k; i=$((i+1)); done;",
            "  echo 'Values:'; m=$((2*n+$3)); j=0;",
            "  while [ $j -lt $m ]; do if [ $j -eq 0 ]; then printf ' 0\\t%s\\n' \"$1\"; elif [ $((j%2)) -eq 0 ]; then printf '\\t%s\\n' \"$1\";",
            "  else printf '\\t%s\\n' \"$2\"; fi; j=$((j+1)); done; }",
            "");
    private static final String GNUCAP_HEAD = String.join("\n",
            "#!/bin/sh",
            "# fake gnucap for cardwright tests",
            "if [ \"$1\" = \"--version\" ]; then echo 'main version: fake 2017.10.03'; exit 0; fi",
            "");

    /** A scenario: the script body after the head, and a piece the one error line must contain. */
    private record Fault(String name, boolean gnucap, String body, String expected) {
    }

    private static List<Fault> faults() {
        return List.of(
                new Fault("hangs", false, "echo $$ >> \"$PIDS\"\nsleep 600\n", "did not finish within 2 s"),
                new Fault("ignores-sigterm", false,
                        "trap '' TERM INT HUP\necho $$ >> \"$PIDS\"\nwhile :; do sleep 1; done\n", "did not finish within 2 s"),
                new Fault("setsid-grandchild-while-hanging", false,
                        "setsid sh -c 'echo $$ >> \"$PIDS\"; exec sleep 600' &\necho $$ >> \"$PIDS\"\nsleep 600\n",
                        "did not finish within 2 s"),
                new Fault("setsid-grandchild-left-behind", false,
                        "setsid sh -c 'echo $$ >> \"$PIDS\"; exec sleep 600' </dev/null >/dev/null 2>&1 &\nsleep 1\n"
                                + "echo 'fake output' > points.raw\nexit 0\n", "no variable count"),
                // ngspice puts "Model issue on line N :" and the reason on two lines: both reach the user, in one line
                new Fault("two-line-warning", false, "echo 'Warning: Model issue on line 6 :'\n"
                        + "echo 'unrecognized parameter (tbv1) - ignored'\nraw 0.65 1e-3 0 > points.raw\n",
                        "Model issue on line 6 : / unrecognized parameter (tbv1) - ignored"),
                new Fault("garbage", false, "echo 'this is not a table of numbers' > points.raw\n", "no variable count"),
                new Fault("binary", false, "raw \"$(printf '\\001\\002\\377')\" 1e-3 0 > points.raw\n", "not a finite number"),
                new Fault("nan", false, "raw nan nan 0 > points.raw\n", "'nan', not a finite number"),
                new Fault("inf", false, "raw inf 1e-3 0 > points.raw\n", "'inf', not a finite number"),
                new Fault("overflow", false, "raw 1e999 1e-3 0 > points.raw\n", "'1e999', not a finite number"),
                new Fault("cut-off", false, "raw 0.6e 1e-3 0 > points.raw\n", "'0.6e', not a finite number"),
                new Fault("too-many", false, "raw 0.65 1e-3 1 > points.raw\n", "unexpected value line"),
                new Fault("too-few", false, "raw 0.65 1e-3 -1 > points.raw\n", "values of its"),
                new Fault("too-many-columns", false, "raw '0.65 7' 1e-3 0 > points.raw\n", "unexpected value line"),
                new Fault("no-output", false, "exit 0\n", "wrote no results"),
                new Fault("runaway-output", false, "raw 0.65 1e-3 0 > points.raw\nyes '\t0.65' | head -n 200000 >> points.raw\n", "bytes of results"),
                new Fault("exits-1", false, "echo 'Error: fake failure' >&2\nexit 1\n", "exited with code 1"),
                new Fault("gnucap-hangs", true, "echo $$ >> \"$PIDS\"\nsleep 600\n", "did not finish within 2 s"),
                new Fault("gnucap-setsid-grandchild", true,
                        "setsid sh -c 'echo $$ >> \"$PIDS\"; exec sleep 600' &\nsleep 600\n", "did not finish within 2 s"),
                new Fault("gnucap-nan", true,
                        "echo 'cardwright gnucap re-simulation of model KS1'\necho '# v(a) v(b) i(D)'\n"
                                + "echo '27. nan 0. 0.'\n", "gnucap: 27. nan 0. 0."));
    }

    private record Outcome(int exitCode, String stdout, String stderr) {
    }

    private static Outcome cli(Path dir, String variable, String value, String... args) throws Exception {
        List<String> command = new ArrayList<>(List.of(
                Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                // a failed run keeps its netlist for the user in the temporary folder: here, the test's own folder
                "-Djava.io.tmpdir=" + dir,
                "-cp", System.getProperty("surefire.test.class.path", System.getProperty("java.class.path")),
                Main.class.getName()));
        command.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(command).directory(dir.toFile())
                .redirectOutput(dir.resolve("stdout.txt").toFile()).redirectError(dir.resolve("stderr.txt").toFile());
        pb.environment().put(variable, value);
        pb.environment().put("PIDS", dir.resolve("pids").toString());
        Process p = pb.start();
        boolean done = p.waitFor(COMMAND_SECONDS, TimeUnit.SECONDS);
        if (!done) {
            p.destroyForcibly();
        }
        assertTrue(done, "the command did not finish in " + COMMAND_SECONDS + " s");
        return new Outcome(p.exitValue(), Files.readString(dir.resolve("stdout.txt")),
                Files.readString(dir.resolve("stderr.txt")));
    }

    private static Path script(Path dir, String name, String text) throws IOException {
        Path file = dir.resolve(name);
        Files.writeString(file, text, StandardCharsets.UTF_8);
        Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("rwx------"));
        return file;
    }

    /** Every PID in the file is gone (waiting up to REAP_MILLIS for the kernel to finish with it). */
    private static void assertNoneLeft(Path pids, String label) throws Exception {
        if (!Files.exists(pids)) {
            return;
        }
        for (String line : Files.readAllLines(pids)) {
            if (line.isBlank()) {
                continue;
            }
            long pid = Long.parseLong(line.strip());
            long deadline = System.currentTimeMillis() + REAP_MILLIS;
            while (alive(pid) && System.currentTimeMillis() < deadline) {
                Thread.sleep(50);
            }
            assertFalse(alive(pid), label + ": process " + pid + " started by the fake simulator is still running");
        }
    }

    /** Alive and not a zombie (a killed orphan waits in the table until init reaps it). */
    private static boolean alive(long pid) throws IOException {
        Optional<ProcessHandle> h = ProcessHandle.of(pid);
        if (h.isEmpty() || !h.get().isAlive()) {
            return false;
        }
        Path stat = Path.of("/proc", Long.toString(pid), "stat");
        if (!Files.exists(stat)) {
            return false;
        }
        String s = Files.readString(stat);
        return s.charAt(s.lastIndexOf(')') + 2) != 'Z';
    }

    /** KS1's generating card without the terms gnucap 2017 does not carry, as a gnucap card in {@code dir}. */
    private static Path gnucapCard(Path dir) throws IOException {
        return Files.writeString(dir.resolve("KS1.gnucap.lib"),
                "* invented KS1 switching diode for the fake-simulator test\n.model KS1 d (is=1.5e-14 n=1.02 rs=0.85 eg=1.11)\n",
                StandardCharsets.UTF_8);
    }

    @TestFactory
    Stream<DynamicTest> everyFaultExitsFiveWithOneLineAndLeavesNoProcess() throws IOException {
        Path card = Simulators.projectDir().resolve("fixtures/demo/generating-card.lib");
        Path data = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        // the runs mostly wait (JVM start, the time limit), so they run side by side and each test takes its outcome
        java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(PARALLEL_RUNS);
        java.util.Map<String, java.util.concurrent.Future<Outcome>> outcomes = new java.util.LinkedHashMap<>();
        java.util.Map<String, Path> dirs = new java.util.HashMap<>();
        for (Fault f : faults()) {
            Path dir = Simulators.tempDir("fake-sim-" + f.name());
            dirs.put(f.name(), dir);
            outcomes.put(f.name(), pool.submit(() -> {
                Path fake = script(dir, "fake.sh", (f.gnucap() ? GNUCAP_HEAD : NGSPICE_HEAD) + f.body());
                // gnucap runs only cards of its own dialect (verify refuses any other before a simulator starts)
                Path runCard = f.gnucap() ? gnucapCard(dir) : card;
                return cli(dir, f.gnucap() ? "CARDWRIGHT_GNUCAP" : "CARDWRIGHT_NGSPICE", fake.toString(),
                        "verify", runCard.toString(), data.toString(), "--engine", f.gnucap() ? "gnucap" : "ngspice",
                        "--sim-timeout", SIM_TIMEOUT_SECONDS);
            }));
        }
        pool.shutdown();
        return faults().stream().map(f -> DynamicTest.dynamicTest(f.name(), () -> {
            Path dir = dirs.get(f.name());
            Outcome o = outcomes.get(f.name()).get(COMMAND_SECONDS * 4, TimeUnit.SECONDS);
            String label = f.name() + ": exit " + o.exitCode() + "\n" + o.stderr();
            assertEquals(ExitCodes.SIMULATOR_FAILED, o.exitCode(), label);
            List<String> lines = o.stderr().lines().filter(l -> !l.isBlank()).toList();
            assertEquals(1, lines.size(), label);
            assertTrue(lines.get(0).startsWith("cardwright: "), label);
            assertTrue(lines.get(0).contains(f.expected()), "expected '" + f.expected() + "' in " + label);
            assertFalse(o.stderr().contains("\tat ") || o.stderr().contains("Exception"), label);
            assertTrue(lines.get(0).chars().allMatch(c -> c >= 0x20 && c < 0x7f), "printable: " + label);
            assertNoneLeft(dir.resolve("pids"), f.name());
            // the line names where the failed run's netlist was kept, and that is inside the run's own folder
            assertTrue(lines.get(0).contains(dir.toString() + "/cardwright-"), "netlist kept in " + dir + ": " + label);
        }));
    }

    @Test
    void aVariableThatNamesNoExecutableSaysSo() throws Exception {
        Path dir = Simulators.tempDir("fake-sim-missing");
        Path card = Simulators.projectDir().resolve("fixtures/demo/generating-card.lib");
        Path data = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        Path missing = dir.resolve("no-such-ngspice");
        Outcome o = cli(dir, "CARDWRIGHT_NGSPICE", missing.toString(),
                "verify", card.toString(), data.toString(), "--engine", "ngspice");
        assertEquals(ExitCodes.SIMULATOR_FAILED, o.exitCode(), o.stderr());
        assertEquals("cardwright: CARDWRIGHT_NGSPICE is set to '" + missing + "', which is not an executable file",
                o.stderr().strip());
        Outcome g = cli(dir, "CARDWRIGHT_GNUCAP", dir.toString(),
                "verify", gnucapCard(dir).toString(), data.toString(), "--engine", "gnucap");
        assertEquals(ExitCodes.SIMULATOR_FAILED, g.exitCode(), g.stderr());
        assertEquals("cardwright: CARDWRIGHT_GNUCAP is set to '" + dir + "', which is not an executable file",
                g.stderr().strip());
    }

    @Test
    void aTimeLimitThatIsNotAPositiveNumberIsAUsageError() {
        Path card = Simulators.projectDir().resolve("fixtures/demo/generating-card.lib");
        Path data = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        for (String bad : List.of("0", "-3", "NaN")) {
            CliRun run = CliRun.of("verify", card.toString(), data.toString(), "--engine", "ngspice", "--sim-timeout", bad);
            assertEquals(ExitCodes.USAGE, run.exitCode(), run.describe());
            assertTrue(run.err().contains("--sim-timeout"), run.describe());
        }
    }
}
