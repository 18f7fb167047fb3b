package org.cardwright.library;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/** Finding device files in a tree, and naming files relative to the library root the same way on every machine. */
public final class LibraryPaths {
    private LibraryPaths() {
    }

    /**
     * Every device file under {@code root}, sorted by their root-relative names; hidden folders are skipped. Every
     * entry whose name ends with {@link DeviceFileReader#SUFFIX} is listed, whatever it is (a folder, a link to
     * nothing, a FIFO), so that reading it reports it rather than passing over it.
     */
    public static List<Path> deviceFiles(Path root) throws IOException {
        if (!Files.isDirectory(root)) {
            throw new IOException(root + ": not a folder");
        }
        Path r = root.toAbsolutePath().normalize();
        try (Stream<Path> walk = Files.walk(r)) {
            return walk.filter(p -> p.getFileName().toString().endsWith(DeviceFileReader.SUFFIX))
                    .filter(p -> !p.equals(r))
                    .filter(p -> !hidden(r, p))
                    .sorted((a, b) -> display(r, a).compareTo(display(r, b)))
                    .toList();
        }
    }

    private static boolean hidden(Path root, Path p) {
        Path rel = root.relativize(p);
        for (int i = 0; i < rel.getNameCount() - 1; i++) {
            if (rel.getName(i).toString().startsWith(".")) {
                return true;
            }
        }
        return false;
    }

    /** {@code p} relative to {@code root}, with forward slashes; the absolute path when it lies outside. */
    public static String display(Path root, Path p) {
        Path r = root.toAbsolutePath().normalize();
        Path a = p.toAbsolutePath().normalize();
        String s = a.startsWith(r) ? r.relativize(a).toString() : a.toString();
        return s.isEmpty() ? "." : s.replace('\\', '/');
    }
}
