package org.cardwright.workflow;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.List;
import java.util.concurrent.ThreadLocalRandom;

/** Writing results: nothing overwritten without permission, every file written whole or not at all. */
public final class OutputFiles {
    private OutputFiles() {
    }

    /** Fails, naming the first one, when any of {@code targets} exists and {@code force} is false. */
    public static void checkWritable(List<Path> targets, boolean force) throws OutputException {
        if (force) {
            return;
        }
        for (Path p : targets) {
            if (Files.exists(p)) {
                throw new OutputException(p + " already exists; pass --force to replace it, or choose another --out folder");
            }
        }
    }

    /** Writes {@code text} as UTF-8 to a temporary file beside {@code target}, then renames it into place. */
    public static void writeAtomically(Path target, String text) throws OutputException {
        Path dir = target.toAbsolutePath().getParent();
        try {
            Files.createDirectories(dir);
            // not Files.createTempFile: it makes the file owner-only (rw-------), and the card would keep that
            Path tmp = dir.resolve("." + target.getFileName() + "."
                    + Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36) + ".tmp");
            try {
                Files.writeString(tmp, text, StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
                try {
                    Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
                }
            } finally {
                Files.deleteIfExists(tmp);
            }
        } catch (IOException e) {
            throw new OutputException("cannot write " + target + ": " + e.getMessage(), e);
        }
    }
}
