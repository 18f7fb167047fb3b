package org.cardwright.sim.process;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.model.Ngspice39;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Runs the installed ngspice and gnucap through {@link SimulatorProcess}. The expected output formats and
 * messages were seen by running ngspice 39 (Debian 39.3+ds-1) and gnucap 2017.10.03 by hand.
 */
class SimulatorProcessTest {
    /** Time limit for runs that should finish at once; generous for a loaded CI machine. */
    private static final Duration NORMAL_TIMEOUT = Duration.ofSeconds(30);
    /** Time limit for the netlists that never end. */
    private static final Duration SHORT_TIMEOUT = Duration.ofSeconds(2);
    /** Longest a timed-out run may take in total: the limit plus killing and draining (5 s grace each). */
    private static final Duration KILL_ALLOWANCE = Duration.ofSeconds(15);
    /** ngspice `print` shows 7 significant digits, so 0.75 V is exact to half a unit in the last place [V]. */
    private static final double NGSPICE_PRINT_TOLERANCE = 5e-7;
    /** gnucap's voltage source has about 10 micro-ohm inside, moving 0.75 V by ~2.5e-9 V; allow 1e-8 [V]. */
    private static final double GNUCAP_DIVIDER_TOLERANCE = 1e-8;
    /** 12 significant digits from `option numdgt=12`, plus the 1e-7 RELTOL forced-current error [V]. */
    private static final double DIODE_VOLTAGE_TOLERANCE = 1e-7;

    private static final String DIVIDER_NGSPICE = String.join("\n",
            "divider 1 V over 1k and 3k",
            "V1 a 0 DC 1",
            "R1 a mid 1k",
            "R2 mid 0 3k",
            ".control",
            "op",
            "print v(mid)",
            "quit",
            ".endc",
            ".end",
            "");

