package org.cardwright.docs;

import org.cardwright.testsupport.TestCopies;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * Issue 11, acceptance: README.md is re-read against the program. Every {@code $ cardwright ...} command the README
 * shows is run as written, in README order, with bash, in a copy of the repository's fixtures, through the shipped
 * launcher {@code ./cardwright} put on the PATH as the README says (a symbolic link), and must exit as the shown
 * output documents (1 where it says "does NOT reproduce" or "beyond limit", else 0); every {@code wrote ...} and
 * {@code Model ...} line shown must be printed. The {@code verify} line a card header carries is run the same way,
 * from the card's folder. Every option in the README's and docs/library.md's synopses exists on its command.
 */
class ReadmeCommandsTest {
    /** Longest one README command may take on a loaded 2-core machine [s] (the lot of 24 parts is the longest). */
    private static final long COMMAND_TIMEOUT_SECONDS = 600;
    /**
     * Commands whose input the README says is not in the repository, with that reason; they are named here, so
     * nothing is skipped silently.
     */
    private static final Map<String, String> NOT_SHIPPED = Map.of();
    private static final Pattern FENCE = Pattern.compile("(?ms)^```[a-z]*\\n(.*?)^```");

    /** One shown command with the output the README shows after it. */
    record Shown(String command, List<String> output, int line) {
        int expectedExit() {
            for (String l : output) {
                if (l.contains("does NOT reproduce") || l.contains("<- beyond limit")) {
                    return 1;
                }
            }
            return 0;
        }
    }

    static List<Shown> shownCommands(String markdown) {
        List<Shown> shown = new ArrayList<>();
        Matcher m = FENCE.matcher(markdown);
        while (m.find()) {
            int line = markdown.substring(0, m.start()).split("\n", -1).length + 1;
            List<String> lines = m.group(1).lines().toList();
            for (int i = 0; i < lines.size(); i++) {
                if (lines.get(i).startsWith("$ cardwright ")) {
                    List<String> out = new ArrayList<>();
                    for (int j = i + 1; j < lines.size() && !lines.get(j).startsWith("$ "); j++) {
                        out.add(lines.get(j));
                    }
                    shown.add(new Shown(lines.get(i).substring(2), out, line + i));
                }
            }
        }
        return shown;
    }

    @Test
    void everyCommandTheReadmeShowsRunsAsShown() throws Exception {
        Simulators.requireNgspice();  // one README command runs --engine ngspice
        Path root = Simulators.projectDir();
        Path work = Simulators.tempDir("readme-commands");
        TestCopies.copyTree(root.resolve("fixtures"), work.resolve("fixtures"), StandardCopyOption.COPY_ATTRIBUTES, StandardCopyOption.REPLACE_EXISTING);
        TestCopies.copyTree(root.resolve("fixtures/library"), work.resolve("lib"), StandardCopyOption.COPY_ATTRIBUTES, StandardCopyOption.REPLACE_EXISTING);  // "copy it somewhere to try the commands"
        Files.createDirectories(work.resolve("target"));
        glitch(work);
        Path bin = launcherOnPath(root, work);

        List<Shown> shown = shownCommands(Files.readString(root.resolve("README.md")));
        assertTrue(shown.size() >= 14, "README commands found: " + shown.size());
        int ran = 0;
        for (Shown s : shown) {
            if (NOT_SHIPPED.containsKey(s.command())) {
                System.out.println("README.md:" + s.line() + ": not run: " + NOT_SHIPPED.get(s.command()));
                continue;
            }
            Result r = run(s.command(), work, bin, work);
            assertEquals(s.expectedExit(), r.exit, "README.md:" + s.line() + ": " + s.command() + "\n" + r);
            for (String l : s.output()) {
                if (l.startsWith("wrote ") || l.startsWith("Model ")) {
                    assertTrue(r.out.lines().anyMatch(l::equals), "README.md:" + s.line() + ": shown line not printed: " + l + "\n" + r);
                }
            }
            ran++;
        }
        assertEquals(shown.size() - NOT_SHIPPED.size(), ran);

        // the verify line in a card's header runs as written, from the card's folder, with the shipped launcher
        for (String card : List.of("demo-out/KS1.ngspice.lib", "demo-out/KSZ6.ngspice.lib")) {
            Path file = work.resolve(card);
            String hint = Files.readAllLines(file).stream().filter(l -> l.startsWith("* verify, from this card's folder: "))
                    .findFirst().orElseThrow().substring("* verify, from this card's folder: ".length());
            Result r = run(hint, file.getParent(), bin, work);
            assertEquals(0, r.exit, card + ": " + hint + "\n" + r);
            assertTrue(r.out.contains("reproduces the data within the limits"), r.toString());
        }
    }

