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
                throw new OutputException(p + " already exists; pass --force to replace it, or write somewhere else");
            }
        }
    }

    /** Writes {@code text} as UTF-8 to a temporary file beside {@code target}, then renames it into place. */
    public static void writeAtomically(Path target, String text) throws OutputException {
        writeAllAtomically(java.util.Map.of(target, text));
    }

    /**
     * Writes several files as one step as far as a file system allows: every text goes to a temporary file
     * beside its target first; only when all of them are written are they renamed into place, each rename
     * atomic. A failure while writing leaves every target as it was.
     */
    public static void writeAllAtomically(java.util.Map<Path, String> files) throws OutputException {
        java.util.Map<Path, Path> temporary = new java.util.LinkedHashMap<>();
        Path current = null;
        try {
            for (java.util.Map.Entry<Path, String> e : files.entrySet()) {
                current = e.getKey();
                Path dir = current.toAbsolutePath().getParent();
                Files.createDirectories(dir);
                // not Files.createTempFile: it makes the file owner-only (rw-------), and the card would keep that
                Path tmp = dir.resolve("." + current.getFileName() + "."
                        + Long.toUnsignedString(ThreadLocalRandom.current().nextLong(), 36) + ".tmp");
                temporary.put(current, tmp);
                Files.writeString(tmp, e.getValue(), StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
            }
            for (java.util.Map.Entry<Path, Path> e : temporary.entrySet()) {
                current = e.getKey();
                try {
                    Files.move(e.getValue(), current, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
                } catch (AtomicMoveNotSupportedException x) {
                    Files.move(e.getValue(), current, StandardCopyOption.REPLACE_EXISTING);
                }
            }
        } catch (IOException e) {
            throw new OutputException("cannot write " + current + ": " + e.getMessage(), e);
        } finally {
            for (Path tmp : temporary.values()) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // a stray temporary file is named for its target and harmless
                }
            }
        }
    }
}
