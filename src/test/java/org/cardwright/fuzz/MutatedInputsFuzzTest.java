package org.cardwright.fuzz;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.cli.Main;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;
import org.cardwright.testsupport.TestCopies;

/**
 * Issue 10 fuzz test: seeded mutations of the project's own fixtures (CSV data of every kind, cards, a device
 * file), each run through the real command line in process ({@link Main#execute(PrintWriter, PrintWriter,
 * String...)}). For every run: no stack trace in the output, never exit 70, no output file left behind by a
 * failure, and a failure's message names the mutated file. All findings are collected and reported together.
 *
 * <p>Mutations: truncation at a random byte, a flipped byte, a byte not valid in UTF-8, a control character, a
 * number replaced by an extreme one (the largest double, 1e-300, 1e999999999, -0, NaN, a 5000-digit number), a
 * line duplicated, deleted or repeated many times, two lines swapped, a cell emptied, a very long line. The
 * number of runs per kind and the seed are fixed, so a failure is reproduced by running the test again; the
 * mutated files stay in target/test-work/fuzz.
 */
class MutatedInputsFuzzTest {
    private static final long SEED = 20261203L;
    private static final int CSV_VERIFY_RUNS = 560;
    private static final int CSV_FIT_RUNS = 90;
    private static final int CARD_RUNS = 250;
    private static final int DEVICE_RUNS = 110;
    private static final Path ROOT = Simulators.projectDir();
    private static final Pattern STACK_FRAME = Pattern.compile("(?m)^\\s+at [\\w.$]+\\(|Exception in thread");
    private static final String[] EXTREMES = {"1.7976931348623157e308", "1e-300", "1e999999999", "-0", "NaN",
        "4.9e-324", "-1.7976931348623157e308", "1".repeat(5000), "0x1p3", "1e-2147483649", "\u221e", "5000"};

    private record Seed(String data, String card) {
    }

    private static final List<Seed> CSV_SEEDS = List.of(
            new Seed("fixtures/demo/ks1-forward-25C.csv", "fixtures/demo/generating-card.lib"),
            new Seed("fixtures/demo/ks1-reverse-25C.csv", "fixtures/demo/generating-card.lib"),
            new Seed("fixtures/demo/ksz6-cv-25C.csv", "fixtures/demo/ksz6-generating-card.lib"),
            new Seed("fixtures/demo/ksz6-recovery-25C.csv", "fixtures/demo/ksz6-generating-card.lib"),
            new Seed("fixtures/demo/ksz6-reverse-25C.csv", "fixtures/demo/ksz6-generating-card.lib"),
            new Seed("fixtures/bench/simulated-meter-loading.csv", "fixtures/bench/generating-card.lib"),
            new Seed("fixtures/exports/semicolon-decimal-comma.csv", "fixtures/demo/generating-card.lib"),
            new Seed("fixtures/exports/compliance-column.csv", "fixtures/demo/generating-card.lib"));

    private static final List<String> CARD_SEEDS = List.of("fixtures/demo/generating-card.lib",
            "fixtures/demo/ksz6-generating-card.lib", "fixtures/cards/one-line.mod", "fixtures/cards/continuation.mod",
            "fixtures/cards/aliases.mod", "fixtures/cards/exponent-forms.mod", "fixtures/cards/spice3-classic.mod",
            "fixtures/cards/recombination-knee.mod", "fixtures/library/switching/SW1.ngspice.lib");

    private final List<String> findings = new ArrayList<>();
    private int runs;

