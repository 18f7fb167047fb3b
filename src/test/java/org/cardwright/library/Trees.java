package org.cardwright.library;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.FileTime;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;

/** File-tree helpers for library tests. */
final class Trees {
    private Trees() {
    }

    /** Every regular file under {@code root} with its bytes, by root-relative name. */
    static Map<String, byte[]> contents(Path root, String suffix) throws IOException {
        Map<String, byte[]> out = new TreeMap<>();
        try (Stream<Path> walk = Files.walk(root)) {
            for (Path p : walk.filter(Files::isRegularFile).filter(p -> p.toString().endsWith(suffix)).toList()) {
                out.put(root.relativize(p).toString().replace('\\', '/'), Files.readAllBytes(p));
            }
        }
        return out;
    }

    /** Modification times of the files under {@code root} ending with {@code suffix}. */
    static Map<String, FileTime> times(Path root, String suffix) throws IOException {
        Map<String, FileTime> out = new TreeMap<>();
        try (Stream<Path> walk = Files.walk(root)) {
            for (Path p : walk.filter(Files::isRegularFile).filter(p -> p.toString().endsWith(suffix)).toList()) {
                out.put(root.relativize(p).toString().replace('\\', '/'), Files.getLastModifiedTime(p));
            }
        }
        return out;
    }

    /** Copies the tree {@code from} into the (new) folder {@code to}. */
    static void copy(Path from, Path to) throws IOException {
        org.cardwright.testsupport.TestCopies.copyTree(from, to, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.COPY_ATTRIBUTES);
    }

    /** Sets every file's modification time to {@code time}, so that a later write is visible whatever the clock's resolution. */
    static void age(Path root, FileTime time) throws IOException {
        try (Stream<Path> walk = Files.walk(root)) {
            for (Path p : walk.filter(Files::isRegularFile).toList()) {
                Files.setLastModifiedTime(p, time);
            }
        }
    }
}
