package org.cardwright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.cardwright.testsupport.Simulators;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

/**
 * Issue 10, templates are data: every hostile template in fixtures/hostile/templates, run through the real command
 * line ({@code fit --templates}), ends with exit 3 and one line naming the template file and saying what was
 * refused, with no stack trace, no card written, nothing read from outside the template folder, and the canary
 * file (which the template tries to create) never created.
 */
class HostileTemplatesTest {
    /** Line 2 of each hostile template's header. */
    private static final Pattern EXPECTED = Pattern.compile("\\s*Expected: exit (\\d+), message contains '(.*)' -->");
    /** The corpus had 25 templates when this test was written; fewer means some went missing. */
    private static final int MIN_TEMPLATES = 25;
    /** Written in the test's outside folder; no message may ever show it. */
    private static final String SECRET = "SECRET-5f2c-not-for-messages";

    @TestFactory
    Stream<DynamicTest> everyHostileTemplateIsRefusedAndRunsNothing() throws IOException {
        Path corpus = Simulators.projectDir().resolve("fixtures/hostile/templates");
        List<Path> templates;
        try (Stream<Path> s = Files.list(corpus)) {
            templates = s.filter(p -> p.toString().endsWith(".ftl")).sorted().toList();
        }
        assertTrue(templates.size() >= MIN_TEMPLATES, "only " + templates.size() + " templates in " + corpus);
        Path data = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        return templates.stream().map(t -> DynamicTest.dynamicTest(t.getFileName().toString(), () -> {
            String text = Files.readString(t, StandardCharsets.UTF_8);
            Matcher m = EXPECTED.matcher(text.lines().skip(1).filter(l -> l.contains("Expected:")).findFirst().orElse(""));
            assertTrue(m.matches(), t + ": its header does not say what to expect");
            int code = Integer.parseInt(m.group(1));
            String fragment = m.group(2);

            Path work = Simulators.tempDir("hostile-template-" + t.getFileName().toString().replace(".ftl", ""));
            Path folder = Files.createDirectories(work.resolve("templates"));
            Path outside = Files.createDirectories(work.resolve("outside"));
            Path canary = work.resolve("canary");
            Files.writeString(outside.resolve("secret.ftl"), SECRET + "\n", StandardCharsets.UTF_8);
            Files.writeString(outside.resolve("lib.ftl"), "<#assign leaked = \"" + SECRET + "\">\n", StandardCharsets.UTF_8);
            Files.createSymbolicLink(folder.resolve("link.ftl"), outside.resolve("secret.ftl"));
            Path template = folder.resolve("ngspice.ftl");
            Files.writeString(template, text.replace("@CANARY@", canary.toString()), StandardCharsets.UTF_8);
            Path out = work.resolve("out");

            CliRun run = CliRun.of("fit", data.toString(), "--name", "KS1", "--dialect", "ngspice", "--out", out.toString(),
                    "--templates", folder.toString());

            assertEquals(code, run.exitCode(), run.describe());
            assertEquals(1, run.errLines().size(), "one line: " + run.describe());
            String line = run.errLines().get(0);
            assertTrue(line.startsWith("cardwright: " + template + ":"), "names the template file: " + line);
            assertTrue(line.contains(fragment), "says '" + fragment + "': " + line);
            assertFalse(run.err().contains("\tat ") || run.out().contains("\tat "), "no stack trace: " + run.describe());
            assertFalse(run.err().contains(SECRET) || run.out().contains(SECRET), "nothing read from outside: " + run.describe());
            assertFalse(Files.exists(canary), "the template ran something: " + canary + " exists");
            assertFalse(Files.exists(out.resolve("KS1.ngspice.lib")), "no card is written");
        }));
    }

    @Test
    void theBundledTemplatesPassTheReadBackCheck() throws IOException {
        Path out = Simulators.tempDir("hostile-template-bundled");
        Path data = Simulators.projectDir().resolve("fixtures/demo/ks1-forward-25C.csv");
        CliRun run = CliRun.of("fit", data.toString(), "--name", "KS1", "--dialect", "ngspice,spice3,gnucap,xyce",
                "--out", out.toString());
        assertEquals(ExitCodes.OK, run.exitCode(), run.describe());
        for (String d : List.of("ngspice", "spice3", "gnucap", "xyce")) {
            assertTrue(Files.isRegularFile(out.resolve("KS1." + d + ".lib")), d);
        }
    }
}