    private static SimulatorProcess ngspice(Duration timeout) {
        return new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(), timeout);
    }

    private static SimulatorProcess gnucap(Duration timeout) {
        return new SimulatorProcess(SimulatorProcess.Kind.GNUCAP, Simulators.requireGnucap(), timeout);
    }

    @Test
    void ngspiceDividerGivesThreeQuartersOfTheSupply() throws Exception {
        // Voltage divider rule (fact of circuit theory): 1 V * 3k / (1k + 3k) = 0.75 V.
        Path work = Simulators.tempDir("process-ngspice-divider");
        SimulatorProcess.Result result = ngspice(NORMAL_TIMEOUT).run(DIVIDER_NGSPICE, work);

        assertEquals(0, result.exitCode());
        assertTrue(Files.isRegularFile(work.resolve("circuit.cir")), "netlist written into the work folder");
        Matcher m = Pattern.compile("v\\(mid\\) = (\\S+)").matcher(result.stdout());
        assertTrue(m.find(), "ngspice printed v(mid): " + result.stdout());
        assertEquals(0.75, Double.parseDouble(m.group(1)), NGSPICE_PRINT_TOLERANCE);
        assertTrue(result.warnings().isEmpty(), "no warnings expected, got " + result.warnings());
        assertTrue(result.elapsed().compareTo(NORMAL_TIMEOUT) < 0);
    }

    @Test
    void ngspiceDiodeAtOneMilliampereFollowsShockley() throws Exception {
        // Shockley equation, V = N Vt ln(I/IS + 1), with ngspice's own k/q and 27 C; RS = 0, GMIN = 1e-12 S
        // takes under 1e-12 A of the 1 mA (diode-model.md section 1).
        String netlist = String.join("\n",
                "diode forced to 1 mA",
                "I1 0 a DC 1m",
                "D1 a 0 dmod",
                ".model dmod D(IS=1e-14 N=1.5)",
                ".options reltol=1e-7 vntol=1e-10 abstol=1e-16",
                ".control",
                "option numdgt=12",
                "op",
                "print v(a)",
                "quit",
                ".endc",
                ".end",
                "");
        SimulatorProcess.Result result = ngspice(NORMAL_TIMEOUT).run(netlist, Simulators.tempDir("process-diode"));

        Matcher m = Pattern.compile("v\\(a\\) = (\\S+)").matcher(result.stdout());
        assertTrue(m.find(), "ngspice printed v(a): " + result.stdout());
        double vt = Ngspice39.thermalVoltage(Ngspice39.REFERENCE_TEMPERATURE);
        double expected = 1.5 * vt * Math.log(1e-3 / 1e-14 + 1);
        assertEquals(expected, Double.parseDouble(m.group(1)), DIODE_VOLTAGE_TOLERANCE);
    }

    @Test
    void gnucapDividerGivesThreeQuartersOfTheSupply() throws Exception {
        String netlist = String.join("\n",
                "gnucap divider 1 V over 1k and 3k",
                "V1 a 0 dc 1",
                "R1 a mid 1k",
                "R2 mid 0 3k",
                ".option numdgt=10",
                ".print op v(mid)",
                ".op",
                ".end",
                "");
        Path work = Simulators.tempDir("process-gnucap-divider");
        SimulatorProcess.Result result = gnucap(NORMAL_TIMEOUT).run(netlist, work);

        assertTrue(Files.isRegularFile(work.resolve("circuit.ckt")), "netlist written into the work folder");
        // gnucap prints a header "#  v(mid)" and then one row: temperature, value.
        Matcher m = Pattern.compile("(?m)^\\s*27\\.\\s+(\\S+)\\s*$").matcher(result.stdout());
        assertTrue(m.find(), "gnucap printed the op row: " + result.stdout());
        assertEquals(0.75, Double.parseDouble(m.group(1)), GNUCAP_DIVIDER_TOLERANCE);
        assertTrue(result.warnings().isEmpty(), "no warnings expected, got " + result.warnings());
    }

    @Test
    void ngspiceUnknownModelParameterIsAWarning() throws Exception {
        // ngspice 39 has TCV, not TBV1 (diode-model.md section 10); it warns and carries on.
        String netlist = String.join("\n",
                "unknown parameter",
                "V1 a 0 DC 0.6",
                "D1 a 0 dmod",
                ".model dmod D(IS=1e-14 TBV1=3)",
                ".control",
                "op",
                "print i(V1)",
                "quit",
                ".endc",
                ".end",
                "");
        SimulatorProcess.Result result = ngspice(NORMAL_TIMEOUT).run(netlist, Simulators.tempDir("process-warn"));

        assertTrue(result.warnings().contains("unrecognized parameter (tbv1) - ignored"),
                "warnings: " + result.warnings());
        assertTrue(result.stdout().contains("i(v1) = "), "the run itself went on: " + result.stdout());
    }

    @Test
    void gnucapUnknownModelParameterIsAWarning() throws Exception {
        // gnucap 2017 rejects IKF (diode-model.md section 9) with "bad parameter ikf ignored".
        String netlist = String.join("\n",
                "gnucap unknown parameter",
                "V1 a 0 dc 0.6",
                "D1 a 0 dmod",
                ".model dmod d (is=1e-14 ikf=1)",
                ".print op i(D1)",
                ".op",
                ".end",
                "");
        SimulatorProcess.Result result = gnucap(NORMAL_TIMEOUT).run(netlist, Simulators.tempDir("process-gwarn"));

        assertTrue(result.warnings().stream().anyMatch(w -> w.startsWith("dmod: bad parameter ikf")),
                "warnings: " + result.warnings());
    }

    @Test
    void endlessNgspiceLoopIsKilledAtTheTimeLimit() throws Exception {
        String netlist = String.join("\n",
                "never ends",
                "V1 a 0 DC 1",
                "R1 a 0 1k",
                ".control",
                "let k = 0",
                "while 1",
                "let k = k + 1",
                "end",
                "quit",
                ".endc",
                ".end",
                "");
        Path work = Simulators.tempDir("process-endless");
        long start = System.nanoTime();
        SimulatorProcess process = ngspice(SHORT_TIMEOUT);
        SimulationException e = assertThrows(SimulationException.class,
                () -> process.run(netlist, work));
        Duration took = Duration.ofNanos(System.nanoTime() - start);

        assertTrue(e.getMessage().startsWith("ngspice did not finish within 2 s"), e.getMessage());
        assertTrue(took.compareTo(SHORT_TIMEOUT) >= 0, "waited the full limit, took " + took);
        assertTrue(took.compareTo(KILL_ALLOWANCE) < 0, "killed promptly, took " + took);
        assertEquals(List.of(), processesWorkingIn(work), "no process left running in " + work);
    }

    @Test
    void timeoutKillsTheWholeProcessTree() throws Exception {
        // `shell` makes ngspice wait for a child shell running sleep: both must die at the time limit.
        String netlist = String.join("\n",
                "child process",
                "V1 a 0 DC 1",
                "R1 a 0 1k",
                ".control",
                "shell sleep 300",
                "quit",
                ".endc",
                ".end",
                "");
        Path work = Simulators.tempDir("process-tree");
        SimulatorProcess process = ngspice(SHORT_TIMEOUT);
        SimulationException e = assertThrows(SimulationException.class,
                () -> process.run(netlist, work));

        assertTrue(e.getMessage().contains("did not finish within 2 s"), e.getMessage());
        assertEquals(List.of(), processesWorkingIn(work), "no process left running in " + work);
    }

    @Test
    void ngspiceErrorLineFailsEvenWithExitCodeZero() throws Exception {
        // ngspice 39 exits with 0 here but prints: Error: RHS "v(a) /" invalid
        String netlist = String.join("\n",
                "control error",
                "V1 a 0 DC 1",
                "R1 a 0 1k",
                ".control",
                "op",
                "let x = v(a) /",
                "quit",
                ".endc",
                ".end",
                "");
        SimulatorProcess process = ngspice(NORMAL_TIMEOUT);
        SimulationException e = assertThrows(SimulationException.class,
                () -> process.run(netlist, Simulators.tempDir("process-error")));
        assertTrue(e.getMessage().startsWith("ngspice reported an error: Error: RHS"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one-line message: " + e.getMessage());
    }

    @Test
    void ngspiceMissingModelFailsWithTheErrorLine() throws Exception {
        String netlist = String.join("\n",
                "missing model",
                "V1 a 0 DC 1",
                "D1 a 0 nomodel",
                ".op",
                ".end",
                "");
        SimulatorProcess process = ngspice(NORMAL_TIMEOUT);
        SimulationException e = assertThrows(SimulationException.class,
                () -> process.run(netlist, Simulators.tempDir("process-nomodel")));
        assertTrue(e.getMessage().startsWith("ngspice exited with code 1: Error on line 3"), e.getMessage());
    }

    @Test
    void controlBlockWithoutQuitIsReportedAsSuch() throws Exception {
        // ngspice 39 quirk: -b exits with 1 after a .control block that does not end with quit.
        String netlist = DIVIDER_NGSPICE.replace("quit\n", "");
        SimulatorProcess process = ngspice(NORMAL_TIMEOUT);
        SimulationException e = assertThrows(SimulationException.class,
                () -> process.run(netlist, Simulators.tempDir("process-noquit")));
        assertTrue(e.getMessage().startsWith(
                "ngspice exited with code 1 (the .control block does not end with quit)"), e.getMessage());
    }

    @Test
    void gnucapMissingModelFailsAlthoughItExitsWithZero() throws Exception {
        String netlist = String.join("\n",
                "gnucap missing model",
                "V1 a 0 dc 1",
                "D1 a 0 nomodel",
                ".print op v(a)",
                ".op",
                ".end",
                "");
        SimulatorProcess process = gnucap(NORMAL_TIMEOUT);
        SimulationException e = assertThrows(SimulationException.class,
                () -> process.run(netlist, Simulators.tempDir("process-gnomodel")));
        assertEquals("gnucap reported an error: D1: can't find: nomodel", e.getMessage().replaceAll(" \\[.*]$", ""));
    }

    @Test
    void missingExecutableIsAFailureNamingTheSimulator() {
        Path nowhere = Simulators.tempDir("process-missing").resolve("no-such-ngspice");
        SimulatorProcess process = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, nowhere, NORMAL_TIMEOUT);
        SimulationException e = assertThrows(SimulationException.class,
                () -> process.run(DIVIDER_NGSPICE, Simulators.tempDir("process-missing-work")));
        assertEquals("ngspice executable not found or not executable: " + nowhere, e.getMessage());
    }

    @Test
    void ngspiceVersionIsTheBannerName() throws Exception {
        // banner line "** ngspice-39 : Circuit level simulation program"
        String version = ngspice(NORMAL_TIMEOUT).version();
        assertTrue(version.matches("ngspice-\\d+(\\.\\d+)*"), "ngspice banner name: " + version);
    }

    @Test
    void gnucapVersionIsTheMainVersion() throws Exception {
        // banner line "main version: master 2017.10.03"
        String version = gnucap(NORMAL_TIMEOUT).version();
        assertTrue(version.matches("gnucap \\S.*\\d{4}\\.\\d{2}\\.\\d{2}"), "gnucap main version: " + version);
    }

    @Test
    void nonPositiveTimeoutIsRejected() {
        Path any = Path.of("ngspice");
        assertThrows(IllegalArgumentException.class,
                () -> new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, any, Duration.ZERO));
    }

    @Test
    void timeLimitIsWrittenInSeconds() {
        assertEquals("30 s", SimulatorProcess.seconds(Duration.ofSeconds(30)));
        assertEquals("2.5 s", SimulatorProcess.seconds(Duration.ofMillis(2500)));
    }

    /**
     * Processes whose working folder is {@code dir}, read from Linux /proc; empty where /proc does not exist.
     * A killed process may take a moment to leave /proc, so this asks again for up to 5 s.
     */
    private static List<Long> processesWorkingIn(Path dir) throws IOException, InterruptedException {
        Path proc = Path.of("/proc");
        if (!Files.isDirectory(proc)) {
            return List.of();
        }
        Path real = dir.toRealPath();
        List<Long> left = List.of();
        for (int attempt = 0; attempt < 50; attempt++) {
            left = ProcessHandle.allProcesses()
                    .filter(ProcessHandle::isAlive)
                    .map(ProcessHandle::pid)
                    .filter(pid -> workingFolderIs(proc.resolve(Long.toString(pid)), real))
                    .toList();
            if (left.isEmpty()) {
                break;
            }
            Thread.sleep(100);
        }
        return left;
    }

    private static boolean workingFolderIs(Path processEntry, Path folder) {
        try {
            return Files.readSymbolicLink(processEntry.resolve("cwd")).equals(folder);
        } catch (IOException | UnsupportedOperationException | SecurityException unreadable) {
            return false; // another user's process, or gone already
        }
    }
}
