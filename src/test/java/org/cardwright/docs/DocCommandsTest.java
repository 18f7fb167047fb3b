package org.cardwright.docs;

import org.cardwright.testsupport.TestCopies;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.File;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.cli.Main;
import org.cardwright.cli.MainAccess;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * Issue 11, house rule "docs describe commands, cite only files the project ships, and every command they show runs
 * as shown", for the documents other than the README (which {@link ReadmeCommandsTest} runs): docs/*.md,
 * DEVELOPERS.md and verify/bench/README.md.
 *
 * <p>The convention (DEVELOPERS.md, "Docs are tested"): a command is a line of a fenced block that starts with
 * {@code $ } (the lines after it, up to the next {@code $ } line, are its shown output), or any line of a block
 * fenced as {@code sh} (a trailing {@code   # comment} is not part of it). Commands run from the root of a fresh
 * copy of the shipped files ({@code git ls-files}), after the demo's fits ({@code scripts/demo}'s
 * {@code ./cardwright fit} lines) have made {@code demo-out/}, in document order, with bash and the shipped
 * launcher on the PATH. What a command is and how it is checked follows from its first word:
 * <ul>
 *   <li>{@code cardwright}, {@code ./cardwright}, {@code java -jar target/cardwright.jar}, {@code java
 *       verify/tools/X.java}, and {@code cp} or {@code mkdir} (a copy to work in): run; the exit code must be the
 *       one the block shows (a shown output line {@code [exit N]}; else 1 when its output says "does NOT
 *       reproduce" or "&lt;- beyond limit"; else 0), and every {@code wrote ...} or {@code Model ...} line and the
 *       last line of the shown output must be printed;</li>
 *   <li>a shipped script (the benchmarks, scripts/test, spark/run-lot): not run (they build with Maven or run for
 *       minutes), but it must be shipped executable and every option shown must be one it or the harness it
 *       starts parses;</li>
 *   <li>{@code mvn}: not run (Maven inside the Maven test run), but its {@code -f} file, {@code -P} profile and
 *       {@code -Dtest} classes must exist;</li>
 *   <li>anything else (an outside tool such as {@code spark-submit}, or {@code ls}): not run; the repository paths
 *       it names are checked by {@link #everyPathTheDocsNameIsShipped()} like any other.</li>
 * </ul>
 * A block that only illustrates (placeholders, an outside machine) is preceded by the line
 * {@code <!-- not run: REASON -->}; there are at most {@link #MAX_NOT_RUN} such blocks, and each is listed on the
 * test's output with its reason.
 */
class DocCommandsTest {
    /** Longest one documented command may take on a loaded 2-core machine [s] (the demo data maker is the longest). */
    private static final long COMMAND_TIMEOUT_SECONDS = 600;
    /** Illustration-only blocks allowed across all the documents; a larger number means the docs stopped being run. */
    private static final int MAX_NOT_RUN = 3;
    private static final Pattern FENCE = Pattern.compile("(?ms)^( {0,3})```([a-z]*)\\n(.*?)^\\1```");  // a fence may be indented in a list item
    private static final Pattern NOT_RUN = Pattern.compile("<!-- not run: (.+?) -->");
    /** A shown output line {@code [exit N]}: the exit code the doc states. */
    private static final Pattern EXIT = Pattern.compile("^\\[exit (\\d+)\\]$");
    /** JMH's own command-line options (jmh-core's {@code -h}) that the docs show after {@code verify/bench/jmh}. */
    private static final Set<String> JMH_OPTIONS = Set.of("-f", "-wi", "-i", "-w", "-r", "-h", "-l", "-prof", "-rf", "-rff");

    static List<Path> documents(Path root) throws IOException {
        List<Path> docs = new ArrayList<>();
        try (Stream<Path> files = Files.list(root.resolve("docs"))) {
            files.filter(f -> f.toString().endsWith(".md")).sorted().forEach(docs::add);
        }
        docs.add(root.resolve("DEVELOPERS.md"));
        docs.add(root.resolve("verify/bench/README.md"));
        return docs;
    }

    /** One command a document shows. */
    record Shown(String doc, int line, String command, List<String> output, boolean prompted) {
        int expectedExit() {
            for (String l : output) {
                Matcher stated = EXIT.matcher(l);
                if (stated.matches()) {
                    return Integer.parseInt(stated.group(1));
                }
                if (l.contains("does NOT reproduce") || l.contains("<- beyond limit")) {
                    return 1;
                }
            }
            return 0;
        }

        String where() {
            return doc + ":" + line + ": " + command;
        }
    }

    /** A block marked as an illustration. */
    record NotRun(String doc, int line, String reason) {
    }

    /** The commands of one document, and its blocks marked not run. */
    static List<Shown> commands(String doc, String markdown, List<NotRun> notRun) {
        List<Shown> shown = new ArrayList<>();
        Matcher m = FENCE.matcher(markdown);
        while (m.find()) {
            int line = markdown.substring(0, m.start()).split("\n", -1).length + 1;  // the first line inside the fence
            String before = markdown.substring(0, m.start()).stripTrailing();
            String previous = before.substring(before.lastIndexOf('\n') + 1);
            Matcher marker = NOT_RUN.matcher(previous);
            if (marker.find()) {
                notRun.add(new NotRun(doc, line - 2, marker.group(1)));
                continue;
            }
            boolean shell = m.group(2).equals("sh") || m.group(2).equals("bash");
            String indent = m.group(1);
            List<String> lines = m.group(3).lines().map(l -> l.startsWith(indent) ? l.substring(indent.length()) : l).toList();
            for (int i = 0; i < lines.size(); i++) {
                String l = lines.get(i);
                if (l.startsWith("$ ")) {
                    List<String> out = new ArrayList<>();
                    int j = i + 1;
                    for (; j < lines.size() && !lines.get(j).startsWith("$ "); j++) {
                        out.add(lines.get(j));
                    }
                    shown.add(new Shown(doc, line + i, stripComment(l.substring(2)), out, true));
                } else if (shell && !l.isBlank() && !l.stripLeading().startsWith("#")) {
                    int start = i;
                    StringBuilder command = new StringBuilder(stripComment(l));
                    while (command.toString().endsWith("\\") && i + 1 < lines.size()) {
                        command.setLength(command.length() - 1);
                        command.append(' ').append(stripComment(lines.get(++i)).strip());
                    }
                    shown.add(new Shown(doc, line + start, command.toString().strip(), List.of(), false));
                }
            }
        }
        return shown;
    }

    /** The command without a trailing comment (two or more spaces, then {@code #}). */
    static String stripComment(String line) {
        return line.replaceFirst("\\s{2,}#.*$", "").stripTrailing();
    }

    /** The command after any leading {@code cd DIR &&} and environment assignments. */
    static String program(String command) {
        String c = command.strip();
        c = c.replaceFirst("^cd \\S+ && ", "");
        while (c.matches("^[A-Z_]+=\\S* .*")) {
            c = c.substring(c.indexOf(' ') + 1);
        }
        return c;
    }

    @Test
    void everyCommandTheDocsShowRunsAsShown() throws Exception {
        Path root = Simulators.projectDir();
        List<String> shipped = shippedFiles(root);
        Path work = Simulators.tempDir("doc-commands");
        for (String f : shipped) {
            Path target = work.resolve(f);
            Files.createDirectories(target.getParent());
            Files.copy(root.resolve(f), target, StandardCopyOption.COPY_ATTRIBUTES);
        }
        Path bin = Files.createDirectories(work.resolve(".test-bin"));
        Files.createSymbolicLink(bin.resolve("cardwright"), work.resolve("cardwright"));
        Files.createDirectories(work.resolve("target"));
        Files.copy(TestCopies.classPathJar(root.resolve("target/test-work").resolve("doc-commands-classpath.jar")), work.resolve("target/cardwright.jar"), StandardCopyOption.REPLACE_EXISTING);

        // the demo's fits make demo-out/, which the docs' examples read
        int demoFits = 0;
        for (String l : Files.readAllLines(root.resolve("scripts/demo"))) {
            if (l.startsWith("./cardwright fit ")) {
                Result r = run(l, work, bin);
                assertEquals(0, r.exit, "scripts/demo: " + l + "\n" + r);
                demoFits++;
            }
        }
        assertEquals(2, demoFits, "scripts/demo's fit lines");

        List<NotRun> notRun = new ArrayList<>();
        Map<String, int[]> perDoc = new TreeMap<>();  // doc -> {run, checked}
        List<Path> docs = new ArrayList<>(documents(root));
        docs.add(root.resolve("README.md"));  // its other commands; ReadmeCommandsTest runs its cardwright lines
        for (Path d : docs) {
            String doc = root.relativize(d).toString();
            int[] counts = perDoc.computeIfAbsent(doc, k -> new int[2]);
            for (Shown s : commands(doc, Files.readString(d), notRun)) {
                String p = program(s.command());
                String first = p.split("\\s+")[0];
                if (doc.equals("README.md") && (first.equals("cardwright") || first.equals("./cardwright"))) {
                    continue;
                }
                if (first.equals("cardwright") || first.equals("./cardwright") || p.startsWith("java -jar target/cardwright.jar ")
                        || first.equals("cp") || first.equals("mkdir")
                        || (first.equals("java") && p.split("\\s+")[1].endsWith(".java"))) {
                    if (p.contains("--engine ngspice") || p.startsWith("java verify/tools/MakeDemoData.java")) {
                        Simulators.requireNgspice();
                    }
                    if (p.contains("--engine gnucap")) {
                        Simulators.requireGnucap();
                    }
                    Result r = run(s.command(), work, bin);
                    assertEquals(s.expectedExit(), r.exit, s.where() + "\n" + r);
                    List<String> shownLines = new ArrayList<>();
                    for (String l : s.output()) {
                        if (l.strip().startsWith("wrote ") || l.startsWith("Model ")) {
                            shownLines.add(l);
                        }
                    }
                    s.output().stream().filter(l -> !l.isBlank() && !EXIT.matcher(l).matches()).reduce((a, b) -> b).ifPresent(shownLines::add);
                    for (String l : shownLines) {
                        assertTrue(Stream.of(r.out, r.err).flatMap(String::lines).map(String::strip).anyMatch(l.strip()::equals),
                                s.where() + ": shown line not printed: " + l + "\n" + r);
                    }
                    counts[0]++;
                } else if (first.equals("mvn")) {
                    checkMaven(root, shipped, s);
                    counts[1]++;
                } else if (shipped.contains(first)) {
                    checkScript(root, s, first, p);
                    counts[1]++;
                } else {
                    counts[1]++;  // an outside tool; its repository paths are checked with every other path
                }
            }
        }
        for (NotRun n : notRun) {
            System.out.println(n.doc() + ":" + n.line() + ": block not run: " + n.reason());
        }
        perDoc.forEach((doc, c) -> System.out.println(doc + ": " + c[0] + " command lines run, " + c[1] + " checked without running"));
        assertTrue(notRun.size() <= MAX_NOT_RUN, "blocks marked not run: " + notRun);
        assertTrue(perDoc.values().stream().mapToInt(c -> c[0]).sum() >= 3, "commands run: " + perDoc);
    }

    /** A script the docs show: shipped executable, and every option shown is one it (or the harness it starts) parses. */
    private static void checkScript(Path root, Shown s, String script, String command) throws Exception {
        assertTrue(Files.isExecutable(root.resolve(script)), s.where() + ": " + script + " is not executable");
        String text = Files.readString(root.resolve(script));
        Set<String> accepted = new LinkedHashSet<>();
        Matcher own = Pattern.compile("(?m)^\\s*(--[a-z][a-z-]*)\\)").matcher(text);
        while (own.find()) {
            accepted.add(own.group(1));
        }
        Matcher harness = Pattern.compile("org\\.cardwright\\.[a-z.]+\\.[A-Z][A-Za-z]+").matcher(text);
        while (harness.find()) {
            String source = harness.group().replace('.', '/') + ".java";
            Path found = Stream.of("src/test/java/", "src/main/java/", "spark/src/main/java/").map(r -> root.resolve(r + source))
                    .filter(Files::exists).findFirst().orElse(null);
            assertNotNull(found, s.where() + ": " + script + " starts " + harness.group() + ", which is not shipped");
            Matcher cases = Pattern.compile("case \"(--[a-z][a-z-]*)\"").matcher(Files.readString(found));
            while (cases.find()) {
                accepted.add(cases.group(1));
            }
            if (harness.group().equals("org.cardwright.spark.SparkLot")) {
                // spark/run-lot takes the lot command's options (its header lists them)
                accepted.addAll(lotOptions());
                accepted.addAll(List.of("--master", "--partitions"));
            }
        }
        boolean jmh = text.contains("org.openjdk.jmh.Main");
        String[] words = command.split("\\s+");
        for (int i = 1; i < words.length; i++) {
            String w = words[i];
            if (w.startsWith("-")) {
                if (jmh) {
                    assertTrue(JMH_OPTIONS.contains(w), s.where() + ": not a JMH option: " + w);
                } else if (w.startsWith("--")) {  // a single-dash word is a value, e.g. --java-option -XX:+UseSerialGC
                    assertTrue(accepted.contains(w), s.where() + ": " + script + " does not take " + w + " (it takes " + accepted + ")");
                }
            } else if (jmh && w.matches("[A-Z][A-Za-z]+") && !words[i - 1].startsWith("-")) {
                try (Stream<Path> benches = Files.walk(root.resolve("src/jmh/java"))) {
                    assertTrue(benches.anyMatch(b -> b.getFileName().toString().startsWith(w)),
                            s.where() + ": no JMH benchmark " + w + " under src/jmh/java");
                }
            }
        }
    }

    private static Set<String> lotOptions() {
        Set<String> names = new LinkedHashSet<>();
        for (CommandLine.Model.OptionSpec o : MainAccess.commandLine().getSubcommands().get("lot").getCommandSpec().options()) {
            names.addAll(List.of(o.names()));
        }
        return names;
    }

    /** A Maven line: its -f file, -P profile and -Dtest classes exist. */
    private static void checkMaven(Path root, List<String> shipped, Shown s) throws IOException {
        String[] words = s.command().split("\\s+");
        for (int i = 0; i < words.length; i++) {
            if (words[i].equals("-f")) {
                assertTrue(shipped.contains(words[i + 1]), s.where() + ": " + words[i + 1] + " is not shipped");
            } else if (words[i].equals("-P")) {
                assertTrue(Files.readString(root.resolve("pom.xml")).contains("<id>" + words[i + 1] + "</id>"),
                        s.where() + ": no Maven profile " + words[i + 1]);
            } else if (words[i].startsWith("-Dtest=")) {
                for (String pattern : words[i].substring("-Dtest=".length()).replace("'", "").split(",")) {
                    PathMatcher matcher = FileSystems.getDefault().getPathMatcher("glob:" + pattern + ".java");
                    assertTrue(shipped.stream().filter(f -> f.startsWith("src/test/java/"))
                            .anyMatch(f -> matcher.matches(Path.of(f).getFileName())), s.where() + ": no test class " + pattern);
                }
            }
        }
    }

    /** Top-level names of the repository whose paths the docs may name. */
    private static final Pattern PATH = Pattern.compile(
            "(?<![\\w./-])((?:src|docs|fixtures|verify|scripts|spark|templates|\\.ci)/[\\w.*/-]*[\\w*/])");
    /** Placeholder names the docs use in paths ({@code templates/NAME.ftl}, {@code verify/tools/X.java}). */
    private static final String PLACEHOLDERS = "NAME|DIALECT|MODEL|X|DIR|FILE|ROOT|CARDS|INPUT|OUT|LIB|PART";
    private static final Pattern LINK = Pattern.compile("\\]\\(([^)\\s#]+)(#[^)]*)?\\)");

    @Test
    void everyPathTheDocsNameIsShipped() throws Exception {
        Path root = Simulators.projectDir();
        List<String> shipped = shippedFiles(root);
        Set<String> folders = new LinkedHashSet<>();
        for (String f : shipped) {
            for (int i = f.indexOf('/'); i > 0; i = f.indexOf('/', i + 1)) {
                folders.add(f.substring(0, i));
            }
        }
        List<Path> docs = new ArrayList<>(documents(root));
        docs.add(root.resolve("README.md"));
        // the fixtures' READMEs are documents too
        shipped.stream().filter(f -> f.startsWith("fixtures/") && f.endsWith("README.md")).forEach(f -> docs.add(root.resolve(f)));
        List<String> missing = new ArrayList<>();
        int checked = 0;
        for (Path d : docs) {
            String doc = root.relativize(d).toString();
            List<String> lines = Files.readAllLines(d);
            for (int n = 0; n < lines.size(); n++) {
                String line = lines.get(n);
                if (line.contains("/work/") || line.contains("/home/")) {  // hygiene: not a path (the words a doc must not contain)
                    missing.add(doc + ":" + (n + 1) + ": names a file outside the repository: " + line.strip());
                }
                Matcher m = PATH.matcher(line);
                while (m.find()) {
                    String p = m.group(1).replaceAll("/$", "");
                    if (p.matches(".*(^|/)target(/.*|$)") || p.matches(".*/(" + PLACEHOLDERS + ")(\\.[a-z]+)?(/.*|$)")) {
                        continue;  // a build output, or a placeholder (templates/NAME.ftl)
                    }
                    checked++;
                    if (!exists(p, shipped, folders)) {
                        missing.add(doc + ":" + (n + 1) + ": " + p);
                    }
                }
                Matcher link = LINK.matcher(line);
                while (link.find()) {
                    String target = link.group(1);
                    if (target.matches("^[a-z]+:.*")) {
                        continue;  // a web address
                    }
                    String p = root.relativize(d.getParent().resolve(target).normalize()).toString().replaceAll("/$", "");
                    checked++;
                    if (!exists(p, shipped, folders)) {
                        missing.add(doc + ":" + (n + 1) + ": link to " + target);
                    }
                }
            }
        }
        assertEquals(List.of(), missing);
        assertTrue(checked > 100, "paths checked: " + checked);
    }

    private static boolean exists(String p, List<String> shipped, Set<String> folders) {
        if (shipped.contains(p) || folders.contains(p)) {
            return true;
        }
        if (p.contains("*")) {
            PathMatcher glob = FileSystems.getDefault().getPathMatcher("glob:" + p);
            return shipped.stream().anyMatch(f -> glob.matches(Path.of(f)));
        }
        return false;
    }

    /**
     * Help text, the developer guide and the example library's device files use the project's words too ("device
     * file", "state file", "outdated"); README.md and docs/ are DocsSafetyAndWordsTest's.
     */
    @Test
    void helpTextAndDeveloperGuideUseOurWords() throws Exception {
        Pattern words = Pattern.compile("(?i)\\brecipes?\\b|\\bstale\\b|build records?");
        CommandLine cl = MainAccess.commandLine();
        List<String> found = new ArrayList<>();
        Map<String, CommandLine> commands = new LinkedHashMap<>(cl.getSubcommands());
        commands.put("", cl);
        commands.forEach((name, c) -> {
            String help = c.getUsageMessage(CommandLine.Help.Ansi.OFF);
            for (String l : help.split("\n")) {
                // an earlier option name kept for old scripts may be named (--allow-stale)
                if (words.matcher(l.replaceAll("--[a-z-]+", "")).find()) {
                    found.add("cardwright " + name + " --help: " + l.strip());
                }
            }
        });
        Path root = Simulators.projectDir();
        List<String> files = new ArrayList<>(List.of("DEVELOPERS.md"));
        // the example library's device files are read as examples of the format, comments included
        shippedFiles(root).stream().filter(f -> f.startsWith("fixtures/library/") && f.endsWith(".yaml")).forEach(files::add);
        for (String f : files) {
            List<String> lines = Files.readAllLines(root.resolve(f));
            for (int i = 0; i < lines.size(); i++) {
                // a Java name (Recipe) or a quoted old keyword may be named
                if (words.matcher(lines.get(i).replaceAll("`[^`]*`", "")).find()) {
                    found.add(f + ":" + (i + 1) + ": " + lines.get(i).strip());
                }
            }
        }
        assertEquals(List.of(), found);
    }

    /**
     * docs/formats.md lists every key {@code verify --json} writes, per section: the section's own keys, the keys of
     * each {@code temperatures[]} entry and of each {@code points[]} entry (every section has per-point entries).
     * Run on the demo zener, which has every data kind (forward, breakdown, C-V, recovery, leakage).
     */
    @Test
    void everyVerifyJsonKeyIsDocumented() throws Exception {
        Path root = Simulators.projectDir();
        Path work = Simulators.tempDir("doc-verify-json");
        List<String> data = new ArrayList<>();
        try (Stream<Path> files = Files.list(root.resolve("fixtures/demo"))) {
            files.filter(f -> f.getFileName().toString().matches("ksz6-.*\\.csv")).sorted().forEach(f -> data.add(f.toString()));
        }
        List<String> fit = new ArrayList<>(List.of("fit", "--kind", "zener", "--name", "Z", "--out", work.toString()));
        fit.addAll(data);
        StringWriter sink = new StringWriter();
        assertEquals(0, Main.execute(new PrintWriter(sink), new PrintWriter(sink), fit.toArray(String[]::new)), sink.toString());
        List<String> verify = new ArrayList<>(List.of("verify", work.resolve("Z.ngspice.lib").toString(), "--json", work.resolve("v.json").toString()));
        verify.addAll(data);
        int exit = Main.execute(new PrintWriter(sink), new PrintWriter(sink), verify.toArray(String[]::new));
        assertTrue(exit == 0 || exit == 1, sink.toString());
        JsonNode json = new ObjectMapper().readTree(work.resolve("v.json").toFile());

        String formats = Files.readString(root.resolve("docs/formats.md"));
        String verifyPart = formats.substring(formats.indexOf("## Verify JSON"));
        Map<String, String> heading = Map.of("forward", "`forward` and `breakdown` have", "breakdown", "`forward` and `breakdown` have",
                "capacitance", "`capacitance`:", "recovery", "`recovery`:", "leakage", "`leakage`:");
        List<String> undocumented = new ArrayList<>();
        int sections = 0;
        for (var e : heading.entrySet()) {
            JsonNode section = json.get(e.getKey());
            assertNotNull(section, "the demo zener's verify JSON has a " + e.getKey() + " section");
            sections++;
            int at = verifyPart.indexOf(e.getValue());
            assertTrue(at >= 0, "docs/formats.md: no table for " + e.getKey());
            List<String> table = verifyPart.substring(at).lines().skip(1).dropWhile(String::isBlank).takeWhile(l -> l.startsWith("|")).toList();
            String all = String.join("\n", table);
            section.fieldNames().forEachRemaining(k -> {
                if (!all.contains("`" + k + "`") && !all.contains("`" + k + ".") && !all.contains("`" + k + "[]`")) {
                    undocumented.add(e.getKey() + "." + k);
                }
            });
            for (String list : List.of("temperatures", "points")) {
                JsonNode entries = section.get(list);
                assertNotNull(entries, e.getKey() + " has " + list + "[]");
                assertTrue(entries.size() > 0, e.getKey() + "." + list + " is empty");
                String row = table.stream().filter(l -> l.startsWith("| `" + list + "[]`")).findFirst().orElse("");
                entries.get(0).fieldNames().forEachRemaining(k -> {
                    if (!row.contains("`" + k + "`")) {
                        undocumented.add(e.getKey() + "." + list + "[]." + k);
                    }
                });
            }
        }
        json.fieldNames().forEachRemaining(k -> {
            if (!verifyPart.contains("| `" + k + "` |")) {
                undocumented.add(k);
            }
        });
        assertEquals(5, sections);
        assertEquals(List.of(), undocumented, "keys verify --json writes that docs/formats.md does not list");
    }

    /**
     * Commands written inline in the text, e.g. {@code `verify --engine gnucap`} or {@code `verify/bench/run --runs
     * 60`}: every option named belongs to that command, and a script named is shipped executable and takes the
     * options shown (checked as the blocks' scripts are).
     */
    @Test
    void everyOptionOfAnInlineCommandExists() throws Exception {
        Path root = Simulators.projectDir();
        List<String> shipped = shippedFiles(root);
        CommandLine cl = MainAccess.commandLine();
        List<Path> docs = new ArrayList<>(documents(root));
        docs.add(root.resolve("README.md"));
        Pattern command = Pattern.compile("`(?:\\./)?(?:cardwright )?(fit|verify|build|tweak|compare|check|lot)((?: [^`]*)? --[a-z][^`]*)`");
        Pattern script = Pattern.compile("`((?:verify/bench|scripts|spark)/[a-z-]+)( [^`]*)?`");
        List<String> wrong = new ArrayList<>();
        int checked = 0;
        for (Path d : docs) {
            String doc = root.relativize(d).toString();
            List<String> lines = Files.readAllLines(d);
            for (int n = 0; n < lines.size(); n++) {
                Matcher m = command.matcher(lines.get(n));
                while (m.find()) {
                    CommandLine sub = cl.getSubcommands().get(m.group(1));
                    Matcher option = Pattern.compile("(?<![\\w-])(--[a-z][a-z-]*)").matcher(m.group(2));
                    while (option.find()) {
                        checked++;
                        if (sub.getCommandSpec().findOption(option.group(1)) == null) {
                            wrong.add(doc + ":" + (n + 1) + ": " + m.group() + ": " + m.group(1) + " has no option " + option.group(1));
                        }
                    }
                }
                Matcher s = script.matcher(lines.get(n));
                while (s.find()) {
                    if (!shipped.contains(s.group(1))) {
                        wrong.add(doc + ":" + (n + 1) + ": " + s.group(1) + " is not shipped");
                        continue;
                    }
                    String args = s.group(2) == null ? "" : s.group(2);
                    args = args.replaceAll("(?<![\\w-])[A-Z]{2,}\\b", "x");  // a placeholder such as INPUT or NAME
                    checkScript(root, new Shown(doc, n + 1, s.group(), List.of(), false), s.group(1), s.group(1) + args);
                    checked++;
                }
            }
        }
        assertEquals(List.of(), wrong);
        assertTrue(checked >= 30, "inline options checked: " + checked);
    }

    /** docs/model.md describes equations only, no bench work, so its breakdown and self-heating sections need none. */
    private static final Set<String> NO_BENCH_WORK = Set.of("docs/model.md", "docs/bibliography.md", "docs/nomenclature.md");

    /**
     * Issue 11, "cautions where the danger is", as a rule over every document rather than a list of places: each
     * section of docs/*.md whose heading names breakdown, recovery, self-heating or series-resistor logs, and each
     * section that mentions a temperature chamber, holds (itself or in a section enclosing it) a caution that
     * defers to local codes; the chamber's caution names frost and condensation.
     */
    @Test
    void everyDangerousSectionCarriesItsCaution() throws Exception {
        Path root = Simulators.projectDir();
        Pattern danger = Pattern.compile("(?i)breakdown|recovery|self-heating|series-resistor");
        List<String> missing = new ArrayList<>();
        int sections = 0;
        for (Path d : documents(root)) {
            String doc = root.relativize(d).toString();
            if (!doc.startsWith("docs/") || NO_BENCH_WORK.contains(doc)) {
                continue;
            }
            List<String> lines = Files.readAllLines(d);
            for (int i = 0; i < lines.size(); i++) {
                Matcher h = Pattern.compile("^(#+) (.*)").matcher(lines.get(i));
                if (!h.find() || insideFence(lines, i)) {
                    continue;
                }
                int level = h.group(1).length();
                String own = sectionText(lines, i, false);
                boolean dangerous = danger.matcher(h.group(2)).find();
                boolean chamber = own.toLowerCase(java.util.Locale.ROOT).contains("chamber");
                if (!dangerous && !chamber) {
                    continue;
                }
                sections++;
                // this section with its subsections, or any section enclosing it
                List<String> scopes = new ArrayList<>(List.of(sectionText(lines, i, true)));
                for (int j = i - 1, l = level; j >= 0 && l > 2; j--) {  // up to a level-2 section, not the page title
                    Matcher up = Pattern.compile("^(#+) ").matcher(lines.get(j));
                    if (up.find() && up.group(1).length() < l && up.group(1).length() >= 2 && !insideFence(lines, j)) {
                        l = up.group(1).length();
                        scopes.add(sectionText(lines, j, true));
                    }
                }
                scopes.replaceAll(t -> t.replaceAll("\\s*\\n>?\\s*", " "));  // one line of text, quote markers gone
                boolean cautioned = scopes.stream().anyMatch(t -> t.contains("Caution") && t.contains("local electrical codes"));
                if (!cautioned) {
                    missing.add(doc + ":" + (i + 1) + ": " + lines.get(i) + ": no caution deferring to local electrical codes");
                }
                if (chamber && scopes.stream().noneMatch(t -> t.contains("frost") && t.contains("condensation"))) {
                    missing.add(doc + ":" + (i + 1) + ": " + lines.get(i) + ": a chamber without the frost and condensation caution");
                }
            }
        }
        assertEquals(List.of(), missing);
        assertTrue(sections >= 6, "sections with a danger: " + sections);
    }

    private static boolean insideFence(List<String> lines, int index) {
        boolean inside = false;
        for (int i = 0; i < index; i++) {
            if (lines.get(i).startsWith("```")) {
                inside = !inside;
            }
        }
        return inside;
    }

    /** The text of the section whose heading is line {@code start}, to the next heading (of its level or above if {@code nested}). */
    private static String sectionText(List<String> lines, int start, boolean nested) {
        int level = lines.get(start).indexOf(' ');
        StringBuilder sb = new StringBuilder(lines.get(start)).append('\n');
        boolean fence = false;
        for (int i = start + 1; i < lines.size(); i++) {
            String l = lines.get(i);
            if (l.startsWith("```")) {
                fence = !fence;
            }
            Matcher h = Pattern.compile("^(#+) ").matcher(l);
            if (!fence && h.find() && (!nested || h.group(1).length() <= level)) {
                break;
            }
            sb.append(l).append('\n');
        }
        return sb.toString();
    }

    /** The synopsis in docs/lot.md names options the lot command has. */
    @Test
    void everyOptionOfTheLotSynopsisExists() throws Exception {
        Set<String> options = lotOptions();
        String lot = Files.readString(Simulators.projectDir().resolve("docs/lot.md"));
        Matcher block = Pattern.compile("(?ms)^cardwright lot (.*?)^```").matcher(lot);
        assertTrue(block.find(), "docs/lot.md has its synopsis");
        Matcher option = Pattern.compile("\\[(--[a-z][a-z-]*)").matcher(block.group(1));
        int checked = 0;
        while (option.find()) {
            assertTrue(options.contains(option.group(1)), "docs/lot.md: cardwright lot has no option " + option.group(1));
            checked++;
        }
        assertTrue(checked >= 10, "options checked: " + checked);
        assertFalse(options.isEmpty());
    }

    static List<String> shippedFiles(Path root) throws Exception {
        Process p = new ProcessBuilder("git", "ls-files").directory(root.toFile()).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(60, TimeUnit.SECONDS) && p.exitValue() == 0, "git ls-files: " + out);
        List<String> files = out.lines().filter(f -> Files.isRegularFile(root.resolve(f))).toList();
        assertTrue(files.size() > 100, "shipped files: " + files.size());
        return files;
    }
    record Result(int exit, String out, String err) {
        @Override
        public String toString() {
            return "exit " + exit + "\n--- stdout ---\n" + out + "\n--- stderr ---\n" + err;
        }
    }

    private static Result run(String commandLine, Path dir, Path bin) throws Exception {
        ProcessBuilder pb = new ProcessBuilder("bash", "-c", commandLine).directory(dir.toFile());
        pb.environment().put("PATH", bin + File.pathSeparator + System.getenv("PATH"));
        pb.environment().put("CARDWRIGHT_NO_CACHE", "1");
        pb.environment().put("CARDWRIGHT_JAVA", Path.of(System.getProperty("java.home"), "bin", "java").toString());
        Path out = Files.createTempFile(bin, "out", ".txt");
        Path err = Files.createTempFile(bin, "err", ".txt");
        Process p = pb.redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        assertTrue(p.waitFor(COMMAND_TIMEOUT_SECONDS, TimeUnit.SECONDS), "timed out: " + commandLine);
        return new Result(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8), Files.readString(err, StandardCharsets.UTF_8));
    }
}
