package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.Duration;
import java.util.Optional;
import org.cardwright.sim.process.SimulatorProcess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * Issue 10, item 3: the simulator's work folders are private and unpredictable (never a fixed name such as cardwright-PID in the system's temporary folder), and
 * the time limit grows with the number of points unless --sim-timeout fixes it.
 */
class SimulatorWorkFolderTest {
    private static final String OWNER_ONLY = "rwx------";

    @Test
    void theWorkFolderIsOwnerOnlyAndNotNamedAfterTheProcess() throws Exception {
        Path root = Engines.workFolder();
        assertEquals(OWNER_ONLY, PosixFilePermissions.toString(Files.getPosixFilePermissions(root)));
        assertNotEquals("cardwright-" + ProcessHandle.current().pid(), root.getFileName().toString());
        Path a = SimulatorProcess.privateFolder(root, "run-");
        Path b = SimulatorProcess.privateFolder(root, "run-");
        assertNotEquals(a, b);
        assertEquals(OWNER_ONLY, PosixFilePermissions.toString(Files.getPosixFilePermissions(a)));
        SimulatorProcess.discard(a);
        SimulatorProcess.discard(b);
    }

    @Test
    void aRunHappensInItsOwnPrivateFolder() throws Exception {
        SimulatorProcess ngspice = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Simulators.requireNgspice(),
                Duration.ofSeconds(60));
        Path parent = Simulators.tempDir("private-run");
        SimulatorProcess.Run run = ngspice.runClean("* private folder\nV1 a 0 DC 1\nR1 a 0 1k\n.op\n.end\n", parent, 1);
        assertEquals(parent, run.folder().getParent());
        assertEquals(OWNER_ONLY, PosixFilePermissions.toString(Files.getPosixFilePermissions(run.folder())));
        SimulatorProcess.discard(run.folder());
    }

    @Test
    void theTimeLimitGrowsWithThePointsUnlessFixed() {
        SimulatorProcess p = new SimulatorProcess(SimulatorProcess.Kind.NGSPICE, Path.of("ngspice"),
                Engines.BASE_TIMEOUT, Engines.TIMEOUT_PER_POINT);
        assertEquals(Engines.BASE_TIMEOUT.plus(Engines.TIMEOUT_PER_POINT.multipliedBy(6000)), p.timeout(6000));
        assertTrue(p.timeout(6000).compareTo(p.timeout(600)) > 0);
        assertThrows(IllegalArgumentException.class, () -> Engines.setTimeLimit(Optional.of(Duration.ZERO)));
        Engines.setTimeLimit(Optional.empty());
    }
}
