package org.cardwright.library;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/** A card changed by hand is refused without the flag, overwritten with it; the message says which card and how to proceed. */
class HandEditTest {

    private static Path builtPart(String name) throws Exception {
        Path root = Simulators.tempDir(name);
        SyntheticParts.write(root, SyntheticParts.twenty().get(2));
        List<PartOutcome> o = new LibraryBuilder(false).build(root, line -> { });
        assertEquals(PartOutcome.Status.BUILT, o.get(0).status(), o.get(0).message());
        return root;
    }

    @Test
    void aHandEditedCardIsRefusedWithoutTheFlagAndOverwrittenWithIt() throws Exception {
        Path root = builtPart("library-hand-edit");
        Path card = root.resolve("group1/TP03.ngspice.lib");
        String generated = Files.readString(card, StandardCharsets.UTF_8);
        String edited = generated.replaceFirst("(?m)^\\+ RS=.*$", "+ RS=1.5");
        assertTrue(!edited.equals(generated), "the edit must change the card");
        Files.writeString(card, edited, StandardCharsets.UTF_8);

        List<PartOutcome> refused = new LibraryBuilder(false).build(root, line -> { });
        PartOutcome o = refused.get(0);
        assertEquals(PartOutcome.Status.REFUSED_EDITED, o.status());
        assertTrue(o.message().contains("group1/TP03.ngspice.lib"), o.message());
        assertTrue(o.message().contains("--replace-edited"), o.message());
        assertEquals(edited, Files.readString(card, StandardCharsets.UTF_8), "the hand edit must survive");

        List<PartOutcome> replaced = new LibraryBuilder(true).build(root, line -> { });
        assertEquals(PartOutcome.Status.BUILT, replaced.get(0).status(), replaced.get(0).message());
        assertEquals(generated, Files.readString(card, StandardCharsets.UTF_8), "the flag restores the generated card");
        assertEquals(PartOutcome.Status.UP_TO_DATE, new LibraryBuilder(false).build(root, line -> { }).get(0).status());
    }

    @Test
    void aCardWithoutABuildRecordIsNotOverwrittenEither() throws Exception {
        Path root = builtPart("library-hand-edit-no-record");
        Files.delete(root.resolve("group1/TP03.state"));
        PartOutcome o = new LibraryBuilder(false).build(root, line -> { }).get(0);
        assertEquals(PartOutcome.Status.REFUSED_EDITED, o.status());
        assertTrue(o.message().contains("no state file"), o.message());
    }

    @Test
    void aDeletedCardIsBuiltAgainIdentically() throws Exception {
        Path root = builtPart("library-deleted-card");
        Path card = root.resolve("group1/TP03.ngspice.lib");
        byte[] generated = Files.readAllBytes(card);
        Files.delete(card);
        PartOutcome o = new LibraryBuilder(false).build(root, line -> { }).get(0);
        assertEquals(PartOutcome.Status.BUILT, o.status(), o.message());
        org.junit.jupiter.api.Assertions.assertArrayEquals(generated, Files.readAllBytes(card));
    }

    @Test
    void aChangedRuleRefitsAndReportsTheResidualsBeforeAndAfter() throws Exception {
        Path root = builtPart("library-rule-change");
        Path device = root.resolve("group1/TP03.device.yaml");
        Files.writeString(device, Files.readString(device) + "rules:\n  - RS=0.9\n", StandardCharsets.UTF_8);
        PartOutcome o = new LibraryBuilder(false).build(root, line -> { }).get(0);
        assertEquals(PartOutcome.Status.BUILT, o.status(), o.message());
        assertTrue(o.message().matches(".*worst RMS \\d+\\.\\d{3} -> \\d+\\.\\d{3} mV.*"), o.message());
        assertTrue(Files.readString(root.resolve("group1/TP03.ngspice.lib")).contains("+ RS=0.9\n"));
    }
}