    @Test
    void theVerifyLineOfEveryCardRunsAsWrittenWithItsOptions() throws Exception {
        Path root = Simulators.projectDir();
        Path work = Simulators.tempDir("card-verify-lines");
        TestCopies.copyTree(root.resolve("fixtures/demo"), work.resolve("data"), StandardCopyOption.COPY_ATTRIBUTES, StandardCopyOption.REPLACE_EXISTING);
        TestCopies.copyTree(root.resolve("fixtures/recovery"), work.resolve("data"), StandardCopyOption.COPY_ATTRIBUTES, StandardCopyOption.REPLACE_EXISTING);
        Path bin = launcherOnPath(root, work);
        // recovery records without a T column need --temp; a fraction of a degree once came out as "500m"
        Result fit = run("cardwright fit data/ks1-*.csv data/ks1-recovery-25C.csv --temp 0.5 --name K1 --out 'cards here'"
                + " --dialect ngspice,spice3,gnucap,xyce", work, bin, work);
        assertEquals(0, fit.exit, fit.toString());
        for (String dialect : List.of("ngspice", "spice3", "gnucap", "xyce")) {
            Path card = work.resolve("cards here/K1." + dialect + ".lib");
            String hint = Files.readAllLines(card).stream().filter(l -> l.startsWith("* verify, from this card's folder: "))
                    .findFirst().orElseThrow().substring("* verify, from this card's folder: ".length());
            assertTrue(hint.contains(" --temp 0.5"), hint);
            assertEquals(!dialect.equals("ngspice"), hint.contains(" --dialect " + dialect), hint);
            Result r = run(hint, card.getParent(), bin, work);
            // 0 or 1 is a verdict; anything else means the line did not run as written
            assertTrue(r.exit == 0 || r.exit == 1, dialect + ": " + hint + "\n" + r);
            assertTrue(r.out.contains("Reverse recovery"), dialect + ": " + r);
        }
    }

    @Test
    void everyOptionOfTheSynopsesExists() throws Exception {
        Path root = Simulators.projectDir();
        CommandLine cl = org.cardwright.cli.MainAccess.commandLine();
        int checked = 0;
        for (String doc : List.of("README.md", "docs/library.md")) {
            String command = null;
            for (String line : Files.readAllLines(root.resolve(doc))) {
                Matcher m = Pattern.compile("^\\s*cardwright (fit|verify|build|tweak|compare|check|lot) (.*)").matcher(line);
                String rest;
                if (m.find()) {
                    command = m.group(1);
                    rest = m.group(2);
                } else if (command != null && line.matches("^\\s+\\[--.*")) {
                    rest = line;  // a synopsis continued on the next line
                } else {
                    command = null;
                    continue;
                }
                CommandLine sub = cl.getSubcommands().get(command);
                Matcher option = Pattern.compile("\\[(--[a-z][a-z-]*)").matcher(rest);
                while (option.find()) {
                    assertNotNull(sub.getCommandSpec().findOption(option.group(1)),
                            doc + ": cardwright " + command + " has no option " + option.group(1) + ": " + line);
                    checked++;
                }
            }
        }
        assertTrue(checked > 60, "options checked: " + checked);
    }

    /** The demo's glitch file: ks1-forward-25C.csv with the voltage of line 41 moved by +12 mV (as the README says). */
    private static void glitch(Path work) throws IOException {
        List<String> lines = new ArrayList<>(Files.readAllLines(work.resolve("fixtures/demo/ks1-forward-25C.csv")));
        String[] cells = lines.get(40).split(",", -1);
        cells[0] = new java.math.BigDecimal(cells[0]).add(new java.math.BigDecimal("0.012")).toPlainString();
        lines.set(40, String.join(",", cells));
        Files.write(work.resolve("ks1-forward-25C-glitch.csv"), lines);
    }

    /** A folder for the PATH holding {@code cardwright}, a link to the shipped launcher, as the README suggests. */
    private static Path launcherOnPath(Path root, Path work) throws IOException {
        Path bin = work.resolve("bin");
        Files.createDirectories(bin);
        Files.createSymbolicLink(bin.resolve("cardwright"), root.resolve("cardwright"));
        return bin;
    }
    record Result(int exit, String out, String err) {
        @Override
        public String toString() {
            return "exit " + exit + "\n--- stdout ---\n" + out + "\n--- stderr ---\n" + err;
        }
    }

    private static Result run(String commandLine, Path dir, Path bin, Path work) throws Exception {
        ProcessBuilder pb = new ProcessBuilder("bash", "-c", commandLine).directory(dir.toFile());
        pb.environment().put("PATH", bin + File.pathSeparator + System.getenv("PATH"));
        pb.environment().put("CARDWRIGHT_JAR", TestCopies.classPathJar(work.resolve("classpath.jar")).toString());
        pb.environment().put("CARDWRIGHT_NO_CACHE", "1");
        pb.environment().put("CARDWRIGHT_JAVA", Path.of(System.getProperty("java.home"), "bin", "java").toString());
        Path out = Files.createTempFile(work, "out", ".txt");
        Path err = Files.createTempFile(work, "err", ".txt");
        Process p = pb.redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        assertTrue(p.waitFor(COMMAND_TIMEOUT_SECONDS, TimeUnit.SECONDS), "timed out: " + commandLine);
        return new Result(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8), Files.readString(err, StandardCharsets.UTF_8));
    }

}
