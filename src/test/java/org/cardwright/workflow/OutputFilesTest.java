package org.cardwright.workflow;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

/** Output files: never replaced without permission, written whole or not at all, no temporary file left behind. */
class OutputFilesTest {

    @Test
    void writesExactUtf8BytesCreatingTheFolderAndLeavesNoTemporaryFile() throws Exception {
        Path dir = Simulators.tempDir("output-files-write");
        Path target = dir.resolve("deeper").resolve("D1.ngspice.lib");
        String text = "* 25 \u00b0C, 1 \u00b5A\n.model D1 D(IS=1e-14)\n";
        OutputFiles.writeAtomically(target, text);
        assertEquals(text, new String(Files.readAllBytes(target), StandardCharsets.UTF_8));
        assertEquals(List.of(target), listing(target.getParent()));
    }

    @Test
    void replacesAnExistingFileWhole() throws Exception {
        Path dir = Simulators.tempDir("output-files-replace");
        Path target = dir.resolve("D1.json");
        Files.writeString(target, "a much longer earlier content that must not survive in any part\n");
        OutputFiles.writeAtomically(target, "{}\n");
        assertEquals("{}\n", Files.readString(target));
        assertEquals(List.of(target), listing(dir));
    }

    @Test
    void refusesAnExistingFileWithoutForceNamingIt() throws Exception {
        Path dir = Simulators.tempDir("output-files-refuse");
        Path free = dir.resolve("free.lib");
        Path taken = Files.writeString(dir.resolve("taken.lib"), "kept\n");
        OutputException e = assertThrows(OutputException.class, () -> OutputFiles.checkWritable(List.of(free, taken), false));
        assertTrue(e.getMessage().startsWith(taken + " already exists"), e.getMessage());
        assertTrue(e.getMessage().contains("--force"), e.getMessage());
        OutputFiles.checkWritable(List.of(free, taken), true);
        OutputFiles.checkWritable(List.of(free), false);
        assertEquals("kept\n", Files.readString(taken));
    }

    @Test
    void unwritablePlaceFailsWithOneLineNamingTheTarget() throws Exception {
        Path dir = Simulators.tempDir("output-files-unwritable");
        Path notAFolder = Files.writeString(dir.resolve("plain-file"), "x");
        Path target = notAFolder.resolve("D1.lib");
        OutputException e = assertThrows(OutputException.class, () -> OutputFiles.writeAtomically(target, "text"));
        assertTrue(e.getMessage().startsWith("cannot write " + target + ": "), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), e.getMessage());
        assertEquals(List.of(notAFolder), listing(dir));
    }

    @Test
    void writtenCardHasTheSamePermissionsAsAnyNewFile() throws Exception {
        Assumptions.assumeTrue(FileSystems.getDefault().supportedFileAttributeViews().contains("posix"),
                "POSIX permissions only");
        Path dir = Simulators.tempDir("output-files-permissions");
        Path plain = Files.writeString(dir.resolve("plain.txt"), "x");
        Path card = dir.resolve("D1.ngspice.lib");
        OutputFiles.writeAtomically(card, "x");
        // the reference is a file made the ordinary way, so the umask of whoever runs the tests applies to both
        assertEquals(Files.getPosixFilePermissions(plain), Files.getPosixFilePermissions(card));
    }

    private static List<Path> listing(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.sorted().toList();
        }
    }
}