    @Test
    void mutatedInputsFailCleanlyNamingTheirFile() throws Exception {
        Path work = Simulators.tempDir("fuzz");
        Random random = new Random(SEED);
        long t0 = System.nanoTime();
        for (int k = 0; k < CSV_VERIFY_RUNS; k++) {
            Seed s = CSV_SEEDS.get(k % CSV_SEEDS.size());
            Path data = mutate(ROOT.resolve(s.data()), work.resolve("data-" + k + "-" + name(s.data())), random);
            Path json = work.resolve("verify-" + k + ".json");
            check("csv verify", data, json, "verify", ROOT.resolve(s.card()).toString(), data.toString(), "--temp", "25",
                    "--json", json.toString());
        }
        for (int k = 0; k < CSV_FIT_RUNS; k++) {
            Seed s = CSV_SEEDS.get(k % CSV_SEEDS.size());
            Path data = mutate(ROOT.resolve(s.data()), work.resolve("fit-" + k + "-" + name(s.data())), random);
            Path out = work.resolve("fit-out-" + k);
            List<String> args = new ArrayList<>(List.of("fit", data.toString(), "--name", "FZ", "--out", out.toString(),
                    "--temp", "25"));
            if (!s.data().contains("forward") && !s.data().contains("meter") && !s.data().contains("exports")) {
                args.add(1, ROOT.resolve("fixtures/demo/ksz6-forward-25C.csv").toString());
            }
            check("csv fit", data, out, args.toArray(new String[0]));
        }
        Path forward = ROOT.resolve("fixtures/demo/ks1-forward-25C.csv");
        for (int k = 0; k < CARD_RUNS; k++) {
            String seed = CARD_SEEDS.get(k % CARD_SEEDS.size());
            Path card = mutate(ROOT.resolve(seed), work.resolve("card-" + k + "-" + name(seed)), random);
            Path json = work.resolve("card-" + k + ".json");
            check("card", card, json, "verify", card.toString(), forward.toString(), "--json", json.toString());
        }
        for (int k = 0; k < DEVICE_RUNS; k++) {
            Path library = work.resolve("library-" + k);
            TestCopies.copyTree(ROOT.resolve("fixtures/library/switching"), library.resolve("switching"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            Path device = library.resolve("switching/SW1.device.yaml");
            mutate(ROOT.resolve("fixtures/library/switching/SW1.device.yaml"), device, random);
            Path junit = work.resolve("check-" + k + ".xml");
            check("device file", device, junit, "check", library.toString(), "--junit", junit.toString());
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        double cpu = ((com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory
                .getOperatingSystemMXBean()).getProcessCpuTime() / 1e9;
        System.out.printf("fuzz: %d runs in %.1f s wall (JVM CPU time so far %.1f s, load average %.1f), %d findings%n",
                runs, seconds, cpu, java.lang.management.ManagementFactory.getOperatingSystemMXBean()
                        .getSystemLoadAverage(), findings.size());
        assertTrue(runs >= 1000, "at least 1000 mutated inputs per run, got " + runs);
        assertTrue(findings.isEmpty(), findings.size() + " findings in " + runs + " runs:\n" + String.join("\n", findings));
    }

    /** Runs one command line and records what is wrong with how it ended. */
    private void check(String kind, Path input, Path output, String... args) throws IOException {
        runs++;
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code;
        try (PrintWriter o = new PrintWriter(out); PrintWriter e = new PrintWriter(err)) {
            code = Main.execute(o, e, args);
        }
        String all = out + "\n" + err;
        String where = kind + " " + input.getFileName() + ": exit " + code + ": ";
        String first = firstLine(err.toString());
        if (STACK_FRAME.matcher(all).find()) {
            findings.add(where + "stack trace in the output: " + first);
        }
        if (code == 70) {
            findings.add(where + "internal error: " + first);
        }
        // exit 1 is a verdict (for check also a stale card or a part that could not be checked, which its line
        // names); a failure is exit 2 and above
        boolean failed = code >= 2;
        if (code >= 2 && exists(output)) {
            findings.add(where + "output left behind after a failure: " + output.getFileName());
        }
        if (failed && !all.contains(input.getFileName().toString())) {
            findings.add(where + "the message does not name the file: " + first);
        }
    }

    private static String firstLine(String text) {
        String t = text.strip();
        int nl = t.indexOf('\n');
        String line = nl < 0 ? t : t.substring(0, nl);
        return line.length() > 300 ? line.substring(0, 300) + "..." : line;
    }

    private static boolean exists(Path output) throws IOException {
        if (!Files.exists(output)) {
            return false;
        }
        if (!Files.isDirectory(output)) {
            return true;
        }
        try (Stream<Path> s = Files.list(output)) {
            return s.findAny().isPresent();
        }
    }

    private static String name(String path) {
        return Path.of(path).getFileName().toString();
    }

    /** Writes a mutated copy of {@code from} to {@code to}: one to three seeded mutations. */
    static Path mutate(Path from, Path to, Random random) throws IOException {
        byte[] bytes = Files.readAllBytes(from);
        int count = 1 + random.nextInt(3);
        for (int i = 0; i < count; i++) {
            bytes = mutateOnce(bytes, random);
        }
        Files.createDirectories(to.getParent());
        Files.write(to, bytes);
        return to;
    }

    private static byte[] mutateOnce(byte[] bytes, Random random) {
        if (bytes.length == 0) {
            return "V,I\n".getBytes(StandardCharsets.US_ASCII);
        }
        int at = random.nextInt(bytes.length);
        switch (random.nextInt(10)) {
            case 0: // truncation
                return java.util.Arrays.copyOf(bytes, at);
            case 1: { // byte flip
                byte[] b = bytes.clone();
                b[at] ^= (byte) (1 << random.nextInt(8));
                return b;
            }
            case 2: // a byte that is not UTF-8
                return splice(bytes, at, at, new byte[] {(byte) (0x80 + random.nextInt(0x40))});
            case 3: // a control character
                return splice(bytes, at, at, new byte[] {(byte) new int[] {0, 1, 0x1b, 0x7f, 0x0b, 0x0c}[random.nextInt(6)]});
            case 4: // an extreme number in place of one
                return replaceNumber(bytes, at, EXTREMES[random.nextInt(EXTREMES.length)]);
            default:
                return mutateLines(new String(bytes, StandardCharsets.ISO_8859_1), random)
                        .getBytes(StandardCharsets.ISO_8859_1);
        }
    }

    private static String mutateLines(String text, Random random) {
        List<String> lines = new ArrayList<>(List.of(text.split("\n", -1)));
        int i = random.nextInt(lines.size());
        int j = random.nextInt(lines.size());
        switch (random.nextInt(6)) {
            case 0 -> lines.add(i, lines.get(j)); // duplicated line
            case 1 -> lines.remove(i); // deleted line
            case 2 -> { // swapped lines
                String a = lines.get(i);
                lines.set(i, lines.get(j));
                lines.set(j, a);
            }
            case 3 -> { // a line repeated many times
                for (int k = 0; k < 200; k++) {
                    lines.add(i, lines.get(j));
                }
            }
            case 4 -> lines.set(i, lines.get(i).replaceFirst("[^,;\\s]+", "")); // a cell emptied
            default -> lines.set(i, lines.get(i) + "9".repeat(70_000)); // an overlong line
        }
        return String.join("\n", lines);
    }

    private static byte[] replaceNumber(byte[] bytes, int at, String number) {
        int start = at;
        while (start < bytes.length && !Character.isDigit(bytes[start])) {
            start++;
        }
        if (start == bytes.length) {
            return bytes;
        }
        int end = start;
        while (end < bytes.length && (Character.isDigit(bytes[end]) || bytes[end] == '.' || bytes[end] == 'e'
                || bytes[end] == '-')) {
            end++;
        }
        return splice(bytes, start, end, number.getBytes(StandardCharsets.UTF_8));
    }

    private static byte[] splice(byte[] bytes, int from, int to, byte[] insert) {
        byte[] out = new byte[bytes.length - (to - from) + insert.length];
        System.arraycopy(bytes, 0, out, 0, from);
        System.arraycopy(insert, 0, out, from, insert.length);
        System.arraycopy(bytes, to, out, from + insert.length, bytes.length - to);
        return out;
    }

}
