package org.cardwright.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * The run from which the launcher {@code ./cardwright} makes its start-up archive (a class-data-sharing archive, or
 * the ahead-of-time cache on Java 25): first the user's own command, as always (its output, its exit code), then,
 * with nothing printed, the everyday commands on the repository's shipped example data, so that the archive holds
 * the classes of a {@code fit}, a {@code verify} and a {@code tweak} whatever the first command was (a
 * {@code --version} or a {@code verify} alone would leave the others out).
 *
 * <p>The extra commands write only into a temporary folder, removed afterwards; example data that is missing is
 * skipped, and any failure of the extra commands is ignored: they only decide what the archive holds.
 */
final class StartupTraining {
    private StartupTraining() {
    }

    /** The system property that names the repository folder on the launcher's archive-making run. */
    static final String PROPERTY = "cardwright.startup-training";

    /**
     * After the user's command on the archive-making run (the launcher sets {@value #PROPERTY} to the repository
     * folder): the extra commands, with every failure ignored, since they only decide what the archive holds.
     */
    static void afterCommand() {
        String home = System.getProperty(PROPERTY);
        if (home == null || home.isEmpty()) {
            return;
        }
        System.out.flush();
        System.err.flush();
        try {
            exercise(Path.of(home));
        } catch (Exception | LinkageError e) {
            // nothing to report: the user's command has finished and its exit code stands
        }
    }

    /** fit, verify and tweak of the shipped examples under {@code home/fixtures}, output discarded. */
    static void exercise(Path home) throws IOException {
        Path demo = home.resolve("fixtures/demo");
        List<String> forward = new ArrayList<>();
        for (String temperature : List.of("minus40C", "25C", "85C", "125C")) {
            Path f = demo.resolve("ks1-forward-" + temperature + ".csv");
            if (Files.isRegularFile(f)) {
                forward.add(f.toString());
            }
        }
        Path reverse = demo.resolve("ks1-reverse-25C.csv");
        Path device = home.resolve("fixtures/library/switching/SW1.device.yaml");
        Path work = Files.createTempDirectory("cardwright-training");
        PrintWriter silent = new PrintWriter(Writer.nullWriter());
        try {
            if (!forward.isEmpty()) {
                List<String> data = new ArrayList<>(forward);
                if (Files.isRegularFile(reverse)) {
                    data.add(reverse.toString());
                }
                Path out = work.resolve("fit");
                List<String> fit = new ArrayList<>(List.of("fit"));
                fit.addAll(data);
                fit.addAll(List.of("--name", "KS1", "--out", out.toString(), "--json", out.resolve("KS1.json").toString()));
                if (Main.execute(silent, silent, fit.toArray(String[]::new)) == ExitCodes.OK) {
                    List<String> verify = new ArrayList<>(List.of("verify", out.resolve("KS1.ngspice.lib").toString()));
                    verify.addAll(data);
                    Main.execute(silent, silent, verify.toArray(String[]::new));
                }
            }
            if (Files.isRegularFile(device)) {
                Main.execute(silent, silent, "tweak", device.toString(), "--set", "RS=+10%");
            }
        } finally {
            try (Stream<Path> files = Files.walk(work)) {
                for (Path p : files.sorted(Comparator.reverseOrder()).toList()) {
                    Files.deleteIfExists(p);
                }
            }
        }
    }
}
