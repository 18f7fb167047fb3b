package org.cardwright.spark;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;

/** Work folders and output listings for the Spark module's tests. */
final class SparkTestFiles {

    private SparkTestFiles() {
    }

    /** The repository's root (the module's parent, or CARDWRIGHT_PROJECT_DIR). */
    static Path projectDir() {
        return Path.of(System.getenv().getOrDefault("CARDWRIGHT_PROJECT_DIR", "..")).toAbsolutePath().normalize();
    }

    /** An empty folder spark/target/test-work/NAME (emptied when it exists). */
    static Path workDir(String name) throws Exception {
        Path dir = projectDir().resolve("spark/target/test-work").resolve(name);
        if (Files.exists(dir)) {
            try (Stream<Path> s = Files.walk(dir)) {
                for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                    Files.delete(p);
                }
            }
        }
        return Files.createDirectories(dir);
    }

    /** Every file a lot wrote under {@code out}, by relative name, but its resumable state (.lot-state). */
    static Map<String, byte[]> outputs(Path out) throws Exception {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(out)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                String name = out.relativize(p).toString();
                if (!name.contains(".lot-state")) {
                    m.put(name, Files.readAllBytes(p));
                }
            }
        }
        return m;
    }
}
