package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;

/**
 * A copy of a plan (a library's inputs, copied once per part) checks its outputs against the inputs it copied as
 * the plan itself would: by path, through a symbolic link and through a hard link, naming the first input that
 * leads there; inputs added to either plan after the copy belong to that plan alone.
 */
class OutputPlanCopyTest {
    @Test
    void aCopyFindsEveryCopiedInputAsThePlanWould() throws Exception {
        Path dir = Simulators.tempDir("output-plan-copy");
        Path data = Files.writeString(dir.resolve("a.csv"), "V,I\n");
        Path hard = Files.createLink(dir.resolve("hard.csv"), data);
        Path soft = Files.createSymbolicLink(dir.resolve("soft.csv"), data);
        OutputPlan library = new OutputPlan().input("a data file of P1", data).input("a data file of P2", data);
        for (Path target : new Path[] {data, hard, soft}) {
            OutputException viaCopy = assertThrows(OutputException.class,
                    () -> library.copy().output("the card", target).check());
            OutputException direct = assertThrows(OutputException.class,
                    () -> new OutputPlan().input("a data file of P1", data).input("a data file of P2", data)
                            .output("the card", target).check());
            assertTrue(viaCopy.getMessage().equals(direct.getMessage()), viaCopy.getMessage() + " / " + direct.getMessage());
            assertTrue(viaCopy.getMessage().contains("a data file of P1"), viaCopy.getMessage());
        }
    }

    @Test
    void inputsAddedAfterTheCopyBelongToOnePlan() throws Exception {
        Path dir = Simulators.tempDir("output-plan-copy-later");
        Path shared = Files.writeString(dir.resolve("shared.csv"), "V,I\n");
        Path own = Files.writeString(dir.resolve("own.csv"), "V,I\n");
        Path later = Files.writeString(dir.resolve("later.csv"), "V,I\n");
        OutputPlan library = new OutputPlan().input("a data file of P1", shared);
        OutputPlan part = library.copy().input("a data file of this part", own);
        library.input("a data file of P9", later);
        // the part's own input is checked, the library's later one is not the part's
        assertThrows(OutputException.class, () -> part.copy().output("the card", own).check());
        assertDoesNotThrow(() -> part.copy().output("the card", later).check());
        // the library sees its later input, and its copies index it
        assertThrows(OutputException.class, () -> library.copy().output("the card", later).check());
        assertThrows(OutputException.class, () -> library.copy().output("the card", shared).check());
        assertDoesNotThrow(() -> library.copy().output("the card", dir.resolve("new.lib")).check());
    }
}
