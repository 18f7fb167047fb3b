package org.cardwright.bench.jmh;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/**
 * The invented demo data of fixtures/demo/, found from the folder the benchmark runs in (the repository root,
 * or the one named by the system property {@code cardwright.root}).
 */
final class DemoData {
    private DemoData() {
    }

    /** The files of fixtures/demo/ whose names start with {@code prefix}, sorted. */
    static List<Path> files(String prefix) throws IOException {
        Path demo = Path.of(System.getProperty("cardwright.root", ".")).resolve("fixtures/demo");
        try (Stream<Path> s = Files.list(demo)) {
            List<Path> out = s.filter(p -> p.getFileName().toString().startsWith(prefix)
                    && p.getFileName().toString().endsWith(".csv")).sorted().toList();
            if (out.isEmpty()) {
                throw new IOException("no " + prefix + "*.csv in " + demo.toAbsolutePath()
                        + "; run from the repository root or set -Dcardwright.root");
            }
            return out;
        }
    }
}
