package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.cardwright.card.Dialect;
import org.cardwright.fit.CapacitanceOptions;
import org.cardwright.testsupport.Simulators;
import org.cardwright.verify.JunctionVerification;
import org.cardwright.verify.Tolerance;
import org.cardwright.verify.VerdictBasis;
import org.junit.jupiter.api.Test;

/**
 * The verify job for a card held in memory against data already read ({@link VerifyWorkflow#runAll(VerifyRequest,
 * String, Inputs)}, what a library build uses for each card's verdict lines) gives exactly what the job that reads
 * the card file and the data files gives, for every data kind, and reads nothing itself. The card is the one that
 * generated the invented zener demo data (fixtures/demo, simulated in ngspice 39: forward at three temperatures,
 * reverse into breakdown and leakage, C-V, recovery).
 */
class VerifyInMemoryTest {
    private static final List<String> ZENER_DATA = List.of("ksz6-forward-minus20C.csv", "ksz6-forward-25C.csv",
            "ksz6-forward-85C.csv", "ksz6-reverse-minus20C.csv", "ksz6-reverse-25C.csv", "ksz6-reverse-85C.csv",
            "ksz6-cv-25C.csv", "ksz6-cv-85C.csv", "ksz6-recovery-25C.csv");

    private static VerifyRequest request(Path card, List<Path> data) {
        return new VerifyRequest(card, data, "builtin", Optional.empty(), Dialect.NGSPICE, OptionalDouble.empty(),
                Tolerance.DEFAULT, Optional.empty(), false, CapacitanceOptions.DEFAULT, FitRequest.BenchOptions.DEFAULT,
                VerdictBasis.NOISE);
    }

    @Test
    void theCardInMemoryAgainstReadInputsGivesWhatTheFilesGiveAndReadsNothing() throws Exception {
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        Path work = Simulators.tempDir("verify-in-memory");
        List<Path> data = new ArrayList<>();
        for (String f : ZENER_DATA) {
            data.add(Files.copy(demo.resolve(f), work.resolve(f)));
        }
        Path card = Files.copy(demo.resolve("ksz6-generating-card.lib"), work.resolve("KSZ6.ngspice.lib"));
        VerifyRequest request = request(card, data);

        JunctionVerification fromFiles = new VerifyWorkflow().runAll(request, v -> "");
        String text = Files.readString(card);
        Inputs inputs = Inputs.read(request.data(), request.readOptions(), request::givenFor);
        // what the job may not read any more: the card file and every data file
        Files.delete(card);
        for (Path p : data) {
            Files.delete(p);
        }
        JunctionVerification inMemory = new VerifyWorkflow().runAll(request, text, inputs);

        // every kind is present, so every branch of the job is compared
        assertTrue(fromFiles.forward().isPresent() && fromFiles.breakdown().isPresent() && fromFiles.leakage().isPresent()
                && fromFiles.capacitance().isPresent() && fromFiles.recovery().isPresent(), fromFiles.toString());
        assertEquals(fromFiles, inMemory, "the same verdicts, residuals and notes, to the last bit");
        assertFalse(Files.exists(card), "nothing was written in the card's place");
    }

    @Test
    void aVerificationInMemoryWritesNoJson() {
        Path demo = Simulators.projectDir().resolve("fixtures/demo");
        VerifyRequest withJson = new VerifyRequest(demo.resolve("ksz6-generating-card.lib"),
                List.of(demo.resolve("ksz6-forward-25C.csv")), "builtin", Optional.empty(), Dialect.NGSPICE,
                OptionalDouble.empty(), Tolerance.DEFAULT, Optional.of(Simulators.tempDir("verify-in-memory-json")
                .resolve("out.json")), false);
        assertThrows(IllegalArgumentException.class, () -> new VerifyWorkflow().runAll(withJson, "", null));
    }
}
