package org.cardwright.testsupport;

import java.io.File;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.jar.Attributes;
import java.util.jar.JarOutputStream;
import java.util.jar.Manifest;
import java.util.stream.Stream;

/** Copies of shipped fixtures for tests that change them, and a jar that runs the classes under test. */
public final class TestCopies {

    private TestCopies() {
    }

    /**
     * Copies the tree {@code from} into the folder {@code to} (created as needed): folders first, in name order, each
     * file with {@code options} (e.g. keeping its time stamps, or replacing a file already there).
     */
    public static void copyTree(Path from, Path to, java.nio.file.CopyOption... options) throws IOException {
        try (Stream<Path> walk = Files.walk(from)) {
            for (Path p : walk.sorted(java.util.Comparator.naturalOrder()).toList()) {
                Path t = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(t);
                } else {
                    Files.copy(p, t, options);
                }
            }
        }
    }

    /**
     * A fresh copy of {@code fixtures/library/FOLDER} in a new temporary folder named after {@code name}, for a
     * test that builds, tweaks or edits a library part without touching the shipped one.
     */
    public static Path libraryFolder(String folder, String name) throws IOException {
        Path from = Simulators.projectDir().resolve("fixtures/library").resolve(folder);
        Path to = Simulators.tempDir(name);
        copyTree(from, to);
        return to;
    }

    /**
     * {@code jar} written (again, each time: the class path may have changed) as a jar holding only a manifest that names
     * cardwright's Main and the test run's class path, so that the launcher and {@code java -jar} run the
     * classes under test rather than a packaged build.
     */
    public static Path classPathJar(Path jar) throws IOException {
        Files.createDirectories(jar.getParent());
        Manifest manifest = new Manifest();
        manifest.getMainAttributes().put(Attributes.Name.MANIFEST_VERSION, "1.0");
        manifest.getMainAttributes().put(Attributes.Name.MAIN_CLASS, "org.cardwright.cli.Main");
        StringBuilder cp = new StringBuilder();
        for (String e : System.getProperty("surefire.test.class.path", System.getProperty("java.class.path")).split(File.pathSeparator)) {
            if (!e.isEmpty()) {
                cp.append(Path.of(e).toAbsolutePath().toUri()).append(' ');
            }
        }
        manifest.getMainAttributes().put(Attributes.Name.CLASS_PATH, cp.toString().trim());
        try (OutputStream o = Files.newOutputStream(jar); JarOutputStream j = new JarOutputStream(o, manifest)) {
            j.flush();
        }
        return jar;
    }
}
