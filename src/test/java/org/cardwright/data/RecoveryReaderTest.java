package org.cardwright.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.OptionalDouble;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/** Reading reverse-recovery records. */
class RecoveryReaderTest {
    private static final Path FIXTURES = Simulators.projectDir().resolve("fixtures");
    /**
     * 10 mA read from a decimal with a suffix: below one ulp (1.7e-18 A), so the reading must be the nearest double
     * [A].
     */
    private static final double CURRENT_ROUNDING_A = 1e-18;
    /**
     * A recovery time of 2.783 ns read from a decimal with a suffix: double rounding only, with room (about 2400 ulp)
     * [s].
     */
    private static final double TIME_ROUNDING_S = 1e-21;

    @Test
    void readsRecordsInSiUnits() throws Exception {
        Path f = FIXTURES.resolve("recovery/ks1-recovery-25C.csv");
        assertTrue(RecoveryReader.looksLikeRecovery(f));
        RecoveryReader.Records r = new RecoveryReader(OptionalDouble.of(298.15)).read(f);
        assertEquals(5, r.records().size());
        RecoveryRecord first = r.records().get(0);
        assertEquals(10e-3, first.forwardCurrent(), CURRENT_ROUNDING_A);
        assertEquals(-10e-3, first.reverseCurrent(), CURRENT_ROUNDING_A);
        assertEquals(2.783e-9, first.recoveryTime(), TIME_ROUNDING_S);
        assertEquals(298.15, first.temperature());
        assertEquals(6, first.line(), "physical line, comments counted");
        assertEquals(64, r.sha256().length());
    }

    @Test
    void reverseCurrentOfTheWrongSignNamesFileLineAndValue() {
        Path f = FIXTURES.resolve("bad-recovery/recovery-ir-wrong-sign.csv");
        DataFileException e = assertThrows(DataFileException.class, () -> new RecoveryReader(OptionalDouble.empty()).read(f));
        assertEquals(6, e.line());
        assertEquals("1", e.rawValue());
        assertTrue(e.getMessage().contains("recovery-ir-wrong-sign.csv:6:"), e.getMessage());
    }

    @Test
    void plainIvFilesAreNotTakenForRecoveryRecords() {
        assertFalse(RecoveryReader.looksLikeRecovery(FIXTURES.resolve("demo/ks1-forward-25C.csv")));
    }

    @Test
    void semicolonsDecimalCommasAndSuffixesReadToTheSameRecords(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        Path f = dir.resolve("export.csv");
        java.nio.file.Files.writeString(f, "# invented test input\nIF;IR;trr;T [degC]\n10m;-10m;2,783n;25\n");
        RecoveryRecord r = new RecoveryReader(OptionalDouble.empty()).read(f).records().get(0);
        assertEquals(10e-3, r.forwardCurrent(), CURRENT_ROUNDING_A);
        assertEquals(-10e-3, r.reverseCurrent(), CURRENT_ROUNDING_A);
        assertEquals(2.783e-9, r.recoveryTime(), TIME_ROUNDING_S);
        assertTrue(RecoveryReader.looksLikeRecovery(f));
    }
}
